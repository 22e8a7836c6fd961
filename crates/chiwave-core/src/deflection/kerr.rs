//! Kerr black hole, equatorial light rays: photon orbits, closest approach, exact deflection.
//!
//! Conventions (docs/physics/deflection.md §1): G = c = 1, lengths in units of M; the spin is signed,
//! a_s = a·sign(L_z), with a_s > 0 **prograde** (ray's orbital angular momentum parallel to the
//! spin); |a_s| ≤ M (the extremal value is allowed). E = 1, L = b. Boyer–Lindquist radius.
//! A = a_s/b, ε = M/b.

use super::quadrature::{singularity_distance, theta_integral};
use super::Deflection;
use crate::error::{in_closed, positive, InputError};
use std::f64::consts::PI;

/// Prograde (+) / retrograde (−) circular photon orbit radius in the equatorial plane.
///
/// # Formula
/// r_ph = 2M{1 + cos[(2/3) arccos(−a_s/M)]} (Bardeen, Press & Teukolsky 1972, ApJ 178, 347,
/// equatorial circular photon orbits; the bracketing test in tests/deflection.rs checks it).
///
/// # Domain
/// |a_s| ≤ 1 (not checked here; see [`critical_b`]). a_s = 0 gives 3M, a_s = ±M gives M and 4M.
pub fn photon_orbit_radius(a: f64) -> f64 {
    2.0 * (1.0 + ((2.0 / 3.0) * (-a).clamp(-1.0, 1.0).acos()).cos())
}

/// Critical impact parameter for capture of equatorial rays (units of M).
///
/// # Formula
/// b_c = 3√(M r_ph) − a_s (Bardeen, Press & Teukolsky 1972, ApJ 178, 347), which is
/// 2M (a_s = +M), 3√3 M (a_s = 0) and 7M (a_s = −M).
///
/// # Examples
/// ```
/// use chiwave_core::deflection::kerr::critical_b;
/// // Bardeen, Press & Teukolsky 1972: b_c = 2M and 7M at a_s = ±M (extremal Kerr).
/// assert!((critical_b(1.0) - 2.0).abs() < 1e-12);
/// assert!((critical_b(-1.0) - 7.0).abs() < 1e-12);
/// ```
pub fn critical_b(a: f64) -> f64 {
    3.0 * photon_orbit_radius(a).sqrt() - a
}

/// Outer horizon r_+ = M + √(M² − a²).
pub fn horizon_radius(a: f64) -> f64 {
    1.0 + (1.0 - a * a).max(0.0).sqrt()
}

/// Turning point σ = b/r0 from the depressed cubic x³ − (1 − A²)x + 2ε(1 − A)² = 0 for
/// x = r0/b (R(r0) = 0 of [`deflection`] divided by r0 b³), largest root by the trigonometric
/// form, polished by Newton steps.
fn turning_point(b: f64, a: f64) -> f64 {
    let aa = a / b;
    let eps = 1.0 / b;
    let p = -(1.0 - aa * aa);
    let q = 2.0 * eps * (1.0 - aa) * (1.0 - aa);
    let amp = 2.0 * (-p / 3.0).sqrt();
    let arg = ((3.0 * q / (2.0 * p)) * (-3.0 / p).sqrt()).clamp(-1.0, 1.0);
    let mut x = amp * (arg.acos() / 3.0).cos();
    for _ in 0..3 {
        let f = x * x * x + p * x + q;
        let fp = 3.0 * x * x + p;
        if fp <= 0.0 {
            break;
        }
        let nx = x - f / fp;
        if nx.is_nan() || nx <= 0.0 {
            break;
        }
        x = nx;
    }
    1.0 / x
}

/// Closest approach r0 (Boyer–Lindquist, units of M) of an escaping equatorial ray; `None` if
/// captured (b ≤ b_c) or b is not finite and positive.
pub fn closest_approach(b: f64, a: f64) -> Option<f64> {
    if !(b.is_finite() && b > critical_b(a) && a.abs() <= 1.0) {
        return None;
    }
    Some(b / turning_point(b, a))
}

/// Exact deflection of an equatorial ray in the Kerr metric.
///
/// # Formula
/// dφ/dr = r[L r − 2M(L − a)]/(Δ √R), R = r⁴ + (a² − L²)r² + 2M(L − a)²r, Δ = r² − 2Mr + a²
/// (Carter 1968, Phys. Rev. 174, 1559: the separated equations with zero Carter constant; the
/// θ-form and its factorization are derived in docs/physics/deflection.md §2; the integral reduced to
/// elliptic form by Iyer & Hansen 2009, arXiv:0908.0085, whose closed form is not used here).
/// With s = b/r = s0 sin θ and the exact factorization
/// Π(s0 t) = s0²(1 − t²)[(1 − A²) − 2ε(1 − A)² s0 g(t)], g(t) = (1 + t + t²)/(1 + t):
///
/// α = 2∫₀^{π/2} { [1 − 2ε(1 − A)s0 t] / ([1 − 2ε s0 t + A² s0² t²] √((1 − A²) − 2ε(1 − A)² s0 g)) − 1 } dθ,
///
/// with the "− 1" carried out algebraically inside the integrand so that no digits are lost
/// at large b (docs/physics/deflection.md §2; tests/deflection.rs compares it with an mpmath
/// evaluation, tests/reference/deflection_mpmath.py).
///
/// # Domain
/// b > 0, |a_s| ≤ M. b ≤ b_c(a_s) is captured (a result). a_s = 0 reduces to Schwarzschild.
/// At fixed b, prograde rays (a_s > 0) are deflected less (sign convention: docs/physics/deflection.md §1).
///
/// # Errors
/// `b` not finite or ≤ 0; `spin` outside [−1, 1]; [`InputError::NoConvergence`] if the
/// quadrature rules disagree.
///
/// # Examples
/// ```
/// use chiwave_core::deflection::{kerr, Deflection};
/// // mpmath 1.3, tests/reference/deflection_mpmath.py (BL r-integral): b = 10, a = 0.9
/// let Deflection::Scattered { alpha, .. } = kerr::deflection(10.0, 0.9).unwrap() else { panic!() };
/// assert!((alpha - 0.504_632_984_000_672_4).abs() < 1e-13);
/// ```
pub fn deflection(b: f64, a: f64) -> Result<Deflection, InputError> {
    deflection_with_accuracy(b, a).map(|(d, _)| d)
}

/// [`deflection`] and the relative accuracy of its α: the difference of the two quadrature
/// rules over α (1e-16, one rounding, for the closed weak-field form used at b > 1e30; 0 when
/// captured).
pub(crate) fn deflection_with_accuracy(b: f64, a: f64) -> Result<(Deflection, f64), InputError> {
    positive("b", b)?;
    in_closed("spin", a, -1.0, 1.0)?;
    if b <= critical_b(a) {
        return Ok((Deflection::Captured, 0.0));
    }
    let sigma = turning_point(b, a);
    let r0 = b / sigma;
    if b > 1e30 {
        // Weak-field terms 4ε + (15π/4)ε² − 4εA are exact to f64 here (Sereno & De Luca 2006, astro-ph/0609435, orders ≤ 2).
        let e = 1.0 / b;
        return Ok((Deflection::Scattered { alpha: 4.0 * e + 3.75 * PI * e * e - 4.0 * e * e * a, closest_approach: r0 }, 1e-16));
    }
    let aa = a / b;
    let eps = 1.0 / b;
    let one_m = 1.0 - aa;
    let k = 2.0 * eps * one_m * one_m * sigma;
    let w_at_1 = (1.0 - aa * aa) - 1.5 * k;
    let rho = singularity_distance(w_at_1, -0.75 * k);
    let f = |th: f64| {
        let t = th.sin();
        let g = t + 1.0 / (1.0 + t);
        let st = sigma * t;
        let d1 = st * (2.0 * eps - aa * aa * st);
        let w1 = aa * aa + k * g;
        let sw = (1.0 - w1).sqrt();
        let num = aa * st * (2.0 * eps - aa * st) + (1.0 - d1) * w1 / (1.0 + sw);
        num / ((1.0 - d1) * sw)
    };
    let (integral, diff) = theta_integral(f, rho, 4.0 * eps, "the Kerr deflection")?;
    Ok((Deflection::Scattered { alpha: 2.0 * integral, closest_approach: r0 }, diff / integral.abs().max(f64::MIN_POSITIVE)))
}
