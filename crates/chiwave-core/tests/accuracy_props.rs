//! Properties of the verdicts and the recommended values: the one rule is monotone in the
//! estimate and in the tolerance; in every result of every request kind, `best.value` is the
//! value under `best.key`, and every estimate is ≥ 0 (or null with a reason) with the rule's
//! verdict. (Identities of the design, no outside source: common practice.)


use chiwave_core::request::{evaluate, Request};
use chiwave_core::validity::{verdict, Verdict};
use proptest::prelude::*;
use serde_json::Value;

/// The value under a dotted key of a result.
fn at<'a>(v: &'a Value, key: &str) -> Option<&'a Value> {
    key.split('.').try_fold(v, |x, k| x.get(k))
}

/// Checks `best` (and `best_e_rad`) and every estimate of one result.
fn check_result(v: &Value) -> Result<(), TestCaseError> {
    let tol = v["tolerance"].as_f64().expect("tolerance in every result");
    for name in ["best", "best_e_rad"] {
        let Some(b) = v.get(name) else { continue };
        let key = b["key"].as_str().unwrap();
        let value = at(v, key).unwrap_or(&Value::Null);
        prop_assert_eq!(&b["value"], value, "{} under {}", name, key);
        let est = b["error_estimate"].as_f64();
        prop_assert_eq!(serde_json::to_value(verdict(est, tol)).unwrap(), b["verdict"].clone());
        if b["value"].is_null() {
            prop_assert!(!b["why"].as_str().unwrap().is_empty());
        }
    }
    let mut all: Vec<&Value> = v["estimates"].as_object().unwrap().values().collect();
    for list in ["series", "orders"] {
        if let Some(Value::Array(a)) = v.get(list) {
            all.extend(a.iter());
        }
    }
    for e in all {
        let est = e["error_estimate"].as_f64();
        if let Some(x) = est {
            prop_assert!(x >= 0.0 && x.is_finite());
        } else {
            prop_assert!(e["error_reason"].as_str().is_some_and(|r| !r.is_empty()), "{e}");
        }
        prop_assert_eq!(serde_json::to_value(verdict(est, tol)).unwrap(), e["verdict"].clone());
    }
    Ok(())
}

fn run(json: String) -> Result<(), TestCaseError> {
    let req: Request = serde_json::from_str(&json).unwrap();
    if let Ok(res) = evaluate(&req) {
        check_result(&serde_json::to_value(&res).unwrap())?;
    }
    Ok(())
}

proptest! {
    #[test]
    fn verdict_is_monotone(a in 0.0f64..1.0, b in 0.0f64..1.0, t1 in 1e-12f64..0.5, t2 in 1e-12f64..0.5) {
        let (lo, hi) = if a <= b { (a, b) } else { (b, a) };
        prop_assert!(verdict(Some(lo), t1) <= verdict(Some(hi), t1));
        let (tl, th) = if t1 <= t2 { (t1, t2) } else { (t2, t1) };
        prop_assert!(verdict(Some(a), th) <= verdict(Some(a), tl));
        prop_assert!(verdict(Some(a), t1) <= verdict(None, t1));
        prop_assert_eq!(verdict(None, t1), Verdict::Outside);
    }

    #[test]
    fn light_best_is_the_value_under_its_key(lb in -3.0f64..6.0, spin in -1.0f64..1.0, kind in 0..3u8, lt in -12.0f64..-0.31) {
        let (s, q) = match kind { 0 => (0.0, 0.0), 1 => (spin, 0.0), _ => (0.0, spin) };
        run(format!(r#"{{"kind": "light", "b": {}, "spin": {s}, "charge": {q}, "tolerance": {}}}"#, 10f64.powf(lb), 10f64.powf(lt)))?;
    }

    #[test]
    fn lens_best_is_the_value_under_its_key(y in 0.001f64..20.0, lw in -3.0f64..5.0, freq in any::<bool>()) {
        let f = if freq { format!(r#", "frequency": "{}Hz""#, 8078.0 * 10f64.powf(lw)) } else { String::new() };
        run(format!(r#"{{"kind": "lens", "mass": "1Msun", "lens_distance": "4kpc", "source_distance": "8kpc", "offset": {y}{f}}}"#))?;
    }

    #[test]
    fn encounter_best_is_the_value_under_its_key(nu in 1e-6f64..0.25, g in 1.0001f64..20.0, lj in 0.0f64..4.0, em in any::<bool>(), k in -1.5f64..1.5) {
        let j = 10f64.powf(lj);
        if em {
            // q1 q2 = κ J with J = ν p∞ b/h ≈ ν p∞ b: choose q2 from κ.
            run(format!(r#"{{"kind": "encounter", "force": "em", "nu": {nu}, "gamma": {g}, "b": {j}, "q1": 0.5, "q2": {}}}"#, 2.0 * k * nu * (g * g - 1.0f64).sqrt() * j))?;
        } else {
            run(format!(r#"{{"kind": "encounter", "nu": {nu}, "gamma": {g}, "j": {j}}}"#))?;
        }
    }
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]
    #[test]
    fn waveform_best_is_the_value_under_its_key(g in 1.0001f64..5.0, lb in 0.5f64..6.0, th in 0.0f64..3.14, em in any::<bool>()) {
        let b = 10f64.powf(lb);
        let force = if em { r#", "force": "em", "q1": 0.1, "q2": -0.2, "energy_flux": false"# } else { r#", "energy_flux": false"# };
        run(format!(r#"{{"kind": "waveform", "m1": 1, "m2": 2, "gamma": {g}, "b": {b}, "theta": {th}, "phi": 0.3, "u_min": -5, "u_max": 5, "u_unit": "b_over_v", "samples": 5{force}}}"#))?;
    }
}
