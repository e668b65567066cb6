import type { EstimateReport, Extraction, OtherStatistic, TTestReport } from '../extract/types.js';

/** Anything the extractor found, placed by segment, sentence and source span. */
export interface Placed {
  segment: number;
  sentence: number;
  span: { start: number; end: number };
}

/** A sentence's key in maps by sentence: its segment and its index there. */
export const sentenceKeyOf = (segment: number, sentence: number): string => `${segment}:${sentence}`;

/** The key of the sentence holding `x` (sentenceKeyOf). */
export const sentenceKey = (x: { segment: number; sentence: number }): string => sentenceKeyOf(x.segment, x.sentence);

/**
 * A t-test's clause: its report runs from its statistic (or the estimate printed right before
 * it, as in `b = 0.37, SE = 0.05, t(96) = 7.73`) to the next test statistic of its sentence,
 * or the end of the sentence. Numbers printed inside it belong to it.
 */
export interface Clause {
  test: TTestReport;
  /** Source offset where the clause starts. */
  start: number;
  /** Source offset where the next clause of the sentence starts; undefined: the sentence end. */
  end?: number;
  /** `b = 0.37` right before the statistic: the estimate the test is about. */
  leadingEstimate?: EstimateReport;
}

type Opener = { kind: 't'; test: TTestReport; start: number; sentence: number } | { kind: 'other'; statistic: OtherStatistic; start: number; sentence: number };

/** Who owns a number: the clause of a t-test, the clause of another test's statistic, or no one. */
export type Owner = { kind: 't'; clause: Clause } | { kind: 'other'; statistic: OtherStatistic } | undefined;

/** How far before its statistic an estimate may sit to lead the clause (source characters). */
const LEADING_REACH = 80;

export interface ClauseIndex {
  clauseOf(test: TTestReport): Clause;
  /** The clause a number sits in; undefined when it precedes every statistic of its sentence. */
  ownerOf(item: Placed): Owner;
  /** Statistics (t and others) in a sentence and in a segment. */
  statisticsInSentence(segment: number, sentence: number): number;
  statisticsInSegment(segment: number): number;
  testsInSegment(segment: number): number;
  /**
   * Tests that compare means (t and F) in a sentence and in a segment: only they could claim a
   * group's mean and SD; a χ², a correlation or a rank test beside them could not.
   */
  meanTestsInSentence(segment: number, sentence: number): number;
  meanTestsInSegment(segment: number): number;
}

/**
 * Builds the clause index of a document in time linear in its records (each list is walked
 * once per segment; lookups are binary searches over one segment's statistics).
 */
export function clauseIndex(x: Extraction): ClauseIndex {
  const estimatesBySegment = groupBy(x.estimates);
  const openersBySegment = new Map<number, Opener[]>();
  const clauses = new Map<TTestReport, Clause>();
  const testsBySegment = groupBy(x.tests);
  const othersBySegment = groupBy(x.otherStatistics);
  for (const [segment, tests] of testsBySegment) {
    const estimates = estimatesBySegment.get(segment) ?? [];
    const others = othersBySegment.get(segment) ?? [];
    let e = 0;
    let o = 0;
    let previousEnd = -1;
    let previousSentence = -1;
    for (const test of tests) {
      // the last estimate ending before the statistic, after the previous statistic's own text
      while (e < estimates.length && (estimates[e] as EstimateReport).span.end <= test.span.start) e += 1;
      while (o < others.length && (others[o] as OtherStatistic).span.end <= test.span.start) o += 1;
      const candidate = e > 0 ? estimates[e - 1] : undefined;
      // a β read both as an estimate and as a statistic of its own is the candidate itself, not a statistic before it
      let k = o - 1;
      while (k >= 0 && candidate && (others[k] as OtherStatistic).span.start === candidate.span.start) k -= 1;
      const lastOtherEnd = k >= 0 ? (others[k] as OtherStatistic).span.end : -1;
      const floor = Math.max(previousSentence === test.sentence ? previousEnd : -1, lastOtherEnd);
      const leading =
        candidate && candidate.sentence === test.sentence && test.span.start - candidate.span.end <= LEADING_REACH && candidate.span.start >= floor
          ? candidate
          : undefined;
      clauses.set(test, { test, start: leading ? leading.span.start : test.span.start, ...(leading ? { leadingEstimate: leading } : {}) });
      previousEnd = test.span.end;
      previousSentence = test.sentence;
    }
  }
  // A coefficient that leads a t-test's clause (`β = .21, t(96) = 2.80`) is that test's estimate, not a test of its own.
  const leadingSpans = new Set([...clauses.values()].flatMap((c) => (c.leadingEstimate ? [c.leadingEstimate.span.start] : [])));
  for (const seg of new Set([...testsBySegment.keys(), ...othersBySegment.keys()])) {
    const list: Opener[] = [];
    for (const t of testsBySegment.get(seg) ?? []) list.push({ kind: 't', test: t, start: (clauses.get(t) as Clause).start, sentence: t.sentence });
    for (const s of othersBySegment.get(seg) ?? []) {
      if (leadingSpans.has(s.span.start)) continue;
      list.push({ kind: 'other', statistic: s, start: s.span.start, sentence: s.sentence });
    }
    list.sort((a, b) => a.start - b.start);
    openersBySegment.set(seg, list);
    list.forEach((op, i) => {
      if (op.kind !== 't') return;
      const next = list[i + 1];
      const clause = clauses.get(op.test) as Clause;
      if (next && next.sentence === op.sentence) clause.end = next.start;
    });
  }
  const sentenceCounts = new Map<string, number>();
  const meanSentenceCounts = new Map<string, number>();
  const meanSegmentCounts = new Map<number, number>();
  for (const [seg, list] of openersBySegment) {
    for (const op of list) {
      const k = sentenceKeyOf(seg, op.sentence);
      sentenceCounts.set(k, (sentenceCounts.get(k) ?? 0) + 1);
      if (op.kind === 't' || op.statistic.kind === 'F') {
        meanSentenceCounts.set(k, (meanSentenceCounts.get(k) ?? 0) + 1);
        meanSegmentCounts.set(seg, (meanSegmentCounts.get(seg) ?? 0) + 1);
      }
    }
  }

  return {
    clauseOf: (test) => clauses.get(test) ?? { test, start: test.span.start },
    ownerOf(item) {
      const list = openersBySegment.get(item.segment);
      if (!list || list.length === 0) return undefined;
      // the last statistic whose clause starts at or before the item
      let lo = 0;
      let hi = list.length - 1;
      let found = -1;
      while (lo <= hi) {
        const mid = (lo + hi) >> 1;
        if ((list[mid] as Opener).start <= item.span.start) {
          found = mid;
          lo = mid + 1;
        } else hi = mid - 1;
      }
      const op = list[found];
      if (!op || op.sentence !== item.sentence) return undefined;
      return op.kind === 't' ? { kind: 't', clause: clauses.get(op.test) as Clause } : { kind: 'other', statistic: op.statistic };
    },
    statisticsInSentence: (segment, sentence) => sentenceCounts.get(sentenceKeyOf(segment, sentence)) ?? 0,
    statisticsInSegment: (segment) => openersBySegment.get(segment)?.length ?? 0,
    testsInSegment: (segment) => testsBySegment.get(segment)?.length ?? 0,
    meanTestsInSentence: (segment, sentence) => meanSentenceCounts.get(sentenceKeyOf(segment, sentence)) ?? 0,
    meanTestsInSegment: (segment) => meanSegmentCounts.get(segment) ?? 0,
  };
}

function groupBy<T extends { segment: number; span: { start: number } }>(items: readonly T[]): Map<number, T[]> {
  const m = new Map<number, T[]>();
  for (const it of items) {
    const list = m.get(it.segment);
    if (list) list.push(it);
    else m.set(it.segment, [it]);
  }
  for (const list of m.values()) list.sort((a, b) => a.span.start - b.span.start);
  return m;
}
