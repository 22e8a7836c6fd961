#!/usr/bin/env bash
# Runs every benchmark in one session and writes bench/report.md and bench/report.json:
#   1. the native criterion benches of chiwave-core (every crates/chiwave-core/benches/*.rs, one
#      after another, with short warm-up and measurement times; `compare`, the native side of the
#      peer and wasm comparisons, last, right before the peers);
#   2. the in-browser timing (tests/e2e/bench-json.mjs: tests/e2e/bench.mjs's figures, the wasm
#      workloads of benches/workloads.json, interaction to next paint per view, start-up);
#   3. the Python peers (benches/peers/*.py: numpy/scipy/mpmath on the same workloads, each checked
#      against chiwave's values and timed).
# Then benches/report.py puts every figure, the wasm/native ratios and the chiwave/peer ratios into
# the report. Nothing is asserted about times; a peer whose results disagree with chiwave's makes
# the script fail (exit 1) after the report is written.
#
#   scripts/bench.sh                 everything (about 10 minutes on 2 cores once built)
#   scripts/bench.sh --quick         shorter criterion measurement (0.5 s warm-up, 1 s measurement)
#   scripts/bench.sh --no-browser    skip the browser part (no Chromium needed)
# Environment: BENCH_WARMUP, BENCH_MEASURE (seconds, criterion), BENCH_ONLY="deflection compare"
# (a subset of the native benches).
# Installs what is missing first: scripts/setup.sh --browser, and a venv .venv-bench/ with
# benches/peers/requirements.txt (numpy, scipy, mpmath pinned; from PyPI).
set -euo pipefail
cd "$(dirname "$0")/.."
export CARGO_TERM_COLOR=never

warmup=${BENCH_WARMUP:-1}
measure=${BENCH_MEASURE:-3}
browser=1
for a in "$@"; do
  case "$a" in
    --quick) warmup=${BENCH_WARMUP:-0.5}; measure=${BENCH_MEASURE:-1} ;;
    --no-browser) browser=0 ;;
    *) echo "scripts/bench.sh: unknown option '$a' (allowed: --quick, --no-browser)" >&2; exit 2 ;;
  esac
done

say() { printf '[bench] %s\n' "$*"; }
work=target/bench-work
rm -rf "$work"
mkdir -p "$work" bench

# --- set-up, each step behind a check ----------------------------------------------------------
if [ "$browser" = 1 ]; then bash scripts/setup.sh --browser; else bash scripts/setup.sh; fi
venv=.venv-bench
if ! cmp -s benches/peers/requirements.txt "$venv/.requirements" 2>/dev/null; then
  say "creating $venv with benches/peers/requirements.txt"
  rm -rf "$venv"
  python3 -m venv "$venv"
  "$venv/bin/pip" install --quiet --disable-pip-version-check -r benches/peers/requirements.txt
  cp benches/peers/requirements.txt "$venv/.requirements"
fi
py="$venv/bin/python"

# --- the machine --------------------------------------------------------------------------------
started=$(date +%s)
"$py" - "$work/machine.json" "$started" <<'EOF'
import json, os, platform, subprocess, sys, datetime
def run(*cmd):
    try:
        return subprocess.run(cmd, capture_output=True, text=True, check=True).stdout.strip().splitlines()[0]
    except Exception:
        return None
cpu = None
with open("/proc/cpuinfo") as f:
    for line in f:
        if line.startswith("model name"):
            cpu = line.split(":", 1)[1].strip(); break
import numpy, scipy, mpmath
dirty = bool(run("git", "status", "--porcelain", "--untracked-files=no"))
m = {
    "date": datetime.datetime.now(datetime.timezone.utc).strftime("%Y-%m-%d %H:%M UTC"),
    "started_epoch": float(sys.argv[2]),
    "commit": (run("git", "rev-parse", "--short", "HEAD") or "?") + (" (with uncommitted changes)" if dirty else ""),
    "cpu": cpu, "nproc": os.cpu_count(), "kernel": platform.release(),
    "rustc": run("rustc", "--version"), "node": run("node", "--version"), "chromium": run("chromium", "--version"),
    "python": platform.python_version(), "numpy": numpy.__version__, "scipy": scipy.__version__, "mpmath": mpmath.__version__,
    "load_before": " ".join(open("/proc/loadavg").read().split()[:3]),
}
json.dump(m, open(sys.argv[1], "w"), indent=1)
EOF

# --- 1. native ----------------------------------------------------------------------------------
# The `compare` bench (the native side of the peer and wasm comparisons) runs last, right before
# the peers, so that both sides of each ratio are measured close together in time.
benches=${BENCH_ONLY:-$(ls crates/chiwave-core/benches/*.rs | xargs -n1 basename | sed 's/\.rs$//' | tr '\n' ' ')}
native() {
  say "native: $1 (warm-up ${warmup} s, measurement ${measure} s per benchmark)"
  cargo bench -q -p chiwave-core --bench "$1" -- --warm-up-time "$warmup" --measurement-time "$measure" \
    >"$work/native-$1.log" 2>&1 || { tail -20 "$work/native-$1.log"; exit 1; }
}
say "building the native benches"
cargo bench -p chiwave-core --no-run >"$work/build-native.log" 2>&1 || { tail -20 "$work/build-native.log"; exit 1; }
for b in $benches; do
  [ "$b" = compare ] || native "$b"
done

# --- 2. browser ---------------------------------------------------------------------------------
if [ "$browser" = 1 ]; then
  say "building the page"
  bash scripts/build-web.sh >"$work/build-web.log" 2>&1 || { tail -20 "$work/build-web.log"; exit 1; }
  say "browser: tests/e2e/bench-json.mjs (bench.mjs, wasm workloads, interaction latency, start-up)"
  node tests/e2e/bench-json.mjs >"$work/browser.json" 2>"$work/browser.err" || { tail -20 "$work/browser.err"; exit 1; }
fi

# --- 3. peers -----------------------------------------------------------------------------------
case " $benches " in *" compare "*) native compare ;; esac
say "chiwave's values for the peers' checks"
cargo bench -q -p chiwave-core --bench compare -- --values >"$work/values.json" 2>"$work/values.err" \
  || { tail -20 "$work/values.err"; exit 1; }
peers_ok=1
: >"$work/peers.jsonl"
# chiwave runs on one thread: keep numpy's linear algebra on one thread too.
export OPENBLAS_NUM_THREADS=1 OMP_NUM_THREADS=1 MKL_NUM_THREADS=1
for s in light_sweep pm_angles "test_body --method scipy" "test_body --method mpmath" em_spectrum gravity_spectrum sky_balance; do
  set -- $s
  say "peer: $*"
  if ! "$py" "benches/peers/$1.py" "${@:2}" --values "$work/values.json" >>"$work/peers.jsonl" 2>>"$work/peers.err"; then
    peers_ok=0
    say "peer $* disagrees with chiwave or failed (see $work/peers.err)"
  fi
done

# --- report -------------------------------------------------------------------------------------
"$py" - "$work/machine.json" <<'EOF'
import json, sys
m = json.load(open(sys.argv[1]))
m["load_after"] = " ".join(open("/proc/loadavg").read().split()[:3])
json.dump(m, open(sys.argv[1], "w"), indent=1)
EOF
"$py" benches/report.py --work "$work" --criterion target/criterion --md bench/report.md --json bench/report.json
say "wrote bench/report.md and bench/report.json"
[ "$peers_ok" = 1 ] || { say "some peers disagree with chiwave: see bench/report.md"; exit 1; }
