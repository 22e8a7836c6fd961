//! chiwave-core: the physics of gravitational and electromagnetic scattering, in plain Rust.
//!
//! Modules, one per observable family:
//! - [`units`]: constants (CODATA 2018, IAU 2015 nominal, IAU 2012 au) and unit parsing.
//! - [`deflection`]: light (massless) deflection by Schwarzschild, Kerr (equatorial) and
//!   Reissner–Nordström lenses; weak-field series; strong-deflection limit; PPN.
//! - [`lensing`]: point-mass lens images, magnifications, time delay; wave-optics amplification.
//! - [`two_body`]: the two-body input model (masses or ν, γ or v, b or j, charges, physical
//!   scale), read and validated once for every two-body request.
//! - [`encounter`]: two-body scattering angle, impulse, radiated energy and angular momentum.
//! - [`waveform`]: leading-order gravitational and electromagnetic waveforms, memory, spectra.
//! - [`detection`]: detector noise curves, signal-to-noise ratio, horizon distance.
//! - [`validity`]: regime flags attached to every result; error estimates, the tolerance and the
//!   one rule that turns an estimate into a verdict (`ok`, `caution`, `outside`); the recommended value.
//! - [`request`]: the serde request types that the page and the CLI both send.
//! - [`references`]: every publication the tool uses, with its BibTeX (the source of `sources`
//!   and `citations` in every result).
//!
//! Shared tools: [`numeric`] (Gauss–Legendre rules, quadrature, polynomial roots, tolerances),
//! [`bessel`] (modified Bessel functions K0, K1 for the spectra), [`error`] (the input error).
//! The layout of the crates and where to add an observable: `docs/architecture.md`.
//!
//! Conventions: G = c = 1 inside the physics, lengths in units of a mass stated per module;
//! electromagnetism in Gaussian units. Errors are values ([`error::InputError`]), never panics.
#![forbid(unsafe_code)]

pub mod bessel;
pub mod deflection;
pub mod detection;
pub mod encounter;
pub mod error;
pub mod lensing;
pub mod numeric;
pub mod references;
pub mod request;
pub mod two_body;
pub mod units;
pub mod validity;
pub mod waveform;

pub use error::InputError;
