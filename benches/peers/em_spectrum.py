#!/usr/bin/env python3
"""Peer of chiwave's closed-form electromagnetic spectrum: dE/(dω dΩ) of two scattering charges
at leading order O(q1 q2), one observer direction, on the ω grid of benches/workloads.json
(`em_spectrum`), vectorised over numpy arrays with scipy.special.k0e/k1e.

Frame of body 2 (at rest at the origin); body 1 moves along +x with speed v on the line y = b;
Gaussian units, c = 1; observer n = (sin θ cos φ, sin θ sin φ, cos θ), basis e_θ, e_φ; κ = 1 − n_x v.
Straight lines with their first-order accelerations, the Liénard–Wiechert radiation field
(Jackson 1999, *Classical Electrodynamics*, 3rd ed., §14.1) Fourier-transformed in u with
∫ cos(ks) ds/√(s² + b²) = 2K0(kb) (Gradshteyn & Ryzhik 3.754.2) and its b-derivative:
  k1 = ω κ b/v,  k2 = ω b/(γ v),
  ã1 = (q1 q2/(m1 v b)) (2i k1 K0(k1)/γ³, 2 k1 K1(k1)/γ, 0),
  ã2 = −(q1 q2/(m2 v b)) (2i k2 K0(k2)/γ, 2 k2 K1(k2), 0),
  Ẽ = q1 e^{−iω n_y b} n × ((n − v) × ã1)/κ² + q2 n × (n × ã2),
  dE/(dω dΩ) = (|Ẽ·e_θ|² + |Ẽ·e_φ|²)/(4π²),
with x K_n(x) = x k_ne(x) e^{−x} and the limits x K0(x) → 0, x K1(x) → 1 at ω = 0.
"""
import math

import numpy as np
from scipy.special import k0e, k1e

import common


def spectrum(m1, m2, q1, q2, gamma, b, theta, phi, omega):
    v = math.sqrt((gamma - 1.0) * (gamma + 1.0)) / gamma
    st, ct, sp, cp = math.sin(theta), math.cos(theta), math.sin(phi), math.cos(phi)
    n = np.array([st * cp, st * sp, ct])
    e_th = np.array([ct * cp, ct * sp, -st])
    e_ph = np.array([-sp, cp, 0.0])
    kappa = 1.0 - n[0] * v
    k1 = omega * kappa * b / v
    k2 = omega * b / (gamma * v)
    with np.errstate(invalid="ignore", divide="ignore"):
        xk0_1, xk1_1 = k1 * k0e(k1) * np.exp(-k1), k1 * k1e(k1) * np.exp(-k1)
        xk0_2, xk1_2 = k2 * k0e(k2) * np.exp(-k2), k2 * k1e(k2) * np.exp(-k2)
    zero = omega == 0.0
    for a in (xk0_1, xk0_2):
        a[zero] = 0.0
    for a in (xk1_1, xk1_2):
        a[zero] = 1.0
    s1 = q1 * q2 / (m1 * v * b)
    s2 = q1 * q2 / (m2 * v * b)
    a1 = np.zeros((len(omega), 3), dtype=complex)
    a1[:, 0] = 2j * s1 * xk0_1 / gamma ** 3
    a1[:, 1] = 2.0 * s1 * xk1_1 / gamma
    a2 = np.zeros((len(omega), 3), dtype=complex)
    a2[:, 0] = -2j * s2 * xk0_2 / gamma
    a2[:, 1] = -2.0 * s2 * xk1_2
    n_minus_v = n - np.array([v, 0.0, 0.0])
    e1 = np.cross(n, np.cross(n_minus_v, a1)) * (q1 * np.exp(-1j * omega * n[1] * b) / kappa ** 2)[:, None]
    e2 = q2 * np.cross(n, np.cross(n, a2))
    e = e1 + e2
    return (np.abs(e @ e_th) ** 2 + np.abs(e @ e_ph) ** 2) / (4.0 * math.pi ** 2)


def main():
    args = common.arguments(__doc__.splitlines()[0])
    w = common.workloads()["em_spectrum"]
    ref = common.chiwave_values(args.values)["em_spectrum"]
    omega = common.grid(w["omega"])
    pars = [w[k] for k in ("m1", "m2", "q1", "q2", "gamma", "b", "theta", "phi")]
    val = spectrum(*pars, omega)
    checks = [
        common.check("ω grid", common.max_rel(omega, ref["omega"]), "light_series", "the same grid formula"),
        common.check("dE/(dω dΩ)", common.max_rel(val, ref["value"]), "em_spectrum",
                     "Cephes K0, K1 in both; rounding of the two bodies' interfering fields"),
    ]
    timing = common.time_it(lambda: spectrum(*pars, omega), args.min_runs, args.min_seconds)
    common.report("em_spectrum", "scipy", len(omega), "frequency (one direction)", timing, checks,
                  "scipy.special.k0e/k1e and numpy cross products vectorised over ω")


if __name__ == "__main__":
    main()
