"""Reference values e^x K0(x), e^x K1(x) for the chiwave-core waveform Bessel routine
(src/special.rs (scaled K0, K1)). mpmath 1.3, mp.dps = 30."""
import mpmath as mp

mp.mp.dps = 30
for x in ["1e-6", "0.01", "0.5", "2", "10", "100", "3000"]:
    x = mp.mpf(x)
    print(mp.nstr(x, 6), mp.nstr(mp.besselk(0, x) * mp.exp(x), 18), mp.nstr(mp.besselk(1, x) * mp.exp(x), 18))
