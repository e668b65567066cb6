import type { Interval } from './pRange.js';

/**
 * The range of a quotient b / s over b in [bLow, bHigh] and s in [sLow, sHigh] with sLow > 0:
 * for a positive divisor the quotient is monotone in each argument, so its extremes lie at the
 * box's corners. Used for a regression coefficient's t = b / SE (the Wald statistic; common
 * practice, no source). NaN where the divisor's interval does not lie above zero.
 */
export function quotientRange(bLow: number, bHigh: number, sLow: number, sHigh: number): Interval {
  if (!(sLow > 0) || !(sHigh >= sLow) || !(bHigh >= bLow)) return { low: NaN, high: NaN };
  const corners = [bLow / sLow, bLow / sHigh, bHigh / sLow, bHigh / sHigh];
  return { low: Math.min(...corners), high: Math.max(...corners) };
}

/**
 * Cramér's V of a table with `rows` × `cols` cells from its Pearson χ² and total N:
 * V = √(χ² / (N · (min(rows, cols) − 1))); for a 2 × 2 table this is |φ| = √(χ²/N)
 * (Cramér 1946; common practice, no source). Checked against scipy.stats.contingency.association
 * (method "cramer") on seeded tables in fixtures/reference/association.json. NaN outside
 * χ² >= 0, N > 0, rows and cols >= 2.
 */
export function cramersV(chiSquare: number, n: number, rows: number, cols: number): number {
  const k = Math.min(rows, cols) - 1;
  if (!(chiSquare >= 0) || !(n > 0) || !(k >= 1)) return NaN;
  return Math.sqrt(chiSquare / (n * k));
}

/**
 * The range of √(χ² / (N·k)) over χ² in [xLow, xHigh], N in [nLow, nHigh] and a fixed k =
 * min(rows, cols) − 1 (k = 1 gives |φ|): it grows with χ² and falls with N, so the ends are
 * corners of the box.
 */
export function associationRange(xLow: number, xHigh: number, nLow: number, nHigh: number, k: number): Interval {
  if (!(xHigh >= 0) || !(nLow > 0) || !(k >= 1)) return { low: NaN, high: NaN };
  return { low: Math.sqrt(Math.max(0, xLow) / (nHigh * k)), high: Math.sqrt(xHigh / (nLow * k)) };
}
