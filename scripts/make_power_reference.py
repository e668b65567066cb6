#!/usr/bin/env python3
"""Golden table of t-test power and required sample sizes, from scipy.stats.nct.

    python3 scripts/make_power_reference.py > fixtures/reference/power.json

Power of a two-sided (or one-sided) t-test at alpha for standardised effect d: two equal groups
of n (df = 2n - 2, noncentrality d*sqrt(n/2)) or one sample / paired differences (df = n - 1,
noncentrality d*sqrt(n)). Required n is the smallest n reaching the target power. scipy from
Debian's python3-scipy; the grid is fixed.
"""
import json
import sys

import scipy
from scipy import stats


def power(design, n, d, alpha, sides):
    df = 2 * n - 2 if design == "two-sample" else n - 1
    ncp = abs(d) * ((n / 2) ** 0.5 if design == "two-sample" else n ** 0.5)
    crit = stats.t.ppf(1 - alpha / sides, df)
    p = stats.nct.sf(crit, df, ncp)
    if sides == 2:
        p += stats.nct.cdf(-crit, df, ncp)
    return float(p)


def required(design, target, d, alpha, sides):
    n = 2
    while power(design, n, d, alpha, sides) < target:
        n += 1
    return n


rows = []
for design in ("two-sample", "paired", "one-sample"):
    for d in (0.2, 0.35, 0.5, 0.8, 1.2):
        for alpha in (0.05, 0.01):
            for sides in (2, 1):
                for target in (0.8, 0.9):
                    n = required(design, target, d, alpha, sides)
                    rows.append({"design": design, "d": d, "alpha": alpha, "sides": sides, "target": target,
                                 "requiredN": n, "powerAtN": power(design, n, d, alpha, sides),
                                 "powerBelow": power(design, n - 1, d, alpha, sides) if n > 2 else None})
json.dump({"source": "scipy %s stats.nct" % scipy.__version__, "script": "scripts/make_power_reference.py", "rows": rows},
          sys.stdout, indent=1)
sys.stdout.write("\n")
