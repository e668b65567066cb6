import type { Segment } from '../parse/types.js';
import { sentenceOf, sentenceStarts, sourceSpan } from './numbers.js';
import { UNIT_WORDS } from './units.js';
import type { IntegerStatement, MeasureMention } from './types.js';
import { matchesOf } from './matches.js';

const NUMBER_WORDS: Record<string, number> = { one: 1, two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12, fifteen: 15, twenty: 20 };
const COUNT = String.raw`(\d{1,3}|one|two|three|four|five|six|seven|eight|nine|ten|eleven|twelve|fifteen|twenty)`;

/**
 * Words that declare a measure's scores whole numbers, each with the number of integer items
 * a score averages (1 for a single item, a count or a sum of items; k for the mean of k items).
 * "scored 1–7" alone is not enough: a scale scored 1–7 may be the mean of several items.
 */
const MEAN_OF_ITEMS = new RegExp(String.raw`(?<![\p{L}])(?:mean|average) of (?:the )?${COUNT} (?:\p{L}{1,20} )?items`, 'iu');
const SUM_OF_ITEMS = new RegExp(String.raw`(?<![\p{L}])(?:sum|total) of (?:the )?${COUNT} (?:\p{L}{1,20} )?items`, 'iu');
const K_ITEM = /(?<![\p{L}\p{N}])(\d{1,3})-item (?:scale|measure|questionnaire|inventory|index|test)(?![\p{L}])/iu;
// Several patterns rather than one alternation: each is judged linear by recheck on its own.
const INTEGER_WORDS = /(?<![\p{L}])(?:single[- ]item|a single item|one item|single rating|integers?|integer[- ]valued|whole[- ]numbers?|whole[- ]number counts?|whole points)(?![\p{L}])/iu;
/** "rated on a single five-point item", "one 7-point Likert item": one item, whatever its points. */
const ONE_ITEM = /(?<![\p{L}])(?:a single|single|one) (?:[\p{L}\p{N}]{1,12}-point |[\p{L}\p{N}]{1,12}-level )?(?:Likert[- ]|rating |response )?item(?![\p{L}])/iu;
const COUNT_OF = /(?<![\p{L}])counts? of \p{L}{3,30}/iu;
const RECORDED_AS_COUNT = /(?<![\p{L}])(?:recorded|counted|tallied|logged|coded) as (?:the )?(?:number|count)s? of(?![\p{L}])/iu;
const NUMBER_RECORDED = /(?<![\p{L}])number of \p{L}{3,30} (?:was|were) (?:recorded|counted|tallied|logged|coded)(?![\p{L}])/iu;

/** The first words of a sentence that declare whole-number scores, if any. */
function integerWords(text: string): RegExpExecArray | null {
  return INTEGER_WORDS.exec(text) ?? ONE_ITEM.exec(text) ?? COUNT_OF.exec(text) ?? RECORDED_AS_COUNT.exec(text) ?? NUMBER_RECORDED.exec(text);
}
/** What a count counts: "the number of errors", "number of Lenses and keywords saved". */
const COUNTED_THING = /(?<![\p{L}])(?:number|counts?) of (\p{L}{3,30})(?: and (\p{L}{3,30}))?/iu;
/**
 * Nouns whose number is a sample size, not a measure ("the number of participants"), or that
 * are often reported in fractions ("number of hours slept"): never a whole-number measure's name.
 */
const NOT_A_COUNTED_MEASURE = /^(?:participant|patient|subject|people|person|individual|child|children|adult|student|pupil|respondent|volunteer|case|observation|sample|group|condition|trial|time|hour|minute|second|week|month|year|study|studie|item|point|unit|measure|factor|variable|level|way)$/u;
/**
 * "The number of reminders averaged M = 2.39": a count reported in its own sentence (tied to
 * that sentence only). "A large number of structures" is a quantity, not a measure.
 */
const NUMBER_OF = /(?<![\p{L}])number of \p{L}{3,30}/iu;
/** Words before "number of" that make it a quantity, not a measure. */
const QUANTITY_BEFORE = new Set(['a', 'an', 'large', 'small', 'great', 'high', 'low', 'growing', 'limited', 'considerable', 'substantial', 'greater', 'larger', 'smaller', 'higher', 'lower', 'equal', 'same']);

/** "The number of reminders" as a measure; "a large number of structures" is a quantity. */
function numberOfMeasure(sentence: string): RegExpExecArray | null {
  const m = NUMBER_OF.exec(sentence);
  if (!m) return null;
  const words = sentence.slice(Math.max(0, m.index - 20), m.index).trimEnd().split(' ');
  return QUANTITY_BEFORE.has((words[words.length - 1] ?? '').toLowerCase()) ? null : m;
}
/** The sentence's subject before its verb: "Mood was rated …", "Errors per shift were recorded …". */
const SUBJECT = /^((?:[\p{L}'’-]{1,30} ){0,5}[\p{L}'’-]{2,30}) (?:was|were|is|are) /u;
const FOR_MEASURE = /^For ((?:[\p{L}'’-]{1,30} ){0,3}[\p{L}'’-]{2,30}), /u;
/** Where a subject's head phrase ends: "errors per shift" → "errors", "number of visits in May" → … */
const HEAD_END = / (?:per|of|in|at|on|for|during|from|with|across|after|before|by) /u;
const SAMPLE_SIZE_DEFINITION = /(?<![\p{L}])(?:n|N|sample size) (?:is|was|=|denotes|indicates|gives|refers to) the (?:number|count) of/u;
const DETERMINERS = new Set(['the', 'a', 'an', 'each', 'every', 'our', 'their', 'its', 'this', 'these', 'that', 'all']);
/** A possessive before the head ("each worker's breaks"): whose, not what, so not part of the name. */
const POSSESSIVE = /^\p{L}[\p{L}-]*['’]s?$/u;
/**
 * Heads that name no measure by themselves ("each child's score"): with the possessive dropped
 * they would tie the declaration to every score of the document.
 */
const GENERIC_HEAD = /^(?:score|rating|value|outcome|response|result|total|answer|mark|number|count|reading)$/u;

/**
 * Words that make a value per unit a rate or an average, not a whole number. A rate ("per hour",
 * "per 100 discharges") undoes only a count the sentence implies ("the number of
 * interruptions per hour"), not one it calls whole-number ("errors per shift were recorded as
 * whole-number counts"); an average over occasions ("averaged over the four rounds", "the mean
 * across visits"; not "averaged across nurses", a mean over units) undoes any, since the unit's
 * value is then a mean.
 */
const RATE = /(?<![\p{L}])per (?:\d{2,6} |hundred |thousand )?(?:hours?|minutes?|days?|weeks?|months?|years?|shifts?|rounds?|visits?|sessions?|trials?|blocks?|admissions?|discharges?|patient-days?|bed-days?)(?![\p{L}])|(?<![\p{L}\p{N}])per (?:\d{2,6}|hundred|thousand)(?![\p{L}\p{N}])/iu;
const AVERAGED = /(?<![\p{L}])(?:averag(?:ed|ing|es?)|mean) (?:over|across) (?:the |all |both |each |(?:\d{1,3}|two|three|four|five|six|seven|eight|nine|ten) )*(?:rounds?|visits?|sessions?|days?|weeks?|months?|trials?|blocks?|occasions?|time ?points?|measurements?|assessments?|shifts?|repetitions?|tasks?|days)(?![\p{L}])/iu;

/**
 * Measures the text declares whole-number, one record per declaring sentence, with the
 * measure's name when the sentence says it (its subject, or the thing counted), so that the
 * declaration can be tied by name to the results that report that measure.
 */
export function findIntegerMeasures(seg: Segment, starts: number[]): IntegerStatement[] {
  const text = seg.text;
  if (!/integer|whole|item|count|number|tall|logged|coded/i.test(text)) return [];
  const out: IntegerStatement[] = [];
  for (let i = 0; i < starts.length; i += 1) {
    const a = starts[i] as number;
    const sentence = text.slice(a, starts[i + 1] ?? text.length);
    const mean = MEAN_OF_ITEMS.exec(sentence);
    const sum = SUM_OF_ITEMS.exec(sentence);
    const kItem = K_ITEM.exec(sentence);
    const integer = integerWords(sentence) ?? numberOfMeasure(sentence);
    // the mean of k items is whole-number only when the items are ("each an integer from 1 to 5")
    const found = mean && integer ? { m: mean, items: itemCount(mean[1] as string) } : sum ? { m: sum, items: 1 } : integer ? { m: integer, items: 1 } : kItem ? { m: kItem, items: Number(kItem[1]) } : undefined;
    if (!found || !(found.items >= 1)) continue;
    const start = a + found.m.index;
    const end = start + found.m[0].length;
    // "n is the number of mice": what n counts, not a measure
    if (SAMPLE_SIZE_DEFINITION.test(sentence)) continue;
    // a count per hour or per 100 discharges is a rate, and one averaged over rounds a mean, not a whole number
    if (found.m !== mean && found.m !== kItem && (AVERAGED.test(sentence) || (integerWords(sentence) === null && RATE.test(sentence)))) continue;
    const measures = measureNames(sentence);
    // "the number of participants" is a sample size, not a whole-number measure
    if (found.m !== mean && found.m !== sum && found.m !== kItem && integerWords(sentence) === null && measures.length === 0) continue;
    out.push({
      segment: seg.id,
      block: seg.block,
      sentence: sentenceOf(starts, start),
      span: sourceSpan(seg, start, end),
      printed: text.slice(start, end),
      items: found.items,
      ...(measures.length > 0 ? { measures } : {}),
    });
  }
  return out;
}

function itemCount(word: string): number {
  return NUMBER_WORDS[word.toLowerCase()] ?? Number(word);
}

/**
 * The declared measures, as lower-case phrases of one to three words with the last word
 * singular: what a count counts ("the number of Lenses and keywords" → lense, keyword), else
 * the head of the sentence's subject ("Errors per shift were recorded …" → error; "Job
 * satisfaction was scored …" → job satisfaction).
 */
function measureNames(sentence: string): string[] {
  const counted = COUNTED_THING.exec(sentence);
  if (counted) return [counted[1], counted[2]].flatMap((w) => (w && !UNIT_WORDS.has(w.toLowerCase()) ? [singular(w)] : [])).filter((w) => !NOT_A_COUNTED_MEASURE.test(w));
  // "For breaks taken, each driver contributed a count …": the measure is named first
  const subject = FOR_MEASURE.exec(sentence.trimStart())?.[1] ?? SUBJECT.exec(sentence.trimStart())?.[1];
  if (!subject) return [];
  const all = subject.toLowerCase().split(HEAD_END)[0]?.split(' ').filter((w) => !DETERMINERS.has(w)) ?? [];
  const words = all.filter((w) => !POSSESSIVE.test(w));
  if (words.length === 0 || words.length > 3) return [];
  const last = words.length - 1;
  const phrase = words.map((w, i) => (i === last ? singular(w) : w)).join(' ');
  if (words.length < all.length && words.length === 1 && GENERIC_HEAD.test(phrase)) return [];
  return NOT_A_COUNTED_MEASURE.test(phrase) ? [] : [phrase];
}

/** `errors` → `error`, `anxiety` stays: enough to match the name in another sentence. */
export function singular(word: string): string {
  const w = word.toLowerCase().replace(/['’]s$/u, '');
  return w.length > 3 && w.endsWith('s') && !w.endsWith('ss') ? w.slice(0, -1) : w;
}

/**
 * Every sentence that names a declared measure: one pass over each segment's words, a map
 * lookup per word for the phrases it can start (so linear in the text).
 */
export function findMeasureMentions(segments: readonly Segment[], declared: readonly IntegerStatement[]): MeasureMention[] {
  const byFirst = new Map<string, string[][]>();
  for (const phrase of new Set(declared.flatMap((d) => d.measures ?? []))) {
    const words = phrase.split(' ');
    const first = words.length === 1 ? (words[0] as string) : (words[0] as string);
    byFirst.set(first, [...(byFirst.get(first) ?? []), words]);
  }
  if (byFirst.size === 0) return [];
  const out: MeasureMention[] = [];
  for (const seg of segments) {
    if (seg.kind === 'code') continue;
    let starts: number[] | undefined;
    const seen = new Set<string>();
    const words = [...matchesOf(/\p{L}[\p{L}'’-]{1,30}/gu, seg.text)];
    words.forEach((m, i) => {
      const candidates = byFirst.get(m[0].toLowerCase()) ?? byFirst.get(singular(m[0]));
      if (!candidates) return;
      for (const phrase of candidates) {
        const last = phrase.length - 1;
        const matches = phrase.every((w, k) => {
          const got = words[i + k]?.[0];
          if (!got) return false;
          return k === last ? singular(got) === w : got.toLowerCase() === w;
        });
        if (!matches) continue;
        starts ??= sentenceStarts(seg.text);
        const sentence = sentenceOf(starts, m.index);
        const measure = phrase.join(' ');
        const key = `${sentence}:${measure}`;
        if (seen.has(key)) continue;
        seen.add(key);
        out.push({ measure, segment: seg.id, sentence, ...(seg.table ? { table: { table: seg.table.table, row: seg.table.row } } : {}) });
      }
    });
  }
  return out;
}
