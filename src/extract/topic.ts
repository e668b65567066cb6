import type { Segment } from '../parse/types.js';
import { matchesOf } from './matches.js';
import { sentenceOf, sentenceStarts } from './numbers.js';
import { indexOfSource } from './offsets.js';
import type { TTestReport } from './types.js';

/**
 * What a stretch of prose is about, as the stems of its content words: the words left when the
 * words of reporting a test are set aside. The link layer compares a test's lead ("Over the
 * twelve weeks the coached arm improved more, t(58) = …") with the text around descriptives
 * printed elsewhere ("At baseline the two arms scored 20.1 (SD = 4.0) …"): a lead that names
 * something the descriptives' text does not is not certainly about them.
 */

/**
 * Words that say nothing about which measure, time or subgroup a sentence is about: function
 * words and the vocabulary of reporting a comparison (common practice, no source).
 */
const REPORTING = new Set(
  (
    'the a an this that these those it its their they them there here of in on at by for from with without to into onto over under ' +
    'between among across after before during than then as and or but nor yet so both either neither each every all any some no not ' +
    'only also again still even more most less least very much many few several other another same such which who whom whose what when ' +
    'where while whereas although though however thus therefore hence indeed overall likewise similarly respectively ' +
    'was were is are be been being had has have did does do gave give gives given giving yielded yield yields showed show shows shown ' +
    'revealed reveal reveals indicated indicate indicates found find finds suggested suggest suggests remained remain became ' +
    'confirmed confirm supported support observed obtained reached reach produced produce led lead reported report reports fewer ' +
    'difference differences differed differ differs differing different significant significantly significance nonsignificant ' +
    'insignificant reliable reliably statistically clear clearly small smaller large larger moderate medium big strong stronger weak ' +
    'slight slightly somewhat marginal marginally trend higher lower greater longer shorter faster slower better worse increase ' +
    'increased decrease decreased compared comparing comparison comparisons contrast contrasted test tests tested testing t-test ' +
    'result results effect effects group groups condition conditions sample samples two one mean means average averaged value values ' +
    'reference against target expected chance hypothesized hypothesised level analysis analyses paired independent welch student ' +
    'students tailed sided direction predicted was pattern data scores score'
  ).split(' '),
);

/** A content word's stem: lower case, a final s dropped, the first five letters. */
export function stem(word: string): string {
  const w = word.toLowerCase();
  return (w.length > 3 && w.endsWith('s') ? w.slice(0, -1) : w).slice(0, 5);
}

const WORD = /\p{L}[\p{L}'’-]{0,40}/gu;
/**
 * WORD's twin for LeadReader, which moves its lastIndex: matchAll (in topicWords) starts from the
 * lastIndex of the expression it is given, so the two must not share one.
 */
const LEAD_WORD = new RegExp(WORD.source, WORD.flags);

/** The content words of a text (three letters or more, not reporting words), lower case, each once. */
export function topicWords(text: string): string[] {
  const out = new Set<string>();
  for (const m of matchesOf(WORD, text)) {
    const w = m[0].toLowerCase().replace(/['’]s$/u, '');
    if (w.length < 3 || REPORTING.has(w)) continue;
    out.add(w);
  }
  return [...out];
}

/** The stems of the content words of a text. */
export function topicStems(text: string): string[] {
  return [...new Set(topicWords(text).map(stem))];
}

/**
 * Where a test's own lead starts: after the last clause boundary (`, but`, `, and`, `; `,
 * `, whereas`, `, while`, `, however`, `, yet`, `, although`) outside parentheses between the
 * sentence start and the statistic, else at the sentence start.
 */
const BOUNDARY = /(?:[,;] (?:but|and|whereas|while|yet|although|though|however)|;) /gu;

export function leadStart(text: string, sentenceStart: number, at: number): number {
  const stretch = text.slice(sentenceStart, at);
  if (!/[,;]/.test(stretch)) return sentenceStart;
  // parenthesis depth before each character, so a boundary inside "(M = 3.2, and M = 3.4)" is no boundary
  const depth = new Int32Array(stretch.length + 1);
  let d = 0;
  for (let i = 0; i < stretch.length; i += 1) {
    depth[i] = d;
    const c = stretch[i];
    if (c === '(' || c === '[') d += 1;
    else if ((c === ')' || c === ']') && d > 0) d -= 1;
  }
  let start = sentenceStart;
  for (const m of matchesOf(BOUNDARY, stretch)) if (depth[m.index] === 0) start = sentenceStart + m.index + m[0].length;
  return start;
}

/**
 * `leadStart` and `topicWords` for the tests of one segment, read in order, in time linear in
 * the segment: a sentence of thousands of tests would otherwise be rescanned from its start for
 * each one. Each sentence's clause boundaries are found once; the content words of a lead are
 * gathered once as the tests move along it, and a lead that gained no word since the test
 * before shares that test's list. Both answers are those of the functions above: where a
 * boundary or a word runs across a test's statistic (so a scan of the text up to it would see
 * it cut), the answer is computed by those functions directly.
 */
export class LeadReader {
  private readonly words = LEAD_WORD;
  private sentence: { start: number; end: number; boundaries: Array<{ index: number; end: number; top: boolean }> } | undefined;
  private lead: { start: number; at: number; scanned: number; seen: Set<string>; list: string[] } | undefined;

  constructor(private readonly text: string) {}

  /** `leadStart(text, sentenceStart, at)` for a statistic at `at` in the sentence [sentenceStart, sentenceEnd). */
  start(sentenceStart: number, sentenceEnd: number, at: number): number {
    if (at > sentenceEnd) return leadStart(this.text, sentenceStart, at);
    if (this.sentence?.start !== sentenceStart || this.sentence.end !== sentenceEnd) this.sentence = { start: sentenceStart, end: sentenceEnd, boundaries: this.boundaries(sentenceStart, sentenceEnd) };
    const list = this.sentence.boundaries;
    // the first boundary starting at or after `at`; the one before it must end by `at`
    let lo = 0;
    let hi = list.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if ((list[mid] as { index: number }).index < at) lo = mid + 1;
      else hi = mid;
    }
    const last = list[lo - 1];
    if (last && last.end > at) return leadStart(this.text, sentenceStart, at);
    for (let i = lo - 1; i >= 0; i -= 1) {
      const b = list[i] as { end: number; top: boolean };
      if (b.top) return b.end;
    }
    return sentenceStart;
  }

  /** Boundaries of one sentence, each marked whether it stands outside parentheses. */
  private boundaries(from: number, to: number): Array<{ index: number; end: number; top: boolean }> {
    const stretch = this.text.slice(from, to);
    if (!/[,;]/.test(stretch)) return [];
    const out: Array<{ index: number; end: number; top: boolean }> = [];
    let d = 0;
    let i = 0;
    for (const m of matchesOf(BOUNDARY, stretch)) {
      for (; i < m.index; i += 1) {
        const c = stretch[i];
        if (c === '(' || c === '[') d += 1;
        else if ((c === ')' || c === ']') && d > 0) d -= 1;
      }
      out.push({ index: from + m.index, end: from + m.index + m[0].length, top: d === 0 });
    }
    return out;
  }

  /** `topicWords(text.slice(lead, at))`; calls come in reading order. */
  wordsOf(lead: number, at: number): string[] {
    if (this.lead?.start !== lead || at < this.lead.at) this.lead = { start: lead, at: lead, scanned: lead, seen: new Set(), list: [] };
    const state = this.lead;
    state.at = at;
    const re = this.words;
    let added = false;
    for (;;) {
      re.lastIndex = state.scanned;
      const m = re.exec(this.text);
      if (!m || m.index >= at) break;
      if (m.index + m[0].length > at) return topicWords(this.text.slice(lead, at));
      state.scanned = m.index + m[0].length;
      const w = m[0].toLowerCase().replace(/['’]s$/u, '');
      if (w.length < 3 || REPORTING.has(w) || state.seen.has(w)) continue;
      state.seen.add(w);
      added = true;
    }
    if (added || state.list.length !== state.seen.size) state.list = [...state.seen];
    return state.list;
  }
}

/**
 * The heading of an abstract or its like, as a whole: "Abstract", "Summary", "Structured
 * abstract", "Highlights", "Key points" (not "Summary of secondary outcomes", "Summary statistics
 * at baseline", "Summary of main findings" in a discussion).
 */
const SUMMARY_SECTION = /^(?:(?:structured|plain[- ]language|lay|graphical|short) )?(?:abstract|summary|highlights|key (?:points|findings|messages))[:.]?$/i;
/** Whether a segment's heading is an abstract's (SUMMARY_SECTION, the heading trimmed). */
export const isSummaryHeading = (heading: string | undefined): boolean => SUMMARY_SECTION.test((heading ?? '').trim());

/**
 * Words that say which way a result went or who took part, not what was compared: an abstract
 * says "exercise reduced fatigue" where the results say "fatigue was lower with exercise"
 * (common practice, no source).
 */
const DIRECTION = new Set(
  (
    'reduced reduce reduces reducing reduction improved improve improves improving improvement lowered raised fell rose dropped ' +
    'declined decline worsened worse benefit benefits benefited gain gains gained change changes changed changing rise fall drop ' +
    'participants participant patients patient subjects people individuals respondents study'
  ).split(' '),
);

/** Number words up to twenty, some round ones after, and ordinals to tenth, as time points are written in words ("six weeks", "the fourth visit"). */
const NUMBER_WORDS: ReadonlyMap<string, number> = new Map([
  ...'zero one two three four five six seven eight nine ten eleven twelve thirteen fourteen fifteen sixteen seventeen eighteen nineteen twenty'
    .split(' ')
    .map((w, i): [string, number] => [w, i]),
  ['twenty-four', 24], ['thirty', 30], ['thirty-six', 36], ['forty-eight', 48], ['sixty', 60],
  ...'first second third fourth fifth sixth seventh eighth ninth tenth'.split(' ').map((w, i): [string, number] => [w, i + 1]),
]);
const ORDINALS = new Set('first second third fourth fifth sixth seventh eighth ninth tenth'.split(' '));
const TIME_UNIT = '(hour|day|week|month|year|session|visit|wave|cycle)s?';

/**
 * "at 12 months", "after six weeks", "the 6-month visit", "the fourth visit", "week 8", "visit
 * 3": a number tied to a unit of time or occasion. A plain "12 weeks", "(ten weeks)" or "a
 * 12-week programme" is a duration, the length of a study or a treatment, not a time point,
 * unless "at", "after" or "by" before it, a follow-up, visit or assessment after it, or an
 * ordinal says it is one.
 */
const TIME_POINT = new RegExp(`\\b(?:(?:(at|after|by) (?:the )?)?(\\d{1,3}|${[...NUMBER_WORDS.keys()].sort((a, b) => b.length - a.length).join('|')})[- ]${TIME_UNIT}\\b( follow-?up| assessment| visit| time ?point)?|\\b${TIME_UNIT} (\\d{1,3})\\b)`, 'gi');

/** The time points a text names, each as "month 12" (unit, number). */
export function timePoints(text: string): string[] {
  const out = new Set<string>();
  for (const m of matchesOf(TIME_POINT, text)) {
    const [, said, printed, unitBefore, follower, unitAfter, after] = m;
    // a duration: not said to be a point, not followed by one, not an ordinal
    if (printed !== undefined && said === undefined && follower === undefined && !ORDINALS.has(printed.toLowerCase())) continue;
    const number = printed !== undefined ? (/^\d/.test(printed) ? Number(printed) : NUMBER_WORDS.get(printed.toLowerCase())) : Number(after);
    const unit = (unitBefore ?? unitAfter ?? '').toLowerCase();
    if (number === undefined || unit === '') continue;
    // a year is twelve months: "at one year" and "at 12 months" are one time point
    out.add(unit === 'year' ? `month ${12 * number}` : `${unit} ${number}`);
  }
  return [...out];
}

/** Words naming a sex, and the sex (common practice, no source). */
const SEXES: ReadonlyMap<string, string> = new Map([
  ...['women', 'woman', 'female', 'females', 'girls', 'girl', 'mothers', 'mother'].map((w): [string, string] => [w, 'sex:female']),
  ...['men', 'man', 'male', 'males', 'boys', 'boy', 'fathers', 'father'].map((w): [string, string] => [w, 'sex:male']),
]);

/** Words naming an age group, and the group (common practice, no source). */
const AGES: ReadonlyMap<string, string> = new Map([
  ...['older', 'elderly', 'old'].map((w): [string, string] => [w, 'age:older']),
  ...['younger', 'young'].map((w): [string, string] => [w, 'age:younger']),
  ...['children', 'child', 'adolescents', 'adolescent', 'infants', 'infant', 'pupils'].map((w): [string, string] => [w, 'stage:children']),
  ...['adults', 'adult'].map((w): [string, string] => [w, 'stage:adults']),
]);

/** The sexes and age groups a list of content words names. */
const subgroupsOf = (words: readonly string[]): string[] => [...new Set(words.flatMap((w) => [SEXES.get(w), AGES.get(w)].filter((g): g is string => g !== undefined)))];

/** "without dementia", "without prior surgery": the content word a "without" excludes. */
const WITHOUT = /\bwithout (?:(?:a|an|any|the|prior|previous|known) )?(\p{L}[\p{L}'’-]{2,40})/giu;

/**
 * What a t-test is about, as repeated-result-agrees ties a result of an abstract to the one
 * with the same df elsewhere: the content words around it (less the words of direction and
 * of who took part, DIRECTION), the time points it names, and the words it names after
 * "without".
 */
export interface TestTopic {
  test: TTestReport;
  /** In a section headed as an abstract or its like (isSummaryHeading). */
  inSummary: boolean;
  /**
   * Content words: for a test of an abstract, those of its own lead (else of its sentence up
   * to it); for another, those of its whole sentence (else of the sentence before, when its own
   * has none or points back to it: "This difference was significant, t(…)"), or of its table
   * row's label and the table's caption.
   */
  words: string[];
  /** The words' stems (`stem`), each once. */
  stems: string[];
  /** Time points: an abstract's, in its words; another's, in its own clause (or the sentence it points back to), or its row and caption. */
  times: string[];
  /** The sexes and age groups named there, each with its dimension ("women": sex:female; "older adults": age:older, stage:adults), each once. */
  subgroups: string[];
  /** The words named after "without" there, lower case. */
  without: string[];
}

/** A sentence that opens by pointing back to the one before: "This difference was significant", "The effect …". */
const POINTS_BACK = /^(?:This|That|These|Those|The|Such|Both) (?:\p{L}+ )?(?:differences?|effects?|changes?|comparisons?|gaps?|contrasts?|results?|improvements?|reductions?|increases?|decreases?)(?![\p{L}])/u;

/** A clause that opens by pointing back to the words before it: "and this difference was significant". */
const CLAUSE_POINTS_BACK = /^(?:and |but |yet )?(?:this|that|these|the) (?:\p{L}+ )?(?:differences?|effects?|changes?|gaps?|contrasts?)(?![\p{L}])/iu;

/** Two topics as one: the words, stems, time points, subgroups and excluded words of both. */
function mergeTopics(a: Omit<TestTopic, 'test' | 'inSummary'>, b: Omit<TestTopic, 'test' | 'inSummary'>): Omit<TestTopic, 'test' | 'inSummary'> {
  const union = (x: readonly string[], y: readonly string[]) => [...new Set([...x, ...y])];
  return { words: union(a.words, b.words), stems: union(a.stems, b.stems), times: union(a.times, b.times), subgroups: union(a.subgroups, b.subgroups), without: union(a.without, b.without) };
}

/** How far back from its statistic an abstract's result is read for its words (characters). */
const LEAD_REACH = 400;

/** The words, stems, time points, sexes and excluded words of a stretch of text. */
function topicOf(stretch: string): Omit<TestTopic, 'test' | 'inSummary'> {
  const words = topicWords(stretch).filter((w) => !DIRECTION.has(w));
  // a word after "without" that the stretch also names otherwise ("with and without dyslexia",
  // "patients who exercised than … without exercise") is the comparison itself, not an exclusion
  const excluded = [...matchesOf(WITHOUT, stretch)].map((m) => (m[1] as string).toLowerCase());
  const count = (list: Iterable<string>) => {
    const n = new Map<string, number>();
    for (const w of list) n.set(stem(w), (n.get(stem(w)) ?? 0) + 1);
    return n;
  };
  const afterWithout = count(excluded);
  const named = excluded.length > 0 ? count([...matchesOf(WORD, stretch)].map((m) => m[0])) : afterWithout;
  const without = [...new Set(excluded.filter((w) => (named.get(stem(w)) ?? 0) <= (afterWithout.get(stem(w)) ?? 0)))];
  return { words, stems: [...new Set(words.map(stem))], times: timePoints(stretch), subgroups: subgroupsOf(words), without };
}

/**
 * The topic of each t-test of an abstract with a df, and of each test elsewhere whose df could
 * be the same (printed alike, or a Welch df that rounds to it). Nothing when no section is an
 * abstract. Linear in the tests and in the text of their sentences.
 */
export function findTopics(segments: readonly Segment[], tests: readonly TTestReport[]): TestTopic[] {
  const inSummary = (t: TTestReport) => isSummaryHeading(segments[t.segment]?.section);
  const summaryDfs = new Set(tests.filter((t) => t.df !== undefined && inSummary(t)).map((t) => Math.round(t.df?.value ?? NaN)));
  if (summaryDfs.size === 0) return [];
  const starts = new Map<number, number[]>();
  const startsOf = (seg: Segment) => {
    let s = starts.get(seg.id);
    if (!s) {
      s = sentenceStarts(seg.text);
      starts.set(seg.id, s);
    }
    return s;
  };
  // each table's caption, for the tests in its rows
  const captions = new Map<number, string>();
  for (const seg of segments) if (seg.legendOf?.role === 'caption' && !captions.has(seg.legendOf.table)) captions.set(seg.legendOf.table, seg.text);
  const bySentence = new Map<string, Omit<TestTopic, 'test' | 'inSummary'>>();
  const captionTopics = new Map<number, Omit<TestTopic, 'test' | 'inSummary'>>();
  const out: TestTopic[] = [];
  for (const t of tests) {
    if (t.df === undefined) continue;
    const summary = inSummary(t);
    if (!summary && !summaryDfs.has(Math.round(t.df.value))) continue;
    const seg = segments[t.segment];
    if (!seg || seg.id !== t.segment) continue;
    const at = indexOfSource(seg, t.span.start);
    const list = startsOf(seg);
    const sentence = sentenceOf(list, at);
    const from = list[sentence] as number;
    const to = list[sentence + 1] ?? seg.text.length;
    if (summary) {
      // an abstract's result is named in its own clause; at most LEAD_REACH characters of it
      // are read, so that a hostile abstract of thousands of results costs no more than its text
      const reach = Math.max(from, at - LEAD_REACH);
      const lead = leadStart(seg.text, reach, at);
      const stretch = topicWords(seg.text.slice(lead, at)).length > 0 ? seg.text.slice(lead, at) : seg.text.slice(reach, at);
      out.push({ test: t, inSummary: true, ...topicOf(stretch) });
      continue;
    }
    if (seg.table) {
      // a table row: its label and cell, with its table's caption (read once per table)
      const table = seg.table.table;
      let caption = captionTopics.get(table);
      if (!caption) {
        caption = topicOf(captions.get(table) ?? '');
        captionTopics.set(table, caption);
      }
      out.push({ test: t, inSummary: false, ...mergeTopics(topicOf(`${t.table?.rowLabel ?? ''}. ${seg.text.slice(from, to)}`), caption) });
      continue;
    }
    // the words of a sentence, read once for all its tests; with the sentence before when it has
    // none of its own or points back to it ("This difference was significant, t(…)")
    const key = `${seg.id}:${sentence}`;
    let topic = bySentence.get(key);
    if (!topic) {
      let stretch = seg.text.slice(from, to);
      if (sentence > 0 && (topicWords(stretch).length === 0 || POINTS_BACK.test(stretch))) stretch = `${seg.text.slice(list[sentence - 1] as number, from)} ${stretch}`;
      topic = topicOf(stretch);
      bySentence.set(key, topic);
    }
    // its time points: those of its own clause (another clause may speak of another time: "…,
    // t(98) = 2.58, having been similar at 6 months"), or of the sentence it points back to
    const own = leadStart(seg.text, Math.max(from, at - LEAD_REACH), at);
    const times = timePoints(seg.text.slice(own, Math.min(to, at + t.printed.length)));
    // (a clause that points back, "…, and this difference was significant, t(98)", takes the sentence's)
    const pointsBack = POINTS_BACK.test(seg.text.slice(from, to)) || CLAUSE_POINTS_BACK.test(seg.text.slice(own, at));
    out.push({ test: t, inSummary: false, ...topic, times: times.length > 0 || !pointsBack ? times : timePoints(seg.text.slice(from, Math.min(to, at + t.printed.length))).concat(topic.times) });
  }
  return out;
}
