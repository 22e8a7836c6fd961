//! Modified Bessel functions of the second kind K0, K1 (and their scaled and x-weighted forms),
//! used by the spectra.
//!
//! Method: the Cephes Chebyshev expansions (S. L. Moshier, Cephes Math Library 2.8, 2000:
//! `[0, 2]` with K0 + ln(x/2) I0 and K1 − ln(x/2) I1, `(2, ∞)` with e^x √x K), in the pure-Rust
//! port of the `spec_math` crate (0.1.x), which builds for wasm32. Cephes quotes a peak
//! relative error of 1.2e-15 on (0, 30]. This module adds the small-argument limits of
//! x K0(x) and x K1(x) that the spectra need at ω → 0, and it is checked against mpmath
//! (`tests/reference/em_bessel_mpmath.py`) in `tests/em_waveform.rs`. The Abramowitz & Stegun
//! equation numbers below are recalled from memory; the formulas are standard.

use spec_math::Bessel;

/// Modified Bessel function of the second kind of order zero, K0(x).
///
/// # Formula
/// K0(x) = ∫_0^∞ e^{−x cosh s} ds (Abramowitz & Stegun 1964, eq. 9.6.24); evaluated by Cephes Chebyshev series (see module doc).
///
/// # Domain
/// x > 0. Special cases: K0(0) = +∞, K0(x < 0) = NaN, K0(NaN) = NaN, K0(+∞) = 0; the result
/// underflows to 0 for x ≳ 705.
///
/// # Examples
/// ```
/// // mpmath 1.3, mp.dps = 40: besselk(0, 1) = 0.42102443824070833...
/// let k = chiwave_core::bessel::bessel_k0(1.0);
/// assert!((k - 0.42102443824070833).abs() < 1e-15);
/// ```
pub fn bessel_k0(x: f64) -> f64 {
    if x.is_nan() {
        return f64::NAN;
    }
    x.bessel_k0()
}

/// Modified Bessel function of the second kind of order one, K1(x).
///
/// # Formula
/// K1(x) = ∫_0^∞ e^{−x cosh s} cosh s ds (Abramowitz & Stegun 1964, eq. 9.6.24 with ν = 1);
/// evaluated by Cephes Chebyshev series (see module doc).
///
/// # Domain
/// x > 0. Special cases: K1(0) = +∞, K1(x < 0) = NaN, K1(NaN) = NaN, K1(+∞) = 0.
///
/// # Examples
/// ```
/// // mpmath 1.3, mp.dps = 40: besselk(1, 1) = 0.60190723019723457...
/// let k = chiwave_core::bessel::bessel_k1(1.0);
/// assert!((k - 0.60190723019723457).abs() < 1e-15);
/// ```
pub fn bessel_k1(x: f64) -> f64 {
    if x.is_nan() {
        return f64::NAN;
    }
    x.bessel_k1()
}

/// e^x K0(x), the exponentially scaled K0 (no underflow at large x).
///
/// # Formula
/// e^x K0(x) = ∫_0^∞ e^{−2x sinh²(s/2)} ds (from K0(x) = ∫_0^∞ e^{−x cosh s} ds, Abramowitz &
/// Stegun 1964, eq. 9.6.24); evaluated by the Cephes `k0e` Chebyshev series (see module doc).
///
/// # Domain
/// x > 0. Special cases: +∞ at 0, NaN for x < 0 or NaN, 0 at +∞; ~√(π/(2x)) for large x.
///
/// # Examples
/// ```
/// // mpmath 1.3, mp.dps = 30, tests/reference/waveform_bessel.py: besselk(0, 10)·e^10
/// let k = chiwave_core::bessel::bessel_k0_scaled(10.0);
/// assert!((k - 0.391631934436598666).abs() < 1e-15);
/// ```
pub fn bessel_k0_scaled(x: f64) -> f64 {
    if x.is_nan() {
        return f64::NAN;
    }
    if x == f64::INFINITY {
        return 0.0;
    }
    x.bessel_k0e()
}

/// e^x K1(x), the exponentially scaled K1 (no underflow at large x).
///
/// # Formula
/// e^x K1(x) = ∫_0^∞ e^{−2x sinh²(s/2)} cosh s ds (Abramowitz & Stegun 1964, eq. 9.6.24 with
/// ν = 1, times e^x); evaluated by the Cephes `k1e` Chebyshev series (see module doc).
///
/// # Domain
/// x > 0. Special cases: +∞ at 0, NaN for x < 0 or NaN, 0 at +∞; ~√(π/(2x)) for large x.
///
/// # Examples
/// ```
/// // mpmath 1.3, mp.dps = 30, tests/reference/waveform_bessel.py: besselk(1, 0.5)·e^0.5
/// let k = chiwave_core::bessel::bessel_k1_scaled(0.5);
/// assert!((k - 2.73100970821178571).abs() < 2e-15);
/// ```
pub fn bessel_k1_scaled(x: f64) -> f64 {
    if x.is_nan() {
        return f64::NAN;
    }
    if x == f64::INFINITY {
        return 0.0;
    }
    x.bessel_k1e()
}

/// x K0(x), continued to x = 0 by its limit 0.
///
/// # Formula
/// x K0(x) = −x (ln(x/2) + γ_E) + O(x³ ln x) as x → 0 (Abramowitz & Stegun 1964, eq. 9.6.13),
/// so the value at 0 is 0. For x > 0 the product is formed directly (K0 is finite there).
///
/// # Domain
/// x ≥ 0; NaN for x < 0 or NaN; 0 at +∞.
///
/// # Examples
/// ```
/// use chiwave_core::bessel::x_k0;
/// assert_eq!(x_k0(0.0), 0.0);
/// // mpmath 1.3, mp.dps = 40: 0.5*besselk(0, 0.5) = 0.46220953561383293...
/// assert!((x_k0(0.5) - 0.46220953561383293).abs() < 1e-15);
/// ```
pub fn x_k0(x: f64) -> f64 {
    if x == 0.0 || x == f64::INFINITY {
        0.0
    } else {
        x * bessel_k0(x)
    }
}

/// x K1(x), continued to x = 0 by its limit 1.
///
/// # Formula
/// x K1(x) = 1 + (x²/2)(ln(x/2) + γ_E − 1/2) + O(x⁴ ln x) as x → 0 (Abramowitz & Stegun 1964,
/// eq. 9.6.11 with n = 1). Below x = 1e-150 the correction is under 1e-297 and the value 1 is
/// returned (K1 itself would overflow for subnormal x).
///
/// # Domain
/// x ≥ 0; NaN for x < 0 or NaN; 0 at +∞.
///
/// # Examples
/// ```
/// use chiwave_core::bessel::x_k1;
/// assert_eq!(x_k1(0.0), 1.0);
/// // mpmath 1.3, mp.dps = 40: 2*besselk(1, 2) = 0.27973176363304486...
/// assert!((x_k1(2.0) - 0.27973176363304486).abs() < 1e-15);
/// ```
pub fn x_k1(x: f64) -> f64 {
    if (0.0..1e-150).contains(&x) {
        1.0
    } else if x == f64::INFINITY {
        0.0
    } else {
        x * bessel_k1(x)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::numeric::rel_diff;

    #[test]
    #[allow(clippy::excessive_precision)] // values transcribed from mpmath as printed
    fn scaled_against_mpmath() {
        // mpmath 1.3, mp.dps = 30, tests/reference/waveform_bessel.py: besselk(ν, x)·e^x
        let cases = [
            (1e-6, 13.9314560050754588, 1000000.99999328427),
            (0.01, 4.7686940285444619, 100.978648458240051),
            (0.5, 1.52410938577390953, 2.73100970821178571),
            (2.0, 0.841568215070771418, 1.03347684706868857),
            (10.0, 0.391631934436598666, 0.410766570595788751),
            (100.0, 0.125175621659126579, 0.125799950479578529),
            (3000.0, 0.0228813275719324368, 0.0228851408088374196),
        ];
        for (x, k0, k1) in cases {
            assert!(rel_diff(bessel_k0_scaled(x), k0) < 1e-14, "K0({x})");
            assert!(rel_diff(bessel_k1_scaled(x), k1) < 1e-14, "K1({x})");
            // Consistent with the unscaled functions where those do not underflow.
            if x < 500.0 {
                assert!(rel_diff(bessel_k0_scaled(x) * (-x).exp(), bessel_k0(x)) < 1e-14);
            }
        }
        assert!(bessel_k0_scaled(-1.0).is_nan() && bessel_k1_scaled(f64::NAN).is_nan());
        assert_eq!(bessel_k0_scaled(f64::INFINITY), 0.0);
        assert_eq!(bessel_k1_scaled(0.0), f64::INFINITY);
    }
}
