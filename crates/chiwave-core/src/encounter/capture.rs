//! Capture by gravitational radiation: is the pair bound after one passage?
//!
//! The pair is bound after the passage when the energy radiated exceeds the kinetic energy
//! available at infinity in the CM frame, E_rad > M(Γ − 1), Γ = E/M = √(1 + 2ν(γ − 1)). Two
//! estimates are given side by side (units G = c = 1, M = m1 + m2, b in GM/c²):
//!
//! * **Newtonian, parabolic** (Quinlan & Shapiro 1989, ApJ 343, 725; closed form in O'Leary,
//!   Kocsis & Loeb 2009, arXiv:0807.2638, MNRAS 395, 2127): the energy a parabolic encounter with
//!   periapsis r_p radiates, ΔE = (85π/(12√2)) G^{7/2} m1² m2² M^{1/2}/(c⁵ r_p^{7/2}), equated with
//!   μv²/2, and gravitational focusing b² ≈ 2GM r_p/v², give
//!   b_max = (340πν/3)^{1/7} (GM/c²)(c/v)^{9/7}.
//! * **Relativistic**: the exact Newtonian quadrupole energy loss on the Kepler hyperbola of
//!   eccentricity e = √(1 + (bv²/GM)²) (Hansen 1972, Phys. Rev. D 5, 1021),
//!   ΔE_H = (8/15) ν² M (GM/(c² p))^{7/2} c² I(e), p = b²v²/(GM),
//!   I(e) = (24 + 73e² + 37e⁴/4) arccos(−1/e) + (301/6 + 673e²/12) √(e² − 1),
//!   multiplied by the velocity factor of the O(G³) post-Minkowskian radiated energy
//!   (Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255),
//!   C(γ) = E(γ)/(Γ (37π/15) v) → 1 as v → 0. At large b, ΔE_H → (37π/15) ν² v/b³, so the
//!   product reproduces the O(G³) PM energy ν² E(γ)/(Γ b³) exactly at leading order in 1/b; as
//!   v → 0 it reduces to the Newtonian hyperbola, and its b_max tends to the parabolic closed form
//!   as b_max,rel/b_max,N − 1 ≃ (1/7)(I′(1)/I(1)) (e − 1) ∝ v^{10/7} (see
//!   `docs/physics/capture.md`, where the construction and its limits are set out).
//!
//! Neither estimate contains the relativistic corrections at periapsis (relative size
//! ≈ v_p² = v² + 2GM/(r_p c²), which grows like v^{4/7} along b_max as v → 0): the result carries
//! a flag with that number, and with the test-body plunge threshold b_c (Schwarzschild geodesic,
//! [`super::testbody::critical_j`]) when the radiative b_max comes near it.

// `!(x > 0.0)` is deliberate: unlike `x <= 0.0` it also rejects NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use crate::two_body::RelativeSpeed;
use super::radiated::e_of_speed;
use super::testbody::critical_j;
use crate::error::{positive, InputError};
use crate::validity::{Check, Flag, Level};
use serde::Serialize;
use std::f64::consts::PI;

/// The regime checks of this file: stable key and the label shown with it.
const CAPTURE_NEWTONIAN_SPEED: Check = Check::new("capture_newtonian_speed", "Newtonian capture speed v/c");
const CAPTURE_PERIAPSIS: Check = Check::new("capture_periapsis", "periapsis speed² at b_max");
const CAPTURE_PLUNGE_THRESHOLD: Check = Check::new("capture_plunge_threshold", "b_max vs plunge threshold");
const CAPTURE_PM_REGIME: Check = Check::new("capture_pm_regime", "PM parameter at b");
const DIRECT_PLUNGE: Check = Check::new("direct_plunge", "direct plunge b/b_c");

/// Hansen's I(e) for e ≥ 1, from x = √(e² − 1) (so that nothing cancels near e = 1).
///
/// # Formula
/// I = (24 + 73e² + 37e⁴/4) arccos(−1/e) + (301/6 + 673e²/12) √(e² − 1), the integral
/// ∫ (1 + e cos φ)² [12(1 + e cos φ)² + e² sin²φ] dφ over the hyperbola's true anomaly
/// |φ| < arccos(−1/e) (Hansen 1972, Phys. Rev. D 5, 1021; the angular form of the quadrupole power
/// of Peters & Mathews 1963, Phys. Rev. 131, 435, eq. 16). arccos(−1/e) = atan2(x, −1).
///
/// # Domain
/// x ≥ 0. Special cases: I(x = 0) = 425π/4 (parabola); x → ∞: I → (37π/8) x⁴ (straight line).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::capture::hansen_i;
/// // Parabola: I(1) = 425π/4 (the e = 1 limit of the formula; Peters' parabolic ΔE).
/// assert!((hansen_i(0.0) / (425.0 * std::f64::consts::PI / 4.0) - 1.0).abs() < 1e-15);
/// ```
pub fn hansen_i(x: f64) -> f64 {
    let x2 = x * x;
    let e2 = 1.0 + x2;
    (24.0 + 73.0 * e2 + 9.25 * e2 * e2) * x.atan2(-1.0) + (301.0 / 6.0 + 673.0 / 12.0 * e2) * x
}

/// Newtonian quadrupole energy radiated on a Kepler hyperbola, in units of M c², from ν, the
/// relative speed at infinity v (fraction of c) and b in GM/c².
///
/// # Formula
/// ΔE/(Mc²) = (8/15) ν² I(e)/p^{7/2}, p = b²v² (GM/c² units), e = √(1 + (bv²)²) (Hansen 1972);
/// written as (8/15) ν² v⁷ I(x)/x⁷ with x = bv².
///
/// # Domain
/// 0 < ν ≤ 1/4, 0 < v < 1, b > 0 (no check; NaN or 0 in, NaN or ∞ out).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::capture::hansen_energy;
/// // Straight-line limit b v² ≫ 1: (37π/15) ν² v/b³ (the slow limit of the O(G³) PM energy).
/// let (nu, v, b) = (0.25, 1e-2, 1e9);
/// let e = hansen_energy(nu, v, b);
/// assert!((e / (37.0 * std::f64::consts::PI / 15.0 * nu * nu * v / (b * b * b)) - 1.0).abs() < 1e-4);
/// ```
pub fn hansen_energy(nu: f64, v: f64, b: f64) -> f64 {
    let x = b * v * v;
    (8.0 / 15.0) * nu * nu * (hansen_i(x).ln() + 7.0 * (v / x).ln()).exp()
}

/// Newtonian parabolic-encounter capture impact parameter b_max/(GM/c²).
///
/// # Formula
/// b_max = (340πν/3)^{1/7} v^{−9/7} (O'Leary, Kocsis & Loeb 2009, arXiv:0807.2638; from
/// Quinlan & Shapiro 1989 with the parabolic energy loss ΔE = (85π/(12√2)) G^{7/2} m1² m2² M^{1/2}
/// /(c⁵ r_p^{7/2}), the e = 1 case of [`hansen_energy`], and b² ≈ 2GM r_p/v²).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::capture::b_max_newtonian;
/// // ν = 1/4, v = 1e-3: (85π/3)^{1/7} · 1e-3^{−9/7}
/// let b = b_max_newtonian(0.25, 1e-3);
/// assert!((b / ((85.0 * std::f64::consts::PI / 3.0).powf(1.0 / 7.0) * 1e-3f64.powf(-9.0 / 7.0)) - 1.0).abs() < 1e-14);
/// ```
pub fn b_max_newtonian(nu: f64, v: f64) -> f64 {
    (340.0 * PI * nu / 3.0).powf(1.0 / 7.0) * v.powf(-9.0 / 7.0)
}

/// The O(G³) PM velocity factor C(γ) = E(γ)/(Γ (37π/15) v) of the relativistic estimate: the
/// ratio of the PM radiated energy (Herrmann et al. 2021, arXiv:2101.07255) to its slow limit.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{capture::pm_velocity_factor, kinematics::RelativeSpeed};
/// let b = RelativeSpeed::from_v(1e-4).unwrap();
/// assert!((pm_velocity_factor(&b, 0.25) - 1.0).abs() < 1e-7);
/// ```
pub fn pm_velocity_factor(boost: &RelativeSpeed, nu: f64) -> f64 {
    let big_gamma = (1.0 + 2.0 * nu * boost.gamma_m1).sqrt();
    e_of_speed(boost) / (big_gamma * 37.0 * PI / 15.0 * boost.v)
}

/// Physical values of a capture estimate (SI).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CapturePhysical {
    /// π b_max² of the relativistic estimate (m²).
    pub cross_section_m2: f64,
    /// π b_max² of the Newtonian estimate (m²).
    pub cross_section_newtonian_m2: f64,
    /// σ v of the relativistic estimate (m³/s): the capture rate per unit number density.
    pub rate_coefficient_m3_s: f64,
    /// b_max of the relativistic estimate (m).
    pub b_max_relativistic_m: f64,
    /// b_max of the Newtonian estimate (m).
    pub b_max_newtonian_m: f64,
}

/// Whether the pair is bound after one passage, with both estimates.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Capture {
    /// The relativistic estimate: E_rad > M(Γ − 1).
    pub bound_after_passage: bool,
    /// The Newtonian parabolic estimate: b < b_max,N.
    pub bound_after_passage_newtonian: bool,
    /// E_rad/(M(Γ − 1)) of the relativistic estimate (> 1: bound).
    pub margin: f64,
    /// The same ratio for the Newtonian parabolic estimate, (b_max,N/b)⁷.
    pub margin_newtonian: f64,
    /// E_rad/(M c²) of the relativistic estimate at b.
    pub e_rad: f64,
    /// E_rad/(M c²) of the O(G³) PM formula at b, ν² E(γ)/(Γ b³) (for comparison).
    pub e_rad_pm: f64,
    /// M(Γ − 1)/(M c²): the kinetic energy at infinity in the CM frame.
    pub kinetic_energy: f64,
    /// Eccentricity of the Newtonian hyperbola with this b and v.
    pub eccentricity: f64,
    /// Newtonian periapsis r_p/(GM/c²) at b.
    pub periapsis_gm: f64,
    /// GM/(b v²): the PM expansion parameter at b.
    pub pm_parameter: f64,
    /// b/(GM/c²) (input).
    pub b_gm: f64,
    /// Largest capturing b of the Newtonian parabolic estimate, units of GM/c².
    pub b_max_newtonian_gm: f64,
    /// Largest capturing b of the relativistic estimate, units of GM/c².
    pub b_max_relativistic_gm: f64,
    /// π b_max² of the relativistic estimate, units of (GM/c²)².
    pub cross_section_gm2: f64,
    /// π b_max² of the Newtonian estimate, units of (GM/c²)².
    pub cross_section_newtonian_gm2: f64,
    /// σ v of the relativistic estimate, units of (GM/c²)² c.
    pub rate_coefficient_gm2_c: f64,
    /// Newtonian periapsis at b_max (relativistic estimate), units of GM/c².
    pub periapsis_at_b_max_gm: f64,
    /// v_p²/c² = v² + 2GM/(r_p c²) at b_max: the relative size of the periapsis corrections
    /// neither estimate contains.
    pub periapsis_speed2_at_b_max: f64,
    /// Test-body (Schwarzschild geodesic) capture impact parameter b_c/(GM/c²) at this γ.
    pub b_plunge_test_body_gm: f64,
    /// b ≤ b_c: the bodies fall together directly in the test-body limit.
    pub plunge_test_body: bool,
    /// π b_max² of the relativistic estimate in m², when the masses are physical (the same as
    /// `physical.cross_section_m2`, at the top level for the CLI contract).
    pub cross_section_m2: Option<f64>,
    pub physical: Option<CapturePhysical>,
    pub flags: Vec<Flag>,
}

/// ln of the relativistic margin E_rel/(M(Γ − 1)) as a function of s = ln(bv²), minus its value
/// at the threshold: φ(s) − ln K. Decreasing in s (I grows at most like x⁴).
struct Threshold {
    ln_k: f64,
}

impl Threshold {
    fn new(boost: &RelativeSpeed, nu: f64) -> Self {
        let big_gamma = (1.0 + 2.0 * nu * boost.gamma_m1).sqrt();
        let t_over_nu = 2.0 * boost.gamma_m1 / (1.0 + big_gamma); // (Γ − 1)/ν without cancellation
        let c = pm_velocity_factor(boost, nu);
        // K = (Γ − 1)/((8/15) ν² v⁷ C) in logs.
        let ln_k = t_over_nu.ln() - nu.ln() - (8.0f64 / 15.0).ln() - 7.0 * boost.v.ln() - c.ln();
        Threshold { ln_k }
    }

    /// ln margin at s = ln x: ln I(x) − 7s − ln K.
    fn ln_margin(&self, s: f64) -> f64 {
        hansen_i(s.exp()).ln() - 7.0 * s - self.ln_k
    }

    /// The root s* of ln_margin (bisection between bounds that always bracket it).
    fn root(&self) -> Result<f64, InputError> {
        // I(x) ≥ I(0) and I(x) ≥ (37π/8) x⁴ (every term of I is positive), so the root is at or
        // above both asymptotic roots; step up until the margin is below 1.
        let s_para = ((425.0 * PI / 4.0).ln() - self.ln_k) / 7.0;
        let s_line = ((37.0 * PI / 8.0).ln() - self.ln_k) / 3.0;
        let mut lo = s_para.max(s_line);
        let mut hi = lo + 1.0;
        let mut k = 0;
        while self.ln_margin(hi) > 0.0 {
            lo = hi;
            hi += 1.0;
            k += 1;
            if k > 200 || !hi.is_finite() {
                return Err(InputError::NoConvergence { what: "capture b_max: no bracket for the threshold".into() });
            }
        }
        for _ in 0..200 {
            let mid = 0.5 * (lo + hi);
            if self.ln_margin(mid) > 0.0 {
                lo = mid;
            } else {
                hi = mid;
            }
            if hi - lo <= 1e-15 * (1.0 + mid.abs()) {
                break;
            }
        }
        let s = 0.5 * (lo + hi);
        if !s.is_finite() {
            return Err(InputError::NoConvergence { what: "capture b_max: threshold not finite".into() });
        }
        Ok(s)
    }
}

/// The relativistic capture impact parameter b_max/(GM/c²) (see the module documentation).
///
/// # Errors
/// [`InputError`] naming `nu` (0 < ν ≤ 1/4); [`InputError::NoConvergence`] if the threshold
/// cannot be bracketed (does not happen for validated inputs).
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{capture::{b_max_newtonian, b_max_relativistic}, kinematics::RelativeSpeed};
/// // v → 0: tends to the parabolic closed form (here v = 1e-5: within 1e-4).
/// let b = RelativeSpeed::from_v(1e-5).unwrap();
/// let r = b_max_relativistic(&b, 0.25).unwrap() / b_max_newtonian(0.25, 1e-5);
/// assert!(r > 1.0 && r - 1.0 < 1e-4);
/// ```
pub fn b_max_relativistic(boost: &RelativeSpeed, nu: f64) -> Result<f64, InputError> {
    check_nu(nu)?;
    let s = Threshold::new(boost, nu).root()?;
    Ok(s.exp() / (boost.v * boost.v))
}

fn check_nu(nu: f64) -> Result<(), InputError> {
    crate::error::finite("nu", nu)?;
    if !(nu > 0.0 && nu <= 0.25) {
        return Err(InputError::OutOfRange { field: "nu", value: nu, allowed: "0 < ν ≤ 1/4".into() });
    }
    Ok(())
}

/// Capture estimate for masses m1, m2 (any common unit), the boost (relative speed at infinity)
/// and b in units of GM/c² (M = m1 + m2); `mass_length_m` = GM/c² in metres for physical values.
///
/// # Formula
/// See the module documentation and `docs/physics/capture.md`.
///
/// # Domain
/// m1, m2 > 0; any validated [`RelativeSpeed`]; 1e-6 ≤ b ≤ 1e60 (GM/c²).
///
/// # Errors
/// [`InputError`] naming `m1`, `m2`, `b` or `mass_length_m`.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{capture::capture, kinematics::RelativeSpeed};
/// // 10 + 10 M☉ at 100 km/s: b_max = (85π/3)^{1/7} v^{−9/7} ≈ 5.6e4 GM/c² (Newtonian closed form).
/// let v = 1e5 / 299_792_458.0;
/// let boost = RelativeSpeed::from_v(v).unwrap();
/// let c = capture(10.0, 10.0, &boost, 1e4, None).unwrap();
/// assert!(c.bound_after_passage && c.bound_after_passage_newtonian);
/// let closed = (85.0 * std::f64::consts::PI / 3.0).powf(1.0 / 7.0) * v.powf(-9.0 / 7.0);
/// assert!((c.b_max_newtonian_gm / closed - 1.0).abs() < 1e-14);
/// assert!((c.b_max_relativistic_gm / closed - 1.0).abs() < 1e-3);
/// let far = capture(10.0, 10.0, &boost, 1e6, None).unwrap();
/// assert!(!far.bound_after_passage && far.margin < 1.0);
/// ```
pub fn capture(m1: f64, m2: f64, boost: &RelativeSpeed, b_gm: f64, mass_length_m: Option<f64>) -> Result<Capture, InputError> {
    positive("m1", m1)?;
    positive("m2", m2)?;
    positive("b", b_gm)?;
    if !(crate::two_body::ORBIT_MIN..=crate::two_body::ORBIT_MAX).contains(&b_gm) {
        return Err(InputError::OutOfRange {
            field: "b",
            value: b_gm,
            allowed: format!("{:e} ≤ b/(GM/c²) ≤ {:e}", crate::two_body::ORBIT_MIN, crate::two_body::ORBIT_MAX),
        });
    }
    if let Some(l) = mass_length_m {
        positive("mass_length_m", l)?;
    }
    let mt = m1 + m2;
    let nu = (m1 / mt) * (m2 / mt);
    check_nu(nu)?;
    let v = boost.v;
    let big_gamma = (1.0 + 2.0 * nu * boost.gamma_m1).sqrt();
    let kinetic = 2.0 * nu * boost.gamma_m1 / (1.0 + big_gamma);
    let th = Threshold::new(boost, nu);
    let x = b_gm * v * v;
    let ln_margin = th.ln_margin(x.ln());
    let margin = ln_margin.exp();
    let e_rad = (ln_margin + kinetic.ln()).exp();
    let e_rad_pm = nu * nu * e_of_speed(boost) / (big_gamma * b_gm * b_gm * b_gm);
    let b_n = b_max_newtonian(nu, v);
    let margin_n = ((b_n / b_gm).ln() * 7.0).exp();
    let b_r = th.root()?.exp() / (v * v);
    let ecc = x.hypot(1.0);
    // r_p = p/(1 + e), p = b² v² (GM/c² units).
    let periapsis = |b: f64| {
        let xx = b * v * v;
        (b * v) * (b * v) / (1.0 + xx.hypot(1.0))
    };
    let rp_max = periapsis(b_r);
    let vp2 = v * v + 2.0 / rp_max;
    let b_c = critical_j(boost) * big_gamma / boost.p_inf;

    let mut flags = Vec::new();
    flags.push(Flag::small_parameter(
        CAPTURE_PERIAPSIS,
        vp2,
        0.01,
        0.1,
        [
            "At b_max the periapsis is slow (v_p² < 0.01 c²): the neglected relativistic corrections at periapsis are below 1 %.",
            "At b_max the periapsis speed² v_p²/c² is 0.01–0.1: both estimates miss relativistic corrections at periapsis of about that relative size (b_max changes by about a seventh of it).",
            "At b_max the periapsis is relativistic (v_p² > 0.1 c²): the capture estimates are outside their validity; a strong-field treatment is needed.",
        ],
    ));
    if b_r <= 2.0 * b_c {
        flags.push(Flag::new(
            CAPTURE_PLUNGE_THRESHOLD,
            if b_r <= b_c { Level::Invalid } else { Level::Caution },
            Some(b_r / b_c),
            format!("The radiative b_max ({b_r:.3}) is within a factor 2 of the test-body plunge impact parameter b_c = {b_c:.3} GM/c²: capture there is a strong-field question (direct plunge) rather than one of energy radiated in a passage."),
        ));
    }
    if b_gm <= b_c {
        flags.push(Flag::new(
            DIRECT_PLUNGE,
            Level::Caution,
            Some(b_gm / b_c),
            format!("b is below the test-body plunge impact parameter b_c = {b_c:.3} GM/c²: in the test-body limit the bodies fall together directly (for comparable masses this threshold is itself an estimate)."),
        ));
    }
    flags.push(Flag::small_parameter(
        CAPTURE_NEWTONIAN_SPEED,
        v,
        0.1,
        0.3,
        [
            "v ≪ c: the Newtonian parabolic estimate applies.",
            "v ≥ 0.1 c: the Newtonian parabolic estimate misses relativistic corrections of order v²; prefer the relativistic estimate.",
            "v ≥ 0.3 c: the Newtonian parabolic estimate is outside its validity.",
        ],
    ));
    let pm = 1.0 / x;
    flags.push(Flag::new(
        CAPTURE_PM_REGIME,
        Level::Ok,
        Some(pm),
        if pm < 0.1 {
            "GM/(b v²) < 0.1: the relativistic estimate is the O(G³) post-Minkowskian radiated energy up to relative corrections of order GM/(b v²).".to_string()
        } else {
            format!("GM/(b v²) = {pm:.3e}: the post-Minkowskian series does not hold at this b; the relativistic estimate rests on the Newtonian hyperbola (times the PM velocity factor).")
        },
    ));

    let sigma = PI * b_r * b_r;
    let sigma_n = PI * b_n * b_n;
    let physical = mass_length_m.map(|l| {
        let c = crate::units::codata2018::C;
        CapturePhysical {
            cross_section_m2: sigma * l * l,
            cross_section_newtonian_m2: sigma_n * l * l,
            rate_coefficient_m3_s: sigma * l * l * v * c,
            b_max_relativistic_m: b_r * l,
            b_max_newtonian_m: b_n * l,
        }
    });
    Ok(Capture {
        bound_after_passage: ln_margin > 0.0,
        bound_after_passage_newtonian: b_gm < b_n,
        margin,
        margin_newtonian: margin_n,
        e_rad,
        e_rad_pm,
        kinetic_energy: kinetic,
        eccentricity: ecc,
        periapsis_gm: periapsis(b_gm),
        pm_parameter: pm,
        b_gm,
        b_max_newtonian_gm: b_n,
        b_max_relativistic_gm: b_r,
        cross_section_gm2: sigma,
        cross_section_newtonian_gm2: sigma_n,
        rate_coefficient_gm2_c: sigma * v,
        periapsis_at_b_max_gm: rp_max,
        periapsis_speed2_at_b_max: vp2,
        b_plunge_test_body_gm: b_c,
        plunge_test_body: b_gm <= b_c,
        cross_section_m2: physical.map(|p| p.cross_section_m2),
        physical,
        flags,
    })
}
