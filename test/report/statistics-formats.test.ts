/**
 * Findings on F, χ², r and z results in each format people and dashboards read: the place, the
 * rule id, the message, and in SARIF the rule's metadata and page address. One invented
 * manuscript holds one result of each kind, each with something to say.
 */
import { readFileSync } from 'node:fs';
import AjvDraft04Module from 'ajv-draft-04';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { countRun, formatHtml, formatHuman, formatJson, formatLines, readJsonReport, type RunReport } from '../../src/report/index.js';
import { cli } from '../cli/harness.js';
import { readReport } from '../helpers.js';

// Invented. The recomputed p values, over the printed rounding: t(28) = 2.10 two-tailed .0444 to .0453
// (scipy.stats.t.sf); F(1, 38) = 4.21 upper tail .0470 to .0472 (scipy.stats.f.sf), so .030 is off;
// χ²(2) = 6.1 upper tail .0462 to .0486 (scipy.stats.chi2.sf), so .030 is off; r(48) = .31 two-tailed
// .0259 to .0375 as df, .0292 to .0418 as n (scipy.stats.t.sf with t = r√(df/(1 − r²))), half that one-tailed,
// so .001 is off either way; z = 3.10 two-tailed .0019 (scipy.stats.norm.sf), so .02 is off either way.
const TEXT = [
  'Recall improved, t(28) = 2.10, p = .045.',
  'Groups differed, F(1, 38) = 4.21, p = .030.',
  'Choices differed, χ²(2, N = 120) = 6.1, p = .030.',
  'The scores correlated, r(48) = .31, p = .001.',
  'The indirect effect held, z = 3.10, p = .02.',
  '',
].join('\n');

/** line:column of the first occurrence of `at` (1-based, UTF-16 columns). */
function placeOf(at: string): { line: number; column: number } {
  const i = TEXT.indexOf(at);
  const before = TEXT.slice(0, i);
  return { line: before.split('\n').length, column: i - before.lastIndexOf('\n') };
}

const EXPECTED = [
  { at: 'F(1, 38)', ruleId: 'p-follows-from-f' },
  { at: 'χ²(2', ruleId: 'p-follows-from-chi-square' },
  { at: 'r(48)', ruleId: 'p-follows-from-r' },
  { at: 'z = 3.10', ruleId: 'p-follows-from-z' },
].map((e) => ({ ...e, ...placeOf(e.at) }));

const report = checkSource('paper.md', TEXT);
const run: RunReport = { tool: { name: 'plumbline', version: '0.0.0-test' }, files: [report], failures: [], rules: [] };

describe('one F, χ², r and z finding each, in every format (invented manuscript)', () => {
  it('the engine gives exactly these findings, at the statistic, tied to its result', () => {
    expect(report.findings.map((f) => ({ ruleId: f.ruleId, line: f.start.line, column: f.start.column }))).toEqual(EXPECTED.map(({ ruleId, line, column }) => ({ ruleId, line, column })));
    const ids = new Set((report.statistics ?? []).map((s) => s.id));
    for (const f of report.findings) expect(ids.has(f.resultId ?? '')).toBe(true);
  });

  it('lines: path:line:column, level, rule id, the message and what to check, one line each', () => {
    const out = formatLines(run).trimEnd().split('\n');
    expect(out).toHaveLength(EXPECTED.length);
    out.forEach((line, i) => {
      const e = EXPECTED[i] as (typeof EXPECTED)[number];
      const f = report.findings[i];
      expect(line.startsWith(`paper.md:${e.line}:${e.column}: ${f?.level} ${e.ruleId} `)).toBe(true);
      expect(line).toContain(' — check: ');
    });
    expect(out[1]).toContain('from χ² = 6.1 (read as 6.05 to 6.15), df = 2');
  });

  it('human: each finding under its line:column and rule id, the text underlined, the count of results by kind', () => {
    const out = formatHuman(run, { color: false });
    for (const e of EXPECTED) {
      expect(out).toContain(`  ${`${e.line}:${e.column}`.padEnd(8)} `);
      expect(out).toMatch(new RegExp(`${e.line}:${e.column}\\s+\\w+\\s+${e.ruleId}\\n`));
      expect(out).toContain(`${e.line} | ${TEXT.split('\n')[e.line - 1]}`);
    }
    // messages are wrapped at the terminal's width, with an indent of four
    expect(out.replace(/\n {4}(?=\S)/g, ' ')).toContain('r = .31 (read as 0.305 to 0.315)');
    expect(out).toContain('1 t-test result and 4 F, χ², r or z results found (5 with p recomputed)');
  });

  it('SARIF through the command line: valid 2.1.0, regions at the statistic, each rule described with its page', async () => {
    const outcome = await cli(['--format', 'sarif', '-', '--stdin-name', 'paper.md'], { stdin: TEXT });
    const log = JSON.parse(outcome.stdout);
    // validated against the OASIS SARIF 2.1.0 schema (test/fixtures/standards/sarif-2.1.0-rtm.5.json), as in formats.test.ts
    const AjvDraft04 = AjvDraft04Module.default;
    const validate = new AjvDraft04({ allErrors: true, strict: false, validateFormats: false, unicodeRegExp: false }).compile(JSON.parse(readFileSync('test/fixtures/standards/sarif-2.1.0-rtm.5.json', 'utf8')));
    expect(validate(log), JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
    const results = log.runs[0].results as Array<{ ruleId: string; ruleIndex: number; locations: Array<{ physicalLocation: { region: { startLine: number; startColumn: number } } }>; message: { text: string } }>;
    const rules = log.runs[0].tool.driver.rules as Array<{ id: string; helpUri?: string; shortDescription: { text: string }; help: { markdown: string } }>;
    expect(results.map((r) => r.ruleId)).toEqual(EXPECTED.map((e) => e.ruleId));
    results.forEach((r, i) => {
      const e = EXPECTED[i] as (typeof EXPECTED)[number];
      expect(r.locations[0]?.physicalLocation.region).toMatchObject({ startLine: e.line, startColumn: e.column });
      const rule = rules[r.ruleIndex];
      expect(rule?.id).toBe(e.ruleId);
      expect(rule?.helpUri).toMatch(new RegExp(`^https://\\S+/rules/${e.ruleId}\\.md$`));
      expect(rule?.help.markdown.startsWith(`# ${e.ruleId}\n`)).toBe(true);
    });
  });

  it('JSON: the summary counts them beside the t results, each carries its tails, and the report meets its schema', () => {
    const written = formatJson(run);
    const data = readReport(written);
    // ajv (npm) validates against our schema as JSON Schema 2020-12, as in formats.test.ts
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    expect(validate(JSON.parse(written)), JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
    expect(data.summary).toMatchObject({ results: 1, checked: 1, statistics: 4, statisticsChecked: 4 });
    expect(countRun(run)).toMatchObject({ statistics: 4, statisticsChecked: 4 });
    const statistics = data.files[0].statistics as Array<{ kind: string; sidedness: { value: string; basis: string } }>;
    expect(statistics.map((st) => st.kind)).toEqual(['F', 'chi-square', 'r', 'z']);
    // nothing in the text says one-tailed: the default applies
    for (const st of statistics) expect(st.sidedness).toEqual({ value: 'two', basis: 'default' });
  });

  it('HTML: each p finding on an F, χ², r or z has its p strip on its card, drawn from the statistic\'s own record', () => {
    const html = formatHtml(run);
    const cards = html.split('<details class="card').slice(1);
    expect(cards).toHaveLength(EXPECTED.length);
    for (const card of cards) expect(card).toContain('<svg class="pstrip"');
    expect(report.findings.every((f) => f.figure?.kind === 'p')).toBe(true);
  });
});

describe('JSON: an F with its groups and a z with its coefficient carry those ties (invented manuscript)', () => {
  // the F and groups of rules/f-follows-from-group-summaries.md (NIST/SEMATECH e-Handbook example, from memory);
  // the z of rules/z-follows-from-coefficient.md (0.42 / 0.15 = 2.80)
  const text = [
    'The three rooms differed in recall (quiet: M = 5.34, SD = 1.12, n = 5; music: M = 7.72, SD = 1.10, n = 5; noise: M = 8.56, SD = 1.38, n = 5), F(2, 12) = 9.59, p = .003.',
    '',
    'Dosage predicted relapse, b = 0.42, SE = 0.15, z = 2.80, p = .005.',
    '',
  ].join('\n');
  const file = checkSource('ties.md', text);
  const written = formatJson({ tool: { name: 'plumbline', version: '0.0.0-test' }, files: [file], failures: [], rules: [] });
  const data = readReport(written);
  it('meets the schema, and each tie says its basis and certainty', () => {
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    expect(validate(JSON.parse(written)), JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
    const [f, z] = data.files[0].statistics as Array<{ kind: string; groups?: { scope: string; certain: boolean; groups: Array<{ printed: string; spreadKind: string }> }; coefficient?: { printed: string; basis: string; certain: boolean } }>;
    expect(f?.kind).toBe('F');
    expect(f?.groups).toMatchObject({ scope: 'sentence', certain: true });
    expect(f?.groups?.groups.map((g) => g.spreadKind)).toEqual(['SD', 'SD', 'SD']);
    expect(z?.kind).toBe('z');
    expect(z?.coefficient).toMatchObject({ printed: 'b = 0.42', basis: 'clause', certain: true });
    expect(file.findings.filter((x) => x.level !== 'note')).toEqual([]);
  });
});


describe('JSON: an F tied to groups in a table it names, and to groups in the paragraph before (invented manuscript)', () => {
  // the groups of rules/f-follows-from-group-summaries.md (NIST/SEMATECH e-Handbook example, from
  // memory; F(2, 12) = 9.59), printed once in a table and once in a paragraph of their own
  const text = [
    'Table 2. Recall by room.',
    '',
    '| Room | n | M | SD |',
    '|---|---|---|---|',
    '| Quiet | 5 | 5.34 | 1.12 |',
    '| Music | 5 | 7.72 | 1.10 |',
    '| Noise | 5 | 8.56 | 1.38 |',
    '',
    'Recall differed by room (Table 2), F(2, 12) = 9.59, p = .003.',
    '',
    'On the retest, recall was 5.34 (SD = 1.12, n = 5) in the quiet room, 7.72 (SD = 1.10, n = 5) with music and 8.56 (SD = 1.38, n = 5) with noise.',
    '',
    'On the retest recall differed by room, F(2, 12) = 9.59, p = .003.',
    '',
  ].join('\n');
  const file = checkSource('table-ties.md', text);
  const data = JSON.parse(formatJson({ tool: { name: 'plumbline', version: '0.0.0-test' }, files: [file], failures: [], rules: [] }));
  it('meets the schema, and says which table, which words named it and what the F named', () => {
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    expect(validate(data), JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
    // the 2.x text is validated as written, and read in the 1.x shape the facts are described in
    const [inTable, before] = (readJsonReport(data) as { files: Array<{ statistics: unknown }> }).files[0]?.statistics as Array<{ groups?: { scope: string; certain: boolean; tableTie?: { name: string; named: { printed: string; basis: string; start: { line: number; column: number } }; outcome: { by: string; words: string[] } } } }>;
    expect(inTable?.groups).toMatchObject({ scope: 'table', certain: true, tableTie: { name: 'Table 2', named: { printed: 'Table 2', basis: 'sentence', start: { line: 9, column: 26 } }, outcome: { by: 'caption', words: ['recall', 'room'] } } });
    expect(before?.groups).toMatchObject({ scope: 'previous-paragraph', certain: true });
    expect(before?.groups?.tableTie).toBeUndefined();
    expect(file.findings.filter((x) => x.ruleId === 'f-follows-from-group-summaries')).toEqual([]);
  });
});
