//! Regime checks of a light-deflection result (thresholds are common practice unless stated). The
//! order in which they are pushed is the order of the `flags` array in the result.

use super::accuracy::LightAccuracy;
use super::request::Validated;
use super::results::SeriesTerm;
use super::Metric;
use crate::validity::{short, verdict, Check, Flag, Level, Verdict};

/// The regime checks of this file: stable key and the label shown with it.
const CAPTURE: Check = Check::new("capture", "capture b/b_c − 1");
const SERIES_CONVERGENCE: Check = Check::new("series_convergence", "series convergence b_c/b");
const GEOMETRIC_OPTICS: Check = Check::new("geometric_optics", "geometric optics w");
const PPN_GAMMA: Check = Check::new("ppn_gamma", "PPN γ");
const WEAK_FIELD: Check = Check::new("weak_field", "weak field M/b");
const STRONG_DEFLECTION: Check = Check::new("strong_deflection", "strong-deflection limit b/b_c − 1");
const BEAM_VS_IMPACT: Check = Check::new("beam_vs_impact", "beam width/b");
const WAVELENGTH_VS_BEAM: Check = Check::new("wavelength_vs_beam", "wavelength/beam width");

/// Relative error shown in a message: two significant digits.
fn rel(x: f64) -> String {
    short(x)
}

/// The regime flags for one evaluation (thresholds are common practice unless stated). Flags
/// that grade the accuracy of a value (`weak_field`, `series_convergence`, `strong_deflection`)
/// take their level from that value's verdict; the others describe conditions.
pub(crate) fn light(v: &Validated, d: f64, alpha: Option<f64>, series: &[SeriesTerm], acc: &LightAccuracy) -> Vec<Flag> {
    let mut out = Vec::new();
    let captured = d <= 0.0;
    let last = series.last();
    let series_note = match last.and_then(|t| t.estimate.error_estimate.map(|e| (t.order, e))) {
        Some((n, e)) => format!("; the series to order {n} is within {} of it", rel(e)),
        None => String::new(),
    };
    // weak_field: judged on the first-order value 4M/b against the exact α.
    let first = &acc.estimates["ppn.alpha_1pm_gr"];
    out.push(match (alpha, first.error_estimate) {
        (Some(_), Some(e)) => Flag::new(
            WEAK_FIELD,
            Level::from(first.verdict),
            Some(1.0 / v.b),
            match first.verdict {
                Verdict::Ok => format!("M/b = {}: the first-order value 4M/b (and the PPN first-order forms) is within {} of the exact α{series_note}.", short(1.0 / v.b), rel(e)),
                _ => format!(
                    "M/b = {}: the first-order value 4M/b (and the PPN first-order forms) is {} from the exact α; use the exact α{series_note}.",
                    short(1.0 / v.b),
                    rel(e)
                ),
            },
        ),
        _ => Flag::new(WEAK_FIELD, Level::Invalid, Some(1.0 / v.b), "b ≤ b_c: the ray is captured; the first-order and PPN values describe no deflection here."),
    });
    out.push(if captured {
        Flag::new(CAPTURE, Level::Invalid, Some(d), "b ≤ b_c: the ray is captured by the hole; there is no deflection angle (alpha = null).")
    } else if d < 0.01 {
        Flag::new(
            CAPTURE,
            Level::Caution,
            Some(d),
            format!("b/b_c − 1 = {}: within 1% of the critical impact parameter; the ray winds near the photon orbit and α ∝ −ln(b/b_c − 1) is very sensitive to b.", short(d)),
        )
    } else if d < 1.0 {
        Flag::new(CAPTURE, Level::Ok, Some(d), format!("b/b_c − 1 = {}: the ray escapes (b > b_c), passing near the photon orbit.", short(d)))
    } else {
        Flag::new(CAPTURE, Level::Ok, Some(d), format!("b/b_c − 1 = {}: well outside the capture cross-section (b > 2 b_c).", short(d)))
    });
    let ratio = 1.0 / (d + 1.0);
    let note = match v.metric {
        Metric::Schwarzschild => "",
        _ => " (for Kerr and Reissner–Nordström the radius b_c is expected, not proven)",
    };
    out.push(match (ratio >= 1.0, last) {
        (false, Some(t)) => Flag::new(
            SERIES_CONVERGENCE,
            Level::from(t.estimate.verdict),
            Some(ratio),
            match t.estimate.error_estimate {
                Some(e) => format!("b_c/b = {}: the series converges (b > b_c{note}); through order {} it is within {} of the exact α.", short(ratio), t.order, rel(e)),
                None => format!("b_c/b = {}: the series converges (b > b_c{note}), but its error could not be estimated.", short(ratio)),
            },
        ),
        _ => Flag::new(
            SERIES_CONVERGENCE,
            Level::Invalid,
            Some(ratio),
            format!("b ≤ b_c: the weak-field series diverges, its partial sums approximate nothing{note}."),
        ),
    });
    let lead = &acc.estimates["strong_deflection.alpha"];
    if let (Metric::Schwarzschild, false, Some(e)) = (v.metric, captured, lead.error_estimate) {
        out.push(Flag::new(
            STRONG_DEFLECTION,
            Level::from(lead.verdict),
            Some(d),
            format!("d = b/b_c − 1 = {}: Bozza's logarithmic form is within about {} of the exact α here (its error grows like d ln d).", short(d), rel(e)),
        ));
    }
    if let Some(lambda) = v.wavelength {
        let w = 8.0 * std::f64::consts::PI / lambda;
        // Geometric optics holds up to corrections of relative order 1/w (Takahashi & Nakamura
        // 2003, astro-ph/0305055): the validity parameter's scaling, judged by the one verdict rule.
        let level = Level::from(verdict(Some(1.0 / w), v.tolerance));
        let msg = if w >= 1.0 {
            format!("w = 4π·2M/λ = {}: wave-optics corrections (interference, diffraction) to the ray picture are of relative order 1/w = {}.", short(w), rel(1.0 / w))
        } else {
            format!("w = 4π·2M/λ = {} < 1: the wavelength exceeds the Schwarzschild radius; diffraction dominates and a ray deflection angle has no meaning (Takahashi & Nakamura 2003, astro-ph/0305055).", short(w))
        };
        out.push(Flag::new(GEOMETRIC_OPTICS, level, Some(w), msg));
    }
    if let Some(l) = v.beam {
        out.push(Flag::small_parameter(
            BEAM_VS_IMPACT,
            l / v.b,
            0.01,
            0.1,
            [
                "beam width ≪ b: the whole beam is deflected by nearly one angle.",
                "beam width is not small against b: its edges are deflected by different angles (α varies across the beam).",
                "beam width comparable to b: there is no single deflection angle for the beam.",
            ],
        ));
        if let Some(lambda) = v.wavelength {
            out.push(Flag::small_parameter(
                WAVELENGTH_VS_BEAM,
                lambda / l,
                0.01,
                0.1,
                [
                    "wavelength ≪ beam width: the beam stays a ray over the lens.",
                    "wavelength not small against the beam width: diffraction spreads the beam by ~λ/ℓ rad.",
                    "beam narrower than a few wavelengths: it diffracts and is no ray.",
                ],
            ));
        }
    }
    if v.gamma != 1.0 {
        out.push(Flag::new(
            PPN_GAMMA,
            Level::Caution,
            Some(v.gamma),
            "γ ≠ 1 rescales only the first series term and the ppn block; alpha stays the exact GR value.",
        ));
    }
    out
}
