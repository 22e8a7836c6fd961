// Timing of the wasm build in headless Chromium (figures printed, nothing asserted):
//  1. the 1000-point α(b) sweep (b = 1 … 10⁶ M, 8 partial sums) through the wasm export,
//     to compare with the native figure of `cargo run --release -p chiwave-web --example native_sweep`;
//  2. a page recompute + redraw after an input change in the light view (evaluate, table,
//     flags, both figures rendered in wasm and put into the DOM, plus the forced layout);
//  3. one gravitational waveform of 2000 samples at one sky position through `evaluate`
//     (no sky integral), to compare with `cargo bench -p chiwave-core --bench waveform`;
//  4. the waveform view: recompute after an input change (evaluate, tables, strain and
//     slow-motion figures, new waveform job), and the progressive sky work: total time to the
//     end and the longest single step (what one animation frame spends on it).
// Run after scripts/build-web.sh:  node tests/e2e/bench.mjs   (or npm run bench)
import { launch, pageUrl } from './support.mjs';

const browser = await launch();
try {
  const page = await browser.context.newPage();
  await page.goto(pageUrl());
  await page.waitForSelector('body[data-ready="true"]', { timeout: 20000 });
  const sweep = await page.evaluate(() => {
    const req = { kind: 'light', b: 10 };
    const times = [];
    for (let i = 0; i < 40; i++) {
      const t = performance.now();
      const s = window.chiwave.light_sweep(req, 1, 1e6, 1000);
      times.push(performance.now() - t);
      if (s.b.length !== 1000) throw new Error('sweep length');
    }
    times.sort((a, b) => a - b);
    return { best: times[0], median: times[times.length >> 1] };
  });
  const redraw = await page.evaluate(async () => {
    const input = document.getElementById('f-light-b');
    const view = document.getElementById('view-light');
    const frame = () => new Promise((r) => requestAnimationFrame(() => r()));
    const inner = [], outer = [];
    for (let i = 0; i < 40; i++) {
      input.value = String(8 + (i % 10) * 1.7);
      const t = performance.now();
      input.dispatchEvent(new Event('input', { bubbles: true }));
      await frame(); // the page recomputes in this animation frame
      void view.offsetHeight; // force style + layout of the new table and SVGs
      outer.push(performance.now() - t);
      inner.push(Number(view.dataset.lastMs));
    }
    const med = (a) => { const s = [...a].sort((x, y) => x - y); return s[s.length >> 1]; };
    return { recompute_median: med(inner), recompute_best: Math.min(...inner), with_layout_median: med(outer) };
  });
  const wave = await page.evaluate(() => {
    const req = { kind: 'waveform', m1: 1, m2: 2, gamma: 1.5, b: 40, theta: 0.9, phi: 0.3, u_min: -20, u_max: 20, u_unit: 'b_over_v', samples: 2000, energy_flux: false };
    const times = [];
    for (let i = 0; i < 60; i++) {
      const t = performance.now();
      const r = window.chiwave.evaluate(req);
      times.push(performance.now() - t);
      if (r.h_plus.length !== 2000) throw new Error('samples');
    }
    times.sort((a, b) => a - b);
    return { best: times[0], median: times[times.length >> 1] };
  });
  const rad = await page.evaluate(async () => {
    document.getElementById('tab-waveform').click();
    const input = document.getElementById('f-waveform-b');
    const view = document.getElementById('view-waveform');
    const frame = () => new Promise((r) => requestAnimationFrame(() => r()));
    const inner = [];
    for (let i = 0; i < 30; i++) {
      input.value = String(500 + 13 * i);
      input.dispatchEvent(new Event('input', { bubbles: true }));
      await frame();
      inner.push(Number(view.dataset.lastMs));
    }
    const med = (a) => { const s = [...a].sort((x, y) => x - y); return s[s.length >> 1]; };
    // The progressive job on its own, stepped as the page steps it (9 ms budget per frame).
    const Job = window.chiwave.WaveformJob ?? window.chiwave.RadiationJob; // renamed in the core
    const job = new Job({ kind: 'waveform', m1: '12 Msun', m2: '7 Msun', v: 0.3, b: 600, theta: 60, phi: 30, angle_unit: 'deg', frame: 'cm', u_min: -8, u_max: 8, u_unit: 'b_over_v', samples: 1200 }, 'energy');
    let longest = 0, steps = 0;
    const t0 = performance.now();
    while (!job.done()) {
      const t = performance.now();
      job.step(9);
      longest = Math.max(longest, performance.now() - t);
      steps += 1;
    }
    const total = performance.now() - t0;
    job.free();
    return { recompute_median: med(inner), total, longest, steps };
  });
  console.log(`wasm waveform 2000 samples:     best ${wave.best.toFixed(3)} ms, median ${wave.median.toFixed(3)} ms`);
  console.log(`waveform view recompute:        median ${rad.recompute_median.toFixed(2)} ms (sky work then runs progressively)`);
  console.log(`waveform sky work (balance, 24×48 map, dE/dω): ${rad.total.toFixed(0)} ms in ${rad.steps} steps, longest step ${rad.longest.toFixed(2)} ms`);
  console.log(`wasm sweep 1000 points:         best ${sweep.best.toFixed(3)} ms, median ${sweep.median.toFixed(3)} ms`);
  console.log(`light view recompute + redraw:  median ${redraw.recompute_median.toFixed(2)} ms (best ${redraw.recompute_best.toFixed(2)} ms) in JS+wasm`);
  console.log(`  input event → next frame incl. layout: median ${redraw.with_layout_median.toFixed(2)} ms (includes waiting for the frame)`);
} finally {
  await browser.close();
}
