//! Ray paths in the lens plane, for drawing a fan of impact parameters.
//!
//! Sources: Carter's separated geodesic equations (Carter 1968, Phys. Rev. 174, 1559) in Mino
//! time (Mino 2003, arXiv:gr-qc/0302075); classical fourth-order Runge–Kutta (common practice).
//!
//! The orbit equations are integrated for s = b/r in the parameter τ = b λ, with λ the Mino
//! time (dτ_proper = r² dλ in the equatorial plane), where they are smooth through the turning
//! point and well conditioned far from the lens (Carter 1968, the separated equations with
//! zero Carter constant, E = 1, L = b; docs/physics/deflection.md §2):
//!
//! (ds/dτ)² = Π(s), d²s/dτ² = Π′(s)/2, dφ/dτ = N/D, with (Kerr, A = a_s/b, ε = M/b)
//! Π = 1 − (1 − A²)s² + 2ε(1 − A)²s³, N = 1 − 2ε(1 − A)s, D = 1 − 2εs + A²s² (= Δ s²/b²);
//! (Reissner–Nordström, q = Q/b) Π = 1 − s² + 2εs³ − q²s⁴, dφ/dτ = 1, i.e. τ = φ
//! (Q = 0: Schwarzschild, s″ = −s + 3εs²).
//!
//! Classical fourth-order Runge–Kutta with a step of 0.005 in τ, shortened where φ or ln s
//! change faster. The ray starts at r = r_max on the incoming branch, at
//! the azimuth given by the exact incoming tail ∫_{r_max}^∞ (dφ/dr) dr (Gauss–Legendre), so
//! that far from the lens it runs parallel to +x at height y = b; the lens is at the origin.
//! Captured rays end at the horizon r = r_+ (for Kerr, where the Boyer–Lindquist azimuth
//! diverges, the path is followed to r_+ + 0.01M and closed radially onto r_+).

use super::{LightRequest, Metric};
use crate::error::{positive, InputError};
use crate::numeric::gauss_legendre;
use serde::Serialize;
use std::f64::consts::PI;

/// One ray in the lens plane (units of M; lens at the origin).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Ray {
    /// Impact parameter b/M.
    pub b: f64,
    pub captured: bool,
    /// Exact deflection (radians) from the closed form / quadrature; `None` when captured.
    pub alpha: Option<f64>,
    /// Azimuth swept from r = ∞ to r = ∞ by the integrated path including both tails (escaping
    /// rays): equals π + α to the integration accuracy (a check on the plot).
    pub swept_azimuth: Option<f64>,
    pub x: Vec<f64>,
    pub y: Vec<f64>,
}

/// A fan of rays.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RayFan {
    pub metric: &'static str,
    pub critical_b: f64,
    /// r_+ / M (draw as a disc).
    pub horizon_radius: f64,
    /// Equatorial photon-orbit radius / M (prograde orbit for Kerr).
    pub photon_orbit_radius: f64,
    pub r_max: f64,
    pub rays: Vec<Ray>,
}

/// Most rays accepted in one fan.
pub const MAX_RAYS: usize = 256;

#[derive(Clone, Copy)]
struct Orbit {
    b: f64,
    /// A = a_s/b (Kerr) — zero otherwise.
    aa: f64,
    /// ε = M/b.
    eps: f64,
    /// q² = (Q/b)² (RN) — zero otherwise.
    q2: f64,
}

impl Orbit {
    /// Π(s) = (ds/dτ)².
    fn pi(&self, s: f64) -> f64 {
        let om = 1.0 - self.aa;
        1.0 - (1.0 - self.aa * self.aa) * s * s + 2.0 * self.eps * om * om * s * s * s - self.q2 * s * s * s * s
    }
    fn pi_prime(&self, s: f64) -> f64 {
        let om = 1.0 - self.aa;
        -2.0 * (1.0 - self.aa * self.aa) * s + 6.0 * self.eps * om * om * s * s - 4.0 * self.q2 * s * s * s
    }
    /// dφ/dτ = N/D (1 without spin).
    fn phi_dot(&self, s: f64) -> f64 {
        let n = 1.0 - 2.0 * self.eps * (1.0 - self.aa) * s;
        let d = 1.0 - 2.0 * self.eps * s + self.aa * self.aa * s * s;
        n / d
    }
    /// ∫₀^{s1} (dφ/dτ)/√Π ds: azimuth swept between r = ∞ and r = b/s1 (s1 well below s0).
    fn tail(&self, s1: f64, rule: &(Vec<f64>, Vec<f64>)) -> f64 {
        rule.0
            .iter()
            .zip(&rule.1)
            .map(|(x, w)| {
                let s = 0.5 * s1 * (1.0 + x);
                0.5 * s1 * w * self.phi_dot(s) / self.pi(s).max(0.0).sqrt()
            })
            .sum()
    }
    fn rhs(&self, y: [f64; 3]) -> [f64; 3] {
        [y[1], 0.5 * self.pi_prime(y[0]), self.phi_dot(y[0])]
    }
}

const MAX_STEPS: usize = 2_000_000;

/// Integrates one ray; returns (r, swept φ) samples and, for an escaping ray, the total swept
/// azimuth including both tails.
fn trace(o: Orbit, r_max: f64, r_plus: f64, captured: bool, kerr: bool, rule: &(Vec<f64>, Vec<f64>)) -> Result<(Vec<[f64; 2]>, Option<f64>), InputError> {
    let eta = 0.005;
    let s_start = o.b / r_max;
    let stop = if kerr { r_plus + 0.01 } else { r_plus };
    let s_stop = o.b / stop;
    let mut y = [s_start, o.pi(s_start).max(0.0).sqrt(), o.tail(s_start, rule)];
    let mut pts = vec![[r_max, y[2]]];
    let add = |a: [f64; 3], k: [f64; 3], f: f64| [a[0] + f * k[0], a[1] + f * k[1], a[2] + f * k[2]];
    for _ in 0..MAX_STEPS {
        let rate = 1f64.max(o.phi_dot(y[0]).abs()).max(y[1].abs() / (10.0 * y[0].max(1e-300)));
        let h = eta / rate;
        let k1 = o.rhs(y);
        let k2 = o.rhs(add(y, k1, 0.5 * h));
        let k3 = o.rhs(add(y, k2, 0.5 * h));
        let k4 = o.rhs(add(y, k3, h));
        let next = [
            y[0] + h / 6.0 * (k1[0] + 2.0 * k2[0] + 2.0 * k3[0] + k4[0]),
            y[1] + h / 6.0 * (k1[1] + 2.0 * k2[1] + 2.0 * k3[1] + k4[1]),
            y[2] + h / 6.0 * (k1[2] + 2.0 * k2[2] + 2.0 * k3[2] + k4[2]),
        ];
        if !next.iter().all(|v| v.is_finite()) {
            break;
        }
        if captured && next[0] >= s_stop {
            // Close onto the horizon: interpolate φ at r = stop, then go radially to r_+.
            let f = ((s_stop - y[0]) / (next[0] - y[0])).clamp(0.0, 1.0);
            let phi = y[2] + f * (next[2] - y[2]);
            pts.push([stop, phi]);
            if stop != r_plus {
                pts.push([r_plus, phi]);
            }
            return Ok((pts, None));
        }
        y = next;
        if y[0] > 0.0 {
            pts.push([o.b / y[0], y[2]]);
        }
        if !captured && y[1] < 0.0 && y[0] <= s_start {
            let swept = y[2] + o.tail(y[0].max(0.0), rule);
            return Ok((pts, Some(swept)));
        }
    }
    Err(InputError::NoConvergence { what: format!("ray integration for b = {} did not finish", o.b) })
}

/// Ray paths for a fan of impact parameters around the lens described by `req` (its `spin`
/// and `charge`; `req.b` is not used).
///
/// # Domain
/// Each b/M in [1e-6, 1e100]; 1 to 256 rays; `r_max` (units of M) ≥ 1.5 × the largest b and ≤ 10⁶;
/// 2 ≤ `n_points` ≤ 100000 points per ray (the path is thinned evenly to that many).
///
/// # Errors
/// Field-named [`InputError`]s for the inputs above (`b_values`, `r_max`, `n_points`), the
/// lens's own (`spin`, `charge`), and non-convergence.
///
/// # Examples
/// ```
/// use chiwave_core::deflection::{rays, LightRequest};
/// let fan = rays(&LightRequest::geometric(10.0), &[4.0, 10.0], 40.0, 200).unwrap();
/// assert!(fan.rays[0].captured);
/// let r = &fan.rays[1];
/// // The integrated path sweeps π + α (α from Darwin's closed form).
/// assert!((r.swept_azimuth.unwrap() - std::f64::consts::PI - r.alpha.unwrap()).abs() < 1e-9);
/// ```
pub fn rays(req: &LightRequest, b_values: &[f64], r_max: f64, n_points: usize) -> Result<RayFan, InputError> {
    let metric = Metric::new(req.spin, req.charge)?;
    if b_values.is_empty() || b_values.len() > MAX_RAYS {
        return Err(InputError::OutOfRange {
            field: "b_values",
            value: b_values.len() as f64,
            allowed: format!("1 to {MAX_RAYS} impact parameters"),
        });
    }
    for &b in b_values {
        positive("b_values", b)?;
        super::check_b("b_values", b)?;
    }
    positive("r_max", r_max)?;
    let bmax = b_values.iter().cloned().fold(0.0, f64::max);
    if !(r_max >= 1.5 * bmax && r_max <= 1e6) {
        return Err(InputError::OutOfRange {
            field: "r_max",
            value: r_max,
            allowed: format!("1.5 × max(b_values) = {} ≤ r_max ≤ 1e6", 1.5 * bmax),
        });
    }
    if !(2..=100_000).contains(&n_points) {
        return Err(InputError::OutOfRange { field: "n_points", value: n_points as f64, allowed: "2 ≤ n_points ≤ 100000".into() });
    }
    let (a, q, kerr) = match metric {
        Metric::Schwarzschild => (0.0, 0.0, false),
        Metric::Kerr { spin } => (spin, 0.0, true),
        Metric::ReissnerNordstrom { charge } => (0.0, charge, false),
    };
    let r_plus = metric.horizon_radius();
    let rule = gauss_legendre(48);
    let mut out = Vec::with_capacity(b_values.len());
    for &b in b_values {
        let defl = metric.deflection(b)?;
        let captured = defl.alpha().is_none();
        let orbit = Orbit { b, aa: a / b, eps: 1.0 / b, q2: (q / b) * (q / b) };
        let (pts, swept) = trace(orbit, r_max, r_plus, captured, kerr, &rule)?;
        let keep = thin(pts.len(), n_points);
        let (x, y) = keep
            .iter()
            .map(|&i| {
                let [r, phi] = pts[i];
                let ang = PI - phi;
                (r * ang.cos(), r * ang.sin())
            })
            .unzip();
        out.push(Ray { b, captured, alpha: defl.alpha(), swept_azimuth: swept, x, y });
    }
    Ok(RayFan {
        metric: metric.name(),
        critical_b: metric.critical_b(),
        horizon_radius: r_plus,
        photon_orbit_radius: metric.photon_orbit_radius(),
        r_max,
        rays: out,
    })
}

/// Indices 0..len thinned evenly to at most `n` (first and last kept).
fn thin(len: usize, n: usize) -> Vec<usize> {
    if len <= n {
        return (0..len).collect();
    }
    (0..n).map(|k| ((k as f64) * (len - 1) as f64 / (n - 1) as f64).round() as usize).collect()
}
