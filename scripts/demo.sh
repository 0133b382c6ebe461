#!/usr/bin/env bash
# The demo: DLVO interaction and stability of a latex in salt, the CCC of a pigment
# dispersion against hard-water calcium, and a short aggregation run of a silica sol after
# a salt shock (under a minute on two cores). Run from the project root after building.
set -euo pipefail
bin=build/bin/brownfloc
"$bin" dlvo scenarios/001-latex-in-salt.toml --curve build/latex-curve.csv
echo
"$bin" ccc scenarios/002-pigment-coating.toml
echo
"$bin" run scenarios/005-silica-sol-salt-shock.toml -o build/demo-run --overwrite
