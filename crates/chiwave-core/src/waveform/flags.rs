//! Regime checks of a waveform (thresholds are common practice unless a flag names a source). The
//! order in which they are pushed is the order of the `flags` array in the result.

use super::em::{EmEnergies, EmSystem};
use super::frames::Binary;
use crate::validity::{short, verdict, Check, ErrorEstimate, Flag, Level};

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
/// deflection (its level the verdict on the LO strain's error estimate `peak`, which is χ₁), the
/// f_char rule of thumb, and the sky rule of the flux integral above γ = 3. `b_weak_field` is
/// never better than `weak_deflection`: a weak field at b does not make the LO waveform hold when
/// the speed is low enough for a large deflection.
pub(crate) fn gravity(sys: &Binary, b_over_gm: f64, energy_flux: bool, chi1: f64, peak: &ErrorEstimate) -> Vec<Flag> {
    let gamma = sys.gamma;
    let deflection_level = Level::from(peak.verdict);
    let mut flags = vec![b_weak_field(b_over_gm, chi1, deflection_level)];
    let size = peak.error_estimate.map(short).unwrap_or_else(|| "unknown".into());
    flags.push(Flag::new(
        WEAK_DEFLECTION,
        deflection_level,
        Some(chi1),
        match deflection_level {
            Level::Ok => format!("LO deflection angle χ₁ = {} rad: the leading-order waveform (first order in the deflection) misses relative corrections of about {size}.", short(chi1)),
            _ if chi1 < 1.0 => format!("LO deflection angle χ₁ = {} rad is not small: the leading-order waveform misses relative corrections of about {size} (at v ≪ c the quadrupole waveform of the Newtonian hyperbola, figure slow_motion, holds to about v).", short(chi1)),
            _ => format!("Deflection angle χ₁ = {} rad is large (or the bodies are captured): the leading-order waveform does not apply.", short(chi1)),
        },
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

/// The validity flag on b for the gravitational LO waveform (thresholds at [`B_INVALID`],
/// [`B_CAUTION`]), never better than the deflection's level `deflection`.
fn b_weak_field(b_over_m: f64, chi1: f64, deflection: Level) -> Flag {
    let (level, msg) = if b_over_m < B_INVALID {
        (
            Level::Invalid,
            "b is below 3√3 GM/c² (the photon-capture impact parameter): the leading-order (weak-deflection) waveform is not a prediction here; the numbers only show the homogeneous O(G²) formula (D·h in units of GM/c², scaling as 1/b)".to_string(),
        )
    } else if b_over_m < B_CAUTION {
        (
            Level::Caution,
            "b is only a few tens of GM/c² or less: the leading-order (weak-deflection) waveform misses corrections of relative size ~GM/(c² b) and larger; treat it as indicative".to_string(),
        )
    } else if deflection == Level::Ok {
        (Level::Ok, format!("b = {} GM/c² ≫ GM/c² and the deflection χ₁ = {} rad is small: the weak-deflection expansion of the waveform applies", short(b_over_m), short(chi1)))
    } else {
        (
            deflection,
            format!("b = {} GM/c² ≫ GM/c², so the field along the orbit is weak, but at this speed the deflection χ₁ = {} rad is not small: the weak-deflection expansion is limited by it (see weak_deflection)", short(b_over_m), short(chi1)),
        )
    };
    Flag::new(B_WEAK_FIELD, level, Some(b_over_m), msg)
}

/// The larger of body 1's deflection angle Δp/(γ m1 v) and body 2's recoil speed relative to v,
/// Δp/(m2 v): the relative size of the corrections to the straight-line field.
pub(crate) fn em_deflection_parameter(sys: &EmSystem) -> f64 {
    let v = sys.v();
    let dp = sys.impulse().abs();
    (dp / (sys.gamma * sys.m1 * v)).max(dp / (sys.m2 * v))
}

/// Flags of the straight-line (first-order) electromagnetic field.
///
/// `em_deflection`: [`em_deflection_parameter`], graded by the one verdict rule at the
/// tolerance `tol`. `em_beaming`: γ, Caution above 100 (the radiation is confined to ~1/γ).
pub(crate) fn em_system(sys: &EmSystem, tol: f64) -> Vec<Flag> {
    let x = em_deflection_parameter(sys);
    let level = Level::from(verdict(Some(x), tol));
    vec![
        Flag::new(
            EM_DEFLECTION,
            level,
            Some(x),
            match level {
                Level::Ok => format!("deflection and recoil {} are small: the straight-line O(q1 q2) field applies to about this relative size", short(x)),
                Level::Caution => format!("deflection or recoil {}: expect corrections of that relative size to the straight-line field", short(x)),
                Level::Invalid => format!("deflection or recoil {} is not small: the straight-line approximation fails", short(x)),
            },
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
pub(crate) fn electromagnetic(sys: &EmSystem, energies: Option<&EmEnergies>, tol: f64) -> Vec<Flag> {
    let mut flags = em_system(sys, tol);
    // Gravity between the bodies is left out of this force law: compare the couplings.
    let g_over_q = sys.m1 * sys.m2 / (sys.q1 * sys.q2).abs();
    // Its size is part of the field's error estimate, so it is graded by the same rule.
    let level = Level::from(verdict(Some(g_over_q), tol));
    flags.push(Flag::new(
        GRAVITY_NEGLECTED,
        level,
        Some(g_over_q),
        match level {
            Level::Ok => format!("G m1 m2/|q1 q2| = {}: gravity is negligible next to the Coulomb coupling", short(g_over_q)),
            Level::Caution => format!("G m1 m2/|q1 q2| = {} is not negligible: the gravitational acceleration, left out here, changes the field and the radiation at that relative size", short(g_over_q)),
            Level::Invalid => format!("G m1 m2/|q1 q2| = {}: gravity is comparable to or stronger than the Coulomb coupling; this electromagnetic-only result misses the dominant interaction", short(g_over_q)),
        },
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
