import type { SeidelWorkspace } from './seidel-workspace.js';

/** Relative slack within which a constraint counts as met. */
export const EPS = 1e-10;

/**
 * Seidel's randomised incremental algorithm for max c·x subject to the first
 * m rows of A·x ≤ B (row-major, d columns, taken in the given order — pass a
 * random order) and the box lo ≤ x ≤ hi (R. Seidel, "Small-dimensional linear
 * programming and convex hulls made easy", Discrete Comput. Geom. 6, 1991;
 * de Berg et al., Computational Geometry, 3rd ed., §4.4–4.7). Start at the
 * best corner of the box and add the constraints one at a time; when the
 * current optimum violates one, the new optimum lies on its hyperplane, so
 * eliminate one variable there and solve the (d−1)-variable programme of the
 * constraints seen so far (the box rows of the eliminated variable first).
 * Expected time O(d!·m).
 * @param d number of unknowns
 * @param A constraint rows (m × d); B right-hand sides; m rows used
 * @param c objective (maximised); lo, hi the box
 * @param ws scratch space from seidelWorkspace
 * @returns an optimum (a view into ws, copy it), or null when infeasible
 * @example seidelCore(1, Float64Array.of(1), Float64Array.of(2), 1, [1], [0], [9], seidelWorkspace(1, 1)) // [2]
 */
export function seidelCore(d: number, A: Float64Array, B: Float64Array, m: number, c: ArrayLike<number>,
  lo: ArrayLike<number>, hi: ArrayLike<number>, ws: SeidelWorkspace): Float64Array | null {
  const x = ws.x[d]!;
  if (d === 1) return solveLine(A, B, m, c[0]!, lo[0]!, hi[0]!, x);
  // Start at the best corner of the box: the optimum of no constraints.
  for (let i = 0; i < d; i++) x[i] = c[i]! > 0 ? hi[i]! : c[i]! < 0 ? lo[i]! : Math.min(Math.max(0, lo[i]!), hi[i]!);
  const e = d - 1;
  const [A1, B1, c1, lo1, hi1, gamma] = [ws.rows[e]!, ws.rhs[e]!, ws.c[e]!, ws.lo[e]!, ws.hi[e]!, ws.gamma[d]!];
  for (let k = 0; k < m; k++) {
    let ax = 0;
    let scale = Math.abs(B[k]!);
    let p = 0;
    for (let i = 0; i < d; i++) {
      const t = A[k * d + i]! * x[i]!;
      ax += t;
      scale += Math.abs(t);
      if (Math.abs(A[k * d + i]!) > Math.abs(A[k * d + p]!)) p = i;
    }
    if (ax - B[k]! <= EPS * scale) continue;
    // Is the new optimum on a_k·x = b_k? Yes: eliminate x_p = β − Σ γ_i x_i.
    const ap = A[k * d + p]!;
    const beta = B[k]! / ap;
    for (let i = 0; i < d; i++) gamma[i] = A[k * d + i]! / ap;
    for (let i = 0, r = 0; i < d; i++) {
      if (i === p) continue;
      A1[r] = -gamma[i]!; // x_p ≤ hi_p
      A1[e + r] = gamma[i]!; // x_p ≥ lo_p
      c1[r] = c[i]! - c[p]! * gamma[i]!;
      lo1[r] = lo[i]!;
      hi1[r++] = hi[i]!;
    }
    B1[0] = hi[p]! - beta;
    B1[1] = beta - lo[p]!;
    for (let j = 0; j < k; j++) {
      const ajp = A[j * d + p]!;
      for (let i = 0, r = 0; i < d; i++) if (i !== p) A1[(j + 2) * e + r++] = A[j * d + i]! - ajp * gamma[i]!;
      B1[j + 2] = B[j]! - ajp * beta;
    }
    const y = seidelCore(e, A1, B1, k + 2, c1, lo1, hi1, ws);
    if (!y) return null;
    let xp = beta;
    for (let i = 0, r = 0; i < d; i++) {
      if (i === p) continue;
      x[i] = y[r]!;
      xp -= gamma[i]! * y[r++]!;
    }
    x[p] = xp;
  }
  return x;
}

/** The one-variable programme: intersect the half-lines, take the best end. */
function solveLine(A: Float64Array, B: Float64Array, m: number, c: number, lo: number, hi: number, x: Float64Array): Float64Array | null {
  let L = lo;
  let U = hi;
  for (let k = 0; k < m; k++) {
    const a = A[k]!;
    const b = B[k]!;
    // A constraint parallel to the line is met everywhere or nowhere.
    if (Math.abs(a) <= 1e-11) {
      if (b < -EPS * 10) return null;
    } else if (a > 0) U = Math.min(U, b / a);
    else L = Math.max(L, b / a);
  }
  if (L > U) {
    if (L - U > EPS * (1 + Math.abs(L) + Math.abs(U))) return null;
    L = U = (L + U) / 2;
  }
  x[0] = c > 0 ? U : c < 0 ? L : Math.min(Math.max(0, L), U);
  return x;
}
