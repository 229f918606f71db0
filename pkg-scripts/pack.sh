#!/usr/bin/env bash
# Packs pkg/ (built by pkg-scripts/build.sh) into an npm tarball in dist/ and prints its path.
#
#   bash pkg-scripts/pack.sh
set -euo pipefail
cd "$(dirname "${BASH_SOURCE[0]}")/.."
ROOT="$(pwd)"
[ -f pkg/package.json ] || { echo "[pack] pkg/package.json missing: run bash pkg-scripts/build.sh first" >&2; exit 1; }
mkdir -p dist target
# Not while build.sh replaces pkg/ (same lock).
exec 9>"${CARGO_TARGET_DIR:-$ROOT/target}/.pkg-build.lock"
flock 9
json="$(npm pack ./pkg --pack-destination dist --json --loglevel=error </dev/null)"
file="$(node -e 'const r = JSON.parse(process.argv[1]); process.stdout.write(r[0].filename)' "$json")"
node -e '
  const r = JSON.parse(process.argv[1])[0];
  console.error(`[pack] ${r.name}@${r.version}: ${r.entryCount} files, ${r.size} B packed, ${r.unpackedSize} B unpacked`);
  for (const f of r.files) console.error(`[pack]   ${String(f.size).padStart(8)}  ${f.path}`);
' "$json"
echo "$ROOT/dist/$file"
