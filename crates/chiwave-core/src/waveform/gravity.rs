//! Evaluation of a validated gravitational waveform request: the strain at the samples, the
//! memory (from the waveform and from Braginsky & Thorne), the radiated energy-momentum (flux
//! integral and closed form), flags, SI values, and the optional spectrum, detector response
//! and slow-motion curve.

use super::energy::{radiated_closed_form, SkyIntegrator, SkyOptions};
use super::frames::{Binary, Frame};
use super::grids::SPECTRUM_SKY;
use super::kernel::{constant_piece, DirectionWaveform, DEFAULT_X_NODES};
use super::memory::{memory_braginsky_thorne, zfl_angle_integrated_closed_form};
use super::observer::{antenna_pattern, PhysicalScales};
use super::quadrupole::{quadrupole_energy_hyperbola, quadrupole_hyperbola};
use super::request::{SpectrumOptions, WaveformRequest};
use super::results::{DetectorResult, GravityWaveformPhysical, GravityWaveformResult, MemoryPair, QuadrupoleResult, SpectrumResult};
use super::spectrum::spectrum_angle_integrated;
use super::validate::Validated;
use super::{accuracy, flags, sources};
use crate::error::{finite, InputError};
use crate::units::{parse_length, Length};

/// Evaluates a validated gravitational request.
///
/// # Errors
/// [`InputError`] naming `distance` (needs physical masses), `detector.*`, `spectrum.*`, or from
/// the system and its quadratures.
pub(crate) fn evaluate(req: &WaveformRequest, c: &Validated) -> Result<GravityWaveformResult, InputError> {
    let (l_tot, gamma, b_over_m, theta, phi) = (c.mass_length_m(), c.gamma(), c.b_over_gm(), c.theta, c.phi);
    let rad = c.rad_per_angle_unit;
    let u = c.u.clone();
    let n = u.len();
    let sys = Binary::new(c.two.kin.m1, c.two.kin.m2, gamma, b_over_m)?;
    let distance_m = match &req.distance {
        None => None,
        Some(q) => match parse_length("distance", q)? {
            Length::Physical { m } => Some(m),
            Length::Geometric(x) => match l_tot {
                Some(l) => Some(x * l),
                None => {
                    return Err(InputError::Inconsistent {
                        field: "distance",
                        reason: "the distance needs physical masses (e.g. m1 = \"10Msun\") and a unit (e.g. \"1Mpc\")".into(),
                    })
                }
            },
        },
    };
    if distance_m.is_some() && l_tot.is_none() {
        return Err(InputError::Inconsistent {
            field: "distance",
            reason: "a physical distance needs physical masses (e.g. m1 = \"10Msun\")".into(),
        });
    }

    let w = DirectionWaveform::new(&sys, req.frame, theta, phi, DEFAULT_X_NODES)?;
    let mut h_plus = Vec::with_capacity(n);
    let mut h_cross = Vec::with_capacity(n);
    for &x in &u {
        let h = w.strain(x);
        h_plus.push(h[0]);
        h_cross.push(h[1]);
    }
    let memory: MemoryPair = w.memory().into();
    let memory_bt: MemoryPair = memory_braginsky_thorne(&sys, req.frame, theta, phi)?.into();
    let closed = radiated_closed_form(&sys, req.frame);
    let (e_flux, p_flux) = if req.energy_flux {
        let mut it = SkyIntegrator::new(&sys, req.frame, SkyOptions::for_gamma(gamma))?;
        let p = it.run();
        (Some(p.energy), Some(p.momentum))
    } else {
        (None, None)
    };
    let constant: MemoryPair = constant_piece(&sys, req.frame, theta, phi)?.into();

    let v = sys.v();
    let chi1 = crate::encounter::pm::chi_1pm_at_b(gamma, sys.cm_energy_ratio(), b_over_m);
    // Physical values.
    let physical = match l_tot {
        Some(l) => {
            let (l1, l2) = (c.two.kin.m1 * l, c.two.kin.m2 * l);
            let b_m = b_over_m * l;
            let scales = PhysicalScales::new(l1, l2, v, b_m, distance_m);
            let to_strain = |x: f64| distance_m.map(|d| x * l / d);
            let hp: Option<Vec<f64>> = distance_m.map(|d| h_plus.iter().map(|x| x * l / d).collect());
            let hc: Option<Vec<f64>> = distance_m.map(|d| h_cross.iter().map(|x| x * l / d).collect());
            let peak = match (&hp, &hc) {
                (Some(a), Some(c)) => Some(a.iter().zip(c).map(|(x, y)| x.hypot(*y)).fold(0.0, f64::max)),
                _ => None,
            };
            let mc2 = mc2_joules(l);
            let e_j = closed.energy * mc2;
            let msun_c2 = crate::units::M_SUN_KG * crate::units::codata2018::C.powi(2);
            Some(GravityWaveformPhysical {
                scales,
                u_s: u.iter().map(|x| x * l / crate::units::codata2018::C).collect(),
                h_plus: hp,
                h_cross: hc,
                peak_strain: peak,
                memory_strain: match (to_strain(memory.plus), to_strain(memory.cross)) {
                    (Some(a), Some(c)) => Some(MemoryPair { plus: a, cross: c }),
                    _ => None,
                },
                mc2_j: mc2,
                e_rad_j: e_j,
                e_rad_msun_c2: e_j / msun_c2,
                distance_m,
            })
        }
        _ => None,
    };

    let spectrum = match &req.spectrum {
        None => None,
        Some(o) => Some(spectrum_result(&sys, req.frame, &w, o)?),
    };
    let detector = match &req.detector {
        None => None,
        Some(d) => {
            let (fp, fx) = antenna_pattern(finite("detector.theta", d.theta)? * rad, finite("detector.phi", d.phi)? * rad, finite("detector.psi", d.psi)? * rad);
            let h: Vec<f64> = h_plus.iter().zip(&h_cross).map(|(a, c)| fp * a + fx * c).collect();
            let strain = match (distance_m, l_tot) {
                (Some(dm), Some(l)) => Some(h.iter().map(|x| x * l / dm).collect()),
                _ => None,
            };
            Some(DetectorResult { f_plus: fp, f_cross: fx, h, strain })
        }
    };
    let quadrupole = if req.quadrupole {
        let q = quadrupole_hyperbola(&sys, req.frame, theta, phi, &u)?;
        Some(QuadrupoleResult { h_plus: q.plus, h_cross: q.cross })
    } else {
        None
    };
    let peak_abs_h = h_plus.iter().zip(&h_cross).map(|(a, c)| a.hypot(*c)).fold(0.0, f64::max);
    let cm_equal = req.frame == Frame::Cm && (sys.m1 - sys.m2).abs() <= 1e-12 * sys.total_mass();
    // The slow-motion reference at the same samples (the quadrupole waveform is cheap beside
    // the LO strain): its peak, and the quadrupole energy of the hyperbola.
    let slow_peak = match &quadrupole {
        Some(q) => q.h_plus.iter().zip(&q.h_cross).map(|(a, c)| a.hypot(*c)).fold(0.0, f64::max),
        None => {
            let q = quadrupole_hyperbola(&sys, req.frame, theta, phi, &u)?;
            q.plus.iter().zip(&q.cross).map(|(a, c)| a.hypot(*c)).fold(0.0, f64::max)
        }
    };
    let slow = accuracy::SlowMotion {
        peak: slow_peak,
        peak_err: accuracy::quadrupole(v, cm_equal),
        energy: quadrupole_energy_hyperbola(sys.m1, sys.m2, v, b_over_m),
        energy_err: v,
    };
    let (estimates, best, best_e_rad) =
        accuracy::gravity(chi1, peak_abs_h, closed.energy, e_flux, &slow, quadrupole.as_ref().map(|_| (v, cm_equal)), c.tolerance);
    let flags = flags::gravity(&sys, b_over_m, req.energy_flux, chi1, &estimates["peak_abs_h"]);
    let (sources, citations) = sources::gravity();
    Ok(GravityWaveformResult {
        best,
        best_e_rad,
        tolerance: c.tolerance,
        u,
        peak_abs_h,
        h_plus,
        h_cross,
        memory,
        memory_braginsky_thorne: memory_bt,
        e_rad_flux: e_flux,
        e_rad_closed: closed.energy,
        e_rad_rel_diff: e_flux.map(|e| (e - closed.energy).abs() / closed.energy),
        p_rad_flux: p_flux,
        p_rad_closed: closed.momentum,
        constant_piece: constant,
        frame: req.frame,
        gamma,
        v,
        m1_over_m: sys.m1,
        m2_over_m: sys.m2,
        b_over_gm: b_over_m,
        b_over_m_alias: b_over_m,
        flags,
        sources,
        citations,
        physical,
        spectrum,
        detector,
        quadrupole,
        estimates,
    })
}

/// M c² in joules from G M/c² in metres: (GM/c²) c⁴/G (CODATA 2018 G and c).
pub(crate) fn mc2_joules(mass_length_m: f64) -> f64 {
    mass_length_m * crate::units::codata2018::C.powi(4) / crate::units::codata2018::G
}

fn spectrum_result(sys: &Binary, frame: Frame, w: &DirectionWaveform, o: &SpectrumOptions) -> Result<SpectrumResult, InputError> {
    let omega = o.omegas()?;
    let de: Vec<f64> = omega.iter().map(|&x| w.spectrum(x)).collect();
    let de_int = if o.angle_integrated {
        Some(spectrum_angle_integrated(sys, frame, &omega, SPECTRUM_SKY)?)
    } else {
        None
    };
    Ok(SpectrumResult {
        omega,
        de_domega_dsolid: de,
        de_domega: de_int,
        zfl_direction: w.spectrum(0.0),
        zfl_closed: zfl_angle_integrated_closed_form(sys),
    })
}
