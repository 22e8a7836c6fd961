//! Complex special functions for the point-lens amplification factor: ln Γ(z) and Kummer's
//! confluent hypergeometric function M(a, 1, z) = ₁F₁(a; 1; z) on the imaginary axis.
//!
//! Why written here: no pure-Rust crate evaluates ₁F₁ for complex arguments (checked with
//! `cargo info`: `puruspe` 0.4.4 and `spfunc` 0.1.3 cover real special functions). The gamma
//! factor is needed as a *logarithm*: Γ(1 − iw/2) ≈ e^{−πw/4} underflows for w ≳ 900 while the
//! prefactor e^{πw/4} overflows, so only ln Γ combined with the prefactor stays in range.
//!
//! Methods:
//! - ln Γ(z), Re z > 0: upward recurrence to Re z ≥ 10, then the Stirling series with eight
//!   Bernoulli terms (Abramowitz & Stegun 1964, eq. 6.1.40 and 6.1.41; DLMF 5.11.1). Truncation
//!   error < 3e-17 relative at |z| ≥ 10. Only e^{ln Γ} is used, so the branch of Im ln Γ does not
//!   matter.
//! - M(iα, 1, it), α ≥ 0, t ≥ 0: the power series Σ (a)_n zⁿ/(n!)² (DLMF 13.2.2) with
//!   compensated (Neumaier) summation while |z| ≤ 3 and α|z| ≤ 6 (largest term ≲ e^{2√(α|z|)}
//!   ≈ 130, so the loss to cancellation stays below ~2 decimal digits). Farther out the series
//!   cancels catastrophically (largest term ~ e^{w y}), so the value and derivative at the edge
//!   of that disc are continued along the ray z = it by Taylor steps of Kummer's equation
//!   z f'' + (b − z) f' − a f = 0 (DLMF 13.2.1), whose Taylor coefficients about z₀ obey
//!   z₀ (n+1)(n+2) c_{n+2} = (n + a) c_n − (n+1)(n + b − z₀) c_{n+1}
//!   (derived here by inserting f = Σ c_n (z − z₀)ⁿ). On the imaginary axis both solutions of
//!   Kummer's equation have the same size (its Whittaker form has a purely oscillatory,
//!   turning-point-free coefficient there), so rounding errors are not amplified along the way.
//!   Step |h| ≤ min(0.35 |z₀|, 3/(½ + √(¼ + (|a| + b)/|z₀|))): the first bound keeps the
//!   singular point z = 0 outside the disc (errors in the coefficients decay like 0.35ⁿ), the
//!   second keeps the local oscillation at ≲ 3 radians per step (terms ~ 3ⁿ/n!).
//! - Large |z| with α²/|z| of order 1 or less: the two sums of the large-|z| expansion
//!   (DLMF 13.7.2), accepted only when they converge to 1e-17 with no term above 1e3
//!   ([`kummer_asymptotic_sums`]); the caller combines them with the Γ prefactors.

use crate::error::InputError;
use num_complex::Complex64;

/// Largest number of power-series terms before the series is declared non-convergent.
const MAX_SERIES_TERMS: usize = 500;
/// Largest number of Taylor terms in one continuation step.
const MAX_TAYLOR_TERMS: usize = 150;
/// Hard cap on continuation steps (the callers check a smaller a-priori budget first).
const MAX_STEPS: usize = 400_000;
/// Radius of the disc |z| where the power series is used (together with α|z| ≤ SERIES_ALPHA_T).
pub(crate) const SERIES_T: f64 = 3.0;
/// Bound on α|z| for the direct power series.
pub(crate) const SERIES_ALPHA_T: f64 = 6.0;
/// Phase advance per Taylor step (radians, roughly).
pub(crate) const STEP_PHASE: f64 = 3.0;
/// Largest step as a fraction of the distance to the singular point z = 0.
const STEP_FRACTION: f64 = 0.35;

/// Neumaier (improved Kahan) compensated sum of complex numbers, per component.
#[derive(Clone, Copy)]
struct CompensatedSum {
    sum: Complex64,
    carry: Complex64,
}

impl CompensatedSum {
    fn new(x: Complex64) -> Self {
        CompensatedSum { sum: x, carry: Complex64::new(0.0, 0.0) }
    }
    fn add(&mut self, x: Complex64) {
        let (s, c) = two_sum(self.sum.re, x.re);
        let (si, ci) = two_sum(self.sum.im, x.im);
        self.sum = Complex64::new(s, si);
        self.carry += Complex64::new(c, ci);
    }
    fn value(&self) -> Complex64 {
        self.sum + self.carry
    }
}

/// |re| + |im|.
fn l1(z: Complex64) -> f64 {
    z.re.abs() + z.im.abs()
}

/// Neumaier's error-free addition step: s = fl(a + b) and the rounding error of it.
fn two_sum(a: f64, b: f64) -> (f64, f64) {
    let s = a + b;
    let c = if a.abs() >= b.abs() { (a - s) + b } else { (b - s) + a };
    (s, c)
}

/// Natural logarithm of the gamma function for complex z with Re z > 0.
///
/// # Formula
/// ln Γ(z) = ln Γ(z + N) − ln Π_{k<N}(z + k) with N the smallest integer making Re(z + N) ≥ 10,
/// then Stirling: ln Γ(w) = (w − ½) ln w − w + ½ ln 2π + Σ_{k=1}^{8} B_{2k} / (2k(2k − 1) w^{2k−1})
/// (Abramowitz & Stegun 1964, eq. 6.1.40–6.1.41; DLMF 5.11.1).
///
/// # Domain
/// Re z > 0, finite. The imaginary part is *a* logarithm of Γ's phase, not necessarily the
/// continuous branch: use it through `exp`.
///
/// # Errors
/// [`InputError::OutOfRange`] (field `"z"`) for Re z ≤ 0 or non-finite z.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::kummer::ln_gamma;
/// use num_complex::Complex64;
/// // Γ(5) = 24 (elementary).
/// let g = ln_gamma(Complex64::new(5.0, 0.0)).unwrap().exp();
/// assert!((g.re - 24.0).abs() < 1e-12 && g.im.abs() < 1e-12);
/// ```
pub fn ln_gamma(z: Complex64) -> Result<Complex64, InputError> {
    if !(z.re.is_finite() && z.im.is_finite()) || z.re <= 0.0 {
        return Err(InputError::OutOfRange {
            field: "z",
            value: z.re,
            allowed: "Re z > 0 and finite (ln Γ is only needed there)".into(),
        });
    }
    let mut w = z;
    let mut prod = Complex64::new(1.0, 0.0);
    while w.re < 10.0 {
        prod *= w;
        w += 1.0;
    }
    // B_{2k} / (2k (2k − 1)) for k = 1..8 (Bernoulli numbers, A&S Table 23.2).
    const C: [f64; 8] = [
        1.0 / 12.0,
        -1.0 / 360.0,
        1.0 / 1260.0,
        -1.0 / 1680.0,
        1.0 / 1188.0,
        -691.0 / 360_360.0,
        1.0 / 156.0,
        -3617.0 / 122_400.0,
    ];
    let inv = w.inv();
    let inv2 = inv * inv;
    let mut series = Complex64::new(0.0, 0.0);
    for c in C.iter().rev() {
        series = series * inv2 + c;
    }
    series *= inv;
    let half_ln_2pi = 0.5 * (2.0 * std::f64::consts::PI).ln();
    Ok((w - 0.5) * w.ln() - w + half_ln_2pi + series - prod.ln())
}

/// How M(a, 1, z) was evaluated.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum KummerMethod {
    /// Direct power series (DLMF 13.2.2).
    Series,
    /// Power series near 0, then this many Taylor steps of Kummer's equation along the ray.
    Continuation { steps: usize },
}

/// Power series of M(a, b, z) and of z M'(a, b, z).
fn series(a: Complex64, b: f64, z: Complex64) -> Result<(Complex64, Complex64), InputError> {
    let mut term = Complex64::new(1.0, 0.0);
    let mut s = CompensatedSum::new(term);
    let mut sd = CompensatedSum::new(Complex64::new(0.0, 0.0));
    let scale = a.norm() + z.norm() + b.abs();
    for n in 0..MAX_SERIES_TERMS {
        let nf = n as f64;
        term = term * (a + nf) * z / ((nf + 1.0) * (b + nf));
        s.add(term);
        sd.add(term * (nf + 1.0));
        let tm = term.norm() * (nf + 2.0);
        let size = s.value().norm() + sd.value().norm();
        if nf > scale && tm <= 1e-18 * size {
            return Ok((s.value(), sd.value()));
        }
        if term == Complex64::new(0.0, 0.0) {
            return Ok((s.value(), sd.value()));
        }
    }
    Err(InputError::NoConvergence { what: format!("power series of 1F1 at |z| = {}", z.norm()) })
}

/// One Taylor step of Kummer's equation from z0 (value f, derivative df) to z0 + h.
fn taylor_step(
    a: Complex64,
    b: f64,
    z0: Complex64,
    h: Complex64,
    f: Complex64,
    df: Complex64,
) -> Result<(Complex64, Complex64), InputError> {
    // Scaled coefficients d_n = c_n hⁿ.
    let mut d0 = f;
    let mut d1 = df * h;
    let mut sf = CompensatedSum::new(d0 + d1);
    let mut sdf = CompensatedSum::new(d1);
    let h2 = h * h;
    let inv_z0 = z0.inv();
    for n in 0..MAX_TAYLOR_TERMS {
        let nf = n as f64;
        let d2 = ((a + nf) * d0 * h2 - (nf + 1.0) * (nf + b - z0) * d1 * h) * inv_z0
            / ((nf + 1.0) * (nf + 2.0));
        sf.add(d2);
        sdf.add(d2 * (nf + 2.0));
        // L1 norms (no square roots): within √2 of the Euclidean ones.
        let size = l1(sf.sum) + l1(sdf.sum);
        if n >= 3 && (l1(d1) + l1(d2)) * (nf + 3.0) <= 1e-18 * size {
            return Ok((sf.value(), sdf.value() / h));
        }
        d0 = d1;
        d1 = d2;
    }
    Err(InputError::NoConvergence {
        what: format!("Taylor continuation of 1F1 at |z| = {}", z0.norm()),
    })
}

/// Largest local rate |d ln f/dz| of the solutions of Kummer's equation at |z| = x on the
/// imaginary axis, for |a| + b = `amag`: ½ + √(¼ + amag/x). At x ≫ amag this is the rate
/// 1 + amag/x of e^z z^{a−b}; at x ≪ amag the Bessel-like rate √(amag/x) of
/// M ≈ J₀(2√(αx)) (from the Whittaker form W'' = −(¼ + α/x + …)W on the ray; derived here).
fn local_rate(amag: f64, x: f64) -> f64 {
    0.5 + (0.25 + amag / x).sqrt()
}

/// The radius where the direct series stops and continuation starts, for |a| = `amag`.
pub(crate) fn series_radius(amag: f64) -> f64 {
    if amag > 0.0 {
        SERIES_T.min(SERIES_ALPHA_T / amag)
    } else {
        SERIES_T
    }
}

/// A-priori count of continuation steps from the series radius out to |z| = `t` for |a| = `amag`
/// (b = 1): ln(t/t_s)/ln 1.35 for the steps bounded by 0.35|z|, plus ≤ (t + 2√((|a| + 1)t))/3
/// for those bounded by the local oscillation (an upper estimate).
pub fn continuation_steps_estimate(amag: f64, t: f64) -> f64 {
    let ts = series_radius(amag);
    if t.is_nan() || t <= ts {
        return 0.0;
    }
    // ∫ local_rate dx / STEP_PHASE ≤ (t + 2√((|a| + 1) t)) / STEP_PHASE, plus the steps bounded
    // by 0.35|z|.
    let geometric = (t / ts).ln() / (1.0 + STEP_FRACTION).ln();
    let oscillation = (t + 2.0 * ((amag + 1.0) * t).sqrt()) / STEP_PHASE;
    geometric + oscillation
}

/// Kummer's function M(a, 1, z) = ₁F₁(a; 1; z) for the lensing arguments a = iα, z = it.
///
/// # Formula
/// M(a, b, z) = Σ_{n≥0} (a)_n zⁿ / ((b)_n n!) (DLMF 13.2.2) near 0, continued along the ray
/// by Taylor steps of z f'' + (b − z) f' − a f = 0 (DLMF 13.2.1); see the module docs.
///
/// # Domain
/// α ≥ 0 and t ≥ 0, finite. Cost grows like (t + α ln t)/3 steps; [`continuation_steps_estimate`]
/// gives it before calling.
///
/// # Errors
/// [`InputError::OutOfRange`] for negative or non-finite α or t; [`InputError::NoConvergence`]
/// if a series or a step fails to converge or more than 400 000 steps would be needed.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::kummer::kummer_m_imaginary;
/// // M(0.5i, 1, 0.045i) = 0.97762875811396367 − 0.00025121069711748296i
/// // (mpmath 1.3, mp.dps = 30, hyp1f1(0.5j, 1, 0.045j); tests/reference/lensing_mpmath.py).
/// let (m, _) = kummer_m_imaginary(0.5, 0.045).unwrap();
/// assert!((m.re - 0.977628758113964).abs() < 1e-14 && (m.im + 0.000251210697117483).abs() < 1e-14);
/// ```
pub fn kummer_m_imaginary(alpha: f64, t: f64) -> Result<(Complex64, KummerMethod), InputError> {
    if !(alpha.is_finite() && alpha >= 0.0) {
        return Err(InputError::OutOfRange { field: "alpha", value: alpha, allowed: "0 ≤ α < ∞".into() });
    }
    if !(t.is_finite() && t >= 0.0) {
        return Err(InputError::OutOfRange { field: "t", value: t, allowed: "0 ≤ t < ∞".into() });
    }
    let a = Complex64::new(0.0, alpha);
    let b = 1.0;
    let dir = Complex64::new(0.0, 1.0);
    let ts = series_radius(alpha);
    if t <= ts {
        let (m, _) = series(a, b, dir * t)?;
        return Ok((m, KummerMethod::Series));
    }
    let (mut f, zdf) = series(a, b, dir * ts)?;
    let mut df = zdf / (dir * ts);
    let mut x = ts;
    let amag = alpha + b;
    let mut steps = 0usize;
    while x < t {
        if steps >= MAX_STEPS {
            return Err(InputError::NoConvergence {
                what: format!("1F1 continuation needs more than {MAX_STEPS} steps (|z| = {t}, |a| = {alpha})"),
            });
        }
        let mut dx = (STEP_FRACTION * x).min(STEP_PHASE / local_rate(amag, x));
        if x + dx > t || t - (x + dx) < 1e-3 * dx {
            dx = t - x;
        }
        let (nf, ndf) = taylor_step(a, b, dir * x, dir * dx, f, df)?;
        f = nf;
        df = ndf;
        x = if dx == t - x { t } else { x + dx };
        steps += 1;
    }
    Ok((f, KummerMethod::Continuation { steps }))
}

/// Smallest |z| at which the large-|z| expansion is tried.
pub(crate) const ASYMPTOTIC_T_MIN: f64 = 40.0;
/// Largest term allowed in the asymptotic sums (limits the loss to cancellation to ~3 digits).
const ASYMPTOTIC_MAX_TERM: f64 = 1e3;

/// The two sums of the large-|z| expansion of M(iα, 1, it) (DLMF 13.7.2 with b = 1):
/// S₁ = Σ_s ((1 − a)_s)² / (s! z^s) and S₂ = Σ_s ((a)_s)² / (s! (−z)^s), a = iα, z = it.
///
/// # Formula
/// M(a, b, z) ~ e^z z^{a−b}/Γ(a) Σ (1 − a)_s (b − a)_s/(s! z^s)
///            + e^{iπa} z^{−a}/Γ(b − a) Σ (a)_s (a − b + 1)_s/(s! (−z)^s),
/// valid for −π/2 < arg z < 3π/2 (DLMF 13.7.2, upper sign; here arg z = π/2).
///
/// # Domain
/// Returns `None` unless t ≥ 40 and both sums reach a term below 1e-17 of their value before
/// their terms start to grow again (after the initial rise up to k ≈ (α² − t)/t when α² > t),
/// with no term above 1e3 (so the truncation and the rounding errors
/// are both ≲ 1e-13). In practice this holds when w/(2y²) = α²/t is of order 1 or less.
pub fn kummer_asymptotic_sums(alpha: f64, t: f64) -> Option<(Complex64, Complex64)> {
    if !(alpha.is_finite() && t.is_finite() && alpha >= 0.0 && t >= ASYMPTOTIC_T_MIN) {
        return None;
    }
    // The term ratio is ≈ (α² + k²)/((k + 1) t): terms may grow up to k₋ ≈ (α² − t)/t, then fall
    // until k₊ ≈ t, where the expansion starts to diverge. No window of decrease: no expansion.
    let disc = t * t - 4.0 * (alpha * alpha - t);
    if disc < 0.0 {
        return None;
    }
    let k_minus = (0.5 * (t - disc.sqrt())).max(0.0);
    let a = Complex64::new(0.0, alpha);
    let z = Complex64::new(0.0, t);
    let sum = |c: Complex64, x: Complex64| -> Option<Complex64> {
        // Σ_s ((c)_s)² / (s! x^s)
        let inv = x.inv();
        let mut term = Complex64::new(1.0, 0.0);
        let mut s = CompensatedSum::new(term);
        let mut last = 1.0f64;
        for k in 0..MAX_SERIES_TERMS {
            let kf = k as f64;
            term = term * (c + kf) * (c + kf) * inv / (kf + 1.0);
            let m = term.norm();
            if m > ASYMPTOTIC_MAX_TERM || !m.is_finite() {
                return None;
            }
            if m <= 1e-17 * s.value().norm() {
                return Some(s.value());
            }
            if kf > k_minus + 2.0 && m > last {
                return None;
            }
            s.add(term);
            last = m;
        }
        None
    };
    let s1 = sum(Complex64::new(1.0, 0.0) - a, z)?;
    let s2 = sum(a, -z)?;
    Some((s1, s2))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ln_gamma_rejects_left_half_plane() {
        assert!(ln_gamma(Complex64::new(0.0, 1.0)).is_err());
        assert!(ln_gamma(Complex64::new(f64::NAN, 1.0)).is_err());
    }

    #[test]
    fn two_sum_is_exact() {
        // 1 + 1e-17 rounds to 1; the error term carries the 1e-17 (common practice, no source).
        let (s, c) = two_sum(1.0, 1e-17);
        assert_eq!(s, 1.0);
        assert_eq!(c, 1e-17);
    }
}
