# SPDX-License-Identifier: MIT
"""Briefs read off plausible building plans drawn here, each kept with the plan
it was read from (the witness), so an exact answer is known to exist.

Plan types (all invented, drawn on a rectangular footprint, then turned and
mirrored at random):
  office   offices along a double-loaded corridor, a stair at each end,
           long corridors split into pieces
  house    a bungalow: day rooms along the south facade with the entrance
           hall, a bedroom corridor across, bedrooms and bath to the north
  pinwheel a house whose four wings turn around a central hall (no straight
           cut crosses it)
  clinic   a T-shaped corridor: a main corridor along the length and a
           branch to the north facade; rooms on both
  school   an assembly hall at one end, classrooms along a corridor
  ring     an office floor with a central core and a corridor around it

A brief is written the way a planner writes one: a door from each room to the
circulation space it opens on (or, for a room inside a suite, to the
neighbour it is reached through), a few wished walls between neighbours,
facade wishes for some rooms on the outline, minimum widths about 15 % under
the drawn ones, aspect limits for some rooms, target areas as drawn (rounded
down to 0.01 m²). Dimensions follow a 0.05 m grid; room sizes are common
practice for each kind of room (no source).

Used by check_quality.py (acceptance), the benchmark, and by hand:
    /usr/bin/python3 tests/python/plan_briefs.py OUTDIR COUNT [SEED]
writes OUTDIR/b<k>.abut.json and OUTDIR/b<k>.witness.json.
"""
import json
import math
import os
import random
import sys

DOOR = 0.9  # shared wall a door needs, m (common practice, no source)
TYPES = ["office", "house", "pinwheel", "clinic", "school", "ring"]


def q(v, step=0.05):
    """Snap to the drawing grid."""
    return round(round(v / step) * step, 6)


class Drawing:
    """Rooms as rectangles (x0, y0, x1, y1) with a kind and category."""

    def __init__(self, w, d):
        self.w, self.d = w, d
        self.rooms = []  # dicts: id, name, rect, category, circulation, suite (id of the room it is reached through)

    def add(self, rid, name, rect, category, circulation=False, via=None):
        x0, y0, x1, y1 = rect
        assert x1 - x0 > 1e-9 and y1 - y0 > 1e-9, (rid, rect)
        self.rooms.append({"id": rid, "name": name, "rect": tuple(rect), "category": category,
                           "circulation": circulation, "via": via})


def split(lo, hi, widths):
    """Cut [lo, hi] into pieces proportional to `widths`, snapped to the grid."""
    total = sum(widths)
    cuts, acc = [lo], lo
    for w in widths[:-1]:
        acc += (hi - lo) * w / total
        cuts.append(q(acc))
    cuts.append(hi)
    return list(zip(cuts[:-1], cuts[1:]))


def pick_widths(rng, length, choices, minimum):
    """Room widths from `choices` filling `length` (the last piece absorbs the rest)."""
    out, acc = [], 0.0
    while length - acc > 0:
        w = rng.choice(choices)
        if length - acc - w < minimum:
            rest = length - acc
            if out and rest < minimum:
                out[-1] += rest
            else:
                out.append(rest)
            break
        out.append(w)
        acc += w
    return out


# ---------------------------------------------------------------- plan types

def office(rng, n):
    c = q(rng.uniform(1.6, 2.1))
    dn, ds = q(rng.uniform(4.5, 6.0)), q(rng.uniform(4.5, 6.0))
    d = dn + c + ds
    per_side = max(2, (n - 2) // 2)
    module = rng.choice([2.7, 3.0, 3.6])
    widths = [module * rng.choice([1, 1, 1, 2]) if rng.random() < 0.8 else module * 1.5 for _ in range(per_side)]
    inner = q(sum(widths))
    sw, se = q(rng.uniform(3.0, 4.2)), q(rng.uniform(3.0, 4.2))
    w = q(inner + sw + se)
    g = Drawing(w, d)
    # Stairs at the corridor's ends, each taking the corridor band and one row.
    west_north = rng.random() < 0.5
    east_north = rng.random() < 0.5
    g.add("stair_w", "Stair west", (0, ds, sw, d) if west_north else (0, 0, sw, ds + c), "circulation", True)
    g.add("stair_e", "Stair east", (w - se, ds, w, d) if east_north else (w - se, 0, w, ds + c), "circulation", True)
    # Corridor pieces of at most ~24 m.
    pieces = max(1, math.ceil(inner / 24.0))
    corridor = split(sw, w - se, [1] * pieces)
    for k, (a, b) in enumerate(corridor):
        g.add(f"corr{k + 1}", "Corridor" + (f" {k + 1}" if pieces > 1 else ""), (a, ds, b, ds + c),
              "circulation", True)
    # Rows: the north row runs from the west stair (or the facade) to the east one.
    rows = [("N", 0 if not west_north else sw, w - (se if east_north else 0), ds + c, d),
            ("S", sw if not west_north else 0, w - (0 if east_north else se), 0, ds)]
    count = 0
    service = ["WC", "Print room", "Kitchenette", "Store", "Server room"]
    for side, x0, x1, y0, y1 in rows:
        ws = pick_widths(rng, x1 - x0, [module, module, module, 2 * module, 1.5 * module], 2.4)
        for a, b in split(x0, x1, ws):
            count += 1
            if rng.random() < 0.15 and service:
                name = service.pop(rng.randrange(len(service)))
                g.add(f"svc{count}", name, (a, y0, b, y1), "service")
            elif b - a > 1.8 * module:
                g.add(f"meet{count}", f"Meeting room {count}", (a, y0, b, y1), "work")
            else:
                g.add(f"off{count}", f"Office {count}", (a, y0, b, y1), "work")
    return g


def house(rng, n):
    c = q(rng.uniform(1.1, 1.3))
    ds, dn = q(rng.uniform(4.2, 5.4)), q(rng.uniform(3.3, 4.2))
    d = ds + c + dn
    south = [("living", "Living room", q(rng.uniform(4.2, 5.6)), "living"),
             ("hall", "Entrance hall", q(rng.uniform(2.0, 2.6)), "circulation"),
             ("kitchen", "Kitchen", q(rng.uniform(3.0, 3.9)), "service")]
    if n >= 10:
        south.append(("dining", "Dining", q(rng.uniform(3.0, 3.6)), "living"))
    if n >= 12:
        south.append(("utility", "Utility", q(rng.uniform(1.8, 2.2)), "service"))
    w = q(sum(s[2] for s in south))
    north = [("bed1", "Main bedroom", q(rng.uniform(3.3, 4.2)), "sleeping"),
             ("bath", "Bathroom", q(rng.uniform(2.2, 2.7)), "service"),
             ("bed2", "Bedroom 2", q(rng.uniform(2.9, 3.5)), "sleeping")]
    if n >= 11:
        north.append(("bed3", "Bedroom 3", q(rng.uniform(2.7, 3.2)), "sleeping"))
    if n >= 13:
        north.append(("study", "Study", q(rng.uniform(2.4, 3.0)), "work"))
    g = Drawing(w, d)
    xs = split(0, w, [s[2] for s in south])
    hall_x = None
    for (rid, name, _, cat), (a, b) in zip(south, xs):
        if rid == "hall":
            hall_x = (a, b)
        g.add(rid, name, (a, 0, b, ds), cat, cat == "circulation")
    # The corridor band: a WC at the west end, the corridor from there east.
    wc_w = q(rng.uniform(1.5, 1.9))
    g.add("wc", "WC", (0, ds, wc_w, ds + c), "service")
    g.add("corridor", "Bedroom corridor", (wc_w, ds, w, ds + c), "circulation", True)
    xs = split(0, w, [s[2] for s in north])
    # The first bedroom must reach past the WC to open on the corridor.
    a0, b0 = xs[0]
    if b0 < wc_w + 1.3:
        xs[0] = (a0, q(wc_w + 1.5))
        xs[1] = (q(wc_w + 1.5), xs[1][1])
    for (rid, name, _, cat), (a, b) in zip(north, xs):
        g.add(rid, name, (a, ds + c, b, d), cat)
    for r in g.rooms:  # the kitchen is reached from the hall or through the dining room
        if r["id"] == "utility":
            r["via"] = "kitchen"
    return g


def pinwheel(rng, n):
    w, d = q(rng.uniform(11, 15)), q(rng.uniform(10, 14))
    s, p = q(w * rng.uniform(0.32, 0.4)), q(w * rng.uniform(0.6, 0.68))
    qq, r = q(d * rng.uniform(0.32, 0.4)), q(d * rng.uniform(0.6, 0.68))
    g = Drawing(w, d)
    g.add("hall", "Central hall", (s, qq, p, r), "circulation", True)
    wings = [("A", (0, r, p, d), "x", (s, p)),      # north-west: hall below it on x in (s, p)
             ("B", (p, qq, w, d), "y", (qq, r)),    # north-east: hall west of it on y in (q, r)
             ("C", (s, 0, w, qq), "x", (s, p)),     # south-east: hall above it on x in (s, p)
             ("D", (0, 0, s, r), "y", (qq, r))]     # south-west: hall east of it on y in (q, r)
    names = [("Living room", "living"), ("Kitchen", "service"), ("Dining", "living"), ("Bedroom", "sleeping"),
             ("Bedroom", "sleeping"), ("Bathroom", "service"), ("Study", "work"), ("Store", "storage"),
             ("Guest room", "sleeping"), ("Utility", "service"), ("Dressing", "storage"), ("Play room", "living")]
    rng.shuffle(names)
    extra = max(0, n - 5)
    counts = [1, 1, 1, 1]
    for _ in range(extra):
        counts[rng.randrange(4)] += 1
    counts = [min(k, 4) for k in counts]
    k = 0
    for (label, (x0, y0, x1, y1), axis, (h0, h1)), m in zip(wings, counts):
        lo, hi = (x0, x1) if axis == "x" else (y0, y1)
        pieces = split(lo, hi, [rng.uniform(0.8, 1.2) for _ in range(m)])
        first = None
        wing_ids = []
        for a, b in pieces:
            k += 1
            name, cat = names[(k - 1) % len(names)]
            rect = (a, y0, b, y1) if axis == "x" else (x0, a, x1, b)
            rid = f"{label.lower()}{k}"
            touches_hall = min(b, h1) - max(a, h0) >= DOOR + 0.3
            g.add(rid, f"{name} {k}", rect, cat, via=None if touches_hall else "neighbour")
            wing_ids.append(rid)
    return g


def clinic(rng, n):
    """A T: the main corridor along the length, the branch from its middle to
    the north facade. North of the main corridor, away from the branch, two
    rows: the front row opens on the main corridor, each back-row room is
    reached through the room in front of it (consulting and examination
    rooms in pairs); beside the branch, a column of rooms on each side."""
    c = q(rng.uniform(1.6, 2.0))
    ds = q(rng.uniform(5.0, 6.0))
    front, back = q(rng.uniform(4.5, 5.5)), q(rng.uniform(3.6, 4.5))
    dn = front + back
    d = ds + c + dn
    module = rng.choice([3.0, 3.3, 3.6])
    bd = q(rng.uniform(4.0, 5.0))       # depth of the rooms beside the branch
    col = max(2, min(4, (n - 8) // 6))  # rooms in each column beside the branch
    outer = max(1, (n - 5 - 2 * col) // 3)  # columns of the two-row parts
    side_w = [module * rng.choice([1, 1, 1.5]) for _ in range(outer)]
    left_n = max(1, outer // 2)
    wl, wr = q(sum(side_w[:left_n])), q(sum(side_w[left_n:]) if outer > left_n else 0)
    w = q(wl + bd + c + bd + wr)
    xb = q(wl + bd)
    g = Drawing(w, d)
    g.add("corr_main", "Main corridor", (0, ds, w, ds + c), "circulation", True)
    g.add("corr_branch", "Branch corridor", (xb, ds + c, xb + c, d), "circulation", True)
    names = [("Treatment room", "care"), ("Staff room", "work"), ("Store", "storage"), ("Sluice", "service"),
             ("Clean utility", "service"), ("Office", "work"), ("WC", "service"), ("Records", "storage"),
             ("Nurse base", "care"), ("Plant room", "service"), ("Consulting room", "care")]
    k = 0
    # South row: consulting rooms either side of reception and waiting.
    recep = q(rng.uniform(6.0, 8.0))
    ws = pick_widths(rng, w - recep, [module, module, 1.5 * module], 2.6)
    cut = len(ws) // 2
    x = 0.0
    for i, cw in enumerate(ws):
        if i == cut:
            g.add("reception", "Reception and waiting", (x, 0, q(x + recep), ds), "care", True)
            x = q(x + recep)
        k += 1
        g.add(f"cons{k}", f"Consulting room {k}", (x, 0, w if i == len(ws) - 1 else q(x + cw), ds), "care")
        x = q(x + cw)
    # Columns beside the branch.
    for x0, x1 in ((xb - bd, xb), (xb + c, xb + c + bd)):
        for a, b in split(ds + c, d, [rng.uniform(0.8, 1.2) for _ in range(col)]):
            k += 1
            name, cat = names[k % len(names)]
            g.add(f"n{k}", f"{name} {k}", (x0, a, x1, b), cat)
    # Two-row parts: the back room of each pair is reached through the front one.
    for x0, x1 in ((0, xb - bd), (xb + c + bd, w)):
        if x1 - x0 < 2.4:
            continue
        for a, b in split(x0, x1, pick_widths(rng, x1 - x0, [module, module, 1.5 * module], 2.6)):
            k += 1
            g.add(f"cons{k}", f"Consulting room {k}", (a, ds + c, b, ds + c + front), "care")
            k += 1
            g.add(f"exam{k}", f"Examination room {k}", (a, ds + c + front, b, d), "care", via=f"cons{k - 1}")
    return g


def school(rng, n):
    """An assembly hall at the west end (a chair store off it), a spine
    corridor beside it from the south facade (the entrance) north, and
    teaching wings east of the spine: classrooms either side of a corridor
    that opens on the spine."""
    c = q(rng.uniform(2.0, 2.6))
    rooms_left = max(4, n - 4)
    bands = max(1, math.ceil(rooms_left / 16))
    per_band = math.ceil(rooms_left / bands)
    g = Drawing(0, 0)
    depths = []
    for _ in range(bands):
        depths.append((q(rng.uniform(6.5, 8.0)), q(rng.uniform(6.5, 8.0))))
    d = q(sum(a + b + c for a, b in depths))
    ah = q(rng.uniform(11, 16))
    length = q(max(per_band / 2, 2) * rng.uniform(6.5, 7.8))
    w = q(ah + c + length)
    g.w, g.d = w, d
    store = q(rng.uniform(2.4, 3.4))
    g.add("assembly", "Assembly hall", (0, store, ah, d), "assembly")
    g.add("chair_store", "Chair store", (0, 0, ah, store), "storage", via="assembly")
    g.add("spine", "Entrance corridor", (ah, 0, ah + c, d), "circulation", True)
    y = 0.0
    k = 0
    for bi, (s_d, n_d) in enumerate(depths):
        rows = ((y, y + s_d), (y + s_d + c, y + s_d + c + n_d))
        g.add(f"corr{bi + 1}", f"Wing corridor {bi + 1}", (ah + c, y + s_d, w, y + s_d + c), "circulation", True)
        for y0, y1 in rows:
            count = max(1, per_band // 2)
            sizes = [rng.choice([7.2, 7.8, 8.4]) if rng.random() < 0.7 else rng.choice([3.6, 4.2])
                     for _ in range(count)]
            for a, b in split(ah + c, w, sizes):
                k += 1
                if b - a < 5.0:
                    name, cat = rng.choice([("WC", "service"), ("Store", "storage"), ("Group room", "teaching"),
                                            ("Staff room", "work")])
                    g.add(f"r{k}", f"{name} {k}", (a, y0, b, y1), cat)
                else:
                    g.add(f"cls{k}", f"Classroom {k}", (a, y0, b, y1), "teaching")
        y = y1
    return g


def ring(rng, n):
    c = q(rng.uniform(1.6, 2.0))
    band = q(rng.uniform(4.8, 6.0))
    core_d = q(rng.uniform(5.0, 7.0))
    d = 2 * band + 2 * c + core_d
    module = rng.choice([2.7, 3.0, 3.6])
    per_row = max(2, (n - 9) // 2 - 1)
    w = q(per_row * module * rng.uniform(1.1, 1.4) + 2 * band)
    g = Drawing(w, d)
    y_s, y_n = band, d - band
    g.add("corr_s", "South corridor", (band, y_s, w - band, y_s + c), "circulation", True)
    g.add("corr_n", "North corridor", (band, y_n - c, w - band, y_n), "circulation", True)
    g.add("corr_w", "West corridor", (band, y_s + c, band + c, y_n - c), "circulation", True)
    g.add("corr_e", "East corridor", (w - band - c, y_s + c, w - band, y_n - c), "circulation", True)
    core = ["Stair", "Lift", "WC", "WC", "Shaft", "Store"][: rng.randint(3, 6)]
    xs = split(band + c, w - band - c, [1.0] * len(core))
    for k, (name, (a, b)) in enumerate(zip(core, xs)):
        # Core rooms run north–south across the core so each meets a corridor.
        g.add(f"core{k + 1}", f"{name} (core)", (a, y_s + c, b, y_n - c), "service")
    k = 0
    for y0, y1 in ((0, band), (d - band, d)):
        ws = pick_widths(rng, w, [module, module, 2 * module], 2.6)
        for a, b in split(0, w, ws):
            k += 1
            g.add(f"o{k}", f"Office {k}", (a, y0, b, y1), "work")
    for x0, x1 in ((0, band), (w - band, w)):
        ws = pick_widths(rng, y_n - y_s, [module, module, 1.5 * module], 2.6)
        for a, b in split(y_s, y_n, ws):
            k += 1
            g.add(f"o{k}", f"Office {k}", (x0, a, x1, b), "work")
    return g


MAKERS = {"office": office, "house": house, "pinwheel": pinwheel, "clinic": clinic, "school": school, "ring": ring}

# ------------------------------------------------------------ brief from plan


def shared(a, b):
    """Length of the wall two axis-aligned rectangles share (0 if none)."""
    ox = min(a[2], b[2]) - max(a[0], b[0])
    oy = min(a[3], b[3]) - max(a[1], b[1])
    if (abs(a[2] - b[0]) < 1e-6 or abs(b[2] - a[0]) < 1e-6) and oy > 1e-6:
        return oy
    if (abs(a[3] - b[1]) < 1e-6 or abs(b[3] - a[1]) < 1e-6) and ox > 1e-6:
        return ox
    return 0.0


def facade_contact(r, w, d):
    x0, y0, x1, y1 = r
    return {"N": x1 - x0 if y1 >= d - 1e-6 else 0.0, "S": x1 - x0 if y0 <= 1e-6 else 0.0,
            "E": y1 - y0 if x1 >= w - 1e-6 else 0.0, "W": y1 - y0 if x0 <= 1e-6 else 0.0}


def transform(g, rng):
    """Turn by a random quarter and mirror at random (north stays up in the file)."""
    turns, mirror = rng.randrange(4), rng.random() < 0.5
    w, d = g.w, g.d
    for r in g.rooms:
        x0, y0, x1, y1 = r["rect"]
        if mirror:
            x0, x1 = w - x1, w - x0
        ww, dd = w, d
        for _ in range(turns):  # quarter turn clockwise: (x, y) -> (y, W - x)
            x0, y0, x1, y1 = y0, ww - x1, y1, ww - x0
            ww, dd = dd, ww
        r["rect"] = tuple(round(v, 6) for v in (x0, y0, x1, y1))
    if turns % 2:
        g.w, g.d = d, w


def brief_of(g, rng, sketch):
    rooms, adjs = [], []
    by_id = {r["id"]: r for r in g.rooms}
    for r in g.rooms:
        x0, y0, x1, y1 = r["rect"]
        short, long_ = min(x1 - x0, y1 - y0), max(x1 - x0, y1 - y0)
        room = {"id": r["id"], "name": r["name"], "area": math.floor((x1 - x0) * (y1 - y0) * 100) / 100,
                "minWidth": math.floor(0.85 * short / 0.05) * 0.05, "category": r["category"]}
        room["minWidth"] = round(room["minWidth"], 2)
        if not r["circulation"] and rng.random() < 0.6:
            room["maxAspect"] = round(math.ceil(max(1.2 * long_ / short, 1.5) * 10) / 10, 1)
        contact = facade_contact(r["rect"], g.w, g.d)
        best = max(contact, key=contact.get)
        if contact[best] >= 1.5:
            u = rng.random()
            if u < 0.45:
                room["facade"] = [best]
            elif u < 0.6:
                room["facade"] = ["any"]
        rooms.append(room)
    circ = [r for r in g.rooms if r["circulation"]]
    pairs = set()
    for r in g.rooms:
        if r["circulation"]:
            continue
        # The circulation space it opens on, else the neighbour it is reached through.
        best, length = None, 0.0
        for c in circ:
            s = shared(r["rect"], c["rect"])
            if s > length:
                best, length = c, s
        if best is None or length < DOOR + 0.3 or r["via"]:
            via = by_id.get(r["via"]) if r["via"] in by_id else None
            cands = [via] if via else [o for o in g.rooms if o is not r]
            best, length = None, 0.0
            for o in cands:
                s = shared(r["rect"], o["rect"])
                if s > length:
                    best, length = o, s
        if best is not None and length >= DOOR + 0.3:
            pairs.add(tuple(sorted((r["id"], best["id"]))))
    # Circulation spaces that meet open into each other.
    for i, a in enumerate(circ):
        for b in circ[i + 1:]:
            if shared(a["rect"], b["rect"]) >= DOOR + 0.3:
                pairs.add(tuple(sorted((a["id"], b["id"]))))
    for a, b in sorted(pairs):
        adjs.append({"rooms": [a, b], "kind": "door", "priority": "must"})
    # A few wished walls between neighbours.
    neighbours = []
    for i, a in enumerate(g.rooms):
        for b in g.rooms[i + 1:]:
            if a["circulation"] or b["circulation"]:
                continue
            if shared(a["rect"], b["rect"]) >= 0.6 and tuple(sorted((a["id"], b["id"]))) not in pairs:
                neighbours.append((a["id"], b["id"]))
    rng.shuffle(neighbours)
    for a, b in neighbours[: max(1, len(g.rooms) // 6)]:
        adjs.append({"rooms": [a, b], "kind": "wall", "priority": "must" if rng.random() < 0.2 else "should"})
    brief = {"format": "abut.project", "version": 1, "units": "m",
             "footprint": {"width": round(g.w, 6), "depth": round(g.d, 6)}, "doorWidth": DOOR,
             "rooms": rooms, "adjacencies": adjs}
    if sketch:
        # Positions roughly where the rooms are (sketch units: 10 per metre, y to the north).
        sk = {}
        for r in g.rooms:
            x0, y0, x1, y1 = r["rect"]
            jitter = 0.15 * math.sqrt((x1 - x0) * (y1 - y0))
            sk[r["id"]] = [round(10 * ((x0 + x1) / 2 + rng.gauss(0, jitter)), 1),
                           round(10 * ((y0 + y1) / 2 + rng.gauss(0, jitter)), 1)]
        brief["sketch"] = sk
    return brief


def make(rng, kind=None, n=None, limit=60):
    """A brief of plan type `kind` with about n rooms (8 to `limit`; houses
    and pinwheel houses stay small)."""
    kind = kind or rng.choice(TYPES)
    n = n or rng.randint(8, limit)
    lo = {"house": 9, "pinwheel": 6}.get(kind, 8)
    hi = {"house": 14, "pinwheel": 20}.get(kind, limit)
    n = max(lo, min(hi, n))
    while True:  # the makers land near n rooms; keep to 8–limit
        g = MAKERS[kind](rng, n)
        if 8 <= len(g.rooms) <= limit:
            break
        n += 1 if len(g.rooms) < 8 else -2
    transform(g, rng)
    brief = brief_of(g, rng, sketch=rng.random() < 0.5)
    witness = {r["id"]: list(r["rect"]) for r in g.rooms}
    return kind, brief, witness


def generate(count, seed, sizes=None, types=None, limit=60):
    """`count` briefs in a fixed order for a seed: (kind, brief, witness)."""
    rng = random.Random(seed)
    types = types or TYPES
    out = []
    for k in range(count):
        kind = types[k % len(types)]
        n = rng.choice(sizes) if sizes else rng.randint(8, limit)
        out.append(make(rng, kind, n, limit))
    return out


if __name__ == "__main__":
    outdir, count = sys.argv[1], int(sys.argv[2])
    seed = int(sys.argv[3]) if len(sys.argv) > 3 else 1
    os.makedirs(outdir, exist_ok=True)
    for k, (kind, brief, witness) in enumerate(generate(count, seed)):
        json.dump(brief, open(os.path.join(outdir, f"b{k}.abut.json"), "w"), indent=1)
        json.dump({"kind": kind, "rooms": witness}, open(os.path.join(outdir, f"b{k}.witness.json"), "w"))
        print(f"b{k}: {kind}, {len(brief['rooms'])} rooms")
