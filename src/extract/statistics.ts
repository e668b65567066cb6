import type { Segment } from '../parse/types.js';
import { readNumber, sentenceOf, sourceSpan } from './numbers.js';
import type { OtherStatistic, OtherStatisticKind } from './types.js';

// Bounded building blocks (see test/regex-safety).
const OP = String.raw`(?:<=|>=|≤|≥|=|<|>)`;
const VALUE = String.raw`([-+]? ?(?:\d{1,9}(?:\.\d{1,12})?|\.\d{1,12}))`;
const DF = String.raw`\d{1,6}(?:\.\d{1,4})?`;
const START = String.raw`(?<![\p{L}\p{N}_'’.])`;

/**
 * The statistics of tests other than t, and coefficients reported as results of their own.
 * Each ends the clause of the t-test before it: a p, CI or effect size after it is its own,
 * never the t-test's. Over-reading here only ends a clause early (a number left unlinked),
 * never links a number to the wrong test.
 */
const PATTERNS: Array<{ kind: OtherStatisticKind; may: RegExp; re: RegExp }> = [
  // F(1, 38) = 4.2 · F1,38 = 4.2 · F_{2,57} = 3.1 · F(2, 57.3) = 3.1 · F < 1
  { kind: 'F', may: /F/, re: new RegExp(String.raw`${START}F(?: ?[(\[] ?${DF} ?[,;] ?${DF} ?[)\]]| ?_?\{? ?${DF} ?, ?${DF} ?\}?)? ?${OP} ?${VALUE}`, 'gu') },
  // χ2(2, N = 120) = 7.1 · χ^2 = 7.1 · chi-square(1) = 4.3
  { kind: 'chi-square', may: /χ|chi|Chi|X\^?2/, re: new RegExp(String.raw`(?:χ|[Cc]hi(?:[- ]squared?)?|X(?=\^?2))(?: ?\^? ?2)?(?: ?[(\[] ?${DF}(?: ?[,;] ?[Nn] ?= ?\d{1,3}(?:,\d{3})?\d{0,6})? ?[)\]])? ?${OP} ?${VALUE}`, 'gu') },
  // r(48) = .32 · r = −.41 · rs = .2 · r_s(30) = .4 · ρ = .3 · τ = .2
  { kind: 'correlation', may: /r|ρ|τ/, re: new RegExp(String.raw`${START}(?:r(?:_?s|_?pb)?|ρ|τ)(?: ?[(\[] ?${DF} ?[)\]])? ?${OP} ?${VALUE}`, 'gu') },
  // R^2 = .31 · R2 = .31
  { kind: 'r-squared', may: /R/, re: new RegExp(String.raw`${START}R(?: ?\^ ?2|2|²)(?:_?adj)? ?${OP} ?${VALUE}`, 'gu') },
  // z = 2.31 · Z = −3.1
  { kind: 'z', may: /[zZ]/, re: new RegExp(String.raw`${START}[zZ] ?${OP} ?${VALUE}`, 'gu') },
  // β = .21 · beta = 0.21 (a standardised coefficient reported without its t)
  { kind: 'beta', may: /β|beta/, re: new RegExp(String.raw`${START}(?:β|beta)(?:_?\{?\d\}?)? ?${OP} ?${VALUE}`, 'gu') },
  // η2 = .08 · η^2_p = .08 · ηp2 = .08 · partial η2 = .08 · ω2 · ε2
  { kind: 'eta-squared', may: /η|eta|ω|ε/, re: new RegExp(String.raw`(?:partial )?(?:η|eta|ω|omega|ε|epsilon)(?: ?_?\{?p\}?)?(?: ?\^? ?2|²)(?: ?_?\{?p\}?)? ?${OP} ?${VALUE}`, 'giu') },
  // OR = 1.8 · RR = 0.7 · HR = 1.2 · aOR = 2.1
  { kind: 'ratio', may: /OR|RR|HR/, re: new RegExp(String.raw`${START}(?:a?OR|RR|HR|IRR) ?${OP} ?${VALUE}`, 'gu') },
  // U = 120 · W = 45 · H(2) = 8.1 · V = .3 (Mann–Whitney, Wilcoxon, Kruskal–Wallis, Cramér)
  { kind: 'rank-or-other', may: /[UWHV]/, re: new RegExp(String.raw`${START}(?:U|W|V|H(?: ?[(\[] ?${DF} ?[)\]])?) ?${OP} ?${VALUE}`, 'gu') },
];

/** Every statistic of another test in one segment, in reading order. */
export function findOtherStatistics(seg: Segment, sentenceStarts: number[]): OtherStatistic[] {
  const out: OtherStatistic[] = [];
  const text = seg.text;
  for (const { kind, may, re } of PATTERNS) {
    if (!may.test(text)) continue;
    for (const m of text.matchAll(re)) {
      const g = m[1];
      if (g === undefined) continue;
      const end = m.index + m[0].length;
      const value = readNumber(seg, end - g.length, end);
      out.push({
        kind,
        segment: seg.id,
        block: seg.block,
        sentence: sentenceOf(sentenceStarts, m.index),
        span: sourceSpan(seg, m.index, end),
        printed: m[0],
        ...(value ? { value } : {}),
      });
    }
  }
  return out.sort((a, b) => a.span.start - b.span.start);
}
