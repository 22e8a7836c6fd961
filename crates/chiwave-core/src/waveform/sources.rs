//! The sources of the waveform results (`sources`: a keyed map, each key naming what its
//! citation covers, listed below), for the gravitational and the electromagnetic result.

use std::collections::BTreeMap;

const LO_WAVEFORM: &str = "LO waveform: our derivation from the relaxed Einstein equations in harmonic gauge with the Landau–Lifshitz pseudotensor (Landau & Lifshitz, Classical Theory of Fields, §96; Poisson & Will 2014, Gravity, ch. 6), see waveform::kernel; equivalent to Kovacs & Thorne 1978 (ApJ 224, 62), Jakobsen et al. 2021 (arXiv:2101.12688), Mougiakakos et al. 2021 (arXiv:2102.08339) by numerical checks";
const FLUX: &str = "flux integral of dE/(du dΩ) = D²(ḣ₊² + ḣ×²)/(16π) (the standard gravitational-wave energy flux, e.g. Maggiore 2008, Gravitational Waves, Vol. 1, ch. 1) of this waveform over u and the sphere";
const CLOSED: &str = "Radiated energy-momentum closed form: Herrmann, Parra-Martinez, Ruf & Zeng 2021, arXiv:2101.07255 (formula recalled, checked against the flux integral of the waveform)";
const MEMORY: &str = "Memory: Braginsky & Thorne 1987, Nature 327, 123, with the LO impulse of Westpfahl 1985";
const ZFL: &str = "Zero-frequency limit: Smarr 1977, PRD 15, 2069; closed form of Di Vecchia, Heissenberg, Russo & Veneziano 2021, arXiv:2101.05772 (recalled; the prefactor 2GQ²/π fixed by the numerical zero-frequency limit of the waveform)";
const ANTENNA: &str = "Antenna pattern: Thorne 1987, 300 Years of Gravitation, ch. 9 (common practice)";

/// Source → citation, gravitational waveform. The keys name what each source covers: `waveform`
/// (h_plus, h_cross, peak_abs_h, memory, constant_piece), `flux` (e_rad_flux, p_rad_flux),
/// `closed_form` (e_rad_closed, p_rad_closed), `memory` (memory_braginsky_thorne),
/// `zero_frequency` (the spectrum's ω → 0 limits), `antenna` (detector).
pub(crate) fn gravity() -> BTreeMap<&'static str, &'static str> {
    BTreeMap::from([
        ("waveform", LO_WAVEFORM),
        ("flux", FLUX),
        ("closed_form", CLOSED),
        ("memory", MEMORY),
        ("zero_frequency", ZFL),
        ("antenna", ANTENNA),
    ])
}

const EM_FIELD: &str = "e_theta, e_phi: Liénard–Wiechert radiation field (Jackson, Classical Electrodynamics, 3rd ed. 1999, §14.1) of the two straight lines with their first-order accelerations (derived in waveform::em); interference of the two bodies included";
const EM_CLOSED: &str = "e_rad_body1: Liénard closed form π q1⁴ q2² (1 + 3γ²)/(12 m1² v b³); e_rad_body2: Larmor closed form π q1² q2⁴ (1 + 3γ²)/(12 γ m2² v b³) (time integrals of the Liénard and Larmor powers, Jackson 1999 §14.2); e_rad_closed = e_rad_body1 + e_rad_body2 (no interference)";
const EM_FLUX: &str = "e_rad_flux: flux integral of D²|E|²/(4π) over u and the sphere (Jackson 1999 §14.1): closed-form body parts plus the interference integral (numerical quadrature)";
const EM_MEMORY: &str = "memory: ∫du D E = −D ΔA_⊥ with D A = Σ q v/(1 − n·v) and the LO impulse 2 q1 q2/(v b); zfl_direction: classical soft-photon limit";
const EM_SPECTRUM: &str = "spectrum: closed-form Bessel K0/K1 spectrum (Fourier transform of the Coulomb profiles, Gradshteyn & Ryzhik 3.754.2, recalled)";

/// Source → citation, electromagnetic waveform: `field` (e_theta, e_phi), `closed_form`
/// (e_rad_body1, e_rad_body2, e_rad_closed), `flux` (e_rad_flux, interference, p_rad_flux),
/// `memory` (memory, impulse), `spectrum`.
pub(crate) fn electromagnetic() -> BTreeMap<&'static str, &'static str> {
    BTreeMap::from([
        ("field", EM_FIELD),
        ("closed_form", EM_CLOSED),
        ("flux", EM_FLUX),
        ("memory", EM_MEMORY),
        ("spectrum", EM_SPECTRUM),
    ])
}
