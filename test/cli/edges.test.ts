/**
 * Numbers at the edges, through the real CLI (issue 18): scientific notation in t and df, p
 * values beyond the double range, a t of hundreds of digits, negative p values, and files in
 * UTF-32 or with a stray UTF-16 mark. Every manuscript is invented. Where a row says a p fits
 * or not, the value comes from mpmath at 60 digits (fixtures/reference/t-log-tail.json,
 * scripts/make_t_log_reference.py) unless it says otherwise.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { cli } from './harness.js';
import { readReport } from '../helpers.js';

// every report is checked against the JSON report's own schema (schema/report.schema.json, with ajv from npm)
const reportSchema = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));

interface Finding { ruleId: string; messageId: string; start: { line: number; column: number }; gap?: Record<string, unknown> }
interface Json { summary: { results: number }; files: Array<{ results: Array<{ t: { value: number; log10?: number }; p?: { number?: { value: number; log10?: number } } }>; findings: Finding[] }> }

async function check(name: string, bytes: string | Buffer): Promise<Json> {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-edges-'));
  writeFileSync(join(dir, name), bytes);
  const out = await cli([name, '-f', 'json'], { cwd: dir });
  expect(out.stderr).toBe('');
  const json: unknown = readReport(out.stdout);
  expect(reportSchema(JSON.parse(out.stdout)), JSON.stringify(reportSchema.errors)).toBe(true);
  return json as Json;
}
const found = (r: Json) => (r.files[0]?.findings ?? []).map((f) => `${f.start.line}:${f.start.column} ${f.ruleId}/${f.messageId}`);

interface Row { name: string; text: string; results: number; expect: string[] }

const NINES = '9'.repeat(400);
const rows: Row[] = [
  // 1.5e1 = 15; t(10) = 15 gives p of about 3e-8 (mpmath, from memory of its order; any p < .001 fits)
  { name: 't in scientific notation is read whole, not cut at the e', text: 'The groups differed, t(10) = 1.5e1, p < .001.\n', results: 1, expect: [] },
  { name: 'df in scientific notation is read whole', text: 'The groups differed, t(1.2e1) = 6.1, p < .001.\n', results: 1, expect: [] },
  // t(12) = 34: log10 p = −12.574 (mpmath row "34", "12"), so p = 2.67e-13; 3.35e1 to 3.45e1 give 2.24e-13 to 3.18e-13
  { name: 'R output with t = 3.4e+01 is found and a fitting p is accepted', text: '```\nt = 3.4e+01, df = 12, p-value = 2.7e-13\n```\n', results: 1, expect: [] },
  { name: "R output as the issue prints it: 2.1e-13 is outside 2.24e-13 to 3.18e-13, a true finding", text: 'The difference held, t = 3.4e+01, df = 12, p-value = 2.1e-13.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  // t(8000) = 45.2: log10 p = −396.80 (mpmath), p = 1.57e-397
  { name: 'p below the double range that fits its t is accepted (compared as log10 p)', text: 'The groups differed, t(8000) = 45.2, p = 1.6e-397.\n', results: 1, expect: [] },
  // t(1000) = 80: log10 p = −436.18 (mpmath)
  { name: 'a bound below the double range that holds is accepted, and is no bound at zero', text: 'The groups differed, t(1000) = 80.0, p < 2.2e-400.\n', results: 1, expect: [] },
  { name: 'p = 1e-400 against a p of 1.6e-397 is a true finding, not a zero p', text: 'The groups differed, t(8000) = 45.2, p = 1e-400.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  { name: 'a 400-digit t is read as itself (no p a double holds), and p < .001 fits it', text: `The groups differed, t(10) = ${NINES}, p < .001.\n`, results: 1, expect: [] },
  { name: 'a 400-digit t with p = .03 is a true finding (its p is about 10^-4000)', text: `The groups differed, t(10) = ${NINES}, p = .03.\n`, results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  { name: 'a run of 401 digits is no t at all (never read in part)', text: `The groups differed, t(10) = ${NINES}9, p = .03.\n`, results: 0, expect: [] },
  { name: 'p = −.05 (Unicode minus) is read and is impossible', text: 'The groups differed, t(10) = 2.50, p = −.05.\n', results: 1, expect: ['1:36 values-are-possible/p-negative'] },
  { name: 'p = -0 is read and is impossible (not a p printed as zero)', text: 'The groups did not differ, t(10) = 0.50, p = -0.\n', results: 1, expect: ['1:42 values-are-possible/p-negative'] },
  { name: 'p < -.05 is a bound no p meets', text: 'The groups differed, t(10) = 2.50, p < -.05.\n', results: 1, expect: ['1:36 values-are-possible/p-below-zero-bound'] },
  // exponents of four digits and more, read whole. t(28) = 2e1000: log10 p = −27988.99, and
  // 2.5e1000 gives −27991.71 (mpmath, beyondDoubleRows), so p = 1e-27989 lies within rounding
  { name: 'a t of 2e1000 is read whole (not as 2) and compared in log space: p = 1e-27989 fits', text: 'The groups differed, t(28) = 2e1000, p = 1e-27989.\n', results: 1, expect: [] },
  { name: 'a t of 2e1000 with p = 1e-4000 is a true finding (its p is about 10^-27989)', text: 'The groups differed, t(28) = 2e1000, p = 1e-4000.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  { name: 'a t of 2e1000 with p < .001 fits', text: 'The groups differed, t(28) = 2e1000, p < .001.\n', results: 1, expect: [] },
  // t(28) = 2.10 gives p = 0.0449 (scipy.stats.t.sf, doubled): 1e-4000 is a true finding, read as 1e-4000, not 1e-400
  { name: 'p = 1e-4000 is read whole', text: 'The groups differed, t(28) = 2.10, p = 1e-4000.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  // exponents of ten digits and more (issue 18): read whole, compared in log space. t(10) = 2.50
  // gives p of about .031 (scipy.stats.t.sf, doubled, from memory of its order): a true finding
  { name: 'an exponent of ten digits is read whole: p = 1e-4000000000 against t(10) = 2.50 is a true finding', text: 'The groups differed, t(10) = 2.50, p = 1e-4000000000.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  { name: 'p = 1e-12345678901 (eleven digits) is read whole, and against t(10) = 2.50 is a true finding', text: 'The groups differed, t(10) = 2.50, p = 1e-12345678901.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  // t(28) = 1e357142857 stands for 0.5e357142857 to 1.5e357142857: log10 p from −9999999981.50 to
  // −9999999968.14 (mpmath at 60 digits, the large-t tail 2·C·df^((df+1)/2)·|t|^(−df)/df, whose
  // relative error df/t² is below 10^-700000000 there)
  { name: 'a p with a ten-digit exponent that fits its t is accepted (log space, no false finding)', text: 'The groups differed, t(28) = 1e357142857, p = 1e-9999999975.\n', results: 1, expect: [] },
  { name: 'a p < bound with a ten-digit exponent that the t meets is accepted', text: 'The groups differed, t(28) = 1e357142857, p < 1e-9999999960.\n', results: 1, expect: [] },
  { name: 'a p with a ten-digit exponent outside its t\'s range is a true finding', text: 'The groups differed, t(28) = 1e357142857, p = 1e-9999999990.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  { name: 'a p written 10^-12345678901 is read whole too', text: 'The groups differed, t(10) = 2.50, p = 10^-12345678901.\n', results: 1, expect: ['1:22 p-follows-from-t/mismatch'] },
  { name: 'an exponent of more digits than a double holds exactly is read, and its p left with a note', text: 'The groups differed, t(10) = 2.50, p = 1e-123456789012345678.\n', results: 1, expect: ['1:22 p-follows-from-t/not-recomputed'] },
  { name: 'an exponent of 401 digits is not read in part: that p is not read (the result gets the note for a missing p)', text: `The groups differed, t(10) = 2.50, p = 1e-${'4'.repeat(401)}.\n`, results: 1, expect: ['1:22 result-is-complete/p-missing'] },
  { name: 'a t with an exponent of ten digits is not read as its mantissa', text: 'The groups differed, t(28) = 2e1000000000, p < .001.\n', results: 0, expect: [] },
  // t(df) for df beyond a double: no df any computation takes, so no recomputed p and no finding
  // resting on one (with a real df of 10^400, t = 2.10 gives the normal's p = .0357 and .20 would not fit)
  { name: 'a df of 1e400 gives no false finding, only the note that its p was not recomputed', text: 'The groups differed, t(1e400) = 2.10, p = .036.\n', results: 1, expect: ['1:22 p-follows-from-t/not-recomputed'] },
  { name: 'a df of 1e400 gives no finding about its p, which cannot be recomputed, only the note', text: 'The groups differed, t(1e400) = 2.10, p = .20.\n', results: 1, expect: ['1:22 p-follows-from-t/not-recomputed'] },
  // dfs of ten digits and more (issue 18): read, not recomputed, said in a note
  { name: 'a df of ten digits is read, and its p is left with a note', text: 'The groups differed, t(1234567890) = 2.10, p = .20.\n', results: 1, expect: ['1:22 p-follows-from-t/not-recomputed'] },
  { name: 'a df of eleven digits given as df = … is read too', text: 'The groups differed, t = 2.10, df = 12345678901, p = .036.\n', results: 1, expect: ['1:22 p-follows-from-t/not-recomputed'] },
  { name: 'a df of nine digits is still recomputed (t(123456789) = 2.10: normal p .0357, scipy.stats.norm.sf doubled, from memory)', text: 'The groups differed, t(123456789) = 2.10, p = .036.\n', results: 1, expect: [] },
  { name: 'a df of 400 digits is read whole, and its p left with a note', text: `The groups differed, t(1${'0'.repeat(399)}) = 2.10, p = .20.\n`, results: 1, expect: ['1:22 p-follows-from-t/not-recomputed'] },
  { name: 'a df of 401 digits is no df read (never read in part), and gives no finding', text: `The groups differed, t(1${'0'.repeat(400)}) = 2.10, p = .20.\n`, results: 0, expect: [] },
];

// a table's p column has a pattern of its own (src/extract/tables.ts): the same edges through it
const TABLE = `| Measure | t | df | p |
| --- | --- | --- | --- |
| Sleep | 2.10 | 28 | −.05 |
| Mood | 2.10 | 28 | -0 |
| Pace | 2.10 | 28 | 1e-4000 |
| Grip | 2e1000 | 28 | < .001 |
| Reach | 2e1000 | 28 | 1e-27989 |
`;

// the df column, a `t (df)` cell and a `t(df)` header read dfs as prose does (DF_NUM): ten digits
// and more read whole (no p recomputed, a note), 401 digits not read at all, never cut
const DF_TABLE = `| Measure | t | df | p |
| --- | --- | --- | --- |
| Sleep | 2.10 | 1234567890 | .20 |
| Mood | 2.10 | 12,345,678,901 | .036 |
| Pace | 2.10 | 1${'0'.repeat(399)} | .20 |
| Reach | 2.10 | 123456789 | .036 |
| Step | 2.10 | 1e400 | .20 |
| Grip | 2.10 | 1${'0'.repeat(400)} | .20 |

| Measure | t (df) | p |
| --- | --- | --- |
| Gait | 2.10 (1234567890) | .20 |

| Measure | t(12345678901) | p |
| --- | --- | --- |
| Tone | 2.10 | .20 |
`;

describe('numbers at the edges, through the CLI', () => {
  for (const row of rows) {
    it(row.name, async () => {
      const r = await check('paper.md', row.text);
      expect(r.summary.results).toBe(row.results);
      expect(found(r)).toEqual(row.expect);
      // JSON stays within its schema's types: no null where a number belongs
      for (const f of r.files[0]?.findings ?? []) for (const v of Object.values(f.gap ?? {})) expect(typeof v).toBe('number');
    });
  }

  it('in a table: a negative p (Unicode minus too) and -0 reach values-are-possible; 1e-4000 and a t of 2e1000 are read whole', async () => {
    const r = await check('table.md', TABLE);
    expect(r.summary.results).toBe(5);
    // Sleep and Mood: impossible p; Pace: t(28) = 2.10 gives p = 0.0449 (scipy), so 1e-4000 is a
    // true finding; Grip and Reach fit (mpmath, beyondDoubleRows, as in the rows above)
    expect(found(r)).toEqual(['3:23 values-are-possible/p-negative', '4:22 values-are-possible/p-negative', '5:10 p-follows-from-t/mismatch']);
    const ps = r.files[0]?.results.map((x) => x.p?.number?.log10) ?? [];
    expect(ps).toEqual([undefined, undefined, -4000, undefined, -27989]);
    expect(r.files[0]?.results.map((x) => x.t.log10)).toEqual([undefined, undefined, undefined, expect.closeTo(1000.30103, 5), expect.closeTo(1000.30103, 5)]);
  });

  it('in a table, dfs of ten digits and more are read whole as in prose: not recomputed, with a note', async () => {
    const r = await check('table.md', DF_TABLE);
    const results = r.files[0]?.results as Array<{ df?: { value: number; printed: string } }>;
    expect(results.map((x) => x.df?.printed)).toEqual(['1234567890', '12,345,678,901', `1${'0'.repeat(399)}`, '123456789', '1e400', undefined, '1234567890', '12345678901']);
    // t(123456789) = 2.10: normal p .0357 (scipy.stats.norm.sf doubled, from memory), so .036 fits
    expect(found(r).filter((f) => f.includes('p-follows-from-t'))).toEqual(['3:11 p-follows-from-t/not-recomputed', '4:10 p-follows-from-t/not-recomputed', '5:10 p-follows-from-t/not-recomputed', '7:10 p-follows-from-t/not-recomputed', '12:10 p-follows-from-t/not-recomputed', '16:10 p-follows-from-t/not-recomputed']);
  });

  it('a p beyond the double range keeps its size in the JSON (value 0, log10 −400)', async () => {
    const r = await check('paper.md', 'The groups differed, t(8000) = 45.2, p = 1e-400.\n');
    expect(r.files[0]?.results[0]?.p?.number).toMatchObject({ value: 0, log10: -400 });
  });

  it('a 400-digit t is written as the largest double with its log10 (JSON has no Infinity)', async () => {
    const r = await check('paper.md', `The groups differed, t(10) = ${NINES}, p < .001.\n`);
    expect(r.files[0]?.results[0]?.t).toMatchObject({ value: Number.MAX_VALUE, log10: 400 });
  });
});

describe('encodings at the edges, through the CLI (byte-order marks of the Unicode Standard, common practice, no source)', () => {
  // p = .31 with t(10) = 2.50 (two-tailed p about .031, from memory): the decision flips, and that finding shows the text was read
  const WRONG = 'The groups differed, t(10) = 2.50, p = .31.\n';
  const encodings: Array<{ name: string; bytes: Buffer; expect: string[] }> = [
    { name: 'UTF-32 LE with its byte-order mark is decoded', bytes: Buffer.concat([Buffer.from([0xff, 0xfe, 0, 0]), Buffer.from(WRONG, 'utf16le').reduce((acc, _b, i, all) => (i % 2 === 0 ? Buffer.concat([acc, Buffer.from([all[i] as number, all[i + 1] as number, 0, 0])]) : acc), Buffer.alloc(0))]), expect: ['1:22 significance-follows-from-t/mismatch'] },
    { name: 'UTF-32 BE with its byte-order mark is decoded', bytes: Buffer.concat([Buffer.from([0, 0, 0xfe, 0xff]), ...[...WRONG].map((c) => Buffer.from([0, 0, 0, c.charCodeAt(0)]))]), expect: ['1:22 significance-follows-from-t/mismatch'] },
    { name: 'UTF-8 after stray bytes FF FE is read as UTF-8, with a note', bytes: Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(WRONG, 'utf8')]), expect: ['1:1 input-is-readable/encoding-guessed', '1:24 significance-follows-from-t/mismatch'] },
    { name: 'UTF-16 LE with its mark is still UTF-16 (it has NUL bytes)', bytes: Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(WRONG, 'utf16le')]), expect: ['1:22 significance-follows-from-t/mismatch'] },
  ];
  for (const e of encodings) {
    it(e.name, async () => {
      expect(found(await check('paper.md', e.bytes))).toEqual(e.expect);
    });
  }
});
