#!/usr/bin/env python3
"""Peer of chiwave's gravitational spectrum: dE/(dω dΩ) of the leading-order waveform of two
scattering bodies at one direction in the frame of body 2, on the ω grid of
benches/workloads.json (`gravity_spectrum`): worldline part and field-stress part (one term per
Feynman-parameter node) transformed in closed form with scipy.special.k0e/k1e, vectorised over
ω × nodes (the formulas and their sources are in gravity.py). The per-direction set-up (the
field-stress quadratic forms at every node) is part of the timed workload, as it is natively.
"""
import numpy as np

import common
import gravity


def spectrum(w, omega):
    ker = gravity.Kernel(w["m1"], w["m2"], w["gamma"], w["b"], w["theta"], w["phi"], w["x_nodes"])
    return ker.spectrum(omega)


def main():
    args = common.arguments(__doc__.splitlines()[0])
    w = common.workloads()["gravity_spectrum"]
    ref = common.chiwave_values(args.values)["gravity_spectrum"]
    omega = common.grid(w["omega"])
    if not np.all(omega > 0.0):
        raise SystemExit("gravity_spectrum: the ω grid must be positive (ω = 0 is the memory limit)")
    val = spectrum(w, omega)
    checks = [
        common.check("ω grid", common.max_rel(omega, ref["omega"]), "light_series", "the same grid formula"),
        common.check("dE/(dω dΩ)", common.max_rel(val, ref["value"]), "gravity_spectrum",
                     "the same closed forms; rounding of the sum over Feynman-parameter nodes"),
    ]
    timing = common.time_it(lambda: spectrum(w, omega), args.min_runs, args.min_seconds)
    common.report("gravity_spectrum", "scipy", len(omega), "frequency (one direction, set-up included)", timing, checks,
                  "numpy port of the same closed form; scipy.special.k0e/k1e over ω × Feynman nodes")


if __name__ == "__main__":
    main()
