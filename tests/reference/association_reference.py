#!/usr/bin/env python3
"""Independent check of the secondary-minimum association constants in the C++ tests.

K = 4 pi int_well (exp(-U/kT) - 1) r^2 dr, from the barrier maximum outwards, for two spheres
in NaCl at 25 C: full Hamaker (1937) van der Waals and the linear superposition double layer
(gamma = tanh(e psi / 4kT), Gregory 1975), re-implemented from the published formulas (the
parameters via dlvo_reference.Pair) and integrated with scipy.integrate.quad (QUADPACK) out to
infinity. Nothing of brownfloc's is used.

The expected values live once, in tests/sim/association_constant.test.cpp (the lines tagged
`// scipy-reference`); the Catch2 test checks the C++ result against them and this script checks
scipy against the same lines, so a drift on either side fails a test.

Usage: association_reference.py TEST_SOURCE     (exit 0 when every case agrees)
       association_reference.py --print         (print the values to paste into the test)
"""
import math
import os
import re
import sys

import numpy as np
from scipy import integrate, optimize

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from dlvo_reference import Pair  # noqa: E402  (kappa, kT and the double-layer prefactor)

MIN_GAP = 0.2e-9
# (label, a1, a2, psi1, psi2, NaCl mM); Hamaker constant 1e-20 J, 298.15 K.
CASES = [
    ("500 nm, -50 mV, 100 mM", 500e-9, 500e-9, -0.050, -0.050, 100.0),
    ("500 nm, -50 mV, 10 mM", 500e-9, 500e-9, -0.050, -0.050, 10.0),
    ("300/800 nm, -50/-40 mV, 20 mM", 300e-9, 800e-9, -0.050, -0.040, 20.0),
]
# Both sides integrate to ~1e-10 relative and locate the barrier to ~1e-9 of its gap (which
# moves K by < 1e-12: the integrand there is r^2 against a well of width ~ nm).
TOLERANCE = 1e-8


def vdw_kT(pair, h):
    """Hamaker (1937): U = -(A/6) [2a1a2/p + 2a1a2/q + ln(p/q)], p = r^2-(a1+a2)^2, q = r^2-(a1-a2)^2.
    With x = 4 a1 a2 / q (so p = q (1 - x)) the bracket is x/2 + x/(2(1-x)) + ln(1-x); its terms
    cancel to O(x^3) far out, where the series sum_{n>=3} (1/2 - 1/n) x^n is used instead."""
    a1, a2 = pair.a1, pair.a2
    r = a1 + a2 + h
    q = r * r - (a1 - a2) ** 2
    x = 4 * a1 * a2 / q
    if x > 0.05:
        p = h * (2 * (a1 + a2) + h)
        bracket = 2 * a1 * a2 / p + 2 * a1 * a2 / q + math.log(p / q)
    else:
        bracket = sum((0.5 - 1.0 / n) * x**n for n in range(3, 40))  # 0.05^40 ~ 1e-52
    return -pair.A / 6 * bracket / pair.kT


def u_kT(pair, h):
    return vdw_kT(pair, h) + pair.dl / (pair.a1 + pair.a2 + h) * math.exp(-pair.kappa * h) / pair.kT


def extremum(pair, lo, hi, sign):
    """Bounded scalar optimisation in log h of sign * U (sign = -1: maximum)."""
    res = optimize.minimize_scalar(lambda lh: sign * u_kT(pair, math.exp(lh)), bounds=(math.log(lo), math.log(hi)),
                                   method="bounded", options={"xatol": 1e-12})
    return math.exp(res.x)


def association_m3(pair):
    gaps = np.geomspace(MIN_GAP, 60 / pair.kappa, 6000)
    u = np.array([u_kT(pair, h) for h in gaps])
    i = int(np.argmax(u))
    h_max = extremum(pair, gaps[max(i - 1, 0)], gaps[i + 1], -1)
    j = i + int(np.argmin(u[i:]))
    h_min = extremum(pair, gaps[j - 1], gaps[j + 1], +1)
    s = pair.a1 + pair.a2

    def f(h):
        return math.expm1(-u_kT(pair, h)) * (s + h) ** 2

    h_far = 20 * s
    points = sorted(set(np.geomspace(h_max, h_far, 200)[1:-1].tolist() + [h_min]))
    near, _ = integrate.quad(f, h_max, h_far, points=points, limit=4000, epsabs=0, epsrel=1e-12)
    # From 20 to 2000 (a1+a2) only the r^-6 van der Waals tail is left (~1e-5 of K here); past
    # that -U r^3/3 (exp(-U) - 1 = -U for U ~ 1e-20 kT) adds ~1e-17 of K, kept for form's sake.
    h_end = 2000 * s
    far, _ = integrate.quad(f, h_far, h_end, points=np.geomspace(h_far, h_end, 40)[1:-1], limit=400,
                            epsabs=0, epsrel=1e-10)
    far += -u_kT(pair, h_end) * (s + h_end) ** 3 / 3
    return 4 * math.pi * (near + far), h_max, h_min, u_kT(pair, h_min)


def expected_from(test_source):
    text = open(test_source).read()
    values = re.findall(r"([0-9.]+e[-+]?[0-9]+),\s*// scipy-reference", text)
    return [float(v) for v in values]


def main():
    results = []
    for label, a1, a2, psi1, psi2, c_mM in CASES:
        k, h_max, h_min, u_min = association_m3(Pair(a1, a2, 1e-20, psi1, psi2, c_mM))
        results.append(k)
        print(f"{label:32s} K = {k:.12e} m^3  barrier at {h_max * 1e9:.6f} nm, minimum {u_min:.6f} kT "
              f"at {h_min * 1e9:.6f} nm")
    if sys.argv[1:] == ["--print"]:
        return 0
    expected = expected_from(sys.argv[1])
    if len(expected) != len(results):
        print(f"FAIL found {len(expected)} `// scipy-reference` values in {sys.argv[1]}, expected {len(results)}")
        return 1
    failures = 0
    for (label, *_), k, e in zip(CASES, results, expected):
        err = abs(k / e - 1)
        ok = err <= TOLERANCE
        failures += not ok
        print(f"{'ok  ' if ok else 'FAIL'} {label:32s} scipy {k:.12e}  test constant {e:.12e}  rel err {err:.2e}")
    print(f"{len(results) - failures} passed, {failures} failed")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
