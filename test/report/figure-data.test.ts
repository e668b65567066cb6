/**
 * The numbers findings carry for their pictures (`figure`), through the real CLI's JSON on an
 * invented manuscript: described by the report schema, and each new number checked against a
 * source outside plumbline.
 */
import { readFileSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { cli } from '../cli/harness.js';
import { readReport } from '../helpers.js';

const P_FILE = 'test/fixtures/pictures/p-values.md';
const OTHER_FILE = 'test/fixtures/pictures/other-quantities.md';

type Figure = Record<string, unknown> & { kind: string };
type Data = { files: Array<{ path: string; findings: Array<{ ruleId: string; figure?: Figure }> }> };

/** The report as written (raw, for the schema) and as a program reads it (readJsonReport). */
async function written(...files: string[]): Promise<{ raw: Data; data: Data }> {
  const out = (await cli(['--format', 'json', ...files])).stdout;
  return { raw: JSON.parse(out), data: readReport(out) };
}

async function json(...files: string[]): Promise<Data> {
  return (await written(...files)).data;
}

describe('the figure data in the JSON report', () => {
  it('is described by the report schema', async () => {
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    const { raw, data } = await written(P_FILE, OTHER_FILE);
    expect(validate(raw), JSON.stringify(validate.errors, null, 1)).toBe(true);
    const kinds = new Set(data.files.flatMap((f) => f.findings.map((x) => x.figure?.kind)).filter(Boolean));
    expect([...kinds].sort()).toEqual(['correlation', 'df', 'interval', 'lattice', 'p']);
    const broken = structuredClone(raw);
    (broken.files[1]!.findings[0]!.figure as Record<string, unknown>).kind = 'pie';
    expect(validate(broken)).toBe(false);
  });
});

describe('the numbers of each figure', () => {
  it('agree with sources outside plumbline', async () => {
    const findings = (await json(OTHER_FILE)).files[0]!.findings;
    const figureOf = (ruleId: string) => findings.find((f) => f.ruleId === ruleId)?.figure as unknown;

    // t(30) = 2.24 with estimate 2.2 and a 95% CI: the interval t implies is 2.2 ± 2.042 × 2.2 / 2.24
    // (2.042: NIST/SEMATECH e-Handbook §1.3.6.7.2, df = 30, upper tail 0.025, from memory of the
    // table as in test/stats/tDistribution.test.ts), each end over the rounding of 2.2 and 2.24
    const ci = figureOf('ci-agrees-with-result') as { level: number; estimate: { low: number; high: number }; fromT: { lower: { low: number; high: number }; upper: { low: number; high: number } } };
    expect(ci.level).toBe(0.95);
    const half = (est: number, t: number) => (2.042 * est) / t;
    expect(ci.fromT.lower.low).toBeCloseTo(2.15 - half(2.25, 2.235), 3);
    expect(ci.fromT.lower.high).toBeCloseTo(2.25 - half(2.15, 2.245), 3);
    expect(ci.fromT.upper.low).toBeCloseTo(2.15 + half(2.15, 2.245), 3);
    expect(ci.fromT.upper.high).toBeCloseTo(2.25 + half(2.25, 2.235), 3);

    // n1 + n2 − 2 = 20 + 22 − 2 = 40, Student's df (common practice, no source), against the printed 44
    expect(figureOf('df-follows-from-n')).toEqual({ kind: 'df', reported: { low: 44, high: 44 }, allowed: [{ label: 'n1 + n2 − 2', low: 40, high: 40 }] });

    // a mean of 13 whole numbers is a multiple of 1/13 (Brown & Heathers 2017, the GRIM test):
    // 2.47 lies between 32/13 = 2.4615… and 33/13 = 2.5385… (exact fractions)
    expect(figureOf('mean-is-possible-for-integers')).toMatchObject({ kind: 'lattice', denominator: 13, possible: [31 / 13, 32 / 13, 33 / 13, 34 / 13] });

    // r = (SD1² + SD2² − SDd²) / (2·SD1·SD2) with SDd = |M2 − M1|·√n / t, from
    // Var(X − Y) = Var X + Var Y − 2 Cov(X, Y) (common practice, no source):
    // 2.8·√15 / 9.5 = 1.1415 and r = (1 + 9 − 1.3030) / 6 = 1.4495 lie inside the implied range
    const r = figureOf('paired-correlation-is-possible') as { implied: { low: number; high: number } };
    const sdd = (2.8 * Math.sqrt(15)) / 9.5;
    const point = (1 + 9 - sdd * sdd) / 6;
    expect(point).toBeGreaterThan(r.implied.low);
    expect(point).toBeLessThan(r.implied.high);
    expect(r.implied.low).toBeGreaterThan(1);
  });

  it('a finding about p draws the p of its result; one with nothing to draw has no figure', async () => {
    const data = await json(P_FILE, 'fixtures/demo/hand-hygiene.md');
    const all = data.files.flatMap((f) => f.findings);
    for (const f of all.filter((x) => x.ruleId === 'p-follows-from-t' || x.ruleId === 'zero-p-is-a-bound')) expect(f.figure).toEqual({ kind: 'p' });
    for (const f of all.filter((x) => x.ruleId === 'design-matches-analysis' || x.ruleId === 'spread-kind-matches-t')) expect(f.figure).toBeUndefined();
    expect(all.some((x) => x.ruleId === 'design-matches-analysis')).toBe(true);
  });
});
