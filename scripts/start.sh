#!/usr/bin/env bash
# Builds everything, shows the CLI on a built-in demo scenario, and serves the page on
# http://127.0.0.1:$PORT (default 8765) with that scenario loaded. Ctrl-C stops the server.
set -euo pipefail
cd "$(dirname "$0")/.."
PORT="${PORT:-8765}"
DEMO="${DEMO:-light-neutron-star-graze}"
bash scripts/build.sh
echo
echo "[start] CLI on the demo scenario '$DEMO':"
./target/release/chiwave scenario "$DEMO" || true
echo
echo "[start] page:        http://127.0.0.1:$PORT/index.html#scenario=$DEMO"
echo "[start] single file: $(pwd)/dist/chiwave.html"
echo "[start] serving dist/ on 127.0.0.1:$PORT (Ctrl-C to stop)"
exec python3 -m http.server "$PORT" --bind 127.0.0.1 --directory dist
