#!/usr/bin/env bash
# The fair-multiflow benchmark command: Apportion's exact max-min fairness (native and
# WebAssembly) against the textbook baseline on SciPy's HiGHS, on generated gravity-model
# instances; then on the real backbones of the shared data folder (../shared/data beside the
# checkout, read in place), against the previous method. Options go to
# shell/bench/fair_benchmark.py (--quick, --large, --budget SECONDS).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
"$root/shell/deps.sh"
"$root/shell/build.sh" native wasm >/dev/null
bench=(/usr/bin/python3 shell/bench/fair_benchmark.py --native build/native/shell/apportion-fair-bench
       --wasm build/wasm/shell/apportion-fair-bench.js)
"${bench[@]}" "$@"
zoo="$root/../shared/data/topology-zoo"
echo
if [ -d "$zoo" ]; then
  "${bench[@]}" --topologies "$zoo" "$@"
else
  echo "apportion: $zoo is missing: the real-topology table is not run"
fi
