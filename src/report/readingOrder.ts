import type { FileReport, ResultRecord, StatisticRecord } from '../engine/types.js';

/** A result as the formatters list it: a t-test, or an F, χ², r or z, with its place in its own list. */
export type AnyResult = { kind: 't'; record: ResultRecord; n: number } | { kind: 'statistic'; record: StatisticRecord; n: number };

/**
 * A file's t results and its F, χ², r and z results together, in reading order (where each
 * starts in the source). Both lists are in reading order already, so this merges them in one pass.
 */
export function resultsInReadingOrder(file: Pick<FileReport, 'results' | 'statistics'>): AnyResult[] {
  const results = file.results;
  const statistics = file.statistics ?? [];
  const out: AnyResult[] = [];
  let i = 0;
  let j = 0;
  while (i < results.length || j < statistics.length) {
    const r = results[i];
    const s = statistics[j];
    if (r && (!s || r.span.start <= s.span.start)) {
      out.push({ kind: 't', record: r, n: i });
      i += 1;
    } else if (s) {
      out.push({ kind: 'statistic', record: s, n: j });
      j += 1;
    }
  }
  return out;
}

/** How many results a file holds, t-tests and F, χ², r and z results together. */
export function resultCount(file: Pick<FileReport, 'results' | 'statistics'>): number {
  return file.results.length + (file.statistics?.length ?? 0);
}
