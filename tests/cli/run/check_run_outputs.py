#!/usr/bin/env python3
"""Smoke test of `brownfloc run SCENARIO --json`: exit 0; standard output is the JSON of
summary.json; summary.json holds every key shared/INTERFACES.md lists (no key twice, finite
numbers, a null only with a `<key>_note`); the CSV headers hold the listed columns in order;
no CSV value is nan or inf; the trajectory file is there with the frames and bytes summary.json
gives; no temporary file is left and nobody holds the .lock at the end.

Usage: check_run_outputs.py BROWNFLOC_EXE SCENARIO [--set ...]
"""
import csv
import fcntl
import json
import math
import os
import subprocess
import sys
import tempfile

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), ".."))
from check_json_keys import check_values  # noqa: E402

SUMMARY_KEYS = """debye_length_nm barrier_kT capture_gap_nm cutoff_gap_nm stability_ratio
stability_ratio_at_capture half_life_fast_s particles box_length_nm number_density_per_m3 seed steps
particle_steps time_step_s time_step_min_s time_step_max_s time_step_rule predicted_steps
measured_rate_constant_m3_per_s measured_rate_constant_ci95_m3_per_s rate_fit_window_s rate_fit_events
measured_stability_ratio measured_stability_ratio_ci95 fractal_dimension fractal_dimension_error
fractal_prefactor fractal_dimension_note bonded_at_start percolating gel_time_s pairs status resumes
brownfloc_version scenario_sha256 wall_time_s particle_steps_per_s threads trajectory_file trajectory_bytes
trajectory_frames""".split()
TIMESERIES_COLUMNS = ("time_s,time_half_lives,clusters,monomers,doublets,triplets,mean_size,weight_mean_size,"
                      "largest,smoluchowski_clusters,smoluchowski_clusters_transient").split(",")
CLUSTERS_PREFIX = "cluster_id,size,radius_of_gyration_nm,hydrodynamic_radius_nm,spans_box".split(",")
SIZE_DISTRIBUTION_COLUMNS = ["time_s", "size", "count"]


def no_duplicates(pairs):
    keys = [k for k, _ in pairs]
    duplicates = sorted({k for k in keys if keys.count(k) > 1})
    if duplicates:
        raise ValueError(f"duplicate keys: {', '.join(duplicates)}")
    return dict(pairs)


def is_subsequence(wanted, columns):
    it = iter(columns)
    return all(any(c == w for c in it) for w in wanted)


def main():
    exe, scenario, extra = sys.argv[1], sys.argv[2], sys.argv[3:]
    problems = []
    with tempfile.TemporaryDirectory(prefix="brownfloc-run-") as scratch:
        out = os.path.join(scratch, "run")
        result = subprocess.run([exe, "run", scenario, "-o", out, "--json", "--threads", "1", *extra],
                                capture_output=True, text=True)
        if result.returncode != 0:
            print(f"FAIL exit {result.returncode}: {result.stderr}")
            return 1
        with open(os.path.join(out, "summary.json")) as f:
            text = f.read()
        summary = json.loads(text, object_pairs_hook=no_duplicates)
        if json.loads(result.stdout, object_pairs_hook=no_duplicates) != summary:
            problems.append("--json output differs from summary.json")
        problems += [f"summary.json: missing {k}" for k in SUMMARY_KEYS if k not in summary]
        check_values(summary, "summary.json: ", problems)
        if summary.get("status") != "complete":
            problems.append(f"summary.json: status {summary.get('status')!r}")
        for name, wanted, exact_prefix in (("timeseries.csv", TIMESERIES_COLUMNS, False),
                                           ("clusters.csv", CLUSTERS_PREFIX, True),
                                           ("size_distribution.csv", SIZE_DISTRIBUTION_COLUMNS, True)):
            with open(os.path.join(out, name), newline="") as f:
                rows = list(csv.reader(f))
            header = rows[0] if rows else []
            ok = header[:len(wanted)] == wanted if exact_prefix else is_subsequence(wanted, header)
            if name == "size_distribution.csv":
                ok = header == wanted
            if not ok:
                problems.append(f"{name}: header {','.join(header)}")
            if len(rows) < 2:
                problems.append(f"{name}: no data rows")
            for r, row in enumerate(rows[1:], start=2):
                if len(row) != len(header):
                    problems.append(f"{name}:{r}: {len(row)} fields, header has {len(header)}")
                for value in row:
                    try:
                        if not math.isfinite(float(value)):
                            problems.append(f"{name}:{r}: {value}")
                    except ValueError:
                        pass  # empty (no value) or true/false
        trajectory = os.path.join(out, str(summary.get("trajectory_file")))
        if not os.path.isfile(trajectory) or os.path.getsize(trajectory) != summary.get("trajectory_bytes"):
            problems.append(f"trajectory: {trajectory} missing or not of trajectory_bytes")
        if not summary.get("trajectory_frames", 0) >= 2:
            problems.append(f"trajectory_frames: {summary.get('trajectory_frames')}")
        leftovers = [n for n in os.listdir(out) if ".tmp-" in n]
        if leftovers:
            problems.append(f"temporary files left: {leftovers}")
        with open(os.path.join(out, ".lock"), "rb") as lock:
            try:
                fcntl.flock(lock, fcntl.LOCK_EX | fcntl.LOCK_NB)
            except OSError:
                problems.append(".lock still held after the run ended")
    for p in problems[:40]:
        print("FAIL", p)
    print(f"run {scenario}: {'ok' if not problems else f'{len(problems)} problems'}")
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
