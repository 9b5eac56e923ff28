# SPDX-License-Identifier: MIT
"""Whether a plan is usable for its brief, judged with shapely alone
(independently of Abut's own checks): the rooms and spare spaces tile the
footprint; every room is within 5 % of its target area (a planner's usual
band at the briefing stage: common practice, no source), at least its minimum
width and at most its aspect limit; every 'must' adjacency is a shared wall
(a door one at least doorWidth long); every facade wish is met (a wall on a
cut-out of the footprint counts, facing the side it faces); every fixed room
exactly where it is fixed; nothing on a cut-out."""
from shapely.geometry import LineString, box
from shapely.ops import unary_union

AREA_BAND = 0.05
EPS = 1e-6


def rect_of(r):
    return (r["x"], r["y"], r["x"] + r["width"], r["y"] + r["depth"])


def shared(a, b):
    """Shared wall length of two rectangles (x0, y0, x1, y1), by shapely: the
    part of b's outline within a hair (1e-6) of a. Plan files give x and
    width, so a wall's two sides can differ in the last bit."""
    if box(*a).intersection(box(*b)).area > 1e-9:
        return 0.0  # overlapping rooms share no wall (the tiling check reports them)
    near = box(*a).buffer(1e-6, join_style=2).intersection(box(*b).boundary).length
    return max(0.0, near - 2e-6)


def facade_length(r, side, w, d, cutouts=()):
    lines = [{"N": LineString([(0, d), (w, d)]), "S": LineString([(0, 0), (w, 0)]),
              "E": LineString([(w, 0), (w, d)]), "W": LineString([(0, 0), (0, d)])}[side]]
    for cx0, cy0, cx1, cy1 in cutouts:  # the cut-out's side that faces away from the room
        lines.append({"N": LineString([(cx0, cy0), (cx1, cy0)]), "S": LineString([(cx0, cy1), (cx1, cy1)]),
                      "E": LineString([(cx0, cy0), (cx0, cy1)]), "W": LineString([(cx1, cy0), (cx1, cy1)])}[side])
    near = box(*r).buffer(1e-6, join_style=2)
    # A cut-out's side counts only where the room lies beyond it, not beside it.
    total = near.intersection(lines[0]).length
    for (cx0, cy0, cx1, cy1), line in zip(cutouts, lines[1:]):
        x0, y0, x1, y1 = r
        beyond = {"N": y1 <= cy0 + 1e-6, "S": y0 >= cy1 - 1e-6, "E": x1 <= cx0 + 1e-6, "W": x0 >= cx1 - 1e-6}[side]
        if beyond:
            total += near.intersection(line).length
    return total


def cutout_rects(brief):
    return [(c["x"], c["y"], c["x"] + c["width"], c["y"] + c["depth"])
            for c in brief["footprint"].get("cutouts", [])]


def judged(brief, rooms, spaces=(), band=AREA_BAND):
    """What the plan given as {id: (x0, y0, x1, y1)} (plus spare rectangles)
    does not meet, as (requirement, room ids, text) with the requirement
    spelled as the plan file's `unmet` spells it (area, minWidth, maxAspect,
    door, adjacency, facade, fixed; "tiling" for the footprint itself).
    `band`: the area band, or None for each room's own (areaTolerance, 5 %)."""
    out = []
    w, d = brief["footprint"]["width"], brief["footprint"]["depth"]
    door = brief.get("doorWidth", 0.9)
    cuts = cutout_rects(brief)
    net = box(0, 0, w, d)
    for c in cuts:
        net = net.difference(box(*c))
    rects = [box(*rooms[r["id"]]) for r in brief["rooms"]] + [box(*s) for s in spaces]
    union = unary_union(rects)
    total = sum(p.area for p in rects)
    if abs(union.area - net.area) > 1e-4 * w * d or abs(total - net.area) > 1e-4 * w * d:
        out.append(("tiling", [], "the rooms do not tile the footprint"))
    if not net.buffer(1e-6, join_style=2).contains(union):
        out.append(("tiling", [], "a room leaves the footprint or stands on a cut-out"))
    for r in brief["rooms"]:
        rid = r["id"]
        x0, y0, x1, y1 = rooms[rid]
        a = (x1 - x0) * (y1 - y0)
        dev = (a - r["area"]) / r["area"]
        own = r.get("areaTolerance", 0.05) if band is None else band
        if abs(dev) > own + 1e-9:
            out.append(("area", [rid], f"{rid}: area {a:.2f} for {r['area']:.2f} ({dev:+.1%})"))
        short, long_ = min(x1 - x0, y1 - y0), max(x1 - x0, y1 - y0)
        if r.get("minWidth") and short < r["minWidth"] - EPS:
            out.append(("minWidth", [rid], f"{rid}: {short:.2f} wide, minimum {r['minWidth']:.2f}"))
        if r.get("maxAspect") and short > 0 and long_ / short > r["maxAspect"] + EPS:
            out.append(("maxAspect", [rid], f"{rid}: aspect {long_ / short:.2f}, limit {r['maxAspect']}"))
        wish = r.get("facade") or []
        sides = {s: facade_length(rooms[rid], s, w, d, cuts) for s in "NESW"}
        if r.get("fixed"):
            f = r["fixed"]
            want = (f["x"], f["y"], f["x"] + f["width"], f["y"] + f["depth"])
            if max(abs(a - b) for a, b in zip(want, rooms[rid])) > 1e-5:
                out.append(("fixed", [rid], f"{rid}: not where it is fixed"))
        if "any" in wish and max(sides.values()) <= EPS:
            out.append(("facade", [rid], f"{rid}: no exterior wall"))
        for s in wish:
            if s != "any" and sides[s] <= EPS:
                out.append(("facade", [rid], f"{rid}: misses the {s} facade"))
    for a in brief["adjacencies"]:
        if a.get("priority", "must") != "must":
            continue
        u, v = a["rooms"]
        length = shared(rooms[u], rooms[v])
        kind = a.get("kind", "door")
        need = door - EPS if kind == "door" else EPS
        if length < need:
            out.append(("door" if kind == "door" else "adjacency", [u, v],
                        f"must {kind} {u}-{v}: shared wall {length:.2f}"))
    return out


def misses(brief, rooms, spaces=(), band=AREA_BAND):
    """What the plan does not meet, as short strings; empty when usable."""
    return [text for _, _, text in judged(brief, rooms, spaces, band)]


def plan_rooms(variant):
    return ({q["id"]: rect_of(q) for q in variant["rooms"]},
            [rect_of(s) for s in variant.get("spaces", [])])
