//! EM leading-order waveform: one time-domain waveform of 2000 samples at one sky position,
//! the Bessel spectrum at 2000 frequencies, and the radiated energies with interference.
use chiwave_core::waveform::em::{energies, field, spectrum, EmSystem};
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn bench(c: &mut Criterion) {
    let s = EmSystem::new(1.0, 0.7, 1.0, -0.8, 1.5, 1.0).expect("valid demo system");
    let u: Vec<f64> = (0..2000).map(|i| -20.0 + 40.0 * i as f64 / 1999.0).collect();
    let w: Vec<f64> = (0..2000).map(|i| 5.0 * i as f64 / 1999.0).collect();
    c.bench_function("em_field_2000_samples", |b| b.iter(|| field(black_box(&s), 1.1, 0.7, black_box(&u))));
    c.bench_function("em_spectrum_2000_frequencies", |b| {
        b.iter(|| spectrum(black_box(&s), 1.1, 0.7, black_box(&w)))
    });
    let mut g = c.benchmark_group("em_energies");
    g.sample_size(10);
    g.bench_function("gamma_1.5", |b| b.iter(|| energies(black_box(&s))));
    let s100 = EmSystem::new(1.0, 0.7, 1.0, -0.8, 100.0, 1.0).expect("valid demo system");
    g.bench_function("gamma_100", |b| b.iter(|| energies(black_box(&s100))));
    g.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
