/**
 * `plumbline summarize`: the corpus summary of batch output (src/corpus/summary.ts counts; the
 * CSV and HTML formatters lay it out). The inputs are small invented batch lines whose counts
 * are worked out by hand here, then batch's own output on invented documents. CSV quoting
 * follows RFC 4180; the formula guard is common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import { CorpusTally, GAP_EDGES } from '../../src/corpus/summary.js';
import { documentCsvRow, gapsCsv, rulesCsv } from '../../src/report/summaryCsv.js';
import { formatSummaryHtml } from '../../src/report/summaryHtml.js';
import { checkSource } from '../../src/engine/index.js';
import { formatJson, readJsonReport } from '../../src/report/json.js';
import { cli } from '../cli/harness.js';

const finding = (ruleId: string, level: string, lastDigitUnits?: number) => ({ ruleId, level, ...(lastDigitUnits === undefined ? {} : { gap: { absolute: lastDigitUnits / 100, lastDigitUnits } }) });
const report = (id: unknown, results: number, findings: object[]) => JSON.stringify({ id, path: String(id), results: Array.from({ length: results }, (_, i) => ({ id: `0:${i}` })), findings });

/** Four documents: 10 results in all, 5 findings; one not checked; one line that is not batch output. */
const LINES = [
  report('a', 4, [finding('p-follows-from-t', 'warning', 3), finding('p-follows-from-t', 'note', 0.7), finding('significance-follows-from-t', 'error', 250)]),
  report(7, 0, []),
  JSON.stringify({ id: 'gone', error: 'cannot read: no such file or folder' }),
  report('c, "quoted"', 6, [finding('p-follows-from-t', 'warning', 1000), finding('effect-size-follows', 'warning')]),
  'this is not batch output',
];

function tally() {
  const t = new CorpusTally();
  const rows = LINES.map((l) => t.add(l));
  return { rows, summary: t.summary() };
}

describe('the corpus summary (counting)', () => {
  it('reads lines of report 2.x as 1.x ones: a gap in last-digit units left to be derived', () => {
    // the same document as line a, written as report 2.0.0 writes it (schema/report.schema.json):
    // 3 = 0.03 / (2 × 0.005); 0.7 stated; 250 = 2.5 / (2 × 0.005)
    const v2 = JSON.stringify({
      id: 'a',
      reportVersion: '2.0.0',
      path: 'a',
      results: Array.from({ length: 4 }, (_, i) => ({ id: `0:${i}` })),
      findings: [
        { ruleId: 'p-follows-from-t', level: 'warning', gap: { absolute: 0.03, roundingAllowance: 0.005 } },
        { ruleId: 'p-follows-from-t', level: 'note', gap: { absolute: 0.007, lastDigitUnits: 0.7, roundingAllowance: 0.005 } },
        { ruleId: 'significance-follows-from-t', level: 'error', gap: { absolute: 2.5, roundingAllowance: 0.005 } },
      ],
      texts: [],
    });
    const t = new CorpusTally();
    expect(t.add(v2)).toMatchObject({ id: 'a', results: 4, findings: 3, byLevel: { error: 1, warning: 1, note: 1 } });
    const s = t.summary();
    expect(s.rules.map((r) => r.ruleId)).toEqual(['p-follows-from-t', 'significance-follows-from-t']);
    // 0.7 → [0, 1); 3 → [2, 5); 250 → [100, 1000)
    expect(s.gaps.find((g) => g.ruleId === 'p-follows-from-t')?.counts).toEqual([1, 0, 1, 0, 0, 0, 0]);
    expect(s.gaps.find((g) => g.ruleId === 'significance-follows-from-t')?.counts).toEqual([0, 0, 0, 0, 0, 1, 0]);
  });
  it('reads lines of report 2.1.0, whose gaps leave out what the result gives back, as 1.x ones', () => {
    // invented results whose p their t does not give: gaps of 230 and 19 units of the p's last digit, and one of p < .05
    const file = checkSource('s.md', 'Scores differed, t(23) = 1.12, p = .042. Ratings rose, t(30) = 0.42, p < .05. Mood fell, t(40) = 2.50, p = .21.\n');
    const run = { tool: { name: 'plumbline', version: '0' }, files: [file], failures: [], rules: [] };
    const data = JSON.parse(formatJson(run)) as { reportVersion: string; files: Array<{ findings: Array<{ gap: object }> }> };
    const v2 = JSON.stringify({ id: 'a', reportVersion: data.reportVersion, ...data.files[0] });
    expect(v2).not.toContain('"roundingAllowance":0.0005');
    const { source: _source, ...v1 } = file;
    const counts = (line: string, t: CorpusTally) => (t.add(line), t.summary().gaps);
    const expected = counts(JSON.stringify({ id: 'a', ...v1 }), new CorpusTally());
    expect(expected.find((g) => g.ruleId === 'significance-follows-from-t')?.counts).toEqual([0, 0, 0, 0, 1, 1, 0]);
    expect(counts(v2, new CorpusTally(readJsonReport))).toEqual(expected);
  });

  it('counts documents, results and findings by level, as worked out by hand', () => {
    const { rows, summary: s } = tally();
    expect(rows.map((r) => r.status)).toEqual(['checked', 'checked', 'not-checked', 'checked', 'not-batch-output']);
    expect(rows[0]).toMatchObject({ line: 1, id: 'a', results: 4, findings: 3, byLevel: { error: 1, warning: 1, note: 1 } });
    expect(rows[2]?.reason).toBe('cannot read: no such file or folder');
    expect(s).toMatchObject({ lines: 5, checked: 3, notChecked: 1, unreadable: [5], results: 10, findings: 5, byLevel: { error: 1, warning: 3, note: 1 }, documentsFlagged: 2 });
  });

  it('gives each rule its findings per 100 results of the whole corpus and the documents it spoke in', () => {
    const { summary: s } = tally();
    const p = s.rules.find((r) => r.ruleId === 'p-follows-from-t');
    // 3 findings over 10 results in the corpus: 30 per 100; in documents a and c
    expect(p).toEqual({ ruleId: 'p-follows-from-t', findings: 3, byLevel: { error: 0, warning: 2, note: 1 }, documents: 2, per100Results: 30 });
    expect(s.rules.map((r) => r.ruleId)).toEqual(['effect-size-follows', 'p-follows-from-t', 'significance-follows-from-t']);
    expect(s.rules.find((r) => r.ruleId === 'significance-follows-from-t')?.per100Results).toBe(10);
    expect(new CorpusTally().summary().rules).toEqual([]);
  });

  it('bins gaps in last-digit units, low edge inclusive, and keeps findings without such a gap apart', () => {
    const { summary: s } = tally();
    expect(s.gapBins.map((b) => b.low)).toEqual([...GAP_EDGES]);
    const p = s.gaps.find((g) => g.ruleId === 'p-follows-from-t');
    // 0.7 → [0, 1); 3 → [2, 5); 1000 → [1000, ∞)
    expect(p?.counts).toEqual([1, 0, 1, 0, 0, 0, 1]);
    expect(s.gaps.find((g) => g.ruleId === 'effect-size-follows')).toEqual({ ruleId: 'effect-size-follows', counts: [0, 0, 0, 0, 0, 0, 0], withoutUnits: 1 });
    // 250 → [100, 1000)
    expect(s.gapTotals).toEqual([1, 0, 1, 0, 0, 1, 1]);
    // documents by findings: a has 3, 7 has 0, c has 2
    expect(s.findingsPerDocument.map((b) => b.documents)).toEqual([1, 0, 1, 1, 0, 0, 0]);
  });
});

describe('the corpus summary as CSV and HTML (layout only)', () => {
  it('writes RFC 4180 CSV: quoted fields where needed, CRLF ends, formulas disarmed', () => {
    const { rows, summary: s } = tally();
    expect(rulesCsv(s).split('\r\n')).toEqual([
      'rule,findings,errors,warnings,notes,documents_with_finding,per_100_results',
      'effect-size-follows,1,0,1,0,1,10',
      'p-follows-from-t,3,0,2,1,2,30',
      'significance-follows-from-t,1,1,0,0,1,10',
      '',
    ]);
    expect(documentCsvRow(rows[3]!)).toBe('4,"c, ""quoted""",checked,6,2,0,2,0,\r\n');
    expect(documentCsvRow(rows[2]!)).toBe('3,gone,not-checked,,,,,,cannot read: no such file or folder\r\n');
    expect(documentCsvRow({ line: 1, id: '=HYPERLINK("x")', status: 'checked', results: 0, findings: 0, byLevel: { error: 0, warning: 0, note: 0 } })).toBe(`1,"'=HYPERLINK(""x"")",checked,0,0,0,0,0,\r\n`);
    const gaps = gapsCsv(s).split('\r\n');
    expect(gaps).toContain('p-follows-from-t,1000 or more,1000,,1');
    expect(gaps).toContain('effect-size-follows,no gap in digit units,,,1');
  });

  it('the HTML page loads nothing and runs nothing, escapes what the input says, and plots every rule', () => {
    const t = new CorpusTally();
    t.add(report('<script>alert(1)</script>', 2, [finding('rule-<b>', 'error', 4)]));
    const html = formatSummaryHtml(t.summary(), 'results <x>.ndjson');
    expect(html).toContain(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'`);
    expect(html).not.toMatch(/<script|<link|<img|<iframe|\bsrc=|url\(/i);
    expect(html).not.toMatch(/https?:\/\//);
    expect(html).toContain('results &lt;x&gt;.ndjson');
    expect(html).toContain('rule-&lt;b&gt;');
    // one bar per rule in the rates chart, one per gap bin, one per count bin
    expect(html.match(/<rect class="bar"/g)).toHaveLength(1 + GAP_EDGES.length + 7);
    expect(html).toContain('An inconsistency is a question');
  });
});

describe('plumbline summarize', () => {
  const doc = (id: string, text: string) => JSON.stringify({ id, text });
  const BATCH_IN = [
    doc('one', 'The groups differed, t(46) = 0.84, p = .04.'),
    doc('two', 'No difference, t(30) = 1.20, p = .24.'),
    '',
  ].join('\n');

  it('summarises what batch wrote: CSV tables by --table, HTML with --format html; exit 0', async () => {
    const batch = await cli(['batch', '--jobs', '1'], { stdin: `${BATCH_IN}\n` });
    expect(batch.stdout.split('\n').filter(Boolean)).toHaveLength(3);
    const rules = await cli(['summarize', '-'], { stdin: batch.stdout });
    expect(rules.code).toBe(0);
    // document one: p = .04 cannot come from t(46) = 0.84 (an error); document two is consistent
    expect(rules.stdout).toContain('significance-follows-from-t,1,1,0,0,1,50\r\n');
    const docs = await cli(['summarize', '--table', 'documents', '-'], { stdin: batch.stdout });
    expect(docs.stdout.split('\r\n').slice(1, 4)).toEqual(['1,one,checked,1,1,1,0,0,', '2,two,checked,1,0,0,0,0,', '3,,not-checked,,,,,,line 3 is empty']);
    const html = await cli(['summarize', '--format', 'html', '-'], { stdin: batch.stdout });
    expect(html.stdout).toMatch(/^<!DOCTYPE html>/);
    expect(html.stdout).toContain('<th>Documents not checked</th><td>1</td>');
  });

  it('names lines that are not batch output and exits 2; refuses options that do not apply', async () => {
    const out = await cli(['summarize', '-'], { stdin: '{"id": 1, "results": [], "findings": []}\nnot json\n' });
    expect(out.code).toBe(2);
    expect(out.stderr).toContain('plumbline: standard input:2: not a line of plumbline batch output');
    expect((await cli(['summarize', '--format', 'json', '-'])).stderr).toContain('--format must be one of csv, html for "summarize"');
    expect((await cli(['summarize', '--table', 'gaps', '--format', 'html', '-'])).stderr).toContain('--table chooses a CSV table');
    expect((await cli(['x.md', '--table', 'gaps'])).stderr).toContain('--table applies to summarize only');
    expect((await cli(['summarize'])).stderr).toContain('summarize needs the results file(s)');
    const missing = await cli(['summarize', '/nonexistent/results.ndjson']);
    expect(missing.stderr).toContain('plumbline: cannot read /nonexistent/results.ndjson: no such file or folder');
    expect(missing.code).toBe(2);
  });
});
