//! Error estimates of a waveform result: the leading-order strain and its peak, the radiated
//! energy, the slow-motion (quadrupole) overlay; the recommended values (`best`, the peak; and
//! `best_e_rad`). Relative estimates; why each is conservative is in `docs/physics/accuracy.md`.

use crate::encounter::accuracy::radiated;
use crate::validity::{Best, ErrorEstimate, Estimates};

const LO_STRAIN: &str = "validity parameter: the leading-order deflection angle χ₁ (the LO strain is first order in the deflection)";
const E_RAD: &str = "validity parameter: exp(3χ₁) − 1 with χ₁ the leading-order deflection angle (calibrated on the slow-motion radiated energy)";
const QUADRUPOLE: &str = "validity parameter: v (octupole and current-quadrupole corrections; v² in the CM frame with equal masses)";
const EM_FIELD: &str = "validity parameter: the deflection and recoil Δp/(γ m₁ v), Δp/(m₂ v) (the field of straight lines), plus G m₁m₂/|q₁q₂| (the radiation of the gravitational acceleration, left out)";

/// Relative error estimate of the slow-motion (quadrupole-formula) waveform of the Newtonian
/// hyperbola against the full one: v, or 10 v² in the centre-of-mass frame with equal masses
/// (where the odd multipoles cancel). Against the leading-order PM strain at a deflection too
/// small to matter (exact in v at that order) the peak differs by at most half of this
/// (tests/waveform_accuracy.rs).
pub fn quadrupole(v: f64, cm_equal_masses: bool) -> f64 {
    if cm_equal_masses {
        10.0 * v * v
    } else {
        v
    }
}

/// The slow-motion reference of a gravitational waveform: the quadrupole waveform's peak and the
/// quadrupole energy of the Newtonian hyperbola with the same masses, v∞ and b, with their own
/// relative estimate ([`quadrupole`] for the strain, v for the energy).
pub(crate) struct SlowMotion {
    pub peak: f64,
    pub peak_err: f64,
    pub energy: f64,
    pub energy_err: f64,
}

const VS_QUADRUPOLE: &str = "vs the quadrupole waveform of the Newtonian hyperbola (exact in the deflection as v → 0), plus its own estimate";
const VS_QUADRUPOLE_E: &str = "vs the quadrupole energy of the Newtonian hyperbola (exact in the deflection as v → 0), plus v";

/// The smaller of two estimates, with its method.
fn smaller(a: (f64, &'static str), b: (f64, &'static str), tol: f64) -> ErrorEstimate {
    let (e, m) = if b.0.is_finite() && b.0 < a.0 { b } else { a };
    ErrorEstimate::new(e, m, tol)
}

/// The estimates of a gravitational waveform result. `chi1` is the leading-order deflection
/// angle, `flux` the flux-integral energy (when computed) against the closed form `closed`,
/// `slow` the slow-motion reference, `quad` (v, CM frame with equal masses) when the quadrupole
/// overlay is in the result.
pub(crate) fn gravity(
    chi1: f64,
    peak: f64,
    closed: f64,
    flux: Option<f64>,
    slow: &SlowMotion,
    quad: Option<(f64, bool)>,
    tol: f64,
) -> (Estimates, Best, Best) {
    let mut est = Estimates::new();
    // Two bounds on the LO strain's error: the deflection angle (at v ≪ c the peak differs from
    // the quadrupole hyperbola's by at most 0.56 χ₁), and the difference from the slow-motion
    // reference plus that reference's own error. The smaller one is kept.
    let peak_est = smaller(
        (chi1.abs(), LO_STRAIN),
        ((peak - slow.peak).abs() / slow.peak + slow.peak_err, VS_QUADRUPOLE),
        tol,
    );
    let e_pair = smaller(
        (radiated(chi1), E_RAD),
        ((closed - slow.energy).abs() / slow.energy + slow.energy_err, VS_QUADRUPOLE_E),
        tol,
    );
    est.insert("peak_abs_h", peak_est.clone());
    est.insert("e_rad_closed", e_pair.clone());
    if let (Some(f), Some(e)) = (flux, e_pair.error_estimate) {
        est.insert("e_rad_flux", ErrorEstimate::new(e + (f - closed).abs() / closed, "as e_rad_closed, plus the flux integral's difference from it", tol));
    }
    if let Some((v, cm_eq)) = quad {
        est.insert("quadrupole", ErrorEstimate::new(quadrupole(v, cm_eq), QUADRUPOLE, tol));
    }
    let best = Best::new(
        "peak_abs_h",
        peak,
        &peak_est,
        "the peak of the leading-order strain over the samples; at v ≪ c with a large deflection the quadrupole waveform of the Newtonian hyperbola (figure slow_motion) is closer to the truth (its error is about v)",
    );
    let best_e = Best::new("e_rad_closed", closed, &e_pair, "the radiated energy at O(G³) in closed form (Herrmann et al. 2021), equal to the flux integral of this waveform");
    (est, best, best_e)
}

/// The estimates of an electromagnetic waveform result: `x` is the larger of the deflection and
/// the recoil (the `em_deflection` parameter) and `g` = G m₁m₂/|q₁q₂| (gravity, left out of the
/// force law, accelerates the charges too: their field changes at that relative size); `flux`
/// the flux integral with interference and its own relative error estimate, when computed;
/// `closed` the sum of the bodies' closed forms. Energies are quadratic in the field: 2(x + g)
/// plus its square.
pub(crate) fn electromagnetic(x: f64, g: f64, peak: f64, closed: f64, flux: Option<(f64, f64)>, tol: f64) -> (Estimates, Best, Best) {
    let mut est = Estimates::new();
    let field = x + g;
    let x = field * (2.0 + field);
    let peak_est = ErrorEstimate::new(field, EM_FIELD, tol);
    est.insert("peak_abs_e", peak_est.clone());
    let best = Best::new("peak_abs_e", peak, &peak_est, "the peak of the first-order field over the samples");
    let best_e = match flux {
        Some((f, ferr)) => {
            let fe = ErrorEstimate::new(x + ferr, "validity parameter (deflection and recoil, neglected gravity; squared for an energy), plus the flux integral's own error estimate", tol);
            est.insert("e_rad_flux", fe.clone());
            est.insert(
                "e_rad_closed",
                ErrorEstimate::new((closed - f).abs() / f.abs() + x + ferr, "vs the flux integral with interference (the closed forms leave it out), plus its estimate", tol),
            );
            Best::new("e_rad_flux", f, &fe, "the radiated energy with the interference of the two bodies' fields (flux integral)")
        }
        None => {
            let ce = ErrorEstimate::none("the interference of the two fields is not known without the flux integral (energy_flux = false)", "vs the flux integral with interference", tol);
            est.insert("e_rad_closed", ce.clone());
            Best::new("e_rad_closed", closed, &ce, "the sum of the bodies' closed forms; the interference term needs the flux integral")
        }
    };
    (est, best, best_e)
}
