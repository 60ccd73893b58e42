import type { ArchLimit, ArchLoads, ArchRing, Hinge } from './types.js';
import { seidelLP, type LpSolver } from './seidel-lp.js';
import { admissibleProgram, BOX, LIVE_BOX } from './admissible-program.js';
import { thrustProgram } from './thrust-program.js';
import { thrustState } from './thrust-state.js';
import { touchingJoints } from './touching-joints.js';
import { minimumThickness } from './minimum-thickness.js';
import { checkLoads } from './check-loads.js';

/**
 * Limit analysis of a masonry ring under Heyman's assumptions — no tensile
 * strength, no sliding, unlimited compressive strength (Heyman, "The stone
 * skeleton", Int. J. Solids Struct. 2, 1966). By the safe theorem the ring
 * stands if some thrust line in equilibrium with the loads lies within it;
 * the set of such lines is a polytope in (H, V, M0), so
 * - H_min / H_max: least and greatest horizontal thrust (LPs in 3 unknowns);
 * - t_min, gsf = t / t_min: geometric factor of safety (Heyman 1969);
 * - load_factor: the largest multiplier λ on live and point loads (an LP in
 *   (H, V, M0, λ); by the uniqueness theorem the collapse multiplier), with
 *   the hinges of the mechanism where the line touches the faces.
 * All solved exactly by seidelLP. Fields that do not exist are left out and
 * the reason is given in `notes`.
 * @param ring from archRing
 * @param loads fill, plan and point loads (all optional)
 * @param solve LP solver (tests pass another to cross-check)
 * @returns thrust range (N per strip), reactions, t_min (m), gsf, hinges, λ, mechanism, safe
 * @example archLimit(archRing({shape: 'circular', radius: 5, half_angle: Math.PI / 2, thickness: 0.75, unit_weight: 2e4})).gsf // ≈ 1.40
 */
export function archLimit(ring: ArchRing, loads: ArchLoads = {}, solve: LpSolver = seidelLP): ArchLimit {
  checkLoads('arch_limit', ring, loads);
  const notes: string[] = [];
  const p = thrustProgram(ring, ring.thickness, loads);
  const hinges = (z: number[]): Hinge[] => touchingJoints(ring.joints, thrustState(p, z));
  const least = solve(admissibleProgram(p, [-1, 0, 0], false));
  let H_min, H_max, V_left, V_right, minHinges, load_factor, mechanism;
  if (least.feasible) {
    const s = thrustState(p, least.x);
    [H_min, V_left, V_right, minHinges] = [s.H, s.V, p.W + p.live - s.V, hinges(least.x)];
    const most = solve(admissibleProgram(p, [1, 0, 0], false));
    if (most.feasible && most.x[0]! < BOX / 2) H_max = thrustState(p, most.x).H;
    else notes.push('H_max is unbounded: a straight line of thrust fits within the ring');
  } else {
    notes.push('no line of thrust fits within the ring under these loads: it is not safe');
  }
  const t_min = minimumThickness(ring, loads, solve);
  if (t_min === undefined) notes.push('no thickness up to the span fits a line of thrust: gsf is set to 0');
  if (p.live > 0) {
    const collapse = solve(admissibleProgram(p, [0, 0, 0, 1], true));
    if (!collapse.feasible) notes.push('the ring cannot carry its dead loads alone: no load factor');
    else if (collapse.x[3]! >= LIVE_BOX / 2 || collapse.x.some((x) => Math.abs(x) >= BOX / 2)) notes.push('the live load never causes collapse: no load factor');
    else [load_factor, mechanism] = [thrustState(p, collapse.x).lambda, hinges(collapse.x)];
  }
  const result = {
    H_min, H_max, V_left, V_right, t_min,
    gsf: t_min === undefined ? 0 : ring.thickness / t_min,
    hinges: minHinges, load_factor, mechanism,
    safe: least.feasible,
    notes,
  };
  // Absent means absent: a document reading a.H_max then gets a clear error, not "undefined".
  return Object.fromEntries(Object.entries(result).filter(([, v]) => v !== undefined)) as unknown as ArchLimit;
}
