//! Property tests: no panic and a named error for any f64 in every field; F → 1 as w → 0.

mod common;

use chiwave_core::lensing::wave::{amplification, amplification_factor, amplification_geometric};
use chiwave_core::lensing::{magnification_curve, LensRequest, PointLens};
use chiwave_core::units::Quantity;
use common::any_f64;
use proptest::prelude::*;

const FIELDS: [&str; 6] = ["mass", "lens_distance", "source_distance", "offset", "frequency", "lens_redshift"];


fn unit() -> impl Strategy<Value = &'static str> {
    prop_oneof![Just(""), Just("Msun"), Just("kg"), Just("kpc"), Just("pc"), Just("m"), Just("Hz"), Just("kHz"), Just("xyz")]
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 256, ..ProptestConfig::default() })]

    #[test]
    fn lens_request_never_panics(
        m in any_f64(), mu in unit(), dl in any_f64(), dlu in unit(), ds in any_f64(), dsu in unit(),
        u in any_f64(), f in proptest::option::of(any_f64()), z in any_f64(),
    ) {
        let r = LensRequest {
            mass: Quantity::Parts { value: m, unit: mu.into() },
            lens_distance: Quantity::Parts { value: dl, unit: dlu.into() },
            source_distance: Quantity::Parts { value: ds, unit: dsu.into() },
            offset: u,
            frequency: f.map(|v| Quantity::Parts { value: v, unit: "Hz".into() }),
            lens_redshift: z,
            tolerance: None,
        };
        match r.evaluate() {
            Ok(out) => {
                prop_assert!(out.einstein_radius_rad.is_finite() && out.einstein_radius_rad > 0.0); // an angle, positive
                prop_assert!(out.total_magnification >= 1.0 && out.time_delay_s.is_finite()); // a point lens never demagnifies
                if let Some(a) = out.amplification {
                    prop_assert!(a.re.is_finite() && a.im.is_finite());
                }
            }
            Err(e) => prop_assert!(FIELDS.contains(&e.field()), "unexpected field {}: {e}", e.field()),
        }
    }

    #[test]
    fn wave_functions_never_panic(w in any_f64(), y in any_f64()) {
        // Cheap cases only: the budget check happens before any work, so huge w·y² is refused fast.
        for r in [amplification(w, y).map(|a| a.value), amplification_geometric(w, y)] {
            match r {
                Ok(v) => prop_assert!(v.re.is_finite() && v.im.is_finite()),
                Err(e) => prop_assert!(["w", "y"].contains(&e.field()), "{e}"),
            }
        }
    }

    #[test]
    fn point_lens_and_curve_never_panic(a in any_f64(), b in any_f64(), n in 0usize..50) {
        if let Ok(l) = PointLens::new(a) {
            let [p, m] = l.magnifications();
            prop_assert!(p >= 1.0 && m <= 0.0 && (p + m - 1.0).abs() < 1e-12 * p); // μ₊ + μ₋ = 1 to rounding, relative to μ₊ ≤ 1e10
        }
        if let Err(e) = magnification_curve(a, b, n) {
            prop_assert!(["offset_min", "offset_max", "n"].contains(&e.field()));
        }
    }

    #[test]
    fn amplification_tends_to_one_as_w_to_zero(lw in -12.0..-3.0f64, y in 0.0..10.0f64) {
        // F → 1 as w → 0 (Takahashi & Nakamura 2003, astro-ph/0305055); observed |F − 1| ≈ (w/2)|ln w|, bound w(1 + |ln w|).
        let w = 10f64.powf(lw);
        let (f, _) = amplification_factor(w, y).unwrap();
        prop_assert!((f - 1.0).norm() <= w * (1.0 + w.ln().abs()), "w={w} y={y}: {f}");
    }
}
