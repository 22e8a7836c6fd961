// End-to-end test of the error estimates on the page (dist/chiwave.html from file://, Debian's
// headless Chromium, network off): every view's headline shows the core's recommended value
// with its estimate and verdict, every compared row carries a verdict badge from the core, and
// the tolerance field changes the verdicts. Expected values come from the CLI (same core).
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import path from 'node:path';
import { sharedPage, artifacts, cli } from './support.mjs';

const ui = sharedPage({ view: 'light' });
let page;
before(async () => { ({ page } = await ui.ready); });

const setState = (view, state) => page.evaluate(([v, s]) => {
  const vw = window.chiwavePage.view(v);
  return vw.setState({ ...vw.getState(), ...s });
}, [view, state]);

/** The headline's recommended value: {key, verdict, value, text}. */
async function headline(view) {
  const best = page.locator(`#view-${view} [data-role="headline"] [data-role="best"]`);
  await best.waitFor();
  return {
    key: await best.getAttribute('data-key'),
    verdict: await best.getAttribute('data-verdict'),
    value: Number(await best.locator('.big[data-value]').getAttribute('data-value')),
    text: await best.innerText(),
  };
}

for (const [view, state] of [
  ['light', { b: '10', b_unit: 'M', mass: '1', mass_unit: 'geometric' }],
  ['lens', {}],
  ['encounter', {}],
  ['waveform', {}],
]) {
  test(`${view}: the headline names the recommended value with its estimate; rows carry verdict badges`, async () => {
    await page.click(`#tab-${view}`);
    assert.deepEqual(await setState(view, state), []);
    const h = await headline(view);
    assert.match(h.text, /^recommended: /);
    assert.match(h.text, /± \S+ \(relative\)/, 'the estimate is shown');
    assert.ok(['ok', 'caution', 'outside'].includes(h.verdict));
    assert.ok(Number.isFinite(h.value));
    const badges = page.locator(`#view-${view} .result-body table [data-verdict].badge`);
    assert.ok((await badges.count()) >= 2, 'verdict badges in the tables');
    // Each badge tells the method of its estimate (or why there is none) on hover.
    const tip = await badges.first().getAttribute('data-source');
    assert.match(tip, /estimated relative error|no error estimate/);
    await page.locator(`#view-${view} [data-part="results"]`).screenshot({ path: path.join(artifacts, `accuracy-${view}.png`) });
  });
}

test('light: the page shows the CLI recommendation, and the tolerance changes the verdicts', async () => {
  await page.click('#tab-light');
  await setState('light', { b: '10', b_unit: 'M', mass: '1', mass_unit: 'geometric', tolerance: '0.01' });
  const c = cli(['light', '--b', '10']);
  assert.ok(!c.why, c.why);
  const h = await headline('light');
  assert.equal(h.key, c.json.best.key);
  assert.ok(Math.abs(h.value - c.json.best.value) <= 1e-12 * Math.abs(c.json.best.value));
  // Order 5 is 9.7e-3 from the exact α at b = 10 M (the CLI's series): ok at 1e-2, caution at 1e-3.
  const row5 = page.locator('#view-light tr[data-key="series_5"]');
  assert.equal(await row5.getAttribute('data-verdict'), c.json.series[4].verdict);
  assert.equal(await row5.getAttribute('data-verdict'), 'ok');
  await ui.fill('#f-light-tolerance', '0.001');
  assert.equal(await row5.getAttribute('data-verdict'), 'caution');
  const c3 = cli(['light', '--b', '10', '--tolerance', '0.001']);
  assert.equal(c3.json.series[4].verdict, 'caution');
  await ui.fill('#f-light-tolerance', '2');
  assert.match(await page.locator('#view-light [data-error-for="tolerance"]').textContent(), /tolerance/);
  await ui.fill('#f-light-tolerance', '0.01');
});

test('encounter: equal masses, γ = 1.09, b = 10 GM/c²: no PM order is recommended', async () => {
  await page.click('#tab-encounter');
  await setState('encounter', { force: 'gravity', mass_mode: 'nu', nu: '0.25', speed: '1.09', speed_unit: 'gamma', orbit: '10', orbit_unit: '' });
  const c = cli(['encounter', '--nu', '0.25', '--gamma', '1.09', '--b', '10']);
  assert.ok(!c.why, c.why);
  const h = await headline('encounter');
  assert.equal(h.key, c.json.best.key);
  assert.equal(h.verdict, c.json.best.verdict);
  for (const o of c.json.orders) {
    assert.equal(await page.locator(`#view-encounter tr[data-order="${o.order}"]`).getAttribute('data-verdict'), o.verdict);
  }
  // The strong-field estimate's row carries its own verdict, not the test body's capture.
  assert.equal(await page.locator('#view-encounter tr[data-ref="chi_estimate"]').getAttribute('data-verdict'), c.json.estimates.chi_estimate.verdict);
});
