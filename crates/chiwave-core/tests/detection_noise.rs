//! Noise curves: the published fits against the numbers their papers quote, against an
//! independent mpmath transcription of the same equations (tests/reference/noise_curves_mpmath.py),
//! and against their documented features (minimum, slopes at the ends, where the confusion noise
//! matters); the CSV reader's errors; a table sampled from a fit reproduces the fit to the
//! accuracy expected of log–log interpolation.

// Reference values are quoted with every digit the mpmath scripts printed.
#![allow(clippy::excessive_precision)]

use chiwave_core::detection::noise::{lisa_confusion_psd, lisa_transfer_frequency, LISA_ARM_M};
use chiwave_core::detection::{LisaObservation, NoiseCurve, NoiseTable, NoiseValidity, Response};
use chiwave_core::numeric::rel_diff;

/// Transcription check tolerance: the mpmath script evaluates the same formulas at 30 digits; the
/// Rust f64 evaluation loses a few ulps in powf/cos/exp and in the cancellation of the aLIGO fit's
/// −5x⁻² term (at most a factor ≈ 3 at 10 Hz), hence 1e-13 rather than the rounding tolerance.
const REL_TRANSCRIPTION: f64 = 1e-13;

fn aligo() -> NoiseCurve {
    NoiseCurve::AdvancedLigo
}

fn lisa(t: Option<f64>) -> NoiseCurve {
    NoiseCurve::Lisa { confusion: t.map(|y| LisaObservation::from_years(y).unwrap()) }
}

/// d ln ASD/d ln f by a central difference (step 1e-5 in ln f; error ~1e-9, below the checks).
fn log_slope(n: &NoiseCurve, f: f64) -> f64 {
    let h: f64 = 1e-5;
    (n.asd(f * h.exp()).unwrap().ln() - n.asd(f * (-h).exp()).unwrap().ln()) / (2.0 * h)
}

/// Minimum of the ASD on [a, b] by golden-section search in ln f (the curves are unimodal there).
fn minimum(n: &NoiseCurve, a: f64, b: f64) -> (f64, f64) {
    let (mut a, mut b) = (a.ln(), b.ln());
    let g = 0.5 * (5f64.sqrt() - 1.0);
    let val = |y: f64| n.asd(y.exp()).unwrap();
    while b - a > 1e-10 {
        let x1 = b - g * (b - a);
        let x2 = a + g * (b - a);
        if val(x1) < val(x2) {
            b = x2;
        } else {
            a = x1;
        }
    }
    let y = 0.5 * (a + b);
    (y.exp(), val(y))
}

#[test]
fn values_quoted_in_the_papers() {
    // Robson, Cornish & Liu 2019 (arXiv:1803.01944) quote L = 2.5 Gm and f* = 19.09 mHz (the value
    // is also in the paper's public summary); chiwave computes f* = c/(2πL).
    assert_eq!(LISA_ARM_M, 2.5e9);
    assert!((lisa_transfer_frequency() * 1e3 - 19.09).abs() < 0.005, "{}", lisa_transfer_frequency());
    // Ajith 2011 (arXiv:1107.1267): f₀ = 245.4 Hz, S₀ = 1e-49 Hz⁻¹; at x = 1 the bracket is
    // 1 − 5 + 111·(1/2)/(3/2) = 33 (arithmetic on the published formula).
    assert!(rel_diff(aligo().psd(245.4).unwrap(), 33e-49) < 1e-15);
    // Ajith 2011: used from the low-frequency cutoff of 10 Hz (recalled from memory).
    assert_eq!(aligo().band().0, 10.0);
    assert_eq!(aligo().validity(9.99), NoiseValidity::Outside);
}

#[test]
fn fits_against_independent_mpmath_transcription() {
    // tests/reference/noise_curves_mpmath.py, mpmath 1.3, mp.dps = 30.
    let aligo_ref = [
        (10.0, 2.3764463059853395e-22),
        (20.0, 5.6173139399973258e-23),
        (50.0, 8.4195685478560345e-24),
        (100.0, 3.1288424086407453e-24),
        (245.4, 1.816590212458495e-24),
        (1000.0, 1.2077117726646426e-23),
        (4000.0, 5.3899371893752368e-23),
        (10000.0, 1.3560134915602752e-22),
    ];
    for (f, a) in aligo_ref {
        assert!(rel_diff(aligo().asd(f).unwrap(), a) < REL_TRANSCRIPTION, "aLIGO at {f} Hz");
    }
    // (f, instrument, 0.5 yr, 1 yr, 2 yr, 4 yr)
    let lisa_ref = [
        (1e-5, 4.4412752278519362e-14, 4.4412827371681371e-14, 4.4412834020145653e-14, 4.441283246958305e-14, 4.4412827226522929e-14),
        (1e-4, 4.5972454977165419e-17, 4.6282889091724242e-17, 4.6314755647468731e-17, 4.6306507060822232e-17, 4.6279966030283191e-17),
        (1e-3, 1.2783194529153668e-19, 3.8006779150121074e-19, 4.2742551893461484e-19, 3.9025984691304002e-19, 2.8803671376517415e-19),
        (3e-3, 1.7437458689344712e-20, 7.7482214482496825e-20, 2.9380772706736142e-20, 3.2052806935598413e-20, 1.7679648532462517e-20),
        (1e-2, 1.2013198920984071e-20, 1.2013201142400616e-20, 1.2013198920994097e-20, 1.2013198924065987e-20, 1.2013198921000335e-20),
        (0.1, 4.6147405987808204e-20, 4.6147405987808204e-20, 4.6147405987808204e-20, 4.6147405987808204e-20, 4.6147405987808204e-20),
        (1.0, 4.4828907276483872e-19, 4.4828907276483872e-19, 4.4828907276483872e-19, 4.4828907276483872e-19, 4.4828907276483872e-19),
    ];
    for (f, i, a, b, c, d) in lisa_ref {
        assert!(rel_diff(lisa(None).asd(f).unwrap(), i) < REL_TRANSCRIPTION, "LISA at {f} Hz");
        for (t, r) in [(0.5, a), (1.0, b), (2.0, c), (4.0, d)] {
            assert!(rel_diff(lisa(Some(t)).asd(f).unwrap(), r) < REL_TRANSCRIPTION, "LISA {t} yr at {f} Hz");
        }
    }
}

#[test]
fn aligo_features() {
    // Minimum: mpmath findroot of d ln S/d ln f (noise_curves_mpmath.py): 260.544 Hz, 1.80039e-24.
    let (f, a) = minimum(&aligo(), 100.0, 1000.0);
    assert!(rel_diff(f, 260.54401898666228) < 1e-7, "{f}");
    assert!(rel_diff(a, 1.8003893521257627e-24) < 1e-12, "{a}");
    // Low-frequency wall: S ∝ x^−4.14 as f → 0, so d ln ASD/d ln f → −2.07 (read off the fit);
    // at the 10 Hz cutoff the −5x⁻² term shifts it to −2.0753 (mpmath, at 10.001 Hz).
    assert!((log_slope(&aligo(), 10.001) - (-2.07530059129)).abs() < 1e-7);
    // Shot noise: S → 111 x² · 1e-49 at high f, d ln ASD/d ln f → 1 (mpmath at 10 kHz: 1.00241).
    assert!((log_slope(&aligo(), 9999.0) - 1.0024).abs() < 1e-3);
}

#[test]
fn lisa_features() {
    let n = lisa(None);
    // Minimum (mpmath findroot): 7.2573 mHz, ASD 1.17781e-20 Hz^-1/2.
    let (f, a) = minimum(&n, 3e-3, 2e-2);
    assert!(rel_diff(f, 0.0072573066805078333) < 1e-7, "{f}");
    assert!(rel_diff(a, 1.1778076785927082e-20) < 1e-12);
    // The acceleration-noise wall: P_acc/(2πf)⁴ gives ASD ∝ f⁻² above 0.4 mHz (read off eqs. 11,
    // 13), and the (0.4 mHz/f)² factor of eq. (11) steepens it to f⁻³ at the lowest frequencies.
    // Local slopes from mpmath (noise_curves_mpmath.py): −2.99926 at 10.1 µHz, −2.10510 at 1 mHz,
    // −1.97513 at 1.5 mHz (where the metrology floor starts to flatten the curve).
    for (f, s) in [(1.01e-5, -2.99926358511), (1e-3, -2.10510114116), (1.5e-3, -1.97512866778)] {
        assert!((log_slope(&n, f) - s).abs() < 1e-7, "{f}: {}", log_slope(&n, f));
    }
    let secant = |a: f64, b: f64| (n.asd(b).unwrap() / n.asd(a).unwrap()).ln() / (b / a).ln();
    // Above f* the transfer-function factor 1 + 0.6(f/f*)² makes the ASD rise ∝ f (secant over a
    // decade: the cos²(f/f*) ripple of the acceleration term averages out).
    assert!((secant(0.1, 1.0) - 1.0).abs() < 0.02, "{}", secant(0.1, 1.0));
    // The galactic confusion noise matters only below a few mHz (tanh cut-off at f_k, Table 1):
    // it raises the 1 mHz ASD several-fold and leaves 20 mHz untouched.
    for t in LisaObservation::YEARS {
        let obs = LisaObservation::from_years(t).unwrap();
        let c = lisa(Some(t));
        assert!(c.asd(1e-3).unwrap() > 2.0 * n.asd(1e-3).unwrap(), "{t} yr");
        assert!(rel_diff(c.asd(2e-2).unwrap(), n.asd(2e-2).unwrap()) < 1e-12, "{t} yr");
        assert!(lisa_confusion_psd(2e-2, obs) < 1e-12 * n.psd(2e-2).unwrap());
    }
}

#[test]
fn observation_times_and_names() {
    for t in [0.5, 1.0, 2.0, 4.0] {
        assert_eq!(LisaObservation::from_years(t).unwrap().years(), t);
    }
    for t in [0.0, 0.75, 3.0, 5.0, f64::NAN] {
        let e = LisaObservation::from_years(t).unwrap_err();
        assert_eq!(e.field(), "t_obs");
    }
    for name in ["aligo", "lisa", "lisa-0.5yr", "lisa-1yr", "lisa-2yr", "lisa-4yr"] {
        assert_eq!(NoiseCurve::from_name(name).unwrap().name(), name);
    }
    let e = NoiseCurve::from_name("et-d").unwrap_err();
    assert!(e.to_string().contains("aligo") && e.field() == "noise", "{e}");
    assert_eq!(aligo().response(), Response::Interferometer);
    assert_eq!(lisa(None).response(), Response::SkyAveraged);
    assert!(aligo().source().contains("arXiv:1107.1267") && lisa(Some(1.0)).source().contains("arXiv:1803.01944"));
}

#[test]
fn refusal_outside_the_band() {
    let e = aligo().asd(1e5).unwrap_err();
    assert_eq!(e.field(), "frequency");
    assert!(e.to_string().contains("100000") && e.to_string().contains("1e4 Hz"), "{e}");
    assert!(lisa(None).asd(2.0).is_err() && lisa(None).asd(f64::NAN).is_err());
    assert_eq!(lisa(None).validity(5e-5), NoiseValidity::Extrapolated);
    assert_eq!(lisa(None).validity(1e-3), NoiseValidity::Valid);
    assert_eq!(lisa(None).validity(1e-6), NoiseValidity::Outside);
    // The one-frequency summary the CLI prints.
    let p = aligo().point(100.0).unwrap();
    assert!(p.valid && p.validity == NoiseValidity::Valid && rel_diff(p.asd * p.asd, p.psd) < 1e-15);
    assert_eq!((p.noise.as_str(), p.band_hz), ("aligo", (10.0, 1e4)));
    let q = lisa(Some(1.0)).point(5e-5).unwrap();
    assert!(!q.valid && q.validity == NoiseValidity::Extrapolated && q.noise == "lisa-1yr");
    assert_eq!(lisa(None).point(3.0).unwrap_err().field(), "frequency");
}

#[test]
fn csv_reader_accepts_headers_comments_and_separators() {
    let text = "# my detector\nfrequency_hz, asd\n10, 1e-22   # first\n\n100,1e-23\n1000 ,  1e-22\n";
    let t = NoiseTable::parse_csv("mine", text, Response::Interferometer).unwrap();
    assert_eq!(t.len(), 3);
    assert_eq!(t.band(), (10.0, 1000.0));
    // Whitespace-separated text (no comma) is read as well.
    let w = NoiseTable::parse_csv("w", "10 1e-22\n100\t1e-23\n", Response::Interferometer).unwrap();
    // Log–log interpolation: midway in ln f between (10, 1e-22) and (100, 1e-23) the ASD is the
    // geometric mean (elementary).
    let mid = 10f64.powf(1.5);
    assert!(rel_diff(w.asd(mid).unwrap(), (1e-22f64 * 1e-23).sqrt()) < 1e-13);
    // Exactly the node values at the nodes.
    assert!(rel_diff(w.asd(100.0).unwrap(), 1e-23) < 1e-13);
    let e = w.asd(5.0).unwrap_err();
    assert!(e.to_string().contains("frequency") && e.to_string().contains("1e1 Hz"), "{e}");
}

#[test]
fn csv_reader_names_the_bad_line() {
    let cases = [
        ("10,1e-22\n5,1e-23\n", "line 2", "increase"),
        ("10,1e-22\n10,1e-23\n", "line 2", "increase"),
        ("10,1e-22\n20,-1e-23\n", "line 2", "ASD"),
        ("10,1e-22\n20,0\n", "line 2", "ASD"),
        ("10,1e-22\n20,inf\n", "line 2", "ASD"),
        ("# c\n10,1e-22\n-20,1e-23\n", "line 3", "frequency"),
        ("f,asd\n10,1e-22\n20,abc\n", "line 3", "'abc'"),
        ("10,1e-22\n20,1e-23,7\n", "line 2", "3 columns"),
        ("10,1e-22\n30\n", "line 2", "1 columns"),
        ("f,asd\n10,1e-22\n", "at least 2", "1 data rows"),
        ("", "at least 2", "0 data rows"),
    ];
    for (text, where_, what) in cases {
        let e = NoiseTable::parse_csv("bad", text, Response::Interferometer).unwrap_err();
        let m = e.to_string();
        assert_eq!(e.field(), "noise");
        assert!(m.contains(where_) && m.contains(what), "{text:?}: {m}");
    }
}

/// The fit sampled into a table at n points per decade and read back reproduces the fit to the
/// accuracy of linear interpolation in (ln f, ln ASD): |Δ ln ASD| ≤ (h²/8) max|ψ''|, ψ = ln ASD as
/// a function of ln f, h = ln 10/n (the standard error bound of linear interpolation). ψ'' is
/// taken from the fit on a grid ten times finer than the table. At 50 points per decade this is
/// ≈ 1e-4 relative for aLIGO and, for LISA, a few 1e-3 near 1 Hz where the cos²(f/f*) ripple of the
/// acceleration term curves the log-log curve.
#[test]
fn table_reproduces_a_sampled_fit() {
    for (curve, lo, hi) in [(aligo(), 10.0f64, 1e4f64), (lisa(Some(4.0)), 1e-5, 1.0)] {
        let n = 50.0;
        let rows = (n * (hi / lo).log10()).round() as usize;
        let h = std::f64::consts::LN_10 / n;
        let mut csv = String::from("frequency,asd\n");
        let fs: Vec<f64> = (0..=rows).map(|i| if i == rows { hi } else { lo * (h * i as f64).exp() }).collect();
        for &f in &fs {
            csv.push_str(&format!("{f:.17e},{:.17e}\n", curve.asd(f).unwrap()));
        }
        let table = NoiseCurve::from_csv("sampled", &csv, curve.response()).unwrap();
        assert_eq!(table.band(), (lo, hi));
        // max |ψ''| over the band on a grid of step h/10 (second differences of the fit).
        let psi = |y: f64| curve.asd(y.exp().clamp(lo, hi)).unwrap().ln();
        let d = h / 10.0;
        let steps = ((hi / lo).ln() / d) as usize;
        let kmax = (1..steps).map(|i| {
            let y = lo.ln() + d * i as f64;
            ((psi(y + d) - 2.0 * psi(y) + psi(y - d)) / (d * d)).abs()
        }).fold(0.0f64, f64::max);
        let bound = h * h / 8.0 * kmax;
        let mut worst = 0.0f64;
        for w in fs.windows(2) {
            let mid = (w[0] * w[1]).sqrt();
            worst = worst.max((table.asd(mid).unwrap() / curve.asd(mid).unwrap()).ln().abs());
        }
        assert!(worst <= 1.01 * bound, "{}: worst {worst} > bound {bound}", curve.name());
        // The bound is a fair figure, not a loose one: the worst midpoint comes within 3× of it.
        assert!(worst >= bound / 3.0, "{}: worst {worst}, bound {bound}", curve.name());
        if curve == aligo() {
            assert!(bound < 2e-3, "aLIGO bound {bound}");
        } else {
            assert!(bound < 1e-2, "LISA bound {bound}");
        }
    }
}
