# SPDX-License-Identifier: MIT
"""Hostile but fair input to abut-cli, checked from outside (CTest
py_hostile_input):

- a full disk (simulated by the writer's test hook ABUT_TEST_WRITE_FAULT)
  keeps the previous file for every output format and exits 2;
- -o to a symlink writes its target; -o to a pipe is refused and the pipe
  stays (made in a temporary folder: never a device under /dev);
- a room named like a spreadsheet formula comes out of the CSV with an
  apostrophe in front (OWASP, "CSV Injection"), read back with Python's csv
  module;
- a name beyond U+FFFF (an emoji) comes out of the DXF as U+FFFD, read back
  with ezdxf (it decoded the old output as U+1F46 followed by "8");
- names holding DXF control codes (\\U+0042, %%d) read back as written, and
  no DXF string (text, layer) over the reference's 255 characters;
- a brief whose targets fill the footprint exactly (read off a tiling,
  rounded to 6 decimals) is accepted by check and plan;
- a folder given as the project is named as a folder;
- a brief without rooms: check and plan agree (exit 3);
- a control character in a name is refused with the field named;
- the editor's --screenshot on a full disk keeps the old PNG whole;
- a signal during a save: SIGTERM leaves no temporary file and the old
  file; what SIGKILL leaves, the next save into that folder removes;
- a footprint with a part narrower than the shortest wall (a 1 nm strip, a
  1 mm sliver): check and plan both say there is no plan;
- plan --time-limit holds for the whole run on a 200-room complete graph,
  2,000 rooms with no adjacencies and a 3,000-room chain;
- cut-outs: check --json names only the brief's rooms (it crashed on two
  cut-outs meeting edge to edge and on a comb of 200);
- fixed rooms: a room that would have to be L-shaped beside a fixed one gets
  no plan with that reason (exit 3, not an internal error), and on small
  random briefs every variant holds its fixed rooms exactly (shapely tiles).

    /usr/bin/python3 tests/python/check_hostile.py ABUT_CLI [--editor ABUT]
"""
import csv
import json
import os
import resource
import stat
import subprocess
import sys
import tempfile

import ezdxf
from ezdxf.lldxf.encoding import decode_dxf_unicode

cli = sys.argv[1]
editor = sys.argv[sys.argv.index("--editor") + 1] if "--editor" in sys.argv else None
failures = []


def run(*args, env=None):
    e = dict(os.environ)
    e.setdefault("QT_QPA_PLATFORM", "offscreen")
    if env:
        e.update(env)
    return subprocess.run([cli, *args], capture_output=True, text=True, env=e)


def expect(cond, what):
    if not cond:
        failures.append(what)
        print("FAIL:", what)


def brief(rooms, footprint=None, adjacencies=()):
    b = {"format": "abut.project", "version": 1, "units": "m", "rooms": rooms,
         "adjacencies": [{"rooms": list(p)} for p in adjacencies]}
    if footprint:
        b["footprint"] = {"width": footprint[0], "depth": footprint[1]}
    return b


with tempfile.TemporaryDirectory() as tmp:
    def path(name):
        return os.path.join(tmp, name)

    small = path("small.abut.json")
    json.dump(brief([{"id": "a", "name": "Living", "area": 20}, {"id": "b", "name": "Kitchen", "area": 10}],
                    (6, 5), [("a", "b")]), open(small, "w"))

    # A full disk: every format keeps the old file.
    for ext in ["pdf", "png", "dxf", "svg", "csv"]:
        out = path("keep." + ext)
        r = run("export", small, "-o", out)
        expect(r.returncode == 0, f"export .{ext}: {r.stderr}")
        good = open(out, "rb").read()
        for after in ["0", str(len(good) // 2), str(len(good) - 1)]:
            r = run("export", small, "-o", out, env={"ABUT_TEST_WRITE_FAULT": after})
            expect(r.returncode == 2, f"full disk .{ext} after {after} bytes: exit {r.returncode}")
            expect("previous file is unchanged" in r.stderr, f"full disk .{ext}: message {r.stderr!r}")
            expect(open(out, "rb").read() == good, f"full disk .{ext} after {after} bytes: file changed")
    plan_out = path("keep.plan.json")
    expect(run("plan", small, "-o", plan_out).returncode == 0, "plan")
    good = open(plan_out, "rb").read()
    r = run("plan", small, "-o", plan_out, env={"ABUT_TEST_WRITE_FAULT": "10"})
    expect(r.returncode == 2 and open(plan_out, "rb").read() == good, "full disk: plan file kept")
    leftovers = [f for f in os.listdir(tmp) if f.startswith(".abut-save-")]
    expect(not leftovers, f"temporary files left behind: {leftovers}")

    # Special output paths.
    target = path("target.plan.json")
    open(target, "w").write("old")
    os.symlink("target.plan.json", path("link.plan.json"))
    r = run("plan", small, "-o", path("link.plan.json"))
    expect(r.returncode == 0, f"plan to a symlink: {r.stderr}")
    expect(os.path.islink(path("link.plan.json")), "the symlink stays a symlink")
    expect(json.load(open(target)).get("format") == "abut.plan", "the symlink's target holds the plan")
    fifo = path("pipe.plan.json")
    os.mkfifo(fifo)
    r = run("plan", small, "-o", fifo)
    expect(r.returncode == 2 and "not a regular file" in r.stderr, f"plan to a pipe: {r.returncode} {r.stderr}")
    expect(stat.S_ISFIFO(os.lstat(fifo).st_mode), "the pipe stays a pipe")

    # Formula-like names in the CSV.
    names = ["=1+2", "+SUM(A1)", "-3", "@cmd", "=HYPERLINK(\"http://x\",\"y\")"]
    rooms = [{"id": f"r{k}", "name": n, "area": 10} for k, n in enumerate(names)]
    f = path("formula.abut.json")
    json.dump(brief(rooms, (10, 5)), open(f, "w"))
    out = path("formula.csv")
    r = run("export", f, "-o", out)
    expect(r.returncode == 0, f"export formula names: {r.stderr}")
    cells = {row["room"]: row["name"] for row in csv.DictReader(open(out, newline=""))}
    for k, n in enumerate(names):
        expect(cells.get(f"r{k}") == "'" + n, f"CSV cell for {n!r}: {cells.get(f'r{k}')!r}")

    # Characters beyond U+FFFF in the DXF.
    f = path("emoji.abut.json")
    json.dump(brief([{"id": "a", "name": "Play \U0001F468 room", "area": 12}], (4, 3)), open(f, "w"))
    out = path("emoji.dxf")
    expect(run("export", f, "-o", out).returncode == 0, "export emoji name")
    # ezdxf keeps \U+XXXX escapes as written; its own decoder reads them as
    # a DXF viewer does (four hex digits each).
    joined = " ".join(decode_dxf_unicode(e.dxf.text) for e in ezdxf.readfile(out).modelspace().query("TEXT"))
    expect("Play \ufffd room" in joined, f"DXF text of an emoji name: {joined!r}")
    expect("\u1f46" not in joined, "no U+1F46 from a misread escape")

    # Strings a DXF reader treats specially, and strings past the reference's
    # 255-character limit. Decoded as the reference says (Autodesk, "Control
    # Codes and Special Characters Reference": %%d degree, %%p plus/minus,
    # %%c diameter, %%% one percent sign) after ezdxf's \U+ decoder; ezdxf
    # 0.18's own plain_text does not know %%%, so the codes are read here.
    def reference_text(raw):
        s, out, k = decode_dxf_unicode(raw), "", 0
        while k < len(s):
            if s.startswith("%%", k) and k + 2 < len(s) and s[k + 2].lower() in "dpc%":
                out += {"d": "\u00b0", "p": "\u00b1", "c": "\u00d8", "%": "%"}[s[k + 2].lower()]
                k += 3
            else:
                out += s[k]
                k += 1
        return out

    specials = ["A\\U+0042", "50%%d", "100%", "a%%%b", "back\\slash %"]
    long_name, long_id = "N" * 300, "i" * 100_000
    rooms = [{"id": f"s{k}", "name": n, "area": 10} for k, n in enumerate(specials)]
    rooms += [{"id": "long", "name": long_name, "area": 10, "category": "c" * 400},
              {"id": long_id, "area": 10, "category": "c" * 399 + "d"}]
    f = path("specials.abut.json")
    json.dump(brief(rooms, (10, 7)), open(f, "w"))
    out = path("specials.dxf")
    r = run("export", f, "-o", out)
    expect(r.returncode == 0, f"export special names: {r.stderr}")
    doc = ezdxf.readfile(out)
    expect(len(doc.audit().errors) == 0, "the DXF with special names audits clean")
    texts = [reference_text(e.dxf.text) for e in doc.modelspace().query("TEXT")]
    for n in specials:
        expect(n in texts, f"DXF text of {n!r} read back as written: {texts[:12]!r}")
    expect(any(t.startswith("N" * 200) and t.endswith("\u2026") for t in texts), "a 300-character name cut short with an ellipsis")
    # Every string in the file, read as raw tags, within the limit.
    from ezdxf.lldxf.tagger import ascii_tags_loader
    with open(out, encoding="cp1252") as fh:
        longest = max(len(str(t.value)) for t in ascii_tags_loader(fh))
    expect(longest <= 255, f"no DXF string over 255 characters (longest {longest})")
    layers = {e.dxf.layer for e in doc.modelspace() if e.dxftype() == "LWPOLYLINE"}
    expect(sum(1 for l in layers if l.startswith("ROOM-CCC")) == 2, f"two long categories on two layers: {sorted(layers)[:4]}")

    # An exact fill: targets read off a 3 x 2 tiling of 11.3 x 10.12, rounded to 6 decimals.
    xs, ys = [0, 3.7, 7.9, 11.3], [0, 4.42, 10.12]
    rooms = []
    for i in range(3):
        for j in range(2):
            rooms.append({"id": f"t{i}{j}", "area": round((xs[i + 1] - xs[i]) * (ys[j + 1] - ys[j]), 6)})
    f = path("exact.abut.json")
    json.dump(brief(rooms, (11.3, 10.12)), open(f, "w"))
    r = run("check", f)
    expect(r.returncode == 0, f"exact fill: check exit {r.returncode}: {r.stdout} {r.stderr}")
    expect("more than the footprint" not in r.stdout + r.stderr, "exact fill is not over the footprint")
    r = run("plan", f, "-o", path("exact.plan.json"), "--time-limit", "10")
    expect(r.returncode == 0, f"exact fill: plan exit {r.returncode}: {r.stderr}")

    # Extreme but plausible sizes export in every format.
    for name, fp, areas in [("huge", (10000, 10000), [1e8 - 1, 1]), ("thin", (0.001, 10000), [5, 5])]:
        f = path(name + ".abut.json")
        json.dump(brief([{"id": f"x{k}", "area": a} for k, a in enumerate(areas)], fp, [("x0", "x1")]), open(f, "w"))
        for ext in ["pdf", "png", "dxf", "svg", "csv"]:
            r = run("export", f, "-o", path(f"{name}.{ext}"), env={})
            expect(r.returncode == 0, f"{name} footprint .{ext}: exit {r.returncode}: {r.stderr[-300:]}")

    # A folder as the project.
    r = run("check", tmp)
    expect(r.returncode == 2 and "is a folder" in r.stderr, f"folder as project: {r.returncode} {r.stderr!r}")

    # No rooms: check and plan agree.
    f = path("empty.abut.json")
    json.dump(brief([]), open(f, "w"))
    rc, rp = run("check", f).returncode, run("plan", f, "-o", path("empty.plan.json")).returncode
    expect(rc == 3 and rp == 3, f"no rooms: check exit {rc}, plan exit {rp}")

    # A control character in a name.
    f = path("control.abut.json")
    json.dump(brief([{"id": "a", "name": "Bed\u0001room", "area": 12}]), open(f, "w"))
    r = run("check", f)
    expect(r.returncode == 2 and "/rooms/0/name" in r.stderr and "control character" in r.stderr,
           f"control character: {r.returncode} {r.stderr!r}")

    # Cut-outs and fixed rooms (round three): check --json on cut-outs names
    # only the brief's rooms, and a fixed room is held exactly or no plan is
    # given (exit 3, never an internal error).
    def with_footprint(rooms, w, d, cutouts=(), adjacencies=()):
        b = brief(rooms, (w, d), adjacencies)
        b["footprint"]["cutouts"] = [{"x": x, "y": y, "width": cw, "depth": cd} for x, y, cw, cd in cutouts]
        return b

    f = path("two-cutouts.abut.json")
    json.dump(with_footprint([{"id": "a", "area": 25, "facade": ["N"]}, {"id": "b", "area": 25},
                              {"id": "c", "area": 25, "facade": ["E"]}], 10, 10,
                             [(5, 5, 5, 2.5), (5, 7.5, 5, 2.5)], [("a", "b"), ("b", "c")]), open(f, "w"))
    r = run("check", "--json", f)
    expect(r.returncode == 0, f"check --json, two cut-outs edge to edge: exit {r.returncode} {r.stderr[-200:]}")
    if r.returncode in (0, 3):
        out = json.loads(r.stdout)
        named = {i for d in out["diagnostics"] for i in d["rooms"]} | set(out["unmetFacade"])
        expect(named <= {"a", "b", "c"}, f"check --json names rooms that are not the brief's: {named}")
    comb = [(0.5 + k, 5, 0.5, 5) for k in range(200)]
    f = path("comb.abut.json")
    json.dump(with_footprint([{"id": f"r{i}", "area": 151} for i in range(10)], 201, 10, comb), open(f, "w"))
    r = run("check", "--json", f)
    expect(r.returncode in (0, 3), f"check --json, 200 cut-outs in a comb: exit {r.returncode} {r.stderr[-200:]}")
    if r.returncode in (0, 3):
        json.loads(r.stdout)

    # A room beside a fixed one that would have to be L-shaped: no plan, with the reason.
    f = path("l-shaped-room.abut.json")
    json.dump(brief([{"id": "A", "area": 9, "fixed": {"x": 0, "y": 0, "width": 3, "depth": 3}},
                     {"id": "B", "area": 71}], (10, 8), [("A", "B")]), open(f, "w"))
    for cmd in (["plan", f, "-o", path("l.plan.json")], ["export", f, "-o", path("l.dxf")], ["check", f]):
        r = run(*cmd)
        expect(r.returncode == 3 and "L-shaped" in r.stdout + r.stderr,
               f"{cmd[0]} with a room that would be L-shaped: exit {r.returncode} {(r.stdout + r.stderr)[-300:]}")

    # Small random briefs with fixed rooms (seeded): never an internal error;
    # every variant written holds every fixed room exactly where it is fixed.
    import random
    from shapely.geometry import box
    from shapely.ops import unary_union
    rng = random.Random(7)
    for k in range(30):
        W, D = rng.choice([8, 10, 12]), rng.choice([6, 8, 10])
        fixed = []
        for _ in range(rng.choice([1, 2])):
            for _ in range(50):
                w, d = rng.choice([1, 2, 3]), rng.choice([1, 2, 3])
                x, y = rng.randrange(0, 2 * (W - w) + 1) / 2, rng.randrange(0, 2 * (D - d) + 1) / 2
                if all(x + w <= g[0] or g[0] + g[2] <= x or y + d <= g[1] or g[1] + g[3] <= y for g in fixed):
                    fixed.append((x, y, w, d))
                    break
        rooms = [{"id": f"F{i}", "area": w * d, "fixed": {"x": x, "y": y, "width": w, "depth": d}}
                 for i, (x, y, w, d) in enumerate(fixed)]
        rest = W * D - sum(g[2] * g[3] for g in fixed)
        parts = [rng.uniform(1, 3) for _ in range(rng.randint(2, 6))]
        rooms += [{"id": f"R{i}", "area": round(rest * p / sum(parts), 2)} for i, p in enumerate(parts)]
        ids = [rm["id"] for rm in rooms]
        f = path(f"fixed{k}.abut.json")
        json.dump(brief(rooms, (W, D), [(ids[i], ids[i + 1]) for i in range(len(ids) - 1)]), open(f, "w"))
        out = path(f"fixed{k}.plan.json")
        r = run("plan", f, "-o", out, "--time-limit", "2", "--threads", "1")
        expect(r.returncode in (0, 3), f"fixed rooms, brief {k}: exit {r.returncode} {r.stderr[-200:]}")
        if r.returncode != 0:
            continue
        for v in json.load(open(out))["variants"]:
            placed = {rm["id"]: rm for rm in v["rooms"]}
            for rm in rooms:
                if "fixed" in rm:
                    g, p = rm["fixed"], placed[rm["id"]]
                    off = max(abs(p[key] - g[key]) for key in ("x", "y", "width", "depth"))
                    expect(off <= 1e-6, f"fixed rooms, brief {k}, variant {v['rank']}: {rm['id']} moved by {off}")
            tiles = [box(t["x"], t["y"], t["x"] + t["width"], t["y"] + t["depth"]) for t in v["rooms"] + v["spaces"]]
            expect(abs(unary_union(tiles).area - W * D) < 1e-6 * W * D and abs(sum(t.area for t in tiles) - W * D) < 1e-6 * W * D,
                   f"fixed rooms, brief {k}, variant {v['rank']}: the rooms do not tile the footprint")

    # check and plan give the same verdict on a footprint with a part no room
    # can take: two halves joined by a 1 nm strip, a cut-out leaving a 1 mm
    # sliver for the only room (both: no plan, exit 3, the part named).
    for name, fp, rooms, pairs in [
            ("strip", {"width": 21, "depth": 10, "cutouts": [{"x": 10, "y": 0, "width": 1, "depth": 10 - 1e-9}]},
             [{"id": "a", "area": 100}, {"id": "b", "area": 100}], [("a", "b")]),
            ("sliver", {"width": 10, "depth": 10, "cutouts": [{"x": 0, "y": 0.001, "width": 10, "depth": 9.999}]},
             [{"id": "a", "area": 0.01}], [])]:
        b = brief(rooms, None, pairs)
        b["footprint"] = fp
        f = path(name + ".abut.json")
        json.dump(b, open(f, "w"))
        c = run("check", f)
        p = run("plan", f, "-o", path(name + ".plan.json"), "--time-limit", "5")
        expect(c.returncode == 3 and "part only" in c.stdout, f"{name}: check exit {c.returncode}: {c.stdout[-300:]}")
        expect(p.returncode == 3 and "part only" in p.stdout + p.stderr, f"{name}: plan exit {p.returncode}: {p.stdout[-300:]} {p.stderr[-300:]}")

    # The editor's screenshot on a full disk: exit 2, the old PNG whole
    # (read back: it still ends with its IEND chunk, PNG specification 5.6).
    if editor:
        shot = path("shot.png")
        e = dict(os.environ, QT_QPA_PLATFORM="offscreen")
        r = subprocess.run([editor, "--screenshot", shot, "--size", "400x300", small], capture_output=True, env=e)
        expect(r.returncode == 0 and os.path.exists(shot), f"editor screenshot: exit {r.returncode}")
        if os.path.exists(shot):
            old = open(shot, "rb").read()
            e["ABUT_TEST_WRITE_FAULT"] = "100"
            r = subprocess.run([editor, "--screenshot", shot, "--size", "600x400", small], capture_output=True, text=True, env=e)
            expect(r.returncode == 2 and "previous file is unchanged" in r.stderr,
                   f"editor screenshot on a full disk: exit {r.returncode} {r.stderr[-200:]}")
            now = open(shot, "rb").read()
            expect(now == old and now[-8:-4] == b"IEND", "the old screenshot is whole after the full disk")

    # A signal during a save: SIGTERM removes the temporary file and the old
    # file stays; what SIGKILL leaves behind goes at the next save there.
    import signal
    import time
    folder = path("signal")
    os.mkdir(folder)
    out = os.path.join(folder, "plan.svg")
    expect(run("export", small, "-o", out).returncode == 0, "first export before the signal")
    before = open(out, "rb").read()

    def leftovers():
        return [n for n in os.listdir(folder) if n.startswith(".abut-save-")]

    def stopped_during_save(sig):
        e = dict(os.environ, QT_QPA_PLATFORM="offscreen", ABUT_TEST_WRITE_PAUSE="4000")
        p = subprocess.Popen([cli, "export", small, "-o", out], env=e, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL)
        deadline = time.time() + 30
        while not leftovers() and time.time() < deadline and p.poll() is None:
            time.sleep(0.02)
        seen = bool(leftovers())
        p.send_signal(sig)
        return seen, p.wait()

    seen, rc = stopped_during_save(signal.SIGTERM)
    expect(seen, "the save's temporary file was seen before the signal")
    expect(rc == -signal.SIGTERM, f"SIGTERM during a save ends the program by that signal: {rc}")
    expect(leftovers() == [], f"no temporary file left after SIGTERM: {leftovers()}")
    expect(open(out, "rb").read() == before, "the old file is unchanged after SIGTERM")
    seen, rc = stopped_during_save(signal.SIGKILL)
    expect(seen and len(leftovers()) == 1, f"SIGKILL leaves the temporary file: {leftovers()}")
    expect(run("export", small, "-o", out).returncode == 0, "export after the SIGKILL")
    expect(leftovers() == [], f"the next save removes what SIGKILL left: {leftovers()}")

    # Time limits cover the whole run, the preparation included: 200 rooms
    # that must all touch (19,900 adjacencies, at most 594 of them planar),
    # 2,000 rooms with no adjacencies, a chain of 3,000 rooms, on one thread.
    # The margin (0.4 of the limit, at least 2 s of processor time) is for
    # the work after the clock runs out: writing the file, and on a busy
    # machine the sizing of a first plan found only then (0.1-0.2 s past the
    # limit on an idle one; the unbounded steps this caught took 20-50 s).
    def timed_brief(name, n, pairs):
        rooms = [{"id": f"r{k}", "area": 12} for k in range(n)]
        side = (12 * n) ** 0.5
        f = path(name + ".abut.json")
        json.dump(brief(rooms, (side, side), pairs), open(f, "w"))
        return f

    for name, n, pairs, limit in [
            ("complete200", 200, [(f"r{a}", f"r{b}") for a in range(200) for b in range(a + 1, 200)], 2),
            ("apart2000", 2000, [], 2),
            ("chain3000", 3000, [(f"r{k - 1}", f"r{k}") for k in range(1, 3000)], 5)]:
        f = timed_brief(name, n, pairs)
        before = resource.getrusage(resource.RUSAGE_CHILDREN)
        started = time.monotonic()
        r = run("plan", f, "-o", path(name + ".plan.json"), "--time-limit", str(limit), "--threads", "1")
        took = time.monotonic() - started
        after = resource.getrusage(resource.RUSAGE_CHILDREN)
        cpu = (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)
        # On a shared machine the run gets a share of a core (cpu / took), and
        # the work after the limit stretches by its inverse: what is measured
        # is that work, (took - limit) at that share, so that a busy machine
        # does not fail the test and an unbounded step still does.
        share = min(1.0, cpu / took) if took > 0 else 1.0
        over = max(0.0, took - limit) * share
        expect(r.returncode in (0, 3), f"{name}: exit {r.returncode} {r.stderr[-200:]}")
        expect(over <= max(2.0, 0.4 * limit),
               f"{name}: --time-limit {limit} took {took:.1f} s ({cpu:.1f} s of processor; {over:.1f} s past the limit)")
        print(f"{name}: --time-limit {limit}: {took:.2f} s, {cpu:.2f} s of processor, exit {r.returncode}")

print(f"{len(failures)} failure(s)")
sys.exit(1 if failures else 0)
