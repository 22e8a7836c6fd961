//! Thin wasm-bindgen layer: JS values in, one core call, JS values or a JS `Error` out.
//!
//! No physics lives here. Every export takes one serde value (read with serde-wasm-bindgen),
//! calls the core (or the plot crate), and returns a plain JS value (maps as objects, `None`
//! as `null`). Errors are JS `Error` objects whose `message` is `"field: what is wrong"` and
//! which carry two extra properties, `field` (the input the page should mark) and `kind`
//! (`"input"` for a core [`InputError`], `"request"` for a malformed request object, `"plot"`
//! for a drawing failure). Nothing here unwraps: a panic in wasm would kill the page.

use chiwave_core::request::{Request, Scenario};
use chiwave_core::InputError;
use serde::Serialize;
use chiwave_plot::scene;
use wasm_bindgen::prelude::*;

mod encounter;
mod waveform;
pub use encounter::encounter_nr;
pub use waveform::WaveformJob;


/// A JS `Error` with `field` and `kind` properties.
pub(crate) fn js_error(kind: &str, field: &str, message: &str) -> js_sys::Error {
    let e = js_sys::Error::new(message);
    // Reflect::set only fails on frozen objects; a fresh Error is not frozen.
    let _ = js_sys::Reflect::set(&e, &JsValue::from_str("field"), &JsValue::from_str(field));
    let _ = js_sys::Reflect::set(&e, &JsValue::from_str("kind"), &JsValue::from_str(kind));
    e
}

pub(crate) fn input_error(e: &InputError) -> js_sys::Error {
    js_error("input", e.field(), &e.to_string())
}

/// Turns a serde error on the request object into an error naming the field if serde names it.
fn request_error(root: &str, e: serde_wasm_bindgen::Error) -> js_sys::Error {
    let msg = e.to_string();
    // serde's messages quote field names in backticks: "unknown field `foo`", "missing field `b`".
    let field = ["unknown field `", "missing field `"]
        .iter()
        .find_map(|p| msg.find(p).map(|i| &msg[i + p.len()..]))
        .and_then(|rest| rest.split('`').next())
        .filter(|f| !f.is_empty())
        .unwrap_or(root)
        .to_string();
    js_error("request", &field, &format!("{field}: {msg}"))
}

pub(crate) fn to_js<T: Serialize + ?Sized>(v: &T) -> Result<JsValue, js_sys::Error> {
    let ser = serde_wasm_bindgen::Serializer::json_compatible();
    v.serialize(&ser).map_err(|e| js_error("request", "result", &format!("result: {e}")))
}

pub(crate) fn read_request(request: JsValue) -> Result<Request, js_sys::Error> {
    serde_wasm_bindgen::from_value(request).map_err(|e| request_error("request", e))
}

/// Evaluates one request `{kind: "light" | "lens" | ..., ...fields}` and returns its result.
///
/// # Errors
/// A JS `Error` naming the field (see the crate docs).
#[wasm_bindgen]
pub fn evaluate(request: JsValue) -> Result<JsValue, js_sys::Error> {
    let req = read_request(request)?;
    let res = chiwave_core::request::evaluate(&req).map_err(|e| input_error(&e))?;
    to_js(&res)
}

/// Draws one figure for a request: `name` is one of [`figure_names`]; `options` is an object
/// `{angle_unit?: "rad"|"deg"|"arcsec"|"mas"|"uas", width?, height?}`.
/// Returns `{svg, frame, series}` (see `chiwave_plot::Rendered`).
///
/// # Errors
/// A JS `Error` naming the field.
#[wasm_bindgen]
pub fn figure(request: JsValue, name: &str, options: JsValue) -> Result<JsValue, js_sys::Error> {
    let req = read_request(request)?;
    let opts: scene::Options = if options.is_undefined() || options.is_null() {
        scene::Options::default()
    } else {
        serde_wasm_bindgen::from_value(options).map_err(|e| request_error("options", e))?
    };
    let fig = scene::figure(&req, name, &opts).map_err(|e| input_error(&e))?;
    let rendered = chiwave_plot::render_for_page(&fig).map_err(|e| js_error("plot", "figure", &e.to_string()))?;
    to_js(&rendered)
}

/// α(b) plot data for a light request's lens: `n` log-spaced b/M from `b_min` to `b_max`, the
/// exact α and every partial sum (`chiwave_core::deflection::AlphaSweep` as a JS object).
///
/// # Errors
/// A JS `Error` naming the field (`b_min`, `b_max`, `n`, or the request's own fields).
#[wasm_bindgen]
pub fn light_sweep(request: JsValue, b_min: f64, b_max: f64, n: usize) -> Result<JsValue, js_sys::Error> {
    let req: chiwave_core::deflection::LightRequest = {
        match read_request(request)? {
            Request::Light(r) => r,
            _ => return Err(js_error("request", "kind", "kind: light_sweep needs a request of kind 'light'")),
        }
    };
    let s = chiwave_core::deflection::sweep(&req, b_min, b_max, n).map_err(|e| input_error(&e))?;
    to_js(&s)
}

/// The figure names [`figure`] knows for a request kind.
#[wasm_bindgen]
pub fn figure_names(kind: &str) -> Vec<String> {
    scene::names(kind).iter().map(|s| s.to_string()).collect()
}

/// Draws a generic figure description (`chiwave_plot::Figure` as JSON) — for views that
/// assemble a figure from result arrays.
///
/// # Errors
/// A JS `Error` with `field = "figure"` for a malformed description.
#[wasm_bindgen]
pub fn render_figure(figure: JsValue) -> Result<JsValue, js_sys::Error> {
    let fig: chiwave_plot::Figure = serde_wasm_bindgen::from_value(figure).map_err(|e| request_error("figure", e))?;
    let r = chiwave_plot::render_for_page(&fig).map_err(|e| js_error("plot", "figure", &e.to_string()))?;
    to_js(&r)
}

/// Checks a scenario object `{name, description, request}` and returns it normalised.
///
/// # Errors
/// A JS `Error` naming the offending field.
#[wasm_bindgen]
pub fn check_scenario(scenario: JsValue) -> Result<JsValue, js_sys::Error> {
    let s: Scenario = serde_wasm_bindgen::from_value(scenario).map_err(|e| request_error("scenario", e))?;
    to_js(&s)
}

/// One angle unit for the page's menus: its request key, label and size in radians.
#[derive(Serialize)]
struct AngleUnitInfo {
    key: &'static str,
    label: &'static str,
    rad_per_unit: f64,
}

#[derive(Serialize)]
struct Info {
    version: &'static str,
    notice: &'static str,
    mass_units: &'static str,
    length_units: &'static str,
    speed_units: &'static str,
    frequency_units: &'static str,
    charge_units: &'static str,
    /// Every output angle unit (`chiwave_core::units::AngleUnit`), so the page keeps no table.
    angle_units: Vec<AngleUnitInfo>,
}

/// Static facts for the page: version, the standing notice, the accepted unit lists, and the
/// angle units `[{key, label, rad_per_unit}]`.
///
/// # Errors
/// Never in practice (serialising static strings).
#[wasm_bindgen]
pub fn info() -> Result<JsValue, js_sys::Error> {
    use chiwave_core::units;
    to_js(&Info {
        version: env!("CARGO_PKG_VERSION"),
        notice: chiwave_core::validity::ESTIMATE_NOTICE,
        mass_units: units::MASS_UNITS,
        length_units: units::LENGTH_UNITS,
        speed_units: units::SPEED_UNITS,
        frequency_units: units::FREQUENCY_UNITS,
        charge_units: units::CHARGE_UNITS,
        angle_units: units::AngleUnit::ALL
            .iter()
            .map(|&u| AngleUnitInfo { key: u.key(), label: u.label(), rad_per_unit: u.radians() })
            .collect(),
    })
}

/// Every reference the tool uses (`chiwave_core::references::listing`): each entry's fields,
/// its short citation (the exact text the results' `sources` strings contain) and its BibTeX.
/// The page's References panel and the source tooltips read it; nothing is fetched.
#[wasm_bindgen]
pub fn references() -> Result<JsValue, js_sys::Error> {
    to_js(&chiwave_core::references::listing())
}
