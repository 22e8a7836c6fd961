#!/usr/bin/env python3
"""Reference values for crates/chiwave-core/tests/lensing*.rs (mpmath 1.3, mp.dps = 30).

Independent of the Rust code: mpmath's own hyp1f1 and gamma (its hypercomb/asymptotic machinery),
not the series + Taylor continuation used in chiwave-core.

Point-lens amplification factor (Takahashi & Nakamura 2003, astro-ph/0305055):
  F(w, y) = exp[pi w/4 + i (w/2)(ln(w/2) - 2 phi_m)] Gamma(1 - i w/2) 1F1(i w/2; 1; i w y^2/2),
  x_m = (y + sqrt(y^2 + 4))/2, phi_m = (x_m - y)^2/2 - ln x_m.
Run: python3 tests/reference/lensing_mpmath.py
"""
import mpmath as mp

mp.mp.dps = 30


def phi_m(y):
    xm = (y + mp.sqrt(y * y + 4)) / 2
    return (xm - y) ** 2 / 2 - mp.log(xm)


def F(w, y):
    w = mp.mpf(w)
    y = mp.mpf(y)
    pref = mp.exp(mp.pi * w / 4 + 1j * (w / 2) * (mp.log(w / 2) - 2 * phi_m(y)))
    return pref * mp.gamma(1 - 1j * w / 2) * mp.hyp1f1(1j * w / 2, 1, 1j * w * y * y / 2)


def show(label, z):
    print(f"{label}: re = {mp.nstr(mp.re(z), 17)}, im = {mp.nstr(mp.im(z), 17)}")


if __name__ == "__main__":
    print(f"mpmath {mp.__version__}, mp.dps = {mp.mp.dps}")
    print("# M(i alpha, 1, i t) = hyp1f1(i alpha, 1, i t)")
    for alpha, t in [(0.5, 0.045), (5.0, 5.0), (50.0, 50.0), (0.05, 500.0), (500.0, 500.0)]:
        show(f"M({alpha}i, 1, {t}i)", mp.hyp1f1(1j * alpha, 1, 1j * t))
    print("# ln Gamma via mpmath.loggamma, compared through exp: Gamma(z)")
    for z in [0.5 + 3j, 1 - 5j, 1 - 50j, 2.5 + 0.1j]:
        show(f"Gamma({z})", mp.gamma(z))
    print("# F(w, y)")
    grid = [(0.1, 0.1), (0.1, 1.0), (1.0, 0.3), (1.0, 1.0), (1.0, 3.0), (3.0, 0.5),
            (5.0, 2.0), (10.0, 0.1), (10.0, 1.0), (30.0, 0.3), (30.0, 3.0), (100.0, 1.0),
            (100.0, 5.0), (300.0, 0.5), (1000.0, 1.0), (1000.0, 10.0), (0.01, 10.0), (2.0, 0.0),
            (1.0, 100.0), (10.0, 30.0), (100.0, 20.0), (1000.0, 30.0), (0.01, 6000.0)]
    for w, y in grid:
        show(f"F({w}, {y})", F(w, y))
    print("# point lens, worked example: M = 0.3 GM_sun/G (IAU 2015 B3), D_L = 4 kpc, D_S = 8 kpc, u = 0.5")
    au = mp.mpf(149597870700); kpc = 1000 * 648000 / mp.pi * au
    gm = mp.mpf("0.3") * mp.mpf("1.3271244e20"); c = mp.mpf(299792458)
    dl, ds = 4 * kpc, 8 * kpc
    te = mp.sqrt(4 * gm * (ds - dl) / (c ** 2 * dl * ds))
    print("theta_E =", mp.nstr(te, 15), "rad =", mp.nstr(te * 648000e3 / mp.pi, 15), "mas; R_E =", mp.nstr(te * dl / au, 15), "au")
    u = mp.mpf("0.5"); r = mp.sqrt(u * u + 4)
    mup, mum = (u * u + 2) / (2 * u * r) + mp.mpf(1) / 2, -((u * u + 2) / (2 * u * r) - mp.mpf(1) / 2)
    print("mu+ =", mp.nstr(mup, 15), "mu- =", mp.nstr(mum, 15), "mu_tot =", mp.nstr(mup - mum, 15))
    print("w = 8 pi G M f/c^3 for 1 M_sun at 100 Hz:", mp.nstr(8 * mp.pi * mp.mpf("1.3271244e20") * 100 / c ** 3, 6),
          "; w = 1 at f =", mp.nstr(c ** 3 / (8 * mp.pi * mp.mpf("1.3271244e20")), 6), "Hz")
