//! Input and evaluation errors. Every message names the field and the allowed range.

use std::fmt;

/// Why a request could not be evaluated.
///
/// A ray or body that is captured is **not** an error: it is a result. These errors are for
/// input outside the physical or numerical domain, and for a computation that did not converge.
#[non_exhaustive]
#[derive(Debug, Clone, PartialEq)]
pub enum InputError {
    /// The value is NaN or infinite.
    NotFinite { field: &'static str, value: f64 },
    /// The value is finite but outside the allowed range, which `allowed` states in words.
    OutOfRange { field: &'static str, value: f64, allowed: String },
    /// The text could not be read as a number with a unit.
    Parse { field: &'static str, text: String, expected: String },
    /// The unit is unknown for this kind of quantity.
    UnknownUnit { field: &'static str, unit: String, allowed: String },
    /// Two inputs do not fit together (for example a physical length without a physical mass).
    Inconsistent { field: &'static str, reason: String },
    /// A required input is missing.
    Missing { field: &'static str, hint: String },
    /// A numerical method failed to reach its tolerance.
    NoConvergence { what: String },
}

impl fmt::Display for InputError {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self {
            InputError::NotFinite { field, value } => {
                write!(f, "{field}: got {value}, which is not a finite number")
            }
            InputError::OutOfRange { field, value, allowed } => {
                write!(f, "{field}: got {value}; allowed: {allowed}")
            }
            InputError::Parse { field, text, expected } => {
                write!(f, "{field}: cannot read '{text}'; expected {expected}")
            }
            InputError::UnknownUnit { field, unit, allowed } => {
                write!(f, "{field}: unknown unit '{unit}'; allowed: {allowed}")
            }
            InputError::Inconsistent { field, reason } => write!(f, "{field}: {reason}"),
            InputError::Missing { field, hint } => write!(f, "{field}: missing; {hint}"),
            InputError::NoConvergence { what } => write!(f, "no convergence: {what}"),
        }
    }
}

impl std::error::Error for InputError {}

impl InputError {
    /// The input field the error is about (`"computation"` for a convergence failure).
    pub fn field(&self) -> &'static str {
        match self {
            InputError::NotFinite { field, .. }
            | InputError::OutOfRange { field, .. }
            | InputError::Parse { field, .. }
            | InputError::UnknownUnit { field, .. }
            | InputError::Inconsistent { field, .. }
            | InputError::Missing { field, .. } => field,
            InputError::NoConvergence { .. } => "computation",
        }
    }
}

/// Checks that `value` is finite.
pub fn finite(field: &'static str, value: f64) -> Result<f64, InputError> {
    if value.is_finite() {
        Ok(value)
    } else {
        Err(InputError::NotFinite { field, value })
    }
}

/// Checks that `value` is finite and strictly positive.
pub fn positive(field: &'static str, value: f64) -> Result<f64, InputError> {
    finite(field, value)?;
    if value > 0.0 {
        Ok(value)
    } else {
        Err(InputError::OutOfRange { field, value, allowed: "a number > 0".into() })
    }
}

/// Checks that `value` is finite and lies in the closed interval `[lo, hi]`.
pub fn in_closed(field: &'static str, value: f64, lo: f64, hi: f64) -> Result<f64, InputError> {
    finite(field, value)?;
    if (lo..=hi).contains(&value) {
        Ok(value)
    } else {
        Err(InputError::OutOfRange { field, value, allowed: format!("{lo} ≤ {field} ≤ {hi}") })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn messages_name_field_and_range() {
        let e = positive("b", -1.0).unwrap_err();
        assert_eq!(e.field(), "b");
        assert!(e.to_string().contains("b") && e.to_string().contains("> 0"));
        let e = finite("mass", f64::NAN).unwrap_err();
        assert!(e.to_string().starts_with("mass:"));
        let e = in_closed("spin", 1.5, -1.0, 1.0).unwrap_err();
        assert!(e.to_string().contains("-1 ≤ spin ≤ 1"), "{e}");
    }
}
