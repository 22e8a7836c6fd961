//! Shared numerical tools, used by every observable family: Gauss–Legendre rules (and a cache of
//! them), fixed, composite and adaptive Gauss–Legendre quadrature ([`quadrature`]), real roots of
//! polynomials ([`poly`]), and the tolerance policy.
//!
//! Sources: Gauss–Legendre quadrature, nodes the zeros of P_n and weights 2/((1 − x²)P_n'(x)²)
//! (Abramowitz & Stegun 1964, Handbook of Mathematical Functions, eq. 25.4.29); the zeros found
//! by Newton's method on the three-term Legendre recurrence (common practice). The other
//! sources are named in the submodules.
//!
//! Tolerance policy (one place): relative errors for quantities that scale, absolute only near
//! zero. Tests use these constants; a test that needs another bound says why beside it.

pub mod poly;
pub mod quadrature;

pub use quadrature::integrate_gl;

use std::sync::OnceLock;

/// Nodes and weights of a Gauss–Legendre rule on [-1, 1].
pub type Rule = (Vec<f64>, Vec<f64>);

/// Relative tolerance for one value computed by two algebraically identical formulas a rounding
/// or two apart (a product regrouped, a constant folded).
pub const REL_ONE_ROUNDING: f64 = 1e-15;
/// Relative tolerance for one quantity computed two ways in a few tens of f64 operations (a sum
/// regrouped, two short closed forms, a unit conversion without cancellation).
pub const REL_FEW_OPS: f64 = 1e-14;
/// Relative tolerance for identities that only involve rounding (on-shell, symmetries).
pub const REL_ROUNDING: f64 = 1e-13;
/// Relative tolerance for a closed form against an independent quadrature in f64.
pub const REL_QUADRATURE: f64 = 1e-12;
/// Relative tolerance for comparisons with values transcribed to 12–15 digits.
pub const REL_TRANSCRIBED: f64 = 1e-11;
/// Relative tolerance for a sky or flux integral on the production rules against the closed
/// form it must reproduce (the rules are sized for it: `waveform::SkyOptions::for_gamma`).
pub const REL_SKY_RULE: f64 = 1e-10;

/// Nodes and weights of the n-point Gauss–Legendre rule on [-1, 1].
///
/// # Formula
/// Roots of the Legendre polynomial P_n by Newton's method from the Tricomi initial guess
/// x_k ≈ cos(π (k − 1/4)/(n + 1/2)); weights w_k = 2 / ((1 − x_k²) P_n'(x_k)²)
/// (Abramowitz & Stegun 1964, eq. 25.4.29; the standard construction).
///
/// # Domain
/// 1 ≤ n ≤ 512 (clamped); exact for polynomials of degree ≤ 2n − 1.
///
/// # Examples
/// ```
/// let (x, w) = chiwave_core::numeric::gauss_legendre(5);
/// let s: f64 = x.iter().zip(&w).map(|(x, w)| w * x.powi(8)).sum();
/// assert!((s - 2.0 / 9.0).abs() < 1e-15);
/// ```
pub fn gauss_legendre(n: usize) -> Rule {
    let n = n.clamp(1, 512);
    let mut x = vec![0.0; n];
    let mut w = vec![0.0; n];
    let m = n.div_ceil(2);
    for k in 0..m {
        let mut z = (std::f64::consts::PI * (k as f64 + 0.75) / (n as f64 + 0.5)).cos();
        let mut dp = 1.0;
        for _ in 0..100 {
            let (mut p0, mut p1) = (1.0, z);
            for j in 2..=n {
                let p2 = ((2 * j - 1) as f64 * z * p1 - (j - 1) as f64 * p0) / j as f64;
                p0 = p1;
                p1 = p2;
            }
            let pn = if n == 1 { z } else { p1 };
            let pm1 = if n == 1 { 1.0 } else { p0 };
            dp = n as f64 * (z * pn - pm1) / (z * z - 1.0);
            let dz = pn / dp;
            z -= dz;
            if dz.abs() < 1e-16 {
                break;
            }
        }
        x[k] = -z;
        x[n - 1 - k] = z;
        let wk = 2.0 / ((1.0 - z * z) * dp * dp);
        w[k] = wk;
        w[n - 1 - k] = wk;
    }
    (x, w)
}

/// Largest rule size kept by [`cached_rule`].
pub const MAX_CACHED_RULE: usize = 256;

/// The n-point Gauss–Legendre rule, computed once per n and kept for the life of the program
/// (the rules used by the hot paths: 12, 16, 24, 32, 48, … 192 nodes).
///
/// # Domain
/// 1 ≤ n ≤ [`MAX_CACHED_RULE`]; n is clamped to that range (callers pass constants).
///
/// # Examples
/// ```
/// let r = chiwave_core::numeric::cached_rule(24);
/// assert_eq!(r, &chiwave_core::numeric::gauss_legendre(24));
/// ```
pub fn cached_rule(n: usize) -> &'static Rule {
    static RULES: [OnceLock<Rule>; MAX_CACHED_RULE + 1] = [const { OnceLock::new() }; MAX_CACHED_RULE + 1];
    let n = n.clamp(1, MAX_CACHED_RULE);
    RULES[n].get_or_init(|| gauss_legendre(n))
}

/// Relative difference |a − b| / max(|a|, |b|), 0 when both are 0.
pub fn rel_diff(a: f64, b: f64) -> f64 {
    let s = a.abs().max(b.abs());
    if s == 0.0 {
        0.0
    } else {
        (a - b).abs() / s
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn gauss_legendre_exactness() {
        // ∫_{-1}^{1} x^{2k} dx = 2/(2k+1) (elementary), exact for 2k ≤ 2n − 1.
        for n in [1usize, 2, 7, 24, 48, 100] {
            let r = gauss_legendre(n);
            let wsum: f64 = r.1.iter().sum();
            assert!((wsum - 2.0).abs() < 1e-14, "n={n}");
            let k = n - 1;
            let s: f64 = r.0.iter().zip(&r.1).map(|(x, w)| w * x.powi(2 * k as i32)).sum();
            assert!(rel_diff(s, 2.0 / (2 * k + 1) as f64) < 1e-13, "n={n}");
        }
        // ∫_0^π sin = 2 (elementary).
        let r = gauss_legendre(20);
        assert!((integrate_gl(f64::sin, 0.0, std::f64::consts::PI, &r) - 2.0).abs() < 1e-14);
    }
}
