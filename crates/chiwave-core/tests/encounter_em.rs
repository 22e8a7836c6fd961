//! Electromagnetic encounter tests (Gaussian units, c = 1). Sources beside each value.
// Reference values are quoted with every digit the reference script printed.
#![allow(clippy::excessive_precision, clippy::inconsistent_digit_grouping)]

mod common;

use chiwave_core::encounter::pl::{self, Darwin};
use chiwave_core::encounter::kinematics::RelativeSpeed;
use chiwave_core::encounter::{EmResult, EncounterRequest, EncounterResult};
use chiwave_core::validity::Level;
use common::*;
use std::f64::consts::PI;

fn em_result(json: &str) -> EmResult {
    let req: EncounterRequest = serde_json::from_str(json).unwrap();
    match req.evaluate().unwrap() {
        EncounterResult::Em(r) => *r,
        EncounterResult::Gravity(_) => panic!("expected em"),
    }
}

fn darwin(g: f64, k: f64) -> Option<f64> {
    match pl::darwin(&RelativeSpeed::from_gamma(g).unwrap(), k) {
        Darwin::Scattered { chi } => Some(chi),
        Darwin::FallToCentre => None,
    }
}

#[test]
fn darwin_matches_mpmath_quadrature() {
    // mpmath 1.3, dps 40: raw orbit quadrature of (du/dφ)² = [p² − 2γku − (J² − k²)u²]/J²
    // (Landau & Lifshitz, *Classical Theory of Fields*, §39), tests/reference/encounter_mpmath.py.
    for (g, k, want) in [
        (1.5, -0.3, 0.9887771189500706932754),
        (1.5, 0.3, -0.6853945422993483087181),
        (1.2, -0.9, 10.0727900569961212447),
        (3.0, 1.5, -1.580512328281642686235), // repulsive strong coupling: cosh branch
        (1.05, 0.02, -0.1304221425821185721943),
    ] {
        let got = darwin(g, k).unwrap();
        assert!(rel_diff(got, want) < REL_QUADRATURE, "γ={g} κ={k}: {got} vs {want}");
    }
}

#[test]
fn darwin_branches_and_fall_to_centre() {
    // Darwin 1913; Landau & Lifshitz, *Classical Theory of Fields*, §39: attraction with |κ| ≥ 1
    // falls to the centre.
    assert!(darwin(1.5, -1.0).is_none() && darwin(1.5, -3.0).is_none());
    // Repulsion is continuous through κ = 1 (the two closed forms meet).
    let (a, b) = (darwin(2.0, 1.0 - 1e-9).unwrap(), darwin(2.0, 1.0 + 1e-9).unwrap());
    assert!((a - b).abs() < 1e-8, "{a} {b}"); // the two closed forms meet at κ = 1; κ = 1 ± 1e-9 moves χ by ~1e-9
    assert!(darwin(2.0, 1.0).unwrap().is_finite());
    // κ = 0: no deflection (elementary).
    assert_eq!(darwin(2.0, 0.0), Some(0.0));
    // Very strong repulsion: the charge bounces almost straight back, χ → −π.
    assert!((darwin(1.5, 1e5).unwrap() + PI).abs() < 1e-3); // χ + π = O(1/κ) at κ = 1e5
}

#[test]
fn darwin_expansion_matches_pl_coefficients() {
    // Series vs exact (Darwin 1913 expanded; Saketh et al. 2022, arXiv:2109.05994): χ − 2(e₁κ + (π/4)κ² + e₃κ³) = O(κ⁴) for a
    // test charge (h = 1): halving κ divides the remainder by ≈ 16.
    for g in [1.1, 1.5, 3.0] {
        let b = RelativeSpeed::from_gamma(g).unwrap();
        for sign in [1.0, -1.0] {
            let rem = |k: f64| darwin(g, k).unwrap() - 2.0 * (pl::e1(&b) * k + pl::e2(1.0) * k * k + pl::e3_test(&b) * k.powi(3));
            let (r1, r2) = (rem(sign * 0.02), rem(sign * 0.01));
            let ratio = r1 / r2;
            assert!((ratio - 16.0).abs() < 3.0, "γ={g} sign={sign}: {ratio}"); // an O(κ⁴) remainder divides by 16 when κ halves, up to O(κ⁵)
        }
    }
}

#[test]
fn rutherford_limit() {
    // Non-relativistic limit (Rutherford; Landau & Lifshitz, *Mechanics*, §19): tan(θ/2) = |k|/(m v² b); with J = m γ v b
    // and κ = k/J this is |κ| γ/v. Deviation O(v²): within 8e-5 at v = 0.01 there.
    let mut prev = f64::INFINITY;
    for v in [0.02, 0.01, 0.005] {
        let b = RelativeSpeed::from_v(v).unwrap();
        let k = 0.5 * v; // tan(θ/2) ≈ 0.5
        for sign in [1.0, -1.0] {
            let chi = match pl::darwin(&b, sign * k) {
                Darwin::Scattered { chi } => chi,
                Darwin::FallToCentre => panic!(),
            };
            let ruth = 2.0 * (k * b.gamma / v).atan();
            let dev = rel_diff(chi.abs(), ruth);
            assert!(dev < 4.0 * v * v, "v={v}: {dev}"); // relativistic corrections O(v²) to Rutherford
            if sign > 0.0 {
                assert!(dev < prev);
                prev = dev;
            }
        }
    }
}

#[test]
fn em_request_geometric() {
    // Like charges repel: all χ negative; attraction positive (sign convention: docs/physics/encounter.md §6).
    let r = em_result(r#"{"force": "em", "m1": 1, "m2": 1, "gamma": 1.5, "b": 1000, "q1": 2, "q2": 3}"#);
    assert!(r.kappa > 0.0 && r.chi.pl1 < 0.0 && r.chi.pl3 < 0.0 && r.chi_test_exact.unwrap() < 0.0); // signs: repulsion gives κ > 0 and χ < 0
    assert!(r.impulse.cm.transverse > 0.0); // pushed away from body 2
    let a = em_result(r#"{"force": "em", "m1": 1, "m2": 1, "gamma": 1.5, "b": 1000, "q1": 2, "q2": -3}"#);
    assert!(a.kappa < 0.0 && a.chi.pl1 > 0.0 && a.chi_test_exact.unwrap() > 0.0 && a.impulse.cm.transverse < 0.0); // signs: attraction gives κ < 0, χ > 0, a kick towards body 2
    // κ = q1 q2/J, J = p b = ν p∞ b/h (docs/physics/encounter.md §1, §6).
    let k = &r.kinematics;
    assert!(rel_diff(r.kappa, 6.0 / (k.nu * k.speed.p_inf * 1000.0 / k.h)) < REL_ROUNDING);
    // 1PL: χ = −2γκ/p∞ (Darwin 1913 expanded; Saketh et al. 2022, arXiv:2109.05994).
    assert!(rel_diff(r.chi.pl1, -2.0 * 1.5 * r.kappa / 1.25f64.sqrt()) < REL_ROUNDING);
    // Radiation reaction always increases χ (δχ_rr > 0, docs/physics/encounter.md §6).
    assert!(r.chi.pl3 > r.chi.pl3_conservative && a.chi.pl3 > a.chi.pl3_conservative);
    // J_rad has the sign of −q1 q2 (docs/physics/encounter.md §6).
    assert!(r.j_rad < 0.0 && a.j_rad > 0.0); // sign of −q1 q2
    // Conservative CM energy of body 1 unchanged.
    assert!(r.impulse.cm.energy.abs() < 1e-18); // exactly conserved: rounding of O(G⁰) energies at p ≈ 1e-3 (absolute)
    // O(e⁴) impulse (Saketh et al. 2022, arXiv:2109.05994): Δp·b̂ = 2q1q2γ/(p∞b) − π q1²q2²(1/m1 + 1/m2)/(2p∞b²) + O(e⁶),
    // units M = m1 + m2 = 1 (bare charges are in units of √G M, bare b in GM/c²).
    let s = em_result(r#"{"force": "em", "m1": 1, "m2": 1, "gamma": 1.5, "b": 1000, "q1": 0.5, "q2": 0.6}"#);
    let (q1, q2, m, bb, p) = (0.5, 0.6, 0.5, 1000.0, 1.25f64.sqrt());
    let lo = 2.0 * q1 * q2 * 1.5 / (p * bb);
    let nlo = -PI * (q1 * q2).powi(2) * (2.0 / m) / (2.0 * p * bb * bb);
    assert!(rel_diff(s.impulse.cm.transverse - lo, nlo) < 0.02, "{} vs {nlo}", s.impulse.cm.transverse - lo); // the next order is O(e⁶): κ ≈ 3e-4 smaller than the NLO term, plus the rounding of lo
    let keys = serde_json::to_value(&r).unwrap();
    for key in ["1pl", "2pl", "3pl_conservative", "3pl"] {
        assert!(keys["chi"][key].is_f64(), "{key}");
    }
    for key in ["chi_test_exact", "e_rad", "e_rad_dipole", "impulse", "flags", "sources", "units"] {
        assert!(keys.get(key).is_some(), "{key}");
    }
    assert_eq!(keys["units"], "Gaussian, c = 1");
}

#[test]
fn fall_to_centre_is_a_result() {
    let r = em_result(r#"{"force": "em", "nu": 0.25, "gamma": 1.2, "j": 1, "q1": 1, "q2": -1}"#);
    assert!(r.kappa < -1.0); // attraction with |κ| > 1
    assert!(r.fall_to_centre && r.chi_test_exact.is_none());
    assert!(r.flags.iter().any(|f| f.key == "fall_to_centre" && f.level == Level::Invalid));
}

#[test]
fn radiated_energy_limits() {
    // Test-charge E_rad (γ → 1) equals the two-body dipole formula when body 2 is infinitely
    // heavy (q2/m2 → 0): π q1⁴q2²(3γ²+1)/(12 m1² v b³) → π q1⁴ q2²/(3 m1² v b³) (Jackson 1999,
    // §14.2, Liénard power on the straight line; §9.2 dipole).
    let r = em_result(r#"{"force": "em", "m1": 1e-12, "m2": 1, "v": 1e-3, "b": 1e8, "q1": 1e-12, "q2": 1e-6}"#);
    assert!(rel_diff(r.e_rad, r.e_rad_dipole) < 1e-5, "{} {}", r.e_rad, r.e_rad_dipole); // O(v²) = 1e-6 and q2/m2 = 1e-6 corrections
    // Equal q/m: no dipole radiation (Jackson 1999, §9.2).
    let r = em_result(r#"{"force": "em", "m1": 1, "m2": 2, "v": 0.01, "b": 1e6, "q1": 1, "q2": 2}"#);
    assert!(r.e_rad_dipole.abs() < 1e-30 && r.e_rad > 0.0); // exactly zero for equal q/m: rounding of q1/m1 − q2/m2 (absolute)
}

#[test]
fn physical_units_and_classical_flags() {
    // Two protons at 1000 km/s: Sommerfeld parameter = α c/v with α = 7.2973525693e-3
    // (CODATA 2018, recalled) — checks the Gaussian/SI conversion end to end.
    let r = em_result(r#"{"force": "em", "m1": "1.67262192369e-27kg", "m2": "1.67262192369e-27kg", "v": "1000km/s", "b": "1e-9m", "q1": "1e", "q2": "1e"}"#);
    let p = r.physical.as_ref().unwrap();
    let want = 7.297_352_5693e-3 * 299_792.458 / 1000.0;
    assert!(rel_diff(p.sommerfeld, want) < 1e-8, "{} vs {want}", p.sommerfeld); // α recalled to 11 digits
    assert!(rel_diff(p.q1_c, 1.602_176_634e-19) < 1e-12); // exact SI e
    assert!(r.flags.iter().any(|f| f.key == "classical_sommerfeld" && f.level == Level::Caution));
    // Rutherford at this speed: tan(θ/2) = e²/(4πε0 μ v² b), μ = m_p/2 (textbook; constants CODATA 2018).
    let k = 1.602_176_634e-19f64.powi(2) / (4.0 * PI * 8.854_187_8128e-12);
    let ruth = 2.0 * (k / (0.5 * 1.672_621_923_69e-27 * 1e12 * 1e-9)).atan();
    assert!(rel_diff(r.chi_test_exact.unwrap().abs(), ruth) < 1e-4, "{} {ruth}", r.chi_test_exact.unwrap()); // O(v²) = 1e-5 relativistic corrections at 1000 km/s
}
