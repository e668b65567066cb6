import fc from 'fast-check';
import { twoSidedPFromT } from '../../src/stats/index.js';

/**
 * Generated results shared by the property tests. Reference for "correct": the two-sided p of
 * Student's t (src/stats, itself checked against scipy and mpmath in test/stats).
 */

/** A correct result: df, t at two decimals, and the p two-tailed t gives, at three decimals (or p < .001). */
export const correctResult = fc.record({ df: fc.integer({ min: 2, max: 500 }), t: fc.integer({ min: 0, max: 900 }) }).map(({ df, t }) => {
  const tv = t / 100;
  const p = twoSidedPFromT(tv, df);
  const printed = p < 0.001 ? 'p < .001' : `p = ${p.toFixed(3).replace(/^0/, '')}`;
  return { df, t: tv.toFixed(2), printed, p };
});

/** A p far from the two-tailed value and from half of it (x4, or /8 for large p), printed at three decimals: outside every reading. */
export function wrongP(p: number): string {
  const wrong = p < 0.2 ? p * 4 + 0.01 : p / 8;
  return wrong.toFixed(3).replace(/^0/, '');
}

/** The rules that judge a p against its t and df. */
export const isPRule = (id: string): boolean => id.includes('follows-from-t') || id === 'one-tailed-p-is-declared';
