/**
 * `vaultbook render FILE [-o OUT.html] [--pdf OUT.pdf] [--set NAME=EXPR …]`:
 * the printable calculation sheet, as one self-contained HTML file and/or a PDF.
 *
 * Output: `-o OUT.html` (or `-o -` for stdout); without -o the HTML goes next to
 * FILE as <name>.html, unless only --pdf was asked for, in which case only
 * the PDF is written. Exit 0 when every check holds, 1 when a check is not
 * failing, 2 when the document has errors (the sheet is still written and
 * says so), cannot be read, or the PDF cannot be printed.
 */
import { createHash } from 'node:crypto';
import { execFile } from 'node:child_process';
import { readFile, writeFile } from 'node:fs/promises';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { basename, dirname, join } from 'node:path';
import { promisify } from 'node:util';
import { evaluateDocument, type CompiledDocument, type CellState, type Diagnostic, type Summary } from '../../engine/index.js';
import { renderSheet, type ArchiveInfo } from '../../engine/render/index.js';
import { explainDocument } from '../../engine/drivers/index.js';
import { parse, readOverrides, SET_OPTION, CASE_OPTION, UsageError } from '../args.js';
import { ChromiumMissingError, printPdf } from '../pdf.js';

const run = promisify(execFile);

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

/**
 * The archive identification of a file: SHA-256 of its bytes, and the git commit and
 * whether the file differs from it, when it is inside a repository (failing soft).
 */
export async function archiveInfo(file: string, bytes: Buffer): Promise<ArchiveInfo> {
  const hash = createHash('sha256').update(bytes).digest('hex');
  const cwd = dirname(file);
  try {
    const opts = { cwd, timeout: 5000 };
    const [{ stdout: head }, { stdout: status }] = await Promise.all([
      run('git', ['rev-parse', 'HEAD'], opts),
      run('git', ['status', '--porcelain', '--', basename(file)], opts),
    ]);
    return { hash, commit: head.trim(), dirty: status.trim() !== '' };
  } catch {
    return { hash };
  }
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

export async function renderCommand(args: string[], out: (s: string) => void): Promise<number> {
  const { values, positionals } = parse(args, { ...SET_OPTION, ...CASE_OPTION, output: { type: 'string', short: 'o' }, pdf: { type: 'string' }, drivers: { type: 'boolean' } });
  if (positionals.length !== 1) throw new UsageError('render takes exactly one FILE');
  const file = positionals[0]!;
  const overrides = readOverrides(values.set as string[] | undefined);
  let bytes: Buffer;
  try {
    bytes = await readFile(file);
  } catch (e) {
    const reason = (e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message;
    process.stderr.write(`vaultbook render: cannot read ${file}: ${reason}\n`);
    return 2;
  }
  const { html, summary } = await renderDocument(bytes.toString('utf8'), file, overrides, archiveInfo(file, bytes), values.case as string | undefined, Boolean(values.drivers));
  const htmlPath = values.output as string | undefined ?? (values.pdf ? null : defaultHtmlPath(file));
  // With the sheet on stdout, messages go to stderr so the HTML stays clean.
  const say = htmlPath === '-' ? (s: string) => { process.stderr.write(`${s}\n`); } : out;
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
        process.stderr.write(`vaultbook render: ${e.message}\n`);
        return 2;
      }
      process.stderr.write(`vaultbook render: printing the PDF failed: ${(e as Error).message}\n`);
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
  if (errors) return 2;
  return failing ? 1 : 0;
}
