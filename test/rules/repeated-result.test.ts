import { describe, expect, it } from 'vitest';
import { checkSource, type FileReport } from '../../src/engine/index.js';
import { extract } from '../../src/extract/index.js';
import { parseDocument } from '../../src/parse/index.js';
import { timePoints } from '../../src/extract/topic.js';
import { expectLinearCheck } from '../helpers.js';

/**
 * repeated-result-agrees ties a result of an abstract to the one result elsewhere with its df
 * and sign. The df alone does not make them one comparison: an abstract reports other outcomes,
 * time points and subgroups of the same sample, whose tests share the df, and its comparison may
 * stand in the results only in a table without t. The words around both must agree for a
 * warning; otherwise the finding is a note that says why. Invented cases; every p is two-tailed
 * from its t and df by scipy 1.17.1 (scipy.stats.t.sf), as noted beside each block.
 */
const run = (markdown: string): FileReport => checkSource('x.md', `${markdown}\n`);
const levels = (r: FileReport, rule: string) => r.findings.filter((f) => f.ruleId === rule).map((f) => f.level);
const of = (markdown: string) => levels(run(markdown), 'repeated-result-agrees');
const messages = (markdown: string) => run(markdown).findings.filter((f) => f.ruleId === 'repeated-result-agrees').map((f) => f.message);

describe('a result repeated in the abstract', () => {
  // t(58) = 1.68: two-tailed p = .098, one-tailed .049; t(58) = 2.18: p = .033; t(58) = 0.91: p = .367 (scipy.stats.t.sf)
  it('only under a heading that is an abstract, not "Summary of secondary outcomes"', () => {
    expect(of('## Results\n\n### Primary outcome\n\nAsthma control was better with retraining, t(58) = 2.18, p = .033.\n\n### Summary of secondary outcomes\n\nInhaler technique was similar, t(58) = 0.91, p = .367.')).toEqual([]);
    expect(of('## Summary\n\nAsthma control was better with retraining, t(58) = 0.91, p = .367.\n\n## Results\n\nAsthma control was better with retraining, t(58) = 2.18, p = .033.')).toEqual(['warning']);
  });
  it('a p labelled one-tailed agrees with the two-tailed p at twice its value', () => {
    expect(of('## Abstract\n\nAdherence was higher with goal-setting, t(58) = 1.68, one-tailed p = .049.\n\n## Results\n\nAdherence was higher with goal-setting, t(58) = 1.68, p = .098.')).toEqual([]);
  });
  it('the groups named the other way round, or a Welch df printed whole, are the same result', () => {
    expect(of('## Abstract\n\nContinence improved more with supervised training, t(69) = 2.36, p = .021.\n\n## Results\n\nContinence was 18.2 with the leaflet and 21.0 with supervised training, t(69) = -2.36, p = .021. Quality of life did not differ, t(69) = 0.50, p = .62.')).toEqual([]);
    expect(of("## Abstract\n\nGrip strength was greater after therapy, t(44) = 1.75, p = .087.\n\n## Results\n\nGrip strength was greater after therapy, Welch's t(43.68) = 1.75, p = .087. Hand function also differed, t(44) = 1.10, p = .277.")).toEqual([]);
  });
  it('in a report of several studies, a mismatch is a note', () => {
    expect(of('## Abstract\n\nIn Experiment 2, retrieval practice improved transfer, t(87) = 2.31, p = .023.\n\n## Experiment 1\n\nTransfer was higher after retrieval practice, t(87) = 1.22, p = .226.')).toEqual(['note']);
  });
});


describe('the words around an abstract\'s result and the one with its df', () => {
  // t(98) = 2.50: p = .014; 1.50: .137; 2.03: .045; 2.58: .011 (scipy.stats.t.sf)
  it('name the same measure in other words: a warning', () => {
    expect(of('## Abstract\n\nExercise reduced fatigue, t(98) = 2.50, p = .014.\n\n## Results\n\nFatigue was lower with exercise than with usual care, t(98) = 1.50, p = .137.')).toEqual(['warning']);
  });
  it('name other measures: a note that names the words', () => {
    // t(58) = 2.18: p = .033; 0.91: .367
    const text = '## Abstract\n\nNausea relief was greater with acupressure (t(58) = 2.18, p = .033).\n\n## Results\n\n| Outcome | Acupressure M (SD) | Sham M (SD) | p |\n|---|---|---|---|\n| Nausea relief | 24.1 (5.0) | 21.2 (5.3) | .033 |\n\nPatient satisfaction did not differ (M = 10.2, SD = 2.5 vs M = 9.6, SD = 2.6; t(58) = 0.91, p = .367).';
    expect(of(text)).toEqual(['note']);
    expect(messages(text)[0]).toContain('"nausea", "relief", "acupressure" are not beside');
  });
  it('name different time points of one unit: a note; the same point, or points of different units, a warning', () => {
    expect(of('## Abstract\n\nAt 12 months, craving was lower with counselling, t(98) = 2.03, p = .045.\n\n## Results\n\nAt 6 months, craving was lower with counselling, t(98) = 2.58, p = .011.')).toEqual(['note']);
    expect(of('## Abstract\n\nAt 12 months, craving was lower with counselling, t(98) = 2.03, p = .045.\n\n## Results\n\nAt twelve months, craving was lower with counselling, t(98) = 2.58, p = .011.')).toEqual(['warning']);
    expect(of('## Abstract\n\nAt 12 weeks, craving was lower with counselling, t(98) = 2.03, p = .045.\n\n## Results\n\nAt 3 months, craving was lower with counselling, t(98) = 2.58, p = .011.')).toEqual(['warning']);
  });
  it('name different sexes, or a group the other excludes: a note', () => {
    // t(78) = 2.20: p = .031; 1.40: .166; t(118) = 3.46: p < .001; 2.40: .018
    expect(of('## Abstract\n\nIn women, training improved balance, t(78) = 2.20, p = .031.\n\n## Results\n\nIn men, balance improved more with training, t(78) = 1.40, p = .166.')).toEqual(['note']);
    const subgroup = '## Abstract\n\nAmong residents with dementia, pharmacist review improved medication appropriateness, t(118) = 3.46, p < .001.\n\n## Results\n\nIn residents without dementia, medication appropriateness was higher after pharmacist review, t(118) = 2.40, p = .018.';
    expect(of(subgroup)).toEqual(['note']);
    expect(messages(subgroup)[0]).toContain('("without dementia")');
  });
  it('a table row is read with its label and its table\'s caption', () => {
    // t(58) = 2.50: p = .015; 2.18: .033
    const table = (caption: string) => `## Abstract\n\nNausea relief at 24 hours was greater with acupressure, t(58) = 2.50, p = .015.\n\n## Results\n\n${caption}\n\n| Outcome | t | df | p |\n|---|---|---|---|\n| Nausea relief | 2.18 | 58 | .033 |`;
    expect(of(table('Table 2. Outcomes at 24 hours with acupressure.'))).toEqual(['warning']);
    expect(of(table('Table 2. Outcomes at 6 hours with acupressure.'))).toEqual(['note']);
  });
  it('a "Summary" in a discussion that cites another trial: a note', () => {
    // t(68) = 3.41: p = .001; 2.09: .040
    expect(of('## Results\n\nChildren in the outdoor-play group accumulated more minutes of activity (M = 40.2, SD = 8.0) than controls (M = 36.1, SD = 8.4), n = 35 per group, t(68) = 2.09, p = .040.\n\n## Discussion\n\n### Summary\n\nThis effect was smaller than in an earlier trial of preschool outdoor time, which reported t(68) = 3.41, p = .001, with the same sample size.')).toEqual(['note']);
  });
});

describe('the review\'s cases: true mismatches the words must not hide', () => {
  // t(98) = 2.50: p = .014; 1.50: .137; 2.03: .045; 2.58: .011; t(58) = 3.10: .003; 2.10: .040 (scipy.stats.t.sf)
  it('a control arm "without exercise", or groups "with and without dyslexia", is the comparison, not an exclusion', () => {
    expect(of('## Abstract\n\nExercise reduced fatigue, t(98) = 2.50, p = .014.\n\n## Results\n\nFatigue was lower in patients who exercised than in patients without exercise, t(98) = 1.50, p = .137.')).toEqual(['warning']);
    expect(of('## Abstract\n\nChildren with dyslexia read more slowly than children without dyslexia, t(58) = 3.10, p = .003.\n\n## Results\n\nReading speed was lower in children with dyslexia than in typical readers, t(58) = 2.10, p = .040.')).toEqual(['warning']);
  });
  it('a time point in another clause of the results sentence is not the result\'s', () => {
    expect(of('## Abstract\n\nAt 12 months, craving was lower with counselling, t(98) = 2.03, p = .045.\n\n## Results\n\nCraving was lower with counselling at the final visit, t(98) = 2.58, p = .011, having been similar at 6 months.')).toEqual(['warning']);
  });
  it('"This difference …" is read with the sentence before it', () => {
    expect(of('## Abstract\n\nExercise reduced fatigue, t(98) = 2.50, p = .014.\n\n## Results\n\nFatigue scores averaged 4.1 with exercise and 4.6 with usual care. This difference between the arms was statistically significant, t(98) = 1.50, p = .137.')).toEqual(['warning']);
  });
  it('near variants that are other comparisons: a year against months, older against younger adults', () => {
    expect(of('## Abstract\n\nAt one year, craving was lower with counselling, t(98) = 2.03, p = .045.\n\n## Results\n\nAt 6 months, craving was lower with counselling, t(98) = 2.58, p = .011.')).toEqual(['note']);
    expect(of('## Abstract\n\nIn older adults, training improved balance, t(78) = 2.20, p = .031.\n\n## Results\n\nIn younger adults, balance improved more with training, t(78) = 1.40, p = .166.')).toEqual(['note']);
  });
});

describe('the second review\'s cases', () => {
  // t(118) = 2.40: p = .018; 2.04: .043; t(98) = 2.85: p = .005; 2.58: .011 (scipy.stats.t.sf)
  it('age words of different kinds ("Adolescents", "Young people") do not clash', () => {
    expect(of('## Abstract\n\nAdolescents who used the app reported less loneliness than controls, t(118) = 2.40, p = .018.\n\n## Results\n\nYoung people who used the app reported less loneliness than controls (M = 20.1, SD = 5.0, n = 60 and M = 22.0, SD = 5.2, n = 60), t(118) = 2.04, p = .043.')).toEqual(['warning']);
  });
  it('a clause that points back ("and this difference was significant") takes its sentence\'s time point', () => {
    expect(of('## Abstract\n\nAt 6 months, pain was lower with physiotherapy than with usual care, t(98) = 2.85, p = .005.\n\n## Results\n\nAt 12 months, pain was lower with physiotherapy than with usual care, and this difference was significant, t(98) = 2.58, p = .011.')).toEqual(['note']);
  });
});

describe('an abstract beside a long table with a long caption', () => {
  // the caption's words are read once per table, not once per row
  const make = (n: number) => `## Abstract\n\nNausea relief was greater with acupressure, t(58) = 2.50, p = .015.\n\n## Results\n\nTable 2. ${Array.from({ length: n }, (_, i) => `outcome${i} measured at visit ${(i % 9) + 1}`).join(' ')}.\n\n| Outcome | t | df | p |\n|---|---|---|---|\n${Array.from({ length: n }, (_, i) => `| Nausea item ${i} | 2.18 | 58 | .033 |`).join('\n')}\n`;
  it('twice the rows and caption cost less than three times the time', () => {
    expectLinearCheck('caption and rows', make, 1000);
  }, 120_000);
});

describe('time points', () => {
  it('are read in digits, in words and as ordinals, with the unit before or after, and are not durations (common practice, no source)', () => {
    expect(timePoints('At 12 months and at the 6-month visit')).toEqual(['month 12', 'month 6']);
    expect(timePoints('after six weeks, at week 8 and at the fourth visit')).toEqual(['week 6', 'week 8', 'visit 4']);
    expect(timePoints('for several months, and weeks later')).toEqual([]);
    // durations: the length of a study or a programme
    expect(timePoints('randomised for ten weeks (12 weeks in all) to a 12-week programme')).toEqual([]);
    expect(timePoints('at the 12-week follow-up, and the 6-month assessment')).toEqual(['week 12', 'month 6']);
    // a year is twelve months
    expect(timePoints('at one year and after 2 years')).toEqual(['month 12', 'month 24']);
  });
});

describe('an abstract beside thousands of results with its df', () => {
  // the words of each sentence are read once for all its tests, and an abstract's result at most
  // a few hundred characters back: twice the results cost less than three times the time
  const unit = (i: number) => `craving at visit ${1 + (i % 9)} was lower with counselling, t(98) = ${(1 + (i % 150) / 100).toFixed(2)}, p = .${String(10 + (i % 80)).padStart(3, '0')}`;
  const make = (separator: string) => (n: number) => `## Abstract\n\n${Array.from({ length: Math.max(1, n / 10) }, (_, i) => unit(i)).join(', ')}.\n\n## Results\n\n${Array.from({ length: n }, (_, i) => unit(i + 7)).join(separator)}.\n`;
  for (const [name, separator] of [['one sentence', ', '], ['one paragraph of sentences', '. Then ']] as const) {
    it(name, () => {
      expectLinearCheck(name, make(separator), 1000);
      expect(extract(parseDocument('x.md', make(separator)(50))).topics.length).toBe(55);
    }, 120_000);
  }
});
