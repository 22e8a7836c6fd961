//! Regime checks of a lens result: the thin-lens point-mass formulas (ray optics) and the wave
//! optics (thresholds are common practice unless a flag names a source).

use super::wave;
use crate::units::codata2018::C;
use crate::validity::{geometric_optics_level, Check, Flag, Level};

/// The regime checks of this file: stable key and the label shown with it.
const DISTANCES: Check = Check::new("distances", "distances");
const LENSING_STRENGTH: Check = Check::new("lensing_strength", "source offset β/θ_E");
const GEOMETRIC_OPTICS: Check = Check::new("geometric_optics", "geometric optics w");
const AMPLIFICATION_METHOD: Check = Check::new("amplification_method", "amplification method");
const THIN_LENS: Check = Check::new("thin_lens", "thin lens 4GM/(c²R_E)");
const EINSTEIN_ANGLE: Check = Check::new("einstein_angle", "Einstein angle θ_E");
const INTERFERENCE_PHASE: Check = Check::new("interference_phase", "interference phase wΔT");

/// Flags for the ray-optics point lens: thin lens / weak deflection, distances, offset regime.
pub(crate) fn point_lens(theta: f64, gm: f64, r_e: f64, z_l: f64, u: f64) -> Vec<Flag> {
    let mut flags = Vec::new();
    // Deflection at the Einstein ring, 4GM/(c² R_E): the thin-lens formulas are its first order.
    let alpha_e = 4.0 * gm / (C * C) / r_e;
    flags.push(Flag::small_parameter(
        THIN_LENS,
        alpha_e,
        1e-4,
        1e-2,
        [
            "Weak deflection at the Einstein ring (4GM/(c²R_E) small): thin-lens point-mass formulas apply, provided the lens is compact (its size ≪ R_E) and isolated.",
            "The deflection at the Einstein ring is not tiny: second-order (post-thin-lens) corrections reach this relative size.",
            "Strong deflection at the Einstein ring: the thin-lens weak-field formulas do not hold; use the exact deflection.",
        ],
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
    let (level, msg) = if u < 0.01 {
        (Level::Caution, "Source within 0.01 θ_E of the lens: point-source magnification ≈ 1/u; a finite source size caps it.")
    } else if u < 1.0 {
        (Level::Ok, "Strong lensing regime: the source lies inside the Einstein ring (μ_tot > 1.342); two bright images.")
    } else if u < 10.0 {
        (Level::Ok, "Source outside the Einstein ring: the saddle image is faint (μ_tot < 1.342).")
    } else {
        (Level::Ok, "Weak lensing regime (u ≥ 10): μ_tot − 1 ≈ 2/u⁴, the saddle image is negligible.")
    };
    flags.push(Flag::new(LENSING_STRENGTH, level, Some(u), msg));
    flags
}

/// Flags for the wave-optics part: geometric-optics validity and the F method.
pub(crate) fn wave_optics(w: f64, delta_t: f64, method: wave::Method) -> Vec<Flag> {
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
    let level = geometric_optics_level(w);
    let msg = match level {
        Level::Ok => "w ≫ 1: geometric optics holds to ~1/w; the ray magnifications describe the signal.",
        Level::Caution => "w of order 1–100: diffraction changes the amplification by ~1/w; use `amplification`, not the ray magnifications.",
        Level::Invalid => "w < 1: the wavelength exceeds the lens' Schwarzschild radius; diffraction dominates and |F| → 1. The ray magnifications do not describe the signal.",
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
