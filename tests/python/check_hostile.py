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
- a brief whose targets fill the footprint exactly (read off a tiling,
  rounded to 6 decimals) is accepted by check and plan;
- a folder given as the project is named as a folder;
- a brief without rooms: check and plan agree (exit 3);
- a control character in a name is refused with the field named.

    /usr/bin/python3 tests/python/check_hostile.py ABUT_CLI
"""
import csv
import json
import os
import stat
import subprocess
import sys
import tempfile

import ezdxf
from ezdxf.lldxf.encoding import decode_dxf_unicode

cli = sys.argv[1]
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

print(f"{len(failures)} failure(s)")
sys.exit(1 if failures else 0)
