import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing } from './types.js';
import type { LpSolver } from './seidel-lp.js';
import { admissibleProgram } from './admissible-program.js';
import { thrustProgram } from './thrust-program.js';

/**
 * Least thickness of the ring, scaled about its fixed centreline, for which
 * a thrust line fits (Heyman, "The safety of masonry arches", Int. J. Mech.
 * Sci. 11, 1969; the geometric factor of safety is t / t_min). Self-weight,
 * centroids and fill all change with t, so the thickness is found by
 * bisection on t with an exact feasibility test (the LP of
 * admissibleProgram) at each trial — fitting is taken to be monotone in t.
 * The trial thickness never exceeds the span nor twice the least centreline
 * radius (beyond which the intrados would fold over).
 * @param ring the ring
 * @param loads validated loads
 * @param solve the LP solver
 * @returns t_min (m) to a relative 1e-9, or undefined when no admissible thickness fits
 * @example minimumThickness(semicircle, {}, seidelLP) / 5 // ≈ 0.1074 for a centreline radius of 5 m
 */
export function minimumThickness(ring: ArchRing, loads: ArchLoads, solve: LpSolver): Metres | undefined {
  const fits = (t: Metres) => solve(admissibleProgram(thrustProgram(ring, t, loads), [-1, 0, 0], false)).feasible;
  const c = ring.centreline;
  let least = Infinity;
  for (let k = 0; k <= 64; k++) least = Math.min(least, c.radius(c.phiCrown + ((c.phiSpringing - c.phiCrown) * k) / 64));
  const cap = Math.min(ring.span, 2 * least) * (1 - 1e-9);
  let hi = Math.min(ring.thickness, cap);
  while (!fits(hi)) {
    if (hi >= cap) return undefined;
    hi = Math.min(hi * 1.5, cap);
  }
  let lo = 0;
  while (hi - lo > 1e-9 * hi) {
    const mid = (lo + hi) / 2;
    if (fits(mid)) hi = mid;
    else lo = mid;
  }
  return hi;
}
