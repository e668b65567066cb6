import { describe, expect, it } from 'vitest';
import { checkSource } from '../../src/engine/index.js';
import { showLastDigitUnits } from '../../src/rule-api/format.js';
import { findingsOf, levelsOf, ruleTable } from './table.js';

// Recomputed p values quoted in names were computed with scipy.stats.f.sf (Debian python3-scipy).
ruleTable('p-follows-from-f', [
  { name: 'exact p that follows (F(1, 38) = 4.21 gives .0470 to .0472)', markdown: 'x, F(1, 38) = 4.21, p = .047.', expect: [] },
  { name: 'p that misses without crossing alpha', markdown: 'x, F(1, 38) = 4.21, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'attached dfs F1,38 read like bracketed ones', markdown: 'x, F1,38 = 4.21, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'p one unit of the last digit away (F(2, 57) = 3.10 gives .0525 to .0530)', markdown: 'x, F(2, 57) = 3.10, p = .06.', expect: ['1:4 mismatch'] },
  { name: 'p rounded to two decimals that follows', markdown: 'x, F(2, 57) = 3.10, p = .05.', expect: [] },
  { name: 'Greenhouse–Geisser dfs read within their rounding (F(1.45, 57.3) = 3.10 gives .0681)', markdown: 'With Greenhouse–Geisser correction, F(1.45, 57.3) = 3.10, MSE = 2.1, p = .068.', expect: [] },
  { name: 'an η² between F and p does not end the clause', markdown: 'x, F(1, 38) = 4.21, η2 = .10, p = .03.', expect: ['1:4 mismatch'] },
  { name: 'F < 1 without dfs is not checked', markdown: 'The groups did not differ, F < 1, p = .02.', expect: [] },
  { name: 'a bound that holds (F(3, 120) = 2.95 gives .0355)', markdown: 'x, F(3, 120) = 2.95, p < .05.', expect: [] },
  { name: 'a bound that fails without crossing alpha', markdown: 'x, F(3, 120) = 2.95, p < .01.', expect: ['1:4 mismatch'] },
  { name: 'never a one-tailed reading: half of .0470 is not accepted', markdown: 'x, F(1, 38) = 4.21, p = .0235.', expect: ['1:4 mismatch'] },
  { name: 'an adjusted p is not compared', markdown: 'x, F(1, 38) = 4.21, p_adj = .03.', expect: [] },
  { name: 'a p after other prose belongs to another statement', markdown: 'x, F(1, 38) = 4.21, which the second experiment did not replicate at all, p = .03.', expect: [] },
  { name: 'a flip of significance belongs to significance-follows-from-statistic', markdown: 'x, F(1, 38) = 2.10, p = .03.', expect: [] },
  { name: 'a t in the same sentence keeps its own p', markdown: 'x, t(38) = 2.05, p = .047, and F(1, 38) = 4.21, p = .047.', expect: [] },
  { name: 'quieted with a reason', markdown: '<!-- plumbline quiet p-follows-from-f: permutation p -->\nx, F(1, 38) = 4.21, p = .03.', expect: [] },
]);

describe('a gap just over half a unit reads as more than the half unit rounding allows', () => {
  // F(2, 44) = 0.001 is read as 0.0005 to 0.0015; scipy.stats.f.sf(0.0015, 2, 44) = 0.9985012
  // (Debian python3-scipy), so .998 misses by 0.5012 units of its last digit, not by "0.5".
  it('shows the units with the digits that tell them apart', () => {
    const report = checkSource('gap.md', 'x, F(2, 44) = 0.001, p = .998.');
    const finding = report.findings.find((f) => f.ruleId === 'p-follows-from-f');
    expect(finding?.message).toContain('(0.501 units of the last printed digit; rounding allows 0.5 units)');
  });
  it('keeps one decimal where one is enough', () => {
    expect(showLastDigitUnits(0.6)).toBe('0.6');
    expect(showLastDigitUnits(0.5)).toBe('0.5');
    expect(showLastDigitUnits(0.50012)).toBe('0.5001');
    expect(showLastDigitUnits(0.500001)).toBe('0.5000');
    expect(showLastDigitUnits(12.34)).toBe('12.3');
  });
});

describe('an F of a repeated-measures analysis whose p fits only a sphericity correction (invented cases)', () => {
  // Reference values: scipy.stats.f.sf (Debian python3-scipy), the corrected range over a grid
  // of 4,001 values of ε from 1/df1 to 1 on both dfs (as scripts/make_sphericity_reference.py).
  // F(3, 45) = 0.62 (0.615 to 0.625): uncorrected p .6026 to .6089; corrected .4415 to .6089.
  // F(3, 44) = 0.62: uncorrected .6027 to .6089. F(1, 15) = 0.62: .4415 to .4451.
  // F(2, 38) = 3.41: uncorrected .04326 to .04363; corrected .04326 to .08064.
  const named = 'Response times across the four cue conditions were compared with a repeated-measures ANOVA.';
  const levels = levelsOf;
  const only = (markdown: string, rule: string) => {
    const found = findingsOf(markdown, rule);
    expect(found).toHaveLength(1);
    return found[0]!;
  };

  it('is a note saying what could not be checked, with the corrected range, when the text names such an analysis', () => {
    const f = only(`${named}\n\nThe cue had no effect, F(3, 45) = 0.62, p = .52.`, 'p-follows-from-f');
    expect(f.level).toBe('note');
    expect(f.message).toMatch(/^Not checked with certainty \(the text speaks of repeated measures elsewhere in the text, “repeated-measures ANOVA”, and with a sphericity correction of both dfs \(ε from 0\.3333 to 1\) the p would be 0\.4415 to 0\.6089, which holds the reported p/);
    // the uncorrected recomputation is still said in full
    expect(f.message).toContain('df1 = 3, df2 = 45: 0.6026 to 0.6089');
    // the words that name the analysis are a place of their own
    expect(f.related?.map((r) => r.message)).toEqual(['repeated measures named here']);
    expect(f.related?.[0]?.start.line).toBe(1);
  });
  it('names the sentence when the words are in it, without a second place', () => {
    const f = only('A repeated-measures ANOVA showed no effect of cue, F(3, 45) = 0.62, p = .52.', 'p-follows-from-f');
    expect(f.level).toBe('note');
    expect(f.message).toContain('speaks of repeated measures in its sentence, “repeated-measures ANOVA”');
    expect(f.related).toBeUndefined();
    const g = only('We ran a repeated-measures ANOVA. It showed no effect of cue, F(3, 45) = 0.62, p = .52.', 'p-follows-from-f');
    expect(g.message).toContain('speaks of repeated measures in its paragraph, “repeated-measures ANOVA”');
    expect(g.related?.[0]?.start.column).toBe(10);
  });
  it('reads the names of the corrections and other names of such an analysis', () => {
    for (const words of ['Greenhouse–Geisser corrections were applied where sphericity was violated.', 'We ran RM ANOVAs on each measure.', 'Cue was a within-subjects factor.', 'An ANOVA with repeated measures on cue was run.', "Mauchly's test was run on each effect."]) {
      expect(levels(`${words}\n\nThe cue had no effect, F(3, 45) = 0.62, p = .52.`, 'p-follows-from-f')).toEqual(['note']);
    }
  });
  it('stays a warning where nothing names such an analysis (repeated measures alone, a mixed model, sphericity as a shape, or a correction said not to be applied)', () => {
    for (const words of [
      '',
      'Each participant was measured twice, in repeated measures.',
      'A linear mixed model with random intercepts was fitted.',
      'The design was within-subject.',
      'Pellet sphericity was scored on a five-point scale.',
      "Mauchly's test showed that sphericity held, so no correction was applied.",
      'The assumption of sphericity was not violated, and no correction was needed.',
    ]) {
      expect(levels(`${words}\n\nThe cue had no effect, F(3, 45) = 0.62, p = .52.`, 'p-follows-from-f')).toEqual(['warning']);
    }
  });
  it('reads a correction a negation elsewhere in the sentence does not deny, and one denied at its words as none', () => {
    const f = 'The cue had no effect, F(3, 45) = 0.62, p = .52.';
    expect(levels(`Greenhouse–Geisser corrected results are reported; no further adjustment for multiple comparisons was made.\n\n${f}`, 'p-follows-from-f')).toEqual(['note']);
    expect(levels(`Greenhouse–Geisser corrections were applied unless sphericity was met.\n\n${f}`, 'p-follows-from-f')).toEqual(['note']);
    expect(levels(`The sphericity assumption held.\n\n${f}`, 'p-follows-from-f')).toEqual(['warning']);
    for (const dash of ['–', '-']) expect(levels(`We applied no Greenhouse${dash}Geisser correction.\n\n${f}`, 'p-follows-from-f')).toEqual(['warning']);
  });
  it('stays a warning where the text says no sphericity correction was applied, or the F\'s paragraph names independent groups', () => {
    expect(levels(`${named} Mauchly's test indicated that sphericity held, so no correction was applied and uncorrected dfs are reported.\n\nThe cue had no effect, F(3, 45) = 0.62, p = .52.`, 'p-follows-from-f')).toEqual(['warning']);
    // F(2, 60) = 3.50 gives .0363 to .0367 (scipy.stats.f.sf): significant, so .06 flips the call
    expect(levels(`${named}\n\nScores of the three independent groups were compared with a one-way ANOVA. The groups did not differ, F(2, 60) = 3.50, p = .06.`, 'significance-follows-from-statistic')).toEqual(['error']);
  });
  it('stays a warning where its own sentence names an analysis between groups only', () => {
    expect(levels(`${named}\n\nA one-way between-subjects ANOVA showed no effect of cue, F(3, 45) = 0.62, p = .52.`, 'p-follows-from-f')).toEqual(['warning']);
  });
  it('finds the corrected p where it peaks inside the first cell of its ε grid', () => {
    // F(20, 800) = 1.67 (1.665 to 1.675): the largest corrected p, .2047 at ε ≈ .0566, holds .205
    // (fixtures/reference/sphericity-ranges.json; scipy.stats.f.sf and mpmath)
    // uncorrected, F(20, 800) = 1.67 gives p below .05, so the call flips: the significance rule speaks
    expect(levels(`${named}\n\nThe cue had no effect, F(20, 800) = 1.67, p = .205.`, 'significance-follows-from-statistic')).toEqual(['note']);
    expect(levels('The cue had no effect, F(20, 800) = 1.67, p = .205.', 'significance-follows-from-statistic')).toEqual(['error']);
  });
  it('stays a warning where no correction reproduces the p', () => {
    expect(levels(`${named}\n\nThe cue had no effect, F(3, 45) = 0.62, p = .32.`, 'p-follows-from-f')).toEqual(['warning']);
  });
  it('stays a warning for an effect that cannot have a correction: df1 = 1, or an error df that is not a multiple of df1', () => {
    expect(levels(`${named}\n\nThe cue had no effect, F(1, 15) = 0.62, p = .52.`, 'p-follows-from-f')).toEqual(['warning']);
    expect(levels(`${named}\n\nThe cue had no effect, F(3, 44) = 0.62, p = .52.`, 'p-follows-from-f')).toEqual(['warning']);
  });
  it('makes a flipped significance call a note too (significance-follows-from-statistic)', () => {
    const markdown = `${named}\n\nThe cue effect was not significant, F(2, 38) = 3.41, p = .06.`;
    expect(levels(markdown, 'significance-follows-from-statistic')).toEqual(['note']);
    expect(levels(markdown.replace(named, ''), 'significance-follows-from-statistic')).toEqual(['error']);
  });
  it('leaves the JSON record of the statistic as it was: its readings are the uncorrected ones', () => {
    const report = checkSource('rm.md', `${named}\n\nThe cue had no effect, F(3, 45) = 0.62, p = .52.`);
    expect(report.statistics?.[0]?.recomputed?.readings.map((r) => r.name)).toEqual(['p (upper tail of F)']);
    expect(report.statistics?.[0]?.recomputed?.fits).toBe(false);
  });
});
