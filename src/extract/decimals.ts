import type { Segment } from '../parse/types.js';
import { matchesOf } from './matches.js';

/** How a document writes the decimal mark: `2.10` or `2,10`. */
export type DecimalConvention = 'point' | 'comma';

/**
 * A number written with a comma in a value position: after `=`, `<`, `>`, `≤`, `≥`, `±` or
 * `:` (with an optional sign), as `= −1,41` or `p = 0,16`. Group 1 is the digits before the
 * comma, group 2 those after it.
 */
const COMMA_VALUE = /(?<=[=<>≤≥±:] ?[-+]? ?)(\d{1,6}),(\d{1,6})(?![\d,])/g;
/** A number written with a point in a value position (`= 2.10`, `< .05`). */
const POINT_VALUE = /[=<>≤≥±:] ?[-+]? ?\d{0,6}\.\d/g;
/** Digits grouped in thousands by points, right before a decimal comma (`1.267,7`, `12.345.678,9`). */
const THOUSANDS_POINTS = /(?<![\d.,])\d{1,3}(?:\.\d{3}){1,4}(?=,\d)/g;
/** Any digits-comma-digits run (a list of three or more numbers is skipped by the caller). */
const COMMA_NUMBER = /(\d{1,6}),(\d{1,6})(?![\d])/g;

/**
 * The document's convention, from the numbers in value positions: comma when the numbers
 * there that can only be decimal commas (`= 1,41`, `= 0,160`: a thousands group has exactly
 * three digits and never follows a lone 0) outnumber those written with a point. Ambiguous
 * commas (`= 1,200`) do not count either way.
 */
export function decimalConvention(segments: readonly Segment[]): DecimalConvention {
  let comma = 0;
  let point = 0;
  for (const seg of segments) {
    if (seg.kind === 'code') continue;
    const text = seg.text;
    if (text.includes(',')) for (const m of matchesOf(COMMA_VALUE, text)) if (isDecimalComma(m[1] as string, m[2] as string)) comma += 1;
    if (text.includes('.')) point += text.match(POINT_VALUE)?.length ?? 0;
  }
  return comma > point ? 'comma' : 'point';
}

/** A comma that no thousands grouping can explain: not followed by exactly three digits, or after a lone 0. */
function isDecimalComma(before: string, after: string): boolean {
  return after.length !== 3 || before === '0';
}

/**
 * The segment with its decimal commas written as points, so that every recogniser reads one
 * spelling (`t(54) = −1,41; p = 0,16` → `t(54) = −1.41; p = 0.16`). One character for one,
 * so the source map is unchanged. In a point document only commas that must be decimal and
 * sit in a value position are rewritten (a result in the other style, quoted or pasted); in a
 * comma document every digit-comma-digit run is, except a df pair after a statistic's
 * symbol (`F(1,38)`), a list of three or more numbers, and, for ambiguous three-digit
 * groups, nothing else is guessed.
 */
export function withDecimalPoints(seg: Segment, convention: DecimalConvention): Segment {
  const text = seg.text;
  if (!text.includes(',')) return seg;
  // the characters are copied only once one is rewritten: most segments with a comma have none
  let chars: string[] | undefined;
  const copy = () => (chars ??= text.split(''));
  let changed = false;
  const rewrite = (at: number) => {
    copy()[at] = '.';
    changed = true;
  };
  if (convention === 'point') {
    for (const m of matchesOf(COMMA_VALUE, text)) {
      if (isDecimalComma(m[1] as string, m[2] as string)) rewrite(m.index + (m[1] as string).length);
    }
  } else {
    // `1.267,7`: points that group thousands before a decimal comma become commas, which every
    // reader takes as thousands separators (`1,267.7` once the decimal comma is a point)
    if (text.includes('.')) for (const m of matchesOf(THOUSANDS_POINTS, text)) {
      for (let i = m.index; i < m.index + m[0].length; i += 1) if (text[i] === '.') copy()[i] = ',';
      changed = true;
    }
    for (const m of matchesOf(COMMA_NUMBER, text)) {
      const comma = m.index + (m[1] as string).length;
      if (inList(text, m.index, comma + 1 + (m[2] as string).length) || afterStatisticBracket(text, m.index)) continue;
      rewrite(comma);
    }
  }
  return changed ? { ...seg, text: chars ? chars.join('') : text } : seg;
}

/** `1,2,3`: the number is one of a comma-separated list without spaces. */
function inList(text: string, start: number, end: number): boolean {
  return (text[start - 1] === ',' && /\d/.test(text[start - 2] ?? '')) || (text[end] === ',' && /\d/.test(text[end + 1] ?? ''));
}

/** `F(1,38)`, `χ2(2,48)`: digits right after a symbol's bracket are a pair of degrees of freedom. */
function afterStatisticBracket(text: string, start: number): boolean {
  let i = start - 1;
  if (text[i] === ' ') i -= 1;
  // a parenthesis only: `CI [0,06; 0,76]` opens an interval, not degrees of freedom
  if (text[i] !== '(') return false;
  i -= 1;
  if (text[i] === ' ') i -= 1;
  // t has one df: `t(23,80)` in a decimal-comma text is a Welch df of 23.80
  if (/[tT]/.test(text[i] ?? '') && !/\p{L}/u.test(text[i - 1] ?? '')) return false;
  return /[\p{L}_²]/u.test(text[i] ?? '') || /\p{L}\d$/u.test(text.slice(Math.max(0, i - 1), i + 1));
}
