import type { LinearProgram } from './seidel-lp.js';
import type { ThrustProgram } from './thrust-program.js';

/** Half-width of the box on the scaled thrust unknowns (h, v, m): an optimum past half of it means "unbounded". */
export const BOX = 1e6;
/** Upper bound on the scaled live multiplier ℓ, far below BOX so that ℓ meets its bound before the thrust does. */
export const LIVE_BOX = 1e3;

/**
 * The safe theorem as a linear programme (Heyman, "The stone skeleton", Int.
 * J. Solids Struct. 2, 1966): the ring stands if the resultant at every joint
 * lies within the joint, |e_j| ≤ t/2, i.e. |M_j| ≤ N_j·t/2, which is the pair
 *   M_j − N_j·t/2 ≤ 0,   −M_j − N_j·t/2 ≤ 0
 * (together they also force N_j ≥ 0: no tension). Unknowns (h, v, m) with the
 * live load at its nominal value (λ = 1), or (h, v, m, ℓ) when the multiplier
 * is free (then ℓ ≥ 0).
 * @param p the scaled joint forms
 * @param objective c of "maximise c·z" (3 or 4 numbers, matching the unknowns)
 * @param lambdaFree whether λ is an unknown (4 unknowns) or 1 (3 unknowns)
 * @returns the programme, rows in joint order
 * @example admissibleProgram(thrustProgram(ring, t, {}), [-1, 0, 0], false) // minimum thrust
 */
export function admissibleProgram(p: ThrustProgram, objective: number[], lambdaFree: boolean): LinearProgram {
  const d = lambdaFree ? 4 : 3;
  const J = p.joints.length;
  const half = p.t / p.L / 2;
  const ell = lambdaFree ? 0 : p.live / p.W;
  const a = new Float64Array(2 * J * d);
  const b = new Float64Array(2 * J);
  for (let j = 0; j < J; j++) {
    const nB = p.nB[j]! + ell * p.nA[j * 4 + 3]!;
    const mB = p.mB[j]! + ell * p.mA[j * 4 + 3]!;
    for (const [r, sign] of [[2 * j, 1], [2 * j + 1, -1]] as const) {
      for (let i = 0; i < d; i++) a[r * d + i] = sign * p.mA[j * 4 + i]! - half * p.nA[j * 4 + i]!;
      b[r] = -(sign * mB - half * nB);
    }
  }
  const lo = [-BOX, -BOX, -BOX, 0].slice(0, d);
  const hi = [BOX, BOX, BOX, LIVE_BOX].slice(0, d);
  return { a, b, c: objective, lo, hi };
}
