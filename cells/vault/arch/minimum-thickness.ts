import type { Metres } from '../profile.js';
import type { ArchLoads, ArchRing } from './types.js';
import type { LpSolver } from './seidel-lp.js';
import { admissibleProgram, BOX } from './admissible-program.js';
import { thrustProgram } from './thrust-program.js';

/**
 * Least thickness of the ring, scaled about its fixed centreline, for which
 * a thrust line fits (Heyman, "The safety of masonry arches", Int. J. Mech.
 * Sci. 11, 1969; the geometric factor of safety is t / t_min).
 *
 * Self-weight, its centroids and the fill all change with t, so t is found
 * as the root of the fitting margin ρ(t): the largest ρ with
 * |M_j| + ρ·W·L ≤ N_j·t/2 at every joint — an LP in (H, V, M0, ρ) at each
 * trial t, positive when a line fits with room to spare and negative when
 * none fits (fitting is taken to be monotone in t). The root is bracketed
 * and closed by the Illinois variant of regula falsi (Dowell & Jarratt, BIT
 * 11, 1971), which keeps the bracket of plain bisection but needs far fewer
 * trials. Trial thicknesses stay below the span and twice the least
 * centreline radius (where the intrados folds over).
 * @param ring the ring
 * @param loads validated loads
 * @param solve the LP solver
 * @returns t_min (m) to a relative 1e-10, on the side where a line fits; undefined when no admissible thickness fits
 * @example minimumThickness(semicircle, {}, seidelLP) / 5 // ≈ 0.1075 for a centreline radius of 5 m
 */
export function minimumThickness(ring: ArchRing, loads: ArchLoads, solve: LpSolver): Metres | undefined {
  const c = ring.centreline;
  let least = Infinity;
  for (let k = 0; k <= 64; k++) least = Math.min(least, c.radius(c.phiCrown + ((c.phiSpringing - c.phiCrown) * k) / 64));
  const cap = Math.min(ring.span, 2 * least) * (1 - 1e-9);
  const margin = (t: Metres): number => {
    const lp = admissibleProgram(thrustProgram(ring, t, loads), [0, 0, 0, 1], false);
    // The margin ρ is a fourth unknown, entering every row with coefficient 1.
    const a = new Float64Array(lp.b.length * 4);
    for (let r = 0; r < lp.b.length; r++) {
      for (let i = 0; i < 3; i++) a[4 * r + i] = lp.a[3 * r + i]!;
      a[4 * r + 3] = 1;
    }
    const r = solve({ ...lp, a, lo: [...lp.lo, -BOX], hi: [...lp.hi, BOX] });
    return r.feasible ? r.x[3]! : -BOX;
  };
  // Bracket: [lo, hi] with no fit at lo and a fit at hi.
  let hi = Math.min(ring.thickness, cap);
  let fhi = margin(hi);
  let lo = hi;
  let flo = fhi;
  while (fhi < 0) {
    if (hi >= cap) return undefined;
    [lo, flo] = [hi, fhi];
    hi = Math.min(hi * 1.5, cap);
    fhi = margin(hi);
  }
  while (flo >= 0) {
    if (lo < 1e-9 * ring.span) return lo;
    [hi, fhi] = [lo, flo];
    lo /= 2;
    flo = margin(lo);
  }
  // Illinois: regula falsi that halves the weight of an end that stays put twice running.
  let side = 0;
  for (let k = 0; k < 200 && hi - lo > 1e-10 * hi; k++) {
    const t = Math.min(Math.max(hi - (fhi * (hi - lo)) / (fhi - flo), lo + 1e-3 * (hi - lo)), hi - 1e-3 * (hi - lo));
    const f = margin(t);
    // A margin of exactly zero (to the solver's precision) is the least thickness itself.
    if (f === 0) return t;
    if (f >= 0) {
      [hi, fhi] = [t, f];
      if (side === 1) flo /= 2;
      side = 1;
    } else {
      [lo, flo] = [t, f];
      if (side === -1) fhi /= 2;
      side = -1;
    }
  }
  return hi;
}
