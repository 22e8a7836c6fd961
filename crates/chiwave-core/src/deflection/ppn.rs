//! Parametrized post-Newtonian (PPN) deflection (Will 2014, Living Rev. Relativ. 17, 4,
//! arXiv:1403.7377; at finite elongation Lambert & Le Poncin-Lafitte 2009, arXiv:0903.1615).
//!
//! α_PPN = [(1 + γ)/2]·4M/b for source and observer at infinity (Will 2014, Living Rev. Rel.
//! 17, 4, arXiv:1403.7377); for an observer at finite distance seeing the ray at elongation φ
//! from the lens, α = (1 + γ)(M/b)(1 + cos φ) (Lambert & Le Poncin-Lafitte 2009,
//! arXiv:0903.1615, as written there). GR has γ = 1.

use serde::Serialize;

/// PPN numbers beside the exact GR result.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Ppn {
    /// The PPN parameter γ used.
    pub gamma: f64,
    /// [(1 + γ)/2]·4M/b, radians.
    pub alpha_1pm: f64,
    /// The GR value 4M/b, radians.
    pub alpha_1pm_gr: f64,
    /// The elongation φ in degrees, when given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub elongation_deg: Option<f64>,
    /// (1 + γ)(M/b)(1 + cos φ), radians, when an elongation is given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub alpha_elongation: Option<f64>,
}

/// The 1PM PPN deflection [(1 + γ)/2]·4M/b (b in units of M).
///
/// # Examples
/// ```
/// use chiwave_core::deflection::ppn::alpha_1pm;
/// // Jupiter limb, IAU 2015 B3 nominal GM = 1.2668653e17 m³/s², R = 7.1492e7 m (Prša et al. 2016,
/// // arXiv:1605.09788): 4GM/(c²R) = 7.88663205425717e-8 rad (evaluated by hand).
/// let m = 1.266_865_3e17 / 299_792_458f64.powi(2);
/// assert!((alpha_1pm(7.149_2e7 / m, 1.0) / 7.886_632_054_257_17e-8 - 1.0).abs() < 1e-13);
/// ```
pub fn alpha_1pm(b: f64, gamma: f64) -> f64 {
    0.5 * (1.0 + gamma) * 4.0 / b
}

/// Finite-elongation form (1 + γ)(M/b)(1 + cos φ) (Lambert & Le Poncin-Lafitte 2009,
/// arXiv:0903.1615). At φ = 180° it vanishes (the ray reaching the observer from behind); as
/// φ → 0 it tends to the 1PM value for a source at infinity behind the lens.
pub fn alpha_elongation(b: f64, gamma: f64, elongation_deg: f64) -> f64 {
    (1.0 + gamma) / b * (1.0 + elongation_deg.to_radians().cos())
}

pub(crate) fn evaluate(b: f64, gamma: f64, elongation_deg: Option<f64>) -> Ppn {
    Ppn {
        gamma,
        alpha_1pm: alpha_1pm(b, gamma),
        alpha_1pm_gr: 4.0 / b,
        elongation_deg,
        alpha_elongation: elongation_deg.map(|e| alpha_elongation(b, gamma, e)),
    }
}
