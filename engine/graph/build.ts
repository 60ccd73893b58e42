/**
 * buildGraph: Cell[] → CellGraph.
 *
 * Finds, while cells still know their lines, what the runtime would only
 * report by name: duplicate definitions, unknown names, names that shadow a
 * unit the document uses, functions the sandbox withholds, and cycles.
 */
import { math } from '../../cells/math.js';
import { NOT_FOR_DOCUMENTS, isDocumentFunction } from '../sandbox/index.js';
import type { Cell, CellGraph, Span } from '../types.js';
import type { Diagnostic, RuleId, StageContext } from '../diagnostic.js';
import type { FailedStatement } from '../parse/cell.js';
import { collectSymbols } from './symbols.js';
import { suggestName } from './suggest.js';

export interface Library {
  /** Names of the registered cell functions. */
  functions: ReadonlySet<string>;
}

const REFUSED = NOT_FOR_DOCUMENTS;

/** Is this a unit mathjs knows (with or without prefix)? */
export function isUnitName(name: string): boolean {
  try {
    return math.Unit.isValuelessUnit(name);
  } catch {
    return false;
  }
}

function isLibraryName(name: string, lib: Library): boolean {
  return lib.functions.has(name) || isDocumentFunction(name);
}

function diag(ctx: StageContext, span: Span, cellId: string, ruleId: RuleId, message: string, note?: string): Diagnostic {
  return {
    message, file: ctx.file, line: span.start.line, column: span.start.column, endLine: span.end.line,
    endColumn: span.end.column, cellId, ruleId, severity: 'error', ...(note ? { note } : {}),
  };
}

/**
 * Builds the dependency graph of a document's cells.
 * @param cells every cell, in document order
 * @param failedStatements statements that failed to parse (their names still count as defined)
 */
export function buildGraph(cells: Cell[], failedStatements: FailedStatement[], lib: Library, ctx: StageContext): CellGraph {
  const failed = new Map<string, Diagnostic>();
  const fail = (d: Diagnostic) => {
    ctx.diagnostics.push(d);
    if (d.cellId && !failed.has(d.cellId)) failed.set(d.cellId, d);
  };
  for (const f of failedStatements) failed.set(f.id, f.diagnostic);

  // Which names are defined, and where first?
  const byId = new Map<string, Cell>();
  const kept: Cell[] = [];
  const failedNames = new Set(failedStatements.map((f) => f.name).filter((n): n is string => n !== null));
  for (const cell of cells) {
    const prior = byId.get(cell.id);
    if (prior || (cell.name && failedNames.has(cell.name))) {
      const line = prior ? prior.span.start.line : failedStatements.find((f) => f.name === cell.name)!.diagnostic.line;
      const d = diag(ctx, cell.span, cell.id, 'graph/duplicate', `"${cell.id}" is defined twice (lines ${line} and ${cell.span.start.line})`,
        'keep one definition, or rename the other');
      ctx.diagnostics.push(d);
      // Which of the two is meant is unknown: the first is not used either, so its dependents say why.
      if (prior && !failed.has(prior.id)) failed.set(prior.id, d);
      continue;
    }
    byId.set(cell.id, cell);
    kept.push(cell);
  }
  const defined = new Set<string>([...byId.keys(), ...failedNames]);

  // Where is each name used as a unit, so that defining it would change `6 m`?
  const unitUses = new Map<string, Cell>();
  for (const cell of kept) {
    cell.uses = [];
    cell.calls = [];
    for (const use of collectSymbols(cell.node)) {
      if (use.role === 'unit' && !unitUses.has(use.name)) unitUses.set(use.name, cell);
    }
  }

  let known: string[] | undefined;
  const suggestions = new Map<string, string | null>();
  for (const cell of kept) {
    if (cell.name && lib.functions.has(cell.name)) {
      fail(diag(ctx, cell.span, cell.id, 'graph/shadow-function', `"${cell.name}" is the name of a vault function; choose another name, e.g. "${cell.name}_1" or a descriptive one`));
      continue;
    }
    const user = cell.name ? unitUses.get(cell.name) : undefined;
    if (cell.name && user && isUnitName(cell.name)) {
      fail(diag(ctx, cell.span, cell.id, 'graph/shadow-unit',
        `"${cell.name}" is also a unit, used as one on line ${user.span.start.line}; defining it would change what "${cell.name}" means there`,
        `rename it, e.g. "${cell.name}_1" or a descriptive name`));
    }
    const seen = new Set<string>();
    for (const use of collectSymbols(cell.node)) {
      const key = `${use.role}:${use.name}`;
      if (seen.has(key)) continue;
      seen.add(key);
      if (REFUSED.has(use.name) && !defined.has(use.name)) {
        fail({ ...diag(ctx, cell.span, cell.id, 'sandbox/refused', `"${use.name}" is not available in a calc document`) });
        continue;
      }
      if (use.role === 'unit') {
        // `3 kN / a` with `a` defined in the document and not a unit: mathjs reads the value.
        if (defined.has(use.name) && !isUnitName(use.name)) {
          if (!cell.uses.includes(use.name)) cell.uses.push(use.name);
        } else if (!isUnitName(use.name) && !defined.has(use.name)) {
          fail(diag(ctx, cell.span, cell.id, 'graph/unknown-name', `unknown unit "${use.name}"`));
        }
        continue;
      }
      // A call of a vault function stays one even where the document wrongly defines that name too.
      if (defined.has(use.name) && !(use.role === 'call' && lib.functions.has(use.name))) {
        if (use.role === 'call') {
          fail(diag(ctx, cell.span, cell.id, 'eval/error', `"${use.name}" is a value defined in this document, not a function`));
        } else if (!cell.uses.includes(use.name)) {
          cell.uses.push(use.name);
        }
        continue;
      }
      if (isLibraryName(use.name, lib)) {
        if (!cell.calls.includes(use.name)) cell.calls.push(use.name);
        continue;
      }
      if (use.role === 'value' && isUnitName(use.name)) continue; // a unit standing alone, e.g. `x / m`
      // One search per unknown name and document: a name misspelt on every line costs one.
      known ??= [...defined, ...lib.functions];
      if (!suggestions.has(use.name)) suggestions.set(use.name, suggestName(use.name, known));
      const guess = suggestions.get(use.name)!;
      const what = use.role === 'call' ? 'function' : 'name';
      fail(diag(ctx, cell.span, cell.id, 'graph/unknown-name',
        `unknown ${what} "${use.name}"${guess ? `; did you mean "${guess}"?` : ''}`));
    }
  }

  const order = orderCells(kept, byId, ctx, fail);
  return { cells: kept, byId, order, failed, unparsed: failedStatements };
}

/** Topological order (Kahn); cells on a cycle are reported with the whole cycle. */
function orderCells(cells: Cell[], byId: Map<string, Cell>, ctx: StageContext, fail: (d: Diagnostic) => void): string[] {
  const indegree = new Map<string, number>();
  const users = new Map<string, string[]>();
  for (const c of cells) {
    const deps = c.uses.filter((u) => byId.has(u));
    indegree.set(c.id, deps.length);
    for (const d of deps) users.set(d, [...(users.get(d) ?? []), c.id]);
  }
  const order: string[] = [];
  const queue = cells.filter((c) => indegree.get(c.id) === 0).map((c) => c.id);
  while (queue.length) {
    const id = queue.shift()!;
    order.push(id);
    for (const u of users.get(id) ?? []) {
      indegree.set(u, indegree.get(u)! - 1);
      if (indegree.get(u) === 0) queue.push(u);
    }
  }
  if (order.length === cells.length) return order;
  // What is left lies on a cycle or downstream of one; name each cycle once.
  const left = new Set(cells.filter((c) => !order.includes(c.id)).map((c) => c.id));
  const reported = new Set<string>();
  for (const start of left) {
    if (reported.has(start)) continue;
    const path: string[] = [];
    const onPath = new Map<string, number>();
    let cur: string | undefined = start;
    while (cur && !onPath.has(cur) && !reported.has(cur)) {
      onPath.set(cur, path.length);
      path.push(cur);
      cur = byId.get(cur)!.uses.find((u) => left.has(u));
    }
    if (cur && onPath.has(cur)) {
      const cycle = path.slice(onPath.get(cur)!);
      const text = [...cycle, cycle[0]].join(' → ');
      for (const id of cycle) {
        reported.add(id);
        fail(diag(ctx, byId.get(id)!.span, id, 'graph/cycle', `circular definition: ${text}`));
      }
    }
    for (const id of path) reported.add(id);
  }
  return order;
}
