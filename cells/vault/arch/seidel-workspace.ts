/** Scratch arrays for each dimension, reused by every subproblem (typed-array allocation dominates otherwise). */
export interface SeidelWorkspace {
  rows: Float64Array[];
  rhs: Float64Array[];
  x: Float64Array[];
  gamma: Float64Array[];
  c: Float64Array[];
  lo: Float64Array[];
  hi: Float64Array[];
}

const shared: ({ m: number; ws: SeidelWorkspace } | undefined)[] = [];

/**
 * Workspace for up to m rows in d unknowns. One per dimension is kept and handed out
 * again while it is large enough: the solver is synchronous, so no two solves share it.
 * @param d number of unknowns
 * @param m number of constraint rows
 * @returns arrays for every dimension 0…d
 * @example seidelWorkspace(4, 402).rows[3].length // (402 + 8)·3
 */
export function seidelWorkspace(d: number, m: number): SeidelWorkspace {
  const kept = shared[d];
  if (kept && kept.m >= m) return kept.ws;
  const per = (size: (e: number) => number) => Array.from({ length: d + 1 }, (_, e) => new Float64Array(size(e)));
  const rows = m + 2 * d;
  const ws = {
    rows: per((e) => rows * e), rhs: per(() => rows), x: per((e) => e), gamma: per((e) => e),
    c: per((e) => e), lo: per((e) => e), hi: per((e) => e),
  };
  shared[d] = { m, ws };
  return ws;
}

