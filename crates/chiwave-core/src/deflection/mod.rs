//! Deflection of light and other massless waves by a mass (Schwarzschild, Kerr equatorial,
//! Reissner–Nordström), weak-field series, strong-deflection limit, PPN.
//!
//! Conventions (docs/physics/deflection.md §1): G = c = 1, lengths in units of the lens mass M; α is the
//! total deflection in radians, positive toward the lens, α = Δφ − π, with b = L/p_∞ and r0 the
//! areal (Boyer–Lindquist) radius of closest approach. Kerr spin is signed, a_s > 0 prograde.
//! Capture (b ≤ b_c) is a result, reported with `alpha = None`, never NaN.
//!
//! Sources, by piece (every function names its own):
//! * exact Schwarzschild α: Darwin 1959, Proc. R. Soc. A 249, 180 — [`schwarzschild`];
//! * Kerr equatorial: Carter-equation θ-form (Carter 1968, Phys. Rev. 174, 1559;
//!   docs/physics/deflection.md §2), photon orbits Bardeen, Press &
//!   Teukolsky 1972, ApJ 178, 347 — [`kerr`];
//! * Reissner–Nordström: Chandrasekhar 1983, *The Mathematical Theory of Black Holes*, ch. 5;
//!   θ-form in docs/physics/deflection.md §2 — [`reissner_nordstrom`];
//! * weak-field series: Keeton & Petters 2005, gr-qc/0511019 (orders 1–4), generated in code to
//!   order 12 — [`series`];
//! * strong-deflection limit: Bozza 2002, gr-qc/0208075 — [`strong`];
//! * PPN: Will 2014, arXiv:1403.7377; Lambert & Le Poncin-Lafitte 2009, arXiv:0903.1615 — [`ppn`].
//!
//! Files: `request.rs` (the request, its validation and evaluation), `results.rs`, `flags.rs`,
//! `sources.rs`, and one file per metric or method listed above.
//!
//! Entry points: [`LightRequest::evaluate`], [`sweep()`] (α against b for plots, an
//! [`AlphaSweep`]), [`rays`] (ray paths in the lens plane).

pub mod kerr;
pub mod ppn;
mod quadrature;
mod rays;
pub mod reissner_nordstrom;
pub mod schwarzschild;
pub mod series;
pub mod strong;
mod sweep;

pub use rays::{rays, Ray, RayFan};
#[allow(deprecated)]
pub use sweep::Sweep;
pub use sweep::{sweep, AlphaSweep, SweepSeries};

mod accuracy;
mod flags;
mod request;
mod results;
mod sources;

pub use accuracy::{strong_reported, STRONG_DEFLECTION_MAX_CORRECTION};
pub use request::{LightRequest, B_MAX, B_MIN};
pub(crate) use request::check_b;
pub use results::{LightPhysical, LightResult, SeriesTerm};

use crate::error::{in_closed, InputError};
use serde::Serialize;

/// Outcome of one ray: scattered with an angle, or captured.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(tag = "status", rename_all = "lowercase")]
pub enum Deflection {
    /// The ray escapes; `alpha` in radians (positive toward the lens), `closest_approach` = r0/M.
    Scattered { alpha: f64, closest_approach: f64 },
    /// b ≤ b_c: the ray falls into the hole; there is no deflection angle.
    Captured,
}

impl Deflection {
    /// The angle, `None` when captured.
    pub fn alpha(&self) -> Option<f64> {
        match self {
            Deflection::Scattered { alpha, .. } => Some(*alpha),
            Deflection::Captured => None,
        }
    }
    /// r0/M, `None` when captured.
    pub fn closest_approach(&self) -> Option<f64> {
        match self {
            Deflection::Scattered { closest_approach, .. } => Some(*closest_approach),
            Deflection::Captured => None,
        }
    }
}

/// The lens: which metric, with its spin or charge in units of M.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Metric {
    Schwarzschild,
    /// Equatorial rays; signed spin a_s/M in [−1, 1], + prograde.
    Kerr { spin: f64 },
    /// Charge Q/M in [−1, 1] (geometrized Gaussian).
    ReissnerNordstrom { charge: f64 },
}

impl Metric {
    /// Chooses the metric from spin a/M and charge Q/M.
    ///
    /// # Errors
    /// `spin` or `charge` not finite or outside [−1, 1]; both nonzero (Kerr–Newman is not
    /// supported) gives [`InputError::Inconsistent`] naming both fields.
    pub fn new(spin: f64, charge: f64) -> Result<Self, InputError> {
        in_closed("spin", spin, -1.0, 1.0)?;
        in_closed("charge", charge, -1.0, 1.0)?;
        Ok(match (spin != 0.0, charge != 0.0) {
            (false, false) => Metric::Schwarzschild,
            (true, false) => Metric::Kerr { spin },
            (false, true) => Metric::ReissnerNordstrom { charge },
            (true, true) => {
                return Err(InputError::Inconsistent {
                    field: "spin",
                    reason: format!(
                        "spin = {spin} and charge = {charge} are both nonzero: a spinning charged (Kerr–Newman) lens is not supported; set spin = 0 or charge = 0"
                    ),
                })
            }
        })
    }

    /// `"schwarzschild"`, `"kerr"` or `"reissner-nordstrom"`.
    pub fn name(&self) -> &'static str {
        match self {
            Metric::Schwarzschild => "schwarzschild",
            Metric::Kerr { .. } => "kerr",
            Metric::ReissnerNordstrom { .. } => "reissner-nordstrom",
        }
    }

    /// Critical impact parameter b_c/M (capture for b ≤ b_c).
    pub fn critical_b(&self) -> f64 {
        match *self {
            Metric::Schwarzschild => schwarzschild::CRITICAL_B,
            Metric::Kerr { spin } => kerr::critical_b(spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::critical_b(charge),
        }
    }

    /// Radius of the (equatorial) circular photon orbit, units of M.
    pub fn photon_orbit_radius(&self) -> f64 {
        match *self {
            Metric::Schwarzschild => schwarzschild::PHOTON_SPHERE,
            Metric::Kerr { spin } => kerr::photon_orbit_radius(spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::photon_sphere_radius(charge),
        }
    }

    /// Outer horizon radius r_+, units of M.
    pub fn horizon_radius(&self) -> f64 {
        match *self {
            Metric::Schwarzschild => 2.0,
            Metric::Kerr { spin } => kerr::horizon_radius(spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::horizon_radius(charge),
        }
    }

    /// Exact deflection at impact parameter `b` (units of M).
    ///
    /// # Errors
    /// `b` not finite or ≤ 0; quadrature non-convergence.
    pub fn deflection(&self, b: f64) -> Result<Deflection, InputError> {
        match *self {
            Metric::Schwarzschild => schwarzschild::deflection(b),
            Metric::Kerr { spin } => kerr::deflection(b, spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::deflection(b, charge),
        }
    }

    /// Weak-field coefficients c_1 … c_n in powers of M/b (n ≤ [`series::MAX_ORDER`]).
    pub fn series_coefficients(&self, n: usize) -> Vec<f64> {
        match *self {
            Metric::Schwarzschild => series::schwarzschild_coefficients(n),
            Metric::Kerr { spin } => series::kerr_coefficients(spin, n),
            Metric::ReissnerNordstrom { charge } => series::rn_coefficients(charge, n),
        }
    }
}
