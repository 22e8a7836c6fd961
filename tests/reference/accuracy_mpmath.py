#!/usr/bin/env python3
"""Reference values for the accuracy batteries, crates/chiwave-core/tests/*_accuracy.rs
(mpmath 1.3, mp.dps = 40). Every value comes from a method independent of the Rust code path:

  * Schwarzschild alpha: Darwin's closed form with mpmath's ellipk/ellipf (deflection_mpmath.py),
    cross-checked here by the theta-form quadrature (quad_a) to 1e-25.
  * Test-body (nu -> 0) scattering angle: raw orbit integral by tanh-sinh quadrature with the
    roots from polyroots (encounter_mpmath.py), split at the turning point's neighbourhood.
  * Darwin's test-charge angle: raw orbit integral (encounter_mpmath.py).
  * Two-body PM angle through 3PM (the reference "truth" at large j, where the 4PM term is
    below the printed tolerance): chi/2 = sum chi_n/j^n with chi_1 = (2g^2-1)/p,
    chi_2 = (3 pi/8)(5g^2-1)/h (Westpfahl 1985; Damour 2018, arXiv:1710.10599),
    chi_3 = chi_3^Schw - 2 nu p Cbar/h^2 + nu (2g^2-1)^2 I(v)/h^2 (Bern et al. 2019,
    arXiv:1901.04424, in the form of Damour 2019, arXiv:1912.02139; radiation reaction Damour 2020,
    arXiv:2010.01641), in 40 digits, with the test-body 4PM coefficient
    chi_4^Schw = (105 pi/128)(33 g^4 - 18 g^2 + 1) printed to bound the omitted term.
  * Quadrupole energy radiated along a Newtonian hyperbola: the Peters & Mathews (1963) power
    P = (8/15) M^2 mu^2 (12 v^2 - 11 rdot^2)/r^4 (G = c = 1) integrated over time in the eccentric
    anomaly eta (the Rust code integrates over the true anomaly instead).
Run: python3 tests/reference/accuracy_mpmath.py
"""
import mpmath as mp
from deflection_mpmath import darwin, quad_a
from encounter_mpmath import Cbar, I_closed, jcrit, chi_darwin_quad

mp.mp.dps = 40
BC = 3 * mp.sqrt(3)


def chi_test_body(g, j):
    """Raw orbit integral chi = 2 int_0^{u0} du/sqrt(P(u)) - pi with P as in encounter_mpmath.py,
    the interval split near u0 so that tanh-sinh resolves the near-capture peak."""
    g, j = mp.mpf(g), mp.mpf(j)
    P = lambda u: (g**2 - (1 - 2*u) * (1 + j**2 * u**2)) / j**2
    roots = mp.polyroots([2, -1, 2 / j**2, (g**2 - 1) / j**2], maxsteps=400, extraprec=400)
    pos = sorted([r.real for r in roots if abs(r.imag) < mp.mpf(10)**-30 and r.real > 0])
    if not pos:
        return None
    u0 = pos[0]
    cuts = [0] + [u0 * (1 - mp.mpf(10)**-k) for k in range(1, 12)] + [u0]
    return (2 * mp.quad(lambda u: 1 / mp.sqrt(P(u)), cuts) - mp.pi).real


def pm3(g, nu, j):
    g, nu, j = mp.mpf(g), mp.mpf(nu), mp.mpf(j)
    p = mp.sqrt(g * g - 1)
    v = p / g
    h = mp.sqrt(1 + 2 * nu * (g - 1))
    c1 = (2 * g * g - 1) / p
    c2 = 3 * mp.pi / 8 * (5 * g * g - 1) / h
    c3s = (64 * p**6 + 72 * p**4 + 12 * p**2 - 1) / (3 * p**3)
    c3 = c3s - 2 * nu * p * Cbar(g) / h**2 + nu * (2 * g * g - 1)**2 * I_closed(v) / h**2
    c4s = 105 * mp.pi / 128 * (33 * g**4 - 18 * g**2 + 1)
    pm = [2 * c1 / j, 2 * c1 / j + 2 * c2 / j**2, 2 * c1 / j + 2 * c2 / j**2 + 2 * c3 / j**3]
    return pm, 2 * c4s / (h**3 * j**4)


def e_quad_hyperbola(v, b, nu):
    M = mp.mpf(1)
    v, b, nu = mp.mpf(v), mp.mpf(b), mp.mpf(nu)
    a = M / v**2
    e = mp.sqrt(1 + (b * v * v / M)**2)
    n0 = mp.sqrt(M / a**3)

    def f(eta):
        ch, sh = mp.cosh(eta), mp.sinh(eta)
        r = a * (e * ch - 1)
        v2 = M * (2 / r + 1 / a)
        rdot = a * e * sh * n0 / (e * ch - 1)
        return mp.mpf(8) / 15 * M**2 * nu**2 / r**4 * (12 * v2 - 11 * rdot**2) * (e * ch - 1) / n0

    # the burst lasts |eta| ~ 1/e around periapsis, the tail out to eta ~ ln e
    pts = sorted(set([mp.mpf(0)] + [mp.mpf(10)**k / e for k in range(-1, 4)] + [mp.log(e) + k for k in range(0, 8)]))
    return 2 * mp.quad(f, pts + [mp.inf])


if __name__ == "__main__":
    print("# Schwarzschild alpha at b = b_c (1 + d): Darwin (ellipk/ellipf) and |Darwin - quad_a|")
    for d in ["1e-6", "1e-4", "1e-3", "1e-2", "0.05", "0.1", "0.2", "0.3", "0.4"]:
        b = BC * (1 + mp.mpf(d))
        a = darwin(b)
        print(f"d = {d}: alpha = {mp.nstr(a, 22)}  (quad_a diff {mp.nstr(abs(a - quad_a(b)), 3)})")
    # The Sun: b = R_sun / (GM_sun/c^2), IAU 2015 nominal R = 6.957e8 m, GM = 1.3271244e20 m^3/s^2.
    msun_len = mp.mpf("1.3271244e20") / mp.mpf(299792458)**2
    b_sun = mp.mpf("6.957e8") / msun_len
    print(f"Sun: b/M = {mp.nstr(b_sun, 22)}, d = {mp.nstr(b_sun / BC - 1, 22)}, alpha = {mp.nstr(darwin(b_sun), 22)}")
    print("# test-body angle, raw quadrature: (gamma, j/jcrit, j, chi)")
    for g in ["1.01", "1.09", "1.5", "3", "10"]:
        jc = jcrit(g)
        for f in ["1.01", "1.1", "1.5", "2", "3", "5", "10", "30", "100", "1000"]:
            j = jc * mp.mpf(f)
            print(f"    ({g}, {f}, {mp.nstr(j, 20)}, {mp.nstr(chi_test_body(g, j), 20)}),")
    print("# two-body 3PM angle at large j: (gamma, nu, j, pm1, pm2, pm3, |4PM test-body term|/h^3)")
    for g, nu, j in [("1.05", "0.25", "300"), ("1.5", "0.25", "200"), ("1.5", "0.1875", "1000"), ("3", "0.25", "500"), ("1.2", "0.1", "100")]:
        pm, t4 = pm3(g, nu, j)
        print(f"    ({g}, {nu}, {j}, {mp.nstr(pm[0], 20)}, {mp.nstr(pm[1], 20)}, {mp.nstr(pm[2], 20)}, {mp.nstr(t4, 6)}),")
    print("# Darwin test-charge angle, raw quadrature: (gamma, kappa, chi)")
    for g, k in [("1.5", "-0.01"), ("1.5", "-0.1"), ("1.5", "-0.5"), ("1.1", "0.05"), ("2", "0.3"), ("1.05", "-0.9")]:
        print(f"    ({g}, {k}, {mp.nstr(chi_darwin_quad(g, k), 20)}),")
    print("# quadrupole energy of the Newtonian hyperbola, E/(M c^2): (v, b v^2, nu, E)")
    for v in ["0.001", "0.0033"]:
        for x in ["10000", "1000", "100", "30", "10", "5", "3"]:
            b = mp.mpf(x) / mp.mpf(v)**2
            print(f"    ({v}, {x}, 0.25, {mp.nstr(e_quad_hyperbola(v, b, mp.mpf('0.25')), 20)}),")
