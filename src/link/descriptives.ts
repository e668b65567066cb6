import type {
  DesignStatement,
  EffectSizeReport,
  EstimateReport,
  Extraction,
  GroupSummary,
  IntervalReport,
  ReferenceValue,
  SampleSize,
  SpreadKind,
  TTestReport,
} from '../extract/types.js';
import type { Span } from '../parse/types.js';
import type { Setting } from './types.js';

export type Design = 'paired' | 'independent' | 'one-sample' | 'unknown';

/** The descriptives a result can be recomputed from, and how they were joined to it. */
export interface DescriptiveLink {
  scope: 'sentence' | 'paragraph' | 'table';
  /** One group (one-sample or differences) or two, in reading order. */
  groups: GroupSummary[];
  /** Each group's spread kind after statements such as "mean ± SEM" are applied. */
  spreadKinds: SpreadKind[];
  /** Where a spread kind came from when the group itself did not say. */
  spreadKindSource?: { span: Span; printed: string };
}

export interface ResultContext {
  descriptives?: DescriptiveLink;
  /** Why no descriptives were joined although some were near (never a silent guess). */
  unlinked?: { reason: string; span: Span };
  design: Setting<Design>;
  reference?: ReferenceValue;
  interval?: IntervalReport;
  estimate?: EstimateReport;
  effectSizes: EffectSizeReport[];
  /** Sample sizes stated in the result's sentence or paragraph, or for the document. */
  sampleSizes: SampleSize[];
}

const sameSentence = (a: { segment: number; sentence: number }, b: { segment: number; sentence: number }) => a.segment === b.segment && a.sentence === b.sentence;

/** Records grouped by the segment they were found in: every join looks only at its own segment. */
function bySegment<T extends { segment: number }>(items: T[]): Map<number, T[]> {
  const m = new Map<number, T[]>();
  for (const it of items) {
    const list = m.get(it.segment);
    if (list) list.push(it);
    else m.set(it.segment, [it]);
  }
  return m;
}

/**
 * Builds the joiner for one document (indexes built once, so a document of any size is joined
 * in linear time). The joiner links each test to the descriptives it can be recomputed from:
 * those in its sentence; else, when it is the only test of its paragraph, those in the
 * paragraph; else, when it sits right after or before a table of groups, that table. More than
 * two groups in scope, or groups a second test could claim as well, is ambiguous: nothing is
 * joined and the reason is kept, so the rules can say so.
 */
export function contextJoiner(x: Extraction): (report: TTestReport) => ResultContext {
  const tests = bySegment(x.tests);
  const overlapsTest = (g: GroupSummary) => (tests.get(g.segment) ?? []).some((t) => g.span.start < t.span.end && t.span.start < g.span.end);
  const prose = bySegment(x.summaries.filter((g) => !g.table && !overlapsTest(g)));
  const tableRows = new Map<number, GroupSummary[]>();
  for (const g of x.summaries) if (g.table) tableRows.set(g.table.table, [...(tableRows.get(g.table.table) ?? []), g]);
  const testsByBlock = new Map<number, TTestReport[]>();
  for (const t of x.tests) testsByBlock.set(t.block, [...(testsByBlock.get(t.block) ?? []), t]);
  const references = bySegment(x.references);
  const intervals = bySegment(x.intervals);
  const estimates = bySegment(x.estimates);
  const effectSizes = bySegment(x.effectSizes);
  const sampleSizes = bySegment(x.sampleSizes);
  const designs = bySegment(x.designs);
  const spreadStatements = x.statements.filter((s) => s.kind === 'spread');
  return (report) => contextFor(report, {
    tests: tests.get(report.segment) ?? [],
    prose: prose.get(report.segment) ?? [],
    tableRows,
    testsByBlock,
    tables: x.tables,
    references: references.get(report.segment) ?? [],
    intervals: intervals.get(report.segment) ?? [],
    estimates: estimates.get(report.segment) ?? [],
    effectSizes: effectSizes.get(report.segment) ?? [],
    sampleSizes: sampleSizes.get(report.segment) ?? [],
    designs: designs.get(report.segment) ?? [],
    spreadStatements,
  });
}

interface Near {
  /** Tests, prose descriptives and context of the report's own segment. */
  tests: TTestReport[];
  prose: GroupSummary[];
  tableRows: Map<number, GroupSummary[]>;
  testsByBlock: Map<number, TTestReport[]>;
  tables: Extraction['tables'];
  references: ReferenceValue[];
  intervals: IntervalReport[];
  estimates: EstimateReport[];
  effectSizes: EffectSizeReport[];
  sampleSizes: SampleSize[];
  designs: DesignStatement[];
  spreadStatements: Extraction['statements'];
}

function contextFor(report: TTestReport, n: Near): ResultContext {
  const testsInBlock = n.tests.filter((t) => t.block === report.block);
  let link: DescriptiveLink | undefined;
  let unlinked: ResultContext['unlinked'];

  const inSentence = n.prose.filter((g) => sameSentence(g, report));
  const testsInSentence = testsInBlock.filter((t) => t.sentence === report.sentence);
  if (inSentence.length > 0) {
    if (inSentence.length <= 2 && testsInSentence.length === 1) link = makeLink('sentence', inSentence, n.spreadStatements);
    else unlinked = { reason: `${inSentence.length} sets of descriptives and ${testsInSentence.length} tests in one sentence`, span: report.span };
  } else {
    const inParagraph = n.prose.filter((g) => !n.tests.some((t) => sameSentence(t, g)));
    if (inParagraph.length > 0) {
      if (inParagraph.length <= 2 && testsInBlock.length === 1) link = makeLink('paragraph', inParagraph, n.spreadStatements);
      else unlinked = { reason: `${inParagraph.length} sets of descriptives and ${testsInBlock.length} tests in one paragraph`, span: report.span };
    } else {
      const table = n.tables.find((t) => report.block === t.lastBlock + 1 || report.block === t.firstBlock - 1);
      const rows = table ? (n.tableRows.get(table.table) ?? []) : [];
      const claimants = table ? [...(n.testsByBlock.get(table.lastBlock + 1) ?? []), ...(n.testsByBlock.get(table.firstBlock - 1) ?? [])] : [];
      if (rows.length > 0) {
        if (rows.length <= 2 && claimants.length === 1) link = makeLink('table', rows, n.spreadStatements);
        else unlinked = { reason: `a table of ${rows.length} groups beside ${claimants.length} tests`, span: report.span };
      }
    }
  }

  const near = <T extends { segment: number; sentence: number }>(items: T[]) => items.filter((i) => sameSentence(i, report));
  const reference = near(n.references)[0] ?? (testsInBlock.length === 1 ? n.references[0] : undefined);
  // A CI printed right after a group's mean and SD is that group's CI, not the test's.
  const isGroupInterval = (i: IntervalReport) =>
    n.prose.some((g) => g.span.end <= i.span.start && i.span.start - g.span.end < 40 && !n.tests.some((t) => t.span.start >= g.span.end && t.span.end <= i.span.start));
  const candidates = near(n.intervals).filter((i) => !isGroupInterval(i));
  const interval = candidates.find((i) => i.span.start >= report.span.start) ?? candidates[0];
  const estimate = near(n.estimates)[0];
  const effectSizes = near(n.effectSizes);
  const sampleSizes = [...near(n.sampleSizes), ...n.sampleSizes.filter((s) => !sameSentence(s, report))];
  return {
    ...(link ? { descriptives: link } : {}),
    ...(unlinked ? { unlinked } : {}),
    design: designFor(report, n.designs, link),
    ...(reference ? { reference } : {}),
    ...(interval ? { interval } : {}),
    ...(estimate ? { estimate } : {}),
    effectSizes,
    sampleSizes,
  };
}

function makeLink(scope: DescriptiveLink['scope'], groups: GroupSummary[], documentKinds: Extraction['statements']): DescriptiveLink {
  const kinds: SpreadKind[] = [];
  let source: DescriptiveLink['spreadKindSource'];
  for (const g of groups) {
    let kind: SpreadKind = g.spread?.kind ?? 'unstated';
    if (kind === 'unstated') {
      const local = documentKinds.find((s) => s.segment === g.segment);
      const agreed = documentKinds.length > 0 && documentKinds.every((s) => s.spread === documentKinds[0]?.spread) ? documentKinds[0] : undefined;
      const st = local ?? agreed;
      if (st?.spread) {
        kind = st.spread;
        source = { span: st.span, printed: st.printed };
      }
    }
    kinds.push(kind);
  }
  return { scope, groups, spreadKinds: kinds, ...(source ? { spreadKindSource: source } : {}) };
}

/**
 * The design, from the most specific evidence: the test named with the statistic ("paired
 * t(22)", "Welch's t"), design words in the sentence, then in the paragraph (when
 * they agree), then structure (one group is one-sample or differences).
 */
function designFor(report: TTestReport, segmentDesigns: DesignStatement[], link: DescriptiveLink | undefined): Setting<Design> {
  const named = report.namedVariant;
  if (named === 'paired') return { value: 'paired', basis: 'in-report' };
  if (named === 'welch' || named === 'student' || named === 'independent') return { value: 'independent', basis: 'in-report' };
  if (named === 'one-sample') return { value: 'one-sample', basis: 'in-report' };
  const pick = (ds: DesignStatement[], basis: Setting<Design>['basis']): Setting<Design> | undefined => {
    const first = ds[0];
    if (!first || !ds.every((d) => d.design === first.design)) return undefined;
    return { value: first.design, basis, span: first.span, printed: first.printed };
  };
  const sentence = pick(segmentDesigns.filter((d) => sameSentence(d, report)), 'sentence');
  if (sentence) return sentence;
  const paragraph = pick(segmentDesigns, 'paragraph');
  if (paragraph) return paragraph;
  // Design words elsewhere in the document are not used: a manuscript often reports paired and
  // independent comparisons side by side.
  if (link?.groups.length === 1) return { value: 'one-sample', basis: 'structure' };
  return { value: 'unknown', basis: 'default' };
}
