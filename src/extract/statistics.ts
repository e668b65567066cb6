import type { Segment } from '../parse/types.js';
import { readNumber, sentenceOf, sourceSpan } from './numbers.js';
import { findP, reportTailEnd } from './tTests.js';
import type { Comparison, OtherStatistic, OtherStatisticKind, ReportedNumber, TTestReport } from './types.js';
import { leadStart, topicStems } from './topic.js';
import { FirstMatches, matchesOf } from './matches.js';
import { textIndexOf } from './offsets.js';

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
  // φ = .21 · phi = .21 · Cramér's V = .18 · V = .18 (a contingency table's association)
  { kind: 'association', may: /[φϕV]|[Pp]hi/, re: new RegExp(String.raw`${START}(?:[φϕ]|[Pp]hi|Cram[ée]r['’]s V|V)(?: ?_?c)? ?${OP} ?${VALUE}`, 'gu') },
  // OR = 1.8 · RR = 0.7 · HR = 1.2 · aOR = 2.1
  { kind: 'ratio', may: /OR|RR|HR/, re: new RegExp(String.raw`${START}(?:a?OR|RR|HR|IRR) ?${OP} ?${VALUE}`, 'gu') },
  // U = 120 · W = 45 · H(2) = 8.1 (Mann–Whitney, Wilcoxon, Kruskal–Wallis)
  { kind: 'rank-or-other', may: /[UWH]/, re: new RegExp(String.raw`${START}(?:U|W|H(?: ?[(\[] ?${DF} ?[)\]])?) ?${OP} ?${VALUE}`, 'gu') },
];

/** Every statistic of another test in one segment, in reading order. */
export function findOtherStatistics(seg: Segment, sentenceStarts: number[]): OtherStatistic[] {
  const out: OtherStatistic[] = [];
  const text = seg.text;
  for (const { kind, may, re } of PATTERNS) {
    if (!may.test(text)) continue;
    for (const m of matchesOf(re, text)) {
      const g = m[1];
      if (g === undefined) continue;
      const end = m.index + m[0].length;
      const value = readNumber(seg, end - g.length, end);
      out.push({
        // a V above 1 is a signed-rank statistic (R prints Wilcoxon's as V), not Cramér's V
        kind: kind === 'association' && value && Math.abs(value.value) > 1 ? 'rank-or-other' : kind,
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

/** The kinds whose p plumbline recomputes. */
const CHECKED: ReadonlySet<OtherStatisticKind> = new Set(['F', 'chi-square', 'correlation', 'z']);
/** Effect sizes of the statistic before them (`F(1, 38) = 4.21, η2 = .10, p = .047`): they do not end its clause. */
const OWN_EFFECT: ReadonlySet<OtherStatisticKind> = new Set(['eta-squared', 'r-squared', 'association']);

// The parts of a statistic's own text (each applied to the text the patterns above matched).
const NUM = String.raw`\d{1,6}(?:\.\d{1,4})?`;
const F_DFS = new RegExp(String.raw`^F ?_?[(\[{]? ?(${NUM}) ?[,;] ?(${NUM})`, 'du');
const CHI_PARTS = new RegExp(String.raw`[(\[] ?(${NUM})(?: ?[,;] ?[Nn] ?= ?(\d{1,3}(?:,\d{3})?\d{0,6}))? ?[)\]]`, 'du');
const R_PARTS = new RegExp(String.raw`^(r(?:_?s|_?pb)?|ρ|τ)(?: ?[(\[] ?(${NUM}) ?[)\]])?`, 'du');
const STAT_OP = /(<=|>=|≤|≥|=|<|>) ?[-+]? ?[.\d]{1,22}$/u;
/** `n = 50` or `N = 1,204` in a correlation's clause. */
const N_IN_CLAUSE = /(?<![\p{L}\p{N}_])[nN] ?= ?(\d{1,3}(?:,\d{3}){1,2}|\d{1,7})(?![\d.])/u;
/** Words before or in a χ²'s clause that name a test other than Pearson's χ² on the whole table, or a corrected χ². */
const CHI_NAMED = /(McNemar|Bowker|goodness[- ]of[- ]fit|Mantel|Cochran|linear[- ]by[- ]linear|trend|Yates|continuity)/iu;
/** A Greenhouse–Geisser or Huynh–Feldt correction named near an F. */
const CORRECTION = /(Greenhouse|Huynh)/u;
/**
 * Words before an F in its sentence, or in its clause, that name an analysis whose F is not the
 * one-way between-groups F of the groups' printed means and SDs: repeated or mixed designs,
 * covariates, Welch's or Brown–Forsythe's F, a factorial design's effects.
 */
export const NOT_ONE_WAY = /(repeated|within[- ]subjects?|within[- ]participants?|mixed|covariat\w{0,4}|ANCOVA|adjust\w{0,4}|Welch|Brown[- –]Forsythe|interaction|main effect|two-way|three-way|factorial|MANOVA|multivariate|over time|across time|time points?|timepoints?|sessions|waves)/iu;
/** Stems of the words that name the one-way ANOVA itself, not what it compares (common practice, no source). */
const METHOD_STEMS = new Set(['anova', 'one-w', 'varia']);
/** A paragraph that may name a table ("Table 2"): only there does an F need its sentence's words. */
const TABLE_WORD = /Tab/u;
/** Words of an F, χ², r or z report that are not other prose. */
const OWN_WORDS = /^(?:mse|ms|ss|greenhouse|geisser|huynh|feldt|gg|hf|epsilon|ε|sphericity|likelihood|ratio|pearson|pearson's|pearson’s|yates|fisher|fisher's|fisher’s|wald|asymptotic|approximate|one-way|anova|ancova|manova|wilks|pillai|trace|lambda)$/iu;
/** Words before an r that make p from t = r√(df/(1 − r²)) an approximation or its df another one. */
const R_DOUBT = /(partial|semi-?partial|Spearman|Kendall|rank|polychoric|tetrachoric|intraclass|ICC|point[- ]biserial|biserial|multiple|canonical|controlling|adjusted)/iu;
/** A rank test's statistic (U, W, T) before a z in its clause: the p printed may be the exact one. */
const RANK_BEFORE = /(?<![\p{L}\p{N}_])(?:U|W|T|V)(?: ?\(\d{1,6}\))? ?[=<>]|Mann|Whitney|Wilcoxon|signed[- ]rank|rank[- ]sum|Kruskal/u;

/**
 * Gives each F, χ², r and z its dfs, n and p: the numbers in the statistic's own text and in
 * its clause, which runs from its value to the next statistic (t or other; an η² or R² is the
 * statistic's own effect size and does not end it), the end of the sentence or 200
 * characters, and stops at a contrast or three words of other prose, as for a t-test.
 */
export function completeStatistics(seg: Segment, starts: number[], others: OtherStatistic[], tests: readonly TTestReport[]): OtherStatistic[] {
  // nothing to complete (most paragraphs): the records as they are, without the indices below
  if (!others.some((o) => CHECKED.has(o.kind) && o.value)) return others;
  const text = seg.text;
  // the text index of each record's start (spans are source offsets; the segment maps them),
  // for this segment's t-tests once, in text order
  const testStarts = tests.filter((t) => t.segment === seg.id).map((test) => ({ at: textIndexOf(seg, test.span.start), test })).sort((a, b) => a.at - b.at);
  const boundaries: Array<{ at: number }> = testStarts.map((t) => ({ at: t.at }));
  for (const o of others) if (!OWN_EFFECT.has(o.kind)) boundaries.push({ at: textIndexOf(seg, o.span.start) });
  boundaries.sort((a, b) => a.at - b.at);
  // φ and V with their text starts, in order: each χ² finds the first after it by binary search
  const associations = others.filter((e) => e.kind === 'association' && e.value).map((e) => ({ ...e, at: textIndexOf(seg, e.span.start) })).sort((a, b) => a.at - b.at);
  // each F's own η²: the first (in the records' order) after its value and before its clause ends.
  // Records in text order, as the recognisers give them, are searched by binary search; in any
  // other order, one by one as before (a scan per F was quadratic in a paragraph of Fs)
  const etas = others.filter((e) => e.kind === 'eta-squared' && e.value).map((e) => ({ e, at: textIndexOf(seg, e.span.start) }));
  const etasInOrder = etas.every((x, i) => i === 0 || (etas[i - 1] as { at: number }).at <= x.at);
  const etaIn = (after: number, before: number): OtherStatistic | undefined => {
    const x = etasInOrder ? firstAfter(etas, after) : etas.find((y) => y.at > after && y.at < before);
    return x !== undefined && x.at < before ? x.e : undefined;
  };
  const hard: number[] = testStarts.map((t) => t.at);
  for (const o of others) if (CHECKED.has(o.kind)) hard.push(textIndexOf(seg, o.span.start));
  // what is the same for every F of the paragraph or sentence, read once
  let paragraphWords: string | null | undefined;
  const namesTable = TABLE_WORD.test(text);
  const stemsBySentence = new Map<number, string[]>();
  // every F of a sentence reads it from its start to the F's clause: the sentence is read once
  const analysisWords = new FirstMatches(NOT_ONE_WAY, text);
  return others.map((o) => {
    if (!CHECKED.has(o.kind) || !o.value) return o;
    const at = textIndexOf(seg, o.span.start);
    const valueEnd = at + o.printed.length;
    const op = STAT_OP.exec(o.printed);
    const out: OtherStatistic = { ...o, ...(op ? { op: comparisonOf(op[1] as string) } : {}) };
    readOwnParts(seg, at, out);
    // the first boundary past this statistic, by binary search (a scan from the first was quadratic)
    const next = firstAfter(boundaries, at)?.at ?? text.length;
    const sentenceEnd = starts[sentenceOf(starts, at) + 1] ?? text.length;
    const windowEnd = Math.min(next, sentenceEnd, valueEnd + 200);
    const tailEnd = reportTailEnd(text, valueEnd, windowEnd, OWN_WORDS);
    const p = findP(seg, valueEnd, tailEnd);
    // a plural p (`ps < .05`) summarises several tests; it is not this one's
    if (p && !/^[pP]s/u.test(p.printed)) out.p = p;
    if (o.kind === 'correlation' || (o.kind === 'chi-square' && !out.n)) {
      const n = N_IN_CLAUSE.exec(text.slice(valueEnd, tailEnd));
      if (n) {
        const a = valueEnd + n.index + n[0].length - (n[1] as string).length;
        const number = readNumber(seg, a, a + (n[1] as string).length);
        if (number) out.n = number;
      }
    }
    const sentenceStart = starts[sentenceOf(starts, at)] as number;
    const before = text.slice(Math.max(sentenceStart, at - 80), at);
    if (o.kind === 'F') {
      // an η² of the F's own clause: the first one after its value and before the clause ends
      const eta = etaIn(at, Math.max(tailEnd, valueEnd + 1));
      if (eta?.value && /^(?:partial )?(?:η|eta)/iu.test(eta.printed)) {
        const etaOp = STAT_OP.exec(eta.printed);
        out.etaSquared = { partial: isPartialEta(eta.printed), op: etaOp ? comparisonOf(etaOp[1] as string) : '=', value: eta.value, span: eta.span, printed: eta.printed };
      }
      const same = sameComparisonAs(seg, at, sentenceStart, testStarts);
      if (same) out.sameAsT = same;
      const near = text.slice(Math.max(sentenceStart, at - 80), tailEnd);
      const c = CORRECTION.exec(near);
      if (c) out.dfCorrection = c[1] === 'Huynh' ? 'huynh-feldt' : 'greenhouse-geisser';
      const w = analysisWords.within(sentenceStart, tailEnd, sentenceEnd);
      if (w) out.analysisWords = w[1] as string;
      if (paragraphWords === undefined) paragraphWords = NOT_ONE_WAY.exec(text)?.[1] ?? null;
      if (paragraphWords !== null) out.paragraphAnalysisWords = paragraphWords;
      // the paragraph's only statistic: its lead, for groups printed in the paragraph before
      if (boundaries.length === 1) out.leadStems = topicStems(text.slice(leadStart(text, sentenceStart, at), at)).filter((w) => !METHOD_STEMS.has(w));
      if (namesTable) {
        const sentence = sentenceOf(starts, at);
        let stems = stemsBySentence.get(sentence);
        if (!stems) {
          stems = topicStems(text.slice(sentenceStart, starts[sentence + 1] ?? text.length));
          stemsBySentence.set(sentence, stems);
        }
        out.sentenceStems = stems;
      }
    }
    if (o.kind === 'chi-square') {
      // a φ or V of the χ²'s own clause: the first one after its value and before the clause ends
      const a = firstAfter(associations, at);
      if (a?.value && a.at < Math.max(tailEnd, valueEnd + 1)) {
        const aOp = STAT_OP.exec(a.printed);
        out.association = { kind: /^[φϕ]|^[Pp]hi/u.test(a.printed) ? 'phi' : 'V', op: aOp ? comparisonOf(aOp[1] as string) : '=', value: a.value, span: a.span, printed: a.printed };
      }
      const named = CHI_NAMED.exec(text.slice(Math.max(sentenceStart, at - 80), tailEnd));
      if (named) out.namedAs = named[1] as string;
    }
    if (o.kind === 'correlation') {
      const d = R_DOUBT.exec(before);
      if (out.symbol !== 'r') out.doubt = `the correlation is printed as ${out.symbol ?? 'a rank correlation'}, whose p is not the t route's`;
      else if (d) out.doubt = `"${d[1]}" before r: its p or df need not be those of a Pearson r`;
    }
    if (o.kind === 'z') {
      // the z's own clause: after the last t, F, χ², r or z before it and the last semicolon
      let from = Math.max(sentenceStart, at - 120);
      for (const b of hard) if (b < at) from = Math.max(from, b + 1);
      const clause = text.slice(from, at);
      if (RANK_BEFORE.test(clause.slice(clause.lastIndexOf(';') + 1))) out.doubt = 'a rank test is named before z: its p may be the exact one rather than the normal approximation';
    }
    let last = valueEnd;
    if (out.p) while (last < tailEnd && (seg.ends[last] as number) <= out.p.span.end) last += 1;
    out.reportSpan = sourceSpan(seg, at, Math.max(valueEnd, last));
    out.reportPrinted = text.slice(at, Math.max(valueEnd, last));
    return out;
  });
}

/** The first item starting after text index `at` (items sorted by `at`). */
function firstAfter<T extends { at: number }>(items: readonly T[], at: number): T | undefined {
  let lo = 0;
  let hi = items.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((items[mid] as T).at <= at) lo = mid + 1;
    else hi = mid;
  }
  return items[lo];
}

/**
 * Words between a t and an F that say the F is the same comparison: `t(38) = 2.05 (equivalently
 * F(1, 38) = 4.20)`, `t(38) = 2.05, p = .047; that is, F(1, 38) = 4.20`. Nothing else may stand
 * between them but the t's own p.
 */
const SAME_COMPARISON = /^(?:,? ?[pP] ?(?:<=|>=|≤|≥|=|<|>) ?\.?\d{1,3}(?:\.\d{1,12})?)?[,;]? ?\(? ?(?:equivalently|equivalent to|i\.e\.,?|that is,?|or equivalently,?) ?$/u;

/**
 * The id of the t-test an F at text index `at` says it is the same comparison as, if its words
 * say so. `tests` are the segment's t-tests with their text starts, in reading order (binary search).
 */
function sameComparisonAs(seg: Segment, at: number, sentenceStart: number, tests: ReadonlyArray<{ at: number; test: TTestReport }>): string | undefined {
  let lo = 0;
  let hi = tests.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((tests[mid] as { at: number }).at < at) lo = mid + 1;
    else hi = mid;
  }
  const last = tests[lo - 1]?.test;
  if (!last) return undefined;
  const from = textIndexOf(seg, last.span.end);
  if (from < sentenceStart || at - from > 40) return undefined;
  return SAME_COMPARISON.test(seg.text.slice(from, at)) ? last.id : undefined;
}

function readOwnParts(seg: Segment, at: number, out: OtherStatistic): void {
  const own = out.printed;
  const num = (m: RegExpExecArray, g: number): ReportedNumber | undefined => {
    const span = m.indices?.[g];
    return span ? readNumber(seg, at + span[0], at + span[1]) : undefined;
  };
  if (out.kind === 'F') {
    out.symbol = 'F';
    const m = F_DFS.exec(own);
    const a = m ? num(m, 1) : undefined;
    const b = m ? num(m, 2) : undefined;
    if (a && b) out.dfs = [a, b];
  } else if (out.kind === 'chi-square') {
    out.symbol = own.slice(0, Math.max(1, own.search(/[ ([=<>≤≥]/u))).trim();
    const m = CHI_PARTS.exec(own);
    const df = m ? num(m, 1) : undefined;
    if (df) out.dfs = [df];
    const n = m && m[2] !== undefined ? num(m, 2) : undefined;
    if (n) out.n = n;
  } else if (out.kind === 'correlation') {
    const m = R_PARTS.exec(own);
    if (m) out.symbol = (m[1] as string).replace('_', '');
    const df = m && m[2] !== undefined ? num(m, 2) : undefined;
    if (df) out.dfs = [df];
  } else if (out.kind === 'z') out.symbol = own.slice(0, 1);
}


function comparisonOf(s: string): Comparison {
  if (s === '<=' || s === '≤') return '<=';
  if (s === '>=' || s === '≥') return '>=';
  if (s === '<' || s === '>') return s;
  return '=';
}

/**
 * Whether an η² is said to be partial: `partial η2`, or a p beside the η (`ηp2`, `η2p`, `η^2_p`,
 * `η_p^2`). Read with string methods on the text the η² pattern matched; ω² and ε² are not η².
 */
function isPartialEta(printed: string): boolean {
  const lower = printed.toLowerCase();
  if (lower.startsWith('partial')) return true;
  const symbolEnd = Math.min(...['=', '<', '>', '≤', '≥'].map((c) => (lower.includes(c) ? lower.indexOf(c) : lower.length)));
  const symbol = lower.slice(0, symbolEnd);
  const rest = symbol.startsWith('η') ? symbol.slice(1) : symbol.startsWith('eta') ? symbol.slice(3) : undefined;
  return rest !== undefined && rest.includes('p');
}
