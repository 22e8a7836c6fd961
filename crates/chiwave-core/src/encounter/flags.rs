//! Regime checks of an encounter (thresholds are common practice unless a flag names a source).
//! The order in which they are pushed is the order of the `flags` array in the result.

use crate::error::InputError;
use crate::two_body::Kinematics;
use crate::validity::{short, Check, ErrorEstimate, Flag, Level};

/// The regime checks of this file: stable key and the label shown with it.
const STRONG_FIELD_ESTIMATE: Check = Check::new("strong_field_estimate", "strong-field estimate");
const CAPTURE_PROXIMITY: Check = Check::new("capture_proximity", "capture proximity j/j_c");
const HIGH_ENERGY: Check = Check::new("high_energy", "energy γ");
const UNITS: Check = Check::new("units", "units");
const FALL_TO_CENTRE: Check = Check::new("fall_to_centre", "fall to centre κ");
const CLASSICAL_SOMMERFELD: Check = Check::new("classical_sommerfeld", "Sommerfeld parameter");
const VELOCITY_REGIME: Check = Check::new("velocity_regime", "velocity v/c");
const PM_PARAMETER: Check = Check::new("pm_parameter", "PM parameter GM/(b v²)");
const PM_TRUNCATION: Check = Check::new("pm_truncation", "3PM share of χ");
const PL_PARAMETER: Check = Check::new("pl_parameter", "PL parameter |κ|/p∞");
const THREE_PL_TWO_BODY: Check = Check::new("three_pl_two_body", "two-body 3PL ν");
const DIPOLE_NONRELATIVISTIC: Check = Check::new("dipole_nonrelativistic", "dipole E_rad v/c");
const CLASSICAL_COMPTON: Check = Check::new("classical_compton", "Compton λ/b");

/// The strong-field estimate could not be evaluated (its own flags are pushed otherwise).
pub(crate) fn estimate_unavailable(err: &InputError) -> Flag {
    Flag::new(STRONG_FIELD_ESTIMATE, Level::Caution, None, format!("Strong-field estimate unavailable: {err}."))
}

/// The strong-field estimate's own flags (from [`super::eob::details`]) with the `eob_estimate`
/// flag graded by the estimate's own error estimate `est` (the one verdict rule).
pub(crate) fn estimate_flags(mut eob_flags: Vec<Flag>, est: &ErrorEstimate) -> Vec<Flag> {
    for f in eob_flags.iter_mut().filter(|f| f.key == "eob_estimate") {
        f.level = Level::from(est.verdict);
        f.value = est.error_estimate;
        f.message = match est.error_estimate {
            Some(e) => format!(
                "Strong-field estimate (PM angle coefficients resummed into an effective-one-body radial potential, Damour 2018; Damour & Rettegno 2023): estimated relative error {} ({}).",
                short(e),
                est.error_method
            ),
            None => format!(
                "Strong-field estimate (PM angle coefficients resummed into an effective-one-body radial potential, Damour 2018; Damour & Rettegno 2023): no error estimate ({}).",
                est.error_reason.as_deref().unwrap_or("unknown")
            ),
        };
    }
    eob_flags
}

/// Relative error shown in a message.
fn rel(e: &ErrorEstimate) -> String {
    match e.error_estimate {
        Some(x) => format!("{} ({})", short(x), e.error_method),
        None => format!("not estimated ({})", e.error_reason.as_deref().unwrap_or("unknown")),
    }
}

/// Flags of the PM series: expansion parameter, distance from the test-body capture, speed,
/// energy, truncation. `j_c` is the test-body capture threshold, `pm3_share` the 3PM term over χ,
/// `est3` the error estimate of the 3PM value: `pm_parameter` and `pm_truncation` take their
/// level from its verdict, so they never disagree with the angle table.
pub(crate) fn gravity(flags: &mut Vec<Flag>, k: &Kinematics, j_c: f64, pm3_share: f64, est3: &ErrorEstimate) {
    let s = &k.speed;
    let pm_x = 1.0 / (k.b_over_gm * s.v * s.v);
    let level = Level::from(est3.verdict);
    flags.push(Flag::new(
        PM_PARAMETER,
        level,
        Some(pm_x),
        match level {
            Level::Ok => format!("GM/(b v²) = {}: the PM series converges quickly here; the 3PM value's estimated error is {}.", short(pm_x), rel(est3)),
            _ => format!("GM/(b v²) = {}: the 3PM value's estimated error is {}; compare with the exact test-body angle and the strong-field estimate.", short(pm_x), rel(est3)),
        },
    ));
    let ratio = k.j / j_c;
    flags.push(if ratio <= 1.0 {
        // In the test-body limit this is the capture of the encounter itself; for comparable
        // masses the two-body capture threshold is lower (see eob_near_capture).
        let level = if k.nu < 0.01 { Level::Invalid } else { Level::Caution };
        Flag::new(
            CAPTURE_PROXIMITY,
            level,
            Some(ratio),
            format!("j/j_c = {}: a test body (ν → 0) at this γ would be captured (j ≤ j_c), so the exact test-body angle is not available; for ν = {} the two-body capture threshold differs (see the strong-field estimate).", short(ratio), short(k.nu)),
        )
    } else if ratio < 2.0 {
        Flag::new(CAPTURE_PROXIMITY, Level::Caution, Some(ratio), format!("j/j_c = {}: within a factor 2 of the test-body capture threshold: strong field; read each angle's error estimate.", short(ratio)))
    } else {
        Flag::new(CAPTURE_PROXIMITY, Level::Ok, Some(ratio), format!("j/j_c = {}: far from the test-body capture threshold (j > 2 j_c).", short(ratio)))
    });
    flags.push(velocity(s.v));
    flags.push(if s.gamma > 10.0 {
        Flag::new(HIGH_ENERGY, Level::Caution, Some(s.gamma), "γ > 10: the conservative-only 3PM term grows like −8γ³ ln(2γ); only the radiation-reacted 3PM value (key 3pm) is physical (Damour 2020, arXiv:2010.01641).")
    } else {
        Flag::new(HIGH_ENERGY, Level::Ok, Some(s.gamma), "γ ≤ 10: conservative and radiation-reacted 3PM both shown; the radiation-reacted one (key 3pm) is the physical value.")
    });
    flags.push(Flag::new(
        PM_TRUNCATION,
        level,
        Some(pm3_share),
        format!("The 3PM term is {} of χ; the 3PM value's estimated error is {}.", short(pm3_share), rel(est3)),
    ));
}

/// Flags of the PL series (Gaussian units): units, expansion parameter, fall to the centre,
/// speed, the omitted two-body 3PL part, the dipole formula's speed.
/// `est3` is the 3PL value's error estimate, `dipole` that of the two-body dipole E_rad: the
/// flags that grade them (`pl_parameter`, `dipole_nonrelativistic`) take their levels from those
/// verdicts.
pub(crate) fn electromagnetic(k: &Kinematics, kappa: f64, fall: bool, est3: &ErrorEstimate, dipole: &ErrorEstimate) -> Vec<Flag> {
    let s = &k.speed;
    let mut flags = vec![Flag::new(UNITS, Level::Ok, None, "Gaussian units with c = 1 (Coulomb force q1 q2/r²); SI charges were converted with q1 q2 → q1 q2/(4π ε0).")];
    let x = kappa.abs() / s.p_inf;
    let level = Level::from(est3.verdict);
    flags.push(Flag::new(
        PL_PARAMETER,
        level,
        Some(x),
        match level {
            Level::Ok => format!("|q1 q2|/(J p∞) = {}: the PL series converges quickly here; the 3PL value's estimated error is {}.", short(x), rel(est3)),
            _ => format!("|q1 q2|/(J p∞) = {}: the 3PL value's estimated error is {}; compare with the exact test-charge angle.", short(x), rel(est3)),
        },
    ));
    flags.push(if fall {
        Flag::new(FALL_TO_CENTRE, Level::Invalid, Some(kappa), "Attraction with |κ| ≥ 1: the test charge falls to the centre (no scattering angle).")
    } else {
        Flag::new(FALL_TO_CENTRE, Level::Ok, Some(kappa), "No fall to the centre (κ > −1).")
    });
    flags.push(velocity(s.v));
    // A condition: the 3PL rows' error estimates include the size of the omitted part.
    flags.push(if k.nu < 0.01 {
        Flag::new(THREE_PL_TWO_BODY, Level::Ok, Some(k.nu), "Near the test-charge limit: the omitted two-body ν part of the conservative 3PL term is small.")
    } else {
        Flag::new(
            THREE_PL_TWO_BODY,
            Level::Caution,
            Some(k.nu),
            format!("ν = {}: the conservative 3PL term uses the test-charge coefficient; its two-body ν dependence is not included (its size is part of the 3PL rows' error estimates).", short(k.nu)),
        )
    });
    flags.push(Flag::new(
        DIPOLE_NONRELATIVISTIC,
        Level::from(dipole.verdict),
        Some(s.v),
        match dipole.error_estimate {
            Some(e) => format!("v = {}: the non-relativistic two-body dipole E_rad (key e_rad_dipole) has an estimated relative error {} ({}).", short(s.v), short(e), dipole.error_method),
            None => format!("v = {}: the two-body dipole E_rad has no error estimate ({}); use the test-charge e_rad.", short(s.v), dipole.error_reason.as_deref().unwrap_or("unknown")),
        },
    ));
    flags
}

/// Flags of the classical description, for physical masses: the Sommerfeld parameter and the
/// Compton wavelength of the lighter body over b.
pub(crate) fn physical(flags: &mut Vec<Flag>, sommerfeld: f64, compton_over_b: f64) {
    flags.push(if sommerfeld > 1e3 {
        Flag::new(CLASSICAL_SOMMERFELD, Level::Ok, Some(sommerfeld), "Sommerfeld parameter ≫ 1: classical scattering applies.")
    } else if sommerfeld > 1.0 {
        Flag::new(CLASSICAL_SOMMERFELD, Level::Caution, Some(sommerfeld), "Sommerfeld parameter only moderately above 1: quantum corrections to the classical angle may be visible.")
    } else {
        Flag::new(CLASSICAL_SOMMERFELD, Level::Invalid, Some(sommerfeld), "Sommerfeld parameter ≤ 1: the encounter is quantum (Born regime); the classical angle does not apply.")
    });
    flags.push(Flag::small_parameter(
        CLASSICAL_COMPTON,
        compton_over_b,
        1e-3,
        1.0,
        [
            "Compton wavelength ≪ b: point particles are classical.",
            "Compton wavelength not negligible against b: quantum corrections may matter.",
            "Compton wavelength ≥ b: the classical description fails.",
        ],
    ));
}

/// The speed regime (always Ok: it says which regime the series are in).
fn velocity(v: f64) -> Flag {
    if v < 0.1 {
        Flag::new(VELOCITY_REGIME, Level::Ok, Some(v), "Slow encounter (v < 0.1 c): post-Newtonian regime; PM/PL series need p∞ j ≫ 1.")
    } else {
        Flag::new(VELOCITY_REGIME, Level::Ok, Some(v), "Relativistic encounter (v ≥ 0.1 c).")
    }
}
