#!/usr/bin/env bash
# The run directory guards (shared/INTERFACES.md, "Run directory"): a directory that holds a
# run is refused without --overwrite (exit 3) and taken with it; a refusal leaves no .lock
# behind; a stale .lock is refused even with --overwrite (exit 3), naming the lock file.
# One thread: nothing here depends on the count, and spare threads only cost time on a busy box.
#   run_directory.sh EXPECT_SH BROWNFLOC_EXE SCENARIO
set -u
expect=$1
exe=$2
scenario=$3
scratch=$(mktemp -d)
trap 'rm -rf "$scratch"' EXIT
dir=$scratch/run
failed=0
step() {  # step DESCRIPTION EXPECTED_EXIT REGEX ARGS...  (REGEX unused for exit 0: --quiet is silent)
    local what=$1 status=0
    shift
    if [ "$1" -eq 0 ]; then
        "$exe" run "$scenario" -o "$dir" --quiet --threads 1 "${@:3}" </dev/null || status=$?
        [ "$status" -eq 0 ] || echo "exit status $status, expected 0" >&2
    else
        bash "$expect" "$1" "$2" -- "$exe" run "$scenario" -o "$dir" --quiet --threads 1 "${@:3}" || status=$?
    fi
    if [ "$status" -ne 0 ]; then
        echo "FAIL: $what" >&2
        failed=1
    fi
}
step "first run into a new directory" 0 -
step "second run without --overwrite" 3 "^error: $dir: holds another run \(summary\.json\). choose another directory with -o or pass --overwrite"
if [ -e "$dir/.lock" ]; then
    echo "FAIL: the refused run left $dir/.lock behind" >&2
    failed=1
    rm -f "$dir/.lock"
fi
step "second run with --overwrite" 0 - --overwrite
touch "$dir/.lock"
step "stale .lock with --overwrite" 3 "^error: $dir/\.lock: another run is writing into this directory \(lock held\)" --overwrite
step "stale .lock without --overwrite" 3 "^error: $dir/\.lock: .*lock held"
exit $failed
