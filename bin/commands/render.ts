/**
 * `vaultbook render FILE [-o OUT.html] [--pdf OUT.pdf] [--set NAME=EXPR …]`:
 * the printable calculation sheet, as one self-contained HTML file and/or a PDF.
 *
 * Output: `-o OUT.html` (or `-o -` for stdout); without -o the HTML goes next to
 * FILE as <name>.html, unless only --pdf was asked for, in which case only
 * the PDF is written. Exit 0 when the sheet is written, whatever its checks say
 * (a failing check is content of the sheet); 2 when the document has errors (the
 * sheet is still written and says so on its first page), cannot be read, has no
 * cells (no sheet is written), or the PDF cannot be printed.
 */
import { writeFile } from 'node:fs/promises';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { basename, dirname, join } from 'node:path';
import { compile, evaluateDocument, formatDiagnostic, type CompiledDocument, type CellState, type Diagnostic, type Summary } from '../../engine/index.js';
import { renderSheet, type ArchiveInfo } from '../../engine/render/index.js';
import { explainDocument } from '../../engine/drivers/index.js';
import { parse, readOverrides, SET_OPTION, CASE_OPTION, UsageError } from '../args.js';
import { DocumentError, readDocument } from '../document.js';
import { archiveInfo } from '../git.js';
import { nothingToRender } from '../load.js';
import { ChromiumMissingError, PdfError, plainReason, printPdf } from '../pdf.js';

export { archiveInfo };

let katexCss: string | null = null;

/**
 * KaTeX's stylesheet with its woff2 fonts inlined as data: URLs (woff and ttf fallbacks dropped),
 * so the sheet needs no network and no files beside it.
 */
export function loadKatexCss(): string {
  if (katexCss !== null) return katexCss;
  const dist = dirname(createRequire(import.meta.url).resolve('katex'));
  const css = readFileSync(join(dist, 'katex.min.css'), 'utf8');
  katexCss = css.replace(/src:([^;}]*)/g, (whole, sources: string) => {
    const woff2 = /url\((fonts\/[A-Za-z0-9_-]+\.woff2)\)/.exec(sources);
    if (!woff2) return whole;
    const data = readFileSync(join(dist, woff2[1]!)).toString('base64');
    return `src:url(data:font/woff2;base64,${data}) format("woff2")`;
  });
  return katexCss;
}

/** The HTML path: -o, else FILE with .html in place of its extension. */
export function defaultHtmlPath(file: string): string {
  const name = basename(file).replace(/\.(md|markdown|txt)$/i, '');
  return join(dirname(file), `${name}.html`);
}

/** The sheet for a document text: compile, evaluate, render (standalone). */
export async function renderDocument(source: string, file: string, overrides: Record<string, string>, archiveLookup?: ArchiveInfo | Promise<ArchiveInfo>, caseName?: string, withDrivers = false): Promise<{ html: string; doc: CompiledDocument; states: Map<string, CellState>; warnings: Map<string, Diagnostic>; summary: Summary }> {
  const { doc, states, warnings, summary, cases } = await evaluateDocument(source, { file, overrides, ...(caseName !== undefined ? { case: caseName } : {}) });
  // The git look-up runs while the document evaluates; it is needed only for the footer.
  const archive = await archiveLookup;
  // The appendix "what drives each check" (--drivers) moves every input of every check: it costs more than the sheet.
  const drivers = withDrivers ? (await explainDocument(source, { file, overrides, ...(caseName !== undefined ? { case: caseName } : {}) })).checks : undefined;
  const html = renderSheet({ doc, states, warnings, cases, ...(drivers ? { drivers } : {}), options: { standalone: true, katexCss: loadKatexCss(), ...(archive ? { archive } : {}) } });
  return { html, doc, states, warnings, summary };
}

export async function renderCommand(args: string[], out: (s: string) => void, err: (s: string) => void = (s) => process.stderr.write(`${s}\n`)): Promise<number> {
  const { values, positionals } = parse(args, { ...SET_OPTION, ...CASE_OPTION, output: { type: 'string', short: 'o' }, pdf: { type: 'string' }, drivers: { type: 'boolean' } });
  if (positionals.length !== 1) throw new UsageError('render takes exactly one FILE');
  const file = positionals[0]!;
  const overrides = readOverrides(values.set as string[] | undefined);
  let read: { bytes: Buffer; text: string };
  try {
    read = await readDocument(file);
  } catch (e) {
    if (!(e instanceof DocumentError)) throw e;
    err(formatDiagnostic(e.toDiagnostic()));
    return 2;
  }
  const nothing = nothingToRender(compile(read.text, { file, overrides }));
  if (nothing) {
    err(`${nothing.map(formatDiagnostic).join('\n')}\n  no sheet was written`);
    return 2;
  }
  const { html, summary } = await renderDocument(read.text, file, overrides, archiveInfo(file, read.bytes), values.case as string | undefined, Boolean(values.drivers));
  const htmlPath = values.output as string | undefined ?? (values.pdf ? null : defaultHtmlPath(file));
  // With the sheet on stdout, messages go to stderr so the HTML stays clean.
  const say = htmlPath === '-' ? err : out;
  if (htmlPath === '-') process.stdout.write(html);
  else if (htmlPath) {
    await writeFile(htmlPath, html);
    say(`wrote ${htmlPath} (${(Buffer.byteLength(html) / 1024).toFixed(0)} kB)`);
  }
  if (values.pdf) {
    try {
      await printPdf(html, values.pdf as string);
      say(`wrote ${values.pdf}`);
    } catch (e) {
      if (e instanceof ChromiumMissingError) {
        err(`vaultbook render: ${e.message}`);
        return 2;
      }
      // Plain words only (PdfError); the HTML sheet, when asked for, is already written.
      err(`vaultbook render: the PDF was not written: ${e instanceof PdfError ? e.message : plainReason(e)}`
        + `${htmlPath && htmlPath !== '-' ? `; the HTML sheet ${htmlPath} was written and prints from any browser` : ''}`);
      return 2;
    }
  }
  // Each check's verdict over every case (the document's own verdict when it has no cases).
  // A check limited to other cases than the one shown (judged in no case here) is counted apart, not as not evaluated.
  const offCase = summary.checks.filter((c) => c.cases !== undefined && c.cases.length === 0).length;
  const verdicts = summary.checks.filter((c) => !(c.cases !== undefined && c.cases.length === 0)).map((c) => c.pass);
  const errors = summary.diagnostics.filter((d) => d.severity === 'error').length;
  const failing = verdicts.filter((v) => v === false).length;
  say(`${summary.checks.length} checks: ${verdicts.filter((v) => v === true).length} hold, ${failing} fail`
    + `${verdicts.some((v) => v === null) ? `, ${verdicts.filter((v) => v === null).length} not evaluated` : ''}`
    + `${offCase ? `, ${offCase} not judged in this case` : ''}`
    + `${errors ? `; ${errors} error${errors === 1 ? '' : 's'}: the sheet says so on its first page` : ''}`);
  // A failing check is content of the sheet, not a failure to render it.
  return errors ? 2 : 0;
}
