//! Electromagnetic radiation of two scattering charges at leading order O(q1 q2): the
//! time-domain field at the observer, its closed-form spectrum (Bessel K0, K1), the memory
//! (zero-frequency limit) and the radiated energy and momentum.
//!
//! # Sources
//! - Liénard–Wiechert radiation field, Liénard and Larmor powers: J. D. Jackson, *Classical
//!   Electrodynamics*, 3rd ed. (1999), §14.1–14.2 (equation numbers not given).
//! - The first-order accelerations (body 1 in the static Coulomb field of body 2, body 2 in the
//!   boosted Coulomb field of body 1, Jackson 1999 §11.10), the Bessel-function spectrum, the
//!   per-body closed-form energies and the memory relation ∫du D E = −D ΔA_⊥: derived for this
//!   module from those textbook fields and checked in `tests/em_waveform.rs` against
//!   independent quadratures.
//! - Fourier transforms of the Coulomb profiles: ∫ cos(W t)/√(v²t² + b²) dt over ℝ equals
//!   (2/v) K0(W b/v) (Gradshteyn & Ryzhik 3.754.2, recalled from memory; checked numerically in
//!   the tests through the spectrum-vs-Fourier-transform comparison).
//!
//! # Conventions
//! Gaussian units, c = 1 (Coulomb force q1 q2/r², Larmor power (2/3) q² a²). Frame A is the
//! rest frame of body 2: body 2 (m2, q2) sits at the origin, body 1 (m1, q1) moves along +x
//! with speed v (γ = 1/√(1 − v²)) on the line y = b, z = 0, with closest approach at t = 0 (the
//! frame A of the gravitational waveform, [`crate::waveform`]). The observer is at distance D in the direction
//! n = (sin θ cos φ, sin θ sin φ, cos θ) (polar axis +z, the normal to the orbital plane), and
//! u = t − D. Components are along e_θ = (cos θ cos φ, cos θ sin φ, −sin θ) and
//! e_φ = (−sin φ, cos φ, 0). All outputs absorb the distance: `field` returns D·E, `spectrum`
//! returns dE/(dω dΩ) (energy per unit frequency and solid angle, the D² of the flux absorbed),
//! `memory` returns −D ΔA_⊥. Masses, charges and b are in any consistent geometric Gaussian units (for
//! example b = 1 and charges and masses in units of b).
//!
//! # Order and validity
//! The field is the O(q1 q2) radiation field of the two straight-line trajectories with
//! their first-order accelerations (body 1 in the static Coulomb field of body 2; body 2, at
//! rest, in the boosted Coulomb field of body 1). The interference of the two bodies' fields
//! is included in every output except the per-body closed forms. It holds when both the
//! deflection of body 1 and the recoil of body 2 are small; [`EmSystem::flags`] grades that.
//! Radiation reaction is neglected (it is higher order).

//!
//! # Files (mirroring the gravitational side)
//! `system.rs` ([`EmSystem`], directions and accelerations), `field.rs` (the time-domain field,
//! as `kernel.rs` for gravity), `memory.rs`, `spectrum.rs` (direction and angle-integrated
//! spectra), `energy.rs` (radiated energy-momentum with interference, sky map of dE/dΩ).

mod energy;
mod field;
mod memory;
mod spectrum;
mod system;

pub use energy::{energies, energies_with, sky_energy, EmEnergies, SkyEnergy, SKY_MAX};
pub use field::{field, field_parts, EmField};
pub use memory::memory;
pub use spectrum::{spectrum, spectrum_integrated, spectrum_integrated_with};
pub use system::{EmSystem, GAMMA_MAX};
