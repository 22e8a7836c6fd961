//! The sources of the waveform results (`sources`: a keyed map, each key naming what its
//! citation covers, listed below; `citations`: the same keys → registry ids), for the
//! gravitational and the electromagnetic result, generated from [`crate::references`].

use crate::references::{cite, source, source_maps, CitationMap, Source, SourceMap};

/// Source → citation, gravitational waveform. The keys name what each source covers: `waveform`
/// (h_plus, h_cross, peak_abs_h, memory, constant_piece), `flux` (e_rad_flux, p_rad_flux),
/// `closed_form` (e_rad_closed, p_rad_closed), `memory` (memory_braginsky_thorne),
/// `zero_frequency` (the spectrum's ω → 0 limits), `antenna` (detector).
const GRAVITY: [(&str, Source); 6] = [
    (
        "waveform",
        source(
            "LO waveform: chiwave's derivation from the relaxed Einstein equations in harmonic gauge with the Landau–Lifshitz pseudotensor (docs/physics/waveform.md §1–2, code waveform::kernel); agrees with the published LO waveforms through the checks listed there",
            &[
                cite("landau1975", "§96"),
                cite("poisson2014", "ch. 6"),
                cite("kovacs1978", ""),
                cite("jakobsen2021", "LO waveform"),
                cite("mougiakakos2021", "LO waveform"),
            ],
        ),
    ),
    (
        "flux",
        source(
            "flux integral of dE/(du dΩ) = D²(ḣ₊² + ḣ×²)/(16π) of this waveform over u and the sphere",
            &[cite("maggiore2008", "ch. 1, energy flux of a gravitational wave")],
        ),
    ),
    (
        "closed_form",
        source(
            "radiated energy-momentum in closed form (the formula as recalled, checked against the flux integral of the waveform: docs/physics/waveform.md §4)",
            &[cite("herrmann2021", "P_rad^μ and E(γ)")],
        ),
    ),
    (
        "memory",
        source(
            "memory from the change of the bodies' momenta, with the LO impulse",
            &[cite("braginsky1987", "memory of a burst"), cite("westpfahl1985", "first-order impulse")],
        ),
    ),
    (
        "zero_frequency",
        source(
            "zero-frequency limit from the memory; closed form as recalled, its prefactor 2GQ²/π fixed by the numerical limit of the waveform (docs/physics/waveform.md §3)",
            &[cite("smarr1977", "zero-frequency limit"), cite("divecchia2021", "dE/dω at ω → 0")],
        ),
    ),
    ("antenna", source("interferometer antenna pattern F₊h₊ + F×h× (common practice)", &[cite("thorne1987", "antenna pattern")])),
];

/// Source → citation, electromagnetic waveform: `field` (e_theta, e_phi), `closed_form`
/// (e_rad_body1, e_rad_body2, e_rad_closed), `flux` (e_rad_flux, interference, p_rad_flux),
/// `memory` (memory, impulse), `spectrum`.
const ELECTROMAGNETIC: [(&str, Source); 5] = [
    (
        "field",
        source(
            "e_theta, e_phi: Liénard–Wiechert radiation field of the two straight lines with their first-order accelerations (derived in waveform::em, docs/physics/waveform.md §5); interference of the two bodies included",
            &[cite("jackson1999", "§14.1")],
        ),
    ),
    (
        "closed_form",
        source(
            "e_rad_body1: Liénard closed form π q1⁴ q2² (1 + 3γ²)/(12 m1² v b³); e_rad_body2: Larmor closed form π q1² q2⁴ (1 + 3γ²)/(12 γ m2² v b³) (time integrals of the powers); e_rad_closed = e_rad_body1 + e_rad_body2 (no interference)",
            &[cite("jackson1999", "§14.2")],
        ),
    ),
    (
        "flux",
        source(
            "e_rad_flux: flux integral of D²|E|²/(4π) over u and the sphere: closed-form body parts plus the interference integral (numerical quadrature)",
            &[cite("jackson1999", "§14.1")],
        ),
    ),
    (
        "memory",
        source(
            "memory: ∫du D E = −D ΔA_⊥ with D A = Σ q v/(1 − n·v) and the LO impulse 2 q1 q2/(v b); zfl_direction: the classical soft-photon limit (docs/physics/waveform.md §5)",
            &[cite("jackson1999", "§14.1, Liénard–Wiechert potentials")],
        ),
    ),
    (
        "spectrum",
        source(
            "spectrum: closed-form Bessel K0/K1 spectrum, the Fourier transform of the Coulomb profiles (table entry recalled, checked numerically)",
            &[cite("gradshteyn2007", "3.754.2")],
        ),
    ),
];

/// `sources` and `citations`, gravitational waveform.
pub(crate) fn gravity() -> (SourceMap, CitationMap) {
    source_maps(&GRAVITY)
}

/// `sources` and `citations`, electromagnetic waveform.
pub(crate) fn electromagnetic() -> (SourceMap, CitationMap) {
    source_maps(&ELECTROMAGNETIC)
}
