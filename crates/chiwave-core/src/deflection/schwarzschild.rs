//! Schwarzschild null geodesics: closest approach, capture, exact deflection (Darwin's
//! elliptic-integral form).
//!
//! Units: G = c = 1, lengths in units of the lens mass M (docs/physics/deflection.md §1). α is the total
//! deflection in radians, positive toward the lens, α = Δφ − π.

use super::Deflection;
use crate::error::{positive, InputError};
use std::f64::consts::{FRAC_PI_4, PI};

/// Critical impact parameter b_c = 3√3 M (photon sphere r = 3M).
///
/// # Formula
/// b_c = 3√3 M (Darwin 1959, Proc. R. Soc. A 249, 180).
pub const CRITICAL_B: f64 = 5.196_152_422_706_632;

/// Photon-sphere radius r = 3M (Darwin 1959).
pub const PHOTON_SPHERE: f64 = 3.0;

/// Impact parameter of the ray whose closest approach is `r0` (units of M).
///
/// # Formula
/// b(r0) = r0 / √(1 − 2M/r0) (Darwin 1959; the turning point of the orbit equation).
///
/// # Domain
/// r0 > 2M (outside the horizon); r0 > 3M for a ray that escapes. Returns `None` for r0 ≤ 2 or
/// a non-finite r0.
///
/// # Examples
/// ```
/// use chiwave_core::deflection::schwarzschild::impact_parameter;
/// // At the photon sphere b = 3√3 M (Darwin 1959).
/// assert!((impact_parameter(3.0).unwrap() - 27f64.sqrt()).abs() < 1e-14);
/// ```
pub fn impact_parameter(r0: f64) -> Option<f64> {
    if r0.is_finite() && r0 > 2.0 {
        Some(r0 / (1.0 - 2.0 / r0).sqrt())
    } else {
        None
    }
}

/// Closest approach r0(b) of an escaping ray, in units of M; `None` if captured (b ≤ 3√3 M) or
/// b is not finite and positive.
///
/// # Formula
/// r0 = (2b/√3) cos[(1/3) arccos(−3√3 M/b)] (the trigonometric root of r³ − b²r + 2Mb² = 0;
/// Darwin 1959), polished near
/// capture by Newton's method on the exact relation for δ = r0 − 3M,
/// δ²(9 + δ) = (b² − 27)(1 + δ), which follows from b² = r0³/(r0 − 2) and has no cancellation
/// as b → b_c (b² − 27 is formed as (b − b_c)(b + b_c)).
///
/// # Examples
/// ```
/// use chiwave_core::deflection::schwarzschild::closest_approach;
/// // mpmath 1.3, tests/reference/deflection_mpmath.py: r0(10) = 8.7888506624997283234
/// assert!((closest_approach(10.0).unwrap() - 8.788_850_662_499_728).abs() < 1e-13);
/// assert!(closest_approach(5.0).is_none()); // captured
/// ```
pub fn closest_approach(b: f64) -> Option<f64> {
    photon_offset(b).map(|d| PHOTON_SPHERE + d)
}

/// δ = r0 − 3M for b > b_c (see [`closest_approach`]).
fn photon_offset(b: f64) -> Option<f64> {
    if !(b.is_finite() && b > CRITICAL_B) {
        return None;
    }
    let arg = (-3.0 * 3f64.sqrt() / b).max(-1.0);
    let r0 = 2.0 * b / 3f64.sqrt() * ((arg.acos()) / 3.0).cos();
    if b > 20.0 {
        // Well conditioned here; the cubic closed form is accurate to rounding.
        return Some(r0 - PHOTON_SPHERE);
    }
    let dp = (b - CRITICAL_B) * (b + CRITICAL_B);
    // φ(δ) = δ³ + 9δ² − d'δ − d' is convex for δ > −3; Newton from above converges monotonically.
    let mut d = (r0 - PHOTON_SPHERE).max((dp / 6.0).sqrt() * 1.5).max(1e-300);
    for it in 0..100 {
        let f = d * d * (9.0 + d) - dp * (1.0 + d);
        let fp = 3.0 * d * d + 18.0 * d - dp;
        if fp <= 0.0 {
            break;
        }
        let next = d - f / fp;
        // After the first step the iterate lies above the root and decreases monotonically;
        // stop when rounding ends the decrease.
        if next.is_nan() || next <= 0.0 || (it > 0 && next >= d) {
            break;
        }
        let done = (d - next).abs() <= 4e-16 * d;
        d = next;
        if done {
            break;
        }
    }
    Some(d)
}

/// Exact deflection angle of a light ray with impact parameter `b` (units of M).
///
/// # Formula
/// Darwin 1959 (Proc. R. Soc. A 249, 180), in the form written in docs/physics/deflection.md §2
/// (tests/deflection.rs checks it against an independent quadrature and mpmath): with P = r0, Q = √((P − 2)(P + 6)),
/// k² = (Q − P + 6)/(2Q) and sin²φ0 = (Q − P + 2)/(Q − P + 6),
/// α = 4√(P/Q) [K(k) − F(φ0, k)] − π.
///
/// Evaluation (same closed form, arranged so that f64 keeps its digits):
/// * K − F(φ0) = F(ψ0) with cot φ0 cot ψ0 = k′ (the standard addition identity, DLMF §19.11,
///   recalled; checked in the tests against K − F computed separately), and
///   F(ψ, k) = sin ψ R_F(cos²ψ, 1 − k² sin²ψ, 1) (Carlson form, DLMF 19.25.5). After using
///   homogeneity this is Δφ = 4√(2P) R_F(8(P − 2)δ/(3P − 6 + Q), 4δ, 3P − 6 + Q), δ = P − 3.
/// * For small k² (b ≳ 40M) the subtraction of π would cost digits, so F(ψ0, k) − ψ0 is summed
///   from its Maclaurin series in k² (binomial series of the integrand, terms
///   (2n choose n)/4ⁿ k²ⁿ ∫₀^ψ sin²ⁿθ dθ), and ψ0 − π/4 and √(P/Q) − 1 are formed without
///   cancellation.
/// * For b > 10³⁰ M the weak-field series 4/b + (15π/4)/b² is exact to f64 (the next term is
///   smaller by a factor 10⁻⁶⁰) and is used instead.
///
/// # Domain
/// b > 0. Rays with b ≤ 3√3 M are captured: [`Deflection::Captured`], never NaN. As b → b_c⁺
/// α diverges like −ln(b/b_c − 1); as b → ∞, α → 4M/b.
///
/// # Errors
/// [`InputError`] for b not finite or ≤ 0 (field `b`), or if the elliptic integral fails.
///
/// # Examples
/// ```
/// use chiwave_core::deflection::{schwarzschild, Deflection};
/// // mpmath 1.3, tests/reference/deflection_mpmath.py: α(10M) = 0.59039578760582732122
/// match schwarzschild::deflection(10.0).unwrap() {
///     Deflection::Scattered { alpha, .. } => assert!((alpha - 0.590_395_787_605_827_3).abs() < 1e-14),
///     Deflection::Captured => unreachable!(),
/// }
/// assert_eq!(schwarzschild::deflection(5.0).unwrap(), Deflection::Captured);
/// ```
pub fn deflection(b: f64) -> Result<Deflection, InputError> {
    positive("b", b)?;
    let Some(delta) = photon_offset(b) else {
        return Ok(Deflection::Captured);
    };
    let p = PHOTON_SPHERE + delta;
    if b > 1e30 {
        let e = 1.0 / b;
        return Ok(Deflection::Scattered { alpha: 4.0 * e + 3.75 * PI * e * e, closest_approach: p });
    }
    let alpha = darwin_alpha(p, delta)?;
    Ok(Deflection::Scattered { alpha, closest_approach: p })
}

/// Darwin's α from P = r0 and δ = r0 − 3 (see [`deflection`]).
fn darwin_alpha(p: f64, delta: f64) -> Result<f64, InputError> {
    let q = p * ((1.0 - 2.0 / p) * (1.0 + 6.0 / p)).sqrt();
    // Q − P = (Q² − P²)/(Q + P) = (4P − 12)/(Q + P), without cancellation.
    let q_minus_p = 4.0 * delta / (q + p);
    let m = (q_minus_p + 6.0) / (2.0 * q);
    if m > 0.1 {
        let s = 3.0 * p - 6.0 + q;
        let x = 8.0 * (p - 2.0) * delta / s;
        let rf = ellip::elliprf(x, 4.0 * delta, s)
            .map_err(|e| InputError::NoConvergence { what: format!("Carlson R_F in Darwin's deflection: {e}") })?;
        return Ok(4.0 * (2.0 * p).sqrt() * rf - PI);
    }
    // Small k²: α/2 = 2√(P/Q)·D + 2(√(P/Q) − 1)ψ0 + 2(ψ0 − π/4), D = F(ψ0, k) − ψ0.
    let eps1 = 1.5 * (q_minus_p + 2.0) / q; // 1 − X, X = k′² tan²φ0 = cot²ψ0
    let x = 1.0 - eps1;
    let sx = x.sqrt();
    let psi_minus = (eps1 / ((1.0 + sx) * (1.0 + sx))).atan();
    let psi = FRAC_PI_4 + psi_minus;
    let sin2 = 1.0 / (1.0 + x);
    let sc = sx / (1.0 + x); // sin ψ cos ψ
    // J_n = ∫₀^ψ sin^{2n}: J_n = ((2n − 1)/(2n)) J_{n−1} − sin^{2n−1}ψ cos ψ /(2n).
    let mut j = psi;
    let mut sin_pow = sc; // sin^{2n−1} cos for n = 1
    let mut coef = 1.0; // (2n choose n)/4^n
    let mut mpow = 1.0;
    let mut d = 0.0;
    for n in 1..200 {
        let nf = n as f64;
        j = ((2.0 * nf - 1.0) * j - sin_pow) / (2.0 * nf);
        sin_pow *= sin2;
        coef *= (2.0 * nf - 1.0) / (2.0 * nf);
        mpow *= m;
        let term = coef * mpow * j;
        d += term;
        if term.abs() <= 1e-18 * d.abs() {
            let rpq = (p / q).sqrt();
            let rpq_minus = -q_minus_p / (q * (rpq + 1.0)); // √(P/Q) − 1 = (P − Q)/(Q(√(P/Q) + 1))
            return Ok(4.0 * (rpq * d + rpq_minus * psi + psi_minus));
        }
    }
    Err(InputError::NoConvergence { what: "series for F(ψ0, k) − ψ0 in Darwin's deflection".into() })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn alpha(b: f64) -> f64 {
        match deflection(b).unwrap() {
            Deflection::Scattered { alpha, .. } => alpha,
            Deflection::Captured => f64::NAN,
        }
    }

    #[test]
    fn branches_agree_at_switch() {
        // The two evaluations of the same closed form must join smoothly at k² = 0.1: compare
        // the literal Darwin formula (K − F with the ellip crate, parameter m = k²) on both sides.
        for b in [30.0, 38.0, 39.5, 40.0, 41.0, 45.0, 60.0] {
            let p = closest_approach(b).unwrap();
            let q = ((p - 2.0) * (p + 6.0)).sqrt();
            let m = (q - p + 6.0) / (2.0 * q);
            let phi0 = ((q - p + 2.0) / (q - p + 6.0)).sqrt().asin();
            let lit = 4.0 * (p / q).sqrt() * (ellip::ellipk(m).unwrap() - ellip::ellipf(phi0, m).unwrap()) - PI;
            // Literal form loses ~|π/α|·1e-16 to the subtraction (b ≤ 60: α ≥ 0.07 → 1e-14 abs).
            assert!((alpha(b) - lit).abs() < 2e-14, "b={b}: {} vs {lit}", alpha(b));
        }
    }

    #[test]
    fn newton_polish_near_capture() {
        // b(r0) round trip (Darwin 1959, b(r0)): r0 = 3 + δ → b → r0.
        // Rounding of b alone moves δ by ≈ 3e-16/δ (δ² ≈ (b² − 27)/9), hence the bound.
        for d in [1e-5, 1e-3, 0.1, 2.0, 15.0] {
            let b = impact_parameter(3.0 + d).unwrap();
            let back = photon_offset(b).unwrap();
            assert!((back - d).abs() < 2e-15 / d + 1e-14 * d, "δ={d}: {back}");
        }
    }
}
