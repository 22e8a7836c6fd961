//! The two-charge system in frame A, validated ([`EmSystem`]), observer directions with their
//! transverse bases, and the first-order accelerations of the two bodies.

use crate::error::{finite, positive, InputError};
use crate::validity::Flag;
use serde::Serialize;
use std::f64::consts::{FRAC_PI_4, PI};

/// Largest relative Lorentz factor accepted by [`EmSystem::new`].
///
/// Above it the forward beaming cone (angle ~1/γ) and the forward pulse (duration ~b/(γ² v))
/// need more sphere nodes than the fixed rules of [`energies`](super::energies) and [`spectrum_integrated`](super::spectrum_integrated)
/// use; the accuracy of those rules is tested up to this value.
pub const GAMMA_MAX: f64 = 1.0e3;

/// A two-charge scattering system in frame A (rest frame of body 2), Gaussian units, c = 1.
///
/// Build it with [`EmSystem::new`], which validates the fields; the functions of this module
/// assume a validated system (a hand-built one with NaN or out-of-range fields gives NaN).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct EmSystem {
    /// Mass of the moving body 1 (> 0).
    pub m1: f64,
    /// Mass of body 2, initially at rest at the origin (> 0).
    pub m2: f64,
    /// Charge of body 1 (Gaussian).
    pub q1: f64,
    /// Charge of body 2 (Gaussian).
    pub q2: f64,
    /// Relative Lorentz factor, 1 < γ ≤ [`GAMMA_MAX`].
    pub gamma: f64,
    /// Impact parameter (> 0), along +y.
    pub b: f64,
}

impl EmSystem {
    /// Validates and builds a system.
    ///
    /// # Domain
    /// m1, m2 > 0; q1, q2 finite with q1 q2 ≠ 0; 1 < γ ≤ [`GAMMA_MAX`]; b > 0. The combination
    /// must keep the field and energy scales (q1 q2/(m1 b²), q1² (q1 q2/m1)²/(v b³) and the
    /// same for body 2) inside the f64 range.
    ///
    /// # Errors
    /// [`InputError::NotFinite`] or [`InputError::OutOfRange`] naming the field (`m1`, `m2`,
    /// `q1`, `q2`, `q1*q2`, `gamma`, `b`) and its allowed range; [`InputError::Inconsistent`]
    /// (field `b`) when the scales overflow or underflow.
    ///
    /// # Examples
    /// ```
    /// use chiwave_core::waveform::em::EmSystem;
    /// let s = EmSystem::new(1.0, 2.0, 0.01, -0.02, 1.5, 1.0).unwrap();
    /// // v = √(γ² − 1)/γ
    /// assert!((s.v() - 0.745_355_992_499_929_9).abs() < 1e-15);
    /// assert!(EmSystem::new(1.0, 2.0, 0.0, 1.0, 1.5, 1.0).is_err());
    /// assert!(EmSystem::new(1.0, 2.0, 1.0, 1.0, 1.0, 1.0).is_err());
    /// ```
    pub fn new(m1: f64, m2: f64, q1: f64, q2: f64, gamma: f64, b: f64) -> Result<Self, InputError> {
        positive("m1", m1)?;
        positive("m2", m2)?;
        finite("q1", q1)?;
        finite("q2", q2)?;
        finite("gamma", gamma)?;
        if !(gamma > 1.0 && gamma <= GAMMA_MAX) {
            return Err(InputError::OutOfRange {
                field: "gamma",
                value: gamma,
                allowed: format!("1 < gamma ≤ {GAMMA_MAX:e} (relative Lorentz factor)"),
            });
        }
        positive("b", b)?;
        let q12 = q1 * q2;
        if q12 == 0.0 || !q12.is_finite() {
            return Err(InputError::OutOfRange {
                field: "q1*q2",
                value: q12,
                allowed: "a finite nonzero product of the charges (a neutral pair does not radiate at this order)"
                    .into(),
            });
        }
        let s = EmSystem { m1, m2, q1, q2, gamma, b };
        let scales = [
            s.k1() / (b * b),
            s.k2() / (b * b),
            s.prefactor1(),
            s.prefactor2(),
            s.body1_energy_closed(),
            s.body2_energy_closed(),
        ];
        if scales.iter().any(|x| !x.is_finite() || *x == 0.0) {
            return Err(InputError::Inconsistent {
                field: "b",
                reason: "the charges, masses and impact parameter give field or energy scales outside the \
                         floating-point range; rescale the units (for example b = 1)"
                    .into(),
            });
        }
        Ok(s)
    }

    /// Relative speed v = √((γ − 1)(γ + 1))/γ (accurate for γ → 1).
    pub fn v(&self) -> f64 {
        ((self.gamma - 1.0) * (self.gamma + 1.0)).sqrt() / self.gamma
    }

    /// 1 − v = 1/(γ² (1 + v)), without cancellation at large γ.
    pub(super) fn one_minus_v(&self) -> f64 {
        1.0 / (self.gamma * self.gamma * (1.0 + self.v()))
    }

    /// q1 q2/m1 (body 1's acceleration scale times b²).
    pub(super) fn k1(&self) -> f64 {
        self.q1 * self.q2 / self.m1
    }

    /// q1 q2/m2 (body 2's acceleration scale times b²).
    pub(super) fn k2(&self) -> f64 {
        self.q1 * self.q2 / self.m2
    }

    /// q1² (q1 q2/m1)²/(v b³): the scale of body 1's energy.
    pub(super) fn prefactor1(&self) -> f64 {
        let a = self.q1 * self.k1();
        (a / self.b) * (a / self.b) / (self.v() * self.b)
    }

    /// q2² (q1 q2/m2)²/(v b³): the scale of body 2's energy.
    pub(super) fn prefactor2(&self) -> f64 {
        let a = self.q2 * self.k2();
        (a / self.b) * (a / self.b) / (self.v() * self.b)
    }

    /// Transverse impulse on body 1 along +y, Δp = 2 q1 q2/(v b).
    ///
    /// # Formula
    /// Δp_y = ∫ q1 E_y dt for the straight line in the Coulomb field of body 2
    /// (Jackson 1999, §13.1, the standard impact-parameter impulse); body 2 receives −Δp.
    /// The same value follows from the boosted Coulomb field of body 1 acting on body 2.
    pub fn impulse(&self) -> f64 {
        2.0 * self.q1 * self.q2 / (self.v() * self.b)
    }

    /// Liénard closed form of the energy radiated by body 1 alone.
    ///
    /// # Formula
    /// E1 = π q1⁴ q2² (1 + 3γ²)/(12 m1² v b³): the time integral of the Liénard power
    /// (2/3) q1² γ⁶ (a² − (v × a)²) (Jackson 1999, §14.2) with the first-order acceleration
    /// a1 = (q1 q2/m1)(v t/γ³, b/γ, 0)/r³ (our derivation; the integral uses
    /// ∫ s² ds/(1 + s²)³ = π/8 and ∫ ds/(1 + s²)³ = 3π/8).
    pub fn body1_energy_closed(&self) -> f64 {
        let g2 = self.gamma * self.gamma;
        PI * (1.0 + 3.0 * g2) / 12.0 * self.prefactor1()
    }

    /// Larmor closed form of the energy radiated by body 2 alone.
    ///
    /// # Formula
    /// E2 = π q1² q2⁴ (1 + 3γ²)/(12 γ m2² v b³): the time integral of (2/3) q2² a2² with
    /// a2 = −(q1 q2/m2) γ (v t, b, 0)/(γ² v² t² + b²)^{3/2} (our derivation).
    pub fn body2_energy_closed(&self) -> f64 {
        let g2 = self.gamma * self.gamma;
        PI * (1.0 + 3.0 * g2) / (12.0 * self.gamma) * self.prefactor2()
    }

    /// Regime flags for the straight-line (first-order) approximation (`em_deflection`,
    /// `em_beaming`; the checks themselves are in the waveform's `flags.rs`), graded at the
    /// default tolerance.
    pub fn flags(&self) -> Vec<Flag> {
        crate::waveform::flags::em_system(self, crate::validity::DEFAULT_TOLERANCE)
    }
}

/// An observer direction with a transverse orthonormal basis and κ = 1 − n_x v computed
/// without cancellation.
#[derive(Debug, Clone, Copy)]
pub(super) struct Dir {
    pub(super) n: [f64; 3],
    pub(super) kappa: f64,
    pub(super) e: [[f64; 3]; 2],
}

impl Dir {
    /// Polar axis +z, basis (e_θ, e_φ) of the module docs.
    pub(super) fn from_angles(sys: &EmSystem, theta: f64, phi: f64) -> Dir {
        let (st, ct) = theta.sin_cos();
        let (sp, cp) = phi.sin_cos();
        // 1 − sin θ cos φ = 2 sin²(π/4 − θ/2) + 2 sin θ sin²(φ/2) (elementary identity).
        let a = (FRAC_PI_4 - 0.5 * theta).sin();
        let c = (0.5 * phi).sin();
        let one_minus_nx = 2.0 * a * a + 2.0 * st * c * c;
        Dir {
            n: [st * cp, st * sp, ct],
            kappa: sys.one_minus_v() + sys.v() * one_minus_nx,
            e: [[ct * cp, ct * sp, -st], [-sp, cp, 0.0]],
        }
    }

    /// Polar axis +y: n = (sin χ cos ψ, n_y, sin χ sin ψ), n_y = cos χ, with the basis
    /// e_χ = (n_y cos ψ, −sin χ, n_y sin ψ), e_ψ = (−sin ψ, 0, cos ψ).
    pub(super) fn from_axis_y(sys: &EmSystem, ny: f64, psi: f64) -> Dir {
        let sc = ((1.0 - ny) * (1.0 + ny)).max(0.0).sqrt();
        let (sp, cp) = psi.sin_cos();
        let h = (0.5 * psi).sin();
        // 1 − sin χ cos ψ = n_y²/(1 + sin χ) + 2 sin χ sin²(ψ/2) (elementary identity).
        let one_minus_nx = ny * ny / (1.0 + sc) + 2.0 * sc * h * h;
        Dir {
            n: [sc * cp, ny, sc * sp],
            kappa: sys.one_minus_v() + sys.v() * one_minus_nx,
            e: [[ny * cp, -sc, ny * sp], [-sp, 0.0, cp]],
        }
    }

    /// Polar axis +x: n = (1 − x, s cos α, s sin α), s = √(x (2 − x)); basis (e_ϑ, e_α).
    pub(super) fn from_axis_x(sys: &EmSystem, x: f64, alpha: f64) -> Dir {
        let s = (x * (2.0 - x)).max(0.0).sqrt();
        let c = 1.0 - x;
        let (sa, ca) = alpha.sin_cos();
        Dir {
            n: [c, s * ca, s * sa],
            kappa: sys.one_minus_v() + sys.v() * x,
            e: [[-s, c * ca, c * sa], [0.0, -sa, ca]],
        }
    }

    /// Coefficients of body 1's (a_x, a_y) and body 2's (a_x, a_y) in D E·e (radiation-field
    /// formulas contracted with a transverse e; the 1/κ³ of body 1 is not included):
    /// n × ((n − v) × a)·e = −(n·a) v e_x − κ a·e, and n × (n × a)·e = −a·e.
    pub(super) fn coefficients(&self, v: f64, k: usize) -> ([f64; 2], [f64; 2]) {
        let e = self.e[k];
        ([-e[0], -(v * self.n[1] * e[0] + self.kappa * e[1])], [-e[0], -e[1]])
    }
}

/// Body 1's acceleration at time t, from the Lorentz force of body 2's static Coulomb field to
/// first order: (q1 q2/m1)(v t/γ³, b/γ, 0)/r³, r² = v²t² + b².
pub(super) fn accel1(sys: &EmSystem, v: f64, t: f64) -> [f64; 2] {
    let r = (v * t).hypot(sys.b);
    let r3 = r * r * r;
    let g = sys.gamma;
    [sys.k1() * v * t / (g * g * g * r3), sys.k1() * sys.b / (g * r3)]
}

/// Body 2's acceleration at time t, from the Lorentz force of body 1's boosted Coulomb field
/// (Jackson 1999, §11.10) to first order: −(q1 q2/m2) γ (v t, b, 0)/(γ² v² t² + b²)^{3/2}.
pub(super) fn accel2(sys: &EmSystem, v: f64, t: f64) -> [f64; 2] {
    let g = sys.gamma;
    let r = (g * v * t).hypot(sys.b);
    let r3 = r * r * r;
    [-sys.k2() * g * v * t / r3, -sys.k2() * g * sys.b / r3]
}
