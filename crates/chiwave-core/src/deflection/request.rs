//! The light-deflection request as the page and `chiwave light` send it (`{"kind": "light",
//! ...}`), its validation and its evaluation.

use super::results::{LightPhysical, LightResult, SeriesTerm};
use super::{accuracy, flags, ppn, series, sources, strong, Metric};
use crate::error::{finite, in_closed, InputError};
use crate::units::{parse_length, parse_mass, AngleUnit, Mass, Quantity};
use serde::{Deserialize, Serialize};

/// Smallest impact parameter accepted in a request, b/M (smaller values are captured anyway).
pub const B_MIN: f64 = 1e-6;
/// Largest impact parameter accepted in a request, b/M (keeps every partial sum finite).
pub const B_MAX: f64 = 1e100;

/// Checks B_MIN ≤ b ≤ B_MAX.
pub(crate) fn check_b(field: &'static str, b: f64) -> Result<f64, InputError> {
    finite(field, b)?;
    if (B_MIN..=B_MAX).contains(&b) {
        Ok(b)
    } else {
        Err(InputError::OutOfRange { field, value: b, allowed: format!("{B_MIN:e} ≤ {field}/M ≤ {B_MAX:e} (and > 0)") })
    }
}

fn default_ppn_gamma() -> f64 {
    1.0
}
fn default_orders() -> usize {
    8
}

/// Light-deflection request, as the page and `chiwave light` send it.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct LightRequest {
    /// Lens mass with a unit (e.g. `"1Msun"`); absent or bare number means geometric (M = 1).
    #[serde(default)]
    pub mass: Option<Quantity>,
    /// Impact parameter: bare number = units of M, or a length with a unit (needs a physical mass).
    pub b: Quantity,
    /// Signed spin a/M, + = prograde, |a| ≤ M.
    #[serde(default)]
    pub spin: f64,
    /// Charge Q/M (geometrised Gaussian), |Q| ≤ M.
    #[serde(default)]
    pub charge: f64,
    /// PPN γ: scales the first-order series term by (1 + γ)/2; the exact α stays GR.
    #[serde(default = "default_ppn_gamma")]
    pub ppn_gamma: f64,
    /// Number of weak-field series orders (1..=12).
    #[serde(default = "default_orders")]
    pub orders: usize,
    /// Optional wavelength of the light (length; bare = units of M), for the geometric-optics flag.
    #[serde(default)]
    pub wavelength: Option<Quantity>,
    /// Optional beam width (length; bare = units of M), for the ray-optics flags.
    #[serde(default)]
    pub beam_width: Option<Quantity>,
    /// Optional solar elongation of the ray in degrees, 0 < φ ≤ 180, for the finite-distance PPN form.
    #[serde(default)]
    pub elongation_deg: Option<f64>,
    /// Relative tolerance of the verdicts, 1e-12 … 0.5 (default 1e-2).
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub tolerance: Option<f64>,
}

impl LightRequest {
    /// A geometric request: b in units of M, Schwarzschild, 8 orders, γ = 1.
    pub fn geometric(b: f64) -> Self {
        LightRequest {
            mass: None,
            b: Quantity::Number(b),
            spin: 0.0,
            charge: 0.0,
            ppn_gamma: 1.0,
            orders: default_orders(),
            wavelength: None,
            beam_width: None,
            elongation_deg: None,
            tolerance: None,
        }
    }
}

/// Validated inputs.
pub(crate) struct Validated {
    pub metric: Metric,
    pub b: f64,
    pub mass: Mass,
    /// G M/c² in metres for a physical mass.
    pub mass_len: Option<f64>,
    pub gamma: f64,
    pub orders: usize,
    pub wavelength: Option<f64>,
    pub beam: Option<f64>,
    pub elongation: Option<f64>,
    pub tolerance: f64,
}

impl LightRequest {
    /// Checks every field and converts to units of M.
    pub(crate) fn validate(&self) -> Result<Validated, InputError> {
        let metric = Metric::new(self.spin, self.charge)?;
        let tolerance = crate::validity::tolerance(self.tolerance)?;
        in_closed("ppn_gamma", self.ppn_gamma, 0.0, 2.0)?;
        if !(1..=series::MAX_ORDER).contains(&self.orders) {
            return Err(InputError::OutOfRange {
                field: "orders",
                value: self.orders as f64,
                allowed: format!("an integer 1 ≤ orders ≤ {}", series::MAX_ORDER),
            });
        }
        let mass = match &self.mass {
            Some(q) => parse_mass("mass", q)?,
            None => Mass::Geometric(1.0),
        };
        let (mass_len, unit_mass) = match mass {
            Mass::Physical { .. } => (mass.length_m(), 1.0),
            Mass::Geometric(m) => (None, m),
        };
        let length = |field: &'static str, q: &Quantity| -> Result<f64, InputError> {
            let x = parse_length(field, q)?.in_units_of(field, mass_len)? / unit_mass;
            crate::error::positive(field, x)
        };
        let b = check_b("b", length("b", &self.b)?)?;
        let wavelength = self.wavelength.as_ref().map(|q| length("wavelength", q)).transpose()?;
        let beam = self.beam_width.as_ref().map(|q| length("beam_width", q)).transpose()?;
        let elongation = match self.elongation_deg {
            Some(e) => {
                finite("elongation_deg", e)?;
                if !(e > 0.0 && e <= 180.0) {
                    return Err(InputError::OutOfRange {
                        field: "elongation_deg",
                        value: e,
                        allowed: "0 < elongation_deg ≤ 180".into(),
                    });
                }
                Some(e)
            }
            None => None,
        };
        Ok(Validated { metric, b, mass, mass_len, gamma: self.ppn_gamma, orders: self.orders, wavelength, beam, elongation, tolerance })
    }

    /// Evaluates the request: exact α (or capture), closest approach, critical b, weak-field
    /// partial sums with their errors, strong-deflection limit, PPN numbers, regime flags,
    /// SI values for a physical mass, and the source of every output.
    ///
    /// # Errors
    /// Validation errors naming the field and its allowed range; non-convergence of a
    /// quadrature (reported, never NaN).
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::deflection::LightRequest;
    /// let mut req = LightRequest::geometric(6.957e8);
    /// req.mass = Some("1Msun".into());
    /// req.b = "6.957e8m".into();
    /// let r = req.evaluate().unwrap();
    /// // Exact GR at b = R☉ (IAU 2015 nominal; Darwin 1959 closed form, mpmath 1.3 in
    /// // tests/reference/deflection_mpmath.py) is 1.75120127283584 arcsec.
    /// assert!((r.alpha_arcsec.unwrap() - 1.751_201_272_835_84).abs() < 1e-12);
    /// // IAU 2015 nominal: 4GM/(c²R) = 1.75119032555998 arcsec (the series' first term).
    /// let first = r.physical.unwrap().ppn_alpha_1pm_arcsec;
    /// assert!((first - 1.751_190_325_559_98).abs() < 1e-12);
    /// ```
    pub fn evaluate(&self) -> Result<LightResult, InputError> {
        let v = self.validate()?;
        let (defl, acc, acc_method) = accuracy::exact_with_accuracy(v.metric, v.b)?;
        let alpha = defl.alpha();
        let bc = v.metric.critical_b();
        let coeffs = v.metric.series_coefficients(v.orders);
        let sums = series::partial_sums(&coeffs, v.b, 0.5 * (1.0 + v.gamma));
        let d = v.b / bc - 1.0;
        let acc = accuracy::light(alpha, acc, acc_method, &coeffs, &sums, v.b, v.gamma, v.metric, d, v.elongation.is_some(), v.tolerance);
        let series: Vec<SeriesTerm> = sums
            .iter()
            .zip(&acc.series)
            .enumerate()
            .map(|(i, (s, e))| SeriesTerm { order: i + 1, alpha: *s, rel_error: alpha.map(|a| (s - a) / a), estimate: e.clone() })
            .collect();
        let strong_deflection = match (v.metric, alpha) {
            (Metric::Schwarzschild, Some(a)) if accuracy::strong_reported(d).is_ok() => strong::compare(d, a),
            _ => None,
        };
        let ppn = ppn::evaluate(v.b, v.gamma, v.elongation);
        let physical = v.mass_len.map(|l| {
            let conv = |u: AngleUnit| alpha.map(|a| u.from_rad(a));
            LightPhysical {
                mass_kg: v.mass.kg().unwrap_or(f64::NAN),
                mass_msun: v.mass.msun().unwrap_or(f64::NAN),
                gm_over_c2_m: l,
                b_m: v.b * l,
                b_over_m: v.b,
                closest_approach_m: defl.closest_approach().map(|r| r * l),
                critical_b_m: bc * l,
                alpha_rad: alpha,
                alpha_deg: conv(AngleUnit::Deg),
                alpha_arcsec: conv(AngleUnit::Arcsec),
                alpha_mas: conv(AngleUnit::Mas),
                alpha_uas: conv(AngleUnit::Uas),
                ppn_alpha_1pm_arcsec: AngleUnit::Arcsec.from_rad(ppn.alpha_1pm),
                wavelength_m: v.wavelength.map(|w| w * l),
            }
        });
        let alpha_arcsec = physical.as_ref().and_then(|p| p.alpha_arcsec);
        let flags = flags::light(&v, d, alpha, &series, &acc);
        let (sources, citations) = sources::light(v.metric);
        Ok(LightResult {
            best: acc.best,
            tolerance: v.tolerance,
            metric: v.metric.name(),
            alpha,
            captured: alpha.is_none(),
            critical_b: bc,
            closest_approach: defl.closest_approach(),
            b_over_m: v.b,
            impact_parameter_alias: v.b,
            series,
            strong_deflection,
            ppn,
            alpha_arcsec,
            physical,
            estimates: acc.estimates,
            flags,
            sources,
            citations,
        })
    }
}
