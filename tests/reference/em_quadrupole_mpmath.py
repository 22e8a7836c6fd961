#!/usr/bin/env python3
"""Electric-quadrupole energy of two charges with equal charge-to-mass ratio on the
straight-line encounter, for the low-velocity test of crates/chiwave-core/tests/em_waveform.rs.

With q1/m1 = q2/m2 = k the electric dipole moment moves uniformly and the magnetic dipole is
(k/2) L (constant), so the leading radiation is electric quadrupole:
    E = (1/180) ∫ dt (d³Q_ij/dt³)²,  Q_ij = Σ q (3 x_i x_j − r² δ_ij) = k μ (3 r_i r_j − r² δ_ij)
(Landau & Lifshitz, The Classical Theory of Fields, §71, Gaussian units, c = 1; recalled),
with the relative orbit r = (v t, b, 0) + first-order deflection, r̈ = (q1 q2/μ) r/r³.
Prints E / (E_dipole-free parts · v²), where the parts are the nonrelativistic per-body
energies π (q1 q2)² ((q1/m1)² + (q2/m2)²)/(3 v b³).
Run: python3 tests/reference/em_quadrupole_mpmath.py   (mpmath 1.3.0, mp.dps = 30)
"""
import mpmath as mp

mp.mp.dps = 30
v = mp.mpf('0.001')
q1, q2, m1, m2, b = 1, 2, 1, 2, 1
k = mp.mpf(q1) / m1
mu = mp.mpf(m1 * m2) / (m1 + m2)
C = q1 * q2 / mu


def q3sq(t):
    r = mp.matrix([v * t, b, 0])
    vv = mp.matrix([v, 0, 0])
    rn = mp.sqrt(v * v * t * t + b * b)
    a = C * r / rn**3
    ad = C * (vv / rn**3 - 3 * r * (v * v * t) / rn**5)
    tr = 2 * ((ad.T * r)[0] + 3 * (a.T * vv)[0])
    s = 0
    for i in range(3):
        for j in range(3):
            q = k * mu * (3 * (ad[i] * r[j] + r[i] * ad[j] + 3 * a[i] * vv[j] + 3 * vv[i] * a[j])
                          - (tr if i == j else 0))
            s += q * q
    return s


E = mp.quad(q3sq, [-mp.inf, 0, mp.inf]) / 180
parts = mp.pi * (q1 * q2)**2 * ((mp.mpf(q1) / m1)**2 + (mp.mpf(q2) / m2)**2) / (3 * v * b**3)
print("E_quadrupole / (parts * v^2) =", mp.nstr(E / parts / v**2, 20))
