#!/usr/bin/env python3
"""Peer of chiwave's energy-balance sky integral: E_rad = (1/16π) ∫dΩ ∫du (ḣ₊² + ḣ×²) of the
leading-order waveform in the frame of body 2, on the sky and u rules of
benches/workloads.json (`sky_balance`), in numpy (formulas and sources in gravity.py): the
per-direction set-up vectorised over all sky cells at once, then one vectorised u × node
evaluation per direction (batching the directions too was measured slower: its temporaries no
longer fit the caches).

Checks: against chiwave's flux integral (the same rule: agreement to rounding) and against the
closed form of Herrmann, Parra-Martinez, Ruf & Zeng 2021 (arXiv:2101.07255),
E_rad = m1² m2² E(γ)/b³ in this frame — an independent result, which the rule reaches to 1e-10.
"""
import common
import gravity

KEYS = ("m1", "m2", "gamma", "b", "n_polar", "n_azimuth", "n_u", "n_x")


def main():
    args = common.arguments(__doc__.splitlines()[0])
    w = common.workloads()["sky_balance"]
    ref = common.chiwave_values(args.values)["sky_balance"]
    pars = [w[k] for k in KEYS]
    energy = gravity.sky_energy(*pars)
    closed = (w["m1"] * w["m2"]) ** 2 * gravity.e_function(w["gamma"]) / w["b"] ** 3
    checks = [
        common.check("E_rad (flux)", common.max_rel(energy, ref["energy"]), "sky_balance",
                     "the same rule: rounding of the sum over ~1e5 terms"),
        common.check("E_rad against Herrmann et al. 2021", common.max_rel(energy, closed), "sky_balance_closed",
                     "the closed form (arXiv:2101.07255) evaluated here; the rule's own accuracy is 1e-10 at γ = 1.5"),
    ]
    timing = common.time_it(lambda: gravity.sky_energy(*pars), args.min_runs, args.min_seconds)
    cells = w["n_polar"] * w["n_azimuth"]
    common.report("sky_balance", "numpy", 1, f"sky integral ({cells} directions)", timing, checks,
                  "numpy port of the same waveform and rules; set-up vectorised over the sky, u × nodes per direction")


if __name__ == "__main__":
    main()
