#!/usr/bin/python3
"""Cross-check of Apportion's fair-multiflow engine against an independent formulation.

For seeded random instances (invented data; up to 30 nodes, 80 arcs, 40 demands), the
shares of `apportion fair` (weighted max-min fairness), the lambda of `apportion concurrent`
and the total of `apportion throughput` are compared with the ARC formulation solved by
SciPy 1.10.1's HiGHS (Debian python3-scipy, scipy.optimize.linprog(method="highs")):
one flow variable per demand and lane, conservation per demand and node, one capacity row
per arc (both lanes of a shared two-way arc together).

Max-min fairness is computed here by the textbook method (D. Nace, M. Pioro, "Max-min
fairness and its applications to routing and load-balancing in communication networks: a
tutorial", IEEE Communications Surveys & Tutorials 10(4), 2008, the iterative LP with
non-blocking tests): each round maximises the common level t of the unfrozen demands, then
tests every unfrozen demand by maximising its own share with t fixed; a demand that cannot
exceed w_k t freezes. (A demand seen above w_k t in any test solution is known not to be
blocked and is not tested again in that round.)
Shares must agree to 1e-6 (relative to the largest capacity). Exit status 0 when all agree.
"""
import argparse
import json
import math
import multiprocessing
import os
import random
import subprocess
import sys

import numpy as np
from scipy.optimize import linprog
from scipy.sparse import lil_matrix

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


class ArcModel:
    """Variables: x[k, lane] for every demand and lane, then f[k], then t."""

    def __init__(self, inst):
        self.n = len(inst["nodes"])
        self.lanes = []
        self.caps = []
        for i, a in enumerate(inst["arcs"]):
            cap = a["capacity"] if a.get("enabled", True) else 0.0
            self.caps.append(cap)
            u, v = int(a["from"][1:]), int(a["to"][1:])
            self.lanes.append((u, v, i))
            if a.get("shared_two_way"):
                self.lanes.append((v, u, i))
        self.dem = [(int(d["origin"][1:]), int(d["destination"][1:]),
                     math.inf if d.get("amount", "max") == "max" else float(d["amount"]), float(d.get("weight", 1)))
                    for d in inst["demands"]]
        K, L = len(self.dem), len(self.lanes)
        self.K, self.L = K, L
        self.nvar = K * L + K + 1
        self.f0 = K * L
        self.t = K * L + K
        # equalities: per demand and node, net outflow of x = f_k at origin, -f_k at destination
        eq = lil_matrix((K * self.n, self.nvar))
        for k, (o, d, _, _) in enumerate(self.dem):
            for j, (u, v, _) in enumerate(self.lanes):
                eq[k * self.n + u, k * L + j] += 1
                eq[k * self.n + v, k * L + j] -= 1
            eq[k * self.n + o, self.f0 + k] -= 1
            eq[k * self.n + d, self.f0 + k] += 1
        self.A_eq = eq.tocsr()
        cap = lil_matrix((len(self.caps), self.nvar))
        for k in range(K):
            for j, (_, _, a) in enumerate(self.lanes):
                cap[a, k * L + j] = 1
        self.A_cap = cap.tocsr()

    def solve(self, c, bounds, extra_ub=None, extra_b=None):
        from scipy.sparse import vstack
        A_ub, b_ub = self.A_cap, list(self.caps)
        if extra_ub is not None:
            A_ub = vstack([A_ub, extra_ub])
            b_ub = b_ub + extra_b
        res = linprog(c, A_ub=A_ub, b_ub=b_ub, A_eq=self.A_eq, b_eq=np.zeros(self.A_eq.shape[0]), bounds=bounds,
                      method="highs")
        if res.status != 0:
            raise RuntimeError(f"reference LP failed: {res.message}")
        return res

    def base_bounds(self):
        b = [(0, None)] * (self.K * self.L)
        b += [(0, None if math.isinf(a) else a) for (_, _, a, _) in self.dem]
        b += [(0, None)]
        return b

    def level_rows(self, ks, coef):
        """rows  coef_k * t - f_k <= 0  for k in ks"""
        rows = lil_matrix((len(ks), self.nvar))
        for r, k in enumerate(ks):
            rows[r, self.f0 + k] = -1
            rows[r, self.t] = coef[k]
        return rows.tocsr(), [0.0] * len(ks)

    def max_min(self):
        K = self.K
        frozen = {}
        while len(frozen) < K:
            open_ = [k for k in range(K) if k not in frozen]
            bounds = self.base_bounds()
            for k, v in frozen.items():
                bounds[self.f0 + k] = (v, v)
            cap_t = min([self.dem[k][2] / self.dem[k][3] for k in open_ if not math.isinf(self.dem[k][2])],
                        default=None)
            bounds[self.t] = (0, cap_t)
            w = [d[3] for d in self.dem]
            rows, rb = self.level_rows(open_, w)
            c = np.zeros(self.nvar)
            c[self.t] = -1
            t = self.solve(c, bounds, rows, rb).x[self.t]
            bounds[self.t] = (t, t)
            newly, not_blocked = [], set()
            for k in open_:
                amt, wk = self.dem[k][2], self.dem[k][3]
                if not math.isinf(amt) and amt <= wk * t + TOL:
                    newly.append(k)
                    continue
                if k in not_blocked:
                    continue
                c = np.zeros(self.nvar)
                c[self.f0 + k] = -1
                x = self.solve(c, bounds, rows, rb).x
                if x[self.f0 + k] <= wk * t + TOL:
                    newly.append(k)
                for j in open_:
                    if x[self.f0 + j] > self.dem[j][3] * t + TOL:
                        not_blocked.add(j)
            if not newly:
                raise RuntimeError("reference froze nothing")
            for k in newly:
                frozen[k] = min(self.dem[k][2], self.dem[k][3] * t)
        return [frozen[k] for k in range(K)]

    def max_throughput(self):
        c = np.zeros(self.nvar)
        c[self.f0:self.f0 + self.K] = -1
        return -self.solve(c, self.base_bounds()).fun

    def max_concurrent(self):
        ks = [k for k in range(self.K) if not math.isinf(self.dem[k][2])]
        if not ks or sum(self.dem[k][2] for k in ks) == 0:
            return None
        bounds = [(0, None)] * self.nvar
        rows, rb = self.level_rows(ks, [d[2] for d in self.dem])
        c = np.zeros(self.nvar)
        c[self.t] = -1
        return self.solve(c, bounds, rows, rb).x[self.t]


def run(exe, work, inst, cmd):
    path = os.path.join(work, "inst.json")
    out = os.path.join(work, "out.json")
    with open(path, "w") as f:
        json.dump(inst, f)
    if os.path.exists(out):
        os.remove(out)
    p = subprocess.run([exe, cmd, path, "--json", out], capture_output=True, text=True)
    if p.returncode != 0 or not os.path.exists(out):
        return None, p.stderr
    return json.load(open(out)), ""


def check(job):
    """Compares one instance; returns (index, problems, largest share difference)."""
    i, inst, exe, work = job
    work = os.path.join(work, f"worker-{os.getpid()}")
    os.makedirs(work, exist_ok=True)
    model = ArcModel(inst)
    scale = max([1.0] + model.caps)
    problems, largest = [], 0.0
    fair, err = run(exe, work, inst, "fair")
    if fair is None:
        problems.append(f"apportion fair failed: {err.strip()}")
    else:
        ref = model.max_min()
        for k, d in enumerate(fair["demands"]):
            diff = abs(d["share"] - ref[k]) / scale
            largest = max(largest, diff)
            if diff > TOL:
                problems.append(f"demand {d['id']}: apportion {d['share']} reference {ref[k]}")
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
