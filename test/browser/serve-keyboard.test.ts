/**
 * The live sheet with the keyboard only, in headless Chromium: each input's accessible name says
 * what it is, the focus ring shows, focus stays on the edited input after Enter and Escape, a
 * refusal is announced, and the write action is a few key presses away.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { FIXTURES } from '../serve/helpers.js';
import { launchBrowser, openLive, nextEvent, type Browser } from './serve-helpers.js';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); }, 60_000);
afterAll(async () => { await browser?.close(); });

describe('vaultbook serve with the keyboard only', { timeout: 120_000 }, () => {
  it('Tab reaches the inputs, Enter edits, refusals are announced, Alt+R and Tab reach the write action', async () => {
    const live = await openLive(browser, join(FIXTURES, 'barrel.md'));
    try {
      const { page, file } = live;
      const focused = () => page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        return { input: el?.dataset.input ?? null, edit: el?.dataset.edit ?? null, action: el?.dataset.action ?? null, label: el?.getAttribute('aria-label') ?? '' };
      });
      // From the top of the page: the print button, the links of the checks summary, then the first input.
      let presses = 0;
      while ((await focused()).input === null && presses < 10) { await page.keyboard.press('Tab'); presses++; }
      expect(presses).toBeLessThanOrEqual(8);
      // Its accessible name says what it is (symbol and description), not only "4.8 m".
      const first = await focused();
      expect(first.label).toMatch(new RegExp(`^${first.input}, .+ = .+; press Enter to change$`));
      expect(await page.getByRole('button', { name: /^L, clear span between springings = 4\.8/ }).count()).toBe(1);
      // A visible focus ring.
      const ring = await page.evaluate(() => { const s = getComputedStyle(document.activeElement!); return [s.outlineStyle, parseFloat(s.outlineWidth)] as const; });
      expect(ring[0]).not.toBe('none');
      expect(ring[1]).toBeGreaterThanOrEqual(2);
      // Go to L and edit it with the keyboard.
      while ((await focused()).input !== 'L') await page.keyboard.press('Tab');
      await page.keyboard.press('Enter');
      expect(await focused()).toMatchObject({ edit: 'L', label: 'L, clear span between springings: value' });
      await page.keyboard.type('3 kN');
      await page.keyboard.press('Enter');
      // Refused: announced (role=alert), marked invalid, focus stays in the field.
      expect((await focused()).edit).toBe('L');
      expect(await page.locator('input.lv-edit[data-edit="L"]').getAttribute('aria-invalid')).toBe('true');
      expect(await page.getByRole('alert').filter({ hasText: 'L is length (m); "3 kN" is force (kN)' }).count()).toBe(1);
      // Escape: back to the input, nothing applied.
      await page.keyboard.press('Escape');
      expect((await focused()).input).toBe('L');
      expect(await page.evaluate(() => window.vaultbook.sheet.overrides.size)).toBe(0);
      // Enter, a value, Enter: applied, focus back on the input.
      await nextEvent(page, 'settled', async () => {
        await page.keyboard.press('Enter');
        await page.keyboard.type('5.2');
        await page.keyboard.press('Enter');
      });
      expect((await focused()).input).toBe('L');
      expect(await page.evaluate(() => [...window.vaultbook.sheet.overrides])).toEqual([['L', '5.2 m']]);
      // Alt+R: straight to the write action.
      await page.keyboard.press('Alt+r');
      expect((await focused()).action).toBe('write');
      // From the top of the page (the bar's print button) it is a few Tab presses away too: the panel comes first in the tab order.
      await page.focus('#lv-print');
      presses = 0;
      while ((await focused()).action !== 'write' && presses < 100) { await page.keyboard.press('Tab'); presses++; }
      expect(presses).toBeLessThanOrEqual(6);
      const reply = await nextEvent<{ ok: boolean }>(page, 'written', () => page.keyboard.press('Enter'));
      expect(reply.ok).toBe(true);
      expect(readFileSync(file, 'utf8')).toMatch(/^L = 5\.2 m {13}#/m);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });
});
