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
});
