//! Checks of `waveform::em` against references outside its code paths: mpmath Bessel values,
//! the Liénard/Larmor closed forms, the nonrelativistic dipole formula, brute-force time-domain
//! flux and Fourier quadratures of the field written here, and Lorentz covariance.

// The mpmath values are pasted with all 17 printed digits.
#![allow(clippy::excessive_precision)]

mod common;

use chiwave_core::numeric::gauss_legendre;
use common::*;
use chiwave_core::bessel::{bessel_k0, bessel_k1, x_k0, x_k1};
use chiwave_core::waveform::em::{
    energies, field, field_parts, memory, sky_energy, spectrum, spectrum_integrated, EmField, EmSystem,
};
use chiwave_core::InputError;
use std::f64::consts::PI;

// ---------------------------------------------------------------------------------------------
// Bessel functions
// ---------------------------------------------------------------------------------------------

// mpmath 1.3.0, mp.dps = 40, tests/reference/em_bessel_mpmath.py: (x, K0(x), K1(x))
const BESSEL_K: [(f64, f64, f64); 16] = [
    (1e-12, 2.7746952631586961e+1, 1.0e+12),
    (1e-6, 1.3931442073626419e+1, 9.9999999999278428e+5),
    (0.001, 7.0236888005623813, 9.9999623815608557e+2),
    (0.1, 2.4270690247020166, 9.8538447808706061),
    (0.5, 9.2441907122766586e-1, 1.6564411200033009),
    (1.0, 4.2102443824070833e-1, 6.0190723019723457e-1),
    (1.9999, 1.1390786025689362e-1, 1.3988426583169102e-1),
    (2.0, 1.1389387274953344e-1, 1.3986588181652243e-1),
    (2.0001, 1.138798870804414e-1, 1.3984750046881143e-1),
    (3.7, 1.5630659921626662e-2, 1.7628035102223267e-2),
    (8.0, 1.4647070522281539e-4, 1.5536921180500113e-4),
    (8.5, 8.6257566349325078e-5, 9.1197247750068985e-5),
    (20.0, 5.7412378153365243e-10, 5.8830579695570382e-10),
    (50.0, 3.4101677497894955e-23, 3.4441022267175556e-23),
    (200.0, 1.2256819797765335e-88, 1.2287423734729858e-88),
    (700.0, 4.6697764316853769e-306, 4.6731107967079661e-306),
];

/// Bessel tolerance: Cephes quotes a peak relative error of 1.2e-15 on (0, 30]; the table is
/// printed to 17 digits. At x = 700 the exponential e^{−x} costs a few more ulps (x·ulp(1)).
const BESSEL_REL: f64 = 3e-15;

#[test]
fn bessel_k0_k1_match_mpmath() {
    for (x, k0, k1) in BESSEL_K {
        let tol = if x > 100.0 { 2e-13 } else { BESSEL_REL }; // at x > 100 the factor e^{−x} costs ~x ulp
        assert!(rel_diff(bessel_k0(x), k0) < tol, "K0({x}) = {} vs {k0}", bessel_k0(x));
        assert!(rel_diff(bessel_k1(x), k1) < tol, "K1({x}) = {} vs {k1}", bessel_k1(x));
        assert!(rel_diff(x_k0(x), x * k0) < tol);
        assert!(rel_diff(x_k1(x), x * k1) < tol);
    }
}

#[test]
fn bessel_special_cases() {
    // Limits x K0(x) → 0 and x K1(x) → 1 at x = 0 (Abramowitz & Stegun 9.6.8–9.6.9, recalled).
    assert_eq!(x_k0(0.0), 0.0);
    assert_eq!(x_k1(0.0), 1.0);
    assert_eq!(x_k1(1e-300), 1.0);
    assert_eq!(x_k0(f64::INFINITY), 0.0);
    assert_eq!(x_k1(f64::INFINITY), 0.0);
    assert!(bessel_k0(f64::NAN).is_nan() && bessel_k1(-1.0).is_nan());
    assert!(bessel_k0(0.0).is_infinite());
    // Wronskian-type identity K1 = −K0' checked by central differences (elementary), x = 1.3.
    let (x, h) = (1.3, 1e-5);
    let d = -(bessel_k0(x + h) - bessel_k0(x - h)) / (2.0 * h);
    assert!(rel_diff(d, bessel_k1(x)) < 1e-9); // central difference, h = 1e-5: O(h²) truncation and ε/h rounding, both ~1e-11
}

// ---------------------------------------------------------------------------------------------
// Constructor
// ---------------------------------------------------------------------------------------------

fn field_of(e: InputError) -> &'static str {
    e.field()
}

#[test]
fn constructor_names_field_and_range() {
    let ok = (1.0, 2.0, 0.5, -0.3, 1.5, 1.0);
    assert!(EmSystem::new(ok.0, ok.1, ok.2, ok.3, ok.4, ok.5).is_ok());
    type Inputs = (f64, f64, f64, f64, f64, f64);
    let cases: [(Inputs, &str); 9] = [
        ((0.0, 2.0, 0.5, -0.3, 1.5, 1.0), "m1"),
        ((1.0, -2.0, 0.5, -0.3, 1.5, 1.0), "m2"),
        ((1.0, 2.0, f64::NAN, -0.3, 1.5, 1.0), "q1"),
        ((1.0, 2.0, 0.5, f64::INFINITY, 1.5, 1.0), "q2"),
        ((1.0, 2.0, 0.5, 0.0, 1.5, 1.0), "q1*q2"),
        ((1.0, 2.0, 0.5, -0.3, 1.0, 1.0), "gamma"),
        ((1.0, 2.0, 0.5, -0.3, 0.5, 1.0), "gamma"),
        ((1.0, 2.0, 0.5, -0.3, 1.5, 0.0), "b"),
        ((1.0, 2.0, 0.5, -0.3, 1.5, 1e-200), "b"),
    ];
    for ((m1, m2, q1, q2, g, b), name) in cases {
        let e = EmSystem::new(m1, m2, q1, q2, g, b).unwrap_err();
        let msg = e.to_string();
        assert_eq!(field_of(e), name, "{msg}");
        assert!(msg.starts_with(name), "{msg}");
    }
    let e = EmSystem::new(1.0, 2.0, 0.5, -0.3, 1.0, 1.0).unwrap_err().to_string();
    assert!(e.contains("1 < gamma"), "{e}");
}

mod props {
    use super::*;
    use common::any_f64;
    use proptest::prelude::*;


    proptest! {
        #![proptest_config(ProptestConfig::with_cases(128))]
        /// Any f64 inputs: the constructor returns a value or an error, never panics, and an
        /// accepted system gives finite field, spectrum and memory values.
        #[test]
        fn constructor_never_panics(m1 in any_f64(), m2 in any_f64(), q1 in any_f64(),
                                    q2 in any_f64(), g in any_f64(), b in any_f64()) {
            if let Ok(s) = EmSystem::new(m1, m2, q1, q2, g, b) {
                let f = field(&s, 1.0, 0.5, &[-1.0, 0.0, 2.0]);
                prop_assert!(f.e_theta.iter().chain(&f.e_phi).all(|x| x.is_finite()));
                let sp = spectrum(&s, 1.0, 0.5, &[0.0, 1.0 / b]);
                prop_assert!(sp.iter().all(|x| x.is_finite() && *x >= 0.0)); // a spectrum is not negative
                let m = memory(&s, 1.0, 0.5);
                prop_assert!(m.iter().all(|x| x.is_finite()));
                let _ = s.flags();
            }
        }
    }
}

// ---------------------------------------------------------------------------------------------
// Brute-force quadratures written for these tests (not the module's rules)
// ---------------------------------------------------------------------------------------------

fn angles(n: [f64; 3]) -> (f64, f64) {
    (n[2].clamp(-1.0, 1.0).acos(), n[1].atan2(n[0]))
}

fn sq(f: &EmField) -> Vec<f64> {
    f.e_theta.iter().zip(&f.e_phi).map(|(a, b)| a * a + b * b).collect()
}

/// Sphere rule with polar axis +x: composite Gauss–Legendre in x = 1 − n_x on geometric panels
/// [0, ε, 2ε, 4ε, …, 2] (ε = 1 − v), and the trapezoid rule with `m` points on the full azimuth.
fn sphere_x(v: f64, m: usize) -> Vec<([f64; 3], f64)> {
    let eps = 1.0 - v;
    let mut edges = vec![0.0];
    let mut e = eps / 4.0;
    while e < 2.0 {
        edges.push(e);
        e *= 2.0;
    }
    edges.push(2.0);
    let (gx, gw) = gauss_legendre(12);
    let mut out = Vec::new();
    for w in edges.windows(2) {
        let (c, h) = (0.5 * (w[0] + w[1]), 0.5 * (w[1] - w[0]));
        for (xi, wi) in gx.iter().zip(&gw) {
            let x = c + h * xi;
            let s = (x * (2.0 - x)).sqrt();
            for k in 0..m {
                let a = 2.0 * PI * k as f64 / m as f64;
                out.push(([1.0 - x, s * a.cos(), s * a.sin()], h * wi * 2.0 * PI / m as f64));
            }
        }
    }
    out
}

/// ∫du of `f(u)` over ℝ by u = c + w tan θ and `n`-point Gauss–Legendre on `panels` equal θ panels.
fn tan_nodes(c: f64, w: f64, panels: usize, n: usize) -> (Vec<f64>, Vec<f64>) {
    let (gx, gw) = gauss_legendre(n);
    let h = PI / panels as f64;
    let mut us = Vec::new();
    let mut ws = Vec::new();
    for p in 0..panels {
        let a = -0.5 * PI + p as f64 * h;
        for (xi, wi) in gx.iter().zip(&gw) {
            let th = a + 0.5 * h * (xi + 1.0);
            us.push(c + w * th.tan());
            ws.push(0.5 * h * wi * w / (th.cos() * th.cos()));
        }
    }
    (us, ws)
}

/// Per-body flux energy and x-momentum by brute force: each body's pulse mapped by its own
/// centre and width (body 1: u = −n_y b + κ (b/v) tan θ; body 2: u = (b/(γ v)) tan θ).
fn brute_body(s: &EmSystem, body: usize) -> (f64, f64) {
    let v = s.v();
    let (mut e, mut px) = (0.0, 0.0);
    for (n, wn) in sphere_x(v, 16) {
        let (th, ph) = angles(n);
        let kappa = 1.0 - n[0] * v;
        let (us, ws) = if body == 0 {
            tan_nodes(-n[1] * s.b, kappa * s.b / v, 2, 16)
        } else {
            tan_nodes(0.0, s.b / (s.gamma * v), 2, 16)
        };
        let f = &field_parts(s, th, ph, &us)[body];
        let de: f64 = sq(f).iter().zip(&ws).map(|(a, w)| a * w).sum::<f64>() / (4.0 * PI);
        e += wn * de;
        px += wn * de * n[0];
    }
    (e, px)
}

/// Total flux energy and momentum (x, y) of the summed field by brute force: u = tan θ over
/// many panels (both pulses, widths of order 1 for the systems tested).
fn brute_total(s: &EmSystem, m: usize) -> (f64, [f64; 2]) {
    let v = s.v();
    let (us, ws) = tan_nodes(0.0, s.b / v, 40, 10);
    let (mut e, mut p) = (0.0, [0.0; 2]);
    for (n, wn) in sphere_x(v, m) {
        let (th, ph) = angles(n);
        let f = field(s, th, ph, &us);
        let de: f64 = sq(&f).iter().zip(&ws).map(|(a, w)| a * w).sum::<f64>() / (4.0 * PI);
        e += wn * de;
        p[0] += wn * de * n[0];
        p[1] += wn * de * n[1];
    }
    (e, p)
}

// ---------------------------------------------------------------------------------------------
// Energies
// ---------------------------------------------------------------------------------------------

#[test]
fn per_body_flux_matches_lienard_and_larmor() {
    for (g, m1, m2, q1, q2) in [(1.1, 1.0, 2.0, 1.0, -0.5), (3.0, 0.5, 1.0, 0.3, 0.7)] {
        let s = EmSystem::new(m1, m2, q1, q2, g, 1.3).unwrap();
        let v = s.v();
        let b3 = 1.3f64.powi(3);
        // Jackson 1999 §14.2 Liénard power integrated over the straight line (docs/physics/waveform.md §5):
        let lienard = PI * q1.powi(4) * q2 * q2 * (1.0 + 3.0 * g * g) / (12.0 * m1 * m1 * v * b3);
        // Larmor power of body 2 in the boosted Coulomb field (Jackson 1999 §14.2; docs/physics/waveform.md §5):
        let larmor = PI * q1 * q1 * q2.powi(4) * (1.0 + 3.0 * g * g) / (12.0 * g * m2 * m2 * v * b3);
        let (e1, p1) = brute_body(&s, 0);
        let (e2, p2) = brute_body(&s, 1);
        assert!(rel_diff(e1, lienard) < 1e-10, "g={g}: body 1 {e1} vs {lienard}"); // brute-force sphere and time quadrature written here, not the module's rule
        assert!(rel_diff(e2, larmor) < 1e-10, "g={g}: body 2 {e2} vs {larmor}"); // as above
        // Body 1 radiates momentum v E1 along x (dP^μ/dτ ∝ u^μ, Jackson §14.2); body 2 none.
        assert!(rel_diff(p1, v * lienard) < 1e-10, "g={g}: p1 {p1}"); // as above
        assert!(p2.abs() < 1e-12 * larmor, "g={g}: p2 {p2}"); // body 2 radiates no net momentum: the brute-force sum cancels to rounding
        let e = energies(&s);
        assert!(rel_diff(e.body1, lienard) < REL_FEW_OPS && rel_diff(e.body2, larmor) < REL_FEW_OPS);
        assert!(rel_diff(e.body1_momentum_x, v * lienard) < REL_FEW_OPS);
    }
}

#[test]
fn total_flux_with_interference_matches_brute_force() {
    for (g, q2) in [(1.5, -0.8), (2.5, 0.6)] {
        let s = EmSystem::new(1.0, 0.7, 1.0, q2, g, 1.0).unwrap();
        let e = energies(&s);
        let (bt, bp) = brute_total(&s, 32);
        assert!(rel_diff(e.total_flux, bt) < 1e-9, "g={g}: {} vs brute {bt}", e.total_flux); // the module's sphere rule against a 32-panel brute force, each good to ~1e-10
        assert!(rel_diff(e.momentum[0], bp[0]) < 1e-9, "g={g}: px {} vs {}", e.momentum[0], bp[0]); // as above
        assert!((e.momentum[1] - bp[1]).abs() < 1e-9 * bt, "g={g}: py {} vs {}", e.momentum[1], bp[1]); // as above, relative to the total
        assert!(e.interference.abs() > 0.05 * e.total_flux, "interference is exercised"); // the case is chosen so that interference is 5% or more of the total
        assert!(e.rel_error_estimate < REL_SKY_RULE);
        assert_eq!(e.total_closed_no_interference, e.body1 + e.body2);
    }
}

#[test]
fn dipole_limit_at_low_velocity() {
    // Nonrelativistic dipole radiation (Larmor formula for the dipole moment, Jackson 1999 §9.2):
    // d̈ = q1 q2 (q1/m1 − q2/m2) r/r³ on the straight line, so
    // E = (2/3) ∫ |d̈|² dt = π (q1 q2)² (q1/m1 − q2/m2)² /(3 v b³), with corrections O(v²):
    // check that (E/E_dip − 1)/v² is the same at two speeds (v² = 2e-6 and 2e-8).
    let (m1, m2, q1, q2, b) = (1.0, 3.0, 1.0, 2.0, 1.0);
    let mut c = Vec::new();
    for dg in [1e-6, 1e-8] {
        let s = EmSystem::new(m1, m2, q1, q2, 1.0 + dg, b).unwrap();
        let v = s.v();
        let dip = PI * (q1 * q2).powi(2) * (q1 / m1 - q2 / m2).powi(2) / (3.0 * v * b * b * b);
        let e = energies(&s);
        c.push((e.total_flux / dip - 1.0) / (v * v));
    }
    assert!(c[0].abs() < 100.0 && rel_diff(c[0], c[1]) < 1e-4, "{c:?}"); // (E/E_dip − 1)/v² is v-independent up to O(v²) = 2e-6 and rounding ~1e-15/v²
    // Equal charge-to-mass ratios: the dipole term cancels between the per-body parts and the
    // interference; what is left is electric quadrupole radiation,
    // E/(parts v²) = 0.925 (mpmath 1.3, tests/reference/em_quadrupole_mpmath.py, Landau &
    // Lifshitz §71 quadrupole formula), up to O(v²) and the cancellation's rounding
    // (1e-15/(0.925 v²) ≈ 5e-9 at v² = 2e-7).
    let s = EmSystem::new(1.0, 2.0, 1.0, 2.0, 1.0 + 1e-7, 1.0).unwrap();
    let v = s.v();
    let e = energies(&s);
    let ratio = e.total_flux / (e.total_closed_no_interference * v * v);
    assert!((ratio - 0.925).abs() < 1e-5, "{ratio}"); // O(v²) = 2e-7 plus the cancellation's rounding ≈ 5e-9 (comment above)
}

#[test]
fn radiated_four_momentum_is_lorentz_covariant() {
    // Frame B = rest frame of body 1: the same system with the labels exchanged, seen after a
    // rotation by π about z. So P_B = (γ(P⁰ − v Pˣ), −γ(Pˣ − v P⁰), −Pʸ) (Lorentz boost along x).
    for g in [1.3, 12.0] {
        let (m1, m2, q1, q2) = (1.0, 0.4, 0.7, -1.1);
        let a = energies(&EmSystem::new(m1, m2, q1, q2, g, 1.0).unwrap());
        let sb = EmSystem::new(m2, m1, q2, q1, g, 1.0).unwrap();
        let bb = energies(&sb);
        let v = sb.v();
        let e_b = g * (a.total_flux - v * a.momentum[0]);
        let px_b = -g * (a.momentum[0] - v * a.total_flux);
        assert!(rel_diff(bb.total_flux, e_b) < REL_SKY_RULE, "g={g}: E_B {} vs {e_b}", bb.total_flux);
        assert!(rel_diff(bb.momentum[0], px_b) < REL_SKY_RULE, "g={g}: Px_B {} vs {px_b}", bb.momentum[0]);
        assert!((bb.momentum[1] + a.momentum[1]).abs() < REL_SKY_RULE * bb.total_flux);
    }
}

// ---------------------------------------------------------------------------------------------
// Spectrum and memory
// ---------------------------------------------------------------------------------------------

/// Numerical Fourier transform ∫du e^{iωu} D E(u) of the time-domain field: composite
/// 16-point Gauss–Legendre on [−U, U], U = 4000 b/v (panels 0.25 b/v near the pulses, 1 b/v
/// outside), plus the two leading integration-by-parts terms of each tail,
/// ∫_U^∞ e^{iωu} g du = e^{iωU}((i/ω) g(U) − g'(U)/ω²) + O(g''/ω³); with g ~ 1/u² the
/// remainder is ~6/(ω³ U⁴) ≈ 2e-11 of the pulse scale at ω = 0.1 (elementary estimate).
fn numeric_ft(s: &EmSystem, th: f64, ph: f64, omegas: &[f64]) -> Vec<[(f64, f64); 2]> {
    let l = s.b / s.v();
    let big_u = 4.0e3 * l;
    let mut edges = Vec::new();
    let mut x = -big_u;
    while x < big_u - 1e-9 {
        edges.push(x);
        x += if x.abs() < 40.0 * l { 0.25 * l } else { l };
    }
    edges.push(big_u);
    let (gx, gw) = gauss_legendre(16);
    let mut us = Vec::new();
    let mut ws = Vec::new();
    for w in edges.windows(2) {
        let (c, h) = (0.5 * (w[0] + w[1]), 0.5 * (w[1] - w[0]));
        for (xi, wi) in gx.iter().zip(&gw) {
            us.push(c + h * xi);
            ws.push(h * wi);
        }
    }
    let f = field(s, th, ph, &us);
    let dh = 1e-3 * l;
    let ends = field(s, th, ph, &[big_u, big_u - dh, big_u + dh, -big_u, -big_u - dh, -big_u + dh]);
    omegas
        .iter()
        .map(|&om| {
            let mut out = [(0.0, 0.0); 2];
            let mut acc = [0.0; 4];
            for (i, (u, w)) in us.iter().zip(&ws).enumerate() {
                let (sn, c) = (om * u).sin_cos();
                acc[0] += w * f.e_theta[i] * c;
                acc[1] += w * f.e_theta[i] * sn;
                acc[2] += w * f.e_phi[i] * c;
                acc[3] += w * f.e_phi[i] * sn;
            }
            for k in 0..2 {
                let (mut re, mut im) = (acc[2 * k], acc[2 * k + 1]);
                let e = if k == 0 { &ends.e_theta } else { &ends.e_phi };
                // Right tail at U: g, g'; left tail at −U: ∫_{−∞}^{−U} = e^{−iωU}(−(i/ω) g + g'/ω²).
                let (g_r, dg_r) = (e[0], (e[2] - e[1]) / (2.0 * dh));
                let (g_l, dg_l) = (e[3], (e[5] - e[4]) / (2.0 * dh));
                let (c, sn) = ((om * big_u).cos(), (om * big_u).sin());
                // e^{iωU}(i g/ω − g'/ω²)
                let (a_re, a_im) = (-dg_r / (om * om), g_r / om);
                re += c * a_re - sn * a_im;
                im += sn * a_re + c * a_im;
                // e^{−iωU}(−i g/ω + g'/ω²)
                let (b_re, b_im) = (dg_l / (om * om), -g_l / om);
                re += c * b_re + sn * b_im;
                im += -sn * b_re + c * b_im;
                out[k] = (re, im);
            }
            out
        })
        .collect()
}

#[test]
fn bessel_spectrum_matches_numerical_fourier_transform() {
    let s = EmSystem::new(1.0, 0.7, 1.0, -0.8, 1.5, 1.0).unwrap();
    let omegas = [0.1, 0.5, 1.3, 2.5];
    for (th, ph) in [(1.1, 0.7), (0.4, 2.5), (2.0, -1.2)] {
        let ft = numeric_ft(&s, th, ph, &omegas);
        let sp = spectrum(&s, th, ph, &omegas);
        for (i, om) in omegas.iter().enumerate() {
            let num = (ft[i][0].0.powi(2) + ft[i][0].1.powi(2) + ft[i][1].0.powi(2) + ft[i][1].1.powi(2))
                / (4.0 * PI * PI);
            assert!(rel_diff(sp[i], num) < 1e-9, "θ={th} φ={ph} ω={om}: {} vs numeric {num}", sp[i]); // 16-point panels and tail terms of the Fourier quadrature (remainder ≈ 2e-11, doc above)
        }
    }
    // Negative ω: |E~(−ω)| = |E~(ω)| for a real field.
    assert_eq!(spectrum(&s, 1.0, 1.0, &[-0.7]), spectrum(&s, 1.0, 1.0, &[0.7]));
}

#[test]
fn memory_equals_time_integral_of_field() {
    // ∫du D E computed from the field by quadrature (tan map, many panels) against −D ΔA_⊥
    // built from the asymptotic velocities (Liénard–Wiechert potential at large distance,
    // Jackson 1999 §14.1; docs/physics/waveform.md §5).
    for g in [1.2, 3.0] {
        let s = EmSystem::new(1.0, 0.5, -0.6, 1.4, g, 2.0).unwrap();
        let (us, ws) = tan_nodes(0.0, s.b / s.v(), 80, 12);
        for (th, ph) in [(0.3, 0.2), (1.5, 1.0), (2.7, 4.0), (1.2, 0.0)] {
            let f = field(&s, th, ph, &us);
            let it: f64 = f.e_theta.iter().zip(&ws).map(|(a, w)| a * w).sum();
            let ip: f64 = f.e_phi.iter().zip(&ws).map(|(a, w)| a * w).sum();
            let m = memory(&s, th, ph);
            let scale = m[0].hypot(m[1]);
            assert!((it - m[0]).abs() < 1e-10 * scale, "g={g} θ={th}: {it} vs {}", m[0]); // tan-map quadrature of the field over u (80 panels of 12 nodes)
            assert!((ip - m[1]).abs() < 1e-10 * scale, "g={g} θ={th}: {ip} vs {}", m[1]); // as above
            // Soft limit of the Bessel spectrum (docs/physics/waveform.md §5): |D ΔA_⊥|²/(4π²).
            let z = spectrum(&s, th, ph, &[1e-10])[0];
            assert!(rel_diff(z, scale * scale / (4.0 * PI * PI)) < 1e-12); // spectrum at ω = 1e-10 ≪ v/b departs from the ZFL by O(ω)
        }
    }
}

#[test]
fn angle_integrated_spectrum_integrates_to_total_energy() {
    // ∫_0^∞ dω dE/dω by ω = ω0 e^z and the trapezoid rule in z (double-exponential decay at
    // large ω, e^z at small ω: common practice), against the time-domain flux total.
    for g in [1.5, 4.0] {
        let s = EmSystem::new(1.0, 0.7, 1.0, -0.8, g, 1.0).unwrap();
        let w0 = s.v() / s.b;
        // Step 0.25 (the trapezoid error falls exponentially with 1/h; 0.5 gave 2e-7, 0.25 gives
        // 7e-12 here); the cut at z = −25 drops ~e^{−25} ≈ 1e-11 of the total.
        let h = 0.25;
        let zs: Vec<f64> = (0..).map(|k| -25.0 + h * k as f64).take_while(|z| *z < 8.0).collect();
        let om: Vec<f64> = zs.iter().map(|z| w0 * z.exp()).collect();
        let d = spectrum_integrated(&s, &om);
        let total: f64 = d.iter().zip(&om).map(|(a, o)| h * a * o).sum();
        let e = energies(&s);
        assert!(rel_diff(total, e.total_flux) < 1e-9, "g={g}: ∫dω = {total} vs {}", e.total_flux); // trapezoid error 7e-12 and the cut at z = −25 (comment above), plus the rule's 1e-10
    }
}

#[test]
fn face_on_field_values() {
    // Face-on (n = ẑ): D E = −(q1 a1 + q2 a2)_⊥ with κ = 1 and t_r = u; at u = 0,
    // a1 = (0, K1/(γ b²)), a2 = (0, −K2 γ/b²) (Coulomb fields of the straight lines; docs/physics/waveform.md §5).
    let s = EmSystem::new(2.0, 5.0, 1.5, 0.5, 1.25, 0.8).unwrap();
    let f = field(&s, 0.0, 0.0, &[0.0, 0.3]);
    let k1 = 1.5 * 0.5 / 2.0;
    let k2 = 1.5 * 0.5 / 5.0;
    let expect = -(1.5 * k1 / (1.25 * 0.64) - 0.5 * k2 * 1.25 / 0.64);
    assert!(rel_diff(f.e_phi[0], expect) < REL_FEW_OPS);
    // At u = 0.3: x-components, a1x = K1 v u/(γ³ r³), a2x = −K2 γ v u/R³.
    let v = s.v();
    let r = (v * 0.3f64).hypot(0.8);
    let rr = (1.25 * v * 0.3f64).hypot(0.8);
    let ex = -(1.5 * k1 * v * 0.3 / (1.25f64.powi(3) * r.powi(3)) - 0.5 * k2 * 1.25 * v * 0.3 / rr.powi(3));
    assert!(rel_diff(f.e_theta[1], ex) < REL_FEW_OPS);
}

#[test]
fn sky_map_sums_to_total_and_rejects_bad_grids() {
    let s = EmSystem::new(1.0, 0.7, 1.0, -0.8, 1.2, 1.0).unwrap();
    let (nt, np) = (40, 40);
    let m = sky_energy(&s, nt, np).unwrap();
    let (dt, dp) = (PI / nt as f64, 2.0 * PI / np as f64);
    let mut sum = 0.0;
    for (i, th) in m.theta.iter().enumerate() {
        for j in 0..np {
            sum += m.de_domega[i * np + j] * th.sin() * dt * dp;
        }
    }
    // Midpoint rule in θ has an O(dθ²) error ≈ 1e-3 here.
    let e = energies(&s);
    assert!(rel_diff(sum, e.total_flux) < 3e-3, "{sum} vs {}", e.total_flux); // midpoint rule in θ: O(dθ²) ≈ 1e-3 (comment above)
    // A cell value equals the brute-force u-integral at that direction.
    let (i, j) = (13, 5);
    let (us, ws) = tan_nodes(0.0, 1.0 / s.v(), 60, 10);
    let f = field(&s, m.theta[i], m.phi[j], &us);
    let de: f64 = sq(&f).iter().zip(&ws).map(|(a, w)| a * w).sum::<f64>() / (4.0 * PI);
    assert!(rel_diff(m.de_domega[i * np + j], de) < 1e-10); // tan-map quadrature over u (60 panels of 10 nodes) against the module's adaptive rule
    assert_eq!(sky_energy(&s, 0, 4).unwrap_err().field(), "n_theta");
    assert_eq!(sky_energy(&s, 4, 100_000).unwrap_err().field(), "n_phi");
}

#[test]
fn flags_grade_the_deflection() {
    let small = EmSystem::new(1.0, 1.0, 0.01, 0.01, 2.0, 1.0).unwrap();
    assert!(small.flags().iter().all(|f| f.level == chiwave_core::validity::Level::Ok));
    let big = EmSystem::new(1.0, 1.0, 1.0, 1.0, 1.01, 1.0).unwrap();
    let f = big.flags();
    assert_eq!(f[0].key, "em_deflection");
    assert_eq!(f[0].level, chiwave_core::validity::Level::Invalid);
}
