//! Strong-field (EOB-type resummed) estimate of the scattering angle — placeholder API only.
//!
//! This file keeps the fixed cross-module signatures so that the encounter branch compiles; the
//! strong-field helper's implementation replaces it at merge. Every function here returns
//! [`InputError::NoConvergence`] ("strong-field estimate not merged yet"); callers report the
//! estimate as unavailable rather than inventing a number.

use crate::error::InputError;
use serde::Serialize;

/// Outcome of the strong-field estimate.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(tag = "status", rename_all = "lowercase")]
pub enum Estimate {
    Scattered { chi: f64, r_min: f64 },
    Captured { j_critical: f64 },
}

/// Relative orbit of the estimate (units of GM).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EobOrbit {
    pub r: Vec<f64>,
    pub phi: Vec<f64>,
    pub captured: bool,
}

fn not_merged() -> InputError {
    InputError::NoConvergence { what: "strong-field estimate not merged yet".into() }
}

/// Strong-field estimate at (γ, ν, j) from the j-expansion coefficients `chi[k] = χ_{k+1}` of χ/2.
///
/// # Errors
/// Always [`InputError::NoConvergence`] in this placeholder.
pub fn estimate(_gamma: f64, _nu: f64, _j: f64, _chi: &[f64]) -> Result<Estimate, InputError> {
    Err(not_merged())
}

/// Critical j of the estimate (capture below).
///
/// # Errors
/// Always [`InputError::NoConvergence`] in this placeholder.
pub fn critical_j(_gamma: f64, _nu: f64, _chi: &[f64]) -> Result<f64, InputError> {
    Err(not_merged())
}

/// Orbit of the estimate with `n` points.
///
/// # Errors
/// Always [`InputError::NoConvergence`] in this placeholder.
pub fn orbit(_gamma: f64, _nu: f64, _j: f64, _chi: &[f64], _n: usize) -> Result<EobOrbit, InputError> {
    Err(not_merged())
}
