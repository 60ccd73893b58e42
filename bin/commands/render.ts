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
import { compile, formatDiagnostic, startSession, type CompiledDocument, type CellState, type Diagnostic } from '../../engine/index.js';
import { renderSheet, collectDiagnostics, verdictOf, type ArchiveInfo } from '../../engine/render/index.js';
import { parse, readOverrides, SET_OPTION, UsageError } from '../args.js';
import { DocumentError, readDocument } from '../document.js';
import { archiveInfo } from '../git.js';
import { noCellsDiagnostic } from '../load.js';
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
export async function renderDocument(source: string, file: string, overrides: Record<string, string>, archiveLookup?: ArchiveInfo | Promise<ArchiveInfo>): Promise<{ html: string; doc: CompiledDocument; states: Map<string, CellState>; warnings: Map<string, Diagnostic> }> {
  const doc = compile(source, { file, overrides });
  return renderCompiled(doc, archiveLookup);
}

/** The sheet for a compiled document. */
async function renderCompiled(doc: CompiledDocument, archiveLookup?: ArchiveInfo | Promise<ArchiveInfo>): Promise<{ html: string; doc: CompiledDocument; states: Map<string, CellState>; warnings: Map<string, Diagnostic> }> {
  const session = startSession(doc);
  const states = await session.settle();
  const warnings = new Map(session.warnings);
  session.dispose();
  // The git look-up runs while the document evaluates; it is needed only for the footer.
  const archive = await archiveLookup;
  const html = renderSheet({ doc, states, warnings, options: { standalone: true, katexCss: loadKatexCss(), ...(archive ? { archive } : {}) } });
  return { html, doc, states, warnings };
}

export async function renderCommand(args: string[], out: (s: string) => void, err: (s: string) => void = (s) => process.stderr.write(`${s}\n`)): Promise<number> {
  const { values, positionals } = parse(args, { ...SET_OPTION, output: { type: 'string', short: 'o' }, pdf: { type: 'string' } });
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
  const compiled = compile(read.text, { file, overrides });
  const empty = noCellsDiagnostic(compiled);
  if (empty) {
    err(`${formatDiagnostic(empty)}\n  no sheet was written`);
    return 2;
  }
  const { html, doc, states, warnings } = await renderCompiled(compiled, archiveInfo(file, read.bytes));
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
  const verdicts = doc.graph.cells.filter((c) => c.kind === 'check').map((c) => verdictOf(states.get(c.id) ?? { status: 'pending' }));
  const errors = collectDiagnostics(doc, states, warnings).filter((d) => d.severity === 'error').length;
  const failing = verdicts.filter((v) => v === 'fail').length;
  say(`${verdicts.length} checks: ${verdicts.length - failing - verdicts.filter((v) => v === 'none').length} satisfied, ${failing} not satisfied`
    + `${errors ? `; ${errors} error${errors === 1 ? '' : 's'}: the sheet says so on its first page` : ''}`);
  // A failing check is content of the sheet, not a failure to render it.
  return errors ? 2 : 0;
}
