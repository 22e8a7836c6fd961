//! Evaluation of a gravitational encounter: every PM order, the exact test-body angle, the
//! strong-field estimate, radiation, impulse, flags and SI values.

use super::results::{order_rows, GravityPhysical, GravityResult, PmAngles, PmCoefficients, TestBodyTerm};
use super::{accuracy, eob, flags, impulse, pm, radiated, sources, testbody};
use crate::error::InputError;
use crate::two_body::TwoBodySystem;
use crate::units;

/// Evaluates a validated gravitational encounter (verdicts at the default tolerance).
///
/// # Errors
/// [`InputError::NoConvergence`] from the test-body quadrature self-check.
pub fn gravity(s: &TwoBodySystem) -> Result<GravityResult, InputError> {
    evaluate(s, crate::validity::DEFAULT_TOLERANCE)
}

/// Evaluates a validated gravitational encounter with verdicts at the relative tolerance `tol`.
///
/// # Errors
/// [`InputError::NoConvergence`] from the test-body quadrature self-check.
pub(crate) fn evaluate(s: &TwoBodySystem, tol: f64) -> Result<GravityResult, InputError> {
    let k = &s.kin;
    let b = &k.speed;
    let c = pm::coefficients(b, k.nu);
    let angles = pm::cumulative_angles(&c, k.j);
    let chi_newtonian = pm::chi_newtonian(k.b_over_gm, b.v);
    let tb = testbody::exact(b, k.j)?;
    let (chi_test_body, test_body_r_min) = match tb {
        testbody::TestBody::Scattered { chi, r_min } => (Some(chi), Some(r_min)),
        testbody::TestBody::Captured => (None, None),
    };
    let j_c = testbody::critical_j(b);
    let chi_for_estimate = [c[0], c[1], c[2] + c[3]];
    let mut eob_flags = Vec::new();
    let mut estimate_missing = None;
    let (chi_estimate, captured, estimate, j_critical_estimate) = match eob::details(b.gamma, k.nu, k.j, &chi_for_estimate) {
        Ok(d) => {
            eob_flags = d.flags;
            match d.estimate {
                e @ eob::Estimate::Scattered { chi, .. } => (Some(chi), false, Some(e), d.j_critical),
                e @ eob::Estimate::Captured { j_critical } => {
                    estimate_missing = Some(format!("the strong-field estimate predicts capture (j = {:.4} below its critical j = {j_critical:.4})", k.j));
                    (None, true, Some(e), d.j_critical)
                }
            }
        }
        Err(err) => {
            estimate_missing = Some(format!("strong-field estimate unavailable: {err}"));
            eob_flags.push(flags::estimate_unavailable(&err));
            (None, false, None, None)
        }
    };
    // Radiation.
    let e_function = radiated::e_of_speed(b);
    let e_rad = k.nu * k.nu * e_function / (k.h * k.b_over_gm.powi(3));
    let p_rad_cm = radiated::p_rad_cm(b, k.m1, k.m2, k.p_cm, k.b_over_gm);
    let j_rad = radiated::j_rad_over_j(b, k.nu, k.h, k.j);
    // Impulse.
    let inp = impulse::ImpulseInput::new(k, c, k.nu * k.nu * e_function / k.b_over_gm.powi(3));
    let cov = impulse::covariant(&inp);
    let imp = impulse::frames(&cov.total, &inp);
    let imp_c = impulse::frames(&cov.conservative, &inp);
    // Test-body PM series at the same γ, j.
    let mut cum = 0.0;
    let test_body_pm = (1..=8)
        .filter_map(|n| {
            let cn = testbody::pm_coefficient(n, b)?;
            cum += 2.0 * cn / k.j.powi(n as i32);
            Some(TestBodyTerm { order: n, coefficient: cn, cumulative: cum })
        })
        .collect();
    let x = 1.0 / k.j;
    let terms = [2.0 * c[0] * x, 2.0 * c[1] * x * x, 2.0 * c[2] * x.powi(3), 2.0 * c[3] * x.powi(3)];
    let mut orders = order_rows(&["1PM", "2PM", "3PM conservative", "3PM radiation reaction"], &terms);
    let acc = accuracy::gravity(
        &accuracy::GravityInputs { k, c, angles, chi_newtonian, chi_test_body, chi_estimate, estimate_missing, e_rad },
        tol,
    );
    for (row, e) in orders.iter_mut().zip(&acc.orders) {
        row.estimate = e.clone();
    }
    let pm3_share = (terms[2] + terms[3]).abs() / angles[3].abs().max(f64::MIN_POSITIVE);
    let mut flags = Vec::new();
    flags::gravity(&mut flags, k, j_c, pm3_share, &orders[3].estimate);
    flags.extend(flags::estimate_flags(eob_flags, &acc.estimates["chi_estimate"]));
    let physical = s.physical.map(|sc| {
        use units::codata2018::{C, HBAR};
        let mc = sc.m_kg * C;
        let e_unit = sc.m_kg * C * C;
        let j_unit = units::codata2018::G * sc.m_kg * sc.m_kg / C;
        let sommerfeld = units::codata2018::G * k.m1 * k.m2 * sc.m_kg * sc.m_kg / (HBAR * C * b.v);
        let compton_over_b = HBAR / (k.m1.min(k.m2) * sc.m_kg * C * k.b_over_gm * sc.length_m);
        GravityPhysical {
            m1_kg: k.m1 * sc.m_kg,
            m2_kg: k.m2 * sc.m_kg,
            m_total_msun: sc.m_kg / units::M_SUN_KG,
            gm_over_c2_m: sc.length_m,
            b_m: k.b_over_gm * sc.length_m,
            b_au: k.b_over_gm * sc.length_m / units::astro::AU,
            v_km_s: b.v * C / 1e3,
            j_si: k.j_total * j_unit,
            e_rad_j: e_rad * e_unit,
            e_rad_msun_c2: e_rad * sc.m_kg / units::M_SUN_KG,
            j_rad_si: j_rad * k.j_total * j_unit,
            impulse_transverse_kg_m_s: imp.cm.transverse * mc,
            sommerfeld,
            compton_over_b,
        }
    });
    if let Some(p) = &physical {
        flags::physical(&mut flags, p.sommerfeld, p.compton_over_b);
    }
    let (sources, citations) = sources::gravity();
    Ok(GravityResult {
        force: "gravity",
        best: acc.best,
        tolerance: tol,
        gamma: b.gamma,
        nu: k.nu,
        j: k.j,
        b_over_gm: k.b_over_gm,
        chi: PmAngles::from(angles),
        chi_newtonian,
        chi_test_body,
        test_body_captured: chi_test_body.is_none(),
        test_body_r_min,
        j_critical_test_body: j_c,
        b_critical_test_body: j_c * k.h / b.p_inf,
        chi_estimate,
        captured,
        estimate,
        j_critical_estimate,
        e_rad,
        j_rad,
        p_rad_cm,
        impulse: imp,
        impulse_conservative: imp_c,
        covariant: cov,
        coefficients: PmCoefficients { chi1: c[0], chi2: c[1], chi3_conservative: c[2], chi3_radiation_reaction: c[3], chi3: c[2] + c[3] },
        test_body_pm,
        kinematics: *k,
        orders,
        estimates: acc.estimates,
        flags,
        sources,
        citations,
        physical,
        notice: crate::validity::ESTIMATE_NOTICE,
    })
}
