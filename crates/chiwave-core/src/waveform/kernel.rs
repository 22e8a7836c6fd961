//! The LO strain for one observer direction: worldline part in closed form, field-stress part as a
//! Gauss–Legendre sum over the Feynman parameter, and the map to a boosted frame.
//!
//! Source: chiwave's derivation from the relaxed Einstein equations in harmonic gauge with the
//! Landau–Lifshitz pseudotensor (Landau & Lifshitz, *Classical Theory of Fields*, §96; Poisson &
//! Will, *Gravity* (2014), ch. 6), written out in docs/physics/waveform.md §2 and checked by this
//! crate's tests (energy balance against Herrmann et al. 2021, arXiv:2101.07255; Lorentz
//! covariance; the memory of Braginsky & Thorne 1987; the quadrupole limit).

// Index loops are kept where the indices are tensor indices (clearer than iterator chains).
#![allow(clippy::needless_range_loop)]

use super::frames::{Basis, Binary, BoostMap, Frame};
use crate::error::{finite, InputError};
use crate::numeric::gauss_legendre;

/// Default number of Gauss–Legendre nodes in the Feynman parameter x (24–48 nodes give about 1e-13
/// at moderate γ, tests/waveform.rs; more are used automatically at high γ, see [`x_nodes_for`]).
pub const DEFAULT_X_NODES: usize = 40;

/// Nodes used for the Feynman-parameter integral at Lorentz factor γ when `requested` is the base
/// count: the integrand sharpens near x → 0 like 1/γ², so the count grows like log γ.
pub(crate) fn x_nodes_for(gamma: f64, requested: usize) -> usize {
    let extra = (8.0 * gamma.ln().max(0.0)).ceil() as usize;
    (requested + extra).min(400)
}

/// Plus and cross polarisations sampled at the requested retarded times.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct Strain {
    pub plus: Vec<f64>,
    pub cross: Vec<f64>,
}

/// Per-node data of the field-stress integral: integrand g(u) = c0/S − P(u)/S³ with
/// S² = s2 u² + s1 u + s0 and P = p2 u² + p1 u + p0, one set of (c0, p) per polarisation.
#[derive(Debug, Clone, Copy)]
pub(crate) struct FieldNode {
    pub weight: f64,
    pub c0: [f64; 2],
    pub p2: [f64; 2],
    pub p1: [f64; 2],
    pub p0: [f64; 2],
    pub s2: f64,
    pub s1: f64,
    pub s0: f64,
}

/// Frame-A kernel for one direction (docs/physics/waveform.md §2).
#[derive(Debug, Clone)]
pub(crate) struct RestKernel {
    pub v: f64,
    pub b: f64,
    /// t = (u + ny_b)/one_m_nxv.
    pub ny_b: f64,
    pub one_m_nxv: f64,
    /// Worldline part h = c_r/r + c_y (1 + v t/r), per polarisation.
    pub c_r: [f64; 2],
    pub c_y: [f64; 2],
    pub nodes: Vec<FieldNode>,
}

type M4 = [[f64; 4]; 4];
const ETA: [f64; 4] = [-1.0, 1.0, 1.0, 1.0];

/// Spatial block of the bilinear Landau–Lifshitz + harmonic-gauge expression E^{ab}(A, B), with the
/// derivative on the first factor replaced by `k` (lower index) and on the second by `p`, amplitudes
/// `a`, `b` (upper indices), indices moved with η (the explicit Landau–Lifshitz expression, docs/physics/waveform.md §2).
fn ll_bilinear(a: &M4, k: &[f64; 4], b: &M4, p: &[f64; 4]) -> [[f64; 3]; 3] {
    let up = |w: &[f64; 4]| [ETA[0] * w[0], w[1], w[2], w[3]];
    let (ku, pu) = (up(k), up(p));
    let mv = |m: &M4, w: &[f64; 4]| {
        let mut r = [0.0; 4];
        for (i, ri) in r.iter_mut().enumerate() {
            *ri = (0..4).map(|l| m[i][l] * w[l]).sum();
        }
        r
    };
    let mdot = |x: &[f64; 4], y: &[f64; 4]| (0..4).map(|l| ETA[l] * x[l] * y[l]).sum::<f64>();
    let ak = mv(a, k);
    let ap = mv(a, p);
    let bk = mv(b, k);
    let bp = mv(b, p);
    let kbp: f64 = (0..4).map(|l| k[l] * bp[l]).sum();
    let pap: f64 = (0..4).map(|l| p[l] * ap[l]).sum();
    let ap_bk = mdot(&ap, &bk);
    let kp = mdot(k, p); // k_l p_l η^{ll}
    // [a·η·(bk)]^c = a^{cn} η_nn (bk)^n
    let mut a_bk = [0.0; 4];
    for (c, x) in a_bk.iter_mut().enumerate() {
        *x = (0..4).map(|n| a[c][n] * ETA[n] * bk[n]).sum();
    }
    let mut a_b = 0.0; // a^{nt} b_{nt}
    let (mut tra, mut trb) = (0.0, 0.0);
    for n in 0..4 {
        tra += ETA[n] * a[n][n];
        trb += ETA[n] * b[n][n];
        for t in 0..4 {
            a_b += a[n][t] * ETA[n] * ETA[t] * b[n][t];
        }
    }
    let big = 2.0 * a_b - tra * trb;
    let mut e = [[0.0; 3]; 3];
    for j in 0..3 {
        for l in 0..3 {
            let (aj, al) = (j + 1, l + 1);
            let eta_jl = if j == l { 1.0 } else { 0.0 };
            let mut aeb = 0.0; // a^{j m} η_mm b^{m l}
            for m in 0..4 {
                aeb += a[aj][m] * ETA[m] * b[m][al];
            }
            e[j][l] = a[aj][al] * kbp - ak[aj] * bp[al] + 0.5 * eta_jl * ap_bk
                - pu[aj] * a_bk[al]
                - pu[al] * a_bk[aj]
                + kp * aeb
                + 0.125 * (2.0 * ku[aj] * pu[al] - eta_jl * kp) * big
                + ap[aj] * bk[al]
                - pap * b[aj][al];
        }
    }
    e
}

/// The field-stress quadratic form C_pol(q) = P_jk C^{jk}(q) for both polarisations (docs/physics/waveform.md §2):
/// C^{jk} is the cross-term (h1, h2) part, both orders, of 16πG(−g)(t_LL + t_H)^{jk} with
/// d → iK, times −1; wave vectors K1 = (−q·v, q) on h1 and K2 = (0, (q·v) n − q) on h2,
/// unit amplitudes u1 u1 and δ0 δ0.
fn c_pol(q: [f64; 3], v: f64, gamma: f64, n: [f64; 3], pol: &[[[f64; 3]; 3]; 2]) -> [f64; 2] {
    let qv = q[0] * v;
    let k1 = [-qv, q[0], q[1], q[2]];
    let k2 = [0.0, qv * n[0] - q[0], qv * n[1] - q[1], qv * n[2] - q[2]];
    let u1 = [gamma, gamma * v, 0.0, 0.0];
    let mut h1 = [[0.0; 4]; 4];
    for i in 0..4 {
        for j in 0..4 {
            h1[i][j] = u1[i] * u1[j];
        }
    }
    let mut h2 = [[0.0; 4]; 4];
    h2[0][0] = 1.0;
    let e12 = ll_bilinear(&h1, &k1, &h2, &k2);
    let e21 = ll_bilinear(&h2, &k2, &h1, &k1);
    let mut out = [0.0; 2];
    for (o, p) in out.iter_mut().zip(pol) {
        for j in 0..3 {
            for l in 0..3 {
                *o += p[j][l] * (e12[j][l] + e21[j][l]);
            }
        }
    }
    out
}

/// N_pol (3×3 symmetric, per polarisation) from C_pol by polarisation: N_aa = C(e_a),
/// N_ab = [C(e_a + e_b) − C(e_a) − C(e_b)]/2.
fn n_pol(v: f64, gamma: f64, n: [f64; 3], pol: &[[[f64; 3]; 3]; 2]) -> [[[f64; 3]; 3]; 2] {
    let e = |a: usize| {
        let mut q = [0.0; 3];
        q[a] = 1.0;
        q
    };
    let diag: Vec<[f64; 2]> = (0..3).map(|a| c_pol(e(a), v, gamma, n, pol)).collect();
    let mut out = [[[0.0; 3]; 3]; 2];
    for a in 0..3 {
        for c in 0..3 {
            for p in 0..2 {
                out[p][a][c] = if a == c {
                    diag[a][p]
                } else {
                    let mut q = e(a);
                    q[c] = 1.0;
                    0.5 * (c_pol(q, v, gamma, n, pol)[p] - diag[a][p] - diag[c][p])
                };
            }
        }
    }
    out
}

fn inv3(m: &[[f64; 3]; 3]) -> ([[f64; 3]; 3], f64) {
    let c00 = m[1][1] * m[2][2] - m[1][2] * m[2][1];
    let c01 = m[1][2] * m[2][0] - m[1][0] * m[2][2];
    let c02 = m[1][0] * m[2][1] - m[1][1] * m[2][0];
    let det = m[0][0] * c00 + m[0][1] * c01 + m[0][2] * c02;
    let inv = [
        [c00, m[0][2] * m[2][1] - m[0][1] * m[2][2], m[0][1] * m[1][2] - m[0][2] * m[1][1]],
        [c01, m[0][0] * m[2][2] - m[0][2] * m[2][0], m[0][2] * m[1][0] - m[0][0] * m[1][2]],
        [c02, m[0][1] * m[2][0] - m[0][0] * m[2][1], m[0][0] * m[1][1] - m[0][1] * m[1][0]],
    ];
    let mut r = [[0.0; 3]; 3];
    for i in 0..3 {
        for j in 0..3 {
            r[i][j] = inv[i][j] / det;
        }
    }
    (r, det)
}

impl RestKernel {
    /// Builds the frame-A kernel at direction (θ, φ) with `x_nodes` Gauss–Legendre nodes.
    pub fn new(sys: &Binary, theta: f64, phi: f64, x_nodes: usize) -> Self {
        let basis = Basis::new(theta, phi);
        let n = basis.n;
        let v = sys.v();
        let g = sys.gamma;
        let (m1, m2, b) = (sys.m1, sys.m2, sys.b);
        let pol = basis.pol_tensors();
        let one_m_nxv = 1.0 - n[0] * v;
        // Worldline part (docs/physics/waveform.md §2), contracted with the polarisation tensors.
        let kk = m1 * g / one_m_nxv;
        let mut c_r = [0.0; 2];
        let mut c_y = [0.0; 2];
        let s = 1.0 - 3.0 * v * v;
        for p in 0..2 {
            let (pxx, pxy) = (pol[p][0][0], pol[p][0][1]);
            c_r[p] = 4.0 * kk * m2 * pxx * (4.0 * v * v + v * n[0] * s / one_m_nxv + 2.0 * s);
            c_y[p] = -4.0 * kk * (m2 * (1.0 + v * v) / (b * v)) * (v * v * pxx * n[1] / one_m_nxv + 2.0 * v * pxy);
        }
        // Field part (docs/physics/waveform.md §2).
        let np = n_pol(v, g, n, &pol);
        let vv = [v, 0.0, 0.0];
        let mut a1 = [[0.0; 3]; 3];
        let mut a2 = [[0.0; 3]; 3];
        for i in 0..3 {
            for j in 0..3 {
                let id = if i == j { 1.0 } else { 0.0 };
                a1[i][j] = id - vv[i] * vv[j];
                a2[i][j] = id - vv[i] * n[j] - n[i] * vv[j] + vv[i] * vv[j];
            }
        }
        // Overall sign (docs/physics/waveform.md §2): the field part is written as +4G(2Gm1m2/γ) N ∫…
        // with C the quadratic form of *minus* the cross terms with d → iK, i.e. C = +E(d → K), E the
        // bilinear LL + harmonic expression. The two linear fields carry opposite Fourier signs
        // (e^{+iK·x} vs e^{−iq·X}), so the prefactor below carries −1; the energy balance against
        // Herrmann et al. 2021 (this module's tests, 1e-10 at several γ) confirms the sign.
        let pref = -4.0 * 2.0 * m1 * m2 / g;
        let (xs, ws) = gauss_legendre(x_nodes_for(g, x_nodes.max(4)));
        let mut nodes = Vec::with_capacity(xs.len());
        for (xg, wg) in xs.iter().zip(&ws) {
            let x = 0.5 * (xg + 1.0);
            let w = 0.5 * wg;
            let mut ax = [[0.0; 3]; 3];
            for i in 0..3 {
                for j in 0..3 {
                    ax[i][j] = x * a1[i][j] + (1.0 - x) * a2[i][j];
                }
            }
            let (ai, det) = inv3(&ax);
            let al = [v * ai[0][0], v * ai[1][0], v * ai[2][0]];
            let be = [b * ai[0][1], b * ai[1][1], b * ai[2][1]];
            let mut node = FieldNode {
                weight: pref * w / det.sqrt(),
                c0: [0.0; 2],
                p2: [0.0; 2],
                p1: [0.0; 2],
                p0: [0.0; 2],
                s2: v * v * ai[0][0],
                s1: 2.0 * v * b * ai[0][1],
                s0: b * b * ai[1][1],
            };
            for p in 0..2 {
                let nm = &np[p];
                let (mut c0, mut aa, mut ab, mut bb) = (0.0, 0.0, 0.0, 0.0);
                for i in 0..3 {
                    for j in 0..3 {
                        c0 += nm[i][j] * ai[i][j];
                        aa += al[i] * nm[i][j] * al[j];
                        ab += al[i] * nm[i][j] * be[j];
                        bb += be[i] * nm[i][j] * be[j];
                    }
                }
                node.c0[p] = c0;
                node.p2[p] = aa;
                node.p1[p] = 2.0 * ab;
                node.p0[p] = bb;
            }
            nodes.push(node);
        }
        RestKernel { v, b, ny_b: n[1] * b, one_m_nxv, c_r, c_y, nodes }
    }

    fn t_of_u(&self, u: f64) -> f64 {
        (u + self.ny_b) / self.one_m_nxv
    }

    /// Worldline part (h₊, h×) at u.
    pub fn worldline(&self, u: f64) -> [f64; 2] {
        let t = self.t_of_u(u);
        let vt = self.v * t;
        let r = vt.hypot(self.b);
        // 1 + vt/r without cancellation for t < 0: b²/(r (r − vt)).
        let y = if vt >= 0.0 { 1.0 + vt / r } else { self.b * self.b / (r * (r - vt)) };
        [self.c_r[0] / r + self.c_y[0] * y, self.c_r[1] / r + self.c_y[1] * y]
    }

    /// d/du of the worldline part.
    pub fn worldline_rate(&self, u: f64) -> [f64; 2] {
        let t = self.t_of_u(u);
        let r = (self.v * t).hypot(self.b);
        let r3 = r * r * r;
        let d_inv_r = -self.v * self.v * t / r3 / self.one_m_nxv;
        let d_y = self.v * self.b * self.b / r3 / self.one_m_nxv;
        [self.c_r[0] * d_inv_r + self.c_y[0] * d_y, self.c_r[1] * d_inv_r + self.c_y[1] * d_y]
    }

    /// Field-stress part (h₊, h×) at u.
    pub fn field(&self, u: f64) -> [f64; 2] {
        let mut h = [0.0; 2];
        for nd in &self.nodes {
            let q = (nd.s2 * u + nd.s1) * u + nd.s0;
            let is = 1.0 / q.sqrt();
            let is3 = is * is * is;
            for p in 0..2 {
                let pu = (nd.p2[p] * u + nd.p1[p]) * u + nd.p0[p];
                h[p] += nd.weight * (nd.c0[p] * is - pu * is3);
            }
        }
        h
    }

    /// d/du of the field-stress part (derivative taken analytically inside the x-integral).
    pub fn field_rate(&self, u: f64) -> [f64; 2] {
        let mut h = [0.0; 2];
        for nd in &self.nodes {
            let q = (nd.s2 * u + nd.s1) * u + nd.s0;
            let dq = 2.0 * nd.s2 * u + nd.s1;
            let is = 1.0 / q.sqrt();
            let is3 = is * is * is;
            let is5 = is3 * is * is;
            for p in 0..2 {
                let pu = (nd.p2[p] * u + nd.p1[p]) * u + nd.p0[p];
                let dp = 2.0 * nd.p2[p] * u + nd.p1[p];
                h[p] += nd.weight * (-0.5 * nd.c0[p] * dq * is3 - dp * is3 + 1.5 * pu * dq * is5);
            }
        }
        h
    }

    /// Centres and time scales (centre, scale) of the features of ḣ(u), for quadrature in u:
    /// the worldline part (centre −n_y b, scale b(1 − n_x v)/v) and the field-stress slices at the
    /// two ends of the Feynman parameter and the narrowest slice.
    pub fn features(&self) -> Vec<(f64, f64)> {
        let mut out = vec![(-self.ny_b, self.b * self.one_m_nxv / self.v)];
        let slice = |nd: &FieldNode| {
            let c = -nd.s1 / (2.0 * nd.s2);
            let d2 = nd.s0 / nd.s2 - c * c;
            (c, d2.max(0.0).sqrt())
        };
        if let (Some(first), Some(last)) = (self.nodes.first(), self.nodes.last()) {
            out.push(slice(first));
            out.push(slice(last));
        }
        if let Some(narrow) = self.nodes.iter().map(slice).min_by(|a, b| a.1.total_cmp(&b.1)) {
            out.push(narrow);
        }
        out
    }
}

/// The waveform seen in one direction of one frame, ready to evaluate at any u.
///
/// # Formula
/// Frame A: D h = worldline part + field-stress part (docs/physics/waveform.md §2). Other frames: the frame-A
/// waveform at the aberrated direction, D'(h'₊ + i h'×)(u') = δ e^{2iψ} D(h₊ + i h×)(δ(u' − n'·a))
/// (docs/physics/waveform.md §1).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{Binary, DirectionWaveform, Frame};
/// let s = Binary::new(0.5, 0.5, 1.2, 40.0).unwrap();
/// let w = DirectionWaveform::new(&s, Frame::Rest2, 1.0, 0.3, 40).unwrap();
/// // Far before the encounter the O(G²) strain vanishes.
/// let h = w.strain(-1e9);
/// assert!(h[0].abs() < 1e-9 && h[1].abs() < 1e-9);
/// ```
#[derive(Debug, Clone)]
pub struct DirectionWaveform {
    pub(crate) kernel: RestKernel,
    pub(crate) map: BoostMap,
}

fn check_angles(theta: f64, phi: f64) -> Result<(), InputError> {
    crate::error::in_closed("theta", theta, 0.0, std::f64::consts::PI)?;
    finite("phi", phi)?;
    if phi.abs() > 1e3 {
        return Err(InputError::OutOfRange { field: "phi", value: phi, allowed: "|phi| ≤ 1000 rad".into() });
    }
    Ok(())
}

impl DirectionWaveform {
    /// Prepares the waveform in `frame` at direction (θ, φ) of that frame.
    ///
    /// # Domain
    /// 0 ≤ θ ≤ π, |φ| ≤ 1000 (radians); `x_nodes` ≥ 4 (Gauss–Legendre nodes in the Feynman
    /// parameter; [`DEFAULT_X_NODES`] is enough for 1e-12 at γ ≤ 3, and more are added at high γ).
    ///
    /// # Errors
    /// [`InputError`] naming `theta` or `phi`.
    pub fn new(sys: &Binary, frame: Frame, theta: f64, phi: f64, x_nodes: usize) -> Result<Self, InputError> {
        check_angles(theta, phi)?;
        let (vel, ay) = match frame {
            Frame::Rest2 => (0.0, 0.0),
            Frame::Cm => {
                let [(e1, _, _), (e2, _, _)] = sys.bodies(Frame::Cm);
                (sys.cm_velocity(), e1 * sys.b / (e1 + e2))
            }
        };
        Ok(Self::build(sys, vel, ay, theta, phi, x_nodes))
    }

    /// The waveform in a frame moving with velocity `vel` (|vel| < 1) along +x relative to frame A,
    /// whose origin is the boosted frame-A origin event moved by `origin_y` along y, at its
    /// direction (θ, φ). `vel = v, origin_y = b` is the rest frame of body 1 with body 1 at the origin.
    ///
    /// # Errors
    /// [`InputError`] naming `vel`, `origin_y`, `theta` or `phi`.
    pub fn in_boosted_frame(
        sys: &Binary,
        vel: f64,
        origin_y: f64,
        theta: f64,
        phi: f64,
        x_nodes: usize,
    ) -> Result<Self, InputError> {
        check_angles(theta, phi)?;
        finite("origin_y", origin_y)?;
        crate::error::in_closed("vel", vel, -0.999_999_999, 0.999_999_999)?;
        Ok(Self::build(sys, vel, origin_y, theta, phi, x_nodes))
    }

    fn build(sys: &Binary, vel: f64, ay: f64, theta: f64, phi: f64, x_nodes: usize) -> Self {
        let map = if vel == 0.0 && ay == 0.0 {
            BoostMap::identity(theta, phi)
        } else {
            BoostMap::new(vel, ay, theta, phi)
        };
        let kernel = RestKernel::new(sys, map.theta_a, map.phi_a, x_nodes);
        DirectionWaveform { kernel, map }
    }

    /// D·(h₊, h×) at retarded time u (O(G²) part).
    pub fn strain(&self, u: f64) -> [f64; 2] {
        let ua = self.map.u_a(u);
        let w = self.kernel.worldline(ua);
        let f = self.kernel.field(ua);
        self.map.rotate([w[0] + f[0], w[1] + f[1]], self.map.delta)
    }

    /// D·(ḣ₊, ḣ×) = d/du of [`DirectionWaveform::strain`].
    pub fn strain_rate(&self, u: f64) -> [f64; 2] {
        let ua = self.map.u_a(u);
        let w = self.kernel.worldline_rate(ua);
        let f = self.kernel.field_rate(ua);
        self.map.rotate([w[0] + f[0], w[1] + f[1]], self.map.delta * self.map.delta)
    }

    /// Only the field-stress part of D·(h₊, h×) at u (for plots and checks).
    pub fn field_part(&self, u: f64) -> [f64; 2] {
        let ua = self.map.u_a(u);
        self.map.rotate(self.kernel.field(ua), self.map.delta)
    }

    /// Late-minus-early strain from the waveform's own asymptotics (worldline part at u → ±∞;
    /// the field part vanishes there, docs/physics/waveform.md §2).
    pub fn memory(&self) -> [f64; 2] {
        // h_wl(+∞) − h_wl(−∞) = 2 c_y (1/r → 0, 1 + vt/r → 2 or 0).
        self.map.rotate([2.0 * self.kernel.c_y[0], 2.0 * self.kernel.c_y[1]], self.map.delta)
    }

    /// The Doppler factor δ of the map to frame A (1 in frame A).
    pub fn doppler(&self) -> f64 {
        self.map.delta
    }

    /// Centres and scales (in this frame's u) of the worldline and field parts.
    pub(crate) fn features(&self) -> Vec<(f64, f64)> {
        let d = self.map.delta;
        self.kernel.features().into_iter().map(|(c, l)| (c / d + self.map.shift, l / d)).collect()
    }
}

/// D·(h₊, h×)(u) at the given retarded times (O(G²) part) in `frame` at direction (θ, φ).
///
/// # Formula
/// See [`DirectionWaveform`]; docs/physics/waveform.md §2.
///
/// # Errors
/// [`InputError`] naming `theta`, `phi` or `u` (every u must be finite).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::{waveform, Binary, Frame};
/// let s = Binary::new(0.5, 0.5, 1.5, 30.0).unwrap();
/// let h = waveform(&s, Frame::Cm, 0.7, 0.2, &[-100.0, 0.0, 100.0]).unwrap();
/// assert_eq!(h.plus.len(), 3);
/// assert!(h.plus.iter().all(|x| x.is_finite()));
/// ```
pub fn waveform(sys: &Binary, frame: Frame, theta: f64, phi: f64, u: &[f64]) -> Result<Strain, InputError> {
    for &x in u {
        finite("u", x)?;
    }
    let w = DirectionWaveform::new(sys, frame, theta, phi, DEFAULT_X_NODES)?;
    let mut s = Strain { plus: Vec::with_capacity(u.len()), cross: Vec::with_capacity(u.len()) };
    for &x in u {
        let h = w.strain(x);
        s.plus.push(h[0]);
        s.cross.push(h[1]);
    }
    Ok(s)
}

/// The u-independent O(G) piece D·(h₊, h×) of the incoming bodies' fields in `frame`:
/// D h_ij = 4 Σ_a E_a [v_a v_a/(1 − n·v_a)]_ij contracted with the polarisation tensors
/// (docs/physics/waveform.md §1). It is not Lorentz-covariant under the polarisation map (it is
/// not transverse-traceless in the four-dimensional sense), so frames compare derivatives or
/// differences only.
///
/// # Errors
/// [`InputError`] naming `theta` or `phi`.
pub fn constant_piece(sys: &Binary, frame: Frame, theta: f64, phi: f64) -> Result<[f64; 2], InputError> {
    check_angles(theta, phi)?;
    let basis = Basis::new(theta, phi);
    let pol = basis.pol_tensors();
    let mut h = [0.0; 2];
    for (e, va, _) in sys.bodies(frame) {
        let k = 4.0 * e * va * va / (1.0 - basis.n[0] * va);
        h[0] += k * pol[0][0][0];
        h[1] += k * pol[1][0][0];
    }
    Ok(h)
}
