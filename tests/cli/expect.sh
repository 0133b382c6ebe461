#!/usr/bin/env bash
# Runs a command and checks how it failed (or succeeded):
#   expect.sh EXPECTED_EXIT REGEX -- COMMAND [ARGS...]
# Passes when the exit status is EXPECTED_EXIT, standard error matches the extended regular
# expression REGEX (grep -E; '' matches anything), and standard output holds no NaN or
# infinity (shared/INTERFACES.md: no NaN in a result, JSON never holds NaN or inf).
# On failure it prints what it expected and what it got, and exits 1.
set -u

if [ "$#" -lt 4 ] || [ "$3" != "--" ]; then
    echo "usage: $0 EXPECTED_EXIT REGEX -- COMMAND [ARGS...]" >&2
    exit 64
fi
expected_exit=$1
regex=$2
shift 3

scratch=$(mktemp -d)
trap 'rm -rf "$scratch"' EXIT
"$@" >"$scratch/stdout" 2>"$scratch/stderr" </dev/null
status=$?

failed=0
if [ "$status" -ne "$expected_exit" ]; then
    echo "FAIL: exit status $status, expected $expected_exit" >&2
    failed=1
fi
if ! grep -Eq -- "$regex" "$scratch/stderr"; then
    echo "FAIL: standard error does not match the regex: $regex" >&2
    failed=1
fi
# Whole words only, so that "information" or "infinite" in a text report do not count;
# -nan, -inf and NaN are caught too.
if grep -Eiqw -- 'nan|inf|infinity' "$scratch/stdout"; then
    echo "FAIL: standard output holds nan or inf:" >&2
    grep -Einw -- 'nan|inf|infinity' "$scratch/stdout" | head -n 5 >&2
    failed=1
fi
if [ "$failed" -ne 0 ]; then
    echo "command: $*" >&2
    echo "--- standard error ---" >&2
    head -c 4000 "$scratch/stderr" >&2
    echo "--- standard output (first 2000 bytes) ---" >&2
    head -c 2000 "$scratch/stdout" >&2
    exit 1
fi
exit 0
