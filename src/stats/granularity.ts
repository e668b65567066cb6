/**
 * GRIM (Brown & Heathers 2016, "The GRIM test", Social Psychological and Personality Science
 * 8(4)): a mean of n integer scores, each the sum of k integer items, is S / (n·k) for some
 * integer S. Returns whether some S gives a mean inside [low, high] (the printed mean's
 * rounding interval), and the nearest possible means below and above the printed one.
 */
export function grimPossible(low: number, high: number, n: number, items = 1): { possible: boolean; below: number; above: number } {
  const total = n * items;
  const first = Math.ceil(low * total - 1e-9);
  const last = Math.floor(high * total + 1e-9);
  const mid = (low + high) / 2;
  return { possible: first <= last, below: Math.floor(mid * total) / total, above: Math.ceil(mid * total) / total };
}

/**
 * GRIMMER (Anaya 2016, "The GRIMMER test", PeerJ Preprints 4:e2400): for n integer scores
 * (k = 1) with sum S and sum of squares Q, SD² = (Q − S²/n) / (n − 1), and Q ≡ S (mod 2)
 * because x² ≡ x (mod 2). True when some S within the mean's interval and some integer Q of
 * S's parity give an SD within [sdLow, sdHigh]. n is at most 1e6 here (the search is over S).
 */
export function grimmerPossible(meanLow: number, meanHigh: number, sdLow: number, sdHigh: number, n: number): boolean {
  if (!(n >= 2) || n > 1e6) return true;
  const first = Math.ceil(meanLow * n - 1e-9);
  const last = Math.floor(meanHigh * n + 1e-9);
  for (let s = first; s <= last; s += 1) {
    const qLow = (n - 1) * Math.max(sdLow, 0) ** 2 + (s * s) / n;
    const qHigh = (n - 1) * sdHigh ** 2 + (s * s) / n;
    let q = Math.ceil(qLow - 1e-7);
    if (((q - s) % 2 + 2) % 2 !== 0) q += 1;
    if (q <= qHigh + 1e-7) return true;
  }
  return false;
}

/** Counts k out of n whose percentage 100·k/n lies in [low, high]: whether k/n can print as given. */
export function percentPossible(count: number, n: number, low: number, high: number): boolean {
  const pct = (100 * count) / n;
  return pct >= low - 1e-9 && pct <= high + 1e-9;
}
