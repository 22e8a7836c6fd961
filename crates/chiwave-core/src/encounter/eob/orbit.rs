//! The relative orbit r(φ) of the estimate's effective radial problem (scattered or captured).

use super::radial::{angle, no_conv, rule, shape, u_w, validate_j, FarForm, NearForm, Shape};
use super::{map::potential, EobOrbit, CAPTURE_STOP_RADIUS, NEAR_CAPTURE_GAP};
use crate::error::InputError;
use crate::numeric::poly;
use crate::numeric::quadrature::{adaptive_gl, integrate_gl, QuadratureFailure};
use std::f64::consts::FRAC_PI_2;

/// Relative orbit r(φ) of the effective radial problem.
///
/// # Formula
/// dφ/du = j/√(p∞² + w(u) − j²u²), u = 1/r (Damour 2018, arXiv:1710.10599). Scattering:
/// incoming leg from r_far = max(100, 20 r_min) to periapsis (φ = π/2 + χ/2), outgoing leg by
/// reflection φ → π + χ − φ; the parametrisations of [`estimate`](super::estimate) are used (θ far from capture,
/// t near capture), with 16-point Gauss–Legendre per step. Capture: from r = 100 inward to
/// r = 2 (or just outside a turning point, or past the barrier top if that is inside r = 2),
/// adaptive Gauss–Legendre per step, points spread evenly in √(Δφ² + (Δ ln r)²).
///
/// # Domain
/// As [`estimate`](super::estimate); 4 ≤ n ≤ 20000 points.
///
/// # Errors
/// As [`estimate`](super::estimate); `n` out of range.
///
/// # Examples
/// ```
/// use chiwave_core::encounter::eob::{orbit, estimate, Estimate};
/// let g = 1.5_f64; let p = (g * g - 1.0).sqrt();
/// let chi = [(2.0 * g * g - 1.0) / p, 3.0 * std::f64::consts::PI / 8.0 * (5.0 * g * g - 1.0),
///            (64.0 * p.powi(6) + 72.0 * p.powi(4) + 12.0 * p * p - 1.0) / (3.0 * p.powi(3))];
/// let o = orbit(g, 1e-9, 20.0, &chi, 101).unwrap();
/// assert!(!o.captured && o.r.len() == 101);
/// if let Estimate::Scattered { chi: x, r_min } = estimate(g, 1e-9, 20.0, &chi).unwrap() {
///     assert!((o.r[50] - r_min).abs() < 1e-12 * r_min);
///     assert!((o.phi[50] - (std::f64::consts::FRAC_PI_2 + x / 2.0)).abs() < 1e-10);
/// }
/// ```
pub fn orbit(gamma: f64, nu: f64, j: f64, chi: &[f64], n: usize) -> Result<EobOrbit, InputError> {
    let pot = potential(gamma, nu, chi)?;
    validate_j(j)?;
    if !(4..=20_000).contains(&n) {
        return Err(InputError::OutOfRange { field: "n", value: n as f64, allowed: "4 ≤ n ≤ 20000".into() });
    }
    let uw = u_w(&pot);
    let sh = shape(&pot, j, uw)?;
    if sh.captured {
        return captured_orbit(&sh, j, n);
    }
    let u0 = sh.u0.ok_or_else(|| no_conv("EOB turning point"))?;
    let chi_v = angle(&pot, &sh, j)?;
    let phi_p = FRAC_PI_2 + 0.5 * chi_v;
    let u_far = (1.0 / (20.0 / u0).max(100.0)).min(0.5 * u0);
    let n_half = n.div_ceil(2);
    let odd = n % 2 == 1;
    let denom = if odd { (n_half - 1) as f64 } else { n_half as f64 - 0.5 };
    let r0 = rule(0);
    let mut r_in = Vec::with_capacity(n_half);
    let mut phi_in = Vec::with_capacity(n_half);
    let near = sh.u1.filter(|&u1| u1 - u0 < NEAR_CAPTURE_GAP * u0);
    if let Some(u1) = near {
        let nf = NearForm::new(&sh.r, u0, u1, j);
        let f = |t: f64| nf.dphi(t);
        let t_far = nf.t_of(u_far);
        // from periapsis outward: t from 0 to t_far; φ = φ_p − ∫_0^t
        let mut acc = 0.0;
        let mut prev_t = 0.0;
        let mut pts = Vec::with_capacity(n_half);
        for k in 0..n_half {
            // k = 0 is the far end (k counted from far to periapsis)
            let s = k as f64 / denom; // 0 .. 1 (or < 1 when even)
            pts.push(t_far * (1.0 - s));
        }
        let mut from_peri: Vec<(f64, f64)> = Vec::with_capacity(n_half);
        for &t in pts.iter().rev() {
            acc += integrate_gl(f, prev_t, t, r0);
            prev_t = t;
            from_peri.push((nf.u(t), phi_p - acc));
        }
        for &(u, ph) in from_peri.iter().rev() {
            r_in.push(1.0 / u);
            phi_in.push(ph);
        }
    } else {
        let ff = FarForm::new(&pot, u0, j);
        let f = |th: f64| ff.dphi(th);
        let th_far = (u_far / u0).asin();
        let mut acc = integrate_gl(f, 0.0, th_far, rule(1));
        let mut prev = th_far;
        for k in 0..n_half {
            let th = th_far + (FRAC_PI_2 - th_far) * k as f64 / denom;
            acc += integrate_gl(f, prev, th, r0);
            prev = th;
            r_in.push(1.0 / (u0 * th.sin()));
            phi_in.push(acc);
        }
    }
    if phi_in.iter().any(|x| !x.is_finite()) {
        return Err(no_conv("EOB orbit quadrature"));
    }
    let mut r = r_in.clone();
    let mut phi = phi_in.clone();
    let skip = usize::from(odd);
    for k in (0..n_half - skip).rev() {
        r.push(r_in[k]);
        phi.push(2.0 * phi_p - phi_in[k]);
    }
    Ok(EobOrbit { r, phi, captured: false })
}

/// Adaptive Gauss–Legendre (16 vs 24 points) of `f` over [a, b]: relative tolerance `tol`, or
/// absolute `tol · (b − a) · scale` (scale: a typical size of f).
fn adaptive(f: &impl Fn(f64) -> f64, a: f64, b: f64, tol: f64, scale: f64, depth: u32) -> Result<f64, InputError> {
    adaptive_gl(f, a, b, tol, scale, depth, (rule(0), rule(1))).map_err(|e| match e {
        QuadratureFailure::NotFinite => no_conv("EOB orbit: integrand not finite"),
        QuadratureFailure::TooDeep => no_conv("EOB orbit: adaptive quadrature"),
    })
}

/// Relative tolerance of the captured-orbit quadrature: near the barrier top R(u) is a small
/// difference of O(j²) terms, so rounding limits it to about 1e-11 there.
const ORBIT_TOL: f64 = 1e-9;

fn captured_orbit(sh: &Shape, j: f64, n: usize) -> Result<EobOrbit, InputError> {
    let r = &sh.r;
    let u_far: f64 = 0.01;
    let mut u_end = 1.0 / CAPTURE_STOP_RADIUS;
    if let Some(ub) = sh.ub {
        u_end = u_end.max(1.25 * ub);
    }
    let hi = poly::cauchy_bound(r);
    if let Some(&root) = poly::real_roots(r, 0.0, hi).first() {
        u_end = u_end.min(root * (1.0 - 1e-6));
    }
    let u_far = u_far.min(0.5 * u_end);
    let f = |u: f64| j / poly::eval(r, u).max(0.0).sqrt();
    let scale = f(0.0);
    // fine grid
    let k_fine = (4 * n).max(400);
    let mut uf = Vec::with_capacity(k_fine + 1);
    let mut pf = Vec::with_capacity(k_fine + 1);
    let mut acc = adaptive(&f, 0.0, u_far, ORBIT_TOL, scale, 40)?;
    uf.push(u_far);
    pf.push(acc);
    for k in 1..=k_fine {
        let u = u_far + (u_end - u_far) * k as f64 / k_fine as f64;
        acc += adaptive(&f, uf[k - 1], u, ORBIT_TOL, scale, 40)?;
        uf.push(u);
        pf.push(acc);
    }
    // arc measure
    let mut s = vec![0.0; uf.len()];
    for k in 1..uf.len() {
        let dl = (uf[k] / uf[k - 1]).ln();
        s[k] = s[k - 1] + ((pf[k] - pf[k - 1]).powi(2) + dl * dl).sqrt();
    }
    let total = s[s.len() - 1];
    let mut out_r = Vec::with_capacity(n);
    let mut out_phi = Vec::with_capacity(n);
    let mut kk = 0;
    for i in 0..n {
        let target = total * i as f64 / (n - 1) as f64;
        while kk + 1 < s.len() - 1 && s[kk + 1] < target {
            kk += 1;
        }
        let ds = s[kk + 1] - s[kk];
        let frac = if ds > 0.0 { ((target - s[kk]) / ds).clamp(0.0, 1.0) } else { 0.0 };
        let u = uf[kk] + frac * (uf[kk + 1] - uf[kk]);
        let ph = if frac == 0.0 { pf[kk] } else { pf[kk] + adaptive(&f, uf[kk], u, ORBIT_TOL, scale, 40)? };
        out_r.push(1.0 / u);
        out_phi.push(ph);
    }
    Ok(EobOrbit { r: out_r, phi: out_phi, captured: true })
}
