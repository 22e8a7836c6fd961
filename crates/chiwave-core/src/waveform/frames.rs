//! The two-body system, the two frames, observer directions and the boost map between frames.
//!
//! Sources: the frames, the polarisation basis, the Doppler factor δ, the polarisation rotation ψ
//! (from the Lorentz invariance of h_{μν} m^μ m^ν) and the origin-shift rule are chiwave's
//! conventions, written out in docs/physics/waveform.md §1;
//! the boost, aberration and Doppler factor are the textbook Lorentz kinematics (Rybicki &
//! Lightman 1979, Radiative Processes in Astrophysics, ch. 4).

// Index loops are kept where the indices are tensor indices (clearer than iterator chains).
#![allow(clippy::needless_range_loop)]

use crate::error::{finite, positive, InputError};
use serde::{Deserialize, Serialize};

/// Which frame the waveform is given in (docs/physics/waveform.md §1).
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize, Default)]
#[serde(rename_all = "lowercase")]
pub enum Frame {
    /// Frame A: rest frame of body 2 (initially), body 2 at the origin.
    #[default]
    Rest2,
    /// Centre-of-mass (centre-of-energy) frame, origin on the straight centre-of-energy line.
    Cm,
}

impl Frame {
    /// The stable name used in JSON.
    pub fn name(self) -> &'static str {
        match self {
            Frame::Rest2 => "rest2",
            Frame::Cm => "cm",
        }
    }
}

/// A validated two-body scattering system in geometric units (G = c = 1).
///
/// # Domain
/// m1, m2 > 0; 1 < γ ≤ 1e4 (relative Lorentz factor); b > 0. Masses and b in any one common
/// geometric unit (the outputs scale homogeneously: D·h ∝ m1 m2/b, energies ∝ m1² m2²/b³).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Binary {
    pub m1: f64,
    pub m2: f64,
    pub gamma: f64,
    pub b: f64,
}

/// Largest relative Lorentz factor accepted (the sky quadrature is clustered for beaming, but
/// beyond this the beams are narrower than f64 can resolve in 1 − v).
pub const GAMMA_MAX: f64 = 1e4;

impl Binary {
    /// Validates and builds the system.
    ///
    /// # Errors
    /// [`InputError`] naming `m1`, `m2`, `gamma` (1 < γ ≤ 1e4) or `b` (> 0).
    ///
    /// # Examples
    /// ```
    /// let s = chiwave_core::waveform::Binary::new(0.5, 0.5, 1.25, 50.0).unwrap();
    /// assert!((s.v() - 0.6).abs() < 1e-15);
    /// ```
    pub fn new(m1: f64, m2: f64, gamma: f64, b: f64) -> Result<Self, InputError> {
        positive("m1", m1)?;
        positive("m2", m2)?;
        positive("b", b)?;
        finite("gamma", gamma)?;
        if !(gamma > 1.0 && gamma <= GAMMA_MAX) {
            return Err(InputError::OutOfRange {
                field: "gamma",
                value: gamma,
                allowed: format!("1 < gamma ≤ {GAMMA_MAX} (relative Lorentz factor)"),
            });
        }
        let s = Binary { m1, m2, gamma, b };
        if s.v() <= 0.0 {
            return Err(InputError::OutOfRange {
                field: "gamma",
                value: gamma,
                allowed: "gamma − 1 > 1e-15 (relative speed must be resolvable in f64)".into(),
            });
        }
        Ok(s)
    }

    /// Builds the system from the relative speed v (fraction of c) instead of γ.
    ///
    /// # Errors
    /// As [`Binary::new`]; `v` must satisfy 0 < v < 1.
    pub fn from_speed(m1: f64, m2: f64, v: f64, b: f64) -> Result<Self, InputError> {
        finite("v", v)?;
        if !(v > 0.0 && v < 1.0) {
            return Err(InputError::OutOfRange { field: "v", value: v, allowed: "0 < v < 1 (fraction of c)".into() });
        }
        let gamma = 1.0 / ((1.0 - v) * (1.0 + v)).sqrt();
        Binary::new(m1, m2, gamma, b)
    }

    /// Relative speed v = sqrt(γ² − 1)/γ, computed without cancellation.
    pub fn v(&self) -> f64 {
        let g = self.gamma;
        ((g - 1.0) * (g + 1.0)).sqrt() / g
    }

    /// Total mass M = m1 + m2.
    pub fn total_mass(&self) -> f64 {
        self.m1 + self.m2
    }

    /// Symmetric mass ratio ν = m1 m2/M².
    pub fn nu(&self) -> f64 {
        let m = self.total_mass();
        self.m1 * self.m2 / (m * m)
    }

    /// Γ = E_cm/M = sqrt(1 + 2ν(γ − 1)).
    pub fn cm_energy_ratio(&self) -> f64 {
        (1.0 + 2.0 * self.nu() * (self.gamma - 1.0)).sqrt()
    }

    /// Magnitude of the LO impulse Q = 2 m1 m2 (2γ² − 1)/(b sqrt(γ² − 1)) (Westpfahl 1985, Fortschr. Phys. 33, 417).
    pub fn impulse(&self) -> f64 {
        let g = self.gamma;
        2.0 * self.m1 * self.m2 * (2.0 * g * g - 1.0) / (self.b * ((g - 1.0) * (g + 1.0)).sqrt())
    }

    /// Velocity V of the CM frame relative to frame A: V = m1 γ v/(m1 γ + m2) (docs/physics/waveform.md §1).
    pub fn cm_velocity(&self) -> f64 {
        self.m1 * self.gamma * self.v() / (self.m1 * self.gamma + self.m2)
    }

    /// The bodies' states in `frame` before the encounter: `[(E_a, v_a along x, y_a)]` for a = 1, 2.
    /// E_a = m_a γ_a; y_a is the line the body moves on (docs/physics/waveform.md §1: in
    /// the CM frame y1 = E2 b/E, y2 = −E1 b/E).
    pub fn bodies(&self, frame: Frame) -> [(f64, f64, f64); 2] {
        match frame {
            Frame::Rest2 => [(self.m1 * self.gamma, self.v(), self.b), (self.m2, 0.0, 0.0)],
            Frame::Cm => {
                let vcm = self.cm_velocity();
                let gv = 1.0 / ((1.0 - vcm) * (1.0 + vcm)).sqrt();
                let v = self.v();
                // Body 1: velocity (v − V)/(1 − vV); energy m1 γ γ_V (1 − vV).
                let v1 = (v - vcm) / (1.0 - v * vcm);
                let e1 = self.m1 * self.gamma * gv * (1.0 - v * vcm);
                let e2 = self.m2 * gv;
                let e = e1 + e2;
                [(e1, v1, e2 * self.b / e), (e2, -vcm, -e1 * self.b / e)]
            }
        }
    }
}

/// Unit direction and polarisation basis for polar angles (θ, φ), polar axis +z (docs/physics/waveform.md §1).
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Basis {
    pub n: [f64; 3],
    pub e_th: [f64; 3],
    pub e_ph: [f64; 3],
}

impl Basis {
    pub fn new(theta: f64, phi: f64) -> Self {
        let (st, ct) = theta.sin_cos();
        let (sp, cp) = phi.sin_cos();
        Basis { n: [st * cp, st * sp, ct], e_th: [ct * cp, ct * sp, -st], e_ph: [-sp, cp, 0.0] }
    }

    /// Polar angles of a unit vector (θ ∈ [0, π], φ ∈ (−π, π]).
    pub fn angles(n: [f64; 3]) -> (f64, f64) {
        let rho = n[0].hypot(n[1]);
        (rho.atan2(n[2]), n[1].atan2(n[0]))
    }

    /// The two symmetric polarisation tensors P₊ = ½(e_θe_θ − e_φe_φ), P× = ½(e_θe_φ + e_φe_θ).
    pub fn pol_tensors(&self) -> [[[f64; 3]; 3]; 2] {
        let mut p = [[[0.0; 3]; 3]; 2];
        for i in 0..3 {
            for j in 0..3 {
                p[0][i][j] = 0.5 * (self.e_th[i] * self.e_th[j] - self.e_ph[i] * self.e_ph[j]);
                p[1][i][j] = 0.5 * (self.e_th[i] * self.e_ph[j] + self.e_ph[i] * self.e_th[j]);
            }
        }
        p
    }
}

/// The map from a frame moving with velocity `vel` along +x relative to frame A (origin event
/// shared, then the origin moved by `a_y` ŷ) back to frame A, for one observer direction.
///
/// For a direction n' in the moving frame: (1, n) ∝ L⁻¹(1, n'), δ = [L⁻¹(1, n')]⁰⁻¹ so that
/// δ(1, n') = L(1, n); u_A = δ (u' − n'_y a_y); D'(h'₊ + i h'×) = δ e^{2iψ} D(h₊ + i h×)
/// (docs/physics/waveform.md §1). ψ is found numerically by boosting m = e_θ + i e_φ of frame A.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct BoostMap {
    /// Direction in frame A (polar angles).
    pub theta_a: f64,
    pub phi_a: f64,
    /// Doppler factor δ.
    pub delta: f64,
    /// cos 2ψ, sin 2ψ.
    pub c2psi: f64,
    pub s2psi: f64,
    /// u_A = delta (u' − shift).
    pub shift: f64,
}

impl BoostMap {
    /// Identity map (frame A itself).
    pub fn identity(theta: f64, phi: f64) -> Self {
        BoostMap { theta_a: theta, phi_a: phi, delta: 1.0, c2psi: 1.0, s2psi: 0.0, shift: 0.0 }
    }

    /// The map for a frame moving with `vel` along x (|vel| < 1) whose origin is displaced by
    /// `a_y` along y, at its direction (θ', φ').
    pub fn new(vel: f64, a_y: f64, theta: f64, phi: f64) -> Self {
        let bp = Basis::new(theta, phi);
        let gv = 1.0 / ((1.0 - vel) * (1.0 + vel)).sqrt();
        // L⁻¹ (1, n'): t = γ(1 + V n'_x), x = γ(n'_x + V).
        let k0 = gv * (1.0 + vel * bp.n[0]);
        let delta = 1.0 / k0;
        let na = [gv * (bp.n[0] + vel) * delta, bp.n[1] * delta, bp.n[2] * delta];
        let norm = (na[0] * na[0] + na[1] * na[1] + na[2] * na[2]).sqrt();
        let na = [na[0] / norm, na[1] / norm, na[2] / norm];
        let (theta_a, phi_a) = Basis::angles(na);
        let ba = Basis::new(theta_a, phi_a);
        // Spatial part of L m for m = (0, e_θ + i e_φ): (γ m_x, m_y, m_z).
        let lre = [gv * ba.e_th[0], ba.e_th[1], ba.e_th[2]];
        let lim = [gv * ba.e_ph[0], ba.e_ph[1], ba.e_ph[2]];
        let dot = |a: [f64; 3], b: [f64; 3]| a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
        // e^{iα} = (Lm)·(e_θ' − i e_φ')/2.
        let re = 0.5 * (dot(lre, bp.e_th) + dot(lim, bp.e_ph));
        let im = 0.5 * (dot(lim, bp.e_th) - dot(lre, bp.e_ph));
        let r = re.hypot(im);
        let (ca, sa) = (re / r, im / r);
        // ψ = −α: cos 2ψ = cos²α − sin²α, sin 2ψ = −2 sin α cos α.
        let c2psi = ca * ca - sa * sa;
        let s2psi = -2.0 * sa * ca;
        BoostMap { theta_a, phi_a, delta, c2psi, s2psi, shift: bp.n[1] * a_y }
    }

    /// Frame-A retarded time for moving-frame u'.
    pub fn u_a(&self, u: f64) -> f64 {
        self.delta * (u - self.shift)
    }

    /// Applies δ e^{2iψ} to a frame-A pair (h₊, h×) (scale = δ for h, δ² for ḣ).
    pub fn rotate(&self, h: [f64; 2], scale: f64) -> [f64; 2] {
        [scale * (self.c2psi * h[0] - self.s2psi * h[1]), scale * (self.s2psi * h[0] + self.c2psi * h[1])]
    }
}
