//! The source of every light-deflection output key (`sources`: output key → citation, and
//! `citations`: output key → registry ids), generated from [`crate::references`].

use super::Metric;
use crate::references::{cite, source, source_maps, CitationMap, Source, SourceMap};

const SCHWARZSCHILD: [(&str, Source); 4] = [
    (
        "alpha",
        source(
            "exact deflection from Darwin's elliptic closed form, evaluated with Carlson's R_F",
            &[cite("darwin1959", "closed form of the orbit"), cite("carlson1995", "R_F"), cite("dlmf", "19.25.5")],
        ),
    ),
    (
        "closest_approach",
        source(
            "r0 = (2b/√3) cos[(1/3) arccos(−3√3 M/b)], the largest root of r³ − b²r + 2Mb² = 0",
            &[cite("darwin1959", "")],
        ),
    ),
    ("critical_b", source("b_c = 3√3 M", &[cite("darwin1959", "")])),
    (
        "series",
        source(
            "weak-field series; orders 1–4 as published, higher orders generated in code (deflection::series) and checked against the exact angle",
            &[cite("keeton2005", "Schwarzschild series, orders 1–4")],
        ),
    ),
];

const KERR: [(&str, Source); 4] = [
    (
        "alpha",
        source(
            "equatorial Kerr deflection by quadrature of the separated geodesic equations (derivation: docs/physics/deflection.md §2)",
            &[cite("carter1968", "separated geodesic equations"), cite("iyer2009", "equatorial deflection integral")],
        ),
    ),
    (
        "closest_approach",
        source("largest root of the equatorial radial potential R(r) = r⁴ + (a² − b²)r² + 2M(b − a)²r", &[cite("carter1968", "")]),
    ),
    (
        "critical_b",
        source("b_c = 3√(M r_ph) − a_s, equatorial photon orbits", &[cite("bardeen1972", "equatorial circular photon orbits")]),
    ),
    (
        "series",
        source(
            "Kerr weak-field series generated in code (deflection::series); orders ≤ 3 compared with the published series",
            &[cite("sereno2006", "weak-deflection Kerr series"), cite("asada2003", "linear order: translated Schwarzschild lens")],
        ),
    ),
];

const REISSNER_NORDSTROM: [(&str, Source); 4] = [
    (
        "alpha",
        source(
            "θ-form quadrature of the Reissner–Nordström null geodesics (derivation: docs/physics/deflection.md §2)",
            &[cite("chandrasekhar1983", "ch. 5"), cite("reissner1916", ""), cite("nordstrom1918", "")],
        ),
    ),
    ("closest_approach", source("largest root of r⁴ − b²(r² − 2Mr + Q²)", &[cite("chandrasekhar1983", "ch. 5")])),
    (
        "critical_b",
        source(
            "b_c = r_ph²/√(r_ph² − 2M r_ph + Q²), r_ph = [3M + √(9M² − 8Q²)]/2, the photon sphere",
            &[cite("chandrasekhar1983", "ch. 5")],
        ),
    ),
    (
        "series",
        source(
            "Reissner–Nordström weak-field series generated in code; orders ≤ 3 compared with the published series",
            &[cite("keeton2005", "Reissner–Nordström section"), cite("eiroa2002", "weak-field deflection")],
        ),
    ),
];

const COMMON: [(&str, Source); 5] = [
    (
        "strong_deflection",
        source(
            "strong-deflection limit α = −ln(b/b_c − 1) + b̄, b̄ = ln[216(7 − 4√3)] − π (Schwarzschild only); the next-order coefficient fitted to the exact angle with mpmath (tests/reference/deflection_mpmath.py, docs/physics/deflection.md §3)",
            &[cite("bozza2002", "strong-field limit coefficients ā, b̄")],
        ),
    ),
    (
        "ppn",
        source(
            "[(1 + γ)/2]·4M/b; at finite solar elongation (1 + γ)(M/b)(1 + cos φ)",
            &[cite("will2014", "PPN light deflection"), cite("lambert2009", "deflection at finite elongation")],
        ),
    ),
    (
        "alpha_arcsec",
        source("alpha converted with 1 rad = 648000/π arcsec; the mass from the IAU 2015 B3 nominal GM", &[cite("prsa2016", "nominal solar GM")]),
    ),
    (
        "physical",
        source(
            "G M/c² from the IAU 2015 B3 nominal GM and the exact c; kg through the CODATA 2018 G",
            &[cite("prsa2016", "nominal solar GM"), cite("codata2018", "G")],
        ),
    ),
    (
        "flags",
        source(
            "regime thresholds: common practice; geometric optics needs w = 4GMω/c³ ≫ 1",
            &[cite("takahashi2003", "geometric-optics limit of F(w, y)")],
        ),
    ),
];

/// Output key → citation (`sources`) and registry citations (`citations`) of a light result.
pub(crate) fn light(metric: Metric) -> (SourceMap, CitationMap) {
    let per_metric = match metric {
        Metric::Schwarzschild => &SCHWARZSCHILD,
        Metric::Kerr { .. } => &KERR,
        Metric::ReissnerNordstrom { .. } => &REISSNER_NORDSTROM,
    };
    let all: Vec<(&'static str, Source)> = per_metric.iter().chain(COMMON.iter()).copied().collect();
    source_maps(&all)
}
