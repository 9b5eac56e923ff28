# SPDX-License-Identifier: MIT
"""The clinic, office-floor and L-shaped studio samples, each read off a plan drawn here (the
witness), so that an exact answer is known to exist; the plans are invented
(room sizes are common practice, no source).

    /usr/bin/python3 tests/python/sample_plans.py write SAMPLES_DIR
        rewrites SAMPLES_DIR/clinic.abut.json, office-floor.abut.json and l-shaped-studio.abut.json
    /usr/bin/python3 tests/python/sample_plans.py check ABUT_CLI SAMPLES_DIR
        the test (CTest py_sample_plans): each sample matches its drawing,
        the drawing meets the sample's brief exactly (judged with shapely),
        and Abut's best variant is usable (plan_quality's judge, each room's
        own area tolerance); the family house's best variant meets every
        target within 10 % and everything else.

A brief is written as in plan_briefs.py: a door from each room to the
circulation space it opens on (or to the room it is reached through), a few
wished walls, facade wishes, minimum widths under the drawn ones.
"""
import json
import os
import subprocess
import sys
import tempfile

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import plan_quality  # noqa: E402

DOOR = 0.9  # m (common practice, no source)


def shared(a, b):
    return plan_quality.shared(a, b)


def clinic():
    """A single-storey clinic, 22 × 12.4 m: consulting and treatment rooms
    on both sides of a corridor, reception and entrance on the south
    facade, staff rooms to the north-east."""
    W, D = 22.0, 12.4
    rooms = [  # id, name, rect, category, minWidth, maxAspect, facade
        ("entry", "Entrance", (10.6, 0, 12.8, 5.0), "circulation", 2.0, None, ["S"]),
        ("reception", "Reception and waiting", (12.8, 0, 19.4, 5.0), "care", 4.0, 2.5, ["S"]),
        ("corridor_w", "West corridor", (0, 5.0, 16.0, 6.6), "circulation", 1.5, None, None),
        ("corridor_e", "East corridor", (16.0, 5.0, 22.0, 6.6), "circulation", 1.5, None, None),
        ("consult1", "Consulting room 1", (0, 0, 3.4, 5.0), "care", 3.0, 1.8, ["any"]),
        ("consult2", "Consulting room 2", (3.4, 0, 6.8, 5.0), "care", 3.0, 1.8, ["any"]),
        ("consult3", "Consulting room 3", (2.4, 6.6, 5.8, 12.4), "care", 3.0, 1.8, ["any"]),
        ("consult4", "Consulting room 4", (5.8, 6.6, 9.2, 12.4), "care", 3.0, 1.8, ["any"]),
        ("treatment", "Treatment room", (6.8, 0, 10.6, 5.0), "care", 3.2, 1.8, ["any"]),
        ("nurse", "Nurse station", (12.2, 6.6, 15.4, 9.8), "care", 2.7, None, None),
        ("dirty", "Dirty utility", (0, 6.6, 2.4, 9.6), "service", 2.0, None, None),
        ("clean", "Clean utility", (12.2, 9.8, 15.4, 12.4), "service", 2.0, None, None),
        ("store", "Store", (15.4, 6.6, 17.6, 9.0), "storage", 1.8, None, None),
        ("staff", "Staff room", (17.6, 6.6, 22.0, 12.4), "work", 3.6, 2.0, ["N"]),
        ("office", "Practice office", (9.2, 6.6, 12.2, 12.4), "work", 2.6, 2.2, ["N"]),
        ("wc_patient", "Patient WC", (19.4, 2.5, 22.0, 5.0), "service", 2.0, None, None),
        ("wc_access", "Accessible WC", (19.4, 0, 22.0, 2.5), "service", 2.2, None, None),
        ("wc_staff", "Staff WC and shower", (15.4, 9.0, 17.6, 12.4), "service", 1.8, None, None),
        ("plant", "Plant room", (0, 9.6, 2.4, 12.4), "service", 2.0, None, ["any"]),
    ]
    adj = [  # a, b, kind, priority
        ("entry", "reception", "door", "must"),
        ("reception", "corridor_w", "door", "must"),
        ("reception", "corridor_e", "door", "must"),
        ("corridor_w", "corridor_e", "wall", "must"),
        ("reception", "wc_access", "door", "must"),
        ("corridor_e", "wc_patient", "door", "must"),
        ("corridor_w", "consult1", "door", "must"),
        ("corridor_w", "consult2", "door", "must"),
        ("corridor_w", "consult3", "door", "must"),
        ("corridor_w", "consult4", "door", "must"),
        ("corridor_w", "treatment", "door", "must"),
        ("corridor_w", "dirty", "door", "must"),
        ("corridor_w", "office", "door", "must"),
        ("corridor_w", "nurse", "door", "must"),
        ("nurse", "clean", "door", "must"),
        ("corridor_e", "store", "door", "must"),
        ("corridor_e", "staff", "door", "must"),
        ("staff", "wc_staff", "door", "must"),
        ("entry", "corridor_w", "door", "should"),
        ("consult1", "consult2", "wall", "should"),
        ("consult3", "consult4", "wall", "should"),
        ("consult2", "treatment", "door", "should"),
        ("office", "nurse", "wall", "should"),
    ]
    return W, D, rooms, adj


def office_floor():
    """One floor of an office building, 62.4 × 12.2 m: offices and meeting
    rooms on both sides of a corridor (cut into four pieces), a stair and
    lift core at each end, WCs, print, kitchenette, server room and store
    between the offices."""
    W, D = 62.4, 12.2
    south, north = (0.0, 5.2), (7.0, 12.2)
    rooms = []

    def row(band, items):
        x = 0.0
        for rid, name, width, category, min_w, aspect, facade in items:
            rooms.append((rid, name, (round(x, 6), band[0], round(x + width, 6), band[1]), category, min_w,
                          aspect, facade))
            x += width
        assert abs(x - W) < 1e-6, x

    def office(k, width, side):
        return (f"office{k}", f"Office {k}", width, "work", 2.6, 2.0, [side])

    def meeting(k):
        return (f"office{k}", f"Meeting room {k}", 4.6, "work", 3.6, 1.6, ["N"])

    n_items = [("core_w", "West core (stair and lift)", 5.8, "circulation", 4.0, None, ["W"])]
    for block in (1, 9, 17, 25):
        n_items.append(meeting(block))
        n_items += [office(block + i, 2.7, "N") for i in (1, 2, 3)]
    n_items.append(("core_e", "East core (stair and lift)", 5.8, "circulation", 4.0, None, ["E"]))
    s_items = [("wc_w", "West WCs", 2.8, "service", 2.4, None, None)]
    s_items += [office(k, 3.05, "S") for k in (5, 6, 7, 8)]
    s_items.append(("print", "Print and copy", 1.8, "service", 1.6, None, None))
    s_items += [office(k, 3.05, "S") for k in (13, 14, 15, 16)]
    s_items.append(("kitchenette", "Kitchenette", 2.4, "service", 2.0, None, None))
    s_items.append(("server", "Server room", 1.8, "service", 1.6, None, None))
    s_items += [office(k, 3.05, "S") for k in (21, 22, 23, 24)]
    s_items.append(("store", "Store", 2.0, "storage", 1.6, None, None))
    s_items += [office(k, 3.05, "S") for k in (29, 30, 31, 32)]
    s_items.append(("wc_e", "East WCs", 2.8, "service", 2.4, None, None))
    row(north, n_items)
    row(south, s_items)
    corridors = []
    for k in range(4):
        rid = f"corr{k + 1}"
        rooms.append((rid, f"Corridor {k + 1}", (W / 4 * k, 5.2, W / 4 * (k + 1), 7.0), "circulation", 1.6,
                      None, None))
        corridors.append(rid)
    rects = {r[0]: r[2] for r in rooms}
    adj = [(corridors[k], corridors[k + 1], "wall", "must") for k in range(3)]
    # A door from every room to the corridor piece it shares most wall with.
    for rid, *_ in rooms:
        if rid in corridors:
            continue
        best = max(corridors, key=lambda c: shared(rects[rid], rects[c]))
        assert shared(rects[rid], rects[best]) >= DOOR, rid
        adj.append((rid, best, "door", "must"))
    # Wished walls between a few neighbours.
    for a, b in [("office1", "office2"), ("office9", "office10"), ("office17", "office18"), ("office25", "office26"),
                 ("print", "office13"), ("server", "office21"), ("kitchenette", "server")]:
        adj.append((a, b, "wall", "should"))
    order = ["corr1", "corr2", "corr3", "corr4"] + [f"office{k}" for k in range(1, 33)] + \
        ["core_w", "core_e", "wc_w", "wc_e", "print", "kitchenette", "server", "store"]
    rooms.sort(key=lambda r: order.index(r[0]))
    return W, D, rooms, adj


def l_shaped_studio():
    """An upper floor of a small design studio on an L-shaped footprint
    (24 × 18 m less a 12 × 9 m cut-out at the north-east: the roof terrace of
    the floor below): a south wing and a west wing, each with a corridor, a
    stair and lift core fixed at the junction (it lines up with the floors
    below)."""
    W, D = 24.0, 18.0
    cut = (12.0, 9.0, 24.0, 18.0)
    rooms = []

    def add(rid, name, rect, category, min_w, aspect, facade):
        rooms.append((rid, name, rect, category, min_w, aspect, facade))

    add("reception", "Reception", (0.0, 0.0, 6.3, 4.5), "circulation", 3.6, None, ["S"])
    add("office_a", "Office A", (6.3, 0.0, 10.2, 4.5), "work", 3.0, 2.0, ["S"])
    add("office_b", "Office B", (10.2, 0.0, 14.1, 4.5), "work", 3.0, 2.0, ["S"])
    add("meeting", "Meeting room", (14.1, 0.0, 19.5, 4.5), "work", 4.0, 1.6, ["S"])
    add("office_c", "Office C", (19.5, 0.0, 24.0, 4.5), "work", 3.4, 2.0, ["E"])
    add("corr_s", "South corridor", (6.3, 4.5, 24.0, 6.3), "circulation", 1.5, None, None)
    add("corr_w", "West corridor", (4.5, 4.5, 6.3, 18.0), "circulation", 1.5, None, None)
    add("core", "Stair and lift", (6.3, 6.3, 9.3, 9.0), "circulation", 2.4, None, None)
    add("wc", "WCs", (9.3, 6.3, 12.3, 9.0), "service", 2.2, None, None)
    add("store", "Store", (12.3, 6.3, 14.7, 9.0), "storage", 2.0, None, None)
    add("kitchenette", "Kitchenette", (14.7, 6.3, 18.3, 9.0), "service", 2.2, None, ["N"])
    add("print", "Print room", (18.3, 6.3, 21.0, 9.0), "service", 2.2, None, None)
    add("plant", "Plant room", (21.0, 6.3, 24.0, 9.0), "service", 2.2, None, None)
    add("office_d", "Office D", (0.0, 4.5, 4.5, 8.4), "work", 3.2, 2.0, ["W"])
    add("office_e", "Office E", (0.0, 8.4, 4.5, 12.3), "work", 3.2, 2.0, ["W"])
    add("office_f", "Office F", (0.0, 12.3, 4.5, 15.3), "work", 2.6, 2.0, ["W"])
    add("office_g", "Office G", (0.0, 15.3, 4.5, 18.0), "work", 2.3, 2.0, ["N"])
    add("studio", "Studio", (6.3, 9.0, 12.0, 14.4), "work", 4.6, 1.6, ["E"])
    add("quiet", "Quiet room", (6.3, 14.4, 12.0, 18.0), "work", 3.0, 2.0, ["N"])
    rects = {r[0]: r[2] for r in rooms}
    corridors = ["corr_s", "corr_w"]
    adj = [("corr_s", "corr_w", "wall", "must")]
    for rid, *_ in rooms:
        if rid in corridors:
            continue
        best = max(corridors, key=lambda c: shared(rects[rid], rects[c]))
        assert shared(rects[rid], rects[best]) >= DOOR, rid
        adj.append((rid, best, "door", "must"))
    for a, b in [("office_a", "office_b"), ("print", "plant"), ("studio", "quiet")]:
        adj.append((a, b, "wall", "should"))
    extra = {"cutouts": [{"x": cut[0], "y": cut[1], "width": cut[2] - cut[0], "depth": cut[3] - cut[1]}],
             "fixed": ["core"]}
    return W, D, rooms, adj, extra


SAMPLES = {"clinic": clinic, "office-floor": office_floor, "l-shaped-studio": l_shaped_studio}


def area(rect):
    return round((rect[2] - rect[0]) * (rect[3] - rect[1]), 4)


def brief_of(name):
    W, D, rooms, adj, *more = SAMPLES[name]()
    extra = more[0] if more else {}
    out = {"format": "abut.project", "version": 1, "units": "m", "footprint": {"width": W, "depth": D},
           "doorWidth": DOOR, "rooms": [], "adjacencies": [], "sketch": {}}
    if extra.get("cutouts"):
        out["footprint"]["cutouts"] = extra["cutouts"]
    for rid, label, rect, category, min_w, aspect, facade in rooms:
        r = {"id": rid, "name": label, "area": area(rect), "minWidth": min_w, "category": category}
        if aspect:
            r["maxAspect"] = aspect
        if facade:
            r["facade"] = facade
        if rid in extra.get("fixed", []):
            r["fixed"] = {"x": rect[0], "y": rect[1], "width": round(rect[2] - rect[0], 6),
                          "depth": round(rect[3] - rect[1], 6)}
        out["rooms"].append(r)
        # Bubble positions: the drawing's room centres, 14 units per metre,
        # y northwards as in the plan.
        out["sketch"][rid] = [round(7 * (rect[0] + rect[2]) - 7 * W, 1), round(7 * (rect[1] + rect[3]) - 7 * D, 1)]
    for a, b, kind, priority in adj:
        out["adjacencies"].append({"rooms": [a, b], "kind": kind, "priority": priority})
    return out, {rid: rect for rid, _, rect, *_ in rooms}


def write(samples):
    for name in SAMPLES:
        brief, _ = brief_of(name)
        with open(os.path.join(samples, name + ".abut.json"), "w") as f:
            json.dump(brief, f, indent=2)
            f.write("\n")


def best_variant_misses(cli, path, brief, band):
    """What Abut's best variant for the sample at `path` misses (plan_quality's
    judge), and the time to its first usable plan."""
    with tempfile.TemporaryDirectory() as tmp:
        out = os.path.join(tmp, "plan.json")
        r = subprocess.run([cli, "plan", path, "-o", out, "--time-limit", "30", "--threads", "1"],
                           capture_output=True, text=True)
        if r.returncode != 0:
            return [f"plan exited {r.returncode}: {r.stderr.strip()}"], None
        plan = json.load(open(out))
    rooms, spaces = plan_quality.plan_rooms(plan["variants"][0])
    return plan_quality.misses(brief, rooms, spaces, band=band), plan.get("search", {}).get("firstUsableSeconds")


def check(cli, samples):
    failures = 0
    # The family house has no drawing here (its footprint leaves 7 m² over,
    # which stands as a spare space): its best variant must still meet every
    # target within 10 % with nothing else missed.
    path = os.path.join(samples, "family-house.abut.json")
    house = json.load(open(path))
    miss, seconds = best_variant_misses(cli, path, house, 0.10)
    print(f"family-house: {len(house['rooms'])} rooms; best variant: "
          f"{'usable' if not miss else '; '.join(miss)}; first usable plan after {seconds} s")
    failures += bool(miss)
    for name in SAMPLES:
        path = os.path.join(samples, name + ".abut.json")
        sample = json.load(open(path))
        brief, witness = brief_of(name)
        if sample["rooms"] != brief["rooms"] or sample["adjacencies"] != brief["adjacencies"] or \
                sample["footprint"] != brief["footprint"]:
            print(f"{name}: the sample is not the brief read off its drawing (run 'write')")
            failures += 1
            continue
        miss = plan_quality.misses(brief, witness, band=1e-6)
        if miss:
            print(f"{name}: the drawing does not meet its own brief: " + "; ".join(miss))
            failures += 1
        band = max(x.get("areaTolerance", 0.05) for x in brief["rooms"])
        miss, seconds = best_variant_misses(cli, path, brief, band)
        print(f"{name}: {len(brief['rooms'])} rooms; best variant: "
              f"{'usable' if not miss else '; '.join(miss)}; first usable plan after {seconds} s")
        failures += bool(miss)
    return failures


if __name__ == "__main__":
    if len(sys.argv) == 3 and sys.argv[1] == "write":
        write(sys.argv[2])
    elif len(sys.argv) == 4 and sys.argv[1] == "check":
        sys.exit(1 if check(sys.argv[2], sys.argv[3]) else 0)
    else:
        sys.exit(__doc__)
