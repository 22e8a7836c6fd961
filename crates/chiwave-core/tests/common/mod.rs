//! Shared support for the core's integration tests (`mod common;` in each test file): the named
//! tolerances (defined once, in `chiwave_core::numeric`, with what each one is for), the
//! relative difference, and the proptest strategy of arbitrary f64 with the edge cases every
//! input must survive.
//!
//! A bound in a test is one of these tolerances or carries its reason on the same line.
#![allow(dead_code, unused_imports)]

pub use chiwave_core::numeric::{
    rel_diff, REL_FEW_OPS, REL_ONE_ROUNDING, REL_QUADRATURE, REL_ROUNDING, REL_SKY_RULE, REL_TRANSCRIBED,
};
use proptest::prelude::*;

/// Any f64: the whole bit range, the non-finite values, signed zeros, the extremes, values just
/// above 1 (γ → 1) and the ranges where inputs are usually accepted, so that both the refusals
/// and the accepted paths are exercised.
pub fn any_f64() -> impl Strategy<Value = f64> {
    prop_oneof![
        proptest::num::f64::ANY,
        Just(f64::NAN),
        Just(f64::INFINITY),
        Just(f64::NEG_INFINITY),
        Just(0.0),
        Just(-0.0),
        Just(1.0),
        Just(-1.0),
        Just(1.0 + 1e-16),
        Just(f64::MIN_POSITIVE),
        Just(f64::MAX),
        -2.0f64..2.0,
        0.0f64..20.0,
        -10.0f64..10.0,
        0.0f64..1.0,
        1.0f64..1e4,
        1e-12f64..1e12,
    ]
}

/// Checks one verdict of the accuracy batteries against the actual relative error `actual`
/// (computed in the test from an independent reference) and prints the row of the battery's
/// table (`cargo test -- --nocapture` shows them): the verdict must be the one rule's
/// (`validity::verdict`) on the estimate; `ok` only where actual < tol; `outside` only where
/// actual > 10·tol/k or there is no estimate. `k` is the estimator's documented conservatism:
/// 1 for an estimate that measures the distance to a reference in the same result (it then
/// equals the actual error up to the reference's own small estimate), and the documented factor
/// by which a bound (a rounding bound, the size of an omitted term) may exceed the actual error.
pub fn check_verdict(label: &str, e: &chiwave_core::validity::ErrorEstimate, actual: f64, tol: f64, k: f64) {
    use chiwave_core::validity::{verdict, Verdict};
    let est = e.error_estimate;
    println!("| {label} | {:?} | {} | {actual:.2e} | tol {tol:.0e} |", e.verdict, est.map(|x| format!("{x:.2e}")).unwrap_or_else(|| "—".into()));
    assert_eq!(e.verdict, verdict(est, tol), "{label}: verdict is not the rule's");
    match e.verdict {
        Verdict::Ok => assert!(actual < tol, "{label}: ok with actual {actual:e} ≥ tol {tol:e} (estimate {est:?})"),
        Verdict::Outside => {
            assert!(est.is_none() || actual > 10.0 * tol / k, "{label}: outside with actual {actual:e} ≤ 10 tol/{k} (estimate {est:?})")
        }
        Verdict::Caution => {}
    }
    // A conservative estimate: never below the actual error (up to 1e-6 of it, the difference
    // between relative-to-the-reference and relative-to-the-truth, and rounding).
    if let Some(x) = est {
        assert!(x * (1.0 + 1e-6) >= actual || actual < 1e-15, "{label}: estimate {x:e} below the actual error {actual:e}");
    }
}
