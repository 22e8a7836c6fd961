//! Error estimates of an encounter result: every PM (PL) order, the Newtonian angle, the exact
//! test-body (test-charge) angle used as a proxy for the two-body angle, the strong-field
//! estimate, the radiated energy and angular momentum; the recommended angle.
//!
//! Every estimate is relative to the (unknown) two-body value. Two references carry their own
//! estimates, and every other angle is judged against them by the triangle inequality,
//! |x − χ| ≤ |x − ref| + |ref − χ|, keeping the smaller of the two bounds:
//! * the exact test-body angle χ_tb at the same γ and j, corrected by the ν-dependence known
//!   through 3PM: exact for ν → 0; for ν > 0 the rest is estimated as the test-body tail beyond
//!   3PM scaled by the coefficients' relative ν-change ([`tb_reference`]);
//! * the strong-field estimate: three times the spread between the estimate built from the 3PM
//!   information and the one built from the 2PM information ([`eob_spread`]).
//!
//! In the ν → 0 limit the PM orders are thus compared with the exact angle. The reasons and the
//! checks that make these conservative are in `docs/physics/accuracy.md`.

use super::{eob, pl, testbody};
use crate::two_body::Kinematics;
use crate::validity::{Best, ErrorEstimate, Estimates, Verdict};
use std::f64::consts::{FRAC_PI_2, PI};

/// Factor on the spread between the strong-field estimates from 3PM and from 2PM information:
/// against the exact test-body angle (ν → 0) the spread times this factor exceeds the actual
/// error by 1.5 or more for 1.01 ≤ γ ≤ 10 and j/j_c from 1.01 to 1000 (mpmath references,
/// tests/encounter_accuracy.rs).
pub const EOB_SPREAD_FACTOR: f64 = 3.0;

const VS_TB: &str = "vs the exact test-body angle (same γ, j) with the ν-dependence known through 3PM, plus an estimate of the rest";
const VS_EOB: &str = "vs the strong-field estimate, plus its own estimate";
const TB_PROXY: &str = "ν-correction: the known 2PM and 3PM ν-dependence plus the test-body tail beyond 3PM × its relative ν-change";
const EOB_OWN: &str = "3 × the spread between the strong-field estimates from 3PM and from 2PM information";
const VS_DARWIN: &str = "vs the exact test-charge angle (same γ, κ) with the known two-body and radiation-reaction parts, plus an estimate of the rest";
const DARWIN_PROXY: &str = "two-body and radiation-reaction corrections: the known 2PL and 3PL ones plus Darwin's tail beyond 2PL × their relative size";
const RADIATED: &str = "validity parameter: exp(3χ₁) − 1 with χ₁ the leading-order deflection angle (calibrated on the slow-motion radiated energy)";

/// One reference angle with its own relative estimate.
#[derive(Clone, Copy)]
struct Reference {
    value: f64,
    err: f64,
    method: &'static str,
}

/// The smallest triangle bound |x − ref|/|ref| + err over the references, with its method.
fn against(x: f64, refs: &[Option<Reference>]) -> Option<(f64, &'static str)> {
    refs.iter()
        .flatten()
        .map(|r| ((x - r.value).abs() / r.value.abs() + r.err, r.method))
        .filter(|(e, _)| e.is_finite())
        .min_by(|a, b| a.0.total_cmp(&b.0))
}

/// The estimate of `x` against `refs`, or none for `reason` (named by `method`).
fn estimate(x: f64, refs: &[Option<Reference>], reason: &str, method: &str, tol: f64) -> ErrorEstimate {
    match against(x, refs) {
        Some((e, m)) => ErrorEstimate::new(e, m, tol),
        None => ErrorEstimate::none(reason, method, tol),
    }
}

/// The strong-field estimate from the 2PM information alone: the angle of the radial problem
/// with w(u) = w₁u + w₂u² (the same map, [`eob::w_from_chi`], truncated after w₂), in closed form
/// χ = 2j/√A [π/2 + arcsin(w₁/√(w₁² + 4A p∞²))] − π, A = j² − w₂ (the elementary integral of
/// 1/√(p∞² + w₁u − Au²) from 0 to its root). `None` (capture) for A ≤ 0.
///
/// # Examples
/// ```
/// // w = 0 (no interaction): χ = 0.
/// assert!(chiwave_core::encounter::accuracy::eob_2pm(0.5, 0.0, 0.0, 10.0).unwrap().abs() < 1e-15);
/// ```
pub fn eob_2pm(p_inf: f64, w1: f64, w2: f64, j: f64) -> Option<f64> {
    let a = j * j - w2;
    if !(a > 0.0) {
        return None;
    }
    let s = (w1 / (w1 * w1 + 4.0 * a * p_inf * p_inf).sqrt()).asin();
    Some(2.0 * j / a.sqrt() * (FRAC_PI_2 + s) - PI)
}

/// Relative spread |χ₃ − χ₂|/χ₃ between the strong-field estimates from 3PM and from 2PM
/// information (χ₃ = `eob3`, the reported estimate); `None` when the 2PM-information one is
/// captured.
pub fn eob_spread(p_inf: f64, chi: &[f64; 3], j: f64, eob3: f64) -> Option<f64> {
    let w = eob::w_from_chi(p_inf, &chi[..2]);
    eob_2pm(p_inf, w[0], w[1], j).map(|e2| (eob3 - e2).abs() / eob3.abs())
}

/// The test-body reference for a two-body encounter at the same γ and j: the exact test-body
/// angle χ_tb corrected by the ν-dependence that is known through 3PM,
/// χ_tb* = χ_tb + Δ₃ with Δ₃ = Σ_{n≤3} 2(χ_n − χ_n^Schw)/jⁿ (radiation reaction included), and the
/// absolute estimate of its distance from the two-body angle, ρ T₃: T₃ = |χ_tb − Σ_{n≤3} 2χ_n^Schw/jⁿ|
/// is the test-body tail beyond 3PM (exact) and ρ = 2 max(|χ₂/χ₂^Schw − 1|, |χ₃/χ₃^Schw − 1|, 1 − h⁻³)
/// twice the largest relative ν-change of the coefficients (h³χ₄ = χ₄^Schw + νX₄ by mass
/// polynomiality: Damour 2019, arXiv:1912.02139). Returns (χ_tb*, ρ T₃); both tend to (χ_tb, 0)
/// as ν → 0.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{accuracy::tb_reference, kinematics::RelativeSpeed, pm, testbody};
/// let b = RelativeSpeed::from_gamma(1.5).unwrap();
/// let c = pm::coefficients(&b, 1e-12);
/// let schw = [1, 2, 3].map(|n| testbody::pm_coefficient(n, &b).unwrap());
/// let (value, err) = tb_reference(&c, &schw, 1.0, 10.0, 1.153856678266915);
/// assert!((value - 1.153856678266915).abs() < 1e-10 && err < 1e-10); // the test-body limit
/// ```
pub fn tb_reference(c: &[f64; 4], schw: &[f64; 3], h: f64, j: f64, chi_tb: f64) -> (f64, f64) {
    let x = 1.0 / j;
    let pm_tb: f64 = (0..3).map(|n| 2.0 * schw[n] * x.powi(n as i32 + 1)).sum();
    let pm_nu = 2.0 * (c[0] * x + c[1] * x * x + (c[2] + c[3]) * x.powi(3));
    let t3 = (chi_tb - pm_tb).abs();
    let rel = |a: f64, b: f64| if b != 0.0 { (a / b - 1.0).abs() } else { 0.0 };
    let rho = 2.0 * rel(c[1], schw[1]).max(rel(c[2] + c[3], schw[2])).max(1.0 - h.powi(-3));
    (chi_tb + (pm_nu - pm_tb), rho * t3)
}

/// The relative error estimate of E_rad at O(G³) and J_rad at O(G²) from the leading-order
/// deflection angle χ₁: exp(3χ₁) − 1. In slow motion the exact quadrupole energy of the
/// Newtonian hyperbola exceeds its large-eccentricity limit (the O(G³) value) by ≈ 2.25χ for
/// small χ, 0.56 at χ = 0.2 and 7.3 at χ = 0.93 (Peters–Mathews power integrated along the
/// hyperbola, tests/reference/accuracy_mpmath.py); exp(3χ) − 1 stays above it up to χ ≈ 2.5,
/// where any estimate is far beyond every tolerance.
pub fn radiated(chi1: f64) -> f64 {
    (3.0 * chi1.abs()).exp_m1()
}

/// Estimates, verdicts and the recommended angle of a gravitational encounter.
pub(crate) struct GravityAccuracy {
    /// One per order row (1PM, 2PM, 3PM conservative, 3PM radiation reaction).
    pub orders: Vec<ErrorEstimate>,
    pub estimates: Estimates,
    pub best: Best,
}

/// Inputs of [`gravity`].
pub(crate) struct GravityInputs<'a> {
    pub k: &'a Kinematics,
    /// [χ₁, χ₂, χ₃^cons, χ₃^rad] of χ/2 = Σ χ_n/jⁿ.
    pub c: [f64; 4],
    /// Cumulative angles [1PM, 2PM, 3PM conservative, 3PM].
    pub angles: [f64; 4],
    pub chi_newtonian: f64,
    pub chi_test_body: Option<f64>,
    /// The strong-field estimate's angle when it scatters.
    pub chi_estimate: Option<f64>,
    /// Why the strong-field estimate has no angle (captured, unavailable).
    pub estimate_missing: Option<String>,
    /// E_rad/(M c²) at O(G³), CM frame.
    pub e_rad: f64,
}

pub(crate) fn gravity(inp: &GravityInputs, tol: f64) -> GravityAccuracy {
    let k = inp.k;
    let b = &k.speed;
    let schw = [1, 2, 3].map(|n| testbody::pm_coefficient(n, b).unwrap_or(f64::NAN));
    // Numerical floors: the test-body quadrature meets mpmath to 1e-12 (tests/encounter.rs), the
    // strong-field angle quadrature converges to 1e-12 (eob::REL_ANGLE), doubled.
    let tb = inp.chi_test_body.map(|t| {
        let (value, abs_err) = tb_reference(&inp.c, &schw, k.h, k.j, t);
        Reference { value, err: abs_err / value.abs() + 1e-12, method: VS_TB }
    });
    let chi3 = [inp.c[0], inp.c[1], inp.c[2] + inp.c[3]];
    let eob_own = inp.chi_estimate.and_then(|e| eob_spread(b.p_inf, &chi3, k.j, e)).map(|s| EOB_SPREAD_FACTOR * s + 2e-12);
    let eob = inp.chi_estimate.zip(eob_own).map(|(value, err)| Reference { value, err, method: VS_EOB });
    let refs = [tb, eob];
    let no_ref = "no reference: the test body is captured at this γ and j, and the strong-field estimate is captured, unavailable or without its own estimate";

    let orders: Vec<ErrorEstimate> = inp.angles.iter().map(|&x| estimate(x, &refs, no_ref, VS_TB, tol)).collect();
    let mut est = Estimates::new();
    est.insert("chi_newtonian", estimate(inp.chi_newtonian, &refs, no_ref, VS_TB, tol));
    // The test-body angle as a proxy: against its ν-corrected self (the known ν-dependence plus
    // the tail estimate) or, if smaller, through the strong-field estimate.
    let tb_est = match inp.chi_test_body {
        Some(t) => match against(t, &refs) {
            Some((v, m)) => ErrorEstimate::new(v, if m == VS_TB { TB_PROXY } else { m }, tol),
            None => ErrorEstimate::none("no estimate of the ν-corrections", TB_PROXY, tol),
        },
        None => ErrorEstimate::none("the test body is captured at this γ and j (j ≤ j_c): no test-body angle", TB_PROXY, tol),
    };
    let eob_est = match (inp.chi_estimate, eob_own) {
        (Some(x), Some(e)) => {
            let via = against(x, &[tb]).filter(|(v, _)| *v < e);
            match via {
                Some((v, m)) => ErrorEstimate::new(v, m, tol),
                None => ErrorEstimate::new(e, EOB_OWN, tol),
            }
        }
        (Some(_), None) => ErrorEstimate::none("the estimate from 2PM information alone predicts capture here, so the spread is not defined", EOB_OWN, tol),
        (None, _) => ErrorEstimate::none(inp.estimate_missing.clone().unwrap_or_else(|| "no strong-field estimate".into()), EOB_OWN, tol),
    };
    est.insert("chi_test_body", tb_est);
    est.insert("chi_estimate", eob_est);
    let chi1 = inp.angles[0];
    // E_rad: the smaller of the validity-parameter bound and the distance from the quadrupole
    // energy of the Newtonian hyperbola (exact in the deflection as v → 0) plus v.
    let e_q = crate::waveform::quadrupole_energy_hyperbola(k.m1, k.m2, b.v, k.b_over_gm);
    let via_q = (inp.e_rad - e_q).abs() / e_q + b.v;
    est.insert(
        "e_rad",
        if via_q.is_finite() && via_q < radiated(chi1) {
            ErrorEstimate::new(via_q, "vs the quadrupole energy of the Newtonian hyperbola (exact in the deflection as v → 0), plus v", tol)
        } else {
            ErrorEstimate::new(radiated(chi1), RADIATED, tol)
        },
    );
    est.insert("j_rad", ErrorEstimate::new(radiated(chi1), RADIATED, tol));

    // The recommended angle.
    let row = |i: usize| (["chi.1pm", "chi.2pm", "chi.3pm_conservative", "chi.3pm"][i], inp.angles[i], &orders[i]);
    let mut first: Vec<(&'static str, f64, &ErrorEstimate)> = vec![row(3), row(1), row(0)];
    if let Some(t) = inp.chi_test_body {
        first.push(("chi_test_body", t, &est["chi_test_body"]));
    }
    let mut second = first.clone();
    if let Some(x) = inp.chi_estimate {
        second.push(("chi_estimate", x, &est["chi_estimate"]));
    }
    let best = choose(&first, &second).map(|(key, v, e)| {
        let why = match key {
            "chi_estimate" => "no PM order is within the tolerance; the strong-field estimate (resummed PM information) has the smallest estimated error",
            "chi_test_body" if k.nu < 1e-3 => "the exact test-body angle has the smallest estimated error (near the test-body limit ν → 0)",
            "chi_test_body" => "the exact test-body angle (ν → 0) has the smallest estimated error; its estimate includes the ν-corrections",
            _ if e.verdict == Verdict::Ok => "the PM sum with the smallest estimated error among those within the tolerance",
            _ => "no value is within the tolerance; this PM sum has the smallest estimated error",
        };
        Best::new(key, v, e, why)
    });
    let best = best.unwrap_or_else(|| {
        let why = match (&inp.chi_test_body, &inp.chi_estimate) {
            (None, None) => format!("no angle can be recommended: the test body is captured and the strong-field estimate has none ({})", inp.estimate_missing.as_deref().unwrap_or("captured")),
            _ => "no angle has an error estimate here".to_string(),
        };
        Best::none("chi_estimate", why, tol)
    });
    GravityAccuracy { orders, estimates: est, best }
}

/// The recommended value: among `first` the smallest estimate with verdict ok; otherwise among
/// `second` the smallest estimate; `None` if nothing has an estimate. Ties keep the order given.
fn choose<'a>(
    first: &[(&'static str, f64, &'a ErrorEstimate)],
    second: &[(&'static str, f64, &'a ErrorEstimate)],
) -> Option<(&'static str, f64, &'a ErrorEstimate)> {
    let smallest = |list: &[(&'static str, f64, &'a ErrorEstimate)], ok_only: bool| {
        list.iter()
            .filter(|(_, v, e)| v.is_finite() && e.error_estimate.is_some() && (!ok_only || e.verdict == Verdict::Ok))
            .fold(None::<(&'static str, f64, &'a ErrorEstimate)>, |acc, &c| match acc {
                Some(a) if a.2.error_estimate <= c.2.error_estimate => Some(a),
                _ => Some(c),
            })
    };
    smallest(first, true).or_else(|| smallest(second, false))
}

/// Estimates, verdicts and the recommended angle of an electromagnetic encounter.
pub(crate) struct EmAccuracy {
    pub orders: Vec<ErrorEstimate>,
    pub estimates: Estimates,
    pub best: Best,
}

/// Inputs of [`electromagnetic`].
pub(crate) struct EmInputs<'a> {
    pub k: &'a Kinematics,
    pub kappa: f64,
    /// The terms of the four order rows (1PL, 2PL, 3PL conservative test charge, radiation reaction).
    pub terms: [f64; 4],
    pub cumulative: [f64; 4],
    pub chi_test_exact: Option<f64>,
    pub charges: (f64, f64),
}

/// The test-charge reference for a two-body electromagnetic encounter at the same γ and κ:
/// Darwin's exact angle χ_D corrected by the two-body and radiation-reaction parts known in the
/// PL series, χ_D* = χ_D + 2(e₂ − e₂^test)κ² + δχ_rr, and the absolute estimate of the rest, ρ T₂:
/// T₂ = |χ_D − 2(e₁κ + e₂^test κ²)| is Darwin's tail beyond 2PL, in which the two-body part of the
/// 3PL coefficient (h²e₃ = e₃^test + νX, Saketh et al. 2021, arXiv:2109.05994) is not known here,
/// and ρ = 2 max(1 − 1/h², ν) bounds its relative size. Both corrections vanish in the
/// test-charge limit.
fn darwin_reference(inp: &EmInputs, chi_d: f64) -> (f64, f64) {
    let b = &inp.k.speed;
    let h = inp.k.h;
    let e2_test = pl::e2(1.0);
    let known = 2.0 * (pl::e2(h) - e2_test) * inp.kappa * inp.kappa + inp.terms[3];
    let tail = (chi_d - 2.0 * (pl::e1(b) * inp.kappa + e2_test * inp.kappa * inp.kappa)).abs();
    let rho = 2.0 * (1.0 - 1.0 / (h * h)).max(inp.k.nu);
    (chi_d + known, rho * tail)
}

pub(crate) fn electromagnetic(inp: &EmInputs, tol: f64) -> EmAccuracy {
    let k = inp.k;
    let d_ref = inp.chi_test_exact.map(|d| {
        let (value, abs_err) = darwin_reference(inp, d);
        Reference { value, err: abs_err / value.abs(), method: VS_DARWIN }
    });
    let refs = [d_ref];
    let fall = "the test charge falls to the centre (κ ≤ −1): no exact angle to compare with, and the series has no meaning";
    let orders: Vec<ErrorEstimate> = inp.cumulative.iter().map(|&x| estimate(x, &refs, fall, VS_DARWIN, tol)).collect();
    let mut est = Estimates::new();
    est.insert(
        "chi_test_exact",
        match inp.chi_test_exact.and_then(|d| against(d, &refs)) {
            Some((e, _)) => ErrorEstimate::new(e, DARWIN_PROXY, tol),
            None => ErrorEstimate::none(fall, DARWIN_PROXY, tol),
        },
    );
    // Radiated energy of body 1 alone: straight-line (first-order) field, so corrections of the
    // size of the deflection; body 2's radiation E₂/E₁ = q₂²m₁²/(γ q₁²m₂²) (the two closed forms of
    // waveform::em) and the interference, at most 2√(E₂/E₁), are left out.
    let chi1 = inp.terms[0].abs();
    let (q1, q2) = inp.charges;
    let r = if q1 != 0.0 { q2 * q2 * k.m1 * k.m1 / (k.speed.gamma * q1 * q1 * k.m2 * k.m2) } else { f64::INFINITY };
    est.insert(
        "e_rad",
        ErrorEstimate::new(
            chi1 + r + 2.0 * r.sqrt(),
            "validity parameter: the 1PL deflection angle, plus body 2's radiation E₂/E₁ and the interference bound 2√(E₂/E₁)",
            tol,
        ),
    );
    // The non-relativistic dipole: relative corrections v² (relativistic) enlarged by the
    // cancellation in q₁/m₁ − q₂/m₂, plus the deflection.
    let (a1, a2) = (q1 / k.m1, q2 / k.m2);
    let canc = ((a1.abs() + a2.abs()) / (a1 - a2).abs()).powi(2);
    let v = k.speed.v;
    let dipole_method = "validity parameter: 4v² × ((|q₁/m₁| + |q₂/m₂|)/|q₁/m₁ − q₂/m₂|)² (relativistic and quadrupole corrections), plus the 1PL deflection angle";
    est.insert(
        "e_rad_dipole",
        if a1 == a2 {
            ErrorEstimate::none("equal charge-to-mass ratios: the dipole radiation vanishes and the quadrupole order decides", dipole_method, tol)
        } else {
            ErrorEstimate::new(4.0 * v * v * canc + chi1, dipole_method, tol)
        },
    );
    est.insert("j_rad", ErrorEstimate::new(chi1, "validity parameter: the 1PL deflection angle (the next order is smaller by about this factor)", tol));

    let row = |i: usize| (["chi.1pl", "chi.2pl", "chi.3pl_conservative", "chi.3pl"][i], inp.cumulative[i], &orders[i]);
    let mut first = vec![row(3), row(1), row(0)];
    if let Some(d) = inp.chi_test_exact {
        first.push(("chi_test_exact", d, &est["chi_test_exact"]));
    }
    let best = choose(&first, &first)
        .map(|(key, v, e)| {
            let why = match key {
                "chi_test_exact" => "Darwin's exact test-charge angle has the smallest estimated error (near the test-charge limit)",
                _ if e.verdict == Verdict::Ok => "the PL sum with the smallest estimated error among those within the tolerance",
                _ => "no value is within the tolerance; this PL sum has the smallest estimated error",
            };
            Best::new(key, v, e, why)
        })
        .unwrap_or_else(|| Best::none("chi_test_exact", format!("no angle can be recommended: {fall}"), tol));
    EmAccuracy { orders, estimates: est, best }
}
