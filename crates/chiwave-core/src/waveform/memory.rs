//! Gravitational-wave memory (Braginsky–Thorne) and the zero-frequency-limit closed form.
//!
//! Sources: Braginsky & Thorne 1987, Nature 327, 123 (equation number not given), linearised in
//! the LO impulse (Westpfahl 1985; docs/physics/waveform.md §3); Smarr 1977, PRD 15, 2069 (ZFL); closed form of Di Vecchia,
//! Heissenberg, Russo & Veneziano 2021, arXiv:2101.05772 (recalled from memory; the prefactor
//! 2GQ²/π is the one the numerical zero-frequency limit of the waveform fixes — it was recalled
//! as GQ²/π; docs/physics/waveform.md §3).

// Index loops are kept where the indices are tensor indices (clearer than iterator chains).
#![allow(clippy::needless_range_loop)]

use super::frames::{Basis, Binary, Frame};
use crate::error::InputError;

/// The Braginsky–Thorne memory D·(Δh₊, Δh×) in `frame` at direction (θ, φ), at LO.
///
/// # Formula
/// D Δh_ij^TT = 4 Δ[Σ_a p_a^i p_a^j/(E_a − n·p_a)]^TT with Δp_1 = −Q ŷ, Δp_2 = +Q ŷ,
/// Q = 2 m1 m2 (2γ² − 1)/(b √(γ² − 1)) and ΔE_a = p_a·Δp_a/E_a = 0 (Westpfahl 1985 LO impulse, G = 1),
/// linearised:
/// Δ[p p/(E − n·p)] = (p Δp + Δp p)/(E − n·p) + p p (n·Δp)/(E − n·p)².
/// In frame A only body 1 contributes.
///
/// # Errors
/// [`InputError`] naming `theta` (0..=π) or `phi` (finite).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{memory_braginsky_thorne, Binary, Frame};
/// let s = Binary::new(0.5, 0.5, 1.5, 20.0).unwrap();
/// // Along the normal to the orbital plane the memory is pure cross.
/// let m = memory_braginsky_thorne(&s, Frame::Rest2, 0.0, 0.0).unwrap();
/// assert!(m[0].abs() < 1e-15 && m[1].abs() > 0.0);
/// ```
pub fn memory_braginsky_thorne(sys: &Binary, frame: Frame, theta: f64, phi: f64) -> Result<[f64; 2], InputError> {
    crate::error::in_closed("theta", theta, 0.0, std::f64::consts::PI)?;
    crate::error::finite("phi", phi)?;
    let basis = Basis::new(theta, phi);
    let pol = basis.pol_tensors();
    let q = sys.impulse();
    let n = basis.n;
    let mut h = [0.0; 2];
    for (k, (e, va, _)) in sys.bodies(frame).into_iter().enumerate() {
        let p = e * va;
        let dpy = if k == 0 { -q } else { q };
        let den = e - n[0] * p;
        for c in 0..2 {
            let (pxx, pxy) = (pol[c][0][0], pol[c][0][1]);
            h[c] += 4.0 * (2.0 * pxy * p * dpy / den + pxx * p * p * n[1] * dpy / (den * den));
        }
    }
    Ok(h)
}

/// The angle-integrated zero-frequency limit dE/dω(ω → 0), closed form (G = 1).
///
/// # Formula
/// dE/dω(0) = (2Q²/π)[(8 − 5γ²)/(3(γ² − 1)) + γ(2γ² − 3) arccosh γ/(γ² − 1)^{3/2}],
/// Q = |Δp| (Di Vecchia, Heissenberg, Russo & Veneziano 2021, arXiv:2101.05772, recalled from
/// memory, with the prefactor fixed by the numerical zero-frequency limit of the waveform,
/// docs/physics/waveform.md §3; compare the normalisation with the paper before citing it as the
/// paper's formula). Frame-invariant.
///
/// # Domain
/// γ > 1. Near γ → 1 the two terms cancel (each ~1/(γ² − 1)); the result keeps about
/// 16 + log10(γ² − 1) digits, so below v ≈ 1e-3 prefer the sky integral of the memory.
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{zfl_angle_integrated_closed_form, Binary};
/// let s = Binary::new(0.5, 0.5, 2.0, 10.0).unwrap();
/// assert!(zfl_angle_integrated_closed_form(&s) > 0.0);
/// ```
pub fn zfl_angle_integrated_closed_form(sys: &Binary) -> f64 {
    let g = sys.gamma;
    let p2 = (g - 1.0) * (g + 1.0);
    let q = sys.impulse();
    let acosh = (g + p2.sqrt()).ln();
    2.0 * q * q / std::f64::consts::PI
        * ((8.0 - 5.0 * g * g) / (3.0 * p2) + g * (2.0 * g * g - 3.0) * acosh / (p2 * p2.sqrt()))
}
