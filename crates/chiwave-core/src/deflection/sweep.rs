//! α against b for plots: exact value and every weak-field partial sum on a log-spaced grid.
//!
//! No formula of its own: each value comes from `deflection::strong` and `deflection::series`,
//! whose doc comments give the sources (Darwin 1959; Keeton & Petters 2005, gr-qc/0511019, and
//! the series generated in code).

use super::{series, LightRequest, Metric};
use crate::error::{positive, InputError};
use serde::Serialize;

/// The former name of [`AlphaSweep`].
#[deprecated(note = "renamed AlphaSweep")]
pub type Sweep = AlphaSweep;

/// One partial-sum curve.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SweepSeries {
    /// Highest order included.
    pub order: usize,
    /// Partial sum through `order` at each b (radians).
    pub alpha: Vec<f64>,
}

/// α(b) on a grid, for a log–log plot.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct AlphaSweep {
    pub metric: &'static str,
    /// b_c/M: the exact curve ends (capture) and the series diverges below it.
    pub critical_b: f64,
    /// Impact parameters b/M, log-spaced from b_min to b_max.
    pub b: Vec<f64>,
    /// Exact α (radians) at each b; `None` where the ray is captured.
    pub alpha: Vec<Option<f64>>,
    /// Partial sums of orders 1..=orders.
    pub series: Vec<SweepSeries>,
    /// Bozza's leading log form at each escaping b where it is meaningful
    /// ([`super::strong_reported`]; null elsewhere). Schwarzschild only, else absent.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub strong_deflection: Option<Vec<Option<f64>>>,
}

/// Largest number of grid points accepted.
pub const MAX_SWEEP_POINTS: usize = 100_000;

/// Exact α and every partial sum on `n` log-spaced impact parameters b_min … b_max (units of
/// M), for the lens described by `req` (its `spin`, `charge`, `ppn_gamma`, `orders`; `req.b`
/// and the optional fields are not used).
///
/// # Errors
/// The request's own validation errors; `b_min`, `b_max` not finite or outside
/// [`super::B_MIN`] … [`super::B_MAX`]; `b_max ≤ b_min`
/// (field `b_max`); `n` outside 2..=100000 (field `n`); non-convergence.
///
/// # Examples
/// ```
/// use chiwave_core::deflection::{sweep, LightRequest};
/// let s = sweep(&LightRequest::geometric(10.0), 1.0, 1e4, 5).unwrap();
/// assert_eq!(s.b.len(), 5);
/// assert_eq!(s.alpha[0], None); // b = 1 M: captured
/// // mpmath 1.3, tests/reference/deflection_mpmath.py: α(1e4 M) = 0.00040011785240819223402
/// assert!((s.alpha[4].unwrap() / 4.001_178_524_081_922e-4 - 1.0).abs() < 1e-12);
/// ```
pub fn sweep(req: &LightRequest, b_min: f64, b_max: f64, n: usize) -> Result<AlphaSweep, InputError> {
    let metric = Metric::new(req.spin, req.charge)?;
    let mut probe = req.clone();
    probe.b = crate::units::Quantity::Number(10.0);
    probe.mass = None;
    probe.wavelength = None;
    probe.beam_width = None;
    let v = probe.validate()?;
    positive("b_min", b_min)?;
    positive("b_max", b_max)?;
    super::check_b("b_min", b_min)?;
    super::check_b("b_max", b_max)?;
    if b_max <= b_min {
        return Err(InputError::OutOfRange { field: "b_max", value: b_max, allowed: format!("b_max > b_min = {b_min}") });
    }
    if !(2..=MAX_SWEEP_POINTS).contains(&n) {
        return Err(InputError::OutOfRange { field: "n", value: n as f64, allowed: format!("2 ≤ n ≤ {MAX_SWEEP_POINTS}") });
    }
    let ratio = (b_max / b_min).ln();
    let b: Vec<f64> = (0..n)
        .map(|i| if i + 1 == n { b_max } else { b_min * (ratio * i as f64 / (n - 1) as f64).exp() })
        .collect();
    let alpha = b.iter().map(|&bi| metric.deflection(bi).map(|d| d.alpha())).collect::<Result<Vec<_>, _>>()?;
    let coeffs = metric.series_coefficients(v.orders.min(series::MAX_ORDER));
    let scale = 0.5 * (1.0 + v.gamma);
    let sums: Vec<Vec<f64>> = b.iter().map(|&bi| series::partial_sums(&coeffs, bi, scale)).collect();
    let series = (0..coeffs.len())
        .map(|k| SweepSeries { order: k + 1, alpha: sums.iter().map(|s| s[k]).collect() })
        .collect();
    let bc = metric.critical_b();
    // Only where the expansion means something (the rule of the light result, so the curve and
    // the table agree; no negative angles far from the photon sphere).
    let strong_deflection = matches!(metric, Metric::Schwarzschild)
        .then(|| b.iter().map(|&bi| super::strong_reported(bi / bc - 1.0).ok().map(|(lead, _)| lead)).collect());
    Ok(AlphaSweep { metric: metric.name(), critical_b: bc, b, alpha, series, strong_deflection })
}
