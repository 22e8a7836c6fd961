//! The grids the core chooses: the log-spaced ω grid of a spectrum request, the sky rule of the
//! angle-integrated spectrum, and the grids of the page's and the CLI's figures (sky-map cells,
//! the spectrum's ω range). The plot crate and the wasm layer take them from here.

use super::energy::SkyOptions;
use super::frames::Binary;
use super::request::SpectrumOptions;
use crate::error::InputError;

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

/// Sky-map grid of the figures (cell centres): 24 × 48 cells of 7.5°.
pub const SKY_N_THETA: usize = 24;
/// See [`SKY_N_THETA`].
pub const SKY_N_PHI: usize = 48;
/// Points of the figures' spectrum (log-spaced).
pub const SPECTRUM_POINTS: usize = 96;

/// The figures' ω range for a system: from 1/100 of v/b (the flat zero-frequency end) to
/// 20 γ² v/b, past the Doppler-raised exponential fall-off (rule of thumb ω ~ v/b for v ≪ c,
/// with the forward Doppler factor ~γ/(1 − v cos θ); a plot range, not a result).
pub fn spectrum_range(sys: &Binary) -> (f64, f64) {
    omega_range(sys.v(), sys.b, sys.gamma)
}

/// [`spectrum_range`] from the relative speed v, b/(GM/c²) and γ.
pub fn omega_range(v: f64, b: f64, gamma: f64) -> (f64, f64) {
    let w = v / b;
    (1e-2 * w, 20.0 * gamma * gamma * w)
}

/// The figures' spectrum options over [`omega_range`] ([`SPECTRUM_POINTS`] log-spaced values).
pub fn figure_spectrum(v: f64, b: f64, gamma: f64, angle_integrated: bool) -> SpectrumOptions {
    let (omega_min, omega_max) = omega_range(v, b, gamma);
    SpectrumOptions { omega_min, omega_max, points: SPECTRUM_POINTS, angle_integrated }
}

/// The figures' ω grid for a system ([`SPECTRUM_POINTS`] log-spaced values over
/// [`spectrum_range`]).
///
/// # Errors
/// Never for a valid system (the range is positive and ordered).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{grids, Binary};
/// let w = grids::spectrum_omegas(&Binary::new(0.5, 0.5, 1.25, 50.0).unwrap()).unwrap();
/// assert_eq!(w.len(), grids::SPECTRUM_POINTS);
/// assert!((w[0] - 0.01 * 0.6 / 50.0).abs() < 1e-18); // v/b/100 with v = 0.6
/// ```
pub fn spectrum_omegas(sys: &Binary) -> Result<Vec<f64>, InputError> {
    figure_spectrum(sys.v(), sys.b, sys.gamma, false).omegas()
}
