import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';

/**
 * A table laid out one group per row ("Group | n | M (SD) | t(79) | p | d"), the test printed in
 * the first group's row: the next row is the other group, so the df, t and d are checked against
 * two groups, not read as a one-sample test of the first row. Invented tables; numbers by scipy
 * 1.17.1: (31.2, 6.1, 40) against (27.9, 6.4, 41) give Student's t(79) = 2.374, p = .020 and
 * pooled-SD d = 0.528 (scipy.stats.ttest_ind_from_stats; d by hand from the pooled SD);
 * t(79) = 3.37 gives p = .0012 (scipy.stats.t.sf). One-sample tests against 25: (31.2, 6.1, 40)
 * gives t(39) = 6.43, p < .001; (27.9, 6.4, 41) gives t(40) = 2.90, p = .006.
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const spoken = (r: FileReport) => r.findings.filter((f) => f.level !== 'note').map((f) => f.ruleId);
const table = (rows: string) => `## Results\n\nTable 2. Final examination score by group\n\n| Group | n | M (SD) | t(79) | p | d |\n|---|---|---|---|---|---|\n${rows}`;

describe('a test in the first of two group rows', () => {
  it('compares the two rows: consistent numbers raise nothing', () => {
    const r = run(table('| Tutored | 40 | 31.2 (6.1) | 2.37 | .020 | 0.53 |\n| Not tutored | 41 | 27.9 (6.4) | | | |'));
    expect(r.results[0]?.context.descriptives?.groups.map((g) => g.printed)).toEqual(['Tutored | 31.2 (6.1) | 40', 'Not tutored | 27.9 (6.4) | 41']);
    expect(spoken(r)).toEqual([]);
  });
  it('a t that the two rows cannot give is still a warning', () => {
    const r = run(table('| Tutored | 40 | 31.2 (6.1) | 3.37 | .001 | 0.53 |\n| Not tutored | 41 | 27.9 (6.4) | | | |'));
    expect(spoken(r)).toContain('t-follows-from-descriptives');
    expect(spoken(r)).not.toContain('df-follows-from-n');
  });
  it('rows that each print a test are each their own group', () => {
    const r = run('## Results\n\nTable 3. Score against the pass mark of 25\n\n| Group | n | M (SD) | t | df | p |\n|---|---|---|---|---|---|\n| Tutored | 40 | 31.2 (6.1) | 6.43 | 39 | < .001 |\n| Not tutored | 41 | 27.9 (6.4) | 2.90 | 40 | .006 |');
    expect(r.results.map((x) => x.context.descriptives?.groups.length)).toEqual([1, 1]);
  });
  it('a third group row without a test leaves the comparison open', () => {
    const r = run(table('| Tutored | 40 | 31.2 (6.1) | 2.37 | .020 | 0.53 |\n| Not tutored | 41 | 27.9 (6.4) | | | |\n| Waiting list | 39 | 28.4 (6.0) | | | |'));
    expect(r.results[0]?.context.descriptives).toBeUndefined();
    expect(r.results[0]?.context.unlinked).toContain('one of three or more group rows');
    expect(spoken(r)).toEqual([]);
  });
});

describe('the review\'s cases', () => {
  it('a "Total" row under the two groups is no third group: a t error is still a warning', () => {
    const r = run(table('| Tutored | 40 | 31.2 (6.1) | 3.37 | .001 | 0.53 |\n| Not tutored | 41 | 27.9 (6.4) | | | |\n| Total | 81 | 29.5 (6.4) | | | |'));
    expect(spoken(r)).toContain('t-follows-from-descriptives');
  });
  it('a one-sample row (its df its own n − 1) is not paired with the next row', () => {
    const r = run('## Results\n\nTable 3. Score against the pass mark of 25 (one-sample t-tests)\n\n| Group | n | M (SD) | t | df | p |\n|---|---|---|---|---|---|\n| Tutored | 40 | 31.2 (6.1) | 6.43 | 39 | < .001 |\n| Not tutored | 41 | 27.9 (6.4) | — | — | — |');
    expect(r.results[0]?.context.descriptives?.groups).toHaveLength(1);
    expect(spoken(r)).not.toContain('df-follows-from-n');
  });
  it('a test in the last of two group rows compares it with the row before', () => {
    const last = (t: string) => table(`| Tutored | 40 | 31.2 (6.1) | | | |\n| Not tutored | 41 | 27.9 (6.4) | ${t} | .020 | 0.53 |`);
    expect(spoken(run(last('2.37')))).toEqual([]);
    expect(spoken(run(last('3.37')))).toContain('t-follows-from-descriptives');
  });
});
