//! Native reference timing for the wasm timing page (tests/e2e/bench.mjs): the same
//! 1000-point α(b) sweep (b = 1 … 10⁶ M, 8 partial sums) that the page times through wasm.
//! Prints figures; asserts nothing. Run: cargo run --release -p chiwave-web --example native_sweep
use chiwave_core::deflection::{sweep, LightRequest};
use std::time::Instant;

fn main() {
    let req = LightRequest::geometric(10.0);
    let mut best = f64::INFINITY;
    let mut total = 0.0;
    let runs = 30;
    for _ in 0..runs {
        let t = Instant::now();
        let s = sweep(&req, 1.0, 1e6, 1000);
        let dt = t.elapsed().as_secs_f64() * 1e3;
        assert!(s.is_ok(), "sweep failed: {s:?}");
        best = best.min(dt);
        total += dt;
    }
    println!("native sweep 1000 points: best {best:.3} ms, mean {:.3} ms over {runs} runs", total / runs as f64);
}
