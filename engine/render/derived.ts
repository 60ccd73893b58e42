/**
 * A derived value (```calc): the formula typeset from its parse tree, the
 * same formula with the values substituted, and the result in its display
 * unit in the output column.
 */
import type { Cell, CellState } from '../types.js';
import { anchorId, descriptionHtml, escapeHtml } from './escape.js';
import { typeset } from './katex.js';
import { exprTex, readsNames } from './tex.js';
import { symbolTex } from './names.js';
import { valueHtml, valueTex } from './quantity.js';
import { stateOf, type RenderContext } from './context.js';
import { blockedHtml, diagnosticHtml } from './diagnostics.js';
import { kernelCallOf, recordsHtml, renderKernelCall } from './kernel.js';
import { workingHtml, type WorkingRow } from './working.js';
import type { MathNode } from 'mathjs';
import { math } from '../../cells/math.js';

/** Is the expression just a name or a chain of fields, possibly converted with `to`? */
function isBareReference(node: MathNode): boolean {
  const n = node as MathNode & { fn?: string; args?: MathNode[]; object?: MathNode; index?: { dotNotation?: boolean } };
  if (n.type === 'OperatorNode' && n.fn === 'to' && n.args) return isBareReference(n.args[0]!);
  if (n.type === 'ParenthesisNode') return isBareReference((n as unknown as { content: MathNode }).content);
  if (n.type === 'SymbolNode') return true;
  return n.type === 'AccessorNode' && !!n.index?.dotNotation && isBareReference(n.object!);
}

function isRecord(v: unknown): boolean {
  return typeof v === 'object' && v !== null && !Array.isArray(v) && !math.isUnit(v) && !math.isMatrix(v);
}

/**
 * Rows of the working: `name = formula`, then `= substituted` when it adds something.
 * Record literals become numbered `{…}` in the formula; `records` collects them for the list below.
 */
function workingRows(cell: Cell, ctx: RenderContext, substitute: boolean, records: MathNode[]): WorkingRow[] {
  const formula = exprTex(cell.node, ctx.scope, false, records);
  const rows: WorkingRow[] = [cell.name ? { lhs: symbolTex(cell.name), tex: `= ${formula}` } : { tex: formula }];
  // A bare name or field (`H = a.H_min to kN`) says nothing new when substituted: the output column shows it.
  if (substitute && readsNames(cell.node, ctx.scope) && !isBareReference(cell.node)) {
    const filled = exprTex(cell.node, ctx.scope, true, records);
    if (filled !== formula) rows.push({ tex: `= ${filled}` });
  }
  return rows;
}

function resultHtml(cell: Cell, value: unknown, ctx: RenderContext): string {
  // A record written in the document is listed item by item in the working; here it is only named.
  if (isRecord(value)) {
    const keys = Object.keys(value as Record<string, unknown>);
    return `<div class="vb-result vb-note">record of ${keys.length} item${keys.length === 1 ? '' : 's'}: ${escapeHtml(keys.join(', '))}</div>`;
  }
  // Text of several words is set as prose so it wraps in the output column (KaTeX never breaks a line inside \text).
  if (typeof value === 'string' && /\s/.test(value.trim()) && !value.startsWith('<svg') && cell.name) {
    return `<div class="vb-result">${typeset(`${symbolTex(cell.name)} =`)} ${valueHtml(value, { sigfigs: ctx.sigfigs, units: ctx.units })}</div>`;
  }
  const tex = valueTex(value, { sigfigs: ctx.sigfigs, unit: cell.displayUnit, units: ctx.units });
  if (tex !== null && cell.name) return `<div class="vb-result">${typeset(`${symbolTex(cell.name)} = ${tex}`)}</div>`;
  return `<div class="vb-result">${valueHtml(value, { sigfigs: ctx.sigfigs, unit: cell.displayUnit, units: ctx.units })}</div>`;
}

/** Status-dependent notes under the working. */
function troubleHtml(state: CellState, ctx: RenderContext): string {
  if (state.status === 'error') return diagnosticHtml(state.diagnostic);
  if (state.status === 'blocked') return blockedHtml(state.by, ctx.doc, state.note);
  if (state.status === 'pending') return '<div class="vb-blocked">…</div>';
  return '';
}

/**
 * The inner HTML of a calc cell's output region: working and output column.
 * @example renderCalcOutput(cell, {status: 'ok', value}, ctx)
 */
export function renderCalcOutput(cell: Cell, state: CellState, ctx: RenderContext): string {
  const ok = state.status === 'ok';
  const fn = kernelCallOf(cell);
  // A kernel call that returns a record gets the table; one that returns a quantity reads like a formula.
  if (fn && !(ok && !isRecord(state.value))) {
    const { work, out } = renderKernelCall(cell, fn, ok ? state.value : null, ctx);
    return `<div class="vb-work vb-work--kernel">${work}${troubleHtml(state, ctx)}</div><div class="vb-out">${out}</div>`;
  }
  const records: MathNode[] = [];
  const work = `<div class="vb-math">${workingHtml(workingRows(cell, ctx, ok, records))}</div>${recordsHtml(records, ctx)}`;
  const out = ok ? resultHtml(cell, state.value, ctx) : '<div class="vb-result vb-none">—</div>';
  return `<div class="vb-work">${work}${troubleHtml(state, ctx)}</div><div class="vb-out">${out}</div>`;
}

/** One ```calc cell as a step of the calculation. */
export function renderCalc(cell: Cell, ctx: RenderContext): string {
  return `<div class="vb-step" id="${anchorId(cell.id)}"><div class="vb-ref"><a href="#${anchorId(cell.id)}">${cell.span.start.line}</a></div>`
    + `<div class="vb-body">${cell.description ? `<p class="vb-desc">${descriptionHtml(cell.description)}</p>` : ''}`
    + `<div class="vb-cellout" data-cell="${escapeHtml(cell.id)}">${renderCalcOutput(cell, stateOf(ctx, cell.id), ctx)}</div></div></div>`;
}
