//! Two-body kinematics at infinity (encounter sheet §0), in units G = c = 1 and M = m1 + m2 = 1.
//!
//! γ = u1·u2, p∞ = √(γ² − 1), ν = m1 m2/M², h = Γ = E/M = √(1 + 2ν(γ − 1)),
//! p = |p_CM| = ν p∞/h, J = p b, j = J/(G m1 m2) = p∞ b/h (b in units of GM/c²).
//! γ − 1 is carried separately so that slow encounters (v ≪ 1) keep their digits.
//!
//! Sources: these are the standard definitions of the PM literature, e.g. Damour 2016,
//! arXiv:1609.00354 (h = E/M and j = J/(G m1 m2) as used there); encounter sheet §0.

use crate::error::InputError;
use serde::Serialize;

/// The relative Lorentz factor with γ − 1 and p∞ = √(γ² − 1) kept to full relative precision.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Boost {
    /// γ = 1/√(1 − v²).
    pub gamma: f64,
    /// γ − 1 (accurate also for v ≪ 1).
    pub gamma_m1: f64,
    /// p∞ = γ v = √(γ² − 1).
    pub p_inf: f64,
    /// Relative speed at infinity, fraction of c.
    pub v: f64,
}

/// Smallest accepted p∞ = γ v (v ≈ 3 m/s): below it the 3PM coefficients (∝ p∞⁻³) lose meaning.
pub const P_INF_MIN: f64 = 1e-8;
/// Largest accepted γ.
pub const GAMMA_MAX: f64 = 1e6;

impl Boost {
    /// From γ − 1 (> 0).
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `field` unless 1e-8 ≤ p∞ and γ ≤ 1e6.
    pub fn from_gamma_m1(field: &'static str, gm1: f64) -> Result<Self, InputError> {
        crate::error::finite(field, gm1)?;
        let gamma = 1.0 + gm1;
        let p_inf = (gm1 * (gamma + 1.0)).sqrt();
        if !(gm1 > 0.0) || !(p_inf >= P_INF_MIN) || gamma > GAMMA_MAX {
            return Err(InputError::OutOfRange {
                field,
                value: gamma,
                allowed: format!("1 + 5e-17 ≤ γ ≤ {GAMMA_MAX:e} (p∞ = √(γ²−1) ≥ {P_INF_MIN:e}, i.e. v ≥ 3 m/s)"),
            });
        }
        Ok(Boost { gamma, gamma_m1: gm1, p_inf, v: p_inf / gamma })
    }

    /// From γ itself.
    ///
    /// # Errors
    /// As [`Boost::from_gamma_m1`], naming `gamma`.
    pub fn from_gamma(gamma: f64) -> Result<Self, InputError> {
        crate::error::finite("gamma", gamma)?;
        if !(gamma > 1.0) {
            return Err(InputError::OutOfRange { field: "gamma", value: gamma, allowed: format!("1 < γ ≤ {GAMMA_MAX:e}") });
        }
        Self::from_gamma_m1("gamma", gamma - 1.0)
    }

    /// From the relative speed v (fraction of c), 0 < v < 1.
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `v` outside 1e-8 ≤ v and γ ≤ 1e6.
    pub fn from_v(v: f64) -> Result<Self, InputError> {
        crate::error::finite("v", v)?;
        if !(v > 0.0 && v < 1.0) {
            return Err(InputError::OutOfRange { field: "v", value: v, allowed: "0 < v < 1 (fraction of c)".into() });
        }
        let s = ((1.0 - v) * (1.0 + v)).sqrt();
        let gm1 = v * v / (s * (1.0 + s));
        let b = Self::from_gamma_m1("v", gm1)?;
        // Keep the user's v and p∞ = v/√(1−v²) exactly as given.
        Ok(Boost { v, p_inf: v / s, ..b })
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

/// Derived kinematics at infinity (encounter sheet §0), M = 1, G = c = 1.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Kinematics {
    /// m1/M.
    pub m1: f64,
    /// m2/M.
    pub m2: f64,
    /// ν = m1 m2/M².
    pub nu: f64,
    #[serde(flatten)]
    pub boost: Boost,
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
    /// the boost and b or j.
    ///
    /// # Errors
    /// [`InputError::OutOfRange`] naming `m1`, `m2`, `b` or `j` for non-positive, non-finite or
    /// out-of-range values (1e-6 ≤ b/(GM), j ≤ 1e60).
    pub fn new(m1: f64, m2: f64, boost: Boost, orbit: Orbit) -> Result<Self, InputError> {
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
        let h = (1.0 + 2.0 * nu * boost.gamma_m1).sqrt();
        let (input, value, b, j) = match orbit {
            Orbit::B(b) => ("b", b, b, boost.p_inf * b / h),
            Orbit::J(j) => ("j", j, j * h / boost.p_inf, j),
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
        let e1 = (m1 * m1 + nu * boost.gamma) / e;
        let e2 = (m2 * m2 + nu * boost.gamma) / e;
        let p_cm = nu * boost.p_inf / h;
        Ok(Kinematics { m1, m2, nu, boost, h, e, e1, e2, p_cm, j_total: p_cm * b, j, b_over_gm: b })
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
        return Err(InputError::OutOfRange { field, value: x, allowed: format!("{ORBIT_MIN:e} ≤ {field} ≤ {ORBIT_MAX:e}") });
    }
    Ok(())
}
