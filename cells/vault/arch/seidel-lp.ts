import { EPS, seidelCore } from './seidel-core.js';
import { seidelWorkspace } from './seidel-workspace.js';
import { randomOrder } from './random-order.js';

/** max c·x subject to a_i·x ≤ b_i (rows of `a`, row-major) and lo ≤ x ≤ hi (finite). */
export interface LinearProgram {
  a: Float64Array;
  b: Float64Array;
  c: number[];
  lo: number[];
  hi: number[];
}

/** An optimum x, or no feasible point. */
export type LpOutcome = { feasible: true; x: number[] } | { feasible: false };

/** Any exact solver of a LinearProgram (the kernel's own, or another for cross-checks). */
export type LpSolver = (lp: LinearProgram) => LpOutcome;

/**
 * Exact solution of a linear programme in a few unknowns with many
 * constraints. Seidel's algorithm (seidelCore) runs on a working set of the
 * constraints — first every s-th row, then grown each round by the 2d rows the
 * working optimum violates most — until the optimum of the working set
 * violates none, when it is optimal for all (the iterative scheme of
 * Clarkson, "Las Vegas algorithms for linear and integer programming when the
 * dimension is small", J. ACM 42, 1995, with a sample suited to an arch: its
 * rows come joint by joint and change slowly, so a spread of joints already
 * lies close to the few that bind). The working set is shuffled from a fixed
 * seed, so answers reproduce; later rounds put the new rows and the rows that
 * bind first, which keeps Seidel's incremental steps few.
 * @param lp the programme; the box keeps every intermediate optimum finite
 * @returns an optimal x, or {feasible: false}
 * @example seidelLP({a: Float64Array.of(1, 1), b: Float64Array.of(1), c: [1, 1], lo: [0, 0], hi: [9, 9]}) // x on x + y = 1
 */
export function seidelLP(lp: LinearProgram): LpOutcome {
  const d = lp.c.length;
  const m = lp.b.length;
  // A local copy: the scans below read it for every row of every round.
  const eps = EPS;
  const A = new Float64Array(m * d);
  const B = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    let sq = 0;
    for (let j = 0; j < d; j++) sq += lp.a[i * d + j]! * lp.a[i * d + j]!;
    // A row of zeros is met everywhere (b ≥ 0) or nowhere.
    if (sq === 0 && lp.b[i]! < 0) return { feasible: false };
    const f = sq === 0 ? 0 : 1 / Math.sqrt(sq);
    for (let j = 0; j < d; j++) A[i * d + j] = lp.a[i * d + j]! * f;
    B[i] = lp.b[i]! * f;
  }
  // An odd stride, so that both rows of a joint's pair are sampled along the ring.
  const stride = Math.max(1, 2 * Math.floor(m / (16 * d)) + 1);
  let work: number[] = [];
  const inWork = new Uint8Array(m);
  for (let i = 0; i < m; i += stride) (work.push(i), (inWork[i] = 1));
  work = randomOrder(work.length, 0x5eed1991).map((k) => work[k]!);
  const [c, lo, hi] = [Float64Array.from(lp.c), Float64Array.from(lp.lo), Float64Array.from(lp.hi)];
  const ws = seidelWorkspace(d, m);
  const Aw = new Float64Array(m * d);
  const Bw = new Float64Array(m);
  for (;;) {
    for (let r = 0; r < work.length; r++) {
      const i = work[r]!;
      for (let j = 0; j < d; j++) Aw[r * d + j] = A[i * d + j]!;
      Bw[r] = B[i]!;
    }
    const x = seidelCore(d, Aw, Bw, work.length, c, lo, hi, ws);
    if (!x) return { feasible: false };
    const worst: [number, number][] = [];
    const tight: number[] = [];
    const slack: number[] = [];
    for (let i = 0; i < m; i++) {
      let ax = 0;
      let scale = Math.abs(B[i]!);
      for (let j = 0; j < d; j++) {
        const t = A[i * d + j]! * x[j]!;
        ax += t;
        scale += Math.abs(t);
      }
      if (inWork[i]) (ax - B[i]! >= -1e3 * eps * scale ? tight : slack).push(i);
      else if (ax - B[i]! > eps * scale) worst.push([i, ax - B[i]!]);
    }
    if (worst.length === 0) return { feasible: true, x: Array.from(x) };
    // Next round: the 2d worst violators, then the rows that bind now, then the rest — an
    // order that finds the new optimum after few violations (the move-to-front heuristic).
    const added = worst.sort((p, q) => q[1] - p[1]).slice(0, 2 * d).map(([i]) => i);
    added.forEach((i) => (inWork[i] = 1));
    work = [...added, ...tight, ...slack];
  }
}
