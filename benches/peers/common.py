"""Shared plumbing of the peer scripts: the workload definitions, chiwave's values, timing,
agreement checks and the one JSON line each script prints.

The workloads are read from benches/workloads.json (the same file the native criterion bench
crates/chiwave-core/benches/compare.rs and the browser timing tests/e2e/bench-json.mjs read), so
every side computes the same points. chiwave's results come from
`cargo bench -p chiwave-core --bench compare -- --values` (a JSON object with one entry per
workload); pass its output file with --values FILE, or let the script run it.

Timing: time.perf_counter around one whole workload call, after one untimed warm-up call (imports,
caches and one-off set-up such as coefficient tables are outside the timed region, as they are
natively); repeated until both `min_runs` runs and `min_seconds` of timed work are done; best and
median reported in milliseconds. Nothing is asserted about times.
"""
import argparse
import json
import math
import os
import platform
import statistics
import subprocess
import sys
import time

import numpy as np

REPO = os.path.abspath(os.path.join(os.path.dirname(__file__), "..", ".."))
WORKLOADS_PATH = os.path.join(REPO, "benches", "workloads.json")

# Agreement tolerances (relative unless said otherwise), one place, each with its reason.
TOLERANCE = {
    # Darwin's closed form loses a few ulps of π (≈ 4.4e-16 each) to its final subtraction of π and
    # to Cephes' K and F: ≤ 4 ulp(π) ≈ 1.8e-15 absolute, i.e. ≤ 2e-13 relative where it is used
    # (b < 500, α ≥ 0.008); from b = 500 the order-8 series equals the exact angle to < 2e-17
    # (truncation bound, see light_sweep.py).
    "light_alpha": 2e-13,
    # Partial sums and the log form (relative to max(|value|, 1): it crosses zero): a few additions,
    # rounding only.
    "light_series": 1e-14,
    # PM closed forms: rounding, amplified at γ − 1 = 1e-3 by the 1/p∞³ of χ₃ and by the
    # cancellation inside C̄(γ) (a factor ≈ 6, documented in pm.rs) — a few 1e-14 at worst.
    "pm_angles": 1e-13,
    # chiwave's test-body quadrature refuses results whose two Gauss rules differ by more than
    # 1e-10 relative (encounter/testbody.rs), so 1e-10 is the accuracy it promises.
    "test_body": 1e-10,
    # Bessel K0, K1 from Cephes in both (scipy.special.k0e/k1e and chiwave's port): rounding, with
    # the interference of the two bodies' fields cancelling by at most a factor ~10 here.
    "em_spectrum": 1e-13,
    # Same closed forms with a 44-node Gauss–Legendre sum per ω: rounding of the sum.
    "gravity_spectrum": 1e-11,
    # Same flux rule: rounding of ~1e5 terms. Against the closed form of Herrmann et al. the rule
    # itself reaches 1e-10 at γ = 1.5 (waveform/energy.rs tests), the independent check.
    "sky_balance": 1e-11,
    "sky_balance_closed": 1e-10,
}


def workloads():
    with open(WORKLOADS_PATH) as f:
        return json.load(f)


def grid(spec):
    """A grid of benches/workloads.json: log, linear or list (see its `about`)."""
    if "log" in spec:
        lo, hi, n = spec["log"]
        n = int(n)
        i = np.arange(n, dtype=float)
        g = lo * np.exp(math.log(hi / lo) * i / (n - 1))
        g[-1] = hi
        return g
    if "linear" in spec:
        lo, hi, n = spec["linear"]
        n = int(n)
        return lo + (hi - lo) * np.arange(n, dtype=float) / (n - 1)
    return np.array(spec["list"], dtype=float)


def arguments(description):
    p = argparse.ArgumentParser(description=description)
    p.add_argument("--values", help="chiwave's values (output of the compare bench with --values)")
    p.add_argument("--min-runs", type=int, default=5)
    p.add_argument("--min-seconds", type=float, default=1.0)
    return p.parse_args()


def chiwave_values(path):
    """chiwave's results for every workload: from `path`, or by running the native bench."""
    if path:
        with open(path) as f:
            return json.load(f)
    out = subprocess.run(
        ["cargo", "bench", "-q", "-p", "chiwave-core", "--bench", "compare", "--", "--values"],
        cwd=REPO, check=True, capture_output=True, text=True,
    ).stdout
    return json.loads(out.strip().splitlines()[-1])


def time_it(fn, min_runs=5, min_seconds=1.0, max_runs=1000):
    """Best and median wall time (ms) of fn(); one untimed warm-up call first."""
    fn()
    times = []
    total = 0.0
    while len(times) < max_runs and (len(times) < min_runs or total < min_seconds):
        t = time.perf_counter()
        fn()
        dt = time.perf_counter() - t
        times.append(dt)
        total += dt
    return {"best_ms": 1e3 * min(times), "median_ms": 1e3 * statistics.median(times), "runs": len(times)}


def max_rel(peer, ref, floor=np.finfo(float).tiny):
    """Largest |peer − ref| / max(|ref|, floor) over finite entries; NaN/None must coincide."""
    peer = np.asarray(peer, dtype=float)
    ref = np.asarray([np.nan if x is None else x for x in np.ravel(ref)], dtype=float).reshape(peer.shape)
    if not np.array_equal(np.isnan(peer), np.isnan(ref)):
        return math.inf
    m = ~np.isnan(ref)
    if not m.any():
        return 0.0
    return float(np.max(np.abs(peer[m] - ref[m]) / np.maximum(np.abs(ref[m]), floor)))


def check(name, value, tolerance_key, source):
    tol = TOLERANCE[tolerance_key]
    return {"quantity": name, "max_rel_diff": value, "tolerance": tol, "source": source, "ok": bool(value <= tol)}


def report(workload, peer, items, item, timing, checks, note):
    """Prints the one JSON line of figures; exit status 1 if a check failed."""
    line = {
        "workload": workload,
        "peer": peer,
        "items": items,
        "item": item,
        **timing,
        "per_item_us": 1e3 * timing["best_ms"] / items,
        "checks": checks,
        "agree": all(c["ok"] for c in checks),
        "note": note,
        "python": platform.python_version(),
        "numpy": np.__version__,
    }
    try:
        import scipy
        line["scipy"] = scipy.__version__
    except ImportError:
        pass
    try:
        import mpmath
        line["mpmath"] = mpmath.__version__
    except ImportError:
        pass
    print(json.dumps(line), flush=True)
    if not line["agree"]:
        print(f"{workload}/{peer}: results disagree with chiwave: {checks}", file=sys.stderr)
        sys.exit(1)
