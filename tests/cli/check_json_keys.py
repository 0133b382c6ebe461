#!/usr/bin/env python3
"""End-to-end check of `brownfloc dlvo|ccc|shelf-life --json` on one scenario: the output is one JSON
document holding every key the project's INTERFACES promise, numbers are finite, and a null
always comes with a `<key>_note`.

Usage: check_json_keys.py dlvo|ccc|shelf-life BROWNFLOC_EXE SCENARIO [--set ...]
"""
import json
import math
import subprocess
import sys

DLVO_PAIR_KEYS = ["kappa_a", "barrier_kT", "barrier_gap_nm", "barrier_at_min_gap", "local_maximum_kT",
                  "primary_minimum_kT", "secondary_minimum_kT", "secondary_minimum_gap_nm",
                  "stability_ratio", "stability_ratio_hydrodynamic", "stability_ratio_experimental",
                  "log10_stability_ratio", "log10_stability_ratio_hydrodynamic",
                  "log10_stability_ratio_experimental", "fast_rate_m3_per_s", "half_life_fast_s",
                  "half_life_s", "half_life_hydrodynamic_s", "warnings"]
DLVO_TOP_KEYS = ["ionic_strength_mM", "debye_length_nm", "pairs", "warnings", "caution", "defaults_applied"]
CCC_KEYS = ["ccc_mM", "ccc_definition", "ccc_by_valence_mM", "schulze_hardy_exponent", "ccc_kinetic_mM",
            "dlog10W_dlog10c", "warnings", "caution"]
SHELF_TOP_KEYS = ["criterion", "criterion_value", "target_days", "surface_hold", "hydrodynamic_correction",
                  "conditions", "rule_of_thumb_note", "ccc_mM", "salt_margin", "settling_distance_m",
                  "not_modelled", "cautions", "warnings", "input_sha256", "seed", "samples", "caution",
                  "band_samples", "inputs_vary", "uncertain_inputs", "concentration_note", "model_choices",
                  "number_density_per_m3", "time_over_tau", "brownfloc_version", "present_salt_mM", "second_salt_note"]
SHELF_CONDITION_KEYS = ["temperature_C", "stability_ratio", "log10_stability_ratio", "half_life_fast_s",
                        "half_life_s", "time_to_criterion_s", "beyond_range", "p5_time_over_target",
                        "acceleration_vs_reference", "acceleration_from_medium", "acceleration_from_stability",
                        "rule_of_thumb_factor", "added_salt_to_target_mM", "added_second_salt_to_target_mM",
                        "ccc_mM", "salt_margin", "sensitivity", "log10_stability_ratio_percentiles",
                        "log10_half_life_s_percentiles"]


def check_values(node, path, problems, noted_by_parent=False):
    if isinstance(node, dict):
        for key, value in node.items():
            if value is None and f"{key}_note" not in node and not noted_by_parent:
                problems.append(f"{path}{key} is null without {key}_note")
            check_values(value, f"{path}{key}.", problems, f"{key}_note" in node)
    elif isinstance(node, list):
        for i, value in enumerate(node):
            check_values(value, f"{path}{i}.", problems)
    elif isinstance(node, float) and not math.isfinite(node):
        problems.append(f"{path} is not finite")


def main():
    command, exe, scenario, extra = sys.argv[1], sys.argv[2], sys.argv[3], sys.argv[4:]
    run = subprocess.run([exe, command, scenario, "--json", *extra], capture_output=True, text=True)
    if run.returncode != 0:
        print(f"exit {run.returncode}: {run.stderr}")
        return 1
    doc = json.loads(run.stdout)  # raises on anything but exactly one JSON document
    problems = []
    if command == "dlvo":
        problems += [f"missing top-level {k}" for k in DLVO_TOP_KEYS if k not in doc]
        for i, pair in enumerate(doc.get("pairs", [])):
            problems += [f"pairs.{i}: missing {k}" for k in DLVO_PAIR_KEYS + ["species"] if k not in pair]
        if len(doc.get("pairs", [])) == 1:
            problems += [f"one species: missing top-level {k}" for k in DLVO_PAIR_KEYS if k not in doc]
    elif command == "shelf-life":
        problems += [f"missing {k}" for k in SHELF_TOP_KEYS if k not in doc]
        for i, c in enumerate(doc.get("conditions", [])):
            problems += [f"conditions.{i}: missing {k}" for k in SHELF_CONDITION_KEYS if k not in c]
            times = c.get("time_to_criterion_s", {})
            if not {"p5", "p50", "p95"} <= set(times) or not all(
                    isinstance(times.get(p), (int, float)) and 0 < times[p] <= 1e12 for p in ("p5", "p50", "p95")):
                problems.append(f"conditions.{i}.time_to_criterion_s must hold p5, p50, p95 in (0, 1e12] s")
            elif not times["p5"] <= times["p50"] <= times["p95"]:
                problems.append(f"conditions.{i}.time_to_criterion_s: p5 <= p50 <= p95 fails")
            for margin in ("added_salt_to_target_mM", "added_second_salt_to_target_mM"):
                if not {"p5", "p50"} <= set(c.get(margin, {})):
                    problems.append(f"conditions.{i}.{margin} must hold p5 and p50")
        if "calibration" in doc:
            for name in doc["calibration"].get("fit_coordinates", []):
                key = "calibrated_" + ("hamaker_J" if "hamaker" in name else name)
                if not {"estimate", "standard_error", "ci95_low", "ci95_high"} <= set(doc.get(key, {})):
                    problems.append(f"missing {key} with estimate, standard_error and the 95 % interval")
            if "jointly" not in doc.get("calibration_note", ""):
                problems.append("calibration_note must say the fit is drawn jointly")
        if not any("do not use it to turn accelerated-test results" in doc.get("rule_of_thumb_note", "") for _ in [0]):
            problems.append("the rule-of-thumb sentence is missing")
    else:
        problems += [f"missing {k}" for k in CCC_KEYS if k not in doc]
        if set(doc.get("ccc_by_valence_mM", {})) != {"1", "2", "3"}:
            problems.append("ccc_by_valence_mM must have keys 1, 2, 3")
    if "not a substitute for real stability testing" not in doc.get("caution", ""):
        problems.append("the caution is missing")
    check_values(doc, "", problems)
    for p in problems:
        print("FAIL", p)
    print(f"{command} {scenario}: {'ok' if not problems else f'{len(problems)} problems'}")
    return 1 if problems else 0


if __name__ == "__main__":
    sys.exit(main())
