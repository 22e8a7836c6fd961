//! Error estimates of a lens result: the thin-lens point-mass formulas (from their validity
//! parameter), the geometric-optics amplification (against the exact F(w, y), or from its
//! scaling where the exact F is too costly), the exact F (its numerical accuracy); the
//! recommended value. Relative estimates; the reasons are in `docs/physics/accuracy.md`.

use super::wave::Method;
use super::PointLens;
use crate::validity::{Best, ErrorEstimate, Estimates};
use num_complex::Complex64;

const THIN_LENS: &str = "validity parameter: thin-lens parameter 4GM/(c²R_E) × (1 + 1/y)";
const GO_VS_EXACT: &str = "vs the exact F(w, y)";
const GO_SCALING: &str = "validity parameter: geometric-optics corrections 1/(wΔT) + 1/(wy²)";
const MU_VS_F2: &str = "vs |F|² (exact wave optics: the rays' incoherent sum misses the interference)";
const F_NUMERICAL: &str = "numerical accuracy of the exact F (f64 phases of size w ln w and wΔT), plus the thin-lens parameter";

/// Relative size of the corrections to the thin-lens point-mass magnification:
/// α_E (1 + 1/y) with α_E = 4GM/(c²R_E) the deflection at the Einstein ring. The corrections to
/// each image's magnification are of relative order ε = α_E/4 (Keeton & Petters 2005,
/// gr-qc/0511019) and cancel in the total at that order (Ebina, Osuga, Asada & Kasai 2000,
/// astro-ph/0011314); the factor 1 + 1/y allows for their growth near the caustic (our choice).
pub(crate) fn thin_lens(alpha_e: f64, y: f64) -> f64 {
    alpha_e * (1.0 + 1.0 / y)
}

/// Relative size of the corrections to the geometric-optics F at dimensionless frequency w and
/// offset y: 1/(wΔT) + 1/(wy²). The corrections fall like 1/w (Takahashi & Nakamura 2003,
/// astro-ph/0305055) with coefficients that grow as the images merge (ΔT → 2y, y → 0); this
/// form bounds the actual |F_geo − F|/|F| by a factor 4 or more over 0.1 ≤ w ≤ 1e3,
/// 3e-3 ≤ y ≤ 30 (scanned against the exact F, tests/lensing_accuracy.rs).
pub(crate) fn geometric_optics(w: f64, y: f64) -> f64 {
    let dt = PointLens::new(y).map(|l| l.time_delay()).unwrap_or(f64::NAN);
    1.0 / (w * dt) + 1.0 / (w * y * y)
}

/// Numerical accuracy of the exact F: ≈ 1e-15 relative for w ≲ 10 and ~1e-16 w beyond (7e-13
/// observed at w = 1000 against mpmath, lensing::wave), plus the rounding of the interference
/// phase wΔT; taken as 1e-14 (1 + w) + 1e-16 wΔT.
pub(crate) fn f_numerical(w: f64, y: f64) -> f64 {
    let dt = PointLens::new(y).map(|l| l.time_delay()).unwrap_or(0.0);
    1e-14 * (1.0 + w) + 1e-16 * w * dt
}

/// The wave-optics part of a lens result.
pub(crate) struct Wave {
    pub w: f64,
    pub f: Complex64,
    pub geometric: Complex64,
    pub method: Method,
}

/// The estimates and the recommended value of a lens result with offset `y`, thin-lens
/// parameter `alpha_e`, total magnification `mu`, and the wave part when a frequency is given.
pub(crate) fn lens(y: f64, alpha_e: f64, mu: f64, wave: Option<&Wave>, tol: f64) -> (Estimates, Best) {
    let mut est = Estimates::new();
    let thin = thin_lens(alpha_e, y);
    let Some(wv) = wave else {
        let e = ErrorEstimate::new(thin, THIN_LENS, tol);
        est.insert("total_magnification", e.clone());
        let best = Best::new(
            "total_magnification",
            mu,
            &e,
            "ray-optics point-lens magnification (no frequency given, so interference is not included); its estimate is the thin-lens correction",
        );
        return (est, best);
    };
    let exact = wv.method != Method::GeometricOptics;
    let go_scale = geometric_optics(wv.w, y);
    let (f_err, f_method) = if exact { (f_numerical(wv.w, y) + thin, F_NUMERICAL) } else { (go_scale + thin, GO_SCALING) };
    let f_est = ErrorEstimate::new(f_err, f_method, tol);
    let go = if exact {
        ErrorEstimate::new((wv.geometric - wv.f).norm() / wv.f.norm() + f_err, GO_VS_EXACT, tol)
    } else {
        ErrorEstimate::new(go_scale + thin, GO_SCALING, tol)
    };
    // |F|² against the rays' sum: the interference and the diffraction both enter.
    let f2 = wv.f.norm_sqr();
    let mu_est = ErrorEstimate::new((mu - f2).abs() / f2 + 2.0 * f_err, MU_VS_F2, tol);
    est.insert("amplification_abs", f_est.clone());
    est.insert("amplification_geometric", go);
    est.insert("total_magnification", mu_est);
    let why = if exact {
        "the exact wave-optics amplification |F(w, y)| of the point lens (Takahashi & Nakamura 2003); |F|² is the flux amplification at this frequency"
    } else {
        "the geometric-optics limit of |F| (the exact F would be too costly at this w and y); |F|² is the flux amplification at this frequency"
    };
    (est, Best::new("amplification_abs", wv.f.norm(), &f_est, why))
}
