//! Regime checks of a lens result: the thin-lens point-mass formulas (ray optics) and the wave
//! optics (thresholds are common practice unless a flag names a source).

use super::wave;
use crate::validity::{short, verdict, Check, ErrorEstimate, Flag, Level, Verdict};

/// The regime checks of this file: stable key and the label shown with it.
const DISTANCES: Check = Check::new("distances", "distances");
const LENSING_STRENGTH: Check = Check::new("lensing_strength", "source offset β/θ_E");
const GEOMETRIC_OPTICS: Check = Check::new("geometric_optics", "geometric optics w");
const AMPLIFICATION_METHOD: Check = Check::new("amplification_method", "amplification method");
const THIN_LENS: Check = Check::new("thin_lens", "thin lens 4GM/(c²R_E)");
const EINSTEIN_ANGLE: Check = Check::new("einstein_angle", "Einstein angle θ_E");
const INTERFERENCE_PHASE: Check = Check::new("interference_phase", "interference phase wΔT");

/// Flags for the ray-optics point lens: thin lens / weak deflection, distances, offset regime.
/// `alpha_e` is the deflection at the Einstein ring 4GM/(c²R_E), `u` the offset, `mu` the total
/// magnification; `thin_lens` takes its level from the verdict on `alpha_e` (the same rule as
/// every error estimate).
pub(crate) fn point_lens(theta: f64, alpha_e: f64, z_l: f64, u: f64, mu: f64, tol: f64) -> Vec<Flag> {
    let mut flags = Vec::new();
    let v = verdict(Some(alpha_e), tol);
    flags.push(Flag::new(
        THIN_LENS,
        Level::from(v),
        Some(alpha_e),
        match v {
            Verdict::Ok => format!("Deflection at the Einstein ring 4GM/(c²R_E) = {}: the thin-lens point-mass formulas hold to about this relative size, provided the lens is compact (its size ≪ R_E) and isolated.", short(alpha_e)),
            _ => format!("Deflection at the Einstein ring 4GM/(c²R_E) = {} is not small: post-thin-lens corrections reach this relative size; use the exact deflection.", short(alpha_e)),
        },
    ));
    flags.push(Flag::small_parameter(
        EINSTEIN_ANGLE,
        theta,
        1e-3,
        1e-1,
        [
            "Small-angle approximation holds (θ_E ≪ 1 rad).",
            "θ_E is not small: small-angle lens equation is only indicative.",
            "θ_E is not small: the small-angle lens equation does not hold.",
        ],
    ));
    if z_l > 0.0 {
        flags.push(Flag::new(
            DISTANCES,
            Level::Caution,
            Some(z_l),
            "Lens at a cosmological redshift: θ_E and R_E use D_LS = D_S − D_L (flat space); for a cosmological lens give angular-diameter distances and note that D_LS ≠ D_S − D_L. The redshifted mass (1 + z_L)M is applied to the time delay and w.",
        ));
    } else {
        flags.push(Flag::new(
            DISTANCES,
            Level::Ok,
            Some(0.0),
            "Flat-space distances, D_LS = D_S − D_L (Galactic lens).",
        ));
    }
    // The images lie at x± = (u ± √(u² + 4))/2 θ_E, separated by √(u² + 4) θ_E ≥ 2θ_E; below
    // about 50 mas (the diffraction limit of a 2–3 m telescope in the optical, common practice)
    // they are not resolved and only the total magnification is observed (microlensing).
    let sep_mas = (u * u + 4.0).sqrt() * theta * 648_000_000.0 / std::f64::consts::PI;
    let seen = if sep_mas < 50.0 {
        format!("the images, {sep_mas:.3} mas apart, are not resolved by ordinary telescopes: the observable is the total magnification μ = {mu:.4}")
    } else {
        format!("the images are {sep_mas:.4e} mas apart; total magnification μ = {mu:.4}")
    };
    let (level, msg) = if u < 0.01 {
        (Level::Caution, format!("Source within 0.01 θ_E of the lens: the point-source magnification ≈ 1/u; a finite source size caps it; {seen}."))
    } else if u < 1.0 {
        (Level::Ok, format!("Source inside the Einstein ring (u < 1, μ > 1.342): two images on either side of the lens; {seen}."))
    } else if u < 10.0 {
        (Level::Ok, format!("Source outside the Einstein ring (u ≥ 1, μ ≤ 1.342): the saddle image is the fainter one; {seen}."))
    } else {
        (Level::Ok, format!("Source far outside the Einstein ring (u ≥ 10): μ − 1 ≈ 2/u⁴ = {}, the saddle image is negligible.", short(2.0 / u.powi(4))))
    };
    flags.push(Flag::new(LENSING_STRENGTH, level, Some(u), msg));
    flags
}

/// Flags for the wave-optics part: geometric-optics validity (its level from the verdict on the
/// geometric-optics F, `go`) and the F method.
pub(crate) fn wave_optics(w: f64, delta_t: f64, method: wave::Method, go: &ErrorEstimate) -> Vec<Flag> {
    let mut flags = Vec::new();
    // The interference phase wΔT (value, radians) is carried in f64: its absolute error is
    // ~1e-16·wΔT rad, 1e-6 rad at 1e10 and 1e-2 rad at 1e14.
    flags.push(Flag::small_parameter(
        INTERFERENCE_PHASE,
        w * delta_t,
        1e10,
        1e14,
        [
            "The interference phase wΔT is resolved (double precision).",
            "The interference phase wΔT (this value, in radians) is large: its rounding error reaches 1e-6 to 1e-2 rad; fine oscillations in F are only indicative.",
            "The interference phase wΔT exceeds what double precision resolves: the oscillating part of F (the phase of the faint image) is not meaningful, only its envelope.",
        ],
    ));
    let level = Level::from(go.verdict);
    let size = go.error_estimate.map(short).unwrap_or_else(|| "unknown".into());
    let msg = if w < 1.0 {
        format!("w = {} < 1: the wavelength exceeds the lens' Schwarzschild radius; diffraction dominates and |F| → 1; the geometric-optics F is {size} off (relative). Use `amplification`.", short(w))
    } else {
        match level {
            Level::Ok => format!("w = {}: geometric optics holds here; the geometric-optics F is within {size} of the exact F ({})", short(w), go.error_method),
            _ => format!("w = {}: diffraction matters; the geometric-optics F is {size} off ({}): use `amplification`, not the ray magnifications.", short(w), go.error_method),
        }
    };
    flags.push(Flag::new(GEOMETRIC_OPTICS, level, Some(w), msg));
    let level = if method == wave::Method::GeometricOptics { Level::Caution } else { Level::Ok };
    let value = match method {
        wave::Method::Continuation { steps } => Some(steps as f64),
        _ => None,
    };
    flags.push(Flag::new(AMPLIFICATION_METHOD, level, value, method.describe()));
    flags
}
