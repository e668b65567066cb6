import type { Extraction, Mention, TestNameWords, TTestReport } from '../extract/types.js';
import type { Span } from '../parse/types.js';
import { clauseIndex, sentenceKey, type ClauseIndex } from './clauses.js';

/**
 * Where a result's test name was said: with its statistic ("Welch's t(21.6)"), in its clause
 * or lead, in its sentence (a plural name such as "paired t-tests"), in its table's header, row
 * or caption, or in the header software printed above its output.
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
  /** Welch's test is named as a test (a t or "test" with it, or on the statistic), not only "Welch's". */
  namesWelchTest?: true;
}

type Named = Mention & { test: TestNameWords };

/**
 * What some names in one scope say together: the designs and variants they name (more than one
 * of either names nothing), the first of them and a few of their words. Kept as a summary so a
 * scope with thousands of names and results costs linear time.
 */
interface Said {
  designs: Set<string>;
  variants: Set<string>;
  printed: string[];
  first: Named;
  basis: TestNameBasis;
  /** Some name in it names Welch's test as a test (TestNameWords.namesTest). */
  welchTest: boolean;
}

const MAX_WORDS = 3;

function say(into: Said | undefined, m: Named, basis: TestNameBasis): Said {
  const s = into ?? { designs: new Set<string>(), variants: new Set<string>(), printed: [], first: m, basis, welchTest: false };
  if (m.test.design) s.designs.add(m.test.design);
  if (m.test.variant) s.variants.add(m.test.variant);
  if (m.test.variant === 'welch' && m.test.namesTest) s.welchTest = true;
  if (s.printed.length < MAX_WORDS && !s.printed.includes(m.printed)) s.printed.push(m.printed);
  return s;
}

/**
 * The test name of every result, read only from the result's own words: a name said with
 * another result, in another sentence of the paragraph, or once for the document ("Welch's
 * t-tests were used") names no particular result. Names that disagree (a paired and an
 * independent one) name nothing. Each name is placed once, so the work is linear in the records
 * (up to the binary searches of the clause index).
 */
export function testNames(x: Extraction): Map<TTestReport, TestName> {
  const out = new Map<TTestReport, TestName>();
  const named = x.mentions.filter((m): m is Named => m.kind === 'test-name' && m.test !== undefined);
  const own = new Map<TTestReport, Said>();
  const sentencePlural = new Map<string, Said>();
  const tableWide = new Map<number, Said>();
  const tableRow = new Map<string, Said>();
  const testsBySentence = new Map<string, TTestReport[]>();
  for (const t of x.tests) push(testsBySentence, sentenceKey(t), t);
  let clauses: ClauseIndex | undefined;
  const headersBySegment = new Map<number, Named[]>();
  for (const m of named) {
    if (m.test.source === 'software-output') {
      push(headersBySegment, m.segment, m);
      continue;
    }
    const table = m.table?.table ?? m.legendOf;
    if (table !== undefined) {
      // a header cell or the caption names the table's tests; another cell names its row's
      if (m.legendOf !== undefined || m.table?.row === 0) tableWide.set(table, say(tableWide.get(table), m, 'table'));
      else tableRow.set(`${table}:${m.table?.row}`, say(tableRow.get(`${table}:${m.table?.row}`), m, 'table'));
      continue;
    }
    const key = sentenceKey(m);
    const tests = testsBySentence.get(key);
    if (!tests) continue;
    if (m.test.plural) {
      sentencePlural.set(key, say(sentencePlural.get(key), m, 'sentence'));
      continue;
    }
    clauses ??= clauseIndex(x);
    const owner = ownerOf(m, tests, clauses);
    if (owner) own.set(owner, say(own.get(owner), m, 'clause'));
  }
  const headerOf = softwareHeaders(x.tests, headersBySegment);
  for (const t of x.tests) {
    const scopes: Said[] = [];
    const header = headerOf.get(t);
    if (header) scopes.push(say(undefined, header, 'software-output'));
    const mine = own.get(t);
    if (mine) scopes.push(mine);
    if (!t.table) {
      const plural = sentencePlural.get(sentenceKey(t));
      if (plural) scopes.push(plural);
    } else {
      const row = tableRow.get(`${t.table.table}:${t.table.row}`);
      if (row) scopes.push(row);
      const wide = tableWide.get(t.table.table);
      if (wide) scopes.push(wide);
    }
    const name = combine(t, scopes);
    if (name) out.set(t, name);
  }
  return out;
}

/**
 * The result a singular name in its sentence belongs to: the next statistic when the name is in
 * that test's lead (its words before the statistic, after the last clause boundary) or stands
 * on it ("Welch's t(21.6)"); else the test whose clause holds it. `tests` are in reading order.
 */
function ownerOf(m: Named, tests: readonly TTestReport[], clauses: ClauseIndex): TTestReport | undefined {
  let lo = 0;
  let hi = tests.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((tests[mid] as TTestReport).span.start <= m.span.start) lo = mid + 1;
    else hi = mid;
  }
  const next = tests[lo];
  if (next && (m.span.end > next.span.start || m.span.start >= (next.lead?.start ?? next.span.start))) return next;
  const owner = clauses.ownerOf(m);
  return owner?.kind === 't' ? owner.clause.test : undefined;
}

/** For each result in code: the header printed above it, when no other result stands between. */
function softwareHeaders(tests: readonly TTestReport[], headersBySegment: Map<number, Named[]>): Map<TTestReport, Named> {
  const out = new Map<TTestReport, Named>();
  if (headersBySegment.size === 0) return out;
  const bySegment = new Map<number, TTestReport[]>();
  for (const t of tests) if (t.inCode && headersBySegment.has(t.segment)) push(bySegment, t.segment, t);
  for (const [segment, list] of bySegment) {
    const headers = headersBySegment.get(segment) as Named[];
    let h = -1;
    let used = -1;
    for (const t of list) {
      while (h + 1 < headers.length && (headers[h + 1] as Named).span.end <= t.span.start) h += 1;
      // one header, one output: a second result after the same header is not named by it
      if (h >= 0 && h !== used) {
        out.set(t, headers[h] as Named);
        used = h;
      }
    }
  }
  return out;
}

function combine(t: TTestReport, scopes: readonly Said[]): TestName | undefined {
  const named = t.namedVariant;
  if (!named && scopes.length === 0) return undefined;
  const designs = new Set<string>();
  const variants = new Set<string>();
  if (named) {
    designs.add(named === 'welch' || named === 'student' || named === 'independent' ? 'independent' : named);
    if (named === 'welch' || named === 'student') variants.add(named);
  }
  for (const s of scopes) {
    for (const d of s.designs) designs.add(d);
    for (const v of s.variants) variants.add(v);
  }
  const design = designs.size === 1 ? ([...designs][0] as TestName['design']) : undefined;
  const variant = variants.size === 1 && design === 'independent' ? ([...variants][0] as TestName['variant']) : undefined;
  const words = [...new Set(scopes.flatMap((s) => s.printed))];
  const first = scopes[0];
  const base =
    named || !first
      ? { basis: 'in-report' as const, printed: [ownWords(named ?? 'independent'), ...words.filter((p) => !sameName(p, named))].join('; '), span: t.span }
      : { basis: first.basis, printed: words.join('; '), span: first.first.span };
  const welchTest = variant === 'welch' && (named === 'welch' || scopes.some((s) => s.welchTest));
  return { ...(design ? { design } : {}), ...(variant ? { variant } : {}), ...base, ...(welchTest ? { namesWelchTest: true as const } : {}) };
}

function ownWords(v: NonNullable<TTestReport['namedVariant']>): string {
  return { welch: "Welch's t", student: "Student's t", paired: 'paired t', 'one-sample': 'one-sample t', independent: 'independent-samples t' }[v];
}

/** A mention that is the statistic's own name ("Welch's t" of "Welch's t(21.6)") is not repeated. */
function sameName(printed: string, v: TTestReport['namedVariant']): boolean {
  return v !== undefined && printed.toLowerCase().startsWith(v === 'one-sample' ? 'one' : v);
}

function push<K, V>(map: Map<K, V[]>, key: K, value: V): void {
  const list = map.get(key);
  if (list) list.push(value);
  else map.set(key, [value]);
}
