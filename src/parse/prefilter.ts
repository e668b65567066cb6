/**
 * Whether a source can hold anything plumbline reads: a t statistic, descriptives, a count
 * with its percentage, a CI, a power statement, a p (for F, χ², r and z), an r, front matter or
 * a plumbline comment. When it
 * cannot, the Markdown parse is skipped: every record the extractor makes needs one of these
 * marks, so the findings are the same either way (test/engine/prefilter.test.ts checks it on
 * every fixture and benchmark corpus). A plain scan over the text, linear in its length.
 */
const SP = '[ \\u00A0\\u2009\\u202F]*';
// `$t$ $(`: two math spans that join; `{ t }`: a TeX group around the letter
const MARKUP = '(?:\\*{1,3}|_{1,3}|</[a-z]{1,6}>|\\$ {0,3}\\$?| {0,3}\\})?';
const MARKS = new RegExp(
  [
    // t(28), *t*(28), t = 2.1, t_{28}, t: 2.1, "| t |", <td>t</td><td>, t { = } 2.1, t ： 2.1
    `(?<![A-Za-z])[tT]s?${MARKUP}${SP}[(\\[_=:|＝（［<{：]`,
    '(?<![A-Za-z])[tT](?: {2}|\\t)', // a column headed t in a table of aligned columns
    '(?<![A-Za-z])[tT][0-9₀-₉]', // t28, t₂₈ (flattened subscripts)
    '(?<![A-Za-z])[tT][- ]?(?:value|statistic|stat|ratio|score|tests?)',
    '(?<![A-Za-z])[tT] (?:is|of|was) ',
    'Welch|Student',
    '±',
    `%${SP}\\)`, // 12 (40%)
    '(?<![A-Za-z])(?:M|N|n)(?:_\\S{1,20})?(?: {0,3}\\})?' + `${SP}[=:]`, // M = 5.2, { M } = 5.2
    'S ?D|S ?E|s\\.d\\.|S\\.D\\.|s\\.e\\.|Std', // S D: letters a PDF converter spaced out in math
    '[Mm]eans?\\b|[Aa]verage|[Aa]vg|[Ss]tandard (?:deviation|error)|[Ss]ample size',
    '[Pp]ower',
    'CI\\b|[Cc]onfidence interval',
    '<!--',
    '^\\uFEFF?---',
    '\\\\text|\\\\emph|\\\\math|\\\\boldsymbol|\\\\bm\\b|\\\\operatorname|\\\\(?:rm|it|bf|tt|cal)\\b', // LaTeX around a statistic
  ].join('|'),
  'm',
);

/**
 * Invisible characters and loose combining marks, which the normaliser drops, can sit inside any
 * of the marks above (t\u200F(28)): a text holding one is parsed. A leading BOM is not one.
 */
const INVISIBLE = /[\u200E\u200F\u061C\u202A-\u202E\u2066-\u2069\uFE00-\uFE0F\u0300-\u036F\u1AB0-\u1AFF\u1DC0-\u1DFF\u20D0-\u20FF\uFE20-\uFE2F]|\uDB40[\uDD00-\uDDEF]|(?<=[\s\S])\uFEFF/;

/**
 * A p with its comparison, and the F, χ², r and z statistics the report lists (`F(1, 38)`, `F1,38`,
 * `F < 1`, `χ²`, `chi-square(1)`, `X2`, `r(48)`, `rs =`, `ρ`, `τ`, `z =`).
 */
const STATISTIC_MARKS = /(?<![A-Za-z])(?:[Pp]s?|r(?:_?s|_?pb)?|F|[zZ])[ \u00A0\u2009\u202F_{]*[=<>≤≥(\[\d]|χ|ρ|τ|X\^?2|(?<![A-Za-z])[Cc]hi(?:[- ]squared?)?[ \u00A0\u2009\u202F^2]*[=<>≤≥(\[]/;

export function mayHoldStatistics(source: string): boolean {
  return MARKS.test(source) || STATISTIC_MARKS.test(source) || INVISIBLE.test(source);
}
