/**
 * A dense two-phase simplex for the dome's lune programme: tens to a few hundred unknowns, where
 * the arch kernel's Seidel solver (built for three or four unknowns) does not reach.
 */

/** max c·x subject to A·x ≤ b (rows of A) and x ≥ 0. */
export interface StandardLp {
  A: number[][];
  b: number[];
  c: number[];
}

export type SimplexOutcome =
  | { status: 'optimal'; x: number[]; value: number }
  | { status: 'infeasible' }
  | { status: 'unbounded' };

const EPS = 1e-9;

/**
 * Two-phase simplex on a dense tableau (Dantzig, Linear Programming and Extensions, 1963; the
 * single-artificial-variable start of phase 1 as in Chvátal, Linear Programming, 1983, ch. 3).
 * Entering column by Dantzig's largest coefficient, switching to Bland's smallest-index rule after
 * a run of degenerate pivots, so it cannot cycle. Rows and the objective should be scaled to order 1.
 * @param lp max c·x, A·x ≤ b, x ≥ 0
 * @returns the optimum, or infeasible / unbounded
 * @example simplex({A: [[1, 1]], b: [1], c: [1, 2]}) // {status: 'optimal', x: [0, 1], value: 2}
 */
export function simplex(lp: StandardLp): SimplexOutcome {
  const m = lp.b.length, n = lp.c.length;
  // Columns: x (n), slacks (m), artificial (1), right-hand side (1).
  const W = n + m + 2, art = n + m, rhs = n + m + 1;
  const T: Float64Array[] = [];
  for (let i = 0; i < m; i++) {
    const row = new Float64Array(W);
    const a = lp.A[i]!;
    for (let j = 0; j < n; j++) row[j] = a[j] ?? 0;
    row[n + i] = 1;
    row[art] = -1;
    row[rhs] = lp.b[i]!;
    T.push(row);
  }
  const basis = Array.from({ length: m }, (_, i) => n + i);
  const nonzero = new Int32Array(W);
  const pivot = (r: number, col: number) => {
    const pr = T[r]!, pv = pr[col]!;
    // Only the pivot row's nonzero entries change the other rows (the slack columns are mostly zero).
    let nz = 0;
    for (let j = 0; j < W; j++) {
      if (pr[j] !== 0) { pr[j] = pr[j]! / pv; nonzero[nz++] = j; }
    }
    for (let i = 0; i < m; i++) {
      if (i === r) continue;
      const row = T[i]!, f = row[col]!;
      if (f !== 0) for (let k = 0; k < nz; k++) { const j = nonzero[k]!; row[j] = row[j]! - f * pr[j]!; }
    }
    basis[r] = col;
  };
  // Maximises obj·x over the current tableau (obj over all W − 1 columns); false when unbounded.
  // The reduced costs d_j = obj_j − Σ_i obj_basis(i)·T[i][j] are kept in a row updated with every pivot.
  const run = (obj: Float64Array, allowed: (j: number) => boolean): boolean => {
    const d = Float64Array.from(obj);
    for (let i = 0; i < m; i++) {
      const cb = obj[basis[i]!]!;
      if (cb !== 0) for (let j = 0; j < W; j++) d[j] = d[j]! - cb * T[i]![j]!;
    }
    let degenerate = 0;
    for (let iter = 0; iter < 50 * (m + n) + 1000; iter++) {
      let enter = -1, best = EPS;
      const bland = degenerate > 20;
      for (let j = 0; j < W - 1; j++) {
        if (d[j]! > best && allowed(j)) {
          enter = j; best = d[j]!;
          if (bland) break;
        }
      }
      if (enter < 0) return true;
      let leave = -1, ratio = Infinity;
      for (let i = 0; i < m; i++) {
        const a = T[i]![enter]!;
        if (a > EPS) {
          const q = T[i]![rhs]! / a;
          if (q < ratio - 1e-12 || (Math.abs(q - ratio) <= 1e-12 && basis[i]! < basis[leave]!)) { ratio = q; leave = i; }
        }
      }
      if (leave < 0) return false;
      degenerate = ratio < 1e-12 ? degenerate + 1 : 0;
      pivot(leave, enter);
      const f = d[enter]!, pr = T[leave]!;
      if (f !== 0) for (let j = 0; j < W; j++) d[j] = d[j]! - f * pr[j]!;
    }
    throw new Error('simplex: no convergence');
  };
  // Phase 1: one artificial variable, entered on the most violated row, makes every row feasible.
  let worst = -1, most = -EPS;
  for (let i = 0; i < m; i++) if (lp.b[i]! < most) { most = lp.b[i]!; worst = i; }
  if (worst >= 0) {
    pivot(worst, art);
    const obj = new Float64Array(W);
    obj[art] = -1;
    run(obj, () => true);
    const r = basis.indexOf(art);
    if (r >= 0) {
      if (T[r]![rhs]! > 1e-7) return { status: 'infeasible' };
      // The artificial is basic at zero: pivot it out on any nonzero entry.
      const col = Array.from({ length: n + m }, (_, j) => j).find((j) => !basis.includes(j) && Math.abs(T[r]![j]!) > EPS);
      if (col !== undefined) pivot(r, col);
    }
  }
  for (const row of T) row[art] = 0;
  const obj = new Float64Array(W);
  lp.c.forEach((v, j) => { obj[j] = v; });
  if (!run(obj, (j) => j !== art)) return { status: 'unbounded' };
  const x = new Array<number>(n).fill(0);
  basis.forEach((j, i) => { if (j < n) x[j] = T[i]![rhs]!; });
  return { status: 'optimal', x, value: lp.c.reduce((s, v, j) => s + v * x[j]!, 0) };
}
