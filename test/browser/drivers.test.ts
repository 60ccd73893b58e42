/**
 * What drives a check on the live page (issue 17): clicking a check marks its dependency path and
 * shows its inputs ranked by swing; a change of input computes them again. Fictional fixture:
 * the cellar barrel vault, whose ring stress c_ring = sigma <= f_d reads the span, rise, thickness,
 * unit weight and fill but not the wall's inputs.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { join } from 'node:path';
import { FIXTURES } from '../serve/helpers.js';
import { launchBrowser, openLive, editInput, type Browser } from './serve-helpers.js';

const BARREL = join(FIXTURES, 'barrel.md');
let browser: Browser;

beforeAll(async () => { browser = await launchBrowser(); }, 60_000);
afterAll(async () => { await browser?.close(); });

describe('live page: what drives a check', { timeout: 120_000 }, () => {
  it('clicking a check marks its dependency path and lists its drivers; an edit updates them; a second click clears', async () => {
    const live = await openLive(browser, BARREL);
    try {
      const { page } = live;
      await page.click('[data-cell="c_ring"]');
      const path = await page.evaluate(() => [...document.querySelectorAll<HTMLElement>('.lv-path')].map((e) => e.dataset.cell).sort());
      expect(path).toContain('L');
      expect(path).toContain('H');
      expect(path).toContain('c_ring');
      expect(path).not.toContain('b_w');
      expect(path).not.toContain('c_tip');
      await page.waitForSelector('.lv-drivers[data-check="c_ring"] table');
      const names = await page.$$eval('.lv-drivers tbody code', (els) => els.map((e) => e.textContent));
      expect(names.length).toBeGreaterThan(0);
      expect(names).not.toContain('b_w');
      const before = await page.locator('.lv-drivers').innerText();
      await editInput(page, 't', '0.3 m');
      await page.waitForFunction((old) => {
        const box = document.querySelector<HTMLElement>('.lv-drivers[data-check="c_ring"]');
        return box !== null && box.innerText !== old;
      }, before, { timeout: 20_000 });
      expect(await page.locator('.lv-drivers').innerText()).toContain('0.3 m');
      await page.click('[data-cell="c_ring"]');
      expect(await page.locator('.lv-path').count()).toBe(0);
      expect(await page.locator('.lv-drivers').count()).toBe(0);
      expect(live.errors).toEqual([]);
    } finally {
      await live.close();
    }
  });
});
