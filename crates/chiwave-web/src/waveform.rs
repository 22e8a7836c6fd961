//! The waveform view's progressive sky work: a handle on the core's
//! [`chiwave_core::waveform::WaveformJob`] (energy balance, sky map, dE/dω over the sphere) that
//! the page advances for a few milliseconds per animation frame, and the two figures drawn from
//! its partial state. No physics here: the sums are the core's, the figures the plot crate's.

use crate::{input_error, js_error, to_js};
use chiwave_core::request::Request;
use chiwave_core::waveform::{self, SkyQuantity};
use chiwave_plot::figures_waveform::{self, Projection, SkyKind};
use chiwave_core::waveform::grids::{self, SKY_N_PHI, SKY_N_THETA};
use chiwave_plot::scene;
use wasm_bindgen::prelude::*;

/// Progressive sky integrals of one gravitational waveform request.
#[wasm_bindgen]
pub struct WaveformJob {
    inner: waveform::WaveformJob,
}

#[wasm_bindgen]
impl WaveformJob {
    /// Starts the sky work for a waveform request: `map` is `"energy"` (dE/dΩ) or `"memory"`
    /// (|DΔh|).
    ///
    /// # Errors
    /// A JS `Error` naming the field: the request's own fields (`force` for em) or `map`.
    #[wasm_bindgen(constructor)]
    pub fn new(request: JsValue, map: &str) -> Result<WaveformJob, js_sys::Error> {
        let req = match crate::read_request(request)? {
            Request::Waveform(r) => r,
            _ => return Err(js_error("request", "kind", "kind: WaveformJob needs a request of kind 'waveform'")),
        };
        let quantity = match map {
            "energy" => SkyQuantity::EnergyPerSolidAngle,
            "memory" => SkyQuantity::Memory,
            other => {
                return Err(js_error("input", "map", &format!("map: unknown sky quantity '{other}'; use energy or memory")))
            }
        };
        let sys = req.gravity_system().map_err(|e| input_error(&e))?.binary;
        let omega = grids::spectrum_omegas(&sys).map_err(|e| input_error(&e))?;
        let inner = waveform::WaveformJob::new(&req, quantity, SKY_N_THETA, SKY_N_PHI, &omega)
            .map_err(|e| input_error(&e))?;
        Ok(WaveformJob { inner })
    }

    /// Works for about `budget_ms` milliseconds (one direction at a time, so a step
    /// overruns by at most one direction) and returns the snapshot
    /// (`chiwave_core::waveform::WaveformSnapshot` as a JS object).
    ///
    /// # Errors
    /// A JS `Error` from a direction (not expected).
    pub fn step(&mut self, budget_ms: f64) -> Result<JsValue, js_sys::Error> {
        let t0 = js_sys::Date::now();
        let budget = if budget_ms.is_finite() { budget_ms.clamp(0.0, 1000.0) } else { 8.0 };
        let mut snap = self.inner.snapshot();
        while !snap.done {
            snap = self.inner.step(1).map_err(|e| input_error(&e))?;
            if js_sys::Date::now() - t0 >= budget {
                break;
            }
        }
        to_js(&snap)
    }

    /// The snapshot without more work.
    ///
    /// # Errors
    /// Only if the snapshot cannot be converted (not expected).
    pub fn snapshot(&self) -> Result<JsValue, js_sys::Error> {
        to_js(&self.inner.snapshot())
    }

    /// True when every phase is done.
    pub fn done(&self) -> bool {
        self.inner.phase() == waveform::WaveformPhase::Done
    }

    /// The sky map as far as it is computed (cells not yet done are blank), rendered in
    /// `projection` (`"cylindrical"` or `"equal_area"`; a change of projection needs no new job)
    /// as `{svg, frame, series, heat}`.
    ///
    /// # Errors
    /// A JS `Error` naming `projection`, or with `kind = "plot"` for a drawing failure.
    pub fn sky_figure(&self, projection: &str) -> Result<JsValue, js_sys::Error> {
        let projection = Projection::parse("projection", projection).map_err(|e| input_error(&e))?;
        let map = self.inner.sky_map();
        let kind = match self.inner.quantity() {
            SkyQuantity::EnergyPerSolidAngle => SkyKind::Energy,
            SkyQuantity::Memory => SkyKind::Memory,
        };
        let fig = figures_waveform::sky(&figures_waveform::SkyData {
            theta: &map.theta,
            phi: &map.phi,
            values: &map.values,
            kind,
            observer: Some(self.inner.observer()),
            frame: scene::frame_caption(self.inner.frame()),
            projection,
            mc2_j: self.inner.mc2_j(),
        });
        let r = chiwave_plot::render_for_page(&fig).map_err(|e| js_error("plot", "figure", &e.to_string()))?;
        to_js(&r)
    }

    /// The spectrum figure: dE/(dω dΩ) at the observer at once, dE/dω over the sphere when its
    /// phase is done, both ω → 0 limits (`{svg, frame, series}`).
    ///
    /// # Errors
    /// A JS `Error` with `kind = "plot"` for a drawing failure.
    pub fn spectrum_figure(&self) -> Result<JsValue, js_sys::Error> {
        let fig = figures_waveform::spectrum(&self.inner.spectrum());
        let r = chiwave_plot::render_for_page(&fig).map_err(|e| js_error("plot", "figure", &e.to_string()))?;
        to_js(&r)
    }
}
