// Shared support of the end-to-end tests and the timing page: Debian's Chromium through
// playwright-core (which downloads no browser), a fresh empty profile, no network; the single-file
// page opened from file:// with guards that record every request and console error; input helpers
// that wait for the page's recompute; the CLI for reference values.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { execFileSync } from 'node:child_process';
import assert from 'node:assert/strict';
import { before, after } from 'node:test';
import { chromium } from 'playwright-core';

export const repo = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const artifacts = path.join(repo, 'tests', 'e2e', 'artifacts');

export const CHROMIUM = process.env.CHIWAVE_CHROMIUM || '/usr/bin/chromium';
const ARGS = [
  '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
  '--disable-component-update', '--disable-sync', '--disable-dev-shm-usage', '--disable-extensions',
  '--disable-default-apps', '--metrics-recording-only', '--no-pings',
];

/** Launches Chromium with a new empty user-data-dir; returns {context, close}. */
export async function launch({ width = 1440, height = 1000 } = {}) {
  const profile = fs.mkdtempSync(path.join(os.tmpdir(), 'chiwave-e2e-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    args: ARGS,
    viewport: { width, height },
    acceptDownloads: true,
    offline: true,
  });
  return {
    context,
    async close() {
      await context.close();
      fs.rmSync(profile, { recursive: true, force: true });
    },
  };
}

export function pageUrl(file = 'chiwave.html') {
  return pathToFileURL(path.join(repo, 'dist', file)).href;
}

/** Records every request and every console error / page error of a page. */
export function watch(page) {
  const requests = [];
  const errors = [];
  page.on('request', (r) => requests.push(r.url()));
  page.on('console', (m) => { if (m.type() === 'error') errors.push(`console: ${m.text()}`); });
  page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
  return { requests, errors };
}

/** The CLI's result for the same case, or {why} when no CLI binary can be run. */
export function cli(args) {
  const bin = ['release', 'debug'].map((p) => path.join(repo, 'target', p, 'chiwave')).find((p) => fs.existsSync(p));
  const [cmd, pre] = bin ? [bin, []] : ['cargo', ['run', '-q', '-p', 'chiwave-cli', '--']];
  try {
    return { json: JSON.parse(execFileSync(cmd, [...pre, ...args, '--json'], { cwd: repo, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] })) };
  } catch (e) {
    return { why: `CLI not usable: ${String(e.stderr || e.message).trim().split('\n').pop()}` };
  }
}


/** Waits for the page's next animation frame (inputs recompute there) and the task after it. */
export function settle(page) {
  return page.evaluate(() => new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0))));
}

/**
 * Opens dist/chiwave.html (+ `hash`) from file:// in a fresh browser, with the request and
 * console guards, waits until the page is ready and (with `view`) shows that view's tab. Returns
 * {page, seen, fill(selector, text), pick(selector, value), assertClean(), close()}.
 */
export async function openPage({ view, hash = '', timeout = 8000, width, height } = {}) {
  assert.ok(fs.existsSync(path.join(repo, 'dist', 'chiwave.html')), 'dist/chiwave.html is missing: run scripts/build-web.sh');
  fs.mkdirSync(artifacts, { recursive: true });
  const browser = await launch({ width, height });
  const page = await browser.context.newPage();
  page.setDefaultTimeout(timeout);
  const seen = watch(page);
  await page.goto(pageUrl() + hash);
  await page.waitForSelector('body[data-ready="true"]', { timeout: 20000 });
  if (view) {
    await page.click(`#tab-${view}`);
    await page.waitForSelector(`#view-${view}:not([hidden])`);
  }
  return {
    page,
    seen,
    /** Sets a text input and fires the input event, as typing does; waits for the recompute. */
    async fill(selector, text) { await page.fill(selector, text); await settle(page); },
    async pick(selector, value) { await page.selectOption(selector, value); await settle(page); },
    /** No request left the page (only file:, data: and blob: URLs) and nothing was logged as an error. */
    assertClean() {
      const bad = seen.requests.filter((u) => !/^(file|data|blob):/.test(u));
      assert.deepEqual(bad, [], 'only file:, data: and blob: URLs');
      assert.deepEqual(seen.errors, []);
    },
    close: () => browser.close(),
  };
}

/** For a test file: opens the page once before its tests (openPage options) and closes it after.
 *  Returns the handle of openPage, filled in when the tests start; `ui.ready` resolves to it (the
 *  root hooks of a file do not wait for each other). */
export function sharedPage(options) {
  const ui = {};
  ui.ready = new Promise((resolve, reject) => {
    before(async () => {
      try { resolve(Object.assign(ui, await openPage(options))); } catch (e) { reject(e); throw e; }
    });
  });
  ui.ready.catch(() => {}); // reported by the hook itself
  after(async () => { if (ui.close) await ui.close(); });
  return ui;
}
