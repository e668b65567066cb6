import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';

/**
 * Results printed in tables, read row by row, and the numbers of each row tied to its test.
 * Invented numbers; each correct row was computed from the textbook formulas (common practice,
 * no source): Student's t = (M1 − M2) / (s_p √(1/n1 + 1/n2)) = 3.008, d = (M1 − M2) / s_p =
 * 0.951, the CI 1.00 ± 2.024 × 0.332 = 0.33 to 1.67; the p values with scipy.stats.t.sf 1.17.1
 * (t(38) = 3.01: .0046; t(5) = 3.3294: .0208).
 */
const run = (source: string, path = 'x.md'): FileReport => checkSource(path, source);
const warnings = (r: FileReport) => r.findings.filter((f) => f.level !== 'note').map((f) => `${f.ruleId}/${f.messageId}@${f.start.line}`);

describe('wide tables: one comparison per row', () => {
  const wide = [
    '| Measure | Standing (n = 20), M (SD) | Seated (n = 20), M (SD) | Difference (95% CI) | t | df | p | d |',
    '|---|---|---|---|---|---|---|---|',
    // s_p = 1.05, SE = 0.332, t = 3.01, d = 0.95, CI 1.00 ± 2.024·0.332 = 0.33 to 1.67
    '| Fatigue | 5.00 (1.00) | 4.00 (1.10) | 1.00 (0.33 to 1.67) | 3.01 | 38 | .005 | 0.95 |',
    // the same groups, t from another comparison: the descriptives cannot give it
    '| Comfort | 5.00 (1.00) | 4.00 (1.10) | | 5.20 | 38 | < .001 | |',
  ].join('\n');
  it('reads t, df, p, the groups of the row, its d and its interval with the estimate', () => {
    const r = run(`${wide}\n`);
    expect(r.results).toHaveLength(2);
    const first = r.results[0]!;
    expect([first.t.value, first.df?.value, first.p?.number?.value]).toEqual([3.01, 38, 0.005]);
    expect(first.context.descriptives?.groups.map((g) => g.printed)).toEqual(['Standing: 5.00 (1.00)', 'Seated: 4.00 (1.10)']);
    expect(first.context.descriptives?.certain).toBe(true);
    expect(first.context.effectSizes.map((e) => [e.printed, e.basis])).toEqual([['d = 0.95', 'table-row']]);
    expect(first.context.interval?.printed).toBe('95% CI 1.00 (0.33 to 1.67)');
    expect(first.context.estimate?.printed).toBe('estimate = 1.00');
  });
  it('a row whose t its own groups cannot give is found, the correct row is not', () => {
    expect(warnings(run(`${wide}\n`))).toEqual(['t-follows-from-descriptives/mismatch@4']);
  });
  it('under a `t (df)` header, each cell\'s df in brackets after its t; a p that cannot follow is flagged', () => {
    // invented; t(99) = 1.071 gives p = .287 and t(40) = 2.50 gives p = .017 (scipy.stats.t.sf doubled), not .17
    const r = run('| Variable | Mean (SD) | t (df) | p |\n|---|---|---|---|\n| Slope | -.030 (.284) | -1.071 (99) | .287 |\n| Shift | .410 (.300) | 2.50 (40)* | .17 |\n');
    expect(r.results.map((x) => [x.t.printed, x.df?.printed, x.df?.value, x.p?.number?.printed])).toEqual([
      ['-1.071', '99', 99, '.287'],
      ['2.50', '40', 40, '.17'],
    ]);
    expect(r.findings.filter((f) => f.level === 'error').map((f) => `${f.ruleId}@${f.start.line}`)).toEqual(['significance-follows-from-t@4']);
    // without the header's `(df)`, a bracket after t is not read as its df
    expect(run('| Variable | t | p |\n|---|---|---|\n| Slope | -1.071 (99) | .287 |\n').results).toEqual([]);
  });
  it('the df in the t column\'s header, and stars in the t cell read with the table\'s legend', () => {
    const r = run('| Measure | A (n = 20), M (SD) | B (n = 20), M (SD) | t(38) |\n|---|---|---|---|\n| Fatigue | 5.00 (1.00) | 4.00 (1.10) | 3.01** |\n| Comfort | 5.00 (1.00) | 4.95 (1.10) | 0.15 |\n\n*Note.* \\*p < .05, \\*\\*p < .01.\n');
    expect(r.results.map((x) => [x.t.value, x.df?.value, x.p?.op, x.p?.number?.value, x.p?.stars?.basis])).toEqual([
      [3.01, 38, '<', 0.01, 'legend'],
      [0.15, 38, undefined, undefined, undefined],
    ]);
    expect(warnings(r)).toEqual([]);
  });
  it('stars after an exact p in its cell leave the p as printed', () => {
    const r = run('| Measure | t | df | p |\n|---|---|---|---|\n| Fatigue | 3.01 | 38 | .005** |\n');
    expect(r.results[0]?.p?.number?.value).toBe(0.005);
    expect(warnings(r)).toEqual([]);
  });
});

describe('long tables: one group per row', () => {
  it('a test in a row of its own is tied to the groups of its measure\'s block', () => {
    const r = run('| Measure | Group | n | M | SD |\n|---|---|---|---|---|\n| Fatigue | Standing | 20 | 5.00 | 1.00 |\n| | Seated | 20 | 4.00 | 1.10 |\n| | *t*(38) = 3.01, *p* = .005 | | | |\n| Comfort | Standing | 20 | 5.00 | 1.00 |\n| | Seated | 20 | 4.00 | 1.10 |\n| | *t*(38) = 5.20, *p* < .001 | | | |\n');
    expect(r.results.map((x) => x.context.descriptives?.groups.map((g) => g.printed))).toEqual([
      ['Standing | 5.00 | 1.00 | 20', 'Seated | 4.00 | 1.10 | 20'],
      ['Standing | 5.00 | 1.00 | 20', 'Seated | 4.00 | 1.10 | 20'],
    ]);
    expect(warnings(r)).toEqual(['t-follows-from-descriptives/mismatch@8']);
  });
  it('a test in prose right after the table is tied to the block of the measure its sentence names', () => {
    const r = run('| Measure | Group | n | M | SD |\n|---|---|---|---|---|\n| Fatigue | Standing | 20 | 5.00 | 1.00 |\n| | Seated | 20 | 4.00 | 1.10 |\n| Comfort | Standing | 20 | 6.00 | 1.00 |\n| | Seated | 20 | 5.10 | 1.10 |\n\nTable 1 gives the group means. Fatigue was higher when standing, t(38) = 3.01, p = .005. Comfort was higher too, t(38) = 5.20, p < .001.\n');
    expect(r.results.map((x) => x.context.descriptives?.groups[0]?.printed)).toEqual(['Standing | 5.00 | 1.00 | 20', 'Standing | 6.00 | 1.00 | 20']);
    expect(warnings(r)).toEqual(['t-follows-from-descriptives/mismatch@8']);
  });
  it('a measure printed in two blocks ties no sentence to either', () => {
    const r = run('| Measure | Group | n | M | SD |\n|---|---|---|---|---|\n| Fatigue | Standing | 20 | 5.00 | 1.00 |\n| | Seated | 20 | 4.00 | 1.10 |\n| Fatigue | Standing | 20 | 6.00 | 1.00 |\n| | Seated | 20 | 5.10 | 1.10 |\n\nFatigue was higher when standing, t(38) = 5.20, p < .001.\n');
    expect(warnings(r)).toEqual([]);
  });
});

describe('labelled cells in the rows of one measure (text converted from PDF)', () => {
  it('t and P in two rows under a label spanning both, the df in the caption', () => {
    // t(5) = 3.33 gives two-tailed p = .021 (scipy.stats.t.sf, computed for this case); P = 0.50 is neither tail
    const html = '<table><tr><td>t-test</td><td>Plot A</td></tr><tr><td rowspan="2">Cover</td><td>P=0.0208</td></tr><tr><td>t=3.3294</td></tr><tr><td rowspan="2">Height</td><td>P=0.50</td></tr><tr><td>t=3.3294</td></tr></table>';
    const r = run(`Table 1 Paired t-tests of plot cover (df = 5).\n\n${html}\n`);
    expect(r.results.map((x) => [x.t.value, x.df?.value, x.p?.number?.value])).toEqual([
      [3.3294, 5, 0.0208],
      [3.3294, 5, 0.5],
    ]);
    expect(r.findings.filter((f) => f.ruleId === 'p-follows-from-t' || f.ruleId === 'significance-follows-from-t').map((f) => f.level)).toEqual(['error']);
  });
});

describe('whole-number measures declared by name are checked in table rows', () => {
  it('GRIM on a group cell of the row that names the measure (2.39 × 19 = 45.41: no whole sum gives it, hand-checked)', () => {
    const r = run('## Measures\n\nErrors were recorded as whole-number counts.\n\n## Results\n\n| Measure | A (n = 19), M (SD) | B (n = 19), M (SD) | t | df | p |\n|---|---|---|---|---|---|\n| Errors | 2.39 (1.10) | 2.37 (1.07) | 0.06 | 36 | .95 |\n| Speed | 2.39 (1.10) | 2.37 (1.07) | 0.06 | 36 | .95 |\n');
    expect(r.findings.filter((f) => f.ruleId === 'mean-is-possible-for-integers').map((f) => `${f.start.line}:${f.messageId}`)).toEqual(['9:grim-mean']);
  });
});

describe('a p column beside another statistic', () => {
  // invented rows: a χ² test with its p, then a one-sample t whose p the table does not print.
  // t(81) = 6.83 gives a two-tailed p of 4e-9 (scipy.stats.t.sf(6.83, 81) doubled), so reading the
  // χ²'s p = .003 as the t's would flag a consistent row.
  const table = [
    '| Trait | χ²(1) | p | Mean | SD | t(81) |',
    '|---|---|---|---|---|---|',
    '| Warmth | 8.80 | .003 | 55.10 | 6.76 | 6.83 |',
  ].join('\n');
  it('leaves the p to the χ² whose column it follows, so the t gets none and nothing is flagged', () => {
    const r = run(`${table}\n`);
    expect(r.results.map((x) => [x.t.printed, x.df?.printed, x.p?.printed])).toEqual([['6.83', '81', undefined]]);
    expect(warnings(r)).toEqual([]);
  });
  it('the control: without the χ² column the same p is the t\'s, and flagged', () => {
    const r = run('| Trait | p | Mean | SD | t(81) |\n|---|---|---|---|---|\n| Warmth | .003 | 55.10 | 6.76 | 6.83 |\n');
    expect(r.results.map((x) => x.p?.printed)).toEqual(['.003']);
    expect(warnings(r).some((w) => w.startsWith('p-follows-from-t'))).toBe(true);
  });
});

describe('a t column named with its test and its df in brackets', () => {
  // t = 3.01 from the groups above (scipy.stats.ttest_ind_from_stats: 3.008, p = .0046); 4.10 (1.00) against 4.00 (0.60): t = 0.383, p = .70 (the same)
  for (const header of ['Unrelated t-value (38)', 'Independent-samples t (38)', 'Unpaired t (df = 38)', 'Related t-value (38)']) {
    it(`reads "${header}"`, () => {
      const r = run(['| | Standing (n = 20) | Seated (n = 20) | ' + header + ' | p-value (2-t) |', '|---|---|---|---|---|', '| Fatigue | 5.00 (1.00) | 4.00 (1.10) | 3.01 | .005 |', '| Comfort | 4.10 (1.00) | 4.00 (0.60) | 0.38 | .70 |', ''].join('\n'));
      expect(r.results.map((x) => [x.t.value, x.df?.value, x.p?.number?.value])).toEqual([[3.01, 38, 0.005], [0.38, 38, 0.7]]);
    });
  }
});

describe('a CI column: its limits whole, its estimate and its level (invented cases, probing)', () => {
  // Critical t(58): 2.0017 for 95%, 2.6633 for 99% (scipy.stats.t.ppf). Estimate −3.8 with 95% CI
  // −8.2 to 0.6: SE = 4.4 / 2.0017, t = 1.73, p = .089; with 99% CI −8.4 to 0.8: SE = 4.6 / 2.6633,
  // t = 2.20, p = .032 (scipy.stats.t.sf)
  const interval = (r: FileReport) => r.results.map((x) => [x.context.interval?.printed, x.context.estimate?.printed]);
  it('reads a negative lower limit whole, not as an estimate and a limit split at its point', () => {
    for (const cell of ['-8.2 to 0.6', '-8.2, 0.6', '−8.2 to 0.6']) {
      const r = run(`| Outcome | 95% CI | t(58) | p |\n|---|---|---|---|\n| Fatigue | ${cell} | -1.73 | .089 |\n`);
      expect(interval(r)).toEqual([[`95% CI ${cell.replace('−', '-')}`, undefined]]);
      expect(warnings(r)).toEqual([]);
    }
  });
  it('takes the estimate from a Difference column beside it, and checks the centre with it', () => {
    const r = run('| Outcome | Difference | 95% CI | t(58) | p |\n|---|---|---|---|---|\n| Fatigue | -3.8 | -8.2 to 0.6 | -1.73 | .089 |\n| Sleep | -3.8 | -9.2 to 0.6 | -1.73 | .089 |\n');
    expect(interval(r)).toEqual([['95% CI -8.2 to 0.6', 'estimate = -3.8'], ['95% CI -9.2 to 0.6', 'estimate = -3.8']]);
    expect(warnings(r)).toEqual(['ci-agrees-with-result/not-centred@4']);
  });
  it("reads the level from the caption when the header prints none, and otherwise assumes 95% only with a note", () => {
    const table = '| Outcome | Difference (CI) | t(58) | p |\n|---|---|---|---|\n| Fatigue | -3.8 (-8.4 to 0.8) | -2.20 | .032 |\n';
    const at99 = run(`Table 2. Outcomes (99% confidence intervals, for three primary comparisons)\n\n${table}`);
    expect(at99.results[0]?.context.interval?.printed).toBe('99% CI -3.8 (-8.4 to 0.8)');
    expect(at99.findings.filter((f) => f.ruleId === 'ci-agrees-with-result')).toEqual([]);
    const unstated = run(`Table 2. Outcomes at 12 weeks\n\n${table}`);
    expect(unstated.findings.filter((f) => f.ruleId === 'ci-agrees-with-result').map((f) => f.level)).toEqual(['note']);
    const at95 = run(`Table 2. Outcomes (95% confidence intervals)\n\n${table}`);
    expect(warnings(at95)).toEqual(['ci-agrees-with-result/width-vs-t@5']);
  });
});
