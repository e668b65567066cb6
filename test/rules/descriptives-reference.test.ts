import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';

/**
 * Reports built from fixtures/reference/descriptives.json: raw data generated with a seeded
 * numpy PCG64 generator and every statistic computed by scipy.stats (ttest_ind, ttest_1samp,
 * ttest_rel; t.ppf for the CIs), by scripts/make_descriptive_reference.py. Correct reports must
 * pass every rule; each kind of corruption must be found by the rule made for it.
 */
interface Group {
  mean: number;
  sd: number;
  n: number;
}
interface Scenario {
  kind: 'independent' | 'one-sample' | 'paired';
  groups: Group[];
  student?: { t: number; df: number; p: number; ci: [number, number] };
  welch?: { t: number; df: number; p: number };
  test?: { t: number; df: number; p: number; ci?: [number, number] };
  reference?: number;
  difference?: number;
  cohensD?: number;
  correlation?: number;
  dz?: number;
}
const data = JSON.parse(readFileSync(new URL('../../fixtures/reference/descriptives.json', import.meta.url), 'utf8')) as { scenarios: Scenario[] };

const f2 = (x: number) => x.toFixed(2);
const pText = (p: number) => (p < 0.001 ? 'p < .001' : `p = ${p.toFixed(3).replace(/^0/, '')}`);
const group = (g: Group, spread: 'SD' | 'SE' = 'SD', value = g.sd) => `(M = ${f2(g.mean)}, ${spread} = ${f2(value)}, n = ${g.n})`;
const rulesFound = (markdown: string) => checkSource('r.md', `${markdown}\n`).findings.map((f) => `${f.ruleId}/${f.messageId}`);
/** The report was read and its descriptives joined: a silent pass is not a pass. */
function expectLinked(markdown: string, groups: number) {
  const report = checkSource('r.md', `${markdown}\n`);
  expect(report.results).toHaveLength(1);
  expect(report.results[0]?.context.descriptives?.groups).toHaveLength(groups);
}

const independent = data.scenarios.filter((s) => s.kind === 'independent');
const oneSample = data.scenarios.filter((s) => s.kind === 'one-sample');
const paired = data.scenarios.filter((s) => s.kind === 'paired');

describe('two independent groups (scipy.stats.ttest_ind on generated data)', () => {
  it('covers the scenarios', () => expect(independent.length).toBeGreaterThanOrEqual(10));
  const sentence = (s: Scenario, o: { a?: string; b?: string; t?: number; df?: number; d?: number; ci?: [number, number] } = {}) => {
    const st = s.student!;
    const [a, b] = s.groups as [Group, Group];
    const t = o.t ?? st.t;
    const ci = o.ci ?? st.ci;
    return `Staff randomised to office A ${o.a ?? group(a)} or office B ${o.b ?? group(b)} differed, difference = ${f2(s.difference!)}, 95% CI [${f2(ci[0])}, ${f2(ci[1])}], t(${o.df ?? st.df}) = ${f2(t)}, ${pText(st.p)}, d = ${f2(o.d ?? s.cohensD!)}.`;
  };
  it.each(independent.map((s, i) => [i, s] as const))('scenario %i: the correct report passes every rule', (_i, s) => {
    expectLinked(sentence(s), 2);
    expect(checkSource('r.md', sentence(s)).results[0]?.context.interval).toBeDefined();
    expect(rulesFound(sentence(s))).toEqual([]);
  });
  it.each(independent.map((s, i) => [i, s] as const))("scenario %i: Welch's report passes every rule", (_i, s) => {
    const [a, b] = s.groups as [Group, Group];
    const w = s.welch!;
    expect(rulesFound(`Office A ${group(a)} and office B ${group(b)}: Welch's t(${f2(w.df)}) = ${f2(w.t)}, ${pText(w.p)}.`)).toEqual([]);
  });
  it.each(independent.map((s, i) => [i, s] as const))('scenario %i: standard errors labelled SD are found', (_i, s) => {
    const [a, b] = s.groups as [Group, Group];
    const found = rulesFound(sentence(s, { a: group(a, 'SD', a.sd / Math.sqrt(a.n)), b: group(b, 'SD', b.sd / Math.sqrt(b.n)) }));
    expect(found).toContain('spread-kind-matches-t/se-labelled-sd');
  });
  it.each(independent.map((s, i) => [i, s] as const))('scenario %i: a wrong df is found', (_i, s) => {
    expect(rulesFound(sentence(s, { df: s.student!.df - 4 }))).toContain('df-follows-from-n/student');
  });
  it.each(independent.map((s, i) => [i, s] as const))('scenario %i: a t half as large again is found', (_i, s) => {
    expect(rulesFound(sentence(s, { t: s.student!.t * 1.5 }))).toContain('t-follows-from-descriptives/mismatch');
  });
  it.each(independent.map((s, i) => [i, s] as const))('scenario %i: a d a quarter of the true one is found', (_i, s) => {
    expect(rulesFound(sentence(s, { d: s.cohensD! * 0.25 }))).toContain('effect-size-follows/mismatch');
  });
  it.each(independent.map((s, i) => [i, s] as const))('scenario %i: a CI built from the SD instead of the SE is found', (_i, s) => {
    const st = s.student!;
    const half = (st.ci[1] - st.ci[0]) / 2;
    const se = Math.abs(s.difference! / st.t);
    const sdBased: [number, number] = [s.difference! - (half / se) * (se * Math.sqrt(s.groups[0]!.n)), s.difference! + (half / se) * (se * Math.sqrt(s.groups[0]!.n))];
    expect(rulesFound(sentence(s, { ci: sdBased })).some((r) => r.startsWith('ci-agrees-with-result/'))).toBe(true);
  });
});

describe('one sample against a test value (scipy.stats.ttest_1samp on generated data)', () => {
  const sentence = (s: Scenario, o: { spread?: number; df?: number } = {}) => {
    const g = s.groups[0] as Group;
    const t = s.test!;
    return `Scores were compared with the test value of ${s.reference!.toFixed(1)} ${group(g, 'SD', o.spread ?? g.sd)}, t(${o.df ?? t.df}) = ${f2(t.t)}, ${pText(t.p)}, 95% CI [${f2(t.ci![0])}, ${f2(t.ci![1])}], d = ${f2(s.cohensD!)}.`;
  };
  it.each(oneSample.map((s, i) => [i, s] as const))('scenario %i: the correct report passes every rule', (_i, s) => {
    expectLinked(sentence(s), 1);
    expect(checkSource('r.md', sentence(s)).results[0]?.context.reference).toBeDefined();
    expect(rulesFound(sentence(s))).toEqual([]);
  });
  it.each(oneSample.map((s, i) => [i, s] as const))('scenario %i: the SE printed as SD is found', (_i, s) => {
    const g = s.groups[0] as Group;
    expect(rulesFound(sentence(s, { spread: g.sd / Math.sqrt(g.n) }))).toContain('spread-kind-matches-t/se-labelled-sd');
  });
  it.each(oneSample.map((s, i) => [i, s] as const))('scenario %i: df = n is found', (_i, s) => {
    expect(rulesFound(sentence(s, { df: s.test!.df + 1 }))).toContain('df-follows-from-n/one-group');
  });
});

describe('one group measured twice (scipy.stats.ttest_rel on generated data)', () => {
  const sentence = (s: Scenario, o: { t?: number; df?: number; p?: string } = {}) => {
    const [a, b] = s.groups as [Group, Group];
    const t = s.test!;
    return `The same participants were measured before ${group(a)} and after ${group(b)}, paired t(${o.df ?? t.df}) = ${f2(o.t ?? t.t)}, ${o.p ?? pText(t.p)}, d_z = ${f2(s.dz!)}.`;
  };
  it.each(paired.map((s, i) => [i, s] as const))('scenario %i: the correct report passes every rule', (_i, s) => {
    expectLinked(sentence(s), 2);
    expect(checkSource('r.md', sentence(s)).results[0]?.context.design.value).toBe('paired');
    expect(rulesFound(sentence(s))).toEqual([]);
  });
  it.each(paired.map((s, i) => [i, s] as const))('scenario %i: a t too large for the SDs (implied r > 1) is found', (_i, s) => {
    const [a, b] = s.groups as [Group, Group];
    const diff = Math.abs(a.mean - b.mean);
    const gap = Math.abs(a.sd - b.sd);
    if (gap < 0.2) return; // the SDs must differ for a t to be impossibly large at this precision
    const tooLarge = (diff * Math.sqrt(a.n)) / (gap / 2);
    expect(rulesFound(sentence(s, { t: tooLarge, p: 'p < .001' }))).toContain('paired-correlation-is-possible/correlation-above-one');
  });
  it.each(paired.map((s, i) => [i, s] as const))('scenario %i: analysed with df = 2n − 2 is found', (_i, s) => {
    const found = rulesFound(sentence(s, { df: 2 * s.groups[0]!.n - 2 }).replace('paired t', 't'));
    expect(found).toContain('design-matches-analysis/paired-analysed-as-independent');
  });
  it('most scenarios have SDs far enough apart for the impossible-t check above', () => {
    expect(paired.filter((s) => Math.abs(s.groups[0]!.sd - s.groups[1]!.sd) >= 0.2).length).toBeGreaterThanOrEqual(paired.length / 2);
  });
  it('the implied correlation matches the one in the raw data', () => {
    // With unrounded inputs the implied r is the sample correlation (scipy's ttest_rel and numpy's corrcoef).
    for (const s of paired) {
      const [a, b] = s.groups as [Group, Group];
      const sdd = (Math.abs(a.mean - b.mean) * Math.sqrt(a.n)) / Math.abs(s.test!.t);
      const r = (a.sd ** 2 + b.sd ** 2 - sdd ** 2) / (2 * a.sd * b.sd);
      expect(r).toBeCloseTo(s.correlation!, 10);
    }
  });
});
