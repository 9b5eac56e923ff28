# SPDX-License-Identifier: MIT
"""Sizing against achievable briefs. Each brief is read off a random rectangle
tiling made here (guillotine cuts at random positions, so no four rooms meet
at a point): target areas are the tiling's areas, minimum widths 95 % of each
room's shorter side, every contact of the tiling a 'must' adjacency (a door
where the tiling leaves at least a door's width of wall, else a wall), and
every room on the outline wishes for the sides it touches. The tiling itself
meets all of it, so the best variant written by `abut-cli plan` must too:
worst area error at most 1 %, every minWidth and every door wall met, checked
here with shapely, independently of Abut's own checks."""
import concurrent.futures
import json
import os
import random
import subprocess
import sys
import tempfile

from shapely.geometry import box

cli = sys.argv[1]
count = int(sys.argv[2]) if len(sys.argv) > 2 else 60
sizes = [int(v) for v in sys.argv[3].split(",")] if len(sys.argv) > 3 else [5, 8, 12, 20, 30, 50, 75, 100]
DOOR = 0.9  # shared wall a door needs, m (common practice, no source)
TOL = 1e-6


def tiling(rng, n, w, d):
    """Guillotine cuts at random positions, each at least 0.15 from every
    earlier cut in the same direction: all contacts are then 0.15 or longer
    and no four rooms meet at a point."""
    rects = [(0.0, 0.0, w, d)]
    xs, ys = [0.0, w], [0.0, d]
    while len(rects) < n:
        i = rng.randrange(len(rects))
        x0, y0, x1, y1 = rects[i]
        vertical = (x1 - x0) >= (y1 - y0)
        lo, hi = (x0, x1) if vertical else (y0, y1)
        used = xs if vertical else ys
        for _ in range(30):
            c = lo + rng.uniform(0.35, 0.65) * (hi - lo)
            if all(abs(c - u) >= 0.15 for u in used):
                break
        else:
            continue
        used.append(c)
        if vertical:
            rects[i] = (x0, y0, c, y1)
            rects.append((c, y0, x1, y1))
        else:
            rects[i] = (x0, y0, x1, c)
            rects.append((x0, c, x1, y1))
    return rects


def shared(a, b):
    return box(*a).buffer(TOL, join_style=2).intersection(box(*b).boundary).length


def brief_of(rects, w, d):
    rooms = []
    for i, (x0, y0, x1, y1) in enumerate(rects):
        sides = [s for s, touch in (("N", y1 >= d - TOL), ("E", x1 >= w - TOL), ("S", y0 <= TOL), ("W", x0 <= TOL)) if touch]
        room = {"id": f"r{i}", "area": (x1 - x0) * (y1 - y0), "minWidth": 0.95 * min(x1 - x0, y1 - y0)}
        if sides:
            room["facade"] = sides
        rooms.append(room)
    adjs = []
    for i in range(len(rects)):
        for j in range(i + 1, len(rects)):
            length = shared(rects[i], rects[j])
            if length > 1e-4:
                adjs.append({"rooms": [f"r{i}", f"r{j}"], "kind": "door" if length >= DOOR + 0.05 else "wall",
                             "priority": "must"})
    return {"format": "abut.project", "version": 1, "footprint": {"width": w, "depth": d},
            "doorWidth": DOOR, "rooms": rooms, "adjacencies": adjs}


def check(k, n, brief, path, out):
    """Plans one brief; returns its failures and worst area error."""
    failures = []
    r = subprocess.run([cli, "plan", path, "-o", out, "--variants", "1"], capture_output=True, text=True)
    if r.returncode != 0:
        return [f"brief {k} ({n} rooms): plan exited {r.returncode}: {r.stderr.strip()[:200]}"], 0.0
    v = json.load(open(out))["variants"][0]
    rects = {q["id"]: (q["x"], q["y"], q["x"] + q["width"], q["y"] + q["depth"]) for q in v["rooms"]}
    worst = 0.0
    for room in brief["rooms"]:
        x0, y0, x1, y1 = rects[room["id"]]
        err = abs((x1 - x0) * (y1 - y0) - room["area"]) / room["area"]
        worst = max(worst, err)
        if min(x1 - x0, y1 - y0) < room["minWidth"] - 1e-6:
            failures.append(f"brief {k} ({n} rooms): {room['id']} narrower than its minWidth")
    if worst > 0.01:
        failures.append(f"brief {k} ({n} rooms): worst area error {worst:.3%}")
    for a in brief["adjacencies"]:
        if a["kind"] != "door":
            continue
        if shared(rects[a["rooms"][0]], rects[a["rooms"][1]]) < DOOR - 1e-6:
            failures.append(f"brief {k} ({n} rooms): door wall {a['rooms']} shorter than {DOOR}")
    return failures, worst


rng = random.Random(60)
failures, worst_seen = [], 0.0
# ABUT_KEEP_DIR=<folder> keeps the briefs and plans there, to look at failures.
keep = os.environ.get("ABUT_KEEP_DIR")
with tempfile.TemporaryDirectory() as scratch:
    tmp = keep or scratch
    if keep:
        os.makedirs(keep, exist_ok=True)
    jobs = []
    for k in range(count):
        n = rng.choice(sizes)
        w, d = rng.uniform(9, 40), rng.uniform(7, 25)
        # Keep rooms usable: about 6 m² or more on average.
        scale = max(1.0, (6.0 * n / (w * d)) ** 0.5)
        w, d = w * scale, d * scale
        # Abut keeps every contact at least 5 cm long; the tilings' contacts
        # are all 15 cm or longer, so they stay achievable.
        rects = tiling(rng, n, w, d)
        brief = brief_of(rects, w, d)
        path = os.path.join(tmp, f"t{k}.abut.json")
        if keep:
            json.dump({f"r{i}": r for i, r in enumerate(rects)}, open(os.path.join(tmp, f"t{k}.tiling.json"), "w"))
        json.dump(brief, open(path, "w"))
        jobs.append((k, n, brief, path, os.path.join(tmp, f"t{k}.plan.json")))
    # The briefs are drawn in order above (same seed, same briefs); planning
    # them runs on every core.
    with concurrent.futures.ThreadPoolExecutor(max_workers=os.cpu_count() or 1) as pool:
        for found, worst in pool.map(lambda job: check(*job), jobs):
            failures += found
            worst_seen = max(worst_seen, worst)

for f in failures[:25]:
    print("FAIL", f)
failed_briefs = {f.split(" (")[0] for f in failures}
print(f"worst area error seen: {worst_seen:.4%}")
print(f"{count - len(failed_briefs)} passed, {len(failed_briefs)} failed")
sys.exit(1 if failures else 0)
