#!/usr/bin/env python3
"""Peer of chiwave's exact test-body scattering angle: the Schwarzschild timelike geodesic
(ν → 0) angle by quadrature at every (γ, j) of benches/workloads.json (`test_body`).

Orbit equation (Schwarzschild geodesic with y = j·M/r, ε = 1/j; e.g. Chandrasekhar 1983, *The
Mathematical Theory of Black Holes*, §19, recalled):
    (dy/dφ)² = F(y) = p² + 2εy − y² + 2εy³ = 2ε(y₀ − y)(y₁ − y)(y − y₂),  p² = γ² − 1,
    χ = 2∫₀^{y₀} dy/√F − π,
with y₂ < 0 < y₀ < y₁ the roots of the cubic. The substitution y = y₀(1 − s²) removes the
inverse square root at the turning point:
    χ = 2∫₀¹ 2√y₀ ds / √(2ε(y₁ − y)(y − y₂)) − π.
j = ratio × j_c(γ), with the capture threshold of the unstable circular orbit of energy γ,
r_c = [3γ² − 4 + γ√(9γ² − 8)]/(2(γ² − 1)), j_c = r_c/√(r_c − 3) (same source, recalled), with
r_c − 3 = 2/(γ√(9γ² − 8) + 3γ² − 2) (rationalised).

Methods (--method):
  mpmath  roots by mp.polyroots, tanh-sinh quadrature mp.quad, at mp.dps = 20: five digits more
          than double precision, because the final subtraction of π costs log10(π/χ) ≤ 4 digits
          at the largest j; the result is rounded to double.
  scipy   roots by numpy.roots, scipy.integrate.quad (QUADPACK qags) with epsrel = 1e-12 in
          double precision: the practitioner's faster alternative; it keeps the 1e-10 chiwave
          promises but not more at the largest j (the subtraction of π).
"""
import argparse
import math

import numpy as np

import common

MP_DPS = 20


def critical_j(gamma):
    # r_c − 3 rationalised, 2/(γ√(9γ² − 8) + 3γ² − 2): the plain difference cancels at large γ
    # (r_c → 3) and would move j, and with it χ near capture, by ~1e-13.
    d = 2.0 / (gamma * np.sqrt(9.0 * gamma ** 2 - 8.0) + 3.0 * gamma ** 2 - 2.0)
    return (3.0 + d) / np.sqrt(d)


def points(w):
    gm1 = common.grid(w["gamma_m1"])
    ratio = common.grid(w["j_over_jc"])
    g, r = np.meshgrid(gm1, ratio, indexing="ij")
    g, r = g.ravel(), r.ravel()
    return g, r * critical_j(1.0 + g)


def chi_mpmath(gm1, js):
    from mpmath import mp, mpf, polyroots, quad, sqrt, pi

    out = []
    with mp.workdps(MP_DPS):
        for g1, j in zip(gm1, js):
            eps = 1 / mpf(j)
            g1 = mpf(g1)
            p2 = g1 * (g1 + 2)
            roots = sorted(r.real for r in polyroots([2 * eps, -1, 2 * eps, p2], maxsteps=100, extraprec=40))
            y2, y0, y1 = roots
            c = 2 * sqrt(y0)
            f = lambda s: c / sqrt(2 * eps * (y1 - y0 * (1 - s * s)) * (y0 * (1 - s * s) - y2))
            out.append(float(2 * quad(f, [0, 1]) - pi))
    return np.array(out)


def chi_scipy(gm1, js):
    from scipy.integrate import quad

    out = np.empty(len(js))
    for i, (g1, j) in enumerate(zip(gm1, js)):
        eps = 1.0 / j
        p2 = g1 * (g1 + 2.0)
        y2, y0, y1 = np.sort(np.roots([2.0 * eps, -1.0, 2.0 * eps, p2]).real)
        c = 2.0 * math.sqrt(y0)
        f = lambda s: c / math.sqrt(2.0 * eps * (y1 - y0 * (1.0 - s * s)) * (y0 * (1.0 - s * s) - y2))
        val, _ = quad(f, 0.0, 1.0, epsabs=0.0, epsrel=1e-12, limit=200)
        out[i] = 2.0 * val - math.pi
    return out


def main():
    p = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    p.add_argument("--method", choices=["mpmath", "scipy"], default="mpmath")
    p.add_argument("--values")
    p.add_argument("--min-runs", type=int, default=3)
    p.add_argument("--min-seconds", type=float, default=1.0)
    args = p.parse_args()
    w = common.workloads()["test_body"]
    ref = common.chiwave_values(args.values)["test_body"]
    gm1, js = points(w)
    fn = chi_mpmath if args.method == "mpmath" else chi_scipy
    chi = fn(gm1, js)
    checks = [
        common.check("(γ − 1, j) points", max(common.max_rel(gm1, ref["gamma_m1"]), common.max_rel(js, ref["j"])),
                     "light_series", "the same j_c closed form (rounding only)"),
        common.check("χ (test body)", common.max_rel(chi, ref["chi"]), "test_body",
                     "chiwave's quadrature promises 1e-10 relative (its two Gauss rules agree to that)"),
    ]
    timing = common.time_it(lambda: fn(gm1, js), args.min_runs, args.min_seconds)
    note = (f"mpmath.polyroots + mpmath.quad (tanh-sinh) at mp.dps = {MP_DPS}, one point after another"
            if args.method == "mpmath" else "numpy.roots + scipy.integrate.quad (epsrel 1e-12), one point after another")
    common.report("test_body", args.method, len(js), "(γ, j) point (one exact angle)", timing, checks, note)


if __name__ == "__main__":
    main()
