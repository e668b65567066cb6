import type { ContextStatement, Extraction, Sidedness, TTestReport } from '../extract/types.js';
import type { Directive } from '../parse/types.js';
import type { DocumentSettings, LinkedDocument, LinkedResult, Setting } from './types.js';

export type * from './types.js';
export type { DescriptiveLink, Design, ResultContext } from './descriptives.js';
import { contextJoiner } from './descriptives.js';

/** Default alpha when nothing sets one: .05 (common practice, no source). */
export const DEFAULT_ALPHA = 0.05;

/**
 * Gives every reported t-test its tails and alpha, from the most specific place that says
 * so: the report itself (`p = .03, one-tailed`), its sentence, an equivalence test named in
 * its sentence or the one before, a document-wide statement (a sentence about tails or alpha
 * that reports no test), front matter, configuration, and last the default (two-tailed,
 * alpha .05). Directives are passed
 * through for the engine, which applies them.
 */
export function link(extraction: Extraction, directives: Directive[], settings: DocumentSettings = {}): LinkedDocument {
  const sentencesWithTests = new Set(extraction.tests.map((t) => key(t.segment, t.sentence)));
  const documentLevel = extraction.statements.filter((s) => !sentencesWithTests.has(key(s.segment, s.sentence)));
  const documentSidedness = agreeing(documentLevel.filter((s) => s.kind === 'sidedness'), (s) => s.sidedness as Sidedness)
    ?? settings.sidedness ?? { value: 'two' as Sidedness, basis: 'default' as const };
  const documentAlpha = agreeing(documentLevel.filter((s) => s.kind === 'alpha'), (s) => s.alpha as number)
    ?? settings.alpha ?? { value: DEFAULT_ALPHA, basis: 'default' as const };

  const join = contextJoiner(extraction);
  const statementsBySegment = new Map<number, ContextStatement[]>();
  for (const s of extraction.statements) statementsBySegment.set(s.segment, [...(statementsBySegment.get(s.segment) ?? []), s]);
  const testsBySegment = new Map<number, TTestReport[]>();
  for (const t of extraction.tests) testsBySegment.set(t.segment, [...(testsBySegment.get(t.segment) ?? []), t]);
  const results: LinkedResult[] = extraction.tests.map((report) => ({
    report,
    sidedness: sidednessFor(report, statementsBySegment.get(report.segment) ?? [], testsBySegment.get(report.segment) ?? [], documentSidedness),
    alpha: alphaFor(report, statementsBySegment.get(report.segment) ?? [], documentAlpha),
    context: join(report),
  }));
  return {
    results,
    pWithoutT: extraction.pWithoutT,
    directives,
    extraction,
    ...(settings.integerMeasure ? { integerMeasure: settings.integerMeasure } : {}),
    ...(settings.frontMatterError ? { frontMatterError: settings.frontMatterError } : {}),
    ...(settings.readNotes ? { readNotes: settings.readNotes } : {}),
    statements: extraction.statements,
    documentAlpha,
    documentSidedness,
  };
}

function key(segment: number, sentence: number): string {
  return `${segment}:${sentence}`;
}

/** One value all statements agree on, as a document-text setting; undefined if none or mixed. */
function agreeing<T>(statements: ContextStatement[], value: (s: ContextStatement) => T): Setting<T> | undefined {
  const first = statements[0];
  if (!first) return undefined;
  if (!statements.every((s) => value(s) === value(first))) return undefined;
  return { value: value(first), basis: 'document-text', span: first.span, printed: first.printed };
}

function sidednessFor(report: TTestReport, statements: ContextStatement[], tests: TTestReport[], fallback: Setting<Sidedness>): Setting<Sidedness> {
  if (report.statedSidedness) {
    return { value: report.statedSidedness.value, basis: 'in-report', span: report.statedSidedness.span };
  }
  const sameSentence = statements.filter((s) => s.segment === report.segment && s.sentence === report.sentence);
  // With several tests in one sentence, a tails word belongs to the test nearest to it.
  const sided = nearest(sameSentence.filter((s) => s.kind === 'sidedness'), report, tests);
  if (sided) return { value: sided.sidedness as Sidedness, basis: 'sentence', span: sided.span, printed: sided.printed };
  const equivalence = statements.find(
    (s) => s.kind === 'equivalence' && s.segment === report.segment && (s.sentence === report.sentence || s.sentence === report.sentence - 1),
  );
  if (equivalence) return { value: 'one', basis: 'equivalence-test', span: equivalence.span, printed: equivalence.printed };
  return fallback;
}

function nearest(candidates: ContextStatement[], report: TTestReport, tests: TTestReport[]): ContextStatement | undefined {
  const peers = tests.filter((t) => t.segment === report.segment && t.sentence === report.sentence);
  return candidates.find((s) => {
    const mine = distance(s, report);
    return peers.every((other) => other === report || distance(s, other) >= mine);
  });
}

function distance(s: ContextStatement, t: TTestReport): number {
  if (s.span.end <= t.span.start) return t.span.start - s.span.end;
  if (s.span.start >= t.span.end) return s.span.start - t.span.end;
  return 0;
}

function alphaFor(report: TTestReport, statements: ContextStatement[], fallback: Setting<number>): Setting<number> {
  const inSentence = statements.find((s) => s.kind === 'alpha' && s.segment === report.segment && s.sentence === report.sentence);
  if (inSentence) return { value: inSentence.alpha as number, basis: 'sentence', span: inSentence.span, printed: inSentence.printed };
  return fallback;
}
