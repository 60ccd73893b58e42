/**
 * Diagnostics on the sheet: in place at the cell they belong to, listed at
 * the top, and a banner on the first page when anything is in error.
 */
import type { CellState, CompiledDocument } from '../types.js';
import type { Diagnostic } from '../diagnostic.js';
import { anchorId, escapeHtml } from './escape.js';

const SEVERITY_WORD: Record<Diagnostic['severity'], string> = { error: 'ERROR', warning: 'WARNING', info: 'NOTE' };
const SEVERITY_MARK: Record<Diagnostic['severity'], string> = { error: '✗', warning: '!', info: 'i' };

/**
 * One diagnostic as a box at its cell.
 * @example diagnosticHtml(d) // '<div class="vb-diag vb-diag--error" role="note">…'
 */
export function diagnosticHtml(d: Diagnostic): string {
  const note = d.note ? `<span class="vb-diag-note">${escapeHtml(d.note)}</span>` : '';
  const detail = d.actual && d.expected ? `<span class="vb-diag-note">got ${escapeHtml(d.actual)}, expected ${escapeHtml(d.expected)}</span>` : '';
  return `<div class="vb-diag vb-diag--${d.severity}" role="note"><span class="vb-diag-mark" aria-hidden="true">${SEVERITY_MARK[d.severity]}</span>`
    + `<span class="vb-diag-word">${SEVERITY_WORD[d.severity]}</span> <span class="vb-diag-at">line ${d.line}:${d.column}</span> `
    + `<span class="vb-diag-msg">${escapeHtml(d.message)}</span> <span class="vb-rule">[${escapeHtml(d.ruleId)}]</span>${note}${detail}</div>`;
}

/**
 * A cell that was not computed because another failed, or (with a note) for the reason the note
 * gives: a field that is not available, a name defined twice.
 */
export function blockedHtml(by: string, doc: CompiledDocument, note?: string): string {
  if (note) return `<div class="vb-blocked" role="note"><span aria-hidden="true">⊘</span> ${escapeHtml(note)}</div>`;
  const source = doc.graph.byId.get(by);
  const where = source ? ` (line ${source.span.start.line})` : '';
  return `<div class="vb-blocked" role="note"><span aria-hidden="true">⊘</span> not computed: it needs <a href="#${anchorId(by)}"><code>${escapeHtml(by)}</code></a>${where}, which failed.</div>`;
}

/** Every diagnostic of a settled document, once each, in line order (as `summarise` lists them). */
export function collectDiagnostics(doc: CompiledDocument, states: Map<string, CellState>, warnings: Map<string, Diagnostic> = new Map()): Diagnostic[] {
  const out: Diagnostic[] = [...doc.diagnostics];
  const seen = new Set(out);
  const add = (d: Diagnostic) => {
    if (!seen.has(d)) { out.push(d); seen.add(d); }
  };
  for (const cell of doc.graph.cells) {
    const s = states.get(cell.id);
    if (s?.status === 'error') add(s.diagnostic);
    const w = warnings.get(cell.id);
    if (w) add(w);
  }
  for (const [id, s] of states) if (s.status === 'error' && !doc.graph.byId.has(id)) add(s.diagnostic);
  return out.sort((a, b) => a.line - b.line || a.column - b.column);
}

/** A link to the diagnostic's cell, or the bare position when it belongs to no cell. */
function placeOf(d: Diagnostic): string {
  const at = `line ${d.line}:${d.column}`;
  return d.cellId ? `<a href="#${anchorId(d.cellId)}">${at}</a>` : at;
}

/**
 * The inner HTML of the element `data-part="diagnostics"`: every problem, linked to its place.
 * @example renderDiagnosticList(doc, states) // '' when there is nothing to say
 */
export function renderDiagnostics(doc: CompiledDocument, states: Map<string, CellState>, warnings?: Map<string, Diagnostic>): string {
  const list = collectDiagnostics(doc, states, warnings);
  if (list.length === 0) return '';
  const items = list.map((d) => `<li class="vb-diag-item vb-diag-item--${d.severity}"><span class="vb-diag-mark" aria-hidden="true">${SEVERITY_MARK[d.severity]}</span>`
    + `<span class="vb-diag-word">${SEVERITY_WORD[d.severity]}</span> ${placeOf(d)} `
    + `${escapeHtml(d.message)} <span class="vb-rule">[${escapeHtml(d.ruleId)}]</span></li>`).join('');
  return `<h2 class="vb-h">Diagnostics</h2><ul class="vb-diag-list">${items}</ul>`;
}

/**
 * The inner HTML of `data-part="status"`: a banner when the sheet has errors or overridden inputs.
 * @example renderStatus(doc, states) // '<div class="vb-banner vb-banner--error">…' or ''
 */
export function renderStatus(doc: CompiledDocument, states: Map<string, CellState>, warnings?: Map<string, Diagnostic>): string {
  const list = collectDiagnostics(doc, states, warnings);
  const errors = list.filter((d) => d.severity === 'error').length;
  const blocked = [...states.values()].filter((s) => s.status === 'blocked').length;
  const parts: string[] = [];
  if (errors > 0) {
    parts.push(`<div class="vb-banner vb-banner--error" role="alert"><strong>✗ THIS SHEET HAS ${errors} ERROR${errors === 1 ? '' : 'S'}.</strong> `
      + `Results are incomplete${blocked ? ` (${blocked} value${blocked === 1 ? '' : 's'} not computed)` : ''}; do not issue or rely on it until the errors listed below are resolved.</div>`);
  }
  const overridden = doc.graph.cells.filter((c) => c.overridden);
  if (overridden.length > 0) {
    const items = overridden.map((c) => `<li><code>${escapeHtml(c.name ?? c.id)}</code> = <code>${escapeHtml(c.source)}</code> (document: <code>${escapeHtml(c.originalSource ?? '')}</code>)</li>`).join('');
    parts.push(`<div class="vb-banner vb-banner--set" role="note"><strong>‡ Inputs changed for this print</strong> — these values differ from the source document:<ul>${items}</ul></div>`);
  }
  return parts.join('');
}
