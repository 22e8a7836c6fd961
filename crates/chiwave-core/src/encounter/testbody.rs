//! Test-body (ν → 0) limit: exact Schwarzschild timelike-geodesic scattering angle, its capture
//! threshold, and its PM coefficients generated to any order.
//!
//! Orbit (Chandrasekhar 1983, *The Mathematical Theory of Black Holes*, ch. 3;
//! docs/physics/encounter.md §3), with y = j·GM/r and ε = 1/j:
//! (dy/dφ)² = F(y) = p∞² + 2εy − y² + 2εy³ = 2ε (y₀ − y)(y₁ − y)(y − y₂),
//! χ = 2∫₀^{y₀} dy/√F − π. Capture when F has no positive root.

use super::kinematics::RelativeSpeed;
use crate::error::InputError;
use crate::numeric::{cached_rule, Rule};
use std::f64::consts::PI;
use std::sync::OnceLock;

/// Highest PM order for which [`pm_coefficient`] is tabulated.
pub const MAX_ORDER: usize = 12;

/// Γ(n/2) for an integer n; `None` at the poles (n ≤ 0 even).
fn gamma_half(n: i64) -> Option<f64> {
    if n <= 0 && n % 2 == 0 {
        return None;
    }
    // Start from Γ(1/2) = √π or Γ(1) = 1 and step by x → x ± 1.
    let (mut x2, mut g) = if n % 2 == 0 { (2_i64, 1.0) } else { (1_i64, PI.sqrt()) };
    while x2 < n {
        g *= x2 as f64 / 2.0;
        x2 += 2;
    }
    while x2 > n {
        x2 -= 2;
        g /= x2 as f64 / 2.0;
    }
    Some(g)
}

/// c[k−1][i] = coefficient of p^{2i−k} in χ_k^Schw, i = 0..=k.
fn table() -> &'static Vec<Vec<f64>> {
    static T: OnceLock<Vec<Vec<f64>>> = OnceLock::new();
    T.get_or_init(|| {
        let mut out = Vec::with_capacity(MAX_ORDER);
        for k in 1..=MAX_ORDER as i64 {
            // binom(−1/2, k) · 2^k
            let mut bin = 1.0;
            for r in 0..k {
                bin *= (-0.5 - r as f64) / (r + 1) as f64;
            }
            let pre = bin * 2f64.powi(k as i32);
            let mut row = Vec::with_capacity(k as usize + 1);
            let mut ck = 1.0; // C(k, i)
            for i in 0..=k {
                let m = k + 2 * i;
                // ½ B((m+1)/2, 1/2 − k) = ½ Γ((m+1)/2) Γ(1/2 − k)/Γ(m/2 + 1 − k), 0 at the poles of the denominator.
                let num = gamma_half(m + 1).unwrap_or(0.0) * gamma_half(1 - 2 * k).unwrap_or(0.0);
                let beta = match gamma_half(m + 2 - 2 * k) {
                    Some(d) => 0.5 * num / d,
                    None => 0.0,
                };
                row.push(pre * ck * beta);
                ck = ck * (k - i) as f64 / (i + 1) as f64;
            }
            out.push(row);
        }
        out
    })
}

/// Test-body PM coefficient χ_n^Schw(γ) of χ/2 = Σ χ_n/jⁿ, generated in code for 1 ≤ n ≤ 12.
///
/// # Formula
/// Expanding the orbit integral in ε = 1/j about the flat-space turning point with Hadamard's
/// finite part (the standard analytic-continuation method, e.g. Damour & Schäfer 1988, Nuovo
/// Cimento B 101, 127; used for the PM angle in Damour 2018, arXiv:1710.10599):
/// χ_n = binom(−1/2, n) 2ⁿ Σᵢ C(n, i) · ½ p^{2i−n} B((n + 2i + 1)/2, 1/2 − n),
/// from g(y) = 2y + 2y³ in F = p² − y² + ε g(y) and Pf∫₀^p y^m (p² − y²)^{−1/2−n} dy =
/// ½ p^{m−2n} B((m+1)/2, 1/2 − n). Checked (tests/encounter.rs) against the closed forms of
/// χ₁…χ₆ (χ₁–χ₃: the ν → 0 limits of Damour 2018, arXiv:1710.10599 and Bern et al. 2019,
/// arXiv:1901.04424; χ₄: Damour 2020, arXiv:1912.02139; χ₅, χ₆: a high-precision fit of the exact
/// quadrature with integer-relation identification, recalled from memory) and against the exact
/// quadrature.
///
/// # Domain
/// n in 1..=12; returns `None` otherwise.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{kinematics::RelativeSpeed, testbody};
/// let b = RelativeSpeed::from_gamma(2.0).unwrap();
/// // χ₂^Schw = (3π/8)(5γ² − 1) = (3π/8)·19 (Bini & Damour 2017, arXiv:1706.06877, ν → 0)
/// let c2 = testbody::pm_coefficient(2, &b).unwrap();
/// assert!((c2 - 3.0 * std::f64::consts::PI / 8.0 * 19.0).abs() < 1e-13);
/// ```
pub fn pm_coefficient(n: usize, b: &RelativeSpeed) -> Option<f64> {
    if n == 0 || n > MAX_ORDER {
        return None;
    }
    let row = &table()[n - 1];
    let p = b.p_inf;
    let p2 = p * p;
    // Σ c_i p^{2i−n} = p^{−n} Σ c_i (p²)^i (Horner).
    let s = row.iter().rev().fold(0.0, |acc, c| acc * p2 + c);
    Some(s / p.powi(n as i32))
}

/// Critical reduced angular momentum j_c of the unstable circular orbit at energy γ (test body):
/// capture for j ≤ j_c.
///
/// # Formula
/// r_c = [3γ² − 4 + γ√(9γ² − 8)] / (2(γ² − 1)), j_c = L_c = r_c/√(r_c − 3) (units GM;
/// the unstable circular orbit of the Schwarzschild effective potential, Misner, Thorne & Wheeler
/// 1973, §25.5; checked by bracketing in tests/encounter.rs). Limits: γ → ∞: j_c/p∞ → 3√3;
/// γ → 1: j_c → 4.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{kinematics::RelativeSpeed, testbody};
/// let b = RelativeSpeed::from_gamma(10.0).unwrap();
/// // mpmath 1.3, dps 40, tests/reference/encounter_mpmath.py: jcrit(10) = 51.87475261674174
/// assert!((testbody::critical_j(&b) - 51.87475261674174).abs() < 1e-11);
/// ```
pub fn critical_j(b: &RelativeSpeed) -> f64 {
    let g = b.gamma;
    let p2 = b.p_inf * b.p_inf;
    // r_c − 3 = [γ√(9p² + 1) − (3p² + 1)]/(2p²) = 2/(γ√(9p² + 1) + 3p² + 1) exactly
    // (γ² = 1 + p²), free of cancellation at both ends (γ → 1: r_c → 4; γ → ∞: r_c → 3).
    let d = 2.0 / (g * (9.0 * p2 + 1.0).sqrt() + 3.0 * p2 + 1.0);
    (3.0 + d) / d.sqrt()
}

/// Outcome of the exact test-body computation.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum TestBody {
    /// Scattered with total angle `chi` (radians) and periapsis r_min (units of GM).
    Scattered { chi: f64, r_min: f64 },
    /// No turning point: the body falls into the hole.
    Captured,
}

/// Gauss–Legendre rules used by the quadrature (computed once).
fn rules() -> [&'static Rule; 2] {
    [cached_rule(12), cached_rule(24)]
}

/// Exact test-body scattering angle in Schwarzschild at the same γ and j (geodesic quadrature).
///
/// # Formula
/// With y₀ the smallest positive root of F (found by safeguarded Newton between the extrema of F)
/// and the exact factorisation F(y) = (y₀ − y) G(y), G = (y₀ + y) − 2ε(1 + y₀² + y₀y + y²)
/// = 2ε(y₁ − y)(y − y₂):
/// χ/2 = ∫₀^{y₀} [F^{−1/2} − (y₀² − y²)^{−1/2}] dy (the subtracted term integrates to π/2), whose
/// integrand is the cancellation-free 2ε(1 + y₀² + y₀y + y²)/[√(y₀ − y) √G √(y₀+y) (√G + √(y₀+y))].
/// The endpoint substitution y = y₀(1 − s²) (docs/physics/encounter.md §3) followed by
/// s = √(δ/y₀) sinh t, δ = y₁ − y₀, removes both the square-root endpoint and the logarithmic
/// peak near capture on y ∈ [y₀/2, y₀]; on [0, y₀/2] the variable
/// w = √(y − y₂) removes the near-singularity of slow, strongly bent orbits. Composite 12- and
/// 24-point Gauss–Legendre on unit panels; their difference is the error estimate.
///
/// # Domain
/// Any validated boost and 0 < j ≤ 1e30. Capture (j ≤ j_c, [`critical_j`]) is a result.
///
/// # Errors
/// [`InputError::NoConvergence`] if the two rules disagree by more than 1e-10 relative (does not
/// happen in the tested domain; within ~1e-9 of the separatrix the angle diverges).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{kinematics::RelativeSpeed, testbody::{exact, TestBody}};
/// let b = RelativeSpeed::from_gamma(1.5).unwrap();
/// // mpmath 1.3, dps 40, raw quadrature (tests/reference/encounter_mpmath.py): 1.153856678266915
/// match exact(&b, 10.0).unwrap() {
///     TestBody::Scattered { chi, .. } => assert!((chi - 1.153856678266915).abs() < 1e-12),
///     TestBody::Captured => unreachable!(),
/// }
/// ```
pub fn exact(b: &RelativeSpeed, j: f64) -> Result<TestBody, InputError> {
    let p2 = b.p_inf * b.p_inf;
    let eps = 1.0 / j;
    // Extrema of F: F' = 6εy² − 2y + 2ε = 0; no real extrema (j² ≤ 12) means F increases: capture.
    let disc = 1.0 - 12.0 * eps * eps;
    if !(disc > 0.0) || j <= critical_j(b) {
        return Ok(TestBody::Captured);
    }
    let sq = disc.sqrt();
    // y_- = (1 − √disc)/(6ε) = 2ε/(1 + √disc) (local maximum), y_+ = (1 + √disc)/(6ε) (minimum).
    let y_lo = 2.0 * eps / (1.0 + sq);
    let y_hi = (1.0 + sq) / (6.0 * eps);
    let f = |y: f64| p2 + 2.0 * eps * y - y * y + 2.0 * eps * y * y * y;
    if !(f(y_hi) < 0.0) {
        return Ok(TestBody::Captured);
    }
    // Safeguarded Newton for y₀ in [y_lo, y_hi] where F decreases from > 0 to < 0.
    let (mut lo, mut hi) = (y_lo, y_hi);
    let mut y = b.p_inf.clamp(lo, hi);
    for _ in 0..200 {
        let fy = f(y);
        if fy > 0.0 {
            lo = y;
        } else {
            hi = y;
        }
        let d = 2.0 * eps - 2.0 * y + 6.0 * eps * y * y;
        let mut yn = y - fy / d;
        if !(yn > lo && yn < hi) {
            yn = 0.5 * (lo + hi);
        }
        if (yn - y).abs() <= 4.0 * f64::EPSILON * y {
            y = yn;
            break;
        }
        y = yn;
    }
    let y0 = y;
    // Remaining roots from Vieta: y₁ + y₂ = j/2 − y₀, y₁ y₂ = −p² j/(2 y₀).
    let s_sum = 0.5 * j - y0;
    let prod = -p2 * j / (2.0 * y0);
    let y1 = 0.5 * (s_sum + (s_sum * s_sum - 4.0 * prod).sqrt());
    let y2 = prod / y1;
    // δ = y₁ − y₀ from G(y₀) = 2y₀ − 2ε(1 + 3y₀²) = 2ε δ (y₀ − y₂), better conditioned than y₁ − y₀.
    let g0 = 2.0 * y0 - 2.0 * eps * (1.0 + 3.0 * y0 * y0);
    let delta = if g0 > 0.0 { g0 / (2.0 * eps * (y0 - y2)) } else { (y1 - y0).max(f64::MIN_POSITIVE) };
    // Piece A, y ∈ [y₀/2, y₀]: y = y₀(1 − s²), s = a sinh t, a = √(δ/y₀), s ≤ 1/√2.
    let a = (delta / y0).sqrt();
    let t_max = (std::f64::consts::FRAC_1_SQRT_2 / a).asinh();
    let piece_a = |t: f64| {
        let sh = a * t.sinh();
        let yy = y0 * (1.0 - sh * sh);
        let ch = t.cosh();
        let g = 2.0 * eps * delta * ch * ch * (yy - y2);
        let sp = (y0 + yy).sqrt();
        let n = 1.0 + y0 * y0 + y0 * yy + yy * yy;
        4.0 * eps * n / ((2.0 * eps * (yy - y2)).sqrt() * sp * (g.sqrt() + sp))
    };
    // Piece B, y ∈ [0, y₀/2]: w = √(y − y₂) removes the near-singularity at y = y₂ ≤ 0, which
    // approaches y = 0 for slow, strongly bent orbits.
    let piece_b = |w: f64| {
        let yy = y2 + w * w;
        let rest = 2.0 * eps * (y1 - yy);
        let g = rest * w * w;
        let sp = (y0 + yy).sqrt();
        let n = 1.0 + y0 * y0 + y0 * yy + yy * yy;
        4.0 * eps * n / ((y0 - yy).sqrt() * rest.sqrt() * sp * (g.sqrt() + sp))
    };
    let [r1, r2] = rules();
    let panels = (t_max.ceil() as usize).clamp(1, 200);
    let (mut i1, mut i2) = (0.0, 0.0);
    for k in 0..panels {
        let (lo, hi) = (t_max * k as f64 / panels as f64, t_max * (k + 1) as f64 / panels as f64);
        i1 += crate::numeric::integrate_gl(piece_a, lo, hi, r1);
        i2 += crate::numeric::integrate_gl(piece_a, lo, hi, r2);
    }
    let (w_lo, w_hi) = ((-y2).max(0.0).sqrt(), (0.5 * y0 - y2).sqrt());
    i1 += crate::numeric::integrate_gl(piece_b, w_lo, w_hi, r1);
    i2 += crate::numeric::integrate_gl(piece_b, w_lo, w_hi, r2);
    let chi = 2.0 * i2;
    // The 12-point rule's error bounds the 24-point one's from above (both converge
    // geometrically on these analytic integrands).
    if !chi.is_finite() || (i1 - i2).abs() > 1e-10 * i2.abs().max(1e-300) {
        return Err(InputError::NoConvergence {
            what: format!("test-body Schwarzschild quadrature at γ = {}, j = {j} (rules differ by {:e})", b.gamma, (i1 - i2).abs()),
        });
    }
    Ok(TestBody::Scattered { chi, r_min: 1.0 / (eps * y0) })
}
