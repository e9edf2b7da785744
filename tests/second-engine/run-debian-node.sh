#!/usr/bin/env bash
# Golden digests on a second V8: Debian's own `nodejs` package (18.x), next to the project's Node.
# Installing that package would replace the system's Node (same package name), so its files are
# unpacked from the .debs into a private folder instead, and its fixed /usr/share/nodejs paths
# (externalized builtins) are served by an overlay mount inside a private mount namespace that
# only this process sees. Needs root (CI and these machines run as root).
set -euo pipefail
cd "$(dirname "$0")/../.."
ROOT_DIR="${DEBIAN_NODE_DIR:-/tmp/driftcase-debian-node}"
PACKAGES=(nodejs libnode108 libc-ares2 node-acorn node-cjs-module-lexer node-undici)

if [ ! -x "$ROOT_DIR/root/usr/bin/node" ]; then
  mkdir -p "$ROOT_DIR/debs" "$ROOT_DIR/root"
  version=$(apt-cache madison nodejs | awk '/debian/ {print $3; exit}')
  if [ -z "$version" ]; then apt-get update -qq; version=$(apt-cache madison nodejs | awk '/debian/ {print $3; exit}'); fi
  (cd "$ROOT_DIR/debs" && apt-get download -qq "nodejs=$version" "libnode108=$version" "${PACKAGES[@]:2}" 2>/dev/null)
  for deb in "$ROOT_DIR"/debs/*.deb; do dpkg-deb -x "$deb" "$ROOT_DIR/root"; done
fi

# Built next to golden-cases.ts so its paths (relative to import.meta.url) resolve as in the source.
BUILT=tests/samples/.check-golden-digests.mjs
trap 'rm -f "$BUILT"' EXIT
npx esbuild tests/second-engine/check-golden-digests.ts --bundle --platform=node --format=esm \
  --target=node18 --log-level=warning --outfile="$BUILT"

unshare -m bash -c "
  mount -t overlay overlay -o lowerdir='$ROOT_DIR/root/usr/share':/usr/share /usr/share
  LD_LIBRARY_PATH='$ROOT_DIR/root/usr/lib/x86_64-linux-gnu' '$ROOT_DIR/root/usr/bin/node' \
    '$BUILT'
"
