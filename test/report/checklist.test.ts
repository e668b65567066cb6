import { readFileSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';
import { formatChecklist, formatJson } from '../../src/report/index.js';

const check = (path: string, options = {}) => checkSource(path, readFileSync(path, 'utf8'), { checklist: true, ...options });

/** item id → statuses, document entries first, then per result in reading order */
function statuses(report: FileReport): Record<string, string[]> {
  return Object.fromEntries(report.checklist.map((c) => [c.ruleId, c.entries.map((e) => e.status)]));
}

describe('a report that meets every item (fixtures/checklist/complete.md, invented)', () => {
  const report = check('fixtures/checklist/complete.md');
  it('finds every item, with its place', () => {
    expect(statuses(report)).toEqual({
      'spread-kind-is-stated': ['not-applicable'],
      'test-is-named': ['found', 'found'],
      'tails-are-stated': ['found'],
      'alpha-is-stated': ['found'],
      'p-is-exact': ['found', 'found'],
      'p-precision-is-sensible': ['found', 'found'],
      'statistic-has-df': ['found', 'found'],
      'effect-size-with-ci': ['found', 'found'],
      'descriptives-with-n': ['found', 'found'],
      'software-is-named': ['found'],
      'assumptions-are-checked': ['found'],
      'multiple-comparisons-addressed': ['not-applicable'],
      'no-trend-wording': ['not-applicable', 'not-applicable'],
    });
    const software = report.checklist.find((c) => c.ruleId === 'software-is-named')?.entries[0];
    expect(software?.place?.start).toEqual({ line: 17, column: 39 });
    expect(software?.detail).toBe('R 4.4.1');
  });
  it('and gives no finding at all', () => {
    expect(report.findings.map((f) => `${f.start.line} ${f.ruleId}/${f.messageId}`)).toEqual([]);
    expect(report.results).toHaveLength(2);
  });
});

describe('a report that meets none (fixtures/checklist/bare.md, invented)', () => {
  const report = check('fixtures/checklist/bare.md');
  it('marks every item missing where it applies', () => {
    expect(statuses(report)).toEqual({
      'spread-kind-is-stated': ['not-applicable'],
      'test-is-named': ['missing', 'missing', 'missing', 'missing', 'missing'],
      'tails-are-stated': ['missing'],
      'alpha-is-stated': ['missing'],
      'p-is-exact': ['missing', 'found', 'found', 'missing', 'found'],
      'p-precision-is-sensible': ['not-applicable', 'found', 'missing', 'not-applicable', 'found'],
      'statistic-has-df': ['found', 'found', 'found', 'found', 'missing'],
      'effect-size-with-ci': ['missing', 'missing', 'missing', 'missing', 'missing'],
      'descriptives-with-n': ['missing', 'missing', 'missing', 'missing', 'missing'],
      'software-is-named': ['missing'],
      'assumptions-are-checked': ['missing'],
      'multiple-comparisons-addressed': ['missing'],
      'no-trend-wording': ['not-applicable', 'missing', 'not-applicable', 'not-applicable', 'not-applicable'],
    });
  });
  it('prints a Markdown checklist with line references a referee can paste', () => {
    const md = formatChecklist({ tool: { name: 'plumbline', version: '0.0.0-test' }, files: [report], failures: [], rules: [] });
    expect(md).toContain('# Reporting checklist: fixtures/checklist/bare.md');
    expect(md).toContain('| Alpha (the significance level) is stated | ');
    // a missing document item has no line (nothing in the text is the place of an absence)
    expect(md).toMatch(/\| The statistics software and its version are named \| .* \| \*\*missing\*\* \|  \| the version of SPSS \|/);
    expect(md).toContain('1. line 5: t(23) = 2.47, p < .05');
    // one line per item: how many results meet it, and where it is missing (the result named where its line holds others)
    expect(md).toMatch(/\| An exact p is given \(p < \.001 allowed\) \| .* \| 3 of 5 \| lines 5 \(t\(23\) = 2\.47, p < \.05\), 6 \(t\(23\) = 0\.41, n\.s\.\) \|/);
    expect(md).toContain('not proof of error or misconduct');
  });
});

describe('profiles', () => {
  it('CONSORT alone keeps only the items CONSORT asks for', () => {
    const report = check('fixtures/checklist/bare.md', { config: { guidelines: ['consort'] } });
    expect(report.checklist.map((c) => c.ruleId)).toEqual(['test-is-named', 'effect-size-with-ci', 'descriptives-with-n']);
    expect(report.guidelines).toEqual(['consort']);
  });
  it('item levels come from configuration', () => {
    const report = check('fixtures/checklist/bare.md', { config: { rules: { 'p-is-exact': 'error' } } });
    expect(report.findings.filter((f) => f.ruleId === 'p-is-exact').map((f) => f.level)).toEqual(['error', 'error']);
  });
  it('the checklist is off unless asked for', () => {
    const report = checkSource('x.md', readFileSync('fixtures/checklist/bare.md', 'utf8'));
    expect(report.checklist).toEqual([]);
    expect(report.findings.some((f) => f.ruleId === 'alpha-is-stated')).toBe(false);
  });
});

describe('the checklist in the JSON output', () => {
  it('validates against schema/report.schema.json', () => {
    const validate = new Ajv2020({ allErrors: true, strict: false }).compile(JSON.parse(readFileSync('schema/report.schema.json', 'utf8')));
    const data = JSON.parse(formatJson({ tool: { name: 'plumbline', version: '0' }, files: [check('fixtures/checklist/bare.md'), check('fixtures/checklist/complete.md')], failures: [], rules: [] }));
    expect(validate(data), JSON.stringify(validate.errors?.slice(0, 3))).toBe(true);
    expect(data.files[0].checklist.length).toBeGreaterThan(10);
  });
});

describe('the per-result items read F, χ², r and z results too, in reading order with the t-tests (invented manuscripts)', () => {
  const entries = (text: string, ruleId: string) =>
    checkSource('s.md', text, { checklist: true }).checklist.find((c) => c.ruleId === ruleId)?.entries.map((e) => `${e.status} ${e.detail}`);
  // each p below follows from its statistic over the printed rounding (scipy.stats f.sf, chi2.sf, norm.sf, t.sf)
  const text = 'Recall improved, t(28) = 2.10, p = .045. Mood differed across the rooms, F(2, 57) = 4.31, p < .05; '
    + 'choice of seat depended on the hour, χ²(2, N = 120) = 7.10, n.s.; sleep tracked mood, r = .32, p = .023; the ratings rose, z = 2.10, p = .036.\n';

  it('an exact p: missing where a bound above .001 or n.s. is printed, found for p = x', () => {
    expect(entries(text, 'p-is-exact')).toEqual(['found p = .045', 'missing p < .05', 'missing "n.s."', 'found p = .023', 'found p = .036']);
  });
  it("the statistic with its df: both of an F's, a χ²'s; an r without df or n is missing; a z has none", () => {
    expect(entries(text, 'statistic-has-df')).toEqual([
      'found df = 28',
      'found df = 2, 57',
      'found df = 2',
      'missing r = .32, p = .023 without its degrees of freedom or n',
      'not-applicable z has no degrees of freedom',
    ]);
  });
  it('an F without any df, and an r without df or n, are missing', () => {
    expect(entries('Mood differed, F = 4.31, p = .018, and sleep tracked mood, r = .32, p = .023.', 'statistic-has-df')).toEqual([
      'missing F = 4.31, p = .018 without its two degrees of freedom',
      'missing r = .32, p = .023 without its degrees of freedom or n',
    ]);
    expect(entries('Sleep tracked mood, r = .32, n = 50, p = .023.', 'statistic-has-df')).toEqual(['found n = 50 (df = n − 2)']);
  });
  it('an effect size with its CI: an F or χ² only, an F without one missing, a χ² without one read not applicable (not every effect size of a χ² is read)', () => {
    expect(entries(text, 'effect-size-with-ci')).toEqual([
      'missing t(28) = 2.10, p = .045 without an effect size or a confidence interval',
      'missing F(2, 57) = 4.31, p < .05 without an effect size or a confidence interval',
      'not-applicable no effect size read beside the χ² (φ, V and odds ratios are read; others are not)',
    ]);
    expect(entries('Mood differed across the rooms, F(2, 57) = 4.31, p = .018, ηp2 = .13, 90% CI [.01, .26].', 'effect-size-with-ci')).toEqual(['found ηp2 = .13, 90% CI [.01, .26]']);
    expect(entries('Mood differed across the rooms, F(2, 57) = 4.31, p = .018, ηp2 = .13.', 'effect-size-with-ci')).toEqual(['missing F(2, 57) = 4.31, p = .018 with ηp2 = .13 but without a confidence interval']);
    expect(entries('Choice of seat depended on the hour, χ²(1, N = 120) = 5.10, p = .024, V = .21, 95% CI [.05, .37].', 'effect-size-with-ci')).toEqual(['found V = .21, 95% CI [.05, .37]']);
    // φ and V are read as the χ²'s own association (rule association-follows-from-chi-square)
    expect(entries('Choice of seat depended on the hour, χ²(1, N = 120) = 5.10, p = .024, φ = .21.', 'effect-size-with-ci')).toEqual(['missing χ^2(1, N = 120) = 5.10, p = .024 with φ = .21 but without a confidence interval']);
  });
  it('the Markdown checklist counts them, names their lines and lists them among the results read', () => {
    const report = checkSource('s.md', text, { checklist: true });
    const md = formatChecklist({ tool: { name: 'plumbline', version: '0.0.0-test' }, files: [report], failures: [], rules: [] });
    expect(md).toContain('1 t-test result and 4 F, χ², r or z results found.');
    expect(md).toMatch(/\| An exact p is given \(p < \.001 allowed\) \| .* \| 3 of 5 \| line 1 \(F\(2, 57\) = 4\.31, p < \.05; χ\^2\(2, N = 120\) = 7\.10, n\.s\.\) \|/);
    expect(md).toContain('2. line 1: F(2, 57) = 4.31, p < .05');
    expect(md).toContain('5. line 1: z = 2.10, p = .036');
  });
});
