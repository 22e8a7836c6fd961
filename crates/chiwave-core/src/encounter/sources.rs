//! The source of every encounter output key, as shown beside each number (`sources` in the
//! result: output key → citation; `citations`: output key → registry ids), generated from
//! [`crate::references`].

use crate::references::{cite, source, source_maps, CitationMap, Source, SourceMap};

const GRAVITY: [(&str, Source); 14] = [
    (
        "1pm",
        source("χ₁ = (2γ² − 1)/p∞", &[cite("portilla1980", ""), cite("westpfahl1985", "first-order angle"), cite("damour2016", "1PM angle")]),
    ),
    (
        "2pm",
        source(
            "χ₂ = (3π/8)(5γ² − 1)/h",
            &[cite("westpfahl1985", "second-order angle"), cite("bini2017", "2PM angle"), cite("damour2018", "2PM angle")],
        ),
    ),
    (
        "3pm_conservative",
        source(
            "conservative 3PM angle, written in the mass-polynomial form",
            &[cite("bern2019", "3PM angle"), cite("bern2019long", ""), cite("antonelli2019", "mass-polynomial form"), cite("damour2020a", "mass polynomiality")],
        ),
    ),
    (
        "3pm",
        source(
            "3PM conservative plus radiation reaction from the linear response to the O(G²) angular-momentum loss",
            &[cite("damour2020b", "radiation-reacted 3PM angle"), cite("divecchia2020", ""), cite("divecchia2021", "")],
        ),
    ),
    (
        "chi_newtonian",
        source("Kepler hyperbola tan(χ/2) = GM/(b v²), Rutherford's formula with the gravitational coupling", &[cite("landau1976", "§19")]),
    ),
    (
        "chi_test_body",
        source("exact Schwarzschild timelike geodesic by quadrature", &[cite("chandrasekhar1983", "ch. 3")]),
    ),
    (
        "test_body_pm",
        source(
            "generated in code by the finite-part expansion of the geodesic integral (encounter::testbody), checked against the exact quadrature (docs/physics/encounter.md §3)",
            &[],
        ),
    ),
    (
        "j_critical_test_body",
        source("unstable circular orbit of Schwarzschild at the given energy", &[cite("mtw1973", "§25.5"), cite("chandrasekhar1983", "ch. 3")]),
    ),
    (
        "chi_estimate",
        source(
            "strong-field estimate: the PM angles resummed into an effective radial potential, whose angle is computed exactly (construction: docs/physics/encounter.md §5)",
            &[cite("damour2018", "energy-gauge effective potential"), cite("damour2023", "resummed PM scattering angle")],
        ),
    ),
    (
        "j_critical_estimate",
        source(
            "double root of the estimate's effective radial potential (its unstable circular orbit; docs/physics/encounter.md §5)",
            &[cite("damour2018", "energy-gauge effective potential")],
        ),
    ),
    ("e_rad", source("radiated energy at O(G³), E_rad/M = ν²(GM/b)³ E(γ)/h", &[cite("herrmann2021", "P_rad^μ and E(γ)"), cite("herrmann2021long", "")])),
    ("p_rad_cm", source("radiated momentum at O(G³) in the CM frame", &[cite("herrmann2021", "P_rad^μ and E(γ)")])),
    ("j_rad", source("radiated angular momentum at O(G²)", &[cite("damour2020b", "J_rad at O(G²) and I(v)")])),
    (
        "impulse",
        source(
            "transverse impulse from the angle; longitudinal parts from the on-shell conditions (p_a + Δp_a)² = m_a² (docs/physics/encounter.md §4)",
            &[cite("westpfahl1985", "impulse"), cite("kosower2019", "LO and NLO impulse")],
        ),
    ),
];

const ELECTROMAGNETIC: [(&str, Source); 9] = [
    ("1pl", source("e₁ = −γ/p∞, from the expansion of the exact test-charge angle", &[cite("darwin1913", "")])),
    ("2pl", source("e₂ = π/(4h)", &[cite("saketh2022", "second-order angle"), cite("bern2023", "second-order angle")])),
    (
        "3pl_conservative",
        source("test-charge e₃ from the expansion of the exact test-charge angle; the two-body ν dependence is NOT included", &[cite("darwin1913", "")]),
    ),
    (
        "3pl",
        source(
            "plus radiation reaction by linear response to the Abraham–Lorentz–Dirac angular-momentum loss (derivation: docs/physics/encounter.md §6)",
            &[cite("damour2020b", "linear-response formula")],
        ),
    ),
    ("chi_test_exact", source("exact relativistic Coulomb scattering of a test charge", &[cite("darwin1913", ""), cite("landau1975", "§39 and its problem")])),
    (
        "e_rad",
        source("test charge, leading order: the Liénard power integrated along the straight line", &[cite("jackson1999", "§14.2")]),
    ),
    (
        "e_rad_dipole",
        source("two bodies, non-relativistic electric dipole: the Larmor power along the straight lines", &[cite("jackson1999", "§14.2")]),
    ),
    (
        "j_rad",
        source("Abraham–Lorentz–Dirac torque at O(e⁴) along the straight lines (derivation: docs/physics/encounter.md §6)", &[cite("jackson1999", "ch. 16, radiation reaction")]),
    ),
    (
        "impulse",
        source("−p sin χ of the PL series and the on-shell longitudinal parts, as for gravity (docs/physics/encounter.md §4)", &[]),
    ),
];

/// `sources` and `citations`, gravitational encounter.
pub(crate) fn gravity() -> (SourceMap, CitationMap) {
    source_maps(&GRAVITY)
}

/// `sources` and `citations`, electromagnetic encounter.
pub(crate) fn electromagnetic() -> (SourceMap, CitationMap) {
    source_maps(&ELECTROMAGNETIC)
}
