#!/usr/bin/env python3
"""Independent high-precision references for chiwave-core's encounter module.

mpmath 1.3.0, mp.dps = 40.  Run:  python3 tests/reference/encounter_mpmath.py

Every value here is computed by a method independent of the Rust code path:
  * E(gamma) of Herrmann, Parra-Martinez, Ruf, Zeng 2021 (arXiv:2101.07255)
    evaluated in 40-digit arithmetic (no cancellation problem), and its small-velocity series
    obtained by Cauchy-integral Taylor coefficients (mp.taylor, method='quad').
  * I(v) of Damour 2020 (arXiv:2010.01641) and Cbar(gamma) (Bern et al. 2019, arXiv:1901.04424, in the
    mass-polynomial form of Damour 2020, arXiv:1912.02139) in 40 digits.
  * Test-body Schwarzschild scattering angle by tanh-sinh quadrature of the raw orbit integral
    (roots from mp.polyroots), not the factorised/sinh-substituted form used in Rust.
  * Darwin (relativistic Coulomb, test charge) angle by quadrature of the raw orbit integral.
The Rust tests quote these numbers with this file named beside them.
"""
from mpmath import mp, mpf, sqrt, log, acosh, atanh, asinh, pi, quad, polyroots, taylor, nstr

mp.dps = 40


def E_closed(g):
    g = mpf(g)
    p = sqrt(g * g - 1)
    f1 = (210*g**6 - 552*g**5 + 339*g**4 - 912*g**3 + 3148*g**2 - 3336*g + 1151) / (48 * p**3)
    f2 = -(35*g**4 + 60*g**3 - 150*g**2 + 76*g - 5) / (8 * p)
    f3 = (2*g**2 - 3) * (35*g**4 - 30*g**2 + 11) / (16 * p**3)
    return pi * (f1 + f2 * log((g + 1) / 2) + f3 * g * acosh(g) / p)


def E_of_v_over_pi_v(v):
    """E/(pi v) written in v (analytic in the disc |v| < 1, removable point at 0)."""
    g = 1 / sqrt(1 - v * v)
    p = g * v
    f1 = (210*g**6 - 552*g**5 + 339*g**4 - 912*g**3 + 3148*g**2 - 3336*g + 1151) / (48 * p**3)
    f2 = -(35*g**4 + 60*g**3 - 150*g**2 + 76*g - 5) / (8 * p)
    f3 = (2*g**2 - 3) * (35*g**4 - 30*g**2 + 11) / (16 * p**3)
    return (f1 + f2 * log((g + 1) / 2) + f3 * atanh(v) / v) / v


def I_closed(v):
    v = mpf(v)
    return -mpf(16) / 3 + 2 / v**2 + 2 * (3 * v**2 - 1) / v**3 * atanh(v)


def Cbar(g):
    g = mpf(g)
    p = sqrt(g * g - 1)
    return mpf(2) / 3 * g * (14 * g**2 + 25) + 4 * (4*g**4 - 12*g**2 - 3) / p * asinh(sqrt((g - 1) / 2))


def jcrit(g):
    g = mpf(g)
    rc = (3*g**2 - 4 + g * sqrt(9*g**2 - 8)) / (2 * (g**2 - 1))
    return sqrt(rc**2 / (rc - 3))


def chi_test_body(g, j):
    """chi = 2 int_0^{u0} du / sqrt(P(u)) - pi, P = [g^2 - (1-2u)(1+j^2 u^2)]/j^2 (Chandrasekhar 1983, ch. 3)."""
    g, j = mpf(g), mpf(j)
    P = lambda u: (g**2 - (1 - 2*u) * (1 + j**2 * u**2)) / j**2
    roots = polyroots([2, -1, 2 / j**2, (g**2 - 1) / j**2], maxsteps=200, extraprec=200)
    pos = sorted([r.real for r in roots if abs(r.imag) < mpf(10)**-30 and r.real > 0])
    u0 = pos[0]
    return (2 * quad(lambda u: 1 / sqrt(P(u)), [0, u0]) - pi).real  # drop ~1e-20 imaginary rounding at the root


def chi_darwin_quad(g, kappa):
    """Test charge (m = 1) in a fixed Coulomb field k/r, k = kappa J, J = p b (b = 1):
    (du/dphi)^2 = [p^2 - 2 g k u - (J^2 - k^2) u^2]/J^2 (Landau & Lifshitz, Classical Theory of Fields, sec. 39); chi = Dphi - pi."""
    g, kappa = mpf(g), mpf(kappa)
    p = sqrt(g * g - 1)
    J = p
    k = kappa * J
    a, bb, c = -(J**2 - k**2), -2 * g * k, p**2
    if a == 0:
        u0 = -c / bb
    else:
        d = sqrt(bb * bb - 4 * a * c)
        cands = [(-bb + d) / (2 * a), (-bb - d) / (2 * a)]
        u0 = min([r for r in cands if r > 0])
    return (2 * quad(lambda u: J / sqrt(c + bb * u + a * u * u), [0, u0]) - pi).real


if __name__ == "__main__":
    print("# E(gamma)/pi = sum_k A[k] v^(2k+1): Cauchy-integral Taylor coefficients (mp.taylor, quad, radius 0.5)")
    cs = taylor(lambda w: E_of_v_over_pi_v(sqrt(w)) if w != 0 else E_of_v_over_pi_v(mpf(10)**-30), 0, 23,
                method='quad', radius=mpf(1) / 2)
    for k, c in enumerate(cs):
        print(f"    {nstr(c, 25)},  // v^{2*k+1}")
    print("# E(gamma) closed form, 40 digits")
    for g in ["1.0000005", "1.0001", "1.01", "1.05", "1.1", "1.5", "2", "10", "100"]:
        print(f"E({g}) = {nstr(E_closed(g), 22)}")
    print("# I(v) closed form, 40 digits")
    for v in ["0.001", "0.05", "0.3", "0.5", "0.9", "0.99"]:
        print(f"I({v}) = {nstr(I_closed(v), 22)}")
    v = mpf("0.3")
    print(f"E(v=0.3) = {nstr(E_closed(1 / sqrt(1 - v * v)), 22)}")
    print("# Cbar(gamma)")
    for g in ["1.000001", "1.01", "1.5", "3"]:
        print(f"Cbar({g}) = {nstr(Cbar(g), 22)}")
    print("# critical j (test body) and exact test-body angle by raw quadrature")
    for g in ["1.1", "1.5", "2", "10"]:
        print(f"jcrit({g}) = {nstr(jcrit(g), 22)}")
    for g, j in [("1.1", "20"), ("1.5", "10"), ("2", "12"), ("10", "60"), ("1.5", "100"), ("1.01", "8")]:
        print(f"chi_test_body(g={g}, j={j}) = {nstr(chi_test_body(g, j), 22)}")
    print("# Darwin test-charge angle by raw quadrature")
    for g, k in [("1.5", "-0.3"), ("1.5", "0.3"), ("1.2", "-0.9"), ("3", "1.5"), ("1.05", "0.02")]:
        print(f"chi_darwin(g={g}, kappa={k}) = {nstr(chi_darwin_quad(g, k), 22)}")
