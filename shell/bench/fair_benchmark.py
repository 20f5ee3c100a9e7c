#!/usr/bin/python3
"""Fair-multiflow benchmark: Apportion's exact weighted max-min fairness against the textbook
baseline, on the same generated instances, in one run.

Instances (invented data): random geometric topologies (nodes in the unit square, each
linked to its nearest neighbours; every link is two opposite arcs) with gravity-model
demands: node masses m_i drawn at random, demand (i, j) proportional to m_i m_j / distance,
the largest K pairs kept, amounts scaled so that together they ask for about twice what the
network can carry.

Baseline: the arc formulation solved by SciPy's HiGHS, one LP per round plus one LP per
unfrozen demand to test it (tests/reference/crosscheck_fair.py, ArcModel.max_min), in a
child process with a time budget. Apportion: `apportion-fair-bench` natively and in
WebAssembly under node. Prints a Markdown table.

With --topologies DIR (the shared data folder's topology-zoo/, read in place, never copied):
real backbones of the Internet Topology Zoo (S. Knight et al., IEEE JSAC 29(9), 2011), each
link two arcs, capacity from the file's LinkSpeedRaw in bit/s (1 Gbit/s where missing) for
Geant2012 and Uninett2010 and 10 per link for the others; demands: the K ordered pairs with
the largest gravity m_i m_j (masses uniform in [1, 10], fixed seed; common practice, no
source), amounts summing to a third of the total capacity. Per row: Apportion natively and
in WebAssembly (peak memory of each process), and the engine as it was before the scale work
(`apportion-fair-bench --baseline`: the dual simplex after every round and one round per
amount level) as the baseline, each in a child with the time budget; the largest share
difference against the baseline, relative to the largest share.
"""
import argparse
import json
import math
import os
import random
import subprocess
import sys
import tempfile
import time

HERE = os.path.dirname(os.path.abspath(__file__))
sys.path.insert(0, os.path.join(HERE, "..", "..", "tests", "reference"))
from topology_instance import topology_instance  # noqa: E402


def instance(nodes, links_per_node, demands, seed):
    rng = random.Random(seed)
    pos = [(rng.random(), rng.random()) for _ in range(nodes)]
    mass = [rng.uniform(1, 10) for _ in range(nodes)]
    dist = lambda a, b: math.hypot(pos[a][0] - pos[b][0], pos[a][1] - pos[b][1]) + 1e-3
    links = set()
    for u in range(nodes):
        near = sorted((dist(u, v), v) for v in range(nodes) if v != u)[:links_per_node]
        for _, v in near:
            links.add((min(u, v), max(u, v)))
    # connect components through a chain so that every demand has a path
    order = sorted(range(nodes), key=lambda v: pos[v][0])
    for a, b in zip(order, order[1:]):
        if rng.random() < 0.15:
            links.add((min(a, b), max(a, b)))
    arcs = []
    for i, (u, v) in enumerate(sorted(links)):
        cap = rng.choice([10, 10, 40, 40, 100])
        arcs.append({"id": f"l{i}ab", "from": f"n{u}", "to": f"n{v}", "capacity": cap})
        arcs.append({"id": f"l{i}ba", "from": f"n{v}", "to": f"n{u}", "capacity": cap})
    pairs = sorted(((mass[i] * mass[j] / dist(i, j), i, j) for i in range(nodes) for j in range(nodes) if i != j),
                   reverse=True)[:demands]
    total_cap = sum(a["capacity"] for a in arcs)
    gravity = sum(p[0] for p in pairs)
    dem = [{"id": f"d{k}", "origin": f"n{i}", "destination": f"n{j}",
            "amount": round(2 * total_cap / 6 * g / gravity, 6)} for k, (g, i, j) in enumerate(pairs)]
    return {"format": "apportion-network", "version": 1, "name": f"gravity {nodes}/{len(arcs)}/{demands}",
            "nodes": [{"id": f"n{v}", "x": pos[v][0] * 1000, "y": pos[v][1] * 1000} for v in range(nodes)],
            "arcs": arcs, "demands": dem}


def baseline_child(path):
    from fair_reference import ArcModel
    inst = json.load(open(path))
    start = time.perf_counter()
    shares, _rounds = ArcModel(inst).max_min()  # the shares and each demand's freezing round
    print(json.dumps({"ms": 1000 * (time.perf_counter() - start), "shares": shares}))


def run_apportion(cmd, path):
    out = subprocess.run(cmd + [path], capture_output=True, text=True, check=True).stdout.split()
    return float(out[1]), (int(out[2]), int(out[3]), int(out[4])), [float(x) for x in out[6:]]


def run_measured(cmd, budget):
    """Runs an apportion-fair-bench command within `budget` seconds: (fields, peak resident
    memory of that process in MB), or (None, why not)."""
    with tempfile.TemporaryFile("w+") as out, tempfile.TemporaryFile("w+") as err:
        p = subprocess.Popen(cmd, stdout=out, stderr=err, text=True)
        deadline = time.time() + budget
        while True:
            pid, status, usage = os.wait4(p.pid, os.WNOHANG)  # this child's own rusage
            if pid:
                break
            if time.time() > deadline:
                p.kill()
                os.wait4(p.pid, 0)
                return None, f"> {budget:.0f} s"
            time.sleep(0.02)
        out.seek(0)
        err.seek(0)
        if os.waitstatus_to_exitcode(status) != 0:
            lines = err.read().strip().splitlines() or ["failed"]
            return None, lines[0].split(": ", 1)[-1][:60]
        return out.read().split(), usage.ru_maxrss / 1024.0


def topologies(a, work):
    cli = os.path.join(os.path.dirname(a.native), "apportion")
    sizes = [500] + ([5000, 0] if a.large else [])  # 0: all ordered pairs
    print("| topology | nodes | arcs | demands | tiers | Apportion ms | LP solves | simplex iterations | "
          "peak MB | previous method ms | speed-up | vs previous | WASM ms | WASM/native | WASM peak MB | WASM vs native |")
    print("|---|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|")
    for name in ("Abilene", "Geant2012", "Uninett2010", "Deltacom", "GtsCe", "UsCarrier"):
        graphml = os.path.join(a.topologies, name + ".graphml")
        if not os.path.exists(graphml):
            print(f"| {name} | missing: {graphml} |")
            continue
        done = set()
        for k in sizes:
            path = os.path.join(work, f"{name}-{k}.json")
            net = topology_instance(cli, graphml, k, 1, path)
            n_dem = len(net["demands"])
            if n_dem in done:
                continue  # fewer pairs than asked: this size is all pairs, already measured
            done.add(n_dem)
            fields, mem = run_measured([a.native, path], a.budget)
            if fields is None:
                print(f"| {name} | {len(net['nodes'])} | {len(net['arcs'])} | {n_dem} | - | {mem} | | | | | | | | | | |",
                      flush=True)
                continue
            ms, lps, iters, tiers = float(fields[1]), fields[2], fields[3], fields[5]
            shares = [float(x) for x in fields[6:]]
            base, _ = run_measured([a.native, "--baseline", path], a.budget)
            base_ms = f"{float(base[1]):.0f}" if base else f"> {a.budget * 1000:.0f}"
            speed = f"{float(base[1]) / ms:.1f}x" if base else f"> {a.budget * 1000 / ms:.0f}x"
            largest = max(abs(x) for x in shares) or 1.0
            vs_base = f"{max(abs(x - float(y)) for x, y in zip(shares, base[6:])) / largest:.1e}" if base else "-"
            wasm, wmem = run_measured(["node", a.wasm, "--warm-up", path], a.budget)
            if wasm:
                wms = float(wasm[1])
                scale = max(x["capacity"] for x in net["arcs"])
                wdiff = max(abs(x - float(y)) for x, y in zip(shares, wasm[6:])) / scale
                wasm_cells = f"{wms:.0f} | {wms / ms:.2f} | {wmem:.0f} | {wdiff:.1e}"
            else:
                wasm_cells = f"{wmem} | | | "
            print(f"| {name} | {len(net['nodes'])} | {len(net['arcs'])} | {n_dem} | {tiers} | {ms:.0f} | {lps} | {iters} | "
                  f"{mem:.0f} | {base_ms} | {speed} | {vs_base} | {wasm_cells} |", flush=True)


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--native", required=True)
    ap.add_argument("--wasm", required=True)
    ap.add_argument("--budget", type=float, default=300, help="seconds for each baseline run")
    ap.add_argument("--quick", action="store_true", help="the smallest size only")
    ap.add_argument("--large", action="store_true", help="also 1,000, 2,000 and 5,000 demands (slow: tens of minutes)")
    ap.add_argument("--topologies", help="the shared data folder's topology-zoo/: benchmark the real backbones")
    ap.add_argument("--baseline-child")
    a = ap.parse_args()
    if a.baseline_child:
        return baseline_child(a.baseline_child)
    if a.topologies:
        return topologies(a, tempfile.mkdtemp(prefix="apportion-fair-bench-"))
    sizes = [(50, 2, 100), (100, 2, 300)]
    if a.large:
        sizes += [(100, 3, 1000), (200, 2, 2000), (200, 2, 5000)]
    if a.quick:
        sizes = sizes[:1]
    work = tempfile.mkdtemp(prefix="apportion-fair-bench-")
    print("| nodes | arcs | demands | tiers | Apportion ms | LP solves | simplex iterations (hot / cold start) | baseline ms | speed-up | WASM ms | WASM/native | largest share difference |")
    print("|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|--:|")
    for n, deg, k in sizes:
        inst = instance(n, deg, k, seed=n * 7919 + k)
        path = os.path.join(work, f"g{n}-{k}.json")
        json.dump(inst, open(path, "w"))
        ms, solves, shares = run_apportion([a.native, "--cold"], path)
        wasm_ms, _, wasm_shares = run_apportion(["node", a.wasm, "--warm-up"], path)
        fair = subprocess.run([os.path.join(os.path.dirname(a.native), "apportion"), "fair", path, "--json",
                               path + ".out"], capture_output=True, text=True)
        tiers = len(json.load(open(path + ".out"))["tiers"]) if fair.returncode == 0 else "?"
        base_ms, diff = None, None
        try:
            p = subprocess.run([sys.executable, __file__, "--native", a.native, "--wasm", a.wasm, "--baseline-child", path],
                               capture_output=True, text=True, timeout=a.budget, check=True)
            ref = json.loads(p.stdout)
            base_ms = ref["ms"]
            scale = max(x["capacity"] for x in inst["arcs"])
            diff = max(abs(x - y) for x, y in zip(shares, ref["shares"])) / scale
        except subprocess.TimeoutExpired:
            pass
        wdiff = max(abs(x - y) for x, y in zip(shares, wasm_shares))
        base = f"{base_ms:.0f}" if base_ms is not None else f"> {a.budget * 1000:.0f}"
        speed = f"{base_ms / ms:.1f}x" if base_ms is not None else f"> {a.budget * 1000 / ms:.0f}x"
        d = f"{diff:.1e}" if diff is not None else f"(WASM vs native {wdiff:.1e})"
        print(f"| {n} | {len(inst['arcs'])} | {k} | {tiers} | {ms:.0f} | {solves[0]} | {solves[1]} / {solves[2]} | {base} | {speed} | "
              f"{wasm_ms:.0f} | {wasm_ms / ms:.2f} | {d} |", flush=True)


if __name__ == "__main__":
    sys.exit(main())
