/** Number words authors use for small counts of comparisons. */
const NUMBER_WORDS: Record<string, number> = { two: 2, three: 3, four: 4, five: 5, six: 6, seven: 7, eight: 8, nine: 9, ten: 10, eleven: 11, twelve: 12, fifteen: 15, twenty: 20 };

/** The number of comparisons: `for 3 comparisons`, `six tests`, `α/4`, `.05/3`, `multiplied by 3`, `m = 3`. */
const COMPARISONS = /(?<![\p{L}\p{N}.])(\d{1,3}|two|three|four|five|six|seven|eight|nine|ten|eleven|twelve|fifteen|twenty) (?:(?:pairwise|planned|post[- ]hoc|primary|secondary|separate|independent) )?(?:comparisons|tests|t-tests|contrasts|outcomes|endpoints|hypotheses)(?![\p{L}])|(?:α|alpha|0?\.05) ?\/ ?(\d{1,3})(?![\d.])|multiplied by (\d{1,3}|two|three|four|five|six|seven|eight|nine|ten)(?![\p{L}\p{N}])|(?<![\p{L}])m ?= ?(\d{1,3})(?![\d.])/iu;

/** The number of comparisons a text states, with where it starts; undefined when it states none (or fewer than 2). */
export function comparisonsIn(text: string): { m: number; index: number } | undefined {
  const c = COMPARISONS.exec(text);
  if (!c) return undefined;
  const word = (c[1] ?? c[2] ?? c[3] ?? c[4] ?? '').toLowerCase();
  const m = NUMBER_WORDS[word] ?? Number(word);
  return m >= 2 ? { m, index: c.index } : undefined;
}
