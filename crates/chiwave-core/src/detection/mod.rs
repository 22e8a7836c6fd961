//! Detection: detector noise curves, the signal-to-noise ratio of an encounter's burst, its
//! optimal and sky-averaged values and the horizon distance.
//!
//! # What is computed
//! * [`noise`]: published analytic sensitivity fits — Advanced LIGO (Ajith 2011,
//!   arXiv:1107.1267) and LISA (Robson, Cornish & Liu 2019, arXiv:1803.01944, with or without the
//!   galactic confusion noise) — and any detector from a CSV table of its amplitude spectral
//!   density ([`NoiseCurve`]).
//! * [`Burst`]: the strain spectrum h̃₊(f), h̃×(f) of the leading-order encounter waveform at a
//!   detector in physical units (closed-form Bessel transform of the core's waveform).
//! * [`snr()`]: ρ² = 4∫|h̃|²/S_n df for a given antenna pattern, the optimal orientation and the
//!   sky average, the horizon distance, where the signal's SNR comes from in frequency
//!   (f_peak, the low-frequency share) and regime flags ([`SnrResult`]).
//!
//! # Conventions
//! Frequencies in Hz, one-sided PSDs in Hz⁻¹, distances in metres. Fourier sign
//! h̃(f) = ∫ h(t) e^{+2πift} dt (ρ does not depend on it). Sky averages are root-mean-square
//! over isotropic directions and uniform polarisation angle. The full statement of the
//! conventions, the memory's low-frequency split and how a sky-averaged curve is combined is in
//! `docs/physics/detection.md`. The core reads no files: the CLI and the page read a noise file
//! and pass its text to [`NoiseCurve::from_csv`].

pub mod noise;
mod burst;
mod quadrature;
mod snr;

pub use burst::{Burst, SNR_X_NODES};
pub use noise::{LisaObservation, NoiseCurve, NoisePoint, NoiseTable, NoiseValidity, Response, NOISE_NAMES};
pub use snr::{snr, HorizonBasis, SnrOptions, SnrResult, DEFAULT_SNR_THRESHOLD, DEFAULT_SNR_TOLERANCE, HUBBLE_CONSTANT_SI, REDSHIFT_CAUTION};

use crate::error::InputError;
use crate::waveform::{Binary, Frame};

/// ρ of an encounter in one call: [`Burst::new`] with [`SNR_X_NODES`], then [`snr()`].
///
/// `sys` in any mass unit (rescaled to m1 + m2 = 1), observer direction (θ, φ) in radians in
/// `frame`, `mass_length_m` = G(m1 + m2)/c² and `distance_m` in metres.
///
/// # Errors
/// As [`Burst::new`] and [`snr()`].
///
/// # Examples
/// ```
/// use chiwave_core::detection::{burst_snr, NoiseCurve, SnrOptions};
/// use chiwave_core::waveform::{Binary, Frame};
/// use chiwave_core::units::{astro::MPC, SUN_LENGTH_M};
/// // 10 + 10 M☉ at v = 0.01 c and b = 200 GM/c² (masses and b in one unit, here M), at 1 Mpc.
/// let sys = Binary::from_speed(0.5, 0.5, 0.01, 200.0).unwrap();
/// let lisa = NoiseCurve::from_name("lisa").unwrap();
/// let r = burst_snr(&sys, Frame::Cm, 0.3, 0.0, 20.0 * SUN_LENGTH_M, MPC, &lisa, &SnrOptions::default()).unwrap();
/// assert!(r.snr.is_none() && r.snr_sky_averaged >= 0.0);
/// ```
#[allow(clippy::too_many_arguments)]
pub fn burst_snr(
    sys: &Binary,
    frame: Frame,
    theta: f64,
    phi: f64,
    mass_length_m: f64,
    distance_m: f64,
    noise: &NoiseCurve,
    opts: &SnrOptions,
) -> Result<SnrResult, InputError> {
    let burst = Burst::new(sys, frame, theta, phi, mass_length_m, distance_m, SNR_X_NODES)?;
    snr(&burst, noise, opts)
}
