//! Error estimates of a light-deflection result: the exact α (its numerical accuracy), every
//! weak-field partial sum and the PPN first-order forms (against the exact α), and the
//! strong-deflection limit (its own next term); the recommended value.
//!
//! Each estimate is relative, |value − truth|/|truth|, and conservative: where a value is
//! compared with the exact α, the estimate is that difference plus the exact α's own accuracy
//! bound. The reasons are written in `docs/physics/accuracy.md`.

use super::{series, strong, Deflection, Metric};
use crate::error::InputError;
use crate::validity::{short, Best, ErrorEstimate, Estimates};

/// Method phrases (shown as `error_method`).
pub(crate) const VS_EXACT: &str = "vs the exact α";
const CLOSED_FORM: &str = "closed form (Darwin 1959): f64 rounding bound, checked against mpmath";
const QUADRATURE: &str = "quadrature self-check: 24- vs 32-point Gauss–Legendre rules";
const PPN_GAMMA_NOTE: &str = "vs the exact α (GR), plus |1 − γ| × the second-order term (its γ-dependence is not modelled)";
const STRONG_NEXT: &str = "bound on the omitted terms, d²(1 + 0.15|ln d|) with d = b/b_c − 1";
const STRONG_LEAD: &str = "vs the next-order strong-deflection value, plus that value's own estimate";

/// Largest relative correction |next − leading|/next at which the strong-deflection values are
/// reported: beyond it the expansion in d = b/b_c − 1 gives no meaningful number (common
/// practice for an asymptotic series: stop where the correction is comparable to the value).
pub const STRONG_DEFLECTION_MAX_CORRECTION: f64 = 0.5;

/// The exact α and the relative accuracy of its evaluation.
///
/// Schwarzschild: Darwin's closed form carries rounding only: 1e-13 relative (the bound it meets
/// against mpmath at 40 digits over b/M = 5.2 … 10⁴, tests/deflection.rs) plus the
/// amplification of the rounding of b, 3e-16 (1 + 1/(d α)) with d = b/b_c − 1 (α ≈ −ln d near
/// the photon sphere, so δα ≈ δb/(b d) there). Kerr and Reissner–Nordström: the difference of the
/// 24- and 32-point rules, which bounds the 32-point error from above, with a floor of 1e-14 for
/// the rounding of the integrand sum.
pub(crate) fn exact_with_accuracy(metric: Metric, b: f64) -> Result<(Deflection, f64, &'static str), InputError> {
    match metric {
        Metric::Schwarzschild => {
            let d = super::schwarzschild::deflection(b)?;
            let dd = b / metric.critical_b() - 1.0;
            // Rounding of b (a few ulp): δα/α = |d ln α/d ln b| δb/b, which is ≈ 1/(d α) near the
            // photon sphere (α ≈ −ln d) and ≈ 1 in the weak field (α ≈ 4M/b); taken as
            // 3e-16 (1 + 1/(d α)).
            let amplification = match d.alpha() {
                Some(a) if dd > 0.0 => 3e-16 * (1.0 + 1.0 / (dd * a.abs())),
                _ => 0.0,
            };
            Ok((d, 1e-13 + amplification, CLOSED_FORM))
        }
        Metric::Kerr { spin } => {
            let (d, acc) = super::kerr::deflection_with_accuracy(b, spin)?;
            Ok((d, acc.max(1e-14), QUADRATURE))
        }
        Metric::ReissnerNordstrom { charge } => {
            let (d, acc) = super::reissner_nordstrom::deflection_with_accuracy(b, charge)?;
            Ok((d, acc.max(1e-14), QUADRATURE))
        }
    }
}

/// Everything the result and its flags need about errors.
pub(crate) struct LightAccuracy {
    /// One estimate per partial sum, orders 1 … n.
    pub series: Vec<ErrorEstimate>,
    pub estimates: Estimates,
    pub best: Best,
}

/// The error estimates of one light result.
///
/// `alpha` is the exact angle (None when captured) with its relative accuracy `acc`; `sums` the
/// partial sums as reported (first term × (1 + γ)/2); `coeffs` the series coefficients; `d` is
/// b/b_c − 1; `elongation` whether the finite-elongation PPN form is in the result.
#[allow(clippy::too_many_arguments)]
pub(crate) fn light(
    alpha: Option<f64>,
    acc: f64,
    acc_method: &'static str,
    coeffs: &[f64],
    sums: &[f64],
    b: f64,
    ppn_gamma: f64,
    metric: Metric,
    d: f64,
    elongation: bool,
    tol: f64,
) -> LightAccuracy {
    let captured_reason = "captured (b ≤ b_c): there is no exact α to compare with, and the weak-field series diverges here";
    let alpha_est = match alpha {
        Some(_) => ErrorEstimate::new(acc, acc_method, tol),
        None => ErrorEstimate::none("captured (b ≤ b_c): there is no deflection angle", acc_method, tol),
    };
    // GR partial sums (first term unscaled), for the truncation error when γ ≠ 1.
    let gr_sums = series::partial_sums(coeffs, b, 1.0);
    let second = coeffs.get(1).map(|c| (c / (b * b)).abs()).unwrap_or(0.0);
    let gamma_shift = (1.0 - ppn_gamma).abs();
    let series_est: Vec<ErrorEstimate> = sums
        .iter()
        .zip(&gr_sums)
        .map(|(s, g)| match alpha {
            Some(a) if gamma_shift == 0.0 => ErrorEstimate::new(((s - a) / a).abs() + acc, VS_EXACT, tol),
            Some(a) => ErrorEstimate::new(((g - a) / a).abs() + acc + gamma_shift * second / a.abs(), PPN_GAMMA_NOTE, tol),
            None => ErrorEstimate::none(captured_reason, VS_EXACT, tol),
        })
        .collect();

    let mut estimates = Estimates::new();
    estimates.insert("alpha", alpha_est.clone());
    // The first-order forms miss every higher order: their error is the exact α's distance
    // from 4M/b (the GR first term); γ only rescales that first term.
    let first_order = match alpha {
        Some(a) => ErrorEstimate::new(((4.0 / b - a) / a).abs() + acc, VS_EXACT, tol),
        None => ErrorEstimate::none(captured_reason, VS_EXACT, tol),
    };
    let first_order_ppn = match alpha {
        Some(_) if gamma_shift == 0.0 => first_order.clone(),
        Some(a) => ErrorEstimate::new(
            ((4.0 / b - a) / a).abs() + acc + gamma_shift * second / a.abs(),
            "vs the exact α (GR) for the omitted higher orders, plus |1 − γ| × the second-order term",
            tol,
        ),
        None => ErrorEstimate::none(captured_reason, VS_EXACT, tol),
    };
    estimates.insert("ppn.alpha_1pm_gr", first_order);
    if elongation {
        estimates.insert("ppn.alpha_1pm", first_order_ppn.clone());
    }
    if elongation {
        estimates.insert("ppn.alpha_elongation", first_order_ppn);
    } else {
        estimates.insert("ppn.alpha_1pm", first_order_ppn);
    }
    let (lead, next) = strong_estimates(metric, alpha, d, acc, tol);
    estimates.insert("strong_deflection.alpha", lead);
    estimates.insert("strong_deflection.alpha_next_order", next);

    let best = match alpha {
        Some(a) => Best::new("alpha", a, &alpha_est, "the exact deflection for this metric (no expansion); its estimate is the numerical accuracy"),
        None => Best::none("alpha", "captured: b ≤ b_c, the ray falls into the hole and has no deflection angle", tol),
    };
    LightAccuracy { series: series_est, estimates, best }
}

/// Estimates of the strong-deflection values (leading, next order), or their absence with the
/// reason (the same rule decides whether they are reported, [`strong_reported`]).
/// `acc` is the exact α's accuracy, whose rounding-of-b part applies to these values too.
fn strong_estimates(metric: Metric, alpha: Option<f64>, d: f64, acc: f64, tol: f64) -> (ErrorEstimate, ErrorEstimate) {
    let none = |why: String| (ErrorEstimate::none(why.clone(), STRONG_LEAD, tol), ErrorEstimate::none(why, STRONG_NEXT, tol));
    if !matches!(metric, Metric::Schwarzschild) {
        return none("the strong-deflection coefficients are those of Schwarzschild; not reported for this metric".into());
    }
    if alpha.is_none() {
        return none("captured (b ≤ b_c): no angle".into());
    }
    match strong_reported(d) {
        Ok((lead, next)) => {
            let e_next = strong_next_bound(d) / next + acc;
            let e_lead = (next - lead).abs() / next + e_next;
            (ErrorEstimate::new(e_lead, STRONG_LEAD, tol), ErrorEstimate::new(e_next, STRONG_NEXT, tol))
        }
        Err(why) => none(why),
    }
}

/// Absolute bound on the remainder of the next-order strong-deflection form,
/// d²(1 + 0.15|ln d|) radians: the expansion in d = b/b_c − 1 goes on with terms d² ln²d, d² ln d,
/// d² (Bozza 2002, gr-qc/0208075, for the logarithmic structure; Iyer & Petters 2007,
/// gr-qc/0611086, for the series beyond it); the measured remainder is 2.0 d² at d = 1e-6 falling
/// to 0.39 d² at d = 0.4 (against mpmath, tests/reference/accuracy_mpmath.py), and this bound
/// exceeds it by a factor 1.5 to 3 there (tests/deflection_accuracy.rs). Our fit.
pub(crate) fn strong_next_bound(d: f64) -> f64 {
    d * d * (1.0 + 0.15 * d.ln().abs())
}

/// The strong-deflection values (leading, next order) where they mean something: d > 0, both
/// positive, and the next-order correction at most [`STRONG_DEFLECTION_MAX_CORRECTION`] of the
/// value. Otherwise the reason they are not reported.
///
/// # Examples
/// ```
/// use chiwave_core::deflection::strong_reported;
/// assert!(strong_reported(1e-3).is_ok());
/// assert!(strong_reported(10.0 / 5.196_152_422_706_632 - 1.0).is_err()); // b = 10 M
/// ```
pub fn strong_reported(d: f64) -> Result<(f64, f64), String> {
    let Some((lead, next)) = strong::limit(d) else {
        return Err(format!("b/b_c − 1 = {} ≤ 0: captured", short(d)));
    };
    if !(lead > 0.0 && next > 0.0) {
        return Err(format!(
            "b/b_c − 1 = {} is not small: the strong-deflection expansion in ln(b/b_c − 1) gives no meaningful value here (its leading term would be {} rad)",
            short(d),
            short(lead)
        ));
    }
    let corr = (next - lead).abs() / next;
    if corr > STRONG_DEFLECTION_MAX_CORRECTION {
        return Err(format!(
            "b/b_c − 1 = {} is not small: the next-order correction is {:.0} % of the value, so the strong-deflection expansion is not meaningful here",
            short(d),
            100.0 * corr
        ));
    }
    Ok((lead, next))
}
