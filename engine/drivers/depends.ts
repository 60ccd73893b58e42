/**
 * inputsOf: the `given` inputs a cell depends on, through every path of the graph.
 */
import type { CellGraph } from '../types.js';
import { upstreamOf } from './prune.js';

/**
 * The given inputs upstream of a cell (its transitive closure over `uses`), in document order.
 * A given cell asked about is its own input.
 * @example inputsOf(graph, 'c_H') // ['w', 'L', 'f', 'H_Rd']
 */
export function inputsOf(graph: CellGraph, id: string): string[] {
  const seen = upstreamOf(graph, [id]);
  return graph.cells.filter((c) => c.kind === 'given' && seen.has(c.id)).map((c) => c.id);
}
