/**
 * summarise: settled cell states → the values, checks and diagnostics of a document,
 * in the JSON contract documented in README.
 */
import type { CellKind, CellState, CheckResult, CompiledDocument } from './types.js';
import type { Diagnostic } from './diagnostic.js';
import { toJsonValue, type JsonValue } from './values/json.js';
import { documentUnitSystem } from './values/format.js';
import { withoutLimitMarker } from './cases/read.js';

export interface ValueEntry extends JsonValue {
  kind: CellKind;
  line: number;
  /** Present when the value was not computed because another cell failed. */
  blocked_by?: string;
  /** Present on inputs replaced by --set: the document's own expression. */
  overridden_from?: string;
}

export interface CheckEntry {
  name: string | null;
  source: string;
  /** The check's comment, without a trailing `[in …]` limit marker (that is `judged_in`). */
  description: string;
  line: number;
  pass: boolean | null;
  utilization: number | null;
  /** Why no verdict, when the check could not be evaluated. */
  blocked_by?: string;
  /** The reason in full, when it is not a failure upstream (a field that is not available, a name defined twice). */
  reason?: string;
  /** With cases (engine/cases): the case that sets the verdict, `case: null` for the document as written. */
  governing?: CaseVerdict;
  /** With cases: the check in each case it is judged in, in case order (the document as written first, as `case: null`). */
  cases?: CaseVerdict[];
  /** A check limited by `[in NAME, …]`: the cases and families it is judged in, as the marker names them. */
  judged_in?: string[];
}

/** A check in one case. */
export interface CaseVerdict {
  case: string | null;
  pass: boolean | null;
  utilization: number | null;
}

/** A case of the document, as listed at the top level of the JSON (the document as written is not listed). */
export interface CaseEntry {
  name: string;
  family: string | null;
  index: number | null;
  overrides: Record<string, string>;
  description: string;
  line: number;
}

export interface Summary {
  file: string;
  meta: Record<string, unknown>;
  values: Record<string, ValueEntry>;
  checks: CheckEntry[];
  /** Every case of the document (engine/cases); empty when it has none. */
  cases?: CaseEntry[];
  /** Each diagnostic also carries `cell` (= cellId), the name the JSON contract uses. */
  diagnostics: Array<Diagnostic & { cell?: string | null }>;
}

/** Collects a settled document into the JSON contract. */
export function summarise(doc: CompiledDocument, states: Map<string, CellState>, warnings: Map<string, Diagnostic>): Summary {
  const sigfigs = typeof doc.meta.sigfigs === 'number' ? doc.meta.sigfigs : 4;
  // Results without units of their own are given in the document's system (kip, psf … for a calc in US units).
  const units = documentUnitSystem(doc);
  const values: Record<string, ValueEntry> = {};
  const checks: CheckEntry[] = [];
  const diagnostics: Diagnostic[] = [...doc.diagnostics];
  const seen = new Set(diagnostics);
  for (const cell of doc.graph.cells) {
    const state = states.get(cell.id) ?? { status: 'pending' };
    if (state.status === 'error' && !seen.has(state.diagnostic)) {
      diagnostics.push(state.diagnostic);
      seen.add(state.diagnostic);
    }
    const warn = warnings.get(cell.id);
    if (warn) diagnostics.push(warn);
    const blockedBy = state.status === 'blocked' ? state.by : state.status === 'error' ? cell.id : undefined;
    if (cell.kind === 'check') {
      const result = state.status === 'ok' ? (state.value as CheckResult) : null;
      const limit = doc.cases.limits.get(cell.id);
      checks.push({
        name: cell.name, source: cell.source, description: withoutLimitMarker(cell.description), line: cell.span.start.line,
        pass: result ? result.pass : null, utilization: result ? result.utilization : null,
        ...(limit?.length ? { judged_in: [...limit] } : {}),
        ...(blockedBy ? { blocked_by: blockedBy } : {}),
        ...(state.status === 'blocked' && state.note ? { reason: state.note } : {}),
      });
    }
    if (!cell.name) continue;
    const json = state.status === 'ok'
      ? toJsonValue(state.value, { sigfigs, units, written: cell.kind === 'given' }, cell.displayUnit)
      : { value: null, unit: null, text: state.status === 'blocked' ? state.note ?? `not computed because ${state.by} failed` : state.status === 'error' ? `error: ${state.diagnostic.message}` : 'pending' };
    values[cell.name] = {
      ...json, kind: cell.kind, line: cell.span.start.line,
      ...(state.status === 'blocked' ? { blocked_by: state.by } : {}),
      ...(state.status === 'blocked' && state.note ? { reason: state.note } : {}),
      ...(cell.overridden && cell.originalSource !== null ? { overridden_from: cell.originalSource } : {}),
    };
  }
  for (const u of doc.graph.unparsed) {
    if (!u.name || values[u.name]) continue;
    values[u.name] = { value: null, unit: null, text: `error: ${u.diagnostic.message}`, kind: u.kind, line: u.diagnostic.line };
  }
  diagnostics.sort((a, b) => a.line - b.line || a.column - b.column);
  return { file: doc.file, meta: doc.meta, values, checks, diagnostics: diagnostics.map((d) => ({ ...d, cell: d.cellId })) };
}
