/**
 * runCases: evaluates cases on the document's own session, one after another.
 *
 * A case sets its inputs with session.setInput (the same path as --set and a live edit), so the
 * runtime recomputes only what lies downstream of them and reuses everything else, compiled
 * expressions included. Moving from one case to the next changes only the inputs that differ.
 */
import type { Session } from '../runtime/bind.js';
import type { CellGraph, CellState, CheckResult } from '../types.js';
import type { Diagnostic } from '../diagnostic.js';
import type { Case } from './expand.js';

/** One check in one case (`case: null` is the document as written). */
export interface CheckCase {
  case: string | null;
  pass: boolean | null;
  utilization: number | null;
}

/** What one case gives: every check's result, and the errors and range warnings the case alone causes. */
export interface CaseResult {
  case: string | null;
  checks: Record<string, CheckCase>;
  diagnostics: Diagnostic[];
}

/**
 * Check results of a settled document in one case.
 * @example resultOf(graph, states, 'EQU', new Set()).checks['c_ot'].pass
 */
export function resultOf(graph: CellGraph, states: Map<string, CellState>, name: string | null, known: ReadonlySet<string>, warnings?: ReadonlyMap<string, Diagnostic>): CaseResult {
  const checks: Record<string, CheckCase> = {};
  const diagnostics: Diagnostic[] = [];
  for (const cell of graph.cells) {
    const s = states.get(cell.id);
    if (cell.kind === 'check') {
      const r = s?.status === 'ok' ? (s.value as CheckResult) : null;
      checks[cell.id] = { case: name, pass: r ? r.pass : null, utilization: r ? r.utilization : null };
    }
    if (s?.status === 'error' && !known.has(`${cell.id}\n${s.diagnostic.message}`)) diagnostics.push(s.diagnostic);
    const w = warnings?.get(cell.id);
    if (w && !known.has(`${cell.id}\n${w.message}`)) diagnostics.push(w);
  }
  return { case: name, checks, diagnostics };
}

/** Errors and warnings already present as written: a case reports only the ones it adds. */
export function errorKeys(graph: CellGraph, states: Map<string, CellState>, warnings?: ReadonlyMap<string, Diagnostic>): Set<string> {
  const keys = new Set<string>();
  for (const cell of graph.cells) {
    const s = states.get(cell.id);
    if (s?.status === 'error') keys.add(`${cell.id}\n${s.diagnostic.message}`);
  }
  for (const [id, w] of warnings ?? []) keys.add(`${id}\n${w.message}`);
  return keys;
}

export interface RunOptions {
  /** Called with each case's settled states (before the next case starts). */
  onCase?: (c: Case, states: Map<string, CellState>) => void;
  /** Put the inputs back and settle at the end, for a session that lives on (default false). */
  restore?: boolean;
}

/**
 * Evaluates each case on the session and returns its results in order.
 * @param known errorKeys of the document as written
 */
export async function runCases(session: Session, cases: readonly Case[], known: ReadonlySet<string>, options: RunOptions = {}): Promise<CaseResult[]> {
  const applied = new Map<string, string>();
  const results: CaseResult[] = [];
  for (const c of cases) {
    for (const input of [...applied.keys()]) {
      if (input in c.overrides) continue;
      session.resetInput(input);
      applied.delete(input);
    }
    const refused: Diagnostic[] = [];
    for (const [input, text] of Object.entries(c.overrides)) {
      if (applied.get(input) === text) continue;
      const d = session.setInput(input, text);
      if (d) refused.push({ ...d, line: c.line, endLine: c.line, cellId: c.name });
      else applied.set(input, text);
    }
    const states = await session.settle();
    options.onCase?.(c, states);
    const r = resultOf(session.graph, states, c.name, known, session.warnings);
    r.diagnostics.unshift(...refused);
    results.push(r);
  }
  for (const input of applied.keys()) session.resetInput(input);
  if (options.restore && applied.size > 0) await session.settle();
  return results;
}
