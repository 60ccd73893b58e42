/**
 * The live page with cases (Chromium, loopback only): the chooser shows a case (its inputs become
 * trial values in the review panel), the checks summary names each check's governing case and
 * follows an input change, and `serve --case NAME` opens on that case.
 * The beam: M = P·a·b/L (any statics text).
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { startServer } from '../../../bin/serve/server.js';
import { launchBrowser, editInput, cellText, type Browser } from '../../browser/serve-helpers.js';
import { fence } from '../../helpers/settle.js';

const BEAM = [
  fence('given', 'L = 6 m  # span', 'gamma_G = 1.0  # factor on the load', 'P = 10 kN  # point load', 'x_P = 3 m  # where the load stands'),
  fence('calc', 'M = gamma_G * P * x_P * (L - x_P) / L to kN m'),
  fence('check', 'c_M = M <= 20 kN m  # bending'),
  fence('cases', 'STR = {gamma_G: 1.35}  # strength', 'axle = {x_P: steps(0.1 * L, 0.9 * L, 5)}  # the load rolled across'),
].join('\n');

let browser: Browser;
let dir: string;
beforeAll(async () => { browser = await launchBrowser(); dir = mkdtempSync(join(tmpdir(), 'vaultbook-live-cases-')); }, 60_000);
afterAll(async () => { await browser?.close(); rmSync(dir, { recursive: true, force: true }); });

async function open(name: string, caseName?: string, text = BEAM): Promise<{ page: Page; close: () => Promise<void>; errors: string[] }> {
  const file = join(dir, name);
  writeFileSync(file, text);
  const server = await startServer({ file, port: 0, logLevel: 'error', ...(caseName ? { case: caseName } : {}) });
  const page = await browser.context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  await page.goto(server.url);
  await page.evaluate(() => window.vaultbook.ready);
  return { page, errors, close: async () => { await page.close(); await server.close(); } };
}

const summary = (page: Page) => page.locator('[data-part="check-summary"]').textContent();

describe('live page with cases', () => {
  it('the chooser lists the cases; choosing STR makes its input a trial value and shows its verdict', async () => {
    const { page, close, errors } = await open('a.md');
    try {
      expect(await page.locator('#lv-case option').allTextContents()).toEqual(['as written', 'STR — strength', 'axle[1] — the load rolled across', 'axle[2] — the load rolled across', 'axle[3] — the load rolled across', 'axle[4] — the load rolled across', 'axle[5] — the load rolled across']);
      // The envelope: STR gives 1.35 · 15 kN m = 20.25 kN m > 20 kN m.
      await page.waitForFunction(() => document.querySelector('[data-part="check-summary"]')?.textContent?.includes('governing: STR'));
      expect(await summary(page)).toContain('FAILS');
      await page.selectOption('#lv-case', 'STR');
      await page.waitForFunction(() => document.querySelector('[data-cell="c_M"]')?.textContent?.includes('FAILS'));
      expect(await page.locator('#lv-review').textContent()).toContain('gamma_G');
      expect(errors).toEqual([]);
    } finally { await close(); }
  });

  it('an input changed on the page moves the envelope: with P = 8 kN every case holds', async () => {
    const { page, close } = await open('b.md');
    try {
      await page.waitForFunction(() => document.querySelector('[data-part="check-summary"]')?.textContent?.includes('governing: STR'));
      await editInput(page, 'P', '8 kN');
      // STR: 1.35 · 8 · 3 · 3 / 6 = 16.2 kN m ≤ 20 kN m.
      await page.waitForFunction(() => !document.querySelector('[data-part="check-summary"]')?.textContent?.includes('FAILS'));
      expect(await summary(page)).toContain('governing: STR');
      expect(await cellText(page, 'c_M')).toContain('HOLDS');
    } finally { await close(); }
  });

  it('a check limited to other cases than the one shown is no flip in the review panel', async () => {
    // c_R is judged in the axle family only. In STR, R = 1.35 · 10 · 3 / 6 = 6.75 kN > 6 kN would "flip" it.
    const text = BEAM.replace("fence('check', 'c_M = M <= 20 kN m  # bending')", '').replace('c_M = M <= 20 kN m  # bending', 'c_M = M <= 20 kN m  # bending\nc_R = gamma_G * P * (L - x_P) / L <= 6 kN  # left reaction [in axle]');
    const { page, close } = await open('d.md', undefined, text);
    try {
      await page.selectOption('#lv-case', 'STR');
      await page.waitForFunction(() => document.querySelector('[data-cell="c_M"]')?.textContent?.includes('FAILS'));
      const panel = (await page.locator('#lv-review').textContent()) ?? '';
      expect(panel).toContain('bending');
      expect(panel).not.toContain('left reaction');
    } finally { await close(); }
  });

  it('a check limited to cases flips as its verdict over them does, under its description without the [in …] marker; choosing its case is no flip', async () => {
    // c_R is judged in STR only, and the page shows its verdict there: R = 1.35 · 10 · 3 / 6 = 6.75 kN > 6 kN fails.
    const text = BEAM.replace('c_M = M <= 20 kN m  # bending', 'c_M = M <= 20 kN m  # bending\nc_R = gamma_G * P * (L - x_P) / L <= 6 kN  # left reaction [in STR]');
    const { page, close, errors } = await open('e.md', undefined, text);
    try {
      expect(await cellText(page, 'c_R')).toContain('FAILS');
      await page.evaluate(() => { (window as unknown as { __cases: Promise<unknown> }).__cases = new Promise((ok) => document.addEventListener('vaultbook:cases', ok, { once: true })); });
      await page.selectOption('#lv-case', 'STR');
      // STR as a trial value: c_M flips (1.35 · 15 = 20.25 kN m > 20 kN m); c_R fails over STR as before, no flip.
      await page.waitForFunction(() => document.querySelector('[data-cell="c_M"]')?.textContent?.includes('FAILS'));
      await page.evaluate(() => (window as unknown as { __cases: Promise<unknown> }).__cases);
      expect(await page.locator('#lv-review').textContent()).toContain('bending');
      expect(await page.locator('#lv-review').textContent()).not.toContain('left reaction');
      // P = 8 kN: R = 1.35 · 8 · 3 / 6 = 5.4 kN ≤ 6 kN holds in STR, once the cases are judged again.
      await editInput(page, 'P', '8 kN');
      await page.waitForFunction(() => document.querySelector('[data-cell="c_R"]')?.textContent?.includes('HOLDS'));
      const panel = (await page.locator('#lv-review').textContent()) ?? '';
      expect(panel).toContain('left reaction ✓ fails → holds');
      expect(panel).not.toContain('[in ');
      expect(await page.locator('[data-cell="c_R"]').getAttribute('class')).toMatch(/lv-flipped-pass/);
      expect(errors).toEqual([]);
    } finally { await close(); }
  });

  it('serve --case axle[1] opens on that case', async () => {
    const { page, close } = await open('c.md', 'axle[1]');
    try {
      expect(await page.locator('#lv-case').inputValue()).toBe('axle[1]');
      // axle[1]: x_P = 0.6 m, M = 10 · 0.6 · 5.4 / 6 = 5.4 kN m.
      await page.waitForFunction(() => document.querySelector('[data-cell="M"]')?.textContent?.includes('5.4'));
    } finally { await close(); }
  });
});
