//! Speed of the light-deflection core: one exact α(b) (target ≥ 1e6 evaluations/s natively),
//! a 1000-point α(b) sweep with 8 partial sums, and the Kerr / Reissner–Nordström quadratures.

use chiwave_core::deflection::{kerr, reissner_nordstrom, schwarzschild, sweep, LightRequest};
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn bench(c: &mut Criterion) {
    // A spread of impact parameters covering both evaluation branches of Darwin's form.
    let bs: Vec<f64> = (0..64).map(|i| 5.3 * 1.15f64.powi(i)).collect();
    c.bench_function("schwarzschild_exact_alpha_64_b", |bch| {
        bch.iter(|| {
            let mut s = 0.0;
            for &b in &bs {
                if let Ok(d) = schwarzschild::deflection(black_box(b)) {
                    s += d.alpha().unwrap_or(0.0);
                }
            }
            s
        })
    });
    c.bench_function("schwarzschild_exact_alpha_b10", |bch| bch.iter(|| schwarzschild::deflection(black_box(10.0))));
    c.bench_function("schwarzschild_exact_alpha_b1e4", |bch| bch.iter(|| schwarzschild::deflection(black_box(1e4))));
    let req = LightRequest::geometric(10.0);
    c.bench_function("sweep_1000_points", |bch| bch.iter(|| sweep(black_box(&req), 1.0, 1e6, 1000)));
    c.bench_function("kerr_alpha_b10_a0.9", |bch| bch.iter(|| kerr::deflection(black_box(10.0), 0.9)));
    c.bench_function("rn_alpha_b10_q0.5", |bch| bch.iter(|| reissner_nordstrom::deflection(black_box(10.0), 0.5)));
    c.bench_function("evaluate_request_b10", |bch| bch.iter(|| black_box(&req).evaluate()));
}

criterion_group!(benches, bench);
criterion_main!(benches);
