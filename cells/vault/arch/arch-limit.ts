import type { ArchLimit, ArchLoads, ArchRing, Hinge } from './types.js';
import { seidelLP, type LpSolver } from './seidel-lp.js';
import { admissibleProgram, BOX, LIVE_BOX } from './admissible-program.js';
import { thrustProgram } from './thrust-program.js';
import { thrustState } from './thrust-state.js';
import { touchingJoints } from './touching-joints.js';
import { minimumThickness } from './minimum-thickness.js';
import { checkLoads } from './check-loads.js';
import { notAvailable } from '../../not-available.js';

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
 * All solved exactly by seidelLP. Every field is returned: an unbounded one
 * (H_max, load_factor) is Infinity, one that does not exist is notAvailable
 * with the reason, which `notes` also gives.
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
  let noLambda = p.live > 0 ? undefined : notAvailable('no live or point load is given to scale');
  if (p.live > 0) {
    const collapse = solve(admissibleProgram(p, [0, 0, 0, 1], true));
    if (!collapse.feasible) {
      notes.push('the ring cannot carry its dead loads alone: no load factor');
      noLambda = notAvailable('the ring cannot carry its dead loads alone');
    } else if (collapse.x[3]! >= LIVE_BOX / 2 || collapse.x.some((x) => Math.abs(x) >= BOX / 2)) notes.push('the live load never causes collapse: load_factor is ∞');
    else [load_factor, mechanism] = [thrustState(p, collapse.x).lambda, hinges(collapse.x)];
  }
  const gsf = t_min === undefined ? 0 : ring.thickness / t_min;
  // Every field is always returned: unbounded is Infinity, what does not exist says why.
  const unsafe = notAvailable(`the ring holds no line of thrust (gsf ${gsf.toFixed(2)} < 1)`);
  return {
    H_min: H_min ?? unsafe, H_max: H_max ?? (least.feasible ? Infinity : unsafe),
    V_left: V_left ?? unsafe, V_right: V_right ?? unsafe,
    t_min: t_min ?? notAvailable('no thickness up to the span fits a line of thrust'),
    gsf,
    hinges: minHinges ?? unsafe,
    load_factor: load_factor ?? noLambda ?? Infinity,
    mechanism: mechanism ?? noLambda ?? notAvailable('the live load never causes collapse: there is no mechanism'),
    safe: least.feasible,
    notes,
  };
}
