//! Regime checks of a light-deflection result (thresholds are common practice unless stated). The
//! order in which they are pushed is the order of the `flags` array in the result.

use super::request::Validated;
use super::Metric;
use crate::validity::{geometric_optics_level, Check, Flag, Level};

/// The regime checks of this file: stable key and the label shown with it.
const CAPTURE: Check = Check::new("capture", "capture b/b_c − 1");
const SERIES_CONVERGENCE: Check = Check::new("series_convergence", "series convergence b_c/b");
const GEOMETRIC_OPTICS: Check = Check::new("geometric_optics", "geometric optics w");
const PPN_GAMMA: Check = Check::new("ppn_gamma", "PPN γ");
const WEAK_FIELD: Check = Check::new("weak_field", "weak field M/b");
const STRONG_DEFLECTION: Check = Check::new("strong_deflection", "strong-deflection limit b/b_c − 1");
const BEAM_VS_IMPACT: Check = Check::new("beam_vs_impact", "beam width/b");
const WAVELENGTH_VS_BEAM: Check = Check::new("wavelength_vs_beam", "wavelength/beam width");

/// The regime flags for one evaluation (thresholds are common practice unless stated).
pub(crate) fn light(v: &Validated, d: f64) -> Vec<Flag> {
    let mut out = Vec::new();
    let captured = d <= 0.0;
    out.push(Flag::small_parameter(
        WEAK_FIELD,
        1.0 / v.b,
        1e-3,
        0.05,
        [
            "M/b ≪ 1: the first-order value 4M/b is good to about 3(M/b) relative (the 15π/4 term).",
            "M/b is not small: 4M/b (and the PPN 1PM form) misses the higher orders at the level of 3(M/b); use the exact alpha or more series orders.",
            "strong field: the weak-field and PPN values are no prediction here; only the exact alpha holds.",
        ],
    ));
    out.push(if captured {
        Flag::new(CAPTURE, Level::Invalid, Some(d), "b ≤ b_c: the ray is captured by the hole; there is no deflection angle (alpha = null).")
    } else if d < 0.01 {
        Flag::new(
            CAPTURE,
            Level::Caution,
            Some(d),
            "within 1% of the critical impact parameter: the ray winds near the photon orbit and alpha ∝ −ln(b/b_c − 1) is very sensitive to b.",
        )
    } else {
        Flag::new(CAPTURE, Level::Ok, Some(d), "well outside the capture cross-section (b/b_c − 1 ≥ 0.01).")
    });
    let ratio = 1.0 / (d + 1.0);
    let note = match v.metric {
        Metric::Schwarzschild => "",
        _ => " (for Kerr and Reissner–Nordström the radius b_c is expected, not proven)",
    };
    out.push(if ratio >= 1.0 {
        Flag::new(
            SERIES_CONVERGENCE,
            Level::Invalid,
            Some(ratio),
            format!("b ≤ b_c: the weak-field series diverges, its partial sums approximate nothing{note}."),
        )
    } else if ratio > 0.5 {
        Flag::new(
            SERIES_CONVERGENCE,
            Level::Caution,
            Some(ratio),
            format!("the series converges only for b > b_c; here its terms shrink only like (b_c/b)^n, so low orders are far off{note}."),
        )
    } else {
        Flag::new(SERIES_CONVERGENCE, Level::Ok, Some(ratio), format!("b > 2 b_c: the series converges, terms shrink at least like 2^-n{note}."))
    });
    if matches!(v.metric, Metric::Schwarzschild) && !captured {
        out.push(Flag::small_parameter(
            STRONG_DEFLECTION,
            d,
            1e-3,
            0.05,
            [
                "d = b/b_c − 1 ≪ 1: Bozza's logarithmic form is accurate (error ∝ d ln d).",
                "d = b/b_c − 1 is not small: the strong-deflection log form is indicative only.",
                "far from the photon sphere: the strong-deflection log form does not apply.",
            ],
        ));
    }
    if let Some(lambda) = v.wavelength {
        let w = 8.0 * std::f64::consts::PI / lambda;
        let level = geometric_optics_level(w);
        let msg = match level {
            Level::Ok => "w = 4π·2M/λ ≫ 1: the wavelength is far below the Schwarzschild radius; geometric optics (rays) holds.",
            Level::Caution => "w = 4π·2M/λ is only moderately large: wave-optics corrections (interference, diffraction) of order 1/w matter.",
            Level::Invalid => "w = 4π·2M/λ ≲ 1: the wavelength exceeds the Schwarzschild radius; diffraction dominates and a ray deflection angle has no meaning (Takahashi & Nakamura 2003, astro-ph/0305055).",
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
