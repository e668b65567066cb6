import type { Segment } from '../parse/types.js';
import { sentenceOf, sourceSpan } from './numbers.js';
import type { GroupAssignment } from './types.js';
import { matchesOf } from './matches.js';

/** A group's name: one to three words, hyphens allowed ("no-incentive", "standing desk"). */
const NAME = String.raw`(\p{L}[\p{L}\p{N}-]{0,30}(?: \p{L}[\p{L}\p{N}-]{0,30}){0,2}?)`;
const KIND = String.raw`(?:group|arm|condition|cohort)`;
const SIZE = String.raw`(?: ?\((?:n|N) ?= ?\d{1,6}\))?`;
/**
 * "randomly assigned to the incentive group or the no-incentive group", "randomised to the
 * quiet-hour (n = 14) or the usual-routine group (n = 13)", "allocated to the leaflet or the
 * waiting-list arm": two named groups that different units were put in.
 */
const ASSIGNED = new RegExp(
  String.raw`(?<![\p{L}])(?:assigned|allocated|randomi[sz]ed)(?: at random)? to (?:either )?(?:the |a |an )?${NAME}(?: ${KIND})?${SIZE},? (?:or|and|versus|vs\.?) (?:to )?(?:the |a |an )?${NAME} ${KIND}s?${SIZE}(?![\p{L}])`,
  'giu',
);
/**
 * Words of an order of conditions or a crossover: every unit then has both conditions, so the
 * groups are not independent ("assigned to the quiet condition first", "in counterbalanced
 * order"). "At the first visit" is not an order.
 */
export const ORDER_WORDS =
  /(?<![\p{L}])(?:(?:condition|treatment|arm|intervention|session|drug|placebo|one) first|(?:first|second) (?:condition|treatment|session|period|phase)|orders?|sequences?|crossover|cross-over|crossed over|counterbalanced)(?![\p{L}])/iu;
/** Words that are not a group's name. */
const NOT_A_NAME = /^(?:one|two|three|four|each|either|other|another|this|that|these|those|their|its|the|a|an|groups?)$/iu;

/** Randomised groups named in one segment, each with its two names in lower case. */
export function findAssignments(seg: Segment, sentenceStarts: number[]): GroupAssignment[] {
  const text = seg.text;
  if (!/assigned|allocated|randomi[sz]ed/i.test(text)) return [];
  const out: GroupAssignment[] = [];
  for (const m of matchesOf(ASSIGNED, text)) {
    const a = (m[1] ?? '').toLowerCase();
    const b = (m[2] ?? '').toLowerCase();
    if (!a || !b || a === b || NOT_A_NAME.test(a) || NOT_A_NAME.test(b)) continue;
    const sentence = sentenceOf(sentenceStarts, m.index);
    const from = sentenceStarts[sentence] as number;
    const to = sentenceStarts[sentence + 1] ?? text.length;
    if (ORDER_WORDS.test(text.slice(from, to))) continue;
    out.push({ segment: seg.id, block: seg.block, sentence, names: [a, b], span: sourceSpan(seg, m.index, m.index + m[0].length), printed: m[0] });
  }
  return out;
}
