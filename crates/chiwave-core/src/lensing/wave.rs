//! Wave optics of a point-mass lens: the amplification factor F(w, y).
//!
//! Source: Takahashi & Nakamura 2003, ApJ 595, 1039, astro-ph/0305055 (earlier Peters 1974;
//! Nakamura & Deguchi 1999). tests/lensing_wave.rs checks it three ways (an independent
//! evaluation of the diffraction integral, the y = 0 modulus, the geometric-optics limit).
//!
//! Conventions (docs/physics/lensing.md §2): waves ∝ e^{−iωt}; F = (w/(2πi)) ∫ d²x exp[i w T(x, y)] with
//! T = |x − y|²/2 − ln|x| − φ_m(y), so F = 1 without a lens and the minimum image carries phase 0.
//! w = 4 G M_Lz ω / c³ = 8π G M_Lz f / c³ with the *redshifted* lens mass M_Lz = (1 + z_L) M;
//! y = β/θ_E. Codes that use e^{+iωt} obtain the complex conjugate.
//!
//! Limits: F → 1 as w → 0 (diffraction: the lens has no effect on waves longer than its
//! Schwarzschild radius); F → F_geo = √|μ₊| − i√|μ₋| e^{iwΔT} as w → ∞, the difference falling
//! like 1/w; at y = 0, |F|² = πw/(1 − e^{−πw}) (finite, unlike the geometric magnification).

use super::kummer::{
    continuation_steps_estimate, kummer_asymptotic_sums, kummer_m_imaginary, ln_gamma, KummerMethod,
};
use super::PointLens;
use crate::error::InputError;
use num_complex::Complex64;
use serde::Serialize;
use std::f64::consts::PI;

/// Largest w accepted by the wave-optics functions.
pub const W_MAX: f64 = 1e8;
/// Largest y = β/θ_E accepted by the wave-optics functions.
pub const Y_MAX: f64 = 1e6;
/// Budget of Taylor-continuation steps for the exact F (a few ms natively); above it
/// [`amplification`] switches to geometric optics and [`amplification_factor`] refuses.
pub const EXACT_STEP_BUDGET: f64 = 60_000.0;

/// Dimensionless frequency w = 8π G M_Lz f / c³.
///
/// # Formula
/// w = 4 G M_Lz ω / c³ = 8π G M_Lz f / c³ with M_Lz = (1 + z_L) M (Takahashi & Nakamura 2003,
/// astro-ph/0305055). `gm_redshifted` is G M_Lz in m³ s⁻².
///
/// # Domain
/// Both arguments finite and > 0; the result is finite unless their product overflows.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::wave::dimensionless_frequency;
/// use chiwave_core::units::iau2015::GM_SUN;
/// // For 1 M☉, w = 1 at f = c³/(8π G M) = 8078.1 Hz (evaluated by hand with IAU 2015
/// // nominal GM☉).
/// let w = dimensionless_frequency(GM_SUN, 8078.1);
/// assert!((w - 1.0).abs() < 1e-5);
/// ```
pub fn dimensionless_frequency(gm_redshifted: f64, frequency_hz: f64) -> f64 {
    use crate::units::codata2018::C;
    8.0 * PI * gm_redshifted * frequency_hz / (C * C * C)
}

/// Phase of the minimum image, φ_m(y) = (x_m − y)²/2 − ln x_m with x_m = (y + √(y² + 4))/2.
///
/// # Formula
/// Takahashi & Nakamura 2003, astro-ph/0305055. x_m − y is computed as
/// 2/(y + √(y² + 4)) to avoid cancellation at large y.
///
/// # Examples
/// ```
/// // y = 0: x_m = 1, φ_m = 1/2 (elementary).
/// assert_eq!(chiwave_core::lensing::wave::phi_m(0.0), 0.5);
/// ```
pub fn phi_m(y: f64) -> f64 {
    let s = y.hypot(2.0);
    let xm = 0.5 * (y + s);
    let d = 2.0 / (y + s);
    0.5 * d * d - xm.ln()
}

fn check_w(w: f64) -> Result<f64, InputError> {
    if !w.is_finite() {
        return Err(InputError::NotFinite { field: "w", value: w });
    }
    if !(0.0..=W_MAX).contains(&w) {
        return Err(InputError::OutOfRange { field: "w", value: w, allowed: format!("0 ≤ w ≤ {W_MAX:e}") });
    }
    Ok(w)
}

fn check_y(y: f64) -> Result<f64, InputError> {
    if !y.is_finite() {
        return Err(InputError::NotFinite { field: "y", value: y });
    }
    if !(0.0..=Y_MAX).contains(&y) {
        return Err(InputError::OutOfRange { field: "y", value: y, allowed: format!("0 ≤ y ≤ {Y_MAX:e} (y = β/θ_E)") });
    }
    Ok(y)
}

/// How an amplification factor was obtained.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(tag = "method", rename_all = "snake_case")]
pub enum Method {
    /// Exact formula, ₁F₁ by its power series.
    Series,
    /// Exact formula, ₁F₁ by power series near 0 and this many Taylor steps along the ray.
    Continuation { steps: usize },
    /// Exact formula, ₁F₁ by its large-|z| expansion (DLMF 13.7.2), converged to ≲ 1e-13.
    Asymptotic,
    /// Geometric-optics limit (the exact evaluation would exceed the step budget); error ~ 1/w.
    GeometricOptics,
}

impl Method {
    /// A short description for flags and tables.
    pub fn describe(self) -> String {
        match self {
            Method::Series => "exact (Takahashi & Nakamura 2003); 1F1 by its power series".into(),
            Method::Continuation { steps } => format!(
                "exact (Takahashi & Nakamura 2003); 1F1 by power series near 0 and {steps} Taylor steps of Kummer's equation"
            ),
            Method::Asymptotic => {
                "exact (Takahashi & Nakamura 2003); 1F1 by its converged large-|z| expansion (DLMF 13.7.2)".into()
            }
            Method::GeometricOptics => {
                "geometric-optics limit √|μ+| − i√|μ−| e^{iwΔT}: the exact evaluation would be too costly here; error of order 1/(wΔT) + 1/(wy²)".into()
            }
        }
    }
}

/// An amplification factor with the method that produced it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Amplification {
    pub value: Complex64,
    pub method: Method,
}

/// Whether the exact F(w, y) is available: the large-|z| expansion converges, or the
/// continuation fits the step budget.
pub fn exact_is_affordable(w: f64, y: f64) -> bool {
    let alpha = 0.5 * w;
    let t = alpha * y * y;
    continuation_steps_estimate(alpha, t) <= EXACT_STEP_BUDGET || kummer_asymptotic_sums(alpha, t).is_some()
}

/// F from the large-|z| expansion of ₁F₁ (DLMF 13.7.2, upper sign, arg z = π/2), with the
/// prefactors of Takahashi & Nakamura's F combined by hand (derived here, no source):
/// F ≈ e^{−iw(ln y + φ_m)} S₂ + y⁻² e^{iΦ} S₁, Φ = 2 Im ln Γ(1 − iα) + t + α ln t + α ln α − 2αφ_m,
/// α = w/2, t = αy². The first term is the undeflected wave's phase relative to the minimum
/// image; the second has modulus ~ 1/y², like the faint image. Nothing overflows.
fn amplification_asymptotic(w: f64, y: f64) -> Result<Option<Complex64>, InputError> {
    let alpha = 0.5 * w;
    let t = alpha * y * y;
    let Some((s1, s2)) = kummer_asymptotic_sums(alpha, t) else {
        return Ok(None);
    };
    let pm = phi_m(y);
    let theta = ln_gamma(Complex64::new(1.0, -alpha))?.im;
    let direct = Complex64::from_polar(1.0, -w * (y.ln() + pm)) * s2;
    let phase = 2.0 * theta + t + alpha * t.ln() + alpha * alpha.ln() - 2.0 * alpha * pm;
    let other = Complex64::from_polar(1.0 / (y * y), phase) * s1;
    Ok(Some(direct + other))
}

/// Exact point-lens amplification factor F(w, y).
///
/// # Formula
/// F(w, y) = exp[πw/4 + i(w/2)(ln(w/2) − 2φ_m(y))] Γ(1 − iw/2) ₁F₁(iw/2; 1; iwy²/2)
/// (Takahashi & Nakamura 2003, astro-ph/0305055). The prefactor
/// and Γ are combined as one exponent through ln Γ, so nothing overflows at large w.
///
/// # Domain
/// 0 ≤ w ≤ 1e8 and 0 ≤ y ≤ 1e6, finite, and [`exact_is_affordable`]: the large-|z| expansion
/// converges (roughly w ≲ 18y²) or the continuation needs ≤ 60 000 steps (≈ wy(y + 2)/6).
/// Together these cover every y in [0, 1e6] for w ≤ 2000 (scanned in the tests); at larger w
/// gaps open near y ~ 10 (w = 3000: 10 < y < 12.5), and at y ≤ 1 F is exact up to w ≈ 1e5.
/// F(0, y) = 1. y = 0 is allowed
/// (no continuation is needed there, at any w): |F|² = πw/(1 − e^{−πw}).
///
/// Accuracy: ≈ 1e-15 relative for w ≲ 10, degrading like ~1e-16·w because phases of size
/// w ln w are carried in f64 (7e-13 observed at w = 1000 against mpmath).
///
/// # Errors
/// [`InputError::NotFinite`] / [`InputError::OutOfRange`] naming `w` or `y`; `OutOfRange` on `w`
/// beyond the step budget (use [`amplification`], which falls back to geometric optics);
/// [`InputError::NoConvergence`] if a series fails.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::wave::amplification_factor;
/// // mpmath 1.3 (tests/reference/lensing_mpmath.py): F(1, 0.3) = 1.67924419493817 − 0.564230508370834 i.
/// let (f, _) = amplification_factor(1.0, 0.3).unwrap();
/// assert!((f.re - 1.67924419493817).abs() < 1e-12);
/// assert!((f.im + 0.564230508370834).abs() < 1e-12);
/// ```
pub fn amplification_factor(w: f64, y: f64) -> Result<(Complex64, Method), InputError> {
    let w = check_w(w)?;
    let y = check_y(y)?;
    if w == 0.0 {
        return Ok((Complex64::new(1.0, 0.0), Method::Series));
    }
    if let Some(f) = amplification_asymptotic(w, y)? {
        return Ok((f, Method::Asymptotic));
    }
    let alpha = 0.5 * w;
    if continuation_steps_estimate(alpha, alpha * y * y) > EXACT_STEP_BUDGET {
        return Err(InputError::OutOfRange {
            field: "w",
            value: w,
            allowed: format!(
                "exact F needs about {:.0} Taylor steps at y = {y}, above the budget of {EXACT_STEP_BUDGET:.0}; use the geometric-optics limit (error ~ 1/w)",
                continuation_steps_estimate(0.5 * w, 0.5 * w * y * y)
            ),
        });
    }
    let lg = ln_gamma(Complex64::new(1.0, -alpha))?;
    let exponent = Complex64::new(0.25 * PI * w, alpha * (alpha.ln() - 2.0 * phi_m(y))) + lg;
    let (m, km) = kummer_m_imaginary(alpha, alpha * y * y)?;
    let f = exponent.exp() * m;
    if !(f.re.is_finite() && f.im.is_finite()) {
        return Err(InputError::NoConvergence { what: format!("F(w = {w}, y = {y}) is not finite") });
    }
    let method = match km {
        KummerMethod::Series => Method::Series,
        KummerMethod::Continuation { steps } => Method::Continuation { steps },
    };
    Ok((f, method))
}

/// Geometric-optics limit of the point-lens amplification factor.
///
/// # Formula
/// F_geo = √|μ₊| − i √|μ₋| e^{iwΔT(y)}, ΔT = y√(y² + 4)/2 + 2 asinh(y/2) (the image time delay in
/// units of 4GM_Lz/c³) (Takahashi & Nakamura 2003, astro-ph/0305055). The −i
/// is the Morse phase of the saddle image.
///
/// # Domain
/// w ≥ 0 and 1e-10 ≤ y ≤ 1e6 (the point-source magnification diverges at y = 0).
///
/// # Errors
/// Range errors naming `w` or `y`.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::wave::amplification_geometric;
/// // At w = 0, F_geo = √|μ+| − i√|μ−|; μ± at y = 0.5 from Paczyński 1986 (evaluated by hand):
/// // 1.5914103126635 and −0.591410312663498.
/// let f = amplification_geometric(0.0, 0.5).unwrap();
/// assert!((f.re - 1.5914103126635f64.sqrt()).abs() < 1e-12);
/// assert!((f.im + 0.591410312663498f64.sqrt()).abs() < 1e-12);
/// ```
pub fn amplification_geometric(w: f64, y: f64) -> Result<Complex64, InputError> {
    let w = check_w(w)?;
    let lens = PointLens::new(y).map_err(|e| rename(e, "y"))?;
    let [mp, mm] = lens.magnifications();
    let phase = w * lens.time_delay();
    let saddle = Complex64::new(0.0, -mm.abs().sqrt()) * Complex64::from_polar(1.0, phase);
    Ok(Complex64::new(mp.abs().sqrt(), 0.0) + saddle)
}

fn rename(e: InputError, field: &'static str) -> InputError {
    match e {
        InputError::OutOfRange { value, allowed, .. } => InputError::OutOfRange { field, value, allowed },
        InputError::NotFinite { value, .. } => InputError::NotFinite { field, value },
        other => other,
    }
}

/// Smallest w at which [`amplification`] may stand in the geometric-optics limit for the exact F
/// (there the two differ by ≲ 1/w ≈ 2 %; common practice, no source).
pub const GEOMETRIC_FALLBACK_W_MIN: f64 = 50.0;

/// F(w, y) exact where affordable, otherwise (for w ≥ 50) its geometric-optics limit, flagged
/// in `method`.
///
/// # Errors
/// As [`amplification_factor`] for bad w or y; `OutOfRange` on `y` if the exact F is too costly
/// and w < 50 (geometric optics would be wrong there; this needs y ≳ 85, far outside the range
/// where the large-|z| expansion fails, so it is not expected to occur). At y = 0 the exact
/// formula needs no continuation and is always available.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::wave::{amplification, Method};
/// let a = amplification(1e6, 1.0).unwrap();
/// assert_eq!(a.method, Method::GeometricOptics);
/// ```
pub fn amplification(w: f64, y: f64) -> Result<Amplification, InputError> {
    let w = check_w(w)?;
    let y = check_y(y)?;
    if exact_is_affordable(w, y) {
        let (value, method) = amplification_factor(w, y)?;
        return Ok(Amplification { value, method });
    }
    if w < GEOMETRIC_FALLBACK_W_MIN {
        return Err(InputError::OutOfRange {
            field: "y",
            value: y,
            allowed: format!("the exact F at w = {w} is too costly at this y, and geometric optics needs w ≥ {GEOMETRIC_FALLBACK_W_MIN}"),
        });
    }
    let value = amplification_geometric(w, y)?;
    Ok(Amplification { value, method: Method::GeometricOptics })
}

/// Plot data for |F| and arg F against w on a logarithmic grid.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct AmplificationCurve {
    /// y = β/θ_E of the curve.
    pub y: f64,
    /// Dimensionless frequencies, logarithmically spaced from w_min to w_max.
    pub w: Vec<f64>,
    /// |F(w, y)|.
    pub abs: Vec<f64>,
    /// arg F(w, y) in radians, in (−π, π].
    pub phase: Vec<f64>,
    /// |F_geo(w, y)|; absent at y = 0, where the geometric magnification diverges.
    pub abs_geometric: Option<Vec<f64>>,
    /// true where F is the exact formula, false where the geometric limit stood in for it.
    pub exact: Vec<bool>,
}

/// |F|, arg F and |F_geo| on n logarithmically spaced w from `w_min` to `w_max`.
///
/// # Domain
/// 0 < w_min < w_max ≤ 1e8, 0 ≤ y ≤ 1e6, 2 ≤ n ≤ 4000.
///
/// # Errors
/// Range errors naming `w_min`, `w_max`, `y` or `n`.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::wave::amplification_curve;
/// let c = amplification_curve(0.0, 0.01, 100.0, 5).unwrap();
/// // At y = 0, |F|² = πw/(1 − e^{−πw}) (Takahashi & Nakamura 2003, y = 0 limit); at w = 100
/// // that is 100π.
/// assert!((c.abs[4].powi(2) / (100.0 * std::f64::consts::PI) - 1.0).abs() < 1e-10);
/// ```
pub fn amplification_curve(y: f64, w_min: f64, w_max: f64, n: usize) -> Result<AmplificationCurve, InputError> {
    let y = check_y(y)?;
    crate::error::positive("w_min", w_min)?;
    crate::error::positive("w_max", w_max)?;
    if w_max > W_MAX || w_min >= w_max {
        return Err(InputError::OutOfRange {
            field: "w_max",
            value: w_max,
            allowed: format!("w_min < w_max ≤ {W_MAX:e}"),
        });
    }
    if !(2..=4000).contains(&n) {
        return Err(InputError::OutOfRange { field: "n", value: n as f64, allowed: "2 ≤ n ≤ 4000".into() });
    }
    let (l0, l1) = (w_min.ln(), w_max.ln());
    let mut out = AmplificationCurve {
        y,
        w: Vec::with_capacity(n),
        abs: Vec::with_capacity(n),
        phase: Vec::with_capacity(n),
        abs_geometric: if y > 0.0 { Some(Vec::with_capacity(n)) } else { None },
        exact: Vec::with_capacity(n),
    };
    for k in 0..n {
        let w = if k == n - 1 { w_max } else { (l0 + (l1 - l0) * k as f64 / (n - 1) as f64).exp() };
        let a = amplification(w, y)?;
        out.w.push(w);
        out.abs.push(a.value.norm());
        out.phase.push(a.value.arg());
        out.exact.push(a.method != Method::GeometricOptics);
        if let Some(g) = out.abs_geometric.as_mut() {
            g.push(amplification_geometric(w, y)?.norm());
        }
    }
    Ok(out)
}
