import type {
  DesignStatement,
  EffectSizeReport,
  EstimateReport,
  Extraction,
  GroupSizes,
  GroupAssignment,
  GroupSummary,
  IntervalReport,
  OtherStatistic,
  ReferenceValue,
  ReportedNumber,
  SampleSize,
  UnitCount,
  SpreadKind,
  TableBlockRecord,
  TableReference,
  TableRow,
  TTestReport,
} from '../extract/types.js';
import type { Span } from '../parse/types.js';
import { blockAt } from '../extract/tables.js';
import { stem } from '../extract/topic.js';
import { clauseIndex, sentenceKey, sentenceKeyOf, type Clause, type ClauseIndex, type Placed } from './clauses.js';
import type { Setting } from './types.js';

export type Design = 'paired' | 'independent' | 'one-sample' | 'unknown';

/**
 * How a number was tied to its result, most certain first: inside the result's clause; in its
 * sentence, which reports no other statistic; in its paragraph, which reports no other
 * statistic; in the result's table row; in a table beside the result.
 */
export type LinkBasis = 'clause' | 'sentence' | 'paragraph' | 'table-row' | 'table';

/** A number tied to a result, with how, and whether that tie is certain enough to warn on. */
export interface Linked<T> {
  item: T;
  basis: LinkBasis;
  /** False where another reading of the text would tie it elsewhere: a rule then only notes. */
  certain: boolean;
  /** Why the tie is not certain, when the basis alone does not say it. */
  doubt?: string;
}

/** What a confidence interval is the interval of. */
export type IntervalTarget = 'estimate' | 'effect-size' | 'group';

export interface IntervalLink extends Linked<IntervalReport> {
  of: IntervalTarget;
  /** The effect size it follows, when it is an effect size's interval. */
  effectSize?: EffectSizeReport;
}

/** The descriptives a result can be recomputed from, and how they were joined to it. */
export interface DescriptiveLink {
  scope: 'sentence' | 'paragraph' | 'previous-paragraph' | 'table';
  /** One group (one-sample or differences) or two, in reading order. */
  groups: GroupSummary[];
  /** Each group's spread kind after statements such as "mean ± SEM" are applied. */
  spreadKinds: SpreadKind[];
  /** Where a spread kind came from when the group itself did not say. */
  spreadKindSource?: { span: Span; printed: string };
  /** False when another statistic shares the sentence or paragraph, or the table is only beside the result. */
  certain: boolean;
  /** Why the tie is not certain, when neither of those says it. */
  doubt?: string;
  /**
   * For groups in a table tied to an F by name (`fGroupsJoiner`): the table, the words that
   * named it ("Table 2", in the F's sentence or paragraph), and the row or block label the F's
   * sentence names, or the caption words it shares when the table holds one set of groups.
   */
  tableTie?: { name: string; named: { span: Span; printed: string; basis: 'sentence' | 'paragraph' }; outcome: { by: 'label' | 'caption'; words: string[] } };
}

export interface ResultContext {
  descriptives?: DescriptiveLink;
  /** Why no descriptives were joined although some were near (never a silent guess). */
  unlinked?: { reason: string; span: Span };
  design: Setting<Design>;
  reference?: ReferenceValue;
  /** The interval of the test's estimate (a mean difference, a coefficient). */
  interval?: IntervalLink;
  /** Every interval tied to the result: the estimate's, an effect size's, a group's. */
  intervals: IntervalLink[];
  /** The estimate the test is about: printed right before its statistic or in its clause. */
  estimate?: Linked<EstimateReport>;
  /**
   * A regression coefficient printed with its SE in the result's own clause (`b = 0.42, SE =
   * 0.15, t(96) = 2.80`), whose t is b/SE. Certain only when it is the clause's one coefficient.
   */
  coefficient?: Linked<EstimateReport & { se: ReportedNumber }>;
  effectSizes: Array<Linked<EffectSizeReport>>;
  /** Sample sizes stated in the result's sentence or paragraph, or for the document. */
  sampleSizes: SampleSize[];
  /** How many t-tests the result's paragraph reports (itself included). */
  testsInParagraph: number;
  /** Two groups' sizes printed in the result's clause or sentence (`n = 25 and 23`), when printed once. */
  groupSizes?: [ReportedNumber, ReportedNumber];
}

/** Records of one segment in reading order, with lookups by position and by sentence. */
class SegmentList<T extends Placed> {
  private readonly bySegment = new Map<number, T[]>();
  constructor(items: readonly T[]) {
    for (const it of items) {
      const list = this.bySegment.get(it.segment);
      if (list) list.push(it);
      else this.bySegment.set(it.segment, [it]);
    }
    for (const list of this.bySegment.values()) list.sort((a, b) => a.span.start - b.span.start);
  }
  all(segment: number): T[] {
    return this.bySegment.get(segment) ?? [];
  }
  /**
   * Items starting in [from, to) in one sentence: those that `between` gives of that sentence,
   * without walking the rest of the segment when `to` is open (sentence numbers grow with
   * position in a segment).
   */
  betweenInSentence(segment: number, sentence: number, from: number, to?: number): T[] {
    const list = this.all(segment);
    const out: T[] = [];
    for (let i = lowerBound(list, from); i < list.length; i += 1) {
      const it = list[i] as T;
      if ((to !== undefined && it.span.start >= to) || it.sentence > sentence) break;
      if (it.sentence === sentence) out.push(it);
    }
    return out;
  }
  private readonly sentences = new Map<string, T[]>();
  /** Items of one sentence (sentence numbers grow with position in a segment); one list per sentence, shared by every caller. */
  inSentence(segment: number, sentence: number): readonly T[] {
    const key = sentenceKeyOf(segment, sentence);
    let found = this.sentences.get(key);
    if (!found) {
      found = this.sentenceItems(segment, sentence);
      this.sentences.set(key, found);
    }
    return found;
  }
  private sentenceItems(segment: number, sentence: number): T[] {
    const list = this.all(segment);
    let lo = 0;
    let hi = list.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((list[mid] as T).sentence < sentence) lo = mid + 1;
      else hi = mid;
    }
    const out: T[] = [];
    for (let i = lo; i < list.length && (list[i] as T).sentence === sentence; i += 1) out.push(list[i] as T);
    return out;
  }
  /** The last item ending at or before `pos` in the sentence, if any. */
  lastBefore(segment: number, sentence: number, pos: number): T | undefined {
    const list = this.all(segment);
    let best: T | undefined;
    for (let i = lowerBound(list, pos) - 1; i >= 0; i -= 1) {
      const it = list[i] as T;
      if (it.sentence !== sentence) break;
      if (it.span.end <= pos) {
        best = it;
        break;
      }
    }
    return best;
  }
}

function lowerBound<T extends Placed>(list: T[], pos: number): number {
  let lo = 0;
  let hi = list.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((list[mid] as T).span.start < pos) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The groups printed in prose, by segment. A group overlapping a test is read inside it (a test
 * printed within its descriptives) and left out.
 */
function proseGroups(x: Extraction, tests: SegmentList<TTestReport>): SegmentList<GroupSummary> {
  const overlapsTest = (g: GroupSummary) => {
    const list = tests.all(g.segment);
    const i = lowerBound(list, g.span.end) - 1;
    const t = list[i];
    return t !== undefined && t.span.end > g.span.start;
  };
  return new SegmentList(x.summaries.filter((g) => !g.table && !overlapsTest(g)));
}

/**
 * Builds the joiner for one document (indexes built once, every lookup a binary search, so a
 * document of any size is joined in linear time). Each number goes to the result whose clause
 * holds it; a number outside every clause goes to the only statistic of its sentence, or, less
 * certainly, of its paragraph. Descriptives go to the only test of their sentence or paragraph,
 * or to a table of groups beside a lone test; anything else is ambiguous and kept as a reason.
 */
export function contextJoiner(x: Extraction): (report: TTestReport) => ResultContext {
  const clauses = clauseIndex(x);
  const tests = new SegmentList(x.tests);
  const prose = proseGroups(x, tests);
  const tableRows = groupBy(x.summaries.filter((g) => g.table), (g) => (g.table as TableRow).table);
  const testsByBlock = groupBy(x.tests, (t) => t.block);
  const rowKey = (r: TableRow) => `${r.table}:${r.row}`;
  const inRows = <T extends { table?: TableRow }>(items: readonly T[]) => groupBy(items.filter((i) => i.table), (i) => rowKey(i.table as TableRow));
  const lists: Lists = {
    references: new SegmentList(x.references),
    intervals: new SegmentList(x.intervals),
    estimates: new SegmentList(x.estimates),
    effectSizes: new SegmentList(x.effectSizes),
    sampleSizes: new SegmentList(x.sampleSizes),
    unitCounts: new SegmentList(x.unitCounts),
    designs: new SegmentList(x.designs),
    groupSizes: new SegmentList(x.groupSizes),
    prose,
    tests,
  };
  const tables: Tables = {
    tableRows,
    testsByBlock,
    tables: x.tables,
    spreads: spreadStatements(x),
    methodsDesign: methodsDesign(x, clauses),
    // the Methods' statements first: the place a finding names
    assignments: severalStudies(x.sections) ? [] : [...x.assignments].sort((a, b) => Number(!METHODS_SECTION.test(x.sections[a.segment] ?? '')) - Number(!METHODS_SECTION.test(x.sections[b.segment] ?? ''))),
    rows: {
      groups: inRows(x.summaries),
      effectSizes: inRows(x.effectSizes),
      intervals: inRows(x.intervals),
      estimates: inRows(x.estimates),
    },
    blocks: groupBy(x.tableBlocks, (b) => b.table),
    tablesWithTests: new Set(x.tests.flatMap((r) => (r.table ? [r.table.table] : []))),
    testRows: new Set(x.tests.flatMap((r) => (r.table ? [rowKey(r.table)] : []))),
    mentions: groupBy(x.tableMentions, sentenceKey),
    byId: firstById(x.tables),
    // the first table each block stands right after or right before (the order `find` met them in)
    beside: tablesBeside(x.tables),
    memo: { testsInSentence: new Map(), sentenceDesign: new Map(), paragraphDesign: new Map(), sampleSizes: new Map() },
  };
  return (report) => contextFor(report, clauses, lists, tables);
}

interface Lists {
  references: SegmentList<ReferenceValue>;
  intervals: SegmentList<IntervalReport>;
  estimates: SegmentList<EstimateReport>;
  effectSizes: SegmentList<EffectSizeReport>;
  sampleSizes: SegmentList<SampleSize>;
  /** Every count of people or units, in digits or words: what a design's own sentence counts. */
  unitCounts: SegmentList<UnitCount>;
  designs: SegmentList<DesignStatement>;
  groupSizes: SegmentList<GroupSizes>;
  prose: SegmentList<GroupSummary>;
  tests: SegmentList<TTestReport>;
}

interface Tables {
  tableRows: Map<number, GroupSummary[]>;
  testsByBlock: Map<number, TTestReport[]>;
  tables: Extraction['tables'];
  spreads: SpreadStatements;
  /** What each table row holds, by `table:row`. */
  rows: {
    groups: Map<string, GroupSummary[]>;
    effectSizes: Map<string, EffectSizeReport[]>;
    intervals: Map<string, IntervalReport[]>;
    estimates: Map<string, EstimateReport[]>;
  };
  /** The measures' blocks of long tables, by table, and the sentences that name one, by `segment:sentence`. */
  blocks: Map<number, TableBlockRecord[]>;
  /** Tables that print tests of their own: their rows are not the groups of a test in prose. */
  tablesWithTests: Set<number>;
  /** The rows that print a test, by `table:row`. */
  testRows: Set<string>;
  mentions: Map<string, Extraction['tableMentions']>;
  /** The design the Methods state for the whole study, when every statement there agrees. */
  methodsDesign: Setting<Design> | undefined;
  /** Randomised groups the text names (none in a document of several studies). */
  assignments: GroupAssignment[];
  byId: Map<number, Extraction['tables'][number]>;
  beside: Map<number, Extraction['tables'][number]>;
  /** Answers that are the same for every result of a sentence or paragraph, computed once. */
  memo: {
    /** Tests of a sentence in a block, by `segment:sentence:block`. */
    testsInSentence: Map<string, number>;
    /** The design a sentence's words outside every statistic's clause give (null: none, or words that disagree). */
    sentenceDesign: Map<string, Setting<Design> | null>;
    paragraphDesign: Map<number, Setting<Design> | null>;
    sampleSizes: Map<string, SampleSize[]>;
  };
}

/** Each table by its number (the first, as `find` would give). */
function firstById(tables: Extraction['tables']): Map<number, Extraction['tables'][number]> {
  const out = new Map<number, Extraction['tables'][number]>();
  for (const tb of tables) if (!out.has(tb.table)) out.set(tb.table, tb);
  return out;
}

/** For each block, the first table (in document order) that ends right before it or starts right after it. */
function tablesBeside(tables: Extraction['tables']): Map<number, Extraction['tables'][number]> {
  const out = new Map<number, Extraction['tables'][number]>();
  for (const tb of tables) {
    if (!out.has(tb.lastBlock + 1)) out.set(tb.lastBlock + 1, tb);
    if (!out.has(tb.firstBlock - 1)) out.set(tb.firstBlock - 1, tb);
  }
  return out;
}

/**
 * The numbers of one kind tied to a result: those in its clause; else, those before every
 * statistic of its sentence when it is the sentence's only statistic; else, those in sentences
 * of its paragraph that hold no statistic when it is the paragraph's only one (not certain: a
 * later sentence may be about something else).
 */
function owned<T extends Placed>(report: TTestReport, clause: Clause, clauses: ClauseIndex, list: SegmentList<T>): Array<Linked<T>> {
  const inClause = list.betweenInSentence(report.segment, report.sentence, clause.start, clause.end);
  if (inClause.length > 0) return inClause.map((item) => ({ item, basis: 'clause', certain: true }));
  if (clauses.statisticsInSentence(report.segment, report.sentence) === 1) {
    const before = list.inSentence(report.segment, report.sentence).filter((i) => clauses.ownerOf(i) === undefined);
    if (before.length > 0) return before.map((item) => ({ item, basis: 'sentence', certain: true }));
  }
  if (clauses.statisticsInSegment(report.segment) === 1) {
    const elsewhere = list.all(report.segment).filter((i) => i.sentence !== report.sentence && clauses.ownerOf(i) === undefined);
    return elsewhere.map((item) => ({ item, basis: 'paragraph', certain: false }));
  }
  return [];
}

/**
 * Effect sizes of one kind printed together in a clause of a sentence that reports several
 * statistics ("…, t(76) = 0.43, p = .67, differed by d = 0.51 and d = 0.10, respectively"): a list
 * for the sentence's tests, in some order the text may or may not say, so which is this test's
 * cannot be told. Each is then not certain.
 */
function listedTogether(links: Array<Linked<EffectSizeReport>>, statistics: number): Array<Linked<EffectSizeReport>> {
  if (statistics < 2 || links.length < 2) return links;
  const count = new Map<string, number>();
  for (const l of links) if (l.basis === 'clause') count.set(l.item.kind, (count.get(l.item.kind) ?? 0) + 1);
  return links.map((l) => {
    const k = count.get(l.item.kind) ?? 0;
    return l.basis === 'clause' && l.certain && k >= 2 ? Object.assign({}, l, { certain: false, doubt: `is one of ${k} effect sizes printed together in a sentence that reports ${statistics} tests, so which is this test's cannot be told` }) : l;
  });
}

/** Whether no statistic other than the report's own claims the item by its clause. */
function notOwnedByAnother(item: Placed, report: TTestReport, clauses: ClauseIndex): boolean {
  const owner = clauses.ownerOf(item);
  return owner === undefined || (owner.kind === 't' && owner.clause.test === report);
}

const PARAGRAPH_SIZES = 16;

function contextFor(report: TTestReport, clauses: ClauseIndex, n: Lists, t: Tables): ResultContext {
  const clause = clauses.clauseOf(report);
  const { link, unlinked } = descriptivesFor(report, clauses, n, t);

  // A result in a table row owns what its own cell prints after it (its clause); failing that,
  // the effect size, interval and estimate of its row that no other statistic's clause owns
  // (a row may hold a G² or F result with its own d in another cell).
  const row = report.table ? `${report.table.table}:${report.table.row}` : undefined;
  const inRow = <T extends Placed>(items: Map<string, T[]>, list: SegmentList<T>): Array<Linked<T>> => {
    if (!row) return [];
    const own = list.betweenInSentence(report.segment, report.sentence, clause.start, clause.end);
    if (own.length > 0) return own.map((item) => ({ item, basis: 'clause', certain: true }));
    return (items.get(row) ?? []).filter((item) => notOwnedByAnother(item, report, clauses)).map((item) => ({ item, basis: 'table-row', certain: true }));
  };
  // A number of its clause that stands in the lead of the next test of its sentence, after a
  // boundary (a semicolon, ", and", ", but") that follows this result ("…, p = .27); the
  // difference, −2.3 (95% CI …), was significant, t(58) = …"), may be that test's: not certain.
  const next = clause.end !== undefined ? n.tests.betweenInSentence(report.segment, report.sentence, clause.end, clause.end + 1)[0] : undefined;
  // (only a lead that starts after this result: one reaching back over it marks no boundary)
  const nextLead = next?.lead && next.lead.start >= report.span.end ? next.lead.start : undefined;
  const beforeNext = <T extends Placed>(links: Array<Linked<T>>): Array<Linked<T>> =>
    nextLead === undefined ? links : links.map((l) => (l.basis === 'clause' && l.certain && l.item.span.start >= nextLead ? Object.assign({}, l, { certain: false, doubt: 'stands in the words that lead up to the next test of its sentence, so it may be that test\'s' }) : l));
  const effectSizes = row ? inRow(t.rows.effectSizes, n.effectSizes) : listedTogether(beforeNext(owned(report, clause, clauses, n.effectSizes)), clauses.statisticsInSentence(report.segment, report.sentence));
  const intervals = row
    ? inRow(t.rows.intervals, n.intervals).filter(notAnother).map((ci): IntervalLink => Object.assign({}, ci, { of: 'estimate' as const }))
    : beforeNext(owned(report, clause, clauses, n.intervals)).filter(notAnother).map((ci) => intervalTarget(ci, report, clause, n));
  const interval = intervals.find((i) => i.of === 'estimate');
  const leading = clause.leadingEstimate;
  const estimate: Linked<EstimateReport> | undefined = row ? inRow(t.rows.estimates, n.estimates)[0] : leading ? { item: leading, basis: 'clause', certain: true } : owned(report, clause, clauses, n.estimates)[0];
  const coefficient = coefficientOf(report, clause, n.estimates);
  const sentenceReferences = n.references.inSentence(report.segment, report.sentence);
  const reference = sentenceReferences[0] ?? (clauses.testsInSegment(report.segment) === 1 ? n.references.all(report.segment)[0] : undefined);
  // The sentence's own first; then the paragraph's first few (rules take the first that fits,
  // and a bounded list keeps a paragraph of thousands of results linear).
  const sizesKey = sentenceKey(report);
  let sampleSizes = t.memo.sampleSizes.get(sizesKey);
  if (!sampleSizes) {
    sampleSizes = n.sampleSizes.inSentence(report.segment, report.sentence).concat(n.sampleSizes.all(report.segment).slice(0, PARAGRAPH_SIZES));
    t.memo.sampleSizes.set(sizesKey, sampleSizes);
  }
  const pairs = n.groupSizes.inSentence(report.segment, report.sentence);
  const groupSizes = pairs.length === 1 ? (pairs[0] as GroupSizes).ns : undefined;
  // a value the result is compared against, printed in its sentence, makes it a one-sample
  // test ("was above the target of 4, t(23) = …") unless two groups are tied to it
  const againstValue: Setting<Design> | undefined =
    sentenceReferences[0] && link?.groups.length !== 2 && !groupSizes ? { value: 'one-sample', basis: 'sentence', span: sentenceReferences[0].span, printed: sentenceReferences[0].printed } : undefined;
  // no literal opening with a spread: V8 would give each context a hidden class of its own (DEVELOPERS.md, Speed)
  return {
    // one group of descriptives is a one-sample test (or differences) before the Methods' design
    design: unlessOccasions(unlessUnequal(designFor(report, clause, clauses, n.designs, n.tests, t.memo) ?? againstValue ?? (link?.groups.length === 1 ? oneGroup : undefined) ?? assignedGroups(link, t.assignments) ?? t.methodsDesign ?? { value: 'unknown', basis: 'default' }, link, groupSizes, n, report), link),
    ...(link ? { descriptives: link } : {}),
    ...(unlinked ? { unlinked } : {}),
    ...(groupSizes ? { groupSizes } : {}),
    ...(reference ? { reference } : {}),
    ...(interval ? { interval } : {}),
    intervals,
    ...(estimate ? { estimate } : {}),
    ...(coefficient ? { coefficient } : {}),
    effectSizes,
    sampleSizes,
    testsInParagraph: clauses.testsInSegment(report.segment),
  };
}

/**
 * The coefficient a t is the Wald statistic of: a coefficient with its SE printed right after
 * it, in the result's own clause (never one tied by its sentence, paragraph or table). A second coefficient in the clause (`b = 0.42, β = .30, SE =
 * 0.15`) leaves open whose SE is printed, so the tie is then not certain.
 */
function coefficientOf(report: TTestReport, clause: Clause, estimates: SegmentList<EstimateReport>): Linked<EstimateReport & { se: ReportedNumber }> | undefined {
  if (report.table || report.plural) return undefined;
  const inClause = estimates.betweenInSentence(report.segment, report.sentence, clause.start, clause.end).filter((e) => e.kind === 'coefficient');
  const item = inClause.find((e) => e.se);
  if (!item?.se) return undefined;
  const withSe = { ...item, se: item.se };
  if (inClause.length > 1) return { item: withSe, basis: 'clause', certain: false, doubt: `shares its clause with ${inClause.length - 1} other coefficient${inClause.length > 2 ? 's' : ''}, so the SE may be another's` };
  return { item: withSe, basis: 'clause', certain: true };
}

/**
 * What an interval is the interval of: the nearest thing printed before it in its sentence.
 * After an effect size (`d = 0.39, 95% CI [0.10, 0.68]`) it is the effect size's; right after
 * a group's mean and SD it is the group's; otherwise (after the statistic, its p or an
 * estimate) it is the interval of the test's estimate. An interval that cannot hold the effect
 * size before it, at either sign and within the printed rounding (`d = 0.62, 95% CI [1.30,
 * 13.70]`), is not that effect size's: it goes to the next thing before it, and the tie is not
 * certain (it may as well be the effect size's interval, mistyped).
 */
function intervalTarget(ci: Linked<IntervalReport>, report: TTestReport, clause: Clause, n: Lists): IntervalLink {
  const at = ci.item.span.start;
  const candidates: Array<{ end: number; of: IntervalTarget; effectSize?: EffectSizeReport }> = [];
  const es = n.effectSizes.lastBefore(ci.item.segment, ci.item.sentence, at);
  if (es) candidates.push({ end: es.span.end, of: 'effect-size', effectSize: es });
  const group = n.prose.lastBefore(ci.item.segment, ci.item.sentence, at);
  if (group && at - group.span.end < 40) candidates.push({ end: group.span.end, of: 'group' });
  const est = n.estimates.lastBefore(ci.item.segment, ci.item.sentence, at);
  if (est) candidates.push({ end: est.span.end, of: 'estimate' });
  const test = n.tests.lastBefore(ci.item.segment, ci.item.sentence, at);
  if (test) candidates.push({ end: test.span.end, of: 'estimate' });
  if (clause.leadingEstimate && clause.leadingEstimate.span.end <= at) candidates.push({ end: clause.leadingEstimate.span.end, of: 'estimate' });
  candidates.sort((a, b) => b.end - a.end);
  const nearest = candidates[0];
  // Nothing before it in the sentence: an interval opening the sentence of a lone test is the test's.
  if (!nearest) return Object.assign({}, ci, { of: 'estimate' as const });
  if (nearest.effectSize && !canHold(ci.item, nearest.effectSize.value)) {
    const next = candidates.find((c) => c.of !== 'effect-size') ?? { of: 'estimate' as const };
    return Object.assign({}, ci, { certain: false, doubt: `it follows ${nearest.effectSize.printed}, which it cannot hold, so it may be that effect size's interval mistyped`, of: next.of });
  }
  return Object.assign({}, ci, { of: nearest.of }, nearest.effectSize ? { effectSize: nearest.effectSize } : undefined);
}

/**
 * An interval printed right after another estimate than the test's ("ICC = 0.86 (95% CI …)", an
 * "SMD", an "AUC (95% CI)" column; IntervalReport.ofOther) is that estimate's, not the result's.
 */
const notAnother = (ci: Linked<IntervalReport>): boolean => ci.item.ofOther === undefined;

/** Whether an interval, widened by half a unit of its last printed digits, holds ±x (x widened likewise). */
function canHold(ci: IntervalReport, x: ReportedNumber): boolean {
  const half = (r: ReportedNumber) => 0.5 * 10 ** (r.exponent - r.decimals);
  const low = Math.min(ci.low.value, ci.high.value) - half(ci.low) - half(x);
  const high = Math.max(ci.low.value, ci.high.value) + half(ci.high) + half(x);
  return [x.value, -x.value].some((v) => v >= low && v <= high);
}

function descriptivesFor(report: TTestReport, clauses: ClauseIndex, n: Lists, t: Tables): { link?: DescriptiveLink; unlinked?: ResultContext['unlinked'] } {
  if (report.table) return tableDescriptives(report, report.table, t);
  const blockKey = `${report.segment}:${report.sentence}:${report.block}`;
  let testsInSentence = t.memo.testsInSentence.get(blockKey);
  if (testsInSentence === undefined) {
    testsInSentence = n.tests.inSentence(report.segment, report.sentence).filter((x) => x.block === report.block).length;
    t.memo.testsInSentence.set(blockKey, testsInSentence);
  }
  const inSentence = n.prose.inSentence(report.segment, report.sentence);
  // certain when no other test of means shares the sentence (a χ² or a correlation cannot
  // claim a group's mean and SD)
  const aloneInSentence = clauses.meanTestsInSentence(report.segment, report.sentence) === 1;
  if (inSentence.length > 0) {
    if (inSentence.length <= 2 && testsInSentence === 1) return { link: withLeadDoubt(report, makeLink('sentence', [...inSentence], t.spreads, aloneInSentence)) };
    return { unlinked: { reason: `${inSentence.length} sets of descriptives and ${testsInSentence} tests in one sentence`, span: report.span } };
  }
  const paragraphGroups = n.prose.all(report.segment);
  // Only a paragraph with a single test can take descriptives from its other sentences.
  const inParagraph = paragraphGroups.length > 0 && paragraphGroups.length <= 8 ? paragraphGroups.filter((g) => n.tests.inSentence(g.segment, g.sentence).length === 0) : paragraphGroups;
  if (inParagraph.length > 0) {
    const testsInBlock = clauses.testsInSegment(report.segment);
    if (inParagraph.length <= 2 && testsInBlock === 1) return { link: withLeadDoubt(report, makeLink('paragraph', inParagraph, t.spreads, clauses.meanTestsInSegment(report.segment) === 1)) };
    return { unlinked: { reason: `${inParagraph.length} sets of descriptives and ${testsInBlock} tests in one paragraph`, span: report.span } };
  }
  // "Job satisfaction was higher …, t(57.3) = 4.04" beside a long table: the block of the
  // measure the sentence names, when it names one
  // measure the sentence names, when it names one, the table reports no test of its own, and
  // the result's paragraph sits right beside it (a caption or note between them)
  const named = t.mentions.get(sentenceKey(report)) ?? [];
  if (named.length === 1) {
    const m = named[0] as Extraction['tableMentions'][number];
    const table = t.byId.get(m.table);
    const beside = table !== undefined && report.block >= table.firstBlock - BESIDE && report.block <= table.lastBlock + BESIDE;
    const blocks = (t.blocks.get(m.table) ?? []).filter((b) => b.label.toLowerCase() === m.label);
    const block = blocks.length === 1 ? blocks[0] : undefined;
    const groups = block && beside && !t.tablesWithTests.has(m.table) ? blockGroups(block, t) : [];
    if (groups.length === 2) return { link: makeLink('table', groups, t.spreads, true) };
  }
  const table = t.beside.get(report.block);
  const rows = table ? (t.tableRows.get(table.table) ?? []) : [];
  const claimants = table ? [...(t.testsByBlock.get(table.lastBlock + 1) ?? []), ...(t.testsByBlock.get(table.firstBlock - 1) ?? [])] : [];
  if (rows.length > 0) {
    if (rows.length <= 2 && claimants.length === 1) return { link: makeLink('table', rows, t.spreads, false) };
    return { unlinked: { reason: `a table of ${rows.length} groups beside ${claimants.length} tests`, span: report.span } };
  }
  return {};
}

/**
 * The groups of a result printed in a table: the groups of its own row (a wide layout prints
 * both there), else those of its measure's block (a long layout prints one group per row, the
 * test in the block's first row or in a row of its own).
 */
/** How many blocks (a caption, a note) may stand between a table and the paragraph that reports its tests. */
const BESIDE = 3;

function tableDescriptives(report: TTestReport, where: TableRow, t: Tables): { link?: DescriptiveLink; unlinked?: ResultContext['unlinked'] } {
  const own = t.rows.groups.get(`${where.table}:${where.row}`) ?? [];
  if (own.length === 2) return { link: makeLink('table', own, t.spreads, true) };
  const block = (t.blocks.get(where.table) ?? []).find((b) => b.firstRow <= where.row && where.row <= b.lastRow);
  const groups = block ? blockGroups(block, t) : own;
  // a table laid out one group per row, each row its own block ("Group | n | M (SD) | t | p"),
  // the test in the first group's row: the next row is the other group when it is one group
  // with no test of its own
  // (not a row whose own test is one-sample: its df is its own n − 1), or in the last group's
  // row, the row before it
  const n = groups.length === 1 ? groups[0]?.n?.value : undefined;
  const oneSample = n !== undefined && report.df !== undefined && report.df.value === n - 1;
  const after = block && groups.length === 1 && !oneSample ? groupRowsAfter(block, t) : [];
  const before = block && groups.length === 1 && !oneSample && after.length === 0 ? groupRowsBeside(block, t, -1) : [];
  if (after.length === 1) return { link: makeLink('table', [...groups, ...after], t.spreads, true) };
  if (before.length === 1) return { link: makeLink('table', [...before, ...groups], t.spreads, true) };
  if (after.length > 1 || before.length > 1) return { unlinked: { reason: 'the test stands in one of three or more group rows of its table, and which of them it compares is not said', span: report.span } };
  if (groups.length === 2 || groups.length === 1) return { link: makeLink('table', groups, t.spreads, true) };
  if (groups.length > 2) return { unlinked: { reason: `${groups.length} groups in the table rows of this test`, span: report.span } };
  return {};
}

/**
 * The group rows right after a block, up to the next row that prints a test: each a block of
 * one row holding one group and no test. One such row is the second group of a test printed in
 * the first group's row; more leave which of them it is compared with open.
 */
function groupRowsAfter(block: TableBlockRecord, t: Tables): GroupSummary[] {
  return groupRowsBeside(block, t, 1);
}

/**
 * The group rows on one side of a block (`step` 1: after it, −1: before it), up to the next row
 * that prints a test or is not one group alone, and never a row of the whole sample ("Total",
 * "All", "Overall"), which is no group of a comparison. Two are enough to know the comparison is
 * open.
 */
function groupRowsBeside(block: TableBlockRecord, t: Tables, step: 1 | -1): GroupSummary[] {
  const blocks = t.blocks.get(block.table) ?? [];
  const out: GroupSummary[] = [];
  for (let row = step === 1 ? block.lastRow + 1 : block.firstRow - 1; out.length < 2 && row >= 0; row += step) {
    const beside = blockAt(blocks, row);
    if (!beside || beside.firstRow !== row || beside.lastRow !== row || t.testRows.has(`${block.table}:${row}`) || WHOLE_SAMPLE_ROW.test(beside.label)) break;
    const groups = blockGroups(beside, t);
    if (groups.length !== 1) break;
    out.push(groups[0] as GroupSummary);
  }
  return out;
}

/** A table row of the whole sample: "Total", "All participants", "Overall", "Whole sample", "Combined". */
const WHOLE_SAMPLE_ROW = /^(?:total|all|overall|whole|combined|both groups|full sample|entire sample)(?![\p{L}])/iu;

function blockGroups(block: TableBlockRecord, t: Tables): GroupSummary[] {
  const out: GroupSummary[] = [];
  for (let r = block.firstRow; r <= block.lastRow; r += 1) for (const g of t.rows.groups.get(`${block.table}:${r}`) ?? []) out.push(g);
  return out;
}

/** Items by key, each list in the items' order (Map.groupBy arrives only in Node 21). */
export function groupBy<T, K>(items: readonly T[], keyOf: (item: T) => K): Map<K, T[]> {
  const m = new Map<K, T[]>();
  for (const it of items) {
    const k = keyOf(it);
    const list = m.get(k);
    if (list) list.push(it);
    else m.set(k, [it]);
  }
  return m;
}

/**
 * Descriptives printed outside the test's own lead (in another sentence, or before a clause
 * boundary such as ", but" in its sentence) are certainly the test's only when the lead names
 * nothing their text does not: "At baseline the arms scored 20.1 (…) and 19.8 (…). Over the
 * twelve weeks the coached arm improved more, t(58) = …" names a time and a change the baseline
 * sentence does not, so those means may be of something else. A lead in the words of reporting
 * alone ("The difference was significant, t(58) = …") refers back to them.
 */
function withLeadDoubt(report: TTestReport, link: DescriptiveLink): DescriptiveLink {
  const lead = report.lead;
  if (!lead || !link.certain || lead.words.length === 0) return link;
  const outside = link.groups.every((g) => g.sentence !== report.sentence || g.span.end <= lead.start);
  if (!outside) return link;
  const known = new Set(link.groups.flatMap((g) => g.topic ?? []));
  const unknown = lead.words.filter((w) => !known.has(stem(w)));
  if (unknown.length === 0) return link;
  const where = link.groups.some((g) => g.sentence !== report.sentence) ? 'another sentence' : 'an earlier clause';
  return { ...link, certain: false, doubt: `the descriptives are printed in ${where}, and the test's words "${unknown.slice(0, 4).join(' ')}" do not appear there, so they may be of another measure, time or group` };
}

function makeLink(scope: DescriptiveLink['scope'], groups: GroupSummary[], spreads: SpreadStatements, certain: boolean): DescriptiveLink {
  const kinds: SpreadKind[] = [];
  let source: DescriptiveLink['spreadKindSource'];
  let other: Extraction['statements'][number] | undefined;
  for (const g of groups) {
    let kind: SpreadKind = g.spread?.kind ?? 'unstated';
    if (kind === 'unstated') {
      const st = spreads.kindFor(g);
      if (st?.spread) {
        kind = st.spread;
        source = { span: st.span, printed: st.printed };
      } else if (st?.spreadOther && g.spread) other = st;
    }
    kinds.push(kind);
  }
  // "±" said to be neither an SD nor an SE: no reading of it as either is certain
  if (other) return { scope, groups, spreadKinds: kinds, certain: false, doubt: `the text says "±" stands for "${other.printed}", neither an SD nor an SE` };
  return { scope, groups, spreadKinds: kinds, ...(source ? { spreadKindSource: source } : {}), certain };
}

/**
 * What "±" stands for, for one group: a statement in the group's own sentence; else one in a
 * sentence of its paragraph that prints no descriptives ("Values are mean ± SEM."); else the
 * statements of the document's sentences without descriptives, when they agree. A label
 * printed beside another group ("(38.2 ± 6.4) (mean ± s.d.)") is that group's only.
 */
export interface SpreadStatements {
  kindFor(g: GroupSummary): Extraction['statements'][number] | undefined;
}

export function spreadStatements(x: Extraction): SpreadStatements {
  const statements = x.statements.filter((s) => s.kind === 'spread');
  const withDescriptives = new Set(x.summaries.map((g) => sentenceKey(g)));
  const bySentence = new Map<string, Extraction['statements'][number]>();
  for (const s of statements) if (!bySentence.has(sentenceKey(s))) bySentence.set(sentenceKey(s), s);
  const general = statements.filter((s) => !withDescriptives.has(sentenceKey(s)));
  const bySegment = new Map<number, Extraction['statements'][number]>();
  for (const s of general) if (!bySegment.has(s.segment)) bySegment.set(s.segment, s);
  const agreed = general.length > 0 && general.every((s) => s.spread === general[0]?.spread) ? general[0] : undefined;
  return { kindFor: (g) => bySentence.get(sentenceKey(g)) ?? bySegment.get(g.segment) ?? agreed };
}

/** How far before a test's statistic (source characters) the words that name it stand ("paired t(29)", "a paired-samples t-test gave t(29)"). */
const NAME_REACH = 40;

/**
 * The design as the words beside the result say it: the test named with the statistic
 * ("paired t(22)", "Welch's t"), design words in its clause, in its sentence, then in the
 * sentences of its paragraph that report no test (when they agree). Undefined when none do:
 * then structure (one group), the Methods' design, or unknown.
 */
function designFor(report: TTestReport, clause: Clause, clauses: ClauseIndex, designs: SegmentList<DesignStatement>, tests: SegmentList<TTestReport>, memo: Tables['memo']): Setting<Design> | undefined {
  const named = report.namedVariant;
  if (named === 'paired') return { value: 'paired', basis: 'in-report' };
  if (named === 'welch' || named === 'student' || named === 'independent') return { value: 'independent', basis: 'in-report' };
  if (named === 'one-sample') return { value: 'one-sample', basis: 'in-report' };
  const pick = (ds: readonly DesignStatement[], basis: Setting<Design>['basis']): Setting<Design> | undefined => {
    const first = ds[0];
    if (!first || !ds.every((d) => d.design === first.design)) return undefined;
    return saidIn({ value: first.design, basis, span: first.span, printed: first.printed }, first);
  };
  const inClause = pick(designs.betweenInSentence(report.segment, report.sentence, clause.start, clause.end), 'sentence');
  if (inClause) return inClause;
  // its lead: the words that lead up to it in its sentence ("…, but another paired t-test
  // suggests that … (t(27) = …"), though another statistic's clause reaches over them
  const lead = report.lead;
  const inLead = lead ? pick(designs.betweenInSentence(report.segment, report.sentence, lead.start, report.span.start), 'sentence') : undefined;
  if (inLead) return inLead;
  const reportSentence = sentenceKey(report);
  // words in a statistic's clause are that statistic's ("paired t(29) = …, and the groups
  // differed, t(58) = …"; its own clause was read above): the sentence's words outside every
  // clause, read once per sentence
  let sentence = memo.sentenceDesign.get(reportSentence);
  if (sentence === undefined) {
    // nor the words that name a test right before its statistic ("(paired t(29) = …")
    const named = tests.inSentence(report.segment, report.sentence).filter((x) => x.namedVariant !== undefined);
    const namesATest = (d: DesignStatement) => named.some((x) => x.span.start >= d.span.end && x.span.start - d.span.end <= NAME_REACH);
    sentence = pick(designs.inSentence(report.segment, report.sentence).filter((d) => clauses.ownerOf(d) === undefined && !namesATest(d)), 'sentence') ?? null;
    memo.sentenceDesign.set(reportSentence, sentence);
  }
  if (sentence) return sentence;
  // the paragraph's words about the design, from sentences that report no test: words beside
  // another result ("each staff member measured twice") are that result's
  // nor from a sentence about one study ("Experiment 2 used a within-participants design"),
  // which the paragraph of an abstract or discussion sets beside results of another study
  let paragraph = memo.paragraphDesign.get(report.segment);
  if (paragraph === undefined) {
    paragraph = pick(designs.all(report.segment).filter((d) => clauses.statisticsInSentence(d.segment, d.sentence) === 0 && !d.namesStudy), 'paragraph') ?? null;
    memo.paragraphDesign.set(report.segment, paragraph);
  }
  if (paragraph) return paragraph;
  return undefined;
}

/**
 * Independent groups, when the two groups tied to the result with certainty are, one each, the
 * two groups the text says units were randomised to: each group's own name beside its numbers
 * ("the incentive group (M = …)", "7.34 (1.97) in the usual-routine group"). A name said after the
 * numbers is the group's when there is one; a group with no name, or with both, ties nothing.
 */
function assignedGroups(link: DescriptiveLink | undefined, assignments: readonly GroupAssignment[]): Setting<Design> | undefined {
  if (!link?.certain || link.groups.length !== 2 || assignments.length === 0) return undefined;
  for (const a of assignments) {
    const [first, second] = link.groups.map((g) => nameOf(g, a.names));
    if (first !== undefined && second !== undefined && first !== second) return { value: 'independent', basis: 'methods', span: a.span, printed: a.printed };
  }
  return undefined;
}

/** Which of the two names a group's own words carry (index), if exactly one. */
function nameOf(g: GroupSummary, names: readonly [string, string]): number | undefined {
  const carries = (words: string | undefined) => {
    if (!words) return [];
    const w = words.toLowerCase();
    return names.flatMap((name, i) => (containsName(w, name) ? [i] : []));
  };
  const after = carries(g.labelAfter);
  const own = after.length > 0 ? after : carries(g.label);
  return own.length === 1 ? own[0] : undefined;
}

/** Whether the name stands in the words as whole words (a hyphen joins: "incentive" is not in "no-incentive"). */
function containsName(words: string, name: string): boolean {
  const joined = (c: string | undefined) => c !== undefined && /[\p{L}\p{N}-]/u.test(c);
  for (let at = words.indexOf(name); at >= 0; at = words.indexOf(name, at + 1)) {
    if (!joined(words[at - 1]) && !joined(words[at + name.length])) return true;
  }
  return false;
}

/** The design words a design read from the text rests on (their sentence), by the setting made from them. */
const designSources = new WeakMap<Setting<Design>, DesignStatement>();
const saidIn = (design: Setting<Design>, statement: DesignStatement): Setting<Design> => {
  designSources.set(design, statement);
  return design;
};

/**
 * A paired design read from words (not from the test's own name, "paired t(22)") does not hold
 * for a result whose two groups are printed with different sizes ("in the 14 men and 10
 * women"): one set of units measured twice has one size, so the words are about another
 * comparison, or units were lost between the measurements. Nor where the two groups' sizes add
 * up to the number of units the design words' own sentence counts ("40 participants completed
 * both sessions", or "Forty participants …" as a sentence opens, beside women, n = 20, and men, n = 20): the groups split the units, so the
 * comparison is between them, not of the units measured twice. Either way the design is not
 * certain: unknown.
 */
function unlessUnequal(design: Setting<Design>, link: DescriptiveLink | undefined, groupSizes: readonly ReportedNumber[] | undefined, lists: Pick<Lists, 'sampleSizes' | 'unitCounts'>, report: TTestReport): Setting<Design> {
  const { sampleSizes } = lists;
  if (design.value !== 'paired' || design.basis === 'in-report') return design;
  // the two groups' sizes: with their descriptives, printed together, or the two sizes of its own sentence ("(n = 26) … (n = 26)")
  const own = link ? [] : groupScoped(sampleSizes.inSentence(report.segment, report.sentence));
  const ns = link?.groups.length === 2 && link.groups.every((g) => g.n) ? link.groups.map((g) => g.n?.value as number) : groupSizes?.length === 2 ? groupSizes.map((g) => g.value) : own.length === 2 ? own.map((x) => x.n.value) : undefined;
  if (!ns) return design;
  const [a, b] = ns as [number, number];
  if (a !== b) return { value: 'unknown', basis: 'default' };
  const source = designSources.get(design);
  if (source) {
    const sizes = sampleSizes.inSentence(source.segment, source.sentence);
    const worded = lists.unitCounts.inSentence(source.segment, source.sentence);
    if (counts(sizes, worded, a + b) && !counts(sizes, worded, a)) return { value: 'unknown', basis: 'default' };
  }
  return design;
}

/**
 * Independent groups read from words (not from the test's own name, "Welch's t") do not hold
 * for a result whose two groups are, one each, two occasions of measurement: "In the yoga arm,
 * pain fell from baseline (M = …) to week 8 (M = …), t(29) = …" compares one arm with itself,
 * whatever the Methods say of the trial ("randomised to yoga or usual care"). The words are
 * about another comparison, so the design is not certain: unknown. The same occasion on both
 * sides ("the yoga arm at week 8 (…) and usual care at week 8 (…)") changes nothing.
 */
function unlessOccasions(design: Setting<Design>, link: DescriptiveLink | undefined): Setting<Design> {
  if (design.value !== 'independent' || design.basis === 'in-report' || link?.groups.length !== 2) return design;
  const [a, b] = link.groups.map((g) => g.occasion);
  return a !== undefined && b !== undefined && a !== b ? { value: 'unknown', basis: 'default' } : design;
}

/** A sentence's sizes that may be a group's, and the totals it counts, each read once per sentence (its shared list): a sentence of thousands of results stays linear. */
const groupScopedOf = new WeakMap<readonly SampleSize[], SampleSize[]>();
const countedOf = new WeakMap<readonly SampleSize[], Set<number>>();
function groupScoped(list: readonly SampleSize[]): SampleSize[] {
  let own = groupScopedOf.get(list);
  if (!own) {
    own = list.filter((x) => x.scope !== 'total' && x.scope !== 'subset');
    groupScopedOf.set(list, own);
  }
  return own;
}
function countedIn(list: readonly SampleSize[]): Set<number> {
  let counted = countedOf.get(list);
  if (!counted) {
    counted = new Set(list.filter((x) => x.scope === 'total' || x.scope === 'unspecified').map((x) => x.n.value));
    countedOf.set(list, counted);
  }
  return counted;
}

/** Whether a sentence counts `n` units: a total it states, or a count spelled out ("Forty participants took part in this within-subject study", as a sentence must open). */
function counts(sizes: readonly SampleSize[], unitCounts: readonly UnitCount[], n: number): boolean {
  return countedIn(sizes).has(n) || unitCounts.some((c) => c.worded && c.value === n);
}

/** Structure, when nothing beside the result says the design: one group is one-sample (or differences). */
const oneGroup: Setting<Design> = { value: 'one-sample', basis: 'structure' };

/**
 * Whether the document reports several studies: a heading names a second study or experiment,
 * or a Methods section comes after a Results section. Then a Methods statement may be about
 * another study than the result, and no design is taken from the Methods.
 */
function severalStudies(sections: ReadonlyArray<string | undefined>): boolean {
  let resultsSeen = false;
  for (const name of sections) {
    if (name === undefined) continue;
    if (SECOND_STUDY.test(name)) return true;
    if (RESULTS_SECTION.test(name)) resultsSeen = true;
    else if (resultsSeen && METHODS_SECTION.test(name)) return true;
  }
  return false;
}

const RESULTS_SECTION = /result|finding/i;
const SECOND_STUDY = /(?<![\p{L}])(?:study|experiment)\s?(?:2|3|4|5|II|III|two|three)(?![\p{L}\p{N}])/iu;

/** Section headings under which the text describes the study's design. */
const METHODS_SECTION = /method|design|procedure|participant|analys|statistic|material|protocol|setting|sample|measure|intervention|apparatus|stimul|instrument/i;

/**
 * The study's design as its Methods describe it: the design words of Methods sections, in
 * sentences that report no test, when they all say the same ("Each nurse completed both
 * conditions in random order"). Words for both designs there ("randomly assigned to two
 * groups … the same staff were measured twice") leave it unknown.
 */
function methodsDesign(x: Extraction, clauses: ClauseIndex): Setting<Design> | undefined {
  if (severalStudies(x.sections)) return undefined;
  // one-sample tests named beside paired or independent ones are about single groups: they
  // do not contradict the design of the comparisons
  const inMethods = x.designs.filter((d) => d.design !== 'one-sample' && METHODS_SECTION.test(x.sections[d.segment] ?? '') && clauses.statisticsInSentence(d.segment, d.sentence) === 0);
  const first = inMethods[0];
  if (!first || !inMethods.every((d) => d.design === first.design)) return undefined;
  return saidIn({ value: first.design, basis: 'methods', span: first.span, printed: first.printed }, first);
}

/** Most groups an F's summaries may count (the numerics search 2^k corners; see oneWayFRange). */
const MAX_F_GROUPS = 12;

/**
 * Ties groups' printed summaries (mean, spread, n) to an F, as descriptives are tied to a
 * t-test: the prose groups of the F's sentence when it is the sentence's only test of means (t
 * or F); else the groups of its paragraph's sentences that report no statistic, when it is the
 * paragraph's only test of means, certain only when those groups stand in one sentence (groups
 * spread over several sentences may be of several measures). With no prose groups in its
 * paragraph, the groups of a table the F's words name (`tableGroupsFor`). Two to MAX_F_GROUPS
 * groups; anything else gives nothing. Linear: each lookup is by sentence, segment or table,
 * counted once.
 */
export function fGroupsJoiner(x: Extraction): (o: OtherStatistic) => DescriptiveLink | undefined {
  // nothing to index in a document without an F beside prose groups
  if (x.summaries.length < 2 || !x.otherStatistics.some((o) => o.kind === 'F')) return () => undefined;
  const clauses = clauseIndex(x);
  const prose = proseGroups(x, new SegmentList(x.tests));
  const spreads = spreadStatements(x);
  const tables = tableGroupsFor(x, clauses, spreads);
  const before = previousParagraphGroupsFor(x, clauses, prose, spreads);
  return (o) => {
    if (o.kind !== 'F') return undefined;
    const inSentence = prose.inSentence(o.segment, o.sentence);
    if (inSentence.length > 0) {
      if (inSentence.length < 2 || inSentence.length > MAX_F_GROUPS || clauses.meanTestsInSentence(o.segment, o.sentence) !== 1) return undefined;
      return makeLink('sentence', [...inSentence], spreads, true);
    }
    const all = prose.all(o.segment);
    // groups in its paragraph's prose are the F's or another's: never a table's beside them
    if (all.length === 0) return tables(o) ?? before(o);
    if (clauses.meanTestsInSegment(o.segment) !== 1) return undefined;
    if (all.length > 4 * MAX_F_GROUPS) return undefined;
    const groups = all.filter((g) => clauses.statisticsInSentence(g.segment, g.sentence) === 0);
    if (groups.length < 2 || groups.length > MAX_F_GROUPS) return undefined;
    const sentences = new Set(groups.map((g) => g.sentence)).size;
    const link = makeLink('paragraph', groups, spreads, sentences === 1);
    return sentences === 1 ? link : { ...link, doubt: `the groups are printed in ${sentences} sentences of the paragraph, which may be of more than one measure` };
  };
}

/**
 * The groups of the paragraph right before an F's, tied only where the tie is as certain as one
 * in the F's own sentence: the F is the only statistic of its paragraph, which names no table
 * and prints no groups; the paragraph before (the block right before, so no heading, table or
 * other paragraph stands between) reports no statistic and prints its two to MAX_F_GROUPS groups
 * in one sentence; every content word of the F's lead ("The composite index at follow-up
 * differed across sites, F(…)", words naming the ANOVA itself aside) is in that sentence, and
 * the lead names at least one; no words in either paragraph name another analysis than a
 * one-way between-groups ANOVA, and the F's dfs are exactly (k − 1, N − k) of those groups.
 * Anything short of that ties nothing.
 */
function previousParagraphGroupsFor(x: Extraction, clauses: ClauseIndex, prose: SegmentList<GroupSummary>, spreads: SpreadStatements): (o: OtherStatistic) => DescriptiveLink | undefined {
  const byBlock = groupBy(
    x.summaries.filter((g) => !g.table),
    (g) => g.block,
  );
  const namingTables = new Set(x.tableReferences.map((r) => r.segment));
  return (o) => {
    if (!o.leadStems || o.leadStems.length === 0 || o.analysisWords || o.paragraphAnalysisWords || o.dfCorrection || o.sameAsT) return undefined;
    const [df1, df2] = o.dfs ?? [];
    if (!df1 || !df2 || df1.decimals > 0 || df2.decimals > 0) return undefined;
    if (namingTables.has(o.segment) || clauses.statisticsInSegment(o.segment) !== 1) return undefined;
    const groups = byBlock.get(o.block - 1) ?? [];
    const first = groups[0];
    if (!first || groups.length < 2 || groups.length > MAX_F_GROUPS) return undefined;
    // every group of that block, unclaimed by a test, in one sentence of one paragraph without statistics
    if (prose.all(first.segment).length !== groups.length) return undefined;
    if (!groups.every((g) => g.segment === first.segment && g.sentence === first.sentence && !g.paragraphAnalysisWords)) return undefined;
    if (clauses.statisticsInSegment(first.segment) !== 0) return undefined;
    if (!groups.every((g) => g.mean && g.spread && g.n && g.n.decimals === 0 && g.n.value >= 1)) return undefined;
    // each group's words run from its sentence's start to it: together, the sentence up to the last
    const topic = new Set(groups.flatMap((g) => g.topic ?? []));
    if (!o.leadStems.every((w) => topic.has(w))) return undefined;
    const k = groups.length;
    const total = groups.reduce((a, g) => a + (g.n as ReportedNumber).value, 0);
    if (df1.value !== k - 1 || df2.value !== total - k) return undefined;
    return makeLink('previous-paragraph', [...groups], spreads, true);
  };
}

/** One set of groups in a table: a wide row (its label the row's), a long block, or a whole long table. */
interface TableSet {
  label?: string;
  groups: GroupSummary[];
}

/**
 * The groups of a table an F names, tied only where every link is certain:
 * - the F's sentence names the table by its caption's number ("Table 2"), or else its paragraph
 *   does and no sentence of it names another (a plural "Tables 2 and 3" names none for sure);
 * - nothing beside the F names another analysis than a one-way between-groups ANOVA (in its
 *   sentence or anywhere in its paragraph: "we computed ANCOVAs" two sentences before), nor a
 *   sphericity correction, and it is its sentence's only test of means;
 * - the table holds one set of groups for the outcome the F names: the one set whose row or
 *   block label the F's sentence names (and no other label of the table), or, in a table of a
 *   single set without labels, a word of the caption the F's sentence shares;
 * - every group prints its mean, spread and n, and the F's dfs are exactly (k − 1, N − k).
 * A single set whose caption shares no word with the F's sentence is tied without certainty (a
 * finding on it is a note); anything else ties nothing. A table named only by the paragraph
 * needs the F to be the paragraph's only test of means when it is chosen by its caption.
 */
function tableGroupsFor(x: Extraction, clauses: ClauseIndex, spreads: SpreadStatements): (o: OtherStatistic) => DescriptiveLink | undefined {
  if (x.tableReferences.length === 0 || !x.summaries.some((g) => g.table)) return () => undefined;
  const references = new SegmentList(x.tableReferences);
  const captions = new Map(x.tableCaptions.map((c) => [c.table, c]));
  const mentions = groupBy(x.tableLabelMentions, (m) => `${m.segment}:${m.sentence}:${m.table}`);
  const summaries = groupBy(x.summaries.filter((g) => g.table), (g) => (g.table as TableRow).table);
  const blocks = groupBy(x.tableBlocks, (b) => b.table);
  const sets = new Map<number, TableSet[]>();
  const setsOf = (table: number): TableSet[] => {
    let found = sets.get(table);
    if (!found) {
      found = tableSets(summaries.get(table) ?? [], blocks.get(table) ?? []);
      sets.set(table, found);
    }
    return found;
  };
  // the table a sentence or paragraph names, and the labels a sentence names, once each: a
  // sentence of thousands of Fs naming a table stays linear
  const namedBy = new Map<string, { reference: TableReference; own: boolean } | null>();
  const nameOf = (list: readonly TableReference[], own: boolean) => {
    const first = list[0];
    return first && first.table !== undefined && list.every((r) => !r.plural && r.table === first.table) ? { reference: first, own } : null;
  };
  const tableNamed = (o: OtherStatistic) => {
    const key = sentenceKey(o);
    let found = namedBy.get(key);
    if (found === undefined) {
      const own = references.inSentence(o.segment, o.sentence);
      if (own.length > 0) found = nameOf(own, true);
      else {
        const paragraph = `${o.segment}`;
        found = namedBy.get(paragraph);
        if (found === undefined) {
          found = nameOf(references.all(o.segment), false);
          namedBy.set(paragraph, found);
        }
      }
      namedBy.set(key, found);
    }
    return found;
  };
  const saidIn = new Map<string, Set<string>>();
  const sharedIn = new Map<string, { shared: string[]; missing: string[] }>();
  return (o) => {
    if (o.analysisWords || o.paragraphAnalysisWords || o.dfCorrection || o.sameAsT) return undefined;
    const [df1, df2] = o.dfs ?? [];
    if (!df1 || !df2 || df1.decimals > 0 || df2.decimals > 0) return undefined;
    if (clauses.meanTestsInSentence(o.segment, o.sentence) !== 1) return undefined;
    const named = tableNamed(o);
    if (!named) return undefined;
    const first = named.reference;
    const own = named.own;
    const table = first.table as number;
    const caption = captions.get(table);
    if (!caption) return undefined;
    const all = setsOf(table);
    if (all.length === 0) return undefined;
    const sayKey = `${o.segment}:${o.sentence}:${table}`;
    let said = saidIn.get(sayKey);
    if (!said) {
      said = new Set((mentions.get(sayKey) ?? []).map((m) => m.label));
      saidIn.set(sayKey, said);
    }
    let set: TableSet | undefined;
    let outcome: NonNullable<DescriptiveLink['tableTie']>['outcome'];
    let doubt: string | undefined;
    // the caption's words the F's sentence shares, and those it does not ("at baseline")
    let words = sharedIn.get(sayKey);
    if (!words) {
      const stems = new Set(o.sentenceStems ?? []);
      words = { shared: caption.words.filter((_, i) => stems.has(caption.stems[i] as string)), missing: caption.words.filter((_, i) => !stems.has(caption.stems[i] as string)) };
      sharedIn.set(sayKey, words);
    }
    const only = all.length === 1 ? all[0] : undefined;
    if (only && only.label === undefined) {
      if (!own && clauses.meanTestsInSegment(o.segment) !== 1) return undefined;
      set = only;
      outcome = { by: 'caption', words: words.shared };
      if (words.shared.length === 0) doubt = `the F's sentence shares no word with the caption of ${caption.name}, so the table's groups may be of another measure`;
    } else {
      if (said.size !== 1) return undefined;
      const label = [...said][0] as string;
      const matching = all.filter((s) => s.label?.toLowerCase() === label);
      if (matching.length !== 1) return undefined;
      set = matching[0] as TableSet;
      outcome = { by: 'label', words: [set.label as string] };
    }
    // a caption naming what the F's sentence does not (a time, a subsample) may be of other data
    if (!doubt && words.missing.length > 0) doubt = `the caption of ${caption.name} names "${words.missing.slice(0, 4).join(' ')}", which the F's sentence does not, so the table may be of another time, sample or measure`;
    const groups = set.groups;
    const k = groups.length;
    if (k < 2 || k > MAX_F_GROUPS || !groups.every((g) => g.mean && g.spread && g.n && g.n.decimals === 0 && g.n.value >= 1)) return undefined;
    const total = groups.reduce((a, g) => a + (g.n as ReportedNumber).value, 0);
    if (df1.value !== k - 1 || df2.value !== total - k) return undefined;
    const link = makeLink('table', [...groups], spreads, doubt === undefined);
    return {
      ...link,
      ...(doubt ? { doubt } : {}),
      tableTie: { name: caption.name, named: { span: first.span, printed: first.printed, basis: own ? 'sentence' : 'paragraph' }, outcome },
    };
  };
}

/**
 * The sets of groups a table prints: each row holding two or more groups (a wide layout, one
 * measure per row, labelled by its row's block); rows holding one group each (a long layout)
 * form one set when each is a block of its own labelled by the group itself (the group's name
 * in the first column), else one set per block, labelled by the block's measure. A table mixing
 * both layouts gives no set.
 */
function tableSets(summaries: readonly GroupSummary[], blocks: readonly TableBlockRecord[]): TableSet[] {
  const byRow = groupBy(summaries, (g) => (g.table as TableRow).row);
  const blockOf = (row: number): TableBlockRecord | undefined => blockAt(blocks, row);
  const wide: TableSet[] = [];
  const long: GroupSummary[] = [];
  for (const [row, groups] of byRow) {
    if (groups.length >= 2) {
      const label = blockOf(row)?.label;
      wide.push({ ...(label ? { label } : {}), groups });
    } else for (const g of groups) long.push(g);
  }
  if (wide.length > 0 && long.length > 0) return [];
  if (wide.length > 0) return wide;
  const byBlock = groupBy(long, (g) => blockOf((g.table as TableRow).row));
  const ownBlocks = [...byBlock].every(([b, gs]) => b !== undefined && gs.length === 1 && (gs[0]?.label ?? '') === b.label);
  if (ownBlocks) return long.length > 0 ? [{ groups: long }] : [];
  const out: TableSet[] = [];
  for (const [b, gs] of byBlock) {
    if (!b) return [];
    out.push({ label: b.label, groups: gs });
  }
  return out;
}
