//! Two-body encounters: scattering angle, impulse, radiated energy and angular momentum, for
//! gravity (post-Minkowskian, PM) and electromagnetism (post-Lorentzian, PL).
//!
//! # What is computed
//! * Gravity ([`Force::Gravity`]): the CM scattering angle χ at 1PM, 2PM, 3PM conservative
//!   (Bern et al. 2019) and 3PM with radiation reaction (Damour 2020) as cumulative partial sums
//!   of χ/2 = Σ χ_n/jⁿ ([`pm`]); the Newtonian hyperbola; the exact test-body (ν → 0) angle by
//!   Schwarzschild geodesic quadrature with its capture threshold, and test-body PM coefficients
//!   to 12th order generated in code ([`testbody`]); the impulse of body 1 through O(G³)
//!   ([`impulse`]); E_rad at O(G³), the CM recoil and J_rad at O(G²) ([`radiated`]); the
//!   strong-field estimate ([`eob`]); a comparison table for numerical-relativity angles
//!   ([`nr`]).
//! * Electromagnetism ([`Force::Em`], [`em`]): χ at 1PL, 2PL, 3PL (test-charge conservative +
//!   radiation reaction), the exact Darwin test-charge angle, E_rad at leading order.
//!
//! # Conventions (encounter sheet §0)
//! c = 1, G explicit then set to 1; M = m1 + m2; all angles in radians, χ > 0 for attraction;
//! lengths in GM/c², momenta in M c, energies in M c², angular momenta in G M²/c.
//! γ = u1·u2, p∞ = √(γ²−1), ν = m1 m2/M², h = E/M = √(1 + 2ν(γ−1)), p = ν M p∞/h, J = p b,
//! j = J/(G m1 m2) = p∞ b/(GMh). b is b_J, orthogonal to the incoming momenta (pitfall 2).
//! Impulse: transverse along b̂ (from body 2 to body 1; attraction negative), longitudinal along
//! body 1's incoming momentum. Electromagnetism is in **Gaussian units, c = 1**.
//! Capture is a result, never an error.

// `!(x > 0.0)` is deliberate throughout: unlike `x <= 0.0` it also rejects NaN.
#![allow(clippy::neg_cmp_op_on_partial_ord)]

pub mod capture;
pub mod em;
pub mod eob;
pub mod impulse;
pub mod kinematics;
pub mod nr;
pub mod pm;
pub mod radiated;
pub mod testbody;

use crate::error::InputError;
use crate::units::{self, Quantity};
use crate::validity::{Flag, Level};
use kinematics::{Boost, Kinematics, Orbit};
use serde::{Deserialize, Serialize};
use std::collections::BTreeMap;

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
}

/// A validated encounter: kinematics plus the physical scale when masses had units.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Setup {
    pub kin: Kinematics,
    /// Physical scale, when the masses were given with units.
    pub scale: Option<Scale>,
    /// Charges in geometric Gaussian units q/(√G M) (EM only).
    pub charges: Option<(f64, f64)>,
}

/// SI scale of a physical encounter.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Scale {
    /// M = m1 + m2 in kg.
    pub m_kg: f64,
    /// G M / c² in metres.
    pub length_m: f64,
}

impl Scale {
    fn from_gm(gm: f64) -> Self {
        Scale { m_kg: gm / units::codata2018::G, length_m: gm / (units::codata2018::C * units::codata2018::C) }
    }
}

/// Largest accepted |q|/(√G M) (geometric Gaussian charge).
pub const CHARGE_MAX: f64 = 1e40;

impl EncounterRequest {
    /// Validates the request and derives the kinematics; `orbit_override` replaces b / j (sweeps).
    ///
    /// # Errors
    /// [`InputError`] naming the field: missing or doubly given inputs, units that do not fit
    /// (a physical b or charge needs physical masses), values out of range
    /// (0 < ν ≤ 1/4, 1 < γ ≤ 1e6, v ≥ 1e-8 c, 1e-6 ≤ b/(GM), j ≤ 1e60, |q|/(√G M) ≤ 1e40).
    pub fn setup_with(&self, orbit_override: Option<Orbit>) -> Result<Setup, InputError> {
        // Masses.
        let (m1, m2, gm_total) = match (&self.nu, &self.m1, &self.m2) {
            (Some(_), Some(_), _) | (Some(_), _, Some(_)) => {
                return Err(InputError::Inconsistent { field: "nu", reason: "give either nu or the masses m1 and m2, not both".into() })
            }
            (Some(nu), None, None) => {
                let (a, b) = Kinematics::masses_from_nu(*nu)?;
                (a, b, None)
            }
            (None, Some(q1), Some(q2)) => {
                let a = units::parse_mass("m1", q1)?;
                let b = units::parse_mass("m2", q2)?;
                match (a, b) {
                    (units::Mass::Physical { gm: g1 }, units::Mass::Physical { gm: g2 }) => (g1, g2, Some(g1 + g2)),
                    (units::Mass::Geometric(x), units::Mass::Geometric(y)) => (x, y, None),
                    _ => {
                        return Err(InputError::Inconsistent {
                            field: "m2",
                            reason: "give both masses with units (e.g. 1.4Msun) or both as bare numbers".into(),
                        })
                    }
                }
            }
            (None, None, _) => return Err(InputError::Missing { field: "m1", hint: "give m1 and m2 (e.g. 10Msun), or nu (0 < ν ≤ 1/4)".into() }),
            (None, Some(_), None) => return Err(InputError::Missing { field: "m2", hint: "give m2 as well (e.g. 10Msun), or use nu".into() }),
        };
        let scale = gm_total.map(Scale::from_gm);
        if let Some(s) = scale {
            if !(s.length_m.is_finite() && s.length_m > 0.0) {
                return Err(InputError::OutOfRange { field: "m1", value: s.m_kg, allowed: "a total mass whose GM/c² is finite".into() });
            }
        }
        // Speed.
        let boost = match (&self.gamma, &self.v) {
            (Some(_), Some(_)) => return Err(InputError::Inconsistent { field: "v", reason: "give either gamma or v, not both".into() }),
            (Some(g), None) => Boost::from_gamma(*g)?,
            (None, Some(q)) => {
                let (x, _) = q.split("v")?;
                let beta = units::parse_speed("v", q).map_err(|e| match e {
                    InputError::OutOfRange { field, .. } => InputError::OutOfRange { field, value: x, allowed: "0 < v < c (299792.458 km/s); bare numbers are fractions of c".into() },
                    other => other,
                })?;
                Boost::from_v(beta)?
            }
            (None, None) => return Err(InputError::Missing { field: "gamma", hint: "give gamma (> 1) or v (e.g. 0.1 or 300km/s)".into() }),
        };
        // Orbit.
        let orbit = match orbit_override {
            Some(o) => o,
            None => match (&self.b, &self.j) {
                (Some(_), Some(_)) => return Err(InputError::Inconsistent { field: "j", reason: "give either b or j, not both".into() }),
                (Some(q), None) => {
                    let l = units::parse_length("b", q)?;
                    Orbit::B(l.in_units_of("b", scale.map(|s| s.length_m))?)
                }
                (None, Some(j)) => Orbit::J(*j),
                (None, None) => return Err(InputError::Missing { field: "b", hint: "give b (e.g. 100, 1au) or j = J/(G m1 m2)".into() }),
            },
        };
        let kin = Kinematics::new(m1, m2, boost, orbit)?;
        // Charges.
        let charges = match self.force {
            Force::Gravity => {
                for (f, q) in [("q1", &self.q1), ("q2", &self.q2)] {
                    if q.is_some() {
                        return Err(InputError::Inconsistent { field: f, reason: "charges are used only with force \"em\"".into() });
                    }
                }
                None
            }
            Force::Em => {
                let q1 = charge("q1", self.q1.as_ref(), scale)?;
                let q2 = charge("q2", self.q2.as_ref(), scale)?;
                let kappa = q1 * q2 / kin.j_total;
                if !kappa.is_finite() || kappa.abs() > 1e6 {
                    return Err(InputError::OutOfRange {
                        field: "q2",
                        value: kappa,
                        allowed: "|κ| = |q1 q2|/(J c) ≤ 1e6 (Gaussian)".into(),
                    });
                }
                Some((q1, q2))
            }
        };
        Ok(Setup { kin, scale, charges })
    }

    /// Validates the request ([`EncounterRequest::setup_with`] without override).
    ///
    /// # Errors
    /// As [`EncounterRequest::setup_with`].
    pub fn setup(&self) -> Result<Setup, InputError> {
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
    /// // 1PM: χ = 2(2γ² − 1)/(p∞ j) = 2·3.5/(√1.25·100) (encounter sheet §1.1)
    /// assert!((r.chi.pm1 - 7.0 / (1.25f64.sqrt() * 100.0)).abs() < 1e-15);
    /// ```
    pub fn evaluate(&self) -> Result<EncounterResult, InputError> {
        let s = self.setup()?;
        Ok(match self.force {
            Force::Gravity => EncounterResult::Gravity(Box::new(gravity(&s)?)),
            Force::Em => EncounterResult::Em(Box::new(electromagnetic(&s)?)),
        })
    }
}

fn charge(field: &'static str, q: Option<&Quantity>, scale: Option<Scale>) -> Result<f64, InputError> {
    let q = q.ok_or_else(|| InputError::Missing { field, hint: "give the charge (e.g. 1e, -1e-9C, 3statC, or a bare number in units of √G M)".into() })?;
    let x = match units::parse_charge(field, q)? {
        units::Charge::Geometric(x) => x,
        c @ units::Charge::Gaussian { .. } => match (c.length_m(), scale) {
            (Some(l), Some(s)) => l / s.length_m,
            _ => {
                return Err(InputError::Inconsistent {
                    field,
                    reason: "a charge with a unit needs masses with units (e.g. 1.67e-27kg)".into(),
                })
            }
        },
    };
    if !x.is_finite() || x.abs() > CHARGE_MAX {
        return Err(InputError::OutOfRange { field, value: x, allowed: format!("|q|/(√G M) ≤ {CHARGE_MAX:e}") });
    }
    Ok(x)
}

/// The cumulative PM angles (radians). JSON keys `1pm`, `2pm`, `3pm_conservative`, `3pm`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PmAngles {
    #[serde(rename = "1pm")]
    pub pm1: f64,
    #[serde(rename = "2pm")]
    pub pm2: f64,
    #[serde(rename = "3pm_conservative")]
    pub pm3_conservative: f64,
    /// 3PM with radiation reaction (the physical 3PM value).
    #[serde(rename = "3pm")]
    pub pm3: f64,
}

impl PmAngles {
    fn from(a: [f64; 4]) -> Self {
        PmAngles { pm1: a[0], pm2: a[1], pm3_conservative: a[2], pm3: a[3] }
    }
}

/// j-expansion coefficients of χ/2 (encounter sheet §0).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PmCoefficients {
    pub chi1: f64,
    pub chi2: f64,
    pub chi3_conservative: f64,
    pub chi3_radiation_reaction: f64,
    pub chi3: f64,
}

/// One row of the order-by-order table.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OrderRow {
    pub order: &'static str,
    /// This order's contribution to χ (radians).
    pub term: f64,
    /// χ summed through this row.
    pub cumulative: f64,
    /// term / (the most complete value).
    pub share_of_total: f64,
    /// term / (cumulative before this row); null for the first row.
    pub relative_change: Option<f64>,
}

fn order_rows(labels: &[&'static str], terms: &[f64]) -> Vec<OrderRow> {
    let total: f64 = terms.iter().sum();
    let mut cum = 0.0;
    labels
        .iter()
        .zip(terms)
        .enumerate()
        .map(|(i, (l, t))| {
            let prev = cum;
            cum += t;
            OrderRow {
                order: l,
                term: *t,
                cumulative: cum,
                share_of_total: if total != 0.0 { t / total } else { 0.0 },
                relative_change: if i == 0 || prev == 0.0 { None } else { Some(t / prev) },
            }
        })
        .collect()
}

/// Test-body PM series term (ν → 0, same γ and j).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct TestBodyTerm {
    pub order: usize,
    /// χ_n^Schw of χ/2 = Σ χ_n/jⁿ (generated in code, [`testbody::pm_coefficient`]).
    pub coefficient: f64,
    /// 2 Σ_{k≤n} χ_k^Schw/j^k (radians).
    pub cumulative: f64,
}

/// SI values of a gravitational encounter with physical masses.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GravityPhysical {
    pub m1_kg: f64,
    pub m2_kg: f64,
    pub m_total_msun: f64,
    /// G M/c² in m.
    pub gm_over_c2_m: f64,
    pub b_m: f64,
    pub b_au: f64,
    pub v_km_s: f64,
    /// J in kg m² s⁻¹.
    pub j_si: f64,
    pub e_rad_j: f64,
    /// E_rad in units of M☉ c².
    pub e_rad_msun_c2: f64,
    pub j_rad_si: f64,
    /// Transverse impulse of body 1 (CM, through O(G³)), kg m s⁻¹.
    pub impulse_transverse_kg_m_s: f64,
    /// Gravitational Sommerfeld parameter G m1 m2/(ħ c v); classical if ≫ 1.
    pub sommerfeld: f64,
    /// Reduced Compton wavelength of the lighter body over b, ħ/(m c b); classical if ≪ 1.
    pub compton_over_b: f64,
}

/// Result of a gravitational encounter (JSON keys are the CLI contract).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GravityResult {
    /// `"gravity"`.
    pub force: &'static str,
    pub gamma: f64,
    pub nu: f64,
    pub j: f64,
    pub b_over_gm: f64,
    /// Cumulative PM angles, radians, > 0 for attraction.
    pub chi: PmAngles,
    /// 2 arctan(GM/(b v²)).
    pub chi_newtonian: f64,
    /// Exact Schwarzschild test-body angle at the same γ and j; null if captured.
    pub chi_test_body: Option<f64>,
    pub test_body_captured: bool,
    /// Test-body periapsis in GM/c² (null if captured).
    pub test_body_r_min: Option<f64>,
    /// Test-body capture threshold j_c at this γ (capture for j ≤ j_c).
    pub j_critical_test_body: f64,
    /// The same threshold as b/(GM) of this encounter, b_c = j_c h/p∞.
    pub b_critical_test_body: f64,
    /// Strong-field estimate (null if captured or unavailable, see `flags`).
    pub chi_estimate: Option<f64>,
    /// Capture predicted by the strong-field estimate.
    pub captured: bool,
    /// The estimate's own output, when available.
    pub estimate: Option<eob::Estimate>,
    /// The strong-field estimate's own capture threshold j_c (null if it predicts none).
    pub j_critical_estimate: Option<f64>,
    /// E_rad/(M c²), CM frame, O(G³).
    pub e_rad: f64,
    /// J_rad/J at O(G²).
    pub j_rad: f64,
    /// Radiated 3-momentum in the CM frame along body 1's incoming direction, units M c (O(G³)).
    pub p_rad_cm: f64,
    /// Δp₁ through O(G³) including radiation, units of M c.
    pub impulse: impulse::Frames,
    /// Δp₁ through O(G³), conservative only.
    pub impulse_conservative: impulse::Frames,
    pub covariant: impulse::CovariantSplit,
    pub coefficients: PmCoefficients,
    pub test_body_pm: Vec<TestBodyTerm>,
    pub kinematics: Kinematics,
    pub orders: Vec<OrderRow>,
    pub flags: Vec<Flag>,
    pub sources: BTreeMap<&'static str, &'static str>,
    pub physical: Option<GravityPhysical>,
    pub notice: &'static str,
}

/// The cumulative PL angles (radians). JSON keys `1pl`, `2pl`, `3pl_conservative`, `3pl`.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PlAngles {
    #[serde(rename = "1pl")]
    pub pl1: f64,
    #[serde(rename = "2pl")]
    pub pl2: f64,
    /// Test-charge conservative e₃ only (two-body ν part not included).
    #[serde(rename = "3pl_conservative")]
    pub pl3_conservative: f64,
    /// With the radiation-reaction δχ_rr.
    #[serde(rename = "3pl")]
    pub pl3: f64,
}

/// Coefficients of χ/2 = Σ e_n κⁿ and the radiation-reaction angle.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PlCoefficients {
    pub e1: f64,
    pub e2: f64,
    pub e3_test: f64,
    pub delta_chi_rr: f64,
}

/// SI values of an electromagnetic encounter with physical masses.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmPhysical {
    pub m1_kg: f64,
    pub m2_kg: f64,
    pub q1_c: f64,
    pub q2_c: f64,
    pub b_m: f64,
    pub v_km_s: f64,
    pub e_rad_j: f64,
    pub e_rad_dipole_j: f64,
    /// Sommerfeld parameter |q1 q2|/(4π ε0 ħ v); classical if ≫ 1.
    pub sommerfeld: f64,
    /// ħ/(m c b) for the lighter body; classical if ≪ 1.
    pub compton_over_b: f64,
}

/// Result of an electromagnetic encounter (Gaussian units, c = 1).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmResult {
    /// `"em"`.
    pub force: &'static str,
    /// `"Gaussian, c = 1"`.
    pub units: &'static str,
    pub gamma: f64,
    pub nu: f64,
    /// κ = q1 q2/(J c), < 0 for attraction.
    pub kappa: f64,
    pub b_over_gm: f64,
    pub chi: PlAngles,
    /// Exact Darwin test-charge angle at the same γ and κ; null on fall to the centre.
    pub chi_test_exact: Option<f64>,
    pub fall_to_centre: bool,
    /// Leading-order E_rad/(M c²) of body 1 as a test charge in the field of body 2 (rest frame 2).
    pub e_rad: f64,
    /// Two-body non-relativistic dipole E_rad/(M c²).
    pub e_rad_dipole: f64,
    /// Mechanical J_rad/J at O(e⁴).
    pub j_rad: f64,
    /// Conservative Δp₁ (transverse through O(e⁶) incl. δχ_rr; longitudinal from on-shell), M c.
    pub impulse: impulse::Frames,
    pub covariant: impulse::Covariant,
    pub coefficients: PlCoefficients,
    pub kinematics: Kinematics,
    pub orders: Vec<OrderRow>,
    pub flags: Vec<Flag>,
    pub sources: BTreeMap<&'static str, &'static str>,
    pub physical: Option<EmPhysical>,
    pub notice: &'static str,
}

/// Result of any encounter, serialised without a tag (`force` says which).
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(untagged)]
pub enum EncounterResult {
    Gravity(Box<GravityResult>),
    Em(Box<EmResult>),
}

fn gravity_sources() -> BTreeMap<&'static str, &'static str> {
    BTreeMap::from([
        ("1pm", "Portilla 1980; Westpfahl 1985; Damour 2016, arXiv:1609.00354 (encounter sheet §1.1)"),
        ("2pm", "Westpfahl 1985, Fortsch. Phys. 33, 417; Bini & Damour 2017, arXiv:1706.06877; Damour 2018, arXiv:1710.10599 (sheet §1.2)"),
        ("3pm_conservative", "Bern, Cheung, Roiban, Shen, Solon, Zeng 2019, arXiv:1901.04424, 1908.01493; mass-polynomial form Damour 2019, arXiv:1912.02139 (sheet §1.3)"),
        ("3pm", "3PM conservative + radiation reaction of Damour 2020, arXiv:2010.01641; Di Vecchia, Heissenberg, Russo, Veneziano arXiv:2008.12743, 2101.05772 (sheet §1.4)"),
        ("chi_newtonian", "Kepler hyperbola tan(χ/2) = GM/(b v²) (sheet §5.1)"),
        ("chi_test_body", "exact Schwarzschild timelike geodesic, quadrature (sheet §5.2; deflection sheet §5)"),
        ("test_body_pm", "generated in code by finite-part expansion of the geodesic integral; checked against sheet §1.5 χ₄…χ₆"),
        ("j_critical_test_body", "unstable circular orbit of Schwarzschild (deflection sheet §5; MTW §25.5)"),
        ("chi_estimate", "strong-field resummed estimate (sheet §7; Damour 2018 arXiv:1710.10599, Damour & Rettegno 2023 arXiv:2211.01399)"),
        ("j_critical_estimate", "double root of the estimate's effective radial potential (unstable circular orbit of the resummed w(r); sheet §7)"),
        ("e_rad", "Herrmann, Parra-Martinez, Ruf, Zeng 2021, arXiv:2101.07255 (sheet §3.1)"),
        ("p_rad_cm", "Herrmann, Parra-Martinez, Ruf, Zeng 2021, arXiv:2101.07255 (sheet §3.1)"),
        ("j_rad", "Damour 2020, arXiv:2010.01641 (sheet §3.2)"),
        ("impulse", "Westpfahl 1985; Kosower, Maybee, O'Connell 2018, arXiv:1811.10950; longitudinal parts from on-shell conditions (sheet §2)"),
    ])
}

fn physical_flags(flags: &mut Vec<Flag>, sommerfeld: f64, compton_over_b: f64) {
    flags.push(if sommerfeld > 1e3 {
        Flag::new("classical_sommerfeld", Level::Ok, Some(sommerfeld), "Sommerfeld parameter ≫ 1: classical scattering applies.")
    } else if sommerfeld > 1.0 {
        Flag::new("classical_sommerfeld", Level::Caution, Some(sommerfeld), "Sommerfeld parameter only moderately above 1: quantum corrections to the classical angle may be visible.")
    } else {
        Flag::new("classical_sommerfeld", Level::Invalid, Some(sommerfeld), "Sommerfeld parameter ≤ 1: the encounter is quantum (Born regime); the classical angle does not apply.")
    });
    flags.push(Flag::small_parameter(
        "classical_compton",
        compton_over_b,
        1e-3,
        1.0,
        [
            "Compton wavelength ≪ b: point particles are classical.",
            "Compton wavelength not negligible against b: quantum corrections may matter.",
            "Compton wavelength ≥ b: the classical description fails.",
        ],
    ));
}

fn common_velocity_flag(v: f64) -> Flag {
    if v < 0.1 {
        Flag::new("velocity_regime", Level::Ok, Some(v), "Slow encounter (v < 0.1 c): post-Newtonian regime; PM/PL series need p∞ j ≫ 1 (pitfall 3).")
    } else {
        Flag::new("velocity_regime", Level::Ok, Some(v), "Relativistic encounter (v ≥ 0.1 c).")
    }
}

/// Evaluates a validated gravitational encounter.
///
/// # Errors
/// [`InputError::NoConvergence`] from the test-body quadrature self-check.
pub fn gravity(s: &Setup) -> Result<GravityResult, InputError> {
    let k = &s.kin;
    let b = &k.boost;
    let c = pm::coefficients(b, k.nu);
    let angles = pm::cumulative_angles(&c, k.j);
    let chi_newtonian = pm::chi_newtonian(k.b_over_gm, b.v);
    let tb = testbody::exact(b, k.j)?;
    let (chi_test_body, test_body_r_min) = match tb {
        testbody::TestBody::Scattered { chi, r_min } => (Some(chi), Some(r_min)),
        testbody::TestBody::Captured => (None, None),
    };
    let j_c = testbody::critical_j(b);
    let chi_for_estimate = [c[0], c[1], c[2] + c[3]];
    let mut flags = Vec::new();
    let (chi_estimate, captured, estimate, j_critical_estimate) = match eob::details(b.gamma, k.nu, k.j, &chi_for_estimate) {
        Ok(d) => {
            flags.extend(d.flags);
            match d.estimate {
                e @ eob::Estimate::Scattered { chi, .. } => (Some(chi), false, Some(e), d.j_critical),
                e @ eob::Estimate::Captured { .. } => (None, true, Some(e), d.j_critical),
            }
        }
        Err(err) => {
            flags.push(Flag::new("strong_field_estimate", Level::Caution, None, format!("Strong-field estimate unavailable: {err}.")));
            (None, false, None, None)
        }
    };
    // Radiation.
    let e_function = radiated::e_of_boost(b);
    let e_rad = k.nu * k.nu * e_function / (k.h * k.b_over_gm.powi(3));
    let p_rad_cm = radiated::p_rad_cm(b, k.m1, k.m2, k.p_cm, k.b_over_gm);
    let j_rad = radiated::j_rad_over_j(b, k.nu, k.h, k.j);
    // Impulse.
    let inp = impulse::ImpulseInput {
        m1: k.m1,
        m2: k.m2,
        gamma: b.gamma,
        p_inf: b.p_inf,
        p_cm: k.p_cm,
        h: k.h,
        b: k.b_over_gm,
        j: k.j,
        chi: c,
        eps_rad: k.nu * k.nu * e_function / k.b_over_gm.powi(3),
    };
    let cov = impulse::covariant(&inp);
    let imp = impulse::frames(&cov.total, &inp);
    let imp_c = impulse::frames(&cov.conservative, &inp);
    // Test-body PM series at the same γ, j.
    let mut cum = 0.0;
    let test_body_pm = (1..=8)
        .filter_map(|n| {
            let cn = testbody::pm_coefficient(n, b)?;
            cum += 2.0 * cn / k.j.powi(n as i32);
            Some(TestBodyTerm { order: n, coefficient: cn, cumulative: cum })
        })
        .collect();
    let x = 1.0 / k.j;
    let terms = [2.0 * c[0] * x, 2.0 * c[1] * x * x, 2.0 * c[2] * x.powi(3), 2.0 * c[3] * x.powi(3)];
    let orders = order_rows(&["1PM", "2PM", "3PM conservative", "3PM radiation reaction"], &terms);
    // Flags.
    let pm_x = 1.0 / (k.b_over_gm * b.v * b.v);
    flags.push(Flag::small_parameter(
        "pm_parameter",
        pm_x,
        0.05,
        0.3,
        [
            "GM/(b v²) small: weak deflection, the PM series converges quickly.",
            "GM/(b v²) not small: higher PM orders matter; compare with the exact test-body and estimate values.",
            "GM/(b v²) large: strong deflection; the truncated PM series is not a prediction here.",
        ],
    ));
    let ratio = k.j / j_c;
    flags.push(if ratio <= 1.0 {
        Flag::new("capture_proximity", Level::Invalid, Some(ratio), "Below the test-body capture threshold (j ≤ j_c): a test body would be captured; PM numbers have no meaning (pitfall 8).")
    } else if ratio < 2.0 {
        Flag::new("capture_proximity", Level::Caution, Some(ratio), "Within a factor 2 of the test-body capture threshold j_c: strong field, PM series unreliable.")
    } else {
        Flag::new("capture_proximity", Level::Ok, Some(ratio), "Far from the test-body capture threshold (j > 2 j_c).")
    });
    flags.push(common_velocity_flag(b.v));
    flags.push(if b.gamma > 10.0 {
        Flag::new("high_energy", Level::Caution, Some(b.gamma), "γ > 10: the conservative-only 3PM term grows like −8γ³ ln(2γ); only the radiation-reacted 3PM value (key 3pm) is physical (pitfall 5).")
    } else {
        Flag::new("high_energy", Level::Ok, Some(b.gamma), "γ ≤ 10: conservative and radiation-reacted 3PM both shown; the radiation-reacted one (key 3pm) is the physical value.")
    });
    let last = (terms[2] + terms[3]).abs() / angles[3].abs().max(f64::MIN_POSITIVE);
    flags.push(Flag::small_parameter(
        "pm_truncation",
        last,
        1e-3,
        0.1,
        [
            "The 3PM term is a small fraction of χ: truncation error is small.",
            "The 3PM term is a sizeable fraction of χ: unknown 4PM terms may change the angle noticeably.",
            "The 3PM term is comparable with χ: the series is not converging here.",
        ],
    ));
    let physical = s.scale.map(|sc| {
        use units::codata2018::{C, HBAR};
        let mc = sc.m_kg * C;
        let e_unit = sc.m_kg * C * C;
        let j_unit = units::codata2018::G * sc.m_kg * sc.m_kg / C;
        let sommerfeld = units::codata2018::G * k.m1 * k.m2 * sc.m_kg * sc.m_kg / (HBAR * C * b.v);
        let compton_over_b = HBAR / (k.m1.min(k.m2) * sc.m_kg * C * k.b_over_gm * sc.length_m);
        GravityPhysical {
            m1_kg: k.m1 * sc.m_kg,
            m2_kg: k.m2 * sc.m_kg,
            m_total_msun: sc.m_kg / units::M_SUN_KG,
            gm_over_c2_m: sc.length_m,
            b_m: k.b_over_gm * sc.length_m,
            b_au: k.b_over_gm * sc.length_m / units::astro::AU,
            v_km_s: b.v * C / 1e3,
            j_si: k.j_total * j_unit,
            e_rad_j: e_rad * e_unit,
            e_rad_msun_c2: e_rad * sc.m_kg / units::M_SUN_KG,
            j_rad_si: j_rad * k.j_total * j_unit,
            impulse_transverse_kg_m_s: imp.cm.transverse * mc,
            sommerfeld,
            compton_over_b,
        }
    });
    if let Some(p) = &physical {
        physical_flags(&mut flags, p.sommerfeld, p.compton_over_b);
    }
    Ok(GravityResult {
        force: "gravity",
        gamma: b.gamma,
        nu: k.nu,
        j: k.j,
        b_over_gm: k.b_over_gm,
        chi: PmAngles::from(angles),
        chi_newtonian,
        chi_test_body,
        test_body_captured: chi_test_body.is_none(),
        test_body_r_min,
        j_critical_test_body: j_c,
        b_critical_test_body: j_c * k.h / b.p_inf,
        chi_estimate,
        captured,
        estimate,
        j_critical_estimate,
        e_rad,
        j_rad,
        p_rad_cm,
        impulse: imp,
        impulse_conservative: imp_c,
        covariant: cov,
        coefficients: PmCoefficients { chi1: c[0], chi2: c[1], chi3_conservative: c[2], chi3_radiation_reaction: c[3], chi3: c[2] + c[3] },
        test_body_pm,
        kinematics: *k,
        orders,
        flags,
        sources: gravity_sources(),
        physical,
        notice: crate::validity::ESTIMATE_NOTICE,
    })
}

/// Evaluates a validated electromagnetic encounter (Gaussian units, c = 1).
///
/// # Errors
/// [`InputError::Missing`] if the setup carries no charges.
pub fn electromagnetic(s: &Setup) -> Result<EmResult, InputError> {
    let (q1, q2) = s.charges.ok_or_else(|| InputError::Missing { field: "q1", hint: "force \"em\" needs q1 and q2".into() })?;
    let k = &s.kin;
    let b = &k.boost;
    let kappa = q1 * q2 / k.j_total;
    let (e1, e2, e3) = (em::e1(b), em::e2(k.h), em::e3_test(b));
    let rr = em::delta_chi_rr(b, q1, q2, k.m1, k.m2, k.e, k.j_total);
    let terms = [2.0 * e1 * kappa, 2.0 * e2 * kappa * kappa, 2.0 * e3 * kappa.powi(3), rr];
    let a1 = terms[0];
    let a2 = a1 + terms[1];
    let a3c = a2 + terms[2];
    let a3 = a3c + terms[3];
    let (chi_test_exact, fall) = match em::darwin(b, kappa) {
        em::Darwin::Scattered { chi } => (Some(chi), false),
        em::Darwin::FallToCentre => (None, true),
    };
    let e_rad = em::e_rad_test(b, q1, q2, k.m1, k.b_over_gm);
    let e_rad_dipole = em::e_rad_dipole(b, q1, q2, k.m1, k.m2, k.b_over_gm);
    let j_rad = em::j_rad(b, q1, q2, k.m1, k.m2, k.e, k.b_over_gm) / k.j_total;
    // Impulse: −p sin χ through O(κ³) and the on-shell longitudinal parts (encounter sheet §2.1
    // construction applied to the PL series; the radiated momentum is not included).
    let t1 = -k.p_cm * terms[0];
    let t2 = -k.p_cm * terms[1];
    let t3 = -k.p_cm * (terms[2] + terms[3] - terms[0].powi(3) / 6.0);
    let kk = (t1 * t1 + 2.0 * t1 * t2) / (2.0 * k.m1 * k.m2 * b.p_inf * b.p_inf);
    let cov = impulse::Covariant { c_b: t1 + t2 + t3, c_u1: -kk * (b.gamma * k.m1 + k.m2), c_u2: kk * (b.gamma * k.m2 + k.m1) };
    let inp = impulse::ImpulseInput {
        m1: k.m1,
        m2: k.m2,
        gamma: b.gamma,
        p_inf: b.p_inf,
        p_cm: k.p_cm,
        h: k.h,
        b: k.b_over_gm,
        j: k.j,
        chi: [0.0; 4],
        eps_rad: 0.0,
    };
    let imp = impulse::frames(&cov, &inp);
    let orders = order_rows(&["1PL", "2PL", "3PL conservative (test charge)", "3PL radiation reaction"], &terms);
    let mut flags = vec![Flag::new("units", Level::Ok, None, "Gaussian units with c = 1 (Coulomb force q1 q2/r²); SI charges were converted with q1 q2 → q1 q2/(4π ε0).")];
    flags.push(Flag::small_parameter(
        "pl_parameter",
        kappa.abs() / b.p_inf,
        0.05,
        0.3,
        [
            "|q1 q2|/(J p∞) small: weak deflection, the PL series converges quickly.",
            "|q1 q2|/(J p∞) not small: compare the PL series with the exact Darwin angle.",
            "|q1 q2|/(J p∞) large: strong deflection; use the exact test-charge angle.",
        ],
    ));
    flags.push(if fall {
        Flag::new("fall_to_centre", Level::Invalid, Some(kappa), "Attraction with |κ| ≥ 1: the test charge falls to the centre (no scattering angle).")
    } else {
        Flag::new("fall_to_centre", Level::Ok, Some(kappa), "No fall to the centre (κ > −1).")
    });
    flags.push(common_velocity_flag(b.v));
    flags.push(Flag::small_parameter(
        "three_pl_two_body",
        k.nu,
        0.01,
        0.3,
        [
            "Near the test-charge limit: the omitted two-body ν part of the conservative 3PL term is small.",
            "The conservative 3PL term uses the test-charge coefficient; its two-body ν dependence is not included.",
            "The conservative 3PL term uses the test-charge coefficient; its two-body ν dependence is not included.",
        ],
    ));
    flags.push(Flag::small_parameter(
        "dipole_nonrelativistic",
        b.v,
        0.1,
        0.3,
        [
            "v ≪ c: the two-body dipole E_rad (key e_rad_dipole) applies.",
            "v not small: the non-relativistic dipole E_rad is only indicative.",
            "v close to c: the non-relativistic dipole E_rad does not apply; use the test-charge e_rad.",
        ],
    ));
    let physical = s.scale.map(|sc| {
        use units::codata2018::{C, EPSILON0, G, HBAR};
        let e_unit = sc.m_kg * C * C;
        // q_SI = q̃ √(4π ε0 G) M.
        let qs = (4.0 * std::f64::consts::PI * EPSILON0 * G).sqrt() * sc.m_kg;
        let (q1c, q2c) = (q1 * qs, q2 * qs);
        let sommerfeld = (q1c * q2c).abs() / (4.0 * std::f64::consts::PI * EPSILON0 * HBAR * C * b.v);
        let compton_over_b = HBAR / (k.m1.min(k.m2) * sc.m_kg * C * k.b_over_gm * sc.length_m);
        EmPhysical {
            m1_kg: k.m1 * sc.m_kg,
            m2_kg: k.m2 * sc.m_kg,
            q1_c: q1c,
            q2_c: q2c,
            b_m: k.b_over_gm * sc.length_m,
            v_km_s: b.v * C / 1e3,
            e_rad_j: e_rad * e_unit,
            e_rad_dipole_j: e_rad_dipole * e_unit,
            sommerfeld,
            compton_over_b,
        }
    });
    if let Some(p) = &physical {
        physical_flags(&mut flags, p.sommerfeld, p.compton_over_b);
    }
    let sources = BTreeMap::from([
        ("1pl", "e₁ = −γ/p∞, from the Darwin solution (encounter sheet §4.1)"),
        ("2pl", "e₂ = π/(4h): Saketh, Vines, Steinhoff, Buonanno 2021, arXiv:2109.05994; Bern et al. 2023, arXiv:2305.08981 (sheet §4.1)"),
        ("3pl_conservative", "test-charge e₃ from Darwin (sheet §4.2); two-body ν dependence NOT included"),
        ("3pl", "plus radiation reaction by linear response from the ALD angular-momentum loss (sheet §4.2, DERIVED)"),
        ("chi_test_exact", "Darwin 1913; Landau & Lifshitz, Classical Theory of Fields §39 Problem 1 (sheet §4.3; deflection sheet §6)"),
        ("e_rad", "test charge, leading order (sheet §4.4)"),
        ("e_rad_dipole", "two-body non-relativistic electric dipole (sheet §4.4)"),
        ("j_rad", "ALD torque, O(e⁴) (sheet §4.2, DERIVED)"),
        ("impulse", "−p sin χ of the PL series and on-shell longitudinal parts (sheet §2.1 construction, §4.1)"),
    ]);
    Ok(EmResult {
        force: "em",
        units: "Gaussian, c = 1",
        gamma: b.gamma,
        nu: k.nu,
        kappa,
        b_over_gm: k.b_over_gm,
        chi: PlAngles { pl1: a1, pl2: a2, pl3_conservative: a3c, pl3: a3 },
        chi_test_exact,
        fall_to_centre: fall,
        e_rad,
        e_rad_dipole,
        j_rad,
        impulse: imp,
        covariant: cov,
        coefficients: PlCoefficients { e1, e2, e3_test: e3, delta_chi_rr: rr },
        kinematics: *k,
        orders,
        flags,
        sources,
        physical,
        notice: crate::validity::ESTIMATE_NOTICE,
    })
}

/// Which variable a sweep runs over.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "lowercase")]
pub enum SweepVar {
    /// b in units of GM/c².
    B,
    /// j = J/(G m1 m2).
    J,
}

/// One point of a χ sweep.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct SweepPoint {
    /// The swept value (b/(GM) or j).
    pub x: f64,
    pub b_over_gm: f64,
    pub j: f64,
    pub chi: PmAngles,
    pub chi_newtonian: f64,
    pub chi_test_body: Option<f64>,
    pub chi_estimate: Option<f64>,
    pub captured: bool,
}

/// A χ(b) or χ(j) sweep for plotting, with the test-body capture threshold.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Sweep {
    pub var: SweepVar,
    pub gamma: f64,
    pub nu: f64,
    /// Test-body capture threshold in j and as b/(GM) (shade x below it).
    pub j_critical_test_body: f64,
    pub b_critical_test_body: f64,
    /// Why the estimate is missing, when it is.
    pub estimate_note: Option<String>,
    pub points: Vec<SweepPoint>,
}

/// Largest number of sweep points.
pub const SWEEP_MAX_POINTS: usize = 20_000;

/// χ at every order, the exact test-body angle and the estimate over a logarithmic grid of `n`
/// points in b/(GM) or j from `min` to `max` (gravity; the request's b / j is ignored).
///
/// # Errors
/// The request's validation errors; [`InputError::OutOfRange`] naming `min`, `max` or `n`
/// (0 < min < max ≤ 1e60, 2 ≤ n ≤ 20000); `force` must be gravity.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::{chi_sweep, EncounterRequest, SweepVar};
/// let req: EncounterRequest = serde_json::from_str(r#"{"nu": 0.25, "gamma": 1.1}"#).unwrap();
/// let s = chi_sweep(&req, SweepVar::J, 2.0, 200.0, 50).unwrap();
/// assert_eq!(s.points.len(), 50);
/// // mpmath 1.3, dps 40 (tests/reference/encounter_mpmath.py): jcrit(1.1) = 4.724555912615340
/// assert!((s.j_critical_test_body - 4.724555912615340).abs() < 1e-12);
/// assert!(s.points[0].chi_test_body.is_none()); // j = 2 < j_c: captured
/// ```
pub fn chi_sweep(req: &EncounterRequest, var: SweepVar, min: f64, max: f64, n: usize) -> Result<Sweep, InputError> {
    if req.force != Force::Gravity {
        return Err(InputError::Inconsistent { field: "force", reason: "the χ sweep is for force \"gravity\"".into() });
    }
    crate::error::positive("min", min)?;
    crate::error::positive("max", max)?;
    if !(max > min) || max > kinematics::ORBIT_MAX {
        return Err(InputError::OutOfRange { field: "max", value: max, allowed: format!("min < max ≤ {:e}", kinematics::ORBIT_MAX) });
    }
    if !(2..=SWEEP_MAX_POINTS).contains(&n) {
        return Err(InputError::OutOfRange { field: "n", value: n as f64, allowed: format!("2 ≤ n ≤ {SWEEP_MAX_POINTS}") });
    }
    let orbit_at = |x: f64| match var {
        SweepVar::B => Orbit::B(x),
        SweepVar::J => Orbit::J(x),
    };
    let s0 = req.setup_with(Some(orbit_at(min)))?;
    let b = s0.kin.boost;
    let nu = s0.kin.nu;
    let c = pm::coefficients(&b, nu);
    let chi_e = [c[0], c[1], c[2] + c[3]];
    let j_c = testbody::critical_j(&b);
    let ratio = (max / min).ln();
    let mut note = None;
    let mut points = Vec::with_capacity(n);
    for i in 0..n {
        let x = if i + 1 == n { max } else { min * (ratio * i as f64 / (n - 1) as f64).exp() };
        let kin = Kinematics::new(s0.kin.m1, s0.kin.m2, b, orbit_at(x))?;
        let tb = match testbody::exact(&b, kin.j)? {
            testbody::TestBody::Scattered { chi, .. } => Some(chi),
            testbody::TestBody::Captured => None,
        };
        let (est, cap) = match eob::estimate(b.gamma, nu, kin.j, &chi_e) {
            Ok(eob::Estimate::Scattered { chi, .. }) => (Some(chi), false),
            Ok(eob::Estimate::Captured { .. }) => (None, true),
            Err(e) => {
                note.get_or_insert_with(|| e.to_string());
                (None, false)
            }
        };
        points.push(SweepPoint {
            x,
            b_over_gm: kin.b_over_gm,
            j: kin.j,
            chi: PmAngles::from(pm::cumulative_angles(&c, kin.j)),
            chi_newtonian: pm::chi_newtonian(kin.b_over_gm, b.v),
            chi_test_body: tb,
            chi_estimate: est,
            captured: cap,
        });
    }
    Ok(Sweep { var, gamma: b.gamma, nu, j_critical_test_body: j_c, b_critical_test_body: j_c * s0.kin.h / b.p_inf, estimate_note: note, points })
}
