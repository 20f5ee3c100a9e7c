#!/usr/bin/python3
"""Cross-check of Apportion's fair-multiflow engine against an independent formulation.

For seeded random instances (invented data; up to 30 nodes, 80 arcs, 40 demands), the
shares of `apportion fair` (weighted max-min fairness), the lambda of `apportion concurrent`
and the total of `apportion throughput` are compared with the ARC formulation solved by
SciPy 1.10.1's HiGHS, max-min fairness by the textbook method of Nace and Pioro (2008); see
fair_reference.py.
Shares must agree to 1e-6 (relative to the largest capacity). `apportion fair` runs with
`--certify`: its certificate must prove every share to 1e-6 of the largest, and the
reference's shares must lie in its proven intervals (to 1e-6 of the largest capacity).
Exit status 0 when all agree.
"""
import argparse
import json
import math
import multiprocessing
import os
import random
import sys

from fair_reference import ArcModel, run_apportion

TOL = 1e-6


def random_instance(rng, i):
    n = rng.randint(3, 30)
    m = rng.randint(n, 80)
    k = rng.randint(1, 40)
    nodes = [{"id": f"v{j}"} for j in range(n)]
    arcs = []
    for a in range(m):
        if a < n - 1:
            u, v = a, a + 1  # a backbone path keeps most demands served
        else:
            u, v = rng.randrange(n), rng.randrange(n)
            while v == u:
                v = rng.randrange(n)
        cap = rng.randint(0, 20) if i % 2 == 0 else round(rng.uniform(0, 20), 4)
        arc = {"id": f"e{a}", "from": f"v{u}", "to": f"v{v}", "capacity": cap}
        if rng.random() < 0.3:
            arc["shared_two_way"] = True
        if rng.random() < 0.05:
            arc["enabled"] = False
        arcs.append(arc)
    demands = []
    for d in range(k):
        o = rng.randrange(n)
        t = rng.randrange(n)
        while t == o:
            t = rng.randrange(n)
        dem = {"id": f"d{d}", "origin": f"v{o}", "destination": f"v{t}",
               "weight": rng.choice([1, 1, 1, 2, 0.5, 3])}
        dem["amount"] = "max" if rng.random() < 0.4 else rng.randint(0, 15)
        demands.append(dem)
    return {"format": "apportion-network", "version": 1, "name": f"random {i}", "nodes": nodes, "arcs": arcs,
            "demands": demands}


def run(exe, work, inst, cmd, extra=()):
    result, _, err = run_apportion([exe], work, inst, cmd, extra=extra)
    return result, err


def check(job):
    """Compares one instance; returns (index, problems, largest share difference)."""
    i, inst, exe, work = job
    work = os.path.join(work, f"worker-{os.getpid()}")
    os.makedirs(work, exist_ok=True)
    model = ArcModel(inst)
    scale = max([1.0] + model.caps)
    problems, largest = [], 0.0
    fair, err = run(exe, work, inst, "fair", ["--certify"])
    if fair is None:
        problems.append(f"apportion fair failed: {err.strip()}")
    else:
        ref, _ = model.max_min()
        cert = fair.get("fairness_certificate", {})
        top = max([d["share"] for d in fair["demands"]] + [1e-300])
        if cert.get("status") != "optimal" or cert.get("max_relative_error", 1) > TOL:
            problems.append(f"certificate: {cert}")
        for k, d in enumerate(fair["demands"]):
            diff = abs(d["share"] - ref[k]) / scale
            largest = max(largest, diff)
            if diff > TOL:
                problems.append(f"demand {d['id']}: apportion {d['share']} reference {ref[k]}")
            b = d.get("fair_share_bounds")
            if b is None or not (b["lower"] - TOL * scale <= ref[k] <= (b["upper"] if b["upper"] is not None
                                                                          else math.inf) + TOL * scale):
                problems.append(f"demand {d['id']}: reference {ref[k]} outside the proven {b} (largest share {top})")
        tp = model.max_throughput()
        if abs(fair["totals"]["max_throughput"] - tp) / scale > TOL:
            problems.append(f"max throughput: apportion {fair['totals']['max_throughput']} reference {tp}")
    conc, err = run(exe, work, inst, "concurrent")
    lam = model.max_concurrent()
    if lam is None:
        if conc is not None:
            problems.append("concurrent should be refused: no demand with a positive amount")
    elif conc is None or abs(conc["totals"]["lambda"] - lam) > TOL * max(1.0, lam):
        problems.append(f"lambda: apportion {conc and conc['totals']['lambda']} reference {lam} {err.strip()}")
    return i, problems, largest


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--apportion", required=True)
    ap.add_argument("--work", required=True)
    ap.add_argument("--count", type=int, default=300)
    ap.add_argument("--jobs", type=int, default=2)
    args = ap.parse_args()
    os.makedirs(args.work, exist_ok=True)
    rng = random.Random(314159)
    jobs = [(i, random_instance(rng, i), args.apportion, args.work) for i in range(args.count)]
    passed = failed = 0
    largest = 0.0
    with multiprocessing.Pool(args.jobs) as pool:
        for i, problems, diff in pool.imap(check, jobs, chunksize=2):
            largest = max(largest, diff)
            if problems:
                failed += 1
                bad = os.path.join(args.work, f"failed-{i}.json")
                json.dump(jobs[i][1], open(bad, "w"))
                print(f"MISMATCH instance {i} (saved {bad}): " + "; ".join(problems[:3]), flush=True)
            else:
                passed += 1
    print(f"compared {args.count} instances (up to 30 nodes, 80 arcs, 40 demands) with SciPy's HiGHS")
    print(f"largest share difference (relative to the largest capacity): {largest:.3g}")
    print(f"{passed} passed, {failed} failed")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main())
