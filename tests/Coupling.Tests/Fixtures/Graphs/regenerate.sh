#!/bin/sh
# Regenerates the graph fixtures in this folder.
# Needs the Debian package python3-networkx; and the .NET SDK for the library's GraphML file.
set -eu
here=$(cd "$(dirname "$0")" && pwd)
repo=$(cd "$here/../../../.." && pwd)
cd "$here"
/usr/bin/python3 make_graph_fixtures.py measures
# The library's own GraphML writer output, then networkx's reading of it.
COUPLING_FIXTURE_OUT="$here" dotnet test "$repo/tests/Coupling.Tests" \
    --filter "FullyQualifiedName~Coupling.Tests.Graphs.GraphMlReadBackTests"
/usr/bin/python3 make_graph_fixtures.py readback
