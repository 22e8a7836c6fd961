//! The waveform results (JSON keys are the stable CLI contract; fields serialise in the order
//! written here).
//!
//! Geometric outputs are in units of the total mass M = m1 + m2 with G = c = 1: `u` in units of
//! GM/c³, `h_plus`/`h_cross` are D·h/(GM/c²) (dimensionless; multiply by GM/c² and divide by D for
//! the strain), energies are E/(M c²). Physical (SI) values are in `physical` when the masses are
//! physical.
//!
//! With `force: "em"` the result is an [`EmWaveformResult`] instead (Gaussian units, c = 1, frame
//! A only): `e_theta`/`e_phi` are D·E in units of c²/√G (charges in units of √G M, the encounter
//! module's convention), energies are E/(M c²).

use super::frames::Frame;
use super::observer::PhysicalScales;
use super::request::WaveformForce;
use crate::validity::{Best, Estimates, Flag};
use serde::Serialize;
use crate::references::{CitationMap, SourceMap};

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
    /// ω → 0 limit of dE/dω, closed form (Di Vecchia et al. 2021, prefactor 2GQ²/π fixed by the
    /// numerical zero-frequency limit).
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

/// Physical (SI) values of a gravitational result, when the masses are physical (JSON key
/// `physical`).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GravityWaveformPhysical {
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
    /// The recommended strain value: the peak `peak_abs_h` with its error estimate.
    pub best: Best,
    /// The recommended radiated energy: `e_rad_closed` with its error estimate.
    pub best_e_rad: Best,
    /// The relative tolerance the verdicts were judged against.
    pub tolerance: f64,
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
    /// The u-independent O(G) piece D·h/(GM/c²): the field of the incoming free masses, not
    /// covariant under the polarisation map, so it is kept apart from the strain.
    pub constant_piece: MemoryPair,
    pub frame: Frame,
    /// Relative Lorentz factor and speed used.
    pub gamma: f64,
    pub v: f64,
    /// m1/M, m2/M.
    pub m1_over_m: f64,
    pub m2_over_m: f64,
    /// b/(GM/c²).
    pub b_over_gm: f64,
    /// The former key of `b_over_gm` (same value), kept for one release.
    #[serde(rename = "b_over_m")]
    pub b_over_m_alias: f64,
    pub flags: Vec<Flag>,
    /// What a source covers → its citation (keys listed in `sources.rs`).
    pub sources: SourceMap,
    /// The same keys → registry ids with their place ([`crate::references`]).
    pub citations: CitationMap,
    pub physical: Option<GravityWaveformPhysical>,
    pub spectrum: Option<SpectrumResult>,
    pub detector: Option<DetectorResult>,
    /// Quadrupole-formula waveform of the Newtonian hyperbola (same u), if asked.
    pub quadrupole: Option<QuadrupoleResult>,
    /// Error estimates of `peak_abs_h`, `e_rad_closed`, `e_rad_flux` and `quadrupole` (when
    /// present), keyed by their JSON key.
    pub estimates: Estimates,
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

/// Electromagnetic spectrum output (closed-form Bessel spectrum, [`super::em::spectrum`]).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmSpectrumResult {
    /// Angular frequency ω, units of c³/(GM).
    pub omega: Vec<f64>,
    /// dE/(dω dΩ) at the observer direction (D² absorbed), E in M c², ω in c³/(GM).
    pub de_domega_dsolid: Vec<f64>,
    /// dE/dω over the sphere, if asked (interference included).
    pub de_domega: Option<Vec<f64>>,
    /// ω → 0 limit of dE/(dω dΩ), |D ΔA_⊥|²/(4π²) from the memory (classical soft-photon limit).
    pub zfl_direction: f64,
}

/// Physical (SI) values of an electromagnetic result, when the masses are physical (JSON key
/// `physical`).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmWaveformPhysical {
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
    /// The recommended field value: the peak `peak_abs_e` with its error estimate.
    pub best: Best,
    /// The recommended radiated energy: `e_rad_flux` (with interference) when computed, else
    /// `e_rad_closed`, with its error estimate.
    pub best_e_rad: Best,
    /// The relative tolerance the verdicts were judged against.
    pub tolerance: f64,
    /// Retarded times, units of GM/c³.
    pub u: Vec<f64>,
    /// D·E along e_θ, units of c²/√G (geometric: charge over length), O(q1 q2), interference included.
    pub e_theta: Vec<f64>,
    /// D·E along e_φ, same units.
    pub e_phi: Vec<f64>,
    /// max over the samples of √(E_θ² + E_φ²), D·E in c²/√G.
    pub peak_abs_e: f64,
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
    /// m1/M, m2/M.
    pub m1_over_m: f64,
    pub m2_over_m: f64,
    /// b/(GM/c²).
    pub b_over_gm: f64,
    /// The former key of `b_over_gm` (same value), kept for one release.
    #[serde(rename = "b_over_m")]
    pub b_over_m_alias: f64,
    /// Charges q/(√G M) used.
    pub q1: f64,
    pub q2: f64,
    /// Transverse impulse on body 1, Δp/(M c) = 2 q1 q2/(v b) (along +y).
    pub impulse: f64,
    /// Units of the outputs, in words.
    pub units: &'static str,
    pub flags: Vec<Flag>,
    /// What a source covers → its citation (keys listed in `sources.rs`).
    pub sources: SourceMap,
    /// The same keys → registry ids with their place ([`crate::references`]).
    pub citations: CitationMap,
    pub spectrum: Option<EmSpectrumResult>,
    pub physical: Option<EmWaveformPhysical>,
    /// Error estimates of `peak_abs_e`, `e_rad_flux`, `e_rad_closed`, keyed by their JSON key.
    pub estimates: Estimates,
}

/// The `units` text of an electromagnetic result.
pub(crate) const EM_UNITS: &str = "Gaussian, c = 1; geometric scaling G = 1 with M = m1 + m2: u in GM/c³, b in GM/c², charges in √G M, e_theta/e_phi = D·E in c²/√G, energies in M c², momenta in M c, ω in c³/(GM); frame A (rest frame of body 2)";
