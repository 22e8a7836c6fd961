//! Figure dispatch: request + figure name → one core plot-data call → one chiwave-plot builder.

use crate::input_error;
use chiwave_core::request::Request;
use chiwave_core::units::AngleUnit;
use chiwave_plot::{Figure, Rendered};
use serde::Deserialize;

/// Drawing options sent by the page.
#[derive(Debug, Clone, Default, Deserialize)]
#[serde(default, deny_unknown_fields)]
pub struct Options {
    pub angle_unit: Option<String>,
    pub width: Option<u32>,
    pub height: Option<u32>,
}

impl Options {
    #[allow(dead_code)]
    fn angle(&self) -> Result<AngleUnit, js_sys::Error> {
        match &self.angle_unit {
            None => Ok(AngleUnit::Rad),
            Some(s) => AngleUnit::parse("angle_unit", s).map_err(|e| input_error(&e)),
        }
    }
}

/// Figure names per request kind.
pub fn names(kind: &str) -> &'static [&'static str] {
    match kind {
        _ => &[],
    }
}

fn unknown(kind: &str, name: &str) -> js_sys::Error {
    let allowed = names(kind).join(", ");
    crate::js_error("request", "figure", &format!("figure: no figure '{name}' for kind '{kind}'; available: {allowed}"))
}

fn finish(mut fig: Figure, opts: &Options) -> Result<Rendered, js_sys::Error> {
    if let Some(w) = opts.width {
        fig.width = w.clamp(320, 2400);
    }
    if let Some(h) = opts.height {
        fig.height = h.clamp(240, 1800);
    }
    chiwave_plot::render_for_page(&fig).map_err(|e| crate::js_error("plot", "figure", &e.to_string()))
}

pub fn figure(req: &Request, name: &str, opts: &Options) -> Result<Rendered, js_sys::Error> {
    match req {
        Request::Light(_) => Err(unknown("light", name)),
        Request::Lens(_) => Err(unknown("lens", name)),
    }
    .and_then(|fig: Figure| finish(fig, opts))
}
