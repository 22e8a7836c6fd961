//! θ-form quadrature shared by the Kerr and Reissner–Nordström deflections (derivation:
//! docs/physics/deflection.md §2).
//!
//! The integrand is smooth on [0, π/2] but has a complex singularity near θ = π/2 at a distance
//! ρ that shrinks as the ray approaches capture. The interval is cut into panels that halve in
//! width toward π/2 until the last panel is no wider than ρ; each panel uses Gauss–Legendre.
//! The result is computed with two rules (24 and 32 nodes) and must agree, otherwise the
//! computation is reported as non-convergent.
//!
//! No formula of its own: the integrands and their sources are in `kerr.rs` and
//! `reissner_nordstrom.rs`; the panels use Gauss–Legendre rules (`crate::numeric`, Abramowitz &
//! Stegun 1964, eq. 25.4.29).

use crate::error::InputError;
use crate::numeric::cached_rule;
use std::f64::consts::FRAC_PI_2;

fn panels(f: &impl Fn(f64) -> f64, rho: f64, n: usize) -> f64 {
    let r = cached_rule(n);
    let mut sum = 0.0;
    let mut lo = 0.0;
    let mut gap = FRAC_PI_2; // distance from lo to π/2
    let target = rho.clamp(1e-13, FRAC_PI_2);
    loop {
        let width = if gap > target { 0.5 * gap } else { gap };
        let hi = lo + width;
        let (c, h) = (lo + 0.5 * width, 0.5 * width);
        sum += h * r.0.iter().zip(&r.1).map(|(x, w)| w * f(c + h * x)).sum::<f64>();
        if width == gap {
            break;
        }
        lo = hi;
        gap -= width;
    }
    sum
}

/// ∫₀^{π/2} f(θ) dθ for an integrand with a complex singularity about `rho` from θ = π/2, and
/// the difference of the 24- and 32-node results (absolute). The 32-node value is returned; the
/// difference bounds its error from above (both rules converge geometrically on these analytic
/// integrands, the 24-node one more slowly).
///
/// # Errors
/// [`InputError::NoConvergence`] if the 24- and 32-node results differ by more than 1e-11
/// (relative, or absolute against `scale`).
pub(crate) fn theta_integral(f: impl Fn(f64) -> f64, rho: f64, scale: f64, what: &str) -> Result<(f64, f64), InputError> {
    let a = panels(&f, rho, 24);
    let b = panels(&f, rho, 32);
    if !(a.is_finite() && b.is_finite()) || (a - b).abs() > 1e-11 * b.abs().max(scale) {
        return Err(InputError::NoConvergence { what: format!("θ-quadrature for {what}: {a} vs {b}") });
    }
    Ok((b, (a - b).abs()))
}

/// Distance estimate ρ = √(2(t* − 1)) of the singularity of 1/√W(sin θ) from θ = π/2, where
/// W(t) ≈ W(1) + W′(1)(t − 1) vanishes at t*.
pub(crate) fn singularity_distance(w1: f64, dw1: f64) -> f64 {
    if dw1 >= 0.0 || w1 <= 0.0 {
        return 1.0;
    }
    (2.0 * w1 / (-dw1)).sqrt()
}
