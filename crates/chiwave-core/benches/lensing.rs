//! Benchmarks of the point-lens amplification factor F(w, y), one case per evaluation method,
//! and of a full lens request and a 200-point amplification curve.

use chiwave_core::lensing::wave::{amplification_curve, amplification_factor};
use chiwave_core::lensing::LensRequest;
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn bench(c: &mut Criterion) {
    let mut g = c.benchmark_group("amplification_factor");
    for (name, w, y) in [
        ("series_w1_y0.3", 1.0, 0.3),
        ("continuation_w10_y1", 10.0, 1.0),
        ("continuation_w100_y1", 100.0, 1.0),
        ("continuation_w1000_y1", 1000.0, 1.0),
        ("asymptotic_w1000_y10", 1000.0, 10.0),
        ("asymptotic_w1_y100", 1.0, 100.0),
    ] {
        g.bench_function(name, |b| b.iter(|| amplification_factor(black_box(w), black_box(y))));
    }
    g.finish();
    c.bench_function("amplification_curve_y1_200pts_w0.01_to_1000", |b| {
        b.iter(|| amplification_curve(black_box(1.0), 0.01, 1000.0, 200))
    });
    let req = LensRequest {
        mass: "30Msun".into(),
        lens_distance: "1Gpc".into(),
        source_distance: "2Gpc".into(),
        offset: 0.5,
        frequency: Some("100Hz".into()),
        lens_redshift: 0.5,
        tolerance: None,
    };
    c.bench_function("lens_request_with_frequency", |b| b.iter(|| black_box(&req).evaluate()));
}

criterion_group!(benches, bench);
criterion_main!(benches);
