#!/bin/sh
# Regenerates the format fixtures in this folder.
# Needs Debian packages: libedf-dev (EDFlib), gcc, python3-numpy; and the .NET SDK for the writer's file.
set -eu
here=$(cd "$(dirname "$0")" && pwd)
repo=$(cd "$here/../../../.." && pwd)
tmp=$(mktemp -d)
trap 'rm -rf "$tmp"' EXIT
gcc -O1 -Wall -o "$tmp/make_edflib_fixture" "$here/make_edflib_fixture.c" -ledf -lm
gcc -O1 -Wall -o "$tmp/read_with_edflib" "$here/read_with_edflib.c" -ledf
gcc -O1 -Wall -o "$tmp/make_edflib_bdf_fixture" "$here/make_edflib_bdf_fixture.c" -ledf -lm
"$tmp/make_edflib_fixture" "$here/edflib_two_rates.edf" "$here/edflib_two_rates.json"
"$tmp/make_edflib_bdf_fixture" "$here/edflib_bdf.bdf" "$here/edflib_bdf.json"
/usr/bin/python3 "$here/make_numpy_fixture.py" "$here"
# The library's own writer output, then EDFlib's reading of it.
COUPLING_FIXTURE_OUT="$here" dotnet test "$repo/tests/Coupling.Tests" \
    --filter "FullyQualifiedName~Coupling.Tests.Formats.EdfWriterTests.EDFlib_reads_the_writer_output_as_written"
"$tmp/read_with_edflib" "$here/coupling_written.edf" "$here/coupling_written_edflib.json"
