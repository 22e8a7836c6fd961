//! The waveform request and result (JSON keys are the stable CLI contract).
//!
//! Geometric outputs are in units of the total mass M = m1 + m2 with G = c = 1: `u` in units of
//! GM/c³, `h_plus`/`h_cross` are D·h/(GM/c²) (dimensionless; multiply by GM/c² and divide by D for
//! the strain), energies are E/(M c²). Physical (SI) values are in `physical` when the masses are
//! physical.
//!
//! With `force: "em"` the result is an [`EmWaveformResult`] instead (Gaussian units, c = 1, frame
//! A only): `e_theta`/`e_phi` are D·E in units of c²/√G (charges in units of √G M, the encounter
//! module's convention), energies are E/(M c²).

use super::energy::{radiated_closed_form, SkyIntegrator, SkyOptions};
use super::frames::{Binary, Frame};
use super::kernel::{constant_piece, DirectionWaveform, DEFAULT_X_NODES};
use super::memory::{memory_braginsky_thorne, zfl_angle_integrated_closed_form};
use super::observer::{antenna_pattern, PhysicalScales};
use super::quadrupole::quadrupole_hyperbola;
use super::spectrum::spectrum_angle_integrated;
use super::em::{self, EmSystem};
use crate::error::{finite, in_closed, InputError};
use crate::two_body::{ChargeUse, NuOrder, TwoBodyInput, TwoBodySystem};
use crate::units::{parse_length, AngleUnit, Length, Quantity};
use crate::validity::{Flag, Level};
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
    /// Symmetric mass ratio ν (0 < ν ≤ 1/4), instead of m1 and m2; then m1 ≥ m2 and M = total_mass.
    #[serde(default)]
    pub nu: Option<f64>,
    /// Total mass when `nu` is given (default 1, geometric).
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
}

/// Plus and cross components of one quantity.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct MemoryPair {
    pub plus: f64,
    pub cross: f64,
}

impl From<[f64; 2]> for MemoryPair {
    fn from(h: [f64; 2]) -> Self {
        MemoryPair { plus: h[0], cross: h[1] }
    }
}

/// Spectrum output.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SpectrumResult {
    /// Angular frequency ω, units of c³/(GM).
    pub omega: Vec<f64>,
    /// dE/(dω dΩ) at the observer direction (D² absorbed), units of M (E in Mc², ω in c³/GM).
    pub de_domega_dsolid: Vec<f64>,
    /// dE/dω over the sphere, if asked.
    pub de_domega: Option<Vec<f64>>,
    /// ω → 0 limit of dE/(dω dΩ) from the memory (Smarr 1977).
    pub zfl_direction: f64,
    /// ω → 0 limit of dE/dω, closed form (Di Vecchia et al. 2021, prefactor 2GQ²/π, sheet §3).
    pub zfl_closed: f64,
}

/// Detector-frame output.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct DetectorResult {
    pub f_plus: f64,
    pub f_cross: f64,
    /// F₊ h₊ + F× h×, geometric (D·h/(GM/c²)).
    pub h: Vec<f64>,
    /// The same at the detector (dimensionless strain), when `distance` and physical masses are given.
    pub strain: Option<Vec<f64>>,
}

/// Physical (SI) values.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct PhysicalResult {
    pub scales: PhysicalScales,
    /// Retarded time in seconds.
    pub u_s: Vec<f64>,
    /// Strain at the observer (needs `distance`).
    pub h_plus: Option<Vec<f64>>,
    pub h_cross: Option<Vec<f64>>,
    /// max over the samples of sqrt(h₊² + h×²) (needs `distance`).
    pub peak_strain: Option<f64>,
    pub memory_strain: Option<MemoryPair>,
    /// M c² in joules (M = m1 + m2): multiplies every geometric energy E/(M c²).
    pub mc2_j: f64,
    /// Radiated energy (closed form) in joules and in M☉c².
    pub e_rad_j: f64,
    pub e_rad_msun_c2: f64,
    /// Distance in metres, when given.
    pub distance_m: Option<f64>,
}

/// Result of a waveform request, serialised without a tag (an em result carries `"force": "em"`).
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(untagged)]
pub enum WaveformResult {
    Gravity(Box<GravityWaveformResult>),
    Em(Box<EmWaveformResult>),
}

impl WaveformResult {
    /// The gravitational result, if this is one.
    pub fn gravity(&self) -> Option<&GravityWaveformResult> {
        match self {
            WaveformResult::Gravity(g) => Some(g),
            WaveformResult::Em(_) => None,
        }
    }

    /// The electromagnetic result, if this is one.
    pub fn em(&self) -> Option<&EmWaveformResult> {
        match self {
            WaveformResult::Em(e) => Some(e),
            WaveformResult::Gravity(_) => None,
        }
    }
}

/// Gravitational waveform result (JSON keys are the CLI contract).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GravityWaveformResult {
    /// Retarded times, units of GM/c³.
    pub u: Vec<f64>,
    /// D·h₊/(GM/c²), O(G²) part.
    pub h_plus: Vec<f64>,
    /// D·h×/(GM/c²), O(G²) part.
    pub h_cross: Vec<f64>,
    /// max over the samples of sqrt(h₊² + h×²), D·h/(GM/c²) (O(G²) part).
    pub peak_abs_h: f64,
    /// Late-minus-early D·Δh/(GM/c²) from the waveform.
    pub memory: MemoryPair,
    /// The same from Braginsky & Thorne 1987 with the LO impulse (independent formula).
    pub memory_braginsky_thorne: MemoryPair,
    /// E_rad/(M c²) in the chosen frame from the flux integral (None if energy_flux = false).
    pub e_rad_flux: Option<f64>,
    /// E_rad/(M c²) in the chosen frame, closed form of Herrmann et al. 2021.
    pub e_rad_closed: f64,
    /// |e_rad_flux − e_rad_closed|/e_rad_closed.
    pub e_rad_rel_diff: Option<f64>,
    /// Radiated momentum P/(M c) from the flux integral and the closed form.
    pub p_rad_flux: Option<[f64; 3]>,
    pub p_rad_closed: [f64; 3],
    /// The u-independent O(G) piece D·h/(GM/c²) (not Lorentz-covariant; sheet §0).
    pub constant_piece: MemoryPair,
    pub frame: Frame,
    /// Relative Lorentz factor and speed used.
    pub gamma: f64,
    pub v: f64,
    /// m1/M, m2/M, b/(GM/c²).
    pub m1_over_m: f64,
    pub m2_over_m: f64,
    pub b_over_m: f64,
    pub flags: Vec<Flag>,
    pub sources: Vec<&'static str>,
    pub physical: Option<PhysicalResult>,
    pub spectrum: Option<SpectrumResult>,
    pub detector: Option<DetectorResult>,
    /// Quadrupole-formula waveform of the Newtonian hyperbola (same u), if asked.
    pub quadrupole: Option<QuadrupoleResult>,
}

/// The slow-motion comparison curve.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct QuadrupoleResult {
    pub h_plus: Vec<f64>,
    pub h_cross: Vec<f64>,
}

/// Components of an electromagnetic quantity along e_θ and e_φ.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ThetaPhi {
    pub theta: f64,
    pub phi: f64,
}

/// Electromagnetic spectrum output (closed-form Bessel spectrum, waveform sheet §2).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmSpectrumResult {
    /// Angular frequency ω, units of c³/(GM).
    pub omega: Vec<f64>,
    /// dE/(dω dΩ) at the observer direction (D² absorbed), E in M c², ω in c³/(GM).
    pub de_domega_dsolid: Vec<f64>,
    /// dE/dω over the sphere, if asked (interference included).
    pub de_domega: Option<Vec<f64>>,
    /// ω → 0 limit of dE/(dω dΩ), |D ΔA_⊥|²/(4π²) from the memory (classical soft-photon limit, sheet §3).
    pub zfl_direction: f64,
}

/// Physical (SI) values of an electromagnetic result, when the masses are physical.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmPhysicalResult {
    /// Total mass M in kg.
    pub total_mass_kg: f64,
    /// Retarded time in seconds.
    pub u_s: Vec<f64>,
    /// Radiated energies in joules (same meaning as the geometric keys).
    pub e_rad_flux_j: Option<f64>,
    pub e_rad_closed_j: f64,
    pub e_rad_body1_j: f64,
    pub e_rad_body2_j: f64,
}

/// Electromagnetic waveform result (`force: "em"`; JSON keys are the CLI contract). Frame A
/// (rest frame of body 2), Gaussian units with c = 1, geometric scaling G = 1 with masses in
/// units of M = m1 + m2 and charges in units of √G M.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmWaveformResult {
    /// Always "em".
    pub force: WaveformForce,
    /// Retarded times, units of GM/c³.
    pub u: Vec<f64>,
    /// D·E along e_θ, units of c²/√G (geometric: charge over length), O(q1 q2), interference included.
    pub e_theta: Vec<f64>,
    /// D·E along e_φ, same units.
    pub e_phi: Vec<f64>,
    /// ∫du D·E = −D ΔA_⊥ along (e_θ, e_φ), units of charge (√G M): the electromagnetic memory.
    pub memory: ThetaPhi,
    /// Total radiated energy E/(M c²) with interference: flux integral of D²|E|²/(4π) over u and
    /// the sphere (body parts in closed form plus the interference integral). None if energy_flux = false.
    pub e_rad_flux: Option<f64>,
    /// e_rad_body1 + e_rad_body2: the per-body closed forms, no interference.
    pub e_rad_closed: f64,
    /// Liénard closed form for body 1 alone, π q1⁴ q2² (1 + 3γ²)/(12 m1² v b³).
    pub e_rad_body1: f64,
    /// Larmor closed form for body 2 alone, π q1² q2⁴ (1 + 3γ²)/(12 γ m2² v b³).
    pub e_rad_body2: f64,
    /// Interference part 2∫du dΩ D² E1·E2/(4π) of e_rad_flux (None if energy_flux = false).
    pub interference: Option<f64>,
    /// Estimated relative error of e_rad_flux (None if energy_flux = false).
    pub e_rad_flux_rel_error: Option<f64>,
    /// Radiated momentum P/(M c) (x, y, z) with interference (None if energy_flux = false).
    pub p_rad_flux: Option<[f64; 3]>,
    pub frame: Frame,
    pub gamma: f64,
    pub v: f64,
    /// m1/M, m2/M, b/(GM/c²).
    pub m1_over_m: f64,
    pub m2_over_m: f64,
    pub b_over_m: f64,
    /// Charges q/(√G M) used.
    pub q1: f64,
    pub q2: f64,
    /// Transverse impulse on body 1, Δp/(M c) = 2 q1 q2/(v b) (along +y).
    pub impulse: f64,
    /// Units of the outputs, in words.
    pub units: &'static str,
    pub flags: Vec<Flag>,
    pub sources: Vec<&'static str>,
    pub spectrum: Option<EmSpectrumResult>,
    pub physical: Option<EmPhysicalResult>,
}

const EM_UNITS: &str = "Gaussian, c = 1; geometric scaling G = 1 with M = m1 + m2: u in GM/c³, b in GM/c², charges in √G M, e_theta/e_phi = D·E in c²/√G, energies in M c², momenta in M c, ω in c³/(GM); frame A (rest frame of body 2)";

const EM_SOURCES: [&str; 5] = [
    "e_theta, e_phi: Liénard–Wiechert radiation field (Jackson, Classical Electrodynamics, 3rd ed. 1999, §14.1) of the two straight lines with their first-order accelerations (waveform reference sheet §2); interference of the two bodies included",
    "e_rad_body1: Liénard closed form π q1⁴ q2² (1 + 3γ²)/(12 m1² v b³); e_rad_body2: Larmor closed form π q1² q2⁴ (1 + 3γ²)/(12 γ m2² v b³) (sheet §2, DERIVED; Jackson 1999 §14.2); e_rad_closed = e_rad_body1 + e_rad_body2 (no interference)",
    "e_rad_flux: flux integral of D²|E|²/(4π) over u and the sphere (sheet §2): closed-form body parts plus the interference integral (numerical quadrature)",
    "memory: ∫du D E = −D ΔA_⊥ with D A = Σ q v/(1 − n·v) and the LO impulse 2 q1 q2/(v b) (sheet §3); zfl_direction: classical soft-photon limit",
    "spectrum: closed-form Bessel K0/K1 spectrum (sheet §2; Fourier transform of the Coulomb profiles, Gradshteyn & Ryzhik 3.754.2, recalled)",
];

const SOURCES: [&str; 5] = [
    "LO waveform: derived from the Landau–Lifshitz relaxed Einstein equations in harmonic gauge (waveform reference sheet §1); equivalent to Kovacs & Thorne 1978, Jakobsen et al. 2021 (arXiv:2101.12688), Mougiakakos et al. 2021 (arXiv:2102.08339) by numerical checks",
    "Radiated energy-momentum closed form: Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255 (recalled formula, sheet §4)",
    "Memory: Braginsky & Thorne 1987, Nature 327, 123, with the LO impulse of Westpfahl 1985",
    "Zero-frequency limit: Smarr 1977, PRD 15, 2069; closed form of Di Vecchia, Heissenberg, Russo & Veneziano 2021, arXiv:2101.05772 (recalled; prefactor 2GQ²/π fixed numerically, sheet §3)",
    "Antenna pattern: Thorne 1987, 300 Years of Gravitation, ch. 9 (common practice)",
];

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

/// Inputs shared by the gravitational and the electromagnetic waveform, validated.
struct Common {
    /// The two-body system (masses in units of M = m1 + m2, γ, b/(GM/c²), charges, SI scale).
    two: TwoBodySystem,
    /// Observer direction, radians.
    theta: f64,
    phi: f64,
    /// Radians per unit of the input angles (`angle_unit`).
    rad_per_angle_unit: f64,
    /// Retarded times, units of GM/c³.
    u: Vec<f64>,
}

impl Common {
    fn gamma(&self) -> f64 {
        self.two.kin.speed.gamma
    }
    fn b_over_gm(&self) -> f64 {
        self.two.kin.b_over_gm
    }
    /// G M/c² in metres, when the masses are physical.
    fn mass_length_m(&self) -> Option<f64> {
        self.two.physical.map(|p| p.length_m)
    }
}

/// Accepted range of b/(GM/c²), M = m1 + m2 (numerical sanity; the LO formulas are homogeneous in b).
const B_MIN: f64 = crate::two_body::ORBIT_MIN;
const B_MAX: f64 = 1e12;

/// Impact parameter below which the gravitational LO waveform is flagged invalid: 3√3 GM/c², the
/// photon-capture impact parameter of a Schwarzschild mass (Misner, Thorne & Wheeler 1973, §25.6;
/// common textbook result). Every body with b below it is captured or strongly deflected.
const B_INVALID: f64 = 5.196_152_422_706_632;
/// Below this b/(GM/c²) the flag is a caution (common practice, no source): the O(G²) waveform
/// misses relative corrections of order GM/(c² b) or larger.
const B_CAUTION: f64 = 50.0;

impl WaveformRequest {
    /// Evaluates the request: the gravitational waveform ([`GravityWaveformResult`]) or, with
    /// `force = "em"`, the electromagnetic one ([`EmWaveformResult`], frame A only).
    ///
    /// # Errors
    /// [`InputError`] naming the offending field and its allowed range: for example charges
    /// missing for em or given for gravity (`q1`, `q2`), `frame = "cm"` with em (`frame`),
    /// b/(GM/c²) outside [1e-6, 1e12] (`b`).
    pub fn evaluate(&self) -> Result<WaveformResult, InputError> {
        match self.force {
            WaveformForce::Gravity => {
                let c = self.common()?;
                Ok(WaveformResult::Gravity(Box::new(self.evaluate_gravity(&c)?)))
            }
            WaveformForce::Em => {
                let c = self.common()?;
                Ok(WaveformResult::Em(Box::new(self.evaluate_em(&c)?)))
            }
        }
    }

    /// The validated gravitational system in units of M (m1 + m2 = 1), the observer direction
    /// (θ, φ) in radians and G M/c² in metres when the masses are physical: what a progressive
    /// sky computation ([`super::RadiationJob`]) needs, without evaluating the waveform.
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
        let c = self.common()?;
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

    fn common(&self) -> Result<Common, InputError> {
        let charges = match self.force {
            WaveformForce::Gravity => ChargeUse::Forbidden,
            WaveformForce::Em => ChargeUse::Required,
        };
        let b_range = || format!("{B_MIN:e} ≤ b ≤ {B_MAX:e} in units of GM/c² (M = m1 + m2) for the waveform");
        let two = self.two_body().validate(NuOrder::HeavierFirst, charges, None).map_err(|e| match e {
            InputError::OutOfRange { field: "b", value, .. } => InputError::OutOfRange { field: "b", value, allowed: b_range() },
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
        Ok(Common { two, theta, phi, rad_per_angle_unit, u })
    }

    fn evaluate_gravity(&self, c: &Common) -> Result<GravityWaveformResult, InputError> {
        let (l_tot, gamma, b_over_m, theta, phi, au) = (c.mass_length_m(), c.gamma(), c.b_over_gm(), c.theta, c.phi, c.rad_per_angle_unit);
        let u = c.u.clone();
        let n = u.len();
        let sys = Binary::new(c.two.kin.m1, c.two.kin.m2, gamma, b_over_m)?;
        let distance_m = match &self.distance {
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

        let w = DirectionWaveform::new(&sys, self.frame, theta, phi, DEFAULT_X_NODES)?;
        let mut h_plus = Vec::with_capacity(n);
        let mut h_cross = Vec::with_capacity(n);
        for &x in &u {
            let h = w.strain(x);
            h_plus.push(h[0]);
            h_cross.push(h[1]);
        }
        let memory: MemoryPair = w.memory().into();
        let memory_bt: MemoryPair = memory_braginsky_thorne(&sys, self.frame, theta, phi)?.into();
        let closed = radiated_closed_form(&sys, self.frame);
        let (e_flux, p_flux) = if self.energy_flux {
            let mut it = SkyIntegrator::new(&sys, self.frame, SkyOptions::for_gamma(gamma))?;
            let p = it.run();
            (Some(p.energy), Some(p.momentum))
        } else {
            (None, None)
        };
        let constant: MemoryPair = constant_piece(&sys, self.frame, theta, phi)?.into();

        // Flags.
        let mut flags = vec![b_flag(b_over_m)];
        let chi = 2.0 * (2.0 * gamma * gamma - 1.0) * sys.cm_energy_ratio() / (b_over_m * (gamma * gamma - 1.0));
        flags.push(Flag::small_parameter(
            "weak_deflection",
            chi,
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
            "f_char_rule",
            if v < 0.3 { Level::Ok } else { Level::Caution },
            Some(v),
            "f_char = v/(2πb) is a rule of thumb for v ≪ c (not fitted); forward-beamed radiation is Doppler-raised by about γ/(1 − v cos θ).",
        ));

        if self.energy_flux && gamma > 3.0 {
            flags.push(Flag::new(
                "flux_resolution",
                Level::Caution,
                Some(gamma),
                "Above γ = 3 the sky grid of the flux integral was not tuned to 1e-10 (tests reach 1e-10 for γ ≤ 2 and about 1e-8 at γ = 3); compare e_rad_flux with e_rad_closed.",
            ));
        }
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
                Some(PhysicalResult {
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

        let spectrum = match &self.spectrum {
            None => None,
            Some(o) => Some(spectrum_result(&sys, self.frame, &w, o)?),
        };
        let detector = match &self.detector {
            None => None,
            Some(d) => {
                let (fp, fx) = antenna_pattern(finite("detector.theta", d.theta)? * au, finite("detector.phi", d.phi)? * au, finite("detector.psi", d.psi)? * au);
                let h: Vec<f64> = h_plus.iter().zip(&h_cross).map(|(a, c)| fp * a + fx * c).collect();
                let strain = match (distance_m, l_tot) {
                    (Some(dm), Some(l)) => Some(h.iter().map(|x| x * l / dm).collect()),
                    _ => None,
                };
                Some(DetectorResult { f_plus: fp, f_cross: fx, h, strain })
            }
        };
        let quadrupole = if self.quadrupole {
            let q = quadrupole_hyperbola(&sys, self.frame, theta, phi, &u)?;
            Some(QuadrupoleResult { h_plus: q.plus, h_cross: q.cross })
        } else {
            None
        };
        let peak_abs_h = h_plus.iter().zip(&h_cross).map(|(a, c)| a.hypot(*c)).fold(0.0, f64::max);
        Ok(GravityWaveformResult {
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
            frame: self.frame,
            gamma,
            v,
            m1_over_m: sys.m1,
            m2_over_m: sys.m2,
            b_over_m,
            flags,
            sources: SOURCES.to_vec(),
            physical,
            spectrum,
            detector,
            quadrupole,
        })
    }

    fn evaluate_em(&self, c: &Common) -> Result<EmWaveformResult, InputError> {
        if self.frame != Frame::Rest2 {
            return Err(InputError::Inconsistent {
                field: "frame",
                reason: "only frame = \"rest2\" (rest frame of body 2) is available for force = \"em\"".into(),
            });
        }
        for (field, given) in [
            ("distance", self.distance.is_some()),
            ("detector", self.detector.is_some()),
            ("quadrupole", self.quadrupole),
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
        let energies = if self.energy_flux { Some(em::energies(&sys)) } else { None };
        let spectrum = match &self.spectrum {
            None => None,
            Some(o) => {
                let omega = omega_grid(o)?;
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
        let mut flags = sys.flags();
        // Gravity between the bodies is left out of this force law: compare the couplings.
        let g_over_q = m1 * m2 / (q1 * q2).abs();
        flags.push(Flag::small_parameter(
            "gravity_neglected",
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
            "units",
            Level::Ok,
            None,
            "Gaussian units with c = 1 (Coulomb force q1 q2/r²); SI charges were converted with q1 q2 → q1 q2/(4π ε0).",
        ));
        if let Some(e) = &energies {
            if e.rel_error_estimate > 1e-8 {
                flags.push(Flag::new(
                    "flux_resolution",
                    Level::Caution,
                    Some(e.rel_error_estimate),
                    "The estimated relative error of e_rad_flux exceeds 1e-8; compare with e_rad_closed.",
                ));
            }
        }
        let physical = c.mass_length_m().map(|l| {
            let cc = crate::units::codata2018::C;
            let mc2 = mc2_joules(l);
            EmPhysicalResult {
                total_mass_kg: l * cc * cc / crate::units::codata2018::G,
                u_s: c.u.iter().map(|x| x * l / cc).collect(),
                e_rad_flux_j: energies.as_ref().map(|e| e.total_flux * mc2),
                e_rad_closed_j: (e1 + e2) * mc2,
                e_rad_body1_j: e1 * mc2,
                e_rad_body2_j: e2 * mc2,
            }
        });
        Ok(EmWaveformResult {
            force: WaveformForce::Em,
            u: c.u.clone(),
            e_theta: f.e_theta,
            e_phi: f.e_phi,
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
            b_over_m: c.b_over_gm(),
            q1,
            q2,
            impulse: sys.impulse(),
            units: EM_UNITS,
            flags,
            sources: EM_SOURCES.to_vec(),
            spectrum,
            physical,
        })
    }
}

/// M c² in joules from G M/c² in metres: (GM/c²) c⁴/G (CODATA 2018 G and c).
pub(crate) fn mc2_joules(mass_length_m: f64) -> f64 {
    mass_length_m * crate::units::codata2018::C.powi(4) / crate::units::codata2018::G
}

/// The validity flag on b for the gravitational LO waveform (thresholds at [`B_INVALID`], [`B_CAUTION`]).
fn b_flag(b_over_m: f64) -> Flag {
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
    Flag::new("b_weak_field", level, Some(b_over_m), msg)
}

impl SpectrumOptions {
    /// The log-spaced ω grid (`points` values from `omega_min` to `omega_max`, both included).
    ///
    /// # Errors
    /// [`InputError`] naming `spectrum.omega_min`, `spectrum.omega_max` or `spectrum.points`.
    pub fn omegas(&self) -> Result<Vec<f64>, InputError> {
        omega_grid(self)
    }
}

/// Log-spaced ω grid of the spectrum options, validated.
fn omega_grid(o: &SpectrumOptions) -> Result<Vec<f64>, InputError> {
    crate::error::positive("spectrum.omega_min", o.omega_min)?;
    crate::error::positive("spectrum.omega_max", o.omega_max)?;
    if o.omega_max <= o.omega_min {
        return Err(InputError::OutOfRange {
            field: "spectrum.omega_max",
            value: o.omega_max,
            allowed: "omega_max > omega_min".into(),
        });
    }
    if !(2..=2000).contains(&o.points) {
        return Err(InputError::OutOfRange {
            field: "spectrum.points",
            value: o.points as f64,
            allowed: "2 ≤ points ≤ 2000".into(),
        });
    }
    let r = (o.omega_max / o.omega_min).ln();
    Ok((0..o.points).map(|i| o.omega_min * (r * i as f64 / (o.points - 1) as f64).exp()).collect())
}

/// Sky rule of the angle-integrated spectrum dE/dω (a plot quantity: coarser than the energy
/// balance's rule; tested against the memory ZFL closed form at ω → 0 in tests/waveform.rs).
pub const SPECTRUM_SKY: SkyOptions = SkyOptions { n_polar: 12, n_azimuth: 16, n_u: 24, n_x: 24 };

fn spectrum_result(sys: &Binary, frame: Frame, w: &DirectionWaveform, o: &SpectrumOptions) -> Result<SpectrumResult, InputError> {
    let omega = omega_grid(o)?;
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
