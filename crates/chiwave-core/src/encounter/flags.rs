//! Regime checks of an encounter (thresholds are common practice unless a flag names a source).
//! The order in which they are pushed is the order of the `flags` array in the result.

use crate::error::InputError;
use crate::two_body::Kinematics;
use crate::validity::{Flag, Level};

/// The strong-field estimate could not be evaluated (its own flags are pushed otherwise).
pub(crate) fn estimate_unavailable(err: &InputError) -> Flag {
    Flag::new("strong_field_estimate", Level::Caution, None, format!("Strong-field estimate unavailable: {err}."))
}

/// Flags of the PM series: expansion parameter, distance from capture, speed, energy, truncation.
/// `j_c` is the test-body capture threshold, `pm3_share` the 3PM term over χ.
pub(crate) fn gravity(flags: &mut Vec<Flag>, k: &Kinematics, j_c: f64, pm3_share: f64) {
    let s = &k.speed;
    let pm_x = 1.0 / (k.b_over_gm * s.v * s.v);
    flags.push(Flag::small_parameter(
        "pm_parameter",
        pm_x,
        0.05,
        0.3,
        [
            "GM/(b v²) small: weak deflection, the PM series converges quickly.",
            "GM/(b v²) not small: higher PM orders matter; compare with the exact test-body and estimate values.",
            "GM/(b v²) large: strong deflection; the truncated PM series is not a prediction here.",
        ],
    ));
    let ratio = k.j / j_c;
    flags.push(if ratio <= 1.0 {
        Flag::new("capture_proximity", Level::Invalid, Some(ratio), "Below the test-body capture threshold (j ≤ j_c): a test body would be captured; PM numbers have no meaning.")
    } else if ratio < 2.0 {
        Flag::new("capture_proximity", Level::Caution, Some(ratio), "Within a factor 2 of the test-body capture threshold j_c: strong field, PM series unreliable.")
    } else {
        Flag::new("capture_proximity", Level::Ok, Some(ratio), "Far from the test-body capture threshold (j > 2 j_c).")
    });
    flags.push(velocity(s.v));
    flags.push(if s.gamma > 10.0 {
        Flag::new("high_energy", Level::Caution, Some(s.gamma), "γ > 10: the conservative-only 3PM term grows like −8γ³ ln(2γ); only the radiation-reacted 3PM value (key 3pm) is physical (Damour 2020, arXiv:2010.01641).")
    } else {
        Flag::new("high_energy", Level::Ok, Some(s.gamma), "γ ≤ 10: conservative and radiation-reacted 3PM both shown; the radiation-reacted one (key 3pm) is the physical value.")
    });
    flags.push(Flag::small_parameter(
        "pm_truncation",
        pm3_share,
        1e-3,
        0.1,
        [
            "The 3PM term is a small fraction of χ: truncation error is small.",
            "The 3PM term is a sizeable fraction of χ: unknown 4PM terms may change the angle noticeably.",
            "The 3PM term is comparable with χ: the series is not converging here.",
        ],
    ));
}

/// Flags of the PL series (Gaussian units): units, expansion parameter, fall to the centre,
/// speed, the omitted two-body 3PL part, the dipole formula's speed.
pub(crate) fn electromagnetic(k: &Kinematics, kappa: f64, fall: bool) -> Vec<Flag> {
    let s = &k.speed;
    let mut flags = vec![Flag::new("units", Level::Ok, None, "Gaussian units with c = 1 (Coulomb force q1 q2/r²); SI charges were converted with q1 q2 → q1 q2/(4π ε0).")];
    flags.push(Flag::small_parameter(
        "pl_parameter",
        kappa.abs() / s.p_inf,
        0.05,
        0.3,
        [
            "|q1 q2|/(J p∞) small: weak deflection, the PL series converges quickly.",
            "|q1 q2|/(J p∞) not small: compare the PL series with the exact Darwin angle.",
            "|q1 q2|/(J p∞) large: strong deflection; use the exact test-charge angle.",
        ],
    ));
    flags.push(if fall {
        Flag::new("fall_to_centre", Level::Invalid, Some(kappa), "Attraction with |κ| ≥ 1: the test charge falls to the centre (no scattering angle).")
    } else {
        Flag::new("fall_to_centre", Level::Ok, Some(kappa), "No fall to the centre (κ > −1).")
    });
    flags.push(velocity(s.v));
    flags.push(Flag::small_parameter(
        "three_pl_two_body",
        k.nu,
        0.01,
        0.3,
        [
            "Near the test-charge limit: the omitted two-body ν part of the conservative 3PL term is small.",
            "The conservative 3PL term uses the test-charge coefficient; its two-body ν dependence is not included.",
            "The conservative 3PL term uses the test-charge coefficient; its two-body ν dependence is not included.",
        ],
    ));
    flags.push(Flag::small_parameter(
        "dipole_nonrelativistic",
        s.v,
        0.1,
        0.3,
        [
            "v ≪ c: the two-body dipole E_rad (key e_rad_dipole) applies.",
            "v not small: the non-relativistic dipole E_rad is only indicative.",
            "v close to c: the non-relativistic dipole E_rad does not apply; use the test-charge e_rad.",
        ],
    ));
    flags
}

/// Flags of the classical description, for physical masses: the Sommerfeld parameter and the
/// Compton wavelength of the lighter body over b.
pub(crate) fn physical(flags: &mut Vec<Flag>, sommerfeld: f64, compton_over_b: f64) {
    flags.push(if sommerfeld > 1e3 {
        Flag::new("classical_sommerfeld", Level::Ok, Some(sommerfeld), "Sommerfeld parameter ≫ 1: classical scattering applies.")
    } else if sommerfeld > 1.0 {
        Flag::new("classical_sommerfeld", Level::Caution, Some(sommerfeld), "Sommerfeld parameter only moderately above 1: quantum corrections to the classical angle may be visible.")
    } else {
        Flag::new("classical_sommerfeld", Level::Invalid, Some(sommerfeld), "Sommerfeld parameter ≤ 1: the encounter is quantum (Born regime); the classical angle does not apply.")
    });
    flags.push(Flag::small_parameter(
        "classical_compton",
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
        Flag::new("velocity_regime", Level::Ok, Some(v), "Slow encounter (v < 0.1 c): post-Newtonian regime; PM/PL series need p∞ j ≫ 1.")
    } else {
        Flag::new("velocity_regime", Level::Ok, Some(v), "Relativistic encounter (v ≥ 0.1 c).")
    }
}
