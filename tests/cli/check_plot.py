#!/usr/bin/env python3
"""`brownfloc shelf-life SCENARIO --plot FILE.svg`: the SVG parses as XML (xml.etree), is an
SVG document with width, height and a viewBox, labels its axes with units, labels the band as
input uncertainty only and marks the CCC and the target.

Usage: check_plot.py BROWNFLOC_EXE SCENARIO OUT.svg [--set ...]
"""
import subprocess
import sys
import xml.etree.ElementTree as ET

exe, scenario, svg_path, *extra = sys.argv[1:]
result = subprocess.run([exe, "shelf-life", scenario, "--plot", svg_path, *extra], capture_output=True, text=True)
if result.returncode != 0:
    sys.exit(f"shelf-life exited {result.returncode}: {result.stderr}")
root = ET.parse(svg_path).getroot()
problems = []
if root.tag != "{http://www.w3.org/2000/svg}svg":
    problems.append(f"root element is {root.tag}, not svg")
for attribute in ("width", "height", "viewBox"):
    if attribute not in root.attrib:
        problems.append(f"svg has no {attribute}")
text = " ".join("".join(t.itertext()) for t in root.iter("{http://www.w3.org/2000/svg}text"))
for expected in ("concentration (mM)", "(days)", "input uncertainty only", "CCC", "target"):
    if expected not in text:
        problems.append(f"no text containing {expected!r}")
raw = open(svg_path, encoding="utf-8").read()
for bad in ("nan", "inf\"", "inf "):
    if bad in raw.lower():
        problems.append(f"the SVG contains {bad!r}")
for p in problems:
    print("FAIL", p)
sys.exit(1 if problems else 0)
