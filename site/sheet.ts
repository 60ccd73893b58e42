/**
 * The one sheet renderer, as the live page uses it (engine/render/, the same
 * code `vaultbook render` runs). This file only adapts its entry points.
 *
 * TEMPORARY: until engine/render/ lands, a minimal stand-in with the same
 * contract (data-cell, data-input, data-part) lets the page be built and tested.
 */
import { marked } from 'marked';
import { formatValue } from '../engine/index.js';
import type { Cell, CellState, CompiledDocument, Diagnostic } from '../engine/index.js';

export interface SheetContext {
  doc: CompiledDocument;
  states: Map<string, CellState>;
  warnings: Map<string, Diagnostic>;
  sigfigs: number;
}

const ESC: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
const esc = (s: unknown) => String(s).replace(/[&<>"']/g, (c) => ESC[c]!);

/** The context every cell render needs; `states` is read live. */
export function makeContext(doc: CompiledDocument, states: Map<string, CellState>, warnings: Map<string, Diagnostic>): SheetContext {
  const s = doc.meta.sigfigs;
  return { doc, states, warnings, sigfigs: typeof s === 'number' ? s : 4 };
}

export function renderCellOutput(cell: Cell, state: CellState, ctx: SheetContext): string {
  let v: string;
  if (state.status === 'ok') v = typeof state.value === 'string' && state.value.startsWith('<svg') ? state.value : esc(formatValue(state.value, { sigfigs: ctx.sigfigs }, cell.displayUnit));
  else if (state.status === 'error') v = `<span class="err">${esc(state.diagnostic.message)}</span>`;
  else if (state.status === 'blocked') v = `blocked by ${esc(state.by)}`;
  else v = '…';
  if (cell.kind === 'given') return `<span data-input="${esc(cell.name)}" data-source="${esc(cell.source)}">${v}</span>`;
  return v;
}

export function renderCheckSummary(doc: CompiledDocument, states: Map<string, CellState>): string {
  let pass = 0, fail = 0;
  for (const c of doc.graph.cells) {
    const s = states.get(c.id);
    if (c.kind !== 'check' || s?.status !== 'ok') continue;
    if ((s.value as { pass: boolean }).pass) pass++; else fail++;
  }
  return `${pass} checks hold, ${fail} fail`;
}

export function renderDiagnostics(doc: CompiledDocument, states: Map<string, CellState>, _warnings?: Map<string, Diagnostic>): string {
  const out: string[] = doc.diagnostics.map((d) => `<li>${esc(d.line)}: ${esc(d.message)}</li>`);
  for (const c of doc.graph.cells) {
    const s = states.get(c.id);
    if (s?.status === 'error') out.push(`<li>${esc(s.diagnostic.line)}: ${esc(s.diagnostic.message)}</li>`);
  }
  return `<ul>${out.join('')}</ul>`;
}

export function renderSheet(input: { doc: CompiledDocument; states: Map<string, CellState>; warnings?: Map<string, Diagnostic>; options?: { standalone?: boolean } }): string {
  const { doc, states } = input;
  const ctx = makeContext(doc, states, input.warnings ?? new Map());
  const parts = doc.blocks.map((b, i) => {
    if (b.kind === 'prose') return marked.parse(b.raw, { async: false }) as string;
    const rows = doc.graph.cells.filter((c) => c.block === i).map((c) => `<div class="row"><code>${esc(c.name ?? c.text)}</code> = `
      + `<span data-cell="${esc(c.id)}">${renderCellOutput(c, states.get(c.id) ?? { status: 'pending' }, ctx)}</span> <small>${esc(c.description)}</small></div>`);
    return `<section class="cells ${b.cellKind}">${rows.join('')}</section>`;
  });
  return `<article class="vb-sheet"><div data-part="check-summary">${renderCheckSummary(doc, states)}</div>${parts.join('')}`
    + `<div data-part="diagnostics">${renderDiagnostics(doc, states)}</div></article>`;
}

/** The sheet's own stylesheet (the same one the standalone sheet inlines). */
export const SHEET_CSS = '';
