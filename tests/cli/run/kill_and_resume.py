#!/usr/bin/env python3
"""Checkpoint and resume (shared/INTERFACES.md; the run issue's "Checkpoint and resume"):

1. A run with a checkpoint after every step gives the same files as one with checkpoints
   only at the start and the end (writing a checkpoint changes nothing in the computation).
2. A run killed with SIGKILL between checkpoints (one thread), resumed on two threads with a
   test-only pause inside its next checkpoint, killed with SIGKILL in that pause, and resumed
   again on one thread, ends with every trajectory byte, timeseries.csv,
   size_distribution.csv, clusters.csv and the state section of the final checkpoint equal
   to the uninterrupted run's, and summary.json equal less the timing fields, status and
   resumes; its frames are numbered 0, 1, 2, ... and their steps rise strictly.
3. SIGTERM is exit 143 with status "interrupted" and a resumable checkpoint; --resume of a
   finished run says "already complete" (exit 0); a scenario.toml edited after the start is
   refused naming the key (exit 2); a damaged checkpoint is exit 2; the run directory may be
   moved between a kill and the resume.

Usage: kill_and_resume.py BROWNFLOC_EXE SCENARIO
"""
import json
import os
import signal
import struct
import subprocess
import sys
import tempfile
import time

SETS = ["run.particles=600", "run.end_half_lives=3", "output.snapshots=30"]
NOT_COMPARED = {"wall_time_s", "particle_steps_per_s", "threads", "status", "resumes"}
FILES = ["timeseries.csv", "size_distribution.csv", "clusters.csv", "trajectory.bftraj", "scenario.toml"]


def command(exe, scenario, directory, threads):
    args = [exe, "run", scenario, "-o", directory, "--threads", str(threads), "--quiet"]
    for s in SETS:
        args += ["--set", s]
    return args


def every(env, interval_s):
    """The environment with the test-only checkpoint interval (the scenario stays the same)."""
    return dict(env, BROWNFLOC_TEST_CHECKPOINT_INTERVAL_S=str(interval_s))


def wait_for(path, timeout_s):
    end = time.time() + timeout_s
    while time.time() < end:
        if os.path.exists(path):
            return True
        time.sleep(0.02)
    return False


def checkpoint_sections(path):
    """The three sections' payloads (tag -> bytes) of a checkpoint file."""
    with open(path, "rb") as f:
        data = f.read()
    at, sections = 16, {}
    while at < len(data):
        tag, length = struct.unpack_from("<IQ", data, at)
        sections[tag] = data[at + 20:at + 20 + length]
        at += 20 + length
    return sections


def frames(path):
    """(frame number, step) of every frame of a trajectory file."""
    with open(path, "rb") as f:
        data = f.read()
    (header_length,) = struct.unpack_from("<Q", data, 16)
    at, out = 32 + header_length, []
    while at + 32 <= len(data):
        sync, _, number, length = struct.unpack_from("<IIQQ", data, at)
        if sync != 0x46524D31:
            raise ValueError(f"no frame marker at byte {at}")
        (step,) = struct.unpack_from("<q", data, at + 32)
        out.append((number, step))
        at += 32 + length
    return out


def compare(a, b, problems, label):
    for name in FILES:
        with open(os.path.join(a, name), "rb") as fa, open(os.path.join(b, name), "rb") as fb:
            if fa.read() != fb.read():
                problems.append(f"{label}: {name} differs")
    with open(os.path.join(a, "summary.json")) as fa, open(os.path.join(b, "summary.json")) as fb:
        sa, sb = json.load(fa), json.load(fb)
    for key in sa:
        if key not in NOT_COMPARED and sa[key] != sb.get(key):
            problems.append(f"{label}: summary.json {key}: {sa[key]!r} against {sb.get(key)!r}")
    state_a = checkpoint_sections(os.path.join(a, "checkpoint.bfckpt")).get(2)
    state_b = checkpoint_sections(os.path.join(b, "checkpoint.bfckpt")).get(2)
    if state_a is None or state_a != state_b:
        problems.append(f"{label}: the state sections of the final checkpoints differ")


def main():
    exe, scenario = sys.argv[1], sys.argv[2]
    problems = []
    env = dict(os.environ, OMP_WAIT_POLICY="passive")
    with tempfile.TemporaryDirectory(prefix="brownfloc-resume-") as scratch:
        straight, each_step, killed = (os.path.join(scratch, n) for n in ("straight", "each-step", "killed"))
        subprocess.run(command(exe, scenario, straight, 1), check=True, env=every(env, 1000))
        subprocess.run(command(exe, scenario, each_step, 2), check=True, env=every(env, 1e-9))
        compare(straight, each_step, problems, "checkpoint every step")

        # SIGKILL between checkpoints: checkpoints every 0.2 s, killed when the trajectory has
        # some frames (not during a checkpoint: the pause hook is not armed).
        run = subprocess.Popen(command(exe, scenario, killed, 1), env=every(env, 0.2))
        trajectory = os.path.join(killed, "trajectory.bftraj")
        full_size = os.path.getsize(os.path.join(straight, "trajectory.bftraj"))
        deadline = time.time() + 300
        while time.time() < deadline and run.poll() is None:
            if os.path.exists(trajectory) and os.path.getsize(trajectory) > 0.3 * full_size:
                break
            time.sleep(0.01)
        if run.poll() is not None:
            problems.append("the first run finished before it could be killed; make the case longer")
        run.send_signal(signal.SIGKILL)
        run.wait()
        # Resume on two threads; SIGKILL inside the pause of its first periodic checkpoint.
        marker = os.path.join(scratch, "paused")
        paused_env = dict(every(env, 0.2), BROWNFLOC_TEST_CHECKPOINT_PAUSE_FILE=marker, BROWNFLOC_TEST_CHECKPOINT_PAUSE_S="30")
        run = subprocess.Popen([exe, "run", "--resume", killed, "--threads", "2", "--quiet"], env=paused_env)
        if not wait_for(marker, 60):
            problems.append("the resumed run never reached a checkpoint")
        run.send_signal(signal.SIGKILL)
        run.wait()
        # SIGTERM of the next resume once it steps (it rewrites summary.json as it starts):
        # exit 143, status interrupted.
        summary_path = os.path.join(killed, "summary.json")
        before = os.stat(summary_path).st_mtime_ns
        run = subprocess.Popen([exe, "run", "--resume", killed, "--threads", "1", "--quiet"], env=env)
        deadline = time.time() + 300
        while time.time() < deadline and run.poll() is None and os.stat(summary_path).st_mtime_ns == before:
            time.sleep(0.01)
        run.send_signal(signal.SIGTERM)
        code = run.wait()
        if code not in (0, 143):
            problems.append(f"SIGTERM: exit {code}, expected 143")
        if code == 143:
            with open(os.path.join(killed, "summary.json")) as f:
                status = json.load(f).get("status")
            if status != "interrupted":
                problems.append(f"SIGTERM: status {status!r}")
        # A run directory may be moved between a kill and the resume.
        moved = killed + "-moved"
        os.rename(killed, moved)
        killed, trajectory = moved, os.path.join(moved, "trajectory.bftraj")
        final = subprocess.run([exe, "run", "--resume", killed, "--threads", "1", "--quiet"], env=env)
        if final.returncode != 0:
            problems.append(f"final resume: exit {final.returncode}")
        compare(straight, killed, problems, "killed and resumed")
        with open(os.path.join(killed, "summary.json")) as f:
            summary = json.load(f)
        if summary.get("status") != "complete" or summary.get("resumes", 0) < 2:
            problems.append(f"status {summary.get('status')!r}, resumes {summary.get('resumes')}")
        numbered = frames(trajectory)
        if [n for n, _ in numbered] != list(range(len(numbered))):
            problems.append("frame numbers are not 0, 1, 2, ...")
        if any(b <= a for (_, a), (_, b) in zip(numbered, numbered[1:])):
            problems.append("frame steps do not rise strictly")

        again = subprocess.run([exe, "run", "--resume", killed], capture_output=True, text=True, env=env)
        if again.returncode != 0 or "already complete" not in again.stderr:
            problems.append(f"--resume of a finished run: exit {again.returncode}: {again.stderr}")

        # An edited scenario.toml, then a damaged checkpoint, refused with exit 2. The
        # interrupted run needs an unfinished checkpoint: SIGTERM right after step 0.
        edited = os.path.join(scratch, "edited")
        run = subprocess.Popen(command(exe, scenario, edited, 1), env=env)
        wait_for(os.path.join(edited, "checkpoint.bfckpt"), 60)
        run.send_signal(signal.SIGTERM)
        run.wait()
        path = os.path.join(edited, "scenario.toml")
        with open(path) as f:
            text = f.read()
        with open(path, "w") as f:
            f.write(text.replace("concentration_mM = 10", "concentration_mM = 20"))
        refused = subprocess.run([exe, "run", "--resume", edited], capture_output=True, text=True, env=env)
        if refused.returncode != 2 or "[electrolyte] concentration_mM" not in refused.stderr:
            problems.append(f"edited scenario: exit {refused.returncode}: {refused.stderr}")
        with open(path, "w") as f:
            f.write(text)
        checkpoint = os.path.join(edited, "checkpoint.bfckpt")
        with open(checkpoint, "r+b") as f:
            f.seek(100)
            byte = f.read(1)
            f.seek(100)
            f.write(bytes([byte[0] ^ 0x10]))
        damaged = subprocess.run([exe, "run", "--resume", edited], capture_output=True, text=True, env=env)
        if damaged.returncode != 2 or "CRC" not in damaged.stderr:
            problems.append(f"damaged checkpoint: exit {damaged.returncode}: {damaged.stderr}")
    for p in problems:
        print("FAIL", p)
    print("kill and resume:", "ok" if not problems else f"{len(problems)} problems")
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
