//! The source of every light-deflection output key (`sources`: output key → citation).

use super::Metric;
use std::collections::BTreeMap;

/// Output key → citation.
pub(crate) fn light(metric: Metric) -> BTreeMap<&'static str, &'static str> {
    let mut s = BTreeMap::new();
    let (alpha, r0, bc, ser) = match metric {
        Metric::Schwarzschild => (
            "Darwin 1959, Proc. R. Soc. A 249, 180 (elliptic closed form), evaluated via Carlson R_F (DLMF 19.25.5)",
            "r0 = (2b/√3) cos[(1/3) arccos(−3√3 M/b)], the largest root of r³ − b²r + 2Mb² = 0 (Darwin 1959)",
            "b_c = 3√3 M (Darwin 1959)",
            "weak-field series, Keeton & Petters 2005, gr-qc/0511019 (orders 1–4); higher orders generated in code (deflection::series), checked against the exact angle",
        ),
        Metric::Kerr { .. } => (
            "Kerr equatorial θ-form quadrature of the Carter equations (Carter 1968, Phys. Rev. 174, 1559; cf. Iyer & Hansen 2009, arXiv:0908.0085)",
            "largest root of the equatorial radial potential R(r) = r⁴ + (a² − b²)r² + 2M(b − a)²r (Carter 1968)",
            "b_c = 3√(M r_ph) − a_s, Bardeen, Press & Teukolsky 1972, ApJ 178, 347",
            "Kerr weak-field series generated in code (deflection::series); Sereno & De Luca 2006, astro-ph/0609435 (orders ≤ 3)",
        ),
        Metric::ReissnerNordstrom { .. } => (
            "θ-form quadrature of the Reissner–Nordström null geodesics (Chandrasekhar 1983, The Mathematical Theory of Black Holes, ch. 5)",
            "largest root of r⁴ − b²(r² − 2Mr + Q²) (Chandrasekhar 1983, ch. 5)",
            "b_c = r_ph²/√(r_ph² − 2M r_ph + Q²), r_ph = [3M + √(9M² − 8Q²)]/2, the photon sphere (Chandrasekhar 1983, ch. 5)",
            "RN weak-field series generated in code; Keeton & Petters 2005, gr-qc/0511019 and Eiroa, Romero & Torres 2002, gr-qc/0203049 (orders ≤ 3)",
        ),
    };
    s.insert("alpha", alpha);
    s.insert("closest_approach", r0);
    s.insert("critical_b", bc);
    s.insert("series", ser);
    s.insert(
        "strong_deflection",
        "Bozza 2002, gr-qc/0208075 (ā = 1, b̄ = ln[216(7 − 4√3)] − π); next-order coefficient fitted to the exact angle with mpmath (tests/reference/deflection_mpmath.py); Schwarzschild only",
    );
    s.insert("ppn", "[(1 + γ)/2]·4M/b (Will 2014, arXiv:1403.7377); finite elongation (1 + γ)(M/b)(1 + cos φ), Lambert & Le Poncin-Lafitte 2009, arXiv:0903.1615");
    s.insert("alpha_arcsec", "alpha converted with 1 rad = 648000/π arcsec; mass from IAU 2015 B3 nominal GM (Prša et al. 2016, arXiv:1605.09788)");
    s.insert("physical", "G M/c² from IAU 2015 B3 nominal GM and the exact c; kg via CODATA 2018 G (Tiesinga et al. 2021)");
    s.insert("flags", "regime thresholds: common practice; geometric optics w = 4GMω/c³ ≫ 1 (Takahashi & Nakamura 2003, astro-ph/0305055)");
    s
}
