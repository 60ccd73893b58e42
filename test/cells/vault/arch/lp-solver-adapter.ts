/**
 * The kernel's LinearProgram handed to javascript-lp-solver (a general
 * simplex code), so tests and the benchmark can cross-check seidelLP on the
 * very same programmes.
 */
import lpSolver from 'javascript-lp-solver';
import type { LinearProgram, LpOutcome } from '../../../../cells/vault/arch/seidel-lp.js';

/**
 * The same programme as a javascript-lp-solver model: free variables x0…,
 * rows r0… ≤ b, and the box as rows x_i ≤ hi_i and −x_i ≤ −lo_i.
 */
export function toSolverModel(lp: LinearProgram) {
  const d = lp.c.length;
  const m = lp.b.length;
  const variables: Record<string, Record<string, number>> = {};
  const constraints: Record<string, { max: number }> = {};
  for (let i = 0; i < d; i++) {
    const v: Record<string, number> = { obj: lp.c[i]!, [`up${i}`]: 1, [`down${i}`]: -1 };
    for (let r = 0; r < m; r++) if (lp.a[r * d + i] !== 0) v[`r${r}`] = lp.a[r * d + i]!;
    variables[`x${i}`] = v;
    constraints[`up${i}`] = { max: lp.hi[i]! };
    constraints[`down${i}`] = { max: -lp.lo[i]! };
  }
  for (let r = 0; r < m; r++) constraints[`r${r}`] = { max: lp.b[r]! };
  const unrestricted = Object.fromEntries(lp.c.map((_, i) => [`x${i}`, 1]));
  return { optimize: 'obj', opType: 'max' as const, constraints, variables, unrestricted };
}

// The package is CommonJS typed as a namespace; at run time the default import is the solver itself.
type Engine = { Solve(model: unknown, precision?: number): unknown };
const loaded = lpSolver as unknown as Engine & { default?: Engine };
const solver: Engine = typeof loaded.Solve === 'function' ? loaded : loaded.default!;

/** An LpSolver backed by javascript-lp-solver. */
export function simplexLP(lp: LinearProgram): LpOutcome {
  // Its default precision (1e-9) also rounds the answer to 1e-9; ask for 1e-12 so margins near zero keep their sign.
  const result = solver.Solve(toSolverModel(lp), 1e-12) as Record<string, number | boolean>;
  if (!result.feasible) return { feasible: false };
  return { feasible: true, x: lp.c.map((_, i) => Number(result[`x${i}`] ?? 0)) };
}
