import { readFileSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import AjvDraft04Module from 'ajv-draft-04';
import { describe, expect, it } from 'vitest';
import { checkSource, RULES } from '../../src/engine/index.js';
import { formatHuman, formatJson, formatSarif, type RunReport } from '../../src/report/index.js';
import { readReport } from '../helpers.js';

const demoPath = 'fixtures/demo/standing-desks.md';
const run = (extra: string[] = []): RunReport => ({
  tool: { name: 'plumbline', version: '0.0.0-test' },
  files: [checkSource(demoPath, readFileSync(demoPath, 'utf8')), ...extra.map((s, i) => checkSource(`extra-${i}.md`, s))],
  failures: [{ path: 'missing.md', message: 'no such file or folder' }],
  rules: RULES.map((r) => ({ id: r.id, summary: r.summary, kind: r.kind, defaultLevel: r.defaultLevel, doc: readFileSync(`rules/${r.id}.md`, 'utf8') })),
});

const hostile = 'Bad \u001b[31mred\u001b]0;title\u0007 text, t(23) = 1.12, p = .42 <script>alert(1)</script> "quote" \\ back\n';

describe('JSON report', () => {
  // The schema is ours (schema/report.schema.json); ajv (npm) validates it as JSON Schema 2020-12.
  const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
  it('validates against schema/report.schema.json, hostile text included', () => {
    const data = JSON.parse(formatJson(run([hostile, 'x, ts(22) > 4.72, ps ≤ .0001.\n'])));
    expect(validate(data), JSON.stringify(validate.errors, null, 1)).toBe(true);
    data.files[0].findings[0].unexpected = 1;
    expect(validate(data)).toBe(false);
  });
  it('holds every result with spans and recomputed values, and every finding as data', () => {
    const data = readReport(formatJson(run()));
    const file = data.files[0];
    expect(file.results).toHaveLength(13);
    const source = readFileSync(demoPath, 'utf8');
    for (const r of file.results) expect(source.slice(r.t.span.start, r.t.span.end)).toBe(r.t.printed);
    const wrong = file.findings.find((f: { ruleId: string }) => f.ruleId === 'significance-follows-from-t');
    expect(wrong.recomputed.quantity).toBe('two-tailed p');
    expect(wrong.recomputed.low).toBeGreaterThan(0.4);
    expect(wrong.gap.lastDigitUnits).toBeGreaterThan(30);
  });
  it('lists F, χ², r and z results with their kind, printed values and spans, valid against the schema', () => {
    // invented text; the p of F(1, 38) = 4.21 is .0470 to .0472 (scipy.stats.f.sf), of z = 3.10 two-tailed .0019 (scipy.stats.norm.sf)
    const text = 'Groups differed, F(1, 38) = 4.21, p = .047, ηp2 = .10, and χ²(2, N = 120) = 6.1, p = .047; the scores correlated, r(48) = .32, p = .02; the indirect effect held, z = 3.10, p = .02.\n';
    const written = formatJson({ tool: { name: 'plumbline', version: '0.0.0-test' }, files: [checkSource('s.md', text)], failures: [], rules: [] });
    expect(validate(JSON.parse(written)), JSON.stringify(validate.errors, null, 1)).toBe(true);
    const data = readReport(written);
    const stats = data.files[0].statistics as Array<{ kind: string; printed: string; span: { start: number; end: number }; value: { printed: string; span: { start: number; end: number } }; dfs?: Array<{ printed: string }>; p?: { printed: string }; recomputed?: { fits: boolean } }>;
    expect(stats.map((s) => s.kind)).toEqual(['F', 'chi-square', 'r', 'z']);
    for (const s of stats) {
      // printed is the text as read (χ² folded to χ^2, as for t results); the span is the source's
      expect(text.slice(s.span.start, s.span.end).replace('χ²', 'χ^2')).toBe(s.printed);
      expect(text.slice(s.value.span.start, s.value.span.end)).toBe(s.value.printed);
    }
    expect(stats[0]?.dfs?.map((d) => d.printed)).toEqual(['1', '38']);
    expect(stats.map((s) => s.recomputed?.fits)).toEqual([true, true, true, false]);
    expect(data.files[0].findings.find((f: { ruleId: string }) => f.ruleId === 'p-follows-from-z').resultId).toBe(data.files[0].statistics[3].id);
  });
  it('is byte-identical for the same input', () => {
    expect(formatJson(run())).toBe(formatJson(run()));
  });
});

// A CommonJS module: its default import is the module, whose `default` is the class.
const AjvDraft04 = AjvDraft04Module.default;

describe('SARIF report', () => {
  // Validated against the OASIS SARIF 2.1.0 schema (test/fixtures/standards/sarif-2.1.0-rtm.5.json);
  // one of its patterns is not valid as a Unicode regular expression, hence unicodeRegExp: false.
  const ajv = new AjvDraft04({ allErrors: true, strict: false, validateFormats: false, unicodeRegExp: false });
  const validate = ajv.compile(JSON.parse(readFileSync('test/fixtures/standards/sarif-2.1.0-rtm.5.json', 'utf8')));
  const log = JSON.parse(formatSarif(run([hostile]), process.cwd()));

  it('validates against the SARIF 2.1.0 schema', () => {
    expect(validate(log), JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
    const broken = structuredClone(log);
    broken.runs[0].results[0].level = 'severe';
    expect(validate(broken)).toBe(false);
  });
  it('lists every rule with help text from its page, and results with exact regions', () => {
    const driver = log.runs[0].tool.driver;
    expect(driver.rules.map((r: { id: string }) => r.id)).toEqual(RULES.map((r) => r.id));
    for (const r of driver.rules) expect(r.help.markdown).toContain(`# ${r.id}`);
    const result = log.runs[0].results.find((r: { ruleId: string }) => r.ruleId === 'significance-follows-from-t');
    const loc = result.locations[0].physicalLocation;
    expect(loc.artifactLocation.uri).toBe('fixtures/demo/standing-desks.md');
    expect(loc.region).toMatchObject({ startLine: 28, startColumn: 12, endLine: 28, endColumn: 36 });
    expect(result.level).toBe('error');
    expect(driver.rules[result.ruleIndex].id).toBe('significance-follows-from-t');
  });
});

describe('human report', () => {
  it('strips terminal control sequences from manuscript text', () => {
    const out = formatHuman(run([hostile]), { color: false });
    expect(out).not.toMatch(/\u001b/);
    expect(out).toContain('Bad ?[31mred?]0;title? text');
  });
  it('colours only when asked', () => {
    expect(formatHuman(run(), { color: true })).toMatch(/\u001b\[31m/);
    expect(formatHuman(run(), { color: false })).not.toMatch(/\u001b/);
  });
  it('carries the cautions and a summary line', () => {
    const out = formatHuman(run(), { color: false });
    expect(out).toContain('not proof of error or misconduct');
    expect(out).toContain('A clean run does not validate a study');
    expect(out).toMatch(/1 file, 13 results found \(12 with p recomputed\), 2 errors, 2 warnings, 3 notes, 1 file not checked/);
  });
});
