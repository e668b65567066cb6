import betainc from '@stdlib/math-base-special-betainc';
import gammaln from '@stdlib/math-base-special-gammaln';
import jStat from 'jstat';

/**
 * Two-tailed p value of Student's t: P(|T| >= |t|) for T ~ t(df).
 *
 * Definition: I_{df/(df+t²)}(df/2, 1/2), the regularized incomplete beta function.
 * Domain: df > 0 (real df allowed, as Welch–Satterthwaite gives), any finite or infinite t.
 * Edge behaviour: t = 0 gives 1; |t| = Infinity gives 0; t = NaN, df <= 0, df = NaN or
 * df = Infinity give NaN (a reported df is finite).
 *
 * Which library and why: jstat's `studentt.cdf` was measured here at about 4e-8 relative
 * error and returns 0 below about 1e-16, which fails plumbline's bar (1e-12 relative, down
 * to 1e-300). @stdlib's `betainc` (a port of Boost's ibeta) meets it. Following Boost's
 * students_t cdf, the argument is chosen so that the small side of x or 1 − x is formed
 * directly: for df > 2t² the upper tail of I_{t²/(df+t²)}(1/2, df/2), otherwise
 * I_{df/(df+t²)}(df/2, 1/2). Forming 1 − x by subtraction would cost df·ε relative
 * error at large df.
 *
 * Accuracy: worst relative error 6.2e-14 against mpmath at 60 digits over the grid in
 * fixtures/reference/t-tail.json (df 1 to 1e6, p down to 1e-300).
 */
export function twoSidedPFromT(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0 && df < Infinity)) return NaN;
  if (t === 0) return 1;
  if (!Number.isFinite(t)) return 0;
  const t2 = t * t;
  if (!Number.isFinite(t2)) return twoSidedFromLargeT(Math.abs(t), df);
  if (df > 2 * t2) return betainc(t2 / (df + t2), 0.5, df / 2, true, true);
  return betainc(df / (df + t2), df / 2, 0.5, true, false);
}

/**
 * One-tailed p in the direction of t: P(T >= |t|) = twoSidedPFromT(t, df) / 2.
 * This is the p an author reports for a directional hypothesis when the effect goes the
 * predicted way. Same domain, edge behaviour and accuracy as twoSidedPFromT.
 */
export function oneSidedPFromT(t: number, df: number): number {
  return twoSidedPFromT(t, df) / 2;
}

/**
 * Upper-tail probability P(T >= t) for any sign of t (so 1 − P for negative t).
 * Used for one-tailed p when the effect goes against the predicted direction.
 */
export function upperTailT(t: number, df: number): number {
  const half = twoSidedPFromT(t, df) / 2;
  return t >= 0 ? half : 1 - half;
}

/**
 * The two-sided critical value t* with P(|T| >= t*) = alpha, for 0 < alpha < 1 and df > 0.
 * jstat's `studentt.inv` gives the starting point (it is within about 1e-7 relative of the
 * answer); a safeguarded Newton/bisection on twoSidedPFromT polishes it so that the returned
 * value meets the same accuracy as twoSidedPFromT. NaN outside the domain.
 */
export function twoSidedCriticalT(alpha: number, df: number): number {
  if (!(alpha > 0 && alpha < 1) || !(df > 0)) return NaN;
  let x = Math.abs(jStat.studentt.inv(1 - alpha / 2, df));
  if (!Number.isFinite(x) || x <= 0) x = 1;
  let lo = 0;
  let hi = Infinity;
  for (let i = 0; i < 200; i += 1) {
    const f = twoSidedPFromT(x, df) - alpha;
    if (f === 0) return x;
    if (f > 0) lo = x; else hi = x;
    const step = f / (2 * tDensity(x, df));
    let next = x + step;
    if (!(next > lo && next < hi)) next = hi === Infinity ? x * 2 : (lo + hi) / 2;
    if (Math.abs(next - x) <= 1e-15 * x) return next;
    x = next;
  }
  return x;
}

/** Density of Student's t at x (log-space for large df). NaN for df <= 0. */
export function tDensity(x: number, df: number): number {
  if (!(df > 0)) return NaN;
  const logC = gammaln((df + 1) / 2) - gammaln(df / 2) - 0.5 * Math.log(df * Math.PI);
  return Math.exp(logC - ((df + 1) / 2) * Math.log1p((x * x) / df));
}

/** |t|² overflows a double (|t| > ~1.3e154): the tail is then 2·C·df^((df+1)/2)·|t|^(−df)/df
 * to within a relative O(df/t²), which is below double precision there; computed in logs. */
function twoSidedFromLargeT(absT: number, df: number): number {
  const logC = gammaln((df + 1) / 2) - gammaln(df / 2) - 0.5 * Math.log(df * Math.PI);
  return Math.exp(Math.LN2 + logC + ((df + 1) / 2) * Math.log(df) - df * Math.log(absT) - Math.log(df));
}

/**
 * Decimal logarithm of the two-tailed p, log10 P(|T| >= |t|) for T ~ t(df): finite where the p
 * itself underflows a double (|t| = 50 with df = 1000 gives about 10^−325; a 400-digit t gives
 * about 10^−4000), so that a reported `p = 1e-400` can be compared with it.
 *
 * Definition: log10 I_x(df/2, 1/2), x = df/(df + t²). Domain and edge behaviour as
 * twoSidedPFromT: t = 0 gives 0, |t| = Infinity gives −Infinity, NaN for NaN t or a df
 * outside (0, Infinity).
 *
 * Method: where twoSidedPFromT is a normal double above 1e-290 its logarithm is taken. Below,
 * the tail is I_x(a, b) = x^a (1 − x)^b / (a·B(a, b)) · CF, with CF the continued fraction of
 * the incomplete beta function (modified Lentz; Numerical Recipes, "betacf", the standard
 * form), all factors but CF taken in logs, ln x and ln(1 − x) from df and t² directly. The
 * fraction converges quickly for x < (a + 1)/(a + b + 2), which holds wherever p is that small
 * (it needs only t² > df/(df + 2)). Where t² overflows, the large-t form of twoSidedFromLargeT
 * is used in logs.
 *
 * Accuracy: within 1e-9 in log10 of mpmath at 60 digits over the grid in
 * fixtures/reference/t-log-tail.json (df 1 to 1e6, log10 p down to −4000); the error comes
 * from gammaln's absolute error at large df, far below what any printed p distinguishes.
 */
export function log10TwoSidedPFromT(t: number, df: number): number {
  if (Number.isNaN(t) || !(df > 0 && df < Infinity)) return NaN;
  if (t === 0) return 0;
  if (!Number.isFinite(t)) return -Infinity;
  const p = twoSidedPFromT(t, df);
  if (p >= 1e-290) return Math.log10(p);
  const absT = Math.abs(t);
  const t2 = absT * absT;
  if (!Number.isFinite(t2)) {
    const logC = gammaln((df + 1) / 2) - gammaln(df / 2) - 0.5 * Math.log(df * Math.PI);
    return (Math.LN2 + logC + ((df + 1) / 2) * Math.log(df) - df * Math.log(absT) - Math.log(df)) / Math.LN10;
  }
  const a = df / 2;
  const b = 0.5;
  const lnSum = Math.log(df + t2);
  const lnX = Math.log(df) - lnSum;
  const ln1mX = Math.log(t2) - lnSum;
  const lnBeta = gammaln(a) + gammaln(b) - gammaln(a + b);
  const cf = betaContinuedFraction(Math.exp(lnX), a, b);
  return (a * lnX + b * ln1mX - lnBeta - Math.log(a) + Math.log(cf)) / Math.LN10;
}

/**
 * log10TwoSidedPFromT for a t given by the decimal logarithm of its magnitude, so that a t no
 * double holds (`t = 2e1000`, a 400-digit t) still has its p: log10 P(|T| >= 10^log10AbsT).
 *
 * Method: below |t| = 1e300 the same as log10TwoSidedPFromT(10^log10AbsT, df). Above, the
 * large-t form of the tail, 2·C·df^((df−1)/2)·|t|^−df with C the density's constant, in logs
 * (ln|t| = log10AbsT·ln 10): its relative error is of order df/t², below 1e-590 there.
 * Domain: df in (0, Infinity); NaN otherwise, or for a NaN log10AbsT; +Infinity gives −Infinity.
 *
 * Accuracy: within 1e-9 in log10 of mpmath at 60 digits over the beyond-double rows of
 * fixtures/reference/t-log-tail.json (t from 1e310 to 5e4000, df 1 to 1000).
 */
export function log10TwoSidedPFromLog10T(log10AbsT: number, df: number): number {
  if (Number.isNaN(log10AbsT) || !(df > 0 && df < Infinity)) return NaN;
  if (log10AbsT < 300) return log10TwoSidedPFromT(10 ** log10AbsT, df);
  if (log10AbsT === Infinity) return -Infinity;
  const logC = gammaln((df + 1) / 2) - gammaln(df / 2) - 0.5 * Math.log(df * Math.PI);
  return (Math.LN2 + logC + ((df + 1) / 2) * Math.log(df) - df * log10AbsT * Math.LN10 - Math.log(df)) / Math.LN10;
}

/** The continued fraction of I_x(a, b) (modified Lentz), for x < (a + 1)/(a + b + 2). */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const tiny = 1e-300;
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < tiny) d = tiny;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 100000; m += 1) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < tiny) d = tiny;
    c = 1 + aa / c;
    if (Math.abs(c) < tiny) c = tiny;
    d = 1 / d;
    const del = d * c;
    h *= del;
    if (Math.abs(del - 1) < 1e-15) break;
  }
  return h;
}
