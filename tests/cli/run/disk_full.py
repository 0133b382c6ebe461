#!/usr/bin/env python3
"""Write failures (the run issue's "Hostile input and write failures"): a run whose disk
fills part-way (the io library's fault seam makes the N-th write fail with ENOSPC), and one
that passes `ulimit -f` (EFBIG, SIGXFSZ ignored), stop with exit 3 and a message naming the
path and the system's reason; the trajectory still gives its intact frames, the last
checkpoint stays valid, and --resume with room again ends with the same bytes as an
uninterrupted run. A run whose estimated output exceeds the free space warns at the start,
naming the sizes and the directory, and still runs (a test-only hook stands for the free
space: BROWNFLOC_TEST_FREE_BYTES); with room, no warning.

Usage: disk_full.py BROWNFLOC_EXE SCENARIO
"""
import json
import os
import subprocess
import sys
import tempfile

SETS = ["run.particles=800", "run.end_half_lives=3", "output.snapshots=30"]
FILES = ["timeseries.csv", "size_distribution.csv", "clusters.csv", "trajectory.bftraj"]


def run_args(exe, scenario, directory):
    args = [exe, "run", scenario, "-o", directory, "--threads", "1", "--quiet"]
    for s in SETS:
        args += ["--set", s]
    return args


def main():
    exe, scenario = sys.argv[1], sys.argv[2]
    problems = []
    env = dict(os.environ, OMP_WAIT_POLICY="passive", BROWNFLOC_TEST_CHECKPOINT_INTERVAL_S="0.05")
    with tempfile.TemporaryDirectory(prefix="brownfloc-disk-") as scratch:
        straight = os.path.join(scratch, "straight")
        subprocess.run(run_args(exe, scenario, straight), check=True, env=env)
        for label, directory, launch in (
                ("ENOSPC", os.path.join(scratch, "full"),
                 lambda d: subprocess.run(run_args(exe, scenario, d), capture_output=True, text=True,
                                          env=dict(env, BROWNFLOC_TEST_FAIL_WRITE="40"))),
                ("ulimit -f", os.path.join(scratch, "limited"),
                 lambda d: subprocess.run(["bash", "-c", 'ulimit -f 200 && exec "$@"', "bash",
                                           *run_args(exe, scenario, d)], capture_output=True, text=True, env=env))):
            failed = launch(directory)
            reason = "No space left on device" if label == "ENOSPC" else "File too large"
            if failed.returncode != 3 or reason not in failed.stderr or directory not in failed.stderr:
                problems.append(f"{label}: exit {failed.returncode}: {failed.stderr.strip()}")
                continue
            exported = subprocess.run([exe, "export", directory], capture_output=True, text=True, env=env)
            if exported.returncode != 0 or exported.stdout.count("\n") != 801:
                problems.append(f"{label}: the trajectory gives no intact frame: {exported.stderr.strip()}")
            resumed = subprocess.run([exe, "run", "--resume", directory, "--threads", "2", "--quiet"],
                                     capture_output=True, text=True, env=env)
            if resumed.returncode != 0:
                problems.append(f"{label}: resume exit {resumed.returncode}: {resumed.stderr.strip()}")
                continue
            for name in FILES:
                with open(os.path.join(straight, name), "rb") as a, open(os.path.join(directory, name), "rb") as b:
                    if a.read() != b.read():
                        problems.append(f"{label}: {name} differs from the uninterrupted run")
            with open(os.path.join(directory, "summary.json")) as f:
                if json.load(f).get("status") != "complete":
                    problems.append(f"{label}: not complete after the resume")
        for free_bytes, warned in (("1000", True), (str(1 << 50), False)):
            directory = os.path.join(scratch, "space-" + free_bytes)
            done = subprocess.run(run_args(exe, scenario, directory), capture_output=True, text=True,
                                  env=dict(env, BROWNFLOC_TEST_FREE_BYTES=free_bytes))
            said = "warning: the run will write about" in done.stderr and "MB free for " + directory in done.stderr
            if done.returncode != 0 or said != warned:
                problems.append(f"free space {free_bytes} bytes: exit {done.returncode}, warned {said} "
                                f"(expected {warned}): {done.stderr.strip()}")
    for p in problems:
        print("FAIL", p)
    print("write failures:", "ok" if not problems else f"{len(problems)} problems")
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
