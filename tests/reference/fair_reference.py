"""The outside reference for Apportion's fair-multiflow engine, shared by the cross-checks.

The ARC formulation solved by SciPy's HiGHS (Debian python3-scipy 1.10.1,
scipy.optimize.linprog(method="highs")): one flow variable per demand and lane,
conservation per demand and node, one capacity row per arc (both lanes of a shared two-way
arc together). It shares no code with Apportion, which routes on paths with column
generation.

Max-min fairness is computed by the textbook method (D. Nace, M. Pioro, "Max-min fairness
and its applications to routing and load-balancing in communication networks: a tutorial",
IEEE Communications Surveys & Tutorials 10(4), 2008, the iterative LP with non-blocking
tests): each round maximises the common level t of the unfrozen demands, then tests every
unfrozen demand by maximising its own share with t fixed; a demand that cannot exceed w_k t
freezes. (A demand seen above w_k t in any test solution is known not to be blocked and is
not tested again in that round.)

Tolerances. `freeze_tol` decides "cannot exceed w_k t": absolute 1e-6 suits data of order
1-100 (the random cross-check). For data over many orders of magnitude, `relative=True`
makes it 1e-9 of max(w_k t, the smallest positive capacity), so that a demand whose whole
world is a 0.001 arc is judged at its own scale, and HiGHS's feasibility tolerances are
tightened from 1e-7 to 1e-9.
"""
import json
import math
import os
import subprocess

import numpy as np
from scipy.optimize import linprog
from scipy.sparse import lil_matrix, vstack


class ArcModel:
    """Variables: x[k, lane] for every demand and lane, then f[k], then t."""

    def __init__(self, inst, relative=False):
        index = {n["id"]: j for j, n in enumerate(inst["nodes"])}
        self.n = len(inst["nodes"])
        self.lanes = []
        self.caps = []
        for i, a in enumerate(inst["arcs"]):
            cap = float(a["capacity"]) if a.get("enabled", True) else 0.0
            self.caps.append(cap)
            u, v = index[a["from"]], index[a["to"]]
            self.lanes.append((u, v, i))
            if a.get("shared_two_way"):
                self.lanes.append((v, u, i))
        self.dem = [(index[d["origin"]], index[d["destination"]],
                     math.inf if d.get("amount", "max") == "max" else float(d["amount"]), float(d.get("weight", 1)))
                    for d in inst["demands"]]
        self.relative = relative
        positive = [c for c in self.caps if c > 0]
        self.smallest = min(positive) if positive else 1.0
        self.options = {"primal_feasibility_tolerance": 1e-9, "dual_feasibility_tolerance": 1e-9} if relative else {}
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

    def freeze_tol(self, level):
        if self.relative:
            return 1e-9 * max(abs(level), self.smallest)
        return 1e-6

    def solve(self, c, bounds, extra_ub=None, extra_b=None):
        A_ub, b_ub = self.A_cap, list(self.caps)
        if extra_ub is not None:
            A_ub = vstack([A_ub, extra_ub])
            b_ub = b_ub + extra_b
        args = dict(A_ub=A_ub, b_ub=b_ub, A_eq=self.A_eq, b_eq=np.zeros(self.A_eq.shape[0]), bounds=bounds,
                    method="highs")
        res = linprog(c, options=self.options, **args)
        if res.status != 0 and self.options:
            # HiGHS may stop at "unknown" under the tightened tolerances; its defaults then decide.
            res = linprog(c, **args)
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
        """Returns (shares, rounds): the max-min fair shares and, per demand, the round it froze in."""
        K = self.K
        frozen, rounds = {}, {}
        round_no = 0
        while len(frozen) < K:
            round_no += 1
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
                tol = self.freeze_tol(wk * t)
                if not math.isinf(amt) and amt <= wk * t + tol:
                    newly.append(k)
                    continue
                if k in not_blocked:
                    continue
                c = np.zeros(self.nvar)
                c[self.f0 + k] = -1
                x = self.solve(c, bounds, rows, rb).x
                if x[self.f0 + k] <= wk * t + tol:
                    newly.append(k)
                for j in open_:
                    if x[self.f0 + j] > self.dem[j][3] * t + self.freeze_tol(self.dem[j][3] * t):
                        not_blocked.add(j)
            if not newly:
                raise RuntimeError("reference froze nothing")
            for k in newly:
                frozen[k] = min(self.dem[k][2], self.dem[k][3] * t)
                rounds[k] = round_no
        return [frozen[k] for k in range(K)], [rounds[k] for k in range(K)]

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


def run_apportion(cmd_prefix, work, inst, command, name="inst", extra=()):
    """Runs `<cmd_prefix> <command> <file> --json <out> <extra...>`; returns (parsed result, raw
    text, stderr)."""
    path = os.path.join(work, f"{name}.json")
    out = os.path.join(work, f"{name}.{command}.out.json")
    with open(path, "w") as f:
        json.dump(inst, f)
    if os.path.exists(out):
        os.remove(out)
    p = subprocess.run(list(cmd_prefix) + [command, path, "--json", out] + list(extra), capture_output=True, text=True)
    if not os.path.exists(out):
        return None, None, p.stderr
    raw = open(out).read()
    return json.loads(raw), raw, p.stderr
