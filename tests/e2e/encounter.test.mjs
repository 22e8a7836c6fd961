// End-to-end test of the encounter view of the single-file page (dist/chiwave.html) from
// file:// in Debian's headless Chromium with the network off. The CSV used below is
// synthetic, invented for this test: it is NOT numerical-relativity data.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import path from 'node:path';
import { sharedPage, settle, artifacts, cli } from './support.mjs';

const V = '#view-encounter';
const ui = sharedPage({ view: 'encounter' });
let page;
before(async () => { ({ page } = await ui.ready); });

const type = (selector, text) => ui.fill(selector, text);
const pick = (selector, value) => ui.pick(selector, value);
const frame = () => settle(page);

/** Enters the geometric case m1 = 1, m2 = 3, γ = 1.1, b = `b` GM/c². */
async function geometricCase(b) {
  await pick('#f-encounter-force', 'gravity');
  await pick('#f-encounter-mass_mode', 'masses');
  await pick('#f-encounter-m1_unit', '');
  await pick('#f-encounter-m2_unit', '');
  await type('#f-encounter-m1', '1');
  await type('#f-encounter-m2', '3');
  await pick('#f-encounter-speed_unit', 'gamma');
  await type('#f-encounter-speed', '1.1');
  await pick('#f-encounter-orbit_unit', '');
  await type('#f-encounter-orbit', String(b));
}

test('encounter: χ(3PM) on the page equals the CLI value for m1 = 1, m2 = 3, γ = 1.1, b = 100', async (t) => {
  await geometricCase(100);
  const cell = page.locator(`${V} [data-key="cum-3pm"]`);
  await cell.waitFor();
  const chi = Number(await cell.getAttribute('data-value'));
  assert.ok(Number.isFinite(chi) && chi > 0, `page shows χ = ${chi}`);
  assert.ok((await cell.getAttribute('data-source')).includes('arXiv'), 'χ(3PM) names its source');
  // the order table carries the same number, with its source, and all four orders
  const cum = page.locator(`${V} [data-key="cum-3pm"]`);
  assert.equal(Number(await cum.getAttribute('data-value')), chi);
  assert.equal(await page.locator(`${V} table[data-role="orders"] tr[data-order]`).count(), 4);
  for (const key of ['chi_newtonian', 'chi_test_body', 'chi_estimate']) {
    assert.ok((await page.locator(`${V} [data-key="${key}"]`).getAttribute('data-source'))?.length > 10, `${key} shown with a source`);
  }
  assert.equal(Number(await page.getAttribute(`${V} [data-key="gamma"]`, 'data-value')), 1.1);
  assert.equal(Number(await page.getAttribute(`${V} [data-key="nu"]`, 'data-value')), 0.1875); // 3/16
  // regime strip: PM parameter, capture proximity, velocity regime
  for (const k of ['pm_parameter', 'capture_proximity', 'velocity_regime']) {
    assert.equal(await page.locator(`${V} [data-role="regime"] [data-flag="${k}"]`).count(), 1, k);
  }
  const c = cli(['encounter', '--m1', '1', '--m2', '3', '--gamma', '1.1', '--b', '100']);
  if (c.why) { t.skip(c.why); return; }
  // The headline shows the core's recommended angle (here the 3PM sum) with its estimate.
  const best = page.locator(`${V} [data-role="headline"] [data-role="best"]`);
  assert.equal(await best.getAttribute('data-key'), c.json.best.key);
  assert.equal(Number(await best.locator('[data-role="best-value"]').getAttribute('data-value')), c.json.best.value);
  const ref = c.json.chi['3pm'];
  // Same core code natively and in wasm: equal up to libm differences.
  assert.ok(Math.abs(chi - ref) <= 1e-12 * Math.abs(ref), `page ${chi} vs CLI ${ref}`);
  await page.screenshot({ path: path.join(artifacts, 'encounter.png'), fullPage: true });
});

test('encounter: χ(b) and orbit figures are drawn with labels and the capture band', async () => {
  const chiSvg = await page.locator('[data-plot="encounter-chi"] .plot-box svg').textContent();
  for (const s of ['impact parameter b [GM/c²]', 'test body captured', '3PM (with radiation reaction)', 'exact test body', 'strong-field estimate']) {
    assert.ok(chiSvg.includes(s), `χ(b) figure: ${s}`);
  }
  const orbSvg = await page.locator('[data-plot="encounter-orbits"] .plot-box svg').textContent();
  assert.match(orbSvg, /EOB effective radius/);
  assert.match(orbSvg, /body 1/);
  // j instead of b → the figure is drawn against j
  await pick('#f-encounter-orbit_unit', 'j');
  await type('#f-encounter-orbit', '45');
  assert.match(await page.locator('[data-plot="encounter-chi"] .plot-box svg').textContent(), /reduced angular momentum j/);
  await pick('#f-encounter-orbit_unit', '');
  await type('#f-encounter-orbit', '100');
});

test('encounter: a captured case is shown as captured, not as an error', async () => {
  await geometricCase(5);
  const banner = page.locator(`${V} [data-role="captured"]`);
  await banner.waitFor();
  assert.match(await banner.textContent(), /capture/i);
  assert.equal(await page.getAttribute(`${V} [data-role="headline"] [data-captured]`, 'data-captured'), 'true');
  assert.equal(await page.locator(`${V} [data-error-for="b"]`).textContent(), '');
  assert.match(await page.locator('[data-plot="encounter-orbits"] .plot-box svg').textContent(), /capture/);
  await page.screenshot({ path: path.join(artifacts, 'encounter-captured.png'), fullPage: true });
  await geometricCase(100);
});

test('encounter: bad input is named next to its field and keeps the last result', async () => {
  const good = await page.getAttribute(`${V} [data-key="cum-3pm"]`, 'data-value');
  await type('#f-encounter-speed', '0.5');
  const msg = page.locator(`${V} [data-error-for="gamma"]`);
  await msg.waitFor({ state: 'visible' });
  assert.match(await msg.textContent(), /gamma/);
  assert.equal(await page.getAttribute(`${V} [data-key="cum-3pm"]`, 'data-value'), good);
  await type('#f-encounter-speed', '1.1');
  assert.equal(await msg.textContent(), '');
});

test('encounter: physical units and the electromagnetic table', async () => {
  await pick('#f-encounter-m1_unit', 'Msun');
  await pick('#f-encounter-m2_unit', 'Msun');
  await pick('#f-encounter-speed_unit', 'km/s');
  await type('#f-encounter-speed', '1300');
  await pick('#f-encounter-orbit_unit', 'au');
  await type('#f-encounter-orbit', '0.6');
  await page.locator(`${V} [data-key="cum-3pm"]`).waitFor();
  assert.match(await page.locator(`${V} .result-body`).textContent(), /Physical units[\s\S]*km\/s[\s\S]*kg m² s⁻¹/);
  await geometricCase(100);
  await pick('#f-encounter-force', 'em');
  await type('#f-encounter-q1', '0.2');
  await type('#f-encounter-q2', '-0.3');
  const pl = page.locator(`${V} [data-key="cum-3pl"]`);
  await pl.waitFor();
  assert.ok(Number(await pl.getAttribute('data-value')) > 0, 'attractive charges deflect inward');
  assert.equal(await page.locator(`${V} table[data-role="orders"] tr[data-order]`).count(), 4);
  assert.ok((await page.locator(`${V} [data-key="chi_test_exact"]`).getAttribute('data-source')).includes('Darwin'));
  assert.match(await page.textContent(`${V} [data-role="plot-note"]`), /gravity only/);
  assert.ok(await page.locator('[data-plot="encounter-chi"]').isHidden(), 'no gravity figure under an em result');
  await page.screenshot({ path: path.join(artifacts, 'encounter-em.png'), fullPage: true });
  await pick('#f-encounter-force', 'gravity');
});

test('encounter: pasted CSV (synthetic, invented) gives a comparison table and plot', async () => {
  const csv = [
    '# synthetic rows invented for this test; not numerical-relativity data',
    'E/M, J/M2, nu, chi, sigma_chi',
    '1.0225, 1.50, 0.25, 1.60, 0.05',
    '1.0225, 1.70, 0.25, 1.05, 0.04',
    '1.0225, 2.00, 0.25, 0.72, 0.03',
  ].join('\n');
  await page.fill(`#f-encounter-nr_csv`, csv);
  await frame();
  const rows = page.locator(`${V} table[data-role="nr-rows"] tbody tr`);
  await rows.first().waitFor();
  assert.equal(await rows.count(), 3);
  assert.equal(await page.locator(`${V} [data-role="nr-error"]`).textContent(), '');
  const svg = await page.locator('[data-plot="encounter-nr"] .plot-box svg').textContent();
  assert.match(svg, /your data ± σχ/);
  assert.match(svg, /3PM/);
  await page.locator(`${V} [data-role="nr"]`).screenshot({ path: path.join(artifacts, 'encounter-nr.png') });
  // a malformed line is reported by the core with its line number
  await page.fill(`#f-encounter-nr_csv`, `${csv}\n1.02, oops`);
  await frame();
  assert.match(await page.locator(`${V} [data-role="nr-error"]`).textContent(), /csv.*line 6/);
  await page.fill(`#f-encounter-nr_csv`, csv);
  await frame();
});

test('encounter: no network requests and no console errors', () => ui.assertClean());
