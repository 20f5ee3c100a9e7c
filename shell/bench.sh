#!/usr/bin/env bash
# The benchmark command: builds the native and WebAssembly benchmarks, runs Apportion beside
# LEMON natively, runs the same core on the same instances under node, and prints one table
# with the Apportion/LEMON and WASM/native ratios. Options go to apportion-bench (e.g.
# --max-arcs 100000 for a quick run, --full for 1M-arc min-cost grids).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
"$root/shell/deps.sh"
"$root/shell/build.sh" native wasm >/dev/null
out=$(mktemp -d); trap 'rm -rf "$out"' EXIT
echo "apportion: native run (Apportion and LEMON)..." >&2
build/native/shell/apportion-bench --machine "$@" > "$out/native.txt"
echo "apportion: WebAssembly run under node (Apportion only)..." >&2
node build/wasm/shell/apportion-bench.js --machine "$@" > "$out/wasm.txt"
/usr/bin/python3 - "$out/native.txt" "$out/wasm.txt" <<'PY'
import math, sys
def rows(path):
    out = {}
    for line in open(path):
        p = line.split()
        out[(p[0], p[1], int(p[3]))] = dict(nodes=int(p[2]), ours=float(p[4]), ref=float(p[5]), v=float(p[6]), rv=float(p[7]))
    return out
nat, wasm = rows(sys.argv[1]), rows(sys.argv[2])
print("| problem | family | nodes | arcs | Apportion ms | LEMON ms | Apportion/LEMON | WASM ms | WASM/native | values agree |")
print("|---|---|--:|--:|--:|--:|--:|--:|--:|---|")
for key, r in nat.items():
    w = wasm.get(key)
    agree = abs(r["v"] - r["rv"]) <= 1e-9 * max(1.0, abs(r["rv"]))
    if w:
        agree = agree and abs(w["v"] - r["v"]) <= 1e-9 * max(1.0, abs(r["v"]))
    print(f"| {key[0]} | {key[1]} | {r['nodes']:,} | {key[2]:,} | {r['ours']:.1f} | {r['ref']:.1f} | "
          f"{r['ours'] / r['ref']:.2f} | {w['ours'] if w else float('nan'):.1f} | "
          f"{(w['ours'] / r['ours']) if w else float('nan'):.2f} | {'yes' if agree else 'NO'} |")
PY
