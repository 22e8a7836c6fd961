//! Two-body kinematics at infinity, in units G = c = 1 and M = m1 + m2 = 1: the relative speed
//! ([`RelativeSpeed`], the one γ-from-v conversion of the program) and the derived energies,
//! momenta and angular momenta ([`Kinematics`]).
//!
//! γ = u1·u2, p∞ = √(γ² − 1), ν = m1 m2/M², h = Γ = E/M = √(1 + 2ν(γ − 1)),
//! p = |p_CM| = ν p∞/h, J = p b, j = J/(G m1 m2) = p∞ b/h (b in units of GM/c², orthogonal to
//! the incoming momenta). γ − 1 is carried separately so that slow encounters (v ≪ 1) keep
//! their digits.
//!
//! Sources: these are the standard definitions of the post-Minkowskian literature, as used in
//! Damour 2016, arXiv:1609.00354 (h = E/M, the exact energy map, and j = J/(G m1 m2)).

use crate::error::InputError;
use serde::Serialize;

/// The relative speed of two bodies at infinity: the Lorentz factor γ with γ − 1 and
/// p∞ = √(γ² − 1) kept to full relative precision, and v.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct RelativeSpeed {
    /// γ = 1/√(1 − v²).
    pub gamma: f64,
    /// γ − 1 (accurate also for v ≪ 1).
    pub gamma_m1: f64,
    /// p∞ = γ v = √(γ² − 1).
    pub p_inf: f64,
    /// Relative speed at infinity, fraction of c.
    pub v: f64,
}

/// The former name of [`RelativeSpeed`] (it holds γ, v and p∞; it is not a boost).
#[deprecated(note = "renamed RelativeSpeed")]
pub type Boost = RelativeSpeed;

/// Smallest accepted p∞ = γ v (v ≈ 3 m/s): below it the 3PM coefficients (∝ p∞⁻³) lose meaning.
pub const P_INF_MIN: f64 = 1e-8;
/// Largest accepted γ (every two-body request; an observable may accept less, see its docs).
pub const GAMMA_MAX: f64 = 1e6;
/// The accepted range of γ, in the words of every error message.
pub const GAMMA_RANGE: &str = "1 < γ ≤ 1e6 with p∞ = √(γ² − 1) ≥ 1e-8 (v ≥ 3 m/s)";
/// The accepted range of v, in the words of every error message.
pub const V_RANGE: &str =
    "0 < v < c (299792.458 km/s) with v ≥ 1e-8 c (3 m/s) and γ ≤ 1e6; bare numbers are fractions of c";

impl RelativeSpeed {
    /// The speed for γ − 1 = `gm1`, or None outside [`GAMMA_RANGE`].
    fn checked(gm1: f64) -> Option<Self> {
        let gamma = 1.0 + gm1;
        let p_inf = (gm1 * (gamma + 1.0)).sqrt();
        if !(gm1 > 0.0) || !(p_inf >= P_INF_MIN) || gamma > GAMMA_MAX {
            return None;
        }
        Some(RelativeSpeed { gamma, gamma_m1: gm1, p_inf, v: p_inf / gamma })
    }

    /// From γ − 1 (> 0).
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `field` (value γ) outside [`GAMMA_RANGE`].
    pub fn from_gamma_m1(field: &'static str, gm1: f64) -> Result<Self, InputError> {
        crate::error::finite(field, gm1)?;
        Self::checked(gm1).ok_or_else(|| InputError::OutOfRange { field, value: 1.0 + gm1, allowed: GAMMA_RANGE.into() })
    }

    /// From γ itself.
    ///
    /// # Errors
    /// [`InputError`] naming `gamma`: not finite, or outside [`GAMMA_RANGE`].
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::two_body::RelativeSpeed;
    /// let s = RelativeSpeed::from_gamma(1.25).unwrap();
    /// assert!((s.v - 0.6).abs() < 1e-15 && (s.p_inf - 0.75).abs() < 1e-15);
    /// assert_eq!(RelativeSpeed::from_gamma(1.0).unwrap_err().field(), "gamma");
    /// ```
    pub fn from_gamma(gamma: f64) -> Result<Self, InputError> {
        crate::error::finite("gamma", gamma)?;
        if !(gamma > 1.0) {
            return Err(InputError::OutOfRange { field: "gamma", value: gamma, allowed: GAMMA_RANGE.into() });
        }
        Self::from_gamma_m1("gamma", gamma - 1.0)
    }

    /// From the relative speed v (fraction of c): the one conversion from v to γ.
    ///
    /// # Formula
    /// s = √((1 − v)(1 + v)), γ − 1 = v²/(s(1 + s)), p∞ = v/s (γ = 1/s, written without the
    /// cancellation of 1/s − 1 at small v; definitions of special relativity).
    ///
    /// # Errors
    /// [`InputError`] naming `v`: not finite, or outside [`V_RANGE`].
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::two_body::RelativeSpeed;
    /// let s = RelativeSpeed::from_v(0.6).unwrap();
    /// assert!((s.gamma - 1.25).abs() < 1e-15);
    /// // v = 1e-6: γ − 1 = v²/2 + 3v⁴/8 + … keeps its digits (Taylor series of 1/√(1 − v²)).
    /// let slow = RelativeSpeed::from_v(1e-6).unwrap();
    /// assert!((slow.gamma_m1 / 5e-13 - 1.0).abs() < 1e-12);
    /// ```
    pub fn from_v(v: f64) -> Result<Self, InputError> {
        crate::error::finite("v", v)?;
        let out_of_range = || InputError::OutOfRange { field: "v", value: v, allowed: V_RANGE.into() };
        if !(v > 0.0 && v < 1.0) {
            return Err(out_of_range());
        }
        let s = ((1.0 - v) * (1.0 + v)).sqrt();
        let gm1 = v * v / (s * (1.0 + s));
        let b = Self::checked(gm1).ok_or_else(out_of_range)?;
        // Keep the user's v and p∞ = v/√(1−v²) exactly as given.
        Ok(RelativeSpeed { v, p_inf: v / s, ..b })
    }
}

/// Which of b or j fixes the orbit.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Orbit {
    /// Impact parameter b in units of GM/c² (M = m1 + m2).
    B(f64),
    /// Reduced angular momentum j = J/(G m1 m2).
    J(f64),
}

/// Largest accepted b/(GM) or j (microscopic encounters have b/(GM) ~ 1e45).
pub const ORBIT_MAX: f64 = 1e60;
/// Smallest accepted b/(GM) or j (far inside capture; keeps 1/j⁸ finite).
pub const ORBIT_MIN: f64 = 1e-6;

/// Derived kinematics at infinity, M = 1, G = c = 1 (definitions in the module docs).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Kinematics {
    /// m1/M.
    pub m1: f64,
    /// m2/M.
    pub m2: f64,
    /// ν = m1 m2/M².
    pub nu: f64,
    #[serde(flatten)]
    pub speed: RelativeSpeed,
    /// h = Γ = E/M = √(1 + 2ν(γ − 1)).
    pub h: f64,
    /// Total CM energy E/(M c²) (= h).
    #[serde(rename = "E")]
    pub e: f64,
    /// CM energy of body 1, E1 = (m1² + m1 m2 γ)/E, units of M c².
    #[serde(rename = "E1")]
    pub e1: f64,
    /// CM energy of body 2, units of M c².
    #[serde(rename = "E2")]
    pub e2: f64,
    /// CM momentum p = ν p∞/h, units of M c.
    pub p_cm: f64,
    /// J = p b, units of G M²/c.
    #[serde(rename = "J")]
    pub j_total: f64,
    /// j = J/(G m1 m2) = p∞ b/h.
    pub j: f64,
    /// b in units of GM/c².
    pub b_over_gm: f64,
}

impl Kinematics {
    /// Builds the kinematics from masses (any common unit; only m1/M and m2/M are used),
    /// the relative speed and b or j.
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `m1`, `m2`, `b` or `j` for non-positive, non-finite or
    /// out-of-range values (1e-6 ≤ b/(GM), j ≤ 1e60).
    pub fn new(m1: f64, m2: f64, speed: RelativeSpeed, orbit: Orbit) -> Result<Self, InputError> {
        crate::error::positive("m1", m1)?;
        crate::error::positive("m2", m2)?;
        let mt = m1 + m2;
        let (m1, m2) = (m1 / mt, m2 / mt);
        let nu = m1 * m2;
        if !(nu > 0.0) {
            return Err(InputError::OutOfRange {
                field: "m1",
                value: m1,
                allowed: "mass ratio m1/m2 between 1e-300 and 1e300 (ν > 0)".into(),
            });
        }
        let h = (1.0 + 2.0 * nu * speed.gamma_m1).sqrt();
        let (input, value, b, j) = match orbit {
            Orbit::B(b) => ("b", b, b, speed.p_inf * b / h),
            Orbit::J(j) => ("j", j, j * h / speed.p_inf, j),
        };
        check_orbit(input, value)?;
        if !((ORBIT_MIN..=ORBIT_MAX).contains(&b) && (ORBIT_MIN..=ORBIT_MAX).contains(&j)) {
            return Err(InputError::OutOfRange {
                field: input,
                value,
                allowed: format!("the derived b/(GM) and j must both lie in [{ORBIT_MIN:e}, {ORBIT_MAX:e}]"),
            });
        }
        let e = h;
        let e1 = (m1 * m1 + nu * speed.gamma) / e;
        let e2 = (m2 * m2 + nu * speed.gamma) / e;
        let p_cm = nu * speed.p_inf / h;
        Ok(Kinematics { m1, m2, nu, speed, h, e, e1, e2, p_cm, j_total: p_cm * b, j, b_over_gm: b })
    }

    /// The masses for a given ν (M = 1, m1 ≤ m2): m1,2 = (1 ∓ √(1 − 4ν))/2.
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `nu` unless 0 < ν ≤ 1/4.
    pub fn masses_from_nu(nu: f64) -> Result<(f64, f64), InputError> {
        crate::error::finite("nu", nu)?;
        if !(nu > 0.0 && nu <= 0.25) {
            return Err(InputError::OutOfRange { field: "nu", value: nu, allowed: "0 < ν ≤ 1/4".into() });
        }
        let s = (1.0 - 4.0 * nu).max(0.0).sqrt();
        // m1 = (1 − s)/2 = 2ν/(1 + s) without cancellation.
        let m1 = 2.0 * nu / (1.0 + s);
        Ok((m1, 1.0 - m1))
    }
}

fn check_orbit(field: &'static str, x: f64) -> Result<(), InputError> {
    crate::error::positive(field, x)?;
    if !(ORBIT_MIN..=ORBIT_MAX).contains(&x) {
        let unit = if field == "b" { " in units of GM/c² (M = m1 + m2)" } else { "" };
        return Err(InputError::OutOfRange { field, value: x, allowed: format!("{ORBIT_MIN:e} ≤ {field} ≤ {ORBIT_MAX:e}{unit}") });
    }
    Ok(())
}
