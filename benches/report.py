#!/usr/bin/env python3
"""Writes bench/report.md and bench/report.json from one run of scripts/bench.sh.

Inputs (all written by scripts/bench.sh in its work directory):
  machine.json   date, machine and tool versions, load average before and after
  target/criterion/**/new/{benchmark,estimates,sample}.json   criterion's results of this run
                 (only files written after the run started are read)
  peers.jsonl    one JSON line per peer script (benches/peers/*.py)
  browser.json   the object printed by tests/e2e/bench-json.mjs
Standard library only.
"""
import argparse
import glob
import json
import math
import os

# What each native benchmark measures, keyed by criterion's full id. A benchmark missing here is
# reported with its id and "(no description)".
NATIVE = {
    "schwarzschild_exact_alpha_64_b": "Darwin's exact Schwarzschild α at 64 impact parameters 5.3 … 3.6e4 M (both evaluation branches).",
    "schwarzschild_exact_alpha_b10": "One exact Schwarzschild α at b = 10 M.",
    "schwarzschild_exact_alpha_b1e4": "One exact Schwarzschild α at b = 1e4 M (small-k² series branch).",
    "sweep_1000_points": "The 1000-point α(b) sweep, b = 1 … 1e6 M: exact α, 8 partial sums and the log form at each b.",
    "kerr_alpha_b10_a0.9": "One exact equatorial Kerr α (quadrature), b = 10 M, a = 0.9 M.",
    "rn_alpha_b10_q0.5": "One exact Reissner–Nordström α (quadrature), b = 10 M, Q = 0.5 M.",
    "evaluate_request_b10": "A whole light request at b = 10 M (validation, exact α, series, flags, sources).",
    "amplification_curve_y1_200pts_w0.01_to_1000": "Point-lens amplification F(w, y = 1) at 200 frequencies w = 0.01 … 1000.",
    "lens_request_with_frequency": "A whole lens request with a wave-optics frequency.",
    "encounter_full_evaluation": "A whole gravitational encounter request (PM orders, E_rad, J_rad, impulse, test-body quadrature, strong-field estimate, flags).",
    "encounter_full_evaluation_near_capture": "The same near capture (ν = 1/4, γ = 1.5, j = 7.2).",
    "encounter_em_evaluation": "A whole electromagnetic encounter request.",
    "encounter_chi_sweep_500": "χ(b) at 500 impact parameters for the encounter figure.",
    "waveform_2000_samples_cm": "One gravitational waveform, 2000 samples at one direction, CM frame (set-up included).",
    "sky/energy_balance_sky_gamma1.5_1e-10": "The energy-balance sky integral at γ = 1.5 on the 16 × 20 rule (1e-10 against Herrmann et al.).",
    "sky/energy_balance_sky_default_gamma1.5": "The same on the default rule for γ = 1.5 (20 × 24).",
    "em_field_2000_samples": "One electromagnetic field time series, 2000 samples at one direction.",
    "em_spectrum_2000_frequencies": "The closed-form electromagnetic spectrum at 2000 frequencies, one direction.",
    "em_energies/gamma_1.5": "Radiated electromagnetic energies with interference (sphere quadrature), γ = 1.5.",
    "em_energies/gamma_100": "The same at γ = 100.",
    "compare/light_sweep": "Peer workload light_sweep (benches/workloads.json): the 1000-point α(b) sweep.",
    "compare/pm_angles": "Peer workload pm_angles: 4 cumulative PM angles at 1000 (ν, γ, j).",
    "compare/test_body": "Peer workload test_body: exact test-body angle at 60 (γ, j) by quadrature.",
    "compare/em_spectrum": "Peer workload em_spectrum: EM spectrum at 2000 ω, one direction.",
    "compare/gravity_spectrum": "Peer workload gravity_spectrum: gravitational spectrum at 2000 ω, one direction, set-up included.",
    "compare/sky_balance": "Peer workload sky_balance: the energy-balance sky integral (320 directions).",
    "compare/request_encounter": "Native side of the wasm/native pair: the encounter request of workloads.json evaluated whole.",
    "compare/request_waveform": "Native side of the wasm/native pair: the 2000-sample waveform request (no sky integral).",
    "compare/request_waveform_balance": "Native side of the wasm/native pair: a 200-sample waveform request with its energy-balance sky integral.",
    "compare/light_sweep_json": "The sweep with the request read from a JSON string and the result written as JSON (serde_json).",
    "compare/request_encounter_json": "The encounter request read from a JSON string, evaluated, the result written as JSON.",
    "compare/request_waveform_json": "The waveform request read from a JSON string, evaluated, the result written as JSON.",
    "compare/request_waveform_balance_json": "The balance request read from a JSON string, evaluated, the result written as JSON.",
}
NATIVE_PREFIX = {
    "amplification_factor/": "One point-lens amplification factor F(w, y) by the method its name gives.",
    "eob estimate": "The strong-field (EOB) estimate of the scattering angle, as named.",
    "eob critical_j": "The strong-field estimate's capture threshold j_c.",
    "eob orbit": "The strong-field estimate's orbit at 400 points.",
}

PEER_WORKLOADS = ["light_sweep", "pm_angles", "test_body", "em_spectrum", "gravity_spectrum", "sky_balance"]
WASM_PAIRS = [
    ("light_sweep", "compare/light_sweep", "light_sweep",
     "The 1000-point α(b) sweep: `light_sweep` export (result converted to JS objects) vs the core `sweep` natively."),
    ("encounter", "compare/request_encounter", "request_encounter",
     "One encounter request with the strong-field estimate: `evaluate` in wasm vs `request::evaluate` natively."),
    ("waveform", "compare/request_waveform", "request_waveform",
     "One 2000-sample waveform request (no sky integral): `evaluate` in wasm vs natively."),
    ("balance sky integral", "compare/request_waveform_balance", "request_waveform_balance",
     "A 200-sample waveform request with its energy-balance sky integral (20 × 24 rule): `evaluate` in wasm vs natively."),
]


def describe(full_id):
    if full_id in NATIVE:
        return NATIVE[full_id]
    for p, d in NATIVE_PREFIX.items():
        if full_id.startswith(p):
            return d
    return "(no description: a benchmark this report's generator does not know yet)"


def criterion_results(root, since):
    out = {}
    for bj in glob.glob(os.path.join(root, "**", "new", "benchmark.json"), recursive=True):
        d = os.path.dirname(bj)
        est_p, smp_p = os.path.join(d, "estimates.json"), os.path.join(d, "sample.json")
        if not (os.path.exists(est_p) and os.path.exists(smp_p)) or os.path.getmtime(est_p) < since:
            continue
        with open(bj) as f:
            meta = json.load(f)
        with open(est_p) as f:
            est = json.load(f)
        with open(smp_p) as f:
            smp = json.load(f)
        per_iter = [t / n for t, n in zip(smp["times"], smp["iters"])]
        out[meta["full_id"]] = {
            "median_ms": est["median"]["point_estimate"] * 1e-6,
            "mean_ms": est["mean"]["point_estimate"] * 1e-6,
            "best_ms": min(per_iter) * 1e-6,
            "samples": len(per_iter),
            "iterations": int(sum(smp["iters"])),
        }
    return out


def fmt_ms(x):
    if x is None or (isinstance(x, float) and math.isnan(x)):
        return "—"
    if x >= 100:
        return f"{x:.0f} ms"
    if x >= 1:
        return f"{x:.2f} ms"
    if x >= 1e-3:
        return f"{x * 1e3:.1f} µs"
    return f"{x * 1e6:.0f} ns"


def fmt_us(x):
    if x >= 1e3:
        return f"{x / 1e3:.2f} ms"
    if x >= 1:
        return f"{x:.2f} µs"
    return f"{x * 1e3:.0f} ns"


def ratio(a, b):
    return a / b if a and b else None


def main():
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--work", required=True)
    ap.add_argument("--criterion", required=True)
    ap.add_argument("--md", required=True)
    ap.add_argument("--json", required=True)
    a = ap.parse_args()
    with open(os.path.join(a.work, "machine.json")) as f:
        machine = json.load(f)
    native = criterion_results(a.criterion, machine["started_epoch"])
    peers = []
    p_path = os.path.join(a.work, "peers.jsonl")
    if os.path.exists(p_path):
        with open(p_path) as f:
            peers = [json.loads(l) for l in f if l.strip().startswith("{")]
    browser = {}
    b_path = os.path.join(a.work, "browser.json")
    if os.path.exists(b_path):
        with open(b_path) as f:
            txt = f.read().strip()
        browser = json.loads(txt.splitlines()[-1]) if txt else {}

    wasm = browser.get("wasm", {})
    pairs = []
    for name, nid, wid, what in WASM_PAIRS:
        n, w, nj = native.get(nid), wasm.get(wid, {}), native.get(nid + "_json")
        pairs.append({
            "workload": name, "native_id": nid, "wasm_id": wid, "what": what,
            "native_best_ms": n and n["best_ms"], "native_median_ms": n and n["median_ms"],
            "native_json_best_ms": nj and nj["best_ms"],
            "ratio_json_best": ratio(w.get("best_ms"), nj and nj["best_ms"]),
            "wasm_best_ms": w.get("best_ms"), "wasm_median_ms": w.get("median_ms"),
            "ratio_best": ratio(w.get("best_ms"), n and n["best_ms"]),
            "ratio_median": ratio(w.get("median_ms"), n and n["median_ms"]),
            "error": w.get("error"),
        })
    pb = browser.get("page_bench", {}).get("parsed") or {}
    sweep_native = native.get("sweep_1000_points")
    if pb.get("wasm_sweep_1000_best_ms") and sweep_native:
        pairs.append({
            "workload": "light_sweep (bench.mjs, single calls)", "native_id": "sweep_1000_points", "wasm_id": "page_bench",
            "what": "The same sweep timed one call at a time by tests/e2e/bench.mjs (performance.now() is coarsened to 0.1 ms), vs deflection/sweep_1000_points.",
            "native_best_ms": sweep_native["best_ms"], "native_median_ms": sweep_native["median_ms"],
            "native_json_best_ms": None, "ratio_json_best": None,
            "wasm_best_ms": pb["wasm_sweep_1000_best_ms"], "wasm_median_ms": pb.get("wasm_sweep_1000_median_ms"),
            "ratio_best": ratio(pb["wasm_sweep_1000_best_ms"], sweep_native["best_ms"]),
            "ratio_median": ratio(pb.get("wasm_sweep_1000_median_ms"), sweep_native["median_ms"]),
            "error": None,
        })

    peer_rows = []
    for p in peers:
        n = native.get(f"compare/{p['workload']}")
        row = {
            "workload": p["workload"], "peer": p["peer"], "items": p["items"], "item": p["item"],
            "chiwave_best_ms": n and n["best_ms"], "chiwave_median_ms": n and n["median_ms"],
            "peer_best_ms": p["best_ms"], "peer_median_ms": p["median_ms"], "peer_runs": p["runs"],
            "chiwave_per_item_us": n and 1e3 * n["best_ms"] / p["items"],
            "peer_per_item_us": p["per_item_us"],
            "throughput_ratio_best": ratio(p["best_ms"], n and n["best_ms"]),
            "throughput_ratio_median": ratio(p["median_ms"], n and n["median_ms"]),
            "agree": p["agree"], "checks": p["checks"], "note": p["note"],
        }
        if p["workload"] == "light_sweep" and wasm.get("light_sweep", {}).get("best_ms"):
            row["chiwave_wasm_best_ms"] = wasm["light_sweep"]["best_ms"]
            row["throughput_ratio_wasm_best"] = p["best_ms"] / wasm["light_sweep"]["best_ms"]
        peer_rows.append(row)

    report = {"machine": machine, "native": native, "browser": browser, "wasm_native": pairs, "peers": peer_rows}
    os.makedirs(os.path.dirname(a.json), exist_ok=True)
    with open(a.json, "w") as f:
        json.dump(report, f, indent=1, ensure_ascii=False)
        f.write("\n")
    with open(a.md, "w") as f:
        f.write(markdown(report))


def markdown(r):
    m = r["machine"]
    L = []
    w = L.append
    w("# chiwave benchmark report")
    w("")
    w(f"Generated by `scripts/bench.sh` on {m['date']} (commit `{m['commit']}`). Raw numbers: `bench/report.json`.")
    w("Times are wall-clock; **best** is the fastest sample mean, **median** the median sample mean (criterion natively, "
      "batches of calls in the browser, whole runs for the peers). Nothing here is asserted by any test.")
    w("")
    w("## Machine")
    w("")
    w("| | |")
    w("|---|---|")
    for k, label in [("cpu", "CPU"), ("nproc", "cores (nproc)"), ("kernel", "kernel"), ("rustc", "rustc"), ("node", "node"),
                     ("chromium", "chromium"), ("python", "python (peers)"), ("numpy", "numpy"), ("scipy", "scipy"), ("mpmath", "mpmath"),
                     ("load_before", "load average before (1, 5, 15 min)"), ("load_after", "load average after")]:
        w(f"| {label} | {m.get(k, '—')} |")
    w("")
    try:
        busy = max(float(str(m.get(k) or "0").split()[0]) for k in ("load_before", "load_after")) > float(m.get("nproc", 1))
    except ValueError:
        busy = False
    if busy:
        w("**The machine was shared and busy during this run** (1-minute load average above the core count before or after): "
          "expect the medians to be inflated; the best figures are the more stable ones.")
        w("")

    w("## chiwave against the peers (same points, same accuracy)")
    w("")
    w("Each peer (`benches/peers/*.py`) computes the workload of `benches/workloads.json` the way a practitioner would "
      "without chiwave, checks its results against chiwave's to the tolerance stated, and is timed warm (one untimed "
      "call first, no process start or import inside the timed region). chiwave's figure is the native criterion "
      "benchmark `compare/<workload>` on the same points. **Ratio = peer time / chiwave time for the same items**, "
      "i.e. how many times more items per second chiwave evaluates.")
    w("")
    w("On this shared 2-core machine the ratios move by up to about ±50 % from one run to the next (other jobs "
      "compete for the cores); the best figures are the steadier ones.")
    w("")
    w("| workload | peer | items | chiwave per item | peer per item | ratio (best) | ratio (median) | agreement (max rel. diff ≤ tol.) |")
    w("|---|---|---:|---:|---:|---:|---:|---|")
    for p in r["peers"]:
        chk = "; ".join(f"{c['quantity']}: {c['max_rel_diff']:.1e} ≤ {c['tolerance']:.0e}" + ("" if c["ok"] else " **FAILED**")
                        for c in p["checks"])
        cw = fmt_us(p["chiwave_per_item_us"]) if p["chiwave_per_item_us"] else "—"
        rb = f"{p['throughput_ratio_best']:.1f}×" if p["throughput_ratio_best"] else "—"
        rm = f"{p['throughput_ratio_median']:.1f}×" if p["throughput_ratio_median"] else "—"
        w(f"| {p['workload']} | {p['peer']} | {p['items']} | {cw} | {fmt_us(p['peer_per_item_us'])} | {rb} | {rm} | {chk} |")
    w("")
    w("What each row measured:")
    w("")
    for p in r["peers"]:
        extra = ""
        if p.get("throughput_ratio_wasm_best"):
            extra = (f" In the browser chiwave (wasm, `light_sweep` export, result converted to JS objects) takes "
                     f"{fmt_ms(p['chiwave_wasm_best_ms'])} for the same sweep, {1 / p['throughput_ratio_wasm_best']:.1f}× the peer's time.")
        w(f"- **{p['workload']} / {p['peer']}**: {p['items']} × {p['item']}; chiwave {fmt_ms(p['chiwave_best_ms'])} best / "
          f"{fmt_ms(p['chiwave_median_ms'])} median for all of them, peer {fmt_ms(p['peer_best_ms'])} / {fmt_ms(p['peer_median_ms'])} "
          f"({p['peer_runs']} runs). Peer: {p['note']}.{extra}")
    w("")

    w("## wasm / native (same workloads)")
    w("")
    w("Native: the core call on an already parsed request (criterion `compare/…`); wasm: the export called from JS "
      "with a JS object, its result converted back to JS objects. The column *native incl. JSON* times natively "
      "what the boundary adds (request read from a JSON string, result written as one), for scale.")
    w("")
    w("| workload | native best | native median | wasm best | wasm median | wasm/native (best) | wasm/native (median) | native incl. JSON (best) | wasm / native incl. JSON |")
    w("|---|---:|---:|---:|---:|---:|---:|---:|---:|")
    for p in r["wasm_native"]:
        rb = f"{p['ratio_best']:.2f}" if p["ratio_best"] else "—"
        rm = f"{p['ratio_median']:.2f}" if p["ratio_median"] else "—"
        rj = f"{p['ratio_json_best']:.2f}" if p.get("ratio_json_best") else "—"
        w(f"| {p['workload']} | {fmt_ms(p['native_best_ms'])} | {fmt_ms(p['native_median_ms'])} | {fmt_ms(p['wasm_best_ms'])} | "
          f"{fmt_ms(p['wasm_median_ms'])} | {rb} | {rm} | {fmt_ms(p.get('native_json_best_ms'))} | {rj} |")
    w("")
    for p in r["wasm_native"]:
        err = f" (wasm side not measured: {p['error']})" if p.get("error") else ""
        w(f"- **{p['workload']}**: {p['what']}{err}")
    w("")

    b = r["browser"]
    w("## In the browser (headless Chromium, the single file opened from disk)")
    w("")
    st = b.get("startup")
    if st:
        w(f"- Single file `dist/chiwave.html`: {st['single_file_bytes'] / 1024:.0f} KiB; first result "
          f"{st['first_result_ms']['median']:.0f} ms median (best {st['first_result_ms']['best']:.0f} ms, "
          f"{st['first_result_ms']['runs']} page loads) from navigation start to `body[data-ready]`.")
    inp = b.get("inp") or {}
    if inp:
        w("")
        w("Interaction to next paint (Event Timing API) while typing into each view's first numeric input "
          "(a digit typed and deleted, 40 key presses 150 ms apart; presses under the 16 ms reporting threshold count as 16 ms):")
        w("")
        w("| view | input | p50 | p95 | max |")
        w("|---|---|---:|---:|---:|")
        for k, v in inp.items():
            if "error" in v:
                w(f"| {k} | — | — | — | {v['error']} |")
            else:
                w(f"| {k} | `{v['input']}` | {v['p50_ms']:.0f} ms | {v['p95_ms']:.0f} ms | {v['max_ms']:.0f} ms |")
    pb = b.get("page_bench") or {}
    if pb.get("lines"):
        w("")
        w("`tests/e2e/bench.mjs` (page recompute and progressive sky work; printed as it reports them):")
        w("")
        w("```")
        L.extend(pb["lines"])
        w("```")
    elif pb.get("error"):
        w(f"- `tests/e2e/bench.mjs` failed: {pb['error']}")
    if b.get("wasm"):
        w("")
        w("wasm workloads of `benches/workloads.json` (batch means after a 1 s warm-up):")
        w("")
        for k, v in b["wasm"].items():
            w(f"- `{k}`: " + (f"best {fmt_ms(v['best_ms'])}, median {fmt_ms(v['median_ms'])} ({v['batches']} batches of {v['batch']})"
                              if "best_ms" in v else f"not measured: {v.get('error')}"))
    w("")

    w("## Native benchmarks (criterion)")
    w("")
    w("| benchmark | median | best | what it measures |")
    w("|---|---:|---:|---|")
    for k in sorted(r["native"]):
        v = r["native"][k]
        w(f"| `{k}` | {fmt_ms(v['median_ms'])} | {fmt_ms(v['best_ms'])} | {describe(k)} |")
    w("")
    w("Run: `scripts/bench.sh` (see its header for options). The peers need numpy, scipy and mpmath "
      "(`benches/peers/requirements.txt`, installed into `.venv-bench/` by the script).")
    w("")
    return "\n".join(L)


if __name__ == "__main__":
    main()
