#!/usr/bin/env python3
"""Reference values for crates/chiwave-core/tests/deflection*.rs (mpmath 1.3, mp.dps = 40).

Independent of the Rust code paths:
  * Schwarzschild: Darwin's closed form (Darwin 1959) with mpmath ellipk/ellipf (parameter
    m = k^2), and the theta-form quadrature (docs/physics/deflection.md section 2) with mp.quad,
    which must agree.
  * Kerr equatorial: the Boyer-Lindquist r-integral (Carter 1968 equations) with the cubic
    factored exactly, r = r0 + v^2, mp.quad on [0, inf]  (the Rust code uses a theta-form).
  * Reissner-Nordstrom: the u-integral with P(u) = (u0 - u) H(u) factored, u = u0 - w^2.
  * Weak-field coefficients c_n: the derivation of docs/physics/deflection.md section 3 (I_n integrals + reversion of
    M/b = h sqrt(1 - 2h)), done with mpmath series arithmetic (the Rust code expands the
    theta-integrand instead).
Run: python3 tests/reference/deflection_mpmath.py
"""
import mpmath as mp

mp.mp.dps = 40
M = mp.mpf(1)


def r0_schw(b):
    b = mp.mpf(b)
    return 2 * b / mp.sqrt(3) * mp.cos(mp.acos(-3 * mp.sqrt(3) / b) / 3)


def darwin(b):
    P = r0_schw(b)
    Q = mp.sqrt((P - 2) * (P + 6))
    m = (Q - P + 6) / (2 * Q)
    phi0 = mp.asin(mp.sqrt((Q - P + 2) / (Q - P + 6)))
    return 4 * mp.sqrt(P / Q) * (mp.ellipk(m) - mp.ellipf(phi0, m)) - mp.pi


def quad_a(b):
    h = 1 / r0_schw(b)
    g = lambda t: (1 + t + t * t) / (1 + t)
    return 2 * mp.quad(lambda th: 1 / mp.sqrt(1 - 2 * h * g(mp.sin(th))), [0, mp.pi / 4, mp.pi / 2]) - mp.pi


def kerr(b, a):
    b = mp.mpf(b); a = mp.mpf(a); L = b
    p = a * a - L * L; q = 2 * M * (L - a) ** 2
    # largest root of r^3 + p r + q = 0
    roots = mp.polyroots([1, 0, p, q], maxsteps=200, extraprec=200)
    r0 = max(mp.re(r) for r in roots if abs(mp.im(r)) < mp.mpf(10) ** -30)
    c2 = r0 * r0 + p  # r^3 + p r + q = (r - r0)(r^2 + r0 r + c2)

    def f(v):
        r = r0 + v * v
        R = r * (r * r + r0 * r + c2)  # R/(r - r0)
        Delta = r * r - 2 * M * r + a * a
        return 2 * r * (L * r - 2 * M * (L - a)) / (Delta * mp.sqrt(R))

    return 2 * mp.quad(f, [0, 1, 10, mp.inf]) - mp.pi, r0


def rn(b, Q):
    b = mp.mpf(b); Q = mp.mpf(Q)
    # P(u) = 1/b^2 - u^2 + 2 u^3 - Q^2 u^4; u0 = smallest positive root
    coeffs = [-Q * Q, 2, -1, 0, 1 / b ** 2]
    roots = mp.polyroots(coeffs, maxsteps=200, extraprec=200)
    u0 = min(mp.re(r) for r in roots if abs(mp.im(r)) < mp.mpf(10) ** -30 and mp.re(r) > 0)
    # H(u) = P(u)/(u0 - u): synthetic division of -P by (u - u0)
    a4, a3, a2, a1, a0 = [-c for c in coeffs]  # -P = Q^2 u^4 - 2u^3 + u^2 - 1/b^2
    h3 = a4; h2 = a3 + u0 * h3; h1 = a2 + u0 * h2; h0 = a1 + u0 * h1
    H = lambda u: h3 * u ** 3 + h2 * u ** 2 + h1 * u + h0  # -P = (u - u0) H  =>  P = (u0 - u) H
    f = lambda w: 4 / mp.sqrt(H(u0 - w * w))
    return mp.quad(f, [0, mp.sqrt(u0) / 2, mp.sqrt(u0)]) - mp.pi, 1 / u0


def weak_coefficients(N):
    g = lambda t: (1 + t + t * t) / (1 + t)
    a = [mp.mpf(0)] + [2 * mp.binomial(2 * n, n) / mp.mpf(2) ** n *
                       mp.quad(lambda th: g(mp.sin(th)) ** n, [0, mp.pi / 2]) for n in range(1, N + 1)]
    # h(eps) from eps = h sqrt(1-2h): fixed point h = eps (1 - 2h)^(-1/2) on truncated series
    def mul(x, y):
        z = [mp.mpf(0)] * (N + 1)
        for i, xi in enumerate(x):
            if xi == 0:
                continue
            for j in range(N + 1 - i):
                z[i + j] += xi * y[j]
        return z
    h = [mp.mpf(0)] * (N + 1); h[1] = mp.mpf(1)
    for _ in range(N + 1):
        # (1 - 2h)^(-1/2) = sum binom(2j, j) (h/2)^j ... = sum binom(2j,j)/4^j (2h)^j
        s = [mp.mpf(0)] * (N + 1); s[0] = mp.mpf(1)
        p = [mp.mpf(0)] * (N + 1); p[0] = mp.mpf(1)
        for j in range(1, N + 1):
            p = mul(p, h)
            for k in range(N + 1):
                s[k] += mp.binomial(2 * j, j) / mp.mpf(2) ** j * p[k]
        h = [mp.mpf(0)] + s[:N]
    alpha = [mp.mpf(0)] * (N + 1)
    p = [mp.mpf(0)] * (N + 1); p[0] = mp.mpf(1)
    for n in range(1, N + 1):
        p = mul(p, h)
        for k in range(N + 1):
            alpha[k] += a[n] * p[k]
    return alpha[1:]


def main():
    print("# mpmath", mp.__version__, "mp.dps =", mp.mp.dps)
    print("## Schwarzschild: Darwin (ellipk/ellipf, m = k^2) vs quadrature A")
    for b in ["5.2", "5.25", "5.5", "6", "7", "10", "20", "50", "100", "1000", "10000"]:
        d = darwin(b); qa = quad_a(b)
        print(f"b={b}: alpha={mp.nstr(d, 20)}  r0={mp.nstr(r0_schw(b), 20)}  |darwin-quadA|={mp.nstr(abs(d - qa), 3)}")
    print("## Bozza 2002 coefficients")
    bbar = mp.log(216 * (7 - 4 * mp.sqrt(3))) - mp.pi
    print("bbar =", mp.nstr(bbar, 20))
    print("D1 =", mp.nstr(mp.mpf(1) / 18 + 2 * mp.sqrt(3) / 9 + mp.mpf(5) / 18 * (bbar + mp.pi), 20))
    bc = 3 * mp.sqrt(3)
    for d in ["1e-2", "1e-4", "1e-6"]:
        b = bc * (1 + mp.mpf(d))
        print(f"d={d}: b={mp.nstr(b, 25)} exact alpha={mp.nstr(darwin(b), 20)}")
    print("## weak-field coefficients c_n (I_n + reversion)")
    for n, c in enumerate(weak_coefficients(12), start=1):
        print(f"c_{n} = {mp.nstr(c, 22)}")
    print("## Kerr equatorial (BL r-integral)")
    for b, a in [("10", "0.9"), ("10", "-0.9"), ("10", "0"), ("6", "0.5"), ("8", "-0.5"), ("3", "1"),
                 ("2.5", "1"), ("7.5", "-1"), ("100", "0.99"), ("1000", "-1")]:
        al, r0 = kerr(b, a)
        print(f"b={b} a={a}: alpha={mp.nstr(al, 20)} r0={mp.nstr(r0, 20)}")
    print("## Reissner-Nordstrom (u-integral)")
    for b, Q in [("10", "0.5"), ("6", "0.8"), ("5", "1"), ("4.5", "1"), ("100", "1"), ("20", "0.3"), ("1000", "0.7")]:
        al, r0 = rn(b, Q)
        print(f"b={b} Q={Q}: alpha={mp.nstr(al, 20)} r0={mp.nstr(r0, 20)}")
    print("## Sun (IAU 2015 nominal), exact GR at b = R_sun, in arcsec")
    GM = mp.mpf("1.3271244e20"); c = mp.mpf(299792458); R = mp.mpf("6.957e8")
    m = GM / c ** 2
    print("GM/c^2 =", mp.nstr(m, 20), "m")
    print("4M/b arcsec =", mp.nstr(4 * m / R * 648000 / mp.pi, 20))
    print("exact arcsec =", mp.nstr(darwin(R / m) * 648000 / mp.pi, 20))
    print("## Solar System and a neutron star (IAU 2015 Resolution B3 nominal values)")
    arcsec = 648000 / mp.pi
    print("Sun 4M/R rad =", mp.nstr(4 * m / R, 20), " M/R =", mp.nstr(m / R, 12))
    print("Sun PPN gamma = 1 + 2.1e-5, arcsec =", mp.nstr((2 + mp.mpf("2.1e-5")) / 2 * 4 * m / R * arcsec, 20))
    r0 = R / m
    print("Sun exact GR with r0 = R, arcsec =", mp.nstr(darwin(r0 / mp.sqrt(1 - 2 / r0)) * arcsec, 20))
    mns = mp.mpf("1.4") * m; r0 = mp.mpf(12000) / mns; b = r0 / mp.sqrt(1 - 2 / r0)
    print("neutron star 1.4 Msun, r0 = 12 km: b =", mp.nstr(b * mns, 20), "m, alpha =", mp.nstr(darwin(b), 20), "rad")
    for name, gm, rad in [("Jupiter", "1.2668653e17", "7.1492e7"), ("Earth", "3.986004e14", "6.3781e6")]:
        a = 4 * mp.mpf(gm) / c ** 2 / mp.mpf(rad)
        print(f"{name} limb PPN gamma = 1: {mp.nstr(a, 20)} rad = {mp.nstr(a * arcsec * 1000, 20)} mas")


if __name__ == "__main__":
    main()
