//! Speed of the strong-field EOB estimate (target: one estimate ≤ ~20 µs natively).
use chiwave_core::encounter::eob::{critical_j, estimate, orbit};
use criterion::{black_box, criterion_group, criterion_main, Criterion};
use std::f64::consts::PI;

/// χ_1, χ_2, χ_3^cons + χ_3^rad (Damour 2016, arXiv:1609.00354; Bini & Damour 2017,
/// arXiv:1706.06877; Bern et al. 2019, arXiv:1901.04424; Damour 2020, arXiv:2010.01641) at γ, ν.
fn chi_total(g: f64, nu: f64) -> Vec<f64> {
    let p = (g * g - 1.0).sqrt();
    let h = (1.0 + 2.0 * nu * (g - 1.0)).sqrt();
    let v = p / g;
    let schw = (64.0 * p.powi(6) + 72.0 * p.powi(4) + 12.0 * p * p - 1.0) / (3.0 * p.powi(3));
    let cbar = 2.0 / 3.0 * g * (14.0 * g * g + 25.0)
        + 4.0 * (4.0 * g.powi(4) - 12.0 * g * g - 3.0) / p * ((g - 1.0) / 2.0).sqrt().asinh();
    let i = -16.0 / 3.0 + 2.0 / (v * v) + 2.0 * (3.0 * v * v - 1.0) / v.powi(3) * v.atanh();
    vec![
        (2.0 * g * g - 1.0) / p,
        3.0 * PI / 8.0 * (5.0 * g * g - 1.0) / h,
        schw - 2.0 * nu * p / (h * h) * cbar + nu * (2.0 * g * g - 1.0).powi(2) * i / (h * h),
    ]
}

fn bench(c: &mut Criterion) {
    let (g, nu) = (1.5, 0.25);
    let chi = chi_total(g, nu);
    let jc = critical_j(g, nu, &chi).unwrap();
    c.bench_function("eob estimate j = 8 (γ = 1.5, ν = 1/4)", |b| {
        b.iter(|| estimate(black_box(g), black_box(nu), black_box(8.0), black_box(&chi)))
    });
    c.bench_function("eob estimate j = 1e4", |b| {
        b.iter(|| estimate(black_box(g), black_box(nu), black_box(1e4), black_box(&chi)))
    });
    c.bench_function("eob estimate near capture j = (1 + 1e-6) j_crit", |b| {
        b.iter(|| estimate(black_box(g), black_box(nu), black_box(jc * (1.0 + 1e-6)), black_box(&chi)))
    });
    c.bench_function("eob estimate captured j = 0.5 j_crit", |b| {
        b.iter(|| estimate(black_box(g), black_box(nu), black_box(0.5 * jc), black_box(&chi)))
    });
    c.bench_function("eob critical_j", |b| b.iter(|| critical_j(black_box(g), black_box(nu), black_box(&chi))));
    c.bench_function("eob orbit n = 400", |b| {
        b.iter(|| orbit(black_box(g), black_box(nu), black_box(8.0), black_box(&chi), 400))
    });
}

criterion_group!(benches, bench);
criterion_main!(benches);
