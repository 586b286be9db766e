#!/usr/bin/env bash
# Paired timing of the command-line tool against the hand-vectorised NumPy/SciPy route (array_route.py) on one
# workload: 32 channels x 100 trials x 1000 samples at 500 Hz, 8-12 Hz, every sample of the epoch, 200 trial-shuffle
# draws. Each round runs the three commands back to back in a rotating order (array route, tool with [plv], tool
# with [plv, wpli, coherence, aec]), so a change in the machine's load hits all of them; the summary gives each
# command's median wall time and the median (min, max) of the per-round ratios array route / tool.
#
#   tests/Coupling.Benchmarks/peer/paired.sh [-n ROUNDS] [-w WARMUPS] [DIR]   # default 5 rounds after 1 warm-up round, DIR /tmp/coupling-peer
#
# Needs the .NET SDK and /usr/bin/python3 (Debian's). Installs python3-numpy and python3-scipy with apt-get when they
# are missing, and libopenblas0-pthread (so numpy's matmul runs on an optimised BLAS rather than the reference one).
set -euo pipefail
rounds=5
warmups=1
while [[ "${1:-}" == -n || "${1:-}" == -w ]]; do
    if [[ "$1" == -n ]]; then rounds="$2"; else warmups="$2"; fi
    shift 2
done
dir="${1:-/tmp/coupling-peer}"
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/../../.." && pwd)"
python=/usr/bin/python3

if ! "$python" -c 'import numpy, scipy' 2>/dev/null; then
    apt-get update && apt-get install -y python3-numpy python3-scipy
fi
if ! dpkg -s libopenblas0-pthread >/dev/null 2>&1; then
    apt-get install -y libopenblas0-pthread || { apt-get update && apt-get install -y libopenblas0-pthread; }
fi

# OpenBLAS 0.3.21 (Debian 12) does not know the newest processor models and falls back to its generic "Prescott"
# kernels, a fifth of the machine's speed in dgemm. The array route gets the AVX-512 kernels in that case, so that it is
# measured at its best (the tool does not use BLAS).
corename() {
    "$python" -c 'import ctypes; l = ctypes.CDLL("libopenblas.so.0"); l.openblas_get_corename.restype = ctypes.c_char_p; print(l.openblas_get_corename().decode())' 2>/dev/null || echo unknown
}
if [[ -z "${OPENBLAS_CORETYPE:-}" && "$(corename)" == Prescott ]] && grep -qw avx512f /proc/cpuinfo; then
    export OPENBLAS_CORETYPE=SkylakeX
fi
blas_core="$(corename)"

dotnet build "$root/src/Coupling.Cli" -c Release -v quiet -nologo >/dev/null
tool="$root/src/Coupling.Cli/bin/Release/net10.0/Coupling.Cli.dll"

mkdir -p "$dir"
[[ -f "$dir/epochs.npy" ]] || "$python" "$here/array_route.py" generate "$dir"
"$python" "$here/array_route.py" plans "$dir"
cd "$dir"

commands=("array|$python $here/array_route.py compute $dir"
          "plv|dotnet $tool run plan-plv.yaml"
          "four|dotnet $tool run plan-four.yaml")
times="$dir/paired-times.tsv"
printf 'round\tcommand\twall_s\tuser_s\tsys_s\tpeak_kib\tload1\n' > "$times"
for ((r = 1 - warmups; r <= rounds; r++)); do
    for ((i = 0; i < 3; i++)); do
        entry="${commands[$(((i + r + 3 * warmups) % 3))]}"
        name="${entry%%|*}"
        load="$(cut -d' ' -f1 /proc/loadavg)"
        # Each tool run writes a new results folder; the previous run's (written by this script) is removed first.
        [[ "$name" == array ]] || rm -rf "$dir/results-$name"
        if ! /usr/bin/time -f '%e\t%U\t%S\t%M' -o "$dir/.time" ${entry#*|} >"$dir/$name.out" 2>&1; then
            echo "$name failed; its output:" >&2
            cat "$dir/$name.out" >&2
            exit 1
        fi
        # Warm-up rounds (r <= 0: disk cache, the runtime's first start) are not counted.
        ((r > 0)) && printf '%d\t%s\t%s\t%s\n' "$r" "$name" "$(tail -1 "$dir/.time")" "$load" >> "$times"
    done
done

"$python" - "$times" "$dir/paired.md" "$rounds" "$blas_core" <<'PY'
import statistics, sys
rows = [line.rstrip("\n").split("\t") for line in open(sys.argv[1])][1:]
wall = {}
for r, name, w, u, s, peak, load in rows:
    wall.setdefault(name, {})[int(r)] = (float(w), float(u) + float(s), int(peak) / 1024, float(load))
names = {"array": "NumPy/SciPy route (PLV only)", "plv": "this tool, measures: [plv]",
         "four": "this tool, measures: [plv, wpli, coherence, aec]"}
loads = [v[3] for d in wall.values() for v in d.values()]
out = [f"Paired run, {sys.argv[3]} rounds, rotating order; 1-minute load average "
       f"{min(loads):.1f}-{max(loads):.1f} at the starts; the array route's OpenBLAS core: {sys.argv[4]}.", "",
       "| command | wall median (min-max) | cpu (user+sys) median | peak resident | array route / this (median, min-max per round) |",
       "| --- | ---: | ---: | ---: | ---: |"]
for key in ("array", "plv", "four"):
    d = wall[key]
    w = [v[0] for v in d.values()]
    cpu = statistics.median(v[1] for v in d.values())
    peak = max(v[2] for v in d.values())
    ratio = ""
    if key != "array":
        rs = [wall["array"][r][0] / d[r][0] for r in d]
        ratio = f"{statistics.median(rs):.2f}x ({min(rs):.2f}-{max(rs):.2f})"
    out.append(f"| {names[key]} | {statistics.median(w):.2f} s ({min(w):.2f}-{max(w):.2f}) | {cpu:.2f} s | {peak:.0f} MiB | {ratio} |")
open(sys.argv[2], "w").write("\n".join(out) + "\n")
print("\n".join(out))
PY
echo "per-run figures: $times; summary: $dir/paired.md"
