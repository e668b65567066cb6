/**
 * The 2.x JSON report (src/report/compact.ts) loses nothing a 1.x reader could read: read back
 * with readJsonReport, every file equals the 1.x text of the same run (the in-memory report as
 * JSON.stringify writes it, which is what 1.5.0 wrote), on manuscripts with every kind of
 * place: t results with descriptives and intervals, F/χ²/r/z, checklist entries, CRLF and
 * byte-order marks, tabs, astral characters, hostile text.
 */
import { readdirSync, readFileSync } from 'node:fs';
import type { ValidateFunction } from 'ajv';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { formatJson, readJsonReport, type RunReport } from '../../src/report/index.js';
import { expandFile, FileEncoder, P_FIGURE_RULES } from '../../src/report/compact.js';
import { manyResults } from '../../bench/corpus.js';
import { readDocxDocument } from '../../src/parse/docx/index.js';
import { readPdf } from '../../src/parse/pdf/index.js';

const runOf = (files: Array<[string, string]>): RunReport => ({
  tool: { name: 'plumbline', version: '0.0.0-test' },
  files: files.map(([path, text]) => checkSource(path, text)),
  failures: [{ path: 'missing.md', message: 'no such file or folder' }],
  rules: [],
});

/** What 1.5.0 wrote for a run: each file without its source, as JSON. */
const v1Files = (run: RunReport) => JSON.parse(JSON.stringify(run.files.map(({ source: _source, ...file }) => file), (_k, v: unknown) => (typeof v === 'number' && !Number.isFinite(v) ? null : v)));

/** schema/report.schema.json compiled once (JSON Schema 2020-12, by ajv). */
let compiled: Promise<ValidateFunction> | undefined;
const reportValidator = () =>
  (compiled ??= import('ajv/dist/2020.js').then(({ Ajv2020 }) => new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')))));

const demo = readFileSync('fixtures/demo/standing-desks.md', 'utf8');
const statistics = 'Groups differed, F(1, 38) = 4.21, p = .047, ηp2 = .10, and χ²(2, N = 120) = 6.1, p = .047; the scores correlated, r(48) = .32, p = .02; the indirect effect held, z = 3.10, p = .02.\n';
const awkward = '\uFEFFIntro\r\n\r\nScores\tdiffered 𝑥, t(23) = 1.12, p = .42, d = 0.9.\rLone CR, t(18) = −2.47, p = .031, 95% CI [−3.1, −0.2]; M = 4.1, SD = 1.2, n = 10; M = 3.0, SD = 1.1, n = 10.\n| t | df | p |\n|---|---|---|\n| 2.10 | 30 | .044 |\n';
const hostile = 'Bad \u001b[31mred\u001b]0;title\u0007 text, t(23) = 1.12, p = .42 <script>alert(1)</script> "quote" \\ back\nx, ts(22) > 4.72, ps ≤ .0001, t(40) = 2.1e1, p < 1e-400.\n';

describe('JSON report 2.x', () => {
  it('reads back into exactly the 1.x files, facts, places, texts and defaults alike', () => {
    const run = runOf([
      ['fixtures/demo/standing-desks.md', demo],
      ['s.md', statistics],
      ['a.md', awkward],
      ['h.md', hostile],
      ['many.md', manyResults(300)],
    ]);
    const data = JSON.parse(formatJson(run));
    expect(data.reportVersion).toBe('2.1.0');
    const read = readJsonReport(data);
    expect(read.files).toEqual(v1Files(run));
    expect(read.failures).toEqual(run.failures);
  });
  it('reads back Word and PDF places with their original, and checklist entries, as 1.x wrote them', async () => {
    // invented files: fixtures/docx/features.docx (scripts/make-docx-fixtures.mjs) and a PDF of the fixtures
    const docx = readDocxDocument('features.docx', new Uint8Array(readFileSync('fixtures/docx/features.docx')));
    const pdf = await readPdf('columns.pdf', new Uint8Array(readFileSync('fixtures/pdf/chromium-columns.pdf')));
    if (!docx.ok || !pdf.ok) throw new Error('the fixtures did not read');
    const run: RunReport = {
      tool: { name: 'plumbline', version: '0.0.0-test' },
      files: [
        checkSource('features.docx', docx.document.source, { document: docx.document, checklist: true }),
        checkSource('columns.pdf', pdf.document.source, { document: pdf.document }),
        checkSource('fixtures/demo/standing-desks.md', demo, { checklist: true }),
      ],
      failures: [],
      rules: [],
    };
    expect(run.files[0]?.original?.kind).toBe('docx');
    expect(run.files[1]?.results.some((r) => r.original !== undefined)).toBe(true);
    expect(run.files[2]?.checklist.length).toBeGreaterThan(0);
    expect(readJsonReport(JSON.parse(formatJson(run))).files).toEqual(v1Files(run));
  });
  it('writes each place as offsets only, and each repeated text once per file', () => {
    const run = runOf([['many.md', manyResults(300)]]);
    const file = JSON.parse(formatJson(run)).files[0];
    const r = file.results[0];
    expect(r.at).toHaveLength(2);
    expect(r).not.toHaveProperty('span');
    expect(r).not.toHaveProperty('start');
    expect(r.t).not.toHaveProperty('exponent');
    expect(new Set(file.texts).size).toBe(file.texts.length);
    // a finding's advice is one index, the same for every finding of its rule and message: written
    // on the first of them (2.1.0), as are a recomputation's quantity and assumptions when they repeat
    const checks = new Map<string, number>();
    for (const f of file.findings) {
      const k = `${f.ruleId}/${f.messageId}`;
      if (checks.has(k)) expect(f).not.toHaveProperty('check');
      else {
        expect(typeof f.check).toBe('number');
        checks.set(k, f.check);
      }
    }
    const read = readJsonReport(JSON.parse(formatJson(run))) as { files: Array<{ findings: Array<{ ruleId: string; messageId: string; check: string }> }> };
    const texts = new Map<string, Set<string>>();
    for (const f of read.files[0]?.findings ?? []) texts.set(`${f.ruleId}/${f.messageId}`, (texts.get(`${f.ruleId}/${f.messageId}`) ?? new Set()).add(f.check));
    expect([...texts.values()].every((s) => s.size === 1)).toBe(true);
  });
  it('is less than half the 1.x text of the same run', () => {
    const run = runOf([['many.md', manyResults(600)]]);
    const v1 = JSON.stringify(v1Files(run)).length;
    // 0.42 of the 1.x text here (600 results); the 60,000-result document of bench figure 14 the same
    expect(formatJson(run).length).toBeLessThan(v1 / 2);
  });
  it('keeps a 1.x report as it is', () => {
    const old = { reportVersion: '1.5.0', files: [{ path: 'x.md', results: [], findings: [] }] };
    expect(readJsonReport(old)).toBe(old);
  });
});

describe('JSON report 2.x on F groups tied through a table or the paragraph before', () => {
  // the generated manuscripts (scripts/generate_manuscripts.py) each name a "Table A1" whose groups an F is tied to
  const generated = readdirSync('fixtures/generated/docs')
    .slice(0, 12)
    .map((f): [string, string] => [`fixtures/generated/docs/${f}`, readFileSync(`fixtures/generated/docs/${f}`, 'utf8')]);
  // four invented cohorts in one paragraph, the F in the next (as in test/rules/f-follows-from-group-summaries.test.ts)
  const before = 'Scores were 12.4 ± 3.1 in the first cohort (n = 22), 14.1 ± 2.8 in the second (n = 25), 13.0 ± 3.5 in the third (n = 20) and 15.2 ± 3.0 in the fourth (n = 23).\n\nA one-way ANOVA showed that the cohorts differed, F(3, 86) = 5.12, p = .017.\n';
  it('reads back tableTie and the previous-paragraph scope as 1.x wrote them, and validates', async () => {
    const run = runOf([...generated, ['before.md', before]]);
    const tied = run.files.flatMap((f) => f.statistics ?? []).filter((st) => JSON.stringify(st).includes('"tableTie"'));
    expect(tied.length).toBeGreaterThan(0);
    expect(JSON.stringify(run.files.at(-1)?.statistics)).toContain('"previous-paragraph"');
    const data = JSON.parse(formatJson(run));
    expect(readJsonReport(data).files).toEqual(v1Files(run));
    const validate = await reportValidator();
    expect(validate(data), JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
  });
});

describe('JSON report 2.x against its schema', () => {
  it('validates, with every kind of place, text and default in it', async () => {
    const validate = await reportValidator();
    const run = runOf([
      ['fixtures/demo/standing-desks.md', demo],
      ['s.md', statistics],
      ['a.md', awkward],
      ['h.md', hostile],
      ['many.md', manyResults(300)],
    ]);
    const data = JSON.parse(formatJson(run));
    expect(validate(data), JSON.stringify(validate.errors?.slice(0, 5), null, 1)).toBe(true);
    // the schema can fail: a place in the 1.x shape is refused
    const r = data.files[0].results[0];
    r.span = { start: r.at[0], end: r.at[1] };
    expect(validate(data)).toBe(false);
  });
});

describe('the 2.x encoding of texts and printed numbers, one by one', () => {
  // a file of invented records, written and read back through the same functions as a report
  const roundTrip = (file: Record<string, unknown>) => {
    const encoder = new FileEncoder('line one\nline two\n');
    const written = JSON.parse(JSON.stringify(encoder.encode(file)));
    return { written, read: expandFile({ ...written, lineStarts: encoder.lineSteps(), texts: encoder.texts }) };
  };
  it('a message with digits is a template and its runs; one holding # is written as it is; one without digits is an index', () => {
    const { written, read } = roundTrip({ findings: [{ message: 'Reported p = .42 from t(23) = 1.12.' }, { message: 'Heading # 2 was read as text.' }, { message: 'the test it belongs to' }] });
    expect(written.findings[0].message).toEqual([expect.any(Number), '.42 23 1.12']);
    expect(written.findings[1].message).toBe('Heading # 2 was read as text.');
    expect(typeof written.findings[2].message).toBe('number');
    expect(read.findings).toEqual([{ message: 'Reported p = .42 from t(23) = 1.12.' }, { message: 'Heading # 2 was read as text.' }, { message: 'the test it belongs to' }]);
  });
  it('cuts any message into the runs of characters that are a digit or a point before a digit, and reads it back whole', () => {
    // the runs by their definition, character by character (DIGIT_RUN in compact.ts is a regular expression)
    const runsOf = (m: string) => {
      const numeric = (i: number) => /[0-9]/.test(m[i] ?? '') || (m[i] === '.' && /[0-9]/.test(m[i + 1] ?? ''));
      const runs: string[] = [];
      for (let i = 0; i < m.length; ) {
        let j = i;
        while (j < m.length && numeric(j)) j += 1;
        if (j > i) runs.push(m.slice(i, j));
        i = Math.max(j, i + 1);
      }
      return runs;
    };
    fc.assert(
      fc.property(fc.array(fc.constantFrom('0', '7', '.', '..', ' ', 'p = ', 'e', '-', '−', '٣', '𝟙', '\n', 'units'), { maxLength: 24 }), (parts) => {
        const message = parts.join('');
        const { written, read } = roundTrip({ findings: [{ message }] });
        expect(read.findings).toEqual([{ message }]);
        const runs = runsOf(message);
        if (runs.length === 0) expect(typeof written.findings[0].message).toBe('number');
        else expect(written.findings[0].message).toEqual([expect.any(Number), runs.join(' ')]);
      }),
      { numRuns: 500 },
    );
  });

  it('a printed number keeps value and decimals unless its plain decimal text gives them exactly', () => {
    const n = (printed: string, value: number, decimals: number, exponent = 0) => ({ printed, value, decimals, exponent });
    const numbers = [n('2.47', 2.47, 2), n('.021', 0.021, 3), n('-3', -3, 0), n('−2.47', -2.47, 2), n('1.5e1', 15, 1, 1), n('1.', 1, 0), n('2.50', 2.5, 2), n('2.5', 2.5, 1)];
    const { written, read } = roundTrip({ results: numbers.map((t) => ({ t })) });
    const kept = (written.results as Array<{ t: Record<string, unknown> }>).map(({ t }) => Object.keys(t).sort().join(' '));
    expect(kept).toEqual(['printed', 'printed', 'printed', 'decimals printed value', 'decimals exponent printed value', 'decimals printed value', 'printed', 'printed']);
    expect((read.results as Array<{ t: unknown }>).map((r) => r.t)).toEqual(numbers);
  });
});

describe('the omissions of report 2.1.0, each written only where its derivation gives back the same value', () => {
  // invented results: a p that its t does not give (significance flips), one printed with <, one with two digits
  const text = 'Scores differed, t(23) = 1.12, p = .042. Ratings rose, t(30) = 0.42, p < .05. Mood fell, t(40) = 2.50, p = .21.\n';
  const written = (run: RunReport) => JSON.parse(formatJson(run)).files[0] as { results: Array<Record<string, Record<string, unknown>>>; findings: Array<Record<string, unknown>> };

  it('leaves out what the result gives back, and reads it back as 1.x wrote it', () => {
    const run = runOf([['s.md', text]]);
    const file = written(run);
    expect(run.files[0]?.findings).toHaveLength(3);
    const [r] = file.results;
    // t, df, p and p's number: their printed is the slice of the result's printed at their offsets
    for (const v of [r?.t, r?.df, r?.p, r?.p?.number as Record<string, unknown>]) {
      expect(v).toHaveProperty('at');
      expect(v).not.toHaveProperty('printed');
    }
    expect(r?.p).not.toHaveProperty('kind');
    expect(r?.p).not.toHaveProperty('op');
    expect(r?.t).not.toHaveProperty('op');
    for (const f of file.findings) {
      expect(f).not.toHaveProperty('at');
      expect(f).not.toHaveProperty('figure');
      expect(f.recomputed).not.toHaveProperty('low');
      expect(f.recomputed).not.toHaveProperty('high');
      expect(f.gap).not.toHaveProperty('absolute');
    }
    // .042 and .21: half a unit of the last digit; p < .05 has no allowance, and says so
    expect(file.findings.map((f) => (f.gap as Record<string, unknown>).roundingAllowance)).toEqual([undefined, null, undefined]);
    expect(readJsonReport(JSON.parse(formatJson(run))).files).toEqual(v1Files(run));
  });

  it('keeps each member where its derivation does not hold', () => {
    const run = runOf([['s.md', text]]);
    const file = run.files[0];
    if (!file) throw new Error('no file');
    const [r0, r1] = file.results;
    const [f0, f1, f2] = file.findings;
    if (!r0 || !r1 || !f0 || !f1 || !f2 || !r0.p || !f0.recomputed || !f0.gap || !f2.gap) throw new Error('the text gave other records');
    // a printed text that is not the slice at the place's offsets; a p of another kind and op
    r0.t.printed = '1.120';
    r0.p.op = '~';
    r1.t.op = '>';
    // a finding at its own place, with its own range, allowance and distance, and one without a picture
    f0.span = { start: f0.span.start + 1, end: f0.span.end };
    f0.start = { line: f0.start.line, column: f0.start.column + 1 };
    f0.recomputed.low += 1e-9;
    f0.gap.roundingAllowance = 0.004;
    f2.gap.absolute += 1e-12;
    delete f1.figure;
    // a check and assumptions of their own, against the finding of the same rule and message before
    f2.check = 'Check the p against the output.';
    if (f2.recomputed) f2.recomputed.assumptions = [...f2.recomputed.assumptions, 'an invented assumption'];
    const w = written(run);
    expect(w.findings[1]).not.toHaveProperty('check');
    expect(typeof w.findings[2]?.check).toBe('number');
    expect(w.findings[1]?.recomputed).not.toHaveProperty('assumptions');
    expect(w.findings[2]?.recomputed).toHaveProperty('assumptions');
    expect(w.results[0]?.t?.printed).toBe('1.120');
    expect(w.results[0]?.p?.op).toBe('~');
    expect(w.results[1]?.t?.op).toBe('>');
    expect(w.findings[0]?.at).toEqual([f0.span.start, f0.span.end]);
    expect(w.findings[0]?.recomputed).toMatchObject({ low: f0.recomputed.low, high: f0.recomputed.high });
    expect(w.findings[0]?.gap).toMatchObject({ roundingAllowance: 0.004 });
    expect(w.findings[1]?.figure).toBeNull();
    expect(w.findings[2]?.gap).toMatchObject({ absolute: f2.gap.absolute });
    expect(w.findings[2]?.gap).not.toHaveProperty('roundingAllowance');
    expect(readJsonReport(JSON.parse(formatJson(run))).files).toEqual(v1Files(run));
  });
});

describe('the default figure table of 2.1.0', () => {
  it('names existing rules, and the docs and the schema list the same ones', () => {
    for (const id of P_FIGURE_RULES) expect(readdirSync('rules')).toContain(`${id}.ts`);
    const docs = readFileSync('docs/output-formats.md', 'utf8');
    const table = docs.slice(docs.indexOf("| rules whose default `figure` is"));
    const rows = table.slice(0, table.indexOf('\n\n')).split('\n').slice(2);
    const listed = rows.flatMap((row) => [...row.matchAll(/`([a-z-]+)`/g)].map((m) => m[1]));
    expect(new Set(listed)).toEqual(new Set(P_FIGURE_RULES));
    const schema = JSON.parse(readFileSync('schema/report.schema.json', 'utf8')) as { $defs: { finding: { properties: { figure: { description: string } } } } };
    const named = [...schema.$defs.finding.properties.figure.description.matchAll(/\b([a-z]+(?:-[a-z]+)+)\b/g)].map((m) => m[1]);
    expect(new Set(named)).toEqual(new Set(P_FIGURE_RULES));
  });
});

describe('a 2.0.0 report read back', () => {
  it('gains none of the members 2.1.0 began to leave out: a p bound keeps its gap without an allowance, and no p figure is made up', () => {
    // an invented result whose p is a bound (no rounding allowance in any version)
    const run = runOf([['s.md', 'Scores rose, t(10) = 1.0, p < .001.\n']]);
    const report = JSON.parse(formatJson(run)) as { reportVersion: string; files: Array<{ results: Array<Record<string, unknown>>; findings: Array<Record<string, unknown>> }> };
    const [file] = report.files;
    const [r] = file?.results ?? [];
    const [f] = file?.findings ?? [];
    const full = run.files[0]?.findings[0];
    if (!r || !f || !full?.gap || !full.recomputed) throw new Error('the text gave other records');
    // as 2.0.0 wrote it: the finding's place, range and distance written out, the gap without
    // roundingAllowance (2.0.0 wrote no null) and the finding without a figure
    f.at = r.at;
    f.recomputed = { ...(f.recomputed as Record<string, unknown>), low: full.recomputed.low, high: full.recomputed.high };
    f.gap = { absolute: full.gap.absolute };
    delete f.figure;
    const read = (version: string) => (readJsonReport({ ...report, reportVersion: version }).files as Array<{ findings: Array<Record<string, unknown>> }>)[0]?.findings[0];
    const old = read('2.0.0');
    expect(old?.gap).toEqual({ absolute: full.gap.absolute });
    expect(old).not.toHaveProperty('figure');
    expect(old?.reported).toBe('t(10) = 1.0, p < .001');
    // the same members read as 2.1.0, where an absent allowance means half the last digit's unit
    expect(read('2.1.0')?.gap).toMatchObject({ roundingAllowance: 0.0005 });
  });
});
