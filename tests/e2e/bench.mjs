// Timing of the wasm build in headless Chromium (figures printed, nothing asserted):
//  1. the 1000-point α(b) sweep (b = 1 … 10⁶ M, 8 partial sums) through the wasm export,
//     to compare with the native figure of `cargo run --release -p chiwave-web --example native_sweep`;
//  2. a page recompute + redraw after an input change in the light view (evaluate, table,
//     flags, both figures rendered in wasm and put into the DOM, plus the forced layout).
// Run after scripts/build-web.sh:  node tests/e2e/bench.mjs   (or npm run bench)
import { launch, pageUrl } from './browser.mjs';

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
  console.log(`wasm sweep 1000 points:         best ${sweep.best.toFixed(3)} ms, median ${sweep.median.toFixed(3)} ms`);
  console.log(`light view recompute + redraw:  median ${redraw.recompute_median.toFixed(2)} ms (best ${redraw.recompute_best.toFixed(2)} ms) in JS+wasm`);
  console.log(`  input event → next frame incl. layout: median ${redraw.with_layout_median.toFixed(2)} ms (includes waiting for the frame)`);
} finally {
  await browser.close();
}
