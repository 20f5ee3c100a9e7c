#!/usr/bin/env bash
# The README's run command: installs what is missing, builds the browser app, writes the
# single-file page, and serves the app on 127.0.0.1 (port $APPORTION_PORT, default 8080)
# with the demo network loaded. Ctrl-C stops the server.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
"$root/shell/deps.sh"
"$root/shell/build.sh" native wasm
mkdir -p dist
cp build/wasm/web/apportion-single.html dist/apportion-single.html
port="${APPORTION_PORT:-8080}"
cat <<MSG

Apportion is ready.
  In a browser:      http://127.0.0.1:$port/apportion.html
  Single file:       $root/dist/apportion-single.html  (opens from file://, no server needed)
  Command line:      $root/build/native/shell/apportion --help

MSG
exec /usr/bin/python3 -m http.server "$port" --bind 127.0.0.1 --directory build/wasm/web
