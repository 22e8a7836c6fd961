// End-to-end test of the figures on the single-file page (dist/chiwave.html) from file:// in
// Debian's headless Chromium: every figure of every view is checked with the browser's own text
// boxes (no two labels overlap, none leaves the figure), the SVG export parses as XML and draws
// with fractional coordinates, and the PNG export has 2× or 4× the figure's pixel size.
import { test, before } from 'node:test';
import assert from 'node:assert/strict';
import fs from 'node:fs';
import path from 'node:path';
import { sharedPage, artifacts, settle } from './support.mjs';

const ui = sharedPage({ timeout: 20000 });
let page;
before(async () => { ({ page } = await ui.ready); });

/** Width and height of a PNG from its IHDR chunk (PNG spec, ISO/IEC 15948: bytes 16–23). */
function pngSize(buf) {
  assert.deepEqual([...buf.subarray(1, 4)], [0x50, 0x4e, 0x47], 'PNG signature');
  assert.equal(buf.subarray(12, 16).toString('latin1'), 'IHDR');
  return [buf.readUInt32BE(16), buf.readUInt32BE(20)];
}

/** Text boxes of every figure in the visible view that overlap each other or leave their
 *  figure, measured by the browser (getBoundingClientRect: the real glyphs of the fonts in use). */
function textProblems(viewId) {
  return page.evaluate((id) => {
    const out = [];
    const view = document.getElementById(id);
    for (const box of view.querySelectorAll('.plot-box')) {
      const svg = box.querySelector('svg');
      if (!svg || !svg.getClientRects().length) continue;
      const name = box.closest('[data-plot]')?.getAttribute('data-plot') || '?';
      const fr = svg.getBoundingClientRect();
      const texts = [...svg.querySelectorAll('text')].filter((t) => t.textContent.trim());
      const rects = texts.map((t) => ({ text: t.textContent.trim(), r: t.getBoundingClientRect() }));
      const tol = 0.5;
      for (const a of rects) {
        if (a.r.left < fr.left - tol || a.r.right > fr.right + tol || a.r.top < fr.top - tol || a.r.bottom > fr.bottom + tol) {
          out.push(`${name}: '${a.text}' leaves the figure`);
        }
      }
      for (let i = 0; i < rects.length; i++) {
        for (let j = 0; j < i; j++) {
          const a = rects[i].r, b = rects[j].r;
          if (a.left < b.right - tol && b.left < a.right - tol && a.top < b.bottom - tol && b.top < a.bottom - tol) {
            out.push(`${name}: '${rects[i].text}' overlaps '${rects[j].text}'`);
          }
        }
      }
    }
    return out;
  }, viewId);
}

test('every figure of every view: no overlapping text, none outside the figure (browser text boxes)', async () => {
  const tabs = await page.locator('[role="tab"][id^="tab-"]').evaluateAll((ts) => ts.map((t) => t.id.slice(4)));
  assert.ok(tabs.length >= 4, `views: ${tabs}`);
  let figures = 0;
  for (const id of tabs) {
    await page.click(`#tab-${id}`);
    await page.waitForSelector(`#view-${id}:not([hidden])`);
    await settle(page);
    // Progressive work (the waveform view's sky sums) finishes before the figures are final.
    if (await page.locator(`#view-${id}[data-work-done]`).count()) {
      await page.waitForSelector(`#view-${id}[data-work-done="true"]`, { timeout: 60000 });
      await settle(page);
    }
    const problems = await textProblems(`view-${id}`);
    assert.deepEqual(problems, [], `view ${id}`);
    const cards = page.locator(`#view-${id} [data-plot]`);
    for (let k = 0; k < await cards.count(); k++) {
      const card = cards.nth(k);
      if (!(await card.locator('.plot-box svg').count()) || !(await card.isVisible())) continue;
      figures++;
      await card.screenshot({ path: path.join(artifacts, `figure-${await card.getAttribute('data-plot')}.png`) });
    }
  }
  assert.ok(figures >= 8, `${figures} figures checked`);
  // The same at a narrow window (the figures are scaled down with the card).
  await page.setViewportSize({ width: 700, height: 900 });
  await page.click('#tab-light');
  await settle(page);
  assert.deepEqual(await textProblems('view-light'), [], 'light view at 700 px');
  await page.setViewportSize({ width: 1440, height: 1000 });
  await ui.assertClean();
});

test('exports: the SVG parses and has fractional coordinates; PNG at 2× and 4× the figure size', async () => {
  await page.click('#tab-light');
  await settle(page);
  const card = page.locator('[data-plot="light-alpha-b"]');
  const [svgDl] = await Promise.all([page.waitForEvent('download'), card.getByRole('button', { name: 'SVG' }).click()]);
  const svgText = fs.readFileSync(await svgDl.path(), 'utf8');
  // Parsed by the browser's XML parser (not the HTML one): a malformed document yields <parsererror>.
  const check = await page.evaluate((text) => {
    const doc = new DOMParser().parseFromString(text, 'image/svg+xml');
    if (doc.getElementsByTagName('parsererror').length) return { error: doc.getElementsByTagName('parsererror')[0].textContent };
    const root = doc.documentElement;
    const nums = [...doc.getElementsByTagName('path')].flatMap((p) => (p.getAttribute('d') || '').split(/[ML ]+/).filter(Boolean).map(Number));
    const distinct = [...new Set(nums)];
    return {
      tag: root.localName,
      width: Number(root.getAttribute('width')),
      height: Number(root.getAttribute('height')),
      viewBox: root.getAttribute('viewBox'),
      total: distinct.length,
      fractional: distinct.filter((v) => !Number.isInteger(v)).length,
      bad: nums.filter((v) => !Number.isFinite(v)).length,
    };
  }, svgText);
  assert.equal(check.error, undefined, `SVG parses as XML: ${check.error}`);
  assert.equal(check.tag, 'svg');
  assert.equal(check.viewBox, `0 0 ${check.width} ${check.height}`);
  assert.equal(check.bad, 0, 'every path number is a number');
  assert.ok(check.total > 100 && check.fractional > 0.9 * check.total, `${check.fractional} of ${check.total} distinct path coordinates are fractional`);

  for (const scale of [2, 4]) {
    await card.locator('select.png-scale').selectOption(String(scale));
    const [dl] = await Promise.all([page.waitForEvent('download'), card.getByRole('button', { name: 'PNG' }).click()]);
    assert.equal(dl.suggestedFilename(), `chiwave-light-alpha-b@${scale}x.png`);
    const [w, h] = pngSize(fs.readFileSync(await dl.path()));
    assert.deepEqual([w, h], [scale * check.width, scale * check.height], `PNG at ${scale}×`);
  }
  await card.locator('select.png-scale').selectOption('2');
});
