// In-browser figures as one JSON object on stdout, for scripts/bench.sh (nothing asserted):
//  1. `page_bench`: the figures of tests/e2e/bench.mjs, which runs as it is (a child process);
//     a JSON line it prints is taken as it is, otherwise its text lines are parsed.
//  2. `wasm`: the workloads of benches/workloads.json through the wasm exports in the single file
//     opened from disk: the α(b) sweep (light_sweep) and the `wasm_native` requests (evaluate),
//     each timed as the mean of a batch of calls (performance.now() is coarsened in Chromium), after
//     a warm-up of at least one second so that the optimising wasm tier is in place; best and median
//     batch means in ms — the same statistic criterion gives natively.
//  3. `inp`: interaction to next paint per view (Event Timing API, durationThreshold 16 ms): a digit
//     typed into and deleted from the view's first numeric input, 20 times each, 150 ms apart;
//     interactions below the 16 ms reporting threshold count as 16 ms. Also a trivial page that
//     formats one number (the floor on this machine).
//  4. `startup`: the single file's size and the time from navigation start to the first result
//     (body[data-ready="true"]).
// Run after scripts/build-web.sh:  node tests/e2e/bench-json.mjs
import fs from 'node:fs';
import path from 'node:path';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

// The shared launcher (launch, pageUrl, repo): support.mjs, or browser.mjs in older trees.
const here = path.dirname(fileURLToPath(import.meta.url));
const helper = ['support.mjs', 'browser.mjs'].find((f) => fs.existsSync(path.join(here, f)));
const { launch, pageUrl, repo } = await import(`./${helper}`);

const workloads = JSON.parse(fs.readFileSync(path.join(repo, 'benches', 'workloads.json'), 'utf8'));

/** Runs bench.mjs and returns its figures (its JSON line if it prints one, else its text parsed). */
function pageBench() {
  let out;
  try {
    out = execFileSync(process.execPath, [path.join(repo, 'tests', 'e2e', 'bench.mjs')], { cwd: repo, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
  } catch (e) {
    return { error: String(e.stderr || e.message).trim().split('\n').slice(-3).join(' ') };
  }
  const lines = out.split('\n').map((l) => l.trim()).filter(Boolean);
  for (const l of lines) {
    if (l.startsWith('{')) {
      try { return { json: JSON.parse(l), lines }; } catch { /* not JSON after all */ }
    }
  }
  const num = (re) => { for (const l of lines) { const m = l.match(re); if (m) return Number(m[1]); } return null; };
  return {
    lines,
    parsed: {
      wasm_waveform_2000_best_ms: num(/waveform 2000 samples:.*best ([\d.]+) ms/),
      wasm_waveform_2000_median_ms: num(/waveform 2000 samples:.*median ([\d.]+) ms/),
      // The view with the progressive sky work is called "radiation" or "waveform".
      sky_view_recompute_median_ms: num(/(?:radiation|waveform) view recompute:\s+median ([\d.]+) ms/),
      sky_work_total_ms: num(/(?:radiation|waveform) sky work.*: ([\d.]+) ms in/),
      sky_work_steps: num(/(?:radiation|waveform) sky work.* in (\d+) steps/),
      sky_work_longest_step_ms: num(/longest step ([\d.]+) ms/),
      wasm_sweep_1000_best_ms: num(/wasm sweep 1000 points:.*best ([\d.]+) ms/),
      wasm_sweep_1000_median_ms: num(/wasm sweep 1000 points:.*median ([\d.]+) ms/),
      light_recompute_median_ms: num(/light view recompute \+ redraw:\s+median ([\d.]+) ms/),
      light_recompute_best_ms: num(/light view recompute \+ redraw:.*\(best ([\d.]+) ms\)/),
      light_input_to_frame_median_ms: num(/input event → next frame incl\. layout: median ([\d.]+) ms/),
    },
  };
}

/** Batch-mean timing of the workloads inside the page. */
async function wasmTimings(page) {
  return page.evaluate(async (w) => {
    const api = window.chiwave;
    const out = {};
    const timeIt = (fn) => {
      // Warm-up: at least 1 s and 5 calls. Then the batch size, so that a batch lasts ≥ 20 ms,
      // from the fastest of five 5-call probes (a busy moment during the warm-up must not
      // shrink the batches to single calls, which the 0.1 ms clock cannot time).
      let calls = 0;
      const t0 = performance.now();
      while (calls < 5 || performance.now() - t0 < 1000) { fn(); calls += 1; }
      let per = Infinity;
      for (let k = 0; k < 5; k++) {
        const t = performance.now();
        for (let i = 0; i < 5; i++) fn();
        per = Math.min(per, (performance.now() - t) / 5);
      }
      const batch = Math.max(1, Math.ceil(20 / Math.max(per, 1e-3)));
      const means = [];
      const tEnd = performance.now() + 2000;
      while (means.length < 10 || (performance.now() < tEnd && means.length < 200)) {
        const t = performance.now();
        for (let i = 0; i < batch; i++) fn();
        means.push((performance.now() - t) / batch);
      }
      means.sort((a, b) => a - b);
      return { best_ms: means[0], median_ms: means[means.length >> 1], batches: means.length, batch };
    };
    const ls = w.light_sweep;
    if (typeof api.light_sweep === 'function') {
      out.light_sweep = timeIt(() => api.light_sweep(ls.request, ls.b_min, ls.b_max, ls.n));
    } else {
      out.light_sweep = { error: 'the page exposes no light_sweep export' };
    }
    for (const [name, req] of Object.entries(w.wasm_native)) {
      if (name === 'about') continue;
      try {
        api.evaluate(req);
        out[`request_${name}`] = timeIt(() => api.evaluate(req));
      } catch (e) {
        out[`request_${name}`] = { error: String(e && e.message ? e.message : e) };
      }
    }
    return out;
  }, workloads);
}

const pct = (a, q) => { const s = [...a].sort((x, y) => x - y); return s[Math.min(s.length - 1, Math.floor(q * s.length))]; };

/** Interaction-to-next-paint figures of `n` trusted key presses into `selector`. */
async function inp(page, selector, n = 40) {
  await page.focus(selector);
  await page.keyboard.press('End');
  await page.waitForTimeout(500);
  await page.evaluate(() => {
    window.__inp = new Map();
    new PerformanceObserver((list) => {
      for (const e of list.getEntries()) {
        if (e.interactionId) window.__inp.set(e.interactionId, Math.max(window.__inp.get(e.interactionId) || 0, e.duration));
      }
    }).observe({ type: 'event', durationThreshold: 16, buffered: false });
  });
  for (let i = 0; i < n; i++) {
    await page.keyboard.press(i % 2 === 0 ? '5' : 'Backspace');
    await page.waitForTimeout(150);
  }
  await page.waitForTimeout(500);
  const seen = await page.evaluate(() => [...window.__inp.values()]);
  const all = [...seen, ...Array(Math.max(0, n - seen.length)).fill(16)];
  return { interactions: n, reported: seen.length, p50_ms: pct(all, 0.5), p95_ms: pct(all, 0.95), max_ms: Math.max(...all) };
}

async function pageInp(browser) {
  const out = {};
  const page = await browser.context.newPage();
  await page.goto(pageUrl());
  await page.waitForSelector('body[data-ready="true"]', { timeout: 20000 });
  const tabs = await page.$$eval('[role="tab"]', (ts) => ts.map((t) => ({ id: t.id, panel: t.getAttribute('aria-controls') })));
  for (const t of tabs) {
    await page.click(`#${t.id}`);
    await page.waitForTimeout(500);
    const input = await page.evaluate((panel) => {
      const root = document.getElementById(panel);
      const el = root && [...root.querySelectorAll('input[inputmode="decimal"], input[type="number"]')].find((x) => x.offsetParent !== null && !x.disabled);
      return el ? el.id : null;
    }, t.panel);
    out[t.id.replace(/^tab-/, '')] = input ? { input, ...(await inp(page, `#${input}`)) } : { error: 'no visible numeric input' };
  }
  await page.close();
  const floor = await browser.context.newPage();
  await floor.setContent('<input id="x" value="10"><p id="o"></p><script>x.oninput = () => { o.textContent = (+x.value).toFixed(3); };</script>');
  out.trivial_page = { input: 'x', ...(await inp(floor, '#x')) };
  await floor.close();
  return out;
}

async function startup(browser) {
  const file = pageUrl();
  const size = fs.statSync(new URL(file)).size;
  const times = [];
  for (let i = 0; i < 5; i++) {
    const page = await browser.context.newPage();
    await page.addInitScript(() => {
      new MutationObserver((_, obs) => {
        if (document.body && document.body.dataset.ready === 'true') { window.__readyAt = performance.now(); obs.disconnect(); }
      }).observe(document, { attributes: true, subtree: true, attributeFilter: ['data-ready'] });
    });
    await page.goto(file);
    await page.waitForSelector('body[data-ready="true"]', { timeout: 20000 });
    times.push(await page.evaluate(() => window.__readyAt));
    await page.close();
  }
  return { single_file_bytes: size, first_result_ms: { best: Math.min(...times), median: pct(times, 0.5), runs: times.length } };
}

const result = { page_bench: pageBench() };
const browser = await launch();
try {
  const page = await browser.context.newPage();
  await page.goto(pageUrl());
  await page.waitForSelector('body[data-ready="true"]', { timeout: 20000 });
  result.user_agent = await page.evaluate(() => navigator.userAgent);
  result.wasm = await wasmTimings(page);
  await page.close();
  result.inp = await pageInp(browser);
  result.startup = await startup(browser);
} finally {
  await browser.close();
}
console.log(JSON.stringify(result));
