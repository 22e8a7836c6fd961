//! Wave-optics tests for the point-lens amplification factor F(w, y).
//!
//! References: mpmath 1.3 (its own hyp1f1 and gamma, a different algorithm from ours), the
//! closed-form limits of Takahashi & Nakamura 2003 (astro-ph/0305055), and a direct quadrature of the diffraction integral.
// The mpmath values are pasted exactly as the script prints them (17 significant digits).
#![allow(clippy::excessive_precision)]

mod common;

use chiwave_core::lensing::kummer::{kummer_m_imaginary, ln_gamma};
use chiwave_core::lensing::wave::{
    amplification, amplification_curve, amplification_factor, amplification_geometric, exact_is_affordable, phi_m,
    Method,
};
use chiwave_core::numeric::{gauss_legendre, integrate_gl};
use common::*;
use num_complex::Complex64;
use std::f64::consts::PI;

/// |a − b| / |b| for complex numbers.
fn crel(a: Complex64, b: Complex64) -> f64 {
    (a - b).norm() / b.norm()
}

#[test]
fn check_value_f_1_03() {
    // mpmath 1.3 (tests/reference/lensing_mpmath.py): F(1, 0.3) = 1.67924419493817 − 0.564230508370834 i.
    let (f, m) = amplification_factor(1.0, 0.3).unwrap();
    assert_eq!(m, Method::Series);
    assert!(crel(f, Complex64::new(1.67924419493817, -0.564230508370834)) < REL_TRANSCRIBED, "{f}");
}

#[test]
fn against_mpmath_grid() {
    // mpmath 1.3, mp.dps = 30, tests/reference/lensing_mpmath.py (F(w, y) from hyp1f1 and gamma).
    let table = F_MPMATH;
    for (w, y, re, im) in table {
        let (f, _) = amplification_factor(w, y).unwrap();
        let e = crel(f, Complex64::new(re, im));
        // Observed ≤ 7e-13 (the largest at w = 1000, where phases of ~3e3 rad are carried);
        // bound 1e-11 = REL_TRANSCRIBED (values transcribed to 17 digits).
        assert!(e < REL_TRANSCRIBED, "w={w} y={y}: {f} vs {re}+{im}i (rel {e:e})");
    }
}

#[test]
fn asymptotic_expansion_agrees_with_continuation() {
    // Two methods inside the code that share nothing but ln Γ: the large-|z| expansion
    // (DLMF 13.7.2, prefactors combined by hand) against the Taylor continuation of Kummer's
    // equation, here assembled with the Takahashi & Nakamura prefactor written out in the test.
    for (w, y) in [(1.0, 40.0), (30.0, 3.0), (100.0, 5.0), (1000.0, 10.0)] {
        let (f, m) = amplification_factor(w, y).unwrap();
        assert_eq!(m, Method::Asymptotic, "w={w} y={y}");
        let alpha = 0.5 * w;
        let (kummer, km) = kummer_m_imaginary(alpha, alpha * y * y).unwrap();
        assert!(matches!(km, chiwave_core::lensing::kummer::KummerMethod::Continuation { .. }));
        let e = Complex64::new(PI * w / 4.0, alpha * (alpha.ln() - 2.0 * phi_m(y)))
            + ln_gamma(Complex64::new(1.0, -alpha)).unwrap();
        let reference = e.exp() * kummer;
        // Observed ≤ 5e-12 (continuation over 19 218 steps at w = 1000, y = 10).
        assert!(crel(f, reference) < 2e-11, "w={w} y={y}: {f} vs {reference}"); // observed ≤ 5e-12 after ~2e4 continuation steps (line above)
    }
}

#[test]
fn against_diffraction_integral() {
    // Independent method (docs/physics/lensing.md §2): the radial diffraction integral rotated
    // to x = e^{iπ/4} s,
    //   F = w e^{iw(y²/2 − φ_m)} e^{πw/4} ∫_0^∞ s^{1−iw} J0(e^{iπ/4} w y s) e^{−ws²/2} ds,
    // evaluated here by Gauss–Legendre panels in v = ln s, with J0 of complex argument by its
    // power series (A&S 9.1.10). No 1F1 and no Γ enters.
    fn j0(z: Complex64) -> Complex64 {
        let q = -z * z / 4.0;
        let mut term = Complex64::new(1.0, 0.0);
        let mut sum = term;
        for k in 1..400 {
            term = term * q / ((k * k) as f64);
            sum += term;
            if term.norm() < 1e-18 * sum.norm() && k as f64 > q.norm() { // series truncated below a double's resolution
                break;
            }
        }
        sum
    }
    let rule = gauss_legendre(24);
    for (w, y) in [(1.0, 0.3), (3.0, 0.5), (5.0, 1.0)] {
        let rot = Complex64::from_polar(1.0, PI / 4.0);
        let s_max = y / 2f64.sqrt() + (y * y / 2.0 + 90.0 / w).sqrt();
        let (v0, v1) = (-24.0, s_max.ln());
        let panels = 400;
        let h = (v1 - v0) / panels as f64;
        let mut total = Complex64::new(0.0, 0.0);
        for p in 0..panels {
            let (a, b) = (v0 + p as f64 * h, v0 + (p + 1) as f64 * h);
            let g = |v: f64, part: usize| {
                let s = v.exp();
                // s^{1−iw} ds = s^{2−iw} dv
                let val = Complex64::from_polar(s * s, -w * v) * j0(rot * (w * y * s)) * (-0.5 * w * s * s).exp();
                if part == 0 { val.re } else { val.im }
            };
            total += Complex64::new(integrate_gl(|v| g(v, 0), a, b, &rule), integrate_gl(|v| g(v, 1), a, b, &rule));
        }
        let pref = Complex64::from_polar(w * (0.25 * PI * w).exp(), w * (0.5 * y * y - phi_m(y)));
        let reference = pref * total;
        let (f, _) = amplification_factor(w, y).unwrap();
        // Tolerance: the integrand cancels by ~e^{w(y² + π)/4} (≈ 2e2 at w = 5, y = 1) and the J0
        // series by ~e^{wys(1 − 1/√2)}; observed agreement ≤ 5e-15, bound 1e-12.
        assert!(crel(f, reference) < REL_QUADRATURE, "w={w} y={y}: {f} vs quadrature {reference} ({:e})", crel(f, reference));
    }
}

#[test]
fn modulus_at_y0_closed_form() {
    // Takahashi & Nakamura 2003, y = 0 limit: at y = 0, |F|² = πw/(1 − e^{−πw}) (from |Γ(1 + ix)|² =
    // πx/sinh(πx), A&S 6.1.31); the code instead uses the Stirling series for ln Γ.
    for w in [1e-6, 1e-3, 0.01, 0.1, 0.5, 1.0, 2.0, 5.0, 20.0, 100.0, 500.0, 1000.0, 1e4, 1e5] {
        let (f, _) = amplification_factor(w, 0.0).unwrap();
        let exact = PI * w / -(-PI * w).exp_m1();
        // 1e-12: the exponent πw/4 + Re ln Γ(1 − iw/2) cancels to O(ln w) from O(w), losing
        // log10(w) digits of absolute accuracy (≈ 1e-11 at w = 1e5).
        let tol = 1e-13 * (1.0 + w.log10().max(0.0)).powi(2) * 10.0; // log10(w) digits lost to the cancellation (comment above)
        assert!((f.norm_sqr() / exact - 1.0).abs() < tol, "w={w}: {} vs {exact}", f.norm_sqr());
    }
}

#[test]
fn large_w_approaches_geometric_optics_like_one_over_w() {
    // Geometric-optics limit (Takahashi & Nakamura 2003): F → √|μ+| − i√|μ−| e^{iwΔT}, the difference falling like 1/w.
    for y in [0.3, 1.0, 3.0] {
        let diff = |w: f64| {
            let (f, _) = amplification_factor(w, y).unwrap();
            (f - amplification_geometric(w, y).unwrap()).norm()
        };
        let low: Vec<f64> = [25.0, 50.0, 100.0].iter().map(|&w| diff(w)).collect();
        let high: Vec<f64> = [400.0, 600.0, 800.0].iter().map(|&w| diff(w)).collect();
        for (w, d) in [25.0, 50.0, 100.0, 400.0, 600.0, 800.0].iter().zip(low.iter().chain(&high)) {
            // w|F − F_geo| stays O(1) (bound 2: common practice, no source; observed ≤ 1.01).
            assert!(w * d < 2.0, "y={y} w={w}: w|F - F_geo| = {}", w * d); // F − F_geo = O(1/w) (comment above)
        }
        let (lmax, hmax) = (low.iter().cloned().fold(0.0, f64::max), high.iter().cloned().fold(0.0, f64::max));
        // A factor ≥ 4 in w must shrink the (oscillating) difference by well over 2.
        assert!(hmax < 0.5 * lmax, "y={y}: max diff {hmax} at w ≥ 400 vs {lmax} at w ≤ 100"); // a factor ≥ 4 in w shrinks an O(1/w) difference by well over 2
    }
}

#[test]
fn small_w_tends_to_one() {
    // F → 1 as w → 0 (no lensing of waves much longer than the Schwarzschild radius; Takahashi & Nakamura 2003).
    // Observed |F − 1| ≈ (w/2)|ln w|; bound w(1 + |ln w|) (common practice, no source).
    for y in [0.0, 0.3, 1.0, 10.0] {
        for w in [1e-10, 1e-8, 1e-6, 1e-4, 1e-2] {
            let (f, _) = amplification_factor(w, y).unwrap();
            assert!((f - 1.0).norm() <= w * (1.0 + w.ln().abs()), "y={y} w={w}: {f}");
        }
    }
    assert_eq!(amplification_factor(0.0, 2.0).unwrap().0, Complex64::new(1.0, 0.0));
}

#[test]
fn kummer_against_mpmath() {
    // mpmath 1.3, mp.dps = 30, tests/reference/lensing_mpmath.py: hyp1f1(iα, 1, it).
    let table: [(f64, f64, f64, f64); 5] = [
        (0.5, 0.045, 0.97762875811396367, -0.00025121069711748296),
        (5.0, 5.0, 0.19328750768255678, -0.17828642042070594),
        (50.0, 50.0, -0.077925706117917661, -0.0055096861913217894),
        (0.05, 500.0, 0.87341356215386195, -0.30860287898593833),
        (500.0, 500.0, -0.010618017783584763, 0.022421401092977173),
    ];
    for (alpha, t, re, im) in table {
        let (m, _) = kummer_m_imaginary(alpha, t).unwrap();
        // Absolute tolerance relative to the O(1) scale of the solutions on this ray (|M| can be
        // small near a zero while the propagated error is set by the solution size ~ 1/√α).
        assert!((m - Complex64::new(re, im)).norm() < 1e-12, "α={alpha} t={t}: {m}"); // absolute, on the O(1) scale of the solutions (comment above)
    }
}

#[test]
fn ln_gamma_against_mpmath_and_identities() {
    // mpmath 1.3, mp.dps = 30, tests/reference/lensing_mpmath.py: gamma(z).
    let table: [(Complex64, f64, f64); 4] = [
        (Complex64::new(0.5, 3.0), 0.021445670552430646, 0.0068653648372616779),
        (Complex64::new(1.0, -5.0), -0.0016996644943606798, 0.0013585194175307527),
        (Complex64::new(1.0, -50.0), -4.0823246773266696e-34, -1.3158660530988403e-33),
        (Complex64::new(2.5, 0.1), 1.3228057593378591, 0.093219864362837385),
    ];
    for (z, re, im) in table {
        let g = ln_gamma(z).unwrap().exp();
        assert!(crel(g, Complex64::new(re, im)) < REL_ROUNDING, "Γ({z}) = {g}");
    }
    // |Γ(1 + ix)|² = πx/sinh(πx) (A&S 6.1.31), in logs to stay in range.
    for x in [0.01, 0.3, 1.0, 7.0, 30.0, 200.0, 1000.0] {
        let lg = ln_gamma(Complex64::new(1.0, x)).unwrap().re;
        let exact = 0.5 * ((2.0 * PI * x).ln() - PI * x - (-(-2.0 * PI * x).exp_m1()).ln());
        assert!((lg - exact).abs() < 1e-13 * (1.0 + x), "x={x}: {lg} vs {exact}"); // Re ln Γ grows like x: rounding relative to its size
    }
    // Γ(n) = (n − 1)! (elementary).
    let mut fact = 1.0;
    for n in 1..20 {
        let g = ln_gamma(Complex64::new(n as f64, 0.0)).unwrap();
        assert!((g.re - f64::ln(fact)).abs() < 1e-13 * (1.0 + f64::ln(fact)), "n={n}"); // as above, relative to ln((n − 1)!)
        fact *= n as f64;
    }
}

#[test]
fn conjugate_convention_is_detected() {
    // The e^{+iωt} convention would give the conjugate: F(1, 0.3) has Im F < 0 in ours
    // (tests/reference/lensing_mpmath.py value), and the geometric limit at large w has the saddle's −i.
    let (f, _) = amplification_factor(1.0, 0.3).unwrap();
    assert!(f.im < -0.5); // the sign of Im F fixes the e^{−iωt} convention
    let g = amplification_geometric(0.0, 1.0).unwrap();
    assert!(g.im < 0.0); // the saddle image carries −i
}

#[test]
fn fallback_to_geometric_optics_beyond_budget() {
    // w = 1e6, y = 10 needs ~1e7 continuation steps: the exact function refuses, naming `w`;
    // `amplification` falls back to geometric optics and says so.
    let e = amplification_factor(1e6, 10.0).unwrap_err();
    assert_eq!(e.field(), "w");
    let a = amplification(1e6, 10.0).unwrap();
    assert_eq!(a.method, Method::GeometricOptics);
    assert_eq!(a.value, amplification_geometric(1e6, 10.0).unwrap());
    // y = 0 never needs the continuation, so it stays exact at any allowed w.
    assert_eq!(amplification(1e7, 0.0).unwrap().method, Method::Series);
}

#[test]
fn curve_is_consistent_with_pointwise_values() {
    let c = amplification_curve(1.0, 0.1, 1000.0, 9).unwrap();
    assert_eq!(c.w.len(), 9);
    assert!((c.w[0] - 0.1).abs() < 1e-15 && c.w[8] == 1000.0); // the first grid point is w_min up to one rounding (absolute)
    for k in 0..9 {
        let (f, _) = amplification_factor(c.w[k], 1.0).unwrap();
        assert_eq!(c.abs[k], f.norm());
        assert_eq!(c.phase[k], f.arg());
        assert!(c.exact[k]);
    }
    let g = c.abs_geometric.as_ref().unwrap();
    assert_eq!(g[8], amplification_geometric(1000.0, 1.0).unwrap().norm());
    assert!(amplification_curve(0.0, 0.1, 10.0, 3).unwrap().abs_geometric.is_none());
    for (y, a, b, n, field) in [
        (1.0, 0.0, 1.0, 5, "w_min"),
        (1.0, 2.0, 1.0, 5, "w_max"),
        (1.0, 0.1, 1.0, 1, "n"),
        (-1.0, 0.1, 1.0, 5, "y"),
        (f64::NAN, 0.1, 1.0, 5, "y"),
    ] {
        assert_eq!(amplification_curve(y, a, b, n).unwrap_err().field(), field);
    }
}

#[test]
fn exact_evaluation_covers_w_up_to_2000_at_every_offset() {
    // Documented coverage: no geometric-optics stand-in for w ≤ 2000 at any y in [1e-3, 1e6]
    // (continuation and large-|z| expansion overlap), and w = 1e4 is exact at y = 1.
    for w in [1e-3, 1.0, 100.0, 1000.0, 2000.0] {
        for k in 0..=300 {
            let y = 10f64.powf(-3.0 + 9.0 * k as f64 / 300.0);
            assert!(exact_is_affordable(w, y), "w={w} y={y}");
        }
    }
    assert!(exact_is_affordable(1e4, 1.0));
    assert!(!exact_is_affordable(3000.0, 11.0));
}
