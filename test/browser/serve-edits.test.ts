/**
 * The live sheet in headless Chromium (issue 16): a check that can no longer be evaluated after an
 * edit is shown as exactly that, a warning, never a pass; and leaving a field with a new value
 * (Tab, or a click elsewhere) applies it rather than dropping it.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { join } from 'node:path';
import { FIXTURES, REPO } from '../serve/helpers.js';
import { launchBrowser, openLive, nextEvent, editInput, type Browser } from './serve-helpers.js';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); }, 60_000);
afterAll(async () => { await browser?.close(); });

describe('vaultbook serve: states after an edit, and edits left by Tab or a click', { timeout: 120_000 }, () => {
  // The four buttress checks are limited to cases by [in …]: on the page as written each shows its verdict over its
  // cases, which follows the cases' verdicts (judged again after each change), in the worker (the default) as on
  // the main thread (localStorage 'vaultbook:evaluate' = 'main', test/browser/serve-worker.test.ts).
  for (const mode of ['worker', 'main'] as const) {
    it(`cross-vault with b_bay = 4 m (${mode === 'worker' ? 'in the worker' : 'on the main thread'}): the four buttress checks read "holds → not evaluated" as warnings on the page and in the review, none as a pass`, async () => {
      // b_bay = 4 m puts the thrust above the top of the buttress (the template's own message: z_T = 3.811 m against
      // a 3.8 m buttress), so the buttress checks cannot be evaluated in their cases; the pocket check fails
      // (z_thrust / z_fill = 1.02, `vaultbook check templates/cross-vault.md --set "b_bay=4 m"`). As written,
      // c_third holds over its case with u = 0.85 (the same command without --set). test/serve/review.test.ts checks the words.
      const live = await openLive(browser, join(REPO, 'templates', 'cross-vault.md'), {
        prepare: async (page) => {
          await page.addInitScript((main) => {
            if (main) localStorage.setItem('vaultbook:evaluate', 'main');
            else localStorage.removeItem('vaultbook:evaluate');
          }, mode === 'main');
        },
      });
      try {
        const { page } = live;
        expect(await page.evaluate(() => window.vaultbook.sheet.worker !== null)).toBe(mode === 'worker');
        expect(await page.locator('[data-cell="c_third"]').textContent()).toMatch(/✓\s*HOLDSu = 0\.85/);
        await editInput(page, 'b_bay', '4 m');
        // From here to the cases' verdicts shown: every main-thread task, long ones reported (in the worker, the
        // cases are judged there and the page swaps their parts a few at a time).
        await page.evaluate(() => {
          const w = window as unknown as { __long: number[] };
          w.__long = [];
          new PerformanceObserver((list) => { for (const e of list.getEntries()) w.__long.push(e.duration); }).observe({ type: 'longtask' });
        });
        // The cases are judged again in the background once the page is quiet.
        await page.waitForFunction(() => /4 of 7 not evaluated/.test(document.querySelector('[data-part="check-summary"]')?.textContent ?? ''), null, { timeout: 30_000 });
        if (mode === 'worker') {
          await page.waitForTimeout(100); // a long task is reported a moment after it ends
          const longest = Math.max(0, ...await page.evaluate(() => (window as unknown as { __long: number[] }).__long));
          console.log(`cross-vault, cases shown after b_bay = 4 m in worker mode: longest main-thread task ${longest.toFixed(0)} ms`);
          // The target is 50 ms; this shared, loaded machine gets 150 ms (as test/browser/serve-worker.test.ts).
          expect(longest).toBeLessThan(150);
        }
        for (const id of ['c_third', 'c_overturn', 'c_slide', 'c_bearing']) {
          const cell = page.locator(`[data-cell="${id}"]`);
          expect(await cell.getAttribute('class'), id).toMatch(/lv-flipped-warn/);
          const text = (await cell.textContent()) ?? '';
          expect(text, id).toContain('NOT EVALUATED');
          expect(text, id).not.toMatch(/✓\s*HOLDS|now holds/i);
          expect(await cell.locator('.lv-badge').textContent(), id).toContain('HOLDS → NOT EVALUATED');
          // The note above the check names its governing case without the utilization painted at load.
          const note = (await page.locator(`.vb-body:has(> [data-cell="${id}"]) > .vb-casenote`).textContent()) ?? '';
          expect(note, id).toMatch(/governing: /);
          expect(note, id).not.toMatch(/u = /);
        }
        const panel = page.locator('#lv-review .lv-flips');
        expect(await panel.innerText()).toMatch(/5 checks changed state/);
        expect(await panel.locator('.lv-fliprow-warn').count()).toBe(4);
        expect(await panel.locator('.lv-fliprow-fail').count()).toBe(1);
        expect(await panel.locator('.lv-fliprow-pass').count()).toBe(0);
        expect(live.errors).toEqual([]);
      } finally { await live.close(); }
    });
  }

  it('cross-vault opened on a case (serve --case EQU), then b_bay = 4 m: the four buttress checks are warnings, none a pass; opening on the case flips none of them', async () => {
    const live = await openLive(browser, join(REPO, 'templates', 'cross-vault.md'), {
      case: 'EQU',
      prepare: async (page) => {
        await page.addInitScript(() => {
          (window as unknown as { __cases: Promise<unknown> }).__cases = new Promise((ok) => document.addEventListener('vaultbook:cases', ok, { once: true }));
        });
      },
    });
    try {
      const { page } = live;
      expect(await page.locator('#lv-case').inputValue()).toBe('EQU');
      const buttress = ['c_third', 'c_overturn', 'c_slide', 'c_bearing'];
      const flipped = () => page.evaluate((ids) => ids.filter((id) => /lv-flipped/.test(document.querySelector(`[data-cell="${id}"]`)?.className ?? '')), buttress);
      // EQU's factors are trial values; each buttress check still shows its verdict over its cases, as written: no flip.
      await page.evaluate(() => (window as unknown as { __cases: Promise<unknown> }).__cases);
      expect(await page.locator('#lv-review tr[data-review-input]').count()).toBeGreaterThan(0);
      expect(await flipped()).toEqual([]);
      await editInput(page, 'b_bay', '4 m');
      await page.waitForFunction(() => /4 of 7 not evaluated/.test(document.querySelector('[data-part="check-summary"]')?.textContent ?? ''), null, { timeout: 30_000 });
      expect(await flipped()).toEqual(buttress);
      for (const id of buttress) expect(await page.locator(`[data-cell="${id}"]`).getAttribute('class'), id).toMatch(/lv-flipped-warn/);
      const panel = page.locator('#lv-review .lv-flips');
      expect(await panel.locator('.lv-fliprow-warn').count()).toBe(4);
      expect(await panel.locator('.lv-fliprow-pass').count()).toBe(0);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('leaving a field with a new value applies it: Tab, and a click elsewhere on the page', async () => {
    const live = await openLive(browser, join(FIXTURES, 'barrel.md'));
    try {
      const { page } = live;
      const overrides = () => page.evaluate(() => [...window.vaultbook.sheet.overrides].sort());
      // Tab away from an edited field: applied (L = 4.8 m in the fixture).
      await nextEvent(page, 'settled', async () => {
        await page.click('[data-input="L"]');
        await page.fill('input.lv-edit[data-edit="L"]', '5.2');
        await page.keyboard.press('Tab');
      });
      expect(await overrides()).toEqual([['L', '5.2 m']]);
      expect(await page.locator('input.lv-edit').count()).toBe(0);
      // A click on the page's title, away from the field: applied too.
      await nextEvent(page, 'settled', async () => {
        await page.click('[data-input="t"]');
        await page.fill('input.lv-edit[data-edit="t"]', '0.25 m');
        await page.locator('h1').first().click();
      });
      expect(await overrides()).toEqual([['L', '5.2 m'], ['t', '0.25 m']]);
      expect(await page.locator('#lv-review tr[data-review-input]').count()).toBe(2);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });
});
