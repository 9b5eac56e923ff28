# SPDX-License-Identifier: MIT
"""Planarity of 2,000 seeded random graphs (5-60 vertices): Abut's core
(Boyer-Myrvold via Boost) must agree with networkx's check_planarity, an
independent implementation (networkx, left-right planarity test)."""
import json
import random
import subprocess
import sys

import networkx as nx

probe = sys.argv[1]
rng = random.Random(20261201)
graphs = []


def planar_by_points(n):
    """A planar graph: random points, shortest segments first, skipping crossings."""
    pts = [(rng.random(), rng.random()) for _ in range(n)]

    def orient(p, q, r):
        return (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0])

    def cross(a, b, c, d):
        return orient(a, b, c) * orient(a, b, d) < 0 and orient(c, d, a) * orient(c, d, b) < 0

    pairs = sorted(((u, v) for u in range(n) for v in range(u + 1, n)),
                   key=lambda e: (pts[e[0]][0] - pts[e[1]][0]) ** 2 + (pts[e[0]][1] - pts[e[1]][1]) ** 2)
    edges = []
    for u, v in pairs:
        if all(len({u, v, a, b}) < 4 or not cross(pts[u], pts[v], pts[a], pts[b]) for a, b in edges):
            edges.append((u, v))
    return edges


for i in range(2000):
    n = rng.randint(5, 60)
    all_pairs = [(u, v) for u in range(n) for v in range(u + 1, n)]
    if i % 2 == 0:
        # Sparse to dense random graphs.
        m = rng.randint(n // 2, min(len(all_pairs), 2 * n))
        edges = rng.sample(all_pairs, m)
    else:
        # A planar graph, sometimes with a few random edges on top: answers
        # on both sides of the line.
        edges = planar_by_points(n)
        extra = rng.choice([0, 0, 1, 2, 3])
        present = set(edges)
        rest = [e for e in all_pairs if e not in present]
        edges += rng.sample(rest, min(extra, len(rest)))
    graphs.append({"n": n, "edges": edges})

out = subprocess.run([probe, "planar"], input=json.dumps({"graphs": graphs}),
                     capture_output=True, text=True, check=True)
ours = json.loads(out.stdout)
assert len(ours) == len(graphs)
planar_count = 0
for i, (g, answer) in enumerate(zip(graphs, ours)):
    G = nx.Graph()
    G.add_nodes_from(range(g["n"]))
    G.add_edges_from(g["edges"])
    expected, _ = nx.check_planarity(G)
    planar_count += expected
    if answer != expected:
        print(f"FAIL graph {i}: abut says {answer}, networkx says {expected}: {g}")
        sys.exit(1)
print(f"planarity agrees with networkx on {len(graphs)} graphs "
      f"({planar_count} planar, {len(graphs) - planar_count} not)")
print(f"{len(graphs)} passed, 0 failed")
