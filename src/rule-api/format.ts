/**
 * Presentation of numbers in messages. p values are shown to 2 significant digits below
 * 0.001 (as 4.1e-8) and to 4 decimals otherwise, so a reader can compare them with what
 * was printed without drowning in digits.
 */
export function showNumber(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const ax = Math.abs(x);
  if (ax < 1e-3 || ax >= 1e6) return x.toExponential(2).replace('e', 'e');
  if (ax < 1) return trimZeros(x.toFixed(4));
  return trimZeros(x.toFixed(3));
}

/**
 * A gap in units of the last printed digit, set beside the half unit that rounding allows: one
 * decimal, or as many more as it takes (up to four) for a gap over the half unit not to read as
 * "0.5" beside "rounding allows 0.5 units".
 */
export function showLastDigitUnits(units: number): string {
  let decimals = 1;
  while (decimals < 4 && units > 0.5 && Number(units.toFixed(decimals)) <= 0.5) decimals += 1;
  return units.toFixed(decimals);
}

/**
 * A bound of a printed number's rounding interval, with one digit more than was printed
 * (t = 5.0000 is read as 4.99995 to 5.00005), so the bound shown is the bound used.
 */
export function showBound(x: number, printedDecimals: number, exponent = 0): string {
  if (!Number.isFinite(x) || exponent !== 0 || printedDecimals > 8) return showNumber(x);
  return x.toFixed(printedDecimals + 1);
}

/** A number given as its decimal logarithm, shown as showNumber would show it: −400.2 → "6.31e-401". */
export function showLog10(x: number): string {
  if (!Number.isFinite(x)) return x < 0 ? '0' : String(10 ** x);
  if (x > -300) return showNumber(10 ** x);
  let power = Math.floor(x);
  let mantissa = (10 ** (x - power)).toFixed(2);
  if (mantissa === '10.00') {
    mantissa = '1.00';
    power += 1;
  }
  return `${mantissa}e${power}`;
}

/** showInterval for a range given as decimal logarithms. */
export function showLog10Interval(low: number, high: number): string {
  const a = showLog10(low);
  const b = showLog10(high);
  return a === b ? a : `${a} to ${b}`;
}

export function showInterval(low: number, high: number): string {
  const a = showNumber(low);
  const b = showNumber(high);
  return a === b ? a : `${a} to ${b}`;
}

function trimZeros(s: string): string {
  if (!s.includes('.')) return s;
  let end = s.length;
  while (s[end - 1] === '0') end -= 1;
  if (s[end - 1] === '.') end -= 1;
  return s.slice(0, end);
}

/** Fill `{name}` placeholders; a missing value is left visible as `{name}` so tests catch it. */
export function fill(template: string, values: Record<string, string | number>): string {
  return template.replace(/\{([a-zA-Z][a-zA-Z0-9]{0,39})\}/g, (whole, name: string) => (name in values ? String(values[name]) : whole));
}
