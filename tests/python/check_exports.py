# SPDX-License-Identifier: MIT
"""Exports read back by independent tools, as a user's CAD and PDF viewer
would: DXF through ezdxf (audit clean; $INSUNITS 6 for metres and 2 for feet,
DXF reference as read by ezdxf; room polylines equal the plan's rectangles;
the OUTLINE polylines enclose the footprint less its cut-outs, by shapely);
the PDF sheet through poppler (pdfinfo: ISO 216 A3 = 297 × 420 mm and A4 =
210 × 297 mm; pdftotext: every room name, the totals and the stated scale;
pdftoppm: the drawn outline measures footprint ÷ scale); CSV through Python's
csv module (a header row, one row per room, totals adding up); SVG through
xml.etree (one rect per room); PNG by its signature."""
import csv
import io
import json
import os
import random
import re
import subprocess
import sys
import tempfile
import unicodedata
import xml.etree.ElementTree as ET

import ezdxf
from shapely.geometry import Polygon, box

cli, samples = sys.argv[1], sys.argv[2]
failures, checked = [], 0
OUTLINE = (0x1F, 0x3A, 0x93)


def run(*args):
    r = subprocess.run([cli, *args], capture_output=True, text=True)
    if r.returncode != 0:
        raise RuntimeError(f"{' '.join(args)} exited {r.returncode}: {r.stderr.strip()}")


def fail(msg):
    failures.append(msg)


def check(project, tmp):
    global checked
    brief = json.load(open(project))
    name = os.path.basename(project)
    units = brief.get("units", "m")
    base = os.path.join(tmp, "x")
    run("plan", project, "-o", base + ".plan.json")
    plan = json.load(open(base + ".plan.json"))
    v = plan["variants"][0]
    for ext in ("dxf", "pdf", "svg", "png", "csv"):
        run("export", project, "-o", base + "." + ext)
    run("export", project, "-o", base + "-a4.pdf", "--sheet", "A4")

    # DXF
    doc = ezdxf.readfile(base + ".dxf")
    audit = doc.audit()
    if audit.has_errors:
        fail(f"{name}: ezdxf audit errors: {[e.message for e in audit.errors][:3]}")
    want_units = 2 if units == "ft" else 6
    if doc.header.get("$INSUNITS") != want_units:
        fail(f"{name}: $INSUNITS {doc.header.get('$INSUNITS')}, expected {want_units}")
    polys = []
    for e in doc.modelspace().query("LWPOLYLINE"):
        if e.dxf.layer.startswith("ROOM-"):
            pts = [(p[0], p[1]) for p in e.get_points()]
            xs, ys = [p[0] for p in pts], [p[1] for p in pts]
            polys.append((min(xs), min(ys), max(xs), max(ys)))
    rects = [(r["x"], r["y"], r["x"] + r["width"], r["y"] + r["depth"]) for r in v["rooms"]]
    if len(polys) != len(rects):
        fail(f"{name}: {len(polys)} room polylines for {len(rects)} rooms")
    else:
        left = list(polys)
        for r in rects:
            match = [p for p in left if all(abs(a - b) < 1e-5 for a, b in zip(p, r))]
            if not match:
                fail(f"{name}: no polyline equals room rectangle {r}")
                break
            left.remove(match[0])
    # The outline: closed polylines round the building (one round the outside,
    # one per courtyard) enclosing exactly the footprint less its cut-outs.
    fp = brief["footprint"]
    net = box(0, 0, fp["width"], fp["depth"])
    for c in fp.get("cutouts", []):
        net = net.difference(box(c["x"], c["y"], c["x"] + c["width"], c["y"] + c["depth"]))
    loops = [Polygon([(p[0], p[1]) for p in e.get_points()])
             for e in doc.modelspace().query("LWPOLYLINE") if e.dxf.layer == "OUTLINE"]
    if not loops or not all(e.closed for e in doc.modelspace().query("LWPOLYLINE") if e.dxf.layer == "OUTLINE"):
        fail(f"{name}: DXF outline missing or not closed")
    else:
        outer = max(loops, key=lambda q: q.area)
        drawn = outer
        for q in loops:
            if q is not outer:
                drawn = drawn.difference(q)
        if abs(drawn.area - net.area) > 1e-6 * net.area or drawn.symmetric_difference(net).area > 1e-6 * net.area:
            fail(f"{name}: DXF outline encloses {drawn.area:.3f}, the footprint less its cut-outs is {net.area:.3f}")
    names = {t.dxf.text for t in doc.modelspace().query("TEXT")}
    for room in brief["rooms"]:
        label = room.get("name", room["id"])
        if label.isascii() and label not in names:
            fail(f"{name}: DXF has no label {label!r}")

    # PDF
    for path, size in ((base + ".pdf", (420, 297)), (base + "-a4.pdf", (297, 210))):
        info = subprocess.run(["pdfinfo", path], capture_output=True, text=True).stdout
        m = re.search(r"Page size:\s+([\d.]+) x ([\d.]+) pts", info)
        got = (float(m.group(1)) * 25.4 / 72, float(m.group(2)) * 25.4 / 72) if m else (0, 0)
        if abs(got[0] - size[0]) > 1 or abs(got[1] - size[1]) > 1:
            fail(f"{name}: {os.path.basename(path)} is {got[0]:.0f} × {got[1]:.0f} mm, expected {size[0]} × {size[1]} (ISO 216, landscape)")
    # NFKC folds typographic ligatures (ﬁ, ﬃ) that a PDF may hold back into letters.
    text = unicodedata.normalize("NFKC", subprocess.run(["pdftotext", base + ".pdf", "-"],
                                                        capture_output=True, text=True).stdout)
    flat = " ".join(text.split())
    for room in brief["rooms"]:
        label = room.get("name", room["id"])
        if " ".join(label.split()) not in flat:
            fail(f"{name}: PDF text lacks room {label!r}")
    total = sum(r["area"] for r in brief["rooms"])
    if f"{total:.1f}" not in text or "Total rooms" not in text:
        fail(f"{name}: PDF text lacks the total {total:.1f}")
    if "Caution" not in text:
        fail(f"{name}: PDF lacks the caution")
    m = re.search(r"Scale 1:(\d+)", text)
    if not m:
        fail(f"{name}: PDF states no scale")
    else:
        denom = int(m.group(1))
        dpi = 100
        subprocess.run(["pdftoppm", "-r", str(dpi), base + ".pdf", base + "-page"], check=True)
        page = [f for f in os.listdir(tmp) if f.startswith("x-page")][0]
        width_px = outline_width(os.path.join(tmp, page))
        os.remove(os.path.join(tmp, page))
        unit_mm = 304.8 if units == "ft" else 1000.0
        want_mm = plan["footprint"]["width"] * unit_mm / denom
        got_mm = width_px * 25.4 / dpi
        if abs(got_mm - want_mm) > 1.5:
            fail(f"{name}: outline drawn {got_mm:.1f} mm wide, scale 1:{denom} says {want_mm:.1f} mm")

    # CSV
    rows = list(csv.reader(io.StringIO(open(base + ".csv", encoding="utf-8").read())))
    header, body = rows[0], rows[1:]
    if header[0] != "room" or not header[3].startswith("target"):
        fail(f"{name}: CSV header {header}")
    rooms = [r for r in body if r[0] not in ("TOTAL", "SPARE", "FOOTPRINT")]
    if len(rooms) != len(brief["rooms"]):
        fail(f"{name}: CSV has {len(rooms)} room rows")
    tot = [r for r in body if r[0] == "TOTAL"][0]
    if abs(sum(float(r[3]) for r in rooms) - float(tot[3])) > 0.01 * len(rooms) or \
       abs(sum(float(r[4]) for r in rooms) - float(tot[4])) > 0.01 * len(rooms):
        fail(f"{name}: CSV totals do not add up")
    spare = float([r for r in body if r[0] == "SPARE"][0][4])
    foot = float([r for r in body if r[0] == "FOOTPRINT"][0][4])
    if abs(float(tot[4]) + spare - foot) > 0.02 * (len(rooms) + 1):
        fail(f"{name}: CSV rooms + spare spaces ≠ footprint")

    # SVG
    root = ET.parse(base + ".svg").getroot()
    ns = "{http://www.w3.org/2000/svg}"
    room_rects = [e for e in root.iter(ns + "rect") if e.get("class") == "room"]
    if len(room_rects) != len(brief["rooms"]):
        fail(f"{name}: SVG has {len(room_rects)} room shapes")

    # PNG
    if open(base + ".png", "rb").read(8) != b"\x89PNG\r\n\x1a\n":
        fail(f"{name}: PNG signature")
    checked += 1


def outline_width(ppm_path):
    """Distance in pixels between the centres of the outline's west and east
    strokes, found by the outline's colour on the rows it crosses as thin
    strokes (an L's or a courtyard's horizontal edges are skipped); the widest
    such row is the bounding width."""
    data = open(ppm_path, "rb").read()
    parts = data.split(maxsplit=4)
    w, h = int(parts[1]), int(parts[2])
    pixels = parts[4]

    def is_outline(x, y):
        i = 3 * (y * w + x)
        return all(abs(pixels[i + k] - OUTLINE[k]) < 12 for k in range(3))

    ys = [y for y in range(0, h, 3) if any(is_outline(x, y) for x in range(0, w, 2))]
    if not ys:
        return 0
    best = 0
    for y in ys[2:-2]:
        runs, start = [], None
        for x in range(w):
            if is_outline(x, y):
                start = x if start is None else start
            elif start is not None:
                runs.append((start, x - 1))
                start = None
        if len(runs) >= 2 and all(b - a <= 8 for a, b in runs):
            best = max(best, (runs[-1][0] + runs[-1][1]) / 2 - (runs[0][0] + runs[0][1]) / 2)
    return best


with tempfile.TemporaryDirectory() as tmp:
    for f in sorted(os.listdir(samples)):
        if f.endswith(".abut.json"):
            check(os.path.join(samples, f), tmp)
    # The family house in feet: areas and footprint converted with the
    # international foot, exactly 0.3048 m (international yard and pound
    # agreement, 1959); the door wall 3 ft (common practice, no source).
    house = json.load(open(os.path.join(samples, "family-house.abut.json")))
    k = 1 / 0.3048
    house["units"] = "ft"
    house["footprint"] = {"width": house["footprint"]["width"] * k, "depth": house["footprint"]["depth"] * k}
    house["doorWidth"] = 3.0
    for r in house["rooms"]:
        r["area"] = r["area"] * k * k
        if "minWidth" in r:
            r["minWidth"] = r["minWidth"] * k
    p = os.path.join(tmp, "house-ft.abut.json")
    json.dump(house, open(p, "w"))
    check(p, tmp)
    # Random briefs: rooms in a ring with a few cross links.
    rng = random.Random(77)
    for i in range(6):
        n = rng.randint(3, 18)
        rooms = [{"id": f"room{j}", "name": f"Room {j}", "area": round(rng.uniform(6, 25), 1),
                  "category": rng.choice(["living", "sleeping", "service", "work"])} for j in range(n)]
        adjs = [{"rooms": [f"room{j}", f"room{(j + 1) % n}"], "kind": rng.choice(["door", "wall"])}
                for j in range(n) if n > 2 or j == 0]
        total = sum(r["area"] for r in rooms)
        w = round((total * 1.1) ** 0.5 * rng.uniform(0.8, 1.3), 2)
        brief = {"format": "abut.project", "version": 1, "footprint": {"width": w, "depth": round(total * 1.1 / w, 2)},
                 "rooms": rooms, "adjacencies": adjs}
        p = os.path.join(tmp, f"random{i}.abut.json")
        json.dump(brief, open(p, "w"))
        check(p, tmp)

for f in failures[:20]:
    print("FAIL", f)
print(f"{checked - len({f.split(':')[0] for f in failures})} passed, {len({f.split(':')[0] for f in failures})} failed")
sys.exit(1 if failures else 0)
