/**
 * renderSheet: a settled document → the printable calculation sheet.
 *
 * Title block, status banner, checks summary, diagnostics and cautions on
 * the first page; then the document in order: prose, input tables, steps of
 * working, checks and figures; and the archive footer. Every value-dependent
 * region is an element `data-cell="<id>"` whose inner HTML is exactly
 * renderCellOutput(cell, state, ctx), so a live page can patch it alone.
 */
import type { CalcBlock, Cell, CellState, CompiledDocument } from '../types.js';
import type { CaseRun } from '../cases/index.js';
import type { Diagnostic } from '../diagnostic.js';
import { anchorId, escapeHtml } from './escape.js';
import { makeRenderContext, type RenderContext, type SheetOptions } from './context.js';
import { readTitle, renderTitleBlock, pageStyle } from './titleblock.js';
import { renderCheckSummary, renderCheck, renderCheckOutput } from './check.js';
import { renderDiagnostics, renderStatus, diagnosticHtml } from './diagnostics.js';
import { renderInputs, renderInputOutput } from './inputs.js';
import { renderCalc, renderCalcOutput } from './derived.js';
import { renderFigure, renderFigureOutput } from './figure.js';
import { renderProse } from './prose.js';
import { renderCautions, renderArchive } from './notes.js';
import { sha256Hex } from './sha256.js';
import { SHEET_CSS } from './sheet-css.js';
import { renderCasesBlock } from './cases.js';
import { renderDriversAppendix } from './drivers.js';
import type { CheckDrivers } from '../drivers/index.js';

export interface SheetInput {
  doc: CompiledDocument;
  states: Map<string, CellState>;
  warnings?: Map<string, Diagnostic>;
  options?: SheetOptions;
  /** The cases' verdicts (Evaluation.cases): the summary shows the governing case, the cases block the envelope. */
  cases?: CaseRun;
  /** What drives each check (engine/drivers, `render --drivers`): an appendix after the body. */
  drivers?: readonly CheckDrivers[];
}

/**
 * The inner HTML of the element `data-cell="<cell.id>"`.
 * @example el.innerHTML = renderCellOutput(cell, session.states.get(cell.id), ctx)
 */
export function renderCellOutput(cell: Cell, state: CellState, ctx: RenderContext): string {
  switch (cell.kind) {
    case 'given': return renderInputOutput(cell, state, ctx);
    case 'calc': return renderCalcOutput(cell, state, ctx);
    case 'check': return renderCheckOutput(cell, state, ctx);
    case 'figure': return renderFigureOutput(cell, state, ctx);
    case 'cases': return '';
  }
}

/** Problems inside a calc block that no rendered cell shows: unreadable lines, duplicates, fence warnings. */
function strayDiagnostics(block: CalcBlock, cells: Cell[], ctx: RenderContext): string {
  const shown = new Set<Diagnostic>();
  for (const c of cells) {
    const s = ctx.states.get(c.id);
    if (s?.status === 'error') shown.add(s.diagnostic);
  }
  const lines = ctx.doc.source.split('\n');
  const stray = ctx.doc.diagnostics.filter((d) => d.line >= block.span.start.line && d.line <= block.span.end.line && !shown.has(d));
  return stray.map((d) => {
    const id = d.cellId && !ctx.doc.graph.byId.has(d.cellId) ? ` id="${anchorId(d.cellId)}"` : '';
    return `<div class="vb-step vb-step--stray"${id}><div class="vb-ref">${d.line}</div><div class="vb-body">`
      + `<pre class="vb-source">${escapeHtml(lines[d.line - 1] ?? '')}</pre>${diagnosticHtml(d)}</div></div>`;
  }).join('');
}

function renderBlock(block: CalcBlock, index: number, ctx: RenderContext, figureNumber: { n: number }): string {
  const cells = ctx.doc.graph.cells.filter((c) => c.block === index);
  let body = '';
  switch (block.cellKind) {
    case 'given': body = cells.length ? renderInputs(cells, ctx) : ''; break;
    case 'calc': body = cells.map((c) => renderCalc(c, ctx)).join(''); break;
    case 'check': body = cells.map((c) => renderCheck(c, ctx)).join(''); break;
    case 'figure': body = cells.map((c) => renderFigure(c, ctx, ++figureNumber.n)).join(''); break;
    case 'cases': body = renderCasesBlock(block, ctx); break;
  }
  return `<section class="vb-block vb-block--${block.cellKind}" id="line-${block.span.start.line}">${body}${strayDiagnostics(block, cells, ctx)}</section>`;
}

/**
 * The sheet's <article>: everything but the page wrapper.
 * @example const html = renderArticle({doc, states})
 */
export function renderArticle(input: SheetInput): string {
  const { doc, states } = input;
  if (!(states instanceof Map)) throw new TypeError('renderSheet: expected states to be a Map');
  if (!doc || !Array.isArray(doc.blocks)) throw new TypeError('renderSheet: expected doc to be a compiled document');
  const options = input.options ?? {};
  const ctx = makeRenderContext(doc, states, input.warnings, options);
  if (input.cases) ctx.cases = input.cases;
  const info = readTitle(doc.meta);
  const figureNumber = { n: 0 };
  const body = doc.blocks.map((b, i) => (b.kind === 'prose'
    ? `<div class="vb-prose">${renderProse(b.raw)}</div>`
    : renderBlock(b, i, ctx, figureNumber))).join('\n');
  const archive = options.archive ?? { hash: sha256Hex(doc.source) };
  const archiveLine = renderArchive(archive, doc.file);
  const appendix = input.drivers ? renderDriversAppendix(input.drivers, undefined, archiveLine) : '';
  // The archive line closes what comes last, as its last child: Chromium keeps it on the page of the text
  // before it (break-before: avoid) only among siblings; after the whole of <main> it could fall onto a page alone.
  // In the drivers appendix it shares an unbreakable wrapper with the last check's table (break-before alone
  // left it on a page of its own after a table that filled the page before).
  return `<article class="vb-sheet">\n<style data-part="page-style">${pageStyle(info, doc.file)}</style>\n`
    + `${renderTitleBlock(info, doc.file)}\n`
    + `<div data-part="status">${renderStatus(doc, states, ctx.warnings)}</div>\n`
    + `<section class="vb-part" data-part="check-summary">${renderCheckSummary(doc, states, ctx)}</section>\n`
    + `<section class="vb-part" data-part="diagnostics">${renderDiagnostics(doc, states, ctx.warnings)}</section>\n`
    + `${renderCautions(ctx.sigfigs)}\n<main class="vb-main">\n${body}\n${appendix ? '' : `${archiveLine}\n`}</main>\n${appendix ? `${appendix}\n` : ''}</article>`;
}

/** What a standalone sheet may load: nothing from anywhere, no scripts; inline styles, data: fonts and images only. */
const CSP = "default-src 'none'; style-src 'unsafe-inline'; font-src data:; img-src data:; base-uri 'none'; form-action 'none'";

/**
 * Renders the calculation sheet.
 * @param input the compiled document, its settled states and warnings, and options
 * @returns a whole self-contained HTML document (standalone, the default) or the <article> alone
 * @example const html = renderSheet({doc, states, options: {standalone: true, katexCss}})
 */
export function renderSheet(input: SheetInput): string {
  const article = renderArticle(input);
  if (input.options?.standalone === false) return article;
  const title = readTitle(input.doc.meta);
  const name = [title.calcRef, title.title || input.doc.file].filter(Boolean).join(' — ');
  return `<!DOCTYPE html>\n<html lang="en">\n<head>\n<meta charset="utf-8">\n`
    + `<meta http-equiv="Content-Security-Policy" content="${CSP}">\n`
    + `<meta name="viewport" content="width=device-width, initial-scale=1">\n<meta name="generator" content="vaultbook">\n`
    + `<title>${escapeHtml(name)}</title>\n<style>${input.options?.katexCss ?? ''}</style>\n<style>${SHEET_CSS}</style>\n</head>\n<body>\n${article}\n</body>\n</html>\n`;
}
