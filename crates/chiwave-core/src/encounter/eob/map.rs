//! The map between the angle coefficients χ_n of χ/2 = Σ χ_n/jⁿ and the coefficients w_n of the
//! energy-gauge potential w(u) = Σ w_n uⁿ, and the validated [`Potential`].

use super::{Potential, MAX_COEFFICIENTS};
use crate::error::InputError;
use std::f64::consts::PI;

// ------------------------------------------------------------------------------------------
// The w ↔ χ map
// ------------------------------------------------------------------------------------------

/// 1/Γ(m/2) for integer m (0 at the poles m = 0, −2, −4, …).
fn rgamma_half(m: i64) -> f64 {
    if m <= 0 && m % 2 == 0 {
        return 0.0;
    }
    // Γ(1/2) = √π, Γ(1) = 1, Γ(x + 1) = x Γ(x).
    let (mut x, mut g) = if m % 2 == 0 { (1.0, 1.0) } else { (0.5, PI.sqrt()) };
    let target = m as f64 / 2.0;
    while x < target - 0.25 {
        g *= x;
        x += 1.0;
    }
    while x > target + 0.25 {
        x -= 1.0;
        g /= x;
    }
    1.0 / g
}

/// Calls `f(k)` for every partition of `n` written as multiplicities k[i] of the part i + 1.
fn partitions(n: usize, f: &mut impl FnMut(&[usize])) {
    fn rec(rest: usize, max_part: usize, k: &mut Vec<usize>, f: &mut impl FnMut(&[usize])) {
        if rest == 0 {
            f(k);
            return;
        }
        for part in (1..=max_part.min(rest)).rev() {
            k[part - 1] += 1;
            rec(rest - part, part, k, f);
            k[part - 1] -= 1;
        }
    }
    let mut k = vec![0usize; n];
    rec(n, n, &mut k, f);
}

/// The angle coefficients χ_n implied by the potential coefficients w_n (inverse of
/// [`w_from_chi`]).
///
/// # Formula
/// Expanding χ/2 + π/2 = j ∫_0^{u0} du / √(p∞² + w(u) − j²u²) in powers of w (Hadamard finite
/// part; each term ∫_0^{p∞/j} u^m (p∞² − j²u²)^(−1/2−K) du is a Beta function) gives
/// ```text
/// χ_n = (√π/2) p∞ⁿ Σ_{k_1 + 2k_2 + … = n} Γ((n+1)/2) / Γ(1 + n/2 − K)  Π_i (w_i/p∞²)^{k_i} / k_i!,
///        K = Σ k_i
/// ```
/// so χ_1 = w_1/(2p∞), χ_2 = (π/4) w_2, χ_3 = p∞ w_3 + w_1 w_2/(2p∞) − w_1³/(24 p∞³),
/// χ_4 = (3π/8)(p∞² w_4 + w_1 w_3 + w_2²/2). Derived here; the first orders agree with
/// Damour 2018 (arXiv:1710.10599) and Damour 2019 (arXiv:1912.02139), equation numbers not
/// confirmed. Tested against a direct large-j expansion of the quadrature and against the
/// Taylor coefficients of the exact isotropic Schwarzschild w (`tests/eob.rs`).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::eob::chi_from_w;
/// let c = chi_from_w(0.5, &[2.0, 3.0, 4.0]);
/// assert!((c[0] - 2.0).abs() < 1e-15);            // w_1/(2 p∞)
/// assert!((c[1] - 0.75 * std::f64::consts::PI).abs() < 1e-15);
/// assert!((c[2] - (2.0 + 6.0 - 8.0 / 3.0)).abs() < 1e-13);
/// ```
pub fn chi_from_w(p_inf: f64, w: &[f64]) -> Vec<f64> {
    (1..=w.len()).map(|n| chi_n_of_w(p_inf, w, n, true)).collect()
}

/// χ_n from w_1..w_n; with `include_top = false` the linear term in w_n is left out.
fn chi_n_of_w(p: f64, w: &[f64], n: usize, include_top: bool) -> f64 {
    let pref = 0.5 * PI.sqrt() * p.powi(n as i32) / rgamma_half(n as i64 + 1);
    let mut sum = 0.0;
    partitions(n, &mut |k: &[usize]| {
        let kk: usize = k.iter().sum();
        if !include_top && k[n - 1] == 1 {
            return;
        }
        let r = rgamma_half(2 + n as i64 - 2 * kk as i64);
        if r == 0.0 {
            return;
        }
        let mut term = r;
        for (i, &ki) in k.iter().enumerate() {
            if ki > 0 {
                let x = w[i] / (p * p);
                let mut fact = 1.0;
                for m in 1..=ki {
                    fact *= m as f64;
                }
                term *= x.powi(ki as i32) / fact;
            }
        }
        sum += term;
    });
    pref * sum
}

/// The potential coefficients w_n from the angle coefficients χ_n (chi[k] = χ_{k+1}).
///
/// # Formula
/// Inverse of the map in [`chi_from_w`], solved order by order:
/// w_1 = 2 p∞ χ_1, w_2 = 4 χ_2/π, w_3 = [χ_3 − w_1 w_2/(2p∞) + w_1³/(24 p∞³)]/p∞,
/// w_4 = 8χ_4/(3π p∞²) − (w_1 w_3 + w_2²/2)/p∞²; in general w_n is χ_n minus the lower-order
/// terms, divided by (√π/2) p∞^(n−2) Γ((n+1)/2)/Γ(n/2).
/// In the test-body limit this gives w_1 = 2(2γ² − 1), w_2 = (3/2)(5γ² − 1), w_3 = 9γ² − 1/2,
/// the Taylor coefficients of the isotropic Schwarzschild w (Damour 2018, arXiv:1710.10599).
///
/// # Domain
/// p∞ > 0. At small p∞ the p∞^(−3) terms of χ_3 and w_1³/(24p∞³) cancel: w_3 loses about
/// 3 log10(1/p∞) digits; [`details`](super::details) flags p∞ < 1e-3.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::eob::w_from_chi;
/// // test body, γ = 2 (Schwarzschild χ_1…χ_3, Damour 2018, arXiv:1710.10599): w_3 = 9γ² − 1/2 = 35.5
/// let (g, p) = (2.0_f64, 3.0_f64.sqrt());
/// let chi = [(2.0 * g * g - 1.0) / p, 3.0 * std::f64::consts::PI / 8.0 * (5.0 * g * g - 1.0),
///            (64.0 * p.powi(6) + 72.0 * p.powi(4) + 12.0 * p * p - 1.0) / (3.0 * p.powi(3))];
/// let w = w_from_chi(p, &chi);
/// assert!((w[2] - 35.5).abs() < 1e-12);
/// ```
pub fn w_from_chi(p_inf: f64, chi: &[f64]) -> Vec<f64> {
    let mut w = vec![0.0; chi.len()];
    for n in 1..=chi.len() {
        let rest = chi_n_of_w(p_inf, &w[..n], n, false);
        let lin = 0.5 * PI.sqrt() * p_inf.powi(n as i32 - 2) * rgamma_half(n as i64) / rgamma_half(n as i64 + 1);
        w[n - 1] = (chi[n - 1] - rest) / lin;
    }
    w
}

// ------------------------------------------------------------------------------------------
// Validation
// ------------------------------------------------------------------------------------------

pub(super) fn validate(gamma: f64, nu: f64, chi: &[f64]) -> Result<f64, InputError> {
    crate::error::finite("gamma", gamma)?;
    if gamma <= 1.0 {
        return Err(InputError::OutOfRange {
            field: "gamma",
            value: gamma,
            allowed: "gamma > 1 (unbound encounter)".into(),
        });
    }
    crate::error::finite("nu", nu)?;
    if !(nu > 0.0 && nu <= 0.25) {
        return Err(InputError::OutOfRange { field: "nu", value: nu, allowed: "0 < nu ≤ 1/4".into() });
    }
    if chi.len() < 3 || chi.len() > MAX_COEFFICIENTS {
        return Err(InputError::OutOfRange {
            field: "chi",
            value: chi.len() as f64,
            allowed: format!("3 to {MAX_COEFFICIENTS} angle coefficients χ_1 … χ_n"),
        });
    }
    for &c in chi {
        crate::error::finite("chi", c)?;
    }
    if chi[0] <= 0.0 {
        return Err(InputError::OutOfRange {
            field: "chi",
            value: chi[0],
            allowed: "χ_1 > 0 (attractive at first PM order)".into(),
        });
    }
    let p = ((gamma - 1.0) * (gamma + 1.0)).sqrt();
    if !(p > 0.0 && p.is_finite()) {
        return Err(InputError::OutOfRange {
            field: "gamma",
            value: gamma,
            allowed: "1 < gamma with sqrt(gamma² − 1) representable".into(),
        });
    }
    Ok(p)
}


/// The energy-gauge potential built from the supplied angle coefficients.
///
/// # Errors
/// `gamma` ≤ 1, `nu` outside (0, 1/4], fewer than 3 or more than [`MAX_COEFFICIENTS`]
/// coefficients, non-finite values, χ_1 ≤ 0, or a potential that overflows double precision.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::eob::potential;
/// let g = 1.5_f64; let p = (g * g - 1.0).sqrt();
/// let pot = potential(g, 0.25, &[(2.0 * g * g - 1.0) / p, 1.0, 1.0]).unwrap();
/// assert!((pot.w[0] - 2.0 * (2.0 * g * g - 1.0)).abs() < 1e-14); // w_1 = 2(2γ² − 1)
/// ```
pub fn potential(gamma: f64, nu: f64, chi: &[f64]) -> Result<Potential, InputError> {
    let p = validate(gamma, nu, chi)?;
    let w = w_from_chi(p, chi);
    if w.iter().any(|x| !x.is_finite()) {
        return Err(InputError::Inconsistent {
            field: "chi",
            reason: "the potential coefficients w_n overflow double precision for these inputs".into(),
        });
    }
    Ok(Potential { p_inf: p, w })
}
