#!/usr/bin/python3
"""Tests of the `apportion` command line: exit codes, help, errors and files.

Each check prints one line; the last line is "N passed, M failed"."""
import argparse
import json
import os
import shutil
import subprocess
import sys
import xml.etree.ElementTree as ET

ap = argparse.ArgumentParser()
ap.add_argument("--apportion", required=True)
ap.add_argument("--root", required=True)
ap.add_argument("--work", required=True)
args = ap.parse_args()
shutil.rmtree(args.work, ignore_errors=True)
os.makedirs(args.work)
demos = sorted(os.path.join(args.root, "demo-networks", f)
               for f in os.listdir(os.path.join(args.root, "demo-networks")) if f.endswith(".json"))
passed = failed = 0


def run(*a):
    return subprocess.run([args.apportion, *a], capture_output=True, text=True)


def check(name, ok, detail=""):
    global passed, failed
    if ok:
        passed += 1
        print(f"ok    {name}")
    else:
        failed += 1
        print(f"FAIL  {name} {detail}")


def w(name, text):
    p = os.path.join(args.work, name)
    with open(p, "w") as f:
        f.write(text)
    return p


# Help: every subcommand answers --help with an example, exit 0.
for cmd in ["validate", "convert", "maxflow", "mincut", "mincost", "demands", "fair", "throughput", "concurrent", "feasible",
            "tradeoff"]:
    r = run(cmd, "--help")
    check(f"{cmd} --help", r.returncode == 0 and "Example" in r.stdout and "demo-networks/" in r.stdout)
r = run()
check("no command is a usage error", r.returncode == 2)
check("unknown command is a usage error", run("frobnicate").returncode == 2)
check("unknown option is a usage error", run("validate", demos[0], "--bogus").returncode == 2)

# The demo networks validate and solve.
for d in demos:
    check(f"validate {os.path.basename(d)}", run("validate", d).returncode == 0)
    r = run("maxflow", d)
    check(f"maxflow {os.path.basename(d)}", r.returncode == 0 and "checked: ok" in r.stdout, r.stderr)
    r = run("mincost", d)
    check(f"mincost {os.path.basename(d)}", r.returncode in (0, 1) and "planning aid" in (r.stdout + r.stderr), r.stderr)

# The fair-multiflow commands solve every demo network, and write their files.
for d in demos:
    for cmd in ["fair", "throughput", "concurrent", "feasible", "tradeoff"]:
        r = run(cmd, d)
        check(f"{cmd} {os.path.basename(d)}", r.returncode == 0 and "checked: ok" in r.stdout, r.stderr)
prefix = os.path.join(args.work, "fair")
r = run("fair", demos[0], "--json", prefix + ".json", "--csv", prefix, "--paths")
fair = json.load(open(prefix + ".json"))
check("fair JSON has tiers, shares and the check",
      fair["status"] == "optimal" and fair["tiers"] and fair["check"]["ok"] and
      all(d["tier"] >= 1 for d in fair["demands"]))
plain, shown = run("fair", demos[0]), run("fair", demos[0], "--progress")
check("fair --progress reports on standard error and leaves the result alone",
      shown.returncode == 0 and shown.stdout == plain.stdout and "apportion fair: solved in" in shown.stderr and
      "LPs" in shown.stderr, shown.stderr)
check("fair CSV tables are written", all(os.path.exists(prefix + s) for s in [".demands.csv", ".arcs.csv", ".paths.csv"]))
# The picture for a report: well-formed SVG (read back with Python's own XML parser), light,
# with the rule, the totals and the caution.
r = run("feasible", demos[0], "--svg", prefix + ".svg")
svg_root = ET.parse(prefix + ".svg").getroot()
svg_text = " ".join(t.text or "" for t in svg_root.iter("{http://www.w3.org/2000/svg}text"))
check("feasible --svg writes the picture for a report",
      r.returncode == 0 and svg_root.find("{http://www.w3.org/2000/svg}rect").get("fill") == "#ffffff" and
      "Rule: can every demand be met?" in svg_text and "throughput" in svg_text and "planning aid" in svg_text,
      svg_text[:300])
# The rounds aggregated by origin give the same shares (to the LP's tolerance, 1e-7 of the
# largest) on every demo network as the per-demand rounds; both checked by the checker.
for d in demos:
    pd = os.path.join(args.work, "per-demand.json")
    bo = os.path.join(args.work, "by-origin.json")
    r1, r2 = run("fair", d, "--json", pd), run("fair", d, "--by-origin", "--json", bo)
    a, b = json.load(open(pd)), json.load(open(bo))
    top = max([x["share"] for x in a["demands"]] + [1e-300])
    check(f"fair --by-origin {os.path.basename(d)}: the same shares, checked",
          r1.returncode == 0 and r2.returncode == 0 and b["check"]["ok"] and
          all(abs(x["share"] - y["share"]) <= 1e-7 * top for x, y in zip(a["demands"], b["demands"])) and
          len(a["demands"]) == len(b["demands"]), r2.stderr)
# The fairness certificate (fair --certify) on every demo: it proves each share to 1e-6 of
# the largest (exit 0), each share lies in its proven interval, and the JSON and CSV carry
# the bounds. An unfair allocation is not asked here: the core tests hold the bounds to the
# exact shares for perturbed allocations.
for d in demos:
    cj = os.path.join(args.work, "certified.json")
    cp = os.path.join(args.work, "certified")
    r = run("fair", d, "--certify", "--json", cj, "--csv", cp)
    c = json.load(open(cj)) if r.returncode == 0 else {"demands": []}
    top = max([x["share"] for x in c["demands"]] + [1e-300])
    bounds = [x.get("fair_share_bounds") for x in c["demands"]]
    header = open(cp + ".demands.csv").readline() if r.returncode == 0 else ""
    check(f"fair --certify {os.path.basename(d)}: every share proven, in its interval, in JSON and CSV",
          r.returncode == 0 and "fairness certificate: every share is within" in r.stdout and
          c.get("fairness_certificate", {}).get("status") == "optimal" and
          c["fairness_certificate"]["max_relative_error"] <= 1e-6 and len(c["demands"]) > 0 and
          all(b is not None and b["lower"] - 1e-9 * top <= x["share"] <= b["upper"] + 1e-9 * top
              for b, x in zip(bounds, c["demands"])) and
          header.strip().endswith("fair_share_lower,fair_share_upper,fair_share_error"), r.stdout[-500:] + r.stderr)
check("tradeoff --certify is a usage error", run("tradeoff", demos[0], "--certify").returncode == 2)
# `apportion certify` proves a saved result; an unfair one (a demand's share and paths scaled
# down, still a feasible routing) is refused with exit 3 naming that demand; a result of
# another rule is bad input.
saved = os.path.join(args.work, "saved.json")
run("fair", demos[0], "--json", saved)
r = run("certify", demos[0], saved)
check("certify a saved fair result: proven (exit 0)",
      r.returncode == 0 and "routing: checked" in r.stdout and "fairness: every share is within" in r.stdout,
      r.stdout + r.stderr)
unfair = json.load(open(saved))
victim = max(unfair["demands"], key=lambda x: x["share"])
victim["share"] *= 0.5
for p in victim["paths"]:
    p["amount"] *= 0.5
for a in unfair["arcs"]:  # the per-arc view follows the paths
    if victim["id"] in a["per_demand"]:
        a["load"] -= a["per_demand"][victim["id"]] * 0.5
        a["per_demand"][victim["id"]] *= 0.5
tampered = w("tampered.json", json.dumps(unfair))
r = run("certify", demos[0], tampered)
check("certify an unfair result: not proven (exit 3), the demand named",
      r.returncode == 3 and "NOT proven" in r.stdout and victim["id"] in r.stdout, r.stdout + r.stderr)
thr = os.path.join(args.work, "throughput.json")
run("throughput", demos[0], "--json", thr)
check("certify a throughput result: bad input (exit 2)", run("certify", demos[0], thr).returncode == 2)
check("fair --hop-limit 0 is a usage error", run("fair", demos[0], "--hop-limit", "0").returncode == 2)
check("tradeoff --epsilon 2 is a usage error", run("tradeoff", demos[0], "--epsilon", "2").returncode == 2)

# Bad input: exit 2, the message names item and field, and no output file appears.
bad = w("bad.json", json.dumps({"format": "apportion-network", "version": 1, "nodes": [{"id": "a"}, {"id": "b"}],
                               "arcs": [{"id": "e1", "from": "a", "to": "b", "capacity": -3}],
                               "demands": [{"id": "k", "origin": "a", "destination": "b", "amount": 1}]}))
out = os.path.join(args.work, "never.json")
r = run("maxflow", bad, "--json", out)
check("a negative capacity is bad input (exit 2)", r.returncode == 2)
check("the message names arc e1 and field capacity", "arc 'e1', field 'capacity'" in r.stderr, r.stderr)
check("no output file after an error", not os.path.exists(out))
r = run("validate", w("broken.json", '{"format": "apportion-network", "version": 1, "nodes": [}'))
check("broken JSON is bad input with a position", r.returncode == 2 and "byte" in r.stderr, r.stderr)
check("a missing file is bad input", run("validate", os.path.join(args.work, "missing.json")).returncode == 2)

# No solution: exit 1.
infeasible = w("infeasible.json", json.dumps({
    "format": "apportion-network", "version": 1, "nodes": [{"id": "a", "supply": 5}, {"id": "b", "supply": -5}],
    "arcs": [{"id": "e1", "from": "a", "to": "b", "capacity": 3, "cost": 1}], "demands": []}))
r = run("mincost", infeasible)
check("infeasible supplies exit 1", r.returncode == 1, r.stdout + r.stderr)

# Files: the input is never overwritten; outputs appear whole.
src = w("copy.json", open(demos[0]).read())
before = open(src).read()
r = run("convert", src, "--to", "json", src)
check("refuses to overwrite its input", r.returncode == 2 and open(src).read() == before)
r = run("maxflow", src, "--json", src)
check("refuses to write a result over its input", r.returncode == 2 and open(src).read() == before)
res = os.path.join(args.work, "result.json")
r = run("maxflow", src, "--json", res, "--csv", os.path.join(args.work, "arcs.csv"))
data = json.load(open(res))
check("result JSON carries status, value, cut and check",
      data["status"] == "optimal" and data["value"] == data["min_cut"]["capacity"] and data["check"]["ok"])
check("no temporary files are left behind", not [f for f in os.listdir(args.work) if ".tmp-" in f])

# Conversions chain: JSON -> CSV -> JSON -> DIMACS and back solve to the same value.
base = os.path.join(args.work, "net")
check("convert to csv", run("convert", demos[0], "--to", "csv", base).returncode == 0)
check("convert csv to json", run("convert", base + ".nodes.csv", "--to", "json", base + ".json").returncode == 0)
check("convert to dimacs-max", run("convert", base + ".json", "--to", "dimacs-max", base + ".max").returncode == 0)
# (units have no place in DIMACS: compare the numbers)
v1 = run("maxflow", demos[0]).stdout.split()[2]
v2 = run("maxflow", base + ".max").stdout.split()[2]
check("the same maximum flow after JSON -> CSV -> JSON -> DIMACS", v1 == v2, f"{v1!r} vs {v2!r}")

# Traffic matrices: generated, written as a matrix, read back, and a demands table added.
base = json.load(open(demos[0]))
n = len(base["nodes"])
gen = os.path.join(args.work, "gravity.json")
r = run("demands", demos[0], gen, "--gravity", "600", "--seed", "3", "--replace")
net = json.load(open(gen)) if r.returncode == 0 else {"demands": []}
check("demands --gravity: every ordered pair, amounts summing to the total",
      r.returncode == 0 and len(net["demands"]) == n * (n - 1) and abs(sum(d["amount"] for d in net["demands"]) - 600) < 1e-9 and
      run("validate", gen).returncode == 0, r.stderr)
matrix = os.path.join(args.work, "gravity.matrix.csv")
r = run("demands", gen, "--export-matrix", matrix)
check("demands --export-matrix writes one row per node and a header", r.returncode == 0 and
      len(open(matrix).read().strip().splitlines()) == n + 1, r.stderr)
back = os.path.join(args.work, "gravity-back.json")
r = run("demands", demos[0], back, "--matrix", matrix, "--replace")
check("demands --matrix reads the matrix back to the same demands",
      r.returncode == 0 and json.load(open(back))["demands"] == net["demands"], r.stderr)
masses = w("masses.csv", "node,mass\n" + "".join(f"{v['id']},{2 if i == 0 else 1}\n" for i, v in enumerate(base["nodes"])))
r = run("demands", demos[0], os.path.join(args.work, "masses.json"), "--gravity", "100", "--masses", masses, "--replace")
got = json.load(open(os.path.join(args.work, "masses.json")))["demands"] if r.returncode == 0 else []
# Hand-derived: node 0 has mass 2, the others 1; pairs touching node 0 have product 2, the
# rest 1: 2(n-1) pairs of 2 and (n-1)(n-2) of 1.
unit = 100 / (4 * (n - 1) + (n - 1) * (n - 2))
check("demands --masses: gravity amounts from the given masses",
      len(got) == n * (n - 1) and all(abs(d["amount"] - unit * (2 if base["nodes"][0]["id"] in (d["origin"], d["destination"]) else 1)) < 1e-9
                                      for d in got), r.stderr)
origin = base["nodes"][0]["id"]
few = os.path.join(args.work, "few.json")
r = run("demands", demos[0], few, "--uniform", "2", "--origins", origin, "--weight", "3")
added = json.load(open(few))["demands"][len(base["demands"]):] if r.returncode == 0 else []
check("demands --uniform --origins: one demand to every other node, with the weight",
      len(added) == n - 1 and all(d["origin"] == origin and d["amount"] == 2 and d["weight"] == 3 for d in added), r.stderr)
table = w("more.demands.csv", f"id,label,origin,destination,amount,weight\nextra,,{origin},{base['nodes'][1]['id']},5,2\n")
r = run("demands", demos[0], os.path.join(args.work, "table.json"), "--table", table)
check("demands --table adds a demands table", r.returncode == 0 and
      json.load(open(os.path.join(args.work, "table.json")))["demands"][-1]["id"] == "extra", r.stderr)
second = base["nodes"][1]["id"]
pasted = w("pasted.tsv", f"From\tTo\tAmount\n{origin}\t{second}\t\n{second}\t{origin}\t7\n")
r = run("demands", demos[0], os.path.join(args.work, "pasted.json"), "--table", pasted)
got = json.load(open(os.path.join(args.work, "pasted.json")))["demands"][len(base["demands"]):] if r.returncode == 0 else []
check("demands --table reads tab-separated cells without ids (a spreadsheet's copy)",
      len(got) == 2 and got[0]["amount"] == "max" and got[1]["amount"] == 7 and got[1]["id"].startswith(f"{second}-{origin}"),
      r.stderr)
bad = w("bad.demands.csv", f"origin,destination,amount\n{origin},nowhere,1\n")
r = run("demands", demos[0], os.path.join(args.work, "x.json"), "--table", bad)
check("demands --table names the row and column of a bad node", r.returncode != 0 and "row '2'" in r.stderr and
      "column 2 (destination)" in r.stderr and "'nowhere'" in r.stderr, r.stderr)
r = run("demands", demos[0], os.path.join(args.work, "x.json"), "--gravity", "1", "--max")
check("demands with two sources of amounts is a usage error", r.returncode == 2 and "exactly one of" in r.stderr)
r = run("demands", demos[0], os.path.join(args.work, "x.json"), "--max", "--origins", "nowhere")
check("demands --origins names a node that does not exist", r.returncode == 2 and "'nowhere'" in r.stderr, r.stderr)
r = run("demands", demos[0], demos[0], "--max")
check("demands never overwrites its input", r.returncode == 2 and json.load(open(demos[0])) == base, r.stderr)

# GraphML link speeds with their unit (invented topology): Mbit/s read into Gbit/s.
topo = w("speeds.graphml", """<graphml><key id="s" for="edge" attr.name="speed"/><graph id="T" edgedefault="undirected">
<node id="a"/><node id="b"/><node id="c"/>
<edge source="a" target="b"><data key="s">2500</data></edge><edge source="b" target="c"/></graph></graphml>""")
out = os.path.join(args.work, "speeds.json")
r = run("convert", topo, "--to", "json", out, "--capacity-attribute", "speed", "--attribute-unit", "Mbit/s",
        "--default-capacity", "10")
conv = json.load(open(out)) if r.returncode == 0 else {}
check("GraphML --attribute-unit: Mbit/s read into Gbit/s, the default in Gbit/s, one warning",
      conv.get("units", {}).get("capacity") == "Gbit/s" and [a["capacity"] for a in conv["arcs"]] == [2.5, 10] and
      "1 of 2 edges" in r.stderr, r.stderr)
r = run("convert", topo, "--to", "json", out, "--capacity-attribute", "speed", "--attribute-unit", "MB/s")
check("GraphML --attribute-unit refuses a unit that is not a link speed", r.returncode == 2 and "'MB/s'" in r.stderr, r.stderr)

geo = w("geo.graphml", """<graphml><key id="x" for="node" attr.name="Longitude"/><key id="y" for="node" attr.name="Latitude"/>
<graph id="G"><node id="a"><data key="x">0</data><data key="y">0</data></node>
<node id="b"><data key="x">1</data><data key="y">0</data></node><edge source="a" target="b"/></graph></graphml>""")
r = run("convert", geo, "--to", "json", out, "--length-as", "cost")
conv = json.load(open(out)) if r.returncode == 0 else {"arcs": [{}]}
# One degree of the equator: 2 pi 6371.0088 / 360 km (derived by hand).
check("GraphML --length-as cost: the great-circle length in km",
      abs(conv["arcs"][0].get("cost", 0) - 111.19508) < 1e-4 and conv["units"]["cost"] == "km", r.stderr)

# Killed mid-write: the output is the old file or the whole new one, never a part.
import signal
import time
big = {"format": "apportion-network", "version": 1, "name": "big", "nodes": [{"id": f"n{i}"} for i in range(20000)],
       "arcs": [{"id": f"a{i}", "from": f"n{i % 20000}", "to": f"n{(i * 7 + 1) % 20000}", "capacity": i % 97 + 1}
                for i in range(200000)], "demands": []}
big_path = w("big.json", json.dumps(big))
target = os.path.join(args.work, "big-out.json")
intact = True
outcomes = []
# Kill times spread over the whole run (about a second here), the write at its end included.
for delay in [0.1 * i for i in range(1, 16)]:
    with open(target, "w") as f:
        f.write("OLD")
    p = subprocess.Popen([args.apportion, "convert", big_path, "--to", "json", target])
    time.sleep(delay)
    p.send_signal(signal.SIGKILL)
    p.wait()
    text = open(target).read()
    outcomes.append("old" if text == "OLD" else "new")
    if text != "OLD":
        try:
            intact = intact and len(json.loads(text)["arcs"]) == 200000
        except ValueError:
            intact = False
check("a write killed at any moment leaves the old file or the whole new one", intact, " ".join(outcomes))
print(f"      kill outcomes: {' '.join(outcomes)}")

print(f"{passed} passed, {failed} failed")
sys.exit(1 if failed else 0)
