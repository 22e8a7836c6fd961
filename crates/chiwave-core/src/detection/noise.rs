//! Detector noise curves: published analytic sensitivity fits and tabulated amplitude spectral
//! densities read from CSV text.
//!
//! # Curves
//! * [`NoiseCurve::AdvancedLigo`]: Advanced LIGO design sensitivity, zero-detuned high-power
//!   configuration, in the analytic fit of Ajith 2011 (arXiv:1107.1267, Phys. Rev. D 84, 084037):
//!   S_n(f) = 10⁻⁴⁹ [x^−4.14 − 5x⁻² + 111(1 − x² + x⁴/2)/(1 + x²/2)] Hz⁻¹, x = f/245.4 Hz,
//!   used from the paper's low-frequency cutoff of 10 Hz. A single L-shaped interferometer with
//!   90° arms: the signal enters through the antenna pattern F₊h₊ + F×h×.
//! * [`NoiseCurve::Lisa`]: LISA in the form of Robson, Cornish & Liu 2019 (arXiv:1803.01944,
//!   Class. Quantum Grav. 36, 105011): the instrument noise of their eqs. (10), (11), (13) with the
//!   arm length L = 2.5 Gm and transfer frequency f* = c/(2πL) = 19.09 mHz, optionally plus the
//!   galactic confusion noise of their eq. (14) with the coefficients of their Table 1 for an
//!   observation time of 0.5, 1, 2 or 4 years (the paper tabulates only these times and gives no
//!   rule between them, so other times are refused). The curve is the **sky- and
//!   polarisation-averaged** effective noise of the two independent LISA channels: the
//!   signal enters as |h̃₊|² + |h̃×|² (see `docs/physics/detection.md`).
//! * [`NoiseCurve::Table`]: any detector, from a CSV of frequency [Hz] and amplitude spectral
//!   density [1/√Hz], interpolated linearly in (ln f, ln ASD) and refused outside its first and
//!   last frequency.
//!
//! A third-generation ground detector is not offered: no analytic fit to Einstein Telescope or
//! Cosmic Explorer could be checked against its paper here (see `docs/physics/detection.md`).
//!
//! # Conventions
//! One-sided power spectral density S_n(f) in Hz⁻¹, ASD = √S_n in Hz^−1/2, frequencies in Hz.
//! The equations and constants above are transcribed from the papers as recalled (none of the
//! equations could be seen in a literature search; the aLIGO form may be the Sathyaprakash &
//! Schutz 2009 fit rather than Ajith's: docs/physics/detection.md); the
//! transcription is checked against an independent mpmath implementation
//! (`tests/reference/noise_curves_mpmath.py`) and against the curves' documented features in
//! `tests/detection_noise.rs`.

use crate::error::{finite, InputError};
use crate::units::codata2018::C;
use serde::Serialize;

/// Ajith 2011 (arXiv:1107.1267): the PSD scale 10⁻⁴⁹ Hz⁻¹ of the aLIGO zero-detuned high-power fit.
const ALIGO_S0: f64 = 1e-49;
/// Ajith 2011: the frequency scale f₀ = 245.4 Hz of the fit.
const ALIGO_F0: f64 = 245.4;
/// Ajith 2011: the low-frequency cutoff, 10 Hz.
pub const ALIGO_F_LOW: f64 = 10.0;
/// Upper end of the aLIGO band used here, 10 kHz: chiwave's choice. Above a few kHz the fit is
/// the f² rise of shot noise, which the design curve follows far beyond where a burst from an
/// encounter of stellar-mass bodies has power.
pub const ALIGO_F_HIGH: f64 = 1e4;

/// Robson, Cornish & Liu 2019 (arXiv:1803.01944): LISA arm length L = 2.5 Gm.
pub const LISA_ARM_M: f64 = 2.5e9;
/// Robson et al. 2019, eq. (10): single-link optical metrology noise amplitude, 1.5e-11 m.
const LISA_OMS_M: f64 = 1.5e-11;
/// Robson et al. 2019, eq. (11): single test-mass acceleration noise amplitude, 3e-15 m s⁻².
const LISA_ACC: f64 = 3e-15;
/// Robson et al. 2019, eq. (14): confusion-noise amplitude A = 9e-45 (Hz⁻¹ with f in Hz).
const LISA_CONF_A: f64 = 9e-45;
/// Lower end of the LISA band, 10 µHz: chiwave's choice (the decade below the mission's
/// 0.1 mHz requirement band, where [`NoiseValidity::Extrapolated`] is reported).
pub const LISA_F_LOW: f64 = 1e-5;
/// Lower end of the band where the LISA noise model is inside the mission's requirement band.
pub const LISA_F_VALID: f64 = 1e-4;
/// Upper end of the LISA band, 1 Hz.
pub const LISA_F_HIGH: f64 = 1.0;

/// LISA transfer frequency f* = c/(2πL) (Robson et al. 2019: 19.09 mHz).
pub fn lisa_transfer_frequency() -> f64 {
    C / (2.0 * std::f64::consts::PI * LISA_ARM_M)
}

/// How a noise curve takes the signal in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Response {
    /// One interferometer with 90° arms: h = F₊h₊ + F×h×; averages use ⟨F₊²⟩ = ⟨F×²⟩ = 1/5.
    Interferometer,
    /// The curve already contains the sky and polarisation average: ρ² = 4∫(|h̃₊|² + |h̃×|²)/S_n df.
    SkyAveraged,
}

/// How far a curve can be trusted at one frequency.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum NoiseValidity {
    /// Inside the range the fit or table was made for.
    Valid,
    /// Inside the band but outside the range the model was made for (shown with a caution).
    Extrapolated,
    /// Outside the band: [`NoiseCurve::asd`] refuses it.
    Outside,
}

/// Observation time for the LISA galactic confusion noise (Robson et al. 2019, Table 1).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
pub enum LisaObservation {
    HalfYear,
    OneYear,
    TwoYears,
    FourYears,
}

/// Robson et al. 2019, eq. (14) coefficients (α, β, κ, γ, f_k) from their Table 1.
struct ConfusionFit {
    alpha: f64,
    beta: f64,
    kappa: f64,
    gamma: f64,
    f_knee: f64,
}

impl LisaObservation {
    /// The accepted observation times in years.
    pub const YEARS: [f64; 4] = [0.5, 1.0, 2.0, 4.0];

    /// From a time in years: exactly one of 0.5, 1, 2, 4.
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `t_obs` for any other value.
    pub fn from_years(t: f64) -> Result<Self, InputError> {
        finite("t_obs", t)?;
        if t == 0.5 {
            Ok(LisaObservation::HalfYear)
        } else if t == 1.0 {
            Ok(LisaObservation::OneYear)
        } else if t == 2.0 {
            Ok(LisaObservation::TwoYears)
        } else if t == 4.0 {
            Ok(LisaObservation::FourYears)
        } else {
            Err(InputError::OutOfRange {
                field: "t_obs",
                value: t,
                allowed: "0.5, 1, 2 or 4 years (the observation times Robson, Cornish & Liu 2019 tabulate for the galactic confusion noise)".into(),
            })
        }
    }

    /// The observation time in years.
    pub fn years(self) -> f64 {
        match self {
            LisaObservation::HalfYear => 0.5,
            LisaObservation::OneYear => 1.0,
            LisaObservation::TwoYears => 2.0,
            LisaObservation::FourYears => 4.0,
        }
    }

    fn fit(self) -> ConfusionFit {
        // Robson, Cornish & Liu 2019, Table 1 (one row per observation time).
        match self {
            LisaObservation::HalfYear => ConfusionFit { alpha: 0.133, beta: 243.0, kappa: 482.0, gamma: 917.0, f_knee: 2.58e-3 },
            LisaObservation::OneYear => ConfusionFit { alpha: 0.171, beta: 292.0, kappa: 1020.0, gamma: 1680.0, f_knee: 2.15e-3 },
            LisaObservation::TwoYears => ConfusionFit { alpha: 0.165, beta: 299.0, kappa: 611.0, gamma: 1340.0, f_knee: 1.73e-3 },
            LisaObservation::FourYears => ConfusionFit { alpha: 0.138, beta: -221.0, kappa: 521.0, gamma: 1680.0, f_knee: 1.13e-3 },
        }
    }
}

/// One noise curve evaluated at one frequency (what `chiwave noise --frequency F` prints).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct NoisePoint {
    /// Name of the curve.
    pub noise: String,
    pub frequency_hz: f64,
    /// Amplitude spectral density, Hz^−1/2.
    pub asd: f64,
    /// One-sided power spectral density, Hz⁻¹.
    pub psd: f64,
    /// True where the curve is inside the range it was made for ([`NoiseValidity::Valid`]).
    pub valid: bool,
    pub validity: NoiseValidity,
    /// The band (f_low, f_high) in Hz.
    pub band_hz: (f64, f64),
    pub response: Response,
    pub source: &'static str,
}

/// A tabulated amplitude spectral density (from CSV text), interpolated log–log.
#[derive(Debug, Clone, PartialEq)]
pub struct NoiseTable {
    label: String,
    /// First and last frequency exactly as read (Hz).
    f_first: f64,
    f_last: f64,
    ln_f: Vec<f64>,
    ln_asd: Vec<f64>,
    response: Response,
}

/// A detector noise curve.
#[derive(Debug, Clone, PartialEq)]
pub enum NoiseCurve {
    /// Advanced LIGO, zero-detuned high power (Ajith 2011 fit), 10 Hz – 10 kHz.
    AdvancedLigo,
    /// LISA (Robson, Cornish & Liu 2019), sky-averaged, 10 µHz – 1 Hz; with the galactic
    /// confusion noise for the given observation time, or instrument noise only (`None`).
    Lisa { confusion: Option<LisaObservation> },
    /// A table read from CSV.
    Table(NoiseTable),
}

/// The names [`NoiseCurve::from_name`] accepts.
pub const NOISE_NAMES: &str = "aligo, lisa (instrument only), lisa-0.5yr, lisa-1yr, lisa-2yr, lisa-4yr (with the galactic confusion noise for that observation time)";

impl NoiseCurve {
    /// The built-in curve of that name (case-insensitive): see [`NOISE_NAMES`].
    ///
    /// # Errors
    /// [`InputError::Parse`] naming `noise` for an unknown name, listing the accepted ones.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::detection::NoiseCurve;
    /// let n = NoiseCurve::from_name("lisa-4yr").unwrap();
    /// assert_eq!(n.name(), "lisa-4yr");
    /// assert!(NoiseCurve::from_name("lisa-3yr").is_err());
    /// ```
    pub fn from_name(name: &str) -> Result<Self, InputError> {
        let n = name.trim().to_ascii_lowercase();
        let lisa = |t: LisaObservation| Ok(NoiseCurve::Lisa { confusion: Some(t) });
        match n.as_str() {
            "aligo" => Ok(NoiseCurve::AdvancedLigo),
            "lisa" => Ok(NoiseCurve::Lisa { confusion: None }),
            "lisa-0.5yr" => lisa(LisaObservation::HalfYear),
            "lisa-1yr" => lisa(LisaObservation::OneYear),
            "lisa-2yr" => lisa(LisaObservation::TwoYears),
            "lisa-4yr" => lisa(LisaObservation::FourYears),
            _ => Err(InputError::Parse { field: "noise", text: name.to_string(), expected: format!("one of {NOISE_NAMES}, or a CSV file") }),
        }
    }

    /// A curve from CSV text (see [`NoiseTable::parse_csv`]); `label` names it in results.
    ///
    /// # Errors
    /// As [`NoiseTable::parse_csv`].
    pub fn from_csv(label: &str, text: &str, response: Response) -> Result<Self, InputError> {
        Ok(NoiseCurve::Table(NoiseTable::parse_csv(label, text, response)?))
    }

    /// Stable name: `aligo`, `lisa`, `lisa-1yr`, … or the table's label.
    pub fn name(&self) -> String {
        match self {
            NoiseCurve::AdvancedLigo => "aligo".into(),
            NoiseCurve::Lisa { confusion: None } => "lisa".into(),
            NoiseCurve::Lisa { confusion: Some(t) } => format!("lisa-{}yr", t.years()),
            NoiseCurve::Table(t) => t.label.clone(),
        }
    }

    /// The primary source of the curve, with the equations used.
    pub fn source(&self) -> &'static str {
        match self {
            NoiseCurve::AdvancedLigo => "Ajith 2011, arXiv:1107.1267 (Phys. Rev. D 84, 084037): analytic fit to the Advanced LIGO zero-detuned high-power design noise, S_n = 1e-49 [x^-4.14 - 5x^-2 + 111(1 - x^2 + x^4/2)/(1 + x^2/2)], x = f/245.4 Hz, from 10 Hz (as recalled; not confirmed against the paper, see docs/physics/detection.md)",
            NoiseCurve::Lisa { confusion: None } => "Robson, Cornish & Liu 2019, arXiv:1803.01944 (Class. Quantum Grav. 36, 105011), eqs. (10), (11), (13): sky-averaged LISA instrument noise, L = 2.5 Gm",
            NoiseCurve::Lisa { confusion: Some(_) } => "Robson, Cornish & Liu 2019, arXiv:1803.01944 (Class. Quantum Grav. 36, 105011), eqs. (10), (11), (13) instrument noise plus eq. (14) galactic confusion noise with the Table 1 coefficients for the observation time",
            NoiseCurve::Table(_) => "user-supplied table of amplitude spectral density, interpolated linearly in (ln f, ln ASD)",
        }
    }

    /// How the curve takes the signal in.
    pub fn response(&self) -> Response {
        match self {
            NoiseCurve::AdvancedLigo => Response::Interferometer,
            NoiseCurve::Lisa { .. } => Response::SkyAveraged,
            NoiseCurve::Table(t) => t.response,
        }
    }

    /// The band (f_low, f_high) in Hz where the curve is defined.
    pub fn band(&self) -> (f64, f64) {
        match self {
            NoiseCurve::AdvancedLigo => (ALIGO_F_LOW, ALIGO_F_HIGH),
            NoiseCurve::Lisa { .. } => (LISA_F_LOW, LISA_F_HIGH),
            NoiseCurve::Table(t) => t.band(),
        }
    }

    /// Whether the curve holds at frequency `f` (Hz).
    pub fn validity(&self, f: f64) -> NoiseValidity {
        let (lo, hi) = self.band();
        if !(f >= lo && f <= hi) {
            return NoiseValidity::Outside;
        }
        match self {
            NoiseCurve::Lisa { .. } if f < LISA_F_VALID => NoiseValidity::Extrapolated,
            _ => NoiseValidity::Valid,
        }
    }

    /// One-sided power spectral density S_n(f) in Hz⁻¹.
    ///
    /// # Formula
    /// See [`NoiseCurve`]'s variants and the module documentation.
    ///
    /// # Domain
    /// f inside [`NoiseCurve::band`].
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `frequency` (with the band) outside the band, or
    /// [`InputError::NotFinite`].
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::detection::NoiseCurve;
    /// // Ajith 2011 fit at f = f₀ = 245.4 Hz: x = 1, S = 1e-49 (1 − 5 + 111·0.5/1.5) = 3.3e-48.
    /// let s = NoiseCurve::AdvancedLigo.psd(245.4).unwrap();
    /// assert!((s / 3.3e-48 - 1.0).abs() < 1e-14);
    /// assert!(NoiseCurve::AdvancedLigo.psd(5.0).is_err());
    /// ```
    pub fn psd(&self, f: f64) -> Result<f64, InputError> {
        self.check(f)?;
        Ok(self.psd_in_band(f))
    }

    /// Amplitude spectral density √S_n(f) in Hz^−1/2.
    ///
    /// # Errors
    /// As [`NoiseCurve::psd`].
    pub fn asd(&self, f: f64) -> Result<f64, InputError> {
        self.psd(f).map(f64::sqrt)
    }

    /// ASD, PSD and validity at `f` (Hz), with the curve's name, band and source.
    ///
    /// # Errors
    /// As [`NoiseCurve::psd`]: outside the band the curve is refused.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::detection::NoiseCurve;
    /// let p = NoiseCurve::from_name("lisa").unwrap().point(5e-5).unwrap();
    /// assert!(!p.valid && p.asd > 0.0); // below 0.1 mHz the LISA model is extrapolated
    /// ```
    pub fn point(&self, f: f64) -> Result<NoisePoint, InputError> {
        let psd = self.psd(f)?;
        let validity = self.validity(f);
        Ok(NoisePoint {
            noise: self.name(),
            frequency_hz: f,
            asd: psd.sqrt(),
            psd,
            valid: validity == NoiseValidity::Valid,
            validity,
            band_hz: self.band(),
            response: self.response(),
            source: self.source(),
        })
    }

    fn check(&self, f: f64) -> Result<(), InputError> {
        finite("frequency", f)?;
        if self.validity(f) == NoiseValidity::Outside {
            let (lo, hi) = self.band();
            return Err(InputError::OutOfRange {
                field: "frequency",
                value: f,
                allowed: format!("{lo:e} Hz ≤ f ≤ {hi:e} Hz, the band of the noise curve '{}'", self.name()),
            });
        }
        Ok(())
    }

    /// S_n(f) for f already known to be inside the band (the quadrature's hot path).
    pub(crate) fn psd_in_band(&self, f: f64) -> f64 {
        match self {
            NoiseCurve::AdvancedLigo => aligo_psd(f),
            NoiseCurve::Lisa { confusion } => lisa_psd(f, *confusion),
            NoiseCurve::Table(t) => t.psd_in_band(f),
        }
    }
}

/// Ajith 2011 (arXiv:1107.1267) aLIGO zero-detuned high-power fit, Hz⁻¹.
fn aligo_psd(f: f64) -> f64 {
    let x = f / ALIGO_F0;
    let x2 = x * x;
    ALIGO_S0 * (x.powf(-4.14) - 5.0 / x2 + 111.0 * (1.0 - x2 + 0.5 * x2 * x2) / (1.0 + 0.5 * x2))
}

/// Robson, Cornish & Liu 2019 (arXiv:1803.01944), eq. (13) instrument part plus eq. (14).
fn lisa_psd(f: f64, confusion: Option<LisaObservation>) -> f64 {
    let fstar = lisa_transfer_frequency();
    // Eq. (10): P_OMS = (1.5e-11 m)² (1 + (2 mHz/f)⁴) Hz⁻¹.
    let r_oms = 2e-3 / f;
    let p_oms = LISA_OMS_M * LISA_OMS_M * (1.0 + r_oms * r_oms * r_oms * r_oms);
    // Eq. (11): P_acc = (3e-15 m s⁻²)² (1 + (0.4 mHz/f)²)(1 + (f/8 mHz)⁴) Hz⁻¹.
    let r_lo = 4e-4 / f;
    let r_hi = f / 8e-3;
    let p_acc = LISA_ACC * LISA_ACC * (1.0 + r_lo * r_lo) * (1.0 + r_hi * r_hi * r_hi * r_hi);
    let w = 2.0 * std::f64::consts::PI * f;
    let w4 = (w * w) * (w * w);
    let c = (f / fstar).cos();
    let y = f / fstar;
    // Eq. (13): S_n = 10/(3L²) [P_OMS + 2(1 + cos²(f/f*)) P_acc/(2πf)⁴] (1 + 0.6 (f/f*)²) + S_c.
    let instrument = 10.0 / (3.0 * LISA_ARM_M * LISA_ARM_M) * (p_oms + 2.0 * (1.0 + c * c) * p_acc / w4) * (1.0 + 0.6 * y * y);
    match confusion {
        None => instrument,
        Some(t) => instrument + lisa_confusion(f, t),
    }
}

/// Robson et al. 2019, eq. (14): S_c = A f^−7/3 exp(−f^α + β f sin κf) [1 + tanh(γ(f_k − f))].
fn lisa_confusion(f: f64, t: LisaObservation) -> f64 {
    let p = t.fit();
    LISA_CONF_A * f.powf(-7.0 / 3.0) * (-f.powf(p.alpha) + p.beta * f * (p.kappa * f).sin()).exp() * (1.0 + (p.gamma * (p.f_knee - f)).tanh())
}

/// The galactic confusion noise S_c(f) alone (Hz⁻¹) for an observation time, Robson et al. 2019
/// eq. (14) with their Table 1 (for plots and checks).
pub fn lisa_confusion_psd(f: f64, t: LisaObservation) -> f64 {
    lisa_confusion(f, t)
}

impl NoiseTable {
    /// Reads a table of frequency [Hz] and amplitude spectral density [Hz^−1/2].
    ///
    /// # Format
    /// One row per line, two numbers separated by a comma (or, when a line has no comma, by
    /// spaces, tabs or a semicolon). Empty lines are skipped; `#` starts a comment (a whole line or
    /// the rest of a line). The first row that is not a comment may be a header (any row whose
    /// fields are not both numbers); any later such row is an error. Frequencies must be finite,
    /// positive and strictly increasing; ASD values finite and positive; at least two rows.
    ///
    /// # Errors
    /// [`InputError::Inconsistent`] naming `noise` with the line number (1-based, counting every
    /// line of the text) and what is wrong.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::detection::{NoiseTable, Response};
    /// let t = NoiseTable::parse_csv("mine", "f,asd\n10,1e-22\n100,1e-23\n", Response::Interferometer).unwrap();
    /// assert!((t.asd(31.622776601683793).unwrap() / 3.1622776601683794e-23 - 1.0).abs() < 1e-13);
    /// let e = NoiseTable::parse_csv("mine", "10,1e-22\n5,1e-23\n", Response::Interferometer).unwrap_err();
    /// assert!(e.to_string().contains("line 2"));
    /// ```
    pub fn parse_csv(label: &str, text: &str, response: Response) -> Result<Self, InputError> {
        let bad = |line: usize, what: String| InputError::Inconsistent { field: "noise", reason: format!("line {line}: {what}") };
        let mut ln_f: Vec<f64> = Vec::new();
        let mut ln_asd: Vec<f64> = Vec::new();
        let mut last_f = 0.0;
        let mut first_f = 0.0;
        let mut seen_row = false;
        for (i, raw) in text.lines().enumerate() {
            let line = i + 1;
            let body = raw.split('#').next().unwrap_or("").trim();
            if body.is_empty() {
                continue;
            }
            let fields: Vec<&str> = if body.contains(',') {
                body.split(',').map(str::trim).collect()
            } else {
                body.split(|c: char| c.is_whitespace() || c == ';').filter(|s| !s.is_empty()).collect()
            };
            let nums: Vec<Option<f64>> = fields.iter().map(|s| s.parse::<f64>().ok()).collect();
            let first_row = !seen_row;
            seen_row = true;
            if nums.iter().any(Option::is_none) {
                if first_row {
                    continue; // header
                }
                let which = fields.iter().zip(&nums).find(|(_, n)| n.is_none()).map(|(s, _)| *s).unwrap_or("");
                return Err(bad(line, format!("'{which}' is not a number (rows are: frequency in Hz, ASD in 1/√Hz)")));
            }
            if fields.len() != 2 {
                return Err(bad(line, format!("{} columns; expected 2 (frequency in Hz, ASD in 1/√Hz)", fields.len())));
            }
            let (f, a) = match (nums[0], nums[1]) {
                (Some(f), Some(a)) => (f, a),
                _ => return Err(bad(line, "expected two numbers".into())),
            };
            if !f.is_finite() || f <= 0.0 {
                return Err(bad(line, format!("frequency {f} must be a finite number > 0 Hz")));
            }
            if !a.is_finite() || a <= 0.0 {
                return Err(bad(line, format!("ASD {a} must be a finite number > 0 (1/√Hz)")));
            }
            if !ln_f.is_empty() && f <= last_f {
                return Err(bad(line, format!("frequency {f} Hz is not above the previous row's {last_f} Hz (frequencies must increase strictly)")));
            }
            if ln_f.is_empty() {
                first_f = f;
            }
            last_f = f;
            ln_f.push(f.ln());
            ln_asd.push(a.ln());
        }
        if ln_f.len() < 2 {
            return Err(InputError::Inconsistent { field: "noise", reason: format!("the table has {} data rows; at least 2 are needed", ln_f.len()) });
        }
        let (f_first, f_last) = (first_f, last_f);
        Ok(NoiseTable { label: label.to_string(), f_first, f_last, ln_f, ln_asd, response })
    }

    /// The label given when reading the table.
    pub fn label(&self) -> &str {
        &self.label
    }

    /// Number of rows.
    pub fn len(&self) -> usize {
        self.ln_f.len()
    }

    /// Always false: a table has at least two rows.
    pub fn is_empty(&self) -> bool {
        self.ln_f.is_empty()
    }

    /// First and last frequency (Hz).
    pub fn band(&self) -> (f64, f64) {
        (self.f_first, self.f_last)
    }

    /// ASD at f (Hz), interpolated linearly in (ln f, ln ASD).
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `frequency` outside the table's range.
    pub fn asd(&self, f: f64) -> Result<f64, InputError> {
        finite("frequency", f)?;
        let (lo, hi) = self.band();
        if !(f >= lo && f <= hi) {
            return Err(InputError::OutOfRange {
                field: "frequency",
                value: f,
                allowed: format!("{lo:e} Hz ≤ f ≤ {hi:e} Hz, the range of the table '{}'", self.label),
            });
        }
        Ok(self.psd_in_band(f).sqrt())
    }

    fn psd_in_band(&self, f: f64) -> f64 {
        let x = f.ln();
        let n = self.ln_f.len();
        // Index of the interval [x_i, x_{i+1}] holding x (clamped at the ends).
        let i = self.ln_f.partition_point(|&v| v <= x).clamp(1, n - 1) - 1;
        let (x0, x1) = (self.ln_f[i], self.ln_f[i + 1]);
        let t = ((x - x0) / (x1 - x0)).clamp(0.0, 1.0);
        let ln_a = self.ln_asd[i] + t * (self.ln_asd[i + 1] - self.ln_asd[i]);
        (2.0 * ln_a).exp()
    }
}
