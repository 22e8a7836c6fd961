//! Point-mass lensing (Einstein radius, images, magnifications, time delay) and wave optics
//! (the Takahashi & Nakamura 2003 amplification factor, in [`wave`]).
//!
//! Sources: Einstein 1936; Refsdal 1964; Paczyński 1986,
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
//!
//! Files: `request.rs` (the request and its evaluation), `results.rs`, `flags.rs`, `sources.rs`;
//! the point lens ([`PointLens`], [`einstein_angle`], [`magnification_curve`]) here; wave optics
//! in [`wave`] with its special functions in [`kummer`].

pub mod kummer;
pub mod wave;

mod accuracy;
mod flags;
mod request;
mod results;
mod sources;

pub use request::LensRequest;
pub use results::{ComplexValue, Image, LensResult};
pub use wave::{amplification_curve, AmplificationCurve};

use crate::error::InputError;
use crate::units::codata2018::C;
use serde::Serialize;

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
    /// x± = (u ± √(u² + 4))/2 (Paczyński 1986, ApJ 304, 1). x₋ is computed as
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
    /// μ± = ±[(u² + 2)/(2u√(u² + 4)) ± 1/2] (Paczyński 1986, ApJ 304, 1). |μ₋| is
    /// computed as 2/(u√(u² + 4)·(u² + 2 + u√(u² + 4))), the same value without cancellation
    /// (it falls like u⁻⁴). μ₊ + μ₋ = 1.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::PointLens;
    /// // Paczyński 1986 formulas at u = 0.5, evaluated by hand: μ+ = 1.5914103126635, μ− = −0.591410312663498.
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
    /// μ = (u² + 2)/(u√(u² + 4)) (Paczyński 1986, ApJ 304, 1). Limits: μ ≈ 1/u as
    /// u → 0, μ − 1 ≈ 2/u⁴ as u → ∞; μ(1) = 3/√5 ≈ 1.342.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::lensing::PointLens;
    /// // Paczyński 1986 formula, evaluated by hand: μ_tot(0.5) = 2.182820625327.
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
    /// astro-ph/0305055); the logarithm equals 2 asinh(y/2), used here.
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
/// Falco 1992). Flat space: a cosmological lens needs angular-diameter
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
/// // θ_E = √(4GM D_LS/(c² D_L D_S)) evaluated by hand (IAU 2015 nominal GM☉, IAU 2012 au):
/// // 0.3 M☉, 4 kpc, 8 kpc → 2.67920207569003e-9 rad.
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
/// // μ(1) = 3/√5 (Paczyński 1986 formula at u = 1).
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
