import { matchesOf } from './matches.js';

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
