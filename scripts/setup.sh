#!/usr/bin/env bash
# Installs what chiwave's build and tests need, each step behind a check, so that a warm machine
# pays seconds. Nothing here downloads a prebuilt binary or a browser from outside the package
# registries: the wasm-bindgen CLI is built from crates.io, Chromium comes from Debian.
#
#   scripts/setup.sh            build needs: wasm32 target, wasm-bindgen CLI, the npm packages
#                               (esbuild bundles the page; playwright-core drives the browser tests)
#   scripts/setup.sh --browser  also Debian's chromium + chromium-driver
set -euo pipefail
cd "$(dirname "$0")/.."

say() { printf '[setup] %s\n' "$*"; }
as_root() { if [ "$(id -u)" = 0 ]; then "$@"; else sudo "$@"; fi; }

# 1. The wasm32 target of the machine's one Rust toolchain.
if ! rustup target list --installed 2>/dev/null | grep -qx wasm32-unknown-unknown; then
  say "adding the wasm32-unknown-unknown target"
  rustup target add wasm32-unknown-unknown
fi

# 2. The wasm-bindgen CLI at exactly the version of the wasm-bindgen crate in Cargo.lock.
#    (No --locked: the registry index here lacks one of its locked dependencies; TOOLCHAIN.md.)
want=$(awk '$1=="name" && $3=="\"wasm-bindgen\"" {getline; gsub(/"/,"",$3); print $3; exit}' Cargo.lock)
have=$(wasm-bindgen --version 2>/dev/null | awk '{print $2}' || true)
if [ -z "$want" ]; then
  say "Cargo.lock has no wasm-bindgen entry; run 'cargo generate-lockfile' first"; exit 1
fi
if [ "$have" != "$want" ]; then
  say "installing wasm-bindgen-cli $want (found '${have:-none}'); this takes about 2-3 minutes once"
  cargo install wasm-bindgen-cli --version "$want"
fi

# 3. npm packages from package-lock.json (esbuild with its @esbuild/linux-x64 binary package, and
#    playwright-core, which downloads no browser). A stamp skips `npm ci` while the lock is unchanged.
if [ -f package-lock.json ]; then
  stamp=node_modules/.chiwave-lock
  if [ ! -f "$stamp" ] || ! cmp -s package-lock.json "$stamp" || [ ! -x node_modules/.bin/esbuild ]; then
    say "npm ci"
    npm ci --no-audit --no-fund --loglevel=error
    cp package-lock.json "$stamp"
  fi
fi

if [ "${1:-}" = "--browser" ]; then
  # 4. Debian's Chromium and its driver (same version), for the browser tests.
  if ! command -v chromium >/dev/null 2>&1 || ! command -v chromedriver >/dev/null 2>&1; then
    say "installing Debian's chromium and chromium-driver"
    as_root apt-get update -qq
    as_root env DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium chromium-driver
  fi
fi
say "ready"
