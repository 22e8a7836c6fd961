// Shared launcher for the end-to-end test and the timing page: Debian's Chromium through
// playwright-core (which downloads no browser), a fresh empty profile, no network.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { execFileSync } from 'node:child_process';
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

