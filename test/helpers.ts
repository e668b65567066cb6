import { expect } from 'vitest';
import { checkSource } from '../src/engine/index.js';
import { readJsonReport } from '../src/report/json.js';

/**
 * Relative-error assertion that prints inputs, got, expected, gap and tolerance on failure.
 */
export function expectRelativeClose(got: number, expected: number, tolerance: number, inputs: string): void {
  const gap = expected === 0 ? Math.abs(got) : Math.abs(got - expected) / Math.abs(expected);
  expect(gap, `${inputs}: got ${got}, expected ${expected}, relative gap ${gap.toExponential(2)}, tolerance ${tolerance}`).toBeLessThanOrEqual(tolerance);
}

/** `n` lines made by `line`, joined by `\n`. */
export function lines(n: number, line: (i: number) => string): string {
  return Array.from({ length: n }, (_, i) => line(i)).join('\n');
}

function seconds(f: () => void): number {
  const t0 = performance.now();
  f();
  return (performance.now() - t0) / 1000;
}

/**
 * Checking the document `make(2n)` takes less than 3× as long as checking `make(n)`: about 2
 * when linear, about 4 when quadratic. Warmed on `make(200)` first; best of two timings each,
 * to keep a busy machine's pauses out of the ratio. A ratio of 3 or more is measured once more,
 * best of three, before it fails: a pause can land on every timing of one size (a parallel test
 * run's other worker), but a quadratic cost shows in every measurement.
 */
export function expectLinearCheck(name: string, make: (n: number) => string, n: number): void {
  checkSource('warm.md', make(200));
  const at = (k: number, tries: number) => {
    const source = make(k);
    let best = Infinity;
    for (let i = 0; i < tries; i += 1) best = Math.min(best, seconds(() => checkSource('x.md', source)));
    return best;
  };
  let small = at(n, 2);
  let large = at(2 * n, 2);
  if (large / small >= 3) {
    small = at(n, 3);
    large = at(2 * n, 3);
  }
  expect(large / small, `${name}: ${small.toFixed(2)} s at ${n}, ${large.toFixed(2)} s at ${2 * n}`).toBeLessThan(3);
}

/**
 * A JSON report's text (or a batch line's) read as a program reads it: in the 1.x shape, places
 * with span/start/end and texts in full (readJsonReport, src/report/json.ts). Anything else
 * parsed (SARIF, an array) is given as JSON.parse gives it.
 */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export function readReport(text: string): any {
  const data: unknown = JSON.parse(text);
  return typeof data === 'object' && data !== null && !Array.isArray(data) ? readJsonReport(data) : data;
}
