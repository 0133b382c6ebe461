#!/usr/bin/env python3
"""`brownfloc run` writes the same run directory with one thread and with two: every file
byte for byte, and summary.json key for key and bit for bit once the timing fields are
removed (shared/INTERFACES.md: everything in the run directory is a pure function of
scenario, seed and binary, except wall_time_s, particle_steps_per_s and threads, and status,
resumes, date_utc and host, which do not differ between two complete runs here). The .lock
file holds the PID of the process that wrote the directory and is not compared; of the
checkpoint, the state section is compared (its bookkeeping section holds the wall time).

Usage: same_bits_any_threads.py BROWNFLOC_EXE SCENARIO [--set ...]
"""
import json
import os
import struct
import subprocess
import sys
import tempfile

TIMING_KEYS = {"wall_time_s", "particle_steps_per_s", "threads"}


def no_duplicates(pairs):
    keys = [k for k, _ in pairs]
    duplicates = sorted({k for k in keys if keys.count(k) > 1})
    if duplicates:
        raise ValueError(f"duplicate keys in summary.json: {', '.join(duplicates)}")
    return dict(pairs)


def state_section(data):
    """The payload of section 2 (state) of a checkpoint (layout in sim/include/sim/checkpoint.hpp)."""
    at = 16
    while at + 20 <= len(data):
        tag, length = struct.unpack_from("<IQ", data, at)
        if tag == 2:
            return data[at + 20:at + 20 + length]
        at += 20 + length
    return None


def run(exe, scenario, extra, directory, threads):
    result = subprocess.run([exe, "run", scenario, "-o", directory, "--threads", str(threads), "--quiet", *extra],
                            capture_output=True, text=True)
    if result.returncode != 0:
        raise RuntimeError(f"--threads {threads}: exit {result.returncode}: {result.stderr}")


def main():
    exe, scenario, extra = sys.argv[1], sys.argv[2], sys.argv[3:]
    problems = []
    with tempfile.TemporaryDirectory(prefix="brownfloc-threads-") as scratch:
        one, two = os.path.join(scratch, "one"), os.path.join(scratch, "two")
        run(exe, scenario, extra, one, 1)
        run(exe, scenario, extra, two, 2)
        files_one, files_two = sorted(os.listdir(one)), sorted(os.listdir(two))
        if files_one != files_two:
            problems.append(f"different files: {files_one} against {files_two}")
        if "summary.json" not in files_one:
            problems.append("no summary.json")
        for name in sorted(set(files_one) & set(files_two) - {".lock"}):
            with open(os.path.join(one, name), "rb") as f:
                a = f.read()
            with open(os.path.join(two, name), "rb") as f:
                b = f.read()
            if name == "summary.json":
                # Python's float is an IEEE double and json reads the shortest round-trip
                # form back to the same bits, so == on the parsed values is a bit comparison.
                sa = json.loads(a, object_pairs_hook=no_duplicates)
                sb = json.loads(b, object_pairs_hook=no_duplicates)
                if sa.get("threads") != 1 or sb.get("threads") != 2:
                    problems.append(f"threads recorded as {sa.get('threads')} and {sb.get('threads')}")
                for key in TIMING_KEYS:
                    sa.pop(key, None)
                    sb.pop(key, None)
                if list(sa) != list(sb):
                    problems.append("summary.json: keys differ or are in another order")
                for key in sa:
                    if sa[key] != sb.get(key):
                        problems.append(f"summary.json: {key}: {sa[key]!r} with 1 thread, {sb.get(key)!r} with 2")
            elif name == "checkpoint.bfckpt":
                if state_section(a) != state_section(b):
                    problems.append("checkpoint.bfckpt: the state sections differ")
            elif a != b:
                problems.append(f"{name} differs ({len(a)} and {len(b)} bytes)")
        print(f"compared {len(files_one)} files: {', '.join(files_one)}")
    for p in problems:
        print("FAIL", p)
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
