import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { LeadReader, leadStart, topicWords } from '../../src/extract/topic.js';
import { expectLinearCheck } from '../helpers.js';

/**
 * Thousands of results in one paragraph, or in one sentence, cost time in proportion to their
 * number: every per-result step (the lead of each test, a df stated before it, the statements of
 * its sentence, its clause, its descriptives, design and sample sizes, quiet comments) reads what
 * it needs once per sentence or paragraph, not once per result. Invented text; the values vary
 * so that no two results print alike.
 */
const value = (i: number) => ({ df: 10 + (i % 80), t: (1 + (i % 300) / 100).toFixed(2), p: `.${String(10 + (i % 89)).padStart(3, '0')}` });
const doc = (body: string) => `# Results\n\n${body}\n`;
const SHAPES: Record<string, { make: (n: number) => string; n: number; each?: (r: ReturnType<typeof checkSource>['results'][number]) => void }> = {
  'one sentence of bracketed results': {
    make: (n) => doc(`${Array.from({ length: n }, (_, i) => { const x = value(i); return `t(${x.df}) = ${x.t}, p = ${x.p}`; }).join(', ')}.`),
    n: 1500,
  },
  'one paragraph of one-result sentences': {
    make: (n) => doc(Array.from({ length: n }, (_, i) => { const x = value(i); return `Scores rose, t(${x.df}) = ${x.t}, p = ${x.p}.`; }).join(' ')),
    n: 1500,
  },
  'one sentence of results with descriptives, intervals, effect sizes, tails and alpha': {
    make: (n) => doc(`${Array.from({ length: n }, (_, i) => { const x = value(i); return `in the ward group (M = 4.${i % 10}, SD = 1.2, n = 20) t(${x.df}) = ${x.t}, p = ${x.p}, d = 0.${30 + (i % 50)}, 95% CI [0.10, 0.90] with α = .05 one-tailed`; }).join(', ')}.`),
    n: 300,
    // each tails word goes to the test nearest to it, each effect size to its own clause
    each: (r) => {
      expect(r.sidedness.basis).toBe('sentence');
      expect(r.context.effectSizes).toHaveLength(1);
    },
  },
  'one sentence of counts with percentages after a part and a side test, beside results': {
    // each count after "80 responded" and "of them" looks back for numbers and parts once per sentence
    make: (n) => doc(`Of 120 patients, 80 responded and normality was checked with the Shapiro–Wilk test at α = .10; ${Array.from({ length: n }, (_, i) => { const x = value(i); return `${10 + (i % 60)} (${20 + (i % 50)}%) of them, t(${x.df}) = ${x.t}, p = ${x.p}`; }).join(', ')}.`),
    n: 1500,
  },
  'one sentence of labelled t values without a df': {
    make: (n) => doc(`With 20 degrees of freedom ${Array.from({ length: n }, (_, i) => { const x = value(i); return `t = ${x.t}, p = ${x.p}`; }).join(', ')}.`),
    n: 1500,
    // the df stated before them, read once for the sentence, is every one's
    each: (r) => expect(r.df?.printed).toBe('20'),
  },
  'a quiet comment before each result': {
    make: (n) => doc(Array.from({ length: n }, (_, i) => { const x = value(i); return `<!-- plumbline quiet p-follows-from-t: invented check -->\nScores rose, t(${x.df}) = ${x.t}, p = ${x.p}.\n`; }).join('\n')),
    n: 800,
  },
};

describe('many results in one paragraph', () => {
  for (const [name, { make, n, each }] of Object.entries(SHAPES)) {
    it(`${name}: checking twice as many costs less than three times as much`, () => {
      expectLinearCheck(name, make, n);
      // and every result is read (the shapes are not empty)
      const results = checkSource('x.md', make(50)).results;
      expect(results).toHaveLength(50);
      if (each) results.forEach(each);
    }, 120_000);
  }
});

/**
 * The same for F results beside groups' summaries (each F's groups are looked up once per
 * sentence) and z results after coefficients with their SEs (binary searches, a bounded walk back).
 */
describe('many F results with groups and z results with coefficients', () => {
  const fs = (n: number) => doc(Array.from({ length: n }, (_, i) => `Sites differed (first: M = 4.${i % 10}, SD = 1.2, n = 20; second: M = 5.1, SD = 1.1, n = 21), F(1, 39) = ${(5 + (i % 40) / 10).toFixed(2)}, p = .0${10 + (i % 80)}.`).join(' '));
  const zs = (n: number) => doc(`${Array.from({ length: n }, (_, i) => `b = 0.${40 + (i % 50)}, SE = 0.15, z = ${(2 + (i % 90) / 100).toFixed(2)}`).join(', ')}.`);
  it('one paragraph of F results, each with its two groups: twice as many costs less than three times as much', () => {
    expectLinearCheck('F with groups', fs, 400);
    const linked = checkSource('x.md', fs(50)).statistics ?? [];
    expect(linked).toHaveLength(50);
  }, 120_000);
  it('one sentence of z results after coefficients: twice as many costs less than three times as much', () => {
    expectLinearCheck('z after coefficients', zs, 1500);
    expect((checkSource('x.md', zs(50)).statistics ?? []).filter((st) => st.kind === 'z')).toHaveLength(50);
  }, 120_000);
});

/**
 * The lead reader gives, test after test, exactly what `leadStart` and `topicWords` give on the
 * text up to each test: generated sentences mix clause boundaries inside and outside brackets,
 * repeated and new words, possessives and words longer than a word match (41 letters).
 */
describe('LeadReader', () => {
  const pieces = ['the ward', ', and', ', but the desk group', '; ', '(M = 3.2, and M = 3.4)', '[a, but b]', "nurses' rota", 'staff’s shift', 'x'.repeat(45), 'ward-level', ', however', 'afternoon', '(open', 'close)', ' ', ', while'];
  it('agrees with leadStart and topicWords on 300 generated sentences', () => {
    let seed = 7;
    const next = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return seed / 2147483648;
    };
    for (let k = 0; k < 300; k += 1) {
      let text = 'Before. ';
      const sentenceStart = text.length;
      const anchors: number[] = [];
      const parts = 5 + Math.floor(next() * 30);
      for (let i = 0; i < parts; i += 1) {
        text += `${pieces[Math.floor(next() * pieces.length)]} `;
        if (next() < 0.4) {
          anchors.push(text.length);
          text += `t(${i}) = 2.${i}, `;
        }
      }
      const sentenceEnd = text.length;
      text += 'After.';
      const reader = new LeadReader(text);
      for (const at of anchors) {
        const lead = reader.start(sentenceStart, sentenceEnd, at);
        expect(lead, `${JSON.stringify(text)} at ${at}`).toBe(leadStart(text, sentenceStart, at));
        if (lead < at) expect(reader.wordsOf(lead, at), `${JSON.stringify(text)} at ${at}`).toEqual(topicWords(text.slice(lead, at)));
      }
    }
  });
});
