import { describe, expect, it } from 'vitest';
import { checkSource, type ResultRecord } from '../../src/engine/index.js';

interface Case {
  name: string;
  markdown: string;
  t: number;
  tOp?: string;
  df?: number;
  dfDecimals?: number;
  pOp?: string;
  p?: number | 'ns';
  pDecimals?: number;
  tails?: 'one' | 'two';
}

// The report styles authors use (common practice, no source), each with what must be read.
const cases: Case[] = [
  { name: 'APA', markdown: 'x, t(28) = 2.10, p = .045.', t: 2.1, df: 28, pOp: '=', p: 0.045, pDecimals: 3 },
  { name: 'no spaces, Unicode minus, bound', markdown: 'x, t(28)=−2.10, p<.05.', t: -2.1, df: 28, pOp: '<', p: 0.05 },
  { name: 'df labelled, capital P', markdown: 'x (t = 2.10, df = 28, P = 0.045).', t: 2.1, df: 28, pOp: '=', p: 0.045 },
  { name: 'df as subscript flattened', markdown: 'x (t28 = 2.10; P = 0.045).', t: 2.1, df: 28, pOp: '=', p: 0.045 },
  { name: 'Welch df', markdown: 'x, t(17.8) = 2.31, p = .033.', t: 2.31, df: 17.8, dfDecimals: 1, pOp: '=', p: 0.033 },
  { name: 'p-value =', markdown: 'x: t = 2.10, df = 28, p-value = 0.045', t: 2.1, df: 28, pOp: '=', p: 0.045 },
  { name: 'p ≤', markdown: 'x, t(40) = 3.10, p ≤ .01.', t: 3.1, df: 40, pOp: '<=', p: 0.01 },
  { name: 'p < .001', markdown: 'x, t(40) = 5.10, p < .001.', t: 5.1, df: 40, pOp: '<', p: 0.001 },
  { name: 'times ten to the power', markdown: 'x, t(40) = 5.93, p = 3.2 × 10^-6.', t: 5.93, df: 40, pOp: '=', p: 3.2e-6, pDecimals: 1 },
  { name: 'HTML superscript exponent', markdown: 'x, t(40) = 5.93, p = 3.2 × 10<sup>−6</sup>.', t: 5.93, df: 40, pOp: '=', p: 3.2e-6 },
  { name: 'e notation', markdown: 'x, t(40) = 5.93, p = 3.2e-6.', t: 5.93, df: 40, pOp: '=', p: 3.2e-6 },
  { name: 'Unicode superscript exponent', markdown: 'x, t(40) = 5.93, p = 3.2 ×10⁻⁶.', t: 5.93, df: 40, pOp: '=', p: 3.2e-6 },
  { name: 'middle-dot decimal', markdown: 'x, t(28) = 2·26, p=0·032.', t: 2.26, df: 28, pOp: '=', p: 0.032, pDecimals: 3 },
  { name: 'p = .000', markdown: 'x, t(28) = 5.90, p = .000.', t: 5.9, df: 28, pOp: '=', p: 0, pDecimals: 3 },
  { name: 'n.s.', markdown: 'x, t(28) = 0.56, n.s.', t: 0.56, df: 28, p: 'ns' },
  { name: 'one-tailed stated', markdown: 'x, t(28) = 1.80, p = .041, one-tailed.', t: 1.8, df: 28, pOp: '=', p: 0.041, tails: 'one' },
  { name: 'two-sided stated before', markdown: 'A two-sided test gave t(28) = 2.10, p = .045.', t: 2.1, df: 28, pOp: '=', p: 0.045, tails: 'two' },
  { name: 'thousands separator in df', markdown: 'x, t(1,200) = 4.37, p < .001.', t: 4.37, df: 1200, pOp: '<', p: 0.001 },
  { name: 'stray space in bracket', markdown: 'x, t( 3.187) = 2.89, p = 0.058.', t: 2.89, df: 3.187, pOp: '=', p: 0.058 },
  { name: 'LaTeX markup', markdown: 'x (\\textit{t}(364) = 0.94, \\textit{p} \\textless{} .35)', t: 0.94, df: 364, pOp: '<', p: 0.35 },
  { name: 'plural with bounds', markdown: 'both ts(22) > 4.72, ps ≤ .0001.', t: 4.72, tOp: '>', df: 22, pOp: '<=', p: 0.0001 },
  { name: 'p = < .001', markdown: 'x (t(47) = 5.21, p = < .001)', t: 5.21, df: 47, pOp: '<', p: 0.001 },
  { name: 'footnote marker glued to p', markdown: 'x, t(82) = 2.00, p = .049.3', t: 2, df: 82, pOp: '=', p: 0.049, pDecimals: 3 },
  { name: 'df after p, labelled', markdown: 't-statistic: 7.89 - p-value: 0.00015 - degrees of freedom: 7.6', t: 7.89, df: 7.6, pOp: '=', p: 0.00015 },
  { name: 'R console', markdown: '```\nt = -2.2251, df = 81.333, p-value = 0.02885\n```', t: -2.2251, df: 81.333, pOp: '=', p: 0.02885 },
  { name: 'square-bracket df', markdown: 'x, t[28] = 2.10, p = .045.', t: 2.1, df: 28, pOp: '=', p: 0.045 },
  { name: 'LaTeX subscript df', markdown: 'x, $t_{28} = 2.10$, $p = .045$.', t: 2.1, df: 28, pOp: '=', p: 0.045 },
  { name: 'decimal commas with a semicolon separator', markdown: 'x, t(54) = −1,41; p = 0,16.', t: -1.41, df: 54, pOp: '=', p: 0.16, pDecimals: 2 },
  { name: 'decimal comma after a lone zero, three digits', markdown: 'x, t(54) = 2,012; p = 0,049.', t: 2.012, df: 54, pOp: '=', p: 0.049, pDecimals: 3 },
  { name: 'bare power of ten as a bound (caret)', markdown: 'x, t(40) = 6.10, P < 10^-6.', t: 6.1, df: 40, pOp: '<', p: 1e-6 },
  { name: 'bare power of ten as a bound (HTML superscript)', markdown: 'x, t(40) = 6.10, p<10<sup>−5</sup>.', t: 6.1, df: 40, pOp: '<', p: 1e-5 },
  { name: 'bare power of ten as a bound (LaTeX)', markdown: 'x, $t(40) = 6.10, p < 10^{-6}$.', t: 6.1, df: 40, pOp: '<', p: 1e-6 },
  { name: 'bare power of ten as a bound (Unicode superscript)', markdown: 'x, t(40) = 6.10, p < 10⁻⁶.', t: 6.1, df: 40, pOp: '<', p: 1e-6 },
  { name: 'power of ten whose superscript a PDF flattened', markdown: 'x, t(40) = 6.10, p < 10−6.', t: 6.1, df: 40, pOp: '<', p: 1e-6 },
  { name: 'written-out label with the df in brackets and p(2-t)', markdown: 'x (Related t-test (31) = 0.75, p(2-t) = 0.46).', t: 0.75, df: 31, pOp: '=', p: 0.46, tails: 'two' },
  { name: 'df named inside the bracket', markdown: 'x, t(df = 31) = 0.75, p = .46.', t: 0.75, df: 31, pOp: '=', p: 0.46 },
  { name: 'p labelled one-tailed in brackets', markdown: 'x, t(30) = 1.80, p (one-tailed) = .041.', t: 1.8, df: 30, pOp: '=', p: 0.041, tails: 'one' },
  { name: 'three stars without a legend: the most lenient common reading (< .01)', markdown: 'x, t(13) = 5.63***.', t: 5.63, df: 13, pOp: '<', p: 0.01 },
  { name: 'stars with a legend', markdown: 'x, t(13) = 5.63***.\n\n*p < .05. **p < .01. ***p < .001.', t: 5.63, df: 13, pOp: '<', p: 0.001 },
];

function only(markdown: string): { r: ResultRecord; source: string } {
  const source = `${markdown}\n`;
  const report = checkSource('x.md', source);
  expect(report.results, JSON.stringify(report.results.map((x) => x.printed))).toHaveLength(1);
  return { r: report.results[0] as ResultRecord, source };
}

describe('report styles', () => {
  it.each(cases)('$name', (c) => {
    const { r, source } = only(c.markdown);
    expect(r.t.value).toBeCloseTo(c.t, 10);
    expect(r.t.op).toBe(c.tOp ?? '=');
    if (c.df !== undefined) expect(r.df?.value).toBeCloseTo(c.df, 10);
    if (c.dfDecimals !== undefined) expect(r.df?.decimals).toBe(c.dfDecimals);
    if (c.p === 'ns') expect(r.p?.kind).toBe('ns');
    else if (c.p !== undefined) {
      expect(r.p?.number?.value).toBeCloseTo(c.p, 12);
      expect(r.p?.op).toBe(c.pOp);
    }
    if (c.pDecimals !== undefined) expect(r.p?.number?.decimals).toBe(c.pDecimals);
    if (c.tails) expect(r.sidedness.value).toBe(c.tails);
    // Every span's characters are the statistic: the number spans hold the printed digits.
    const slice = (s: { span: { start: number; end: number } }) => source.slice(s.span.start, s.span.end);
    expect(slice(r.t).replace('−', '-').replace('·', '.').replace(',', '.')).toBe(r.t.printed);
    if (r.df) expect(slice(r.df)).toBe(r.df.printed);
    if (r.p?.number && r.p.number.exponent === 0 && !r.p.stars) expect(slice(r.p.number).replace('·', '.').replace(',', '.')).toBe(r.p.number.printed);
    expect(slice(r).length).toBeGreaterThan(0);
    expect(source.slice(r.span.start, r.span.start + 1)).toMatch(/^[tT]/);
  });
});

describe('prose that is not a result (no false extractions)', () => {
  const prose = [
    'At time t = 5 min the samples were frozen.',
    'The t-test was chosen because the data were paired.',
    'We report the p-value as a probability, see p. 45 and pp. 12–15.',
    'Expression of p53 rose in treated cells (Table 2).',
    'We set t0 = 0 and measured until t = 67.',
    'Participants wore t-shirts; the p-hacking debate is covered elsewhere.',
    'The critical value was t = 2.069 > 1.714 for a one-tailed test.',
    'Wilcoxon T = 45 was computed for the ranks.',
    'Compute t(x) = 2 for the boundary condition.',
    'The drug reduced pain (F(1, 28) = 4.10, p = .052).',
    'Correlation was moderate, r(28) = .41, p = .024.',
    'Groups 1,2 and 3 were pooled; see sections 2,3.',
  ];
  it.each(prose)('%s', (text) => {
    expect(checkSource('x.md', `${text}\n`).results).toEqual([]);
  });
});

describe('adjusted p values are recognised and labelled, not compared with t', () => {
  const adjusted: Array<{ name: string; markdown: string; method: string }> = [
    { name: 'Bonferroni-corrected in brackets after the p', markdown: 'x, t(40) = 2.10, p = .135 (Bonferroni-corrected).', method: 'bonferroni' },
    { name: 'p_adj subscript', markdown: 'x, t(40) = 2.80, p_adj = .045.', method: 'unspecified' },
    { name: 'Holm-adjusted before the p', markdown: 'x, t(40) = 1.20, Holm-adjusted p = .90.', method: 'holm' },
    { name: 'FDR-corrected after the p', markdown: 'x, t(40) = 2.10, p = .09, FDR-corrected.', method: 'fdr' },
  ];
  it.each(adjusted)('$name', ({ markdown, method }) => {
    const report = checkSource('x.md', `${markdown}\n`);
    expect(report.results).toHaveLength(1);
    expect(report.results[0]?.p?.adjusted?.method).toBe(method);
    expect(report.results[0]?.recomputed).toBeUndefined();
    expect(report.findings.filter((f) => f.level !== 'note')).toEqual([]);
  });
});

describe('a decimal-comma document that groups thousands with points', () => {
  // (1267.7 − 1081.8)/√(201.0²/30 + 139.3²/30) = 4.16 (common practice, no source: Welch's and,
  // with equal n, Student's t)
  const markdown = 'Energy intake was higher with the large plates (M = 1.267,7 kcal; SD = 201,0; n = 30) than with the small ones (M = 1.081,8 kcal; SD = 139,3; n = 30); t(58) = 4,16; p < 0,001.\n';
  it('reads 1.267,7 as 1267.7, so the means give the printed t and nothing is flagged', () => {
    const r = checkSource('x.md', markdown);
    expect(r.results[0]?.context.descriptives?.groups.map((g) => g.printed)).toEqual(['M = 1,267.7 kcal; SD = 201.0; n = 30', 'M = 1,081.8 kcal; SD = 139.3; n = 30']);
    expect(r.findings).toEqual([]);
  });
  it('a point before a comma that is not a thousands group is left alone (t(58) = 4,16 stays 4.16)', () => {
    expect(checkSource('x.md', markdown).results[0]?.t.value).toBe(4.16);
  });
});
