/**
 * R Markdown inline code that prints a number written into it: `` `r apa_num(1.98)` ``,
 * `` `r 1.98` ``, `` `r format(12.50, nsmall = 2)` `` (Quarto: `` `{r} 1.98` ``). Knitting
 * prints that number where the code stands, so the reader takes the literal as prose at its
 * own source place. A call that reads a variable, or nests another call, prints what the
 * source does not show, and stays unread.
 */

/** A number literal as R writes it (an `L` suffix marks an integer). */
const NUMBER = /^[-+]?(?:[0-9]{1,15}(?:\.[0-9]{0,15})?|\.[0-9]{1,15})(?:[eE][-+]?[0-9]{1,3})?L?$/;
const CONSTANT = /^(?:TRUE|FALSE|T|F|NULL|NA|NA_real_|NA_integer_|NA_character_|Inf|-Inf|NaN)$/;
const STRING = /^(?:"[^"\\\n]{0,200}"|'[^'\\\n]{0,200}')$/;
const NAME = /^[A-Za-z.][A-Za-z0-9._]{0,60}$/;
/** `apa_num(` or `papaja::apa_num(`. */
const CALL = /^([A-Za-z.][A-Za-z0-9._]{0,60}(?:::[A-Za-z.][A-Za-z0-9._]{0,60})?)[ \t\r\n]{0,3}\(/;
/** The engine marker: `r ` (R Markdown) or `{r} ` (Quarto); the code may wrap to the next line. */
const ENGINE = /^[ \t]{0,3}(?:r|\{r\})[ \t\r\n]{1,4}/;
const isSpace = (c: string | undefined) => c === ' ' || c === '\t' || c === '\n' || c === '\r';

/** The literal number a piece of inline code prints, as a range of `code`, or undefined. */
export function literalNumberOfInlineR(code: string): { start: number; end: number } | undefined {
  if (code.length > 400) return undefined;
  const engine = ENGINE.exec(code);
  if (!engine) return undefined;
  const from = engine[0].length;
  let to = code.length;
  while (to > from && isSpace(code[to - 1])) to -= 1;
  const expr = code.slice(from, to);
  if (NUMBER.test(expr)) return trimSuffix(code, from, to);
  const call = CALL.exec(expr);
  if (!call || !expr.endsWith(')')) return undefined;
  const args = splitArguments(expr, call[0].length, expr.length - 1);
  if (!args) return undefined;
  let first: { start: number; end: number } | undefined;
  for (const a of args) {
    const eq = namedValue(expr, a.start, a.end);
    const value = eq ?? a;
    const text = expr.slice(value.start, value.end);
    const isNumber = NUMBER.test(text);
    if (!isNumber && !CONSTANT.test(text) && !STRING.test(text)) return undefined;
    if (!eq && !first) {
      if (!isNumber) return undefined;
      first = value;
    }
  }
  return first ? trimSuffix(code, from + first.start, from + first.end) : undefined;
}

/** Drop an integer's `L`. */
function trimSuffix(code: string, start: number, end: number): { start: number; end: number } {
  return code[end - 1] === 'L' ? { start, end: end - 1 } : { start, end };
}

/** The comma-separated arguments in `expr[from, to)` (trimmed ranges), or undefined when one nests. */
function splitArguments(expr: string, from: number, to: number): Array<{ start: number; end: number }> | undefined {
  const out: Array<{ start: number; end: number }> = [];
  let start = from;
  let quote = '';
  for (let i = from; i <= to; i += 1) {
    const c = i < to ? expr[i] : ',';
    if (quote) {
      if (c === quote) quote = '';
      continue;
    }
    if (c === '"' || c === "'") quote = c;
    else if (c === '(' || c === ')' || c === '[' || c === '{') return undefined;
    else if (c === ',') {
      let a = start;
      let b = i;
      while (a < b && isSpace(expr[a])) a += 1;
      while (b > a && isSpace(expr[b - 1])) b -= 1;
      if (a === b) return undefined;
      out.push({ start: a, end: b });
      start = i + 1;
    }
  }
  return quote ? undefined : out;
}

/** For `name = value`, the value's range; undefined for a positional argument. */
function namedValue(expr: string, start: number, end: number): { start: number; end: number } | undefined {
  const eq = expr.indexOf('=', start);
  if (eq < 0 || eq >= end) return undefined;
  const name = expr.slice(start, eq).trim();
  if (!NAME.test(name)) return undefined;
  let a = eq + 1;
  while (a < end && isSpace(expr[a])) a += 1;
  return { start: a, end };
}
