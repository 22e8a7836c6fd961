//! Evaluation of a validated electromagnetic waveform request (Gaussian units, c = 1, frame A):
//! the field D·E at the samples, the memory, the radiated energies (closed forms and flux
//! integral with interference), flags, SI values and the optional spectrum.

use super::em::{self, EmSystem};
use super::frames::Frame;
use super::gravity::mc2_joules;
use super::request::{WaveformForce, WaveformRequest};
use super::results::{EmSpectrumResult, EmWaveformPhysical, EmWaveformResult, ThetaPhi, EM_UNITS};
use super::validate::Validated;
use super::{accuracy, flags, sources};
use crate::error::InputError;

/// Evaluates a validated electromagnetic request (frame A only).
///
/// # Errors
/// [`InputError`] naming `frame` (only rest2), `distance`, `detector` or `quadrupole` (gravity
/// only), `spectrum.*`, or from [`EmSystem::new`].
pub(crate) fn evaluate(req: &WaveformRequest, c: &Validated) -> Result<EmWaveformResult, InputError> {
    if req.frame != Frame::Rest2 {
        return Err(InputError::Inconsistent {
            field: "frame",
            reason: "only frame = \"rest2\" (rest frame of body 2) is available for force = \"em\"".into(),
        });
    }
    for (field, given) in [
        ("distance", req.distance.is_some()),
        ("detector", req.detector.is_some()),
        ("quadrupole", req.quadrupole),
    ] {
        if given {
            return Err(InputError::Inconsistent {
                field,
                reason: "not available for force = \"em\" (gravity only); the em result is D·E in geometric Gaussian units".into(),
            });
        }
    }
    let (q1, q2) = c.two.charges.ok_or(InputError::Missing { field: "q1", hint: "force \"em\" needs q1 and q2".into() })?;
    let (m1, m2) = (c.two.kin.m1, c.two.kin.m2);
    let sys = EmSystem::new(m1, m2, q1, q2, c.gamma(), c.b_over_gm())?;
    let f = em::field(&sys, c.theta, c.phi, &c.u);
    let mem = em::memory(&sys, c.theta, c.phi);
    let e1 = sys.body1_energy_closed();
    let e2 = sys.body2_energy_closed();
    let energies = if req.energy_flux { Some(em::energies(&sys)) } else { None };
    let spectrum = match &req.spectrum {
        None => None,
        Some(o) => {
            let omega = o.omegas()?;
            let de = em::spectrum(&sys, c.theta, c.phi, &omega);
            let de_int = if o.angle_integrated { Some(em::spectrum_integrated(&sys, &omega)) } else { None };
            Some(EmSpectrumResult {
                omega,
                de_domega_dsolid: de,
                de_domega: de_int,
                zfl_direction: (mem[0] * mem[0] + mem[1] * mem[1]) / (4.0 * std::f64::consts::PI.powi(2)),
            })
        }
    };
    let flags = flags::electromagnetic(&sys, energies.as_ref(), c.tolerance);
    let peak_abs_e = f.e_theta.iter().zip(&f.e_phi).map(|(a, b)| a.hypot(*b)).fold(0.0, f64::max);
    let (estimates, best, best_e_rad) = accuracy::electromagnetic(
        flags::em_deflection_parameter(&sys),
        m1 * m2 / (q1 * q2).abs(),
        peak_abs_e,
        e1 + e2,
        energies.as_ref().map(|e| (e.total_flux, e.rel_error_estimate)),
        c.tolerance,
    );
    let physical = c.mass_length_m().map(|l| {
        let cc = crate::units::codata2018::C;
        let mc2 = mc2_joules(l);
        EmWaveformPhysical {
            total_mass_kg: l * cc * cc / crate::units::codata2018::G,
            u_s: c.u.iter().map(|x| x * l / cc).collect(),
            e_rad_flux_j: energies.as_ref().map(|e| e.total_flux * mc2),
            e_rad_closed_j: (e1 + e2) * mc2,
            e_rad_body1_j: e1 * mc2,
            e_rad_body2_j: e2 * mc2,
        }
    });
    let (sources, citations) = sources::electromagnetic();
    Ok(EmWaveformResult {
        force: WaveformForce::Em,
        best,
        best_e_rad,
        tolerance: c.tolerance,
        u: c.u.clone(),
        e_theta: f.e_theta,
        e_phi: f.e_phi,
        peak_abs_e,
        memory: ThetaPhi { theta: mem[0], phi: mem[1] },
        e_rad_flux: energies.as_ref().map(|e| e.total_flux),
        e_rad_closed: e1 + e2,
        e_rad_body1: e1,
        e_rad_body2: e2,
        interference: energies.as_ref().map(|e| e.interference),
        e_rad_flux_rel_error: energies.as_ref().map(|e| e.rel_error_estimate),
        p_rad_flux: energies.as_ref().map(|e| e.momentum),
        frame: Frame::Rest2,
        gamma: c.gamma(),
        v: sys.v(),
        m1_over_m: m1,
        m2_over_m: m2,
        b_over_gm: c.b_over_gm(),
        b_over_m_alias: c.b_over_gm(),
        q1,
        q2,
        impulse: sys.impulse(),
        units: EM_UNITS,
        flags,
        sources,
        citations,
        spectrum,
        physical,
        estimates,
    })
}
