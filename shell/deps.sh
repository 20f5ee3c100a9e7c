#!/usr/bin/env bash
# Installs what Apportion needs on a fresh Debian 12 machine, once; later runs only check.
# Debian packages come through apt; Dear ImGui and pugixml come as pinned source tarballs
# from Debian's source archive (see fetch-source.sh). Nothing third-party lives in the repo.
set -euo pipefail
here="$(cd "$(dirname "$0")" && pwd)"
root="$(cd "$here/.." && pwd)"

# Packages every build or test step uses. Versions are Debian 12's (bookworm) own.
packages=(
  build-essential cmake ninja-build python3 ca-certificates xz-utils curl
  nlohmann-json3-dev catch2            # JSON parsing; the test framework
  emscripten                           # WebAssembly toolchain (3.1.6, clang 14)
  clang-14 libclang-rt-14-dev          # libFuzzer with the sanitizers (shell/fuzz.sh)
  python3-networkx python3-scipy glpk-utils liblemon-dev  # outside references for tests and benchmark
  fonts-dejavu-core python3-fonttools  # the page's text font, cut down at build time
)
if [ "${APPORTION_WITH_BROWSER:-0}" = 1 ]; then packages+=(chromium); fi

missing=()
for p in "${packages[@]}"; do
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q 'install ok installed' || missing+=("$p")
done
if [ ${#missing[@]} -gt 0 ]; then
  echo "apportion: installing Debian packages: ${missing[*]}"
  if [ "$(id -u)" != 0 ]; then echo "apportion: run as root to install packages" >&2; exit 1; fi
  export DEBIAN_FRONTEND=noninteractive
  apt-get update -qq || { echo "apportion: apt-get update failed (no access to the package archive?)" >&2; exit 1; }
  apt-get install -y -qq --no-install-recommends "${missing[@]}" >/dev/null ||
    { echo "apportion: could not install: ${missing[*]}" >&2; exit 1; }
fi

# Source packages, pinned by version and by the sha256 of the upstream tarball.
"$here/fetch-source.sh" imgui 1.90.1+ds-1 imgui_1.90.1+ds.orig.tar.xz \
  ecce377df0f90b292f15dcbd83d438bddc162b2388c881132bde18c787572a1c "$root/third_party/imgui"
"$here/fetch-source.sh" pugixml 1.13-0.2 pugixml_1.13.orig.tar.gz \
  5c5ad5d7caeb791420408042a7d88c2c6180781bf218feca259fd9d840a888e1 "$root/third_party/pugixml"
"$here/fetch-source.sh" highs 1.10.0+ds-1 highs_1.10.0+ds.orig.tar.xz \
  5964fc1ca4f0b23dd45987bbed1838f2e570e96aa624635ac63d277152b6c94a "$root/third_party/highs"
