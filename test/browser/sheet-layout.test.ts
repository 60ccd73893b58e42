/**
 * The sheet's layout in real Chromium, for every template and a stress sheet of long formulas,
 * long lists and long names: nothing sticks out of its column at 1024 px or in print, the PDF
 * holds every number the working shows, and the body text keeps its size on every page.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readdirSync, readFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { CHROMIUM_PATH, launchPrinter, printPdf, type Printer } from '../../bin/pdf.js';
import { renderDocument } from '../../bin/commands/render.js';
import { textSize, figureClashes, figureTextSizes, overflowsIn, pdfFontSizes, workingNumbers } from './sheet-measure.js';

const haveTools = existsSync(CHROMIUM_PATH) && (() => { try { execFileSync('pdftohtml', ['-v'], { stdio: 'ignore' }); return true; } catch { return false; } })();
const artifacts = fileURLToPath(new URL('../../test-artifacts/', import.meta.url));
const repo = (p: string) => fileURLToPath(new URL(`../../${p}`, import.meta.url));
/** Every template (a new one is measured without a line here), and the stress sheet. */
const SHEETS = [...readdirSync(repo('templates')).filter((f) => f.endsWith('.md')).sort().map((f) => `templates/${f}`), 'test/fixtures/sheets/long-formulas.md'];
/** A4 less the sheet's left and right margins (18 mm + 15 mm), in CSS px. */
const PRINT_WIDTH = Math.floor((210 - 33) / 25.4 * 96);

describe.skipIf(!haveTools)('sheet layout in Chromium', () => {
  let printer: Printer;
  beforeAll(async () => {
    mkdirSync(artifacts, { recursive: true });
    printer = await launchPrinter();
  }, 60_000);
  afterAll(async () => { await printer?.close(); });

  it('figureClashes finds a line through a label and a label over another text (the measure itself can fail)', async () => {
    const page = await printer.open('<div class="vb-svg"><svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 100 50" width="100mm" height="50mm" font-size="3">'
      + '<line x1="0" y1="20" x2="100" y2="20" stroke="#000"/><text class="vb-label" x="50" y="21" text-anchor="middle">H = 77.0 kN</text>'
      + '<text x="10" y="40">fixed</text><text class="vb-label" x="12" y="40">over</text><text class="vb-label" x="50" y="45">alone</text></svg></div>');
    expect(await figureClashes(page)).toEqual(['figure 1: a line crosses "H = 77.0 kN"', 'figure 1: "fixed" overlaps "over"']);
    await page.close();
  });

  for (const file of SHEETS) {
    const name = file.split('/').pop()!.replace(/\.md$/, '');
    it(`${name}: nothing overflows its box at 1024 px or in print; the PDF keeps the body size and every number`, async () => {
      const { html } = await renderDocument(readFileSync(repo(file), 'utf8'), `${name}.md`, {}, { hash: 'f'.repeat(64) });
      const page = await printer.open(html);
      await page.setViewportSize({ width: 1024, height: 900 });
      expect(await overflowsIn(page), 'screen, 1024 px').toEqual([]);
      const numbers = await workingNumbers(page);
      await page.emulateMedia({ media: 'print' });
      await page.setViewportSize({ width: PRINT_WIDTH, height: 1100 });
      expect(await overflowsIn(page), 'print width').toEqual([]);
      const figureText = await figureTextSizes(page);
      // Figures: every text at least 8 pt on paper; no label crossed by a line or another text; nothing outside the drawing.
      expect(figureText.filter((t) => t.pt < 8), 'figure texts under 8 pt').toEqual([]);
      expect(await figureClashes(page)).toEqual([]);
      await page.close();

      const pdf = `${artifacts}layout-${name}.pdf`;
      await printPdf(html, pdf, printer);
      // Every number of the working is in the PDF's text (none was cut off at a margin).
      const text = execFileSync('pdftotext', [pdf, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
      const missing = numbers.filter((n) => !text.includes(n));
      expect(missing, `${numbers.length} numbers in the working`).toEqual([]);
      // Not a vacuous measure: the working shows numbers. The buttress shows the fewest (5: its factors, loads and
      // depth): each of its checks is judged only in its cases, so the body shows their formulas without
      // substitution, and its other cells are bare references whose values the output column shows.
      expect(numbers.length).toBeGreaterThanOrEqual(5);
      // The text keeps its size on every page (prose 10.5 pt, working 10 pt, tables 9 pt): nothing shrank a page to fit,
      // which Chromium does to a whole printout when one element is wider than the paper (it was 6.5 pt before).
      const pages = pdfFontSizes(pdf);
      const bodies = pages.map(textSize);
      console.log(`${name}: ${pages.length} pages, text sizes ${bodies.join(' ')} pt, smallest ${Math.min(...pages.flatMap((p) => [...p.keys()]))} pt; `
        + `figure text ${figureText.length ? Math.min(...figureText.map((t) => t.pt)) : '—'} pt smallest`);
      // A page given to a figure has the figure's labels as its bulk, at 8 pt (the least they print at); it was not
      // shrunk when its largest text, the running title (12 pt and more), kept its size (a page shrunk to fit has all below 8).
      for (const [i, b] of bodies.entries()) {
        const largest = Math.max(...pages[i]!.keys());
        expect(b >= 8.5 || (b >= 8 && largest >= 12), `text size on page ${i + 1}: ${b} pt, largest ${largest} pt`).toBe(true);
      }
      // The running footer is never cut, and no page holds only the end of the document and its archive footer.
      const rawPages = execFileSync('pdftotext', [pdf, '-'], { encoding: 'utf8' }).split('\f').filter((t) => t.trim());
      const pageTexts = rawPages.map((t) => t.replace(/\s+/g, ' '));
      for (const [i, t] of pageTexts.entries()) {
        expect(t, `footer of page ${i + 1}`).not.toMatch(/prepared [^·]*…/);
        // What the page holds besides its running header (first line), footer (last lines, from the project on) and archive line.
        const lines = rawPages[i]!.split('\n').filter((l) => l.trim());
        const footerAt = lines.map((l) => /^Hartwell Hill College|^job /.test(l)).lastIndexOf(true);
        const body = lines.slice(1, footerAt < 0 ? undefined : footerAt).join(' ').replace(/source \S+ · SHA-256 f+/, '').replace(/sheet \d+ of \d+/, '');
        expect(body.length, `text on page ${i + 1} besides header, footer and archive line`).toBeGreaterThan(200);
      }
      // A footer too long for one line wraps (pdftotext reads "sheet n of N" into the middle of it).
      if (name === 'long-formulas') {
        for (const t of pageTexts) expect(t.replace(/ sheet \d+ of \d+/, '')).toContain('checked K. Osei-Brightwater, independent checker for the college estates department');
      }
    }, 120_000);
  }
});
