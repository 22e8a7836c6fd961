#!/usr/bin/env python3
"""Reference values of the modified Bessel functions K0 and K1 for the EM spectrum tests.

Run: python3 tests/reference/em_bessel_mpmath.py
Uses mpmath 1.3.0 with mp.dps = 40 (mpmath.besselk, an implementation independent of the
Cephes Chebyshev expansions used by the Rust code). Prints Rust array literals
(x, K0(x), K1(x)) that are pasted into crates/chiwave-core/tests/em_waveform.rs.
"""
import mpmath as mp

mp.mp.dps = 40

XS = ["1e-12", "1e-6", "0.001", "0.1", "0.5", "1", "1.9999", "2", "2.0001", "3.7", "8", "8.5",
      "20", "50", "200", "700"]

print("// mpmath 1.3.0, mp.dps = 40, tests/reference/em_bessel_mpmath.py: (x, K0(x), K1(x))")
print("const BESSEL_K: [(f64, f64, f64); %d] = [" % len(XS))
for s in XS:
    x = mp.mpf(s)
    k0 = mp.besselk(0, x)
    k1 = mp.besselk(1, x)
    print("    (%s, %s, %s)," % (s, mp.nstr(k0, 17, min_fixed=0, max_fixed=0),
                                mp.nstr(k1, 17, min_fixed=0, max_fixed=0)))
print("];")
