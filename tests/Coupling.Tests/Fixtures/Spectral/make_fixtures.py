#!/usr/bin/python3
"""Writes the reference values for the band isolation tests.

Run from this folder with Debian's interpreter (python3-scipy):
    /usr/bin/python3 make_fixtures.py
Outputs kaiser_order.json, bandpass_taps.json and analytic_signal.json here.
Floats are written by json with repr, so they round-trip exactly.
"""
import json
import numpy as np
import scipy
from scipy import signal

META = {"scipy": scipy.__version__, "numpy": np.__version__}


def write(name, cases):
    with open(name, "w") as f:
        json.dump({"source": META, "cases": cases}, f, indent=1)
        f.write("\n")


# Kaiser order and beta: scipy.signal.kaiserord(ripple, width) with width as a
# fraction of the Nyquist rate. numtaps is scipy's value as returned (not forced odd).
order_cases = []
for attenuation in [10.0, 21.0, 30.0, 40.0, 50.0, 50.5, 60.0, 80.0, 100.0]:
    for transition, rate in [(1.0, 250.0), (2.0, 500.0), (7.5, 1000.0), (0.5, 128.0), (3.3, 2048.0)]:
        numtaps, beta = signal.kaiserord(attenuation, transition / (0.5 * rate))
        order_cases.append({"attenuation_db": attenuation, "transition_hz": transition,
                            "sample_rate": rate, "numtaps": int(numtaps), "beta": float(beta)})
write("kaiser_order.json", order_cases)

# Kaiser-window band-pass taps: scipy.signal.firwin(numtaps, [low, high],
# window=('kaiser', beta), pass_zero=False, scale=True, fs=rate).
taps_cases = []
for low, high, rate, attenuation, transition in [
        (4.0, 8.0, 250.0, 60.0, 1.0), (8.0, 12.0, 500.0, 40.0, 2.0), (13.0, 30.0, 1000.0, 60.0, 3.25),
        (30.0, 80.0, 1000.0, 80.0, 7.5), (1.0, 4.0, 128.0, 30.0, 1.0), (60.0, 90.0, 200.0, 60.0, 10.0)]:
    numtaps, beta = signal.kaiserord(attenuation, transition / (0.5 * rate))
    numtaps |= 1
    taps = signal.firwin(numtaps, [low, high], window=("kaiser", beta), pass_zero=False, scale=True, fs=rate)
    taps_cases.append({"low_hz": low, "high_hz": high, "sample_rate": rate, "numtaps": int(numtaps),
                       "beta": float(beta), "taps": [float(v) for v in taps]})
write("bandpass_taps.json", taps_cases)

# Analytic signal: scipy.signal.hilbert(x) (FFT method), odd and even lengths.
rng = np.random.default_rng(20240611)
hilbert_cases = []
for n in [1, 2, 3, 8, 17, 64, 101, 250]:
    x = rng.standard_normal(n)
    z = signal.hilbert(x)
    hilbert_cases.append({"n": n, "x": [float(v) for v in x], "re": [float(v) for v in z.real],
                          "im": [float(v) for v in z.imag]})
write("analytic_signal.json", hilbert_cases)
