//! The waveform request as the page and the CLI send it (`{"kind": "waveform", ...}`): its
//! fields, options and entry points. Validation is in `validate.rs` (the two-body fields through
//! [`crate::two_body`]), results in [`super::results`], the evaluations in `gravity.rs` and
//! `electromagnetic.rs`.

use super::frames::{Binary, Frame};
use super::results::WaveformResult;
use crate::error::InputError;
use crate::two_body::TwoBodyInput;
use crate::units::{AngleUnit, Quantity};
use serde::{Deserialize, Serialize};

/// Which field radiates.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum WaveformForce {
    #[default]
    Gravity,
    Em,
}

/// Unit of the requested time window.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "snake_case")]
pub enum TimeUnit {
    /// GM/c³ with M = m1 + m2.
    #[default]
    Gm,
    /// b/v, the crossing time of the impact parameter at the relative speed.
    BOverV,
    /// Seconds (needs physical masses).
    S,
}

/// Interferometer response options: source sky angles in the detector frame and polarisation angle.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct DetectorOptions {
    /// Polar angle of the source in the detector frame (angle_unit).
    pub theta: f64,
    /// Azimuth of the source in the detector frame (angle_unit).
    pub phi: f64,
    /// Polarisation angle ψ (angle_unit).
    #[serde(default)]
    pub psi: f64,
}

/// Spectrum options: log-spaced angular frequencies ω (units of c³/(GM)).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct SpectrumOptions {
    pub omega_min: f64,
    pub omega_max: f64,
    #[serde(default = "default_spectrum_points")]
    pub points: usize,
    /// Also integrate over the sphere (dE/dω); costs one sky integral per call.
    #[serde(default)]
    pub angle_integrated: bool,
}

fn default_spectrum_points() -> usize {
    64
}
fn default_samples() -> usize {
    1000
}
fn default_true() -> bool {
    true
}

/// A waveform request (`{"kind": "waveform", ...}`).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct WaveformRequest {
    /// "gravity" (default) or "em".
    #[serde(default)]
    pub force: WaveformForce,
    /// Mass of body 1 (incoming): bare number (geometric) or with a unit ("10Msun").
    #[serde(default)]
    pub m1: Option<Quantity>,
    /// Mass of body 2 (initially at rest in frame A).
    #[serde(default)]
    pub m2: Option<Quantity>,
    /// Symmetric mass ratio ν (0 < ν ≤ 1/4), instead of m1 and m2; then m1 ≥ m2 (the heavier body
    /// comes in) and M = total_mass.
    #[serde(default)]
    pub nu: Option<f64>,
    /// Total mass when `nu` is given (default 1, geometric); refused together with m1 and m2.
    #[serde(default)]
    pub total_mass: Option<Quantity>,
    /// Relative Lorentz factor γ (give exactly one of gamma and v).
    #[serde(default)]
    pub gamma: Option<f64>,
    /// Relative speed at infinity: "1000km/s", "0.3c" or a bare fraction of c.
    #[serde(default)]
    pub v: Option<Quantity>,
    /// Impact parameter: a bare number is b/(GM/c²) with M = m1 + m2 (as for the encounter
    /// request), or a length with a unit (which needs physical masses). Any 1e-6 ≤ b/(GM/c²) ≤ 1e12 is computed (the LO strain is homogeneous,
    /// D·h ∝ m1 m2/b); the `b_weak_field` flag marks b below a few GM/c² as outside the
    /// weak-deflection regime.
    pub b: Quantity,
    /// Observer polar angle from +z (normal to the orbital plane).
    pub theta: f64,
    /// Observer azimuth from +x (direction of body 1 in frame A).
    pub phi: f64,
    /// Unit of theta, phi and the detector angles (default rad).
    #[serde(default)]
    pub angle_unit: Option<AngleUnit>,
    /// "rest2" (default) or "cm".
    #[serde(default)]
    pub frame: Frame,
    /// First retarded time, in units of `u_unit` (default GM/c³).
    pub u_min: f64,
    /// Last retarded time (> u_min), same unit.
    pub u_max: f64,
    /// Unit of u_min and u_max: "gm" (GM/c³, default), "b_over_v" (the crossing time b/v, so
    /// ±10 covers the burst whatever the masses) or "s" (seconds; needs physical masses). The
    /// output `u` is always in GM/c³ (and `physical.u_s` in seconds).
    #[serde(default)]
    pub u_unit: TimeUnit,
    /// Number of evenly spaced samples, both ends included (2..=100000).
    #[serde(default = "default_samples")]
    pub samples: usize,
    /// Observer distance (physical length, needs physical masses) for the strain at the detector.
    #[serde(default)]
    pub distance: Option<Quantity>,
    /// Charge of body 1 for force = "em" (required there, refused for gravity): `"1e"`,
    /// `"-1e-9C"`, `"3statC"`, or a bare number in units of √G M (geometric Gaussian, G = c = 1,
    /// M = m1 + m2; the encounter module's convention). A charge with a unit needs physical masses.
    #[serde(default)]
    pub q1: Option<Quantity>,
    /// Charge of body 2 (initially at rest in frame A), as `q1`.
    #[serde(default)]
    pub q2: Option<Quantity>,
    /// Interferometer response (needs `distance` for physical strain; geometric otherwise).
    #[serde(default)]
    pub detector: Option<DetectorOptions>,
    /// Spectrum in the observer direction (and over the sphere if asked).
    #[serde(default)]
    pub spectrum: Option<SpectrumOptions>,
    /// Compute the flux integral of the energy over u and the sphere (default true).
    #[serde(default = "default_true")]
    pub energy_flux: bool,
    /// Also return the quadrupole-formula waveform of the Newtonian hyperbola (default false).
    #[serde(default)]
    pub quadrupole: bool,
    /// Relative tolerance of the verdicts, 1e-12 … 0.5 (default 1e-2).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub tolerance: Option<f64>,
}

/// A validated gravitational request reduced to what the sky sums need
/// ([`WaveformRequest::gravity_system`]).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GravitySystem {
    /// The binary in units of M (m1 + m2 = 1).
    pub binary: Binary,
    /// Observer direction (θ, φ) in radians.
    pub observer: (f64, f64),
    /// G M/c² in metres, when the masses are physical.
    pub mass_length_m: Option<f64>,
}

impl WaveformRequest {
    /// Evaluates the request: the gravitational waveform ([`GravityWaveformResult`](super::GravityWaveformResult)) or, with
    /// `force = "em"`, the electromagnetic one ([`EmWaveformResult`](super::EmWaveformResult), frame A only).
    ///
    /// # Errors
    /// [`InputError`] naming the offending field and its allowed range: for example charges
    /// missing for em or given for gravity (`q1`, `q2`), `frame = "cm"` with em (`frame`),
    /// b/(GM/c²) outside [1e-6, 1e12] (`b`).
    pub fn evaluate(&self) -> Result<WaveformResult, InputError> {
        let c = self.validate()?;
        Ok(match self.force {
            WaveformForce::Gravity => WaveformResult::Gravity(Box::new(super::gravity::evaluate(self, &c)?)),
            WaveformForce::Em => WaveformResult::Em(Box::new(super::electromagnetic::evaluate(self, &c)?)),
        })
    }

    /// The validated gravitational system in units of M (m1 + m2 = 1), the observer direction
    /// (θ, φ) in radians and G M/c² in metres when the masses are physical: what a progressive
    /// sky computation ([`super::WaveformJob`]) needs, without evaluating the waveform.
    ///
    /// # Errors
    /// The request's own validation errors; `force` for an electromagnetic request.
    pub fn gravity_system(&self) -> Result<GravitySystem, InputError> {
        if self.force != WaveformForce::Gravity {
            return Err(InputError::Inconsistent {
                field: "force",
                reason: "the sky integrals here are for the gravitational waveform; the em result reports e_rad_flux directly".into(),
            });
        }
        let c = self.validate()?;
        let sys = Binary::new(c.two.kin.m1, c.two.kin.m2, c.gamma(), c.b_over_gm())?;
        Ok(GravitySystem { binary: sys, observer: (c.theta, c.phi), mass_length_m: c.mass_length_m() })
    }

    /// The two-body fields of the request (ν gives m1 ≥ m2: the heavier body comes in).
    pub fn two_body(&self) -> TwoBodyInput<'_> {
        TwoBodyInput {
            m1: self.m1.as_ref(),
            m2: self.m2.as_ref(),
            nu: self.nu,
            total_mass: self.total_mass.as_ref(),
            gamma: self.gamma,
            v: self.v.as_ref(),
            b: Some(&self.b),
            j: None,
            q1: self.q1.as_ref(),
            q2: self.q2.as_ref(),
        }
    }
}
