#!/usr/bin/python3
"""Cross-check of Apportion's single-commodity solvers against outside references.

For seeded random instances (invented data), Apportion's `maxflow` and `mincost` results are
compared with independent formulations of the same problem, built here from the same
instance data:
  - networkx 2.8.8 (Debian python3-networkx): maximum_flow_value (preflow push) and
    network_simplex, on integer instances;
  - GLPK 5.0 (Debian glpk-utils): `glpsol --maxflow` / `--mincost` on DIMACS files this
    script writes itself, on integer instances;
  - SciPy 1.10.1 (Debian python3-scipy): linprog(method="highs") on the arc formulation, on
    real-valued instances, where shared two-way arcs get their true constraint
    x(u,v) + x(v,u) <= capacity.
Values must agree to 1e-9 relative. Exit status 0 when all agree.
"""
import argparse
import json
import math
import os
import random
import re
import subprocess
import sys

import networkx as nx
import numpy as np
from scipy.optimize import linprog

REL = 1e-9


def close(a, b):
    return abs(a - b) <= REL * max(1.0, abs(a), abs(b))


def random_instance(rng, integral, two_way_share):
    n = rng.randint(2, 40)
    m = rng.randint(0, 150)
    nodes = [{"id": f"v{i}"} for i in range(n)]
    arcs = []
    for a in range(m):
        if a < n - 1 and rng.random() < 0.5:
            u, v = a, a + 1
        else:
            u, v = rng.randrange(n), rng.randrange(n)
        cap = rng.randint(0, 100) if integral else round(rng.uniform(0, 100), 6)
        cost = rng.randint(0, 20) if integral else round(rng.uniform(0, 20), 6)
        arc = {"id": f"e{a}", "from": f"v{u}", "to": f"v{v}", "capacity": cap, "cost": cost}
        if rng.random() < two_way_share:
            arc["shared_two_way"] = True
        arcs.append(arc)
    return {"format": "apportion-network", "version": 1, "name": "random", "nodes": nodes, "arcs": arcs,
            "demands": [{"id": "d", "origin": "v0", "destination": f"v{n - 1}", "amount": "max"}]}


def lanes(inst):
    """(u, v, cap, cost, arc index) per directed lane."""
    out = []
    for i, a in enumerate(inst["arcs"]):
        u, v = int(a["from"][1:]), int(a["to"][1:])
        out.append((u, v, a["capacity"], a["cost"], i))
        if a.get("shared_two_way"):
            out.append((v, u, a["capacity"], a["cost"], i))
    return out


def run_apportion(exe, work, inst, args):
    path = os.path.join(work, "inst.json")
    out = os.path.join(work, "result.json")
    with open(path, "w") as f:
        json.dump(inst, f)
    if os.path.exists(out):
        os.remove(out)
    p = subprocess.run([exe] + args[:1] + [path] + args[1:] + ["--json", out], capture_output=True, text=True)
    if not os.path.exists(out):
        return p.returncode, None
    with open(out) as f:
        return p.returncode, json.load(f)


def nx_max_flow(inst, n):
    g = nx.DiGraph()
    g.add_nodes_from(range(n))
    for u, v, cap, _, _ in lanes(inst):
        if u == v:
            continue
        if g.has_edge(u, v):
            g[u][v]["capacity"] += cap  # parallel arcs merge
        else:
            g.add_edge(u, v, capacity=cap)
    return nx.maximum_flow_value(g, 0, n - 1)


def write_dimacs(inst, n, path, kind, supply=None):
    # Self-loops change no flow value, but glpsol counts a loop at s as outflow: leave them out.
    ls = [l for l in lanes(inst) if l[0] != l[1]]
    if not ls:
        return False
    with open(path, "w") as f:
        f.write(f"p {kind} {n} {len(ls)}\n")
        if kind == "max":
            f.write(f"n 1 s\nn {n} t\n")
        else:
            for v, b in enumerate(supply):
                if b:
                    f.write(f"n {v + 1} {b}\n")
        for u, v, cap, cost, _ in ls:
            if kind == "max":
                f.write(f"a {u + 1} {v + 1} {cap}\n")
            else:
                f.write(f"a {u + 1} {v + 1} 0 {cap} {cost}\n")
    return True


def glpk_objective(args, work):
    out = os.path.join(work, "glpk.out")
    subprocess.run(["glpsol"] + args + ["-o", out], capture_output=True, check=True)
    text = open(out).read()
    status = re.search(r"Status:\s+(\S+)", text).group(1)
    obj = re.search(r"Objective:\s+(?:\S+\s+=\s+)?(-?[0-9.eE+-]+)", text)
    return status, float(obj.group(1)) if obj else None


def lp_arc_formulation(inst, n, supply=None):
    """Max flow (supply None) or min-cost flow as an LP: one variable per lane, one
    capacity row per arc (both lanes of a shared two-way arc together), conservation rows."""
    ls = lanes(inst)
    k = len(ls)
    A_ub, b_ub = [], []
    for i, a in enumerate(inst["arcs"]):
        row = [1.0 if l[4] == i else 0.0 for l in ls]
        A_ub.append(row)
        b_ub.append(a["capacity"])
    if supply is None:
        # variables: lanes + value; net outflow(v) = value at s, -value at t, 0 elsewhere
        A_eq = np.zeros((n, k + 1))
        for j, (u, v, _, _, _) in enumerate(ls):
            A_eq[u, j] += 1
            A_eq[v, j] -= 1
        A_eq[0, k] = -1
        A_eq[n - 1, k] = 1
        c = np.zeros(k + 1)
        c[k] = -1
        A_ub = [r + [0.0] for r in A_ub]
        res = linprog(c, A_ub=A_ub or None, b_ub=b_ub or None, A_eq=A_eq, b_eq=np.zeros(n), bounds=(0, None),
                      method="highs")
        return -res.fun
    A_eq = np.zeros((n, k))
    for j, (u, v, _, _, _) in enumerate(ls):
        A_eq[u, j] += 1
        A_eq[v, j] -= 1
    c = np.array([l[3] for l in ls], dtype=float)
    res = linprog(c if k else None, A_ub=A_ub or None, b_ub=b_ub or None, A_eq=A_eq if k else None,
                  b_eq=np.array(supply, dtype=float) if k else None, bounds=(0, None), method="highs")
    return res.fun if res.status == 0 else None


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--apportion", required=True)
    ap.add_argument("--work", required=True)
    ap.add_argument("--count", type=int, default=200)
    args = ap.parse_args()
    os.makedirs(args.work, exist_ok=True)
    rng = random.Random(20261202)
    failures = 0
    compared = {"networkx": 0, "glpk": 0, "scipy-highs": 0}

    def fail(kind, i, msg, inst):
        nonlocal failures
        failures += 1
        bad = os.path.join(args.work, f"failed-{kind}-{i}.json")
        with open(bad, "w") as f:
            json.dump(inst, f)
        print(f"MISMATCH {kind} instance {i}: {msg} (saved {bad})")

    for i in range(args.count):
        integral = i % 2 == 0
        inst = random_instance(rng, integral, 0.0 if i % 3 else 0.25)
        n = len(inst["nodes"])
        rc, res = run_apportion(args.apportion, args.work, inst, ["maxflow"])
        if rc != 0 or res is None or not res["check"]["ok"]:
            fail("maxflow", i, f"apportion exit {rc}", inst)
            continue
        ours = res["value"]
        if not close(ours, res["min_cut"]["capacity"]):
            fail("maxflow", i, "flow value differs from the cut capacity", inst)
        if integral:
            ref = nx_max_flow(inst, n)
            compared["networkx"] += 1
            if not close(ours, ref):
                fail("maxflow", i, f"apportion {ours} networkx {ref}", inst)
            dim = os.path.join(args.work, "ref.max")
            g = glpk_objective(["--maxflow", dim], args.work)[1] if write_dimacs(inst, n, dim, "max") else 0.0
            compared["glpk"] += 1
            if not close(ours, g):
                fail("maxflow", i, f"apportion {ours} glpk {g}", inst)
        else:
            ref = lp_arc_formulation(inst, n)
            compared["scipy-highs"] += 1
            if not close(ours, ref):
                fail("maxflow", i, f"apportion {ours} scipy {ref}", inst)

    for i in range(args.count):
        integral = i % 2 == 0
        inst = random_instance(rng, integral, 0.0 if i % 3 else 0.25)
        n = len(inst["nodes"])
        # Supplies: a random amount from v0 to the last node, sometimes more than can be sent.
        amount = rng.randint(0, 120) if integral else round(rng.uniform(0, 120), 6)
        supply = [0] * n
        supply[0], supply[n - 1] = amount, -amount
        if i % 4 < 2 and amount:  # through the file's node supplies
            for v, b in enumerate(supply):
                if b:
                    inst["nodes"][v]["supply"] = b
            cli = ["mincost"]
        else:  # through the command line
            cli = ["mincost", "--from", "v0", "--to", f"v{n - 1}", "--amount", repr(amount)]
        rc, res = run_apportion(args.apportion, args.work, inst, cli)
        if integral:
            G = nx.DiGraph()
            for v in range(n):
                G.add_node(v, demand=-supply[v])
            # networkx DiGraph has no parallel arcs: route each lane through its own middle node.
            for j, (u, v, cap, cost, _) in enumerate(lanes(inst)):
                mid = ("lane", j)
                G.add_edge(u, mid, capacity=cap, weight=cost)
                G.add_edge(mid, v, capacity=cap, weight=0)
            try:
                ref = nx.network_simplex(G)[0]
            except nx.NetworkXUnfeasible:
                ref = None
            compared["networkx"] += 1
            dim = os.path.join(args.work, "ref.min")
            if write_dimacs(inst, n, dim, "min", supply):
                status, g = glpk_objective(["--mincost", dim], args.work)
            else:
                status, g = ("OPTIMAL", 0.0) if amount == 0 else ("INFEASIBLE", None)
            compared["glpk"] += 1
            if (status == "OPTIMAL") != (ref is not None):
                fail("mincost", i, f"networkx and glpk disagree on feasibility ({status})", inst)
            if ref is not None and not close(g, ref):
                fail("mincost", i, f"networkx {ref} glpk {g}", inst)
        else:
            ref = lp_arc_formulation(inst, n, supply)
            compared["scipy-highs"] += 1
        if ref is None:
            if rc != 1 or res is None or res["status"] != "infeasible":
                fail("mincost", i, f"reference says infeasible, apportion exit {rc}", inst)
        else:
            if rc != 0 or res is None or not res["check"]["ok"] or not close(res["cost"], ref):
                fail("mincost", i, f"apportion {res and res.get('cost')} (exit {rc}) reference {ref}", inst)

    total = 2 * args.count
    print(f"compared {total} instances ({args.count} max flow, {args.count} min-cost flow); "
          f"reference solves: {compared}")
    print(f"{total - failures} passed, {failures} failed")
    return 0 if failures == 0 else 1


if __name__ == "__main__":
    sys.exit(main())
