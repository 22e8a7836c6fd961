//! Impulse (momentum kick) of body 1 through O(G³), conservative and radiative
//! (construction: docs/physics/encounter.md §4).
//!
//! Δp₁^μ = c_b b̂^μ + c_u1 u₁^μ + c_u2 u₂^μ, mostly-minus metric, b̂ the unit spacelike vector
//! from body 2 to body 1 orthogonal to u₁ and u₂ (attraction: c_b < 0). Units: M c with
//! M = m1 + m2, G = c = 1, b in GM/c².
//!
//! Sources: Westpfahl 1985 and Kosower, Maybee, O'Connell 2018, arXiv:1811.10950 (LO, NLO
//! transverse); transverse O(G³) from p sin χ with the 3PM angle (Bern et al. 2019,
//! arXiv:1901.04424; Damour 2020, arXiv:2010.01641); longitudinal parts re-derived from the
//! on-shell conditions (docs/physics/encounter.md §4; the radiative part follows from
//! P_rad^μ ∝ u₁ + u₂ of Herrmann et al. 2021, arXiv:2101.07255).

use serde::Serialize;

/// Covariant coefficients of Δp₁ (units of M c).
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Default)]
pub struct Covariant {
    pub c_b: f64,
    pub c_u1: f64,
    pub c_u2: f64,
}

/// Conservative and radiative coefficients and their sum.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CovariantSplit {
    pub conservative: Covariant,
    /// Radiation-reaction part: transverse from χ₃^rad, longitudinal from P_rad (O(G³)).
    pub radiative: Covariant,
    pub total: Covariant,
}

/// Frame components of Δp₁ (units of M c): transverse along b̂, longitudinal along body 1's
/// incoming momentum, and energy.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Components {
    pub transverse: f64,
    pub longitudinal: f64,
    pub energy: f64,
}

/// Δp₁ in the CM frame and in the initial rest frame of body 2.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct Frames {
    pub cm: Components,
    pub rest2: Components,
}

/// Inputs the impulse needs (all in units M = 1).
#[derive(Debug, Clone, Copy)]
pub struct ImpulseInput {
    pub m1: f64,
    pub m2: f64,
    pub gamma: f64,
    pub p_inf: f64,
    /// CM momentum p = ν p∞/h.
    pub p_cm: f64,
    /// h = E/M.
    pub h: f64,
    pub b: f64,
    pub j: f64,
    /// χ₁, χ₂, χ₃^cons, χ₃^rad of χ/2 = Σ χ_n/jⁿ.
    pub chi: [f64; 4],
    /// u₂·P_rad = G³ m1² m2² E(γ)/b³ (0 for no radiation).
    pub eps_rad: f64,
}

impl ImpulseInput {
    /// The inputs for the kinematics `k`, the angle coefficients `chi` and the radiated `eps_rad`.
    pub fn new(k: &crate::two_body::Kinematics, chi: [f64; 4], eps_rad: f64) -> Self {
        let s = &k.speed;
        ImpulseInput { m1: k.m1, m2: k.m2, gamma: s.gamma, p_inf: s.p_inf, p_cm: k.p_cm, h: k.h, b: k.b_over_gm, j: k.j, chi, eps_rad }
    }
}

/// Covariant impulse coefficients through O(G³).
///
/// # Formula
/// Q₁ = 2 m1 m2 (2γ² − 1)/(p∞ b), Q₂ = (3π/4)(5γ² − 1) m1 m2/(p∞ b²) (M = 1),
/// Q₃ = p [2χ₃ − (2χ₁)³/6]/j³ (from p sin χ). c_b = −(Q₁ + Q₂ + Q₃).
/// Conservative longitudinal: c_u1 = −K(γ m1 + m2), c_u2 = +K(γ m2 + m1),
/// K = (Q₁² + 2Q₁Q₂)/(2 m1 m2 p∞²). Radiative: c_u1 += −γ ε/p∞², c_u2 += ε/p∞², ε = u₂·P_rad
/// (docs/physics/encounter.md §4).
pub fn covariant(inp: &ImpulseInput) -> CovariantSplit {
    use std::f64::consts::PI;
    let ImpulseInput { m1, m2, gamma: g, p_inf, p_cm, b, j, chi, eps_rad, .. } = *inp;
    let mm = m1 * m2;
    let q1 = 2.0 * mm * (2.0 * g * g - 1.0) / (p_inf * b);
    let q2 = 0.75 * PI * (5.0 * g * g - 1.0) * mm / (p_inf * b * b);
    let j3 = j * j * j;
    let q3c = p_cm * (2.0 * chi[2] - (2.0 * chi[0]).powi(3) / 6.0) / j3;
    let q3r = p_cm * 2.0 * chi[3] / j3;
    let k = (q1 * q1 + 2.0 * q1 * q2) / (2.0 * mm * p_inf * p_inf);
    let conservative = Covariant { c_b: -(q1 + q2 + q3c), c_u1: -k * (g * m1 + m2), c_u2: k * (g * m2 + m1) };
    let radiative = Covariant { c_b: -q3r, c_u1: -g * eps_rad / (p_inf * p_inf), c_u2: eps_rad / (p_inf * p_inf) };
    let total = Covariant {
        c_b: conservative.c_b + radiative.c_b,
        c_u1: conservative.c_u1 + radiative.c_u1,
        c_u2: conservative.c_u2 + radiative.c_u2,
    };
    CovariantSplit { conservative, radiative, total }
}

/// Frame components of Δp₁ from covariant coefficients (docs/physics/encounter.md §4).
///
/// # Formula
/// CM: u₁ = (E₁/m1, +p e/m1), u₂ = (E₂/m2, −p e/m2), E_a = (m_a² + m1 m2 γ)/E:
/// ΔE₁ = c_u1 E₁/m1 + c_u2 E₂/m2, Δp_∥ = (c_u1/m1 − c_u2/m2) p, Δp_⊥ = c_b.
/// Rest frame of body 2: u₂ = (1, 0), u₁ = (γ, p∞ e): ΔE₁ = γ c_u1 + c_u2, Δp_∥ = p∞ c_u1.
pub fn frames(c: &Covariant, inp: &ImpulseInput) -> Frames {
    let (m1, m2, g) = (inp.m1, inp.m2, inp.gamma);
    let e = inp.h;
    let e1 = (m1 * m1 + m1 * m2 * g) / e;
    let e2 = (m2 * m2 + m1 * m2 * g) / e;
    let cm = Components {
        transverse: c.c_b,
        longitudinal: (c.c_u1 / m1 - c.c_u2 / m2) * inp.p_cm,
        energy: c.c_u1 * e1 / m1 + c.c_u2 * e2 / m2,
    };
    let rest2 = Components { transverse: c.c_b, longitudinal: inp.p_inf * c.c_u1, energy: g * c.c_u1 + c.c_u2 };
    Frames { cm, rest2 }
}
