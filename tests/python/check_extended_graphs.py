# SPDX-License-Identifier: MIT
"""Extended graphs written by `abut-cli extended`, checked independently with
networkx: planar; 3V - 7 edges; the poles form the 4-cycle N-E-S-W with no
chord; no separating triangle (removing a triangle's three vertices leaves
the graph connected, the test for a triangle that is not a face in a
triangulated disc); every brief adjacency present unless `check --json`
reports it dropped; facade wishes met unless reported unmet.
Briefs: the samples plus 300 seeded random briefs made here."""
import concurrent.futures
import json
import os
import random
import subprocess
import sys
import tempfile
from itertools import combinations

import networkx as nx

cli, samples_dir = sys.argv[1], sys.argv[2]
failures = 0
checked = 0


def fail(msg):
    global failures
    failures += 1
    print("FAIL", msg)


def random_brief(rng, n):
    rooms = []
    for i in range(n):
        r = {"id": f"room{i}", "area": round(rng.uniform(5, 30), 1)}
        if rng.random() < 0.25:
            r["facade"] = [rng.choice(["N", "E", "S", "W", "any"])]
        rooms.append(r)
    # Random points, Delaunay-free planar graph: greedy non-crossing segments.
    pts = [(rng.random(), rng.random()) for _ in range(n)]

    def cross(a, b, c, d):
        def o(p, q, r):
            return (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0])
        return o(a, b, c) * o(a, b, d) < 0 and o(c, d, a) * o(c, d, b) < 0

    pairs = sorted(combinations(range(n), 2),
                   key=lambda e: (pts[e[0]][0] - pts[e[1]][0]) ** 2 + (pts[e[0]][1] - pts[e[1]][1]) ** 2)
    edges = []
    for u, v in pairs:
        if rng.random() < 0.35:
            continue
        if any(len({u, v, a, b}) == 4 and cross(pts[u], pts[v], pts[a], pts[b]) for a, b in edges):
            continue
        edges.append((u, v))
    adjs = [{"rooms": [f"room{u}", f"room{v}"],
             "kind": rng.choice(["door", "wall"]),
             "priority": rng.choice(["must", "must", "should"])} for u, v in edges]
    sketch = {f"room{i}": [pts[i][0] * 500, pts[i][1] * 500] for i in range(n)}
    return {"format": "abut.project", "version": 1, "rooms": rooms,
            "adjacencies": adjs, "sketch": sketch}


def run_cli(project_path):
    """`extended` and `check --json` on one brief: (graph, report) or an error."""
    with tempfile.TemporaryDirectory() as tmp:
        ext_path = os.path.join(tmp, "x.ext.json")
        r = subprocess.run([cli, "extended", project_path, "-o", ext_path], capture_output=True, text=True)
        if r.returncode != 0:
            return None, None, f"{project_path}: extended exited {r.returncode}: {r.stderr}"
        ext = json.load(open(ext_path))
    rep = json.loads(subprocess.run([cli, "check", project_path, "--json"],
                                    capture_output=True, text=True).stdout)
    return ext, rep, None


def check(project_path, brief, ext, rep, error):
    global checked
    if error:
        return fail(error)
    G = nx.Graph()
    G.add_nodes_from(ext["vertices"])
    G.add_edges_from(map(tuple, ext["edges"]))
    V, E = G.number_of_nodes(), G.number_of_edges()
    poles = ext["poles"]
    N, Ea, S, W = poles["N"], poles["E"], poles["S"], poles["W"]
    where = project_path
    if not nx.check_planarity(G)[0]:
        return fail(f"{where}: not planar")
    if E != 3 * V - 7:
        return fail(f"{where}: {E} edges, expected 3V-7 = {3 * V - 7}")
    for a, b in [(N, Ea), (Ea, S), (S, W), (W, N)]:
        if not G.has_edge(a, b):
            return fail(f"{where}: pole edge {a}-{b} missing")
    if G.has_edge(N, S) or G.has_edge(Ea, W):
        return fail(f"{where}: chord between opposite poles")
    for u, v in G.edges():
        for w in set(G[u]) & set(G[v]):
            if w <= max(u, v):
                continue
            H = G.copy()
            H.remove_nodes_from([u, v, w])
            # The outer quadrangle's triangles (two poles and a corner room)
            # leave the rest connected too; any triangle that splits it is separating.
            if H.number_of_nodes() > 0 and not nx.is_connected(H):
                return fail(f"{where}: separating triangle {u}, {v}, {w}")
    dropped = {tuple(sorted(p)) for p in rep["dropped"]}
    for a in brief["adjacencies"]:
        pair = tuple(sorted(a["rooms"]))
        if pair not in dropped and not G.has_edge(*pair):
            return fail(f"{where}: adjacency {pair} missing and not reported dropped")
    unmet = set(rep["unmetFacade"])
    # Cut-outs of the footprint are vertices too (named by Abut, not rooms of
    # the brief): a wall on one is a facade, the side it faces only the
    # layout shows (plans are checked with shapely in check_plans/check_quality).
    ids = {r["id"] for r in brief["rooms"]}
    cutouts = [v for v in ext["vertices"] if v not in ids and v not in (N, Ea, S, W) and not v.startswith("spare")]
    if len(cutouts) != len(brief.get("footprint", {}).get("cutouts", [])):
        return fail(f"{where}: {len(cutouts)} cut-out vertices for {len(brief['footprint'].get('cutouts', []))} cut-outs")
    for room in brief["rooms"]:
        for side in room.get("facade", []):
            if room["id"] in unmet or any(G.has_edge(room["id"], c) for c in cutouts):
                continue
            if side == "any":
                if not any(G.has_edge(room["id"], p) for p in (N, Ea, S, W)):
                    return fail(f"{where}: {room['id']} reaches no facade")
            elif not G.has_edge(room["id"], poles[side]):
                return fail(f"{where}: {room['id']} does not reach {side}")
    checked += 1


# The command-line runs two at a time (both cores); the checks here in order.
with tempfile.TemporaryDirectory() as tmp:
    jobs = []
    for name in sorted(os.listdir(samples_dir)):
        if name.endswith(".abut.json"):
            path = os.path.join(samples_dir, name)
            jobs.append((path, json.load(open(path))))
    rng = random.Random(4242)
    for i in range(300):
        brief = random_brief(rng, rng.randint(3, 40))
        path = os.path.join(tmp, f"brief{i}.abut.json")
        with open(path, "w") as f:
            json.dump(brief, f)
        jobs.append((path, brief))
    with concurrent.futures.ThreadPoolExecutor(max_workers=2) as pool:
        for (path, brief), result in zip(jobs, pool.map(lambda job: run_cli(job[0]), jobs)):
            check(path, brief, *result)

print(f"{checked} passed, {failures} failed")
sys.exit(1 if failures else 0)
