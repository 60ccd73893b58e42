/**
 * The printed sheet of each template: page count, the smallest font size in the PDF and the smallest
 * figure text on paper (target: figure text ≥ 8 pt; nothing shrunk to fit).
 */
import { readdirSync, readFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { launchPrinter, printPdf } from '../../bin/pdf.js';
import { renderDocument } from '../../bin/commands/render.js';
import { figureTextSizes, pdfFontSizes, textSize } from '../browser/sheet-measure.js';

const REPO = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

export async function run(): Promise<string[]> {
  const printer = await launchPrinter();
  const dir = mkdtempSync(join(tmpdir(), 'vaultbook-bench-print-'));
  const lines: string[] = [];
  try {
    for (const name of readdirSync(join(REPO, 'templates')).filter((f) => f.endsWith('.md')).sort()) {
      const { html } = await renderDocument(readFileSync(join(REPO, 'templates', name), 'utf8'), name, {}, { hash: '0'.repeat(64) });
      const pdf = join(dir, `${name}.pdf`);
      await printPdf(html, pdf, printer);
      const pages = pdfFontSizes(pdf);
      const smallest = Math.min(...pages.flatMap((p) => [...p.keys()]));
      const text = Math.min(...pages.map(textSize));
      const page = await printer.open(html);
      await page.emulateMedia({ media: 'print' });
      await page.setViewportSize({ width: Math.floor((210 - 33) / 25.4 * 96), height: 1100 });
      const fig = (await figureTextSizes(page)).map((t) => t.pt);
      await page.close();
      lines.push(`print: ${name}: ${pages.length} pages; smallest font in the PDF ${smallest} pt; running text at least ${text} pt on every page;`
        + ` smallest figure text ${fig.length ? `${Math.min(...fig)} pt (target ≥ 8 pt: ${Math.min(...fig) >= 8 ? 'met' : 'NOT met'})` : '—'}`);
    }
  } finally {
    await printer.close();
    rmSync(dir, { recursive: true, force: true });
  }
  return lines;
}
