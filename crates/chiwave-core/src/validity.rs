//! Regime flags shown with every result: where an approximation holds and where it does not.
//!
//! A flag has a stable `key` (for scripts), a short human `label` (for tables and badges: the
//! page keeps no list of flag names), a [`Level`], the number it was judged on, and a sentence
//! for people that says what breaks. Each family declares its checks ([`Check`]: key and label)
//! once, beside their thresholds, in its `flags.rs` (or where its flags are made). Thresholds
//! are common practice unless a flag's constructor names a source.

use serde::Serialize;

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
}
