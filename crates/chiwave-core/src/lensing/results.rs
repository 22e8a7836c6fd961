//! The point-lens result (JSON keys are the stable CLI contract; fields serialise in the order
//! written here).

use crate::validity::{Best, Estimates, Flag};
use serde::Serialize;
use crate::references::{CitationMap, SourceMap};

/// One lensed image.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Image {
    /// Position in units of θ_E, signed (positive on the source's side).
    pub position: f64,
    /// Signed magnification (negative for the saddle image).
    pub magnification: f64,
}

/// A complex number as JSON `{"re": …, "im": …}`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ComplexValue {
    pub re: f64,
    pub im: f64,
}

impl From<num_complex::Complex64> for ComplexValue {
    fn from(z: num_complex::Complex64) -> Self {
        ComplexValue { re: z.re, im: z.im }
    }
}

/// Point-lens result. The keys `einstein_radius_rad`, `images`, `total_magnification`,
/// `time_delay_s`, `w` and `amplification` are the stable CLI contract.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LensResult {
    /// The recommended value: |F| (exact wave optics) when a frequency is given, else the
    /// ray-optics total magnification, with its error estimate.
    pub best: Best,
    /// The relative tolerance the verdicts were judged against.
    pub tolerance: f64,
    /// θ_E in radians.
    pub einstein_radius_rad: f64,
    /// θ_E in milliarcseconds.
    pub einstein_radius_mas: f64,
    /// R_E = θ_E D_L in au.
    pub einstein_radius_au: f64,
    /// R_E in metres.
    pub einstein_radius_m: f64,
    /// The images: first the minimum (x₊ > 0, μ₊ > 0), then the saddle (x₋ < 0, μ₋ < 0).
    pub images: Vec<Image>,
    /// |μ₊| + |μ₋|.
    pub total_magnification: f64,
    /// Arrival-time difference (saddle − minimum) in seconds, observer frame.
    pub time_delay_s: f64,
    /// The same in units of 4 G M_Lz / c³ (ΔT).
    pub time_delay_dimensionless: f64,
    /// Echo of the offset u = β/θ_E.
    pub offset: f64,
    /// Lens mass in nominal solar masses.
    pub mass_msun: f64,
    /// Redshifted mass (1 + z_L) M in nominal solar masses.
    pub redshifted_mass_msun: f64,
    /// Frequency in Hz, when given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub frequency_hz: Option<f64>,
    /// Dimensionless frequency w = 8π G M_Lz f / c³, when a frequency is given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub w: Option<f64>,
    /// Amplification factor F(w, y) (exact, or its geometric limit: see `amplification_method`).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification: Option<ComplexValue>,
    /// |F|.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_abs: Option<f64>,
    /// arg F in radians.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_phase_rad: Option<f64>,
    /// Geometric-optics F_geo = √|μ₊| − i√|μ₋| e^{iwΔT}.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_geometric: Option<ComplexValue>,
    /// `"series"`, `"continuation"`, `"asymptotic"` (all exact) or `"geometric_optics"`.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_method: Option<&'static str>,
    /// Error estimates of the magnification and amplification values, keyed by their JSON key.
    pub estimates: Estimates,
    /// Regime flags.
    pub flags: Vec<Flag>,
    /// Output key → source of its formula (a human string).
    pub sources: SourceMap,
    /// Output key → the same citations as registry ids with their place ([`crate::references`]).
    pub citations: CitationMap,
}
