//! The radial problem of the estimate: the radicand R(u) = p∞² + w(u) − j²u² and its shape
//! (turning point, barrier, capture), the angle quadrature (far from and near capture), and the
//! critical j.

use super::{Potential, NEAR_CAPTURE_GAP, REL_ANGLE};
use crate::error::InputError;
use crate::numeric::poly;
use crate::numeric::quadrature::{integrate_gl, integrate_panels};
use crate::numeric::{cached_rule, Rule};
use std::f64::consts::{FRAC_PI_2, PI};

/// j must be > 0.
pub(super) fn validate_j(j: f64) -> Result<f64, InputError> {
    crate::error::positive("j", j)
}

// ------------------------------------------------------------------------------------------
// Shape of the radial problem
// ------------------------------------------------------------------------------------------

pub(super) struct Shape {
    /// Coefficients of R(u) = p∞² + w(u) − j² u².
    pub(super) r: Vec<f64>,
    /// Outermost turning point (first positive root of R) when the body scatters.
    pub(super) u0: Option<f64>,
    /// Next root of R after u0.
    pub(super) u1: Option<f64>,
    /// First local minimum of R (barrier top), if any.
    pub(super) ub: Option<f64>,
    pub(super) captured: bool,
}

pub(super) fn radicand(pot: &Potential, j: f64) -> Vec<f64> {
    let mut c = vec![pot.p_inf * pot.p_inf];
    c.extend_from_slice(&pot.w);
    c[2] -= j * j;
    c
}

/// First positive maximum of w(u) (∞ when w' > 0 for all u > 0).
pub(super) fn u_w(pot: &Potential) -> f64 {
    if pot.w.iter().all(|&x| x >= 0.0) {
        return f64::INFINITY;
    }
    let mut c = vec![0.0];
    c.extend_from_slice(&pot.w);
    let dw = poly::derivative(&c);
    let d2 = poly::derivative(&dw);
    let hi = poly::cauchy_bound(&dw);
    poly::real_roots(&dw, 0.0, hi)
        .into_iter()
        .find(|&x| poly::eval(&d2, x) < 0.0 || poly::eval(&dw, x * (1.0 + 1e-9)) < 0.0)
        .unwrap_or(f64::INFINITY)
}

pub(super) fn shape(pot: &Potential, j: f64, uw: f64) -> Result<Shape, InputError> {
    let r = radicand(pot, j);
    if r.iter().any(|x| !x.is_finite()) {
        return Err(InputError::Inconsistent {
            field: "j",
            reason: "j² overflows double precision; use j < 1e150".into(),
        });
    }
    let hi = poly::cauchy_bound(&r);
    if !hi.is_finite() {
        return Err(InputError::Inconsistent {
            field: "j",
            reason: "the radial potential overflows double precision for these inputs".into(),
        });
    }
    let (roots, crit) = poly::roots_and_critical(&r, 0.0, hi);
    let dr = poly::derivative(&r);
    let d2r = poly::derivative(&dr);
    let ub = crit.into_iter().find(|&x| poly::eval(&d2r, x) > 0.0);
    let u0 = roots.first().copied();
    let u1 = roots.get(1).copied();
    let captured = match u0 {
        None => true,
        Some(u0) => ub.is_some_and(|ub| ub < u0) || u0 >= uw || poly::eval(&dr, u0) >= 0.0,
    };
    Ok(Shape { r, u0: if captured { None } else { u0 }, u1, ub, captured })
}

// ------------------------------------------------------------------------------------------
// Quadrature
// ------------------------------------------------------------------------------------------

pub(super) const RULE_SIZES: [usize; 8] = [16, 24, 32, 48, 64, 96, 128, 192];

/// The k-th rule of [`RULE_SIZES`] (cached).
pub(super) fn rule(k: usize) -> &'static Rule {
    cached_rule(RULE_SIZES[k])
}

/// Pieces of the far-from-capture integrand: with u = u0 sin θ,
/// χ/2 = ∫_0^{π/2} D/(√(1−D)(1+√(1−D))) dθ, D(u) = [w(u0) − w(u)]/[(u0 − u) j² (u0 + u)].
pub(super) struct FarForm {
    /// Coefficients of the divided difference [w(u0) − w(u)]/(u0 − u).
    dw: Vec<f64>,
    u0: f64,
    j2: f64,
}

impl FarForm {
    pub(super) fn new(pot: &Potential, u0: f64, j: f64) -> Self {
        let n = pot.w.len();
        // w(u) = Σ_{k=1}^{n} w_k u^k; (u0^k − u^k)/(u0 − u) = Σ_{m=0}^{k−1} u0^{k−1−m} u^m
        let mut dw = vec![0.0; n];
        for (m, d) in dw.iter_mut().enumerate() {
            let mut s = 0.0;
            let mut pw = 1.0; // u0^{k-1-m} for k = m+1
            for k in (m + 1)..=n {
                s += pot.w[k - 1] * pw;
                pw *= u0;
            }
            *d = s;
        }
        FarForm { dw, u0, j2: j * j }
    }
    fn d(&self, theta: f64) -> f64 {
        let u = self.u0 * theta.sin();
        poly::eval(&self.dw, u) / (self.j2 * (self.u0 + u))
    }
    /// Integrand of χ/2.
    fn chi_half(&self, theta: f64) -> f64 {
        let d = self.d(theta);
        let s = (1.0 - d).sqrt();
        d / (s * (1.0 + s))
    }
    /// Integrand of φ (dφ/dθ).
    pub(super) fn dphi(&self, theta: f64) -> f64 {
        1.0 / (1.0 - self.d(theta)).sqrt()
    }
}

/// Pieces of the near-capture integrand: R = (u0 − u)(u1 − u) P(u), u = u0 − ε sinh² t,
/// ε = u1 − u0: j du/√R = 2 j dt/√P.
pub(super) struct NearForm {
    p: Vec<f64>,
    u0: f64,
    eps: f64,
    j: f64,
}

impl NearForm {
    pub(super) fn new(r: &[f64], u0: f64, u1: f64, j: f64) -> Self {
        let q = poly::deflate(r, u0);
        let p = poly::deflate(&q, u1);
        NearForm { p, u0, eps: u1 - u0, j }
    }
    pub(super) fn u(&self, t: f64) -> f64 {
        let s = t.sinh();
        self.u0 - self.eps * s * s
    }
    /// t at which u(t) = u.
    pub(super) fn t_of(&self, u: f64) -> f64 {
        ((self.u0 - u).max(0.0) / self.eps).sqrt().asinh()
    }
    pub(super) fn dphi(&self, t: f64) -> f64 {
        2.0 * self.j / poly::eval(&self.p, self.u(t)).sqrt()
    }
}

pub(super) fn no_conv(what: &str) -> InputError {
    InputError::NoConvergence { what: what.into() }
}

/// χ of a scattering configuration.
pub(super) fn angle(pot: &Potential, sh: &Shape, j: f64) -> Result<f64, InputError> {
    let u0 = sh.u0.ok_or_else(|| no_conv("EOB angle: no turning point"))?;
    let near = sh.u1.filter(|&u1| u1 - u0 < NEAR_CAPTURE_GAP * u0);
    if let Some(u1) = near {
        // outer part u ∈ [0, u0/2]: R is bounded away from 0, plain rule in u;
        // inner part u ∈ [u0/2, u0]: u = u0 − ε sinh²t, composite rule in t.
        let nf = NearForm::new(&sh.r, u0, u1, j);
        let t_end = nf.t_of(0.5 * u0);
        let f = |t: f64| nf.dphi(t);
        let fo = |u: f64| j / poly::eval(&sh.r, u).sqrt();
        let mut m = (t_end / 1.5).ceil().max(1.0) as usize;
        for k in 0..5 {
            let (ra, rb) = (rule(k.min(RULE_SIZES.len() - 2)), rule((k + 1).min(RULE_SIZES.len() - 1)));
            let lo = integrate_panels(f, 0.0, t_end, m, rule(0)) + integrate_gl(fo, 0.0, 0.5 * u0, ra);
            let hi = integrate_panels(f, 0.0, t_end, m, rule(1)) + integrate_gl(fo, 0.0, 0.5 * u0, rb);
            let chi_lo = 2.0 * lo - PI;
            let chi_hi = 2.0 * hi - PI;
            if chi_hi.is_finite() && (chi_hi - chi_lo).abs() <= REL_ANGLE * chi_hi.abs().max(1.0) {
                return Ok(chi_hi);
            }
            m *= 2;
        }
        Err(no_conv("EOB angle quadrature near capture"))
    } else {
        let ff = FarForm::new(pot, u0, j);
        let f = |th: f64| ff.chi_half(th);
        for k in 0..RULE_SIZES.len() - 1 {
            let lo = integrate_gl(f, 0.0, FRAC_PI_2, rule(k));
            let hi = integrate_gl(f, 0.0, FRAC_PI_2, rule(k + 1));
            if hi.is_finite() && (hi - lo).abs() <= REL_ANGLE * hi.abs() {
                return Ok(2.0 * hi);
            }
        }
        Err(no_conv("EOB angle quadrature"))
    }
}

// ------------------------------------------------------------------------------------------
// Critical j
// ------------------------------------------------------------------------------------------

pub(super) fn is_captured(pot: &Potential, j: f64, uw: f64) -> Result<bool, InputError> {
    Ok(shape(pot, j, uw)?.captured)
}

/// Critical j of the model, the boundary of capture; `j_captured` (if any) is a j known to be
/// captured, so the answer is ≥ it.
pub(super) fn critical(pot: &Potential, uw: f64, j_captured: Option<f64>) -> Result<Option<f64>, InputError> {
    let p2 = pot.p_inf * pot.p_inf;
    let mut wc = vec![0.0];
    wc.extend_from_slice(&pot.w);
    let dw = poly::derivative(&wc);
    let d2w = poly::derivative(&dw);
    // Double root R = R' = 0: j² = w'(u)/(2u) and G(u) = p∞² + w − u w'/2 = 0.
    let mut g = vec![p2];
    g.extend(pot.w.iter().enumerate().map(|(k, &wk)| wk * (1.0 - (k as f64 + 1.0) / 2.0)));
    let mut cands = Vec::new();
    for u in poly::real_roots(&g, 0.0, poly::cauchy_bound(&g)) {
        let j2 = poly::eval(&dw, u) / (2.0 * u);
        if j2 > 0.0 && poly::eval(&d2w, u) - 2.0 * j2 > 0.0 && u < uw {
            cands.push(j2.sqrt());
        }
    }
    if uw.is_finite() {
        let j2 = (p2 + poly::eval(&wc, uw)) / (uw * uw);
        if j2 > 0.0 {
            cands.push(j2.sqrt());
        }
    }
    cands.sort_by(|a, b| b.total_cmp(a));
    let floor = j_captured.unwrap_or(0.0);
    const DELTA: f64 = 1e-8;
    for &jc in &cands {
        if jc < floor {
            break;
        }
        if !is_captured(pot, jc * (1.0 + DELTA), uw)? && is_captured(pot, jc * (1.0 - DELTA), uw)? {
            return Ok(Some(jc));
        }
    }
    // Fallback: bisection on the capture predicate.
    let mut hi = cands.first().copied().unwrap_or(1.0).max(floor).max(1e-300) * 2.0;
    let mut n = 0;
    while is_captured(pot, hi, uw)? {
        hi *= 2.0;
        n += 1;
        if n > 200 || !hi.is_finite() {
            return Err(no_conv("critical j: no scattering found at large j"));
        }
    }
    let mut lo = match j_captured {
        Some(jc) => jc,
        None => {
            let mut lo = hi / 2.0;
            let mut n = 0;
            while !is_captured(pot, lo, uw)? {
                lo /= 2.0;
                n += 1;
                if n > 200 || lo == 0.0 {
                    return Ok(None);
                }
            }
            lo
        }
    };
    for _ in 0..200 {
        if hi - lo <= 4.0 * f64::EPSILON * hi {
            break;
        }
        let mid = if hi > 4.0 * lo { (lo * hi).sqrt() } else { 0.5 * (lo + hi) };
        if is_captured(pot, mid, uw)? {
            lo = mid;
        } else {
            hi = mid;
        }
    }
    Ok(Some(hi))
}
