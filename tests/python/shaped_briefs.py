# SPDX-License-Identifier: MIT
"""Briefs read off plausible plans on footprints that are not one rectangle,
and on floors whose stair and lift core is fixed, each kept with the plan it
was read from (the witness: an exact answer exists).

Plan types (all invented; turned and mirrored at random like plan_briefs.py):
  ell        an L: a double-loaded corridor wing along one facade and a
             second wing at right angles from its end (one cut-out at a
             corner); half of them with the stair at the corner fixed
  you        a U: a wing along one facade and two wings from its ends (one
             cut-out on an edge: the court)
  courtyard  rooms all round, a corridor round a courtyard in the middle
             (one cut-out inside)
  core       an office floor round a central core whose stair and lift are
             fixed (the floors above and below decide where they go)

The brief is written as plan_briefs.py writes one (doors to the circulation
each room opens on, minimum widths 15 % under the drawn ones, targets as
drawn), plus `footprint.cutouts` and `rooms[].fixed`; a room's facade wish is
read off its exterior walls, a wall on a cut-out counting as one facing the
side it faces. Room sizes are common practice (no source).

    /usr/bin/python3 tests/python/shaped_briefs.py OUTDIR COUNT [SEED]
"""
import json
import math
import os
import random
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from plan_briefs import Drawing, brief_of, pick_widths, q, ring, split, transform  # noqa: E402

TYPES = ["ell", "you", "courtyard", "core"]
CUT = "cutout"  # category of the pseudo-rooms that stand for cut-outs while drawing


def row(g, rng, prefix, x0, x1, y0, y1, module, names, along_x=True):
    """Rooms side by side along a strip (x0..x1 when along_x, else y0..y1)."""
    lo, hi = (x0, x1) if along_x else (y0, y1)
    ws = pick_widths(rng, hi - lo, [module, module, 1.5 * module, 2 * module], 2.6)
    for a, b in split(lo, hi, ws):
        k = len(g.rooms) + 1
        name, cat = names[k % len(names)]
        g.add(f"{prefix}{k}", f"{name} {k}", (a, y0, b, y1) if along_x else (x0, a, x1, b), cat)


OFFICE = [("Office", "work"), ("Office", "work"), ("Meeting room", "work"), ("Store", "storage"),
          ("Office", "work"), ("WC", "service"), ("Office", "work"), ("Print room", "service")]


def ell(rng, n):
    """South wing along x, west wing along y from its west end; the cut-out
    fills the north-east."""
    c = q(rng.uniform(1.6, 2.0))
    ds, dn = q(rng.uniform(4.5, 5.5)), q(rng.uniform(4.5, 5.5))   # south wing rows
    ww, we = q(rng.uniform(4.5, 5.5)), q(rng.uniform(4.2, 5.2))   # west wing rows
    module = rng.choice([2.7, 3.0, 3.6])
    per = max(2, n // 4)
    w = q(ww + c + we + per * module * rng.uniform(0.9, 1.2))
    d = q(ds + c + dn + per * module * rng.uniform(0.9, 1.2))
    g = Drawing(w, d)
    xw = q(ww + c + we)  # the west wing's east facade
    ya = q(ds + c + dn)  # the south wing's north facade
    stair = (ww, 0, q(ww + c), ds)  # at the corner, south of the junction
    g.add("stair", "Stair", stair, "circulation", True)
    g.add("corr_s", "Corridor south wing", (q(ww + c), ds, w, q(ds + c)), "circulation", True)
    g.add("corr_w", "Corridor west wing", (ww, ds, q(ww + c), d), "circulation", True)
    row(g, rng, "s", 0, ww, 0, ds, module, OFFICE)
    row(g, rng, "s", q(ww + c), w, 0, ds, module, OFFICE)
    row(g, rng, "n", q(ww + c), w, q(ds + c), ya, module, OFFICE)
    row(g, rng, "w", 0, ww, ds, d, module, OFFICE, along_x=False)
    row(g, rng, "e", q(ww + c), xw, ya, d, module, OFFICE, along_x=False)
    g.add("cut1", "Cut-out", (xw, ya, w, d), CUT)
    fixed = ["stair"] if rng.random() < 0.5 else []
    return g, fixed


def you(rng, n):
    """South wing along x, a wing north from each end; the court between them."""
    c = q(rng.uniform(1.6, 2.0))
    ds, dn = q(rng.uniform(4.5, 5.5)), q(rng.uniform(4.5, 5.5))
    module = rng.choice([2.7, 3.0, 3.6])
    wing = [(q(rng.uniform(4.2, 5.2)), q(rng.uniform(4.2, 5.2))) for _ in range(2)]
    per = max(2, n // 6)
    court = q(per * module * rng.uniform(0.9, 1.2))
    w = q(sum(a + c + b for a, b in wing) + court)
    d = q(ds + c + dn + per * module * rng.uniform(0.8, 1.1))
    g = Drawing(w, d)
    ya = q(ds + c + dn)
    (aw, bw), (ae, be) = wing
    xw = q(aw + c + bw)          # west wing's east facade (the court's west side)
    xe = q(w - (ae + c + be))    # east wing's west facade
    g.add("corr_s", "Corridor south wing", (q(aw + c), ds, q(w - ae - c), q(ds + c)), "circulation", True)
    g.add("corr_w", "Corridor west wing", (aw, ds, q(aw + c), d), "circulation", True)
    g.add("corr_e", "Corridor east wing", (q(w - ae - c), ds, q(w - ae), d), "circulation", True)
    row(g, rng, "s", 0, aw, 0, ds, module, OFFICE)
    row(g, rng, "s", aw, q(w - ae), 0, ds, module, OFFICE)
    row(g, rng, "s", q(w - ae), w, 0, ds, module, OFFICE)
    row(g, rng, "n", q(aw + c), q(w - ae - c), q(ds + c), ya, module, OFFICE)
    row(g, rng, "w", 0, aw, ds, d, module, OFFICE, along_x=False)
    row(g, rng, "v", q(aw + c), xw, ya, d, module, OFFICE, along_x=False)
    row(g, rng, "u", xe, q(w - ae - c), ya, d, module, OFFICE, along_x=False)
    row(g, rng, "e", q(w - ae), w, ds, d, module, OFFICE, along_x=False)
    g.add("cut1", "Court", (xw, ya, xe, d), CUT)
    return g, []


def courtyard(rng, n):
    """Rooms all round the outside, a corridor round the courtyard."""
    c = q(rng.uniform(1.6, 2.0))
    band = q(rng.uniform(4.5, 5.5))
    module = rng.choice([2.7, 3.0, 3.6])
    per = max(2, n // 5)
    w = q(2 * (band + c) + per * module * rng.uniform(0.8, 1.1))
    d = q(2 * (band + c) + max(2, per - 1) * module * rng.uniform(0.8, 1.1))
    g = Drawing(w, d)
    g.add("corr_s", "Corridor south", (band, band, q(w - band), q(band + c)), "circulation", True)
    g.add("corr_n", "Corridor north", (band, q(d - band - c), q(w - band), q(d - band)), "circulation", True)
    g.add("corr_w", "Corridor west", (band, q(band + c), q(band + c), q(d - band - c)), "circulation", True)
    g.add("corr_e", "Corridor east", (q(w - band - c), q(band + c), q(w - band), q(d - band - c)),
          "circulation", True)
    row(g, rng, "s", 0, w, 0, band, module, OFFICE)
    row(g, rng, "n", 0, w, q(d - band), d, module, OFFICE)
    row(g, rng, "w", 0, band, band, q(d - band), module, OFFICE, along_x=False)
    row(g, rng, "e", q(w - band), w, band, q(d - band), module, OFFICE, along_x=False)
    g.add("cut1", "Courtyard", (q(band + c), q(band + c), q(w - band - c), q(d - band - c)), CUT)
    return g, []


def core(rng, n):
    g = ring(rng, max(n, 12))
    # The core's first two rooms are the stair and the lift: fixed.
    return g, ["core1", "core2"]


MAKERS = {"ell": ell, "you": you, "courtyard": courtyard, "core": core}


def facade_sides(rect, w, d, cutouts):
    """Exterior wall length per side: the bounding rectangle's sides and the
    sides of the cut-outs the room borders (facing away from the room)."""
    x0, y0, x1, y1 = rect
    out = {"N": x1 - x0 if y1 >= d - 1e-6 else 0.0, "S": x1 - x0 if y0 <= 1e-6 else 0.0,
           "E": y1 - y0 if x1 >= w - 1e-6 else 0.0, "W": y1 - y0 if x0 <= 1e-6 else 0.0}
    for cx0, cy0, cx1, cy1 in cutouts:
        ox = min(x1, cx1) - max(x0, cx0)
        oy = min(y1, cy1) - max(y0, cy0)
        if abs(cy0 - y1) < 1e-6 and ox > 0:
            out["N"] += ox
        if abs(cy1 - y0) < 1e-6 and ox > 0:
            out["S"] += ox
        if abs(cx0 - x1) < 1e-6 and oy > 0:
            out["E"] += oy
        if abs(cx1 - x0) < 1e-6 and oy > 0:
            out["W"] += oy
    return out


def make(rng, kind=None, n=None):
    kind = kind or rng.choice(TYPES)
    n = n or rng.randint(10, 30)
    g, fixed = MAKERS[kind](rng, n)
    transform(g, rng)
    cut_rects = [r["rect"] for r in g.rooms if r["category"] == CUT]
    g.rooms = [r for r in g.rooms if r["category"] != CUT]
    brief = brief_of(g, rng, sketch=rng.random() < 0.5)
    brief["footprint"]["cutouts"] = [{"x": round(x0, 6), "y": round(y0, 6), "width": round(x1 - x0, 6),
                                      "depth": round(y1 - y0, 6)} for x0, y0, x1, y1 in cut_rects]
    by_id = {r["id"]: r for r in g.rooms}
    for room in brief["rooms"]:
        x0, y0, x1, y1 = by_id[room["id"]]["rect"]
        if room["id"] in fixed:
            room["fixed"] = {"x": round(x0, 6), "y": round(y0, 6), "width": round(x1 - x0, 6),
                             "depth": round(y1 - y0, 6)}
        # Facade wishes read again, walls on cut-outs included.
        room.pop("facade", None)
        sides = facade_sides((x0, y0, x1, y1), g.w, g.d, cut_rects)
        best = max(sides, key=sides.get)
        if sides[best] >= 1.5 and not by_id[room["id"]]["circulation"]:
            u = rng.random()
            if u < 0.45:
                room["facade"] = [best]
            elif u < 0.6:
                room["facade"] = ["any"]
    witness = {r["id"]: list(r["rect"]) for r in g.rooms}
    return kind, brief, witness


def generate(count, seed):
    rng = random.Random(seed)
    return [make(rng, TYPES[k % len(TYPES)], rng.randint(10, 30)) for k in range(count)]


if __name__ == "__main__":
    outdir, count = sys.argv[1], int(sys.argv[2])
    seed = int(sys.argv[3]) if len(sys.argv) > 3 else 1
    os.makedirs(outdir, exist_ok=True)
    for k, (kind, brief, witness) in enumerate(generate(count, seed)):
        json.dump(brief, open(os.path.join(outdir, f"s{k}.abut.json"), "w"), indent=1)
        json.dump({"kind": kind, "rooms": witness}, open(os.path.join(outdir, f"s{k}.witness.json"), "w"))
        print(f"s{k}: {kind}, {len(brief['rooms'])} rooms, {len(brief['footprint']['cutouts'])} cut-out(s)")
