#!/usr/bin/env bash
# Runs every test: native unit, property and reference tests (core, plot, CLI), doctests,
# the wasm binding tests in headless Chromium, and the end-to-end page test.
# Installs what is missing first (scripts/setup.sh --browser).
set -euo pipefail
cd "$(dirname "$0")/.."
export CARGO_TERM_COLOR=never
bash scripts/setup.sh --browser

echo "[test] native: cargo test --workspace"
cargo test --workspace --exclude chiwave-web
cargo test -p chiwave-web --lib

echo "[test] build: CLI (release) and page"
cargo build --release -p chiwave-cli
bash scripts/build-web.sh

echo "[test] wasm binding layer in headless Chromium"
cargo test --target wasm32-unknown-unknown -p chiwave-web

echo "[test] end-to-end page test (playwright-core + Debian chromium)"
npm test
