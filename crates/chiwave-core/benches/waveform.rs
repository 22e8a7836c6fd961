//! Waveform speed targets: one 2000-sample waveform at one sky position (≤ 2 ms native) and a
//! full energy-balance sky integral (≤ 200 ms native).
use chiwave_core::waveform::{Binary, DirectionWaveform, Frame, SkyIntegrator, SkyOptions, DEFAULT_X_NODES};
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn bench(c: &mut Criterion) {
    let s = Binary::new(0.5, 0.5, 1.5, 20.0).unwrap();
    let u: Vec<f64> = (0..2000).map(|i| -400.0 + 0.4 * i as f64).collect();
    c.bench_function("waveform_2000_samples_cm", |b| {
        b.iter(|| {
            let w = DirectionWaveform::new(&s, Frame::Cm, 1.0, 0.4, DEFAULT_X_NODES).unwrap();
            let mut acc = 0.0;
            for &x in &u {
                let h = w.strain(black_box(x));
                acc += h[0] + h[1];
            }
            acc
        })
    });
    let mut g = c.benchmark_group("sky");
    g.sample_size(10);
    g.bench_function("energy_balance_sky_gamma1.5_1e-10", |b| {
        b.iter(|| {
            let opts = SkyOptions { n_polar: 16, n_azimuth: 20, n_u: 32, n_x: 32 };
            SkyIntegrator::new(&s, Frame::Rest2, opts).unwrap().run().energy
        })
    });
    g.bench_function("energy_balance_sky_default_gamma1.5", |b| {
        b.iter(|| SkyIntegrator::new(&s, Frame::Rest2, SkyOptions::for_gamma(1.5)).unwrap().run().energy)
    });
    g.finish();
}
criterion_group!(benches, bench);
criterion_main!(benches);
