#!/usr/bin/env bash
# Builds everything: the native CLI (target/release/chiwave) and the page
# (dist/index.html for serving, dist/chiwave.html as one self-contained offline file).
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh
cargo build --release -p chiwave-cli
bash scripts/build-web.sh
echo "[build] CLI:         $(pwd)/target/release/chiwave"
echo "[build] single file: $(pwd)/dist/chiwave.html (open it from disk; it needs no network)"
