//! Radiated energy–momentum at O(G³) and angular momentum at O(G²) in gravitational scattering.
//!
//! Sources: Herrmann, Parra-Martinez, Ruf, Zeng 2021, arXiv:2101.07255 (PRL 126, 201602; long
//! version arXiv:2104.03957) for P_rad^μ; Damour 2020, arXiv:2010.01641 for J_rad and I(v). Units G = c = 1, M = m1 + m2 = 1, b in GM/c².
//!
//! Both E(γ) and I(v) cancel catastrophically as v → 0 (their 1/v³ and 1/v² terms cancel): below
//! [`SERIES_SWITCH_V`] they are evaluated from their small-velocity series, whose coefficients
//! make the switch continuous to ≤ 1e-12 relative (tested).

use super::kinematics::RelativeSpeed;
use crate::numeric::poly;
use std::f64::consts::PI;

/// Relative speed v below which E and I use their small-velocity series.
///
/// At v = 0.3 the closed forms lose a factor ≈ 10 (E, written in γ − 1) and ≈ 150 (I) to
/// cancellation, and the 24-term E series is truncated at ~1e-24 (tests/reference/encounter_mpmath.py).
pub const SERIES_SWITCH_V: f64 = 0.3;

/// E(γ)/(π v) = Σ_k A[k] v^{2k}: Taylor coefficients by Cauchy integral in mpmath 1.3
/// (mp.taylor, method = 'quad', radius 0.5 in v², mp.dps = 40), tests/reference/encounter_mpmath.py.
/// The first three equal 37/15, 2393/840, 61703/10080 (the v-series of Herrmann et al. 2021's E(γ),
/// tests/reference/waveform_herrmann.py).
#[allow(clippy::excessive_precision)] // quoted with the digits the script printed
const E_SERIES: [f64; 24] = [
    2.466666666666666667,
    2.84880952380952381,
    6.121329365079365079,
    8.826656633297258297,
    11.12566446140664891,
    13.1590078758047508,
    15.00823484624036095,
    16.72193994800789554,
    18.33086526602718138,
    19.85559355031847532,
    21.31059208053491459,
    22.70645235769221166,
    24.05119649458528271,
    25.35107580454960258,
    26.61107962361513588,
    27.8352715200045242,
    29.02701866397766346,
    30.18915277874749719,
    31.32408592904342041,
    32.43389568162660892,
    33.52038898544579211,
    34.58515094085157068,
    35.62958262596225078,
    36.65493085652437936,
];

/// E(γ) of Herrmann, Parra-Martinez, Ruf & Zeng 2021 (arXiv:2101.07255), including the π:
/// P_rad^0 in the rest frame of body 2 is G³ m1² m2² E(γ)/b³.
///
/// # Formula
/// E/π = f₁ + f₂ ln((γ+1)/2) + f₃ γ arccosh(γ)/√(γ²−1), with
/// f₁ = (210γ⁶ − 552γ⁵ + 339γ⁴ − 912γ³ + 3148γ² − 3336γ + 1151)/(48(γ²−1)^{3/2}),
/// f₂ = −(35γ⁴ + 60γ³ − 150γ² + 76γ − 5)/(8√(γ²−1)),
/// f₃ = (2γ² − 3)(35γ⁴ − 30γ² + 11)/(16(γ²−1)^{3/2})  (**16** in this form; with 8 the last term carries 1/(2√(γ²−1))).
/// For v < 0.3: E = π v Σ A_k v^{2k} (24 terms; A₀ = 37/15 is the Newtonian quadrupole value).
///
/// # Domain
/// 1 ≤ γ ≤ 1e40. Special cases: E(1) = 0; γ < 1 or NaN → NaN (callers validate first);
/// γ → ∞: E/π → (35/8)(1 + 2 ln 2) γ³ (read off the formula: the ln γ terms of f₂ and f₃ cancel).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::radiated::e_function;
/// // mpmath 1.3, dps 40, tests/reference/encounter_mpmath.py: E(1.5) = 24.19824348449789
/// assert!((e_function(1.5) / 24.19824348449789 - 1.0).abs() < 1e-13);
/// // v → 0: E/(π v) → 37/15 (the Newtonian straight-line quadrupole energy, docs/physics/waveform.md §4)
/// assert!((e_function(1.0 + 5e-9) / (std::f64::consts::PI * 1e-4) - 37.0 / 15.0).abs() < 1e-6);
/// ```
pub fn e_function(gamma: f64) -> f64 {
    if gamma == 1.0 {
        return 0.0;
    }
    if !(gamma > 1.0) || gamma.is_infinite() {
        return f64::NAN;
    }
    let gm1 = gamma - 1.0;
    let p = (gm1 * (gamma + 1.0)).sqrt();
    e_of(gamma, gm1, p)
}

/// E(γ) from a [`RelativeSpeed`] (keeps the digits of γ − 1 for slow encounters).
pub fn e_of_speed(b: &RelativeSpeed) -> f64 {
    e_of(b.gamma, b.gamma_m1, b.p_inf)
}

/// E from γ, x = γ − 1 and p∞. The polynomials are re-expanded in x (exact integer
/// coefficients) and the logarithms use ln_1p, so that each of f₁, f₂, f₃ keeps full relative
/// precision near γ = 1; only their intrinsic 1/p³ cancellation remains (≈ 1e-15 at v = 0.3).
fn e_of(g: f64, x: f64, p: f64) -> f64 {
    let v = p / g;
    if v < SERIES_SWITCH_V {
        let w = v * v;
        let s = E_SERIES.iter().rev().fold(0.0, |acc, c| acc * w + c);
        return PI * v * s;
    }
    let p3 = p * p * p;
    // 210γ⁶ − 552γ⁵ + 339γ⁴ − 912γ³ + 3148γ² − 3336γ + 1151 with γ = 1 + x, etc.
    let f1 = poly::eval_descending(&[210.0, 708.0, 729.0, -876.0, 76.0, 80.0, 48.0], x) / (48.0 * p3);
    let f2 = -poly::eval_descending(&[35.0, 200.0, 240.0, 96.0, 16.0], x) / (8.0 * p);
    let f3 = poly::eval_descending(&[70.0, 420.0, 885.0, 740.0, 172.0, -16.0, -16.0], x) / (16.0 * p3);
    // ln((γ+1)/2) = ln(1 + x/2); arccosh γ = ln(γ + p∞) = ln(1 + x + p∞).
    PI * (f1 + f2 * (0.5 * x).ln_1p() + f3 * g * (x + p).ln_1p() / p)
}

/// I(v) of Damour 2020 (arXiv:2010.01641), entering χ₃^rad and J_rad.
///
/// # Formula
/// I(v) = −16/3 + 2/v² + 2(3v² − 1) arctanh(v)/v³. For v < 0.3 the exact series
/// I = Σ_{k≥1} [6/(2k+1) − 2/(2k+3)] v^{2k} = (8/5)v² + (32/35)v⁴ + (40/63)v⁶ + …
/// (from arctanh(v)/v = Σ v^{2n}/(2n+1); the series and the closed form are checked against
/// mpmath in the tests).
///
/// # Domain
/// 0 ≤ v < 1; I(0) = 0; v → 1: I → 4 ln(2γ) − 10/3 (diverges); outside → NaN.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::radiated::i_function;
/// // mpmath 1.3, dps 40, tests/reference/encounter_mpmath.py: I(0.5) = 0.4694420893304473
/// assert!((i_function(0.5) / 0.4694420893304473 - 1.0).abs() < 1e-14);
/// ```
pub fn i_function(v: f64) -> f64 {
    if !(0.0..1.0).contains(&v) {
        return f64::NAN;
    }
    if v < SERIES_SWITCH_V {
        return i_series(v);
    }
    (2.0 / (v * v) - 16.0 / 3.0) + 2.0 * (3.0 * v * v - 1.0) * v.atanh() / (v * v * v)
}

/// I from a [`RelativeSpeed`]: arctanh v = arccosh γ = ln(γ + p∞), so γ up to 1e6 keeps its digits.
pub fn i_of_speed(b: &RelativeSpeed) -> f64 {
    let v = b.v;
    if v < SERIES_SWITCH_V {
        return i_series(v);
    }
    let ath = (b.gamma + b.p_inf).ln();
    // 1/v² = γ²/p∞²
    let inv_v2 = (b.gamma / b.p_inf).powi(2);
    (2.0 * inv_v2 - 16.0 / 3.0) + 2.0 * (3.0 - inv_v2) * ath / v
}

fn i_series(v: f64) -> f64 {
    let w = v * v;
    let mut s = 0.0;
    let mut wk = w;
    for k in 1..=40 {
        let kf = k as f64;
        let term = (6.0 / (2.0 * kf + 1.0) - 2.0 / (2.0 * kf + 3.0)) * wk;
        s += term;
        if term < 1e-18 * s {
            break;
        }
        wk *= w;
    }
    s
}

/// CM-frame radiated energy E_rad/(M c²) = ν² (GM/b)³ E(γ)/h (Herrmann et al. 2021, arXiv:2101.07255, in the CM frame).
///
/// Source: Herrmann, Parra-Martinez, Ruf, Zeng 2021, arXiv:2101.07255. Slow limit:
/// E_rad → (37π/15) G³ m1² m2² v/b³.
pub fn e_rad(b: &RelativeSpeed, nu: f64, h: f64, b_over_gm: f64) -> f64 {
    nu * nu * e_of_speed(b) / (h * b_over_gm.powi(3))
}

/// CM-frame recoil: the radiated 3-momentum along body 1's incoming direction, units of M c,
/// P_rad = (G³ m1² m2²/b³) E(γ)/(γ + 1) · p (1/m1 − 1/m2) (from Herrmann et al. 2021,
/// arXiv:2101.07255, P_rad ∝ u1 + u2). The mechanical recoil of the pair is −P_rad.
pub fn p_rad_cm(b: &RelativeSpeed, m1: f64, m2: f64, p_cm: f64, b_over_gm: f64) -> f64 {
    let nu = m1 * m2;
    nu * nu * e_of_speed(b) / ((b.gamma + 1.0) * b_over_gm.powi(3)) * p_cm * (1.0 / m1 - 1.0 / m2)
}

/// Radiated angular momentum at O(G²), J_rad/J = 2(2γ² − 1) ν p∞ I(v)/(h² j²).
///
/// Source: Damour 2020, arXiv:2010.01641 (slow limit J_rad → (16/5) G² m1² m2² v²/(M b),
/// the quadrupole result on the straight line).
pub fn j_rad_over_j(b: &RelativeSpeed, nu: f64, h: f64, j: f64) -> f64 {
    2.0 * (2.0 * b.gamma * b.gamma - 1.0) * nu * b.p_inf * i_of_speed(b) / (h * h * j * j)
}
