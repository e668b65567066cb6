#!/usr/bin/env python3
"""Reference t-tests computed from generated raw data, for plumbline's descriptives tests.

    python3 scripts/make_descriptive_reference.py > fixtures/reference/descriptives.json

Raw data come from numpy's PCG64 generator with a fixed seed (numpy from Debian's
python3-numpy); every statistic is computed by scipy.stats (ttest_1samp, ttest_ind with
equal_var True and False, ttest_rel; t.ppf for confidence intervals). Each scenario records the
group summaries and test results unrounded; the tests print them at chosen decimals.
"""
import json
import sys

import numpy as np
import scipy
from scipy import stats

rng = np.random.Generator(np.random.PCG64(20261202))
scenarios = []


def summary(x):
    return {"mean": float(np.mean(x)), "sd": float(np.std(x, ddof=1)), "n": int(len(x))}


def ci_diff(diff, se, df, level=0.95):
    crit = float(stats.t.ppf(0.5 + level / 2, df))
    return [diff - crit * se, diff + crit * se]


for i in range(12):
    n1 = int(rng.integers(8, 60))
    n2 = int(rng.integers(8, 60))
    a = rng.normal(50 + rng.normal(0, 5), rng.uniform(5, 15), n1)
    b = rng.normal(50, rng.uniform(5, 15), n2)
    s = stats.ttest_ind(a, b, equal_var=True)
    w = stats.ttest_ind(a, b, equal_var=False)
    sp = np.sqrt(((n1 - 1) * np.var(a, ddof=1) + (n2 - 1) * np.var(b, ddof=1)) / (n1 + n2 - 2))
    diff = float(np.mean(a) - np.mean(b))
    se_pooled = float(sp * np.sqrt(1 / n1 + 1 / n2))
    scenarios.append({
        "kind": "independent",
        "groups": [summary(a), summary(b)],
        "student": {"t": float(s.statistic), "df": n1 + n2 - 2, "p": float(s.pvalue), "ci": ci_diff(diff, se_pooled, n1 + n2 - 2)},
        "welch": {"t": float(w.statistic), "df": float(w.df), "p": float(w.pvalue)},
        "difference": diff,
        "cohensD": float(diff / sp),
    })

for i in range(8):
    n = int(rng.integers(8, 60))
    x = rng.normal(rng.uniform(-3, 3), rng.uniform(2, 8), n)
    mu = float(round(rng.uniform(-2, 2), 1))
    r = stats.ttest_1samp(x, mu)
    se = float(np.std(x, ddof=1) / np.sqrt(n))
    scenarios.append({
        "kind": "one-sample",
        "groups": [summary(x)],
        "reference": mu,
        "test": {"t": float(r.statistic), "df": n - 1, "p": float(r.pvalue), "ci": ci_diff(float(np.mean(x)) - mu, se, n - 1)},
        "difference": float(np.mean(x)) - mu,
        "cohensD": float((np.mean(x) - mu) / np.std(x, ddof=1)),
    })

for i in range(8):
    n = int(rng.integers(8, 60))
    before = rng.normal(50, rng.uniform(5, 12), n)
    after = before + rng.normal(rng.uniform(-4, 4), rng.uniform(2, 6), n)
    r = stats.ttest_rel(before, after)
    d = before - after
    scenarios.append({
        "kind": "paired",
        "groups": [summary(before), summary(after)],
        "test": {"t": float(r.statistic), "df": n - 1, "p": float(r.pvalue)},
        "correlation": float(np.corrcoef(before, after)[0, 1]),
        "dz": float(np.mean(d) / np.std(d, ddof=1)),
    })

json.dump({
    "source": "numpy %s PCG64(20261202) raw data; scipy %s stats.ttest_1samp/ttest_ind/ttest_rel" % (np.__version__, scipy.__version__),
    "script": "scripts/make_descriptive_reference.py",
    "scenarios": scenarios,
}, sys.stdout, indent=1)
sys.stdout.write("\n")
