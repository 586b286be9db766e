#!/bin/sh
# Builds gemm_peak against Debian's OpenBLAS (apt-get install -y libopenblas-dev).
set -e
cd "$(dirname "$0")"
gcc -O2 -o gemm_peak gemm_peak.c -I/usr/include/x86_64-linux-gnu/openblas-pthread -lopenblas
