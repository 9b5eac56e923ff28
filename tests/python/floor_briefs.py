# SPDX-License-Identifier: MIT
"""Briefs of professional floors, 40 to 400 rooms, read off plans drawn here;
each is kept with the plan it was read from (the witness), so an exact answer
is known to exist.

Floor types (all invented, drawn on a rectangular footprint, then turned and
mirrored at random):
  hotel    a double-loaded corridor in pieces of at most ~26 m; guest rooms
           on both facades, each reached through its own entry from the
           corridor with a bathroom beside the entry; a stair at each end
           and a lift lobby with two lifts in the middle; linen rooms
  flats    a double-loaded corridor; each flat a column between corridor and
           facade: a hall along the corridor and its rooms behind it (living
           room, kitchen, bedrooms, bathroom), every room opening on the hall;
           stairs at the ends, a lift by the corridor
  ward     a ring of four corridors round a block of support rooms (opening
           on the ring), patient rooms along both long facades, some with a
           shower room reached through them; stairs and day rooms at the ends
  office2  two corridors and three bands of rooms: offices on each facade,
           meeting rooms, stores and a core between the corridors; a cross
           corridor joining the two at each end, by the stairs
Dimensions follow a 0.05 m grid; room sizes are common practice for each kind
of room (no source). The brief is written as plan_briefs.brief_of writes it
(doors to the circulation a room opens on or to the room it is reached
through, a few wished walls, facade wishes for some rooms on the outline,
minimum widths 15 % under the drawn ones, aspect limits for some rooms).

    /usr/bin/python3 tests/python/floor_briefs.py OUTDIR COUNT [SEED] [ROOMS]
writes OUTDIR/f<k>.abut.json and OUTDIR/f<k>.witness.json.
"""
import json
import math
import os
import random
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
from plan_briefs import Drawing, brief_of, pick_widths, q, split, transform  # noqa: E402

TYPES = ["hotel", "flats", "ward", "office2"]


def corridor_pieces(g, x0, x1, y0, y1, prefix, name, longest=26.0):
    """A corridor from x0 to x1 in pieces of at most `longest` metres; their ids."""
    pieces = max(1, math.ceil((x1 - x0) / longest))
    ids = []
    for k, (a, b) in enumerate(split(x0, x1, [1] * pieces)):
        rid = f"{prefix}{k + 1}"
        g.add(rid, name + (f" {k + 1}" if pieces > 1 else ""), (a, y0, b, y1), "circulation", True)
        ids.append(rid)
    return ids


def hotel(rng, n):
    c = q(rng.uniform(1.6, 2.0))
    room_depth = q(rng.uniform(5.8, 7.2))
    entry_depth = q(rng.uniform(2.2, 2.6))
    module = rng.choice([3.6, 3.75, 3.9, 4.2])
    d = 2 * (room_depth + entry_depth) + c
    suites = max(4, round(n / 3) - 3)
    per_side = math.ceil(suites / 2)
    stair = q(rng.uniform(3.4, 4.2))
    core = q(rng.uniform(5.0, 6.5))
    inner = per_side * module
    w = q(inner + 2 * stair + core)
    g = Drawing(w, d)
    ys, yc, yn = 0.0, room_depth + entry_depth, room_depth + entry_depth + c
    # Stairs at the ends take the corridor band and the north rows; linen rooms below them.
    g.add("stair_w", "Stair west", (0, yc, stair, d), "circulation", True)
    g.add("stair_e", "Stair east", (w - stair, yc, w, d), "circulation", True)
    g.add("linen_w", "Linen room west", (0, 0, stair, yc), "service")
    g.add("linen_e", "Linen room east", (w - stair, 0, w, yc), "service")
    corridor_pieces(g, stair, w - stair, yc, yn, "corr", "Corridor")
    # The lift lobby in the middle of the north side, two lifts behind it.
    mid = q(stair + inner / 2 - core / 2 + (per_side % 2) * module / 2)
    g.add("lobby", "Lift lobby", (mid, yn, mid + core, yn + entry_depth + 1.0), "circulation", True)
    g.add("lift1", "Lift 1", (mid, yn + entry_depth + 1.0, mid + core / 2, d), "core", via="lobby")
    g.add("lift2", "Lift 2", (mid + core / 2, yn + entry_depth + 1.0, mid + core, d), "core", via="lobby")
    count = 0
    for side in ("S", "N"):
        spans = [(stair, mid), (mid + core, w - stair)] if side == "N" else [(stair, w - stair)]
        for a0, a1 in spans:
            k = max(1, round((a1 - a0) / module))
            for x0, x1 in split(a0, a1, [1] * k):
                count += 1
                bath = q(min(2.2, (x1 - x0) - 1.45))  # the entry keeps a door's width and frame
                if side == "S":
                    room, zone = (x0, 0, x1, room_depth), (room_depth, yc)
                else:
                    room, zone = (x0, d - room_depth, x1, d), (yn, d - room_depth)
                g.add(f"entry{count}", f"Entry {count}", (x0, zone[0], x1 - bath, zone[1]), "circulation")
                g.add(f"bath{count}", f"Bathroom {count}", (x1 - bath, zone[0], x1, zone[1]), "service",
                      via=f"entry{count}")
                g.add(f"guest{count}", f"Guest room {count}", room, "sleeping", via=f"entry{count}")
    return g


def flats(rng, n):
    c = q(rng.uniform(1.5, 1.9))
    hall = q(rng.uniform(1.3, 1.6))
    depth = q(rng.uniform(7.5, 9.5))
    d = 2 * (hall + depth) + c
    count_flats = max(2, round(n / 5.5))
    per_side = math.ceil(count_flats / 2)
    stair = q(rng.uniform(3.5, 4.2))
    # Each flat's rooms in a row behind its hall, at widths usual for them (metres along the hall).
    plans = []
    for _ in range(per_side):
        kinds = [("living", "Living room", 3.6, 4.5), ("kitchen", "Kitchen", 2.4, 3.0),
                 ("bath", "Bathroom", 2.0, 2.4)]
        kinds += [(f"bed{b + 1}", f"Bedroom {b + 1}", 2.8, 3.4) for b in range(rng.choice([1, 1, 2, 2, 3]))]
        rng.shuffle(kinds)
        plans.append([(rid, name, q(rng.uniform(lo, hi))) for rid, name, lo, hi in kinds])
    inner = q(sum(sum(wd for _, _, wd in p) for p in plans))
    w = q(inner + 2 * stair)
    g = Drawing(w, d)
    yc, yn = hall + depth, hall + depth + c
    g.add("stair_w", "Stair west", (0, yc, stair, d), "circulation", True)
    g.add("stair_e", "Stair east", (w - stair, 0, w, yn), "circulation", True)
    g.add("lift", "Lift", (0, 0, stair, yc), "core")
    g.add("store", "Bicycle store", (w - stair, yn, w, d), "service")
    corridor_pieces(g, stair, w - stair, yc, yn, "corr", "Corridor")
    flat = 0
    for side in ("S", "N"):
        x = stair
        order = plans if side == "S" else plans[::-1]
        for rooms in order:
            flat += 1
            x0, x1 = x, q(x + sum(wd for _, _, wd in rooms))
            x = x1
            h0, h1 = (depth, yc) if side == "S" else (yn, yn + hall)
            r0, r1 = (0, depth) if side == "S" else (yn + hall, d)
            hall_id = f"f{flat}hall"
            # The hall is the flat's own: it opens on the corridor, not on the next flat's hall.
            g.add(hall_id, f"Hall of flat {flat}", (x0, h0, x1, h1), "circulation")
            a = x0
            for k, (rid, name, wd) in enumerate(rooms):
                b = x1 if k == len(rooms) - 1 else q(a + wd)
                cat = "service" if rid in ("kitchen", "bath") else "living" if rid == "living" else "sleeping"
                g.add(f"f{flat}{rid}", f"{name}, flat {flat}", (a, r0, b, r1), cat, via=hall_id)
                a = b
    return g


def ward(rng, n):
    """One ring per ward of about 110 rooms, the wards side by side, an end
    zone (corner rooms, a stair, a day room) before, between and after them."""
    c = q(rng.uniform(1.8, 2.4))
    dp = q(rng.uniform(5.0, 6.0))
    e = q(rng.uniform(4.0, 5.0))
    centre = q(rng.uniform(8.0, 11.0))
    d = 2 * (dp + c) + centre
    module = rng.choice([3.3, 3.6, 3.9])
    rings = max(1, round(n / 110))
    per_ring = n / rings
    per_side = max(3, math.ceil(max(6, round((per_ring - 12) * 0.6)) / 2))
    inner = q(per_side * module)
    span = inner + 2 * c  # a ring's outer width
    w = q(rings * span + (rings + 1) * e)
    g = Drawing(w, d)
    names = ["Treatment room", "Store", "Office", "Pantry", "Linen store", "Equipment", "Doctors' room",
             "Nurses' room", "Interview room", "Consulting room", "Staff WC", "Cleaner"]
    ends = ["Staff base", "Clean utility", "Dirty utility", "Sluice room", "Store", "Office"]
    mid = q(dp + c + centre / 2)
    for z in range(rings + 1):  # end zones
        a = q(z * (span + e))
        b = q(a + e)
        g.add(f"corner{z}s", rng.choice(ends) + f" {z + 1}", (a, 0, b, dp + c), "service")
        g.add(f"corner{z}n", rng.choice(ends) + f" {z + 1}n", (a, d - dp - c, b, d), "service")
        g.add(f"stair{z}", f"Stair {z + 1}", (a, dp + c, b, mid), "circulation", True)
        g.add(f"day{z}", f"Day room {z + 1}", (a, mid, b, d - dp - c), "living")
    patient = sup = 0
    for k in range(rings):
        x0 = q(k * (span + e) + e)
        x1 = q(x0 + span)
        t = f"w{k + 1}"
        g.add(f"{t}s", f"South corridor, ward {k + 1}", (x0, dp, x1, dp + c), "circulation", True)
        g.add(f"{t}n", f"North corridor, ward {k + 1}", (x0, d - dp - c, x1, d - dp), "circulation", True)
        g.add(f"{t}w", f"West corridor, ward {k + 1}", (x0, dp + c, x0 + c, d - dp - c), "circulation", True)
        g.add(f"{t}e", f"East corridor, ward {k + 1}", (x1 - c, dp + c, x1, d - dp - c), "circulation", True)
        for y0, y1 in ((0, dp), (d - dp, d)):
            for a, b in split(x0, x1, [1] * max(1, round((x1 - x0) / module))):
                patient += 1
                if rng.random() < 0.35 and b - a >= 3.3:  # a shower room beside it, reached through the room
                    sh = q(1.6)
                    g.add(f"pat{patient}", f"Patient room {patient}", (a, y0, b - sh, y1), "sleeping")
                    g.add(f"shower{patient}", f"Shower room {patient}", (b - sh, y0, b, y1), "service",
                          via=f"pat{patient}")
                else:
                    g.add(f"pat{patient}", f"Patient room {patient}", (a, y0, b, y1), "sleeping")
        # The support block inside the ring: a row along each long corridor.
        cx0, cx1, cy0, cy1 = x0 + c, x1 - c, dp + c, d - dp - c
        for ya, yb in ((cy0, mid), (mid, cy1)):
            ws = pick_widths(rng, cx1 - cx0, [2.7, 3.0, 3.6, 4.2], 2.4)
            for a, b in split(cx0, cx1, ws):
                sup += 1
                g.add(f"sup{sup}", rng.choice(names) + f" {sup}", (a, ya, b, yb), "service")
    return g


def office2(rng, n):
    c = q(rng.uniform(1.6, 2.0))
    dn, ds = q(rng.uniform(4.8, 6.0)), q(rng.uniform(4.8, 6.0))
    dm = q(rng.uniform(5.0, 7.0))
    d = dn + c + dm + c + ds
    module = rng.choice([2.7, 3.0, 3.6])
    per_band = max(6, round((n - 10) / 3))
    inner = q(per_band * module)
    stair = q(rng.uniform(3.6, 4.4))
    w = q(inner + 2 * stair)
    g = Drawing(w, d)
    ya0, ya1 = ds, ds + c            # south corridor
    yb0, yb1 = ds + c + dm, ds + 2 * c + dm  # north corridor
    south = corridor_pieces(g, stair, w - stair, ya0, ya1, "cs", "South corridor")
    north = corridor_pieces(g, stair, w - stair, yb0, yb1, "cn", "North corridor")
    # The ends: a cross corridor joining the two, a stair beyond each.
    for side, (a, b) in (("w", (0, stair)), ("e", (w - stair, w))):
        g.add(f"cross_{side}", f"Cross corridor {side.upper()}", (a, ya0, b, yb1), "circulation", True)
        g.add(f"stair_{side}s", "Stair", (a, 0, b, ya0), "circulation", True)
        g.add(f"stair_{side}n", "Stair", (a, yb1, b, d), "circulation", True)
    count = 0
    service = ["WC", "Print room", "Kitchenette", "Store", "Server room", "Archive", "Cleaner"]
    for band, (y0, y1) in (("S", (0, ya0)), ("M", (ya1, yb0)), ("N", (yb1, d))):
        ws = pick_widths(rng, w - 2 * stair, [module, module, module, 2 * module, 1.5 * module], 2.4)
        for a, b in split(stair, w - stair, ws):
            count += 1
            if band == "M" and rng.random() < 0.4 and service:
                g.add(f"svc{count}", service.pop(rng.randrange(len(service))), (a, y0, b, y1), "service")
            elif b - a > 1.8 * module or band == "M":
                g.add(f"meet{count}", f"Meeting room {count}", (a, y0, b, y1), "work")
            else:
                g.add(f"off{count}", f"Office {count}", (a, y0, b, y1), "work")
    return g


def align_pieces(g):
    """Moves each cut between two corridor pieces to the nearest place where
    it leaves every room along the corridor at least a door's width (1.2 m
    with its frame) on one piece: such a room could open on neither."""
    pieces = [r for r in g.rooms if r["circulation"]]
    for a in pieces:
        for b in pieces:
            ax0, ay0, ax1, ay1 = a["rect"]
            bx0, by0, bx1, by1 = b["rect"]
            if abs(ax1 - bx0) > 1e-6 or abs(ay0 - by0) > 1e-6 or abs(ay1 - by1) > 1e-6:
                continue
            along = [r["rect"] for r in g.rooms if not r["circulation"] and
                     (abs(r["rect"][3] - ay0) < 1e-6 or abs(r["rect"][1] - ay1) < 1e-6)]

            def fine(x):
                return all(not (rx0 < x - 1e-6 and x + 1e-6 < rx1) or max(x - rx0, rx1 - x) >= 1.2
                           for rx0, _, rx1, _ in along)
            spots = sorted({ax1} | {v for rx0, _, rx1, _ in along for v in (rx0, rx1)}, key=lambda v: abs(v - ax1))
            for x in spots:
                if x - ax0 > 2.0 and bx1 - x > 2.0 and fine(x):
                    a["rect"] = (ax0, ay0, x, ay1)
                    b["rect"] = (x, by0, bx1, by1)
                    break


MAKERS = {"hotel": hotel, "flats": flats, "ward": ward, "office2": office2}


def make(rng, kind, n):
    """A brief of floor type `kind` with about n rooms (40 to 400): the
    makers land near n; within ±20 % of it."""
    want = n
    for _ in range(12):
        g = MAKERS[kind](rng, n)
        if abs(len(g.rooms) - want) <= 0.2 * want:
            break
        n = max(10, round(n * want / len(g.rooms)))
    align_pieces(g)
    transform(g, rng)
    brief = brief_of(g, rng, sketch=rng.random() < 0.5)
    witness = {r["id"]: list(r["rect"]) for r in g.rooms}
    return brief, witness


def generate(count, seed, sizes=(40, 250)):
    """`count` briefs in a fixed order for a seed: (kind, brief, witness);
    room counts drawn from `sizes` (a range) or one size."""
    rng = random.Random(seed)
    out = []
    for k in range(count):
        kind = TYPES[k % len(TYPES)]
        n = rng.randint(*sizes) if len(sizes) == 2 else sizes[0]
        brief, witness = make(rng, kind, n)
        out.append((kind, brief, witness))
    return out


if __name__ == "__main__":
    outdir, count = sys.argv[1], int(sys.argv[2])
    seed = int(sys.argv[3]) if len(sys.argv) > 3 else 1
    sizes = (int(sys.argv[4]),) if len(sys.argv) > 4 else (40, 250)
    os.makedirs(outdir, exist_ok=True)
    for k, (kind, brief, witness) in enumerate(generate(count, seed, sizes)):
        json.dump(brief, open(os.path.join(outdir, f"f{k}.abut.json"), "w"), indent=1)
        json.dump({"kind": kind, "rooms": witness}, open(os.path.join(outdir, f"f{k}.witness.json"), "w"))
        print(f"f{k}: {kind}, {len(brief['rooms'])} rooms")
