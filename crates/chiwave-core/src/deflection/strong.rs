//! Strong-deflection (logarithmic) limit for Schwarzschild, b → b_c⁺.
//!
//! Source: Bozza 2002, Phys. Rev. D 66, 103001, gr-qc/0208075 (leading terms); the next-order
//! term was fitted to the exact angle in high precision (docs/physics/deflection.md §3; the
//! coefficient 5/18 identified to 14 digits), to be compared with Iyer & Petters 2007 (gr-qc/0611086), whose printed coefficients were not
//! compared.

use serde::Serialize;

/// ā = 1 (Bozza 2002, gr-qc/0208075, Schwarzschild coefficients).
pub const ABAR: f64 = 1.0;

/// b̄ = ln[216(7 − 4√3)] − π = −0.40023003975526165 (Bozza 2002, gr-qc/0208075).
pub fn bbar() -> f64 {
    // 7 − 4√3 = 1/(7 + 4√3), formed without cancellation.
    (216.0 / (7.0 + 4.0 * 3f64.sqrt())).ln() - std::f64::consts::PI
}

/// D1 = 1/18 + 2√3/9 + (5/18)(b̄ + π) = 1.20194534996934 (chiwave's fit, docs/physics/deflection.md §3;
/// tests/reference/deflection_mpmath.py).
pub fn d1() -> f64 {
    1.0 / 18.0 + 2.0 * 3f64.sqrt() / 9.0 + 5.0 / 18.0 * (bbar() + std::f64::consts::PI)
}

/// The strong-deflection estimates beside the exact value.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct StrongDeflection {
    /// d = b/b_c − 1, the expansion variable.
    pub d: f64,
    /// Leading log form −ā ln d + b̄ (radians).
    pub alpha: f64,
    /// Relative error of `alpha` against the exact α.
    pub rel_error: f64,
    /// With the next-order term d[−(5/18) ln d + D1] added.
    pub alpha_next_order: f64,
    /// Relative error of `alpha_next_order` against the exact α.
    pub rel_error_next_order: f64,
    pub abar: f64,
    pub bbar: f64,
    pub d1: f64,
}

/// Leading strong-deflection form α ≈ −ā ln(b/b_c − 1) + b̄ (Bozza 2002, gr-qc/0208075).
///
/// # Formula
/// α_SDL = −ln d + b̄, d = b/b_c − 1; error O(d ln d) (Bozza 2002). Next order:
/// α ≈ −ln d + b̄ + d[−(5/18) ln d + D1] (chiwave's fit, docs/physics/deflection.md §3).
///
/// # Domain
/// d > 0 (returns `None` otherwise); useful for d ≲ 10⁻².
///
/// # Examples
/// ```
/// use chiwave_core::deflection::strong::limit;
/// // mpmath 1.3, tests/reference/deflection_mpmath.py: exact α at d = 1e-6 is 13.415285557794178382
/// let (lead, next) = limit(1e-6).unwrap();
/// assert!((next - 13.415_285_557_794_178).abs() < 1e-9);
/// assert!((lead - 13.415_285_557_794_178).abs() < 2e-5);
/// ```
pub fn limit(d: f64) -> Option<(f64, f64)> {
    if !(d > 0.0 && d.is_finite()) {
        return None;
    }
    let lead = -ABAR * d.ln() + bbar();
    Some((lead, lead + d * (-5.0 / 18.0 * d.ln() + d1())))
}

/// Both estimates with their errors against `exact` (at d = b/b_c − 1 > 0).
pub fn compare(d: f64, exact: f64) -> Option<StrongDeflection> {
    let (lead, next) = limit(d)?;
    Some(StrongDeflection {
        d,
        alpha: lead,
        rel_error: (lead - exact) / exact,
        alpha_next_order: next,
        rel_error_next_order: (next - exact) / exact,
        abar: ABAR,
        bbar: bbar(),
        d1: d1(),
    })
}
