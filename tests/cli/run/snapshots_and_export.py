#!/usr/bin/env python3
"""Snapshots and `brownfloc export` (shared/INTERFACES.md, trajectory section):
- the snapshot schedule never changes the run: two runs with 2 and 9 snapshots (float32 and
  float64 positions) write the same timeseries.csv, size_distribution.csv and clusters.csv
  and the same summary.json less timing, trajectory and scenario-hash fields;
- summary.json counts the frames; `export --frame last` of both runs gives the same clusters
  and, within float32 rounding, the same positions; frame 0 has every particle on its own;
- a frame that does not exist is exit 2; `export | head -1` ends quietly with exit 0; `-o` to
  a symbolic link is refused (exit 3) and leaves the link's target alone.

Usage: snapshots_and_export.py BROWNFLOC_EXE SCENARIO
"""
import csv
import io
import json
import os
import subprocess
import sys
import tempfile

NOT_COMPARED = {"wall_time_s", "particle_steps_per_s", "threads", "trajectory_bytes", "trajectory_frames",
                "scenario_sha256"}


def run(exe, scenario, directory, *sets):
    args = [exe, "run", scenario, "-o", directory, "--threads", "1", "--quiet"]
    for s in sets:
        args += ["--set", s]
    subprocess.run(args, check=True)


def export(exe, directory, *extra):
    return subprocess.run([exe, "export", directory, *extra], capture_output=True, text=True)


def rows(text):
    return list(csv.DictReader(io.StringIO(text)))


def main():
    exe, scenario = sys.argv[1], sys.argv[2]
    problems = []
    with tempfile.TemporaryDirectory(prefix="brownfloc-snapshots-") as scratch:
        a, b = os.path.join(scratch, "a"), os.path.join(scratch, "b")
        run(exe, scenario, a, "output.snapshots=2")
        run(exe, scenario, b, "output.snapshots=9", 'output.trajectory_precision="float64"')
        for name in ("timeseries.csv", "size_distribution.csv", "clusters.csv"):
            with open(os.path.join(a, name), "rb") as fa, open(os.path.join(b, name), "rb") as fb:
                if fa.read() != fb.read():
                    problems.append(f"{name} depends on the snapshot schedule")
        with open(os.path.join(a, "summary.json")) as fa, open(os.path.join(b, "summary.json")) as fb:
            sa, sb = json.load(fa), json.load(fb)
        for key in sa:
            if key not in NOT_COMPARED and sa[key] != sb.get(key):
                problems.append(f"summary.json {key} depends on the snapshot schedule")
        if (sa.get("trajectory_frames"), sb.get("trajectory_frames")) != (2, 9):
            problems.append(f"trajectory_frames {sa.get('trajectory_frames')} and {sb.get('trajectory_frames')}")

        last_a, last_b = export(exe, a), export(exe, b, "--frame", "last")
        if last_a.returncode or last_b.returncode:
            problems.append(f"export exit {last_a.returncode}, {last_b.returncode}: {last_a.stderr}{last_b.stderr}")
        else:
            ra, rb = rows(last_a.stdout), rows(last_b.stdout)
            if len(ra) != len(rb) or not ra:
                problems.append(f"export rows {len(ra)} and {len(rb)}")
            for x, y in zip(ra, rb):
                if x["cluster"] != y["cluster"] or x["spans_box"] != y["spans_box"] or x["species"] != y["species"]:
                    problems.append(f"particle {x['id']}: cluster {x['cluster']} against {y['cluster']}")
                    break
                for c in ("x_nm", "y_nm", "z_nm"):
                    if abs(float(x[c]) - float(y[c])) > 1e-6 * max(1.0, abs(float(y[c]))):
                        problems.append(f"particle {x['id']} {c}: {x[c]} (float32) against {y[c]} (float64)")
        first = export(exe, b, "--frame", "0")
        if first.returncode or any(r["cluster"] != r["id"] for r in rows(first.stdout)):
            problems.append("frame 0 does not hold every particle on its own")

        missing = export(exe, b, "--frame", "9")
        if missing.returncode != 2 or "no intact frame of that number" not in missing.stderr:
            problems.append(f"--frame 9 of 9 frames: exit {missing.returncode}: {missing.stderr}")

        head = subprocess.run(f"'{exe}' export '{b}' | head -1", shell=True, capture_output=True, text=True,
                              executable="/bin/bash")
        if head.stdout != "id,species,radius_nm,x_nm,y_nm,z_nm,cluster,spans_box\n" or head.stderr:
            problems.append(f"export | head -1: {head.stdout!r} {head.stderr!r}")

        target = os.path.join(scratch, "target.csv")
        with open(target, "w") as f:
            f.write("keep\n")
        link = os.path.join(scratch, "link.csv")
        os.symlink(target, link)
        refused = export(exe, b, "-o", link)
        with open(target) as f:
            kept = f.read() == "keep\n"
        if refused.returncode != 3 or not kept:
            problems.append(f"-o to a symbolic link: exit {refused.returncode}, target kept {kept}: {refused.stderr}")
    for p in problems:
        print("FAIL", p)
    print("snapshots and export:", "ok" if not problems else f"{len(problems)} problems")
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
