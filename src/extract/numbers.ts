import type { Segment, Span } from '../parse/types.js';
import type { ReportedNumber } from './types.js';

/** Source span of segment characters [a, b). */
export function sourceSpan(seg: Segment, a: number, b: number): Span {
  const last = Math.max(a, b - 1);
  return { start: seg.starts[a] as number, end: seg.ends[last] as number };
}

/**
 * A decimal number as printed at text[a, b): optional sign, digits with optional thousands
 * separators ("1,200"), optional fraction, and an optional `e` exponent written in the text
 * (`1.5e1`, `3.4e+01`) when none is passed; decimals counts the (mantissa's) fraction digits.
 * A number beyond a double's range keeps its size as `log10`: `1e-400` has value 0 and a
 * 400-digit t has value Infinity, and neither is a zero or an infinity as printed.
 */
export function readNumber(seg: Segment, a: number, b: number, exponent = 0, mantissaEnd = b): ReportedNumber | undefined {
  let raw = seg.text.slice(a, mantissaEnd);
  let power = exponent;
  if (exponent === 0 && mantissaEnd === b) {
    const e = SCIENTIFIC_TAIL.exec(raw);
    if (e) {
      power = Number(e[1]);
      raw = raw.slice(0, e.index);
    }
  }
  const cleaned = raw.replace(/[\s,]/g, '').replace(/^\+/, '');
  if (!/^-?(?:\d+(?:\.\d*)?|\.\d+)$/.test(cleaned)) return undefined;
  const dot = cleaned.indexOf('.');
  const decimals = dot < 0 ? 0 : cleaned.length - dot - 1;
  // an exponent no double holds exactly (16 digits and more) gives 0 or Infinity; its size is kept below
  const value = power === 0 ? Number(cleaned) : Number.isSafeInteger(power) ? Number(`${cleaned}e${power}`) : Number(cleaned) === 0 ? Number(cleaned) : (power > 0 ? Infinity : 0) * (cleaned.startsWith('-') ? -1 : 1);
  if (Number.isNaN(value)) return undefined;
  const out: ReportedNumber = { printed: seg.text.slice(a, b), value, decimals, exponent: power, span: sourceSpan(seg, a, b) };
  const magnitude = beyondDouble(cleaned, power, value);
  if (magnitude) out.beyondDouble = magnitude;
  return out;
}

/** `e1`, `E+01`, `e-13` at the end of a number's text: group 1 is the exponent. */
const SCIENTIFIC_TAIL = /(?<=[\d.])[eE]([-+]?\d{1,9})$/;

/**
 * The decimal logarithm of a printed number's magnitude and its mantissa, when the double
 * `value` lost it (overflow to Infinity, or underflow to 0 or a subnormal of a non-zero
 * number); undefined for numbers a double holds.
 */
function beyondDouble(cleaned: string, power: number, value: number): ReportedNumber['beyondDouble'] {
  const digits = cleaned.replace(/^-/, '');
  const firstDigit = digits.search(/[1-9]/);
  if (firstDigit < 0) return undefined; // zero as printed
  if (Number.isFinite(value) && Math.abs(value) >= 2.2250738585072014e-308) return undefined;
  // the significant digits as d.ddd × 10^k, read from the text (no double holds the number)
  const dot = digits.indexOf('.');
  const intDigits = dot < 0 ? digits.length : dot;
  const k = firstDigit < intDigits ? intDigits - firstDigit - 1 : -(firstDigit - intDigits);
  const significant = digits.replace('.', '').replace(/^0+/, '').slice(0, 17);
  const lead = Number(`${significant.slice(0, 1)}.${significant.slice(1) || '0'}`);
  const mantissa = Number(cleaned.replace(/^-/, ''));
  return { log10: Math.log10(lead) + k + power, ...(Number.isFinite(mantissa) ? { mantissa } : {}) };
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

/** Where the sentence holding `index` starts and ends in a text of `length` characters (`starts` as for sentenceOf). */
export function sentenceBounds(starts: number[], index: number, length: number): [number, number] {
  const i = sentenceOf(starts, index);
  return [starts[i] as number, starts[i + 1] ?? length];
}

/** The text without white space or any of these characters at its end (a loop: a trailing-run pattern is quadratic). */
export function trimEndOf(text: string, chars: string): string {
  let end = text.length;
  while (end > 0 && (chars.includes(text[end - 1] as string) || /\s/.test(text[end - 1] as string))) end -= 1;
  return text.slice(0, end);
}
