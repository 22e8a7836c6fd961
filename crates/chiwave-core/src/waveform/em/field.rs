//! The time-domain radiation field D·E of the two charges at the observer (the analogue of the
//! gravitational `kernel.rs`).

use super::system::{accel1, accel2, Dir, EmSystem};
use serde::Serialize;

/// D·E at the observer, components along e_θ and e_φ, one entry per requested u.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct EmField {
    pub e_theta: Vec<f64>,
    pub e_phi: Vec<f64>,
}

/// The two bodies' radiation fields D·E separately: `[body 1, body 2]`.
///
/// # Formula
/// Liénard–Wiechert radiation field (Jackson 1999, §14.1):
/// D E1 = q1 n × ((n − v) × a1)/(1 − n·v)³ at the retarded time t = (u + n_y b)/(1 − n_x v),
/// D E2 = q2 n × (n × a2(u)), with the first-order accelerations of the module docs.
///
/// # Domain
/// Any θ, φ and finite u. Non-finite entries give NaN at that index.
pub fn field_parts(sys: &EmSystem, theta: f64, phi: f64, u: &[f64]) -> [EmField; 2] {
    let d = Dir::from_angles(sys, theta, phi);
    let v = sys.v();
    let k3 = d.kappa * d.kappa * d.kappa;
    let (c1t, c2t) = d.coefficients(v, 0);
    let (c1p, c2p) = d.coefficients(v, 1);
    let mut f1 = EmField { e_theta: Vec::with_capacity(u.len()), e_phi: Vec::with_capacity(u.len()) };
    let mut f2 = EmField { e_theta: Vec::with_capacity(u.len()), e_phi: Vec::with_capacity(u.len()) };
    for &ui in u {
        let tr = (ui + d.n[1] * sys.b) / d.kappa;
        let a1 = accel1(sys, v, tr);
        let a2 = accel2(sys, v, ui);
        f1.e_theta.push(sys.q1 * (c1t[0] * a1[0] + c1t[1] * a1[1]) / k3);
        f1.e_phi.push(sys.q1 * (c1p[0] * a1[0] + c1p[1] * a1[1]) / k3);
        f2.e_theta.push(sys.q2 * (c2t[0] * a2[0] + c2t[1] * a2[1]));
        f2.e_phi.push(sys.q2 * (c2p[0] * a2[0] + c2p[1] * a2[1]));
    }
    [f1, f2]
}

/// The total O(q1 q2) radiation field D·E = D (E1 + E2) at the observer (interference included).
///
/// # Formula
/// See [`field_parts`]; this is their sum. Body 1's pulse is centred at u = −n_y b with
/// duration ~(1 − n_x v) b/v, body 2's at u = 0 with duration ~b/(γ v).
///
/// # Domain
/// Any θ, φ; finite u (non-finite entries give NaN at that index).
///
/// # Limits
/// |u| → ∞: the field falls off like 1/u² (the x-accelerations); m2 → ∞ leaves body 1's
/// field alone (test-charge limit of body 2).
///
/// # Examples
/// ```
/// use chiwave_core::waveform::em::{field, EmSystem};
/// let s = EmSystem::new(1.0, 1.0, 1.0, 1.0, 2.0, 1.0).unwrap();
/// // Face-on observer (θ = 0, φ = 0) at u = 0: D E = −(q1 a1/(1)³ + q2 a2), only y survives
/// // in e_φ. a1_y = 1/(γ b²) = 0.5, a2_y = −γ/b² = −2 → D E_φ = −(0.5 − 2) = 1.5.
/// let f = field(&s, 0.0, 0.0, &[0.0]);
/// assert!((f.e_phi[0] - 1.5).abs() < 1e-14);
/// assert!(f.e_theta[0].abs() < 1e-14);
/// ```
pub fn field(sys: &EmSystem, theta: f64, phi: f64, u: &[f64]) -> EmField {
    let [mut f1, f2] = field_parts(sys, theta, phi, u);
    for (a, b) in f1.e_theta.iter_mut().zip(&f2.e_theta) {
        *a += b;
    }
    for (a, b) in f1.e_phi.iter_mut().zip(&f2.e_phi) {
        *a += b;
    }
    f1
}
