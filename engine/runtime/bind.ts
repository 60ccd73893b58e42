/**
 * bindGraph: CellGraph → a live Session on @observablehq/runtime.
 *
 * Each cell becomes exactly one runtime variable (name, inputs, function).
 * The runtime orders the work and recomputes only what depends on a change;
 * this file adds no scheduler of its own.
 */
import { Runtime, type Variable } from '@observablehq/runtime';
import type { Cell, CellGraph, CellState } from '../types.js';
import type { Diagnostic, StageContext } from '../diagnostic.js';
import { readOverride } from '../parse/override.js';
import { CellFailure } from './failure.js';
import { evaluateCell, checkRange } from './evaluate.js';
import { observeCell } from './observe.js';
import { resetDocumentBudget } from '../sandbox/index.js';

export interface Session {
  readonly graph: CellGraph;
  /** Current state of every cell (and of every statement that failed to parse). */
  readonly states: Map<string, CellState>;
  /** How many times each cell's expression has been evaluated. */
  readonly evaluations: Map<string, number>;
  /** Warnings found while evaluating (values outside their range). */
  readonly warnings: Map<string, Diagnostic>;
  /** Resolves once every cell has a settled state. */
  settle(): Promise<Map<string, CellState>>;
  /** Replaces a given input's expression; returns a diagnostic instead when the text is not acceptable. */
  setInput(name: string, source: string): Diagnostic | null;
  /** Puts a given input back to the document's value. */
  resetInput(name: string): void;
  /** Called on every state change. */
  subscribe(listener: (id: string, state: CellState) => void): () => void;
  dispose(): void;
}

type Internal = { _compute(): Promise<void>; _promise?: Promise<unknown> };

/**
 * Binds a graph to a new runtime and starts evaluating.
 * @param graph from buildGraph
 * @param ctx file name and the diagnostics list (range warnings are kept on the session)
 */
export function bindGraph(graph: CellGraph, ctx: StageContext): Session {
  const runtime = new Runtime();
  const module = runtime.module();
  const states = new Map<string, CellState>();
  const evaluations = new Map<string, number>();
  const warnings = new Map<string, Diagnostic>();
  const listeners = new Set<(id: string, state: CellState) => void>();
  const variables = new Map<string, Variable>();
  const originals = new Map<string, { node: Cell['node']; source: string }>();

  const report = (id: string, state: CellState) => {
    states.set(id, state);
    for (const l of listeners) l(id, state);
  };

  const definition = (cell: Cell) => (...inputs: unknown[]) => {
    evaluations.set(cell.id, (evaluations.get(cell.id) ?? 0) + 1);
    const value = evaluateCell(cell, inputs, ctx);
    const warn = cell.kind === 'given' ? checkRange(cell, value, ctx) : null;
    if (warn) warnings.set(cell.id, warn); else warnings.delete(cell.id);
    return value;
  };

  const defineCell = (cell: Cell) => {
    const failure = graph.failed.get(cell.id);
    const v = variables.get(cell.id) ?? module.variable(observeCell(cell.id, report, (id) => states.get(id)));
    variables.set(cell.id, v);
    if (failure) v.define(cell.id, [], () => { throw new CellFailure(cell.id, failure); });
    else v.define(cell.id, [...cell.uses], definition(cell));
  };

  for (const cell of graph.cells) defineCell(cell);
  // Statements that never became cells still have names others may use.
  for (const [id, failure] of graph.failed) {
    if (graph.byId.has(id)) continue;
    const v = module.variable(observeCell(id, report, (x) => states.get(x)));
    variables.set(id, v);
    v.define(id, [], () => { throw new CellFailure(id, failure); });
  }

  const settle = async () => {
    for (let round = 0; round < 1000; round++) {
      await (runtime as unknown as Internal)._compute();
      await Promise.allSettled([...variables.values()].map((v) => (v as unknown as Internal)._promise));
      await new Promise((r) => setTimeout(r, 0));
      if (![...states.values()].some((s) => s.status === 'pending')) break;
    }
    return states;
  };

  const setInput = (name: string, source: string): Diagnostic | null => {
    const cell = graph.byId.get(name);
    const reading = readOverride(cell, name, source, (n) => graph.byId.has(n));
    if (!reading.ok) {
      return {
        message: reading.message, file: ctx.file, line: cell?.span.start.line ?? 1, column: 1, endLine: cell?.span.end.line ?? 1,
        endColumn: 1, cellId: name, ruleId: reading.ruleId, severity: 'error',
      };
    }
    const { node, cell: given } = reading;
    if (!originals.has(name)) originals.set(name, { node: given.node, source: given.source });
    given.node = node;
    given.source = source;
    given.overridden = true;
    given.originalSource = originals.get(name)!.source;
    resetDocumentBudget(ctx);
    defineCell(given);
    return null;
  };

  const resetInput = (name: string) => {
    const cell = graph.byId.get(name);
    const original = originals.get(name);
    if (!cell || !original) return;
    cell.node = original.node;
    cell.source = original.source;
    cell.overridden = false;
    cell.originalSource = null;
    originals.delete(name);
    resetDocumentBudget(ctx);
    defineCell(cell);
  };

  return {
    graph, states, evaluations, warnings, settle, setInput, resetInput,
    subscribe: (l) => { listeners.add(l); return () => listeners.delete(l); },
    dispose: () => runtime.dispose(),
  };
}
