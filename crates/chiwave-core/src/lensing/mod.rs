//! Point-mass lensing (Einstein radius, images, magnifications, time delay) and wave optics
//! (the Takahashi & Nakamura 2003 amplification factor, in [`wave`]).
//!
//! Sources (deflection sheet §4, VERIFIED there): Einstein 1936; Refsdal 1964; Paczyński 1986,
//! ApJ 304, 1; Schneider, Ehlers & Falco 1992 (*Gravitational Lenses*); Takahashi & Nakamura 2003,
//! ApJ 595, 1039, astro-ph/0305055 for the time delay in units of 4GM_Lz/c³ and the wave optics.
//!
//! Conventions:
//! - Thin lens, point mass, flat space: D_LS = D_S − D_L. This is right for Galactic lenses;
//!   a cosmological lens needs angular-diameter distances (and D_LS ≠ D_S − D_L), which this
//!   module does not compute: give D_L, D_S accordingly and read the `distances` flag.
//! - u = y = β/θ_E > 0 (`offset`). Image positions are signed, in units of θ_E, positive on the
//!   source's side; magnifications are signed (the saddle image has μ₋ < 0).
//! - The redshifted mass M_Lz = (1 + z_L) M enters the time delay and w; θ_E uses M.
//! - Waves ∝ e^{−iωt} (see [`wave`]).

pub mod kummer;
pub mod wave;

pub use wave::{amplification_curve, AmplificationCurve};

use crate::error::InputError;
use crate::units::codata2018::C;
use crate::units::iau2015::GM_SUN;
use crate::units::{astro::AU, parse_frequency, parse_length, parse_mass, AngleUnit, Length, Mass, Quantity};
use crate::validity::{geometric_optics_level, Check, Flag, Level};
use serde::{Deserialize, Serialize};
use std::collections::BTreeMap;

/// The regime checks of this file: stable key and the label shown with it.
const DISTANCES: Check = Check::new("distances", "distances");
const LENSING_STRENGTH: Check = Check::new("lensing_strength", "source offset β/θ_E");
const GEOMETRIC_OPTICS: Check = Check::new("geometric_optics", "geometric optics w");
const AMPLIFICATION_METHOD: Check = Check::new("amplification_method", "amplification method");
const THIN_LENS: Check = Check::new("thin_lens", "thin lens 4GM/(c²R_E)");
const EINSTEIN_ANGLE: Check = Check::new("einstein_angle", "Einstein angle θ_E");
const INTERFERENCE_PHASE: Check = Check::new("interference_phase", "interference phase wΔT");

/// Smallest accepted offset u = β/θ_E (the point-source magnification ≈ 1/u diverges at 0).
pub const OFFSET_MIN: f64 = 1e-10;
/// Largest accepted offset u = β/θ_E (lensing is then ≈ 2/u⁴ in magnification).
pub const OFFSET_MAX: f64 = 1e6;
/// Largest accepted lens redshift.
pub const REDSHIFT_MAX: f64 = 1000.0;

/// A point-mass lens at a validated source offset u = β/θ_E (dimensionless).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PointLens {
    u: f64,
}

impl PointLens {
    /// Validates the offset u = β/θ_E.
    ///
    /// # Domain
    /// 1e-10 ≤ u ≤ 1e6. u = 0 (source on the caustic) is refused: the point-source
    /// magnification diverges there. The wave-optics F(w, 0) is finite: see
    /// [`wave::amplification_factor`].
    ///
    /// # Errors
    /// [`InputError::NotFinite`] or [`InputError::OutOfRange`] naming `offset`.
    pub fn new(offset: f64) -> Result<Self, InputError> {
        if !offset.is_finite() {
            return Err(InputError::NotFinite { field: "offset", value: offset });
        }
        if !(OFFSET_MIN..=OFFSET_MAX).contains(&offset) {
            return Err(InputError::OutOfRange {
                field: "offset",
                value: offset,
                allowed: format!(
                    "{OFFSET_MIN:e} ≤ offset ≤ {OFFSET_MAX:e} (β/θ_E; 0 is the caustic, where the point-source magnification diverges)"
                ),
            });
        }
        Ok(PointLens { u: offset })
    }

    /// The offset u = β/θ_E.
    pub fn offset(&self) -> f64 {
        self.u
    }

    /// Image positions [x₊, x₋] in units of θ_E (signed; x₋ < 0 is on the far side).
    ///
    /// # Formula
    /// x± = (u ± √(u² + 4))/2 (Paczyński 1986; deflection sheet §4). x₋ is computed as
    /// −2/(u + √(u² + 4)) (same value, no cancellation at large u).
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::PointLens;
    /// // x± = (0.5 ± √4.25)/2 = 1.28077640640442, −0.78077640640442 (elementary).
    /// let [xp, xm] = PointLens::new(0.5).unwrap().image_positions();
    /// assert!((xp - 1.28077640640442).abs() < 1e-13 && (xm + 0.78077640640442).abs() < 1e-13);
    /// ```
    pub fn image_positions(&self) -> [f64; 2] {
        let s = self.u.hypot(2.0);
        [0.5 * (self.u + s), -2.0 / (self.u + s)]
    }

    /// Signed magnifications [μ₊, μ₋] (μ₋ < 0, the saddle image).
    ///
    /// # Formula
    /// μ± = ±[(u² + 2)/(2u√(u² + 4)) ± 1/2] (Paczyński 1986; deflection sheet §4). |μ₋| is
    /// computed as 2/(u√(u² + 4)·(u² + 2 + u√(u² + 4))), the same value without cancellation
    /// (it falls like u⁻⁴). μ₊ + μ₋ = 1.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::PointLens;
    /// // Deflection sheet §4 at u = 0.5: μ+ = 1.5914103126635, μ− = −0.591410312663498.
    /// let [mp, mm] = PointLens::new(0.5).unwrap().magnifications();
    /// assert!((mp - 1.5914103126635).abs() < 1e-12 && (mm + 0.591410312663498).abs() < 1e-12);
    /// ```
    pub fn magnifications(&self) -> [f64; 2] {
        let u = self.u;
        let q = u * u.hypot(2.0);
        let half_total = (u * u + 2.0) / (2.0 * q);
        let minus = 2.0 / (q * (u * u + 2.0 + q));
        [half_total + 0.5, -minus]
    }

    /// Total magnification |μ₊| + |μ₋|.
    ///
    /// # Formula
    /// μ = (u² + 2)/(u√(u² + 4)) (Paczyński 1986; deflection sheet §4). Limits: μ ≈ 1/u as
    /// u → 0, μ − 1 ≈ 2/u⁴ as u → ∞; μ(1) = 3/√5 ≈ 1.342.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::PointLens;
    /// // Deflection sheet §4: μ_tot(0.5) = 2.182820625327.
    /// assert!((PointLens::new(0.5).unwrap().total_magnification() - 2.182820625327).abs() < 1e-12);
    /// ```
    pub fn total_magnification(&self) -> f64 {
        let u = self.u;
        (u * u + 2.0) / (u * u.hypot(2.0))
    }

    /// Dimensionless time delay ΔT between the images, in units of 4 G M_Lz / c³.
    ///
    /// # Formula
    /// ΔT = y√(y² + 4)/2 + ln[(√(y² + 4) + y)/(√(y² + 4) − y)] (Takahashi & Nakamura 2003,
    /// astro-ph/0305055; deflection sheet §4); the logarithm equals 2 asinh(y/2), used here.
    /// Limits: ΔT ≈ 2y for y → 0, ΔT ≈ y²/2 + 2 ln y for y → ∞.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::PointLens;
    /// // ΔT(1) = √5/2 + ln((√5 + 1)/(√5 − 1)) = 2.08045763886910 (elementary; mpmath 1.3 check).
    /// assert!((PointLens::new(1.0).unwrap().time_delay() - 2.08045763886910).abs() < 1e-13);
    /// ```
    pub fn time_delay(&self) -> f64 {
        let y = self.u;
        0.5 * y * y.hypot(2.0) + 2.0 * (0.5 * y).asinh()
    }
}

/// Angular Einstein radius of a point mass.
///
/// # Formula
/// θ_E = √(4 G M D_LS / (c² D_L D_S)), D_LS = D_S − D_L (Einstein 1936; Schneider, Ehlers &
/// Falco 1992; deflection sheet §4). Flat space: a cosmological lens needs angular-diameter
/// distances, with D_LS ≠ D_S − D_L.
///
/// # Domain
/// `gm` (G M, m³ s⁻²) > 0; 0 < `d_l` < `d_s` (metres).
///
/// # Errors
/// Range errors naming `mass`, `lens_distance` or `source_distance`; `mass` if θ_E under- or
/// overflows.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::einstein_angle;
/// use chiwave_core::units::{astro::KPC, iau2015::GM_SUN};
/// // Deflection sheet §4 worked example: 0.3 M☉, 4 kpc, 8 kpc → 2.67920207569003e-9 rad.
/// let t = einstein_angle(0.3 * GM_SUN, 4.0 * KPC, 8.0 * KPC).unwrap();
/// assert!((t / 2.67920207569003e-9 - 1.0).abs() < 1e-12);
/// ```
pub fn einstein_angle(gm: f64, d_l: f64, d_s: f64) -> Result<f64, InputError> {
    crate::error::positive("mass", gm)?;
    crate::error::positive("lens_distance", d_l)?;
    crate::error::positive("source_distance", d_s)?;
    if d_l >= d_s {
        return Err(InputError::OutOfRange {
            field: "lens_distance",
            value: d_l,
            allowed: format!("0 < lens_distance < source_distance = {d_s:e} m (values in metres)"),
        });
    }
    let d_ls = d_s - d_l;
    // Written as a product of ratios so that nothing overflows before the square root.
    let theta = (4.0 * (gm / (C * C)) / d_l * (d_ls / d_s)).sqrt();
    if !(theta.is_finite() && theta >= f64::MIN_POSITIVE) {
        return Err(InputError::OutOfRange {
            field: "mass",
            value: gm,
            allowed: "a mass and distances whose Einstein angle fits double precision".into(),
        });
    }
    Ok(theta)
}

/// Point-lens request, as the page and `chiwave lens` send it.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LensRequest {
    /// Lens mass with a unit (e.g. `"0.3Msun"`); a physical mass is required.
    pub mass: Quantity,
    /// Observer–lens distance D_L (e.g. `"4kpc"`; a bare number is in units of GM/c²).
    pub lens_distance: Quantity,
    /// Observer–source distance D_S > D_L.
    pub source_distance: Quantity,
    /// Source position β in units of the Einstein radius, 1e-10 ≤ offset ≤ 1e6.
    pub offset: f64,
    /// Wave frequency (e.g. `"100Hz"`); when present, w and the amplification factor are given.
    #[serde(default)]
    pub frequency: Option<Quantity>,
    /// Lens redshift z_L, 0 ≤ z_L ≤ 1000 (the redshifted mass (1 + z_L) M enters w and the delay).
    #[serde(default)]
    pub lens_redshift: f64,
}

/// One lensed image.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Image {
    /// Position in units of θ_E, signed (positive on the source's side).
    pub position: f64,
    /// Signed magnification (negative for the saddle image).
    pub magnification: f64,
}

/// A complex number as JSON `{"re": …, "im": …}`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ComplexValue {
    pub re: f64,
    pub im: f64,
}

impl From<num_complex::Complex64> for ComplexValue {
    fn from(z: num_complex::Complex64) -> Self {
        ComplexValue { re: z.re, im: z.im }
    }
}

/// Point-lens result. The keys `einstein_radius_rad`, `images`, `total_magnification`,
/// `time_delay_s`, `w` and `amplification` are the stable CLI contract.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LensResult {
    /// θ_E in radians.
    pub einstein_radius_rad: f64,
    /// θ_E in milliarcseconds.
    pub einstein_radius_mas: f64,
    /// R_E = θ_E D_L in au.
    pub einstein_radius_au: f64,
    /// R_E in metres.
    pub einstein_radius_m: f64,
    /// The images: first the minimum (x₊ > 0, μ₊ > 0), then the saddle (x₋ < 0, μ₋ < 0).
    pub images: Vec<Image>,
    /// |μ₊| + |μ₋|.
    pub total_magnification: f64,
    /// Arrival-time difference (saddle − minimum) in seconds, observer frame.
    pub time_delay_s: f64,
    /// The same in units of 4 G M_Lz / c³ (ΔT).
    pub time_delay_dimensionless: f64,
    /// Echo of the offset u = β/θ_E.
    pub offset: f64,
    /// Lens mass in nominal solar masses.
    pub mass_msun: f64,
    /// Redshifted mass (1 + z_L) M in nominal solar masses.
    pub redshifted_mass_msun: f64,
    /// Frequency in Hz, when given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub frequency_hz: Option<f64>,
    /// Dimensionless frequency w = 8π G M_Lz f / c³, when a frequency is given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub w: Option<f64>,
    /// Amplification factor F(w, y) (exact, or its geometric limit: see `amplification_method`).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification: Option<ComplexValue>,
    /// |F|.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_abs: Option<f64>,
    /// arg F in radians.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_phase_rad: Option<f64>,
    /// Geometric-optics F_geo = √|μ₊| − i√|μ₋| e^{iwΔT}.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_geometric: Option<ComplexValue>,
    /// `"series"`, `"continuation"`, `"asymptotic"` (all exact) or `"geometric_optics"`.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub amplification_method: Option<&'static str>,
    /// Regime flags.
    pub flags: Vec<Flag>,
    /// Output key → source of its formula.
    pub sources: BTreeMap<&'static str, &'static str>,
}

const SRC_EINSTEIN: &str = "Einstein 1936; Refsdal 1964; Schneider, Ehlers & Falco 1992, Gravitational Lenses; deflection sheet §4";
const SRC_IMAGES: &str = "Paczyński 1986, ApJ 304, 1; Schneider, Ehlers & Falco 1992; deflection sheet §4";
const SRC_DELAY: &str = "Takahashi & Nakamura 2003, ApJ 595, 1039, arXiv:astro-ph/0305055 (T(y) in units of 4GM_Lz/c³); deflection sheet §4";
const SRC_WAVE: &str = "Takahashi & Nakamura 2003, ApJ 595, 1039, arXiv:astro-ph/0305055 (point-lens F(w, y), e^{-iωt} convention); deflection sheet §4";

impl LensRequest {
    /// Evaluates the request.
    ///
    /// # Errors
    /// Validation errors naming the field and its allowed range: `mass` (physical, > 0),
    /// `lens_distance`, `source_distance` (> 0, D_L < D_S), `offset` (1e-10 … 1e6),
    /// `lens_redshift` (0 … 1000), `frequency` (> 0, with finite w).
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::LensRequest;
    /// let r = LensRequest {
    ///     mass: "0.3Msun".into(), lens_distance: "4kpc".into(), source_distance: "8kpc".into(),
    ///     offset: 0.5, frequency: None, lens_redshift: 0.0,
    /// };
    /// let out = r.evaluate().unwrap();
    /// // Deflection sheet §4 worked example: θ_E = 0.552625097039022 mas, R_E = 2.21050038815609 au.
    /// assert!((out.einstein_radius_mas / 0.552625097039022 - 1.0).abs() < 1e-12);
    /// assert!((out.einstein_radius_au / 2.21050038815609 - 1.0).abs() < 1e-12);
    /// ```
    pub fn evaluate(&self) -> Result<LensResult, InputError> {
        let gm = match parse_mass("mass", &self.mass)? {
            Mass::Physical { gm } => gm,
            Mass::Geometric(_) => {
                return Err(InputError::Inconsistent {
                    field: "mass",
                    reason: "give the lens mass with a unit (kg, g, Msun, Mearth, Mjup), e.g. 0.3Msun; lensing needs a physical mass".into(),
                })
            }
        };
        let mass_length = gm / (C * C);
        let metres = |field: &'static str, q: &Quantity| -> Result<f64, InputError> {
            let v = match parse_length(field, q)? {
                Length::Physical { m } => m,
                Length::Geometric(x) => x * mass_length,
            };
            crate::error::positive(field, v)
        };
        let d_l = metres("lens_distance", &self.lens_distance)?;
        let d_s = metres("source_distance", &self.source_distance)?;
        let lens = PointLens::new(self.offset)?;
        let z_l = self.lens_redshift;
        if !z_l.is_finite() {
            return Err(InputError::NotFinite { field: "lens_redshift", value: z_l });
        }
        if !(0.0..=REDSHIFT_MAX).contains(&z_l) {
            return Err(InputError::OutOfRange {
                field: "lens_redshift",
                value: z_l,
                allowed: format!("0 ≤ lens_redshift ≤ {REDSHIFT_MAX}"),
            });
        }
        let frequency = match &self.frequency {
            Some(q) => Some(parse_frequency("frequency", q)?),
            None => None,
        };
        let theta = einstein_angle(gm, d_l, d_s)?;
        let r_e = theta * d_l;
        let gm_z = (1.0 + z_l) * gm;
        let [x_p, x_m] = lens.image_positions();
        let [mu_p, mu_m] = lens.magnifications();
        let delta_t = lens.time_delay();
        let time_delay_s = 4.0 * gm_z / (C * C * C) * delta_t;

        let mut flags = point_lens_flags(theta, gm, r_e, z_l, lens.offset());
        let mut sources = BTreeMap::new();
        for k in ["einstein_radius_rad", "einstein_radius_mas", "einstein_radius_au", "einstein_radius_m"] {
            sources.insert(k, SRC_EINSTEIN);
        }
        sources.insert("images", SRC_IMAGES);
        sources.insert("total_magnification", SRC_IMAGES);
        sources.insert("time_delay_s", SRC_DELAY);
        sources.insert("time_delay_dimensionless", SRC_DELAY);
        sources.insert("mass_msun", "IAU 2015 Resolution B3 nominal (GM)☉ (Prša et al. 2016, arXiv:1605.09788)");

        let mut result = LensResult {
            einstein_radius_rad: theta,
            einstein_radius_mas: AngleUnit::Mas.from_rad(theta),
            einstein_radius_au: r_e / AU,
            einstein_radius_m: r_e,
            images: vec![
                Image { position: x_p, magnification: mu_p },
                Image { position: x_m, magnification: mu_m },
            ],
            total_magnification: lens.total_magnification(),
            time_delay_s,
            time_delay_dimensionless: delta_t,
            offset: lens.offset(),
            mass_msun: gm / GM_SUN,
            redshifted_mass_msun: gm_z / GM_SUN,
            frequency_hz: frequency,
            w: None,
            amplification: None,
            amplification_abs: None,
            amplification_phase_rad: None,
            amplification_geometric: None,
            amplification_method: None,
            flags: Vec::new(),
            sources,
        };

        if let Some(f) = frequency {
            let w = wave::dimensionless_frequency(gm_z, f);
            if !(w.is_finite() && w <= wave::W_MAX) {
                return Err(InputError::OutOfRange {
                    field: "frequency",
                    value: f,
                    allowed: format!(
                        "a frequency giving w = 8πG(1 + z_L)M f/c³ ≤ {:e} (here w = {w:e})",
                        wave::W_MAX
                    ),
                });
            }
            let to_request = |e: InputError| match e {
                InputError::OutOfRange { field: "y", value, allowed } => {
                    InputError::OutOfRange { field: "offset", value, allowed }
                }
                InputError::OutOfRange { field: "w", value, allowed } => {
                    InputError::OutOfRange { field: "frequency", value, allowed }
                }
                other => other,
            };
            let a = wave::amplification(w, lens.offset()).map_err(to_request)?;
            let geo = wave::amplification_geometric(w, lens.offset()).map_err(to_request)?;
            result.w = Some(w);
            result.amplification = Some(a.value.into());
            result.amplification_abs = Some(a.value.norm());
            result.amplification_phase_rad = Some(a.value.arg());
            result.amplification_geometric = Some(geo.into());
            result.amplification_method = Some(match a.method {
                wave::Method::Series => "series",
                wave::Method::Continuation { .. } => "continuation",
                wave::Method::Asymptotic => "asymptotic",
                wave::Method::GeometricOptics => "geometric_optics",
            });
            for k in ["w", "amplification", "amplification_abs", "amplification_phase_rad", "amplification_geometric"] {
                result.sources.insert(k, SRC_WAVE);
            }
            flags.extend(wave_flags(w, delta_t, a.method));
        }
        result.flags = flags;
        Ok(result)
    }
}

/// Flags for the ray-optics point lens: thin lens / weak deflection, distances, offset regime.
fn point_lens_flags(theta: f64, gm: f64, r_e: f64, z_l: f64, u: f64) -> Vec<Flag> {
    let mut flags = Vec::new();
    // Deflection at the Einstein ring, 4GM/(c² R_E): the thin-lens formulas are its first order.
    let alpha_e = 4.0 * gm / (C * C) / r_e;
    flags.push(Flag::small_parameter(
        THIN_LENS,
        alpha_e,
        1e-4,
        1e-2,
        [
            "Weak deflection at the Einstein ring (4GM/(c²R_E) small): thin-lens point-mass formulas apply, provided the lens is compact (its size ≪ R_E) and isolated.",
            "The deflection at the Einstein ring is not tiny: second-order (post-thin-lens) corrections reach this relative size.",
            "Strong deflection at the Einstein ring: the thin-lens weak-field formulas do not hold; use the exact deflection.",
        ],
    ));
    flags.push(Flag::small_parameter(
        EINSTEIN_ANGLE,
        theta,
        1e-3,
        1e-1,
        [
            "Small-angle approximation holds (θ_E ≪ 1 rad).",
            "θ_E is not small: small-angle lens equation is only indicative.",
            "θ_E is not small: the small-angle lens equation does not hold.",
        ],
    ));
    if z_l > 0.0 {
        flags.push(Flag::new(
            DISTANCES,
            Level::Caution,
            Some(z_l),
            "Lens at a cosmological redshift: θ_E and R_E use D_LS = D_S − D_L (flat space); for a cosmological lens give angular-diameter distances and note that D_LS ≠ D_S − D_L. The redshifted mass (1 + z_L)M is applied to the time delay and w.",
        ));
    } else {
        flags.push(Flag::new(
            DISTANCES,
            Level::Ok,
            Some(0.0),
            "Flat-space distances, D_LS = D_S − D_L (Galactic lens).",
        ));
    }
    let (level, msg) = if u < 0.01 {
        (Level::Caution, "Source within 0.01 θ_E of the lens: point-source magnification ≈ 1/u; a finite source size caps it.")
    } else if u < 1.0 {
        (Level::Ok, "Strong lensing regime: the source lies inside the Einstein ring (μ_tot > 1.342); two bright images.")
    } else if u < 10.0 {
        (Level::Ok, "Source outside the Einstein ring: the saddle image is faint (μ_tot < 1.342).")
    } else {
        (Level::Ok, "Weak lensing regime (u ≥ 10): μ_tot − 1 ≈ 2/u⁴, the saddle image is negligible.")
    };
    flags.push(Flag::new(LENSING_STRENGTH, level, Some(u), msg));
    flags
}

/// Flags for the wave-optics part: geometric-optics validity and the F method.
fn wave_flags(w: f64, delta_t: f64, method: wave::Method) -> Vec<Flag> {
    let mut flags = Vec::new();
    // The interference phase wΔT (value, radians) is carried in f64: its absolute error is
    // ~1e-16·wΔT rad, 1e-6 rad at 1e10 and 1e-2 rad at 1e14.
    flags.push(Flag::small_parameter(
        INTERFERENCE_PHASE,
        w * delta_t,
        1e10,
        1e14,
        [
            "The interference phase wΔT is resolved (double precision).",
            "The interference phase wΔT (this value, in radians) is large: its rounding error reaches 1e-6 to 1e-2 rad; fine oscillations in F are only indicative.",
            "The interference phase wΔT exceeds what double precision resolves: the oscillating part of F (the phase of the faint image) is not meaningful, only its envelope.",
        ],
    ));
    let level = geometric_optics_level(w);
    let msg = match level {
        Level::Ok => "w ≫ 1: geometric optics holds to ~1/w; the ray magnifications describe the signal.",
        Level::Caution => "w of order 1–100: diffraction changes the amplification by ~1/w; use `amplification`, not the ray magnifications.",
        Level::Invalid => "w < 1: the wavelength exceeds the lens' Schwarzschild radius; diffraction dominates and |F| → 1. The ray magnifications do not describe the signal.",
    };
    flags.push(Flag::new(GEOMETRIC_OPTICS, level, Some(w), msg));
    let level = if method == wave::Method::GeometricOptics { Level::Caution } else { Level::Ok };
    let value = match method {
        wave::Method::Continuation { steps } => Some(steps as f64),
        _ => None,
    };
    flags.push(Flag::new(AMPLIFICATION_METHOD, level, value, method.describe()));
    flags
}

/// Plot data for the ray-optics magnification against the offset.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct MagnificationCurve {
    /// Offsets u = β/θ_E, evenly spaced.
    pub offset: Vec<f64>,
    /// Total magnification.
    pub total: Vec<f64>,
    /// μ₊ (minimum image).
    pub plus: Vec<f64>,
    /// μ₋ (saddle image, negative).
    pub minus: Vec<f64>,
}

/// μ(u) on n evenly spaced offsets from `offset_min` to `offset_max`.
///
/// # Domain
/// 1e-10 ≤ offset_min < offset_max ≤ 1e6, 2 ≤ n ≤ 100 000.
///
/// # Errors
/// Range errors naming `offset_min`, `offset_max` or `n`.
///
/// # Examples
/// ```
/// use chiwave_core::lensing::magnification_curve;
/// let c = magnification_curve(0.5, 1.0, 3).unwrap();
/// // μ(1) = 3/√5 (Paczyński 1986; deflection sheet §4 formula at u = 1).
/// assert!((c.total[2] - 3.0 / 5f64.sqrt()).abs() < 1e-14);
/// ```
pub fn magnification_curve(offset_min: f64, offset_max: f64, n: usize) -> Result<MagnificationCurve, InputError> {
    let rename = |e: InputError, field: &'static str| match e {
        InputError::OutOfRange { value, allowed, .. } => InputError::OutOfRange { field, value, allowed },
        InputError::NotFinite { value, .. } => InputError::NotFinite { field, value },
        other => other,
    };
    PointLens::new(offset_min).map_err(|e| rename(e, "offset_min"))?;
    PointLens::new(offset_max).map_err(|e| rename(e, "offset_max"))?;
    if offset_min >= offset_max {
        return Err(InputError::OutOfRange {
            field: "offset_max",
            value: offset_max,
            allowed: format!("offset_max > offset_min = {offset_min}"),
        });
    }
    if !(2..=100_000).contains(&n) {
        return Err(InputError::OutOfRange { field: "n", value: n as f64, allowed: "2 ≤ n ≤ 100000".into() });
    }
    let mut c = MagnificationCurve {
        offset: Vec::with_capacity(n),
        total: Vec::with_capacity(n),
        plus: Vec::with_capacity(n),
        minus: Vec::with_capacity(n),
    };
    for k in 0..n {
        let u = if k == n - 1 { offset_max } else { offset_min + (offset_max - offset_min) * k as f64 / (n - 1) as f64 };
        let lens = PointLens::new(u)?;
        let [p, m] = lens.magnifications();
        c.offset.push(u);
        c.total.push(lens.total_magnification());
        c.plus.push(p);
        c.minus.push(m);
    }
    Ok(c)
}
