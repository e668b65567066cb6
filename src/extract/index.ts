import type { ParsedDocument, Segment } from '../parse/types.js';
import { decimalConvention, withDecimalPoints } from './decimals.js';
import { sentenceStarts } from './numbers.js';
import { findStatements } from './statements.js';

/** Cheap pre-check (no global state) before the sentence-level search for t-less p values. */
const MAY_NAME_T_TEST = /t[- ]tests?|(?:Student|Welch)/i;
import { findMentions, findSoftwareHeaders } from './mentions.js';
import { findIntegerMeasures, findMeasureMentions } from './measures.js';
import { findAssignments } from './assignments.js';
import { findPowerStatements } from './power.js';
import { findSummaries } from './summaries.js';
import { findTableMentions, nameTableRows, readTables } from './tables.js';
import { findLabelMentions, findTableReferences, readCaptions } from './tableReferences.js';
import { findPWithoutT } from './pWithoutT.js';
import { completeStatistics, findOtherStatistics, NOT_ONE_WAY } from './statistics.js';
import { findTableDimensions } from './contingency.js';
import { applyStarLegends, findStarLegends, type StarLegend } from './stars.js';
import { findTTests } from './tTests.js';
import { findTopics } from './topic.js';
import type { Extraction } from './types.js';

export type * from './types.js';
export { sentenceStarts } from './numbers.js';

/** What the recognisers find in one segment on its own, before the passes over the whole document. */
interface SegmentFinds {
  legend: StarLegend | undefined;
  tests: Extraction['tests'];
  otherStatistics: Extraction['otherStatistics'];
  tableDimensions: Extraction['tableDimensions'];
  statements: Extraction['statements'];
  summaries: Extraction['summaries'];
  sampleSizes: Extraction['sampleSizes'];
  unitCounts: Extraction['unitCounts'];
  groupSizes: Extraction['groupSizes'];
  intervals: Extraction['intervals'];
  estimates: Extraction['estimates'];
  effectSizes: Extraction['effectSizes'];
  designs: Extraction['designs'];
  assignments: Extraction['assignments'];
  references: Extraction['references'];
  integerMeasures: Extraction['integerMeasures'];
  counts: Extraction['counts'];
  powerStatements: Extraction['powerStatements'];
  mentions: Extraction['mentions'];
  pWithoutT: Extraction['pWithoutT'];
}

/**
 * What the recognisers found in each segment, kept for the next extraction of a document that
 * shares segment objects with this one (an incremental re-read, see reparseDocument): a segment
 * object is never changed once made, and what is found in it depends only on it, the decimal
 * convention and the source at its own offsets, which an edit elsewhere leaves alone. Two
 * passes over the whole document change t-test records in place, so the cache hands out copies
 * of those (see fresh).
 */
export class ExtractionCache {
  private readonly bySegment = new WeakMap<Segment, { convention: string; finds: SegmentFinds }>();

  reuse(seg: Segment, convention: string): SegmentFinds | undefined {
    const hit = this.bySegment.get(seg);
    return hit && hit.convention === convention ? fresh(hit.finds) : undefined;
  }

  store(seg: Segment, convention: string, finds: SegmentFinds): void {
    this.bySegment.set(seg, { convention, finds: fresh(finds) });
  }
}

/**
 * A copy of what the passes over the whole document change in place: a t-test's `table` (named
 * by nameTableRows) and its p's `number` and `stars` (applyStarLegends). Everything else is
 * read, never written, after the segment's own recognisers.
 */
function fresh(finds: SegmentFinds): SegmentFinds {
  // copied with Object.assign: a literal opening with a spread gives each copy a hidden class of its own (DEVELOPERS.md, Speed)
  return { ...finds, tests: finds.tests.map((t) => Object.assign({}, t, t.p ? { p: Object.assign({}, t.p) } : undefined)) };
}

/**
 * A text of digits, spaces, points, commas and plus or minus signs alone: nothing any recogniser
 * below reads can be made of it, since each needs a letter (a statistic's symbol, a word) or
 * another mark (`±`, `%`, `(`, `=`, `<`, `*`, `×`, `/`, `α`, …) beside the numbers. A long table's
 * cells are mostly such texts, and running some twenty recognisers over each of 300,000 of them
 * (and collecting their empty lists) cost more than the rest of reading the table.
 * test/extract/numbers-only.test.ts runs the recognisers on generated texts of this kind.
 */
export const NUMBERS_ONLY = /^[0-9 .,+-]*$/;

/** What findInSegment gives a numbers-only text: nothing (shared, frozen: the lists are only read). */
const NOTHING: SegmentFinds = Object.freeze({
  legend: undefined, tests: [], otherStatistics: [], tableDimensions: [], statements: [], summaries: [], sampleSizes: [], unitCounts: [], groupSizes: [], intervals: [], estimates: [], effectSizes: [],
  designs: [], assignments: [], references: [], integerMeasures: [], counts: [], powerStatements: [], mentions: [], pWithoutT: [],
} satisfies SegmentFinds);
for (const list of Object.values(NOTHING)) if (Array.isArray(list)) Object.freeze(list);

function findInSegment(seg: Segment, source: string): SegmentFinds {
  return NUMBERS_ONLY.test(seg.text) ? NOTHING : recogniseSegment(seg, source);
}

/** Every recogniser run on one segment (findInSegment skips those that cannot hold anything). */
export function recogniseSegment(seg: Segment, source: string): SegmentFinds {
  const legend = seg.kind === 'code' ? undefined : findStarLegends(seg);
  const starts = sentenceStarts(seg.text);
  const tests = findTTests(seg, starts);
  // the spelling of t's sign in the source (the normaliser folds − into -): for minus-is-a-minus-sign
  if (seg.kind !== 'code') for (const test of tests) if (!test.inCode && test.t.value < 0 && source[test.t.span.start] === '-') test.t.hyphenMinus = true;
  if (seg.kind === 'code') {
    return {
      legend, tests, otherStatistics: [], tableDimensions: [], statements: [], summaries: [], sampleSizes: [], unitCounts: [], groupSizes: [], intervals: [], estimates: [], effectSizes: [],
      designs: [], assignments: [], references: [], integerMeasures: [], counts: [], powerStatements: [], mentions: findSoftwareHeaders(seg, starts), pWithoutT: [],
    };
  }
  // in the order the recognisers have always run
  const otherStatistics = completeStatistics(seg, starts, withoutOverlap(findOtherStatistics(seg, starts), tests), tests);
  const tableDimensions = findTableDimensions(seg, starts);
  const statements = findStatements(seg, starts);
  const found = findSummaries(seg, starts);
  // words of the paragraph naming another analysis than a one-way ANOVA, for an F in the next one
  const analysis = found.summaries.length > 0 ? NOT_ONE_WAY.exec(seg.text)?.[1] : undefined;
  if (analysis) for (const g of found.summaries) g.paragraphAnalysisWords = analysis;
  return {
    legend,
    tests,
    otherStatistics,
    tableDimensions,
    statements,
    summaries: found.summaries,
    sampleSizes: found.sampleSizes,
    unitCounts: found.unitCounts,
    groupSizes: found.groupSizes,
    intervals: found.intervals,
    estimates: found.estimates,
    effectSizes: found.effectSizes,
    designs: found.designs,
    assignments: findAssignments(seg, starts),
    references: found.references,
    integerMeasures: findIntegerMeasures(seg, starts),
    counts: found.counts,
    powerStatements: findPowerStatements(seg, starts),
    mentions: findMentions(seg, starts),
    pWithoutT: MAY_NAME_T_TEST.test(seg.text) ? findPWithoutT(seg, starts, tests) : [],
  };
}

/** Every reported t-test, context statement and t-less p of a parsed document, in reading order. */
export function extract(doc: ParsedDocument, cache?: ExtractionCache): Extraction {
  // Numbers are read once, under the document's decimal convention: every recogniser below
  // sees decimal points only.
  const convention = decimalConvention(doc.segments);
  const segments = doc.segments.map((s) => withDecimalPoints(s, convention));
  const out: Extraction = {
    decimalConvention: convention,
    tests: [],
    otherStatistics: [],
    tableDimensions: [],
    statements: [],
    pWithoutT: [],
    summaries: [],
    sampleSizes: [],
    unitCounts: [],
    groupSizes: [],
    intervals: [],
    estimates: [],
    effectSizes: [],
    designs: [],
    assignments: [],
    references: [],
    integerMeasures: [],
    measureMentions: [],
    counts: [],
    powerStatements: [],
    mentions: [],
    sections: segments.map((s) => s.section),
    topics: [],
    tables: [],
    tableBlocks: [],
    tableMentions: [],
    tableReferences: [],
    tableCaptions: [],
    tableLabelMentions: [],
  };
  const legends: StarLegend[] = [];
  doc.segments.forEach((original, i) => {
    const seg = segments[i] as Segment;
    let finds = cache?.reuse(original, convention);
    if (!finds) {
      finds = findInSegment(seg, doc.source);
      cache?.store(original, convention, finds);
    }
    if (finds.legend) legends.push(finds.legend);
    append(out.tests, finds.tests);
    append(out.otherStatistics, finds.otherStatistics);
    append(out.tableDimensions, finds.tableDimensions);
    append(out.statements, finds.statements);
    append(out.summaries, finds.summaries);
    append(out.sampleSizes, finds.sampleSizes);
    append(out.unitCounts, finds.unitCounts);
    append(out.groupSizes, finds.groupSizes);
    append(out.intervals, finds.intervals);
    append(out.estimates, finds.estimates);
    append(out.effectSizes, finds.effectSizes);
    append(out.designs, finds.designs);
    append(out.assignments, finds.assignments);
    append(out.references, finds.references);
    append(out.integerMeasures, finds.integerMeasures);
    append(out.counts, finds.counts);
    append(out.powerStatements, finds.powerStatements);
    append(out.mentions, finds.mentions);
    append(out.pWithoutT, finds.pWithoutT);
  });
  for (const seg of segments) {
    if (!seg.table) continue;
    const t = out.tables.find((x) => x.table === seg.table?.table);
    if (t) t.lastBlock = Math.max(t.lastBlock, seg.block);
    else out.tables.push({ table: seg.table.table, firstBlock: seg.block, lastBlock: seg.block });
  }
  const tables = readTables(segments);
  const tableMeans = new Set(tables.summaries.map((t) => t.mean?.span.start));
  out.summaries = out.summaries.filter((s) => !tableMeans.has(s.mean?.span.start)).concat(tables.summaries);
  out.summaries.sort((a, b) => a.span.start - b.span.start);
  const seen = new Set(out.tests.map((t) => t.span.start));
  for (const t of tables.tests) if (!seen.has(t.span.start)) out.tests.push(t);
  out.tests.sort((a, b) => a.span.start - b.span.start);
  for (const [list, extra] of [[out.effectSizes, tables.effectSizes], [out.intervals, tables.intervals], [out.estimates, tables.estimates]] as const) {
    append(list as Array<(typeof extra)[number]>, extra);
    list.sort((a, b) => a.span.start - b.span.start);
  }
  out.tableBlocks = tables.blocks;
  nameTableRows(out.tests, segments, tables.blocks);
  out.tableMentions = findTableMentions(segments, tables.blocks, out.tables);
  out.tableCaptions = readCaptions(segments);
  out.tableReferences = findTableReferences(segments, out.tableCaptions);
  out.tableLabelMentions = findLabelMentions(segments, out.tableReferences, tables.blocks);
  applyStarLegends(out.tests, legends);
  out.measureMentions = findMeasureMentions(segments, out.integerMeasures);
  out.topics = findTopics(segments, out.tests);
  return out;
}

/**
 * Records that do not overlap any of `taken` (a t-test's own numbers are not another
 * statistic). Both lists are in reading order and `taken` does not overlap itself, so one
 * pointer walks `taken` once: linear in both.
 */
function withoutOverlap<T extends { span: { start: number; end: number } }>(items: T[], taken: readonly { span: { start: number; end: number } }[]): T[] {
  if (taken.length === 0) return items;
  const out: T[] = [];
  let j = 0;
  for (const it of items) {
    while (j < taken.length && (taken[j] as { span: { end: number } }).span.end <= it.span.start) j += 1;
    const t = taken[j];
    if (!t || t.span.start >= it.span.end) out.push(it);
  }
  return out;
}

/** Append without spreading into arguments (a spread of some 100,000 items overflows the stack). */
function append<T>(to: T[], items: readonly T[]): void {
  for (const x of items) to.push(x);
}
