/**
 * Opening the live page: from calling `serve` (startServer) to the sheet painted in headless
 * Chromium, for the page built once and reused (the default) and for Vite's development server.
 * The browser is started first, so its own start is not counted, and the server's modules are loaded
 * by the first start (a cold `vaultbook serve` process adds its own start to these). Target: 2 s (issue 16).
 */
import { copyFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium } from 'playwright-core';
import { startServer } from '../../bin/serve/server.js';
import { buildSite } from '../../bin/serve/built-site.js';

const REPO = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const RUNS = 3;

export async function run(): Promise<string[]> {
  const dir = mkdtempSync(join(tmpdir(), 'vaultbook-bench-start-'));
  const file = join(dir, 'barrel-vault.md');
  copyFileSync(join(REPO, 'templates', 'barrel-vault.md'), file);
  const profile = mkdtempSync(join(tmpdir(), 'vaultbook-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium', headless: true, viewport: { width: 1400, height: 1000 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  const lines: string[] = [];
  try {
    const build = await buildSite();
    lines.push(`serve-start: page bundle ${build.built ? `built in ${(build.ms / 1000).toFixed(1)} s (first use after a source change)` : `reused (key check ${build.ms.toFixed(0)} ms)`}`);
    for (const site of ['built', 'dev'] as const) {
      const times: number[] = [];
      const lives: number[] = [];
      let requests = 0;
      for (let i = 0; i < RUNS; i++) {
        const page = await context.newPage();
        // The first frame painted with the sheet in it (the server's first paint, or the live sheet).
        await page.addInitScript(() => {
          new MutationObserver((_, obs) => {
            const sheet = document.getElementById('lv-sheet');
            if (!sheet?.firstElementChild) return;
            obs.disconnect();
            requestAnimationFrame(() => setTimeout(() => { (window as unknown as { __painted: number }).__painted = performance.timeOrigin + performance.now(); }, 0));
          }).observe(document, { childList: true, subtree: true });
        });
        let count = 0;
        page.on('request', () => { count++; });
        const t0 = performance.timeOrigin + performance.now();
        const server = await startServer({ file, port: 0, logLevel: 'error', site });
        await page.goto(server.url);
        const [painted, live] = await page.evaluate(() => window.vaultbook.ready.then(() => new Promise<[number, number]>((ok) => requestAnimationFrame(() => setTimeout(() => {
          ok([(window as unknown as { __painted: number }).__painted, performance.timeOrigin + performance.now()]);
        }, 0)))));
        times.push(painted - t0);
        lives.push(live - t0);
        requests = count;
        await page.close();
        await server.close();
      }
      times.sort((a, b) => a - b);
      lives.sort((a, b) => a - b);
      const median = times[Math.floor(times.length / 2)]!;
      const liveMedian = lives[Math.floor(lives.length / 2)]!;
      lines.push(`serve-start: ${site === 'built' ? 'built page' : 'development server'}: serve start → sheet painted median ${(median / 1000).toFixed(2)} s over ${RUNS} starts`
        + ` (${requests} requests; target ≤ 2 s: ${median <= 2000 ? 'met' : 'NOT met'}); editable (evaluated in the page) at ${(liveMedian / 1000).toFixed(2)} s`);
    }
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
    rmSync(dir, { recursive: true, force: true });
  }
  return lines;
}
