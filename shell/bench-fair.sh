#!/usr/bin/env bash
# The fair-multiflow benchmark command: Apportion's exact max-min fairness (native and
# WebAssembly) against the textbook baseline on SciPy's HiGHS, on generated gravity-model
# instances. Options go to shell/bench/fair_benchmark.py (--quick, --budget SECONDS).
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
"$root/shell/deps.sh"
"$root/shell/build.sh" native wasm >/dev/null
exec /usr/bin/python3 shell/bench/fair_benchmark.py --native build/native/shell/apportion-fair-bench \
  --wasm build/wasm/shell/apportion-fair-bench.js "$@"
