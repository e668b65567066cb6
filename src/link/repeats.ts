import type { TestTopic } from '../extract/types.js';
import { stem } from '../extract/topic.js';

/**
 * Whether a result of an abstract and the one result elsewhere with its df are certainly one
 * comparison, from the words around each (src/extract/topic.ts). The df alone does not tie
 * them: an abstract reports outcomes, time points and subgroups whose tests share the study's
 * df, and its own comparison may stand in the results only in a table without t. The tie is
 * certain when at least half of the abstract's words for its result are named around the other
 * one (the measure; the rest may be qualifiers the results give elsewhere), the two do not name
 * different time points of one unit or different sexes (each naming one the other does not), and no word
 * named beside one is excluded ("without …") beside the other.
 * Otherwise the reason, in the words of a note.
 */
export function repeatDoubt(summary: TestTopic | undefined, other: TestTopic | undefined, section: string): string | undefined {
  if (!summary || summary.stems.length === 0) return 'the abstract names nothing beside its result, so which comparison of the results it repeats is told by its df alone';
  if (!other || other.stems.length === 0) return `the result in "${section}" has no words beside it, so that it is the abstract's comparison is told by its df alone`;
  const own = new Set(other.stems);
  const missing = summary.words.filter((w) => !own.has(stem(w)));
  const shared = summary.stems.filter((s) => own.has(s)).length;
  // the measure is named beside both: at least half the abstract's words (the rest may qualify
  // it where the results say so elsewhere: "at follow-up", "on Thursdays")
  if (shared === 0 || 2 * shared < summary.stems.length) {
    return `the abstract's result and the one with its df in "${section}" may be different comparisons: the abstract's words ${quoteList(missing)} are not beside the one in "${section}"`;
  }
  const clash = timeClash(summary.times, other.times);
  if (clash !== undefined) return `the abstract's result is at ${clash[0].join(', ')} and the one with its df in "${section}" at ${clash[1].join(', ')}`;
  // subgroups clash within one dimension (sex, age, life stage): "women" against "men"; not
  // "adolescents" against "young people"
  const dimension = (g: string) => g.slice(0, g.indexOf(':'));
  const label = (g: string) => g.slice(g.indexOf(':') + 1);
  for (const g of summary.subgroups) {
    const theirs = other.subgroups.filter((o) => dimension(o) === dimension(g));
    if (theirs.length > 0 && !theirs.includes(g) && !summary.subgroups.some((x) => theirs.includes(x))) {
      return `the abstract's result is of ${label(g)} participants and the one with its df in "${section}" of ${theirs.map(label).join(', ')}`;
    }
  }
  const excluded = excludedIn(summary, other) ?? excludedIn(other, summary);
  if (excluded !== undefined) return `"${excluded.word}" is named beside one of the abstract's result and the one with its df in "${section}", and excluded ("without ${excluded.without}") beside the other`;
  return undefined;
}

/** A word named beside one test that the other's text excludes ("without dementia"), with the excluded word as printed. */
function excludedIn(named: TestTopic, excluding: TestTopic): { word: string; without: string } | undefined {
  const own = new Set(named.without.map(stem));
  for (const without of excluding.without) {
    const s = stem(without);
    if (own.has(s)) continue;
    const word = named.words.find((w) => stem(w) === s);
    if (word !== undefined) return { word, without };
  }
  return undefined;
}

/**
 * Time points of one unit that differ: "month 12" against "month 6" (each side's of that unit).
 * Points of different units ("visit 1", "month 3") may be one time and do not clash.
 */
function timeClash(a: readonly string[], b: readonly string[]): [string[], string[]] | undefined {
  const unit = (t: string) => t.slice(0, t.indexOf(' '));
  for (const u of new Set(a.map(unit))) {
    const mine = a.filter((t) => unit(t) === u);
    const theirs = b.filter((t) => unit(t) === u);
    if (theirs.length > 0 && !mine.some((t) => theirs.includes(t))) return [mine, theirs];
  }
  return undefined;
}

const quoteList = (words: string[]) => words.map((w) => `"${w}"`).join(', ');
