/**
 * The printed sheet in real headless Chromium (Debian's package, driven by
 * playwright-core): page count, running header and footer on every page, and
 * a screenshot of the first page in test-artifacts/ for a person to look at.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { CHROMIUM_PATH, launchPrinter, printPdf, type Printer } from '../../bin/pdf.js';
import { renderDocument } from '../../bin/commands/render.js';

const haveChromium = existsSync(CHROMIUM_PATH);
const havePoppler = (() => { try { execFileSync('pdftotext', ['-v'], { stdio: 'ignore' }); return true; } catch { return false; } })();
if (!haveChromium) console.warn(`sheet-print tests skipped: no Chromium at ${CHROMIUM_PATH} (apt-get install chromium)`);
if (!havePoppler) console.warn('sheet-print tests skipped: pdftotext missing (apt-get install poppler-utils)');

const artifacts = fileURLToPath(new URL('../../test-artifacts/', import.meta.url));
const fixture = (name: string) => fileURLToPath(new URL(`../fixtures/sheets/${name}.md`, import.meta.url));

/** Text of each page, from pdftotext -layout (pages end with form feeds). */
function pagesOf(pdfFile: string): string[] {
  const text = execFileSync('pdftotext', ['-layout', pdfFile, '-'], { encoding: 'utf8' });
  return text.split('\f').filter((p, i, all) => i < all.length - 1 || p.trim() !== '');
}

describe.skipIf(!haveChromium || !havePoppler)('printing a sheet with Chromium', () => {
  let printer: Printer;
  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    printer = await launchPrinter();
  }, 60_000);
  afterAll(async () => { await printer?.close(); });

  it('printPdf(sheet) puts the running header and "sheet n of N" on every page', async () => {
    const file = fixture('arch-ring');
    const { html } = await renderDocument(readFileSync(file, 'utf8'), 'arch-ring.md', {}, { hash: 'f'.repeat(64) });
    const out = `${artifacts}arch-ring.pdf`;
    await printPdf(html, out, printer);
    const info = execFileSync('pdfinfo', [out], { encoding: 'utf8' });
    const count = Number(/Pages:\s+(\d+)/.exec(info)![1]);
    // Title block, summary and cautions fill the first sheet; the working two more; the figures end on the fourth.
    expect(count).toBe(4);
    expect(info).toMatch(/Page size:.*\(A4\)/); // from the sheet's @page rule
    const pages = pagesOf(out);
    expect(pages.length).toBe(count);
    pages.forEach((page, i) => {
      expect(page, `page ${i + 1}`).toContain('calc VB-A01 · rev B · 2026-03-14');
      expect(page, `page ${i + 1}`).toContain('Cellar vault ring — limit analysis (fictional demo)');
      expect(page, `page ${i + 1}`).toContain('job J-4417 · prepared R. Almeida · checked K. Osei');
      expect(page, `page ${i + 1}`).toContain(`sheet ${i + 1} of ${count}`);
    });
    expect(pages[0]).toContain('CHECKS');
    expect(pages[0]).toContain('SCOPE AND LIMITATIONS');
    expect(pages[count - 1]).toContain('SHA-256');
  }, 120_000);

  it('a sheet with errors says so on its printed first page', async () => {
    const file = fixture('errors');
    const { html } = await renderDocument(readFileSync(file, 'utf8'), 'errors.md', {}, { hash: '0'.repeat(64) });
    const out = `${artifacts}errors.pdf`;
    await printPdf(html, out, printer);
    expect(pagesOf(out)[0]).toContain('THIS SHEET HAS 3 ERRORS');
  }, 120_000);

  it('render --drivers: the archive line ends the last page with the appendix\'s last table, never on a page alone', async () => {
    // The clerestory template's appendix filled its page to the end, and the archive line printed alone on the next.
    const file = fileURLToPath(new URL('../../templates/clerestory.md', import.meta.url));
    const { html } = await renderDocument(readFileSync(file, 'utf8'), 'clerestory.md', {}, { hash: 'f'.repeat(64) }, undefined, true);
    const out = `${artifacts}clerestory-drivers.pdf`;
    await printPdf(html, out, printer);
    const pages = pagesOf(out);
    expect(pages[pages.length - 1]).toContain('source clerestory.md · SHA-256');
    pages.forEach((page, i) => {
      // The page without its running header (first line), running footer (from the project's name on) and archive line.
      const lines = page.split('\n').filter((l) => l.trim());
      const footerAt = lines.findIndex((l) => /^\s*Hartwell Hill College/.test(l));
      const body = lines.slice(1, footerAt < 0 ? undefined : footerAt).filter((l) => !/^\s*source \S+ · SHA-256/.test(l));
      expect(body.join(' ').trim().length, `page ${i + 1} of ${pages.length} holds more than the archive line`).toBeGreaterThan(100);
    });
  }, 180_000);

  it('the first page is saved as a screenshot (screen) and as printed (PDF page 1) for review', async () => {
    const file = fixture('verdicts');
    const { html } = await renderDocument(readFileSync(file, 'utf8'), 'verdicts.md', {}, { hash: 'f'.repeat(64) });
    const page = await printer.open(html);
    await page.setViewportSize({ width: 900, height: 1200 });
    const png = await page.screenshot({ path: `${artifacts}sheet-first-page.png` });
    await page.close();
    expect(png.subarray(1, 4).toString()).toBe('PNG');
    writeFileSync(`${artifacts}verdicts.html`, html);
    const pdf = `${artifacts}verdicts.pdf`;
    await printPdf(html, pdf, printer);
    execFileSync('pdftoppm', ['-f', '1', '-l', '1', '-r', '80', '-png', '-singlefile', pdf, `${artifacts}sheet-first-page-printed`]);
    expect(existsSync(`${artifacts}sheet-first-page-printed.png`)).toBe(true);
  }, 120_000);
});
