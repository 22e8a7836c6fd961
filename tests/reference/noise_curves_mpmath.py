"""Reference values for the detector noise fits in chiwave-core's detection::noise, from an
independent transcription of the published equations in mpmath 1.3 (mp.dps = 30):

* Advanced LIGO, zero-detuned high power: the analytic fit of Ajith 2011 (arXiv:1107.1267),
  S_n = 1e-49 [x^-4.14 - 5 x^-2 + 111 (1 - x^2 + x^4/2)/(1 + x^2/2)] / Hz, x = f/245.4 Hz.
* LISA: Robson, Cornish & Liu 2019 (arXiv:1803.01944), eqs. (10), (11), (13), with the galactic
  confusion noise of eq. (14) and the Table 1 coefficients.

Prints the ASD at test frequencies, the location and value of each curve's minimum (root of
d ln S/d ln f by mpmath.findroot) and the logarithmic slopes at the ends of the bands.
Run: python3 tests/reference/noise_curves_mpmath.py
"""
import mpmath as mp

mp.mp.dps = 30
C = mp.mpf(299792458)


def aligo(f):
    x = mp.mpf(f) / mp.mpf("245.4")
    return mp.mpf("1e-49") * (x ** mp.mpf("-4.14") - 5 / x**2 + 111 * (1 - x**2 + x**4 / 2) / (1 + x**2 / 2))


L = mp.mpf("2.5e9")
FSTAR = C / (2 * mp.pi * L)
TABLE1 = {  # Robson, Cornish & Liu 2019, Table 1: alpha, beta, kappa, gamma, f_k
    "0.5": ("0.133", "243", "482", "917", "0.00258"),
    "1": ("0.171", "292", "1020", "1680", "0.00215"),
    "2": ("0.165", "299", "611", "1340", "0.00173"),
    "4": ("0.138", "-221", "521", "1680", "0.00113"),
}


def lisa(f, t=None):
    f = mp.mpf(f)
    p_oms = mp.mpf("1.5e-11") ** 2 * (1 + (mp.mpf("2e-3") / f) ** 4)
    p_acc = mp.mpf("3e-15") ** 2 * (1 + (mp.mpf("0.4e-3") / f) ** 2) * (1 + (f / mp.mpf("8e-3")) ** 4)
    s = 10 / (3 * L**2) * (p_oms + 2 * (1 + mp.cos(f / FSTAR) ** 2) * p_acc / (2 * mp.pi * f) ** 4) * (1 + mp.mpf("0.6") * (f / FSTAR) ** 2)
    if t is not None:
        a, b, k, g, fk = (mp.mpf(v) for v in TABLE1[t])
        s += mp.mpf("9e-45") * f ** (mp.mpf(-7) / 3) * mp.exp(-f**a + b * f * mp.sin(k * f)) * (1 + mp.tanh(g * (fk - f)))
    return s


def slope(fn, f):
    # d ln ASD / d ln f
    return mp.diff(lambda y: mp.log(fn(mp.e**y)) / 2, mp.log(f))


print(f"LISA f* = c/(2 pi L) = {mp.nstr(FSTAR, 20)} Hz")
for f in ["10", "20", "50", "100", "245.4", "1000", "4000", "10000"]:
    print(f"aligo ASD({f} Hz) = {mp.nstr(mp.sqrt(aligo(f)), 17)}")
fmin = mp.findroot(lambda y: mp.diff(lambda z: mp.log(aligo(mp.e**z)), y), mp.log(250))
print(f"aligo minimum: f = {mp.nstr(mp.e**fmin, 17)} Hz, ASD = {mp.nstr(mp.sqrt(aligo(mp.e**fmin)), 17)}")
print(f"aligo slope at 10 Hz = {mp.nstr(slope(aligo, 10), 12)}, at 1e4 Hz = {mp.nstr(slope(aligo, 1e4), 12)}")

for f in ["1e-5", "1e-4", "1e-3", "3e-3", "1e-2", "0.1", "1"]:
    print(f"lisa ASD({f} Hz) = {mp.nstr(mp.sqrt(lisa(f)), 17)}" + "".join(
        f", {t} yr: {mp.nstr(mp.sqrt(lisa(f, t)), 17)}" for t in TABLE1))
fmin = mp.findroot(lambda y: mp.diff(lambda z: mp.log(lisa(mp.e**z)), y), mp.log(mp.mpf("7e-3")))
print(f"lisa minimum: f = {mp.nstr(mp.e**fmin, 17)} Hz, ASD = {mp.nstr(mp.sqrt(lisa(mp.e**fmin)), 17)}")
for f in ["1e-5", "1e-3", "0.5", "1"]:
    print(f"lisa slope d ln ASD/d ln f at {f} Hz = {mp.nstr(slope(lisa, mp.mpf(f)), 12)}")
for f in ["10.001", "1.01e-5", "1.5e-3", "2e-3"]:
    fn = lisa if float(f) < 1 else aligo
    print(f"{fn.__name__} slope d ln ASD/d ln f at {f} Hz = {mp.nstr(slope(fn, mp.mpf(f)), 12)}")
