//! Encounter exports beyond `evaluate`/`figure`: the numerical-relativity comparison. The CSV
//! text goes straight to the core (`encounter::nr::parse_csv`, `encounter::nr::compare`); the
//! figure is built by `chiwave_plot::figures_encounter::nr_comparison`. No physics here.

use crate::{input_error, to_js};
use chiwave_core::encounter::nr::{self, NrComparison};
use chiwave_core::units::AngleUnit;
use chiwave_plot::{figures_encounter, Rendered};
use serde::Serialize;
use wasm_bindgen::prelude::*;

#[derive(Serialize)]
struct NrPage {
    rows: Vec<NrComparison>,
    figure: Rendered,
}

/// Compares user-supplied NR rows (CSV text: `E/M, J/M², ν, χ, σχ` per line, optional header,
/// `#` comments) with every PM order, the exact test body and the strong-field estimate.
/// `angle_unit` is `"rad"`, `"deg"`, … for the figure's axis (empty: radians).
/// Returns `{rows: [NrComparison], figure: {svg, frame, series}}`.
///
/// # Errors
/// A JS `Error` naming the field (`csv` with the line number, `E/M`, `J/M²`, `nu`, `sigma_chi`
/// with the row number, or `angle_unit`).
#[wasm_bindgen]
pub fn encounter_nr(csv: &str, angle_unit: &str) -> Result<JsValue, js_sys::Error> {
    let unit = if angle_unit.is_empty() { AngleUnit::Rad } else { AngleUnit::parse("angle_unit", angle_unit).map_err(|e| input_error(&e))? };
    let rows = nr::parse_csv(csv).and_then(|r| nr::compare(&r)).map_err(|e| input_error(&e))?;
    let fig = figures_encounter::nr_comparison(&rows, unit);
    let figure = chiwave_plot::render_for_page(&fig).map_err(|e| crate::js_error("plot", "figure", &e.to_string()))?;
    to_js(&NrPage { rows, figure })
}
