import type { ParsedDocument } from '../parse/types.js';
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
import { findPWithoutT } from './pWithoutT.js';
import { completeStatistics, findOtherStatistics } from './statistics.js';
import { findTableDimensions } from './contingency.js';
import { applyStarLegends, findStarLegends, type StarLegend } from './stars.js';
import { findTTests } from './tTests.js';
import type { Extraction } from './types.js';

export type * from './types.js';
export { sentenceStarts } from './numbers.js';

/** Every reported t-test, context statement and t-less p of a parsed document, in reading order. */
export function extract(doc: ParsedDocument): Extraction {
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
    tables: [],
    tableBlocks: [],
    tableMentions: [],
  };
  const legends: StarLegend[] = [];
  for (const seg of segments) {
    const legend = seg.kind === 'code' ? undefined : findStarLegends(seg);
    if (legend) legends.push(legend);
    const starts = sentenceStarts(seg.text);
    const tests = findTTests(seg, starts);
    // the spelling of t's sign in the source (the normaliser folds − into -): for minus-is-a-minus-sign
    if (seg.kind !== 'code') for (const test of tests) if (!test.inCode && test.t.value < 0 && doc.source[test.t.span.start] === '-') test.t.hyphenMinus = true;
    append(out.tests, tests);
    if (seg.kind !== 'code') {
      append(out.otherStatistics, completeStatistics(seg, starts, withoutOverlap(findOtherStatistics(seg, starts), tests), tests));
      append(out.tableDimensions, findTableDimensions(seg, starts));
      append(out.statements, findStatements(seg, starts));
      const found = findSummaries(seg, starts);
      append(out.summaries, found.summaries);
      append(out.sampleSizes, found.sampleSizes);
      append(out.groupSizes, found.groupSizes);
      append(out.intervals, found.intervals);
      append(out.estimates, found.estimates);
      append(out.effectSizes, found.effectSizes);
      append(out.designs, found.designs);
      append(out.assignments, findAssignments(seg, starts));
      append(out.references, found.references);
      append(out.integerMeasures, findIntegerMeasures(seg, starts));
      append(out.counts, found.counts);
      append(out.powerStatements, findPowerStatements(seg, starts));
      append(out.mentions, findMentions(seg, starts));
      if (MAY_NAME_T_TEST.test(seg.text)) append(out.pWithoutT, findPWithoutT(seg, starts, tests));
    } else append(out.mentions, findSoftwareHeaders(seg, starts));
  }
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
  applyStarLegends(out.tests, legends);
  out.measureMentions = findMeasureMentions(segments, out.integerMeasures);
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
