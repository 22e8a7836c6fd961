//! Deflection of light and other massless waves by a mass (Schwarzschild, Kerr equatorial,
//! Reissner–Nordström), weak-field series, strong-deflection limit, PPN.
//!
//! Conventions (deflection sheet §0): G = c = 1, lengths in units of the lens mass M; α is the
//! total deflection in radians, positive toward the lens, α = Δφ − π. Capture is a result.

use crate::error::InputError;
use crate::units::Quantity;
use serde::{Deserialize, Serialize};

fn default_ppn_gamma() -> f64 {
    1.0
}
fn default_orders() -> usize {
    8
}

/// Light-deflection request, as the page and `chiwave light` send it.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LightRequest {
    /// Lens mass with a unit (e.g. `"1Msun"`); absent or bare number means geometric (M = 1).
    #[serde(default)]
    pub mass: Option<Quantity>,
    /// Impact parameter: bare number = units of M, or a length with a unit (needs a physical mass).
    pub b: Quantity,
    /// Signed spin a/M, + = prograde, |a| ≤ M.
    #[serde(default)]
    pub spin: f64,
    /// Charge Q/M (geometrised Gaussian), |Q| ≤ M.
    #[serde(default)]
    pub charge: f64,
    /// PPN γ: scales the first-order series term by (1 + γ)/2; the exact α stays GR.
    #[serde(default = "default_ppn_gamma")]
    pub ppn_gamma: f64,
    /// Number of weak-field series orders (1..=N).
    #[serde(default = "default_orders")]
    pub orders: usize,
}

/// Light-deflection result (JSON keys are the CLI contract).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LightResult {
    pub alpha: Option<f64>,
    pub captured: bool,
    pub critical_b: f64,
    pub closest_approach: Option<f64>,
}

impl LightRequest {
    /// Evaluates the request.
    ///
    /// # Errors
    /// Validation errors naming the field and its allowed range.
    pub fn evaluate(&self) -> Result<LightResult, InputError> {
        Err(InputError::NoConvergence { what: "deflection is being built".into() })
    }
}
