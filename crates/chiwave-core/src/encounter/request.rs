//! The encounter request as the page and the CLI send it (`{"kind": "encounter", ...}`), and its
//! validation through the two-body model ([`crate::two_body`]).

use super::results::EncounterResult;
use crate::error::InputError;
use crate::two_body::{ChargeUse, NuOrder, Orbit, TwoBodyInput, TwoBodySystem};
use crate::units::Quantity;
use serde::{Deserialize, Serialize};

/// Which interaction drives the encounter.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum Force {
    #[default]
    Gravity,
    Em,
}

/// Encounter request, as the page and the CLI send it (`{"kind": "encounter", ...}`).
///
/// Give the masses `m1`, `m2` (both with units, e.g. `"1.4Msun"`, or both bare numbers) **or**
/// `nu` (then M = 1, m1 ≤ m2); `gamma` **or** `v` (`"300km/s"`, or a bare fraction of c);
/// `b` (`"1au"`, `"1e5km"`, or bare = units of GM/c² with M = m1 + m2) **or** `j` = J/(G m1 m2).
/// For `force: "em"` also `q1`, `q2` (`"1e"`, `"1e-9C"`, `"3statC"`, or bare = units of √G M,
/// Gaussian).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize, Default)]
#[serde(deny_unknown_fields)]
pub struct EncounterRequest {
    #[serde(default)]
    pub force: Force,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub m1: Option<Quantity>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub m2: Option<Quantity>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub nu: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub gamma: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub v: Option<Quantity>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub b: Option<Quantity>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub j: Option<f64>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub q1: Option<Quantity>,
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub q2: Option<Quantity>,
    /// Relative tolerance of the verdicts, 1e-12 … 0.5 (default 1e-2).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub tolerance: Option<f64>,
}

/// The former name of the validated system ([`TwoBodySystem`]).
#[deprecated(note = "use two_body::TwoBodySystem")]
pub type Setup = TwoBodySystem;

impl EncounterRequest {
    /// The two-body fields of the request.
    pub fn two_body(&self) -> TwoBodyInput<'_> {
        TwoBodyInput {
            m1: self.m1.as_ref(),
            m2: self.m2.as_ref(),
            nu: self.nu,
            total_mass: None,
            gamma: self.gamma,
            v: self.v.as_ref(),
            b: self.b.as_ref(),
            j: self.j,
            q1: self.q1.as_ref(),
            q2: self.q2.as_ref(),
        }
    }

    /// Validates the request and derives the kinematics; `orbit_override` replaces b / j (sweeps).
    ///
    /// # Errors
    /// [`InputError`] naming the field: the two-body model's errors ([`TwoBodyInput::validate`],
    /// with ν giving m1 ≤ m2), and for `force: "em"` the coupling |κ| = |q1 q2|/J ≤ 1e6
    /// (field `q2`).
    pub fn setup_with(&self, orbit_override: Option<Orbit>) -> Result<TwoBodySystem, InputError> {
        let charges = match self.force {
            Force::Gravity => ChargeUse::Forbidden,
            Force::Em => ChargeUse::Required,
        };
        let s = self.two_body().validate(NuOrder::LighterFirst, charges, orbit_override)?;
        if let Some((q1, q2)) = s.charges {
            let kappa = q1 * q2 / s.kin.j_total;
            if !kappa.is_finite() || kappa.abs() > 1e6 {
                return Err(InputError::OutOfRange { field: "q2", value: kappa, allowed: "|κ| = |q1 q2|/(J c) ≤ 1e6 (Gaussian)".into() });
            }
        }
        Ok(s)
    }

    /// Validates the request ([`EncounterRequest::setup_with`] without override).
    ///
    /// # Errors
    /// As [`EncounterRequest::setup_with`].
    pub fn setup(&self) -> Result<TwoBodySystem, InputError> {
        self.setup_with(None)
    }

    /// Evaluates the request: every order, exact references, radiation, impulse, flags.
    ///
    /// # Errors
    /// Validation errors naming the field and its allowed range; [`InputError::NoConvergence`]
    /// if the test-body quadrature fails its self-check. Capture is a result.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::encounter::{EncounterRequest, EncounterResult};
    /// let req: EncounterRequest = serde_json::from_str(r#"{"nu": 0.25, "gamma": 1.5, "j": 100}"#).unwrap();
    /// let EncounterResult::Gravity(r) = req.evaluate().unwrap() else { panic!("gravity") };
    /// // 1PM: χ = 2(2γ² − 1)/(p∞ j) = 2·3.5/(√1.25·100) (Westpfahl 1985; Damour 2016, arXiv:1609.00354)
    /// assert!((r.chi.pm1 - 7.0 / (1.25f64.sqrt() * 100.0)).abs() < 1e-15);
    /// ```
    pub fn evaluate(&self) -> Result<EncounterResult, InputError> {
        let tol = crate::validity::tolerance(self.tolerance)?;
        let s = self.setup()?;
        Ok(match self.force {
            Force::Gravity => EncounterResult::Gravity(Box::new(super::gravity::evaluate(&s, tol)?)),
            Force::Em => EncounterResult::Em(Box::new(super::electromagnetic::evaluate(&s, tol)?)),
        })
    }
}

