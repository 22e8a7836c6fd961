//! The two-body input model: one reading and one validation of the inputs every request about
//! two bodies shares — the masses (m1 and m2, with units or bare, or the symmetric mass ratio ν
//! with an optional total mass), the relative speed (γ or v), the orbit (impact parameter b or
//! reduced angular momentum j), the charges (q1, q2) and the physical scale.
//!
//! A request keeps its own serde struct (with `deny_unknown_fields`, so unknown fields are
//! refused), lends its two-body fields as a [`TwoBodyInput`], and gets back a validated
//! [`TwoBodySystem`]: the kinematics at infinity ([`Kinematics`], G = c = 1, M = m1 + m2 = 1),
//! the SI scale when the masses carry units ([`PhysicalScale`]) and the charges in geometric
//! Gaussian units q/(√G M). Every two-body request (encounter, waveform, and later detection,
//! capture, batch rows) reports the same field names, ranges and wording.
//!
//! # Accepted ranges (one for every request)
//! * m1, m2 > 0, both with a mass unit or both bare; or 0 < ν ≤ 1/4 (`total_mass` goes with ν
//!   only); the mass ratio between 1e-300 and 1e300.
//! * γ: [`GAMMA_RANGE`] (1 < γ ≤ 1e6, p∞ ≥ 1e-8); v: [`V_RANGE`]. An observable may accept
//!   less where its own numerics stop (the waveforms: γ ≤ 1e4 for gravity and γ ≤ 1e3 for
//!   electromagnetism, see `waveform::Binary` and `waveform::em::EmSystem`); it then says so
//!   with its own range.
//! * b/(GM/c²) and j in [1e-6, 1e60] (each derived from the other must lie there too); a
//!   physical b needs physical masses.
//! * |q|/(√G M) ≤ [`CHARGE_MAX`]; a charge with a unit needs physical masses.
//!
//! Conventions (units, frames) are those of [`kinematics`]; the ν → masses map is
//! [`Kinematics::masses_from_nu`], with the order of the two bodies fixed by each request
//! ([`NuOrder`]).

// `!(x > 0.0)` is deliberate: unlike `x <= 0.0` it also rejects NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

pub mod kinematics;

#[allow(deprecated)]
pub use kinematics::Boost;
pub use kinematics::{Kinematics, Orbit, RelativeSpeed, GAMMA_MAX, GAMMA_RANGE, ORBIT_MAX, ORBIT_MIN, P_INF_MIN, V_RANGE};

use crate::error::InputError;
use crate::units::{self, Charge, Mass, Quantity};

/// Largest accepted |q|/(√G M) (geometric Gaussian charge).
pub const CHARGE_MAX: f64 = 1e40;

/// Which body is the lighter one when the masses come from ν (each request documents its own
/// choice; both are kept so that no result changes).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum NuOrder {
    /// m1 ≤ m2 (the encounter request).
    LighterFirst,
    /// m1 ≥ m2: the heavier body 1 comes in (the waveform request).
    HeavierFirst,
}

/// Whether a request reads the charges q1, q2.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ChargeUse {
    /// Charges are refused (gravity).
    Forbidden,
    /// Both charges are required (electromagnetism).
    Required,
}

/// The two-body fields of a request, borrowed from it (absent fields are `None`).
#[derive(Debug, Clone, Copy, Default, PartialEq)]
pub struct TwoBodyInput<'a> {
    pub m1: Option<&'a Quantity>,
    pub m2: Option<&'a Quantity>,
    pub nu: Option<f64>,
    /// Total mass M, only together with `nu` (default: geometric 1).
    pub total_mass: Option<&'a Quantity>,
    pub gamma: Option<f64>,
    pub v: Option<&'a Quantity>,
    pub b: Option<&'a Quantity>,
    pub j: Option<f64>,
    pub q1: Option<&'a Quantity>,
    pub q2: Option<&'a Quantity>,
}

/// SI scale of a two-body system whose masses carry units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PhysicalScale {
    /// M = m1 + m2 in kg (G M / G, CODATA 2018 G).
    pub m_kg: f64,
    /// G M/c² in metres.
    pub length_m: f64,
}

impl PhysicalScale {
    /// The scale of a total mass parameter G M (m³ s⁻²).
    pub fn from_gm(gm: f64) -> Self {
        use units::codata2018::{C, G};
        PhysicalScale { m_kg: gm / G, length_m: gm / (C * C) }
    }
}

/// A validated two-body system.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TwoBodySystem {
    /// Kinematics at infinity, G = c = 1, M = 1.
    pub kin: Kinematics,
    /// SI scale, when the masses were given with units.
    pub physical: Option<PhysicalScale>,
    /// Charges q/(√G M) (geometric Gaussian), when the request uses them.
    pub charges: Option<(f64, f64)>,
}

impl TwoBodyInput<'_> {
    /// Reads and validates the two-body fields. `orbit` replaces b / j when given (sweeps).
    ///
    /// # Errors
    /// [`InputError`] naming the field with the range of the module docs: missing or doubly
    /// given inputs (`m1`, `m2`, `nu`, `total_mass`, `gamma`, `v`, `b`, `j`), units that do not
    /// fit (a physical b or charge without physical masses, one mass with a unit and one
    /// without), values out of range, charges given to gravity or missing for
    /// electromagnetism.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::two_body::{ChargeUse, NuOrder, TwoBodyInput};
    /// let (m1, m2, b) = ("10Msun".into(), "20Msun".into(), "1au".into());
    /// let v = "1000km/s".into();
    /// let input = TwoBodyInput { m1: Some(&m1), m2: Some(&m2), v: Some(&v), b: Some(&b), ..Default::default() };
    /// let s = input.validate(NuOrder::LighterFirst, ChargeUse::Forbidden, None).unwrap();
    /// assert!((s.kin.nu - 2.0 / 9.0).abs() < 1e-15); // 10·20/30²
    /// let none = TwoBodyInput { m1: Some(&m1), v: Some(&v), b: Some(&b), ..Default::default() };
    /// assert_eq!(none.validate(NuOrder::LighterFirst, ChargeUse::Forbidden, None).unwrap_err().field(), "m2");
    /// ```
    pub fn validate(&self, nu_order: NuOrder, charges: ChargeUse, orbit: Option<Orbit>) -> Result<TwoBodySystem, InputError> {
        let (m1, m2, physical) = self.masses(nu_order)?;
        let speed = self.speed()?;
        let orbit = match orbit {
            Some(o) => o,
            None => self.orbit(physical)?,
        };
        let kin = Kinematics::new(m1, m2, speed, orbit)?;
        let charges = match charges {
            ChargeUse::Forbidden => {
                for (field, q) in [("q1", self.q1), ("q2", self.q2)] {
                    if q.is_some() {
                        return Err(InputError::Inconsistent {
                            field,
                            reason: "charges are used only with force \"em\"; remove q1 and q2 for gravity".into(),
                        });
                    }
                }
                None
            }
            ChargeUse::Required => Some((charge("q1", self.q1, physical)?, charge("q2", self.q2, physical)?)),
        };
        Ok(TwoBodySystem { kin, physical, charges })
    }

    /// The two masses (any common unit; the kinematics normalise them) and the SI scale.
    fn masses(&self, nu_order: NuOrder) -> Result<(f64, f64, Option<PhysicalScale>), InputError> {
        let (m1, m2, gm_total, total_field) = match (self.nu, self.m1, self.m2) {
            (Some(_), Some(_), _) | (Some(_), _, Some(_)) => {
                return Err(InputError::Inconsistent { field: "nu", reason: "give either nu or the masses m1 and m2, not both".into() })
            }
            (Some(nu), None, None) => {
                let (light, heavy) = Kinematics::masses_from_nu(nu)?;
                let gm = match self.total_mass {
                    Some(q) => match units::parse_mass("total_mass", q)? {
                        Mass::Physical { gm } => Some(gm),
                        Mass::Geometric(_) => None,
                    },
                    None => None,
                };
                let (a, b) = match nu_order {
                    NuOrder::LighterFirst => (light, heavy),
                    NuOrder::HeavierFirst => (heavy, light),
                };
                (a, b, gm, "total_mass")
            }
            (None, Some(q1), Some(q2)) => {
                if self.total_mass.is_some() {
                    return Err(InputError::Inconsistent {
                        field: "total_mass",
                        reason: "total_mass goes with nu only; with m1 and m2 the total mass is m1 + m2".into(),
                    });
                }
                match (units::parse_mass("m1", q1)?, units::parse_mass("m2", q2)?) {
                    (Mass::Physical { gm: g1 }, Mass::Physical { gm: g2 }) => (g1, g2, Some(g1 + g2), "m1"),
                    (Mass::Geometric(x), Mass::Geometric(y)) => (x, y, None, "m1"),
                    _ => {
                        return Err(InputError::Inconsistent {
                            field: "m2",
                            reason: "give both masses with units (e.g. 1.4Msun) or both as bare numbers".into(),
                        })
                    }
                }
            }
            (None, None, None) => {
                return Err(InputError::Missing { field: "m1", hint: "give m1 and m2 (e.g. 10Msun), or nu (0 < ν ≤ 1/4)".into() })
            }
            (None, None, Some(_)) => {
                return Err(InputError::Missing { field: "m1", hint: "give m1 as well (e.g. 10Msun), or use nu".into() })
            }
            (None, Some(_), None) => {
                return Err(InputError::Missing { field: "m2", hint: "give m2 as well (e.g. 10Msun), or use nu".into() })
            }
        };
        let physical = gm_total.map(PhysicalScale::from_gm);
        if let Some(s) = physical {
            if !(s.length_m.is_finite() && s.length_m > 0.0) {
                return Err(InputError::OutOfRange {
                    field: total_field,
                    value: s.m_kg,
                    allowed: "a total mass whose GM/c² is finite".into(),
                });
            }
        }
        Ok((m1, m2, physical))
    }

    /// The relative speed from `gamma` or `v` (the one conversion [`RelativeSpeed::from_v`]).
    fn speed(&self) -> Result<RelativeSpeed, InputError> {
        match (self.gamma, self.v) {
            (Some(_), Some(_)) => Err(InputError::Inconsistent { field: "v", reason: "give either gamma or v, not both".into() }),
            (Some(g), None) => RelativeSpeed::from_gamma(g),
            (None, Some(q)) => {
                // Out-of-range speeds are reported with the number as typed, in its unit.
                let (x, _) = q.split("v")?;
                let in_words = |e: InputError| match e {
                    InputError::OutOfRange { field, .. } => InputError::OutOfRange { field, value: x, allowed: V_RANGE.into() },
                    other => other,
                };
                RelativeSpeed::from_v(units::parse_speed("v", q).map_err(in_words)?).map_err(in_words)
            }
            (None, None) => Err(InputError::Missing { field: "gamma", hint: "give gamma (> 1) or v (e.g. 0.1 or 300km/s)".into() }),
        }
    }

    /// The orbit from `b` (bare: units of GM/c²; with a unit: needs `physical`) or `j`.
    fn orbit(&self, physical: Option<PhysicalScale>) -> Result<Orbit, InputError> {
        match (self.b, self.j) {
            (Some(_), Some(_)) => Err(InputError::Inconsistent { field: "j", reason: "give either b or j, not both".into() }),
            (Some(q), None) => Ok(Orbit::B(units::parse_length("b", q)?.in_units_of("b", physical.map(|s| s.length_m))?)),
            (None, Some(j)) => Ok(Orbit::J(j)),
            (None, None) => Err(InputError::Missing { field: "b", hint: "give b (e.g. 100, 1au) or j = J/(G m1 m2)".into() }),
        }
    }
}

/// One charge in geometric Gaussian units q/(√G M): a bare number as it is, a charge with a unit
/// (C, statC, e) through [`Charge::length_m`] over the mass length G M/c².
fn charge(field: &'static str, q: Option<&Quantity>, physical: Option<PhysicalScale>) -> Result<f64, InputError> {
    let q = q.ok_or_else(|| InputError::Missing {
        field,
        hint: "force \"em\" needs q1 and q2 (e.g. 1e, -1e-9C, 3statC, or a bare number in units of √G M)".into(),
    })?;
    let x = match units::parse_charge(field, q)? {
        Charge::Geometric(x) => x,
        c @ Charge::Gaussian { .. } => match (c.length_m(), physical) {
            (Some(l), Some(s)) => l / s.length_m,
            _ => {
                return Err(InputError::Inconsistent {
                    field,
                    reason: "a charge with a unit needs masses with units (e.g. 1.67e-27kg); bare charges are in units of √G M".into(),
                })
            }
        },
    };
    crate::error::finite(field, x)?;
    if x.abs() > CHARGE_MAX {
        return Err(InputError::OutOfRange { field, value: x, allowed: format!("|q|/(√G M) ≤ {CHARGE_MAX:e}") });
    }
    Ok(x)
}

#[cfg(test)]
mod tests {
    use super::*;

    fn q(x: &str) -> Quantity {
        x.into()
    }

    #[test]
    fn one_wording_for_missing_and_double_inputs() {
        let (m, g, b) = (q("1"), Some(1.5), q("100"));
        let base = TwoBodyInput { m1: Some(&m), m2: Some(&m), gamma: g, b: Some(&b), ..Default::default() };
        let field = |i: TwoBodyInput| i.validate(NuOrder::LighterFirst, ChargeUse::Forbidden, None).unwrap_err().field();
        assert_eq!(field(TwoBodyInput { m1: None, ..base }), "m1");
        assert_eq!(field(TwoBodyInput { m2: None, ..base }), "m2");
        assert_eq!(field(TwoBodyInput { m1: None, m2: None, ..base }), "m1");
        assert_eq!(field(TwoBodyInput { nu: Some(0.2), ..base }), "nu");
        assert_eq!(field(TwoBodyInput { total_mass: Some(&m), ..base }), "total_mass");
        assert_eq!(field(TwoBodyInput { v: Some(&m), ..base }), "v");
        assert_eq!(field(TwoBodyInput { gamma: None, ..base }), "gamma");
        assert_eq!(field(TwoBodyInput { j: Some(3.0), ..base }), "j");
        assert_eq!(field(TwoBodyInput { b: None, ..base }), "b");
        assert_eq!(field(TwoBodyInput { q2: Some(&m), ..base }), "q2");
        let em = base.validate(NuOrder::LighterFirst, ChargeUse::Required, None).unwrap_err();
        assert_eq!(em.field(), "q1");
    }

    #[test]
    fn nu_order_and_units() {
        let b = q("100");
        let i = TwoBodyInput { nu: Some(0.2), gamma: Some(1.5), b: Some(&b), ..Default::default() };
        let light = i.validate(NuOrder::LighterFirst, ChargeUse::Forbidden, None).unwrap().kin;
        let heavy = i.validate(NuOrder::HeavierFirst, ChargeUse::Forbidden, None).unwrap().kin;
        assert!(light.m1 < light.m2 && heavy.m1 > heavy.m2);
        assert_eq!((light.m1, light.m2), (heavy.m2, heavy.m1));
        // A speed out of range is reported as typed, in its unit.
        let v = q("1e-5m/s");
        let e = TwoBodyInput { gamma: None, v: Some(&v), ..i }.validate(NuOrder::LighterFirst, ChargeUse::Forbidden, None).unwrap_err();
        assert_eq!(e.to_string(), format!("v: got 0.00001; allowed: {V_RANGE}"));
        // A physical b needs physical masses; a physical total mass gives it a scale.
        let (au, tm) = (q("1au"), q("30Msun"));
        assert_eq!(TwoBodyInput { b: Some(&au), ..i }.validate(NuOrder::LighterFirst, ChargeUse::Forbidden, None).unwrap_err().field(), "b");
        let s = TwoBodyInput { b: Some(&au), total_mass: Some(&tm), ..i }.validate(NuOrder::LighterFirst, ChargeUse::Forbidden, None).unwrap();
        // b/(GM/c²) = au/(30 GM☉/c²) (IAU 2012 au, IAU 2015 GM☉).
        assert!((s.kin.b_over_gm / (units::astro::AU / (30.0 * units::SUN_LENGTH_M)) - 1.0).abs() < 1e-14);
    }
}
