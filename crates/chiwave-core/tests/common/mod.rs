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

/// The plus and cross parts of a symmetric tensor h_ij for an observer in the direction (θ, φ):
/// h₊ = ½(e_θe_θ − e_φe_φ):h, h× = ½(e_θe_φ + e_φe_θ):h with e_θ = (cos θ cos φ, cos θ sin φ,
/// −sin θ), e_φ = (−sin φ, cos φ, 0) (the README's polarisation basis).
pub fn plus_cross(h: &[[f64; 3]; 3], theta: f64, phi: f64) -> [f64; 2] {
    let (st, ct) = theta.sin_cos();
    let (sp, cp) = phi.sin_cos();
    let et = [ct * cp, ct * sp, -st];
    let ep = [-sp, cp, 0.0];
    let mut out = [0.0; 2];
    for i in 0..3 {
        for j in 0..3 {
            out[0] += 0.5 * (et[i] * et[j] - ep[i] * ep[j]) * h[i][j];
            out[1] += 0.5 * (et[i] * ep[j] + ep[i] * et[j]) * h[i][j];
        }
    }
    out
}

/// Point-lens amplification factor from mpmath 1.3, mp.dps = 30 (tests/reference/lensing_mpmath.py:
/// F from mpmath's hyp1f1 and gamma, independent of the Rust series and continuation):
/// (w, y, Re F, Im F).
pub const F_MPMATH: [(f64, f64, f64, f64); 23] = [
    (0.1, 0.1, 1.0654608479228424, -0.17327932301213603),
    (0.1, 1.0, 1.0722375026497189, -0.09890809699661532),
    (1.0, 0.3, 1.6792441949381667, -0.56423050837083423),
    (1.0, 1.0, 1.3774479180866973, 0.20921170471940769),
    (1.0, 3.0, 1.0923561718577773, 0.015424658416934274),
    (3.0, 0.5, 1.3816798460149346, 0.78264115849364777),
    (5.0, 2.0, 0.87066544865620307, 0.097510772729790078),
    (10.0, 0.1, 4.2011022782293783, 0.86453344809329615),
    (10.0, 1.0, 1.4656980352033304, 0.15497847986152898),
    (30.0, 0.3, 0.69893684009400669, -0.7548773373593856),
    (30.0, 3.0, 1.0957583963611609, -0.0098116851430640615),
    (100.0, 1.0, 1.3481576095262211, -0.31577448803492788),
    (100.0, 5.0, 0.96522828388634065, 0.010954462870036017),
    (300.0, 0.5, 2.0287416966536104, -0.05184926544547886),
    (1000.0, 1.0, 1.3555620939251483, -0.30980772489998904),
    (1000.0, 10.0, 1.0051113131658971, 0.0083969162887186401),
    (0.01, 10.0, 1.0053804931693981, -0.0008444875810374802),
    (2.0, 0.0, 1.9216163774825058, -1.6131742764865697),
    (1.0, 100.0, 1.0000261208488792, 9.6508874675050169e-5),
    (10.0, 30.0, 0.99923067151712547, 0.0007976788409725426),
    (100.0, 20.0, 1.0013136531808185, 0.0021143594925583091),
    (1000.0, 30.0, 0.99896782728450782, 0.00040305602955211758),
    (0.01, 6000.0, 1.0000000234473025, -1.4893920846242573e-8),
];
