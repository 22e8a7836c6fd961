//! Slow-motion comparison: the quadrupole-formula waveform of the exact Newtonian hyperbola.
//!
//! Sources: quadrupole formula h_ij = (2G/D) d²Q_ij/dt² = (4Gμ/D)(v_i v_j − G M x_i x_j/r³)
//! (Einstein 1918; e.g. Maggiore, *Gravitational Waves* vol. 1 (2008), §3.3);
//! Kepler hyperbola in the eccentric-anomaly parametrisation (docs/physics/waveform.md §6; e.g. Landau & Lifshitz,
//! *Mechanics*, §15).

// Index loops are kept where the indices are tensor indices (clearer than iterator chains).
#![allow(clippy::needless_range_loop)]

use super::frames::{Basis, Binary, Frame};
use super::kernel::Strain;
use crate::error::{finite, InputError};

/// Relative orbit of the Newtonian hyperbola at time t (periapsis at t = 0): (x, y, vx, vy),
/// oriented so the incoming asymptote is along +x at y = +b (docs/physics/waveform.md §6).
pub(crate) fn hyperbola_state(m: f64, v_inf: f64, b: f64, t: f64) -> [f64; 4] {
    let a = m / (v_inf * v_inf);
    let e = (1.0 + (b * v_inf * v_inf / m).powi(2)).sqrt();
    let n0 = (m / (a * a * a)).sqrt();
    let tau = n0 * t;
    // Solve e sinh η − η = τ (odd, increasing, convex for η > 0): Newton from the right.
    let s = tau.abs();
    let mut eta = (s / (e - 1.0)).asinh();
    for _ in 0..200 {
        let f = e * eta.sinh() - eta - s;
        let df = e * eta.cosh() - 1.0;
        let step = f / df;
        eta -= step;
        if step.abs() <= 1e-16 * eta.abs().max(1e-300) {
            break;
        }
    }
    let eta = eta.copysign(tau);
    let se = (e * e - 1.0).sqrt();
    let x = a * (e - eta.cosh());
    let y = a * se * eta.sinh();
    let den = e * eta.cosh() - 1.0;
    let vx = -a * n0 * eta.sinh() / den;
    let vy = a * n0 * se * eta.cosh() / den;
    // Reflect y → −y, then rotate by arctan √(e² − 1) (cos = 1/e, sin = √(e²−1)/e).
    let (c, sn) = (1.0 / e, se / e);
    let (y, vy) = (-y, -vy);
    [c * x - sn * y, sn * x + c * y, c * vx - sn * vy, sn * vx + c * vy]
}

/// Quadrupole-formula D·(h₊, h×)(u) of the exact Newtonian hyperbola with the same masses, the
/// relative speed at infinity v = √(γ² − 1)/γ and impact parameter b, minus its u-independent
/// O(G) part 4μ v∞v∞ (so it compares with the O(G²) PM strain, docs/physics/waveform.md §6).
///
/// # Formula
/// D h_ij = 4μ (v_i v_j − M x_i x_j/r³) − 4μ v∞_i v∞_j, μ = m1 m2/M (Einstein 1918). The time is the
/// CM time (u = t − D); in frame A the curve is shifted by the origin rule (docs/physics/waveform.md §1),
/// u_A = u_cm − n_y E1 b/E, so it can be drawn beside the frame-A PM waveform (there the two agree
/// only to O(v), docs/physics/waveform.md §6; in the CM frame with equal masses to O(v²)).
///
/// # Errors
/// [`InputError`] naming `theta`, `phi` or `u`.
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{quadrupole_hyperbola, Binary, Frame};
/// let s = Binary::from_speed(0.5, 0.5, 0.01, 1e5).unwrap();
/// let h = quadrupole_hyperbola(&s, Frame::Cm, 1.0, 0.5, &[-1e12, 0.0]).unwrap();
/// assert!(h.plus[0].abs() < 1e-6 * h.plus[1].abs().max(1e-300) + 1e-30);
/// ```
pub fn quadrupole_hyperbola(
    sys: &Binary,
    frame: Frame,
    theta: f64,
    phi: f64,
    u: &[f64],
) -> Result<Strain, InputError> {
    crate::error::in_closed("theta", theta, 0.0, std::f64::consts::PI)?;
    finite("phi", phi)?;
    let basis = Basis::new(theta, phi);
    let pol = basis.pol_tensors();
    let m = sys.total_mass();
    let mu = sys.m1 * sys.m2 / m;
    let vinf = sys.v();
    let shift = match frame {
        Frame::Cm => 0.0,
        Frame::Rest2 => {
            let [(e1, _, _), (e2, _, _)] = sys.bodies(Frame::Cm);
            basis.n[1] * e1 * sys.b / (e1 + e2)
        }
    };
    let mut out = Strain { plus: Vec::with_capacity(u.len()), cross: Vec::with_capacity(u.len()) };
    for &ui in u {
        finite("u", ui)?;
        let [x, y, vx, vy] = hyperbola_state(m, vinf, sys.b, ui + shift);
        let r = x.hypot(y);
        let k = m / (r * r * r);
        let hxx = 4.0 * mu * (vx * vx - vinf * vinf - k * x * x);
        let hxy = 4.0 * mu * (vx * vy - k * x * y);
        let hyy = 4.0 * mu * (vy * vy - k * y * y);
        let mut h = [0.0; 2];
        for (c, hc) in h.iter_mut().enumerate() {
            *hc = pol[c][0][0] * hxx + 2.0 * pol[c][0][1] * hxy + pol[c][1][1] * hyy;
        }
        out.plus.push(h[0]);
        out.cross.push(h[1]);
    }
    Ok(out)
}

/// Energy radiated in the quadrupole approximation along the Newtonian hyperbola of masses
/// `m1`, `m2` (G = c = 1, in any common unit: the result is in units of (m1 + m2) c²), relative
/// speed at infinity `v_inf` (fraction of c) and impact parameter `b` (in G(m1 + m2)/c²).
///
/// # Formula
/// The quadrupole power along a Kepler orbit of semi-latus rectum p and eccentricity e,
/// P = (8/15)(G⁴ m1² m2² M/(c⁵ p⁵))(1 + e cos φ)⁴ [12(1 + e cos φ)² + e² sin²φ] (Peters & Mathews
/// 1963, Phys. Rev. 131, 435, written with p = a(1 − e²)), integrated over the hyperbola
/// (|φ| < φ∞ = arccos(−1/e), dt = r² dφ/√(GMp), r = p/(1 + e cos φ); Hansen 1972, Phys. Rev. D 5,
/// 1021, for the hyperbolic case):
/// E = (8/15) G^{7/2} m1² m2² M^{1/2}/(c⁵ p^{7/2}) ∫ (1 + e cos φ)² [12(1 + e cos φ)² + e² sin²φ] dφ,
/// with p = b² v∞²/(GM), e = √(1 + b² v∞⁴/(GM)²). The integrand is a positive polynomial in cos φ,
/// integrated by 48-point Gauss–Legendre (exact to rounding for this smooth integrand). Large e: E/(Mc²) → (37π/15) ν² v∞/b³, the O(G³)
/// slow-motion limit.
///
/// # Domain
/// m1, m2 > 0, 0 < v_inf < 1, b > 0 (any e > 1). Slow motion: corrections of relative order v∞².
///
/// # Examples
/// ```
/// use chiwave_core::waveform::quadrupole_energy_hyperbola;
/// // Large eccentricity: (37π/15) ν² v/b³ (Herrmann et al. 2021, slow-motion limit), ν = 1/4.
/// let (v, b) = (1e-3, 1e12);
/// let e = quadrupole_energy_hyperbola(0.5, 0.5, v, b);
/// assert!((e / (37.0 * std::f64::consts::PI / 15.0 / 16.0 * v / b.powi(3)) - 1.0).abs() < 1e-4);
/// ```
pub fn quadrupole_energy_hyperbola(m1: f64, m2: f64, v_inf: f64, b: f64) -> f64 {
    let m = m1 + m2;
    let (m1, m2) = (m1 / m, m2 / m);
    let x = b * v_inf * v_inf; // b v²/(GM)
    let p = b * x; // p = b² v²/(GM), in GM
    let e = (1.0 + x * x).sqrt();
    // The integrand is positive and a polynomial in cos φ: Gauss–Legendre on (0, φ∞), doubled by
    // symmetry, has no cancellation at any e (the closed form in ∫cosⁿφ does, like e⁴ at large e).
    let phi_inf = (-1.0 / e).acos();
    let f = |phi: f64| {
        let (s, c) = phi.sin_cos();
        let q = 1.0 + e * c;
        q * q * (12.0 * q * q + e * e * s * s)
    };
    let integral = 2.0 * crate::numeric::integrate_gl(f, 0.0, phi_inf, crate::numeric::cached_rule(48));
    8.0 / 15.0 * m1 * m1 * m2 * m2 / p.powf(3.5) * integral
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn orientation_and_periapsis() {
        // Kepler: periapsis distance a(e − 1) at t = 0; incoming velocity → (+v, 0) at y → +b.
        let (m, v, b): (f64, f64, f64) = (1.0, 0.1, 500.0);
        let a = m / (v * v);
        let e = (1.0f64 + (b * v * v / m).powi(2)).sqrt();
        let s0 = hyperbola_state(m, v, b, 0.0);
        assert!((s0[0].hypot(s0[1]) - a * (e - 1.0)).abs() < 1e-9 * a);
        let s = hyperbola_state(m, v, b, -1e9);
        assert!((s[2] - v).abs() < 1e-5 * v && s[3].abs() < 1e-5 * v, "{s:?}");
        // Angular momentum per unit mass x vy − y vx = −b v∞ at all times (exact conservation;
        // L_z < 0 for b along +y, docs/physics/waveform.md §1).
        for t in [-1e9, -3e3, 0.0, 7e4] {
            let s = hyperbola_state(m, v, b, t);
            let l = s[0] * s[3] - s[1] * s[2];
            assert!((l + b * v).abs() < 1e-9 * b * v, "{l} {s:?}");
        }
        assert!(s[1] > 0.0);
        // The orbit is deflected toward −y (attraction toward the origin).
        let late = hyperbola_state(m, v, b, 1e9);
        assert!(late[3] < 0.0);
    }
}
