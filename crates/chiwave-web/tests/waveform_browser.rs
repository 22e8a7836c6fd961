//! Binding-layer tests of the waveform exports in headless Chromium: the progressive
//! `WaveformJob` (steps, snapshot, figures) and its field-named errors. The sums themselves are
//! tested natively in chiwave-core (waveform::progressive, tests/waveform.rs).
#![cfg(target_arch = "wasm32")]

use chiwave_web::{evaluate, figure_names, WaveformJob};
use js_sys::{Reflect, JSON};
use wasm_bindgen::JsValue;
use wasm_bindgen_test::*;

wasm_bindgen_test_configure!(run_in_browser);

fn get(v: &JsValue, key: &str) -> JsValue {
    Reflect::get(v, &JsValue::from_str(key)).expect("object")
}

const REQ: &str = r#"{"kind":"waveform","m1":1,"m2":2,"gamma":1.3,"b":50,"theta":0.8,"phi":0.3,"u_min":-10,"u_max":10,"u_unit":"b_over_v","samples":11}"#;

#[wasm_bindgen_test]
fn job_steps_to_the_same_balance_as_evaluate() {
    let req = JSON::parse(REQ).expect("json");
    let mut job = WaveformJob::new(req.clone(), "energy").expect("job starts");
    let first = job.step(0.0).expect("one chunk");
    assert_eq!(get(&first, "done").as_bool(), Some(false));
    assert_eq!(get(&first, "phase").as_string().as_deref(), Some("balance"));
    assert!(get(&first, "e_rad_rel_diff").is_null(), "no balance before the flux integral is complete");
    let mut snap = first;
    for _ in 0..100_000 {
        if job.done() {
            break;
        }
        snap = job.step(5.0).expect("step");
    }
    assert!(job.done());
    // evaluate() runs the same flux integral in one go (SkyIntegrator::run).
    let full = evaluate(req).expect("evaluate");
    let a = get(&snap, "e_rad_flux").as_f64().unwrap_or(f64::NAN);
    let b = get(&full, "e_rad_flux").as_f64().unwrap_or(f64::NAN);
    assert_eq!(a, b, "progressive {a} vs one-shot {b}");
    // Balance against Herrmann et al. 2021 (arXiv:2101.07255) via e_rad_closed.
    assert!(get(&snap, "e_rad_rel_diff").as_f64().unwrap_or(1.0) < 1e-10);
    let sky = job.sky_figure("equal_area").expect("sky figure");
    assert!(get(&sky, "svg").as_string().unwrap_or_default().contains("cos θ"));
    let spec = job.spectrum_figure().expect("spectrum figure");
    assert!(get(&spec, "svg").as_string().unwrap_or_default().contains("over the sphere"));
}

#[wasm_bindgen_test]
fn job_errors_name_the_field() {
    let req = JSON::parse(REQ).expect("json");
    let e: JsValue = WaveformJob::new(req.clone(), "flux").err().expect("bad map").into();
    assert_eq!(get(&e, "field").as_string().as_deref(), Some("map"));
    let job = WaveformJob::new(req, "energy").expect("job starts");
    let e: JsValue = job.sky_figure("mercator").expect_err("bad projection").into();
    assert_eq!(get(&e, "field").as_string().as_deref(), Some("projection"));
    let em = JSON::parse(&REQ.replace(r#""kind":"waveform","#, r#""kind":"waveform","force":"em","q1":0.1,"q2":0.1,"#)).expect("json");
    let e: JsValue = WaveformJob::new(em, "energy").err().expect("gravity only").into();
    assert_eq!(get(&e, "field").as_string().as_deref(), Some("force"));
    assert!(figure_names("waveform").contains(&"em_field".to_string()));
}
