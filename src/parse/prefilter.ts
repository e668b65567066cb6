/**
 * Whether a source can hold anything plumbline reads: a t statistic, descriptives, a count
 * with its percentage, a CI, a power statement, front matter or a plumbline comment. When it
 * cannot, the Markdown parse is skipped: every record the extractor makes needs one of these
 * marks, so the findings are the same either way (test/engine/prefilter.test.ts checks it on
 * every fixture and benchmark corpus). A plain scan over the text, linear in its length.
 */
const SP = '[ \\u00A0\\u2009\\u202F]*';
const MARKUP = '(?:\\*{1,3}|_{1,3}|</[a-z]{1,6}>|\\$)?';
const MARKS = new RegExp(
  [
    `(?<![A-Za-z])[tT]s?${MARKUP}${SP}[(\\[_=:|＝（［]`, // t(28), *t*(28), t = 2.1, t_{28}, t: 2.1, "| t |"
    '(?<![A-Za-z])[tT][0-9₀-₉]', // t28, t₂₈ (flattened subscripts)
    '(?<![A-Za-z])[tT][- ]?(?:value|statistic|stat|ratio|score|tests?)',
    '(?<![A-Za-z])[tT] (?:is|of|was) ',
    'Welch|Student',
    '±',
    `%${SP}\\)`, // 12 (40%)
    '(?<![A-Za-z])(?:M|N|n)(?:_\\S{1,20})?' + `${SP}[=:]`,
    'SD|SE|s\\.d\\.|S\\.D\\.|s\\.e\\.|Std',
    '[Mm]eans?\\b|[Aa]verage|[Aa]vg|[Ss]tandard (?:deviation|error)|[Ss]ample size',
    '[Pp]ower',
    'CI\\b|[Cc]onfidence interval',
    '<!--',
    '^\\uFEFF?---',
    '\\\\text|\\\\emph|\\\\math', // LaTeX around a statistic
  ].join('|'),
  'm',
);

export function mayHoldStatistics(source: string): boolean {
  return MARKS.test(source);
}
