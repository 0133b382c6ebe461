#!/usr/bin/env bash
# The demo: DLVO interaction and stability of a latex in salt, and the CCC of a pigment
# dispersion against hard-water calcium. Run from the project root after building.
set -euo pipefail
bin=build/bin/brownfloc
"$bin" dlvo scenarios/001-latex-in-salt.toml --curve build/latex-curve.csv
echo
"$bin" ccc scenarios/002-pigment-coating.toml
