import type { Point } from '../profile.js';
import type { ArchLoads, ArchRing, Newtons } from './types.js';
import { seidelLP } from './seidel-lp.js';
import { BOX, solveAdmissible } from './admissible-program.js';
import { thrustProgram } from './thrust-program.js';
import { thrustState } from './thrust-state.js';
import { thrustPoints } from './thrust-points.js';
import { voussoirLoads } from './voussoir-loads.js';
import { checkLoads } from './check-loads.js';

/**
 * The line of thrust of a given horizontal thrust H under symmetric loads.
 * Symmetry fixes V = half the total load; of the lines left with H and V the
 * one returned is the best centred, the one whose largest eccentricity ratio
 * |e_j| / (joint half-length) is least — a one-parameter minimax in the crown
 * position, solved as a two-variable LP (seidelLP). For H within
 * [H_min, H_max] it lies within the ring; outside that range no line does, and
 * the call is refused with the range (a line below the springing is no answer).
 * @param ring the ring
 * @param loads symmetric loads
 * @param H horizontal thrust per strip (N), > 0
 * @returns the centres of pressure on the joints (m), left springing to right
 * @example thrustLine(ring, {}, 40e3).length // ring.joints.length
 */
export function thrustLine(ring: ArchRing, loads: ArchLoads, H: Newtons): Point[] {
  checkLoads('thrust_line', ring, loads);
  if (!(H > 0 && Number.isFinite(H))) throw new RangeError(`thrust_line: H must be positive, got ${H} N`);
  const { fixed, live } = voussoirLoads(ring, ring.thickness, loads);
  const all = [...fixed, ...live];
  const total = all.reduce((s, l) => s + l.W, 0);
  const moment = all.reduce((s, l) => s + l.W * l.x, 0);
  if (Math.abs(moment) > 1e-9 * total * ring.span) {
    throw new RangeError('thrust_line: loads must be symmetric about the crown (use arch_limit for other loads)');
  }
  const p = thrustProgram(ring, ring.thickness, loads);
  const h = H / p.W;
  const v = total / 2 / p.W;
  // Joint j: M̂ = m + c_j with c_j the part fixed by h and v; N̂_j fixed. Unknowns (m, s): min s, |m + c_j| ≤ s·N̂_j.
  const base = thrustState(p, [h, v, 0], false);
  const J = p.joints.length;
  const a = new Float64Array(4 * J);
  const b = new Float64Array(2 * J);
  base.joints.forEach((jt, j) => {
    const n = jt.N / p.W;
    if (!(n > 0)) throw new RangeError(`thrust_line: H = ${H} N is too small for the thrust to stay in compression`);
    const c = jt.M / (p.W * p.L);
    a.set([1, -n, -1, -n], 4 * j);
    b[2 * j] = -c;
    b[2 * j + 1] = c;
  });
  const best = seidelLP({ a, b, c: [0, -1], lo: [-BOX, 0], hi: [BOX, BOX] });
  if (!best.feasible) throw new RangeError('thrust_line: no line of thrust found for this H');
  const state = thrustState(p, [h, v, best.x[0]!], false);
  // e is + towards the extrados: the best-centred line leaving a face at any section means no line with this H fits.
  const slack = OUTSIDE_TOLERANCE * ring.thickness;
  const leaves = state.joints.some((jt, j) => jt.e > p.joints[j]!.up + slack || -jt.e > p.joints[j]!.down + slack);
  if (leaves) throw new RangeError(`thrust_line: H = ${H} N ${outsideRange(p)}`);
  return thrustPoints(p.joints, state);
}

/** How far past the faces (as a fraction of the thickness) a line may run and still be within the ring: rounding only. */
const OUTSIDE_TOLERANCE = 1e-6;

/** Why no line of thrust with this H fits: the range of H that does, from the least and greatest thrust states. */
function outsideRange(p: ReturnType<typeof thrustProgram>): string {
  const least = solveAdmissible(p, [-1, 0, 0], {}, seidelLP);
  if (!least.feasible) return 'has no line of thrust within the ring, and no H has: the ring holds no line of thrust (see arch_limit)';
  const lo = thrustState(p, least.x, false).H;
  const most = solveAdmissible(p, [1, 0, 0], {}, seidelLP);
  const hi = most.feasible && most.x[0]! < BOX / 2 ? `${thrustState(p, most.x, false).H} N` : 'no upper bound';
  return `has no line of thrust within the ring: it lies outside H_min = ${lo} N … H_max = ${hi} (the range arch_limit gives)`;
}
