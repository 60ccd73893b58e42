/**
 * Printing the live page gives the same sheet as `vaultbook render --pdf`:
 * both PDFs are turned to text (pdftotext -layout) and compared, with and
 * without a trial value (the page's edit against `render --set`).
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { execFileSync, spawnSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { FIXTURES, REPO } from '../serve/helpers.js';
import { launchBrowser, openLive, editInput, type Browser } from './serve-helpers.js';

let browser: Browser;
beforeAll(async () => { browser = await launchBrowser(); }, 60_000);
afterAll(async () => { await browser?.close(); });

function pdfText(pdf: string): string {
  return execFileSync('pdftotext', ['-layout', pdf, '-'], { encoding: 'utf8' });
}

/**
 * Holds the worker's messages back while `window.__hold` is true; `window.__release()` delivers them in order.
 * (The same wrapping of the worker's message listener as the delayed answers of test/browser/serve-worker.test.ts.)
 */
const HELD_ANSWERS = `{ const add = Worker.prototype.addEventListener;
  window.__held = []; window.__hold = false;
  window.__release = () => { window.__hold = false; for (const f of window.__held.splice(0)) f(); };
  Worker.prototype.addEventListener = function (type, fn, options) {
    return add.call(this, type, type === 'message' ? (e) => { if (window.__hold) window.__held.push(() => fn(e)); else fn(e); } : fn, options);
  }; }`;

function pageCount(pdf: string): number {
  return Number(/Pages:\s+(\d+)/.exec(execFileSync('pdfinfo', [pdf], { encoding: 'utf8' }))![1]);
}

describe('printing the live page', { timeout: 180_000 }, () => {
  for (const [label, set] of [['as the document stands', null], ['with a trial value', ['L', '6 m']]] as const) {
    it(`prints the same sheet as render --pdf, ${label}`, async () => {
      const live = await openLive(browser, join(FIXTURES, 'barrel.md'));
      try {
        const { page, file, dir } = live;
        // The CLI, given the same path the server was given.
        const cliPdf = join(dir, 'cli.pdf');
        const r = spawnSync(process.execPath, [join(REPO, 'bin', 'vaultbook.js'), 'render', file, '--pdf', cliPdf, ...(set ? ['--set', `${set[0]}=${set[1]}`] : [])], { encoding: 'utf8', timeout: 120_000 });
        expect([0, 1], r.stderr).toContain(r.status);
        if (set) await editInput(page, set[0], set[1]);
        // The page, printed the way the render command prints.
        await page.emulateMedia({ media: 'print' });
        await page.evaluate(() => document.fonts.ready.then(() => undefined));
        expect(await page.locator('#lv-review').isVisible()).toBe(false);
        expect(await page.locator('.lv-bar').isVisible()).toBe(false);
        const livePdf = join(dir, 'live.pdf');
        writeFileSync(livePdf, await page.pdf({ preferCSSPageSize: true, printBackground: true, displayHeaderFooter: false, tagged: true }));
        const cliText = pdfText(cliPdf), liveText = pdfText(livePdf);
        expect(cliText.length).toBeGreaterThan(1000);
        if (set) expect(liveText).toMatch(/Inputs changed for this print/i);
        expect(liveText).toBe(cliText);
        expect(pageCount(livePdf)).toBe(pageCount(cliPdf));
        console.log(`print (${label}): ${pageCount(livePdf)} pages, ${liveText.length} characters of text, identical to render --pdf`);
        expect(live.errors).toEqual([]);
      } finally { await live.close(); }
    });
  }

  it('prints a value still being recomputed marked as pending, with a note at the top; the same page settled prints neither', async () => {
    const live = await openLive(browser, join(REPO, 'templates', 'cross-vault.md'), {
      prepare: async (page) => {
        await page.addInitScript(HELD_ANSWERS);
        await page.addInitScript(() => {
          localStorage.removeItem('vaultbook:evaluate');
          const w = window as unknown as { __casesAtLoad: Promise<unknown> };
          w.__casesAtLoad = new Promise((ok) => document.addEventListener('vaultbook:cases', ok, { once: true }));
        });
      },
    });
    type Held = { __hold: boolean; __release(): void };
    const printed = async (name: string): Promise<string> => {
      await page.emulateMedia({ media: 'print' });
      await page.evaluate(() => document.fonts.ready.then(() => undefined));
      const pdf = join(live.dir, `${name}.pdf`);
      writeFileSync(pdf, await page.pdf({ preferCSSPageSize: true, printBackground: true }));
      await page.emulateMedia({ media: 'screen' });
      // pdftotext breaks lines at the page's width: words only.
      return pdfText(pdf).replace(/\s+/g, ' ');
    };
    const { page } = live;
    try {
      expect(await page.evaluate(() => window.vaultbook.sheet.worker !== null)).toBe(true);
      await page.evaluate(() => (window as unknown as { __casesAtLoad: Promise<unknown> }).__casesAtLoad);
      const settledText = await printed('settled');
      expect(settledText).not.toContain('value pending');
      expect(settledText).not.toContain('Printed while values were being recomputed');

      // 1. The worker's answer to an edit is held: the cells it moves are marked waiting, and print so.
      await page.evaluate(() => { (window as unknown as Held).__hold = true; });
      await page.click('[data-input="b_bay"]');
      await page.fill('input.lv-edit[data-edit="b_bay"]', '4 m');
      await page.keyboard.press('Enter');
      await page.waitForFunction(() => document.querySelector('[data-cell="vault_G"].lv-computing') !== null);
      const pending = await printed('pending');
      expect(pending).toContain('Printed while values were being recomputed');
      expect(pending).toContain('value pending — recomputing');
      expect(await page.locator('#lv-pending-note').isVisible()).toBe(false); // on screen the marks say it

      // 2. The answer delivered, the cases are judged again (held too): the checks summary and each check limited to
      // cases show the verdicts of before the edit, and print marked.
      const settled = page.evaluate(() => new Promise((ok) => document.addEventListener('vaultbook:settled', ok, { once: true })));
      await page.evaluate(() => { const w = window as unknown as Held; w.__release(); w.__hold = true; });
      await settled;
      await page.waitForFunction(() => document.querySelector('[data-cell="c_third"].lv-stale') !== null);
      expect(await page.locator('.lv-computing').count()).toBe(0);
      expect(await page.locator('[data-part="check-summary"]').getAttribute('class')).toMatch(/lv-stale/);
      const judging = await printed('judging');
      expect(judging).toContain('Printed while values were being recomputed');
      expect(judging).toContain('value pending — recomputing');

      // 3. Everything in: nothing is marked.
      const cases = page.evaluate(() => new Promise((ok) => document.addEventListener('vaultbook:cases', ok, { once: true })));
      await page.evaluate(() => (window as unknown as Held).__release());
      await cases;
      expect(await page.locator('.lv-stale, .lv-computing').count()).toBe(0);
      const after = await printed('after');
      expect(after).toContain('4 of 7 not evaluated');
      expect(after).not.toContain('value pending');
      expect(after).not.toContain('Printed while values were being recomputed');
      expect(live.errors).toEqual([]);
    } finally { await live.close(); }
  });
});
