#!/usr/bin/python3
"""Writes the reference values for the DPSS taper tests.

Run from this folder with Debian's interpreter (python3-scipy):
    /usr/bin/python3 make_dpss_fixture.py
Outputs dpss_tapers.json here: scipy.signal.windows.dpss(M, NW, Kmax, sym=True, norm=2, return_ratios=True)
for a few lengths and time-half-bandwidth products. Floats are written by json with repr, so they round-trip exactly.
"""
import json
import numpy as np
import scipy
from scipy.signal import windows

META = {"scipy": scipy.__version__, "numpy": np.__version__}

cases = []
for length, nw, count in [(16, 2.0, 3), (64, 2.5, 4), (101, 3.0, 5), (250, 4.0, 7), (33, 1.5, 2)]:
    tapers, ratios = windows.dpss(length, nw, Kmax=count, sym=True, norm=2, return_ratios=True)
    cases.append({"length": length, "nw": nw, "count": count,
                  "tapers": [[float(v) for v in row] for row in tapers],
                  "ratios": [float(r) for r in ratios]})
with open("dpss_tapers.json", "w") as f:
    json.dump({"source": META, "cases": cases}, f, indent=1)
    f.write("\n")
