//! Weak-field series α = Σ c_n (M/b)ⁿ, with the coefficients generated in code.
//!
//! # Method
//! The exact θ-integrands (docs/physics/deflection.md §2: Schwarzschild, Kerr and RN forms) are
//! expanded as truncated power series in two small variables, (ε, A) = (M/b, a_s/b) for Kerr
//! and (ε, q) = (M/b, Q/b) for Reissner–Nordström, at every node of a 64-point Gauss–Legendre
//! rule in θ. The turning point s0 = b/r0 is itself expanded by fixed-point iteration of
//! Π(s0) = 0. Summing the node series with the weights gives every coefficient C_{j,k} of
//! ε^j x^k at once; the integrands are entire in θ apart from poles of 1/(1 + sin θ) at
//! θ = −π/2, so the rule is exact to rounding. Schwarzschild is the k = 0 column.
//!
//! This is a different route from the one in docs/physics/deflection.md §3 (I_n integrals and
//! series reversion, which the reference script tests/reference/deflection_mpmath.py follows); the tests compare the two,
//! and orders 1–4 with Keeton & Petters 2005 (gr-qc/0511019).
//!
//! For a lens with spin a_s (or charge Q) in units of M, the order-n coefficient is
//! c_n = Σ_k C_{n−k,k} a_sᵏ (or Qᵏ), so the n-th term is c_n (M/b)ⁿ.
//!
//! # Convergence
//! The Schwarzschild series converges only for b > 3√3 M (its radius is set by the capture singularity; docs/physics/deflection.md §3).
//! For Kerr and RN the same behaviour (divergence at b ≤ b_c) is expected but not proven here.

use crate::numeric::gauss_legendre;
use std::sync::OnceLock;

/// Highest order generated (and accepted as `orders`).
pub const MAX_ORDER: usize = 12;

const N: usize = MAX_ORDER;
const W: usize = N + 1;

/// Truncated bivariate power series Σ c[i][j] εⁱ xʲ, i + j ≤ N.
#[derive(Clone)]
struct Bi([f64; W * W]);

impl Bi {
    fn zero() -> Self {
        Bi([0.0; W * W])
    }
    fn constant(c: f64) -> Self {
        let mut z = Bi::zero();
        z.0[0] = c;
        z
    }
    /// c·εⁱ xʲ.
    fn mono(c: f64, i: usize, j: usize) -> Self {
        let mut z = Bi::zero();
        z.0[i * W + j] = c;
        z
    }
    fn add(&self, o: &Bi) -> Bi {
        let mut z = self.clone();
        z.0.iter_mut().zip(o.0.iter()).for_each(|(a, b)| *a += b);
        z
    }
    fn scale(&self, s: f64) -> Bi {
        let mut z = self.clone();
        z.0.iter_mut().for_each(|a| *a *= s);
        z
    }
    fn mul(&self, o: &Bi) -> Bi {
        let mut z = Bi::zero();
        for i1 in 0..=N {
            for j1 in 0..=N - i1 {
                let a = self.0[i1 * W + j1];
                if a == 0.0 {
                    continue;
                }
                for i2 in 0..=N - i1 - j1 {
                    for j2 in 0..=N - i1 - j1 - i2 {
                        z.0[(i1 + i2) * W + j1 + j2] += a * o.0[i2 * W + j2];
                    }
                }
            }
        }
        z
    }
    /// Σ_k f[k] xᵏ for a series x with zero constant term (Horner).
    fn compose(f: &[f64], x: &Bi) -> Bi {
        let mut r = Bi::constant(f[N]);
        for k in (0..N).rev() {
            r = r.mul(x);
            r.0[0] += f[k];
        }
        r
    }
}

/// Maclaurin coefficients of (1 − x)^{−1/2}: (2k choose k)/4ᵏ.
fn inv_sqrt_one_minus() -> [f64; W] {
    let mut c = [0.0; W];
    c[0] = 1.0;
    for k in 1..W {
        c[k] = c[k - 1] * (2 * k - 1) as f64 / (2 * k) as f64;
    }
    c
}

/// Maclaurin coefficients of (1 + y)^{1/2}: binom(1/2, k).
fn sqrt_one_plus() -> [f64; W] {
    let mut c = [0.0; W];
    c[0] = 1.0;
    for k in 1..W {
        c[k] = c[k - 1] * (0.5 - (k - 1) as f64) / k as f64;
    }
    c
}

/// Which θ-integrand to expand.
#[derive(Clone, Copy)]
enum Family {
    Kerr,
    Rn,
}

/// Generates C[j][k] (flattened) for α = Σ C_{j,k} εʲ xᵏ.
fn generate(fam: Family) -> Bi {
    let isq = inv_sqrt_one_minus();
    let sq = sqrt_one_plus();
    let geom: [f64; W] = [1.0; W]; // 1/(1 − x)
    let eps = Bi::mono(1.0, 1, 0);
    let x = Bi::mono(1.0, 0, 1);
    let x2 = x.mul(&x);
    // Turning point σ = s0.
    let mut sigma = Bi::constant(1.0);
    match fam {
        Family::Kerr => {
            // σ = (1 − A²)^{−1/2} (1 + 2ε(1 − A)²σ³)^{1/2}
            let pre = Bi::compose(&isq, &x2);
            let one_m = Bi::constant(1.0).add(&x.scale(-1.0));
            let c = eps.mul(&one_m).mul(&one_m).scale(2.0);
            for _ in 0..=N {
                let s3 = sigma.mul(&sigma).mul(&sigma);
                sigma = pre.mul(&Bi::compose(&sq, &c.mul(&s3)));
            }
        }
        Family::Rn => {
            // σ = (1 + 2εσ³ − q²σ⁴)^{1/2}
            for _ in 0..=N {
                let s2 = sigma.mul(&sigma);
                let s3 = s2.mul(&sigma);
                let y = eps.mul(&s3).scale(2.0).add(&x2.mul(&s2).mul(&s2).scale(-1.0));
                sigma = Bi::compose(&sq, &y);
            }
        }
    }
    let (nodes, weights) = gauss_legendre(64);
    let half = std::f64::consts::FRAC_PI_4; // [0, π/2]: centre π/4, half-width π/4
    let mut acc = Bi::zero();
    let es = eps.mul(&sigma);
    for (xn, wn) in nodes.iter().zip(&weights) {
        let th = half + half * xn;
        let t = th.sin();
        let g = t + 1.0 / (1.0 + t);
        let integrand = match fam {
            Family::Kerr => {
                let one_m = Bi::constant(1.0).add(&x.scale(-1.0));
                let num = Bi::constant(1.0).add(&es.mul(&one_m).scale(-2.0 * t));
                let xs = x.mul(&sigma);
                let d1 = es.scale(2.0 * t).add(&xs.mul(&xs).scale(-t * t));
                let w1 = x2.add(&es.mul(&one_m).mul(&one_m).scale(2.0 * g));
                num.mul(&Bi::compose(&geom, &d1)).mul(&Bi::compose(&isq, &w1))
            }
            Family::Rn => {
                let qs = x.mul(&sigma);
                let w1 = es.scale(2.0 * g).add(&qs.mul(&qs).scale(-(1.0 + t * t)));
                Bi::compose(&isq, &w1)
            }
        };
        acc = acc.add(&integrand.scale(2.0 * wn * half));
    }
    acc.0[0] -= std::f64::consts::PI;
    acc
}

fn table(fam: Family) -> &'static Bi {
    static KERR: OnceLock<Bi> = OnceLock::new();
    static RN: OnceLock<Bi> = OnceLock::new();
    match fam {
        Family::Kerr => KERR.get_or_init(|| generate(Family::Kerr)),
        Family::Rn => RN.get_or_init(|| generate(Family::Rn)),
    }
}

/// Generated coefficient C_{j,k} of εʲ A^k (Kerr: A = a_s/b, signed, + prograde), j + k ≤ 12.
///
/// # Formula
/// Term-by-term expansion of the Kerr θ-form (docs/physics/deflection.md §2); see the module docs.
/// Low orders: C_{1,1} = −4, C_{2,1} = −10π (Sereno & De Luca 2006, astro-ph/0609435).
///
/// # Examples
/// ```
/// use chiwave_core::deflection::series::kerr_coefficient;
/// // Sereno & De Luca 2006 (astro-ph/0609435), order 3: −10π ε² A.
/// assert!((kerr_coefficient(2, 1).unwrap() + 10.0 * std::f64::consts::PI).abs() < 1e-11);
/// ```
pub fn kerr_coefficient(j: usize, k: usize) -> Option<f64> {
    (j + k <= N).then(|| table(Family::Kerr).0[j * W + k])
}

/// Generated coefficient C_{j,k} of εʲ q^k (Reissner–Nordström, q = Q/b), j + k ≤ 12.
///
/// # Examples
/// ```
/// use chiwave_core::deflection::series::rn_coefficient;
/// // Keeton & Petters 2005 (gr-qc/0511019), RN order 2: −(3π/4) q² (survives as M → 0).
/// assert!((rn_coefficient(0, 2).unwrap() + 0.75 * std::f64::consts::PI).abs() < 1e-12);
/// ```
pub fn rn_coefficient(j: usize, k: usize) -> Option<f64> {
    (j + k <= N).then(|| table(Family::Rn).0[j * W + k])
}

/// Schwarzschild coefficients c_1 … c_n of α = Σ c_n (M/b)ⁿ (n ≤ 12).
///
/// # Formula
/// c_n = C_{n,0} of the Kerr expansion. Known values (Keeton & Petters 2005, gr-qc/0511019, orders 1–4; higher ones from
/// tests/reference/deflection_mpmath.py): 4, 15π/4, 128/3,
/// 3465π/64 (Keeton & Petters 2005, gr-qc/0511019), 3584/5, 255255π/256, 98304/7,
/// 334639305π/16384, …
///
/// # Examples
/// ```
/// use chiwave_core::deflection::series::schwarzschild_coefficients;
/// let c = schwarzschild_coefficients(4);
/// // Keeton & Petters 2005, gr-qc/0511019: c_4 = 3465π/64.
/// assert!((c[3] / (3465.0 * std::f64::consts::PI / 64.0) - 1.0).abs() < 1e-13);
/// ```
pub fn schwarzschild_coefficients(n: usize) -> Vec<f64> {
    (1..=n.min(N)).map(|j| table(Family::Kerr).0[j * W]).collect()
}

/// Order-n coefficients c_1 … c_n (in powers of M/b) for a Kerr lens with signed spin `a`
/// (units of M): c_n = Σ_k C_{n−k,k} aᵏ.
pub fn kerr_coefficients(a: f64, n: usize) -> Vec<f64> {
    let t = table(Family::Kerr);
    (1..=n.min(N)).map(|ord| (0..=ord).map(|k| t.0[(ord - k) * W + k] * a.powi(k as i32)).sum()).collect()
}

/// Order-n coefficients c_1 … c_n for a Reissner–Nordström lens with charge `q` (units of M):
/// c_n = Σ_k C_{n−k,k} qᵏ (odd k vanish).
pub fn rn_coefficients(q: f64, n: usize) -> Vec<f64> {
    let t = table(Family::Rn);
    (1..=n.min(N)).map(|ord| (0..=ord).map(|k| t.0[(ord - k) * W + k] * q.powi(k as i32)).sum()).collect()
}

/// Partial sums S_n = Σ_{k ≤ n} c_k (M/b)ᵏ for n = 1 … len(c), with the first term scaled by
/// `first_scale` (the PPN factor (1 + γ)/2, Will 2014, arXiv:1403.7377).
pub fn partial_sums(c: &[f64], b: f64, first_scale: f64) -> Vec<f64> {
    let e = 1.0 / b;
    let mut s = 0.0;
    let mut p = 1.0;
    c.iter()
        .enumerate()
        .map(|(i, ci)| {
            p *= e;
            s += if i == 0 { first_scale * ci * p } else { ci * p };
            s
        })
        .collect()
}
