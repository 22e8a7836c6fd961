//! Leading-order gravitational waveforms of a scattering encounter: strain, memory, spectrum,
//! radiated energy-momentum, the slow-motion (quadrupole) comparison and observer scales.
//!
//! # What is computed
//! The O(G²) strain `D·h₊(u)`, `D·h×(u)` of two point masses on (initially) straight lines, at
//! leading post-Minkowskian order, for any masses, relative Lorentz factor γ, impact parameter b
//! and observer direction. The strain is the sum of a worldline part (closed form) and a
//! field-stress part reduced to a smooth one-dimensional Feynman-parameter integral evaluated by
//! Gauss–Legendre quadrature.
//!
//! # Sources
//! * Waveform construction: our derivation (`kernel.rs`, [`waveform()`]) from the relaxed
//!   Einstein equations in harmonic gauge with the Landau–Lifshitz pseudotensor (Landau &
//!   Lifshitz, *Classical Theory of Fields*, §96; Poisson & Will, *Gravity* (2014), ch. 6). It is
//!   equivalent to Kovacs & Thorne 1978 (ApJ 224, 62), Jakobsen, Mogull, Plefka & Steinhoff 2021
//!   (arXiv:2101.12688) and Mougiakakos, Riva & Vernizzi 2021 (arXiv:2102.08339) by numerical
//!   checks (energy balance, Lorentz covariance, memory, quadrupole limit; `tests/waveform.rs`),
//!   not compared term by term.
//! * Radiated energy-momentum: Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255
//!   (recalled formula), reproduced by the flux integral of this waveform.
//! * Memory: Braginsky & Thorne 1987, Nature 327, 123.
//! * Zero-frequency limit: Smarr 1977, PRD 15, 2069; closed form of Di Vecchia, Heissenberg, Russo
//!   & Veneziano 2021, arXiv:2101.05772 (recalled; the prefactor 2GQ²/π fixed by the numerical
//!   zero-frequency limit of this waveform).
//!
//! # Files
//! The request (`request.rs`, validated in `validate.rs` through [`crate::two_body`]), the
//! results (`results.rs`), regime checks (`flags.rs`), sources (`sources.rs`), the two
//! evaluations (`gravity.rs`, `electromagnetic.rs`), the grids the core chooses ([`grids`]), the
//! physics (`kernel.rs` strain, `memory.rs`, `spectrum.rs`, `energy.rs` sky integrals,
//! `quadrupole.rs`, `observer.rs` SI scales and antenna pattern, `frames.rs`), the progressive
//! sky work ([`WaveformJob`]) and the electromagnetic family ([`em`]).
//!
//! # Conventions
//! * G = c = 1; every geometric quantity is in units of the total mass M = m1 + m2 unless a
//!   function says otherwise (masses are passed as numbers in any common unit; the functions are
//!   homogeneous, so passing m1 + m2 = 1 makes the output "in units of M").
//! * Frame A (`Frame::Rest2`): body 2 initially at rest at the origin, body 1 incoming along +x with
//!   speed v, impact parameter b along +y, z normal to the orbital plane. The undeflected paths are
//!   closest at t = 0; u = t − D.
//! * CM frame (`Frame::Cm`): same axes, boosted along x with V = m1 γ v/(m1 γ + m2); origin on the
//!   straight centre-of-energy worldline at t = 0.
//! * Observer direction n = (sin θ cos φ, sin θ sin φ, cos θ); polarisation basis
//!   e_θ = (cos θ cos φ, cos θ sin φ, −sin θ), e_φ = (−sin φ, cos φ, 0);
//!   h₊ = ½(e_θe_θ − e_φe_φ):h, h× = ½(e_θe_φ + e_φe_θ):h.
//! * The u-independent O(G) field of the incoming bodies is reported separately
//!   ([`constant_piece`]); it is not Lorentz-covariant under the polarisation map.
//! * Flux: dE/(du dΩ) = D²(ḣ₊² + ḣ×²)/(16π).
//! * The LO strain is homogeneous in the couplings (D·h ∝ m1 m2/b in units of M), so any b > 0
//!   is computed; requests flag b below a few GM/c² as outside the weak-deflection regime.
//!
//! The electromagnetic analogue (two charges, Gaussian units, frame A) is in [`em`]; a request with
//! `force: "em"` returns an [`EmWaveformResult`].

pub mod accuracy;
pub mod em;
mod electromagnetic;
mod energy;
mod flags;
mod frames;
mod gravity;
pub mod grids;
mod kernel;
mod memory;
mod observer;
mod job;
mod quadrupole;
mod request;
mod results;
mod sources;
mod spectrum;
mod validate;

pub use energy::{
    radiated_closed_form, sky_map, sky_map_row, RadiatedClosed, SkyIntegrator, SkyMap, SkyOptions, SkyProgress,
    SkyQuantity,
};
pub use frames::{Binary, Frame};
pub use grids::SPECTRUM_SKY;
pub use kernel::{constant_piece, waveform, DirectionWaveform, Strain, DEFAULT_X_NODES};
pub use memory::{memory_braginsky_thorne, zfl_angle_integrated_closed_form};
pub use observer::{antenna_pattern, characteristic_frequency, spectrum_si, strain_unit, PhysicalScales, SpectrumSi};
pub use job::{WaveformJob, WaveformPhase, WaveformSnapshot, SpectrumCurves};
pub use quadrupole::{quadrupole_energy_hyperbola, quadrupole_hyperbola};
pub use request::{DetectorOptions, GravitySystem, SpectrumOptions, TimeUnit, WaveformForce, WaveformRequest};
pub use results::{
    DetectorResult, EmSpectrumResult, EmWaveformPhysical, EmWaveformResult, GravityWaveformPhysical, GravityWaveformResult,
    MemoryPair, QuadrupoleResult, SpectrumResult, ThetaPhi, WaveformResult,
};
pub use spectrum::{spectrum_angle_integrated, zfl_from_memory, SkySpectrum};
