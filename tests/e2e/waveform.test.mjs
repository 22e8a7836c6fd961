// End-to-end test of the waveform & radiation view of the single-file page (dist/chiwave.html) from
// file:// in Debian's headless Chromium with the network off. Reference values come from the
// native CLI (same core) and from the closed form of Herrmann et al. 2021 (arXiv:2101.07255,
// via the core's e_rad_closed), which the flux integral must reproduce.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import path from 'node:path';
import { sharedPage, artifacts, cli } from './support.mjs';

const V = '#view-waveform';
const ui = sharedPage({ view: 'waveform', timeout: 20000 });
let page;
before(async () => { ({ page } = await ui.ready); });

const fill = (selector, text) => ui.fill(selector, text);
const pick = (selector, value) => ui.pick(selector, value);
/** A number shown in the view: a table cell (data-key) or a headline number (data-role). */
const value = async (name) => Number(await page.locator(`${V} [data-key="${name}"], ${V} [data-role="${name}"]`).first().getAttribute('data-value'));
const skyDone = () => page.waitForSelector(`${V}[data-work-done="true"]`, { timeout: 60000 });
const rel = (a, b) => Math.abs(a - b) / Math.abs(b);

/** Geometric case: m1 = 1, m2 = 2, γ = 1.5, b = 40 GM/c², θ = 50°, φ = 20°, ±10 b/v, 201 samples. */
async function geometricCase(frameName) {
  await pick('#f-waveform-force', 'gravity');
  await pick('#f-waveform-m1_unit', '');
  await pick('#f-waveform-m2_unit', '');
  await fill('#f-waveform-m1', '1');
  await fill('#f-waveform-m2', '2');
  await pick('#f-waveform-speed_unit', 'gamma');
  await fill('#f-waveform-speed', '1.5');
  await pick('#f-waveform-b_unit', '');
  await fill('#f-waveform-b', '40');
  await fill('#f-waveform-theta', '50');
  await fill('#f-waveform-phi', '20');
  await pick('#f-waveform-frame', frameName);
  await fill('#f-waveform-distance', '');
  await fill('#f-waveform-u_min', '-10');
  await fill('#f-waveform-u_max', '10');
  await pick('#f-waveform-u_unit', 'b_over_v');
  await fill('#f-waveform-samples', '201');
}
const CLI_CASE = ['waveform', '--m1', '1', '--m2', '2', '--gamma', '1.5', '--b', '40', '--theta', '50', '--phi', '20',
  '--angle-unit', 'deg', '--u-min', '-10', '--u-max', '10', '--u-unit', 'b_over_v', '--samples', '201'];

test('waveform: the live energy balance equals the CLI and the closed form (both frames)', async () => {
  for (const fr of ['rest2', 'cm']) {
    await geometricCase(fr);
    // Start the sky work afresh (an input left unchanged keeps it running) and follow it: while
    // the sky integrals run, the progress bar moves through intermediate values.
    await fill('#f-waveform-b', '41');
    await fill('#f-waveform-b', '40');
    const fractions = await page.evaluate(() => new Promise((resolve) => {
      const seen = [];
      const bar = document.querySelector('#view-waveform [data-role="sky-progress"]');
      const look = () => {
        seen.push(Number(bar.dataset.fraction));
        if (bar.dataset.phase === 'done' || seen.length > 2000) resolve(seen); else requestAnimationFrame(look);
      };
      look();
    }));
    const mid = new Set(fractions.filter((f) => f > 0 && f < 1));
    assert.ok(mid.size >= 3, `progress shown in steps (${[...mid].length} intermediate values)`);
    await skyDone();
    const flux = await value('e-rad-flux');
    const closed = await value('e-rad-closed');
    const pageRel = await value('e-rad-rel');
    const c = cli([...CLI_CASE, '--frame', fr]);
    assert.ok(!c.why, c.why);
    // Same core sums natively and in wasm: equal up to libm differences.
    assert.ok(rel(flux, c.json.e_rad_flux) < 1e-12, `${fr}: page flux ${flux} vs CLI ${c.json.e_rad_flux}`);
    assert.ok(rel(closed, c.json.e_rad_closed) < 1e-14, `${fr}: page closed ${closed} vs CLI ${c.json.e_rad_closed}`);
    // The acceptance test of the waveform: flux integral = Herrmann et al. 2021 closed form.
    assert.ok(pageRel < 1e-10, `${fr}: balance ${pageRel}`);
    assert.ok((await value('p-rad-rel')) < 1e-9, `${fr}: momentum balance`);
    assert.match(await page.locator(`${V} [data-key="e-rad-closed"]`).getAttribute('data-source'), /arXiv:2101\.07255/);
    // The memory table: waveform against Braginsky–Thorne, same numbers as the CLI.
    const mem = Number(await page.locator(`${V} table[data-role="memory"] tbody tr:nth-child(2) td:nth-child(2)`).getAttribute('data-value'));
    assert.ok(rel(mem, c.json.memory.plus) < 1e-12, `${fr}: memory ${mem} vs ${c.json.memory.plus}`);
  }
  await page.screenshot({ path: path.join(artifacts, 'waveform.png'), fullPage: true });
});

test('waveform: figures — strain with memory, sky map in both projections, spectrum, slow motion', async () => {
  await geometricCase('rest2');
  await skyDone();
  const svg = (stem) => page.locator(`${V} [data-plot="waveform-${stem}"] svg`).innerHTML();
  assert.match(await svg('strain'), /Strain, rest frame of body 2/);
  assert.match(await svg('strain'), /memory Δh₊/);
  assert.match(await svg('slow'), /quadrupole hyperbola/);
  assert.match(await svg('sky'), /Energy per solid angle/);
  assert.match(await svg('spectrum'), /over the sphere/, 'dE/dω over the sphere drawn once its phase is done');
  // Hovering the map reads the cell's value (the heat layer travels with the rendered figure).
  await page.locator(`${V} [data-plot="waveform-sky"] .plot-box`).hover();
  assert.match(await page.textContent(`${V} [data-plot="waveform-sky"] [data-role="heat-readout"]`), /^dE\/dΩ = \S+ \[M\]$/);
  await pick('#f-waveform-projection', 'equal_area');
  assert.equal(await page.getAttribute(V, 'data-work-done'), 'true', 'a new projection redraws the map; the sums are not restarted');
  assert.match(await svg('sky'), /cos θ/);
  await pick('#f-waveform-sky', 'memory');
  await skyDone();
  const sky = await svg('sky');
  assert.match(sky, /cos θ/);
  assert.match(sky, /Memory over the sky/);
  await page.locator(`${V} [data-plot="waveform-sky"]`).screenshot({ path: path.join(artifacts, 'waveform-sky.png') });
  await pick('#f-waveform-projection', 'cylindrical');
  await pick('#f-waveform-sky', 'energy');
});

test('waveform: an input change cancels the running sky work and restarts it', async () => {
  await geometricCase('cm');
  await skyDone();
  await fill('#f-waveform-b', '80');
  assert.equal(await page.getAttribute(`${V}`, 'data-work-done'), 'false', 'restarted');
  await skyDone();
  const c = cli([...CLI_CASE.map((a) => (a === '40' ? '80' : a)), '--frame', 'cm', '--energy-flux', 'false']);
  assert.ok(!c.why, c.why);
  // E_rad ∝ 1/b³ at fixed γ (Herrmann et al. 2021): the final balance is for the new b.
  assert.ok(rel(await value('e-rad-closed'), c.json.e_rad_closed) < 1e-14);
  assert.ok((await value('e-rad-rel')) < 1e-10);
});

test('waveform: physical units — strain at the distance, seconds, joules, detector response', async () => {
  await pick('#scenario-pick', 'waveform-stellar-encounter');
  await page.waitForSelector(`${V}:not([hidden])`);
  await skyDone();
  const peak = await value('peak-strain');
  const c = cli(['scenario', 'waveform-stellar-encounter']);
  assert.ok(!c.why, c.why);
  const r = c.json.result || c.json;
  assert.ok(rel(peak, r.physical.peak_strain) < 1e-12, `peak ${peak} vs ${r.physical.peak_strain}`);
  assert.ok(rel(await value('e-rad-j'), r.physical.e_rad_j) < 1e-12);
  assert.ok(rel(await value('e-rad-flux-j'), r.physical.e_rad_j) < 1e-9, 'balance in joules');
  assert.match(await page.locator(`${V} [data-plot="waveform-strain"] svg`).innerHTML(), /detector F₊h₊ \+ F×h×/);
  assert.match(await page.locator(`${V} [data-plot="waveform-strain"] svg`).innerHTML(), /retarded time u \[s\]/);
});

test('waveform: electromagnetic field and per-body energies equal the CLI', async () => {
  await geometricCase('rest2');
  await pick('#f-waveform-force', 'em');
  await fill('#f-waveform-q1', '0.1');
  await fill('#f-waveform-q2', '-0.2');
  await page.waitForSelector(`${V} [data-key="em-body1"]`);
  const c = cli([...CLI_CASE, '--force', 'em', '--q1', '0.1', '--q2', '-0.2']);
  assert.ok(!c.why, c.why);
  for (const [role, key] of [['em-body1', 'e_rad_body1'], ['em-body2', 'e_rad_body2'], ['em-flux', 'e_rad_flux']]) {
    assert.ok(rel(await value(role), c.json[key]) < 1e-12, `${role}: ${await value(role)} vs ${c.json[key]}`);
  }
  assert.ok(await page.locator(`${V} [data-plot="waveform-sky"]`).isHidden());
  assert.ok(await page.locator(`${V} [data-role="balance"]`).isHidden());
  assert.match(await page.locator(`${V} [data-plot="waveform-em"] svg`).innerHTML(), /D·E_θ/);
  assert.match(await page.locator(`${V} [data-plot="waveform-em-spectrum"] svg`).innerHTML(), /Bessel/);
  await page.screenshot({ path: path.join(artifacts, 'waveform-em.png'), fullPage: true });
  await pick('#f-waveform-force', 'gravity');
});

test('waveform: bad input is named next to its field and keeps the last result', async () => {
  await geometricCase('rest2');
  await fill('#f-waveform-b', '-3');
  const msg = await page.textContent(`${V} [data-error-for="b"]`);
  assert.match(msg, /b/);
  assert.ok((await page.textContent(`${V} .stale-note`)).length > 0);
  await fill('#f-waveform-b', '40');
  await pick('#f-waveform-u_unit', 's');
  assert.match(await page.textContent(`${V} [data-error-for="u_min"]`), /physical masses/);
  await pick('#f-waveform-u_unit', 'b_over_v');
  assert.equal(await page.textContent(`${V} [data-error-for="u_min"]`), '');
  // A window that ends before it starts is refused by the core, named at the window field.
  await fill('#f-waveform-u_max', '-20');
  assert.match(await page.textContent(`${V} [data-error-for="u_min"]`), /u_max > u_min/);
  await fill('#f-waveform-u_max', '10');
});

test('waveform: no network requests and no console errors', () => ui.assertClean());
