//! The light-deflection result (JSON keys are the stable CLI contract; fields serialise in the
//! order written here).

use super::{ppn, strong};
use crate::references::{CitationMap, SourceMap};
use crate::validity::{Best, ErrorEstimate, Estimates, Flag};
use serde::Serialize;

/// One weak-field partial sum.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SeriesTerm {
    /// Highest order n included.
    pub order: usize,
    /// Σ_{k ≤ n} c_k (M/b)^k, radians (first term × (1 + γ)/2).
    pub alpha: f64,
    /// (partial sum − exact α)/exact α; `None` when captured.
    pub rel_error: Option<f64>,
    /// Its error estimate and verdict (JSON keys `error_estimate`, `error_method`,
    /// `error_reason`, `verdict`, beside the keys above).
    #[serde(flatten)]
    pub estimate: ErrorEstimate,
}

/// SI values, present when the mass has a physical unit (JSON key `physical`).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LightPhysical {
    pub mass_kg: f64,
    pub mass_msun: f64,
    /// G M/c², metres.
    pub gm_over_c2_m: f64,
    pub b_m: f64,
    pub b_over_m: f64,
    pub closest_approach_m: Option<f64>,
    pub critical_b_m: f64,
    pub alpha_rad: Option<f64>,
    pub alpha_deg: Option<f64>,
    pub alpha_arcsec: Option<f64>,
    pub alpha_mas: Option<f64>,
    pub alpha_uas: Option<f64>,
    /// PPN [(1 + γ)/2]·4GM/(c²b) in arcsec.
    pub ppn_alpha_1pm_arcsec: f64,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub wavelength_m: Option<f64>,
}

/// Light-deflection result (JSON keys are the CLI contract).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LightResult {
    /// The recommended value: the exact α (or null when captured), with its numerical accuracy.
    pub best: Best,
    /// The relative tolerance the verdicts were judged against.
    pub tolerance: f64,
    /// `"schwarzschild"`, `"kerr"` or `"reissner-nordstrom"`.
    pub metric: &'static str,
    /// Exact deflection, radians, positive toward the lens; `None` when captured.
    pub alpha: Option<f64>,
    pub captured: bool,
    /// b_c/M.
    pub critical_b: f64,
    /// r0/M; `None` when captured.
    pub closest_approach: Option<f64>,
    /// b/M as used (M the lens mass, G = c = 1).
    pub b_over_m: f64,
    /// The former key of `b_over_m` (same value), kept for one release.
    #[serde(rename = "impact_parameter")]
    pub impact_parameter_alias: f64,
    /// Partial sums of the weak-field series, orders 1..=orders.
    pub series: Vec<SeriesTerm>,
    /// Bozza's log limit beside the exact value: Schwarzschild, not captured, and only where the
    /// expansion is meaningful (`deflection::strong_reported`); otherwise null, with the reason
    /// in `estimates["strong_deflection.alpha"].error_reason`.
    pub strong_deflection: Option<strong::StrongDeflection>,
    pub ppn: ppn::Ppn,
    /// α in arcsec, only with a physical mass.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub alpha_arcsec: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub physical: Option<LightPhysical>,
    /// Error estimates of the other approximate values (PPN first-order forms, the
    /// strong-deflection values), keyed by their JSON key.
    pub estimates: Estimates,
    pub flags: Vec<Flag>,
    /// Output key → citation of the formula that produced it (a human string).
    pub sources: SourceMap,
    /// Output key → the same citations as registry ids with their place ([`crate::references`]).
    pub citations: CitationMap,
}
