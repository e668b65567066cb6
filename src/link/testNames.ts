import type { Extraction, Mention, TestNameWords, TTestReport } from '../extract/types.js';
import type { Span } from '../parse/types.js';
import { clauseIndex, type ClauseIndex } from './clauses.js';

/**
 * Where a result's test name was said: with its statistic ("Welch's t(21.6)"), in its clause,
 * in its sentence (a name before every statistic of the sentence, or a plural name such as
 * "paired t-tests"), in its table's header, row or caption, or in the header software printed
 * above its output.
 */
export type TestNameBasis = 'in-report' | 'clause' | 'sentence' | 'table' | 'software-output';

/** The name of the test behind one result, from that result's own words only. */
export interface TestName {
  design?: 'paired' | 'independent' | 'one-sample';
  variant?: 'welch' | 'student';
  basis: TestNameBasis;
  /** The words that name it, as printed (several joined by "; "). */
  printed: string;
  span: Span;
}

type Named = Mention & { test: TestNameWords };

/**
 * The test name of every result, read only from the result's own words: a name said with
 * another result, in another sentence of the paragraph, or once for the document ("Welch's
 * t-tests were used") names no particular result. Names that disagree (a paired and an
 * independent one) name nothing. Linear in the records: mentions are grouped by segment and
 * sentence once.
 */
export function testNames(x: Extraction): Map<TTestReport, TestName> {
  const out = new Map<TTestReport, TestName>();
  const named = x.mentions.filter((m): m is Named => m.kind === 'test-name' && m.test !== undefined);
  const bySentence = new Map<string, Named[]>();
  const byTable = new Map<number, Named[]>();
  const bySegment = new Map<number, Named[]>();
  for (const m of named) {
    push(bySentence, `${m.segment}:${m.sentence}`, m);
    const table = m.table?.table ?? m.legendOf;
    if (table !== undefined) push(byTable, table, m);
    if (m.test.source === 'software-output') push(bySegment, m.segment, m);
  }
  const testsBySentence = new Map<string, TTestReport[]>();
  const testsBySegment = new Map<number, TTestReport[]>();
  for (const t of x.tests) {
    push(testsBySentence, `${t.segment}:${t.sentence}`, t);
    push(testsBySegment, t.segment, t);
  }
  let clauses: ClauseIndex | undefined;
  for (const t of x.tests) {
    const found: Array<{ m: Named; basis: TestNameBasis }> = [];
    if (t.inCode) {
      const header = softwareHeader(t, bySegment.get(t.segment) ?? [], testsBySegment.get(t.segment) ?? []);
      if (header) found.push({ m: header, basis: 'software-output' });
    } else if (t.table) {
      for (const m of byTable.get(t.table.table) ?? []) {
        if (m.legendOf !== undefined || m.table?.row === 0 || m.table?.row === t.table.row) found.push({ m, basis: 'table' });
      }
    }
    const inSentence = (bySentence.get(`${t.segment}:${t.sentence}`) ?? []).filter((m) => m.test.source === 'prose' && m.table?.row !== 0);
    if (inSentence.length > 0 && !t.table) {
      clauses ??= clauseIndex(x);
      const tests = testsBySentence.get(`${t.segment}:${t.sentence}`) ?? [t];
      for (const m of inSentence) {
        const basis = ownBasis(t, m, tests, clauses);
        if (basis) found.push({ m, basis });
      }
    }
    const name = combine(t, found);
    if (name) out.set(t, name);
  }
  return out;
}

/**
 * Whether a name in the result's sentence is the result's own: a plural name names every test
 * of its sentence; a name in the lead of a test (its words before the statistic, after the
 * last clause boundary) is that test's; a name after a statistic is its clause's.
 */
function ownBasis(t: TTestReport, m: Named, tests: readonly TTestReport[], clauses: ClauseIndex): TestNameBasis | undefined {
  if (m.test.plural) return 'sentence';
  // the test whose lead holds the name, or whose statistic it stands on ("Welch's t(21.6)")
  const leading = tests.find((u) => m.span.start < u.span.start && (m.span.end > u.span.start || m.span.start >= (u.lead?.start ?? u.span.start)));
  if (leading) return leading === t ? 'clause' : undefined;
  const owner = clauses.ownerOf(m);
  return owner?.kind === 't' && owner.clause.test === t ? 'clause' : undefined;
}

/** The header printed above the result's output: the last one before it with no other result between. */
function softwareHeader(t: TTestReport, headers: readonly Named[], tests: readonly TTestReport[]): Named | undefined {
  const header = headers.filter((h) => h.span.end <= t.span.start).at(-1);
  if (!header) return undefined;
  const between = tests.some((u) => u !== t && u.span.start > header.span.end && u.span.start < t.span.start);
  return between ? undefined : header;
}

const RANK: Record<TestNameBasis, number> = { 'in-report': 0, 'software-output': 1, clause: 2, sentence: 3, table: 4 };

function combine(t: TTestReport, found: Array<{ m: Named; basis: TestNameBasis }>): TestName | undefined {
  const own = t.namedVariant;
  const designs = new Set<string>();
  const variants = new Set<string>();
  if (own) {
    designs.add(own === 'welch' || own === 'student' || own === 'independent' ? 'independent' : own);
    if (own === 'welch' || own === 'student') variants.add(own);
  }
  for (const { m } of found) {
    if (m.test.design) designs.add(m.test.design);
    if (m.test.variant) variants.add(m.test.variant);
  }
  if (!own && found.length === 0) return undefined;
  const sorted = [...found].sort((a, b) => RANK[a.basis] - RANK[b.basis]);
  const first = sorted[0];
  const printed = [...new Set(sorted.map((f) => f.m.printed))];
  const design = designs.size === 1 ? ([...designs][0] as TestName['design']) : undefined;
  const variant = variants.size === 1 && design === 'independent' ? ([...variants][0] as TestName['variant']) : undefined;
  const base = own
    ? { basis: 'in-report' as const, printed: [ownWords(own), ...printed.filter((p) => !sameName(p, own))].join('; '), span: t.span }
    : { basis: (first as { basis: TestNameBasis }).basis, printed: printed.join('; '), span: (first as { m: Named }).m.span };
  return { ...(design ? { design } : {}), ...(variant ? { variant } : {}), ...base };
}

function ownWords(v: NonNullable<TTestReport['namedVariant']>): string {
  return { welch: "Welch's t", student: "Student's t", paired: 'paired t', 'one-sample': 'one-sample t', independent: 'independent-samples t' }[v];
}

/** A mention that is the statistic's own name ("Welch's t" of "Welch's t(21.6)") is not repeated. */
function sameName(printed: string, v: NonNullable<TTestReport['namedVariant']>): boolean {
  return printed.toLowerCase().startsWith(v === 'one-sample' ? 'one' : v);
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}
