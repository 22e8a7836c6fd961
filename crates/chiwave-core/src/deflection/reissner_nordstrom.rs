//! Reissner–Nordström black hole: photon sphere, closest approach, exact light deflection.
//!
//! Conventions (docs/physics/deflection.md §1): G = c = 1, lengths in units of M,
//! f(r) = 1 − 2M/r + Q²/r² with Q in geometrized Gaussian units (SI: Q² → G Q²/(4π ε0 c⁴)),
//! |Q| ≤ M (the extremal value is allowed). ε = M/b, q = Q/b. Only Q² enters.
//!
//! Sources: the metric is Reissner 1916 and Nordström 1918; its photon sphere and light deflection
//! as used here agree with Eiroa, Romero & Torres 2002, arXiv:gr-qc/0203049 and Chandrasekhar 1983,
//! *The Mathematical Theory of Black Holes*, ch. 5 (recalled; the tests check each form
//! independently: the quadrature against mpmath, the series against the quadrature).

use super::quadrature::{singularity_distance, theta_integral};
use super::Deflection;
use crate::error::{in_closed, positive, InputError};
use std::f64::consts::PI;

/// Photon-sphere radius r_ph = [3M + √(9M² − 8Q²)]/2 (Chandrasekhar 1983, ch. 5; the
/// double root of the orbit equation's quartic).
pub fn photon_sphere_radius(q: f64) -> f64 {
    0.5 * (3.0 + (9.0 - 8.0 * q * q).max(0.0).sqrt())
}

/// Critical impact parameter b_c = r_ph²/√(r_ph² − 2M r_ph + Q²) (Chandrasekhar 1983, ch. 5).
///
/// # Examples
/// ```
/// use chiwave_core::deflection::reissner_nordstrom::critical_b;
/// // Extremal Q = M: r_ph = 2M, b_c = 4M (Chandrasekhar 1983 formulas, evaluated by hand).
/// assert!((critical_b(1.0) - 4.0).abs() < 1e-14);
/// ```
pub fn critical_b(q: f64) -> f64 {
    let r = photon_sphere_radius(q);
    r * r / (r * r - 2.0 * r + q * q).sqrt()
}

/// Outer horizon r_+ = M + √(M² − Q²).
pub fn horizon_radius(q: f64) -> f64 {
    1.0 + (1.0 - q * q).max(0.0).sqrt()
}

/// Largest root r0 of r⁴ − b²(r² − 2Mr + Q²) = 0 (the turning point, (du/dφ)² = 0), solved for
/// x = r0/b as x⁴ − x² + 2εx − (Qε)² = 0 (scale-free, no overflow for large b) by Newton's
/// method from x = 1, which converges monotonically because the quartic is increasing and
/// convex for x ≥ x0 (r0 ≥ r_ph > b/√6 for b > b_c).
fn turning_point(b: f64, q: f64) -> Result<f64, InputError> {
    let eps = 1.0 / b;
    let qe2 = (q * eps) * (q * eps);
    let mut x: f64 = 1.0;
    for _ in 0..300 {
        let f = x * x * x * x - x * x + 2.0 * eps * x - qe2;
        let fp = 4.0 * x * x * x - 2.0 * x + 2.0 * eps;
        if fp <= 0.0 {
            break;
        }
        let nx = x - f / fp;
        if nx >= x {
            return Ok(x * b);
        }
        x = nx;
    }
    if x.is_finite() && x > 0.0 {
        Ok(x * b)
    } else {
        Err(InputError::NoConvergence { what: "Reissner–Nordström turning point".into() })
    }
}

/// Closest approach r0 (units of M) of an escaping ray; `None` if captured or b invalid.
pub fn closest_approach(b: f64, q: f64) -> Option<f64> {
    if !(b.is_finite() && b > critical_b(q) && q.abs() <= 1.0) {
        return None;
    }
    turning_point(b, q).ok()
}

/// Exact deflection of light by a Reissner–Nordström black hole.
///
/// # Formula
/// (du/dφ)² = 1/b² − u² + 2Mu³ − Q²u⁴ (Chandrasekhar 1983, ch. 5; θ-form derived in
/// docs/physics/deflection.md §2). With s = bu = s0 sin θ and the
/// exact factorization Π(s0 t) = s0²(1 − t²)[1 − 2ε s0 g(t) + q² s0² (1 + t²)],
/// g(t) = (1 + t + t²)/(1 + t):
///
/// α = 2∫₀^{π/2} [W^{−1/2} − 1] dθ, W = 1 − 2ε s0 g(sin θ) + q² s0² (1 + sin²θ),
///
/// with W^{−1/2} − 1 = w/(√W(1 + √W)), w = 1 − W, so that no digits are lost at large b (tests/deflection.rs
/// compares it with an mpmath evaluation, tests/reference/deflection_mpmath.py).
///
/// # Domain
/// b > 0, |Q| ≤ M; b ≤ b_c(Q) is captured (a result). Q = 0 reduces to Schwarzschild.
///
/// # Errors
/// `b` not finite or ≤ 0; `charge` outside [−1, 1]; [`InputError::NoConvergence`].
///
/// # Examples
/// ```
/// use chiwave_core::deflection::{reissner_nordstrom as rn, Deflection};
/// // mpmath 1.3, tests/reference/deflection_mpmath.py (u-integral): b = 10, Q = 0.5
/// let Deflection::Scattered { alpha, .. } = rn::deflection(10.0, 0.5).unwrap() else { panic!() };
/// assert!((alpha - 0.575_610_050_252_044_1).abs() < 1e-13);
/// ```
pub fn deflection(b: f64, q: f64) -> Result<Deflection, InputError> {
    deflection_with_accuracy(b, q).map(|(d, _)| d)
}

/// [`deflection`] and the relative accuracy of its α: the difference of the two quadrature
/// rules over α (1e-16, one rounding, for the closed weak-field form used at b > 1e30; 0 when
/// captured).
pub(crate) fn deflection_with_accuracy(b: f64, q: f64) -> Result<(Deflection, f64), InputError> {
    positive("b", b)?;
    in_closed("charge", q, -1.0, 1.0)?;
    if b <= critical_b(q) {
        return Ok((Deflection::Captured, 0.0));
    }
    let r0 = turning_point(b, q)?;
    if b > 1e30 {
        // Weak-field terms 4ε + (15π/4)ε² − (3π/4)q² are exact to f64 here (Keeton & Petters 2005, gr-qc/0511019, RN section).
        let e = 1.0 / b;
        return Ok((Deflection::Scattered { alpha: 4.0 * e + (3.75 - 0.75 * q * q) * PI * e * e, closest_approach: r0 }, 1e-16));
    }
    let sigma = b / r0;
    let eps = 1.0 / b;
    let qq = q / b;
    let k = 2.0 * eps * sigma;
    let c = qq * qq * sigma * sigma;
    // W(1) = 1 − 3εσ·... ; W'(1) = −(3/4)k + 2c.
    let rho = singularity_distance(1.0 - 1.5 * k + 2.0 * c, -0.75 * k + 2.0 * c);
    let f = |th: f64| {
        let t = th.sin();
        let g = t + 1.0 / (1.0 + t);
        let w = k * g - c * (1.0 + t * t);
        let sw = (1.0 - w).sqrt();
        w / (sw * (1.0 + sw))
    };
    let (integral, diff) = theta_integral(f, rho, 4.0 * eps, "the Reissner–Nordström deflection")?;
    Ok((Deflection::Scattered { alpha: 2.0 * integral, closest_approach: r0 }, diff / integral.abs().max(f64::MIN_POSITIVE)))
}
