#!/usr/bin/env python3
"""Reference values of Cramér's V (and |φ| for 2 x 2 tables) for plumbline's tests of
src/stats/association.ts.

    python3 scripts/make_association_reference.py > fixtures/reference/association.json

Source: scipy.stats.contingency.association(table, method="cramer") (Debian python3-scipy) on
contingency tables drawn with numpy's default_rng and the seed below; the χ² beside each is
scipy.stats.chi2_contingency(table, correction=False), Pearson's χ² without a continuity
correction. The output is the same for the same library versions, which are written into the file.
"""
import json

import numpy as np
import scipy
from scipy import stats
from scipy.stats import contingency

SEED = 20261215
rng = np.random.default_rng(SEED)

cases = []
for shape in [(2, 2)] * 12 + [(2, 3), (3, 2), (3, 3), (2, 5), (4, 3), (3, 6), (5, 5), (4, 7)] * 3:
    while True:
        table = rng.integers(1, 60, size=shape)
        if table.sum(axis=0).min() > 0 and table.sum(axis=1).min() > 0:
            break
    chi2, _, dof, _ = stats.chi2_contingency(table, correction=False)
    cases.append({
        "table": table.tolist(),
        "rows": shape[0],
        "cols": shape[1],
        "n": int(table.sum()),
        "chiSquare": float(chi2),
        "df": int(dof),
        "cramerV": float(contingency.association(table, method="cramer")),
    })

print(json.dumps({
    "source": "scipy %s (stats.contingency.association, method cramer; stats.chi2_contingency, correction=False), numpy %s; scripts/make_association_reference.py, seed %d"
              % (scipy.__version__, np.__version__, SEED),
    "cases": cases,
}, indent=1))
