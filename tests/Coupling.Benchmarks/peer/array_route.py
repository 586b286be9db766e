"""The comparison peer: the same narrowband phase-locking analysis written as hand-vectorised NumPy/SciPy.

    python3 array_route.py generate DIR      # writes DIR/epochs.npy (+ labels, plans for the command-line tool)
    python3 array_route.py compute DIR       # band isolation + PLV + trial-shuffle surrogates, as an analyst would

Workload: 32 channels x 100 trials x 1000 samples at 500 Hz, one band (8-12 Hz), every sample of the whole epoch,
200 trial-shuffle draws. The route:

* zero-phase FIR band-pass, forward and backward (the filtfilt response |H|^2) on even-reflected padding of one filter
  length per side, done in the frequency domain over the whole trials x channels x samples array at once;
  Kaiser-window design by scipy.signal.kaiserord / firwin (60 dB, 2 Hz transition), the tool's specification;
* analytic signal by FFT (Marple 1999; the definition of scipy.signal.hilbert), fused with the filter in the same
  transform, padding cut off afterwards;
* unit phasors laid out time x channels x trials; the cross sums of all pairs at every time point as one batched
  complex matrix product (numpy.matmul over the time axis, BLAS zgemm per time point); PLV = |sum| / N averaged over
  time (Lachaux et al. 1999, Hum Brain Mapp 8:194-208);
* surrogates: per draw one random trial order applied to the second factor (kept trial-major, so the reordering is a
  copy of whole blocks), the same batched product, the same summary; draws run on all cores in a thread pool; p =
  (b + 1) / (M + 1) with ties counted (Phipson and Smyth 2010).
"""
import os
import sys
import time
from concurrent.futures import ThreadPoolExecutor

# One BLAS thread per worker: the draws run on all cores through a thread pool instead (numpy releases the
# interpreter lock inside matmul); threading each small 32 x 100 x 32 product inside OpenBLAS was slower.
os.environ.setdefault("OPENBLAS_NUM_THREADS", "1")

import numpy as np
import scipy.fft
import scipy.signal

RATE = 500.0
CHANNELS, TRIALS, SAMPLES = 32, 100, 1000
BAND = (8.0, 12.0)
TRANSITION_HZ = 2.0
ATTENUATION_DB = 60.0
DRAWS = 200
SEED = 7


def generate(folder):
    """AR(1) noise (coefficient 0.97) plus a white floor per channel and trial, and a 10 Hz rhythm shared by two
    channel groups with a fixed lag, so that some pairs are coupled."""
    os.makedirs(folder, exist_ok=True)
    rng = np.random.default_rng(2026)
    noise = rng.uniform(-0.5, 0.5, size=(TRIALS, CHANNELS, SAMPLES + 500))
    x = scipy.signal.lfilter([1.0], [1.0, -0.97], noise, axis=-1)[..., 500:]
    x += 0.1 * rng.uniform(-0.5, 0.5, size=x.shape)
    t = np.arange(SAMPLES) / RATE
    phase = rng.uniform(0, 2 * np.pi, size=(TRIALS, 1))
    rhythm = np.sin(2 * np.pi * 10 * t[None, :] + phase)
    x[:, 0:4, :] += 1.5 * rhythm[:, None, :]
    x[:, 4:8, :] += 1.5 * np.sin(2 * np.pi * 10 * t[None, :] + phase - 0.8)[:, None, :]
    np.save(os.path.join(folder, "epochs.npy"), np.ascontiguousarray(x, dtype=np.float64))
    with open(os.path.join(folder, "labels.txt"), "w") as f:
        f.write("go\n" * TRIALS)
    plans(folder)


def plans(folder):
    """The tool's two plans for the same work. The whole 2 s epoch is the window, so the 969-tap filter's edge effects
    reach into it from the padding; the array route analyses such windows too (from reflected padding), so the plans
    accept them (edge_effects: accept) rather than being refused."""
    labels = ", ".join(f"E{c + 1}" for c in range(CHANNELS))
    for name, measures in (("plv", "[plv]"), ("four", "[plv, wpli, coherence, aec]")):
        with open(os.path.join(folder, f"plan-{name}.yaml"), "w") as f:
            f.write(f"""recording: epochs.npy
sample_rate: {RATE:g}
epochs: {{ first_sample_time: 0, labels: labels.txt, channel_labels: [{labels}] }}
conditions: {{ go: go }}
trial: {{ start: 0, end: {SAMPLES / RATE:g} }}
window: {{ start: 0, end: {SAMPLES / RATE:g} }}
bands: {{ alpha: [{BAND[0]:g}, {BAND[1]:g}] }}
decomposition: {{ method: fir-hilbert, transition: {TRANSITION_HZ:g}, attenuation: {ATTENUATION_DB:g}, time_step: 1, edge_effects: accept }}
measures: {measures}
surrogates: {DRAWS}
seed: {SEED}
output: results-{name}
figures: false
""")


def design():
    numtaps, beta = scipy.signal.kaiserord(ATTENUATION_DB, TRANSITION_HZ / (0.5 * RATE))
    numtaps |= 1
    return scipy.signal.firwin(numtaps, BAND, window=("kaiser", beta), pass_zero=False, fs=RATE)


def narrowband(x, taps):
    """Forward-backward FIR filtering and the analytic signal, one real-input FFT per row, all rows at once."""
    pad = len(taps)
    padded = np.pad(x, ((0, 0), (0, 0), (pad, pad)), mode="reflect")
    length = padded.shape[-1]
    size = scipy.fft.next_fast_len(length + 2 * (len(taps) - 1), real=True)
    gain = np.abs(scipy.fft.rfft(taps, size)) ** 2          # |H|^2: forward then backward, zero phase
    weights = np.full(size // 2 + 1, 2.0)
    weights[0] = 1.0
    if size % 2 == 0:
        weights[-1] = 1.0
    spectrum = scipy.fft.rfft(padded, size, axis=-1, workers=-1)
    spectrum *= gain * weights
    full = np.zeros(padded.shape[:2] + (size,), dtype=np.complex128)
    full[..., : size // 2 + 1] = spectrum
    z = scipy.fft.ifft(full, axis=-1, workers=-1)
    return z[..., pad: pad + x.shape[-1]]


def plv_matrix(u, v_conj_t):
    """Mean over time of |sum_n u_a,n conj(v_b,n)| / N for all pairs: one batched complex product."""
    s = np.matmul(u, v_conj_t)                               # time x channels x channels
    return np.abs(s).mean(axis=0) / u.shape[-1]


def compute(folder):
    clock = time.perf_counter()
    x = np.load(os.path.join(folder, "epochs.npy"))
    loaded = time.perf_counter()
    z = narrowband(x, design())
    u = z / np.abs(z)
    by_trial = np.ascontiguousarray(u.conj().transpose(0, 2, 1))  # trials x time x channels (conjugated)
    u = np.ascontiguousarray(u.transpose(2, 1, 0))                 # time x channels x trials
    isolated = time.perf_counter()
    observed = plv_matrix(u, by_trial.transpose(1, 0, 2))
    rng = np.random.default_rng(SEED)
    orders = [rng.permutation(u.shape[-1]) for _ in range(DRAWS)]
    total = np.zeros_like(observed)
    squares = np.zeros_like(observed)
    exceed = np.zeros(observed.shape, dtype=np.int64)

    def draw(order):
        return plv_matrix(u, np.take(by_trial, order, axis=0).transpose(1, 0, 2))

    with ThreadPoolExecutor(max_workers=os.cpu_count()) as pool:
        values = pool.map(draw, orders)
        for value in values:
            total += value
            squares += value * value
            exceed += value >= observed
    mean = total / DRAWS
    sd = np.sqrt((squares - DRAWS * mean * mean) / (DRAWS - 1))
    p = (exceed + 1.0) / (DRAWS + 1.0)
    zscore = (observed - mean) / sd
    done = time.perf_counter()
    a, b = np.triu_indices(observed.shape[0], 1)
    np.savetxt(os.path.join(folder, "array-route-plv.tsv"), np.column_stack([a + 1, b + 1, observed[a, b], zscore[a, b], p[a, b]]),
               fmt=["%d", "%d", "%.17g", "%.17g", "%.17g"], delimiter="\t", header="a\tb\tvalue\tz\tp", comments="")
    print(f"load {loaded - clock:.2f} s, band isolation {isolated - loaded:.2f} s, "
          f"observed + {DRAWS} surrogates {done - isolated:.2f} s, total {time.perf_counter() - clock:.2f} s")


if __name__ == "__main__":
    if len(sys.argv) != 3 or sys.argv[1] not in ("generate", "plans", "compute"):
        sys.exit(__doc__)
    {"generate": generate, "plans": plans, "compute": compute}[sys.argv[1]](sys.argv[2])
