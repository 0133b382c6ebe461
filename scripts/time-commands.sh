#!/usr/bin/env bash
# Wall time of `brownfloc dlvo` and `brownfloc ccc` end to end (process start to exit) on
# every demo scenario: the median of 9 runs each. Target: under 100 ms each.
set -euo pipefail
bin=${1:-build/bin/brownfloc}
for command in dlvo ccc; do
  for scenario in scenarios/*.toml; do
    times=()
    for _ in $(seq 9); do
      start=$(date +%s%N)
      "$bin" "$command" "$scenario" --json >/dev/null
      times+=($(( ($(date +%s%N) - start) / 1000 )))
    done
    median=$(printf '%s\n' "${times[@]}" | sort -n | sed -n 5p)
    awk -v c="$command" -v s="$(basename "$scenario")" -v us="$median" 'BEGIN { printf "%-5s %-40s median %6.1f ms\n", c, s, us / 1000 }'
  done
done
