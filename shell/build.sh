#!/usr/bin/env bash
# build.sh PRESET...: configure (once) and build the named CMake presets. Incremental: a
# second run rebuilds only what changed.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
export EMSDK_PYTHON=/usr/bin/python3 NODE_PATH=/usr/share/nodejs
for preset in "$@"; do
  if [ ! -f "build/$preset/build.ninja" ]; then
    cmake --preset "$preset" >/dev/null
  fi
  echo "apportion: building $preset"
  cmake --build --preset "$preset" -- -j"$(nproc)" | grep -v '^\[' || true
  [ "${PIPESTATUS[0]}" = 0 ] || { echo "apportion: build of $preset failed" >&2; exit 1; }
done
