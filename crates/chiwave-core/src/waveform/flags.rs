//! Regime checks of a waveform (thresholds are common practice unless a flag names a source). The
//! order in which they are pushed is the order of the `flags` array in the result.

use super::em::{EmEnergies, EmSystem};
use super::frames::Binary;
use crate::encounter::pm;
use crate::validity::{Check, Flag, Level};

/// The regime checks of this file: stable key and the label shown with it.
const F_CHAR_RULE: Check = Check::new("f_char_rule", "f_char rule of thumb");
const FLUX_RESOLUTION: Check = Check::new("flux_resolution", "flux-integral resolution");
const B_WEAK_FIELD: Check = Check::new("b_weak_field", "impact parameter b/(GM/c²)");
const UNITS: Check = Check::new("units", "units");
const WEAK_DEFLECTION: Check = Check::new("weak_deflection", "LO deflection angle");
const EM_DEFLECTION: Check = Check::new("em_deflection", "deflection and recoil");
const EM_BEAMING: Check = Check::new("em_beaming", "beaming γ");
const GRAVITY_NEGLECTED: Check = Check::new("gravity_neglected", "gravity against Coulomb G m1 m2/|q1 q2|");

/// Impact parameter below which the gravitational LO waveform is flagged invalid: 3√3 GM/c², the
/// photon-capture impact parameter of a Schwarzschild mass (Misner, Thorne & Wheeler 1973, §25.6;
/// common textbook result). Every body with b below it is captured or strongly deflected.
const B_INVALID: f64 = 5.196_152_422_706_632;
/// Below this b/(GM/c²) the flag is a caution (common practice, no source): the O(G²) waveform
/// misses relative corrections of order GM/(c² b) or larger.
const B_CAUTION: f64 = 50.0;

/// Flags of the gravitational LO waveform: b against the strong field, the size of the LO
/// deflection, the f_char rule of thumb, and the sky rule of the flux integral above γ = 3.
pub(crate) fn gravity(sys: &Binary, b_over_gm: f64, energy_flux: bool) -> Vec<Flag> {
    let gamma = sys.gamma;
    let mut flags = vec![b_weak_field(b_over_gm)];
    flags.push(Flag::small_parameter(
        WEAK_DEFLECTION,
        pm::chi_1pm_at_b(gamma, sys.cm_energy_ratio(), b_over_gm),
        0.05,
        0.3,
        [
            "LO deflection angle small: the leading-order waveform is a good approximation.",
            "LO deflection angle not small: higher PM orders change the waveform at the tens-of-percent level.",
            "Deflection angle large (or capture): the leading-order waveform does not apply.",
        ],
    ));
    let v = sys.v();
    flags.push(Flag::new(
        F_CHAR_RULE,
        if v < 0.3 { Level::Ok } else { Level::Caution },
        Some(v),
        "f_char = v/(2πb) is a rule of thumb for v ≪ c (not fitted); forward-beamed radiation is Doppler-raised by about γ/(1 − v cos θ).",
    ));
    if energy_flux && gamma > 3.0 {
        flags.push(Flag::new(
            FLUX_RESOLUTION,
            Level::Caution,
            Some(gamma),
            "Above γ = 3 the sky grid of the flux integral was not tuned to 1e-10 (tests reach 1e-10 for γ ≤ 2 and about 1e-8 at γ = 3); compare e_rad_flux with e_rad_closed.",
        ));
    }
    flags
}

/// The validity flag on b for the gravitational LO waveform (thresholds at [`B_INVALID`], [`B_CAUTION`]).
fn b_weak_field(b_over_m: f64) -> Flag {
    let (level, msg) = if b_over_m < B_INVALID {
        (
            Level::Invalid,
            "b is below 3√3 GM/c² (the photon-capture impact parameter): the leading-order (weak-deflection) waveform is not a prediction here; the numbers only show the homogeneous O(G²) formula (D·h in units of GM/c², scaling as 1/b)",
        )
    } else if b_over_m < B_CAUTION {
        (
            Level::Caution,
            "b is only a few tens of GM/c² or less: the leading-order (weak-deflection) waveform misses corrections of relative size ~GM/(c² b) and larger; treat it as indicative",
        )
    } else {
        (Level::Ok, "b ≫ GM/c²: the weak-deflection expansion of the waveform applies")
    };
    Flag::new(B_WEAK_FIELD, level, Some(b_over_m), msg)
}

/// Flags of the straight-line (first-order) electromagnetic field.
///
/// `em_deflection`: the larger of body 1's deflection angle Δp/(γ m1 v) and body 2's recoil
/// speed relative to v, Δp/(m2 v); Ok below 0.01, Caution below 0.1 (common practice, no
/// source). `em_beaming`: γ, Caution above 100 (the radiation is confined to ~1/γ).
pub(crate) fn em_system(sys: &EmSystem) -> Vec<Flag> {
    let v = sys.v();
    let dp = sys.impulse().abs();
    let x = (dp / (sys.gamma * sys.m1 * v)).max(dp / (sys.m2 * v));
    vec![
        Flag::small_parameter(
            EM_DEFLECTION,
            x,
            0.01,
            0.1,
            [
                "deflection and recoil are small: the straight-line O(q1 q2) field applies",
                "deflection or recoil of a few per cent: expect corrections of that relative size",
                "deflection or recoil is not small: the straight-line approximation fails",
            ],
        ),
        Flag::small_parameter(
            EM_BEAMING,
            sys.gamma,
            100.0,
            f64::INFINITY,
            [
                "moderate beaming",
                "strong forward beaming: features on angular scale 1/γ and time scale b/(γ² v)",
                "strong forward beaming",
            ],
        ),
    ]
}

/// Flags of the electromagnetic waveform result: the straight-line field ([`em_system`]), the
/// neglected gravity, the unit system, and the flux integral's error estimate.
pub(crate) fn electromagnetic(sys: &EmSystem, energies: Option<&EmEnergies>) -> Vec<Flag> {
    let mut flags = em_system(sys);
    // Gravity between the bodies is left out of this force law: compare the couplings.
    let g_over_q = sys.m1 * sys.m2 / (sys.q1 * sys.q2).abs();
    flags.push(Flag::small_parameter(
        GRAVITY_NEGLECTED,
        g_over_q,
        0.01,
        0.3,
        [
            "gravity is negligible next to the Coulomb coupling (G m1 m2 ≪ |q1 q2|)",
            "G m1 m2/|q1 q2| is not negligible: the gravitational deflection and radiation, left out here, correct the result at that relative size",
            "gravity is comparable to or stronger than the Coulomb coupling: this electromagnetic-only result misses the dominant interaction",
        ],
    ));
    flags.push(Flag::new(
        UNITS,
        Level::Ok,
        None,
        "Gaussian units with c = 1 (Coulomb force q1 q2/r²); SI charges were converted with q1 q2 → q1 q2/(4π ε0).",
    ));
    if let Some(e) = energies {
        if e.rel_error_estimate > 1e-8 {
            flags.push(Flag::new(
                FLUX_RESOLUTION,
                Level::Caution,
                Some(e.rel_error_estimate),
                "The estimated relative error of e_rad_flux exceeds 1e-8; compare with e_rad_closed.",
            ));
        }
    }
    flags
}
