#!/usr/bin/env python3
"""Independent check of `brownfloc dlvo --json` against scipy.

Re-implements, from the published formulas and nothing of brownfloc's, the interaction of
two spheres in a z:z salt (Hamaker 1937 van der Waals, textbook form; linear superposition
double layer with gamma = tanh(ze psi / 4kT), Gregory 1975) and integrates the Fuchs (1934)
stability ratio with scipy.integrate.quad (QUADPACK), with and without the Honig et al.
(1971) correction. Water properties: Malmberg & Maryott (1956), Patek et al. (2009).
Cases: barriers from about 5 to 40 kT and an unequal pair.

Usage: dlvo_reference.py BROWNFLOC_EXE SCENARIO_DIR   (exit 0 when every case agrees)
"""
import json
import math
import subprocess
import sys

import numpy as np
from scipy import integrate, optimize

KB, E, NA, EPS0 = 1.380649e-23, 1.602176634e-19, 6.02214076e23, 8.8541878128e-12


def water(temperature_K):
    t = temperature_K - 273.15
    eps_r = 87.740 - 0.40008 * t + 9.398e-4 * t**2 - 1.410e-6 * t**3
    a, b = (280.68, 511.45, 61.131, 0.45903), (-1.9, -7.7, -19.6, -40.0)
    eta = 1e-6 * sum(ai * (temperature_K / 300.0) ** bi for ai, bi in zip(a, b))
    return eps_r, eta


class Pair:
    def __init__(self, a1, a2, hamaker, psi1, psi2, salt_mM, z=1, temperature_K=298.15):
        self.a1, self.a2, self.A = a1, a2, hamaker
        eps_r, _ = water(temperature_K)
        self.eps = EPS0 * eps_r
        self.kT = KB * temperature_K
        ionic_strength = 0.5 * (salt_mM * z * z * 2)  # mol/m^3
        self.kappa = math.sqrt(2 * NA * E * E * ionic_strength / (self.eps * self.kT))
        g1 = math.tanh(z * E * psi1 / (4 * self.kT))
        g2 = math.tanh(z * E * psi2 / (4 * self.kT))
        self.dl = 64 * math.pi * self.eps * (self.kT / (z * E)) ** 2 * g1 * g2 * a1 * a2

    def u_kT(self, h):
        a1, a2 = self.a1, self.a2
        r = a1 + a2 + h
        p = h * (2 * (a1 + a2) + h)          # r^2 - (a1+a2)^2 without cancellation
        q = r * r - (a1 - a2) ** 2
        vdw = -self.A / 6 * (2 * a1 * a2 / p + 2 * a1 * a2 / q + math.log(p / q))
        return (vdw + self.dl / r * math.exp(-self.kappa * h)) / self.kT

    def beta(self, h):
        u = h * (self.a1 + self.a2) / (2 * self.a1 * self.a2)
        return (6 * u * u + 13 * u + 2) / (6 * u * u + 4 * u)


def log10_w(pair, min_gap, hydrodynamic):
    s = pair.a1 + pair.a2
    rc = s + min_gap
    # barrier location and height, for scaling and as a break point
    gaps = np.geomspace(min_gap, 50 / pair.kappa, 4000)
    u = np.array([pair.u_kT(h) for h in gaps])
    k = int(np.argmax(u))
    umax = max(u[k], 0.0)
    hmax = gaps[k]

    def f(h):
        b = pair.beta(h) if hydrodynamic else 1.0
        return rc * b * math.exp(pair.u_kT(h) - umax) / (s + h) ** 2

    h_far = 50 / pair.kappa + 10 * s
    # QUADPACK's first nodes on a long interval sit nanometres from its ends, wider than a
    # barrier; 400 geometric break points (plus the barrier) resolve every feature.
    pts = sorted(set(np.geomspace(min_gap, h_far, 400)[1:-1].tolist() + ([hmax] if min_gap < hmax < h_far else [])))
    near, _ = integrate.quad(f, min_gap, h_far, points=pts, limit=4000, epsabs=0, epsrel=1e-11)
    mid, _ = integrate.quad(f, h_far, 100 * h_far, limit=500, epsabs=0, epsrel=1e-11)
    # Beyond 100 h_far (> 200 um), |U| < 1e-9 kT and beta - 1 < 1e-3, and this piece is < 1e-3
    # of W: taking U = 0, beta = 1 there errs by < 1e-6 relative.
    tail = mid + rc * math.exp(-umax) / (s + 100 * h_far)
    return (umax + math.log(near + tail)) / math.log(10), umax, hmax


def barrier(pair, min_gap, guess):
    res = optimize.minimize_scalar(lambda lh: -pair.u_kT(math.exp(lh)),
                                   bounds=(math.log(min_gap), math.log(50 / pair.kappa)),
                                   method="bounded", options={"xatol": 1e-12})
    return -res.fun, math.exp(res.x)


def run(exe, scenario, sets):
    cmd = [exe, "dlvo", scenario, "--json"]
    for s in sets:
        cmd += ["--set", s]
    out = subprocess.run(cmd, check=True, capture_output=True, text=True).stdout
    return json.loads(out)


def main():
    exe, scenario_dir = sys.argv[1], sys.argv[2]
    latex = f"{scenario_dir}/001-latex-in-salt.toml"
    failures = 0
    barriers_seen = []
    cases = []
    # (label, Pair, scenario, --set list, pair index in JSON)
    for c_mM, psi_mV in ((200, -30), (150, -30), (100, -30), (60, -30), (60, -35)):
        sets = [f"electrolyte.concentration_mM={c_mM}", f"particle.surface_potential_mV={psi_mV}"]
        cases.append((f"latex 100 nm, {c_mM} mM, {psi_mV} mV", Pair(100e-9, 100e-9, 1e-20, psi_mV * 1e-3,
                      psi_mV * 1e-3, c_mM), latex, sets, 0))
    hetero = f"{scenario_dir}/003-oxide-heteroaggregation.toml"
    sets = ["species.1.radius_nm=60", "species.1.surface_potential_mV=-35", "species.1.hamaker_J=1e-20",
            "species.2.radius_nm=250", "species.2.surface_potential_mV=-25", "species.2.hamaker_J=1e-20",
            "electrolyte.salt=\"NaCl\"", "electrolyte.concentration_mM=30", "medium.temperature_C=25"]
    cases.append(("unequal 60/250 nm, 30 mM", Pair(60e-9, 250e-9, 1e-20, -0.035, -0.025, 30), hetero, sets, 1))

    for label, pair, scenario, sets, index in cases:
        got = run(exe, scenario, sets)["pairs"][index]
        min_gap = 0.2e-9
        ub, hb = barrier(pair, min_gap, None)
        w, _, _ = log10_w(pair, min_gap, False)
        wh, _, _ = log10_w(pair, min_gap, True)
        barriers_seen.append(ub)
        # Tolerances: barrier height 1e-6 kT and position 1e-6 relative (both optimisers are
        # far tighter); log10 W 1e-6 (both quadratures run at 1e-11 relative).
        checks = [("barrier_kT", got["barrier_kT"], ub, 1e-6, "abs"),
                  ("barrier_gap_nm", got["barrier_gap_nm"], hb * 1e9, 1e-5, "rel"),
                  ("log10_stability_ratio", got["log10_stability_ratio"], w, 1e-6, "abs"),
                  ("log10_stability_ratio_hydrodynamic", got["log10_stability_ratio_hydrodynamic"], wh, 1e-6, "abs")]
        for key, value, ref, tol, kind in checks:
            err = abs(value - ref) if kind == "abs" else abs(value / ref - 1)
            ok = err <= tol
            failures += not ok
            print(f"{'ok  ' if ok else 'FAIL'} {label:28s} {key:36s} brownfloc {value:.10g}  scipy {ref:.10g}  "
                  f"{kind} err {err:.2e}")
    if not (min(barriers_seen) < 8 and max(barriers_seen) > 38):
        print(f"FAIL the cases must span 5-40 kT barriers; saw {min(barriers_seen):.1f}-{max(barriers_seen):.1f}")
        failures += 1
    print(f"{len(cases) * 4 - failures} passed, {failures} failed")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
