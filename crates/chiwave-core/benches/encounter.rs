//! Encounter benchmarks: one full evaluation (all PM orders, E_rad, J_rad, impulse, test-body
//! quadrature, flags; the strong-field estimate once merged) and a 500-point χ(b) sweep.
use chiwave_core::encounter::{chi_sweep, EncounterRequest, SweepVar};
use criterion::{black_box, criterion_group, criterion_main, Criterion};

fn bench(c: &mut Criterion) {
    let req: EncounterRequest = serde_json::from_str(r#"{"m1": "30Msun", "m2": "20Msun", "v": "0.3c", "b": "2000km"}"#).unwrap();
    c.bench_function("encounter_full_evaluation", |b| b.iter(|| black_box(&req).evaluate().unwrap()));
    let near: EncounterRequest = serde_json::from_str(r#"{"nu": 0.25, "gamma": 1.5, "j": 7.2}"#).unwrap();
    c.bench_function("encounter_full_evaluation_near_capture", |b| b.iter(|| black_box(&near).evaluate().unwrap()));
    let em: EncounterRequest = serde_json::from_str(r#"{"force": "em", "nu": 0.2, "gamma": 1.2, "b": 100, "q1": 1, "q2": -1}"#).unwrap();
    c.bench_function("encounter_em_evaluation", |b| b.iter(|| black_box(&em).evaluate().unwrap()));
    let sweep: EncounterRequest = serde_json::from_str(r#"{"nu": 0.25, "gamma": 1.5}"#).unwrap();
    c.bench_function("encounter_chi_sweep_500", |b| b.iter(|| chi_sweep(black_box(&sweep), SweepVar::B, 3.0, 3000.0, 500).unwrap()));
}

criterion_group!(benches, bench);
criterion_main!(benches);
