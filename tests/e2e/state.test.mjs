// End-to-end tests of what every view shares (dist/chiwave.html from file://, Debian chromium,
// network off): the flat input state (getState → setState on a fresh page shows the same numbers),
// the one number parser (nan, inf and overflowing text refused with the field named, the last
// result kept), and the former view id #view=radiation opening the waveform view.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import { sharedPage, openPage, settle } from './support.mjs';

const ui = sharedPage();
let page;
before(async () => { ({ page } = await ui.ready); });

// Synthetic rows invented for this test: NOT numerical-relativity data.
const NR_ROWS = 'E/M, J/M2, nu, chi, sigma_chi\n1.0225, 1.50, 0.25, 1.60, 0.05\n1.0225, 2.00, 0.25, 0.72, 0.03';

// For each view, inputs set away from their defaults (state key → value), entered through the
// form as a user would: text boxes typed, selects picked, boxes ticked.
const CASES = {
  light: { mass_unit: 'Msun', mass: '1.4', b_unit: 'km', b: '30', spin: '0.3', orders: '6', angles: 'arcsec', sources: 'true' },
  lens: { mass: '0.7', mass_unit: 'Mjup', offset: '0.3', frequency: '50', frequency_unit: 'mHz', lens_redshift: '0.2', angles: 'uas' },
  encounter: { mass_mode: 'nu', nu: '0.2', speed_unit: 'c', speed: '0.4', orbit_unit: 'j', orbit: '30', angles: 'deg', nr_csv: NR_ROWS },
  waveform: { m1_unit: '', m1: '1', m2_unit: '', m2: '3', speed_unit: 'gamma', speed: '1.3', b: '80', frame: 'rest2', distance: '',
    u_unit: 'gm', u_min: '-500', u_max: '500', samples: '301', detector: 'true', det_psi: '35', sky: 'memory', projection: 'equal_area' },
};

/** Enters `values` into the form of view `id` (element ids are f-<view>-<state key>). */
async function enter(p, id, values) {
  for (const [key, value] of Object.entries(values)) {
    const sel = `#f-${id}-${key}`;
    const kind = await p.$eval(sel, (e) => (e.tagName === 'SELECT' ? 'select' : e.type === 'checkbox' ? 'check' : 'text'));
    if (kind === 'select') await p.selectOption(sel, value);
    else if (kind === 'check') await p.setChecked(sel, value === 'true');
    else await p.fill(sel, value);
    await settle(p);
  }
}

/** Every number the view shows (text and full double), once its progressive work is done. */
async function shown(p, id) {
  await p.waitForSelector(`#view-${id}:not([data-work-done="false"])`, { timeout: 60000 });
  return p.evaluate((v) => [...document.querySelectorAll(`#view-${v} [data-value]`)]
    .map((e) => `${e.getAttribute('data-key') || e.getAttribute('data-role') || ''}=${e.textContent}|${e.getAttribute('data-value')}`), id);
}

for (const [id, values] of Object.entries(CASES)) {
  test(`${id}: getState → setState on a fresh page shows the same numbers`, async () => {
    await page.click(`#tab-${id}`);
    await enter(page, id, values);
    const state = await page.evaluate((v) => window.chiwavePage.view(v).getState(), id);
    for (const [k, v] of Object.entries(state)) assert.equal(typeof v, 'string', `state value of ${k} is text`);
    for (const [k, v] of Object.entries(values)) assert.equal(state[k], v, `state carries ${k}`);
    assert.deepEqual(await page.$$eval(`#view-${id} .field-error`, (es) => es.map((e) => e.textContent).filter(Boolean)), [], 'no input refused');
    const before = await shown(page, id);
    assert.ok(before.length > 10, `${id} shows numbers (${before.length})`);

    const fresh = await ui.page.context().newPage();
    try {
      await fresh.goto(page.url().split('#')[0]);
      await fresh.waitForSelector('body[data-ready="true"]', { timeout: 20000 });
      const problems = await fresh.evaluate(([v, s]) => window.chiwavePage.view(v).setState(s), [id, state]);
      assert.deepEqual(problems, []);
      await fresh.click(`#tab-${id}`);
      assert.deepEqual(await fresh.evaluate((v) => window.chiwavePage.view(v).getState(), id), state, 'same state');
      assert.deepEqual(await shown(fresh, id), before, 'same numbers');
    } finally {
      await fresh.close();
    }
  });
}

test('setState names what it cannot use and keeps the defaults', async () => {
  const problems = await page.evaluate(() => window.chiwavePage.view('light').setState({ b: '12', colour: 'red', orders: '99' }));
  assert.equal(problems.length, 2);
  assert.match(problems[0], /unknown key 'colour'/);
  assert.match(problems[1], /^orders: '99'/);
  const state = await page.evaluate(() => window.chiwavePage.view('light').getState());
  assert.equal(state.b, '12');
  assert.equal(state.orders, '8', 'default kept');
});

// One plain-number box and one box with a unit (or mode) select per view: [view, box, request key
// named in the message and where the message shows].
const BOXES = [
  ['light', 'spin', 'spin', 'spin'], ['light', 'b', 'b', 'b'],
  ['lens', 'offset', 'offset', 'offset'], ['lens', 'mass', 'mass', 'mass'],
  ['encounter', 'speed', 'gamma', 'gamma'], ['encounter', 'm1', 'm1', 'm1'],
  ['waveform', 'theta', 'theta', 'theta'], ['waveform', 'b', 'b', 'b'], ['waveform', 'u_max', 'u_max', 'u_min'],
];

for (const [id, box, key, at] of BOXES) {
  test(`${id}: "nan", "inf" and 1e999 in ${box} are refused, naming ${key}`, async () => {
    await page.click(`#tab-${id}`);
    await page.evaluate((v) => window.chiwavePage.view(v).setState({}), id); // defaults
    if (id === 'encounter') await page.selectOption('#f-encounter-mass_mode', 'masses');
    await settle(page);
    const sel = `#f-${id}-${box}`;
    const good = await page.inputValue(sel);
    const numbers = () => page.$$eval(`#view-${id} .result-body [data-value]`, (es) => es.map((e) => e.getAttribute('data-value')));
    const kept = await numbers();
    assert.ok(kept.length > 5);
    const msg = page.locator(`#view-${id} [data-error-for="${at}"]`);
    for (const bad of ['nan', 'NaN', 'inf', '-Infinity', '1e999']) {
      await ui.fill(sel, bad);
      assert.match(await msg.textContent(), new RegExp(`^${key}: cannot read '${bad}' as a finite number$`), `${id} ${box} = ${bad}`);
      assert.equal(await page.getAttribute(sel, 'aria-invalid'), 'true');
      assert.ok((await page.textContent(`#view-${id} .stale-note`)).length > 0, 'marked as stale');
      assert.deepEqual(await numbers(), kept, 'the last result stays');
    }
    await ui.fill(sel, good);
    assert.equal(await msg.textContent(), '');
  });
}

test('#view=radiation (the former id) opens the waveform view', async () => {
  for (const hash of ['#view=radiation', '#view=waveform']) {
    const other = await openPage({ hash });
    try {
      assert.ok(await other.page.isVisible('#view-waveform'), hash);
      assert.equal(await other.page.getAttribute('#tab-waveform', 'aria-selected'), 'true');
      assert.ok(await other.page.isHidden('#view-light'));
      assert.match(await other.page.textContent('#tab-waveform'), /Waveform/);
      other.assertClean();
    } finally {
      await other.close();
    }
  }
});

test('state tests: no network requests and no console errors', () => ui.assertClean());
