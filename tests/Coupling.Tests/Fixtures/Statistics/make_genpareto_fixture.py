"""Writes genpareto.csv: survival function values of the generalised Pareto distribution from scipy.

scipy.stats.genpareto(c, loc=0, scale).sf(z), with c the shape (xi) in the convention F(z) = 1 - (1 + c z/scale)^(-1/c).
Run from this folder with Debian's Python: /usr/bin/python3 make_genpareto_fixture.py
"""
import csv

import numpy as np
import scipy
from scipy.stats import genpareto

rows = []
for c in (-0.4, -0.2, -0.05, 0.0, 0.1, 0.3):
    for scale in (0.02, 1.0, 3.5):
        for z in (0.0, 0.01, 0.1, 0.5, 1.0, 2.0, 5.0, 20.0):
            rows.append((repr(c), repr(scale), repr(z), repr(float(genpareto.sf(z, c, loc=0, scale=scale)))))

with open("genpareto.csv", "w", newline="") as f:
    w = csv.writer(f)
    w.writerow([f"# scipy {scipy.__version__}, numpy {np.__version__}"])
    w.writerow(["shape", "scale", "z", "survival"])
    w.writerows(rows)
