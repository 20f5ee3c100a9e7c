#!/usr/bin/env bash
# fetch-source.sh NAME VERSION ORIG_TARBALL SHA256 DEST
# Downloads a Debian source package with `apt-get source --download-only`, through a private
# apt configuration (the system's own is left alone), checks the sha256 of the upstream
# tarball, and unpacks it into DEST. The archive address is read from the system's apt
# sources, never written here. A second run finds DEST complete and does nothing.
set -euo pipefail
name=$1 version=$2 orig=$3 sha=$4 dest=$5
stamp="$dest/.apportion-source"
if [ -f "$stamp" ] && [ "$(cat "$stamp")" = "$name $version $sha" ]; then exit 0; fi

mirror=""
for f in /etc/apt/sources.list.d/*.sources; do
  [ -f "$f" ] || continue
  mirror=$(awk '/^URIs:/ {print $2; exit}' "$f"); [ -n "$mirror" ] && break
done
if [ -z "$mirror" ] && [ -f /etc/apt/sources.list ]; then
  mirror=$(awk '$1 == "deb" {for (i = 2; i <= NF; i++) if ($i ~ /^[a-z]+:\/\//) {print $i; exit}}' /etc/apt/sources.list)
fi
[ -n "$mirror" ] || { echo "apportion: no Debian archive found in the apt configuration" >&2; exit 1; }

work=$(mktemp -d); trap 'rm -rf "$work"' EXIT
mkdir -p "$work/lists/partial" "$work/cache/archives/partial" "$work/etc" "$work/dl"
cat > "$work/etc/src.sources" <<SRC
Types: deb-src
URIs: $mirror
Suites: bookworm trixie
Components: main
Signed-By: /usr/share/keyrings/debian-archive-keyring.gpg
SRC
opts=(-o Dir::Etc::SourceList=/dev/null -o "Dir::Etc::SourceParts=$work/etc"
      -o "Dir::State::Lists=$work/lists" -o "Dir::Cache=$work/cache" -o APT::Sandbox::User=root)
echo "apportion: fetching source package $name $version"
apt-get "${opts[@]}" -qq update >/dev/null 2>&1 || true
# apt checks signatures and hashes; when only the tarball is served (see DEVELOPERS.md),
# fall back to it from the pool and rely on the pinned sha256 below.
if ! (cd "$work/dl" && apt-get "${opts[@]}" -qq source --download-only "$name=$version" >/dev/null 2>&1); then
  pool="pool/main/${name:0:1}/$name"
  (cd "$work/dl" && curl -fsSL -o "$orig" "$mirror/$pool/$orig") ||
    { echo "apportion: cannot download source package $name $version" >&2; exit 1; }
fi
[ -f "$work/dl/$orig" ] || { echo "apportion: $orig missing after download" >&2; exit 1; }
got=$(sha256sum "$work/dl/$orig" | cut -d' ' -f1)
if [ "$got" != "$sha" ]; then
  echo "apportion: checksum mismatch for $orig: expected $sha, got $got" >&2; exit 1
fi
rm -rf "$dest"; mkdir -p "$dest"
tar -xf "$work/dl/$orig" -C "$dest" --strip-components=1
echo "$name $version $sha" > "$stamp"
