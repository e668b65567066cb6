#!/usr/bin/env python3
"""Golden table of Student t tail probabilities for plumbline's accuracy tests.

    python3 scripts/make_t_reference.py > fixtures/reference/t-tail.json

Source: mpmath (Debian package python3-mpmath) at 60 significant digits is the
reference; scipy.stats.t.sf (python3-scipy) is recorded beside it as a second,
independent value. The grid is fixed (no randomness) so the output is
byte-identical for the same library versions, which are written into the file.

Definitions (common practice, no source): for T ~ t(df),
  two-tailed p = P(|T| >= |t|) = I_{df/(df+t^2)}(df/2, 1/2)
  one-tailed p = P(T >= |t|) = two-tailed p / 2
"""
import json
import sys

import mpmath as mp
import scipy
from scipy import stats

mp.mp.dps = 60

DFS = ["1", "1.5", "2", "3", "4.5", "5", "7.3", "10", "17.8", "30", "63.2", "100", "240",
       "1000", "10000", "100000", "1000000"]
TS = ["0", "0.001", "0.05", "0.5", "1", "1.5", "1.96", "2", "2.5", "3", "4", "5", "6", "8",
      "12", "20", "40", "100", "300", "1000", "1e4", "1e6", "1e20", "1e100"]


def two_tailed(t, df):
    t = mp.mpf(t)
    df = mp.mpf(df)
    if t == 0:
        return mp.mpf(1)
    t2 = t * t
    # 1 - I_y(1/2, df/2) keeps ~48 of 60 digits while p > 1e-12 (used when t^2 < df);
    # otherwise the direct form I_x(df/2, 1/2) at 100 digits, or, where mpmath's series
    # does not converge, the tail integral of the density (tanh-sinh quadrature) at 100.
    if t2 < df:
        y = t2 / (df + t2)
        try:
            p = 1 - mp.betainc(mp.mpf(1) / 2, df / 2, 0, y, regularized=True)
        except (ValueError, mp.libmp.NoConvergence):
            p = mp.mpf(0)
        if p > mp.mpf("1e-12"):
            return p
    with mp.workdps(100):
        try:
            return +mp.betainc(df / 2, mp.mpf(1) / 2, 0, df / (df + t2), regularized=True)
        except (ValueError, mp.libmp.NoConvergence):
            return 2 * upper_tail_by_quadrature(t, df)


def upper_tail_by_quadrature(t, df):
    log_c = mp.loggamma((df + 1) / 2) - mp.loggamma(df / 2) - mp.log(df * mp.pi) / 2

    def density(u):
        return mp.exp(log_c - (df + 1) / 2 * mp.log1p(u * u / df))

    return mp.quad(density, [t, t + 1 / t, t + 10 / t, t + 5, mp.inf])


rows = []
for df in DFS:
    for t in TS:
        p = two_tailed(t, df)
        if p < mp.mpf("1e-300"):
            continue  # below the double range plumbline promises
        rows.append({
            "t": t,
            "df": df,
            "pTwoTailed": mp.nstr(p, 20, min_fixed=-1, max_fixed=-1),
            "scipyTwoTailed": repr(float(2 * stats.t.sf(float(t), float(df)))),
        })

json.dump({
    "source": "mpmath %s at %d digits; scipy %s stats.t.sf recorded as a cross-check"
              % (mp.__version__, mp.mp.dps, scipy.__version__),
    "script": "scripts/make_t_reference.py",
    "rows": rows,
}, sys.stdout, indent=1)
sys.stdout.write("\n")
