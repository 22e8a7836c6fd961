//! The figure model: a generic [`Figure`] (axes, series, bands, markers, legend) and what a
//! rendering returns to the page ([`PlotFrame`], [`Rendered`]). Colours: [`crate::colour`].

use crate::heatmap;
use serde::{Deserialize, Serialize};

/// An RGB colour.
pub type Rgb = [u8; 3];

/// chiwave's named colours (the Okabe & Ito 2008 series palette and the neutrals): see
/// [`crate::colour`].
pub use crate::colour::palette;

/// How a line is stroked.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum Dash {
    #[default]
    Solid,
    Dashed,
    Dotted,
    /// Dash, dot, dash, dot.
    #[serde(rename = "dash_dot")]
    DashDot,
    /// Long dashes.
    #[serde(rename = "long_dash")]
    LongDash,
    /// Dash, dot, dot.
    #[serde(rename = "dash_dot_dot")]
    DashDotDot,
}

/// Line style of a series.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Style {
    pub color: Rgb,
    pub width: u32,
    pub dash: Dash,
    /// Fill the closed polygon with this colour and opacity (0..1) instead of only stroking.
    pub fill: Option<(Rgb, f64)>,
}

impl Style {
    pub fn line(color: Rgb, width: u32) -> Self {
        Style { color, width, dash: Dash::Solid, fill: None }
    }
    pub fn dashed(color: Rgb, width: u32) -> Self {
        Style { color, width, dash: Dash::Dashed, fill: None }
    }
    pub fn dotted(color: Rgb, width: u32) -> Self {
        Style { color, width, dash: Dash::Dotted, fill: None }
    }
}

/// A line series: `None` points break the line (a gap).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Series {
    /// Legend text; an empty label keeps the series out of the legend and the hover readout.
    pub label: String,
    pub points: Vec<Option<(f64, f64)>>,
    pub style: Style,
}

/// A shaded band over an x-interval (for example the capture region b ≤ b_c).
/// Infinite ends reach the edge of the plot.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Band {
    pub label: String,
    pub x0: f64,
    pub x1: f64,
    pub color: Rgb,
    pub opacity: f64,
}

/// A vertical error bar at `x` from `lo` to `hi` around `y`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct ErrorBar {
    pub x: f64,
    pub y: f64,
    pub lo: f64,
    pub hi: f64,
}

/// A set of markers (with optional error bars) sharing a legend entry.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Markers {
    pub label: String,
    pub points: Vec<(f64, f64)>,
    pub error_bars: Vec<ErrorBar>,
    pub color: Rgb,
    pub radius: u32,
}

/// One axis: label with unit, scale, optional fixed range (data units).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Axis {
    /// Label including the unit, e.g. `"impact parameter b [M]"`.
    pub label: String,
    pub log: bool,
    pub range: Option<(f64, f64)>,
}

impl Axis {
    pub fn linear(label: impl Into<String>) -> Self {
        Axis { label: label.into(), log: false, range: None }
    }
    pub fn log(label: impl Into<String>) -> Self {
        Axis { label: label.into(), log: true, range: None }
    }
}

/// The builder's preferred corner for the legend. The drawing routine keeps it when the
/// legend covers no data there; otherwise it takes another empty corner, or puts the legend
/// outside the plot (see [`crate::render`]). `None` draws no legend.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum LegendAt {
    #[default]
    TopRight,
    TopLeft,
    BottomLeft,
    BottomRight,
    None,
}

/// A complete figure description.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct Figure {
    pub title: String,
    pub x: Axis,
    pub y: Axis,
    pub series: Vec<Series>,
    pub bands: Vec<Band>,
    pub markers: Vec<Markers>,
    pub legend: LegendAt,
    /// Same data length per pixel on both axes (linear axes only), e.g. for ray pictures.
    pub equal_aspect: bool,
    pub width: u32,
    pub height: u32,
    /// A heat-map layer under the series (sky maps), with its colour bar in the title row.
    #[serde(default)]
    pub heat: Option<heatmap::Heat>,
}

impl Figure {
    /// An empty figure of the default size (760 × 460 px).
    pub fn new(title: impl Into<String>, x: Axis, y: Axis) -> Self {
        Figure {
            title: title.into(),
            x,
            y,
            series: Vec::new(),
            bands: Vec::new(),
            markers: Vec::new(),
            legend: LegendAt::TopRight,
            equal_aspect: false,
            width: 760,
            height: 460,
            heat: None,
        }
    }
}

/// The plot area in SVG pixels and the data ranges it shows, for pixel → data inversion.
///
/// For a log axis, pixel position is linear in log10(value) between log10(min) and log10(max).
/// Pixel y grows downward: `top` is the pixel row of `y_max`, `top + height` that of `y_min`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct PlotFrame {
    pub left: f64,
    pub top: f64,
    pub width: f64,
    pub height: f64,
    pub x_min: f64,
    pub x_max: f64,
    pub y_min: f64,
    pub y_max: f64,
    pub x_log: bool,
    pub y_log: bool,
    pub svg_width: u32,
    pub svg_height: u32,
}

impl PlotFrame {
    fn axis(v: f64, log: bool) -> f64 {
        if log {
            v.log10()
        } else {
            v
        }
    }
    fn unaxis(v: f64, log: bool) -> f64 {
        if log {
            10f64.powf(v)
        } else {
            v
        }
    }
    /// Data → pixel.
    pub fn to_pixel(&self, x: f64, y: f64) -> (f64, f64) {
        let (x0, x1) = (Self::axis(self.x_min, self.x_log), Self::axis(self.x_max, self.x_log));
        let (y0, y1) = (Self::axis(self.y_min, self.y_log), Self::axis(self.y_max, self.y_log));
        let px = self.left + (Self::axis(x, self.x_log) - x0) / (x1 - x0) * self.width;
        let py = self.top + (y1 - Self::axis(y, self.y_log)) / (y1 - y0) * self.height;
        (px, py)
    }
    /// Pixel → data.
    pub fn to_data(&self, px: f64, py: f64) -> (f64, f64) {
        let (x0, x1) = (Self::axis(self.x_min, self.x_log), Self::axis(self.x_max, self.x_log));
        let (y0, y1) = (Self::axis(self.y_min, self.y_log), Self::axis(self.y_max, self.y_log));
        let ax = x0 + (px - self.left) / self.width * (x1 - x0);
        let ay = y1 - (py - self.top) / self.height * (y1 - y0);
        (Self::unaxis(ax, self.x_log), Self::unaxis(ay, self.y_log))
    }
}

/// A series as the page's hover readout needs it (labelled series only).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct HoverSeries {
    pub label: String,
    pub color: String,
    pub x: Vec<Option<f64>>,
    pub y: Vec<Option<f64>>,
}

/// Everything the page needs for one figure.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Rendered {
    pub title: String,
    pub x_label: String,
    pub y_label: String,
    pub svg: String,
    pub frame: PlotFrame,
    pub series: Vec<HoverSeries>,
    /// The heat-map layer's cells, for a hover readout of the value under the pointer.
    pub heat: Option<heatmap::Heat>,
}

/// Drawing failed (kept for callers; the SVG writer itself cannot fail).
#[derive(Debug, Clone, PartialEq)]
pub struct PlotError(pub String);

impl std::fmt::Display for PlotError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        write!(f, "figure: {}", self.0)
    }
}
impl std::error::Error for PlotError {}

/// `#rrggbb` for a colour.
pub fn hex(c: Rgb) -> String {
    format!("#{:02x}{:02x}{:02x}", c[0], c[1], c[2])
}
