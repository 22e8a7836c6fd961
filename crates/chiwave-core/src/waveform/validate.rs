//! Validation of a waveform request: the two-body fields through the one two-body model
//! ([`crate::two_body`], ν giving m1 ≥ m2), then the waveform's own fields (observer direction,
//! time window, samples) and its b ceiling.

use super::request::{TimeUnit, WaveformForce, WaveformRequest};
use crate::error::{finite, in_closed, InputError};
use crate::two_body::{ChargeUse, NuOrder, TwoBodySystem};
use crate::units::AngleUnit;

/// Inputs shared by the gravitational and the electromagnetic waveform, validated.
pub(crate) struct Validated {
    /// The two-body system (masses in units of M = m1 + m2, γ, b/(GM/c²), charges, SI scale).
    pub(crate) two: TwoBodySystem,
    /// Observer direction, radians.
    pub(crate) theta: f64,
    pub(crate) phi: f64,
    /// Radians per unit of the input angles (`angle_unit`).
    pub(crate) rad_per_angle_unit: f64,
    /// Retarded times, units of GM/c³.
    pub(crate) u: Vec<f64>,
    /// Relative tolerance of the verdicts.
    pub(crate) tolerance: f64,
}

impl Validated {
    pub(crate) fn gamma(&self) -> f64 {
        self.two.kin.speed.gamma
    }
    pub(crate) fn b_over_gm(&self) -> f64 {
        self.two.kin.b_over_gm
    }
    /// G M/c² in metres, when the masses are physical.
    pub(crate) fn mass_length_m(&self) -> Option<f64> {
        self.two.physical.map(|p| p.length_m)
    }
}

/// Accepted range of b/(GM/c²), M = m1 + m2 (numerical sanity; the LO formulas are homogeneous in b).
const B_MIN: f64 = crate::two_body::ORBIT_MIN;
const B_MAX: f64 = 1e12;

impl WaveformRequest {
    /// Validates every field (the two-body ones first) and lays out the retarded times.
    ///
    /// # Errors
    /// [`InputError`] naming the field and its allowed range.
    pub(crate) fn validate(&self) -> Result<Validated, InputError> {
        let tolerance = crate::validity::tolerance(self.tolerance)?;
        let charges = match self.force {
            WaveformForce::Gravity => ChargeUse::Forbidden,
            WaveformForce::Em => ChargeUse::Required,
        };
        let b_range = || format!("{B_MIN:e} ≤ b ≤ {B_MAX:e} in units of GM/c² (M = m1 + m2) for the waveform");
        let two = self.two_body().validate(NuOrder::HeavierFirst, charges, None).map_err(|e| match e {
            InputError::OutOfRange { field: "b", value, .. } if value > 0.0 => InputError::OutOfRange { field: "b", value, allowed: b_range() },
            other => other,
        })?;
        let (gamma, b_over_m) = (two.kin.speed.gamma, two.kin.b_over_gm);
        let l_tot = two.physical.map(|p| p.length_m);
        if b_over_m > B_MAX {
            return Err(InputError::OutOfRange { field: "b", value: b_over_m, allowed: b_range() });
        }
        let rad_per_angle_unit = self.angle_unit.unwrap_or(AngleUnit::Rad).radians();
        let theta = finite("theta", self.theta)? * rad_per_angle_unit;
        let phi = finite("phi", self.phi)? * rad_per_angle_unit;
        in_closed("theta", theta, 0.0, std::f64::consts::PI)?;
        if phi.abs() > 1e3 {
            return Err(InputError::OutOfRange { field: "phi", value: self.phi, allowed: "|phi| ≤ 1000 rad".into() });
        }
        finite("u_min", self.u_min)?;
        finite("u_max", self.u_max)?;
        if self.u_max <= self.u_min {
            return Err(InputError::OutOfRange { field: "u_max", value: self.u_max, allowed: "u_max > u_min".into() });
        }
        // GM/c³ per unit of the window.
        let u_scale = match self.u_unit {
            TimeUnit::Gm => 1.0,
            TimeUnit::BOverV => b_over_m * gamma / ((gamma - 1.0) * (gamma + 1.0)).sqrt(),
            TimeUnit::S => match l_tot {
                Some(l) => crate::units::codata2018::C / l,
                None => {
                    return Err(InputError::Inconsistent {
                        field: "u_unit",
                        reason: "a window in seconds needs physical masses (e.g. m1 = \"10Msun\"); use gm or b_over_v".into(),
                    })
                }
            },
        };
        let (u_min, u_max) = (self.u_min * u_scale, self.u_max * u_scale);
        let ulim = 1e15;
        in_closed("u_min", u_min, -ulim, ulim)?;
        in_closed("u_max", u_max, -ulim, ulim)?;
        if !(2..=100_000).contains(&self.samples) {
            return Err(InputError::OutOfRange {
                field: "samples",
                value: self.samples as f64,
                allowed: "2 ≤ samples ≤ 100000".into(),
            });
        }
        let n = self.samples;
        let du = (u_max - u_min) / (n - 1) as f64;
        let u: Vec<f64> = (0..n).map(|i| if i + 1 == n { u_max } else { u_min + du * i as f64 }).collect();
        Ok(Validated { two, theta, phi, rad_per_angle_unit, u, tolerance })
    }
}
