//! The lens accuracy battery: the verdicts of the geometric-optics amplification, the ray-optics
//! magnification and the exact |F| against the actual error from mpmath's F(w, y), from
//! diffraction (w ≪ 1) to geometric optics (w = 1000); the geometric-optics scaling bound; the
//! recommended value; the microlensing wording. `cargo test --test lensing_accuracy --
//! --nocapture` prints the battery's table.
#![allow(clippy::excessive_precision)]

mod common;

use chiwave_core::lensing::wave::{amplification_factor, amplification_geometric};
use chiwave_core::lensing::{LensRequest, PointLens};
use chiwave_core::validity::Verdict;
use common::*;
use num_complex::Complex64;

/// IAU 2015 nominal GM☉ and c (exact): f = w c³/(8π GM☉) gives dimensionless frequency w for 1 M☉.
fn frequency_for(w: f64) -> f64 {
    w * 299_792_458f64.powi(3) / (8.0 * std::f64::consts::PI * 1.327_124_4e20)
}

/// Ray-optics F of the two images, written out here (Takahashi & Nakamura 2003,
/// astro-ph/0305055): √|μ₊| − i√|μ₋| e^{iwΔT}, μ± = 1/2 ± (y² + 2)/(2y√(y² + 4)),
/// ΔT = y√(y² + 4)/2 + ln[(√(y² + 4) + y)/(√(y² + 4) − y)].
fn f_geometric(w: f64, y: f64) -> Complex64 {
    let s = (y * y + 4.0).sqrt();
    let mu_p = 0.5 + (y * y + 2.0) / (2.0 * y * s);
    let mu_m = mu_p - 1.0;
    let dt = 0.5 * y * s + ((s + y) / (s - y)).ln();
    Complex64::new(mu_p.sqrt(), 0.0) - Complex64::new(0.0, mu_m.sqrt()) * Complex64::from_polar(1.0, w * dt)
}

#[test]
fn wave_optics_battery() {
    // A 1 M☉ lens at 1 Gpc (source at 2 Gpc): the thin-lens parameter is ~1e-11, so the
    // verdicts judge the diffraction alone.
    // mpmath 1.3 values (tests/reference/lensing_mpmath.py, in tests/common), y > 0 (the ray
    // magnifications diverge at y = 0) and w up to 1000.
    for (w, y, re, im) in F_MPMATH.into_iter().filter(|&(w, y, _, _)| y > 0.0 && w * y * y < 2e5) {
        let exact = Complex64::new(re, im);
        for tol in [1e-2, 1e-4, 1e-8] {
            let req = LensRequest {
                mass: "1Msun".into(),
                lens_distance: "1Gpc".into(),
                source_distance: "2Gpc".into(),
                offset: y,
                frequency: Some(format!("{}Hz", frequency_for(w)).as_str().into()),
                lens_redshift: 0.0,
                tolerance: Some(tol),
            };
            let r = req.evaluate().unwrap();
            assert!(rel_diff(r.w.unwrap(), w) < 1e-12);
            let label = format!("w = {w}, y = {y}");
            let go = f_geometric(w, y);
            check_verdict(&format!("{label}: geometric-optics F"), &r.estimates["amplification_geometric"], (go - exact).norm() / exact.norm(), tol, 1.0);
            let mu = r.total_magnification;
            check_verdict(&format!("{label}: ray magnification vs |F|²"), &r.estimates["total_magnification"], (mu - exact.norm_sqr()).abs() / exact.norm_sqr(), tol, 1.0);
            // The recommended |F|: exact, within every tolerance here (its estimate is the
            // numerical accuracy, a bound: k large, never outside).
            assert_eq!(r.best.key, "amplification_abs");
            check_verdict(&format!("{label}: |F|"), &r.estimates["amplification_abs"], rel_diff(r.amplification_abs.unwrap(), exact.norm()), tol, 1e6);
            assert_eq!(r.best.verdict, Verdict::Ok, "{label}");
        }
    }
}

#[test]
fn geometric_optics_scaling_bound() {
    // 1/(wΔT) + 1/(wy²) bounds |F_geo − F|/|F| by a factor of at least 4 over 0.1 ≤ w ≤ 1000,
    // 3e-3 ≤ y ≤ 30, against the exact F (itself checked against mpmath in lensing_wave.rs):
    // the estimate used where the exact F is too costly is conservative.
    let mut worst: f64 = 0.0;
    for iy in 0..60 {
        let y = 10f64.powf(-2.5 + 4.0 * iy as f64 / 59.0);
        for iw in 0..120 {
            let w = 10f64.powf(-1.0 + 4.0 * iw as f64 / 119.0);
            let Ok((f, _)) = amplification_factor(w, y) else { continue };
            let g = amplification_geometric(w, y).unwrap();
            let dt = PointLens::new(y).unwrap().time_delay();
            let bound = 1.0 / (w * dt) + 1.0 / (w * y * y);
            worst = worst.max((g - f).norm() / f.norm() / bound);
        }
    }
    assert!(worst <= 0.25, "worst actual/bound = {worst}");
    // Where the exact F is too costly the result says so and uses that bound.
    let r = LensRequest {
        mass: "1Msun".into(),
        lens_distance: "1Gpc".into(),
        source_distance: "2Gpc".into(),
        offset: 1.0,
        frequency: Some(format!("{}Hz", frequency_for(1e6)).as_str().into()),
        lens_redshift: 0.0,
        tolerance: None,
    }
    .evaluate()
    .unwrap();
    assert_eq!(r.amplification_method, Some("geometric_optics"));
    let e = r.estimates["amplification_abs"].error_estimate.unwrap();
    assert!((1e-7..1e-5).contains(&e), "{e}"); // 1/(wΔT) + 1/(wy²) = 1.5e-6 at w = 1e6, y = 1
}

#[test]
fn ray_optics_best_and_microlens_wording() {
    // Without a frequency the recommended value is the ray-optics magnification, judged by the
    // thin-lens parameter. A 0.5 M☉ lens at 4 kpc, source at 8 kpc: θ_E = 0.71 mas
    // (θ_E = √(4GM D_LS/(c² D_L D_S)), Einstein 1936).
    let r = LensRequest {
        mass: "0.5Msun".into(),
        lens_distance: "4kpc".into(),
        source_distance: "8kpc".into(),
        offset: 0.5,
        frequency: None,
        lens_redshift: 0.0,
        tolerance: None,
    }
    .evaluate()
    .unwrap();
    assert!((0.70..0.72).contains(&r.einstein_radius_mas));
    assert_eq!((r.best.key, r.best.value), ("total_magnification", Some(r.total_magnification)));
    assert_eq!(r.best.verdict, Verdict::Ok);
    let f = r.flags.iter().find(|f| f.key == "lensing_strength").unwrap();
    assert!(!f.message.contains("strong lensing") && !f.message.contains("bright"), "{}", f.message);
    assert!(f.message.contains("not resolved") && f.message.contains("total magnification"), "{}", f.message);
}
