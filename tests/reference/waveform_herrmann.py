"""Reference values for the O(G^3) radiated energy function E(gamma) of Herrmann, Parra-Martinez,
Ruf & Zeng 2021 (arXiv:2101.07255), in the form with 8 in the f3 denominator and
1/(2 sqrt(g^2-1)) on the last term (equivalent to the form with 16 and 1/sqrt(g^2-1)).  Used by chiwave-core waveform tests.

Prints (1) E(gamma) at test points with mpmath 1.3 at mp.dps = 40, and (2) the exact rational
coefficients of the low-velocity series E/pi = sum c_k v^(2k+1), computed with sympy.
"""
import mpmath as mp
import sympy as sp

mp.mp.dps = 40


def e_over_pi(g):
    g = mp.mpf(g)
    p2 = g * g - 1
    p = mp.sqrt(p2)
    f1 = (210*g**6 - 552*g**5 + 339*g**4 - 912*g**3 + 3148*g**2 - 3336*g + 1151) / (48 * p2 * p)
    f2 = -(35*g**4 + 60*g**3 - 150*g**2 + 76*g - 5) / (8 * p)
    f3 = (2*g**2 - 3) * (35*g**4 - 30*g**2 + 11) / (8 * p2 * p)
    return f1 + f2 * mp.log((g + 1) / 2) + f3 * g * mp.acosh(g) / (2 * p)


for g in ["1.0001", "1.001", "1.01", "1.02", "1.1", "1.5", "2", "3", "5", "10"]:
    print(f"gamma={g}: E(gamma) = {mp.nstr(mp.pi * e_over_pi(g), 30)}")

v = sp.symbols('v', positive=True)
g = 1 / sp.sqrt(1 - v**2)
p = g * v
f1 = (210*g**6 - 552*g**5 + 339*g**4 - 912*g**3 + 3148*g**2 - 3336*g + 1151) / (48 * p**3)
f2 = -(35*g**4 + 60*g**3 - 150*g**2 + 76*g - 5) / (8 * p)
f3 = (2*g**2 - 3) * (35*g**4 - 30*g**2 + 11) / (8 * p**3)
acosh = sp.log(g + p)
expr = f1 + f2 * sp.log((g + 1) / 2) + f3 * g * acosh / (2 * p)
ser = sp.series(expr, v, 0, 16).removeO()
ser = sp.expand(ser)
for k in range(0, 16):
    c = ser.coeff(v, k)
    if c != 0:
        print(f"v^{k}: {c} = {sp.N(c, 25)}")
