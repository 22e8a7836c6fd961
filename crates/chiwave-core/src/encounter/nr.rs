//! Comparison with numerical-relativity (NR) scattering angles supplied by the user.
//!
//! chiwave ships **no** NR data. The user gives a CSV with one row per simulation:
//! `E/M, J/M², ν, χ, σχ` (E and J the initial ADM energy and angular momentum in units G = c = 1,
//! χ in radians). A header line is optional; lines starting with `#` are comments.
//! Inputs are converted with the relations of docs/physics/encounter.md §1 (Damour 2016,
//! arXiv:1609.00354, energy map):
//! γ = 1 + (h² − 1)/(2ν) with h = E/M, and j = (J/(G M²))/ν. Using ADM values of initial data
//! at finite separation as asymptotic E and J is standard practice (Damour et al. 2014,
//! arXiv:1402.7307) but an approximation.

use super::kinematics::{RelativeSpeed, Kinematics, Orbit};
use super::{eob, pm, testbody, PmAngles};
use crate::error::InputError;
use serde::Serialize;

/// One user-supplied NR row.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct NrRow {
    pub e_over_m: f64,
    pub j_over_m2: f64,
    pub nu: f64,
    pub chi: f64,
    pub sigma_chi: f64,
}

/// Parses the CSV described in the module docs (commas, semicolons or whitespace separate).
///
/// # Errors
/// [`InputError::Parse`] naming `csv` with the line number for a malformed line (a non-numeric
/// line is accepted only as the first non-comment line, the header); [`InputError::Missing`] if
/// there are no data rows.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::nr::parse_csv;
/// // synthetic rows, invented for this example (not NR data)
/// let rows = parse_csv("# synthetic\nE/M,J/M2,nu,chi,sigma\n1.02, 1.1, 0.25, 1.2, 0.01\n").unwrap();
/// assert_eq!(rows.len(), 1);
/// assert_eq!(rows[0].nu, 0.25);
/// ```
pub fn parse_csv(text: &str) -> Result<Vec<NrRow>, InputError> {
    let mut rows = Vec::new();
    let mut seen_first = false;
    for (i, raw) in text.lines().enumerate() {
        let line = raw.trim();
        if line.is_empty() || line.starts_with('#') {
            continue;
        }
        let fields: Vec<&str> = line.split(|c: char| c == ',' || c == ';' || c.is_whitespace()).filter(|s| !s.is_empty()).collect();
        let nums: Result<Vec<f64>, _> = fields.iter().map(|s| s.parse::<f64>()).collect();
        let first = !seen_first;
        seen_first = true;
        match nums {
            Ok(v) if v.len() == 5 => rows.push(NrRow { e_over_m: v[0], j_over_m2: v[1], nu: v[2], chi: v[3], sigma_chi: v[4] }),
            Err(_) if first => continue, // header
            _ => {
                return Err(InputError::Parse {
                    field: "csv",
                    text: format!("line {}: {}", i + 1, line),
                    expected: "five numbers per row: E/M, J/M², ν, χ, σχ".into(),
                })
            }
        }
    }
    if rows.is_empty() {
        return Err(InputError::Missing { field: "csv", hint: "no data rows (expected E/M, J/M², ν, χ, σχ per line)".into() });
    }
    Ok(rows)
}

/// One compared row: the user's values and every prediction at the converted (γ, j).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct NrComparison {
    pub input: NrRow,
    pub gamma: f64,
    pub j: f64,
    pub chi: PmAngles,
    pub chi_test_body: Option<f64>,
    pub chi_estimate: Option<f64>,
    pub captured: bool,
    /// Why the estimate is missing, when it is.
    pub estimate_note: Option<String>,
    /// (χ_NR − χ_3PM)/σχ, null for σχ = 0.
    pub pull_3pm: Option<f64>,
}

/// Converts and compares every row.
///
/// # Errors
/// [`InputError::OutOfRange`] naming `E/M` (needs E/M > 1, an unbound encounter), `J/M²` (> 0),
/// `nu` (0 < ν ≤ 1/4) or `sigma_chi` (≥ 0), with the row number in the message; test-body
/// quadrature non-convergence.
pub fn compare(rows: &[NrRow]) -> Result<Vec<NrComparison>, InputError> {
    rows.iter()
        .enumerate()
        .map(|(i, r)| {
            let bad = |field: &'static str, value: f64, allowed: &str| InputError::OutOfRange { field, value, allowed: format!("{allowed} (row {})", i + 1) };
            if !(r.e_over_m.is_finite() && r.e_over_m > 1.0) {
                return Err(bad("E/M", r.e_over_m, "E/M > 1 (unbound)"));
            }
            if !(r.j_over_m2.is_finite() && r.j_over_m2 > 0.0) {
                return Err(bad("J/M²", r.j_over_m2, "J/M² > 0"));
            }
            if !(r.nu.is_finite() && r.nu > 0.0 && r.nu <= 0.25) {
                return Err(bad("nu", r.nu, "0 < ν ≤ 1/4"));
            }
            if !(r.sigma_chi.is_finite() && r.sigma_chi >= 0.0 && r.chi.is_finite()) {
                return Err(bad("sigma_chi", r.sigma_chi, "finite χ and σχ ≥ 0"));
            }
            let h = r.e_over_m;
            let boost = RelativeSpeed::from_gamma_m1("E/M", (h - 1.0) * (h + 1.0) / (2.0 * r.nu))?;
            let (m1, m2) = Kinematics::masses_from_nu(r.nu)?;
            let kin = Kinematics::new(m1, m2, boost, Orbit::J(r.j_over_m2 / r.nu))?;
            let c = pm::coefficients(&boost, r.nu);
            let chi = PmAngles::from(pm::cumulative_angles(&c, kin.j));
            let tb = match testbody::exact(&boost, kin.j)? {
                testbody::TestBody::Scattered { chi, .. } => Some(chi),
                testbody::TestBody::Captured => None,
            };
            let (est, cap, note) = match eob::estimate(boost.gamma, r.nu, kin.j, &[c[0], c[1], c[2] + c[3]]) {
                Ok(eob::Estimate::Scattered { chi, .. }) => (Some(chi), false, None),
                Ok(eob::Estimate::Captured { .. }) => (None, true, None),
                Err(e) => (None, false, Some(e.to_string())),
            };
            Ok(NrComparison {
                input: *r,
                gamma: boost.gamma,
                j: kin.j,
                chi,
                chi_test_body: tb,
                chi_estimate: est,
                captured: cap,
                estimate_note: note,
                pull_3pm: if r.sigma_chi > 0.0 { Some((r.chi - chi.pm3) / r.sigma_chi) } else { None },
            })
        })
        .collect()
}
