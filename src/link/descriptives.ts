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

/**
 * Joins each test to the descriptives it can be recomputed from: those in its sentence;
 * else, when it is the only test of its paragraph, those in the paragraph; else, when it sits
 * right after or before a table of groups, that table. More than two groups in scope, or
 * groups a second test could claim as well, is ambiguous: nothing is joined and the reason
 * is kept, so the rules can say so.
 */
export function contextFor(report: TTestReport, x: Extraction): ResultContext {
  const testsInBlock = x.tests.filter((t) => t.block === report.block && t.segment === report.segment);
  const overlapsTest = (g: GroupSummary) => x.tests.some((t) => g.span.start < t.span.end && t.span.start < g.span.end);
  const prose = x.summaries.filter((g) => !g.table && !overlapsTest(g));
  let link: DescriptiveLink | undefined;
  let unlinked: ResultContext['unlinked'];

  const inSentence = prose.filter((g) => sameSentence(g, report));
  const testsInSentence = testsInBlock.filter((t) => t.sentence === report.sentence);
  if (inSentence.length > 0) {
    if (inSentence.length <= 2 && testsInSentence.length === 1) link = makeLink('sentence', inSentence, x);
    else unlinked = { reason: `${inSentence.length} sets of descriptives and ${testsInSentence.length} tests in one sentence`, span: report.span };
  } else {
    const inParagraph = prose.filter((g) => g.segment === report.segment && !x.tests.some((t) => sameSentence(t, g)));
    if (inParagraph.length > 0) {
      if (inParagraph.length <= 2 && testsInBlock.length === 1) link = makeLink('paragraph', inParagraph, x);
      else unlinked = { reason: `${inParagraph.length} sets of descriptives and ${testsInBlock.length} tests in one paragraph`, span: report.span };
    } else {
      const table = x.tables.find((t) => report.block === t.lastBlock + 1 || report.block === t.firstBlock - 1);
      const rows = table ? x.summaries.filter((g) => g.table?.table === table.table) : [];
      const claimants = table ? x.tests.filter((t) => t.block === table.lastBlock + 1 || t.block === table.firstBlock - 1) : [];
      if (rows.length > 0) {
        if (rows.length <= 2 && claimants.length === 1) link = makeLink('table', rows, x);
        else unlinked = { reason: `a table of ${rows.length} groups beside ${claimants.length} tests`, span: report.span };
      }
    }
  }

  const near = <T extends { segment: number; sentence: number }>(items: T[]) => items.filter((i) => sameSentence(i, report));
  const inBlock = <T extends { segment: number }>(items: T[]) => items.filter((i) => i.segment === report.segment);
  const reference = near(x.references)[0] ?? (testsInBlock.length === 1 ? inBlock(x.references)[0] : undefined);
  // A CI printed right after a group's mean and SD is that group's CI, not the test's.
  const isGroupInterval = (i: IntervalReport) =>
    x.summaries.some((g) => g.segment === i.segment && g.span.end <= i.span.start && i.span.start - g.span.end < 40 && !x.tests.some((t) => t.span.start >= g.span.end && t.span.end <= i.span.start));
  const candidates = near(x.intervals).filter((i) => !isGroupInterval(i));
  const interval = candidates.find((i) => i.span.start >= report.span.start) ?? candidates[0];
  const estimate = near(x.estimates)[0];
  const effectSizes = near(x.effectSizes);
  const sampleSizes = [...near(x.sampleSizes), ...inBlock(x.sampleSizes).filter((s) => !sameSentence(s, report))];
  return {
    ...(link ? { descriptives: link } : {}),
    ...(unlinked ? { unlinked } : {}),
    design: designFor(report, x, link),
    ...(reference ? { reference } : {}),
    ...(interval ? { interval } : {}),
    ...(estimate ? { estimate } : {}),
    effectSizes,
    sampleSizes,
  };
}

function makeLink(scope: DescriptiveLink['scope'], groups: GroupSummary[], x: Extraction): DescriptiveLink {
  const kinds: SpreadKind[] = [];
  let source: DescriptiveLink['spreadKindSource'];
  const documentKinds = x.statements.filter((s) => s.kind === 'spread');
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
function designFor(report: TTestReport, x: Extraction, link: DescriptiveLink | undefined): Setting<Design> {
  const named = report.namedVariant;
  if (named === 'paired') return { value: 'paired', basis: 'in-report' };
  if (named === 'welch' || named === 'student' || named === 'independent') return { value: 'independent', basis: 'in-report' };
  if (named === 'one-sample') return { value: 'one-sample', basis: 'in-report' };
  const pick = (ds: DesignStatement[], basis: Setting<Design>['basis']): Setting<Design> | undefined => {
    const first = ds[0];
    if (!first || !ds.every((d) => d.design === first.design)) return undefined;
    return { value: first.design, basis, span: first.span, printed: first.printed };
  };
  const sentence = pick(x.designs.filter((d) => sameSentence(d, report)), 'sentence');
  if (sentence) return sentence;
  const paragraph = pick(x.designs.filter((d) => d.segment === report.segment), 'paragraph');
  if (paragraph) return paragraph;
  // Design words elsewhere in the document are not used: a manuscript often reports paired and
  // independent comparisons side by side.
  if (link?.groups.length === 1) return { value: 'one-sample', basis: 'structure' };
  return { value: 'unknown', basis: 'default' };
}
