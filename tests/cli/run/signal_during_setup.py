#!/usr/bin/env python3
"""A signal during set-up (the run issue's "Signals": the flag is checked in long set-up
loops, not only between steps): SIGINT while a large run is still placing its particles
ends it within seconds with exit 130, says nothing was written, and leaves no run
directory; SIGTERM likewise exits 143. Placing 4e6 particles takes about 15 s on one core
of the build machine, so an exit within 5 s of the signal shows the placement loop listened.

Usage: signal_during_setup.py BROWNFLOC_EXE SCENARIO
"""
import os
import signal
import subprocess
import sys
import tempfile
import time


def main():
    exe, scenario = sys.argv[1], sys.argv[2]
    problems = []
    with tempfile.TemporaryDirectory(prefix="brownfloc-setup-signal-") as scratch:
        for sig, code in ((signal.SIGINT, 130), (signal.SIGTERM, 143)):
            directory = os.path.join(scratch, sig.name)
            run = subprocess.Popen([exe, "run", scenario, "--set", "run.particles=4000000", "-o", directory,
                                    "--threads", "1"], stdout=subprocess.DEVNULL, stderr=subprocess.PIPE,
                                   text=True)
            time.sleep(1.5)
            sent = time.time()
            run.send_signal(sig)
            try:
                _, err = run.communicate(timeout=60)
            except subprocess.TimeoutExpired:
                run.kill()
                run.communicate()
                problems.append(f"{sig.name}: still running 60 s after the signal")
                continue
            waited = time.time() - sent
            if run.returncode != code or "interrupted during set-up; nothing was written" not in err:
                problems.append(f"{sig.name}: exit {run.returncode} (expected {code}): {err.strip()}")
            if waited > 5.0:
                problems.append(f"{sig.name}: exited {waited:.1f} s after the signal (limit 5 s)")
            if os.path.exists(directory):
                problems.append(f"{sig.name}: the run directory was created: {os.listdir(directory)}")
            print(f"{sig.name}: exit {run.returncode} after {waited:.2f} s")
    for p in problems:
        print("FAIL", p)
    print("signal during set-up:", "ok" if not problems else f"{len(problems)} problems")
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
