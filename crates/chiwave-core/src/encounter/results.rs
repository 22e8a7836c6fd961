//! The encounter results (JSON keys are the stable CLI contract; fields serialise in the order
//! written here).

use super::{eob, impulse};
use crate::two_body::Kinematics;
use crate::validity::{Best, ErrorEstimate, Estimates, Flag};
use serde::Serialize;
use crate::references::{CitationMap, SourceMap};

/// The cumulative PM angles (radians). JSON keys `1pm`, `2pm`, `3pm_conservative`, `3pm`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PmAngles {
    #[serde(rename = "1pm")]
    pub pm1: f64,
    #[serde(rename = "2pm")]
    pub pm2: f64,
    #[serde(rename = "3pm_conservative")]
    pub pm3_conservative: f64,
    /// 3PM with radiation reaction (the physical 3PM value).
    #[serde(rename = "3pm")]
    pub pm3: f64,
}

impl PmAngles {
    pub(crate) fn from(a: [f64; 4]) -> Self {
        PmAngles { pm1: a[0], pm2: a[1], pm3_conservative: a[2], pm3: a[3] }
    }
}

/// j-expansion coefficients of χ/2 = Σ χ_n/jⁿ ([`super::pm`]).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PmCoefficients {
    pub chi1: f64,
    pub chi2: f64,
    pub chi3_conservative: f64,
    pub chi3_radiation_reaction: f64,
    pub chi3: f64,
}

/// One row of the order-by-order table.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OrderRow {
    pub order: &'static str,
    /// This order's contribution to χ (radians).
    pub term: f64,
    /// χ summed through this row.
    pub cumulative: f64,
    /// term / (the most complete value).
    pub share_of_total: f64,
    /// term / (cumulative before this row); null for the first row.
    pub relative_change: Option<f64>,
    /// The error estimate of `cumulative` against the two-body angle, and its verdict (JSON
    /// keys `error_estimate`, `error_method`, `error_reason`, `verdict`).
    #[serde(flatten)]
    pub estimate: ErrorEstimate,
}

/// The order-by-order table of the cumulative series with terms `terms`.
pub(crate) fn order_rows(labels: &[&'static str], terms: &[f64]) -> Vec<OrderRow> {
    let total: f64 = terms.iter().sum();
    let mut cum = 0.0;
    labels
        .iter()
        .zip(terms)
        .enumerate()
        .map(|(i, (l, t))| {
            let prev = cum;
            cum += t;
            OrderRow {
                order: l,
                term: *t,
                cumulative: cum,
                share_of_total: if total != 0.0 { t / total } else { 0.0 },
                relative_change: if i == 0 || prev == 0.0 { None } else { Some(t / prev) },
                estimate: ErrorEstimate::none("not estimated", "", crate::validity::DEFAULT_TOLERANCE),
            }
        })
        .collect()
}

/// Test-body PM series term (ν → 0, same γ and j).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct TestBodyTerm {
    pub order: usize,
    /// χ_n^Schw of χ/2 = Σ χ_n/jⁿ (generated in code, [`super::testbody::pm_coefficient`]).
    pub coefficient: f64,
    /// 2 Σ_{k≤n} χ_k^Schw/j^k (radians).
    pub cumulative: f64,
}

/// SI values of a gravitational encounter with physical masses.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GravityPhysical {
    pub m1_kg: f64,
    pub m2_kg: f64,
    pub m_total_msun: f64,
    /// G M/c² in m.
    pub gm_over_c2_m: f64,
    pub b_m: f64,
    pub b_au: f64,
    pub v_km_s: f64,
    /// J in kg m² s⁻¹.
    pub j_si: f64,
    pub e_rad_j: f64,
    /// E_rad in units of M☉ c².
    pub e_rad_msun_c2: f64,
    pub j_rad_si: f64,
    /// Transverse impulse of body 1 (CM, through O(G³)), kg m s⁻¹.
    pub impulse_transverse_kg_m_s: f64,
    /// Gravitational Sommerfeld parameter G m1 m2/(ħ c v); classical if ≫ 1.
    pub sommerfeld: f64,
    /// Reduced Compton wavelength of the lighter body over b, ħ/(m c b); classical if ≪ 1.
    pub compton_over_b: f64,
}

/// Result of a gravitational encounter (JSON keys are the CLI contract).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GravityResult {
    /// `"gravity"`.
    pub force: &'static str,
    /// The recommended angle (key `chi.3pm`, `chi.2pm`, `chi.1pm`, `chi_test_body` or
    /// `chi_estimate`) with its error estimate, or null with the reason.
    pub best: Best,
    /// The relative tolerance the verdicts were judged against.
    pub tolerance: f64,
    pub gamma: f64,
    pub nu: f64,
    pub j: f64,
    pub b_over_gm: f64,
    /// Cumulative PM angles, radians, > 0 for attraction.
    pub chi: PmAngles,
    /// 2 arctan(GM/(b v²)).
    pub chi_newtonian: f64,
    /// Exact Schwarzschild test-body angle at the same γ and j; null if captured.
    pub chi_test_body: Option<f64>,
    pub test_body_captured: bool,
    /// Test-body periapsis in GM/c² (null if captured).
    pub test_body_r_min: Option<f64>,
    /// Test-body capture threshold j_c at this γ (capture for j ≤ j_c).
    pub j_critical_test_body: f64,
    /// The same threshold as b/(GM) of this encounter, b_c = j_c h/p∞.
    pub b_critical_test_body: f64,
    /// Strong-field estimate (null if captured or unavailable, see `flags`).
    pub chi_estimate: Option<f64>,
    /// Capture predicted by the strong-field estimate.
    pub captured: bool,
    /// The estimate's own output, when available.
    pub estimate: Option<eob::Estimate>,
    /// The strong-field estimate's own capture threshold j_c (null if it predicts none).
    pub j_critical_estimate: Option<f64>,
    /// E_rad/(M c²), CM frame, O(G³).
    pub e_rad: f64,
    /// J_rad/J at O(G²).
    pub j_rad: f64,
    /// Radiated 3-momentum in the CM frame along body 1's incoming direction, units M c (O(G³)).
    pub p_rad_cm: f64,
    /// Δp₁ through O(G³) including radiation, units of M c.
    pub impulse: impulse::Frames,
    /// Δp₁ through O(G³), conservative only.
    pub impulse_conservative: impulse::Frames,
    pub covariant: impulse::CovariantSplit,
    pub coefficients: PmCoefficients,
    pub test_body_pm: Vec<TestBodyTerm>,
    pub kinematics: Kinematics,
    pub orders: Vec<OrderRow>,
    /// Error estimates of `chi_newtonian`, `chi_test_body`, `chi_estimate`, `e_rad`, `j_rad`.
    pub estimates: Estimates,
    pub flags: Vec<Flag>,
    /// Output key → citation (a human string).
    pub sources: SourceMap,
    /// Output key → the same citations as registry ids with their place ([`crate::references`]).
    pub citations: CitationMap,
    pub physical: Option<GravityPhysical>,
    pub notice: &'static str,
}

/// The cumulative PL angles (radians). JSON keys `1pl`, `2pl`, `3pl_conservative`, `3pl`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PlAngles {
    #[serde(rename = "1pl")]
    pub pl1: f64,
    #[serde(rename = "2pl")]
    pub pl2: f64,
    /// Test-charge conservative e₃ only (two-body ν part not included).
    #[serde(rename = "3pl_conservative")]
    pub pl3_conservative: f64,
    /// With the radiation-reaction δχ_rr.
    #[serde(rename = "3pl")]
    pub pl3: f64,
}

/// Coefficients of χ/2 = Σ e_n κⁿ and the radiation-reaction angle.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PlCoefficients {
    pub e1: f64,
    pub e2: f64,
    pub e3_test: f64,
    pub delta_chi_rr: f64,
}

/// SI values of an electromagnetic encounter with physical masses.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmPhysical {
    pub m1_kg: f64,
    pub m2_kg: f64,
    pub q1_c: f64,
    pub q2_c: f64,
    pub b_m: f64,
    pub v_km_s: f64,
    pub e_rad_j: f64,
    pub e_rad_dipole_j: f64,
    /// Sommerfeld parameter |q1 q2|/(4π ε0 ħ v); classical if ≫ 1.
    pub sommerfeld: f64,
    /// ħ/(m c b) for the lighter body; classical if ≪ 1.
    pub compton_over_b: f64,
}

/// Result of an electromagnetic encounter (Gaussian units, c = 1).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmResult {
    /// `"em"`.
    pub force: &'static str,
    /// The recommended angle (key `chi.3pl`, `chi.2pl`, `chi.1pl` or `chi_test_exact`) with its
    /// error estimate, or null with the reason.
    pub best: Best,
    /// The relative tolerance the verdicts were judged against.
    pub tolerance: f64,
    /// `"Gaussian, c = 1"`.
    pub units: &'static str,
    pub gamma: f64,
    pub nu: f64,
    /// κ = q1 q2/(J c), < 0 for attraction.
    pub kappa: f64,
    pub b_over_gm: f64,
    pub chi: PlAngles,
    /// Exact Darwin test-charge angle at the same γ and κ; null on fall to the centre.
    pub chi_test_exact: Option<f64>,
    pub fall_to_centre: bool,
    /// Leading-order E_rad/(M c²) of body 1 as a test charge in the field of body 2 (rest frame 2).
    pub e_rad: f64,
    /// Two-body non-relativistic dipole E_rad/(M c²).
    pub e_rad_dipole: f64,
    /// Mechanical J_rad/J at O(e⁴).
    pub j_rad: f64,
    /// Conservative Δp₁ (transverse through O(e⁶) incl. δχ_rr; longitudinal from on-shell), M c.
    pub impulse: impulse::Frames,
    pub covariant: impulse::Covariant,
    pub coefficients: PlCoefficients,
    pub kinematics: Kinematics,
    pub orders: Vec<OrderRow>,
    /// Error estimates of `chi_test_exact`, `e_rad`, `e_rad_dipole`, `j_rad`.
    pub estimates: Estimates,
    pub flags: Vec<Flag>,
    /// Output key → citation (a human string).
    pub sources: SourceMap,
    /// Output key → the same citations as registry ids with their place ([`crate::references`]).
    pub citations: CitationMap,
    pub physical: Option<EmPhysical>,
    pub notice: &'static str,
}

/// Result of any encounter, serialised without a tag (`force` says which).
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(untagged)]
pub enum EncounterResult {
    Gravity(Box<GravityResult>),
    Em(Box<EmResult>),
}
