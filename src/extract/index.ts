import type { ParsedDocument } from '../parse/types.js';
import { sentenceStarts } from './numbers.js';
import { findStatements } from './statements.js';

/** Cheap pre-check (no global state) before the sentence-level search for t-less p values. */
const MAY_NAME_T_TEST = /t[- ]tests?|(?:Student|Welch)/i;
import { findMentions } from './mentions.js';
import { findPowerStatements } from './power.js';
import { findSummaries } from './summaries.js';
import { findTableSummaries, findTableTests } from './tables.js';
import { findPWithoutT } from './pWithoutT.js';
import { findTTests } from './tTests.js';
import type { Extraction } from './types.js';

export type * from './types.js';
export { sentenceStarts } from './numbers.js';

/** Every reported t-test, context statement and t-less p of a parsed document, in reading order. */
export function extract(doc: ParsedDocument): Extraction {
  const out: Extraction = {
    tests: [],
    statements: [],
    pWithoutT: [],
    summaries: [],
    sampleSizes: [],
    intervals: [],
    estimates: [],
    effectSizes: [],
    designs: [],
    references: [],
    integerMeasures: [],
    counts: [],
    powerStatements: [],
    mentions: [],
    sections: doc.segments.map((s) => s.section),
    tables: [],
  };
  for (const seg of doc.segments) {
    const starts = sentenceStarts(seg.text);
    const tests = findTTests(seg, starts);
    out.tests.push(...tests);
    if (seg.kind !== 'code') {
      out.statements.push(...findStatements(seg, starts));
      const found = findSummaries(seg, starts);
      out.summaries.push(...found.summaries);
      out.sampleSizes.push(...found.sampleSizes);
      out.intervals.push(...found.intervals);
      out.estimates.push(...found.estimates);
      out.effectSizes.push(...found.effectSizes);
      out.designs.push(...found.designs);
      out.references.push(...found.references);
      out.integerMeasures.push(...found.integerMeasures);
      out.counts.push(...found.counts);
      out.powerStatements.push(...findPowerStatements(seg, starts));
      out.mentions.push(...findMentions(seg, starts));
      if (MAY_NAME_T_TEST.test(seg.text)) out.pWithoutT.push(...findPWithoutT(seg, starts, tests));
    }
  }
  for (const seg of doc.segments) {
    if (!seg.table) continue;
    const t = out.tables.find((x) => x.table === seg.table?.table);
    if (t) t.lastBlock = Math.max(t.lastBlock, seg.block);
    else out.tables.push({ table: seg.table.table, firstBlock: seg.block, lastBlock: seg.block });
  }
  const tableSummaries = findTableSummaries(doc.segments);
  const tableMeans = new Set(tableSummaries.map((t) => t.mean?.span.start));
  out.summaries = out.summaries.filter((s) => !tableMeans.has(s.mean?.span.start)).concat(tableSummaries);
  out.summaries.sort((a, b) => a.span.start - b.span.start);
  const seen = new Set(out.tests.map((t) => t.span.start));
  for (const t of findTableTests(doc.segments)) if (!seen.has(t.span.start)) out.tests.push(t);
  out.tests.sort((a, b) => a.span.start - b.span.start);
  return out;
}
