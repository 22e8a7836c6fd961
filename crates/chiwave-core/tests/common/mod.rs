//! Shared support for the core's integration tests (`mod common;` in each test file): the named
//! tolerances (defined once, in `chiwave_core::numeric`, with what each one is for), the
//! relative difference, and the proptest strategy of arbitrary f64 with the edge cases every
//! input must survive.
//!
//! A bound in a test is one of these tolerances or carries its reason on the same line.
#![allow(dead_code, unused_imports)]

pub use chiwave_core::numeric::{
    rel_diff, REL_FEW_OPS, REL_ONE_ROUNDING, REL_QUADRATURE, REL_ROUNDING, REL_SKY_RULE, REL_TRANSCRIBED,
};
use proptest::prelude::*;

/// Any f64: the whole bit range, the non-finite values, signed zeros, the extremes, values just
/// above 1 (γ → 1) and the ranges where inputs are usually accepted, so that both the refusals
/// and the accepted paths are exercised.
pub fn any_f64() -> impl Strategy<Value = f64> {
    prop_oneof![
        proptest::num::f64::ANY,
        Just(f64::NAN),
        Just(f64::INFINITY),
        Just(f64::NEG_INFINITY),
        Just(0.0),
        Just(-0.0),
        Just(1.0),
        Just(-1.0),
        Just(1.0 + 1e-16),
        Just(f64::MIN_POSITIVE),
        Just(f64::MAX),
        -2.0f64..2.0,
        0.0f64..20.0,
        -10.0f64..10.0,
        0.0f64..1.0,
        1.0f64..1e4,
        1e-12f64..1e12,
    ]
}
