# SPDX-License-Identifier: MIT
"""Draws a brief's witness or a plan variant as SVG (to look at by hand):
    draw_plan.py BRIEF.abut.json (WITNESS.json | PLAN.json [RANK]) OUT.svg
Rooms are outlined and labelled with id and area deviation; 'must' doors that
miss their door-wide wall are drawn as red lines between room centres."""
import json
import sys

import plan_quality

brief = json.load(open(sys.argv[1]))
other = json.load(open(sys.argv[2]))
out = sys.argv[-1]
if "variants" in other:
    rank = int(sys.argv[3]) if len(sys.argv) > 4 else 1
    rooms, spaces = plan_quality.plan_rooms(other["variants"][rank - 1])
else:
    rooms, spaces = {k: tuple(v) for k, v in other["rooms"].items()}, []
w, d = brief["footprint"]["width"], brief["footprint"]["depth"]
s = 900 / max(w, d)
parts = [f'<svg xmlns="http://www.w3.org/2000/svg" width="{w * s + 20}" height="{d * s + 20}">',
         '<rect width="100%" height="100%" fill="white"/>']
Y = lambda y: 10 + (d - y) * s
X = lambda x: 10 + x * s
targets = {r["id"]: r for r in brief["rooms"]}
for rid, (x0, y0, x1, y1) in rooms.items():
    r = targets[rid]
    dev = ((x1 - x0) * (y1 - y0) - r["area"]) / r["area"]
    fill = "#dde8f0" if r.get("category") == "circulation" else "#f4efe4"
    parts.append(f'<rect x="{X(x0)}" y="{Y(y1)}" width="{(x1 - x0) * s}" height="{(y1 - y0) * s}" '
                 f'fill="{fill}" stroke="black" stroke-width="1.5"/>')
    fs = max(7, min(12, (x1 - x0) * s / 8))
    parts.append(f'<text x="{X((x0 + x1) / 2)}" y="{Y((y0 + y1) / 2)}" font-size="{fs}" text-anchor="middle">'
                 f'{rid}</text>')
    parts.append(f'<text x="{X((x0 + x1) / 2)}" y="{Y((y0 + y1) / 2) + fs + 1}" font-size="{fs}" '
                 f'text-anchor="middle">{dev:+.0%}</text>')
for (x0, y0, x1, y1) in spaces:
    parts.append(f'<rect x="{X(x0)}" y="{Y(y1)}" width="{(x1 - x0) * s}" height="{(y1 - y0) * s}" '
                 f'fill="#cccccc" stroke="black"/>')
for a in brief["adjacencies"]:
    u, v = a["rooms"]
    if a.get("priority", "must") != "must":
        continue
    need = brief.get("doorWidth", 0.9) if a.get("kind", "door") == "door" else 1e-6
    if plan_quality.shared(rooms[u], rooms[v]) < need - 1e-6:
        (a0, b0, a1, b1), (c0, d0, c1, d1) = rooms[u], rooms[v]
        parts.append(f'<line x1="{X((a0 + a1) / 2)}" y1="{Y((b0 + b1) / 2)}" x2="{X((c0 + c1) / 2)}" '
                     f'y2="{Y((d0 + d1) / 2)}" stroke="red" stroke-width="2"/>')
parts.append("</svg>")
open(out, "w").write("\n".join(parts))
