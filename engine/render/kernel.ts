/**
 * A call of a kernel function (`a = arch_limit(r)`) is not typeset as a
 * formula: the sheet shows the arguments and a compact table of the returned
 * fields that the rest of the document reads.
 */
import type { MathNode } from 'mathjs';
import type { Cell } from '../types.js';
import { cellFunctions } from '../library.js';
import { anchorId, escapeHtml } from './escape.js';
import { typeset } from './katex.js';
import { exprTex } from './tex.js';
import { fieldTex, symbolTex } from './names.js';
import { valueHtml } from './quantity.js';
import type { RenderContext } from './context.js';

type AnyNode = MathNode & { fn?: AnyNode; name?: string; args?: AnyNode[]; properties?: Record<string, AnyNode>; type: string };

/** The kernel function a cell calls at its top level, if any. */
export function kernelCallOf(cell: Cell): string | null {
  const n = cell.node as AnyNode;
  if (n.type !== 'FunctionNode' || n.fn?.type !== 'SymbolNode') return null;
  return cellFunctions.has(n.fn.name!) ? n.fn.name! : null;
}

/** One argument: as written, then its value when that says more. */
function argumentTex(node: MathNode, ctx: RenderContext, records?: MathNode[]): string {
  const written = exprTex(node, ctx.scope, false, records);
  const shown = exprTex(node, ctx.scope, true, records);
  return written === shown ? written : `${written} = ${shown}`;
}

function recordItems(node: AnyNode, ctx: RenderContext): string[] {
  return Object.entries(node.properties ?? {}).map(([key, value]) => `<li><span class="vb-key">${escapeHtml(key)}</span> ${typeset(argumentTex(value, ctx))}</li>`);
}

/**
 * The items of record literals, one list per record, numbered as the formula numbers them.
 * @param records ObjectNodes collected by exprTex
 */
export function recordsHtml(records: MathNode[], ctx: RenderContext): string {
  return records.map((r, i) => `<ul class="vb-args"><li class="vb-recno">{…}<sub>${i + 1}</sub></li>${recordItems(r as AnyNode, ctx).join('')}</ul>`).join('');
}

/** The arguments of the call, options records spread out one per item. */
function argumentsHtml(cell: Cell, ctx: RenderContext): string {
  const items: string[] = [];
  const nested: MathNode[] = [];
  for (const arg of (cell.node as AnyNode).args ?? []) {
    if (arg.type === 'ObjectNode') items.push(...recordItems(arg, ctx));
    else items.push(`<li>${typeset(argumentTex(arg, ctx, nested))}</li>`);
  }
  return (items.length ? `<ul class="vb-args">${items.join('')}</ul>` : '') + recordsHtml(nested, ctx);
}

/** Where a kernel result goes when no field of it is read: the cells it is passed to. */
function passedToHtml(cell: Cell, ctx: RenderContext): string {
  const users = ctx.usersOf.get(cell.id) ?? [];
  if (users.length === 0) return '<p class="vb-note">Not used further in this document.</p>';
  const links = users.map((u) => `<a href="#${anchorId(u.id)}">${escapeHtml(u.name ?? u.kind)} (line ${u.span.start.line})</a>`);
  return `<p class="vb-note">Passed whole to ${links.join(', ')}.</p>`;
}

/**
 * The working of a kernel call: the function, its arguments, and the fields used later.
 * @param value the returned record (null when the call failed)
 */
export function renderKernelCall(cell: Cell, fn: string, value: unknown, ctx: RenderContext): { work: string; out: string } {
  // The function's description is printed at its first call only.
  const doc = ctx.firstCall.get(fn) === cell.id ? cellFunctions.get(fn)?.doc ?? '' : '';
  const head = `<p class="vb-call"><code>${escapeHtml(fn)}</code> <span class="vb-call-doc">${escapeHtml(doc)}</span></p>`;
  const work = head + argumentsHtml(cell, ctx);
  if (value === null) return { work, out: '' };
  const fields = ctx.fieldUses.get(cell.id) ?? [];
  const record = typeof value === 'object' && value !== null && !Array.isArray(value) ? value as Record<string, unknown> : null;
  const notes = record && Array.isArray(record.notes) && record.notes.every((n) => typeof n === 'string') && record.notes.length
    ? `<ul class="vb-kernel-notes">${(record.notes as string[]).map((n) => `<li>${escapeHtml(n)}</li>`).join('')}</ul>` : '';
  if (fields.length === 0 || !record) return { work: work + notes, out: passedToHtml(cell, ctx) };
  const name = cell.name ?? cell.id;
  const rows = fields.map((f) => {
    const has = Object.prototype.hasOwnProperty.call(record, f);
    const shown = has ? valueHtml(record[f], { sigfigs: ctx.sigfigs, engineering: true, units: ctx.units }) : '<span class="vb-none">not returned</span>';
    return `<tr><td class="vb-sym">${typeset(`${symbolTex(name)}{.}${fieldTex(f)}`)}</td><td class="vb-num">${shown}</td></tr>`;
  }).join('');
  return { work: work + notes, out: `<table class="vb-fields"><caption>results used</caption><tbody>${rows}</tbody></table>` };
}
