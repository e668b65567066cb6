import type { Segment, Span } from '../parse/types.js';
import type { ReportedNumber } from './types.js';

/** Source span of segment characters [a, b). */
export function sourceSpan(seg: Segment, a: number, b: number): Span {
  const last = Math.max(a, b - 1);
  return { start: seg.starts[a] as number, end: seg.ends[last] as number };
}

/**
 * A decimal number as printed at text[a, b): optional sign, digits with optional thousands
 * separators ("1,200"), optional fraction; decimals counts the fraction's digits.
 */
export function readNumber(seg: Segment, a: number, b: number, exponent = 0, mantissaEnd = b): ReportedNumber | undefined {
  const raw = seg.text.slice(a, mantissaEnd);
  const cleaned = raw.replace(/[\s,]/g, '').replace(/^\+/, '');
  if (!/^-?(?:\d+(?:\.\d*)?|\.\d+)$/.test(cleaned)) return undefined;
  const dot = cleaned.indexOf('.');
  const decimals = dot < 0 ? 0 : cleaned.length - dot - 1;
  const mantissa = Number(cleaned);
  const value = exponent === 0 ? mantissa : Number(`${cleaned}e${exponent}`);
  if (!Number.isFinite(value)) return undefined;
  return { printed: seg.text.slice(a, b), value, decimals, exponent, span: sourceSpan(seg, a, b) };
}

/**
 * Sentence index of each character: a sentence ends at . ! ? followed by space and a capital,
 * an opening quote or bracket, or a number that starts a clause ("… P = 0.074. 8 (36%) of the
 * 22 nurses …").
 */
export function sentenceStarts(text: string): number[] {
  const starts = [0];
  const re = /[.!?](?:["”’)\]]?)\s+(?=[A-Z“"(]|\d{1,6}(?:,\d{3})? (?:\(|[a-z]))/g;
  for (let m = re.exec(text); m; m = re.exec(text)) {
    // "Fig. 2", "e.g. A", "vs. B", "et al. (", "p. 45" are not sentence ends
    const before = text.slice(Math.max(0, m.index - 6), m.index + 1);
    if (/(?:\b(?:Fig|Figs|Tab|Eq|e\.g|i\.e|vs|al|cf|approx|No|no|ca|p|pp|Vol|vol|ch|Sect|sect|Ref|ref)\.)$/.test(before)) continue;
    // "(mean ± s.d.) (n = 8)": a dotted abbreviation closing a bracket, or before one, ends no sentence
    if ((m[0].includes(')') || m[0].includes(']') || text[m.index + m[0].length] === '(') && /(?:^|[^\p{L}])(?:\p{L}\.){1,3}\p{L}\.$/u.test(text.slice(Math.max(0, m.index - 8), m.index + 1))) continue;
    starts.push(m.index + m[0].length);
  }
  return starts;
}

export function sentenceOf(starts: number[], index: number): number {
  let lo = 0;
  let hi = starts.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if ((starts[mid] as number) <= index) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

/** The text without white space or any of these characters at its end (a loop: a trailing-run pattern is quadratic). */
export function trimEndOf(text: string, chars: string): string {
  let end = text.length;
  while (end > 0 && (chars.includes(text[end - 1] as string) || /\s/.test(text[end - 1] as string))) end -= 1;
  return text.slice(0, end);
}
