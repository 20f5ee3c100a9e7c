#!/usr/bin/env bash
# The README's test command: installs what is missing, builds every preset and runs every
# test -- native (release, and debug with sanitizers), WebAssembly under node, the
# cross-checks against outside libraries, the command-line tests, a seeded smoke run of
# every fuzz target and the browser tests.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
APPORTION_WITH_BROWSER=1 "$root/shell/deps.sh"
"$root/shell/build.sh" native native-debug wasm fuzz

status=0
for preset in native native-debug wasm; do
  echo "apportion: tests ($preset)"
  # The sanitizer build runs the unit and command-line tests; the reference cross-checks,
  # which test numbers rather than memory, run once in the release build.
  label=(); [ "$preset" = native-debug ] && label=(-LE reference)
  ctest --preset "$preset" -j2 "${label[@]}" || status=1
done

echo "apportion: fuzzing smoke run (seeded, 2,000 inputs per target)"
"$root/shell/fuzz.sh" --smoke || status=1

echo "apportion: browser tests"
(cd tests/browser && npm ci --no-audit --no-fund --silent) || { echo "apportion: npm ci failed" >&2; exit 1; }
mkdir -p build/expected
for demo in demo-networks/*.json; do
  name=$(basename "$demo" .json)
  build/native/shell/apportion fair "$demo" --json "build/expected/$name.fair.json" >/dev/null
done
node tests/browser/app.mjs --web build/wasm/web --root . --expected build/expected --artefacts artefacts/browser || status=1

if [ $status = 0 ]; then echo "apportion: all tests passed"; else echo "apportion: some tests FAILED" >&2; fi
exit $status
