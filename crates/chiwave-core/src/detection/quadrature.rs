//! Globally adaptive Gauss–Kronrod (7, 15) quadrature of a vector-valued integrand, with an
//! error estimate.
//!
//! Method: the 15-point Kronrod extension of the 7-point Gauss rule (Kronrod 1965; nodes and
//! weights as tabulated in QUADPACK's `qk15`, Piessens, de Doncker-Kapenga, Überhuber & Kahaner
//! 1983, *QUADPACK*, Springer). Each interval's error is |K15 − G7| of the control component (a
//! conservative estimate: K15 is usually far more accurate than G7); the interval with the largest
//! error is bisected until the summed error is below the tolerance (the global strategy of
//! QUADPACK's `qag`). The nodes and weights are checked in this module's tests: exactness on
//! polynomials up to degree 22 (Kronrod) and 13 (Gauss), and the Gauss nodes against
//! [`crate::numeric::gauss_legendre`].

use crate::error::InputError;

/// Kronrod nodes on [0, 1) (QUADPACK `qk15` table `xgk`); the odd entries are the Gauss nodes.
#[allow(clippy::excessive_precision)] // as tabulated
const XGK: [f64; 8] = [
    0.991455371120812639206854697526329,
    0.949107912342758524526189684047851,
    0.864864423359769072789712788640926,
    0.741531185599394439863864773280788,
    0.586087235467691130294144845693013,
    0.405845151377397166906606412076961,
    0.207784955007898467600689403773245,
    0.000000000000000000000000000000000,
];
/// Kronrod weights (QUADPACK `qk15` table `wgk`).
#[allow(clippy::excessive_precision)]
const WGK: [f64; 8] = [
    0.022935322010529224963732008058970,
    0.063092092629978553290700663189204,
    0.104790010322250183839876322541518,
    0.140653259715525918745189590510238,
    0.169004726639267902826583426598550,
    0.190350578064785409913256402421014,
    0.204432940075298892414161999234649,
    0.209482141084727828012999174891714,
];
/// 7-point Gauss weights for the nodes XGK[1], XGK[3], XGK[5], XGK[7] (QUADPACK `qk15` `wg`).
#[allow(clippy::excessive_precision)]
const WG: [f64; 4] = [
    0.129484966168869693270611432679082,
    0.279705391489276667901467771423780,
    0.381830050505118944950369775488975,
    0.417959183673469387755102040816327,
];

/// One interval of the final partition with its integral.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Segment<const N: usize> {
    pub a: f64,
    pub b: f64,
    pub value: [f64; N],
    pub error: f64,
}

/// Outcome of [`integrate`].
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Quadrature<const N: usize> {
    pub value: [f64; N],
    /// Estimated absolute error of the control component.
    pub error: f64,
    pub evaluations: usize,
    /// True when the error estimate met the tolerance.
    pub converged: bool,
    pub segments: Vec<Segment<N>>,
}

/// Both rules on [a, b]: (Kronrod value, |K − G| of the control component).
fn gk15<const N: usize>(f: &mut impl FnMut(f64) -> [f64; N], a: f64, b: f64, control: usize) -> Result<([f64; N], f64), InputError> {
    let c = 0.5 * (a + b);
    let h = 0.5 * (b - a);
    let mut k = [0.0; N];
    let mut g = [0.0; N];
    let mut add = |x: f64, wk: f64, wg: f64| -> Result<(), InputError> {
        let y = f(x);
        for j in 0..N {
            if !y[j].is_finite() {
                return Err(InputError::NoConvergence { what: format!("integrand is not finite ({}) at {x:e}", y[j]) });
            }
            k[j] += wk * y[j];
            g[j] += wg * y[j];
        }
        Ok(())
    };
    add(c, WGK[7], WG[3])?;
    for i in 0..7 {
        let wg = if i % 2 == 1 { WG[i / 2] } else { 0.0 };
        let d = h * XGK[i];
        add(c - d, WGK[i], wg)?;
        add(c + d, WGK[i], wg)?;
    }
    for j in 0..N {
        k[j] *= h;
        g[j] *= h;
    }
    Ok((k, (k[control] - g[control]).abs()))
}

/// Integrates `f` over the union of the intervals between consecutive `breaks` (increasing).
///
/// Stops when the summed error of component `control` is ≤ max(abs_tol, rel_tol·|value|), or
/// when `max_intervals` intervals exist (then `converged` is false and `error` says how far).
///
/// # Errors
/// [`InputError::NoConvergence`] when the integrand is not finite somewhere or fewer than two
/// breaks are given.
pub(crate) fn integrate<const N: usize>(
    mut f: impl FnMut(f64) -> [f64; N],
    breaks: &[f64],
    rel_tol: f64,
    abs_tol: f64,
    max_intervals: usize,
    control: usize,
) -> Result<Quadrature<N>, InputError> {
    if breaks.len() < 2 || control >= N {
        return Err(InputError::NoConvergence { what: "quadrature needs at least one interval".into() });
    }
    let mut segs: Vec<Segment<N>> = Vec::with_capacity(max_intervals.min(256));
    for w in breaks.windows(2) {
        let (v, e) = gk15(&mut f, w[0], w[1], control)?;
        segs.push(Segment { a: w[0], b: w[1], value: v, error: e });
    }
    let mut evaluations = 15 * segs.len();
    loop {
        let total: f64 = segs.iter().map(|s| s.value[control]).sum();
        let err: f64 = segs.iter().map(|s| s.error).sum();
        let tol = abs_tol.max(rel_tol * total.abs());
        let converged = err <= tol;
        if converged || segs.len() >= max_intervals {
            let mut value = [0.0; N];
            for s in &segs {
                for (v, x) in value.iter_mut().zip(&s.value) {
                    *v += x;
                }
            }
            segs.sort_by(|x, y| x.a.total_cmp(&y.a));
            return Ok(Quadrature { value, error: err, evaluations, converged, segments: segs });
        }
        let (i, _) = segs
            .iter()
            .enumerate()
            .max_by(|x, y| x.1.error.total_cmp(&y.1.error))
            .ok_or_else(|| InputError::NoConvergence { what: "quadrature lost its intervals".into() })?;
        let s = segs.swap_remove(i);
        let m = 0.5 * (s.a + s.b);
        let (v1, e1) = gk15(&mut f, s.a, m, control)?;
        let (v2, e2) = gk15(&mut f, m, s.b, control)?;
        evaluations += 30;
        segs.push(Segment { a: s.a, b: m, value: v1, error: e1 });
        segs.push(Segment { a: m, b: s.b, value: v2, error: e2 });
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn poly_on_unit(k: i32) -> ([f64; 1], [f64; 1]) {
        // Kronrod and Gauss sums of x^k on [-1, 1].
        let mut kk = WGK[7] * 0f64.powi(k);
        let mut gg = WG[3] * 0f64.powi(k);
        for i in 0..7 {
            let x = XGK[i];
            let s = x.powi(k) + (-x).powi(k);
            kk += WGK[i] * s;
            if i % 2 == 1 {
                gg += WG[i / 2] * s;
            }
        }
        ([kk], [gg])
    }

    #[test]
    fn rules_are_exact_on_polynomials() {
        // ∫_{-1}^{1} x^k dx = 2/(k + 1) for even k, 0 for odd (elementary). Kronrod (15 nodes) is
        // exact to degree 22, Gauss (7 nodes) to degree 13.
        for k in 0..=22 {
            let exact = if k % 2 == 0 { 2.0 / (k as f64 + 1.0) } else { 0.0 };
            let (kk, gg) = poly_on_unit(k);
            assert!((kk[0] - exact).abs() < 2e-16 * 8.0, "Kronrod k={k}: {} vs {exact}", kk[0]);
            if k <= 13 {
                assert!((gg[0] - exact).abs() < 2e-16 * 8.0, "Gauss k={k}: {} vs {exact}", gg[0]);
            }
        }
        // Not exact one degree higher (the rules are not over-determined by accident).
        let (_, gg) = poly_on_unit(14);
        assert!((gg[0] - 2.0 / 15.0).abs() > 1e-6);
    }

    #[test]
    fn gauss_nodes_match_legendre_roots() {
        // Independent construction: Newton on the Legendre recurrence (crate::numeric).
        let (x, w) = crate::numeric::gauss_legendre(7);
        let mut pos: Vec<(f64, f64)> = x.iter().zip(&w).filter(|(x, _)| **x >= -1e-15).map(|(x, w)| (*x, *w)).collect();
        pos.sort_by(|a, b| b.0.total_cmp(&a.0));
        for (j, (xn, wn)) in pos.iter().enumerate() {
            assert!((xn - XGK[2 * j + 1]).abs() < 1e-15, "node {j}");
            assert!((wn - WG[j]).abs() < 1e-15, "weight {j}");
        }
    }

    #[test]
    fn adaptive_reaches_tolerance_on_a_peak() {
        // ∫_0^1 dx/((x − 0.3)² + 1e-6) = 1e3 [atan(0.7e3) + atan(0.3e3)] (elementary).
        let exact = 1e3 * ((0.7e3f64).atan() + (0.3e3f64).atan());
        let q = integrate(|x| [1.0 / ((x - 0.3) * (x - 0.3) + 1e-6)], &[0.0, 1.0], 1e-10, 0.0, 500, 0).unwrap();
        assert!(q.converged);
        assert!((q.value[0] / exact - 1.0).abs() < 1e-10, "{} vs {exact}", q.value[0]);
        assert!(q.error >= (q.value[0] - exact).abs()); // the estimate bounds the actual error here
        // Non-finite integrands are an error, not a NaN.
        assert!(integrate(|x| [if x > 0.5 { f64::NAN } else { 1.0 }], &[0.0, 1.0], 1e-8, 0.0, 50, 0).is_err());
        // A divergent integrand hits the interval cap and is reported as not converged.
        let q = integrate(|x| [1.0 / x.sqrt().powi(3)], &[0.0, 1.0], 1e-12, 0.0, 20, 0).unwrap();
        assert!(!q.converged && q.segments.len() == 20);
    }
}
