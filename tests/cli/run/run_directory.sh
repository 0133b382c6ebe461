#!/usr/bin/env bash
# The run directory guards (shared/INTERFACES.md, "Run directory"): a directory that holds a
# run is refused without --overwrite (exit 3) and taken with it; the lock is a kernel
# advisory lock (flock) on RUN_DIR/.lock: a .lock file left by a killed run blocks nothing,
# while a live holder makes a second writer fail (exit 3) naming the holder's PID.
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
step "second run without --overwrite" 3 "^error: $dir: holds another run \(summary\.json\). choose another directory with -o, pass --overwrite, or continue it with --resume"
step "second run with --overwrite" 0 - --overwrite
echo 999999 > "$dir/.lock"  # a lock file without a holder, as a killed run leaves it
step "leftover .lock file with --overwrite" 0 - --overwrite
# A live holder: flock(1) holds the same kind of lock the run takes, the file names PID 4242.
echo 4242 > "$dir/.lock"
flock "$dir/.lock" sleep 30 > /dev/null 2>&1 &  # no shared output pipe: ctest would wait for it
holder=$!
for _ in $(seq 50); do flock -n "$dir/.lock" true 2>/dev/null || break; sleep 0.1; done
step "lock held by another process, with --overwrite" 3 "^error: $dir: another brownfloc process \(PID 4242\) is writing into this run directory" --overwrite
pkill -P "$holder" 2>/dev/null  # the sleep that flock started
kill "$holder" 2>/dev/null
wait "$holder" 2>/dev/null
exit $failed
