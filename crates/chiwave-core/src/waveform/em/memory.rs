//! The electromagnetic memory ∫du D E = −D ΔA_⊥ (the zero-frequency limit of the spectrum).

use super::system::{Dir, EmSystem};

/// Memory: ∫du D E = −D ΔA_⊥, components along (e_θ, e_φ).
///
/// # Formula
/// D A = Σ_a q_a v_a/(1 − n·v_a) (the Liénard–Wiechert potential at large distance, Jackson 1999
/// §14.1), linearised in the velocity changes:
/// Δ(v/(1 − n·v)) = Δv/κ + v (n·Δv)/κ², κ = 1 − n_x v, with Δv1 = (0, Δp/(γ m1), 0),
/// Δv2 = (0, −Δp/m2, 0), Δp = 2 q1 q2/(v b) ([`EmSystem::impulse`]).
/// Then dE/(dω dΩ)(0) = |D ΔA_⊥|²/(4π²) (classical soft-photon limit).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::em::{memory, EmSystem};
/// let s = EmSystem::new(1.0, 1.0, 1.0, 1.0, 2.0, 1.0).unwrap();
/// // Face-on: κ = 1, ΔA_⊥ = q1 Δv1 + q2 Δv2 along y; Δp = 2/v, v = √3/2.
/// let dp = 2.0 / (3f64.sqrt() / 2.0);
/// let m = memory(&s, 0.0, 0.0);
/// assert!((m[1] + (dp / 2.0 - dp)).abs() < 1e-14);
/// ```
pub fn memory(sys: &EmSystem, theta: f64, phi: f64) -> [f64; 2] {
    let d = Dir::from_angles(sys, theta, phi);
    let v = sys.v();
    let dp = sys.impulse();
    let dv1 = [0.0, dp / (sys.gamma * sys.m1), 0.0];
    let dv2 = [0.0, -dp / sys.m2, 0.0];
    let ndv1 = d.n[0] * dv1[0] + d.n[1] * dv1[1] + d.n[2] * dv1[2];
    let beta = [v, 0.0, 0.0];
    let mut da = [0.0; 3];
    for i in 0..3 {
        da[i] = sys.q1 * (dv1[i] / d.kappa + beta[i] * ndv1 / (d.kappa * d.kappa)) + sys.q2 * dv2[i];
    }
    let dot = |e: &[f64; 3]| -(e[0] * da[0] + e[1] * da[1] + e[2] * da[2]);
    [dot(&d.e[0]), dot(&d.e[1])]
}
