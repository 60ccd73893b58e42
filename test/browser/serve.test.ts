/**
 * The live sheet in real headless Chromium: edit, review, reset, reload on save, write-back.
 * Each test serves its own temp copy of a fictional fixture on its own port.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { rewriteGivenValues } from '../../bin/serve/rewrite.js';
import { FIXTURES } from '../serve/helpers.js';
import { launchBrowser, openLive, nextEvent, editInput, cellText, type Browser } from './serve-helpers.js';

const BARREL = join(FIXTURES, 'barrel.md');
let browser: Browser;

beforeAll(async () => { browser = await launchBrowser(); }, 60_000);
afterAll(async () => { await browser?.close(); });

describe('vaultbook serve in the browser', { timeout: 120_000 }, () => {
  it('shows the sheet with every input editable', async () => {
    const live = await openLive(browser, BARREL);
    try {
      const { page } = live;
      expect(await page.locator('[data-input]').count()).toBe(10);
      expect(await page.locator('[data-input="L"]').getAttribute('tabindex')).toBe('0');
      expect(await cellText(page, 'H')).toContain('26');
      expect(await page.locator('[data-part="check-summary"]').innerText()).toMatch(/3 checks/i);
      expect(await page.locator('#lv-review').isHidden()).toBe(true);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('an edit re-evaluates only the dependents, patches only changed elements, flips a check and opens the review', async () => {
    const live = await openLive(browser, BARREL);
    try {
      const { page } = live;
      // Keep hold of elements that must not be replaced: the wall weight does not depend on the span.
      await page.evaluate(() => {
        const w = window as unknown as Record<string, unknown>;
        w.__W = document.querySelector('[data-cell="W"]')!.firstElementChild;
        w.__H = document.querySelector('[data-cell="H"]')!.firstElementChild;
        w.__evals = Object.fromEntries(window.vaultbook.sheet.evaluationCounts());
      });
      expect(await cellText(page, 'H')).toContain('4.8');
      // A bare number keeps the document's unit: 6 → 6 m.
      const e = await editInput(page, 'L', '6');
      expect(await page.evaluate(() => window.vaultbook.sheet.overrides.get('L'))).toBe('6 m');
      // Exactly L and what depends on it was evaluated, once each.
      const ran = await page.evaluate(() => {
        const before = (window as unknown as { __evals: Record<string, number> }).__evals;
        return [...window.vaultbook.sheet.evaluationCounts()].filter(([id, n]) => n !== (before[id] ?? 0)).map(([id, n]) => `${id}:${n - (before[id] ?? 0)}`).sort();
      });
      expect(ran).toEqual(['H:1', 'L:1', 'M_o:1', 'M_r:1', 'V:1', 'c_ring:1', 'c_third:1', 'c_tip:1', 'k_arc:1', 'sigma:1', 'w:1', 'x_R:1']);
      expect([...e.changed].sort()).toEqual(ran.map((r) => r.split(':')[0]));
      expect(e.patched).not.toContain('W');
      expect(await page.evaluate(() => document.querySelector('[data-cell="W"]')!.firstElementChild === (window as unknown as { __W: Element }).__W)).toBe(true);
      expect(await page.evaluate(() => document.querySelector('[data-cell="H"]')!.firstElementChild === (window as unknown as { __H: Element }).__H)).toBe(false);
      // Results and the working (values substituted) follow; hand check H = w L²/(8 f) = 10.58 · 36 / 9.6 = 39.7 kN/m.
      const h = await cellText(page, 'H');
      expect(h).toContain('39.7');
      expect(h).not.toContain('4.8');
      expect(h).toMatch(/Δ \+13\.7 kN\/m\s*\(\+52\.7 %\)/);
      // The middle-third check flips, loudly.
      const third = page.locator('[data-cell="c_third"]');
      expect(await third.getAttribute('class')).toContain('lv-flipped-fail');
      expect(await third.textContent()).toContain('HOLDS → FAILS');
      expect(await page.locator('[data-part="check-summary"]').innerText()).toMatch(/1 of 3 checks FAIL/);
      // The review panel: the input, document → now, and the flip.
      const panel = page.locator('#lv-review');
      expect(await panel.isVisible()).toBe(true);
      expect(await panel.locator('tr[data-review-input="L"]').innerText()).toMatch(/L\s+4\.8 m\s+→\s+6 m/);
      expect(await panel.locator('.lv-flips').innerText()).toMatch(/1 check changed state[\s\S]*middle third of the wall base ✗ holds → fails/);
      expect(await page.evaluate(() => document.body.classList.contains('lv-reviewing'))).toBe(true);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('the page keeps its height while scrolling: every part has its space reserved (barrel-vault template)', async () => {
    const live = await openLive(browser, join(FIXTURES, '..', '..', '..', 'templates', 'barrel-vault.md'));
    try {
      const { page } = live;
      await page.evaluate(() => new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(() => requestAnimationFrame(ok)))));
      const heights: number[] = [await page.evaluate(() => document.documentElement.scrollHeight)];
      for (let y = 0; y < heights[0]!; y += 900) {
        await page.evaluate((top) => window.scrollTo(0, top), y);
        await page.evaluate(() => new Promise((ok) => requestAnimationFrame(() => requestAnimationFrame(ok))));
        heights.push(await page.evaluate(() => document.documentElement.scrollHeight));
      }
      console.log(`page height while scrolling: ${Math.min(...heights)}–${Math.max(...heights)} px (${heights.join(" ")})`);
      expect(Math.max(...heights) - Math.min(...heights)).toBeLessThanOrEqual(0.01 * heights[0]!);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('figures and kernel results follow an edit (fictional arch with its line of thrust)', async () => {
    const live = await openLive(browser, join(FIXTURES, 'arch.md'));
    try {
      const { page } = live;
      const figure = page.locator('[data-cell^="figure@"]');
      expect(await figure.count()).toBe(1);
      const svgBefore = await figure.locator('svg').first().evaluate((el) => el.outerHTML);
      const hBefore = await cellText(page, 'H');
      await editInput(page, 't', '0.1 m');
      const svgAfter = await figure.locator('svg').first().evaluate((el) => el.outerHTML);
      expect(svgAfter).not.toBe(svgBefore);
      expect(await cellText(page, 'H')).not.toBe(hBefore);
      // A ring 0.1 m thick over 4 m has a geometric factor of safety below 2 (Heyman's safe theorem).
      expect(await page.locator('[data-cell="c_gsf"]').getAttribute('class')).toContain('lv-flipped-fail');
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('a second edit and a per-input undo, then one action puts everything back to the document', async () => {
    const live = await openLive(browser, BARREL);
    try {
      const { page } = live;
      const before = await page.locator('#lv-sheet').innerText();
      await editInput(page, 'L', '6');
      await editInput(page, 't', '0.3 m');
      expect(await page.locator('#lv-review tr[data-review-input]').count()).toBe(2);
      await nextEvent(page, 'settled', () => page.click('#lv-review [data-action="reset-one"][data-name="t"]'));
      expect(await page.locator('#lv-review tr[data-review-input]').count()).toBe(1);
      await nextEvent(page, 'settled', () => page.click('#lv-review [data-action="reset-all"]'));
      expect(await page.evaluate(() => window.vaultbook.sheet.overrides.size)).toBe(0);
      expect(await page.locator('#lv-review').isHidden()).toBe(true);
      expect(await page.locator('.lv-badge').count()).toBe(0);
      expect(await page.locator('.lv-flipped-fail, .lv-flipped-warn, .lv-flipped-pass').count()).toBe(0);
      expect(await page.locator('#lv-sheet').innerText()).toBe(before);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('an edit applies on Enter only; a value of another dimension is refused beside the field, kept open when leaving it, never applied', async () => {
    const live = await openLive(browser, BARREL);
    try {
      const { page } = live;
      await page.evaluate(() => {
        const w = window as unknown as { __patches: number };
        w.__patches = 0;
        document.addEventListener('vaultbook:patched', () => { w.__patches++; });
      });
      const patches = () => page.evaluate(() => (window as unknown as { __patches: number }).__patches);
      // Typing key by key applies nothing (no "0" on the way to "0.25"), so no cell flashes.
      await page.click('[data-input="t"]');
      await page.keyboard.press('Control+A');
      await page.keyboard.type('0.25', { delay: 20 });
      expect(await patches()).toBe(0);
      expect(await page.evaluate(() => window.vaultbook.sheet.overrides.size)).toBe(0);
      // A force for a thickness: refused with a message beside the field, marked invalid, nothing applied.
      await page.keyboard.press('Control+A');
      await page.keyboard.type('3 kN');
      await page.keyboard.press('Enter');
      const field = page.locator('input.lv-edit[data-edit="t"]');
      expect(await field.getAttribute('aria-invalid')).toBe('true');
      const msg = page.locator('#lv-edit-msg-t');
      expect(await msg.isVisible()).toBe(true);
      expect(await msg.innerText()).toMatch(/t is length \(m\); "3 kN" is force \(kN\)\. Not applied\./);
      expect(await msg.getAttribute('role')).toBe('alert');
      // Leaving the field does not drop the refused value: the field stays open with its message.
      await page.keyboard.press('Tab');
      expect(await field.isVisible()).toBe(true);
      expect(await field.inputValue()).toBe('3 kN');
      expect(await page.evaluate(() => window.vaultbook.sheet.overrides.size)).toBe(0);
      expect(await patches()).toBe(0);
      // Corrected and committed: applied, and focus stays on the edited input.
      await nextEvent(page, 'settled', async () => {
        await field.fill('0.25');
        await field.press('Enter');
      });
      expect(await page.evaluate(() => [...window.vaultbook.sheet.overrides])).toEqual([['t', '0.25 m']]);
      expect(await page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.input)).toBe('t');
      // Escape keeps the value and the focus.
      await page.keyboard.press('Enter');
      await field.fill('9 m');
      await field.press('Escape');
      expect(await page.evaluate(() => (document.activeElement as HTMLElement | null)?.dataset.input)).toBe('t');
      expect(await page.evaluate(() => [...window.vaultbook.sheet.overrides])).toEqual([['t', '0.25 m']]);
      // The document's value typed another way is no change: 4.80 for 4.8 m.
      await page.click('[data-input="L"]');
      await page.fill('input.lv-edit[data-edit="L"]', '4.80');
      await page.keyboard.press('Enter');
      expect(await page.evaluate(() => [...window.vaultbook.sheet.overrides])).toEqual([['t', '0.25 m']]);
      expect(await page.locator('#lv-review tr[data-review-input]').count()).toBe(1);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('saving the file in another editor reloads the page within a second, keeping trial values that still apply', async () => {
    const live = await openLive(browser, BARREL);
    try {
      const { page, file } = live;
      await editInput(page, 'L', '6');
      await editInput(page, 'P', '80 kN/m');
      // Another editor: raises the fill load and drops the input P (folding it into the formulas).
      const text = readFileSync(file, 'utf8');
      const edited = text.replace('q_fill = 6 kN/m^2', 'q_fill = 8 kN/m^2')
        .replace(/^P = 50 kN\/m.*\n/m, '').replaceAll('(W + P)', '(W + 50 kN/m)').replace('(W + P + V)', '(W + 50 kN/m + V)');
      expect(edited).not.toContain('P)');
      const t0 = Date.now();
      const loaded = await nextEvent<{ version: string }>(page, 'loaded', async () => writeFileSync(file, edited));
      const ms = Date.now() - t0;
      console.log(`file-watch reload: ${ms} ms from save to reloaded page`);
      expect(ms).toBeLessThan(1000);
      expect(loaded.version).not.toBe('');
      expect(await cellText(page, 'q_fill')).toContain('8');
      expect(await page.evaluate(() => [...window.vaultbook.sheet.overrides])).toEqual([['L', '6 m']]);
      expect(await cellText(page, 'L')).toContain('6');
      const panel = await page.locator('#lv-review').innerText();
      expect(panel).toMatch(/changed on disk and was reloaded/);
      expect(panel).toMatch(/no longer applied: P/);
      expect(panel).toMatch(/L\s+4\.8 m\s+→\s+6 m/);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('"Write these inputs into the document" replaces only the value text, byte for byte (CRLF file)', async () => {
    const live = await openLive(browser, BARREL, { transform: (t) => t.replace(/\n/g, '\r\n') });
    try {
      const { page, file } = live;
      const original = readFileSync(file, 'utf8');
      await editInput(page, 'L', '5.2');
      await editInput(page, 'gamma', '19 kN/m^3');
      const reply = await nextEvent<{ ok: boolean }>(page, 'written', () => page.click('#lv-review [data-action="write"]'));
      expect(reply.ok).toBe(true);
      const expected = original.replace('L = 4.8 m             #', 'L = 5.2 m             #').replace('gamma = 18 kN/m^3     #', 'gamma = 19 kN/m^3     #');
      expect(readFileSync(file, 'utf8')).toBe(expected);
      expect(readFileSync(file).equals(Buffer.from(rewriteGivenValues(original, { L: '5.2 m', gamma: '19 kN/m^3' }).text, 'utf8'))).toBe(true);
      // The written values are now the document's: no trial values left, a note says what was written.
      expect(await page.evaluate(() => window.vaultbook.sheet.overrides.size)).toBe(0);
      expect(await page.locator('#lv-review').innerText()).toMatch(/Wrote 2 inputs into .*: L, gamma/);
      expect(await page.locator('.lv-badge').count()).toBe(0);
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });

  it('write-back after a change on disk the page has not seen is refused; nothing is overwritten', async () => {
    // Held from the start: an event stream already open cannot be paused, only refused.
    let hold = true;
    const live = await openLive(browser, BARREL, {
      // Stand in for a slow notification: while `hold` is set, the server's file-change events do not reach the page
      // (the built page hears them on /__events, the development server's page on its websocket).
      prepare: async (page) => {
        await page.route('**/__events', (route) => (hold ? route.abort() : route.continue()));
        await page.routeWebSocket(/.*/, (ws) => {
          const server = ws.connectToServer();
          server.onMessage((m) => { if (!(hold && String(m).includes('vaultbook:doc'))) ws.send(m); });
          ws.onMessage((m) => server.send(m));
        });
      },
    });
    try {
      const { page, file } = live;
      await editInput(page, 'L', '5.2 m');
      hold = true;
      const external = readFileSync(file, 'utf8').replace('# ring thickness, one brick', '# ring thickness, one brick (checked on site)');
      writeFileSync(file, external);
      await new Promise((r) => setTimeout(r, 700)); // the server has seen it; the page has not
      const reply = await nextEvent<{ ok: boolean; conflict?: boolean }>(page, 'written', () => page.click('#lv-review [data-action="write"]'));
      expect(reply).toMatchObject({ ok: false, conflict: true });
      expect(readFileSync(file, 'utf8')).toBe(external);
      expect(await page.locator('#lv-review .lv-msg-error').innerText()).toMatch(/changed on disk since this page loaded it; nothing was written/);
      // Load the version on disk: the trial value is kept; writing now succeeds on top of the other edit.
      hold = false;
      await nextEvent(page, 'loaded', () => page.click('#lv-review [data-action="reload"]'));
      expect(await page.evaluate(() => [...window.vaultbook.sheet.overrides])).toEqual([['L', '5.2 m']]);
      const ok = await nextEvent<{ ok: boolean }>(page, 'written', () => page.click('#lv-review [data-action="write"]'));
      expect(ok.ok).toBe(true);
      expect(readFileSync(file, 'utf8')).toBe(external.replace('L = 4.8 m             #', 'L = 5.2 m             #'));
      // The browser logs the refused request itself; nothing else went wrong.
      expect(live.errors.filter((e) => !/status of 409 \(Conflict\)|net::ERR_FAILED/.test(e))).toEqual([]);
    } finally { await live.close(); }
  });
});
