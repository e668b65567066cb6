import type { Segment } from '../parse/types.js';
import { sentenceOf, sourceSpan } from './numbers.js';
import { NAMES_T_TEST } from './statements.js';
import { findP } from './tTests.js';
import type { PWithoutT, TTestReport } from './types.js';
import { matchesOf } from './matches.js';

/**
 * In a sentence that names a t-test ("a paired t-test showed …") but holds no t statistic,
 * the p values given: the reader cannot check them, which the reporting rules point out.
 */
export function findPWithoutT(seg: Segment, starts: number[], tests: TTestReport[]): PWithoutT[] {
  const out: PWithoutT[] = [];
  const withT = new Set(tests.map((t) => t.sentence));
  const done = new Set<number>();
  for (const m of matchesOf(NAMES_T_TEST, seg.text)) {
    const sentence = sentenceOf(starts, m.index);
    if (withT.has(sentence) || done.has(sentence)) continue;
    done.add(sentence);
    const from = starts[sentence] as number;
    const to = starts[sentence + 1] ?? seg.text.length;
    let at = from;
    for (;;) {
      const p = findP(seg, at, to);
      if (!p) break;
      // "* p < .05; ** p < .01": a legend saying what the stars mean, not a reported p
      if (!afterMarks(seg, at, p.span.start)) out.push({ segment: seg.id, block: seg.block, p, mention: sourceSpan(seg, m.index, m.index + m[0].length), mentionPrinted: m[0] });
      let next = at;
      while (next < to && (seg.ends[next] as number) <= p.span.end) next += 1;
      if (next <= at) break;
      at = next;
    }
  }
  return out;
}

/** Whether the p starting at source offset `start` follows stars or daggers (a legend's key), spaces aside. */
function afterMarks(seg: Segment, from: number, start: number): boolean {
  let i = from;
  while (i < seg.text.length && (seg.starts[i] as number) < start) i += 1;
  let j = i - 1;
  while (j >= 0 && seg.text[j] === ' ') j -= 1;
  const c = seg.text[j];
  return c === '*' || c === '†' || c === '‡' || c === '§';
}
