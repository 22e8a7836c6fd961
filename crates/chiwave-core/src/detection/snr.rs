//! Signal-to-noise ratio of an encounter's burst in a detector, its optimal and sky-averaged
//! values, and the horizon distance.
//!
//! # Formula
//! ρ² = 4 ∫ |h̃(f)|²/S_n(f) df over the noise curve's band (the matched-filter SNR of a known
//! signal in stationary Gaussian noise with one-sided PSD S_n; e.g. Cutler & Flanagan 1994,
//! arXiv:gr-qc/9402014, §II — equation number not checked), for the recorded strain
//! h = F₊h₊ + F×h×. Writing
//! Γ_ab = 4 ∫ Re(h̃_a h̃_b*)/S_n df (a, b ∈ {+, ×}), ρ² = Fᵀ Γ F for any antenna pattern
//! (F₊, F×). Derived values:
//! * optimal orientation: the largest eigenvalue of Γ (an interferometer with the source
//!   overhead has F = (cos 2ψ, sin 2ψ); the maximum over ψ of Fᵀ Γ F is λ_max);
//! * sky- and polarisation-averaged (root mean square over isotropic directions and uniform ψ):
//!   ⟨ρ²⟩ = (Γ₊₊ + Γ××)/5, from ⟨F₊²⟩ = ⟨F×²⟩ = 1/5, ⟨F₊F×⟩ = 0 for a 90° interferometer
//!   (Thorne 1987 in *300 Years of Gravitation*, ch. 9, common practice; checked by averaging
//!   [`crate::waveform::antenna_pattern`] over a grid in `tests/detection_snr.rs`);
//! * a curve that already contains the sky average (LISA in the form of Robson, Cornish & Liu
//!   2019, arXiv:1803.01944): ⟨ρ²⟩ = Γ₊₊ + Γ××, their sky-averaged SNR with the factor 3/10 of the
//!   two channels inside S_n; no orientation-specific value exists for such a curve.
//!
//! The integral runs in ln f with adaptive Gauss–Kronrod quadrature and an error estimate
//! ([`super::quadrature`]), from the band's lower edge to the smaller of the band's upper edge and
//! the frequency where the burst's power has fallen below e^{−100} of its scale.
//!
//! ρ ∝ 1/D exactly, so the horizon distance for a threshold ρ_thr is D_h = D ρ(D)/ρ_thr. Redshift
//! is not included: when z ≈ H₀D_h/c ≥ 0.1 the result carries a caution.
//!
//! Conventions and the low-frequency (memory) split: `docs/physics/detection.md`.

// `!(x > 0.0)` is deliberate: unlike `x <= 0.0` it also catches NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

use super::burst::Burst;
use super::noise::{NoiseCurve, NoiseValidity, Response, LISA_F_VALID};
use super::quadrature::integrate;
use crate::error::{finite, InputError};
use crate::units::codata2018::C;
use crate::validity::{Check, Flag, Level};
use serde::Serialize;

/// The regime checks of this file: stable key and the label shown with it.
const COSMOLOGICAL_DISTANCE: Check = Check::new("cosmological_distance", "distance redshift z");
const COSMOLOGICAL_HORIZON: Check = Check::new("cosmological_horizon", "horizon redshift z");
const LOW_BAND_EDGE: Check = Check::new("low_band_edge", "signal at the band's low edge");
const MEMORY_DOMINATED: Check = Check::new("memory_dominated", "memory share of ρ²");
const NO_SIGNAL_IN_BAND: Check = Check::new("no_signal_in_band", "signal in band");
const NOISE_EXTRAPOLATED: Check = Check::new("noise_extrapolated", "extrapolated noise share");
const QUADRATURE: Check = Check::new("quadrature", "SNR quadrature error");
const SKY_AVERAGED_CURVE: Check = Check::new("sky_averaged_curve", "sky-averaged noise curve");

/// Default detection threshold ρ = 8 (common practice for a single detector).
pub const DEFAULT_SNR_THRESHOLD: f64 = 8.0;
/// Default relative tolerance of ρ² (of the polarisation-summed integral Γ₊₊ + Γ××).
pub const DEFAULT_SNR_TOLERANCE: f64 = 1e-6;
/// Largest number of quadrature intervals before the result is returned as not converged.
const MAX_INTERVALS: usize = 400;
/// H₀ = 67.4 km/s/Mpc (Planck Collaboration 2020, A&A 641, A6, arXiv:1807.06209: 67.36 ± 0.54,
/// recalled from memory), used only for the redshift caution z ≈ H₀D/c.
pub const HUBBLE_CONSTANT_SI: f64 = 67.4e3 / crate::units::astro::MPC;
/// Redshift from which distances count as cosmological (common practice): z ≥ 0.1.
pub const REDSHIFT_CAUTION: f64 = 0.1;

/// Options of [`snr`].
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct SnrOptions {
    /// Antenna pattern (F₊, F×) for the orientation-specific ρ; `None` means (1, 0).
    pub antenna: Option<(f64, f64)>,
    /// Threshold ρ for the horizon distance (> 0; default 8).
    pub threshold: f64,
    /// Relative tolerance of the quadrature (1e-12 ≤ tol ≤ 1e-2; default 1e-6).
    pub rel_tol: f64,
    /// Frequency (Hz) below which ρ² counts as low-frequency; `None`: the burst's corner
    /// frequency [`Burst::split_frequency_hz`].
    pub split_hz: Option<f64>,
}

impl Default for SnrOptions {
    fn default() -> Self {
        SnrOptions { antenna: None, threshold: DEFAULT_SNR_THRESHOLD, rel_tol: DEFAULT_SNR_TOLERANCE, split_hz: None }
    }
}

/// Which SNR the horizon distance is for.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum HorizonBasis {
    /// The optimally oriented ρ (interferometer curves).
    Optimal,
    /// The sky-averaged ρ (curves that contain the sky average).
    SkyAveraged,
}

/// The detection figures of one burst in one detector.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SnrResult {
    /// Name of the noise curve.
    pub noise: String,
    pub response: Response,
    /// Distance D (m) the ρ values are for.
    pub distance_m: f64,
    /// ρ for the given antenna pattern; `None` for a sky-averaged curve.
    pub snr: Option<f64>,
    /// The antenna pattern used for `snr`.
    pub antenna: (f64, f64),
    /// ρ of the optimally oriented interferometer; `None` for a sky-averaged curve.
    pub snr_optimal: Option<f64>,
    /// Root-mean-square ρ over sky positions and polarisation angles.
    pub snr_sky_averaged: f64,
    pub threshold: f64,
    /// D ρ/ρ_thr (m) for the ρ named by `horizon_basis`.
    pub horizon_distance_m: f64,
    pub horizon_basis: HorizonBasis,
    /// z ≈ H₀ D_h/c at the horizon (only to judge whether redshift matters).
    pub horizon_redshift: f64,
    /// Lower and upper limits of the integral actually used (Hz).
    pub f_low_hz: f64,
    pub f_high_hz: f64,
    /// Where the polarisation-summed integrand per ln f, 4f(|h̃₊|² + |h̃×|²)/S_n, peaks (Hz).
    pub f_peak_hz: f64,
    /// The low-frequency split (Hz).
    pub f_split_hz: f64,
    /// Share of the sky-averaged ρ² from f < f_split (the memory-dominated part of the spectrum).
    pub low_frequency_share: f64,
    /// Share of the sky-averaged ρ² from where the noise curve is extrapolated (LISA below 0.1 mHz).
    pub extrapolated_share: f64,
    /// Estimated relative error of Γ₊₊ + Γ×× from the quadrature.
    pub rel_error_estimate: f64,
    /// Number of spectrum evaluations.
    pub evaluations: usize,
    /// Γ = [[Γ₊₊, Γ₊×], [Γ₊×, Γ××]] at D: ρ² = Fᵀ Γ F.
    pub gamma_matrix: [[f64; 2]; 2],
    /// The part of Γ from f < f_split.
    pub gamma_matrix_low: [[f64; 2]; 2],
    pub flags: Vec<Flag>,
}

impl SnrResult {
    /// ρ for any antenna pattern (F₊, F×) of an interferometer curve: √(Fᵀ Γ F); `None` for a
    /// sky-averaged curve.
    ///
    /// # Examples
    /// See [`snr`].
    pub fn snr_for(&self, fp: f64, fx: f64) -> Option<f64> {
        match self.response {
            Response::Interferometer => Some(quad(&self.gamma_matrix, fp, fx).max(0.0).sqrt()),
            Response::SkyAveraged => None,
        }
    }

    /// The same result at another distance (ρ ∝ 1/D; horizon unchanged).
    ///
    /// # Errors
    /// [`InputError`] naming `distance` unless finite and > 0.
    pub fn at_distance(&self, distance_m: f64) -> Result<SnrResult, InputError> {
        crate::error::positive("distance", distance_m)?;
        let k = self.distance_m / distance_m;
        let mut r = self.clone();
        r.distance_m = distance_m;
        r.snr = r.snr.map(|x| x * k);
        r.snr_optimal = r.snr_optimal.map(|x| x * k);
        r.snr_sky_averaged *= k;
        for row in r.gamma_matrix.iter_mut().chain(r.gamma_matrix_low.iter_mut()) {
            for x in row.iter_mut() {
                *x *= k * k;
            }
        }
        r.flags.retain(|f| f.key != "cosmological_distance");
        if let Some(f) = distance_flag(distance_m) {
            r.flags.push(f);
        }
        Ok(r)
    }

    /// Weights [w₊₊, w××, w₊×] of |h̃_eff|² = Σ w_ab Re(h̃_a h̃_b*) for the characteristic strain
    /// 2f|h̃_eff| that is compared with √(f S_n) (so that ρ² = ∫ (h_c/h_n)² d ln f):
    /// the given antenna (F₊², F×², F₊F×) on an interferometer curve, the sky average (1, 1, 0)
    /// on a sky-averaged curve.
    pub fn weights(&self) -> [f64; 3] {
        match self.response {
            Response::Interferometer => {
                let (p, x) = self.antenna;
                [p * p, x * x, p * x]
            }
            Response::SkyAveraged => [1.0, 1.0, 0.0],
        }
    }
}

fn quad(m: &[[f64; 2]; 2], fp: f64, fx: f64) -> f64 {
    fp * fp * m[0][0] + 2.0 * fp * fx * m[0][1] + fx * fx * m[1][1]
}

/// Largest eigenvalue of a symmetric 2×2 matrix.
fn lambda_max(m: &[[f64; 2]; 2]) -> f64 {
    let a = 0.5 * (m[0][0] + m[1][1]);
    let d = 0.5 * (m[0][0] - m[1][1]);
    a + d.hypot(m[0][1])
}

fn redshift(d_m: f64) -> f64 {
    HUBBLE_CONSTANT_SI * d_m / C
}

fn distance_flag(d_m: f64) -> Option<Flag> {
    let z = redshift(d_m);
    (z >= REDSHIFT_CAUTION).then(|| {
        Flag::new(
            COSMOLOGICAL_DISTANCE,
            Level::Caution,
            Some(z),
            format!("The distance corresponds to z ≈ {z:.2}: ρ is computed without redshift (no (1+z) lowering of the frequencies, D used as the luminosity distance)."),
        )
    })
}

/// ρ of `burst` in the detector described by `noise`.
///
/// # Formula
/// See the module documentation.
///
/// # Domain
/// Antenna pattern finite with |F| ≤ 1 per component; threshold > 0; 1e-12 ≤ rel_tol ≤ 1e-2;
/// split frequency > 0.
///
/// # Errors
/// [`InputError`] naming `antenna`, `snr_threshold`, `rel_tol` or `split_hz`; an antenna pattern
/// given for a sky-averaged curve ([`InputError::Inconsistent`] naming `antenna`);
/// [`InputError::NoConvergence`] if the integrand is not finite.
///
/// # Examples
/// ```
/// use chiwave_core::detection::{snr, Burst, NoiseCurve, SnrOptions, SNR_X_NODES};
/// use chiwave_core::waveform::{Binary, Frame};
/// use chiwave_core::units::{astro::MPC, SUN_LENGTH_M};
/// // 10 + 10 M☉ at v = 0.05 c, b = 30 GM/c², seen from above the orbital plane at 10 Mpc.
/// let sys = Binary::from_speed(0.5, 0.5, 0.05, 30.0).unwrap();
/// let burst = Burst::new(&sys, Frame::Cm, 0.0, 0.0, 20.0 * SUN_LENGTH_M, 10.0 * MPC, SNR_X_NODES).unwrap();
/// let r = snr(&burst, &NoiseCurve::AdvancedLigo, &SnrOptions::default()).unwrap();
/// let (opt, avg) = (r.snr_optimal.unwrap(), r.snr_sky_averaged);
/// assert!(opt >= r.snr.unwrap() && opt > avg && avg > 0.0);
/// // ρ ∝ 1/D: the horizon is where ρ_opt = 8.
/// assert!((r.horizon_distance_m / (10.0 * MPC) - opt / 8.0).abs() < 1e-12 * opt);
/// ```
pub fn snr(burst: &Burst, noise: &NoiseCurve, opts: &SnrOptions) -> Result<SnrResult, InputError> {
    let response = noise.response();
    let antenna = match (opts.antenna, response) {
        (Some(_), Response::SkyAveraged) => {
            return Err(InputError::Inconsistent {
                field: "antenna",
                reason: format!("the noise curve '{}' already contains the sky and polarisation average; an antenna pattern does not apply to it", noise.name()),
            })
        }
        (Some((fp, fx)), _) => {
            crate::error::in_closed("antenna", fp, -1.0, 1.0)?;
            crate::error::in_closed("antenna", fx, -1.0, 1.0)?;
            (fp, fx)
        }
        (None, _) => (1.0, 0.0),
    };
    crate::error::positive("snr_threshold", opts.threshold)?;
    crate::error::in_closed("rel_tol", opts.rel_tol, 1e-12, 1e-2)?;
    let f_split = match opts.split_hz {
        Some(s) => crate::error::positive("split_hz", s)?,
        None => burst.split_frequency_hz(),
    };
    finite("split_hz", f_split)?;

    let (band_lo, band_hi) = noise.band();
    let f_lo = band_lo;
    let f_hi = band_hi.min(burst.cutoff_frequency_hz().max(2.0 * band_lo));
    let (y_lo, y_hi) = (f_lo.ln(), f_hi.ln());
    // Break points: every decade, the split, and where the curve stops being extrapolated.
    let step = std::f64::consts::LN_10;
    let n = ((y_hi - y_lo) / step).ceil().max(1.0) as usize;
    let mut breaks: Vec<f64> = (0..=n).map(|i| y_lo + (y_hi - y_lo) * i as f64 / n as f64).collect();
    let y_valid = if matches!(noise, NoiseCurve::Lisa { .. }) { LISA_F_VALID.ln() } else { y_lo };
    for y in [f_split.ln(), y_valid] {
        if y > y_lo && y < y_hi && breaks.iter().all(|b| (b - y).abs() > 1e-9 * step) {
            breaks.push(y);
        }
    }
    breaks.sort_by(f64::total_cmp);

    let integrand = |y: f64| -> [f64; 4] {
        let f = y.exp();
        let p = burst.power(f);
        let k = 4.0 * f / noise.psd_in_band(f);
        let (a, b, c) = (k * p[0], k * p[1], k * p[2]);
        [a, b, c, a + b]
    };
    let mut peak = (f64::NEG_INFINITY, y_lo);
    let q = integrate(
        |y| {
            let v = integrand(y);
            if v[3] > peak.0 {
                peak = (v[3], y);
            }
            v
        },
        &breaks,
        opts.rel_tol,
        0.0,
        MAX_INTERVALS,
        3,
    )?;
    let mut evaluations = q.evaluations;
    let to_matrix = |v: &[f64; 4]| [[v[0], v[2]], [v[2], v[1]]];
    let gamma = to_matrix(&q.value);
    let (mut low, mut extrapolated) = ([0.0; 4], 0.0);
    let y_split = f_split.ln();
    for s in &q.segments {
        if s.b <= y_split + 1e-12 {
            for (l, v) in low.iter_mut().zip(&s.value) {
                *l += v;
            }
        }
        if s.b <= y_valid + 1e-12 && noise.validity((0.5 * (s.a + s.b)).exp()) == NoiseValidity::Extrapolated {
            extrapolated += s.value[3];
        }
    }
    let trace = q.value[3];

    // Peak of the integrand per ln f: golden-section refinement inside the segment that holds
    // the best node (the integrand is smooth and locally unimodal there).
    let mut f_peak = peak.1.exp();
    if trace > 0.0 {
        if let Some(s) = q.segments.iter().find(|s| peak.1 >= s.a && peak.1 <= s.b) {
            let w = s.b - s.a;
            let (mut a, mut b) = ((peak.1 - 0.5 * w).max(y_lo), (peak.1 + 0.5 * w).min(y_hi));
            let g = 0.5 * (5f64.sqrt() - 1.0);
            let mut x1 = b - g * (b - a);
            let mut x2 = a + g * (b - a);
            let (mut f1, mut f2) = (integrand(x1)[3], integrand(x2)[3]);
            for _ in 0..40 {
                if f1 < f2 {
                    a = x1;
                    x1 = x2;
                    f1 = f2;
                    x2 = a + g * (b - a);
                    f2 = integrand(x2)[3];
                } else {
                    b = x2;
                    x2 = x1;
                    f2 = f1;
                    x1 = b - g * (b - a);
                    f1 = integrand(x1)[3];
                }
                evaluations += 1;
                // f_peak to 1e-4 relative: the integrand is flat at its peak, nothing finer is meaningful.
                if b - a < 1e-4 {
                    break;
                }
            }
            let y = 0.5 * (a + b);
            if integrand(y)[3] >= peak.0 {
                f_peak = y.exp();
            }
        }
    }

    let (snr_given, snr_optimal, snr_avg, basis) = match response {
        Response::Interferometer => {
            let given = quad(&gamma, antenna.0, antenna.1).max(0.0).sqrt();
            (Some(given), Some(lambda_max(&gamma).max(0.0).sqrt()), (trace / 5.0).max(0.0).sqrt(), HorizonBasis::Optimal)
        }
        Response::SkyAveraged => (None, None, trace.max(0.0).sqrt(), HorizonBasis::SkyAveraged),
    };
    let rho_h = match basis {
        HorizonBasis::Optimal => snr_optimal.unwrap_or(0.0),
        HorizonBasis::SkyAveraged => snr_avg,
    };
    let d = burst.distance_m();
    let horizon = d * rho_h / opts.threshold;
    let z_h = redshift(horizon);
    let share = |part: f64| if trace > 0.0 { (part / trace).clamp(0.0, 1.0) } else { 0.0 };
    let low_share = share(low[3]);
    let extrapolated_share = share(extrapolated);
    let rel_err = if trace > 0.0 { q.error / trace } else { 0.0 };

    let mut flags = Vec::new();
    if response == Response::SkyAveraged {
        flags.push(Flag::new(
            SKY_AVERAGED_CURVE,
            Level::Ok,
            None,
            format!("The noise curve '{}' contains the sky and polarisation average: only the sky-averaged ρ is defined (snr and snr_optimal are null).", noise.name()),
        ));
    }
    if !(trace > 0.0) {
        flags.push(Flag::new(
            NO_SIGNAL_IN_BAND,
            Level::Caution,
            Some(burst.cutoff_frequency_hz()),
            format!("The burst has no power in the band {f_lo:.3e}–{band_hi:.3e} Hz above the numerical resolution (its spectrum ends near {:.3e} Hz): ρ = 0.", burst.cutoff_frequency_hz()),
        ));
    } else {
        let edge = integrand(y_lo)[3];
        evaluations += 1;
        let ratio = edge / peak.0.max(edge);
        if ratio >= 0.1 {
            flags.push(Flag::new(
                LOW_BAND_EDGE,
                Level::Caution,
                Some(ratio),
                format!("The integrand at the band's lower edge ({f_lo:.3e} Hz) is {ratio:.2} of its peak: ρ depends on where the noise curve stops; the burst (its memory, |h̃| ∝ 1/f) has more power below."),
            ));
        }
    }
    if low_share > 0.5 {
        flags.push(Flag::new(
            MEMORY_DOMINATED,
            Level::Caution,
            Some(low_share),
            format!("{:.0} % of ρ² comes from below f_split = {f_split:.3e} Hz, where h̃ is the memory's 1/f tail: the detector sees the permanent strain offset as a step, and ρ rests on the noise curve's low-frequency part (and, for a real search, on how the data are filtered there).", 100.0 * low_share),
        ));
    }
    if extrapolated_share > 0.01 {
        flags.push(Flag::new(
            NOISE_EXTRAPOLATED,
            Level::Caution,
            Some(extrapolated_share),
            format!("{:.0} % of ρ² comes from below {LISA_F_VALID:e} Hz, where the noise model is extrapolated beyond the band it was made for.", 100.0 * extrapolated_share),
        ));
    }
    if !q.converged {
        flags.push(Flag::new(
            QUADRATURE,
            Level::Caution,
            Some(rel_err),
            format!("The frequency integral stopped at its interval limit with an estimated relative error {rel_err:.1e} (requested {:.0e}).", opts.rel_tol),
        ));
    }
    if z_h >= REDSHIFT_CAUTION {
        flags.push(Flag::new(
            COSMOLOGICAL_HORIZON,
            Level::Caution,
            Some(z_h),
            format!("The horizon distance corresponds to z ≈ {z_h:.2}: redshift is not included (frequencies lowered by 1 + z, luminosity distance), so the horizon is only indicative."),
        ));
    }
    if let Some(f) = distance_flag(d) {
        flags.push(f);
    }

    Ok(SnrResult {
        noise: noise.name(),
        response,
        distance_m: d,
        snr: snr_given,
        antenna,
        snr_optimal,
        snr_sky_averaged: snr_avg,
        threshold: opts.threshold,
        horizon_distance_m: horizon,
        horizon_basis: basis,
        horizon_redshift: z_h,
        f_low_hz: f_lo,
        f_high_hz: f_hi,
        f_peak_hz: f_peak,
        f_split_hz: f_split,
        low_frequency_share: low_share,
        extrapolated_share,
        rel_error_estimate: rel_err,
        evaluations,
        gamma_matrix: gamma,
        gamma_matrix_low: to_matrix(&low),
        flags,
    })
}
