//! Gauss–Legendre quadrature on an interval: one rule, a composite rule of equal panels, an
//! adaptive rule that compares two rule sizes, and an adaptive bisection for several integrands
//! at once.
//!
//! Sources: the Gauss–Legendre rule (Abramowitz & Stegun 1964, eq. 25.4.29, nodes and weights
//! from [`super::gauss_legendre`]); the error estimates by comparison of two rules and by
//! bisection are common practice (e.g. Davis & Rabinowitz 1984, *Methods of Numerical
//! Integration*, ch. 6, adaptive quadrature), with no formula of their own.

use super::Rule;

/// Integrates `f` over [a, b] with a Gauss–Legendre rule.
///
/// # Formula
/// ∫_a^b f ≈ h Σ_k w_k f(c + h x_k), c = (a + b)/2, h = (b − a)/2 (Abramowitz & Stegun 1964,
/// eq. 25.4.29); exact for polynomials of degree ≤ 2n − 1.
///
/// # Examples
/// ```
/// use chiwave_core::numeric::{gauss_legendre, integrate_gl};
/// // ∫_0^1 x⁵ dx = 1/6 (elementary), exact for the 3-point rule.
/// let s = integrate_gl(|x| x.powi(5), 0.0, 1.0, &gauss_legendre(3));
/// assert!((s - 1.0 / 6.0).abs() < 1e-15);
/// ```
pub fn integrate_gl(f: impl Fn(f64) -> f64, a: f64, b: f64, rule: &Rule) -> f64 {
    let (c, h) = (0.5 * (a + b), 0.5 * (b - a));
    rule.0.iter().zip(&rule.1).map(|(x, w)| w * f(c + h * x)).sum::<f64>() * h
}

/// Composite rule: [a, b] cut into `m` equal panels, each integrated with `rule`.
///
/// # Formula
/// Σ_{k<m} [`integrate_gl`] over [a + k h, a + (k + 1) h], h = (b − a)/m.
///
/// # Examples
/// ```
/// use chiwave_core::numeric::{gauss_legendre, quadrature::integrate_panels};
/// // ∫_0^π sin = 2 (elementary).
/// let s = integrate_panels(f64::sin, 0.0, std::f64::consts::PI, 4, &gauss_legendre(8));
/// assert!((s - 2.0).abs() < 1e-14);
/// ```
pub fn integrate_panels(f: impl Fn(f64) -> f64, a: f64, b: f64, m: usize, rule: &Rule) -> f64 {
    let h = (b - a) / m as f64;
    (0..m).map(|k| integrate_gl(&f, a + k as f64 * h, a + (k + 1) as f64 * h, rule)).sum()
}

/// Why an adaptive quadrature gave up.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum QuadratureFailure {
    /// The integrand returned NaN or ±∞ somewhere.
    NotFinite,
    /// The interval was halved `depth` times without reaching the tolerance.
    TooDeep,
}

/// Adaptive Gauss–Legendre: `coarse` and `fine` rules on [a, b]; accepted when they agree to the
/// relative tolerance `tol`, or to the absolute `tol · (b − a) · scale` (`scale` a typical size
/// of f); otherwise both halves are integrated the same way, at most `depth` times deep.
///
/// # Errors
/// [`QuadratureFailure::NotFinite`] when the fine rule gives a non-finite value,
/// [`QuadratureFailure::TooDeep`] when the depth is exhausted.
///
/// # Examples
/// ```
/// use chiwave_core::numeric::{cached_rule, quadrature::adaptive_gl};
/// // ∫_{−1}^{1} dx/(ε² + x²) = (2/ε) arctan(1/ε) (elementary); the peak of width ε = 0.01
/// // forces bisection.
/// let f = |x: f64| 1.0 / (1e-4 + x * x);
/// let s = adaptive_gl(&f, -1.0, 1.0, 1e-12, 1.0, 40, (cached_rule(16), cached_rule(24))).unwrap();
/// let exact = 200.0 * 100f64.atan();
/// assert!((s - exact).abs() < 1e-11 * exact);
/// ```
pub fn adaptive_gl(
    f: &impl Fn(f64) -> f64,
    a: f64,
    b: f64,
    tol: f64,
    scale: f64,
    depth: u32,
    (coarse, fine): (&Rule, &Rule),
) -> Result<f64, QuadratureFailure> {
    let lo = integrate_gl(f, a, b, coarse);
    let hi = integrate_gl(f, a, b, fine);
    if !hi.is_finite() {
        return Err(QuadratureFailure::NotFinite);
    }
    if (hi - lo).abs() <= tol * hi.abs().max((b - a) * scale) {
        return Ok(hi);
    }
    if depth == 0 {
        return Err(QuadratureFailure::TooDeep);
    }
    let m = 0.5 * (a + b);
    Ok(adaptive_gl(f, a, m, tol, scale, depth - 1, (coarse, fine))?
        + adaptive_gl(f, m, b, tol, scale, depth - 1, (coarse, fine))?)
}

/// Adaptive bisection with one Gauss–Legendre rule for `N` integrands at once, over the pieces
/// between consecutive `breaks`.
///
/// Each interval's value is compared with the sum over its two halves; an interval is accepted
/// when, for every component, the difference is below its share (by length) of the tolerance
/// `tol[k]` or below `rounding_floor` times ∫|f_k| over the halves (differences that small are
/// rounding, not truncation). At most `max_intervals` intervals are made; past that budget the
/// remaining intervals are accepted as they are. Returns the integrals and the summed
/// |differences| (an error estimate).
///
/// # Examples
/// ```
/// use chiwave_core::numeric::{gauss_legendre, quadrature::adaptive_bisection};
/// // ∫_0^1 (x, e^x) dx = (1/2, e − 1) (elementary).
/// let f = |x: f64| [x, x.exp()];
/// let (s, _) = adaptive_bisection(&f, &[0.0, 1.0], [1e-13; 2], &gauss_legendre(10), 100, 1e-14);
/// assert!((s[0] - 0.5).abs() < 1e-15 && (s[1] - (1f64.exp() - 1.0)).abs() < 1e-14);
/// ```
pub fn adaptive_bisection<const N: usize>(
    f: &dyn Fn(f64) -> [f64; N],
    breaks: &[f64],
    tol: [f64; N],
    rule: &Rule,
    max_intervals: usize,
    rounding_floor: f64,
) -> ([f64; N], [f64; N]) {
    // Value and integral of |f| (the latter sets the rounding floor of the comparison).
    let quad = |a: f64, b: f64| -> ([f64; N], [f64; N]) {
        let (c, h) = (0.5 * (a + b), 0.5 * (b - a));
        let mut s = [0.0; N];
        let mut sa = [0.0; N];
        for (x, w) in rule.0.iter().zip(&rule.1) {
            let y = f(c + h * x);
            for k in 0..N {
                s[k] += w * y[k];
                sa[k] += w * y[k].abs();
            }
        }
        (s.map(|x| x * h), sa.map(|x| x * h))
    };
    let mut sum = [0.0; N];
    let mut err = [0.0; N];
    if breaks.len() < 2 {
        return (sum, err);
    }
    let total = breaks[breaks.len() - 1] - breaks[0];
    let mut stack: Vec<(f64, f64, [f64; N])> =
        breaks.windows(2).filter(|w| w[1] > w[0]).map(|w| (w[0], w[1], quad(w[0], w[1]).0)).collect();
    let mut count = stack.len();
    while let Some((a, b, q)) = stack.pop() {
        let m = 0.5 * (a + b);
        let (ql, al) = quad(a, m);
        let (qr, ar) = quad(m, b);
        let share = (b - a) / total;
        let mut ok = true;
        let mut diff = [0.0; N];
        for k in 0..N {
            diff[k] = (q[k] - ql[k] - qr[k]).abs();
            if diff[k] > (tol[k] * share).max(rounding_floor * (al[k] + ar[k])) {
                ok = false;
            }
        }
        if ok || count >= max_intervals || m <= a || m >= b {
            for k in 0..N {
                sum[k] += ql[k] + qr[k];
                err[k] += diff[k];
            }
        } else {
            count += 1;
            stack.push((a, m, ql));
            stack.push((m, b, qr));
        }
    }
    (sum, err)
}
