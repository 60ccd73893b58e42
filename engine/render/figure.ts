/**
 * Figures: the SVG a figure function made is embedded as markup; any other
 * value of a figure cell is shown as text.
 */
import type { Cell, CellState } from '../types.js';
import { figureIn, isFigure } from '../../cells/figures/registry.js';
import { anchorId, descriptionHtml, escapeHtml } from './escape.js';
import { stateOf, type RenderContext } from './context.js';
import { blockedHtml, diagnosticHtml } from './diagnostics.js';
import { typeset } from './katex.js';
import { exprTex } from './tex.js';
import { figureUnitsFor } from './figure-units.js';

/**
 * The inner HTML of a figure's output region.
 * @example renderFigureOutput(cell, {status: 'ok', value: section(r, a)}, ctx)
 */
export function renderFigureOutput(cell: Cell, state: CellState, ctx: RenderContext): string {
  switch (state.status) {
    case 'ok':
      // In the document's units and significant figures: a calc in ft, kip and psf gets its figures' quantities in those.
      if (isFigure(state.value)) return `<div class="vb-svg">${figureIn(state.value, figureUnitsFor(ctx.sigfigs, ctx.units))}</div>`;
      return `<div class="vb-diag vb-diag--error" role="note"><span class="vb-diag-word">NOT A FIGURE</span> this value was not drawn by a figure function, so it is shown as text:</div>`
        + `<pre class="vb-text">${escapeHtml(String(state.value))}</pre>`;
    case 'error': return diagnosticHtml(state.diagnostic);
    case 'blocked': return blockedHtml(state.by, ctx.doc, state.note);
    default: return '<div class="vb-blocked">…</div>';
  }
}

/** One ```figure line: the drawing, captioned with its description and the call. */
export function renderFigure(cell: Cell, ctx: RenderContext, number: number): string {
  const call = typeset(exprTex(cell.node, ctx.scope, false));
  const caption = `<figcaption><span class="vb-fignum">Figure ${number}.</span> ${descriptionHtml(cell.description)} <span class="vb-figcall">${call}</span></figcaption>`;
  return `<figure class="vb-figure" id="${anchorId(cell.id)}"><div class="vb-ref"><a href="#${anchorId(cell.id)}">${cell.span.start.line}</a></div>`
    + `<div class="vb-figbody"><div class="vb-cellout" data-cell="${escapeHtml(cell.id)}">${renderFigureOutput(cell, stateOf(ctx, cell.id), ctx)}</div>${caption}</div></figure>`;
}
