# SPDX-License-Identifier: MIT
"""Benchmark of the plan search (figures, not a test): for generated briefs of
10, 30, 60, 100 and 200 rooms (read off plausible plans, tests/python/
plan_briefs.py), the share that gets a usable best variant, the time to the
first usable variant and the time to the end, with `abut-cli plan` on every
core. Prints "name: value unit" lines.

    bench_search.py ABUT_CLI [--per-size 6] [--sizes 10,30,60,100,200]
    bench_search.py ABUT_CLI --floors [--per-size 4] [--sizes 50,100,200,400]

Aims on a 2-core machine: first usable variant for 30 rooms within 1 s, 60
rooms within 5 s, 200 rooms within 60 s. With --floors, professional floors
(tests/python/floor_briefs.py: hotel floors, floors of flats, wards, offices
with two corridors, read off drawn plans) of 50, 100, 200 and 400 rooms; aim:
usable within seconds (not met yet: see DEVELOPERS.md, Known gaps)."""
import argparse
import json
import os
import statistics
import subprocess
import sys
import tempfile
import time

here = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, os.path.join(here, "..", "python"))
import floor_briefs  # noqa: E402
import plan_briefs  # noqa: E402
import plan_quality  # noqa: E402

ap = argparse.ArgumentParser()
ap.add_argument("cli")
ap.add_argument("--per-size", type=int, default=6)
ap.add_argument("--sizes")
ap.add_argument("--floors", action="store_true", help="professional floors (floor_briefs.py)")
args = ap.parse_args()
if args.sizes is None:
    args.sizes = "50,100,200,400" if args.floors else "10,30,60,100,200"

with tempfile.TemporaryDirectory() as tmp:
    for n in [int(v) for v in args.sizes.split(",")]:
        types = ["house", "pinwheel", "office", "clinic", "school", "ring"] if n <= 20 else \
            ["office", "clinic", "school", "ring"]
        if args.floors:
            briefs = floor_briefs.generate(args.per_size, 2000 + n, sizes=(n,))
        else:
            briefs = plan_briefs.generate(args.per_size, 1000 + n, sizes=[n], types=types, limit=max(60, n))
        usable, firsts, ends, rooms = 0, [], [], []
        for k, (kind, brief, _) in enumerate(briefs):
            path = os.path.join(tmp, f"n{n}_{k}.abut.json")
            out = os.path.join(tmp, f"n{n}_{k}.plan.json")
            json.dump(brief, open(path, "w"))
            limit = 120 if n > 100 else 60
            start = time.monotonic()
            r = subprocess.run([args.cli, "plan", path, "-o", out, "--variants", "3", "--time-limit", str(limit)],
                               capture_output=True, text=True)
            ends.append(time.monotonic() - start)
            rooms.append(len(brief["rooms"]))
            if r.returncode != 0:
                continue
            plan = json.load(open(out))
            r_, s_ = plan_quality.plan_rooms(plan["variants"][0])
            if not plan_quality.misses(brief, r_, s_):
                usable += 1
            if "firstUsableSeconds" in plan.get("search", {}):
                firsts.append(plan["search"]["firstUsableSeconds"])
        name = f"search/{'floor_' if args.floors else ''}{n}_rooms"
        print(f"{name}_briefs: {len(briefs)} ({min(rooms)}-{max(rooms)} rooms)")
        print(f"{name}_usable: {usable} of {len(briefs)}")
        if firsts:
            print(f"{name}_first_usable_median: {statistics.median(firsts):.2f} s")
            print(f"{name}_first_usable_worst: {max(firsts):.2f} s")
        print(f"{name}_end_median: {statistics.median(ends):.2f} s")
        print(f"{name}_end_worst: {max(ends):.2f} s", flush=True)
