#!/usr/bin/python3
"""Numerical stress test of Apportion's weighted max-min fairness.

Five families of generated instances (invented data, seeded), each built to trouble a
floating-point LP engine:
  span-6, -9    capacities and amounts from 0.001 to 1e3 and to 1e6 (6 and 9 orders of magnitude)
  wide-range    capacities and amounts from 0.001 to 1e9 (12 orders of magnitude) in one network,
                every fourth a 1e9 backbone ring with 0.001-0.01 access arcs ("two worlds")
  parallel      3-5 nodes joined by 40-120 parallel arcs per pair
  zero-capacity 40% of the arcs at capacity 0, some taken out of service
  disconnected  two or three components; a third of the demands cross between them
  ties          symmetric networks (star, ring, grid, complete bipartite) where many demands
                freeze in the same tier
For each instance `apportion fair` must either report status optimal and
  - every share equal to the reference (SciPy's HiGHS, textbook max-min; fair_reference.py)
    within 1e-6 of max(the reference share, the smallest positive capacity): each demand is
    judged at its own scale, so a 0.001 share next to 1e9 arcs must be right too;
  - every demand in the same tier as the reference's freezing round;
  - the independent checker satisfied: every arc's excess at most 1e-6 of its capacity, every
    demand's imbalance at most 1e-6 of its share (the documented tolerance; both floored at
    the smallest positive capacity);
or fail with the status "numerical difficulty" and a message. Where SciPy's own LPs fail,
SciPy is asked again with the data divided by Apportion's power-of-two unit; if that fails
too, an optimal result is counted apart and judged by the checker and the WebAssembly
comparison alone. Determinism: every instance is solved twice and the result files must be
byte-identical. With --wasm, the same command in WebAssembly under node must give the same
status and a byte-identical result file (tiers and shares are also compared, to 1e-9 of the
share's scale, to say what differs).
With --no-reference, SciPy is skipped (the WebAssembly build's test: native against
WebAssembly and the checker). Exit status 0 when every instance passes.
"""
import argparse
import json
import math
import multiprocessing
import os
import random
import shlex
import sys

from fair_reference import ArcModel, run_apportion

SHARE_TOL = 1e-6       # against the reference, relative to the demand's scale
WASM_TOL = 1e-9        # native against WebAssembly, relative to the demand's scale
CHECK_TOL = 1e-6       # checker violations, each relative to its own arc or demand


def network(name, n, arcs, demands):
    return {"format": "apportion-network", "version": 1, "name": name,
            "nodes": [{"id": f"v{j}"} for j in range(n)],
            "arcs": [dict(a, id=f"e{i}") for i, a in enumerate(arcs)],
            "demands": [dict(d, id=f"d{i}") for i, d in enumerate(demands)]}


def arc(u, v, cap, two_way=False, enabled=True):
    a = {"from": f"v{u}", "to": f"v{v}", "capacity": cap}
    if two_way:
        a["shared_two_way"] = True
    if not enabled:
        a["enabled"] = False
    return a


def demand(o, d, amount="max", weight=1):
    return {"origin": f"v{o}", "destination": f"v{d}", "amount": amount, "weight": weight}


def random_pair(rng, n):
    o = rng.randrange(n)
    d = rng.randrange(n)
    while d == o:
        d = rng.randrange(n)
    return o, d


def wide(rng, low=-3, high=9):
    return float(f"{10 ** rng.uniform(low, high):.6g}")


def wide_range(rng, i, low=-3, high=9):
    if i % 4 == 3:
        # Two worlds: a 1e9 backbone ring with 0.001-0.01 access tails; demands across both.
        ring = rng.randint(4, 7)
        tails = rng.randint(3, 6)
        n = ring + tails
        arcs = [arc(j, (j + 1) % ring, float(f"{rng.uniform(1, 9):.3g}e9"), two_way=True) for j in range(ring)]
        for t in range(tails):
            arcs.append(arc(ring + t, rng.randrange(ring), float(f"{rng.uniform(1, 10):.3g}e-3")))
            arcs.append(arc(rng.randrange(ring), ring + t, float(f"{rng.uniform(1, 10):.3g}e-3")))
        demands = [demand(*random_pair(rng, ring)) for _ in range(rng.randint(2, 5))]
        demands += [demand(ring + rng.randrange(tails), rng.randrange(ring), weight=rng.choice([1, 2]))
                    for _ in range(rng.randint(2, 5))]
        demands += [demand(rng.randrange(ring), ring + rng.randrange(tails)) for _ in range(rng.randint(1, 3))]
        return network(f"wide-range {i} (two worlds)", n, arcs, demands)
    n = rng.randint(4, 14)
    arcs = [arc(j, j + 1, wide(rng, low, high), two_way=rng.random() < 0.3) for j in range(n - 1)]
    for _ in range(rng.randint(n, 30)):
        arcs.append(arc(*random_pair(rng, n), wide(rng, low, high), two_way=rng.random() < 0.3))
    demands = [demand(*random_pair(rng, n), amount="max" if rng.random() < 0.5 else wide(rng, low, high),
                      weight=rng.choice([1, 1, 2, 0.5])) for _ in range(rng.randint(3, 10))]
    return network(f"wide-range {i}" if high - low == 12 else f"span-{high - low} {i}", n, arcs, demands)


def span_6(rng, i):
    return wide_range(rng, 4 * i, -3, 3)  # never the "two worlds" case (i % 4 == 3)


def span_9(rng, i):
    return wide_range(rng, 4 * i, -3, 6)


def parallel(rng, i):
    n = rng.randint(3, 5)
    arcs = []
    for j in range(n - 1):
        for _ in range(rng.randint(40, 120)):
            u, v = (j, j + 1) if rng.random() < 0.7 else (j + 1, j)
            arcs.append(arc(u, v, rng.choice([1, 1, 2, 0.5, 3, 10, 0.25]), two_way=rng.random() < 0.2))
    demands = [demand(*random_pair(rng, n), weight=rng.choice([1, 2])) for _ in range(rng.randint(5, 15))]
    return network(f"parallel {i}", n, arcs, demands)


def zero_capacity(rng, i):
    n = rng.randint(5, 15)
    arcs = []
    for j in range(rng.randint(n + 5, 40)):
        u, v = (j, j + 1) if j < n - 1 else random_pair(rng, n)
        cap = 0 if rng.random() < 0.4 else rng.randint(1, 20)
        arcs.append(arc(u, v, cap, two_way=rng.random() < 0.2, enabled=rng.random() > 0.1))
    demands = [demand(*random_pair(rng, n), amount="max" if rng.random() < 0.6 else rng.randint(0, 10))
               for _ in range(rng.randint(4, 15))]
    return network(f"zero-capacity {i}", n, arcs, demands)


def disconnected(rng, i):
    parts = rng.randint(2, 3)
    sizes = [rng.randint(3, 7) for _ in range(parts)]
    starts = [sum(sizes[:p]) for p in range(parts)]
    arcs = []
    for p in range(parts):
        s, m = starts[p], sizes[p]
        for j in range(m):
            arcs.append(arc(s + j, s + (j + 1) % m, rng.randint(1, 12), two_way=rng.random() < 0.4))
        for _ in range(m):
            u, v = random_pair(rng, m)
            arcs.append(arc(s + u, s + v, rng.randint(1, 12)))
    demands = []
    for _ in range(rng.randint(6, 16)):
        p = rng.randrange(parts)
        if rng.random() < 1 / 3:
            q = (p + 1 + rng.randrange(parts - 1)) % parts
            demands.append(demand(starts[p] + rng.randrange(sizes[p]), starts[q] + rng.randrange(sizes[q])))
        else:
            u, v = random_pair(rng, sizes[p])
            demands.append(demand(starts[p] + u, starts[p] + v, weight=rng.choice([1, 2])))
    return network(f"disconnected {i}", sum(sizes), arcs, demands)


def ties(rng, i):
    kind = i % 4
    if kind == 0:  # star: hub 0, leaves 1..L, both directions; every ordered leaf pair a demand
        leaves = rng.randint(5, 8)
        arcs = [arc(0, j, 1) for j in range(1, leaves + 1)] + [arc(j, 0, 1) for j in range(1, leaves + 1)]
        demands = [demand(a, b) for a in range(1, leaves + 1) for b in range(1, leaves + 1) if a != b]
        return network(f"ties {i} (star of {leaves})", leaves + 1, arcs, demands)
    if kind == 1:  # ring with equal two-way capacities; all pairs
        n = rng.randint(6, 9)
        arcs = [arc(j, (j + 1) % n, 2, two_way=True) for j in range(n)]
        demands = [demand(a, b) for a in range(n) for b in range(a + 1, n)]
        return network(f"ties {i} (ring of {n})", n, arcs, demands)
    if kind == 2:  # grid with unit two-way capacities; random pairs, equal weights
        side = rng.randint(4, 5)
        arcs = []
        for r in range(side):
            for c in range(side):
                v = r * side + c
                if c + 1 < side:
                    arcs.append(arc(v, v + 1, 1, two_way=True))
                if r + 1 < side:
                    arcs.append(arc(v, v + side, 1, two_way=True))
        demands = [demand(*random_pair(rng, side * side)) for _ in range(rng.randint(20, 30))]
        return network(f"ties {i} (grid {side}x{side})", side * side, arcs, demands)
    # complete bipartite, equal capacities, every left-right pair a demand
    left, right = rng.randint(3, 5), rng.randint(3, 5)
    arcs = [arc(a, left + b, 1) for a in range(left) for b in range(right)]
    demands = [demand(a, left + b) for a in range(left) for b in range(right)]
    return network(f"ties {i} (bipartite {left}x{right})", left + right, arcs, demands)


FAMILIES = [("span-6", span_6, 12), ("span-9", span_9, 12), ("wide-range", wide_range, 24), ("parallel", parallel, 8), ("zero-capacity", zero_capacity, 12),
            ("disconnected", disconnected, 10), ("ties", ties, 8)]


def power_of_two_unit(caps):
    """The internal unit of core/multiflow/unit_scale.h: the smallest positive capacity into
    [1, 2), unless the largest would then pass 2^30."""
    positive = [c for c in caps if c > 0]
    if not positive:
        return 1.0
    low, high = math.frexp(min(positive))[1], math.frexp(max(positive))[1]
    return math.ldexp(1.0, max(low - 1, high - 30))


def scaled(inst, factor):
    """The instance with every capacity and amount divided by `factor`."""
    out = json.loads(json.dumps(inst))
    for a in out["arcs"]:
        a["capacity"] = a["capacity"] / factor
    for d in out["demands"]:
        if d.get("amount", "max") != "max":
            d["amount"] = d["amount"] / factor
    return out


def scale_of(value, smallest):
    return max(abs(value), smallest)


def check(job):
    """Returns (family, name, outcome, problems, notes) for one instance."""
    family, inst, native, wasm, reference, work = job
    work = os.path.join(work, f"worker-{os.getpid()}")
    os.makedirs(work, exist_ok=True)
    problems, notes = [], {}
    first, raw1, err1 = run_apportion(native, work, inst, "fair", "a")
    again, raw2, _ = run_apportion(native, work, inst, "fair", "b")
    if raw1 != raw2:
        problems.append("two native runs gave different result files")
    model = ArcModel(inst, relative=True)
    other, raw3, err3 = run_apportion(wasm, work, inst, "fair", "w") if wasm else (None, None, "")
    if first is None:
        if "numerical difficulty" not in err1:
            problems.append(f"apportion fair failed: {err1.strip()}")
        if wasm and (other is not None or "numerical difficulty" not in err3):
            problems.append("native reported numerical difficulty, WebAssembly did not")
        return family, inst["name"], "numerical difficulty", problems, notes
    outcome = "optimal"
    ref = None
    if reference:
        try:
            ref, rounds = model.max_min()
        except RuntimeError:
            # The reference's own LPs (arc formulation, unscaled) can fail where Apportion's
            # scaled path formulation solves. Then SciPy is asked again with the data divided
            # by a power of two (the rule of core/multiflow/unit_scale.h: exact, so the
            # shares scale back exactly); if that fails too, the independent checker and the
            # native/WebAssembly comparison are what stands.
            factor = power_of_two_unit(model.caps)
            try:
                ref, rounds = ArcModel(scaled(inst, factor), relative=True).max_min()
                ref = [x * factor for x in ref]
                notes["reference_scaled"] = factor
            except RuntimeError as e2:
                outcome = "reference failed"
                notes["reference_error"] = str(e2)
    if ref is not None:
        worst = 0.0
        for k, d in enumerate(first["demands"]):
            diff = abs(d["share"] - ref[k]) / scale_of(ref[k], model.smallest)
            worst = max(worst, diff)
            if diff > SHARE_TOL:
                problems.append(f"demand {d['id']}: share {d['share']!r}, reference {ref[k]!r}")
            if d["tier"] != rounds[k]:
                problems.append(f"demand {d['id']}: tier {d['tier']}, reference round {rounds[k]}")
        notes["share_error"] = worst
    c = first["check"]
    notes["violation"] = max(c["max_capacity_violation"], c["max_conservation_violation"], c["max_share_error"])
    if not c["ok"] or notes["violation"] > CHECK_TOL:
        problems.append(f"checker: ok={c['ok']}, largest relative violation {notes['violation']:.3g}")
    if wasm:
        if other is None:
            problems.append(f"WebAssembly run failed where native succeeded: {err3.strip()}")
        else:
            notes["wasm_identical"] = raw3 == raw1
            if raw3 != raw1:
                problems.append("the result files of native and WebAssembly differ")
            for k, (d, e) in enumerate(zip(first["demands"], other["demands"])):
                if d["tier"] != e["tier"]:
                    problems.append(f"demand {d['id']}: tier native {d['tier']}, WebAssembly {e['tier']}")
                if abs(d["share"] - e["share"]) / scale_of(d["share"], model.smallest) > WASM_TOL:
                    problems.append(f"demand {d['id']}: share native {d['share']!r}, WebAssembly {e['share']!r}")
    return family, inst["name"], outcome, problems, notes


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--apportion", required=True, help="the native command line")
    ap.add_argument("--wasm", help="the WebAssembly command line, e.g. 'node build/wasm/shell/apportion.js'")
    ap.add_argument("--work", required=True)
    ap.add_argument("--jobs", type=int, default=2)
    ap.add_argument("--no-reference", action="store_true",
                    help="skip SciPy (native against WebAssembly and the checker only)")
    args = ap.parse_args()
    os.makedirs(args.work, exist_ok=True)
    native = [args.apportion]
    if not os.path.exists(args.apportion):
        print(f"the native command line {args.apportion} is missing: build the native preset first")
        return 1
    wasm = shlex.split(args.wasm) if args.wasm else None
    jobs = []
    for family, make, count in FAMILIES:
        rng = random.Random(f"apportion stress {family}")
        jobs += [(family, make(rng, i), native, wasm, not args.no_reference, args.work) for i in range(count)]
    summary = {f: {"instances": 0, "optimal": 0, "reference failed": 0, "numerical difficulty": 0, "failed": 0,
                   "share_error": 0.0,
                   "violation": 0.0, "wasm_identical": 0} for f, _, _ in FAMILIES}
    with multiprocessing.Pool(args.jobs) as pool:
        for (family, name, outcome, problems, notes), job in zip(pool.imap(check, jobs), jobs):
            s = summary[family]
            s["instances"] += 1
            s[outcome] += 1
            s["share_error"] = max(s["share_error"], notes.get("share_error", 0.0))
            s["violation"] = max(s["violation"], notes.get("violation", 0.0))
            s["wasm_identical"] += 1 if notes.get("wasm_identical") else 0
            if outcome == "numerical difficulty":
                print(f"{name}: numerical difficulty reported", flush=True)
            if "reference_scaled" in notes:
                print(f"{name}: SciPy solved it only with the data divided by {notes['reference_scaled']:g}",
                      flush=True)
            if outcome == "reference failed":
                print(f"{name}: optimal and checked; the reference failed ({notes['reference_error']})", flush=True)
            if problems:
                s["failed"] += 1
                bad = os.path.join(args.work, "failed-" + name.split(" (")[0].replace(" ", "-") + ".json")
                json.dump(job[1], open(bad, "w"), indent=1)
                print(f"FAILED {name} (saved {bad}): " + "; ".join(problems[:4]), flush=True)
    print("family         instances  optimal  optimal, no reference  difficulty  failed  worst share error"
          "  worst violation" + ("  wasm byte-identical" if wasm else ""))
    failed = 0
    for f, s in summary.items():
        failed += s["failed"]
        print(f"{f:<14} {s['instances']:>9} {s['optimal']:>8} {s['reference failed']:>22} "
              f"{s['numerical difficulty']:>11} {s['failed']:>7}"
              + (f" {s['share_error']:>18.2g}" if not args.no_reference else f" {'-':>18}")
              + f" {s['violation']:>16.2g}"
              + (f" {s['wasm_identical']:>20}" if wasm else ""))
    print("share error: |apportion - reference| / max(reference, smallest positive capacity); "
          "violation: the checker's largest, relative to its arc or demand")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
