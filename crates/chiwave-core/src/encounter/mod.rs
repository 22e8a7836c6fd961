//! Two-body encounters: scattering angle, impulse, radiated energy and angular momentum, for
//! gravity (post-Minkowskian, PM) and electromagnetism (post-Lorentzian, PL).
//!
//! # What is computed
//! * Gravity ([`Force::Gravity`], [`gravity()`]): the CM scattering angle χ at 1PM, 2PM, 3PM
//!   conservative (Bern et al. 2019) and 3PM with radiation reaction (Damour 2020) as cumulative
//!   partial sums of χ/2 = Σ χ_n/jⁿ ([`pm`]); the Newtonian hyperbola; the exact test-body
//!   (ν → 0) angle by Schwarzschild geodesic quadrature with its capture threshold, and
//!   test-body PM coefficients to 12th order generated in code ([`testbody`]); the impulse of
//!   body 1 through O(G³) ([`impulse`]); E_rad at O(G³), the CM recoil and J_rad at O(G²)
//!   ([`radiated`]); the strong-field estimate ([`eob`]); a comparison table for
//!   numerical-relativity angles ([`nr`]); χ over a range of b or j for plots ([`chi_sweep`]).
//! * Electromagnetism ([`Force::Em`], [`electromagnetic()`], formulas in [`pl`]): χ at 1PL, 2PL,
//!   3PL (test-charge conservative + radiation reaction), the exact Darwin test-charge angle,
//!   E_rad at leading order.
//!
//! # Files
//! [`request`] (the serde request and its validation through the two-body model),
//! [`results`] (the result types: JSON keys are the CLI contract), `flags.rs` (regime checks),
//! `sources.rs` (the source of every output key), `gravity.rs` and `electromagnetic.rs` (the
//! evaluations), [`sweep`] (χ sweeps); the formulas in [`pm`], [`pl`], [`testbody`],
//! [`radiated`], [`impulse`], [`eob`].
//!
//! # Conventions
//! c = 1, G explicit then set to 1; M = m1 + m2; all angles in radians, χ > 0 for attraction;
//! lengths in GM/c², momenta in M c, energies in M c², angular momenta in G M²/c.
//! γ = u1·u2, p∞ = √(γ²−1), ν = m1 m2/M², h = E/M = √(1 + 2ν(γ−1)), p = ν M p∞/h, J = p b,
//! j = J/(G m1 m2) = p∞ b/(GMh) (Damour 2016, arXiv:1609.00354). b is b_J, orthogonal to the
//! incoming momenta (not the eikonal b_e = b_J/cos(χ/2), which differs from O(G³) on).
//! Impulse: transverse along b̂ (from body 2 to body 1; attraction negative), longitudinal along
//! body 1's incoming momentum. Electromagnetism is in **Gaussian units, c = 1**.
//! Capture is a result, never an error.

// `!(x > 0.0)` is deliberate throughout: unlike `x <= 0.0` it also rejects NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

pub mod accuracy;
pub mod capture;
mod electromagnetic;
pub mod eob;
mod flags;
mod gravity;
pub mod impulse;
pub mod nr;
pub mod pl;
pub mod pm;
pub mod radiated;
pub mod request;
pub mod results;
mod sources;
pub mod sweep;
pub mod testbody;

pub use crate::two_body::kinematics;
pub use crate::two_body::CHARGE_MAX;
pub use electromagnetic::electromagnetic;
pub use gravity::gravity;
#[allow(deprecated)]
pub use request::Setup;
pub use request::{EncounterRequest, Force};
pub use results::{
    EmPhysical, EmResult, EncounterResult, GravityPhysical, GravityResult, OrderRow, PlAngles, PlCoefficients, PmAngles,
    PmCoefficients, TestBodyTerm,
};
#[allow(deprecated)]
pub use sweep::Sweep;
pub use sweep::{chi_sweep, ChiSweep, SweepPoint, SweepVar, SWEEP_MAX_POINTS};
