/**
 * Review: what changed against the values the author signed.
 *
 * The document's own values (evaluated with no overrides) are the baseline.
 * Each result is compared with its baseline value; a check whose verdict
 * differs from the document's is a flip and is shown loudly.
 * Pure functions returning data or HTML strings; main.ts puts them on the page.
 */
import type { Unit } from 'mathjs';
import { formatNumber, formatUtilization, formatValue, toJsonValue } from '../engine/index.js';
import { sigfigsFor } from '../engine/values/format.js';
import type { Cell, CellState, CheckResult, CompiledDocument, UnitSystem } from '../engine/index.js';

/** A given input whose value differs from the document's. */
export interface InputChange {
  name: string;
  /** The document's value text. */
  from: string;
  /** The value text in use now. */
  to: string;
  line: number;
}

export type ResultChange =
  | { kind: 'quantity'; id: string; before: string; after: string; delta: string; percent: string | null; sign: -1 | 0 | 1 }
  | { kind: 'check'; id: string; before: boolean | null; after: boolean | null; flipped: boolean; utilBefore: number | null; utilAfter: number | null }
  | { kind: 'record'; id: string; fields: FieldChange[] }
  | { kind: 'text'; id: string; before: string; after: string }
  | { kind: 'state'; id: string; before: string; after: string };

/** One field of a record result (a kernel call's answer) that moved. */
export interface FieldChange {
  name: string;
  before: string;
  after: string;
  /** The signed difference with its unit, or null when the field is not a quantity (a list, a text). */
  delta: string | null;
  percent: string | null;
}

function isCheck(v: unknown): v is CheckResult {
  return typeof v === 'object' && v !== null && (v as CheckResult).isCheck === true;
}

function stateWord(s: CellState | undefined): string {
  if (!s) return 'not computed';
  if (s.status === 'ok') return 'a value';
  if (s.status === 'error') return 'an error';
  if (s.status === 'blocked') return `blocked by ${s.by}`;
  return 'pending';
}

/** Relative size below which two values count as equal (round-off from unit conversion). */
const SAME = 1e-12;

function signedText(x: number, text: string): string {
  return x > 0 ? `+${text}` : text;
}

function percentText(diff: number, before: number): string | null {
  if (before === 0) return null;
  const p = (diff / Math.abs(before)) * 100;
  return `${signedText(p, formatNumber(p, 3))} %`;
}

/** The difference of two plain numbers or same-dimension quantities, or null when they cannot be compared. */
function quantityChange(id: string, displayUnit: Cell['displayUnit'] | undefined, before: unknown, after: unknown, sigfigs: number, units: UnitSystem, written = false): Extract<ResultChange, { kind: 'quantity' }> | null | undefined {
  // A given input before and after reads with the digits it was written with, as the sheet shows it.
  const shown = { sigfigs, units, written };
  if (typeof before === 'number' && typeof after === 'number') {
    const diff = after - before;
    if (Math.abs(diff) <= SAME * Math.max(Math.abs(before), Math.abs(after))) return null;
    const sign = diff > 0 ? 1 : -1;
    return {
      kind: 'quantity', id, before: formatNumber(before, sigfigsFor(before, shown)), after: formatNumber(after, sigfigsFor(after, shown)),
      delta: signedText(diff, formatNumber(diff, sigfigs)), percent: percentText(diff, before), sign,
    };
  }
  if (!isUnit(before) || !isUnit(after) || !before.equalBase(after)) return undefined;
  const siA = before.value as number, siB = after.value as number;
  const diffSI = siB - siA;
  if (Math.abs(diffSI) <= SAME * Math.max(Math.abs(siA), Math.abs(siB))) return null;
  // Shown in the unit the sheet shows the result in.
  const unit = toJsonValue(after, { sigfigs, units }, displayUnit).unit;
  const diff = unit ? after.toNumber(unit) - before.toNumber(unit) : diffSI;
  const diffText = `${formatNumber(diff, sigfigs)}${unit ? ` ${unit}` : ''}`;
  return {
    kind: 'quantity', id, before: formatValue(before, shown, unit), after: formatValue(after, shown, unit),
    delta: signedText(diffSI, diffText), percent: percentText(diffSI, siA), sign: diffSI > 0 ? 1 : -1,
  };
}

function isUnit(v: unknown): v is Unit {
  return typeof v === 'object' && v !== null && (v as { isUnit?: boolean }).isUnit === true;
}

/** A check's verdict and utilization: `pass` null when it is not evaluated. */
export interface CheckVerdict {
  pass: boolean | null;
  utilization: number | null;
}

const NOT_EVALUATED: CheckVerdict = { pass: null, utilization: null };

/**
 * How a check's verdict moved: from the document's to the one shown now (for a check limited to
 * cases, its verdict over those cases before and after).
 * @returns null when neither its state nor its utilization changed (within round-off)
 * @example compareVerdicts('c_third', {pass: true, utilization: 0.85}, {pass: null, utilization: null})
 *          // {kind: 'check', flipped: true, before: true, after: null, …}
 */
export function compareVerdicts(id: string, before: CheckVerdict, after: CheckVerdict): Extract<ResultChange, { kind: 'check' }> | null {
  const pb = before.pass, pa = after.pass;
  const ub = before.utilization, ua = after.utilization;
  const sameUtil = ub === ua || (ub !== null && ua !== null && Math.abs(ub - ua) <= SAME * Math.max(Math.abs(ub), Math.abs(ua)));
  if (pb === pa && sameUtil) return null;
  return { kind: 'check', id, before: pb, after: pa, flipped: pb !== pa, utilBefore: ub, utilAfter: ua };
}

/**
 * How one cell's current state differs from the document's.
 * @returns null when nothing changed (within round-off)
 * @param units the document's system of units: results are compared in the unit the sheet shows them in
 * @example compareToDocument(cell, {status:'ok', value: 72 kN/m}, {status:'ok', value: 80 kN/m}, 4)
 *          // {kind:'quantity', delta:'+8 kN/m', percent:'+11.1 %', …}
 */
export function compareToDocument(cell: Cell, before: CellState | undefined, after: CellState | undefined, sigfigs = 4, units: UnitSystem = 'si'): ResultChange | null {
  if (cell.kind === 'check') {
    const x = before?.status === 'ok' && isCheck(before.value) ? before.value : null;
    const y = after?.status === 'ok' && isCheck(after.value) ? after.value : null;
    return compareVerdicts(cell.id, x ?? NOT_EVALUATED, y ?? NOT_EVALUATED);
  }
  if (before?.status !== 'ok' || after?.status !== 'ok') {
    if (before?.status === after?.status && (before?.status !== 'blocked' || (before as { by: string }).by === (after as { by: string }).by)) return null;
    return { kind: 'state', id: cell.id, before: stateWord(before), after: stateWord(after) };
  }
  const q = quantityChange(cell.id, cell.displayUnit, before.value, after.value, sigfigs, units, cell.kind === 'given');
  if (q !== undefined) return q;
  // Figures redraw themselves; records are compared field by field; lists and text by how they read.
  if (typeof after.value === 'string' && after.value.startsWith('<svg')) return null;
  if (isRecord(before.value) && isRecord(after.value)) {
    const fields = recordChanges(before.value, after.value, sigfigs, units);
    return fields.length ? { kind: 'record', id: cell.id, fields } : null;
  }
  const tb = formatValue(before.value, { sigfigs, units }), ta = formatValue(after.value, { sigfigs, units });
  return tb === ta ? null : { kind: 'text', id: cell.id, before: tb, after: ta };
}

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v) && !isUnit(v) && !isCheck(v) && Object.getPrototypeOf(v) === Object.prototype;
}

/** The fields of a record that moved, in the record's order (fields new or gone included). */
function recordChanges(before: Record<string, unknown>, after: Record<string, unknown>, sigfigs: number, units: UnitSystem): FieldChange[] {
  const names = [...new Set([...Object.keys(after), ...Object.keys(before)])];
  const out: FieldChange[] = [];
  for (const name of names) {
    const [b, a] = [before[name], after[name]];
    const q = quantityChange(name, undefined, b, a, sigfigs, units);
    if (q === null) continue;
    if (q) {
      out.push({ name, before: q.before, after: q.after, delta: q.delta, percent: q.percent });
      continue;
    }
    const tb = b === undefined ? 'absent' : formatValue(b, { sigfigs, units }), ta = a === undefined ? 'absent' : formatValue(a, { sigfigs, units });
    if (tb !== ta) out.push({ name, before: tb, after: ta, delta: null, percent: null });
  }
  return out;
}

/** Fields of a changed record named in its badge; the rest are counted (all are in its tooltip). */
const BADGE_FIELDS = 3;

/** The inputs whose value text differs from the document's, in document order. */
export function inputChanges(doc: CompiledDocument, overrides: ReadonlyMap<string, string>): InputChange[] {
  const out: InputChange[] = [];
  for (const cell of doc.graph.cells) {
    if (cell.kind !== 'given' || !cell.name || !overrides.has(cell.name)) continue;
    out.push({ name: cell.name, from: cell.originalSource ?? cell.source, to: overrides.get(cell.name)!, line: cell.span.start.line });
  }
  return out;
}

const ESC: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
export const esc = (s: unknown) => String(s).replace(/[&<>"']/g, (c) => ESC[c]!);

/** A check's state: exactly one of three, on the page as on the sheet and in the JSON. */
export type CheckState = 'holds' | 'fails' | 'not evaluated';

/** The state of a check from its `pass` (null: it could not be evaluated). */
export function checkState(pass: boolean | null): CheckState {
  return pass === null ? 'not evaluated' : pass ? 'holds' : 'fails';
}

/**
 * How a change of state is shown: a failure is loud, a check that can no longer be evaluated is a
 * warning (never a pass), and only a check that now holds is green.
 */
export function flipTone(after: boolean | null): 'fail' | 'warn' | 'pass' {
  return after === false ? 'fail' : after === null ? 'warn' : 'pass';
}

const FLIP_MARK = { fail: '✗', warn: '⚠', pass: '✓' } as const;

/** "holds → not evaluated": the change of state, exactly. */
export function flipText(before: boolean | null, after: boolean | null): string {
  return `${checkState(before)} → ${checkState(after)}`;
}

/** A utilization as every output prints it (two decimals, rounded up, agreeing with the verdict). */
function utilText(u: number | null, pass: boolean | null): string {
  return u === null ? '—' : formatUtilization(u, pass);
}

/**
 * The badge shown beside a result: its change against the document.
 * @returns HTML, '' when unchanged
 */
export function changeBadge(change: ResultChange | null): string {
  if (!change) return '';
  switch (change.kind) {
    case 'quantity':
      return `<span class="lv-delta ${change.sign > 0 ? 'lv-up' : 'lv-down'}" title="document: ${esc(change.before)}">`
        + `Δ ${esc(change.delta)}${change.percent ? ` <small>(${esc(change.percent)})</small>` : ''}</span>`;
    case 'check':
      if (change.flipped) {
        const tone = flipTone(change.after);
        return `<span class="lv-flip lv-flip-${tone}" role="alert">`
          + `${FLIP_MARK[tone]} ${flipText(change.before, change.after).toUpperCase()}`
          + `${change.utilBefore !== null || change.utilAfter !== null ? ` (utilization ${utilText(change.utilBefore, change.before)} → ${utilText(change.utilAfter, change.after)})` : ''}</span>`;
      }
      return `<span class="lv-delta">utilization ${utilText(change.utilBefore, change.before)} → ${utilText(change.utilAfter, change.after)}</span>`;
    case 'record': {
      const one = (f: FieldChange) => (f.delta === null ? `${f.name} ${f.before} → ${f.after}` : `${f.name} ${f.delta}${f.percent ? ` (${f.percent})` : ''}`);
      const shown = change.fields.slice(0, BADGE_FIELDS).map(one).join('; ');
      const more = change.fields.length - BADGE_FIELDS;
      const title = change.fields.map((f) => `${f.name}: ${f.before} → ${f.after}`).join('\n');
      return `<span class="lv-delta" title="${esc(title)}">Δ ${esc(shown)}${more > 0 ? ` <small>and ${more} more field${more === 1 ? '' : 's'}</small>` : ''}</span>`;
    }
    case 'text':
      return `<span class="lv-delta" title="document: ${esc(change.before)}">changed</span>`;
    case 'state':
      return `<span class="lv-delta lv-state">document: ${esc(change.before)} → now: ${esc(change.after)}</span>`;
  }
}

export interface PanelModel {
  file: string;
  inputs: InputChange[];
  flips: Array<{ id: string; label: string; before: boolean | null; after: boolean | null }>;
  changedResults: number;
  /** Inputs kept from before a reload that the new document no longer has. */
  dropped: string[];
  /** A message after a write (ok) or a refusal (error). */
  message: { kind: 'ok' | 'error' | 'info'; text: string; conflict?: boolean } | null;
  writing: boolean;
}

/**
 * The review panel: changed inputs (document → now), flipped checks, and the actions.
 * @returns HTML for the panel's body
 */
export function renderReviewPanel(m: PanelModel): string {
  const rows = m.inputs.map((i) => `<tr data-review-input="${esc(i.name)}"><th scope="row"><a href="#" data-goto="${esc(i.name)}">${esc(i.name)}</a></th>`
    + `<td class="lv-from">${esc(i.from)}</td><td class="lv-arrow">→</td><td class="lv-to">${esc(i.to)}</td>`
    + `<td><button type="button" data-action="reset-one" data-name="${esc(i.name)}" title="back to ${esc(i.from)}">undo</button></td></tr>`).join('');
  const flips = m.flips.length
    ? `<div class="lv-flips" role="alert"><strong>${m.flips.length} check${m.flips.length === 1 ? '' : 's'} changed state:</strong><ul>`
      + m.flips.map((f) => `<li class="lv-fliprow-${flipTone(f.after)}"><a href="#" data-goto="${esc(f.id)}">${esc(f.label)}</a> `
        + `${FLIP_MARK[flipTone(f.after)]} ${esc(flipText(f.before, f.after))}</li>`).join('')
      + '</ul></div>'
    : '';
  const dropped = m.dropped.length
    ? `<p class="lv-dropped">No longer in the document, so no longer applied: ${m.dropped.map(esc).join(', ')}</p>`
    : '';
  const msg = m.message
    ? `<p class="lv-msg lv-msg-${m.message.kind}" role="${m.message.kind === 'error' ? 'alert' : 'status'}">${esc(m.message.text)}`
      + `${m.message.conflict ? ' <button type="button" data-action="reload">Load the version on disk</button>' : ''}</p>`
    : '';
  if (!m.inputs.length) return `${dropped}${msg}`;
  return `<h2>Trial values <small>against ${esc(m.file)}</small></h2>`
    + `<table class="lv-inputs"><thead><tr><th>input</th><th>document</th><th></th><th>now</th><th></th></tr></thead><tbody>${rows}</tbody></table>`
    + flips
    + `<p class="lv-count">${m.changedResults} result${m.changedResults === 1 ? '' : 's'} differ from the document.</p>`
    + dropped
    + `<div class="lv-actions"><button type="button" data-action="reset-all">Back to the document's values</button>`
    + `<button type="button" data-action="write"${m.writing ? ' disabled' : ''}>Write these inputs into the document</button></div>`
    + msg;
}
