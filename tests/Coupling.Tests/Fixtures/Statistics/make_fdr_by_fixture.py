"""Writes fdr_by.csv: random p-value families and their Benjamini-Yekutieli adjusted values from statsmodels.

Run from this folder with Debian's Python: /usr/bin/python3 make_fdr_by_fixture.py
"""
import csv

import numpy as np
import statsmodels
from statsmodels.stats.multitest import multipletests

rng = np.random.default_rng(20261202)
rows = []
for family in range(6):
    m = int(rng.integers(5, 80))
    # A mixture of small and uniform p-values, with some ties, like a connectivity table with a few real edges.
    p = np.where(rng.random(m) < 0.3, np.round(rng.random(m) * 0.0005, 6), rng.random(m))
    reject, adjusted, _, _ = multipletests(p, alpha=0.05, method="fdr_by")
    for i in range(m):
        rows.append((family, repr(float(p[i])), repr(float(adjusted[i])), int(reject[i])))

with open("fdr_by.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow([f"# statsmodels {statsmodels.__version__}, numpy {np.__version__}"])
    w.writerow(["family", "p", "adjusted", "reject_at_0.05"])
    w.writerows(rows)
