#!/usr/bin/env bash
# The whole test suite in three timed stages (what .ci/run and the README's test command run):
#   1. release     Release build with warnings as errors, every test (ctest --preset ci)
#   2. sanitizers  g++ -O1 with AddressSanitizer + UBSan (-fno-sanitize-recover=all), every
#                  test except the slow engine validations (ctest label "slow") and benchmarks
#   3. fuzz        clang++ libFuzzer targets: each run with -seed=1 for a fixed number of
#                  inputs (time-capped), then the checked-in corpus and regressions replayed
# Each stage prints its wall time; the script stops at the first failing stage.
#   bash scripts/test-all.sh [release|sanitizers|fuzz ...]   (default: all three)
set -euo pipefail
cd "$(dirname "$0")/.."
stages=("$@")
((${#stages[@]})) || stages=(release sanitizers fuzz)

# Inputs per fuzz target and the time cap that guards them: about 45 s each at the rates
# measured on the 2-core build machine (scenario 7 000/s since distributions and
# [calibration] joined the seeds, trajectory 12 500/s, checkpoint 18 000/s with ASan +
# UBSan); run_files about 35 s at 25 000/s.
fuzz_runs_scenario=${BROWNFLOC_FUZZ_RUNS_SCENARIO:-320000}
fuzz_runs_trajectory=${BROWNFLOC_FUZZ_RUNS_TRAJECTORY:-560000}
fuzz_runs_checkpoint=${BROWNFLOC_FUZZ_RUNS_CHECKPOINT:-800000}
fuzz_runs_run_files=${BROWNFLOC_FUZZ_RUNS_RUN_FILES:-875000}
fuzz_time_cap_s=60

stage_release() {
  cmake --workflow --preset ci
}

stage_sanitizers() {
  cmake --preset asan
  cmake --build --preset asan
  ctest --preset asan -LE slow
}

run_fuzzer() {  # run_fuzzer NAME RUNS SEED_FILES...
  local name=$1 runs=$2
  shift 2
  local work
  work=$(mktemp -d)
  cp "$@" "$work"/ 2>/dev/null || true
  [ -d "tests/fuzz/corpus/$name" ] && cp tests/fuzz/corpus/"$name"/* "$work"/ 2>/dev/null || true
  echo "fuzz: $name, $runs inputs from seed 1 (cap ${fuzz_time_cap_s} s)"
  local log=$work.log status=0
  "build-fuzz/bin/${name}_fuzz" -seed=1 -runs="$runs" -max_total_time="$fuzz_time_cap_s" -malloc_limit_mb=256 \
    -print_final_stats=1 -artifact_prefix="$work.crash-" "$work" > "$log" 2>&1 || status=$?
  grep -E '^stat::(number_of_executed_units|average_exec_per_sec)' "$log" || true
  if [ "$status" -ne 0 ]; then
    echo "fuzz: $name found a failing input (kept as $work.crash-*); add it to tests/fuzz/regressions/$name/" >&2
    tail -40 "$log" >&2
    return 1
  fi
  rm -rf "$work" "$log"
  # Replay what is checked in: the corpus and every input that once crashed.
  local replay=()
  for dir in "tests/fuzz/corpus/$name" "tests/fuzz/regressions/$name"; do
    [ -d "$dir" ] && replay+=("$dir"/*)
  done
  if ((${#replay[@]})); then
    "build-fuzz/bin/${name}_fuzz" -runs=1 "${replay[@]}" > /dev/null 2>&1 || {
      echo "fuzz: $name fails on a checked-in input" >&2
      "build-fuzz/bin/${name}_fuzz" -runs=1 "${replay[@]}" 2>&1 | tail -20 >&2
      return 1
    }
  fi
}

stage_fuzz() {
  cmake --preset fuzz
  cmake --build --preset fuzz
  # A crash makes libFuzzer exit non-zero; `set -e` would stop at the grep, so check status.
  local status=0
  run_fuzzer scenario "$fuzz_runs_scenario" scenarios/*.toml tests/cli/bad/*.toml || status=1
  run_fuzzer trajectory "$fuzz_runs_trajectory" tests/trajectory/data/*.bftraj || status=1
  run_fuzzer checkpoint "$fuzz_runs_checkpoint" || status=1
  run_fuzzer run_files "$fuzz_runs_run_files" || status=1
  return $status
}

# Budgets on the 2-core CI machine [s]: release 15 min, sanitizers 10 min, fuzz 5 min.
declare -A budget_s=([release]=900 [sanitizers]=600 [fuzz]=300)
summary=""
for stage in "${stages[@]}"; do
  start=$(date +%s)
  echo "=== stage $stage ==="
  "stage_$stage"
  took=$(( $(date +%s) - start ))
  echo "=== stage $stage: $took s ==="
  summary+="$stage ${took} s (budget ${budget_s[$stage]} s); "
done
echo "stage times: ${summary%; }"
