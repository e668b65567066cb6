#!/usr/bin/env python3
"""Adjusted p values of seeded random sets of p values, for plumbline's test of adjustedPRange
(src/stats/adjust.ts): every adjusted p must lie in the range given for its unadjusted p.

    python3 scripts/make_adjusted_reference.py > fixtures/reference/adjusted-p.json

Benjamini-Hochberg: scipy.stats.false_discovery_control (Debian python3-scipy). Holm and
Hochberg: their step-down and step-up formulas written out here (common practice, from memory:
Holm 1979, Hochberg 1988), independent of plumbline's code. Bonferroni and Sidak: min(1, m p)
and 1 - (1 - p)^m.
"""
import json

import numpy as np
import scipy
from scipy import stats

SEED = 20261205
rng = np.random.default_rng(SEED)


def holm(p):
    m = len(p)
    order = np.argsort(p)
    out = np.empty(m)
    running = 0.0
    for rank, i in enumerate(order):
        running = max(running, min(1.0, (m - rank) * p[i]))
        out[i] = running
    return out


def hochberg(p):
    m = len(p)
    order = np.argsort(p)[::-1]
    out = np.empty(m)
    running = 1.0
    for k, i in enumerate(order):
        rank = m - k  # 1-based rank from the smallest
        running = min(running, (m - rank + 1) * p[i])
        out[i] = min(1.0, running)
    return out


sets = []
for m in (2, 3, 5, 8, 20):
    for _ in range(20):
        # a mix of small and large p values, as a paper's family of tests has
        p = np.where(rng.random(m) < 0.5, rng.random(m) * 0.05, rng.random(m))
        sets.append({
            "m": m,
            "p": [float(x) for x in p],
            "fdr": [float(x) for x in stats.false_discovery_control(p, method="bh")],
            "holm": [float(x) for x in holm(p)],
            "hochberg": [float(x) for x in hochberg(p)],
            "bonferroni": [float(min(1.0, m * x)) for x in p],
            "sidak": [float(1 - (1 - x) ** m) for x in p],
        })

print(json.dumps({"source": "scipy.stats.false_discovery_control (BH); Holm and Hochberg written out; seeded", "seed": SEED, "versions": {"scipy": scipy.__version__, "numpy": np.__version__}, "sets": sets}, indent=1))
