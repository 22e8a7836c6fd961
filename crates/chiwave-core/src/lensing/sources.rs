//! The sources of the lens result's output keys (`sources`: output key → citation, and
//! `citations`: output key → registry ids), generated from [`crate::references`].

use crate::references::{cite, source, source_maps, CitationMap, Source, SourceMap};

const EINSTEIN: Source = source(
    "θ_E = √(4GM D_LS/(c² D_L D_S)), flat-space distances D_LS = D_S − D_L",
    &[cite("einstein1936", ""), cite("refsdal1964", ""), cite("schneider1992", "point-mass lens")],
);
const IMAGES: Source = source(
    "x± = (y ± √(y² + 4))/2, μ± = ±[(y² + 2)/(2y√(y² + 4)) ± 1/2]",
    &[cite("paczynski1986", "point-lens magnification"), cite("schneider1992", "point-mass lens")],
);
const DELAY: Source = source(
    "T(y) = y√(y² + 4)/2 + ln[(√(y² + 4) + y)/(√(y² + 4) − y)] in units of 4GM_Lz/c³",
    &[cite("takahashi2003", "point-lens time delay")],
);
const WAVE: Source = source(
    "point-lens amplification F(w, y) in closed form (₁F₁), e^{−iωt} convention (docs/physics/lensing.md §2)",
    &[cite("takahashi2003", "point-lens F(w, y)"), cite("nakamura1999", "diffraction integral")],
);
const MASS: Source = source("solar masses from the IAU 2015 Resolution B3 nominal (GM)☉", &[cite("prsa2016", "nominal solar GM")]);

/// `sources` and `citations` of a lens result; `wave` adds the wave-optics keys.
pub(crate) fn lens(wave: bool) -> (SourceMap, CitationMap) {
    let mut all: Vec<(&'static str, Source)> = vec![
        ("einstein_radius_rad", EINSTEIN),
        ("einstein_radius_mas", EINSTEIN),
        ("einstein_radius_au", EINSTEIN),
        ("einstein_radius_m", EINSTEIN),
        ("images", IMAGES),
        ("total_magnification", IMAGES),
        ("time_delay_s", DELAY),
        ("time_delay_dimensionless", DELAY),
        ("mass_msun", MASS),
    ];
    if wave {
        for k in ["w", "amplification", "amplification_abs", "amplification_phase_rad", "amplification_geometric"] {
            all.push((k, WAVE));
        }
    }
    source_maps(&all)
}
