"""Reference values for chiwave-core's encounter::capture (capture by gravitational radiation).

Independent of the Rust code paths:
* Hansen's I(e) (Hansen 1972, Phys. Rev. D 5, 1021) as mpmath quadrature of the angular form of
  the Peters & Mathews 1963 quadrupole power, I(e) = int (1 + e cos phi)^2 [12 (1 + e cos phi)^2
  + e^2 sin^2 phi] dphi over |phi| < arccos(-1/e); its closed form, I(1) and I'(1) from sympy.
* The relativistic capture impact parameter b_max (Hansen energy times the velocity factor of the
  O(G^3) radiated energy E(gamma) of Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255,
  evaluated from its closed form at high precision) found with mpmath.findroot, beside the
  Newtonian parabolic closed form (340 pi nu/3)^(1/7) v^(-9/7) (O'Leary, Kocsis & Loeb 2009,
  arXiv:0807.2638).
Run: python3 tests/reference/capture_mpmath.py   (mpmath 1.3, sympy 1.14, mp.dps = 50)
"""
import mpmath as mp
import sympy as sp

mp.mp.dps = 50

e_s, phi_s = sp.symbols("e phi", positive=True)
u = 1 + e_s * sp.cos(phi_s)
G = sp.integrate(sp.expand(u**2 * (12 * u**2 + e_s**2 * sp.sin(phi_s) ** 2)), phi_s)
I_closed = sp.simplify(sp.expand_trig(2 * (G.subs(phi_s, sp.acos(-1 / e_s)) - G.subs(phi_s, 0))))
print("I(e) closed form (sympy):", I_closed)
print("I(1) =", sp.nsimplify(sp.limit(I_closed, e_s, 1)), "  I'(1) =", sp.simplify(sp.limit(sp.diff(I_closed, e_s), e_s, 1, "+")))


def hansen_quad(e):
    e = mp.mpf(e)
    p0 = mp.acos(-1 / e)
    f = lambda p: (1 + e * mp.cos(p)) ** 2 * (12 * (1 + e * mp.cos(p)) ** 2 + e**2 * mp.sin(p) ** 2)
    return 2 * mp.quad(f, [0, p0 / 2, p0])


for e in ["1", "1.000001", "1.01", "1.5", "3", "10", "1000"]:
    print(f"I(e={e}) by quadrature = {mp.nstr(hansen_quad(e), 25)}")


def e_herrmann(g):
    g = mp.mpf(g)
    p = mp.sqrt(g * g - 1)
    f1 = (210*g**6 - 552*g**5 + 339*g**4 - 912*g**3 + 3148*g**2 - 3336*g + 1151) / (48 * p**3)
    f2 = -(35*g**4 + 60*g**3 - 150*g**2 + 76*g - 5) / (8 * p)
    f3 = (2*g**2 - 3) * (35*g**4 - 30*g**2 + 11) / (16 * p**3)
    return mp.pi * (f1 + f2 * mp.log((g + 1) / 2) + f3 * g * mp.acosh(g) / p)


def b_max_rel(v, nu):
    v, nu = mp.mpf(v), mp.mpf(nu)
    g = 1 / mp.sqrt(1 - v * v)
    big = mp.sqrt(1 + 2 * nu * (g - 1))
    cfac = e_herrmann(g) / (big * 37 * mp.pi / 15 * v)
    kin = big - 1

    def margin(lnb):
        b = mp.e**lnb
        x = b * v * v
        e = mp.sqrt(1 + x * x)
        return mp.log(mp.mpf(8) / 15 * nu**2 * hansen_quad(e) / (b * v) ** 7 * cfac / kin)

    b0 = (340 * mp.pi * nu / 3) ** (mp.mpf(1) / 7) * v ** (-mp.mpf(9) / 7)
    return mp.e ** mp.findroot(margin, mp.log(b0)), b0


for v, nu in [("1e-3", "0.25"), ("0.01", "0.25"), ("0.1", "0.25"), ("0.3", "0.25"), ("0.01", "0.09")]:
    br, bn = b_max_rel(v, nu)
    print(f"v={v} nu={nu}: b_max_rel = {mp.nstr(br, 20)}  b_max_newtonian = {mp.nstr(bn, 20)}")
