//! The closed-form Bessel spectrum of the field in one direction and its integral over the
//! sphere (the analogue of the gravitational `spectrum.rs`).

use super::energy::{sphere_nodes, sphere_size};
use super::system::{Dir, EmSystem};
use crate::numeric::gauss_legendre;
use crate::bessel::{x_k0, x_k1};
use num_complex::Complex64;
use std::f64::consts::PI;

/// Fourier transforms E~_a(ω) = ∫du e^{iωu} D E_a(u) of the two bodies' fields along the two
/// basis vectors of `d` (ω ≥ 0): `[body][component]`.
fn spectrum_parts(sys: &EmSystem, d: &Dir, omega: f64) -> [[Complex64; 2]; 2] {
    let v = sys.v();
    let g = sys.gamma;
    let b = sys.b;
    let k1 = omega * d.kappa * b / v;
    let k2 = omega * b / (g * v);
    // Our derivation (module docs): a~1 = (q1 q2/(m1 v b)) (2 i k1 K0(k1)/γ³, 2 k1 K1(k1)/γ, 0),
    //           a~2 = −(q1 q2/(m2 v b)) (2 i k2 K0(k2)/γ, 2 k2 K1(k2), 0).
    let s1 = sys.k1() / (v * b);
    let s2 = sys.k2() / (v * b);
    let a1 = [Complex64::new(0.0, 2.0 * s1 * x_k0(k1) / (g * g * g)), Complex64::new(2.0 * s1 * x_k1(k1) / g, 0.0)];
    let a2 = [Complex64::new(0.0, -2.0 * s2 * x_k0(k2) / g), Complex64::new(-2.0 * s2 * x_k1(k2), 0.0)];
    let phase = Complex64::from_polar(1.0, -omega * d.n[1] * b);
    let k2f = d.kappa * d.kappa;
    let part = |k: usize| {
        let (c1, c2) = d.coefficients(v, k);
        (phase * (a1[0] * c1[0] + a1[1] * c1[1]) * (sys.q1 / k2f), (a2[0] * c2[0] + a2[1] * c2[1]) * sys.q2)
    };
    let (p0, p1) = (part(0), part(1));
    [[p0.0, p1.0], [p0.1, p1.1]]
}

/// Closed-form energy spectrum per unit solid angle, dE/(dω dΩ) with the D² absorbed.
///
/// # Formula
/// dE/(dω dΩ) = |E~(ω)|²/(4π²) with E~ = ∫du e^{iωu} D E (one-sided in ω, so that
/// ∫_0^∞ dω gives dE/dΩ). With k1 = ω (1 − n_x v) b/v and k2 = ω b/(γ v) (our derivation, from
/// the Fourier transforms of the Coulomb profiles in the module docs):
/// - E~1 = q1 e^{−iω n_y b} n × ((n − v) × a~1)/(1 − n·v)², a~1 = (q1 q2/(m1 v b)) (2i k1 K0(k1)/γ³, 2 k1 K1(k1)/γ, 0);
/// - E~2 = q2 n × (n × a~2), a~2 = −(q1 q2/(m2 v b)) (2i k2 K0(k2)/γ, 2 k2 K1(k2), 0).
///
/// # Domain
/// ω ≥ 0; a negative ω gives the value at |ω| (the field is real, so |E~(−ω)| = |E~(ω)|).
/// NaN entries give NaN.
///
/// # Limits
/// ω → 0: the soft-photon value |D ΔA_⊥|²/(4π²) (see [`memory`](super::memory)). ω → ∞: exponential decay,
/// like e^{−2 ω (1 − n_x v) b/v} for body 1 and e^{−2 ω b/(γ v)} for body 2.
///
/// # Examples
/// ```
/// use chiwave_core::waveform::em::{memory, spectrum, EmSystem};
/// use std::f64::consts::PI;
/// let s = EmSystem::new(1.0, 3.0, 1.0, -1.0, 1.3, 1.0).unwrap();
/// let m = memory(&s, 1.0, 0.4);
/// let zfl = (m[0] * m[0] + m[1] * m[1]) / (4.0 * PI * PI);
/// let sp = spectrum(&s, 1.0, 0.4, &[0.0, 1e-9]);
/// assert!((sp[0] - zfl).abs() < 1e-14 * zfl);
/// assert!((sp[1] - zfl).abs() < 1e-12 * zfl);
/// ```
pub fn spectrum(sys: &EmSystem, theta: f64, phi: f64, omega: &[f64]) -> Vec<f64> {
    let d = Dir::from_angles(sys, theta, phi);
    omega
        .iter()
        .map(|&w| {
            let a = spectrum_parts(sys, &d, w.abs());
            ((a[0][0] + a[1][0]).norm_sqr() + (a[0][1] + a[1][1]).norm_sqr()) / (4.0 * PI * PI)
        })
        .collect()
}

/// Sphere nodes (direction, weight) for body 1's own radiation, polar axis +x, clustered toward +x.
///
/// x = 1 − n_x is mapped as x = ε((1 + 2/ε)^σ − 1), ε = (1 − v)/v, σ ∈ [0, 1] by Gauss–Legendre;
/// then x + ε = κ/v and the powers of κ in body 1's radiation become exponentials in σ (common
/// practice for a near-endpoint pole, no source). The azimuth α about x uses the midpoint rule
/// on [0, π] with the mirror α → −α (n_z → −n_z) folded in.
fn sphere_nodes_forward(sys: &EmSystem, n_sigma: usize, n_alpha: usize) -> Vec<(Dir, f64)> {
    let v = sys.v();
    let eps = sys.one_minus_v() / v;
    let big = (2.0 / eps).ln_1p();
    let (xs, ws) = gauss_legendre(n_sigma);
    let mut out = Vec::with_capacity(n_sigma * n_alpha);
    for (xi, wi) in xs.iter().zip(&ws) {
        let sigma = 0.5 * (xi + 1.0);
        let x = (eps * (big * sigma).exp_m1()).min(2.0);
        let jac = big * (x + eps) * 0.5 * wi;
        for k in 0..n_alpha {
            let alpha = (k as f64 + 0.5) * PI / n_alpha as f64;
            out.push((Dir::from_axis_x(sys, x, alpha), jac * 2.0 * PI / n_alpha as f64));
        }
    }
    out
}

/// Size of the forward rule used for body 1's own spectrum in [`spectrum_integrated`].
const N_SIGMA: usize = 48;
const N_ALPHA: usize = 24;

/// Angle-integrated spectrum dE/dω (closed-form Bessel spectrum integrated over the sphere).
///
/// # Formula
/// dE/dω = ∫dΩ |E~(ω)|²/(4π²) with [`spectrum`]'s E~; ∫_0^∞ dω of it is
/// `energies(sys).total_flux`. Body 1's own part |E~1|² uses a rule clustered on the forward
/// cone (48 × 24 nodes); body 2's part and the interference use the band rule of [`energies`](super::energies),
/// refined with ω (up to 320 × 320 nodes) to follow the interference phase e^{−iω n_y b}.
///
/// # Accuracy
/// Measured against rules with twice the nodes: relative error ≤ 1e-10 for γ ≤ 100 at every
/// ω, up to ≈ 5e-6 at γ = 1000 (ω ≳ 300 v/b). ∫dω reproduces `total_flux` to 1e-11 at
/// γ = 1.5 and 4 (tests).
///
/// # Domain
/// ω ≥ 0 (negative ω gives the value at |ω|).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::em::{spectrum_integrated, EmSystem};
/// let s = EmSystem::new(1.0, 1.0, 1.0, 1.0, 1.2, 1.0).unwrap();
/// let d = spectrum_integrated(&s, &[0.5, 5.0]);
/// assert!(d[0] > d[1] && d[1] > 0.0);
/// ```
pub fn spectrum_integrated(sys: &EmSystem, omega: &[f64]) -> Vec<f64> {
    let n0 = sphere_size(sys.gamma);
    let x_cap = 40.0 * sys.gamma;
    spectrum_integrated_by(sys, omega, |w| {
        // The interference carries the phase e^{−iω n_y b}: resolve it with ~10 √(ω b/v)
        // nodes per dimension while it matters (k2 = ω b/(γ v) ≲ 40), at most 320.
        let x = (w * sys.b / sys.v()).min(x_cap);
        n0.max((10.0 * x.sqrt()).ceil() as usize).min(320)
    })
}

/// [`spectrum_integrated`] with a fixed `n` × `n` band rule (interference and body 2) at every
/// ω; for convergence studies.
pub fn spectrum_integrated_with(sys: &EmSystem, omega: &[f64], n: usize) -> Vec<f64> {
    spectrum_integrated_by(sys, omega, |_| n)
}

fn spectrum_integrated_by(sys: &EmSystem, omega: &[f64], band_size: impl Fn(f64) -> usize) -> Vec<f64> {
    let forward = sphere_nodes_forward(sys, N_SIGMA, N_ALPHA);
    let mut band_cache: Vec<(usize, Vec<(Dir, f64)>)> = Vec::new();
    omega
        .iter()
        .map(|&w| {
            let w = w.abs();
            let n = band_size(w);
            let idx = match band_cache.iter().position(|(k, _)| *k == n) {
                Some(i) => i,
                None => {
                    band_cache.push((n, sphere_nodes(sys, n, n)));
                    band_cache.len() - 1
                }
            };
            let band = &band_cache[idx].1;
            // |E~1|² on the forward rule; |E~2|² + 2 Re(E~1·E~2*) on the band rule.
            let own1: f64 = forward
                .iter()
                .map(|(d, wt)| {
                    let a = spectrum_parts(sys, d, w);
                    wt * (a[0][0].norm_sqr() + a[0][1].norm_sqr())
                })
                .sum();
            let rest: f64 = band
                .iter()
                .map(|(d, wt)| {
                    let a = spectrum_parts(sys, d, w);
                    wt * (0..2).map(|k| a[1][k].norm_sqr() + 2.0 * (a[0][k] * a[1][k].conj()).re).sum::<f64>()
                })
                .sum();
            (own1 + rest) / (4.0 * PI * PI)
        })
        .collect()
}
