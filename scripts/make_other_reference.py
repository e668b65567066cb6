#!/usr/bin/env python3
"""Golden tables of the F, chi-square and normal tails and of Pearson r's p, for plumbline's
accuracy tests of src/stats/otherDistributions.ts.

    python3 scripts/make_other_reference.py > fixtures/reference/other-tails.json

Source: mpmath (Debian python3-mpmath) at 60 significant digits is the reference; scipy
(Debian python3-scipy: stats.f.sf, stats.chi2.sf, stats.norm.sf, stats.pearsonr's t route)
is recorded beside it as a second, independent value. Points come from a fixed grid plus a
seeded random draw (numpy's default_rng with the seed below), so the output is the same for
the same library versions, which are written into the file.

Definitions (common practice, no source):
  F upper tail    P(F >= f)     = I_{df2/(df2+df1 f)}(df2/2, df1/2)
  chi2 upper tail P(X >= x)     = Q(df/2, x/2)
  z two-sided     P(|Z| >= |z|) = erfc(|z|/sqrt 2)
  r two-sided     p of t = r sqrt(df/(1-r^2)) on df = n - 2 degrees of freedom, two-sided
"""
import json

import mpmath as mp
import numpy as np
import scipy
from scipy import stats

mp.mp.dps = 60
SEED = 20261203
rng = np.random.default_rng(SEED)


def s(x):
    return mp.nstr(x, 30, min_fixed=-400, max_fixed=400) if x != 0 else "0"


def f_sf(f, d1, d2):
    f, d1, d2 = mp.mpf(f), mp.mpf(d1), mp.mpf(d2)
    if f == 0:
        return mp.mpf(1)
    with mp.workdps(100):
        return +mp.betainc(d2 / 2, d1 / 2, 0, d2 / (d2 + d1 * f), regularized=True)


def chi2_sf(x, df):
    x, df = mp.mpf(x), mp.mpf(df)
    if x == 0:
        return mp.mpf(1)
    with mp.workdps(100):
        return +mp.gammainc(df / 2, x / 2, mp.inf, regularized=True)


def z_two(z):
    with mp.workdps(100):
        return +mp.erfc(abs(mp.mpf(z)) / mp.sqrt(2))


def t_two(t, df):
    t, df = mp.mpf(t), mp.mpf(df)
    if t == 0:
        return mp.mpf(1)
    with mp.workdps(100):
        return +mp.betainc(df / 2, mp.mpf(1) / 2, 0, df / (df + t * t), regularized=True)


def r_two(r, df):
    r, df = mp.mpf(r), mp.mpf(df)
    with mp.workdps(100):
        t = r * mp.sqrt(df / (1 - r * r))
        return t_two(t, df)


F_CASES = [(f, d1, d2) for f in ["0.01", "0.5", "1", "2.5", "4.21", "10", "40", "250"]
           for d1 in ["1", "2", "3.7", "10"] for d2 in ["5", "38", "57.3", "200", "5000"]]
for _ in range(60):
    F_CASES.append((repr(round(float(rng.uniform(0, 30)), 3)), repr(round(float(rng.uniform(1, 12)), 2)),
                    repr(round(float(rng.uniform(2, 400)), 2))))

CHI_CASES = [(x, df) for x in ["0.01", "0.5", "1", "3.84", "6.1", "20", "100", "600", "1500"]
             for df in ["1", "2", "3", "7", "20", "120", "1000"]]
for _ in range(60):
    CHI_CASES.append((repr(round(float(rng.uniform(0, 80)), 3)), str(int(rng.integers(1, 40)))))

Z_CASES = ["0", "0.001", "0.5", "1", "1.5", "1.96", "2.31", "3", "5", "8", "12", "20", "37"]
for _ in range(30):
    Z_CASES.append(repr(round(float(rng.uniform(0, 10)), 3)))

R_CASES = [(r, df) for r in ["0", "0.05", "0.32", "-0.41", "0.7", "0.95", "0.999"] for df in ["3", "10", "48", "200", "5000"]]
for _ in range(40):
    R_CASES.append((repr(round(float(rng.uniform(-0.99, 0.99)), 3)), str(int(rng.integers(3, 500)))))

out = {
    "source": "mpmath %s at 60 digits (scipy %s beside it); scripts/make_other_reference.py, seed %d" % (mp.__version__, scipy.__version__, SEED),
    "f": [{"f": f, "df1": d1, "df2": d2, "p": s(f_sf(f, d1, d2)),
           "scipy": float(stats.f.sf(float(f), float(d1), float(d2)))} for f, d1, d2 in F_CASES],
    "chiSquare": [{"x": x, "df": df, "p": s(chi2_sf(x, df)),
                   "scipy": float(stats.chi2.sf(float(x), float(df)))} for x, df in CHI_CASES],
    "z": [{"z": z, "p": s(z_two(z)), "scipy": float(2 * stats.norm.sf(abs(float(z))))} for z in Z_CASES],
    "r": [{"r": r, "df": df, "p": s(r_two(r, df)),
           "scipy": float(2 * stats.t.sf(abs(float(r)) * np.sqrt(float(df) / (1 - float(r) ** 2)), float(df)))}
          for r, df in R_CASES],
}
print(json.dumps(out, indent=1))
