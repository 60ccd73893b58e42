/**
 * prunedDocument: the document cut down to what some cells depend on, so a session of it evaluates
 * nothing else (a figure, or a comparison no target reads, is never re-evaluated by a move).
 */
import type { CellGraph, CompiledDocument } from '../types.js';
import { collectSymbols } from '../graph/symbols.js';

/** Every cell id upstream of the given ones, themselves included. */
export function upstreamOf(graph: CellGraph, ids: Iterable<string>): Set<string> {
  const seen = new Set<string>();
  const stack = [...ids];
  while (stack.length) {
    const id = stack.pop()!;
    if (seen.has(id)) continue;
    seen.add(id);
    stack.push(...(graph.byId.get(id)?.uses ?? []));
  }
  return seen;
}

/**
 * The same document with only the cells the targets need, and those the cases' expressions read.
 * @example startSession(prunedDocument(doc, ['c_H'])) // evaluates c_H and what it uses, nothing more
 */
export function prunedDocument(doc: CompiledDocument, targets: readonly string[]): CompiledDocument {
  const caseNames = doc.cases.lines.flatMap((l) => [...l.values.map((v) => v.input), ...l.values.flatMap((v) => collectSymbols(v.node).map((s) => s.name))]);
  const keep = upstreamOf(doc.graph, [...targets, ...caseNames.filter((n) => doc.graph.byId.has(n))]);
  const cells = doc.graph.cells.filter((c) => keep.has(c.id));
  const graph: CellGraph = {
    cells, byId: new Map(cells.map((c) => [c.id, c])), order: doc.graph.order.filter((id) => keep.has(id)),
    failed: new Map([...doc.graph.failed].filter(([id]) => keep.has(id))), unparsed: doc.graph.unparsed.filter((u) => keep.has(u.id)),
  };
  return { ...doc, graph };
}
