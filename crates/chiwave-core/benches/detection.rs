//! Detection and capture timings: the SNR of one encounter in Advanced LIGO and in LISA (burst
//! spectrum set-up plus the adaptive frequency integral), and one capture estimate. These are the
//! per-row costs a batch run pays.
use chiwave_core::detection::{snr, Burst, NoiseCurve, SnrOptions, SNR_X_NODES};
use chiwave_core::{encounter::capture::capture, two_body::RelativeSpeed};
use chiwave_core::units::{astro::MPC, SUN_LENGTH_M};
use chiwave_core::waveform::{Binary, Frame};
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn bench(c: &mut Criterion) {
    let l = 20.0 * SUN_LENGTH_M;
    // 10 + 10 M☉ at v = 0.05 c (15 000 km/s), b = 15 GM/c²: a burst near 10 Hz (aLIGO) whose
    // memory reaches the LISA band.
    let sys = Binary::from_speed(0.5, 0.5, 0.05, 15.0).unwrap();
    let aligo = NoiseCurve::AdvancedLigo;
    let lisa = NoiseCurve::from_name("lisa-4yr").unwrap();
    let opts = SnrOptions::default();
    c.bench_function("snr_aligo_one_encounter", |b| {
        b.iter(|| {
            let burst = Burst::new(black_box(&sys), Frame::Cm, 0.7, 0.3, l, 10.0 * MPC, SNR_X_NODES).unwrap();
            snr(&burst, &aligo, &opts).unwrap().snr_sky_averaged
        })
    });
    c.bench_function("snr_lisa_4yr_one_encounter", |b| {
        b.iter(|| {
            let burst = Burst::new(black_box(&sys), Frame::Cm, 0.7, 0.3, l, 10.0 * MPC, SNR_X_NODES).unwrap();
            snr(&burst, &lisa, &opts).unwrap().snr_sky_averaged
        })
    });
    let boost = RelativeSpeed::from_v(1e5 / 299_792_458.0).unwrap();
    c.bench_function("capture_estimate", |b| {
        b.iter(|| capture(10.0, 10.0, black_box(&boost), black_box(3e4), Some(l)).unwrap().b_max_relativistic_gm)
    });
}
criterion_group!(benches, bench);
criterion_main!(benches);
