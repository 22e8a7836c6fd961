//! Binding-layer tests of the encounter exports in headless Chromium: values in, values or
//! field-named JS errors out. The physics is tested natively in chiwave-core.
#![cfg(target_arch = "wasm32")]

use chiwave_web::{encounter_nr, figure, figure_names};
use js_sys::{Array, Reflect, JSON};
use wasm_bindgen::JsValue;
use wasm_bindgen_test::*;

wasm_bindgen_test_configure!(run_in_browser);

fn get(v: &JsValue, key: &str) -> JsValue {
    Reflect::get(v, &JsValue::from_str(key)).expect("object")
}

#[wasm_bindgen_test]
fn encounter_figures_are_listed_and_drawn() {
    assert_eq!(figure_names("encounter"), vec!["chi_b", "chi_j", "orbits"]);
    let req = JSON::parse(r#"{"kind":"encounter","m1":1,"m2":3,"gamma":1.1,"b":100}"#).expect("json");
    for name in ["chi_b", "chi_j", "orbits"] {
        let r = figure(req.clone(), name, JsValue::UNDEFINED).expect("figure draws");
        assert!(get(&r, "svg").as_string().unwrap_or_default().starts_with("<svg"), "{name}");
    }
    let em = JSON::parse(r#"{"kind":"encounter","force":"em","m1":1,"m2":3,"gamma":1.1,"b":100,"q1":0.2,"q2":-0.3}"#).expect("json");
    let e: JsValue = figure(em, "chi_b", JsValue::UNDEFINED).expect_err("gravity only").into();
    assert_eq!(get(&e, "field").as_string().as_deref(), Some("force"));
}

#[wasm_bindgen_test]
fn nr_csv_goes_through_the_core() {
    // synthetic rows, invented for this test (not NR data)
    let out = encounter_nr("E/M,J/M2,nu,chi,sigma\n1.0225,1.5,0.25,1.6,0.05\n1.0225,1.7,0.25,1.05,0.04\n", "deg").expect("valid csv");
    let rows = get(&out, "rows");
    assert!(Array::is_array(&rows));
    assert_eq!(Array::from(&rows).length(), 2);
    assert!(get(&get(&out, "figure"), "svg").as_string().unwrap_or_default().contains("[deg]"));
    let e: JsValue = encounter_nr("1.02, 1.5, 0.25\n", "").expect_err("three numbers").into();
    assert_eq!(get(&e, "field").as_string().as_deref(), Some("csv"));
    let e: JsValue = encounter_nr("0.99, 1.5, 0.25, 1, 0.1\n", "").expect_err("bound").into();
    assert_eq!(get(&e, "field").as_string().as_deref(), Some("E/M"));
}
