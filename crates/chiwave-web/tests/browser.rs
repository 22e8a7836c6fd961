//! Binding-layer tests in headless Chromium (wasm-bindgen-test-runner + chromedriver; Chrome
//! options in ../webdriver.json). They check the JS surface only: values in, values or
//! field-named JS errors out. The physics is tested natively in chiwave-core.
#![cfg(target_arch = "wasm32")]

use chiwave_web::{check_scenario, evaluate, figure, figure_names, info, references, render_figure};
use js_sys::{Array, Object, Reflect, JSON};
use wasm_bindgen::{JsCast, JsValue};
use wasm_bindgen_test::*;

wasm_bindgen_test_configure!(run_in_browser);

fn js(text: &str) -> JsValue {
    JSON::parse(text).expect("test JSON is valid")
}

fn get(v: &JsValue, key: &str) -> JsValue {
    Reflect::get(v, &JsValue::from_str(key)).expect("object")
}

/// The message and field of a JS error returned by an export.
fn error_parts(e: js_sys::Error) -> (String, String) {
    let v: JsValue = e.into();
    assert!(v.is_instance_of::<js_sys::Error>(), "errors are JS Error objects");
    (get(&v, "message").as_string().unwrap_or_default(), get(&v, "field").as_string().unwrap_or_default())
}

#[wasm_bindgen_test]
fn good_light_request_gives_a_plain_object() {
    let r = evaluate(js(r#"{"kind":"light","b":10}"#)).expect("b = 10 M is valid");
    assert!(r.is_object() && !r.is_instance_of::<js_sys::Map>(), "maps are serialised as objects");
    let alpha = get(&r, "alpha").as_f64().expect("alpha is a number");
    // mpmath 1.3, tests/reference/deflection_mpmath.py: α(10M) = 0.59039578760582732122
    // (Darwin 1959 closed form evaluated independently of the Rust code).
    assert!((alpha / 0.590_395_787_605_827_3 - 1.0).abs() < 1e-12, "{alpha}");
    assert_eq!(get(&r, "captured").as_bool(), Some(false));
    let sources = get(&r, "sources");
    assert!(sources.is_object() && get(&sources, "alpha").is_string(), "sources is an object keyed by output");
    assert!(Array::is_array(&get(&r, "flags")));
    // Every flag carries its human label from the core.
    let first = Array::from(&get(&r, "flags")).get(0);
    assert_eq!(get(&first, "key").as_string().as_deref(), Some("weak_field"));
    assert_eq!(get(&first, "label").as_string().as_deref(), Some("weak field M/b"));
    assert!(Array::is_array(&get(&r, "series")));
}

#[wasm_bindgen_test]
fn captured_ray_is_a_result_not_an_error() {
    let r = evaluate(js(r#"{"kind":"light","b":4}"#)).expect("capture is a result");
    assert_eq!(get(&r, "captured").as_bool(), Some(true));
    assert!(get(&r, "alpha").is_null(), "alpha is null when captured");
}

#[wasm_bindgen_test]
fn nan_is_an_error_naming_the_field() {
    let req = js(r#"{"kind":"light","b":10}"#);
    Reflect::set(&req, &"b".into(), &JsValue::from_f64(f64::NAN)).expect("set");
    let (msg, field) = error_parts(evaluate(req).expect_err("NaN must be refused"));
    assert_eq!(field, "b");
    assert!(msg.starts_with("b:"), "{msg}");
    let (msg, field) = error_parts(evaluate(js(r#"{"kind":"light","b":"NaN"}"#)).expect_err("text NaN refused"));
    assert_eq!(field, "b", "{msg}");
}

#[wasm_bindgen_test]
fn unknown_unit_is_an_error_naming_the_field() {
    let (msg, field) = error_parts(evaluate(js(r#"{"kind":"light","mass":"2 stone","b":10}"#)).expect_err("unknown unit"));
    assert_eq!(field, "mass");
    assert!(msg.contains("stone"), "{msg}");
    let (msg, field) = error_parts(evaluate(js(r#"{"kind":"light","b":"10 furlongs"}"#)).expect_err("unknown unit"));
    assert_eq!(field, "b");
    assert!(msg.contains("unit"), "{msg}");
}

#[wasm_bindgen_test]
fn malformed_requests_name_the_field_too() {
    let (msg, field) = error_parts(evaluate(js(r#"{"kind":"light","b":10,"colour":"red"}"#)).expect_err("unknown field"));
    assert_eq!(field, "colour", "{msg}");
    let (_, field) = error_parts(evaluate(js(r#"{"kind":"light"}"#)).expect_err("missing b"));
    assert_eq!(field, "b");
    let (msg, field) = error_parts(evaluate(js(r#"{"kind":"teleport"}"#)).expect_err("unknown kind"));
    assert_eq!(field, "request", "{msg}");
    let (_, field) = error_parts(evaluate(JsValue::UNDEFINED).expect_err("undefined"));
    assert_eq!(field, "request");
    let (_, field) = error_parts(evaluate(js(r#"{"kind":"light","b":10,"spin":1.5}"#)).expect_err("|a| > M"));
    assert_eq!(field, "spin");
}

#[wasm_bindgen_test]
fn figures_return_svg_and_frame() {
    for name in figure_names("light") {
        let r = figure(js(r#"{"kind":"light","b":10}"#), &name, js(r#"{"angle_unit":"arcsec"}"#)).expect("figure");
        let svg = get(&r, "svg").as_string().unwrap_or_default();
        assert!(svg.starts_with("<svg"), "{name}");
        let frame = get(&r, "frame");
        assert!(get(&frame, "width").as_f64().unwrap_or(0.0) > 100.0, "{name}");
        assert!(Array::is_array(&get(&r, "series")));
    }
    let r = figure(js(r#"{"kind":"light","b":10}"#), "alpha_b", js(r#"{"angle_unit":"arcsec"}"#)).expect("figure");
    assert!(get(&r, "svg").as_string().unwrap_or_default().contains("deflection angle α [arcsec]"));
    // A captured request still draws (the marker is simply absent).
    assert!(figure(js(r#"{"kind":"light","b":4}"#), "rays", JsValue::UNDEFINED).is_ok());
    let (_, field) = error_parts(figure(js(r#"{"kind":"light","b":10}"#), "pie", JsValue::NULL).expect_err("no such figure"));
    assert_eq!(field, "figure");
    let (_, field) = error_parts(figure(js(r#"{"kind":"light","b":10}"#), "alpha_b", js(r#"{"angle_unit":"furlong"}"#)).expect_err("bad unit"));
    assert_eq!(field, "angle_unit");
    let (_, field) = error_parts(figure(js(r#"{"kind":"light","b":-1}"#), "alpha_b", JsValue::NULL).expect_err("bad b"));
    assert_eq!(field, "b");
}

#[wasm_bindgen_test]
fn generic_figure_and_scenario_and_info() {
    let fig = js(r#"{"title":"t","x":{"label":"x [s]","log":false,"range":null},"y":{"label":"y [m]","log":true,"range":null},
        "series":[{"label":"s","points":[[1,1],null,[2,10]],"style":{"color":[0,0,0],"width":1,"dash":"solid","fill":null}}],
        "bands":[],"markers":[],"legend":"top_right","equal_aspect":false,"width":400,"height":300}"#);
    let r = render_figure(fig).expect("generic figure");
    assert!(get(&r, "svg").as_string().unwrap_or_default().contains("x [s]"));
    let (_, field) = error_parts(render_figure(js(r#"{"title":1}"#)).expect_err("bad figure"));
    assert!(!field.is_empty());
    let s = check_scenario(js(r#"{"name":"n","description":"d","request":{"kind":"light","b":7.5,"spin":0.83}}"#)).expect("scenario");
    assert_eq!(get(&get(&s, "request"), "kind").as_string().as_deref(), Some("light"));
    let i = info().expect("info");
    assert!(get(&i, "notice").as_string().unwrap_or_default().contains("not a substitute"));
    // The angle units come from the core's AngleUnit: 1 deg = π/180 rad (definition).
    let units = Array::from(&get(&i, "angle_units"));
    assert_eq!(units.length(), 5);
    let deg = units.get(1);
    assert_eq!(get(&deg, "key").as_string().as_deref(), Some("deg"));
    assert_eq!(get(&deg, "rad_per_unit").as_f64(), Some(std::f64::consts::PI / 180.0));
    assert_eq!(get(&units.get(4), "label").as_string().as_deref(), Some("µas"));
    let _: Object = i.dyn_into().expect("info is an object");
}

/// `references()` returns the registry with each entry's short citation and BibTeX, and every
/// citation of a result names an id in it; each short citation appears in the source text.
#[wasm_bindgen_test]
fn references_list_the_registry_with_bibtex() {
    let list: Array = references().expect("registry").into();
    assert!(list.length() > 50);
    let mut ids = Vec::new();
    for e in list.iter() {
        let id = get(&e, "id").as_string().expect("id");
        let bib = get(&e, "bibtex").as_string().expect("bibtex");
        assert!(bib.contains(&format!("{{{id},")), "{id}: {bib}");
        assert!(get(&e, "short").is_string());
        ids.push(id);
    }
    let r = evaluate(js(r#"{"kind":"light","b":10}"#)).expect("valid");
    let cites = get(&get(&r, "citations"), "alpha");
    let first = Array::from(&cites).get(0);
    let id = get(&first, "id").as_string().expect("id");
    assert!(ids.contains(&id), "{id}");
    let text = get(&get(&r, "sources"), "alpha").as_string().expect("text");
    let short = list.iter().find(|e| get(e, "id").as_string().as_deref() == Some(id.as_str())).map(|e| get(&e, "short").as_string().unwrap());
    assert!(text.contains(&short.unwrap()), "{text}");
}
