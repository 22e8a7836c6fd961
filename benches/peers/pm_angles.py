#!/usr/bin/env python3
"""Peer of chiwave's post-Minkowskian scattering angles: the cumulative CM angle χ at 1PM, 2PM,
3PM conservative and 3PM with radiation reaction for every (ν, γ − 1, j) of the product grid of
benches/workloads.json (`pm_angles`), vectorised over numpy arrays.

With p = p∞ = √((γ − 1)(γ + 1)), h = √(1 + 2ν(γ − 1)), v = p/γ and χ/2 = Σ χ_n / jⁿ:
  χ₁ = (2γ² − 1)/p                                   (Westpfahl 1985; Damour 2016, arXiv:1609.00354)
  χ₂ = (3π/8)(5γ² − 1)/h                             (Westpfahl 1985; Bini & Damour 2017, arXiv:1706.06877)
  χ₃^cons = χ₃^Schw − (2νp/h²) C̄(γ),  χ₃^Schw = (64p⁶ + 72p⁴ + 12p² − 1)/(3p³),
  C̄ = (2/3)γ(14γ² + 25) + 4(4γ⁴ − 12γ² − 3) arcsinh(√((γ − 1)/2))/p
                          (Bern et al. 2019, arXiv:1901.04424, 1908.01493, in the form of
                           Damour 2019, arXiv:1912.02139; Antonelli et al. 2019, arXiv:1901.07102)
  χ₃^rad = ν(2γ² − 1)² I(v)/h²,  I(v) = −16/3 + 2/v² + 2(3v² − 1) arctanh(v)/v³
                          (Damour 2020, arXiv:2010.01641; Di Vecchia, Heissenberg, Russo &
                           Veneziano 2021, arXiv:2101.05772)
and χ = 2χ₁/j, + 2χ₂/j², + 2χ₃^cons/j³, + 2χ₃^rad/j³ (cumulative).

I(v) cancels catastrophically as v → 0 (terms of size 2/v² leave (8/5)v²), so below v = 0.3 it is
summed from its Maclaurin series Σ_{k≥1} [6/(2k + 1) − 2/(2k + 3)] v^{2k}, which follows from
arctanh(v)/v = Σ v^{2n}/(2n + 1) (elementary); without it the 3PM radiation term loses up to
eight digits at γ − 1 = 1e-3. arctanh(v) is formed as ln(γ + p), which keeps its digits at large γ.
"""
import math

import numpy as np

import common

SERIES_BELOW_V = 0.3
# 40 terms: the k-th is below 1e-18 of the sum for v < 0.3.
_K = np.arange(1, 41, dtype=float)
I_SERIES = 6.0 / (2.0 * _K + 1.0) - 2.0 / (2.0 * _K + 3.0)


def i_function(gamma, p):
    v = p / gamma
    out = np.empty_like(v)
    s = v < SERIES_BELOW_V
    w = v[s] ** 2
    out[s] = w * np.polyval(I_SERIES[::-1], w)  # Σ_k I_SERIES[k − 1] w^k, Horner
    c = ~s
    g, pc, vc = gamma[c], p[c], v[c]
    inv_v2 = (g / pc) ** 2
    out[c] = (2.0 * inv_v2 - 16.0 / 3.0) + 2.0 * (3.0 - inv_v2) * np.log(g + pc) / vc
    return out


def coefficients(nu, gm1):
    """[χ₁, χ₂, χ₃^cons, χ₃^rad] of χ/2 = Σ χ_n/jⁿ, shape (4, n)."""
    g = 1.0 + gm1
    p = np.sqrt(gm1 * (g + 1.0))
    h2 = 1.0 + 2.0 * nu * gm1
    h = np.sqrt(h2)
    g2 = g * g
    p2 = p * p
    chi1 = (2.0 * g2 - 1.0) / p
    chi2 = 3.0 * math.pi / 8.0 * (5.0 * g2 - 1.0) / h
    schw = (((64.0 * p2 + 72.0) * p2 + 12.0) * p2 - 1.0) / (3.0 * p2 * p)
    cbar = 2.0 / 3.0 * g * (14.0 * g2 + 25.0) + 4.0 * ((4.0 * g2 - 12.0) * g2 - 3.0) / p * np.arcsinh(np.sqrt(0.5 * gm1))
    chi3c = schw - 2.0 * nu * p / h2 * cbar
    chi3r = nu * (2.0 * g2 - 1.0) ** 2 * i_function(g, p) / h2
    return chi1, chi2, chi3c, chi3r


def pm_angles(nu, gm1, j):
    """[χ_1PM, χ_2PM, χ_3PM,cons, χ_3PM] (cumulative, radians), shape (4, n)."""
    chi1, chi2, chi3c, chi3r = coefficients(nu, gm1)
    x = 1.0 / j
    a1 = 2.0 * chi1 * x
    a2 = a1 + 2.0 * chi2 * x * x
    a3c = a2 + 2.0 * chi3c * x ** 3
    a3 = a3c + 2.0 * chi3r * x ** 3
    return np.stack([a1, a2, a3c, a3])


def points(w):
    nu, gm1, j = np.meshgrid(common.grid(w["nu"]), common.grid(w["gamma_m1"]), common.grid(w["j"]), indexing="ij")
    return nu.ravel(), gm1.ravel(), j.ravel()


def main():
    args = common.arguments(__doc__.splitlines()[0])
    w = common.workloads()["pm_angles"]
    ref = common.chiwave_values(args.values)["pm_angles"]
    nu, gm1, j = points(w)
    chi = pm_angles(nu, gm1, j)
    grid_diff = max(common.max_rel(nu, ref["nu"]), common.max_rel(gm1, ref["gamma_m1"]), common.max_rel(j, ref["j"]))
    checks = [
        common.check("(ν, γ − 1, j) grid", grid_diff, "light_series", "the same grid formula (exp rounding only)"),
        common.check("χ 1PM, 2PM, 3PM cons, 3PM", common.max_rel(chi, ref["chi"]), "pm_angles",
                     "rounding of the closed forms, amplified by 1/p∞³ and C̄'s cancellation at γ − 1 = 1e-3"),
        common.check("coefficients χ₁, χ₂, χ₃^cons, χ₃^rad", common.max_rel(np.stack(coefficients(nu, gm1)), ref["coefficients"]),
                     "pm_angles", "as above; χ₃^rad checks the small-v series of I(v) on its own"),
    ]
    timing = common.time_it(lambda: pm_angles(nu, gm1, j), args.min_runs, args.min_seconds)
    common.report("pm_angles", "numpy", len(nu), "encounter (4 cumulative PM angles)", timing, checks,
                  "closed forms vectorised over numpy arrays; I(v) by its series below v = 0.3")


if __name__ == "__main__":
    main()
