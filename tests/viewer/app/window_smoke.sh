#!/usr/bin/env bash
# The window starts on a real run and keeps running (no crash, no error) until it is stopped;
# on a run that is still empty it waits instead of failing; on a damaged trajectory it shows
# the reason in its window until closed (exit 2 then). Input cannot be scripted
# here (no X automation tools); the window's drawing is the same FrameView the --render
# pixel tests check.
#   window_smoke.sh BROWNFLOC BROWNFLOC_VIEW SCENARIO      (run under xvfb-run)
set -u
brownfloc=$1 view=$2 scenario=$3
scratch=$(mktemp -d)
trap 'rm -rf "$scratch"' EXIT
"$brownfloc" run "$scenario" -o "$scratch/run" --quiet --set run.particles=300 || exit 1
timeout 4 "$view" "$scratch/run" 2>"$scratch/stderr"
status=$?
if [ "$status" -ne 124 ] || grep -q "error" "$scratch/stderr"; then
  echo "FAIL: the window exited with $status before it was stopped:"; cat "$scratch/stderr"; exit 1
fi
# Only the trajectory's header, no frame yet: the window waits for the run.
mkdir "$scratch/empty"
head -c "$(( $(od -An -t u8 -j 16 -N 8 "$scratch/run/trajectory.bftraj") + 32 ))" "$scratch/run/trajectory.bftraj" \
  > "$scratch/empty/trajectory.bftraj"
timeout 3 "$view" "$scratch/empty" 2>"$scratch/stderr"
status=$?
if [ "$status" -ne 124 ] || grep -q "error" "$scratch/stderr"; then
  echo "FAIL: the window on an empty trajectory exited with $status:"; cat "$scratch/stderr"; exit 1
fi
# A damaged trajectory: the reason is shown in a window (and on standard error) until closed.
mkdir "$scratch/damaged"
echo "not a trajectory" > "$scratch/damaged/trajectory.bftraj"
timeout 3 "$view" "$scratch/damaged" 2>"$scratch/stderr"
status=$?
if [ "$status" -ne 124 ] || ! grep -q "^error: .*trajectory.bftraj" "$scratch/stderr"; then
  echo "FAIL: the window on a damaged trajectory exited with $status:"; cat "$scratch/stderr"; exit 1
fi
echo "window smoke test: ok"
