# SPDX-License-Identifier: MIT
"""Every miss of every variant is in its `unmet` list (CTest py_unmet_complete).

For briefs read off drawn plans (plan_briefs.py: offices, houses, clinics,
schools, ring offices; shaped_briefs.py: L, U, courtyard, fixed cores) and
the samples, `abut-cli plan --variants 5` runs with a short time limit, so
that plenty of variants miss something. Each variant written is judged
independently with shapely (plan_quality.judged: each room's own area band,
minimum widths, aspect limits, 'must' doors a door wide, 'must' walls of any
length, facade wishes, fixed rooms in place), and every miss the judge finds
must appear in the variant's `unmet` list with the same requirement and the
same rooms; the list may say more (Abut counts a wall shorter than 0.05 m as
no contact), never less. `usable` must agree with an empty list.

    /usr/bin/python3 tests/python/check_unmet.py ABUT_CLI SAMPLES [--count N] [--time-limit S]
"""
import argparse
import glob
import json
import os
import subprocess
import sys
import tempfile
from concurrent.futures import ThreadPoolExecutor

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import plan_briefs  # noqa: E402
import plan_quality  # noqa: E402
import shaped_briefs  # noqa: E402


def check(cli, path, time_limit):
    brief = json.load(open(path))
    out = path.replace(".abut.json", ".plan.json")
    r = subprocess.run([cli, "plan", path, "-o", out, "--variants", "5", "--threads", "1",
                        "--time-limit", str(time_limit)], capture_output=True, text=True)
    if r.returncode == 3:
        return [], 0
    if r.returncode != 0:
        return [f"{path}: plan exit {r.returncode}: {r.stderr[-300:]}"], 0
    plan = json.load(open(out))
    problems, judged_misses = [], 0
    for v in plan["variants"]:
        rooms, spaces = plan_quality.plan_rooms(v)
        listed = {(u["requirement"], tuple(sorted(u["rooms"]))) for u in v.get("unmet", [])}
        found = plan_quality.judged(brief, rooms, spaces, band=None)
        judged_misses += len(found)
        for kind, ids, text in found:
            if kind == "tiling":
                problems.append(f"{path} variant {v['rank']}: {text}")
            elif (kind, tuple(sorted(ids))) not in listed:
                problems.append(f"{path} variant {v['rank']}: the judge finds \"{text}\", unmet does not list it")
        if v.get("usable") and v.get("unmet"):
            problems.append(f"{path} variant {v['rank']}: usable, yet unmet lists {len(v['unmet'])}")
        if not v.get("usable") and not v.get("unmet") and found:
            problems.append(f"{path} variant {v['rank']}: not usable and nothing unmet")
    return problems, judged_misses


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("cli")
    ap.add_argument("samples")
    ap.add_argument("--count", type=int, default=24)
    ap.add_argument("--time-limit", type=float, default=1.0)
    ap.add_argument("--seed", type=int, default=11)
    a = ap.parse_args()
    with tempfile.TemporaryDirectory() as tmp:
        plain, shaped = os.path.join(tmp, "plain"), os.path.join(tmp, "shaped")
        os.makedirs(plain)
        os.makedirs(shaped)
        for prefix, folder, made in [("b", plain, plan_briefs.generate(a.count, a.seed)),
                                     ("s", shaped, shaped_briefs.generate(max(4, a.count // 3), a.seed))]:
            for k, (_, brief, _) in enumerate(made):
                json.dump(brief, open(os.path.join(folder, f"{prefix}{k}.abut.json"), "w"))
        paths = sorted(glob.glob(os.path.join(plain, "*.abut.json")) + glob.glob(os.path.join(shaped, "*.abut.json")))
        for s in sorted(glob.glob(os.path.join(a.samples, "*.abut.json"))):
            copy = os.path.join(tmp, os.path.basename(s))
            open(copy, "w").write(open(s).read())
            paths.append(copy)
        with ThreadPoolExecutor(2) as pool:
            results = list(pool.map(lambda p: check(a.cli, p, a.time_limit), paths))
    problems = [p for r, _ in results for p in r]
    for p in problems[:40]:
        print("FAIL:", p)
    print(f"{len(paths)} briefs, {sum(n for _, n in results)} misses found by the judge, {len(problems)} problem(s)")
    sys.exit(1 if problems else 0)


if __name__ == "__main__":
    main()
