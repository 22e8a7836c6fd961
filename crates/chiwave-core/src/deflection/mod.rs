//! Deflection of light and other massless waves by a mass (Schwarzschild, Kerr equatorial,
//! Reissner–Nordström), weak-field series, strong-deflection limit, PPN.
//!
//! Conventions (deflection sheet §0): G = c = 1, lengths in units of the lens mass M; α is the
//! total deflection in radians, positive toward the lens, α = Δφ − π, with b = L/p_∞ and r0 the
//! areal (Boyer–Lindquist) radius of closest approach. Kerr spin is signed, a_s > 0 prograde.
//! Capture (b ≤ b_c) is a result, reported with `alpha = None`, never NaN.
//!
//! Sources, by piece (every function names its own):
//! * exact Schwarzschild α: Darwin 1959, Proc. R. Soc. A 249, 180 (sheet §1) — [`schwarzschild`];
//! * Kerr equatorial: Carter-equation θ-form (sheet §2), photon orbits Bardeen, Press &
//!   Teukolsky 1972, ApJ 178, 347 — [`kerr`];
//! * Reissner–Nordström: sheet §2 — [`reissner_nordstrom`];
//! * weak-field series: Keeton & Petters 2005, gr-qc/0511019 (orders 1–4), generated in code to
//!   order 12 — [`series`];
//! * strong-deflection limit: Bozza 2002, gr-qc/0208075 — [`strong`];
//! * PPN: Will 2014, arXiv:1403.7377; Lambert & Le Poncin-Lafitte 2009, arXiv:0903.1615 — [`ppn`].
//!
//! Entry points: [`LightRequest::evaluate`], [`sweep()`] (α against b for plots, an
//! [`AlphaSweep`]), [`rays`] (ray paths in the lens plane).

pub mod kerr;
pub mod ppn;
mod quadrature;
mod rays;
pub mod reissner_nordstrom;
pub mod schwarzschild;
pub mod series;
pub mod strong;
mod sweep;

pub use rays::{rays, Ray, RayFan};
#[allow(deprecated)]
pub use sweep::Sweep;
pub use sweep::{sweep, AlphaSweep, SweepSeries};

use crate::error::{finite, in_closed, InputError};
use crate::units::{parse_length, parse_mass, AngleUnit, Mass, Quantity};
use crate::validity::{geometric_optics_level, Check, Flag, Level};
use serde::{Deserialize, Serialize};
use std::collections::BTreeMap;

/// The regime checks of this file: stable key and the label shown with it.
const CAPTURE: Check = Check::new("capture", "capture b/b_c − 1");
const SERIES_CONVERGENCE: Check = Check::new("series_convergence", "series convergence b_c/b");
const GEOMETRIC_OPTICS: Check = Check::new("geometric_optics", "geometric optics w");
const PPN_GAMMA: Check = Check::new("ppn_gamma", "PPN γ");
const WEAK_FIELD: Check = Check::new("weak_field", "weak field M/b");
const STRONG_DEFLECTION: Check = Check::new("strong_deflection", "strong-deflection limit b/b_c − 1");
const BEAM_VS_IMPACT: Check = Check::new("beam_vs_impact", "beam width/b");
const WAVELENGTH_VS_BEAM: Check = Check::new("wavelength_vs_beam", "wavelength/beam width");

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

/// Outcome of one ray: scattered with an angle, or captured.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
#[serde(tag = "status", rename_all = "lowercase")]
pub enum Deflection {
    /// The ray escapes; `alpha` in radians (positive toward the lens), `closest_approach` = r0/M.
    Scattered { alpha: f64, closest_approach: f64 },
    /// b ≤ b_c: the ray falls into the hole; there is no deflection angle.
    Captured,
}

impl Deflection {
    /// The angle, `None` when captured.
    pub fn alpha(&self) -> Option<f64> {
        match self {
            Deflection::Scattered { alpha, .. } => Some(*alpha),
            Deflection::Captured => None,
        }
    }
    /// r0/M, `None` when captured.
    pub fn closest_approach(&self) -> Option<f64> {
        match self {
            Deflection::Scattered { closest_approach, .. } => Some(*closest_approach),
            Deflection::Captured => None,
        }
    }
}

/// The lens: which metric, with its spin or charge in units of M.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Metric {
    Schwarzschild,
    /// Equatorial rays; signed spin a_s/M in [−1, 1], + prograde.
    Kerr { spin: f64 },
    /// Charge Q/M in [−1, 1] (geometrized Gaussian).
    ReissnerNordstrom { charge: f64 },
}

impl Metric {
    /// Chooses the metric from spin a/M and charge Q/M.
    ///
    /// # Errors
    /// `spin` or `charge` not finite or outside [−1, 1]; both nonzero (Kerr–Newman is not
    /// supported) gives [`InputError::Inconsistent`] naming both fields.
    pub fn new(spin: f64, charge: f64) -> Result<Self, InputError> {
        in_closed("spin", spin, -1.0, 1.0)?;
        in_closed("charge", charge, -1.0, 1.0)?;
        Ok(match (spin != 0.0, charge != 0.0) {
            (false, false) => Metric::Schwarzschild,
            (true, false) => Metric::Kerr { spin },
            (false, true) => Metric::ReissnerNordstrom { charge },
            (true, true) => {
                return Err(InputError::Inconsistent {
                    field: "spin",
                    reason: format!(
                        "spin = {spin} and charge = {charge} are both nonzero: a spinning charged (Kerr–Newman) lens is not supported; set spin = 0 or charge = 0"
                    ),
                })
            }
        })
    }

    /// `"schwarzschild"`, `"kerr"` or `"reissner-nordstrom"`.
    pub fn name(&self) -> &'static str {
        match self {
            Metric::Schwarzschild => "schwarzschild",
            Metric::Kerr { .. } => "kerr",
            Metric::ReissnerNordstrom { .. } => "reissner-nordstrom",
        }
    }

    /// Critical impact parameter b_c/M (capture for b ≤ b_c).
    pub fn critical_b(&self) -> f64 {
        match *self {
            Metric::Schwarzschild => schwarzschild::CRITICAL_B,
            Metric::Kerr { spin } => kerr::critical_b(spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::critical_b(charge),
        }
    }

    /// Radius of the (equatorial) circular photon orbit, units of M.
    pub fn photon_orbit_radius(&self) -> f64 {
        match *self {
            Metric::Schwarzschild => schwarzschild::PHOTON_SPHERE,
            Metric::Kerr { spin } => kerr::photon_orbit_radius(spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::photon_sphere_radius(charge),
        }
    }

    /// Outer horizon radius r_+, units of M.
    pub fn horizon_radius(&self) -> f64 {
        match *self {
            Metric::Schwarzschild => 2.0,
            Metric::Kerr { spin } => kerr::horizon_radius(spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::horizon_radius(charge),
        }
    }

    /// Exact deflection at impact parameter `b` (units of M).
    ///
    /// # Errors
    /// `b` not finite or ≤ 0; quadrature non-convergence.
    pub fn deflection(&self, b: f64) -> Result<Deflection, InputError> {
        match *self {
            Metric::Schwarzschild => schwarzschild::deflection(b),
            Metric::Kerr { spin } => kerr::deflection(b, spin),
            Metric::ReissnerNordstrom { charge } => reissner_nordstrom::deflection(b, charge),
        }
    }

    /// Weak-field coefficients c_1 … c_n in powers of M/b (n ≤ [`series::MAX_ORDER`]).
    pub fn series_coefficients(&self, n: usize) -> Vec<f64> {
        match *self {
            Metric::Schwarzschild => series::schwarzschild_coefficients(n),
            Metric::Kerr { spin } => series::kerr_coefficients(spin, n),
            Metric::ReissnerNordstrom { charge } => series::rn_coefficients(charge, n),
        }
    }
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
        }
    }
}

/// One weak-field partial sum.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SeriesTerm {
    /// Highest order n included.
    pub order: usize,
    /// Σ_{k ≤ n} c_k (M/b)^k, radians (first term × (1 + γ)/2).
    pub alpha: f64,
    /// (partial sum − exact α)/exact α; `None` when captured.
    pub rel_error: Option<f64>,
}

/// SI values, present when the mass has a physical unit.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Physical {
    pub mass_kg: f64,
    pub mass_msun: f64,
    /// G M/c², metres.
    pub gm_over_c2_m: f64,
    pub b_m: f64,
    pub b_over_m: f64,
    pub closest_approach_m: Option<f64>,
    pub critical_b_m: f64,
    pub alpha_rad: Option<f64>,
    pub alpha_deg: Option<f64>,
    pub alpha_arcsec: Option<f64>,
    pub alpha_mas: Option<f64>,
    pub alpha_uas: Option<f64>,
    /// PPN [(1 + γ)/2]·4GM/(c²b) in arcsec.
    pub ppn_alpha_1pm_arcsec: f64,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub wavelength_m: Option<f64>,
}

/// Light-deflection result (JSON keys are the CLI contract).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LightResult {
    /// `"schwarzschild"`, `"kerr"` or `"reissner-nordstrom"`.
    pub metric: &'static str,
    /// Exact deflection, radians, positive toward the lens; `None` when captured.
    pub alpha: Option<f64>,
    pub captured: bool,
    /// b_c/M.
    pub critical_b: f64,
    /// r0/M; `None` when captured.
    pub closest_approach: Option<f64>,
    /// b/M as used (M the lens mass, G = c = 1).
    pub b_over_m: f64,
    /// The former key of `b_over_m` (same value), kept for one release.
    #[serde(rename = "impact_parameter")]
    pub impact_parameter_alias: f64,
    /// Partial sums of the weak-field series, orders 1..=orders.
    pub series: Vec<SeriesTerm>,
    /// Bozza's log limit beside the exact value (Schwarzschild, not captured; otherwise null).
    pub strong_deflection: Option<strong::StrongDeflection>,
    pub ppn: ppn::Ppn,
    /// α in arcsec, only with a physical mass.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub alpha_arcsec: Option<f64>,
    #[serde(skip_serializing_if = "Option::is_none")]
    pub physical: Option<Physical>,
    pub flags: Vec<Flag>,
    /// Output key → citation of the formula that produced it.
    pub sources: BTreeMap<&'static str, &'static str>,
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
}

impl LightRequest {
    /// Checks every field and converts to units of M.
    pub(crate) fn validate(&self) -> Result<Validated, InputError> {
        let metric = Metric::new(self.spin, self.charge)?;
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
        Ok(Validated { metric, b, mass, mass_len, gamma: self.ppn_gamma, orders: self.orders, wavelength, beam, elongation })
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
    /// // Deflection sheet §3: exact GR at b = R_sun (IAU 2015 nominal) is 1.75120127283584 arcsec.
    /// assert!((r.alpha_arcsec.unwrap() - 1.751_201_272_835_84).abs() < 1e-12);
    /// // IAU 2015 nominal: 4GM/(c²R) = 1.75119032555998 arcsec (the series' first term).
    /// let first = r.physical.unwrap().ppn_alpha_1pm_arcsec;
    /// assert!((first - 1.751_190_325_559_98).abs() < 1e-12);
    /// ```
    pub fn evaluate(&self) -> Result<LightResult, InputError> {
        let v = self.validate()?;
        let defl = v.metric.deflection(v.b)?;
        let alpha = defl.alpha();
        let bc = v.metric.critical_b();
        let coeffs = v.metric.series_coefficients(v.orders);
        let sums = series::partial_sums(&coeffs, v.b, 0.5 * (1.0 + v.gamma));
        let series = sums
            .iter()
            .enumerate()
            .map(|(i, s)| SeriesTerm { order: i + 1, alpha: *s, rel_error: alpha.map(|a| (s - a) / a) })
            .collect();
        let d = v.b / bc - 1.0;
        let strong_deflection = match (v.metric, alpha) {
            (Metric::Schwarzschild, Some(a)) => strong::compare(d, a),
            _ => None,
        };
        let ppn = ppn::evaluate(v.b, v.gamma, v.elongation);
        let physical = v.mass_len.map(|l| {
            let conv = |u: AngleUnit| alpha.map(|a| u.from_rad(a));
            Physical {
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
        Ok(LightResult {
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
            flags: flags(&v, d),
            sources: sources(v.metric),
        })
    }
}

/// The regime flags for one evaluation (thresholds are common practice unless stated).
fn flags(v: &Validated, d: f64) -> Vec<Flag> {
    let mut out = Vec::new();
    let captured = d <= 0.0;
    out.push(Flag::small_parameter(
        WEAK_FIELD,
        1.0 / v.b,
        1e-3,
        0.05,
        [
            "M/b ≪ 1: the first-order value 4M/b is good to about 3(M/b) relative (the 15π/4 term).",
            "M/b is not small: 4M/b (and the PPN 1PM form) misses the higher orders at the level of 3(M/b); use the exact alpha or more series orders.",
            "strong field: the weak-field and PPN values are no prediction here; only the exact alpha holds.",
        ],
    ));
    out.push(if captured {
        Flag::new(CAPTURE, Level::Invalid, Some(d), "b ≤ b_c: the ray is captured by the hole; there is no deflection angle (alpha = null).")
    } else if d < 0.01 {
        Flag::new(
            CAPTURE,
            Level::Caution,
            Some(d),
            "within 1% of the critical impact parameter: the ray winds near the photon orbit and alpha ∝ −ln(b/b_c − 1) is very sensitive to b.",
        )
    } else {
        Flag::new(CAPTURE, Level::Ok, Some(d), "well outside the capture cross-section (b/b_c − 1 ≥ 0.01).")
    });
    let ratio = 1.0 / (d + 1.0);
    let note = match v.metric {
        Metric::Schwarzschild => "",
        _ => " (for Kerr and Reissner–Nordström the radius b_c is expected, not proven)",
    };
    out.push(if ratio >= 1.0 {
        Flag::new(
            SERIES_CONVERGENCE,
            Level::Invalid,
            Some(ratio),
            format!("b ≤ b_c: the weak-field series diverges, its partial sums approximate nothing{note}."),
        )
    } else if ratio > 0.5 {
        Flag::new(
            SERIES_CONVERGENCE,
            Level::Caution,
            Some(ratio),
            format!("the series converges only for b > b_c; here its terms shrink only like (b_c/b)^n, so low orders are far off{note}."),
        )
    } else {
        Flag::new(SERIES_CONVERGENCE, Level::Ok, Some(ratio), format!("b > 2 b_c: the series converges, terms shrink at least like 2^-n{note}."))
    });
    if matches!(v.metric, Metric::Schwarzschild) && !captured {
        out.push(Flag::small_parameter(
            STRONG_DEFLECTION,
            d,
            1e-3,
            0.05,
            [
                "d = b/b_c − 1 ≪ 1: Bozza's logarithmic form is accurate (error ∝ d ln d).",
                "d = b/b_c − 1 is not small: the strong-deflection log form is indicative only.",
                "far from the photon sphere: the strong-deflection log form does not apply.",
            ],
        ));
    }
    if let Some(lambda) = v.wavelength {
        let w = 8.0 * std::f64::consts::PI / lambda;
        let level = geometric_optics_level(w);
        let msg = match level {
            Level::Ok => "w = 4π·2M/λ ≫ 1: the wavelength is far below the Schwarzschild radius; geometric optics (rays) holds.",
            Level::Caution => "w = 4π·2M/λ is only moderately large: wave-optics corrections (interference, diffraction) of order 1/w matter.",
            Level::Invalid => "w = 4π·2M/λ ≲ 1: the wavelength exceeds the Schwarzschild radius; diffraction dominates and a ray deflection angle has no meaning (Takahashi & Nakamura 2003, astro-ph/0305055).",
        };
        out.push(Flag::new(GEOMETRIC_OPTICS, level, Some(w), msg));
    }
    if let Some(l) = v.beam {
        out.push(Flag::small_parameter(
            BEAM_VS_IMPACT,
            l / v.b,
            0.01,
            0.1,
            [
                "beam width ≪ b: the whole beam is deflected by nearly one angle.",
                "beam width is not small against b: its edges are deflected by different angles (α varies across the beam).",
                "beam width comparable to b: there is no single deflection angle for the beam.",
            ],
        ));
        if let Some(lambda) = v.wavelength {
            out.push(Flag::small_parameter(
                WAVELENGTH_VS_BEAM,
                lambda / l,
                0.01,
                0.1,
                [
                    "wavelength ≪ beam width: the beam stays a ray over the lens.",
                    "wavelength not small against the beam width: diffraction spreads the beam by ~λ/ℓ rad.",
                    "beam narrower than a few wavelengths: it diffracts and is no ray.",
                ],
            ));
        }
    }
    if v.gamma != 1.0 {
        out.push(Flag::new(
            PPN_GAMMA,
            Level::Caution,
            Some(v.gamma),
            "γ ≠ 1 rescales only the first series term and the ppn block; alpha stays the exact GR value.",
        ));
    }
    out
}

/// Output key → citation.
fn sources(metric: Metric) -> BTreeMap<&'static str, &'static str> {
    let mut s = BTreeMap::new();
    let (alpha, r0, bc, ser) = match metric {
        Metric::Schwarzschild => (
            "Darwin 1959, Proc. R. Soc. A 249, 180 (elliptic closed form; deflection sheet §1), evaluated via Carlson R_F (DLMF 19.25.5)",
            "r0 = (2b/√3) cos[(1/3) arccos(−3√3 M/b)] (deflection sheet §1)",
            "b_c = 3√3 M (Darwin 1959; deflection sheet §1)",
            "weak-field series, Keeton & Petters 2005, gr-qc/0511019 (orders 1–4); higher orders generated in code (deflection sheet §1 values)",
        ),
        Metric::Kerr { .. } => (
            "Kerr equatorial θ-form quadrature of the Carter equations (deflection sheet §2; cf. Iyer & Hansen 2009, arXiv:0908.0085)",
            "largest root of R(r) = r⁴ + (a² − b²)r² + 2M(b − a)²r (deflection sheet §2)",
            "b_c = 3√(M r_ph) − a_s, Bardeen, Press & Teukolsky 1972, ApJ 178, 347 (deflection sheet §2)",
            "Kerr weak-field series generated in code; sheet §2 table (orders 1–6), Sereno & De Luca 2006, astro-ph/0609435 (orders ≤ 3)",
        ),
        Metric::ReissnerNordstrom { .. } => (
            "Reissner–Nordström θ-form quadrature (deflection sheet §2)",
            "largest root of r⁴ − b²(r² − 2Mr + Q²) (deflection sheet §2)",
            "b_c = r_ph²/√(r_ph² − 2M r_ph + Q²), r_ph = [3M + √(9M² − 8Q²)]/2 (deflection sheet §2)",
            "RN weak-field series generated in code; Keeton & Petters 2005, gr-qc/0511019 and Eiroa, Romero & Torres 2002, gr-qc/0203049 (orders ≤ 3); sheet §2 table (orders 1–6)",
        ),
    };
    s.insert("alpha", alpha);
    s.insert("closest_approach", r0);
    s.insert("critical_b", bc);
    s.insert("series", ser);
    s.insert(
        "strong_deflection",
        "Bozza 2002, gr-qc/0208075 (ā = 1, b̄ = ln[216(7 − 4√3)] − π); next order from deflection sheet §1 (high-precision fit); Schwarzschild only",
    );
    s.insert("ppn", "[(1 + γ)/2]·4M/b (Will 2014, arXiv:1403.7377); finite elongation (1 + γ)(M/b)(1 + cos φ), Lambert & Le Poncin-Lafitte 2009, arXiv:0903.1615");
    s.insert("alpha_arcsec", "alpha converted with 1 rad = 648000/π arcsec; mass from IAU 2015 B3 nominal GM (Prša et al. 2016, arXiv:1605.09788)");
    s.insert("physical", "G M/c² from IAU 2015 B3 nominal GM and the exact c; kg via CODATA 2018 G (Tiesinga et al. 2021)");
    s.insert("flags", "regime thresholds: common practice; geometric optics w = 4GMω/c³ ≫ 1 (Takahashi & Nakamura 2003, astro-ph/0305055)");
    s
}
