/**
 * The interval of true values that print as `value` with `decimals` digits after the point,
 * under round-half-to-either (the conventions of spreadsheets and statistics packages differ
 * at the exact half, so both ends are taken as reachable): [value − h, value + h] with
 * h = 0.5·10^−decimals. A printed integer (decimals 0) gives ±0.5. A small relative widening
 * (1e-12, about 4500 ulps) absorbs the binary representation of decimal strings, so that a
 * value on the printed boundary is never excluded by floating-point noise.
 *
 * Edge behaviour: negative decimals or NaN give [NaN, NaN]; an infinite value (a printed number
 * beyond a double) gives [value, value].
 */
export function roundingInterval(value: number, decimals: number): [number, number] {
  if (Number.isNaN(value) || !(decimals >= 0)) return [NaN, NaN];
  if (!Number.isFinite(value)) return [value, value];
  const half = 0.5 * 10 ** -decimals;
  const slack = Math.abs(value) * 1e-12 + 1e-300;
  return [value - half - slack, value + half + slack];
}

/** Interval of a value printed in scientific notation: mantissa digits set the half-unit. */
export function scientificRoundingInterval(mantissa: number, mantissaDecimals: number, exponent: number): [number, number] {
  const [lo, hi] = roundingInterval(mantissa, mantissaDecimals);
  const scale = 10 ** exponent;
  return [lo * scale, hi * scale];
}

/** The size of one unit in the last printed digit: 10^−decimals. */
export function lastDigitUnit(decimals: number): number {
  return 10 ** -decimals;
}
