//! Evaluation of an electromagnetic encounter (Gaussian units, c = 1): every PL order, Darwin's
//! exact test-charge angle, radiated energy and angular momentum, impulse, flags, SI values.

use super::results::{order_rows, EmPhysical, EmResult, PlAngles, PlCoefficients};
use super::{accuracy, flags, impulse, pl, sources};
use crate::error::InputError;
use crate::two_body::TwoBodySystem;
use crate::units;

/// Evaluates a validated electromagnetic encounter (Gaussian units, c = 1; verdicts at the
/// default tolerance).
///
/// # Errors
/// [`InputError::Missing`] if the setup carries no charges.
pub fn electromagnetic(s: &TwoBodySystem) -> Result<EmResult, InputError> {
    evaluate(s, crate::validity::DEFAULT_TOLERANCE)
}

/// Evaluates a validated electromagnetic encounter with verdicts at the relative tolerance `tol`.
///
/// # Errors
/// [`InputError::Missing`] if the setup carries no charges.
pub(crate) fn evaluate(s: &TwoBodySystem, tol: f64) -> Result<EmResult, InputError> {
    let (q1, q2) = s.charges.ok_or_else(|| InputError::Missing { field: "q1", hint: "force \"em\" needs q1 and q2".into() })?;
    let k = &s.kin;
    let b = &k.speed;
    let kappa = q1 * q2 / k.j_total;
    let (e1, e2, e3) = (pl::e1(b), pl::e2(k.h), pl::e3_test(b));
    let rr = pl::delta_chi_rr(b, q1, q2, k.m1, k.m2, k.e, k.j_total);
    let terms = [2.0 * e1 * kappa, 2.0 * e2 * kappa * kappa, 2.0 * e3 * kappa.powi(3), rr];
    let a1 = terms[0];
    let a2 = a1 + terms[1];
    let a3c = a2 + terms[2];
    let a3 = a3c + terms[3];
    let (chi_test_exact, fall) = match pl::darwin(b, kappa) {
        pl::Darwin::Scattered { chi } => (Some(chi), false),
        pl::Darwin::FallToCentre => (None, true),
    };
    let e_rad = pl::e_rad_test(b, q1, q2, k.m1, k.b_over_gm);
    let e_rad_dipole = pl::e_rad_dipole(b, q1, q2, k.m1, k.m2, k.b_over_gm);
    let j_rad = pl::j_rad(b, q1, q2, k.m1, k.m2, k.e, k.b_over_gm) / k.j_total;
    // Impulse: −p sin χ through O(κ³) and the on-shell longitudinal parts (the construction of
    // the gravitational impulse, encounter::impulse, applied to the PL series; the radiated
    // momentum is not included).
    let t1 = -k.p_cm * terms[0];
    let t2 = -k.p_cm * terms[1];
    let t3 = -k.p_cm * (terms[2] + terms[3] - terms[0].powi(3) / 6.0);
    let kk = (t1 * t1 + 2.0 * t1 * t2) / (2.0 * k.m1 * k.m2 * b.p_inf * b.p_inf);
    let cov = impulse::Covariant { c_b: t1 + t2 + t3, c_u1: -kk * (b.gamma * k.m1 + k.m2), c_u2: kk * (b.gamma * k.m2 + k.m1) };
    let inp = impulse::ImpulseInput::new(k, [0.0; 4], 0.0);
    let imp = impulse::frames(&cov, &inp);
    let mut orders = order_rows(&["1PL", "2PL", "3PL conservative (test charge)", "3PL radiation reaction"], &terms);
    let acc = accuracy::electromagnetic(
        &accuracy::EmInputs { k, kappa, terms, cumulative: [a1, a2, a3c, a3], chi_test_exact, charges: (q1, q2) },
        tol,
    );
    for (row, e) in orders.iter_mut().zip(&acc.orders) {
        row.estimate = e.clone();
    }
    let mut flags = flags::electromagnetic(k, kappa, fall, &orders[3].estimate, &acc.estimates["e_rad_dipole"]);
    let physical = s.physical.map(|sc| {
        use units::codata2018::{C, EPSILON0, G, HBAR};
        let e_unit = sc.m_kg * C * C;
        // q_SI = q̃ √(4π ε0 G) M.
        let qs = (4.0 * std::f64::consts::PI * EPSILON0 * G).sqrt() * sc.m_kg;
        let (q1c, q2c) = (q1 * qs, q2 * qs);
        let sommerfeld = (q1c * q2c).abs() / (4.0 * std::f64::consts::PI * EPSILON0 * HBAR * C * b.v);
        let compton_over_b = HBAR / (k.m1.min(k.m2) * sc.m_kg * C * k.b_over_gm * sc.length_m);
        EmPhysical {
            m1_kg: k.m1 * sc.m_kg,
            m2_kg: k.m2 * sc.m_kg,
            q1_c: q1c,
            q2_c: q2c,
            b_m: k.b_over_gm * sc.length_m,
            v_km_s: b.v * C / 1e3,
            e_rad_j: e_rad * e_unit,
            e_rad_dipole_j: e_rad_dipole * e_unit,
            sommerfeld,
            compton_over_b,
        }
    });
    if let Some(p) = &physical {
        flags::physical(&mut flags, p.sommerfeld, p.compton_over_b);
    }
    let (sources, citations) = sources::electromagnetic();
    Ok(EmResult {
        force: "em",
        best: acc.best,
        tolerance: tol,
        units: "Gaussian, c = 1",
        gamma: b.gamma,
        nu: k.nu,
        kappa,
        b_over_gm: k.b_over_gm,
        chi: PlAngles { pl1: a1, pl2: a2, pl3_conservative: a3c, pl3: a3 },
        chi_test_exact,
        fall_to_centre: fall,
        e_rad,
        e_rad_dipole,
        j_rad,
        impulse: imp,
        covariant: cov,
        coefficients: PlCoefficients { e1, e2, e3_test: e3, delta_chi_rr: rr },
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
