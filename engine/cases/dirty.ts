/**
 * downstreamOf: the cells a change of some inputs makes dirty — the inputs themselves and
 * everything that reads them, directly or through other cells. A case re-evaluates exactly these.
 */
import type { CellGraph } from '../types.js';

/**
 * The dirty subgraph of a change of inputs, as cell ids.
 * @example downstreamOf(graph, ['x_P']) // Set {'x_P', 'M', 'R', 'c_M', 'c_R'}
 */
export function downstreamOf(graph: CellGraph, inputs: Iterable<string>): Set<string> {
  const users = new Map<string, string[]>();
  for (const c of graph.cells) for (const u of c.uses) users.set(u, [...(users.get(u) ?? []), c.id]);
  const dirty = new Set<string>();
  const stack = [...inputs];
  while (stack.length) {
    const id = stack.pop()!;
    if (dirty.has(id)) continue;
    dirty.add(id);
    stack.push(...(users.get(id) ?? []));
  }
  return dirty;
}
