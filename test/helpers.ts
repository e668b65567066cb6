import { expect } from 'vitest';

/**
 * Relative-error assertion that prints inputs, got, expected, gap and tolerance on failure.
 */
export function expectRelativeClose(got: number, expected: number, tolerance: number, inputs: string): void {
  const gap = expected === 0 ? Math.abs(got) : Math.abs(got - expected) / Math.abs(expected);
  expect(gap, `${inputs}: got ${got}, expected ${expected}, relative gap ${gap.toExponential(2)}, tolerance ${tolerance}`).toBeLessThanOrEqual(tolerance);
}
