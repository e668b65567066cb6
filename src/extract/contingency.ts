import type { Segment } from '../parse/types.js';
import { sentenceOf, sourceSpan } from './numbers.js';
import type { TableDimensions } from './types.js';
import { matchesOf } from './matches.js';

const COUNT = String.raw`(\d{1,2}|two|three|four|five|six|seven|eight|nine|ten)`;
const WORDS: Record<string, number> = { two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10 };

/**
 * A contingency table's size, in clear forms only: `a 2 × 3 contingency table`, `2 x 2 table`,
 * `a 3-by-4 cross-tabulation`. Not a factorial design (`2 × 2 design`), and not two factors of a
 * larger table (`2 × 2 × 3`): the look-behind and look-ahead refuse a third dimension.
 */
const BY_SIZE = /(?<![\p{L}\p{N}.,×✕])(?<!\d ?[×✕xX] ?)(\d{1,2})(?: ?[×✕xX] ?| by |-by-)(\d{1,2})(?! ?[×✕xX] ?\d|-by-| by \d)(?:[- ](?:contingency|frequency|cross-?classification))? (?:tables?|cross-?tabulations?|crosstabs?)(?![\p{L}])/gu;
/** `across three groups and four categories`: the rows' and the columns' number in words or digits. */
const ACROSS = new RegExp(String.raw`(?<![\p{L}])across ${COUNT} (?:groups|conditions|arms|sites|cohorts) and ${COUNT} (?:response |outcome )?(?:categories|outcomes)(?![\p{L}])`, 'giu');

/** The contingency tables whose size a segment states, in reading order. */
export function findTableDimensions(seg: Segment, starts: number[]): TableDimensions[] {
  const text = seg.text;
  const out: TableDimensions[] = [];
  if (!/table|tabulation|crosstab|across/iu.test(text)) return out;
  for (const re of [BY_SIZE, ACROSS]) {
    for (const m of matchesOf(re, text)) {
      const rows = countOf(m[1] as string);
      const cols = countOf(m[2] as string);
      if (!(rows >= 2 && cols >= 2)) continue;
      const end = m.index + m[0].length;
      out.push({ segment: seg.id, block: seg.block, sentence: sentenceOf(starts, m.index), span: sourceSpan(seg, m.index, end), printed: m[0], rows, cols });
    }
  }
  return out.sort((a, b) => a.span.start - b.span.start);
}

function countOf(s: string): number {
  return WORDS[s.toLowerCase()] ?? Number(s);
}
