//! The strain spectrum h̃₊(f), h̃×(f) of an encounter's burst at a detector, in physical units.
//!
//! # Formula
//! The core's leading-order waveform gives the closed-form transform of the strain rate,
//! Ḣ̃(ω) = ∫ du e^{iωu} Ḣ(u), per polarisation and direction (Bessel K0, K1 of ω times the
//! worldline and field-stress time scales; see [`crate::waveform`]). In a frame moving relative to
//! frame A (the CM frame), the waveform maps as D h'(u') = δ R(2ψ) D h_A(δ(u' − s)), so
//! Ḣ̃'(ω) = δ R(2ψ) e^{iωs} Ḣ̃_A(ω/δ) (a change of variables). The strain follows from
//! H̃ = Ḣ̃/(−iω) for ω > 0, which carries the memory's 1/ω growth at low frequency. In physical
//! units, with L = GM/c², T = GM/c³ and the distance D,
//! h(t) = (L/D) H(t/T), so h̃(f) = (L/D) T H̃(2πfT).
//!
//! # Conventions
//! Fourier sign: h̃(f) = ∫ h(t) e^{+2πift} dt, the sign of the core's spectra. The usual
//! data-analysis sign e^{−2πift} gives the complex conjugate; every quantity used for the SNR
//! (|h̃₊|², |h̃×|², Re h̃₊h̃×*) is the same in both. The common phase e^{iωs} is dropped for the
//! same reason. See `docs/physics/detection.md`.

// `!(f > 0.0)` is deliberate: unlike `f <= 0.0` it also catches NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use crate::error::{positive, InputError};
use crate::units::codata2018::C;
use crate::waveform::{Binary, DirectionWaveform, Frame};
use num_complex::Complex64;

/// Gauss–Legendre nodes in the Feynman parameter used for detection spectra: ρ² needs a few
/// significant digits, not the 1e-12 of [`crate::waveform::DEFAULT_X_NODES`] (the difference
/// is checked in `tests/detection_snr.rs`).
pub const SNR_X_NODES: usize = 24;

/// Above ω·τ_min = this value every term of the transform is below e^{−50} of its scale, so the
/// power is below e^{−100}: the quadrature stops there.
const CUTOFF_EXPONENT: f64 = 50.0;

/// The burst seen by an observer at distance D in one direction of one frame.
#[derive(Debug, Clone)]
pub struct Burst {
    wave: DirectionWaveform,
    /// GM/c³ in seconds.
    time_unit_s: f64,
    /// (GM/c²)/D × GM/c³: h̃ [1/Hz] per unit of the geometric H̃.
    amplitude: f64,
    /// Angular frequency (geometric) above which the transform is negligible.
    omega_cut: f64,
    /// Angular frequency (geometric) of the burst's corner: 1/τ of the worldline time scale.
    omega_split: f64,
    distance_m: f64,
}

impl Burst {
    /// Prepares the burst of `sys` seen in `frame` at direction (θ, φ) of that frame (radians),
    /// for a total mass of length `mass_length_m` = G(m1 + m2)/c² and a distance `distance_m`.
    ///
    /// `sys` may use any mass unit: it is rescaled to m1 + m2 = 1 (b in units of M).
    ///
    /// # Domain
    /// 0 ≤ θ ≤ π, |φ| ≤ 1000; GM/c² > 0 and D > 0 finite (metres); `x_nodes` ≥ 4
    /// ([`SNR_X_NODES`] is enough for ρ).
    ///
    /// # Errors
    /// [`InputError`] naming `theta`, `phi`, `mass_length_m` or `distance`.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::detection::{Burst, SNR_X_NODES};
    /// use chiwave_core::waveform::{Binary, Frame};
    /// use chiwave_core::units::{astro::MPC, SUN_LENGTH_M};
    /// let sys = Binary::from_speed(0.5, 0.5, 0.01, 20.0).unwrap();
    /// let burst = Burst::new(&sys, Frame::Cm, 1.0, 0.3, 20.0 * SUN_LENGTH_M, MPC, SNR_X_NODES).unwrap();
    /// // Below the corner frequency the strain is the memory's tail: |h̃| f is nearly constant.
    /// let f = 1e-3 * burst.split_frequency_hz();
    /// let p1 = burst.power(f);
    /// let p2 = burst.power(0.5 * f);
    /// assert!(((p1[0] + p1[1]) / (p2[0] + p2[1]) - 0.25).abs() < 1e-3);
    /// ```
    pub fn new(sys: &Binary, frame: Frame, theta: f64, phi: f64, mass_length_m: f64, distance_m: f64, x_nodes: usize) -> Result<Self, InputError> {
        positive("mass_length_m", mass_length_m)?;
        positive("distance", distance_m)?;
        let m = sys.total_mass();
        let unit = Binary::new(sys.m1 / m, sys.m2 / m, sys.gamma, sys.b / m)?;
        let wave = DirectionWaveform::new(&unit, frame, theta, phi, x_nodes.max(4))?;
        let delta = wave.map.delta;
        let k = &wave.kernel;
        // Time scales of the transform in frame A: the worldline's b(1 − n_x v)/v and each
        // field-stress slice's half-width d (the exponents of K0, K1 in `rate_transform`).
        let tau_wl = k.b * k.one_m_nxv / k.v;
        let tau_min = k
            .nodes
            .iter()
            .filter_map(|nd| {
                let c = -nd.s1 / (2.0 * nd.s2);
                let d2 = nd.s0 / nd.s2 - c * c;
                (d2 > 0.0).then(|| d2.sqrt())
            })
            .fold(tau_wl, f64::min);
        let time_unit_s = mass_length_m / C;
        Ok(Burst {
            wave,
            time_unit_s,
            amplitude: mass_length_m / distance_m * time_unit_s,
            omega_cut: CUTOFF_EXPONENT * delta / tau_min,
            omega_split: delta / tau_wl,
            distance_m,
        })
    }

    /// The distance D in metres.
    pub fn distance_m(&self) -> f64 {
        self.distance_m
    }

    /// The waveform behind the spectrum.
    pub fn waveform(&self) -> &DirectionWaveform {
        &self.wave
    }

    /// The corner frequency f_split = 1/(2π τ) in Hz, τ the worldline time scale
    /// b(1 − n·v)/v seen in this frame (Doppler factor included): v/(2πb) for v ≪ c. Below it
    /// |h̃| is the memory's tail |Δh|/(2πf); above it the spectrum falls off exponentially.
    pub fn split_frequency_hz(&self) -> f64 {
        self.omega_split / (2.0 * std::f64::consts::PI * self.time_unit_s)
    }

    /// The frequency in Hz above which the burst's power is below e^{−100} of its scale.
    pub fn cutoff_frequency_hz(&self) -> f64 {
        self.omega_cut / (2.0 * std::f64::consts::PI * self.time_unit_s)
    }

    /// h̃₊(f), h̃×(f) in Hz⁻¹ (sign convention: module documentation; common phase dropped).
    ///
    /// # Domain
    /// f > 0 (Hz); for f ≤ 0 or NaN both are 0 + 0i.
    pub fn polarisations(&self, f: f64) -> [Complex64; 2] {
        if !(f > 0.0) {
            return [Complex64::new(0.0, 0.0); 2];
        }
        let w = 2.0 * std::f64::consts::PI * f * self.time_unit_s;
        let r = self.rate(w);
        // h̃ = Ḣ̃/(−iω) = i Ḣ̃/ω.
        let s = Complex64::new(0.0, self.amplitude / w);
        [s * r[0], s * r[1]]
    }

    /// [|h̃₊|², |h̃×|², Re(h̃₊ h̃×*)] in Hz⁻² at f (Hz); zeros for f ≤ 0.
    pub fn power(&self, f: f64) -> [f64; 3] {
        if !(f > 0.0) {
            return [0.0; 3];
        }
        let w = 2.0 * std::f64::consts::PI * f * self.time_unit_s;
        if w > self.omega_cut {
            return [0.0; 3];
        }
        let r = self.rate(w);
        let a = self.amplitude / w;
        let a2 = a * a;
        [a2 * r[0].norm_sqr(), a2 * r[1].norm_sqr(), a2 * (r[0] * r[1].conj()).re]
    }

    /// Characteristic strain 2f|h̃_eff(f)| with |h̃_eff|² = w₊₊|h̃₊|² + w××|h̃×|² + 2w₊× Re h̃₊h̃×*
    /// for the response weights `w = [w₊₊, w××, w₊×]` (see [`crate::detection::SnrResult::weights`]).
    pub fn characteristic_strain(&self, f: f64, w: [f64; 3]) -> f64 {
        let p = self.power(f);
        2.0 * f * (w[0] * p[0] + w[1] * p[1] + 2.0 * w[2] * p[2]).max(0.0).sqrt()
    }

    /// Ḣ̃ in this frame at geometric angular frequency ω > 0, without the common phase.
    fn rate(&self, w: f64) -> [Complex64; 2] {
        let map = &self.wave.map;
        let t = self.wave.kernel.rate_transform(w / map.delta);
        let d = map.delta;
        [
            (t[0] * map.c2psi - t[1] * map.s2psi) * d,
            (t[0] * map.s2psi + t[1] * map.c2psi) * d,
        ]
    }
}
