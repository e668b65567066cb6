#!/usr/bin/env python3
"""Golden table of log10 two-tailed Student t p values far below the double range.

    python3 scripts/make_t_log_reference.py > fixtures/reference/t-log-tail.json

Source: mpmath (Debian package python3-mpmath) at 60 significant digits. mpmath's numbers have
an unbounded exponent, so p = 10^-4000 is an ordinary value there. The grid is fixed (no
randomness); the mpmath version is written into the file. Tests never run Python.

Definition (common practice, no source): for T ~ t(df),
  two-tailed p = P(|T| >= |t|) = I_{df/(df+t^2)}(df/2, 1/2)
Where mpmath's incomplete beta does not converge, the tail integral of the density
(tanh-sinh quadrature) is used instead, and the file records which.
"""
import json

import mpmath as mp

mp.mp.dps = 60

# (t, df) pairs whose p lies at or below about 1e-290, plus a few above as a bridge
GRID = [
    ("40", "1000"), ("45", "1000"), ("50", "1000"), ("80", "1000"),
    ("38", "100000"), ("40", "100000"), ("43", "10000"), ("45.2", "8000"), ("44", "1000000"),
    ("1e30", "10"), ("1e40", "10"), ("1e100", "5"), ("1e200", "3"), ("1e300", "2.5"),
    ("1e20", "30"), ("1e10", "100"), ("1e5", "240"), ("300", "240"), ("1000", "240"),
    ("1e150", "3"), ("1e160", "7.3"), ("1e250", "17.8"),
    ("150.2", "10"), ("34", "12"), ("12", "30"),
    ("1e60", "10"), ("1e90", "10"), ("1e6", "63.2"), ("1e4", "240"),
]

# t beyond the double range (printed as `2e1000`): plumbline reads their size as log10 |t|;
# written as "beyondDoubleRows", t as printed and its log10 as mpmath gives it
GRID_BEYOND = [
    ("1e310", "1"), ("1.5e310", "2.5"), ("2e1000", "28"), ("2.5e1000", "28"), ("1.5e1000", "10"),
    ("5e4000", "3"), ("1e500", "240"), ("3e2000", "1000"), ("7e350", "63.2"),
]

def log10_two_tailed(t, df):
    t = mp.mpf(t)
    df = mp.mpf(df)
    x = df / (df + t * t)
    with mp.workdps(100):
        try:
            p = mp.betainc(df / 2, mp.mpf(1) / 2, 0, x, regularized=True)
            if p > 0:
                return mp.log10(p), "betainc"
        except (ValueError, mp.libmp.NoConvergence):
            pass
        log_c = mp.loggamma((df + 1) / 2) - mp.loggamma(df / 2) - mp.log(df * mp.pi) / 2

        def density(u):
            return mp.exp(log_c - (df + 1) / 2 * mp.log1p(u * u / df))

        tail = mp.quad(density, [t, t + 1 / t, t + 10 / t, t + 5, mp.inf])
        return mp.log10(2 * tail), "quadrature"


rows = []
for t, df in GRID:
    value, method = log10_two_tailed(t, df)
    rows.append({"t": t, "df": df, "log10p": mp.nstr(value, 25), "method": method})

beyond = []
for t, df in GRID_BEYOND:
    value, method = log10_two_tailed(t, df)
    beyond.append({"t": t, "log10t": mp.nstr(mp.log10(mp.mpf(t)), 25), "df": df, "log10p": mp.nstr(value, 25), "method": method})

print(json.dumps({
    "source": "mpmath " + mp.__version__ + " at 60 significant digits (100 inside); scripts/make_t_log_reference.py",
    "definition": "log10 of the two-tailed p, P(|T| >= |t|) = I_{df/(df+t^2)}(df/2, 1/2)",
    "rows": rows,
    "beyondDoubleRows": beyond,
}, indent=1))
