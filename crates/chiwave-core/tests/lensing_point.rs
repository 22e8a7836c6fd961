//! Point-mass lens tests: worked example, identities over a grid, request validation, JSON keys.

mod common;

use chiwave_core::lensing::{einstein_angle, magnification_curve, LensRequest, PointLens};
use chiwave_core::units::astro::{AU, KPC};
use chiwave_core::units::iau2015::GM_SUN;
use chiwave_core::validity::Level;
use common::*;

fn example(offset: f64) -> LensRequest {
    LensRequest {
        mass: "0.3Msun".into(),
        lens_distance: "4kpc".into(),
        source_distance: "8kpc".into(),
        offset,
        frequency: None,
        lens_redshift: 0.0,
        tolerance: None,
    }
}

#[test]
fn worked_example_point_lens() {
    let r = example(0.5).evaluate().unwrap();
    // Worked example (M = 0.3 GM☉^N/G, D_L = 4 kpc, D_S = 8 kpc; mpmath 1.3, tests/reference/lensing_mpmath.py):
    // θ_E = 2.67920207569003e-9 rad = 0.552625097039022 mas, R_E = 2.21050038815609 au.
    assert!(rel_diff(r.einstein_radius_rad, 2.67920207569003e-9) < REL_TRANSCRIBED);
    assert!(rel_diff(r.einstein_radius_mas, 0.552625097039022) < REL_TRANSCRIBED);
    assert!(rel_diff(r.einstein_radius_au, 2.21050038815609) < REL_TRANSCRIBED);
    // Paczyński 1986 at u = 0.5 (same script): μ+ = 1.5914103126635, μ− = −0.591410312663498, μ_tot = 2.182820625327.
    assert!(rel_diff(r.images[0].magnification, 1.5914103126635) < REL_TRANSCRIBED);
    assert!(rel_diff(r.images[1].magnification, -0.591410312663498) < REL_TRANSCRIBED);
    assert!(rel_diff(r.total_magnification, 2.182820625327) < REL_TRANSCRIBED);
    // x± = (0.5 ± √4.25)/2 (elementary, Paczyński 1986 formula by hand).
    assert!(rel_diff(r.images[0].position, (0.5 + 4.25f64.sqrt()) / 2.0) < REL_ROUNDING);
    assert!(rel_diff(r.images[1].position, (0.5 - 4.25f64.sqrt()) / 2.0) < REL_ROUNDING);
    // Time delay 4GM/c³ ΔT(0.5): ΔT = 0.5√4.25/2 + ln((√4.25 + 0.5)/(√4.25 − 0.5)) (Takahashi & Nakamura
    // 2003 formula written out by hand with the log, not the asinh form the code uses).
    let s = 4.25f64.sqrt();
    let dt = 0.25 * s + ((s + 0.5) / (s - 0.5)).ln();
    let c = chiwave_core::units::codata2018::C;
    assert!(rel_diff(r.time_delay_s, 4.0 * 0.3 * GM_SUN / (c * c * c) * dt) < REL_FEW_OPS);
    assert!(rel_diff(r.mass_msun, 0.3) < REL_ROUNDING);
    // R_E = θ_E D_L (definition).
    assert!(rel_diff(r.einstein_radius_au * AU, r.einstein_radius_rad * 4.0 * KPC) < REL_ROUNDING);
}

#[test]
fn identities_over_a_grid() {
    // μ+ + μ− = 1 and μ_tot = (u² + 2)/(u√(u² + 4)) = μ+ − μ− (Paczyński 1986); the images
    // solve the lens equation u = x − 1/x (Schneider, Ehlers & Falco 1992), and x+ x− = −1.
    for k in 0..=60 {
        let u = 10f64.powf(-4.0 + 8.0 * k as f64 / 60.0);
        let l = PointLens::new(u).unwrap();
        let [mp, mm] = l.magnifications();
        let [xp, xm] = l.image_positions();
        assert!((mp + mm - 1.0).abs() < 4.0 * f64::EPSILON * mp, "u={u}"); // an exact identity: four roundings
        assert!(rel_diff(mp - mm, (u * u + 2.0) / (u * (u * u + 4.0).sqrt())) < REL_ROUNDING, "u={u}");
        assert!(rel_diff(l.total_magnification(), mp - mm) < REL_ROUNDING, "u={u}");
        // x − 1/x = u is a difference of two terms that can both exceed u (x+ → 1 as u → 0,
        // x− → 0 as u → ∞): the rounding bound is relative to the larger term.
        assert!((xp - 1.0 / xp - u).abs() < REL_ROUNDING * xp.max(1.0 / xp), "u={u}");
        assert!((xm - 1.0 / xm - u).abs() < REL_ROUNDING * (1.0 / xm).abs().max(xm.abs()), "u={u}");
        assert!((xp * xm + 1.0).abs() < REL_ONE_ROUNDING, "u={u}");
        // μ± = 1/(1 − x±⁻⁴) (point-lens Jacobian; Schneider, Ehlers & Falco 1992). Near u = 0,
        // 1 − x⁻⁴ ≈ ±2u cancels, so this reference itself is only good to ~ε/u.
        let tol = REL_FEW_OPS * (1.0 + 1.0 / u); // the reference's own cancellation ~ε/u (above)
        assert!(rel_diff(mp, 1.0 / (1.0 - xp.powi(-4))) < tol, "u={u}");
        if u < 100.0 {
            assert!(rel_diff(mm, 1.0 / (1.0 - xm.powi(-4))) < tol, "u={u}");
        }
        // ΔT = T(x−) − T(x+) with T(x) = (x − u)²/2 − ln|x| (Fermat potential, Schneider, Ehlers & Falco 1992).
        if u > 1e-3 && u < 100.0 {
            let t = |x: f64| 0.5 * (x - u).powi(2) - x.abs().ln();
            assert!(rel_diff(l.time_delay(), t(xm) - t(xp)) < 1e-11, "u={u}"); // the Fermat-potential difference cancels ~3 digits at u = 1e-3
        }
    }
    // Limits: μ_tot → 1/u as u → 0 and μ_tot − 1 → 2/u⁴ as u → ∞ (expansions of the closed form).
    assert!(rel_diff(PointLens::new(1e-8).unwrap().total_magnification(), 1e8) < 1e-12); // μ_tot = 1/u + O(u) at u = 1e-8 (expansion of the closed form)
    let l = PointLens::new(1e3).unwrap();
    assert!(rel_diff(-l.magnifications()[1], 1e-12) < 1e-5); // |μ−| = 1/u⁴ + O(u⁻⁶) at u = 1e3
}

#[test]
fn redshift_scales_delay_and_w_not_theta() {
    let mut r = example(1.0);
    r.frequency = Some("100Hz".into());
    let a = r.evaluate().unwrap();
    r.lens_redshift = 1.0;
    let b = r.evaluate().unwrap();
    assert_eq!(a.einstein_radius_rad, b.einstein_radius_rad);
    assert!(rel_diff(b.time_delay_s, 2.0 * a.time_delay_s) < REL_ROUNDING);
    assert!(rel_diff(b.w.unwrap(), 2.0 * a.w.unwrap()) < REL_ROUNDING);
    assert!(b.flags.iter().any(|f| f.key == "distances" && f.level == Level::Caution));
    // w = 8πGM f/c³: for 1 M☉ at 100 Hz, w = 0.0124 (mpmath 1.3, tests/reference/lensing_mpmath.py); here 0.3 M☉.
    assert!((a.w.unwrap() / 0.3 - 0.0124).abs() < 5e-5); // 0.0124 quoted to 3 digits
    // w < 1: diffraction dominates, the ray magnification is flagged invalid and |F| ≈ 1.
    assert!(a.flags.iter().any(|f| f.key == "geometric_optics" && f.level == Level::Invalid));
    assert!((a.amplification_abs.unwrap() - 1.0).abs() < 0.05); // |F| = 1 + O(w) at w ≈ 4e-3
}

#[test]
fn json_keys_are_the_cli_contract() {
    let mut r = example(0.5);
    let v = serde_json::to_value(r.evaluate().unwrap()).unwrap();
    for k in ["einstein_radius_rad", "images", "total_magnification", "time_delay_s", "flags", "sources"] {
        assert!(v.get(k).is_some(), "missing {k}");
    }
    assert!(v.get("w").is_none() && v.get("amplification").is_none());
    assert!(v["images"][0]["position"].is_f64() && v["images"][1]["magnification"].is_f64());
    r.frequency = Some("5kHz".into());
    let v = serde_json::to_value(r.evaluate().unwrap()).unwrap();
    for k in ["w", "amplification", "amplification_abs", "amplification_geometric", "amplification_method"] {
        assert!(v.get(k).is_some(), "missing {k}");
    }
    assert!(v["amplification"]["re"].is_f64() && v["amplification"]["im"].is_f64());
    assert!(v["sources"]["amplification"].as_str().unwrap().contains("astro-ph/0305055"));
    // Request JSON round trip through the tagged Request enum.
    let req: chiwave_core::request::Request = serde_json::from_str(
        r#"{"kind":"lens","mass":"0.3Msun","lens_distance":"4kpc","source_distance":"8kpc","offset":0.5}"#,
    )
    .unwrap();
    assert!(chiwave_core::request::evaluate(&req).is_ok());
}

#[test]
fn validation_names_fields() {
    let cases: Vec<(LensRequest, &str)> = vec![
        (LensRequest { mass: "-1Msun".into(), ..example(0.5) }, "mass"),
        (LensRequest { mass: "1".into(), ..example(0.5) }, "mass"),
        (LensRequest { mass: "1 parsecs".into(), ..example(0.5) }, "mass"),
        (LensRequest { mass: "nan".into(), ..example(0.5) }, "mass"),
        (LensRequest { lens_distance: "9kpc".into(), ..example(0.5) }, "lens_distance"),
        (LensRequest { lens_distance: "8kpc".into(), ..example(0.5) }, "lens_distance"),
        (LensRequest { lens_distance: "4 Msun".into(), ..example(0.5) }, "lens_distance"),
        (LensRequest { source_distance: "0kpc".into(), ..example(0.5) }, "source_distance"),
        (LensRequest { source_distance: "inf".into(), ..example(0.5) }, "source_distance"),
        (example(0.0), "offset"),
        (example(-1.0), "offset"),
        (example(f64::NAN), "offset"),
        (example(1e7), "offset"),
        (LensRequest { lens_redshift: -0.1, ..example(0.5) }, "lens_redshift"),
        (LensRequest { lens_redshift: f64::INFINITY, ..example(0.5) }, "lens_redshift"),
        (LensRequest { frequency: Some("0Hz".into()), ..example(0.5) }, "frequency"),
        (LensRequest { frequency: Some("1e300GHz".into()), ..example(0.5) }, "frequency"),
        (LensRequest { frequency: Some("3 furlongs".into()), ..example(0.5) }, "frequency"),
    ];
    for (r, field) in cases {
        let e = r.evaluate().unwrap_err();
        assert_eq!(e.field(), field, "{e}");
        assert!(e.to_string().starts_with(field), "{e}");
    }
    let e = example(0.0).evaluate().unwrap_err().to_string();
    assert!(e.contains("1e-10") && e.contains("caustic"), "{e}");
    assert_eq!(einstein_angle(GM_SUN, 2.0, 1.0).unwrap_err().field(), "lens_distance");
}

#[test]
fn magnification_curve_matches_point_values() {
    let c = magnification_curve(0.1, 2.0, 20).unwrap();
    assert_eq!(c.offset.len(), 20);
    assert_eq!(c.offset[19], 2.0);
    for k in 0..20 {
        let l = PointLens::new(c.offset[k]).unwrap();
        assert_eq!(c.total[k], l.total_magnification());
        assert_eq!([c.plus[k], c.minus[k]], l.magnifications());
    }
    assert_eq!(magnification_curve(0.0, 1.0, 5).unwrap_err().field(), "offset_min");
    assert_eq!(magnification_curve(1.0, 0.5, 5).unwrap_err().field(), "offset_max");
    assert_eq!(magnification_curve(0.1, 1.0, 1).unwrap_err().field(), "n");
}
