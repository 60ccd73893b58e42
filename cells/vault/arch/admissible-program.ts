import type { LinearProgram, LpSolver } from './seidel-lp.js';
import type { ThrustProgram } from './thrust-program.js';

/** Half-width of the box on the scaled thrust unknowns (h, v, m): an optimum past half of it means "unbounded". */
export const BOX = 1e6;
/** Upper bound on the scaled live multiplier ℓ, far below BOX so that ℓ meets its bound before the thrust does. */
export const LIVE_BOX = 1e3;

/** A tangent of the stress-block bound on one side of section j, taken at the normal force Nk (N). */
export interface StrengthCut {
  j: number;
  side: 1 | -1;
  Nk: number;
}

/** What else goes into the programme besides the thrust unknowns. */
export interface AdmissibleOptions {
  /** λ is an unknown (ℓ, after h, v, m). */
  lambdaFree?: boolean;
  /** A margin ρ is the last unknown: every eccentricity row reads … + ρ ≤ 0 (for the minimum thickness). */
  margin?: boolean;
  /** Extents of each section below and above its mid-point (m), in place of the sections' own (a trial thickness). */
  offsets?: { down: ArrayLike<number>; up: ArrayLike<number> };
  /** Tangents of the finite-strength bound. */
  cuts?: readonly StrengthCut[];
}

/**
 * The safe theorem as a linear programme (Heyman, "The stone skeleton", Int.
 * J. Solids Struct. 2, 1966): the ring stands if the resultant at every
 * section lies within it, −down ≤ e_j ≤ up with e_j = −M_j/N_j, i.e.
 *   M_j − N_j·down ≤ 0,   −M_j − N_j·up ≤ 0
 * (together they also force N_j ≥ 0: no tension).
 * - Sliding (ring.friction μ finite): |T_j| ≤ μ·N_j at every joint, the two
 *   rows T_j − μN_j ≤ 0 and −T_j − μN_j ≤ 0 (Coulomb friction; linear in the
 *   unknowns for given loads: Gilbert, Casapulla, Ahmed, Computers &
 *   Structures 84, 2006 — from memory).
 * - Finite strength (f_c·b finite): the compressed block of depth a = N/(f_c·b)
 *   must fit between the resultant and the face, e ≤ up − a/2, i.e.
 *   −M ≤ N·up − N²/(2 f_c b) (a rectangular stress block: common practice).
 *   The right side is concave in N, so the bound is convex and its tangents
 *   at chosen N_k, −M − N·(up − N_k/(f_c b)) ≤ N_k²/(2 f_c b), are valid rows
 *   that close on it (Kelley's cutting planes, J. SIAM 8, 1960).
 * Unknowns (h, v, m), then ℓ when λ is free (ℓ ≥ 0), then ρ for a margin.
 * @param p the scaled section forms
 * @param objective c of "maximise c·z" (one number per unknown)
 * @param lambdaFree whether λ is an unknown or 1 (or the options)
 * @returns the programme, eccentricity rows first in section order
 * @example admissibleProgram(thrustProgram(ring, t, {}), [-1, 0, 0], false) // minimum thrust
 */
export function admissibleProgram(p: ThrustProgram, objective: number[], lambdaFree: boolean | AdmissibleOptions): LinearProgram {
  const o: AdmissibleOptions = typeof lambdaFree === 'boolean' ? { lambdaFree } : lambdaFree;
  const free = o.lambdaFree ?? false;
  const d = 3 + (free ? 1 : 0) + (o.margin ? 1 : 0);
  const J = p.joints.length;
  const ell = free ? 0 : p.live / p.W;
  const cuts = o.cuts ?? [];
  const friction = Number.isFinite(p.mu) ? p.joints.filter((s) => s.kind === 'joint').length : 0;
  const rows = 2 * J + cuts.length + 2 * friction;
  const a = new Float64Array(rows * d);
  const b = new Float64Array(rows);
  const down = o.offsets?.down ?? p.joints.map((s) => s.down);
  const up = o.offsets?.up ?? p.joints.map((s) => s.up);
  let r = 0;
  /** Row: sign·M̂ − k·N̂ (+ ρ) ≤ c, with k in units of N̂ per M̂ (an offset over L). */
  const row = (j: number, sign: number, k: number, c: number, withMargin: boolean, forms: 'm' | 't' = 'm') => {
    const A = forms === 'm' ? p.mA : p.tA;
    const B = forms === 'm' ? p.mB : p.tB;
    for (let i = 0; i < 3; i++) a[r * d + i] = sign * A[j * 4 + i]! - k * p.nA[j * 4 + i]!;
    if (free) a[r * d + 3] = sign * A[j * 4 + 3]! - k * p.nA[j * 4 + 3]!;
    if (o.margin) a[r * d + d - 1] = withMargin ? 1 : 0;
    const fixedPart = sign * (B[j]! + ell * A[j * 4 + 3]!) - k * (p.nB[j]! + ell * p.nA[j * 4 + 3]!);
    b[r++] = c - fixedPart;
  };
  for (let j = 0; j < J; j++) {
    row(j, 1, down[j]! / p.L, 0, true);
    row(j, -1, up[j]! / p.L, 0, true);
  }
  for (const cut of cuts) {
    const off = cut.side === 1 ? down[cut.j]! : up[cut.j]!;
    row(cut.j, cut.side, (off - cut.Nk / p.fb) / p.L, (cut.Nk * cut.Nk) / (2 * p.fb * p.W * p.L), true);
  }
  if (friction) {
    // T/W against μ·N/W: the tangential forms are scaled by W alone, like N.
    p.joints.forEach((s, j) => {
      if (s.kind !== 'joint') return;
      row(j, 1, p.mu, 0, false, 't');
      row(j, -1, p.mu, 0, false, 't');
    });
  }
  const lo = [-BOX, -BOX, -BOX, ...(free ? [0] : []), ...(o.margin ? [-BOX] : [])];
  const hi = [BOX, BOX, BOX, ...(free ? [LIVE_BOX] : []), ...(o.margin ? [BOX] : [])];
  return { a, b, c: objective, lo, hi };
}

/** An optimum of the admissible programme with its finite-strength rounds. */
export type Admissible = { feasible: true; x: number[]; rounds: number } | { feasible: false; rounds: number };

/**
 * Solves the admissible programme; with finite strength, adds tangents of
 * the stress-block bound where the optimum breaks it and solves again, until
 * every section meets it within 1e-9·W·L (the tangents at N_k = f_c·b·offset
 * start it off: each caps |M| at f_c·b·offset²/2).
 * @param p the scaled section forms
 * @param objective c of "maximise c·z"
 * @param o unknowns and offsets, as admissibleProgram
 * @param solve the LP solver
 * @returns the optimum (or infeasible) and how many programmes were solved
 * @example solveAdmissible(p, [0, 0, 0, 1], {lambdaFree: true}, seidelLP).x[3] // ℓ at collapse
 */
export function solveAdmissible(p: ThrustProgram, objective: number[], o: AdmissibleOptions, solve: LpSolver): Admissible {
  if (!Number.isFinite(p.fb)) {
    const r = solve(admissibleProgram(p, objective, o));
    return r.feasible ? { ...r, rounds: 1 } : { feasible: false, rounds: 1 };
  }
  const J = p.joints.length;
  const down = o.offsets?.down ?? p.joints.map((s) => s.down);
  const up = o.offsets?.up ?? p.joints.map((s) => s.up);
  const cuts: StrengthCut[] = [];
  for (let j = 0; j < J; j++) cuts.push({ j, side: 1, Nk: p.fb * down[j]! }, { j, side: -1, Nk: p.fb * up[j]! });
  const tol = 1e-9 * p.W * p.L;
  for (let round = 1; ; round++) {
    const r = solve(admissibleProgram(p, objective, { ...o, cuts }));
    if (!r.feasible) return { feasible: false, rounds: round };
    const z = r.x;
    const ell = o.lambdaFree ? z[3]! : p.live / p.W;
    const rho = o.margin ? z[z.length - 1]! * p.W * p.L : 0;
    let worst = 0;
    for (let j = 0; j < J; j++) {
      let n = p.nB[j]! + p.nA[j * 4 + 3]! * ell;
      let m = p.mB[j]! + p.mA[j * 4 + 3]! * ell;
      for (let i = 0; i < 3; i++) {
        n += p.nA[j * 4 + i]! * z[i]!;
        m += p.mA[j * 4 + i]! * z[i]!;
      }
      const [N, M] = [n * p.W, m * p.W * p.L];
      for (const side of [1, -1] as const) {
        const off = side === 1 ? down[j]! : up[j]!;
        const excess = side * M - (N * off - (N * N) / (2 * p.fb)) + rho;
        if (excess > tol) {
          cuts.push({ j, side, Nk: Math.max(N, 0) });
          worst = Math.max(worst, excess);
        }
      }
    }
    if (worst === 0 || round >= 200) return { feasible: true, x: z, rounds: round };
  }
}
