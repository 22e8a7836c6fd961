//! Strong-field estimate of the two-body scattering angle: the post-Minkowskian (PM) angle
//! coefficients resummed into an effective-one-body (EOB) radial potential in the energy gauge,
//! and the angle of that radial problem integrated exactly.
//!
//! Method: Damour 2018, arXiv:1710.10599 (energy-gauge EOB mass shell, the w-potential and its
//! map to the angle coefficients); Damour & Rettegno 2023, arXiv:2211.01399 (PM information in
//! w-potentials compared with numerical-relativity scattering, radiation-reacted potentials);
//! conventions of [`crate::two_body::kinematics`]. Equation numbers of the papers are not
//! confirmed here; the map below was re-derived (see [`w_from_chi`]) and tested.
//!
//! # Variables (fixed by Damour 2018)
//! * γ = u1·u2 > 1 is also the effective energy per unit reduced mass, Ê_eff = γ, because the
//!   EOB energy map E = M h with h = √(1 + 2ν(γ − 1)) is exact (Damour 2016, arXiv:1609.00354).
//! * p∞ = √(γ² − 1): effective momentum at infinity per unit reduced mass μ = ν M.
//! * j = J/(G m1 m2) = J/(G M μ): the effective angular momentum equals the real one.
//! * r = R/(G M): effective (energy-gauge, isotropic-like) radius; u = 1/r. It is **not** a
//!   coordinate-invariant separation of the two bodies: r_min and the orbit are those of the
//!   effective radial problem.
//! * Effective mass shell (energy gauge, Damour 2018):
//!   p_r² = p∞² + w(u) − j² u²,  w(u) = Σ_{n≥1} w_n(γ, ν) uⁿ,
//!   with p_r the effective radial momentum per unit μ. The angle of the relative orbit is
//!   dφ/dr = j/(r² p_r), so χ = −π + 2 j ∫_0^{u0} du/√(p∞² + w(u) − j²u²), u0 = 1/r_min.
//!   ν enters only through the supplied χ_n (e.g. χ_2 ∝ 1/h); the map w ↔ χ depends on p∞ only.
//!
//! # Which χ_3 to pass
//! Pass the **radiation-reacted total** χ_3 = χ_3^cons + χ_3^rad (Bern et al. 2019 with the
//! radiation reaction of Damour 2020, arXiv:2010.01641; [`super::pm`]).
//! Damour & Rettegno 2023 (arXiv:2211.01399) compare w potentials built from PM angles with
//! numerical-relativity scattering and report the best agreement for the radiation-reacted
//! information (their abstract; they also extract a radiation-reacted potential from NR); we
//! follow them and map the radiation-reacted angle. (Only that summary was consulted here; their
//! equations are not transcribed.) Besides, with the conservative χ_3 alone w_3 turns negative
//! at high energy (w_3 < 0 for γ > 2.317 at ν = 1/4 and γ > 4.041 at ν = 0.1, mpmath 1.3 root of
//! w_3(γ) with the formulas of [`super::pm`]; because χ_3^cons ~ −8γ³ ln 2γ, Damour 2020),
//! which gives the truncated potential an unphysical repulsive core; with the total χ_3, w_3 > 0
//! throughout (tested on a grid in `tests/eob.rs`).
//!
//! # Capture (our definition, documented choice)
//! Let R(u) = p∞² + w(u) − j²u² on u > 0 (R(0) = p∞² > 0). The model predicts **capture** when
//! the incoming body meets no turning point in the region where the model describes an
//! attractive barrier, precisely when either
//! 1. R has no positive root (p_r² > 0 all the way in), or
//! 2. the first local minimum of R (the top of the effective barrier j²u² − w) comes before the
//!    first root: the body passes over the barrier, whatever the truncated polynomial does
//!    further in, or
//! 3. the first root lies at or beyond u_w, the first positive maximum of w(u): inside r_w = 1/u_w
//!    the truncated potential turns repulsive, an artefact of truncation (this happens only when
//!    some w_n < 0, e.g. for a conservative-only χ_3 at high energy); such a "bounce" is not
//!    accepted as scattering. This third rule is ours, not from the papers.
//!
//! Otherwise the body scatters off the outermost turning point u0 (the first root). For the
//! physical case w_n > 0 (total χ_3) only rule 1 is active; by Descartes' rule of signs R then
//! has 0 or 2 positive roots, and the critical j is the double-root condition R = R' = 0, i.e.
//! the unstable circular orbit of the effective problem at zero radial energy. As j decreases to
//! j_crit the two roots merge and the angle grows without bound (logarithmically).
//!
//! This is an **estimate**: the potential is a truncated PM series, resummed only in the sense
//! that the angle integral is not expanded. At large j it reproduces the supplied PM series up to
//! O(1/j^(n+1)) (tested); near capture it differs from the PM series, which has no meaning there.
//!
//! # Files
//! `map.rs` (χ_n ↔ w_n and the validated potential), `radial.rs` (the radicand's shape, the angle
//! quadrature and the critical j), `orbit.rs` (r(φ)); this file holds the types, the flags and
//! the entry points.

mod map;
mod orbit;
mod radial;

pub use map::{chi_from_w, potential, w_from_chi};
pub use orbit::orbit;

use crate::error::InputError;
use crate::validity::{Check, Flag, Level};
use radial::{critical, no_conv, shape, u_w, validate_j};
use serde::Serialize;

/// The regime checks of this file: stable key and the label shown with it.
const EOB_ESTIMATE: Check = Check::new("eob_estimate", "resummed estimate");
const EOB_NEAR_CAPTURE: Check = Check::new("eob_near_capture", "estimate near capture j/j_c");
const EOB_LOW_VELOCITY: Check = Check::new("eob_low_velocity", "estimate at low velocity p∞");

/// Largest number of angle coefficients χ_1 … χ_n accepted.
pub const MAX_COEFFICIENTS: usize = 8;

/// Smallest radius (units of GM) to which a captured orbit is followed.
pub const CAPTURE_STOP_RADIUS: f64 = 2.0;

/// Relative tolerance of the angle quadrature (agreement of two rules of different order).
pub(super) const REL_ANGLE: f64 = 1e-12;

/// Below this gap (u1 − u0)/u0 between the turning point and the next root of R the
/// near-capture (logarithmic) substitution is used.
pub(super) const NEAR_CAPTURE_GAP: f64 = 0.25;

/// Result of the strong-field estimate.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(tag = "status", rename_all = "lowercase")]
pub enum Estimate {
    /// The body scatters. `chi` is the total CM scattering angle in radians (> 0 for net
    /// attraction); `r_min` the turning point of the effective radial problem in units of GM.
    Scattered { chi: f64, r_min: f64 },
    /// The model predicts capture; `j_critical` is its own critical j (capture for j < j_critical).
    Captured { j_critical: f64 },
}

/// Relative orbit of the effective radial problem, in units of GM and radians.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EobOrbit {
    /// Effective radius r = R/(GM) of each point.
    pub r: Vec<f64>,
    /// Polar angle φ, 0 at r = ∞ on the incoming leg; φ = π/2 + χ/2 at periapsis.
    pub phi: Vec<f64>,
    /// True when the model predicts capture (the orbit then spirals in to r ≈ 2).
    pub captured: bool,
}

/// The energy-gauge radial potential w(u) = Σ w_n uⁿ together with p∞.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Potential {
    /// p∞ = √(γ² − 1).
    pub p_inf: f64,
    /// w[k] = w_{k+1}.
    pub w: Vec<f64>,
}

/// Estimate together with its inputs to the regime flags.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Details {
    pub estimate: Estimate,
    pub potential: Potential,
    /// The model's critical j (None when the model predicts no capture at any j).
    pub j_critical: Option<f64>,
    pub flags: Vec<Flag>,
}

// ------------------------------------------------------------------------------------------
// Public entry points
// ------------------------------------------------------------------------------------------

/// Strong-field estimate of the scattering angle from the PM coefficients, resummed in an
/// energy-gauge EOB radial potential and integrated exactly.
///
/// # Formula
/// w_n from χ_n by [`w_from_chi`]; then
/// χ = −π + 2j ∫_0^{u0} du/√(p∞² + w(u) − j²u²) (Damour 2018, arXiv:1710.10599). Numerically, with u = u0 sin θ the angle is written without cancellation as
/// χ/2 = ∫_0^{π/2} D/(√(1−D)(1+√(1−D))) dθ, D = [w(u0) − w(u)]/[(u0−u) j² (u0+u)], by
/// Gauss–Legendre rules of increasing size until two agree to 1e-12. Near capture (the next
/// root u1 of the radicand within 0.25 u0) the radicand is factored as (u0−u)(u1−u)P(u) and,
/// on u ∈ [u0/2, u0], u = u0 − (u1−u0) sinh²t removes the logarithmic near-singularity
/// (composite rule in t); the outer part u ∈ [0, u0/2] is integrated directly in u.
///
/// # Domain
/// gamma > 1, 0 < nu ≤ 1/4, j > 0, chi = [χ_1, χ_2, χ_3, …] (3 to 8 coefficients of χ/2 in 1/j,
/// [`super::pm`]), finite, χ_1 > 0. Pass the radiation-reacted total χ_3 (module docs).
/// Limits: j → ∞ reproduces the PM series Σ 2χ_n/jⁿ up to O(1/j^(n+1)); j ↓ j_crit gives
/// χ → ∞ (logarithmically); j < j_crit is capture. The module docs define capture.
///
/// # Errors
/// Invalid input names the field; `NoConvergence` if the quadrature does not converge.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::eob::{estimate, Estimate};
/// // test body at γ = 1.5 with χ_1 … χ_3 of Schwarzschild (Damour 2018, arXiv:1710.10599), j = 2000:
/// // the exact angle and the PM series differ by O(1/j⁴), here ~1e-8 relative
/// let g = 1.5_f64; let p = (g * g - 1.0).sqrt();
/// let chi = [(2.0 * g * g - 1.0) / p, 3.0 * std::f64::consts::PI / 8.0 * (5.0 * g * g - 1.0),
///            (64.0 * p.powi(6) + 72.0 * p.powi(4) + 12.0 * p * p - 1.0) / (3.0 * p.powi(3))];
/// let j = 2000.0;
/// let pm = 2.0 * (chi[0] / j + chi[1] / (j * j) + chi[2] / (j * j * j));
/// match estimate(g, 1e-9, j, &chi).unwrap() {
///     Estimate::Scattered { chi: x, .. } => assert!((x - pm).abs() < 1e-7 * pm),
///     _ => panic!("should scatter"),
/// }
/// ```
pub fn estimate(gamma: f64, nu: f64, j: f64, chi: &[f64]) -> Result<Estimate, InputError> {
    let pot = potential(gamma, nu, chi)?;
    validate_j(j)?;
    estimate_potential(&pot, j)
}

/// [`estimate`] for a potential given directly.
///
/// # Errors
/// As [`estimate`]; `j` must be > 0.
pub fn estimate_potential(pot: &Potential, j: f64) -> Result<Estimate, InputError> {
    validate_j(j)?;
    let uw = u_w(pot);
    let sh = shape(pot, j, uw)?;
    if sh.captured {
        let jc = critical(pot, uw, Some(j))?.ok_or_else(|| no_conv("critical j"))?;
        return Ok(Estimate::Captured { j_critical: jc });
    }
    let chi = radial::angle(pot, &sh, j)?;
    let u0 = sh.u0.ok_or_else(|| no_conv("EOB turning point"))?;
    if !chi.is_finite() {
        return Err(no_conv("EOB angle is not finite"));
    }
    Ok(Estimate::Scattered { chi, r_min: 1.0 / u0 })
}

/// The model's critical angular momentum: capture for j < j_crit.
///
/// # Formula
/// For w_n > 0 the double-root condition R = R' = 0 of R(u) = p∞² + w(u) − j²u²:
/// p∞² + w(u_c) − u_c w'(u_c)/2 = 0 (smallest positive root with R''(u_c) > 0),
/// j_crit² = w'(u_c)/(2u_c). With a repulsive core (module docs, rule 3) the boundary can instead
/// be where the turning point reaches u_w; every candidate is verified on the capture predicate,
/// with a bisection fallback.
///
/// # Errors
/// As [`estimate`]; `Inconsistent` (field `chi`) if the model predicts no capture at any j.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::eob::critical_j;
/// // test body at γ = 1.5 with χ_1 … χ_3 of Schwarzschild (Damour 2018, arXiv:1710.10599)
/// let g = 1.5_f64; let p = (g * g - 1.0).sqrt();
/// let chi = [(2.0 * g * g - 1.0) / p, 3.0 * std::f64::consts::PI / 8.0 * (5.0 * g * g - 1.0),
///            (64.0 * p.powi(6) + 72.0 * p.powi(4) + 12.0 * p * p - 1.0) / (3.0 * p.powi(3))];
/// let jc = critical_j(g, 1e-9, &chi).unwrap();
/// // w = 7u + 15.375u² + 19.75u³ (w_3 = 9γ² − 1/2): double root solved independently below
/// let (w1, w2, w3) = (7.0, 15.375, 19.75);
/// // G(u) = p² + w1 u/2 − w3 u³/2 = 0 by bisection
/// let (mut a, mut b) = (0.0_f64, 10.0_f64);
/// for _ in 0..200 { let m = 0.5 * (a + b);
///     if p * p + w1 * m / 2.0 - w3 * m.powi(3) / 2.0 > 0.0 { a = m } else { b = m } }
/// let j2 = (w1 + 2.0 * w2 * a + 3.0 * w3 * a * a) / (2.0 * a);
/// assert!((jc - j2.sqrt()).abs() < 1e-12 * jc);
/// ```
pub fn critical_j(gamma: f64, nu: f64, chi: &[f64]) -> Result<f64, InputError> {
    let pot = potential(gamma, nu, chi)?;
    let uw = u_w(&pot);
    critical(&pot, uw, None)?.ok_or_else(|| InputError::Inconsistent {
        field: "chi",
        reason: "the potential built from these coefficients predicts no capture at any j".into(),
    })
}

/// [`estimate`] with the potential, the critical j and regime flags.
///
/// Flags: `eob_estimate` (always Caution: resummed estimate from truncated PM information),
/// `eob_near_capture` (value j/j_crit; Caution below 1.5 or when captured),
/// `eob_low_velocity` (value p∞; Caution below 1e-3, where w_3 loses digits by cancellation).
///
/// # Errors
/// As [`estimate`].
///
/// # Examples
/// ```
/// use chiwave_core::encounter::eob::details;
/// let g = 1.5_f64; let p = (g * g - 1.0).sqrt();
/// let chi = [(2.0 * g * g - 1.0) / p, 3.0 * std::f64::consts::PI / 8.0 * (5.0 * g * g - 1.0),
///            (64.0 * p.powi(6) + 72.0 * p.powi(4) + 12.0 * p * p - 1.0) / (3.0 * p.powi(3))];
/// let d = details(g, 1e-9, 5.0, &chi).unwrap();
/// assert!(d.j_critical.unwrap() > 5.0); // captured
/// ```
pub fn details(gamma: f64, nu: f64, j: f64, chi: &[f64]) -> Result<Details, InputError> {
    let pot = potential(gamma, nu, chi)?;
    validate_j(j)?;
    let est = estimate_potential(&pot, j)?;
    let jc = match est {
        Estimate::Captured { j_critical } => Some(j_critical),
        Estimate::Scattered { .. } => critical(&pot, u_w(&pot), None)?,
    };
    let mut flags = vec![Flag::new(
        EOB_ESTIMATE,
        Level::Caution,
        None,
        "Strong-field estimate: PM angle coefficients resummed into an effective-one-body radial potential (Damour 2018; Damour & Rettegno 2023); not an exact result.",
    )];
    match (est, jc) {
        (Estimate::Captured { .. }, Some(c)) => flags.push(Flag::new(
            EOB_NEAR_CAPTURE,
            Level::Caution,
            Some(j / c),
            "The model predicts capture (j below its critical j); no scattering angle.",
        )),
        (Estimate::Scattered { .. }, Some(c)) if j < 1.5 * c => flags.push(Flag::new(
            EOB_NEAR_CAPTURE,
            Level::Caution,
            Some(j / c),
            "Strong field: close to the model's capture threshold; the angle depends logarithmically on j − j_crit and on the truncation of the potential.",
        )),
        (_, Some(c)) => flags.push(Flag::new(EOB_NEAR_CAPTURE, Level::Ok, Some(j / c), "Far from capture.")),
        (_, None) => {}
    }
    if pot.p_inf < 1e-3 {
        flags.push(Flag::new(
            EOB_LOW_VELOCITY,
            Level::Caution,
            Some(pot.p_inf),
            "Low velocity: reconstructing w_3 from χ_3 cancels terms of order p∞^-3; digits are lost.",
        ));
    }
    Ok(Details { estimate: est, potential: pot, j_critical: jc, flags })
}
