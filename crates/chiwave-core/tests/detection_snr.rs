//! Signal-to-noise ratio checks against routes outside the SNR code: for a flat noise curve ρ²
//! equals (4/S₀)∫|h̃|²df computed here from the time-domain strain rate by an FFT (Parseval); the
//! memory's low-frequency tail against the waveform's own asymptotic memory; ρ ∝ 1/D; the optimal
//! orientation against a search over polarisation angles; the sky average against a grid average of
//! the antenna pattern; a table sampled from a fit against the fit.

// Index loops over FFT bins are clearer than iterator chains here.
#![allow(clippy::needless_range_loop)]

use chiwave_core::detection::*;
use chiwave_core::numeric::{gauss_legendre, rel_diff};
use chiwave_core::units::{astro::MPC, codata2018::C, SUN_LENGTH_M};
use chiwave_core::waveform::{antenna_pattern, Binary, DirectionWaveform, Frame, DEFAULT_X_NODES};
use num_complex::Complex64;
use std::f64::consts::PI;

const L20: f64 = 20.0 * SUN_LENGTH_M;

fn flat_noise(lo: f64, hi: f64, asd: f64) -> NoiseCurve {
    NoiseCurve::from_csv("flat", &format!("{lo:.17e},{asd:e}\n{hi:.17e},{asd:e}\n"), Response::Interferometer).unwrap()
}

/// In-place iterative radix-2 FFT with the e^{+i2πjk/n} sign (Cooley & Tukey 1965; common
/// practice), written here so that the reference does not share code with the closed form.
fn fft(a: &mut [Complex64]) {
    let n = a.len();
    let mut j = 0;
    for i in 1..n {
        let mut bit = n >> 1;
        while j & bit != 0 {
            j ^= bit;
            bit >>= 1;
        }
        j |= bit;
        if i < j {
            a.swap(i, j);
        }
    }
    let mut len = 2;
    while len <= n {
        let w = Complex64::from_polar(1.0, 2.0 * PI / len as f64);
        for start in (0..n).step_by(len) {
            let mut wk = Complex64::new(1.0, 0.0);
            for k in 0..len / 2 {
                let u = a[start + k];
                let v = a[start + k + len / 2] * wk;
                a[start + k] = u + v;
                a[start + k + len / 2] = u - v;
                wk *= w;
            }
        }
        len <<= 1;
    }
}

/// For a flat PSD S₀ on [f_a, f_b], ρ² = (4/S₀)∫|F₊h̃₊ + F×h̃×|² df. Reference: the strain rate
/// Ḣ(u) of the waveform sampled in the time domain (`DirectionWaveform::strain_rate`, no Bessel
/// functions), its FFT gives Ḣ̃ on a grid of ω, |H̃|² = |Ḣ̃|²/ω², and the trapezoidal rule on the
/// grid bins between f_a and f_b (chosen on bins) gives the integral (Parseval's theorem links the
/// two sides of the transform).
#[test]
fn flat_noise_matches_fft_of_the_time_domain_rate() {
    let sys = Binary::from_speed(0.5, 0.5, 0.3, 20.0).unwrap();
    let (theta, phi) = (1.0, 0.4);
    let d = MPC;
    let t_m = L20 / C;
    let w = DirectionWaveform::new(&sys, Frame::Cm, theta, phi, DEFAULT_X_NODES).unwrap();
    // Window of n du = 2^20 GM/c³ (the burst lasts b/v ≈ 67) sampled every 4 GM/c³: the spectrum
    // at the Nyquist frequency π/4 is below e^{−80} of its scale (the burst's shortest time
    // scale is ≈ 57 GM/c³), so aliasing is negligible.
    let n = 1usize << 18;
    let du = 4.0;
    let mut a: Vec<[Complex64; 2]> = Vec::with_capacity(n);
    let mut p = vec![Complex64::new(0.0, 0.0); n];
    let mut x = vec![Complex64::new(0.0, 0.0); n];
    for j in 0..n {
        let u = (j as f64 - (n / 2) as f64) * du;
        let r = w.strain_rate(u);
        p[j] = Complex64::new(r[0] * du, 0.0);
        x[j] = Complex64::new(r[1] * du, 0.0);
    }
    fft(&mut p);
    fft(&mut x);
    let dw = 2.0 * PI / (n as f64 * du);
    for k in 0..n / 2 {
        a.push([p[k], x[k]]);
    }
    // Band on bins: from 640 Δω (6.2 Hz) to 80000 Δω (774 Hz).
    let (ka, kb) = (640usize, 80_000usize);
    let f_of = |k: usize| k as f64 * dw / (2.0 * PI * t_m);
    let (fa, fb) = (f_of(ka), f_of(kb));
    let s0_asd = 1e-23;
    let noise = flat_noise(fa, fb, s0_asd);
    let burst = Burst::new(&sys, Frame::Cm, theta, phi, L20, d, DEFAULT_X_NODES).unwrap();
    let r = snr(&burst, &noise, &SnrOptions { rel_tol: 1e-10, ..SnrOptions::default() }).unwrap();
    assert_eq!((r.f_low_hz, r.f_high_hz.min(fb)), (fa, fb));
    // Γ_ab from the FFT: 4/S₀ × (L/D)² T/(2π) ∫ Re(H̃_a H̃_b*) dω, trapezoid over the bins.
    let scale = 4.0 / (s0_asd * s0_asd) * (L20 / d).powi(2) * t_m / (2.0 * PI);
    let mut g = [0.0; 3];
    for k in ka..=kb {
        let wgt = if k == ka || k == kb { 0.5 } else { 1.0 };
        let om = k as f64 * dw;
        let [hp, hx] = a[k];
        let inv = 1.0 / (om * om);
        g[0] += wgt * hp.norm_sqr() * inv;
        g[1] += wgt * hx.norm_sqr() * inv;
        g[2] += wgt * (hp * hx.conj()).re * inv;
    }
    for v in g.iter_mut() {
        *v *= scale * dw;
    }
    let gm = r.gamma_matrix;
    // The FFT side carries the truncation of the time window: the strain's c/r part makes Ḣ fall
    // off only as 1/u², which leaves a relative error ∝ 1/(ω_a U)² (measured: 4× smaller per
    // doubling of the window; 4e-7 here). The closed form is integrated to 1e-10.
    let tol = 2e-6;
    assert!(rel_diff(gm[0][0], g[0]) < tol, "{} vs {}", gm[0][0], g[0]);
    assert!(rel_diff(gm[1][1], g[1]) < tol, "{} vs {}", gm[1][1], g[1]);
    assert!((gm[0][1] - g[2]).abs() < tol * (g[0] + g[1]), "{} vs {}", gm[0][1], g[2]);
    // ρ for the given antenna is the quadratic form.
    let (fp, fx) = antenna_pattern(0.7, 1.9, 0.3);
    let rho2_fft = fp * fp * g[0] + fx * fx * g[1] + 2.0 * fp * fx * g[2];
    assert!(rel_diff(r.snr_for(fp, fx).unwrap().powi(2), rho2_fft) < tol);
}

/// Below the burst's corner frequency the strain spectrum is the memory's tail:
/// f |h̃(f)| → |Δh| (L/D)/(2π), with Δh the late-minus-early strain of the time-domain waveform.
#[test]
fn low_frequency_tail_is_the_memory() {
    for (v, b, frame, th, ph) in [(0.01, 200.0, Frame::Cm, 0.8, 0.3), (0.5, 30.0, Frame::Rest2, 2.0, -1.0), (0.9, 10.0, Frame::Cm, 0.4, 2.5)] {
        let sys = Binary::from_speed(0.5, 0.5, v, b).unwrap();
        let burst = Burst::new(&sys, frame, th, ph, L20, MPC, DEFAULT_X_NODES).unwrap();
        let m = burst.waveform().memory();
        let f = 1e-5 * burst.split_frequency_hz();
        let h = burst.polarisations(f);
        for p in 0..2 {
            let expect = m[p].abs() * L20 / MPC / (2.0 * PI);
            assert!(rel_diff(f * h[p].norm(), expect) < 1e-4, "v={v} pol {p}: {} vs {expect}", f * h[p].norm());
        }
    }
}

#[test]
fn snr_scales_as_one_over_distance() {
    let sys = Binary::from_speed(0.5, 0.5, 0.05, 30.0).unwrap();
    let n = NoiseCurve::AdvancedLigo;
    let b1 = Burst::new(&sys, Frame::Cm, 0.3, 0.2, L20, MPC, SNR_X_NODES).unwrap();
    let b3 = Burst::new(&sys, Frame::Cm, 0.3, 0.2, L20, 3.0 * MPC, SNR_X_NODES).unwrap();
    let r1 = snr(&b1, &n, &SnrOptions::default()).unwrap();
    let r3 = snr(&b3, &n, &SnrOptions::default()).unwrap();
    // The integrand scales by exactly 1/9, so every adaptive decision is the same: rounding only.
    assert!(rel_diff(r1.snr.unwrap(), 3.0 * r3.snr.unwrap()) < 1e-13);
    assert!(rel_diff(r1.snr_optimal.unwrap(), 3.0 * r3.snr_optimal.unwrap()) < 1e-13);
    assert!(rel_diff(r1.snr_sky_averaged, 3.0 * r3.snr_sky_averaged) < 1e-13);
    assert!(rel_diff(r1.horizon_distance_m, r3.horizon_distance_m) < 1e-13);
    let moved = r1.at_distance(3.0 * MPC).unwrap();
    assert!(rel_diff(moved.snr.unwrap(), r3.snr.unwrap()) < 1e-13);
    // D_h = D ρ/ρ_thr with the optimal ρ, threshold 8 by default.
    assert!(rel_diff(r1.horizon_distance_m, MPC * r1.snr_optimal.unwrap() / 8.0) < 1e-15);
    let r12 = snr(&b1, &n, &SnrOptions { threshold: 12.0, ..SnrOptions::default() }).unwrap();
    assert!(rel_diff(r12.horizon_distance_m * 12.0, r1.horizon_distance_m * 8.0) < 1e-15);
}

/// The optimal ρ is at least ρ for any detector orientation, and a search over the polarisation
/// angle of an interferometer with the source overhead (F₊, F×) = (cos 2ψ, sin 2ψ) reaches it.
#[test]
fn optimal_orientation_bounds_every_orientation() {
    let sys = Binary::from_speed(0.3, 0.7, 0.2, 12.0).unwrap();
    let burst = Burst::new(&sys, Frame::Cm, 1.1, 0.7, L20, MPC, SNR_X_NODES).unwrap();
    let r = snr(&burst, &NoiseCurve::AdvancedLigo, &SnrOptions::default()).unwrap();
    let opt = r.snr_optimal.unwrap();
    assert!(opt > 0.0);
    let mut best = 0.0f64;
    for i in 0..=40 {
        for j in 0..40 {
            for k in 0..20 {
                let (th, ph, psi) = (PI * i as f64 / 40.0, 2.0 * PI * j as f64 / 40.0, PI * k as f64 / 20.0);
                let (fp, fx) = antenna_pattern(th, ph, psi);
                let rho = r.snr_for(fp, fx).unwrap();
                assert!(rho <= opt * (1.0 + 1e-12), "θ={th} φ={ph} ψ={psi}: {rho} > {opt}");
            }
        }
    }
    // ψ search overhead (θ = 0, φ = 0), then a golden-section refinement.
    let f = |psi: f64| {
        let (fp, fx) = antenna_pattern(0.0, 0.0, psi);
        r.snr_for(fp, fx).unwrap()
    };
    let mut arg = 0.0;
    for k in 0..3600 {
        let psi = PI * k as f64 / 3600.0;
        if f(psi) > best {
            best = f(psi);
            arg = psi;
        }
    }
    let (mut a, mut b) = (arg - PI / 3600.0, arg + PI / 3600.0);
    let g = 0.5 * (5f64.sqrt() - 1.0);
    while b - a > 1e-12 {
        let (x1, x2) = (b - g * (b - a), a + g * (b - a));
        if f(x1) < f(x2) {
            a = x1;
        } else {
            b = x2;
        }
    }
    assert!(rel_diff(f(0.5 * (a + b)), opt) < 1e-12, "{} vs {opt}", f(0.5 * (a + b)));
}

/// Sky- and polarisation-averaged ρ² = (Γ₊₊ + Γ××)/5 (⟨F₊²⟩ = ⟨F×²⟩ = 1/5, ⟨F₊F×⟩ = 0 for a 90°
/// interferometer): checked by averaging ρ² = Fᵀ Γ F over a product grid in cos θ (Gauss–Legendre),
/// φ and ψ (uniform), exact for the trigonometric polynomials of the antenna pattern.
#[test]
fn sky_average_matches_grid_average_of_antenna_pattern() {
    let sys = Binary::from_speed(0.5, 0.5, 0.4, 8.0).unwrap();
    let burst = Burst::new(&sys, Frame::Cm, 0.6, -0.5, L20, MPC, SNR_X_NODES).unwrap();
    let r = snr(&burst, &NoiseCurve::AdvancedLigo, &SnrOptions::default()).unwrap();
    let (x, w) = gauss_legendre(12);
    let (nphi, npsi) = (16, 8);
    let mut avg = 0.0;
    for (ct, wt) in x.iter().zip(&w) {
        for j in 0..nphi {
            for k in 0..npsi {
                let (fp, fx) = antenna_pattern(ct.acos(), 2.0 * PI * j as f64 / nphi as f64, PI * k as f64 / npsi as f64);
                avg += 0.5 * wt / (nphi * npsi) as f64 * r.snr_for(fp, fx).unwrap().powi(2);
            }
        }
    }
    assert!(rel_diff(avg, r.snr_sky_averaged.powi(2)) < 1e-13, "{avg} vs {}", r.snr_sky_averaged.powi(2));
    let g = r.gamma_matrix;
    assert!(rel_diff(r.snr_sky_averaged.powi(2), (g[0][0] + g[1][1]) / 5.0) < 1e-15);
}

/// LISA's curve contains the sky average: ρ̄² = Γ₊₊ + Γ×× and no orientation-specific value; an
/// antenna pattern given with it is refused.
#[test]
fn sky_averaged_curve_combination() {
    let sys = Binary::from_speed(0.5, 0.5, 0.01, 30.0).unwrap();
    let burst = Burst::new(&sys, Frame::Cm, 0.9, 0.1, L20, 10.0 * MPC, SNR_X_NODES).unwrap();
    let lisa = NoiseCurve::from_name("lisa-4yr").unwrap();
    let r = snr(&burst, &lisa, &SnrOptions::default()).unwrap();
    assert!(r.snr.is_none() && r.snr_optimal.is_none() && r.snr_for(1.0, 0.0).is_none());
    let g = r.gamma_matrix;
    assert!(rel_diff(r.snr_sky_averaged.powi(2), g[0][0] + g[1][1]) < 1e-15);
    assert_eq!(r.horizon_basis, HorizonBasis::SkyAveraged);
    assert!(r.flags.iter().any(|f| f.key == "sky_averaged_curve"));
    assert_eq!(r.weights(), [1.0, 1.0, 0.0]);
    let e = snr(&burst, &lisa, &SnrOptions { antenna: Some((1.0, 0.0)), ..SnrOptions::default() }).unwrap_err();
    assert_eq!(e.field(), "antenna");
    // The same sky-averaged combination for a table declared sky-averaged (LISA sampled into CSV).
    let mut csv = String::new();
    for i in 0..=500 {
        let f = 1e-5 * 10f64.powf(5.0 * i as f64 / 500.0);
        csv.push_str(&format!("{f:e},{:e}\n", lisa.asd(f.min(1.0)).unwrap()));
    }
    let t = NoiseCurve::from_csv("lisa-table", &csv, Response::SkyAveraged).unwrap();
    let rt = snr(&burst, &t, &SnrOptions::default()).unwrap();
    // 100 rows per decade: the interpolation error of the PSD is ≲ 1e-3 (bound of
    // detection_noise.rs scaled by (50/100)² and doubled for PSD), averaged further by the integral.
    assert!(rel_diff(rt.snr_sky_averaged, r.snr_sky_averaged) < 1e-3, "{} vs {}", rt.snr_sky_averaged, r.snr_sky_averaged);
}

/// A table sampled from the aLIGO fit gives the fit's ρ to the interpolation accuracy.
#[test]
fn sampled_table_reproduces_fit_snr() {
    let fit = NoiseCurve::AdvancedLigo;
    let mut csv = String::from("# sampled aLIGO fit, 100 rows per decade\nf,asd\n");
    for i in 0..=300 {
        let f = 10.0 * 10f64.powf(3.0 * i as f64 / 300.0);
        csv.push_str(&format!("{f:.17e},{:.17e}\n", fit.asd(f.min(1e4)).unwrap()));
    }
    let table = NoiseCurve::from_csv("aligo-table", &csv, Response::Interferometer).unwrap();
    for (v, b) in [(0.05, 15.0), (0.3, 10.0), (0.6, 20.0)] {
        let sys = Binary::from_speed(0.5, 0.5, v, b).unwrap();
        let burst = Burst::new(&sys, Frame::Cm, 0.5, 0.5, L20, MPC, SNR_X_NODES).unwrap();
        let a = snr(&burst, &fit, &SnrOptions::default()).unwrap();
        let t = snr(&burst, &table, &SnrOptions::default()).unwrap();
        // PSD interpolation error ≤ 2 × (1.7e-3)/4 ≈ 9e-4 (100 rows per decade); ρ: half of that.
        assert!(rel_diff(a.snr_optimal.unwrap(), t.snr_optimal.unwrap()) < 5e-4, "v={v}: {:?} vs {:?}", a.snr_optimal, t.snr_optimal);
    }
}

/// The default Feynman-parameter node count for detection (24) agrees with the waveform default
/// (40, about 1e-12) to far better than ρ needs.
#[test]
fn snr_node_count_is_enough() {
    for (v, b) in [(0.05, 20.0), (0.5, 10.0), (0.95, 10.0)] {
        let sys = Binary::from_speed(0.5, 0.5, v, b).unwrap();
        for noise in [NoiseCurve::AdvancedLigo, NoiseCurve::from_name("lisa").unwrap()] {
            let lo = Burst::new(&sys, Frame::Cm, 0.7, 0.2, L20, MPC, SNR_X_NODES).unwrap();
            let hi = Burst::new(&sys, Frame::Cm, 0.7, 0.2, L20, MPC, DEFAULT_X_NODES).unwrap();
            let a = snr(&lo, &noise, &SnrOptions::default()).unwrap();
            let b2 = snr(&hi, &noise, &SnrOptions::default()).unwrap();
            if b2.snr_sky_averaged > 0.0 {
                assert!(rel_diff(a.snr_sky_averaged, b2.snr_sky_averaged) < 1e-6, "v={v} {}: {} vs {}", noise.name(), a.snr_sky_averaged, b2.snr_sky_averaged);
            }
        }
    }
}

/// f_peak is the maximum of the polarisation-summed integrand per ln f (dense scan here), and the
/// low-frequency share is 0 or 1 when the split lies below or above the band.
#[test]
fn peak_and_low_frequency_share() {
    let sys = Binary::from_speed(0.5, 0.5, 0.2, 12.0).unwrap();
    let burst = Burst::new(&sys, Frame::Cm, 1.2, 0.3, L20, MPC, SNR_X_NODES).unwrap();
    let n = NoiseCurve::AdvancedLigo;
    let r = snr(&burst, &n, &SnrOptions::default()).unwrap();
    let (lo, hi) = (r.f_low_hz, r.f_high_hz);
    let g = |f: f64| {
        let p = burst.power(f);
        4.0 * f * (p[0] + p[1]) / n.psd(f).unwrap()
    };
    let mut best = (0.0, lo);
    for i in 0..=20000 {
        let f = lo * (hi / lo).powf(i as f64 / 20000.0);
        if g(f) > best.0 {
            best = (g(f), f);
        }
    }
    // Scan resolution: (hi/lo)^(1/20000) − 1 ≈ 2e-4 in f.
    assert!(rel_diff(r.f_peak_hz, best.1) < 5e-4, "{} vs {}", r.f_peak_hz, best.1);
    assert!(g(r.f_peak_hz) >= best.0 * (1.0 - 1e-9));
    let below = snr(&burst, &n, &SnrOptions { split_hz: Some(1.0), ..SnrOptions::default() }).unwrap();
    let above = snr(&burst, &n, &SnrOptions { split_hz: Some(1e5), ..SnrOptions::default() }).unwrap();
    assert_eq!((below.low_frequency_share, above.low_frequency_share), (0.0, 1.0));
    // A split inside the band divides ρ² between the parts exactly (the split is a break point).
    let mid = snr(&burst, &n, &SnrOptions { split_hz: Some(r.f_peak_hz), ..SnrOptions::default() }).unwrap();
    assert!(mid.low_frequency_share > 0.05 && mid.low_frequency_share < 0.95);
    // Default split: the corner frequency of the burst; v/(2πb) for v ≪ c (common practice).
    let slow = Binary::from_speed(0.5, 0.5, 1e-3, 100.0).unwrap();
    let sb = Burst::new(&slow, Frame::Cm, 1.0, 0.0, L20, MPC, SNR_X_NODES).unwrap();
    let fchar = chiwave_core::waveform::characteristic_frequency(1e-3, 100.0 * L20);
    assert!(rel_diff(sb.split_frequency_hz(), fchar) < 2e-3);
}

#[test]
fn cautions_and_errors() {
    // A loud, slow burst in LISA: memory-dominated, horizon far beyond z = 0.1.
    let sys = Binary::from_speed(0.5, 0.5, 0.3, 5.0).unwrap();
    let burst = Burst::new(&sys, Frame::Cm, 0.5, 0.0, 2e6 * SUN_LENGTH_M, 100.0 * MPC, SNR_X_NODES).unwrap();
    let r = snr(&burst, &NoiseCurve::from_name("lisa").unwrap(), &SnrOptions::default()).unwrap();
    let keys: Vec<&str> = r.flags.iter().map(|f| f.key).collect();
    assert!(r.horizon_redshift > 0.1 && keys.contains(&"cosmological_horizon"), "{keys:?} z={}", r.horizon_redshift);
    // A 20 M☉ burst in LISA at b = 20 GM/c²: its spectrum lies far above the band, ρ² comes from
    // the memory.
    let s2 = Binary::from_speed(0.5, 0.5, 0.1, 20.0).unwrap();
    let b2 = Burst::new(&s2, Frame::Cm, 0.5, 0.0, L20, MPC, SNR_X_NODES).unwrap();
    let r2 = snr(&b2, &NoiseCurve::from_name("lisa").unwrap(), &SnrOptions::default()).unwrap();
    assert!(r2.low_frequency_share > 0.99 && r2.flags.iter().any(|f| f.key == "memory_dominated"));
    // Its aLIGO spectrum ends well below 10 Hz at b = 1e4: no signal, ρ = 0, flagged.
    let s3 = Binary::from_speed(0.5, 0.5, 0.01, 1e4).unwrap();
    let b3 = Burst::new(&s3, Frame::Cm, 0.5, 0.0, L20, MPC, SNR_X_NODES).unwrap();
    let r3 = snr(&b3, &NoiseCurve::AdvancedLigo, &SnrOptions::default()).unwrap();
    assert!(r3.snr_optimal == Some(0.0) && r3.flags.iter().any(|f| f.key == "no_signal_in_band"));
    // A slow, wide encounter in LISA peaks near 0.2 mHz: part of ρ² comes from below 0.1 mHz,
    // where the LISA model is extrapolated; the share is reported and flagged.
    let s4 = Binary::from_speed(0.5, 0.5, 1e5 / C, 1e4).unwrap();
    let b4 = Burst::new(&s4, Frame::Cm, 0.5, 0.3, L20, MPC, SNR_X_NODES).unwrap();
    let r4 = snr(&b4, &NoiseCurve::from_name("lisa").unwrap(), &SnrOptions::default()).unwrap();
    assert!(r4.extrapolated_share > 0.01 && r4.extrapolated_share < 0.5, "{}", r4.extrapolated_share);
    assert!(r4.flags.iter().any(|f| f.key == "noise_extrapolated"));
    // Bad options name their field.
    let bad = [
        (SnrOptions { antenna: Some((1.5, 0.0)), ..SnrOptions::default() }, "antenna"),
        (SnrOptions { threshold: 0.0, ..SnrOptions::default() }, "snr_threshold"),
        (SnrOptions { rel_tol: 1.0, ..SnrOptions::default() }, "rel_tol"),
        (SnrOptions { split_hz: Some(-1.0), ..SnrOptions::default() }, "split_hz"),
    ];
    for (o, field) in bad {
        assert_eq!(snr(&burst, &NoiseCurve::AdvancedLigo, &o).unwrap_err().field(), field);
    }
    assert_eq!(Burst::new(&sys, Frame::Cm, 0.5, 0.0, L20, -1.0, SNR_X_NODES).unwrap_err().field(), "distance");
    assert_eq!(Burst::new(&sys, Frame::Cm, 4.0, 0.0, L20, MPC, SNR_X_NODES).unwrap_err().field(), "theta");
    // Everything finite, and the result serialises for the CLI.
    let json = serde_json::to_string(&r).unwrap();
    assert!(json.contains("\"snr_sky_averaged\"") && !json.contains("NaN"));
}
