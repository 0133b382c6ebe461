#!/usr/bin/env bash
# The demo: DLVO interaction and stability of a latex in salt, the CCC of a pigment
# dispersion against hard-water calcium, a shelf-life estimate for a latex paint made up with
# hard water (uncertain inputs, with a plot of time against salt), the same paint calibrated
# to measured stability ratios, and a short aggregation run of a silica sol after
# a salt shock (under a minute on two cores), and a picture of its last frame. Run from the
# project root after building.
set -euo pipefail
bin=build/bin/brownfloc
"$bin" dlvo scenarios/001-latex-in-salt.toml --curve build/latex-curve.csv
echo
"$bin" ccc scenarios/002-pigment-coating.toml
echo
"$bin" shelf-life scenarios/006-latex-paint-shelf-life.toml --plot build/shelf-life.svg
echo "shelf-life: the time against salt, with the Monte Carlo band, is in build/shelf-life.svg"
echo
"$bin" shelf-life scenarios/007-latex-paint-calibrated.toml
echo
"$bin" run scenarios/005-silica-sol-salt-shock.toml -o build/demo-run --overwrite
echo
# A picture of the run's last frame with the plots beside it. brownfloc-view needs an X
# display even to render off screen; without one, the render runs under xvfb-run.
view=(build/bin/brownfloc-view build/demo-run --render build/demo-run/last-frame.png --plots --select largest)
if [ -n "${DISPLAY:-}" ]; then
  png=$("${view[@]}")
else
  png=$(xvfb-run -a -s "-screen 0 1280x800x24" "${view[@]}")
fi
echo "brownfloc-view: the last frame, with the plots, is in $png"
echo "Replay the run in a window (press H for the keys): build/bin/brownfloc-view build/demo-run"
