//! Post-Minkowskian scattering-angle coefficients of χ/2 = Σ χ_n / jⁿ (conventions:
//! docs/physics/encounter.md §1–§2).
//!
//! Conventions: χ is the total CM scattering angle, positive for attraction; this module expands
//! **χ/2** (some papers expand χ itself): χ ≈ 2χ₁/j + 2χ₂/j² + 2χ₃/j³. Units G = c = 1, M = m1 + m2.
//! The 3PM value is given both conservative and with radiation reaction; only the sum is
//! physical at high energy (Damour 2020, arXiv:2010.01641).

use super::kinematics::RelativeSpeed;
use std::f64::consts::PI;

/// 1PM coefficient χ₁ = (2γ² − 1)/p∞ (independent of ν).
///
/// Source: Portilla 1980; Westpfahl 1985; Damour 2016, arXiv:1609.00354 (its ν → 0 limit is
/// checked against the test-body quadrature in tests/encounter.rs).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{kinematics::RelativeSpeed, pm};
/// let b = RelativeSpeed::from_gamma(1.5).unwrap();
/// // (2·2.25 − 1)/√1.25 = 3.5/1.118034 = 3.130495
/// assert!((pm::chi1(&b) - 3.5 / 1.25f64.sqrt()).abs() < 1e-15);
/// ```
pub fn chi1(b: &RelativeSpeed) -> f64 {
    (2.0 * b.gamma * b.gamma - 1.0) / b.p_inf
}

/// 2PM coefficient χ₂ = (3π/8)(5γ² − 1)/h; no radiation reaction at this order.
///
/// Source: Westpfahl 1985, Fortsch. Phys. 33, 417; Bini & Damour 2017, arXiv:1706.06877;
/// Damour 2018, arXiv:1710.10599.
pub fn chi2(b: &RelativeSpeed, h: f64) -> f64 {
    3.0 * PI / 8.0 * (5.0 * b.gamma * b.gamma - 1.0) / h
}

/// Test-body (Schwarzschild) 3PM coefficient χ₃^Schw = (64p⁶ + 72p⁴ + 12p² − 1)/(3p³), p = p∞.
///
/// Source: the ν → 0 limit of Bern et al. 2019 (arXiv:1901.04424); Damour 2018, arXiv:1710.10599.
/// Checked against the exact test-body quadrature (tests/encounter.rs).
pub fn chi3_schw(b: &RelativeSpeed) -> f64 {
    let p2 = b.p_inf * b.p_inf;
    (((64.0 * p2 + 72.0) * p2 + 12.0) * p2 - 1.0) / (3.0 * p2 * b.p_inf)
}

/// Damour's mass-polynomial 3PM function
/// C̄(γ) = (2/3)γ(14γ² + 25) + 4(4γ⁴ − 12γ² − 3)/p∞ · arcsinh(√((γ − 1)/2)).
///
/// Source: Bern, Cheung, Roiban, Shen, Solon, Zeng 2019, arXiv:1901.04424 and 1908.01493, in the
/// form of Antonelli et al. 2019, arXiv:1901.07102 and Damour 2019, arXiv:1912.02139. Limit γ → 1: C̄ → 4 + 18p² + (91/10)p⁴ (the 26 and −22 cancel to 4;
/// the cancellation costs only a factor ≈ 6 in rounding, so no series is needed).
pub fn cbar(b: &RelativeSpeed) -> f64 {
    let g = b.gamma;
    let g2 = g * g;
    2.0 / 3.0 * g * (14.0 * g2 + 25.0) + 4.0 * ((4.0 * g2 - 12.0) * g2 - 3.0) / b.p_inf * (0.5 * b.gamma_m1).sqrt().asinh()
}

/// Conservative 3PM coefficient χ₃^cons = χ₃^Schw − (2ν p∞/h²) C̄(γ).
///
/// Source: Bern et al. 2019 (arXiv:1901.04424, 1908.01493) in the mass-polynomial form of
/// Damour 2019, arXiv:1912.02139. h²χ₃ is linear in ν.
/// High energy: χ₃^cons/γ³ → −8 ln(2γ) (diverges; Damour 2020, arXiv:2010.01641),
/// never use it alone there.
pub fn chi3_conservative(b: &RelativeSpeed, nu: f64, h: f64) -> f64 {
    chi3_schw(b) - 2.0 * nu * b.p_inf / (h * h) * cbar(b)
}

/// Radiation-reaction part of the 3PM coefficient χ₃^rad = ν (2γ² − 1)² I(v)/h².
///
/// Source: Damour 2020, arXiv:2010.01641; Di Vecchia, Heissenberg, Russo, Veneziano 2020/21,
/// arXiv:2008.12743 and 2101.05772 (it cancels the high-energy log; derivation by linear
/// response: docs/physics/encounter.md §2).
/// I(v) is [`super::radiated::i_function`].
pub fn chi3_radiation_reaction(b: &RelativeSpeed, nu: f64, h: f64) -> f64 {
    let s = 2.0 * b.gamma * b.gamma - 1.0;
    nu * s * s * super::radiated::i_of_speed(b) / (h * h)
}

/// The three j-expansion coefficients [χ₁, χ₂, χ₃^cons, χ₃^rad] at (γ, ν).
pub fn coefficients(b: &RelativeSpeed, nu: f64) -> [f64; 4] {
    let h = (1.0 + 2.0 * nu * b.gamma_m1).sqrt();
    [chi1(b), chi2(b, h), chi3_conservative(b, nu, h), chi3_radiation_reaction(b, nu, h)]
}

/// Cumulative PM angles χ (not χ/2) at reduced angular momentum j:
/// [1PM, 2PM, 3PM conservative, 3PM with radiation reaction].
pub fn cumulative_angles(c: &[f64; 4], j: f64) -> [f64; 4] {
    let x = 1.0 / j;
    let a1 = 2.0 * c[0] * x;
    let a2 = a1 + 2.0 * c[1] * x * x;
    let a3c = a2 + 2.0 * c[2] * x * x * x;
    let a3 = a3c + 2.0 * c[3] * x * x * x;
    [a1, a2, a3c, a3]
}

/// Newtonian hyperbola, χ = 2 arctan(GM/(b v²)) (b in units of GM/c², v = relative speed).
///
/// Source: the Kepler hyperbola (Landau & Lifshitz, *Mechanics*, §19). Expands as χ₁ → 1/p, χ₃ → −1/(3p³).
pub fn chi_newtonian(b_over_gm: f64, v: f64) -> f64 {
    2.0 * (1.0 / (b_over_gm * v * v)).atan()
}

/// The 1PM scattering angle at impact parameter b, χ = 2χ₁/j = 2(2γ² − 1) h/(b (γ² − 1))
/// (b in units of GM/c², h = E/M; with j = p∞ b/h).
///
/// Source: Portilla 1980; Westpfahl 1985; Damour 2016, arXiv:1609.00354 (as [`chi1`]). Used as
/// the size of the leading-order deflection by the waveform's `weak_deflection` flag.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{kinematics::RelativeSpeed, pm};
/// let s = RelativeSpeed::from_gamma(1.5).unwrap();
/// let (h, b) = (1.0, 100.0); // test body: h = 1, so j = p∞ b
/// assert!((pm::chi_1pm_at_b(1.5, h, b) - 2.0 * pm::chi1(&s) / (s.p_inf * b)).abs() < 1e-16);
/// ```
pub fn chi_1pm_at_b(gamma: f64, h: f64, b_over_gm: f64) -> f64 {
    2.0 * (2.0 * gamma * gamma - 1.0) * h / (b_over_gm * (gamma * gamma - 1.0))
}
