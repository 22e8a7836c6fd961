#!/usr/bin/env bash
# Builds the page: the wasm module (release), its JS glue (wasm-bindgen --target web), then
# (www/tools/build.mjs, bundling with esbuild) dist/index.html (+ css/ and js/, for serving on
# 127.0.0.1) and dist/chiwave.html, one self-contained file (CSS, JS, scenarios and wasm inlined)
# that works from file:// offline.
# Needs what scripts/setup.sh installs (wasm32 target, wasm-bindgen CLI = the pinned crate version,
# the npm packages); it runs it first, which costs seconds on a warm machine.
set -euo pipefail
cd "$(dirname "$0")/.."
bash scripts/setup.sh >/dev/null
cargo build --release --target wasm32-unknown-unknown -p chiwave-web
wasm-bindgen --target web --out-dir www/pkg --remove-name-section --remove-producers-section \
  target/wasm32-unknown-unknown/release/chiwave_web.wasm
node www/tools/build.mjs
echo "$(pwd)/dist/chiwave.html"
