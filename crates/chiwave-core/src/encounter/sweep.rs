//! χ over a log-spaced range of b or j (gravity), for the χ(b) and χ(j) figures: every PM order,
//! the Newtonian and exact test-body angles and the strong-field estimate at each point.

use super::results::PmAngles;
use super::{eob, pm, testbody, EncounterRequest, Force};
use crate::error::InputError;
use crate::two_body::{kinematics, Kinematics, Orbit};
use serde::{Deserialize, Serialize};

/// The former name of [`ChiSweep`].
#[deprecated(note = "renamed ChiSweep")]
pub type Sweep = ChiSweep;

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
pub struct ChiSweep {
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
pub fn chi_sweep(req: &EncounterRequest, var: SweepVar, min: f64, max: f64, n: usize) -> Result<ChiSweep, InputError> {
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
    let b = s0.kin.speed;
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
    Ok(ChiSweep { var, gamma: b.gamma, nu, j_critical_test_body: j_c, b_critical_test_body: j_c * s0.kin.h / b.p_inf, estimate_note: note, points })
}
