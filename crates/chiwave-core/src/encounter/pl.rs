//! Electromagnetic analogue of the post-Minkowskian series, order by order in the coupling
//! (post-Lorentzian, PL): scattering of two charges, **Gaussian units with c = 1** throughout
//! (Coulomb force q1 q2/r², Larmor power (2/3) q² a²).
//!
//! Sources: Darwin 1913 (Phil. Mag. 25, 201) and Landau & Lifshitz, *Classical Theory of
//! Fields*, §39 Problem 1 for the exact test-charge angle, whose expansion gives e₁, e₂^test and
//! e₃^test; Saketh, Vines, Steinhoff & Buonanno 2021 (arXiv:2109.05994) and Bern et al. 2023
//! (arXiv:2305.08981) for the two-body e₂; Jackson 1999 (*Classical Electrodynamics*, 3rd ed.,
//! §14.2) for the radiated powers; the radiation-reaction angle by the linear-response formula
//! of Damour 2020 (arXiv:2010.01641) applied to the Abraham–Lorentz–Dirac angular-momentum loss.
//!
//! Charges are carried in geometric Gaussian units q̃ = q/(√G M) (M = m1 + m2), so that with
//! lengths in GM/c² and momenta in M c the coupling is κ = q1 q2/J = q̃1 q̃2/(p̃ b̃) (negative for
//! attraction). SI input is converted at the edge ([`crate::units::parse_charge`]):
//! q1 q2 → q1 q2/(4π ε0). Gravity is not included in this force law.
//! χ/2 = Σ e_n κⁿ; χ > 0 for attraction, < 0 for like charges.

use super::kinematics::RelativeSpeed;
use std::f64::consts::PI;

/// e₁ = −γ/p∞: the first term of the expansion of Darwin's exact angle ([`darwin`]) in κ.
pub fn e1(b: &RelativeSpeed) -> f64 {
    -b.gamma / b.p_inf
}

/// e₂ = π/(4h) (Saketh, Vines, Steinhoff, Buonanno 2021, arXiv:2109.05994; Bern et al. 2023,
/// arXiv:2305.08981). The test-charge value π/4 is the second term of Darwin's angle; the 1/h
/// follows because the O(e⁴) impulse is the sum of the two probe limits (∝ 1/m1 + 1/m2:
/// Maxwell theory has no photon self-coupling).
pub fn e2(h: f64) -> f64 {
    PI / (4.0 * h)
}

/// Conservative test-charge e₃^test = −γ(2γ² − 3)/(3p∞³): the third term of Darwin's angle.
/// The two-body ν-dependent part (h²e₃ = e₃^test + νX(γ), arXiv:2109.05994, 2305.08981) is
/// **not included**.
pub fn e3_test(b: &RelativeSpeed) -> f64 {
    -b.gamma * (2.0 * b.gamma * b.gamma - 3.0) / (3.0 * b.p_inf.powi(3))
}

/// Radiation-reaction correction to χ at O(e⁶):
/// δχ_rr = (4/3) γ² (q1 q2)² (q1² m2² + q2² m1²)/(E² J³) (always > 0).
///
/// Source: the linear-response formula δχ = −½ (∂χ/∂J) J_rad (Damour 2020, arXiv:2010.01641)
/// with the leading PL angle χ ≈ 2e₁ q1 q2/J and the O(e⁴) loss [`j_rad`] (our derivation; no
/// independent radiation-reaction orbit integration checks it in this repository yet).
pub fn delta_chi_rr(b: &RelativeSpeed, q1: f64, q2: f64, m1: f64, m2: f64, e: f64, j_total: f64) -> f64 {
    let qq = q1 * q2;
    4.0 / 3.0 * b.gamma * b.gamma * qq * qq * (q1 * q1 * m2 * m2 + q2 * q2 * m1 * m1) / (e * e * j_total.powi(3))
}

/// Mechanical angular momentum radiated at O(e⁴),
/// J_rad = −(4/3) q1 q2 γ m1 m2 (q1²/m1² + q2²/m2²)/(E b); sign of −q1 q2. Our derivation: the
/// Abraham–Lorentz–Dirac torque of each body integrates to −(2/3) q_a² u_a × Δu_a along its
/// straight line (Jackson 1999, ch. 16, for the radiation-reaction force), with the LO velocity
/// changes.
pub fn j_rad(b: &RelativeSpeed, q1: f64, q2: f64, m1: f64, m2: f64, e: f64, b_len: f64) -> f64 {
    -4.0 / 3.0 * q1 * q2 * b.gamma * m1 * m2 * (q1 * q1 / (m1 * m1) + q2 * q2 / (m2 * m2)) / (e * b_len)
}

/// Outcome of the exact test-charge (Darwin) computation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Darwin {
    Scattered { chi: f64 },
    /// Attraction with |κ| ≥ 1: the charge spirals into the centre (no angle).
    FallToCentre,
}

/// Exact relativistic test-charge (Darwin 1913) scattering angle at (γ, κ = q1 q2/J).
///
/// # Formula
/// For κ² < 1, with w = √(1 − κ²): χ = (2/w) atan2(p∞ w, γκ) − π, an algebraically equivalent
/// form of χ = (2/w)[π/2 − arcsin x] − π, x = (γ/p∞)κ/√(1 + κ²/p∞²) (Darwin 1913; Landau &
/// Lifshitz, Classical Theory of Fields §39 Problem 1; since arccos x = atan2(p∞ w, γκ)). For
/// repulsion with κ > 1, w' = √(κ² − 1): χ = (2/w') artanh(p∞ w'/(γκ)) − π, equal to the cosh
/// branch (2/w') arccosh(γκ/√(κ² + p∞²)) − π of the same solution. Both forms are regular at
/// |κ| = 1 for repulsion.
///
/// # Domain
/// Any validated boost, finite κ. Attraction with κ ≤ −1: [`Darwin::FallToCentre`].
/// κ → 0: χ → 2e₁κ (Rutherford at v ≪ 1: tan(|χ|/2) = |q1q2|/(μ v² b)).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{kinematics::RelativeSpeed, pl::{darwin, Darwin}};
/// let b = RelativeSpeed::from_gamma(1.5).unwrap();
/// // mpmath 1.3, dps 40, raw orbit quadrature (tests/reference/encounter_mpmath.py): 0.9887771189500707
/// let Darwin::Scattered { chi } = darwin(&b, -0.3) else { panic!("expected scattering") };
/// assert!((chi - 0.9887771189500707).abs() < 1e-14);
/// ```
pub fn darwin(b: &RelativeSpeed, kappa: f64) -> Darwin {
    let (g, p) = (b.gamma, b.p_inf);
    let k2 = kappa * kappa;
    if kappa <= -1.0 {
        return Darwin::FallToCentre;
    }
    let dphi = if k2 < 1.0 {
        let w = ((1.0 - kappa) * (1.0 + kappa)).sqrt();
        if kappa > 0.0 {
            let z = p * w / (g * kappa);
            2.0 * atan_over(z) * p / (g * kappa)
        } else {
            2.0 * (p * w).atan2(g * kappa) / w
        }
    } else {
        let w = ((kappa - 1.0) * (kappa + 1.0)).sqrt();
        let z = p * w / (g * kappa);
        2.0 * atanh_over(z) * p / (g * kappa)
    };
    Darwin::Scattered { chi: dphi - PI }
}

/// atan(z)/z, regular at 0.
fn atan_over(z: f64) -> f64 {
    if z.abs() < 1e-5 {
        1.0 - z * z / 3.0 + z.powi(4) / 5.0
    } else {
        z.atan() / z
    }
}

/// artanh(z)/z, regular at 0 (|z| < 1).
fn atanh_over(z: f64) -> f64 {
    if z.abs() < 1e-5 {
        1.0 + z * z / 3.0 + z.powi(4) / 5.0
    } else {
        z.atanh() / z
    }
}

/// Leading-order radiated energy of a test charge (q1, m1) passing a fixed charge q2, rest frame
/// of body 2: E_rad = π q1⁴ q2² (3γ² + 1)/(12 m1² v b³): the time integral of the Liénard power
/// (Jackson 1999, §14.2) along the straight line with the first-order acceleration.
pub fn e_rad_test(b: &RelativeSpeed, q1: f64, q2: f64, m1: f64, b_len: f64) -> f64 {
    PI * q1.powi(4) * q2 * q2 * (3.0 * b.gamma * b.gamma + 1.0) / (12.0 * m1 * m1 * b.v * b_len.powi(3))
}

/// Two-body non-relativistic electric-dipole radiated energy,
/// E_rad = π q1² q2² (q1/m1 − q2/m2)²/(3 v b³): the Larmor power (Jackson 1999, §14.2) of the
/// dipole q1 r1 + q2 r2 integrated along the straight lines. Valid for v ≪ 1; vanishes for
/// equal q/m.
pub fn e_rad_dipole(b: &RelativeSpeed, q1: f64, q2: f64, m1: f64, m2: f64, b_len: f64) -> f64 {
    let d = q1 / m1 - q2 / m2;
    PI * q1 * q1 * q2 * q2 * d * d / (3.0 * b.v * b_len.powi(3))
}
