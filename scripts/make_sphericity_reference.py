#!/usr/bin/env python3
"""Golden table of the upper-tail p of F under a sphericity correction of unknown size, for
plumbline's accuracy test of upperPRangeFSphericity (src/stats/otherDistributions.ts).

    python3 scripts/make_sphericity_reference.py > fixtures/reference/sphericity-ranges.json

The corrected test takes both dfs times one epsilon, from its lower bound 1/df1 to 1
(Greenhouse & Geisser, 1959; common practice, no source for the exact wording). For each case
the smallest p over epsilon (at the box's largest F) and the largest (at its smallest F) are
found independently of plumbline's method: scipy.stats.f.sf (Debian python3-scipy) on a grid of
4,001 epsilons, then scipy.optimize.minimize_scalar (bounded) on the two grid cells beside the
best point; mpmath (Debian python3-mpmath, 50 digits, betainc) then gives p at the epsilon found.
The cases are a fixed grid of invented F values and dfs (df2 a multiple of df1, as a
within-subject effect's error df is).
"""
import json

import mpmath as mp
import numpy as np
import scipy
from scipy import optimize, stats

mp.mp.dps = 50


def f_sf_mp(f, d1, d2):
    f, d1, d2 = mp.mpf(f), mp.mpf(d1), mp.mpf(d2)
    if f == 0:
        return mp.mpf(1)
    return mp.betainc(d2 / 2, d1 / 2, 0, d2 / (d2 + d1 * f), regularized=True)


def extreme(f, d1, d2, sign):
    """sign 1: the smallest p over epsilon in [1/d1, 1]; sign -1: the largest."""
    eps = np.linspace(1 / d1, 1, 4001)
    vals = sign * stats.f.sf(f, d1 * eps, d2 * eps)
    i = int(np.argmin(vals))
    best_e, best_v = eps[i], vals[i]
    lo, hi = eps[max(i - 1, 0)], eps[min(i + 1, len(eps) - 1)]
    if hi > lo:
        r = optimize.minimize_scalar(lambda e: sign * stats.f.sf(f, d1 * e, d2 * e), bounds=(lo, hi), method="bounded", options={"xatol": 1e-12})
        if r.fun < best_v:
            best_e, best_v = float(r.x), float(r.fun)
    return best_e, f_sf_mp(f, d1 * mp.mpf(best_e), d2 * mp.mpf(best_e))


cases = []
for d1 in (2, 3, 4, 6, 8, 12, 20):
    for m in (1, 5, 13, 40):
        d2 = d1 * m
        # 1.67 with df1 = 20: the largest p lies inside the first grid cell of epsilon
        for f, half in ((0.002, 0.0005), (0.43, 0.005), (0.9, 0.005), (1.03, 0.005), (1.25, 0.005), (1.5, 0.05), (1.67, 0.005), (2.6, 0.005), (4.2, 0.05), (9.5, 0.05), (25.3, 0.05)):
            f_lo, f_hi = float(f"{f - half:.6g}"), float(f"{f + half:.6g}")
            e_low, p_low = extreme(f_hi, d1, d2, 1)
            e_high, p_high = extreme(f_lo, d1, d2, -1)
            cases.append({
                "fLow": repr(f_lo), "fHigh": repr(f_hi), "df1": d1, "df2": d2,
                "low": mp.nstr(p_low, 25), "epsilonAtLow": e_low,
                "high": mp.nstr(p_high, 25), "epsilonAtHigh": e_high,
            })

print(json.dumps({
    "source": "scipy.stats.f.sf on a 4,001-point epsilon grid refined by scipy.optimize.minimize_scalar; p at that epsilon by mpmath betainc (50 digits)",
    "versions": {"scipy": scipy.__version__, "numpy": np.__version__, "mpmath": mp.__version__},
    "cases": cases,
}, indent=1))
