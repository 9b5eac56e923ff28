# SPDX-License-Identifier: MIT
"""Plan files written by `abut-cli plan`, checked independently with shapely
(geometry) and networkx (graph facts): rooms and spare spaces tile the
footprint less its cut-outs (which the plan file repeats) with no overlap; every adjacency not listed in `dropped` is a
shared wall of positive length (door kind: at least doorWidth); every facade
wish is met unless the room is listed in `unmetFacade` (a wall on a cut-out
facing the side counts); variants are sorted
best first. Briefs: the samples plus 1,000 seeded random briefs made here
(random planar adjacency graphs, random facade wishes, door/wall and
must/should mixes, some disconnected)."""
import concurrent.futures
import json
import os
import random
import subprocess
import sys
import tempfile

import networkx as nx
from shapely.geometry import box
from shapely.ops import unary_union

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import plan_quality  # noqa: E402

cli, samples_dir = sys.argv[1], sys.argv[2]
count = int(sys.argv[3]) if len(sys.argv) > 3 else 1000
TOL = 1e-5
failures = []
checked = 0


def random_brief(rng, n):
    rooms = [{"id": f"room{i}", "area": round(rng.uniform(6, 30), 1)} for i in range(n)]
    for r in rooms:
        if rng.random() < 0.2:
            r["facade"] = [rng.choice(["N", "E", "S", "W", "any"])]
        if rng.random() < 0.3:
            r["minWidth"] = round(rng.uniform(1.0, 2.4), 2)
    # A random maximal planar graph grown by vertex insertion into faces
    # (networkx checks planarity), thinned at random.
    G = nx.Graph()
    if n >= 3:
        G.add_edges_from([(0, 1), (1, 2), (0, 2)])
        faces = [(0, 1, 2), (0, 1, 2)]
        for v in range(3, n):
            f = faces.pop(rng.randrange(len(faces)))
            G.add_edges_from((u, v) for u in f)
            faces += [(f[0], f[1], v), (f[1], f[2], v), (f[0], f[2], v)]
    elif n == 2:
        G.add_edge(0, 1)
    assert nx.check_planarity(G)[0]
    keep = rng.uniform(0.3, 1.0)
    adjs = [{"rooms": [f"room{u}", f"room{v}"], "kind": rng.choice(["door", "wall"]),
             "priority": rng.choice(["must", "must", "should"])}
            for u, v in G.edges() if rng.random() < keep]
    total = sum(r["area"] for r in rooms)
    w = round((total * rng.uniform(1.0, 1.3)) ** 0.5 * rng.uniform(0.8, 1.25), 2)
    d = round(total * 1.35 / w, 2)
    return {"format": "abut.project", "version": 1, "units": "m",
            "footprint": {"width": w, "depth": d}, "doorWidth": 0.9,
            "rooms": rooms, "adjacencies": adjs}


def shared_length(a, b):
    """Length of the wall two rectangles share. Coordinates in the file are
    x, width: x + width may differ from the neighbour's x in the last bit, so
    grow one rectangle by a hair and measure the overlap of the boundaries."""
    return a.buffer(TOL, join_style=2).intersection(b.boundary).length


def plan_of(path):
    """Runs `abut-cli plan`; returns (plan, None) or (None, what went wrong)."""
    with tempfile.TemporaryDirectory() as tmp:
        out = os.path.join(tmp, "p.plan.json")
        # A short budget: this checks what every plan is, not how good it is.
        r = subprocess.run([cli, "plan", path, "-o", out, "--variants", "3", "--time-limit", "3", "--threads", "1"],
                           capture_output=True, text=True)
        if r.returncode != 0:
            return None, f"{path}: plan exited {r.returncode}: {r.stderr.strip()}"
        return json.load(open(out)), None


def check_all(jobs):
    """Plans every (path, brief) on every core, then checks them in order."""
    with concurrent.futures.ThreadPoolExecutor(max_workers=os.cpu_count() or 1) as pool:
        results = list(pool.map(lambda job: plan_of(job[0]), jobs))
    for (path, brief), (plan, error) in zip(jobs, results):
        if error:
            failures.append(error)
        else:
            check(path, brief, plan)


def check(path, brief, plan):
    global checked
    fw, fd = plan["footprint"]["width"], plan["footprint"]["depth"]
    cuts = [(c["x"], c["y"], c["x"] + c["width"], c["y"] + c["depth"]) for c in plan["footprint"].get("cutouts", [])]
    def rects(fp):
        return [(c["x"], c["y"], c["width"], c["depth"]) for c in fp.get("cutouts", [])]
    if rects(brief.get("footprint", {})) != rects(plan["footprint"]):
        failures.append(f"{path}: the plan file does not repeat the footprint's cut-outs")
    footprint = box(0, 0, fw, fd)
    for c in cuts:
        footprint = footprint.difference(box(*c))
    door = brief.get("doorWidth", 0.9)
    ids = [r["id"] for r in brief["rooms"]]
    scores = [v["score"] for v in plan["variants"]]
    if scores != sorted(scores):
        failures.append(f"{path}: variants are not sorted best first")
    for v in plan["variants"]:
        where = f"{path} variant {v['rank']}"
        rooms = {r["id"]: box(r["x"], r["y"], r["x"] + r["width"], r["y"] + r["depth"]) for r in v["rooms"]}
        if sorted(rooms) != sorted(ids):
            failures.append(f"{where}: rooms differ from the brief")
            continue
        shapes = list(rooms.values()) + [box(s["x"], s["y"], s["x"] + s["width"], s["y"] + s["depth"])
                                         for s in v["spaces"]]
        if abs(sum(s.area for s in shapes) - footprint.area) > TOL * footprint.area:
            failures.append(f"{where}: areas add up to {sum(s.area for s in shapes)}, not {footprint.area}")
            continue
        union = unary_union(shapes)
        if union.symmetric_difference(footprint).area > TOL * footprint.area:
            failures.append(f"{where}: the rectangles do not cover the footprint")
            continue
        overlap = False
        for i in range(len(shapes)):
            for j in range(i + 1, len(shapes)):
                if shapes[i].intersection(shapes[j]).area > TOL:
                    overlap = True
        if overlap:
            failures.append(f"{where}: rectangles overlap")
            continue
        dropped = {tuple(sorted(p)) for p in v["dropped"]}
        for a in brief["adjacencies"]:
            pair = tuple(sorted(a["rooms"]))
            if pair in dropped:
                continue
            need = door if a.get("kind", "door") == "door" else TOL
            got = shared_length(rooms[pair[0]], rooms[pair[1]])
            if got < need - TOL:
                failures.append(f"{where}: {pair} share {got:.4f}, need {need}")
        unmet = set(v["unmetFacade"])
        for r in brief["rooms"]:
            if r["id"] in unmet:
                continue
            for side in r.get("facade", []):
                rect = rooms[r["id"]].bounds
                touches = [plan_quality.facade_length(rect, s, fw, fd, cuts) > TOL for s in "NESW"]
                ok = any(touches) if side == "any" else touches["NESW".index(side)]
                if not ok:
                    failures.append(f"{where}: {r['id']} misses facade {side}")
        checked += 1


jobs = []
for name in sorted(os.listdir(samples_dir)):
    if name.endswith(".abut.json"):
        p = os.path.join(samples_dir, name)
        jobs.append((p, json.load(open(p))))

rng = random.Random(7)
with tempfile.TemporaryDirectory() as tmp:
    for i in range(count):
        brief = random_brief(rng, rng.randint(1, 25))
        p = os.path.join(tmp, f"b{i}.abut.json")
        json.dump(brief, open(p, "w"))
        jobs.append((p, brief))
    check_all(jobs)

for f in failures[:20]:
    print("FAIL", f)
print(f"{checked} passed, {len(failures)} failed")
sys.exit(1 if failures else 0)
