/**
 * Checks: the inequality typeset, with both sides' values and the
 * utilization; a verdict that reads the same in colour and in greyscale
 * (a mark and a word, never colour alone); and the summary at the top.
 */
import type { Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import { evaluateNode } from '../sandbox/index.js';
import type { Cell, CellState, CheckResult, CompiledDocument } from '../types.js';
import { formatUtilization, separatingSigfigs, splitQuantity } from '../values/format.js';
import { anchorId, descriptionHtml, escapeHtml } from './escape.js';
import { typeset } from './katex.js';
import { exprTex, readsNames } from './tex.js';
import { symbolTex } from './names.js';
import { readableUnit, valueTex } from './quantity.js';
import { makeRenderContext, stateOf, type RenderContext } from './context.js';
import { blockedHtml, diagnosticHtml } from './diagnostics.js';
import { recordsHtml } from './kernel.js';
import { workingHtml } from './working.js';
import type { MathNode } from 'mathjs';
import { caseVerdict, checkCasesNote, notJudgedHere, withoutLimitMarker } from './cases.js';

/**
 * How a check came out, in the three states used everywhere (holds, fails, not evaluated);
 * 'near' is a check that holds with less than 5 % to spare: its verdict word is HOLDS like any other that
 * holds (a check is holds, fails or not evaluated, nothing else); the closeness is a note beside it.
 */
export type Verdict = 'pass' | 'near' | 'fail' | 'none';

/** Utilization above which a passing check is flagged as close to its limit. */
export const NEAR_LIMIT = 0.95;

const WORDS: Record<Verdict, { mark: string; word: string }> = {
  pass: { mark: '✓', word: 'HOLDS' },
  near: { mark: '◆', word: 'HOLDS' },
  fail: { mark: '✗', word: 'FAILS' },
  none: { mark: '?', word: 'NOT EVALUATED' },
};

/**
 * The verdict of a check state.
 * @example verdictOf({status: 'ok', value: {isCheck: true, pass: true, utilization: 0.97, …}}) // 'near'
 */
export function verdictOf(state: CellState): Verdict {
  if (state.status !== 'ok') return 'none';
  const r = state.value as CheckResult;
  if (!r.pass) return 'fail';
  return r.utilization !== null && r.utilization > NEAR_LIMIT ? 'near' : 'pass';
}

function utilizationBar(u: number | null): string {
  if (u === null) return '';
  const width = Math.max(0, Math.min(1, u)) * 100;
  return `<span class="vb-bar" aria-hidden="true"><span class="vb-bar-fill" style="width:${width.toFixed(1)}%"></span></span>`;
}

/** The utilization text, agreeing with the verdict at the limit. */
function utilizationOf(verdict: Verdict, u: number): string {
  return formatUtilization(u, verdict === 'fail' ? false : verdict === 'none' ? null : true);
}

/** Beside HOLDS when a check holds with less than 5 % to spare: a note, not a verdict of its own. */
const NEAR_NOTE = `<span class="vb-near-note">within ${Math.round((1 - NEAR_LIMIT) * 100)} % of the limit</span>`;

/** The verdict badge: mark, word, utilization and, close to the limit, a note saying so. */
export function verdictHtml(verdict: Verdict, utilization: number | null): string {
  const { mark, word } = WORDS[verdict];
  const u = utilization === null ? '' : `<span class="vb-util">u = ${utilizationOf(verdict, utilization)}</span>${utilizationBar(utilization)}`;
  return `<div class="vb-verdict vb-verdict--${verdict}"><span class="vb-mark" aria-hidden="true">${mark}</span><span class="vb-word">${word}</span>${u}${verdict === 'near' ? NEAR_NOTE : ''}</div>`;
}

/** A check limited to other cases than the one shown: not judged here, and not "not evaluated". */
const NOT_JUDGED = { mark: '–', word: 'not judged in this case' };

/** Is this check limited to cases other than the one the sheet shows? */
function offCase(cell: Cell, ctx: RenderContext): boolean {
  return Boolean(ctx.cases?.shown) && notJudgedHere(cell, ctx) !== null;
}

/** Do two compared values differ (so that their printed texts must differ too)? */
function differ(a: unknown, b: unknown): boolean {
  try {
    return !math.equal(a as never, b as never);
  } catch {
    return false;
  }
}

/** Both sides in one unit, so that they can be compared by eye; with enough figures to tell them apart when they differ. */
function sidesTex(r: CheckResult, ctx: RenderContext): [string, string] | null {
  let unit: string | null = null;
  if (math.isUnit(r.demand) && math.isUnit(r.capacity)) {
    const d = splitQuantity(r.demand as Unit, readableUnit(r.demand as Unit, ctx.units));
    try { (r.capacity as Unit).toNumber(d.unit); unit = d.unit; } catch { unit = null; }
  }
  const show = (sf: number): [string, string] => [valueTex(r.demand, { sigfigs: sf, unit, units: ctx.units }) ?? '', valueTex(r.capacity, { sigfigs: sf, unit, units: ctx.units }) ?? ''];
  const sigfigs = separatingSigfigs(show, ctx.sigfigs, differ(r.demand, r.capacity));
  const a = valueTex(r.demand, { sigfigs, unit, units: ctx.units });
  const b = valueTex(r.capacity, { sigfigs, unit, units: ctx.units });
  return a !== null && b !== null ? [a, b] : null;
}

const COMPARISONS = new Set(['smaller', 'smallerEq', 'larger', 'largerEq', 'equal', 'unequal']);

/** A comparison side the substituted row prints as one value (a name, a field, a number or a quantity written out), with its display unit. */
function shownSide(node: MathNode, ctx: RenderContext): { value: unknown; unit: string | null } | undefined {
  let n = node as MathNode & { content?: MathNode; name?: string; value?: unknown; object?: MathNode; index?: { dotNotation?: boolean; dimensions: MathNode[] } };
  while (n.type === 'ParenthesisNode' && n.content) n = n.content as typeof n;
  const path: string[] = [];
  let p: typeof n | undefined = n;
  while (p && p.type === 'AccessorNode' && p.index?.dotNotation && p.index.dimensions.length === 1) {
    const key = p.index.dimensions[0] as MathNode & { value?: unknown };
    if (typeof key.value !== 'string') return undefined;
    path.unshift(key.value);
    p = p.object as typeof n;
  }
  if (p?.type === 'SymbolNode' && ctx.scope.isDefined(p.name!)) return ctx.scope.resolve?.([p.name!, ...path]);
  if (path.length || readsNames(n, ctx.scope) || n.filter((x) => x.type === 'FunctionNode').length) return undefined;
  // A constant side (1, 20 kN): no name in it, so it evaluates to what is written.
  try {
    return { value: evaluateNode(n), unit: null };
  } catch {
    return undefined;
  }
}

/**
 * The significant figures for the substituted row of a check: more than the sheet's when the two
 * sides of one of its comparisons differ but would print alike (p = 1.0004 in `p <= 1`).
 */
function substitutedSigfigs(node: MathNode, ctx: RenderContext): number {
  let sigfigs = ctx.sigfigs;
  node.traverse((child) => {
    const c = child as MathNode & { fn?: string; args?: MathNode[] };
    if (c.type !== 'OperatorNode' || !COMPARISONS.has(c.fn as string) || c.args?.length !== 2) return;
    const a = shownSide(c.args[0]!, ctx);
    const b = shownSide(c.args[1]!, ctx);
    if (!a || !b) return;
    const show = (sf: number): [string, string] => [valueTex(a.value, { sigfigs: sf, unit: a.unit, units: ctx.units }) ?? '', valueTex(b.value, { sigfigs: sf, unit: b.unit, units: ctx.units }) ?? ''];
    sigfigs = Math.max(sigfigs, separatingSigfigs(show, ctx.sigfigs, differ(a.value, b.value)));
  });
  return sigfigs;
}

const OP_TEX: Record<string, string> = { '<=': '\\le', '>=': '\\ge', '<': '<', '>': '>' };

function workingRows(cell: Cell, r: CheckResult | null, ctx: RenderContext, records: MathNode[]): string[] {
  const rows: string[] = [];
  const formula = exprTex(cell.node, ctx.scope, false, records);
  rows.push(formula);
  if (r && readsNames(cell.node, ctx.scope)) {
    const sigfigs = substitutedSigfigs(cell.node, ctx);
    const filled = exprTex(cell.node, sigfigs === ctx.sigfigs ? ctx.scope : { ...ctx.scope, sigfigs }, true, records);
    if (filled !== formula) rows.push(filled);
  }
  if (r && r.op) {
    const sides = sidesTex(r, ctx);
    if (sides) {
      const compared = `${sides[0]} ${OP_TEX[r.op]} ${sides[1]}`;
      if (compared !== rows[rows.length - 1]) rows.push(compared);
      if (r.utilization !== null) {
        const [num, den] = r.op === '>=' || r.op === '>' ? [sides[1], sides[0]] : sides;
        rows.push(`\\text{utilization} = \\frac{${num}}{${den}} = ${formatUtilization(r.utilization, r.pass)}`);
      }
    }
  }
  return rows;
}

/**
 * The inner HTML of a check's output region: the working and the verdict.
 * @example renderCheckOutput(cell, state, ctx)
 */
export function renderCheckOutput(cell: Cell, state: CellState, ctx: RenderContext): string {
  // A check limited to other cases: its formula and its verdict over those cases (engine/render/cases.ts).
  const elsewhere = notJudgedHere(cell, ctx);
  if (elsewhere) {
    const out = offCase(cell, ctx)
      ? `<div class="vb-verdict vb-verdict--off"><span class="vb-mark" aria-hidden="true">${NOT_JUDGED.mark}</span><span class="vb-word">${NOT_JUDGED.word}</span></div>`
      : verdictHtml(elsewhere.verdict, elsewhere.utilization);
    return `<div class="vb-work"><div class="vb-math">${typeset(exprTex(cell.node, ctx.scope, false), true)}</div></div>`
      + `<div class="vb-out">${out}</div>`;
  }
  const r = state.status === 'ok' ? (state.value as CheckResult) : null;
  const trouble = state.status === 'error' ? diagnosticHtml(state.diagnostic) : state.status === 'blocked' ? blockedHtml(state.by, ctx.doc, state.note) : '';
  const verdict = verdictOf(state);
  const records: MathNode[] = [];
  const rows = workingRows(cell, r, ctx, records).map((tex) => ({ tex }));
  return `<div class="vb-work"><div class="vb-math">${workingHtml(rows)}</div>${recordsHtml(records, ctx)}${trouble}</div>`
    + `<div class="vb-out">${verdictHtml(verdict, r?.utilization ?? null)}</div>`;
}

/** One ```check line as a step of the calculation. */
export function renderCheck(cell: Cell, ctx: RenderContext): string {
  const name = cell.name ? `${typeset(symbolTex(cell.name))} ` : '';
  const head = cell.description || cell.name ? `<p class="vb-desc">${name}${descriptionHtml(withoutLimitMarker(cell.description))}</p>` : '';
  return `<div class="vb-step vb-step--check" id="${anchorId(cell.id)}"><div class="vb-ref"><a href="#${anchorId(cell.id)}">${cell.span.start.line}</a></div>`
    + `<div class="vb-body">${head}${checkCasesNote(cell, ctx)}<div class="vb-cellout" data-cell="${escapeHtml(cell.id)}">${renderCheckOutput(cell, stateOf(ctx, cell.id), ctx)}</div></div></div>`;
}

/**
 * The inner HTML of the element `data-part="check-summary"`: every check with its
 * utilization and verdict, linked to its line, under a one-line tally.
 * @example renderCheckSummary(doc, states)
 */
export function renderCheckSummary(doc: CompiledDocument, states: Map<string, CellState>, ctx: RenderContext = makeRenderContext(doc, states)): string {
  const checks = doc.graph.cells.filter((c) => c.kind === 'check');
  if (checks.length === 0) return '<h2 class="vb-h">Checks</h2><p class="vb-note">This document has no checks.</p>';
  const tally: Record<Verdict, number> = { pass: 0, near: 0, fail: 0, none: 0 };
  let off = 0;
  const rows = checks.map((cell, i) => {
    const state = stateOf(ctx, cell.id);
    if (offCase(cell, ctx)) {
      off++;
      const what = cell.description ? descriptionHtml(withoutLimitMarker(cell.description)) : typeset(exprTex(cell.node, ctx.scope, false));
      return `<tr class="vb-sum vb-sum--off"><td class="vb-ref">${i + 1}</td><td>${what}</td><td class="vb-num">—</td><td class="vb-barcell"></td>`
        + `<td class="vb-sum-verdict"><span class="vb-mark" aria-hidden="true">${NOT_JUDGED.mark}</span> ${NOT_JUDGED.word}</td>`
        + `<td class="vb-ref"><a href="#${anchorId(cell.id)}">line ${cell.span.start.line}</a></td></tr>`;
    }
    const byCase = caseVerdict(cell, ctx);
    const verdict = byCase ? byCase.verdict : verdictOf(state);
    tally[verdict]++;
    const u = byCase ? byCase.utilization : state.status === 'ok' ? (state.value as CheckResult).utilization : null;
    const governs = byCase && !byCase.neutral ? `<br><span class="vb-note">${escapeHtml(byCase.note)}</span>` : '';
    const what = (cell.description ? descriptionHtml(withoutLimitMarker(cell.description)) : typeset(exprTex(cell.node, ctx.scope, false))) + governs;
    return `<tr class="vb-sum vb-sum--${verdict}"><td class="vb-ref">${i + 1}</td><td>${what}</td>`
      + `<td class="vb-num">${u === null ? '—' : utilizationOf(verdict, u)}</td><td class="vb-barcell">${utilizationBar(u)}</td>`
      + `<td class="vb-sum-verdict"><span class="vb-mark" aria-hidden="true">${WORDS[verdict].mark}</span> ${WORDS[verdict].word}${verdict === 'near' ? ` ${NEAR_NOTE}` : ''}</td>`
      + `<td class="vb-ref"><a href="#${anchorId(cell.id)}">line ${cell.span.start.line}</a></td></tr>`;
  }).join('');
  const bad = tally.fail + tally.none;
  // Checks limited to other cases are counted apart: they are not judged here, which is not "not evaluated".
  const judged = checks.length - off;
  const offNote = off ? `; ${off} not judged in this case` : '';
  const overall = bad === 0
    ? `<p class="vb-overall vb-overall--pass"><span class="vb-mark">✓</span> All ${judged} checks ${off ? 'judged in this case ' : ''}hold${tally.near ? `; ${tally.near} within 5 % of the limit` : ''}${offNote}.</p>`
    : `<p class="vb-overall vb-overall--fail"><span class="vb-mark">${tally.fail ? '✗' : '?'}</span> ${[
      tally.fail ? `${tally.fail} of ${judged} checks FAIL` : '',
      tally.none ? `${tally.none} of ${judged} not evaluated` : '',
    ].filter(Boolean).join('; ')}${offNote}.</p>`;
  return `<h2 class="vb-h">Checks</h2>${overall}<table class="vb-summary"><thead><tr><th class="vb-ref">#</th><th>check</th><th class="vb-num">utilization</th><th></th><th>verdict</th><th class="vb-ref">where</th></tr></thead><tbody>${rows}</tbody></table>`;
}
