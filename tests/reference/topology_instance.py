"""The benchmark's and the scale check's instance on a real topology (Internet Topology Zoo,
S. Knight et al., IEEE JSAC 29(9), 2011; read from ../shared/data, never copied): every
undirected link two opposite arcs, capacities from the link speeds where the file has them
(bit/s, else 1e9) or 10 per link, and the node pairs with the largest gravity products
(masses uniform in [1, 10] with a seed; common practice, no source) asking amounts that sum
to a third of the total capacity."""
import json
import os
import random
import subprocess


def topology_instance(cli, graphml, demands, seed, path, decimals=None):
    """Writes the instance to `path` (JSON) and returns it as a dict; demands 0: all pairs;
    `decimals`: amounts rounded so, as a table typed or exported by a planner holds them."""
    name = os.path.basename(graphml)[:-len(".graphml")]
    speeds = name in ("Geant2012", "Uninett2010")
    capacity = ["--capacity-attribute", "LinkSpeedRaw", "--default-capacity", "1e9"] if speeds else \
        ["--default-capacity", "10"]
    subprocess.run([cli, "convert", graphml, "--to", "json", path, "--undirected", "pairs"] + capacity,
                   check=True, capture_output=True)
    net = json.load(open(path))
    rng = random.Random(seed)
    ids = [v["id"] for v in net["nodes"]]
    mass = {v: rng.uniform(1, 10) for v in ids}
    pairs = sorted(((mass[i] * mass[j], i, j) for i in ids for j in ids if i != j), reverse=True)
    pairs = pairs[:demands] if demands else pairs
    total_cap = sum(a["capacity"] for a in net["arcs"])
    g = sum(p[0] for p in pairs)
    amount = (lambda x: x) if decimals is None else (lambda x: round(x, decimals))
    net["demands"] = [{"id": f"d{k}", "origin": i, "destination": j, "amount": amount(2 * total_cap / 6 * m / g)}
                      for k, (m, i, j) in enumerate(pairs)]
    net["name"] = f"{name}, {len(pairs)} gravity demands"
    json.dump(net, open(path, "w"))
    return net
