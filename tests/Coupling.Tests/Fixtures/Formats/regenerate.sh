#!/bin/sh
# Regenerates the format fixtures in this folder.
# Needs Debian packages: libedf-dev (EDFlib), gcc, python3-numpy.
set -eu
here=$(cd "$(dirname "$0")" && pwd)
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
gcc -O1 -Wall -o "$tmp/make_edflib_fixture" "$here/make_edflib_fixture.c" -ledf -lm
"$tmp/make_edflib_fixture" "$here/edflib_two_rates.edf" "$here/edflib_two_rates.json"
/usr/bin/python3 "$here/make_numpy_fixture.py" "$here"
