//! The workloads of `benches/workloads.json`, timed natively for the side-by-side comparisons of
//! `scripts/bench.sh`: the same points as the Python peers (`benches/peers/`) and the same
//! requests as the in-browser timing (`tests/e2e/bench-json.mjs`).
//!
//! `cargo bench -p chiwave-core --bench compare` times them (criterion, group `compare`; the
//! `*_json` variants also read the request from a JSON string and write the result as one, the
//! native analogue of the conversions a wasm call pays);
//! `cargo bench -p chiwave-core --bench compare -- --values` instead prints chiwave's results for
//! every workload as one JSON object (the peers check theirs against it) and times nothing.
use chiwave_core::deflection::{sweep, LightRequest};
use chiwave_core::two_body::RelativeSpeed;
use chiwave_core::encounter::testbody::{self, TestBody};
use chiwave_core::encounter::pm;
use chiwave_core::request::{evaluate, Request};
use chiwave_core::waveform::em::{self, EmSystem};
use chiwave_core::waveform::{radiated_closed_form, Binary, DirectionWaveform, Frame, SkyIntegrator, SkyOptions};
use criterion::{black_box, Criterion, SamplingMode};
use serde_json::{json, Value};

const WORKLOADS: &str = include_str!(concat!(env!("CARGO_MANIFEST_DIR"), "/../../benches/workloads.json"));

/// A grid as described in `benches/workloads.json` (`log`, `linear` or `list`).
fn grid(spec: &Value) -> Vec<f64> {
    let three = |v: &Value| {
        let a: Vec<f64> = v.as_array().expect("grid [lo, hi, n]").iter().map(|x| x.as_f64().expect("number")).collect();
        (a[0], a[1], a[2] as usize)
    };
    if let Some(v) = spec.get("log") {
        let (lo, hi, n) = three(v);
        let r = (hi / lo).ln();
        (0..n).map(|i| if i + 1 == n { hi } else { lo * (r * i as f64 / (n - 1) as f64).exp() }).collect()
    } else if let Some(v) = spec.get("linear") {
        let (lo, hi, n) = three(v);
        (0..n).map(|i| lo + (hi - lo) * i as f64 / (n - 1) as f64).collect()
    } else {
        spec["list"].as_array().expect("grid list").iter().map(|x| x.as_f64().expect("number")).collect()
    }
}

fn num(v: &Value, key: &str) -> f64 {
    v[key].as_f64().unwrap_or_else(|| panic!("workloads.json: number {key}"))
}

fn light_request(w: &Value) -> LightRequest {
    match serde_json::from_value::<Request>(w["request"].clone()).expect("light request") {
        Request::Light(r) => r,
        _ => panic!("light_sweep.request must be of kind light"),
    }
}

/// (ν, γ − 1, j) triples of the product grid, j fastest.
fn pm_points(w: &Value) -> Vec<(f64, f64, f64)> {
    let (nus, gs, js) = (grid(&w["nu"]), grid(&w["gamma_m1"]), grid(&w["j"]));
    let mut out = Vec::with_capacity(nus.len() * gs.len() * js.len());
    for &nu in &nus {
        for &g in &gs {
            for &j in &js {
                out.push((nu, g, j));
            }
        }
    }
    out
}

/// The four cumulative angles at each (ν, γ − 1, j); the kinematics (p∞, v) are part of the work,
/// as they are for the peer.
fn pm_angles(points: &[(f64, f64, f64)]) -> Vec<[f64; 4]> {
    points
        .iter()
        .map(|&(nu, gm1, j)| {
            let b = RelativeSpeed::from_gamma_m1("gamma", gm1).expect("valid γ");
            pm::cumulative_angles(&pm::coefficients(&b, nu), j)
        })
        .collect()
}

/// (boost, j) pairs with j = ratio × j_c(γ), j fastest.
fn test_body_points(w: &Value) -> Vec<(RelativeSpeed, f64)> {
    let mut out = Vec::new();
    for g in grid(&w["gamma_m1"]) {
        let b = RelativeSpeed::from_gamma_m1("gamma", g).expect("valid γ");
        for r in grid(&w["j_over_jc"]) {
            out.push((b, r * testbody::critical_j(&b)));
        }
    }
    out
}

/// The exact angle at each point; the kinematics are part of the work, as they are for the peer.
fn test_body_angles(points: &[(RelativeSpeed, f64)]) -> Vec<Option<f64>> {
    points
        .iter()
        .map(|(b, j)| match testbody::exact(&RelativeSpeed::from_gamma_m1("gamma", b.gamma_m1).expect("valid γ"), *j) {
            Ok(TestBody::Scattered { chi, .. }) => Some(chi),
            Ok(TestBody::Captured) => None,
            Err(e) => panic!("test-body quadrature failed: {e}"),
        })
        .collect()
}

fn em_system(w: &Value) -> EmSystem {
    let k = |s| num(w, s);
    EmSystem::new(k("m1"), k("m2"), k("q1"), k("q2"), k("gamma"), k("b")).expect("valid EM system")
}

fn binary(w: &Value) -> Binary {
    Binary::new(num(w, "m1"), num(w, "m2"), num(w, "gamma"), num(w, "b")).expect("valid binary")
}

fn gravity_spectrum(sys: &Binary, w: &Value, omega: &[f64]) -> Vec<f64> {
    let d = DirectionWaveform::new(sys, Frame::Rest2, num(w, "theta"), num(w, "phi"), num(w, "x_nodes") as usize)
        .expect("valid direction");
    omega.iter().map(|&o| d.spectrum(o)).collect()
}

fn sky_options(w: &Value) -> SkyOptions {
    let k = |s| num(w, s) as usize;
    SkyOptions { n_polar: k("n_polar"), n_azimuth: k("n_azimuth"), n_u: k("n_u"), n_x: k("n_x") }
}

fn sky_energy(sys: &Binary, opts: SkyOptions) -> f64 {
    SkyIntegrator::new(sys, Frame::Rest2, opts).expect("valid sky options").run().energy
}

/// chiwave's results for every workload, for the peers' agreement checks.
fn values(all: &Value) -> Value {
    let ls = &all["light_sweep"];
    let s = sweep(&light_request(ls), num(ls, "b_min"), num(ls, "b_max"), ls["n"].as_u64().expect("n") as usize)
        .expect("sweep");
    let pm_w = &all["pm_angles"];
    let pts = pm_points(pm_w);
    let chi = pm_angles(&pts);
    let coeffs: Vec<[f64; 4]> =
        pts.iter().map(|&(nu, g, _)| pm::coefficients(&RelativeSpeed::from_gamma_m1("gamma", g).expect("valid γ"), nu)).collect();
    let tb = test_body_points(&all["test_body"]);
    let em_w = &all["em_spectrum"];
    let em_omega = grid(&em_w["omega"]);
    let gw = &all["gravity_spectrum"];
    let g_omega = grid(&gw["omega"]);
    let sb = &all["sky_balance"];
    let sky_sys = binary(sb);
    json!({
        "light_sweep": {
            "b": s.b,
            "alpha": s.alpha,
            "series": s.series.iter().map(|c| &c.alpha).collect::<Vec<_>>(),
            "strong_deflection": s.strong_deflection,
        },
        "pm_angles": {
            "nu": pts.iter().map(|p| p.0).collect::<Vec<_>>(),
            "gamma_m1": pts.iter().map(|p| p.1).collect::<Vec<_>>(),
            "j": pts.iter().map(|p| p.2).collect::<Vec<_>>(),
            "chi": (0..4).map(|k| chi.iter().map(|c| c[k]).collect::<Vec<_>>()).collect::<Vec<_>>(),
            "coefficients": (0..4).map(|k| coeffs.iter().map(|c| c[k]).collect::<Vec<_>>()).collect::<Vec<_>>(),
        },
        "test_body": {
            "gamma_m1": tb.iter().map(|p| p.0.gamma_m1).collect::<Vec<_>>(),
            "j": tb.iter().map(|p| p.1).collect::<Vec<_>>(),
            "chi": test_body_angles(&tb),
        },
        "em_spectrum": {
            "omega": em_omega,
            "value": em::spectrum(&em_system(em_w), num(em_w, "theta"), num(em_w, "phi"), &em_omega),
        },
        "gravity_spectrum": { "omega": g_omega, "value": gravity_spectrum(&binary(gw), gw, &g_omega) },
        "sky_balance": {
            "energy": sky_energy(&sky_sys, sky_options(sb)),
            "energy_closed": radiated_closed_form(&sky_sys, Frame::Rest2).energy,
        },
    })
}

fn bench(c: &mut Criterion, all: &Value) {
    let mut g = c.benchmark_group("compare");
    let ls = &all["light_sweep"];
    let req = light_request(ls);
    let (b_min, b_max, n) = (num(ls, "b_min"), num(ls, "b_max"), ls["n"].as_u64().expect("n") as usize);
    g.bench_function("light_sweep", |b| b.iter(|| sweep(black_box(&req), b_min, b_max, n)));
    // With the request read from JSON and the result written as JSON: the native analogue of the
    // conversions a wasm call pays at the boundary.
    let req_json = ls["request"].to_string();
    g.bench_function("light_sweep_json", |b| {
        b.iter(|| {
            let r: Request = serde_json::from_str(black_box(&req_json)).expect("request");
            let Request::Light(r) = r else { panic!("light request") };
            serde_json::to_string(&sweep(&r, b_min, b_max, n).expect("sweep")).expect("JSON")
        })
    });

    let pts = pm_points(&all["pm_angles"]);
    g.bench_function("pm_angles", |b| b.iter(|| pm_angles(black_box(&pts))));

    let tb = test_body_points(&all["test_body"]);
    g.bench_function("test_body", |b| b.iter(|| test_body_angles(black_box(&tb))));

    let em_w = &all["em_spectrum"];
    let (em_sys, em_omega) = (em_system(em_w), grid(&em_w["omega"]));
    let (th, ph) = (num(em_w, "theta"), num(em_w, "phi"));
    g.bench_function("em_spectrum", |b| b.iter(|| em::spectrum(black_box(&em_sys), th, ph, black_box(&em_omega))));

    let gw = &all["gravity_spectrum"];
    let (g_sys, g_omega) = (binary(gw), grid(&gw["omega"]));
    g.bench_function("gravity_spectrum", |b| b.iter(|| gravity_spectrum(black_box(&g_sys), gw, black_box(&g_omega))));

    // The slow ones (tens of ms per call): flat sampling, 20 samples.
    g.sampling_mode(SamplingMode::Flat).sample_size(20);
    let sb = &all["sky_balance"];
    let (sky_sys, opts) = (binary(sb), sky_options(sb));
    g.bench_function("sky_balance", |b| b.iter(|| sky_energy(black_box(&sky_sys), opts)));

    let wn = &all["wasm_native"];
    for name in ["encounter", "waveform", "waveform_balance"] {
        let r: Request = serde_json::from_value(wn[name].clone()).expect("request");
        g.bench_function(format!("request_{name}"), |b| b.iter(|| evaluate(black_box(&r)).expect("evaluates")));
        let text = wn[name].to_string();
        g.bench_function(format!("request_{name}_json"), |b| {
            b.iter(|| {
                let r: Request = serde_json::from_str(black_box(&text)).expect("request");
                serde_json::to_string(&evaluate(&r).expect("evaluates")).expect("JSON")
            })
        });
    }
    g.finish();
}

fn main() {
    let all: Value = serde_json::from_str(WORKLOADS).expect("benches/workloads.json is JSON");
    if std::env::args().any(|a| a == "--values") {
        println!("{}", values(&all));
        return;
    }
    let mut c = Criterion::default().configure_from_args();
    bench(&mut c, &all);
    c.final_summary();
}
