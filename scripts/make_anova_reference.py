#!/usr/bin/env python3
"""Reference values of the one-way analysis-of-variance F for plumbline's tests of
src/stats/oneWayAnova.ts and the rule f-follows-from-group-summaries.

    python3 scripts/make_anova_reference.py > fixtures/reference/one-way-anova.json

Source: scipy.stats.f_oneway (Debian python3-scipy) on raw scores drawn with numpy's
default_rng and the seed below: k groups (2 to 6) of 4 to 60 units, with group means and SDs
drawn at random. Each case keeps the exact means (numpy mean), SDs (ddof=1) and sizes, the
same means and SDs rounded to `decimals` places as a manuscript would print them, and the
exact F and its dfs (k - 1, N - k). The output is the same for the same library versions,
which are written into the file.
"""
import json

import numpy as np
import scipy
from scipy import stats

SEED = 20261203
rng = np.random.default_rng(SEED)

cases = []
for i in range(60):
    k = int(rng.integers(2, 7))
    ns = [int(rng.integers(4, 61)) for _ in range(k)]
    scale = 10.0 ** int(rng.integers(-1, 3))
    centre = float(rng.uniform(0, 5)) * scale
    spread = float(rng.uniform(0.3, 2.0)) * scale
    shift = float(rng.uniform(0, 1.5)) * spread
    groups = [rng.normal(centre + shift * float(rng.standard_normal()), spread * float(rng.uniform(0.6, 1.5)), size=n) for n in ns]
    f, p = stats.f_oneway(*groups)
    decimals = int(rng.integers(1, 4))
    cases.append({
        "n": ns,
        "mean": [float(np.mean(g)) for g in groups],
        "sd": [float(np.std(g, ddof=1)) for g in groups],
        "decimals": decimals,
        "printedMean": [f"{np.mean(g):.{decimals}f}" for g in groups],
        "printedSd": [f"{np.std(g, ddof=1):.{decimals}f}" for g in groups],
        "F": float(f),
        "p": float(p),
        "df": [k - 1, sum(ns) - k],
    })

print(json.dumps({
    "source": "scipy %s (stats.f_oneway on raw scores), numpy %s; scripts/make_anova_reference.py, seed %d" % (scipy.__version__, np.__version__, SEED),
    "cases": cases,
}, indent=1))
