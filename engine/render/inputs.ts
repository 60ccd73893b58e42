/**
 * The inputs of a calc: a table of symbol, value with unit, description and
 * allowed range, with a mark where a value was changed for this print.
 */
import type { Cell, CellState } from '../types.js';
import { anchorId, descriptionHtml, escapeHtml } from './escape.js';
import { typeset } from './katex.js';
import { symbolTex } from './names.js';
import { valueHtml } from './quantity.js';
import { stateOf, type RenderContext } from './context.js';
import { blockedHtml, diagnosticHtml } from './diagnostics.js';
import { evaluateNode } from '../sandbox/index.js';

/** A range bound shown with its unit, or as written when it cannot be evaluated. */
function boundHtml(node: Cell['node'], text: string, sigfigs: number): string {
  try {
    return valueHtml(evaluateNode(node), { sigfigs });
  } catch {
    return escapeHtml(text);
  }
}

/**
 * The inner HTML of a given input's value cell: the value in an element `data-input`,
 * the override mark, and a flag when it is outside its range or failed.
 * @example renderInputOutput(cell, {status: 'ok', value: math.unit(6.4, 'm')}, ctx)
 */
export function renderInputOutput(cell: Cell, state: CellState, ctx: RenderContext): string {
  const name = cell.name ?? cell.id;
  const input = (inner: string) => `<span class="vb-value" data-input="${escapeHtml(name)}" data-source="${escapeHtml(cell.source)}">${inner}</span>`;
  let out: string;
  switch (state.status) {
    // An input is shown with every digit it was written with (1.0004 stays 1.0004 on a sheet of 3 significant figures).
    case 'ok': out = input(valueHtml(state.value, { sigfigs: ctx.sigfigs, unit: cell.displayUnit, written: true })); break;
    case 'error': out = input('<span class="vb-none">—</span>') + diagnosticHtml(state.diagnostic); break;
    case 'blocked': out = input('<span class="vb-none">—</span>') + blockedHtml(state.by, ctx.doc, state.note); break;
    default: out = input('<span class="vb-none">…</span>');
  }
  if (cell.overridden) {
    out += `<span class="vb-set" title="changed for this print">‡ set</span>`
      + `<span class="vb-was">document: <code>${escapeHtml(cell.originalSource ?? '')}</code></span>`;
  }
  const warning = ctx.warnings.get(cell.id);
  if (warning) out += `<span class="vb-flag">! outside the allowed range</span>`;
  return out;
}

/**
 * A ```given block as a table.
 * @param cells the block's cells, in order
 */
export function renderInputs(cells: Cell[], ctx: RenderContext): string {
  const rows = cells.map((cell) => {
    const range = cell.range
      ? `${boundHtml(cell.range.loNode, cell.range.lo, ctx.sigfigs)} … ${boundHtml(cell.range.hiNode, cell.range.hi, ctx.sigfigs)}`
      : '';
    const symbol = cell.name ? typeset(symbolTex(cell.name)) : escapeHtml(cell.id);
    return `<tr class="vb-input${cell.overridden ? ' vb-input--set' : ''}" id="${anchorId(cell.id)}">`
      + `<td class="vb-ref">${cell.span.start.line}</td><td class="vb-sym">${symbol}</td>`
      + `<td class="vb-q" data-cell="${escapeHtml(cell.id)}">${renderInputOutput(cell, stateOf(ctx, cell.id), ctx)}</td>`
      + `<td class="vb-desc">${descriptionHtml(cell.description)}</td><td class="vb-range">${range}</td></tr>`;
  }).join('');
  return `<table class="vb-inputs"><thead><tr><th class="vb-ref" title="source line">line</th><th>symbol</th><th>value</th><th>description</th><th>allowed range</th></tr></thead><tbody>${rows}</tbody></table>`;
}

