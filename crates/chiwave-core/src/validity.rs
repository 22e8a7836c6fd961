//! Regime flags shown with every result: where an approximation holds and where it does not.
//!
//! A flag has a stable `key` (for scripts), a short human `label` (for tables and badges: the
//! page keeps no list of flag names), a [`Level`], the number it was judged on, and a sentence
//! for people that says what breaks. Each family declares its checks ([`Check`]: key and label)
//! once, beside their thresholds, in its `flags.rs` (or where its flags are made). Thresholds
//! are common practice unless a flag's constructor names a source.
//!
//! Error estimates: every approximate value of a result carries an [`ErrorEstimate`] (relative,
//! with the method that produced it, or null with the reason), and one rule, [`verdict`], turns
//! it into `ok` / `caution` / `outside` at the request's `tolerance` (default
//! [`DEFAULT_TOLERANCE`]). Flags that grade the accuracy of a value take their level from the
//! same verdict ([`Level::from`]), so one condition never gets two levels. Each result names
//! its recommended value, [`Best`]. The estimators of each family are in its `accuracy.rs`;
//! `docs/physics/accuracy.md` says why each is conservative.

use crate::error::InputError;
use serde::Serialize;
use std::collections::BTreeMap;

/// How far a result can be trusted in a regime.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Level {
    /// Well inside the regime where the formula holds.
    Ok,
    /// Near the edge: the number is indicative; read the message.
    Caution,
    /// Outside the regime: the number should not be used as a prediction.
    Invalid,
}

/// The identity of a regime check: its stable key and its short human label.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Check {
    /// Stable machine-readable name, e.g. `"weak_field"`.
    pub key: &'static str,
    /// Short human name, e.g. `"weak field M/b"` (what the quantity judged is).
    pub label: &'static str,
}

impl Check {
    /// A check with its key and label.
    pub const fn new(key: &'static str, label: &'static str) -> Self {
        Check { key, label }
    }
}

/// One regime check attached to a result.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Flag {
    /// Stable machine-readable name, e.g. `"weak_field"`.
    pub key: &'static str,
    /// Short human name of the check, e.g. `"PM parameter GM/(b v²)"`.
    pub label: &'static str,
    pub level: Level,
    /// The quantity the judgement was made on (e.g. M/b), when there is one.
    pub value: Option<f64>,
    /// What the check means for the result, in one or two sentences.
    pub message: String,
}

impl Flag {
    /// A flag of `check` at `level`, judged on `value`, with its `message`.
    pub fn new(check: Check, level: Level, value: Option<f64>, message: impl Into<String>) -> Self {
        Flag { key: check.key, label: check.label, level, value, message: message.into() }
    }

    /// Grades a small expansion parameter `x` (≥ 0): Ok below `ok`, Caution below `bad`,
    /// Invalid above; the message for each level is given.
    pub fn small_parameter(check: Check, x: f64, ok: f64, bad: f64, msgs: [&str; 3]) -> Self {
        let (level, msg) = if x < ok {
            (Level::Ok, msgs[0])
        } else if x < bad {
            (Level::Caution, msgs[1])
        } else {
            (Level::Invalid, msgs[2])
        };
        Flag::new(check, level, Some(x), msg)
    }
}

/// Smallest dimensionless frequency w = 4GMω/c³ (= 8πGMf/c³, M the lens mass, redshifted for
/// the lens) at which the `geometric_optics` flag is Ok, for the light and the lens results
/// alike: ray optics then holds up to corrections of order 1/w ≤ 1% (the amplification factor
/// F(w, y) tends to its geometric-optics limit with O(1/w) corrections: Takahashi & Nakamura
/// 2003, astro-ph/0305055). Between w = 1 and this value the flag is a caution; below w = 1
/// diffraction dominates and the flag is invalid.
pub const GEOMETRIC_OPTICS_W: f64 = 100.0;

/// The level of the `geometric_optics` flag at dimensionless frequency `w` (see
/// [`GEOMETRIC_OPTICS_W`]): Ok from it up, Caution from 1, Invalid below 1 (and for NaN).
///
/// # Examples
/// ```
/// use chiwave_core::validity::{geometric_optics_level, Level};
/// assert_eq!(geometric_optics_level(150.0), Level::Ok);
/// assert_eq!(geometric_optics_level(60.0), Level::Caution);
/// assert_eq!(geometric_optics_level(0.5), Level::Invalid);
/// ```
pub fn geometric_optics_level(w: f64) -> Level {
    if w >= GEOMETRIC_OPTICS_W {
        Level::Ok
    } else if w >= 1.0 {
        Level::Caution
    } else {
        Level::Invalid
    }
}

/// The worst level among `flags` (Ok for none).
pub fn worst(flags: &[Flag]) -> Level {
    flags.iter().map(|f| f.level).max().unwrap_or(Level::Ok)
}

// ------------------------------------------------------------------------------------------
// Error estimates and verdicts
// ------------------------------------------------------------------------------------------

/// Default relative tolerance of the verdicts (the `tolerance` field of every request).
pub const DEFAULT_TOLERANCE: f64 = 1e-2;
/// Smallest tolerance accepted: below it even the exact values' rounding bounds fail it.
pub const TOLERANCE_MIN: f64 = 1e-12;
/// Largest tolerance accepted: a relative error of one half is the end of "an estimate".
pub const TOLERANCE_MAX: f64 = 0.5;

/// The tolerance of a request: `None` gives [`DEFAULT_TOLERANCE`].
///
/// # Errors
/// [`InputError`] naming `tolerance` when it is not finite or outside
/// [`TOLERANCE_MIN`] … [`TOLERANCE_MAX`].
///
/// # Examples
/// ```
/// use chiwave_core::validity::tolerance;
/// assert_eq!(tolerance(None).unwrap(), 1e-2);
/// assert!(tolerance(Some(2.0)).unwrap_err().to_string().starts_with("tolerance:"));
/// ```
pub fn tolerance(t: Option<f64>) -> Result<f64, InputError> {
    let Some(t) = t else { return Ok(DEFAULT_TOLERANCE) };
    crate::error::finite("tolerance", t)?;
    if (TOLERANCE_MIN..=TOLERANCE_MAX).contains(&t) {
        Ok(t)
    } else {
        Err(InputError::OutOfRange {
            field: "tolerance",
            value: t,
            allowed: format!("{TOLERANCE_MIN:e} ≤ tolerance ≤ {TOLERANCE_MAX} (relative error)"),
        })
    }
}

/// How a value compares with the tolerance, judged on its error estimate ([`verdict`]).
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "lowercase")]
pub enum Verdict {
    /// Estimated relative error below the tolerance.
    Ok,
    /// Estimated relative error between the tolerance and ten times it.
    Caution,
    /// Estimated relative error beyond ten times the tolerance, or no estimate.
    Outside,
}

/// The one rule that turns an error estimate into a verdict, for every value of every result.
///
/// # Formula
/// `ok` if estimate < tolerance, `caution` if estimate < 10·tolerance, `outside` otherwise and
/// when there is no estimate (`None`, or not a finite number ≥ 0).
///
/// # Examples
/// ```
/// use chiwave_core::validity::{verdict, Verdict};
/// assert_eq!(verdict(Some(1e-3), 1e-2), Verdict::Ok);
/// assert_eq!(verdict(Some(5e-2), 1e-2), Verdict::Caution);
/// assert_eq!(verdict(Some(0.2), 1e-2), Verdict::Outside);
/// assert_eq!(verdict(None, 1e-2), Verdict::Outside);
/// ```
pub fn verdict(estimate: Option<f64>, tolerance: f64) -> Verdict {
    match estimate {
        Some(e) if e >= 0.0 && e < tolerance => Verdict::Ok,
        Some(e) if e >= 0.0 && e < 10.0 * tolerance => Verdict::Caution,
        _ => Verdict::Outside,
    }
}

impl From<Verdict> for Level {
    /// The level of a regime flag that judges the same value as a verdict.
    fn from(v: Verdict) -> Level {
        match v {
            Verdict::Ok => Level::Ok,
            Verdict::Caution => Level::Caution,
            Verdict::Outside => Level::Invalid,
        }
    }
}

/// The error estimate of one value: relative, ≥ 0, with the method that produced it, or null
/// with the reason; and its [`verdict`] at the request's tolerance. JSON keys `error_estimate`,
/// `error_method`, `error_reason`, `verdict` (flattened into `series` and `orders` entries, and
/// the values of a result's `estimates` map).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ErrorEstimate {
    /// Estimated relative error |value − truth|/|truth|, or null (see `error_reason`).
    pub error_estimate: Option<f64>,
    /// How the estimate was made, in a few words (e.g. "vs the exact α").
    pub error_method: String,
    /// Why there is no estimate (null when there is one).
    pub error_reason: Option<String>,
    pub verdict: Verdict,
}

impl ErrorEstimate {
    /// An estimate made by `method`; a non-finite or negative number becomes "no estimate".
    pub fn new(estimate: f64, method: impl Into<String>, tolerance: f64) -> Self {
        if estimate.is_finite() && estimate >= 0.0 {
            ErrorEstimate { error_estimate: Some(estimate), error_method: method.into(), error_reason: None, verdict: verdict(Some(estimate), tolerance) }
        } else {
            ErrorEstimate::none(format!("the estimate is not a finite number ({estimate})"), method, tolerance)
        }
    }

    /// No estimate, for `reason`; the verdict is `outside`.
    pub fn none(reason: impl Into<String>, method: impl Into<String>, tolerance: f64) -> Self {
        ErrorEstimate { error_estimate: None, error_method: method.into(), error_reason: Some(reason.into()), verdict: verdict(None, tolerance) }
    }

    /// [`ErrorEstimate::new`] for `Some`, [`ErrorEstimate::none`] with `reason` for `None`.
    pub fn from_option(estimate: Option<f64>, method: impl Into<String>, reason: impl Into<String>, tolerance: f64) -> Self {
        match estimate {
            Some(e) => ErrorEstimate::new(e, method, tolerance),
            None => ErrorEstimate::none(reason, method, tolerance),
        }
    }

    /// The estimate, when there is one.
    pub fn value(&self) -> Option<f64> {
        self.error_estimate
    }
}

/// Error estimates of the approximate values of a result that are not in `series` or `orders`,
/// keyed by the value's JSON key (dotted for nested keys, e.g. `strong_deflection.alpha`).
pub type Estimates = BTreeMap<&'static str, ErrorEstimate>;

/// The recommended value of a result: the most accurate value it holds (`key` names it, dotted
/// for nested keys), with its error estimate and verdict and why it was chosen. `value` is null
/// (with `why`) when nothing qualifies.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Best {
    pub key: &'static str,
    pub value: Option<f64>,
    pub error_estimate: Option<f64>,
    pub error_method: String,
    pub verdict: Verdict,
    pub why: String,
}

impl Best {
    /// The value under `key` with its estimate.
    pub fn new(key: &'static str, value: f64, estimate: &ErrorEstimate, why: impl Into<String>) -> Self {
        Best {
            key,
            value: Some(value),
            error_estimate: estimate.error_estimate,
            error_method: estimate.error_method.clone(),
            verdict: estimate.verdict,
            why: why.into(),
        }
    }

    /// Nothing to recommend under `key`, for the reason `why`.
    pub fn none(key: &'static str, why: impl Into<String>, tolerance: f64) -> Self {
        Best { key, value: None, error_estimate: None, error_method: String::new(), verdict: verdict(None, tolerance), why: why.into() }
    }
}

/// A number for people in messages: two significant digits, plain from 1e-3 to 1e4, otherwise
/// in e-notation (`0.32`, `9.6e-4`, `1.5e6`).
///
/// # Examples
/// ```
/// use chiwave_core::validity::short;
/// assert_eq!((short(0.3225), short(9.56e-4), short(2.0), short(4.6e6)), ("0.32".into(), "9.6e-4".into(), "2".into(), "4.6e6".into()));
/// ```
pub fn short(x: f64) -> String {
    if !x.is_finite() {
        return format!("{x}");
    }
    let a = x.abs();
    if a == 0.0 || (1e-3..1e4).contains(&a) {
        let digits = if a == 0.0 { 0 } else { (1 - a.log10().floor() as i32).max(0) as usize };
        let s = format!("{x:.digits$}");
        if s.contains('.') {
            s.trim_end_matches('0').trim_end_matches('.').to_string()
        } else {
            s
        }
    } else {
        format!("{x:.1e}")
    }
}

/// The standing caution shown with every result on the page and in the CLI tables.
pub const ESTIMATE_NOTICE: &str =
    "Results are analytic and perturbative estimates with stated validity; they are not a substitute for full numerical simulations.";

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn grading() {
        const X: Check = Check::new("x", "the parameter x");
        let f = Flag::small_parameter(X, 0.5, 0.01, 0.1, ["a", "b", "c"]);
        assert_eq!(f.level, Level::Invalid);
        assert_eq!((f.key, f.label), ("x", "the parameter x"));
        let g = Flag::small_parameter(X, 0.001, 0.01, 0.1, ["a", "b", "c"]);
        assert_eq!(g.level, Level::Ok);
        assert_eq!(worst(&[f, g]), Level::Invalid);
        assert_eq!(worst(&[]), Level::Ok);
    }

    #[test]
    fn verdict_edges() {
        // The rule at its edges (definition, no source): strict inequalities, NaN and negatives refused.
        assert_eq!(verdict(Some(0.0), 1e-2), Verdict::Ok);
        assert_eq!(verdict(Some(1e-2), 1e-2), Verdict::Caution);
        assert_eq!(verdict(Some(0.1), 1e-2), Verdict::Outside);
        assert_eq!(verdict(Some(f64::NAN), 1e-2), Verdict::Outside);
        assert_eq!(verdict(Some(-1e-3), 1e-2), Verdict::Outside);
        assert_eq!(Level::from(Verdict::Caution), Level::Caution);
        let e = ErrorEstimate::new(f64::INFINITY, "m", 1e-2);
        assert!(e.error_estimate.is_none() && e.error_reason.is_some() && e.verdict == Verdict::Outside);
        assert!(tolerance(Some(1e-13)).is_err() && tolerance(Some(f64::NAN)).is_err() && tolerance(Some(0.5)).is_ok());
    }
}
