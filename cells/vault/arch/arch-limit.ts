import type { ArchLimit, ArchLoads, ArchRing, Hinge, SlidingRatio } from './types.js';
import { seidelLP, type LpSolver } from './seidel-lp.js';
import { solveAdmissible, BOX, LIVE_BOX, type Admissible } from './admissible-program.js';
import { thrustProgram, type ThrustProgram } from './thrust-program.js';
import { thrustState, type ThrustState } from './thrust-state.js';
import { touchingJoints, slidingRatio } from './touching-joints.js';
import { minimumThickness } from './minimum-thickness.js';
import { checkLoads } from './check-loads.js';
import { liveActions } from './live-actions.js';
import { notAvailable, type NotAvailable } from '../../not-available.js';

/** The collapse state of a programme: λ (Infinity when it never collapses), its hinges, and what limits it. */
export interface Collapse {
  load_factor: number | NotAvailable;
  mechanism: Hinge[] | NotAvailable;
  governs: string | NotAvailable;
  state?: ThrustState;
  rounds: number;
  /** λ with uncrushable blocks, when finite strength was given. */
  lambdaRigid?: number;
}

/**
 * The collapse multiplier of a programme: the largest λ on the live and
 * point loads for which an admissible line of thrust exists (by the
 * uniqueness theorem, the collapse load factor), its mechanism, and what
 * governs: 'sliding' when a friction row binds at the optimum, else
 * 'crushing' when finite strength is given and the rigid ring would never
 * collapse or the stress blocks lower λ by more than 5 %, else 'hinges'
 * (the notes give both λ whenever f_c is given).
 * @param p the programme at the ring as built
 * @param solve LP solver
 * @param x0 the left springing's x in the kernel frame, negated (span / 2)
 * @param judge find what governs (with f_c this solves the rigid programme too); false: λ and mechanism only
 * @returns λ, mechanism, governs
 * @example collapse(thrustProgram(ring, ring.thickness, {P: 5e4, P_at: 2}), seidelLP, ring.span / 2).load_factor
 */
export function collapse(p: ThrustProgram, solve: LpSolver, x0: number, judge = true): Collapse {
  if (!(p.live > 0)) {
    const why = 'there is no live or point load for λ to multiply';
    return { load_factor: notAvailable(why), mechanism: notAvailable(why), governs: notAvailable(why), rounds: 0 };
  }
  const r: Admissible = solveAdmissible(p, [0, 0, 0, 1], { lambdaFree: true }, solve);
  if (!r.feasible) {
    const why = 'the ring cannot carry its permanent loads alone';
    return { load_factor: notAvailable(why), mechanism: notAvailable(why), governs: notAvailable(why), rounds: r.rounds };
  }
  if (r.x[3]! >= LIVE_BOX / 2 || r.x.some((x) => Math.abs(x) >= BOX / 2)) {
    const why = 'the live load never causes collapse (λ is unbounded)';
    return { load_factor: Infinity, mechanism: notAvailable(why), governs: notAvailable(why), rounds: r.rounds };
  }
  const state = thrustState(p, r.x, true);
  const mechanism = touchingJoints(p, state, x0);
  let governs = 'hinges';
  let lambdaRigid: number | undefined;
  if (!judge) return { load_factor: state.lambda, mechanism, governs: notAvailable('not judged'), state, rounds: r.rounds };
  if (Number.isFinite(p.mu) && slidingBinds(p, state)) governs = 'sliding';
  else if (Number.isFinite(p.fb)) {
    const rigid = solveAdmissible({ ...p, fb: Infinity }, [0, 0, 0, 1], { lambdaFree: true }, solve);
    lambdaRigid = rigid.feasible && rigid.x[3]! < LIVE_BOX / 2 ? thrustState(p, rigid.x, true).lambda : Infinity;
    // Crushing governs where the rigid ring would never collapse, or where the stress blocks cost more than 5 %.
    if (state.lambda < 0.95 * lambdaRigid) governs = 'crushing';
    return { load_factor: state.lambda, mechanism, governs, state, rounds: r.rounds, lambdaRigid };
  }
  return { load_factor: state.lambda, mechanism, governs, state, rounds: r.rounds };
}

function slidingBinds(p: ThrustProgram, s: ThrustState): boolean {
  return s.joints.some((a, j) => p.joints[j]!.kind === 'joint' && a.N > 0 && Math.abs(a.T) >= p.mu * a.N * (1 - 1e-6));
}

/**
 * Limit analysis of a masonry ring (Heyman, "The stone skeleton", Int. J.
 * Solids Struct. 2, 1966): no tensile strength; unlimited compressive
 * strength and no sliding unless the ring gives f_c or friction. By the safe
 * theorem the ring stands if some line of thrust in equilibrium with the
 * loads lies within it; the set of such lines is a polytope in (H, V, M0), so
 * - H_min / H_max: least and greatest horizontal thrust (LPs in 3 unknowns);
 * - t_min, gsf = t / t_min: geometric factor of safety, by the ring's gsf_definition;
 * - load_factor: the largest multiplier λ on live and point loads, with the
 *   hinges of the mechanism and what governs it.
 * Every field is always present: Infinity where unbounded, NotAvailable with
 * the reason where the quantity does not exist.
 * @param ring from archRing
 * @param loads fill, plan and point loads (all optional)
 * @param solve LP solver (tests pass another to cross-check)
 * @returns thrust range (N per strip), reactions, t_min (m), gsf, hinges, λ, mechanism, stresses, sliding ratios, safe
 * @example archLimit(archRing({shape: 'circular', radius: 5, half_angle: Math.PI / 2, thickness: 0.75, unit_weight: 2e4})).gsf
 */
export function archLimit(ring: ArchRing, loads: ArchLoads = {}, solve: LpSolver = seidelLP): ArchLimit {
  checkLoads('arch_limit', ring, loads);
  const notes: string[] = [];
  const x0 = ring.span / 2;
  const p = thrustProgram(ring, ring.thickness, loads);
  const sliding: SlidingRatio[] = [];
  const least = solveAdmissible(p, [-1, 0, 0], {}, solve);
  const slides = least.feasible ? undefined : frictionBlocks(ring, loads, p, solve, x0);
  // Where friction alone bars every line, t_min and gsf are the geometric ones (without the friction limit), and the notes say so.
  const t_min = slides ? slides.t_min : minimumThickness(ring, loads, solve);
  const gsf = t_min === undefined ? 0 : ring.thickness / t_min;
  const unsafe = slides ? `friction makes the ring inadmissible: without the friction limit a line of thrust fits, but ${slides.why}`
    : `the ring holds no line of thrust (gsf ${gsf.toFixed(2)} < 1)`;
  if (slides) {
    sliding.push(slides.ratio);
    notes.push(slides.t_min === undefined ? 'without the friction limit no thickness up to the span fits either: gsf is set to 0'
      : `t_min and gsf (${gsf.toFixed(2)}) are geometric, without the friction limit: with μ = ${ring.friction} no thickness makes the ring safe here`);
  }
  let H_min: number | NotAvailable = notAvailable(unsafe);
  let H_max: number | NotAvailable = notAvailable(unsafe);
  let V_left: number | NotAvailable = notAvailable(unsafe);
  let V_right: number | NotAvailable = notAvailable(unsafe);
  let hinges: Hinge[] | NotAvailable = notAvailable(unsafe);
  let sigma_max: number | NotAvailable = notAvailable(Number.isFinite(p.fb) ? unsafe
    : 'no compressive strength f_c given in arch_ring: the blocks are taken as uncrushable');
  let sigma_max_at: number | NotAvailable = sigma_max;
  if (least.feasible && Number.isFinite(p.fb)) [sigma_max, sigma_max_at] = leastPeakStress(p, solve, ring.depth, x0);
  if (least.feasible) {
    const s = thrustState(p, least.x, false);
    [H_min, V_left, V_right] = [s.H, s.V, p.W + p.live - s.V];
    hinges = touchingJoints(p, s, x0);
    sliding.push(slidingRatio(p, s, 'least thrust', x0));
    const most = solveAdmissible(p, [1, 0, 0], {}, solve);
    if (most.feasible && most.x[0]! < BOX / 2) {
      const g = thrustState(p, most.x, false);
      H_max = g.H;
      sliding.push(slidingRatio(p, g, 'greatest thrust', x0));
    } else {
      H_max = Infinity;
      notes.push('H_max is unbounded: a straight line of thrust fits within the ring');
    }
    if (symmetricFive(hinges, ring.span)) notes.push('the least-thrust state is symmetric and shows five hinges (a pair on each side and one at the crown); four suffice for a mechanism, a symmetric state may show five');
  } else {
    notes.push(`${unsafe}: it is not safe`);
  }
  if (t_min === undefined && !slides) notes.push('no thickness up to the span fits a line of thrust: gsf is set to 0');
  const c = collapse(p, solve, x0);
  if (c.state) sliding.push(slidingRatio(p, c.state, 'collapse', x0));
  if (c.lambdaRigid !== undefined && c.state) {
    const drop = Number.isFinite(c.lambdaRigid) ? `λ ${c.lambdaRigid.toPrecision(4)} with uncrushable blocks, ${c.state.lambda.toPrecision(4)} with f_c` : `λ unbounded with uncrushable blocks, ${c.state.lambda.toPrecision(4)} with f_c`;
    notes.push(c.governs === 'crushing' ? `crushing governs the load factor: ${drop}` : `finite strength: ${drop}`);
  }
  if (c.governs === 'sliding') notes.push('sliding governs the load factor: a joint reaches |T| = μ·N at collapse');
  if (Array.isArray(c.mechanism) && symmetricFive(c.mechanism, ring.span)) notes.push('the collapse state is symmetric and shows five hinges');
  return {
    H_min, H_max, V_left, V_right,
    t_min: t_min === undefined ? notAvailable('no thickness up to the span holds a line of thrust') : t_min,
    gsf,
    gsf_definition: GSF_TEXT[ring.gsf_definition ?? 'loads_as_built'],
    hinges, load_factor: c.load_factor, mechanism: c.mechanism, governs: c.governs,
    sigma_max, sigma_max_at, sliding,
    load_spread: liveActions(ring, loads).spread,
    safe: least.feasible,
    notes,
  };
}

/**
 * When the ring holds no line of thrust with its friction limit but does without it: the joint where the
 * least-thrust line without friction needs the most friction (|T|/N against μ), and t_min without friction.
 * Undefined when friction is not what bars the ring.
 */
function frictionBlocks(ring: ArchRing, loads: ArchLoads, p: ThrustProgram, solve: LpSolver, x0: number):
  { why: string; ratio: SlidingRatio; t_min: number | undefined } | undefined {
  if (!Number.isFinite(p.mu)) return undefined;
  const free = solveAdmissible({ ...p, mu: Infinity }, [-1, 0, 0], {}, solve);
  if (!free.feasible) return undefined;
  const ratio = slidingRatio(p, thrustState(p, free.x, false), 'least thrust without friction', x0);
  const deg = (ratio.angle * 180) / Math.PI;
  const why = `the least-thrust line needs |T|/N = ${ratio.ratio.toFixed(3)} at the joint at ${deg.toFixed(1)}° (x = ${ratio.x.toFixed(3)} m), more than μ = ${p.mu}: the joints there would slide`;
  return { why, ratio, t_min: minimumThickness(Object.create(ring, { friction: { value: Infinity, enumerable: true } }) as ArchRing, loads, solve) };
}

/** The sheet's words for each definition of the geometric factor of safety. */
export const GSF_TEXT = {
  loads_as_built: "loads as built (Heyman): the ring's bounds shrink about the centreline, every load stays as built",
  ring_scaled: 'ring scaled: the ring shrinks about its centreline with its self-weight, fill replacing the masonry removed',
} as const;

/** Five hinges placed symmetrically about the crown. */
function symmetricFive(h: readonly Hinge[], span: number): boolean {
  if (h.length !== 5) return false;
  return h.every((a, i) => Math.abs(a.x + h[4 - i]!.x - span) < 1e-3 * span && a.face === h[4 - i]!.face);
}

/**
 * The least peak stress with which the loads can be carried: the smallest
 * strength f for which an admissible line of thrust with stress blocks of
 * depth N/(f·b) exists (bisection on log f, to 1e-4, between 0 and f_c), and
 * the joint where the block of that line is fullest.
 */
function leastPeakStress(p: ThrustProgram, solve: LpSolver, b: number, x0: number): [number, number] {
  const fits = (f: number) => solveAdmissible({ ...p, fb: f * b }, [-1, 0, 0], {}, solve);
  let hi = p.fb / b;
  let lo = hi / 4;
  let best = fits(hi);
  let probe = fits(lo);
  while (probe.feasible && lo > 1) {
    [hi, best] = [lo, probe];
    lo /= 4;
    probe = fits(lo);
  }
  while (hi / lo > 1 + 1e-4) {
    const mid = Math.sqrt(lo * hi);
    const r = fits(mid);
    if (r.feasible) [hi, best] = [mid, r];
    else lo = mid;
  }
  if (!best.feasible) return [hi, 0];
  const state = thrustState({ ...p, fb: hi * b }, best.x, false);
  return [hi, highestStress(p, state, x0, b)[1]];
}

/** The highest mean stress of a stress block centred on the resultant, N / (b·2·distance to the nearer face), and where. */
function highestStress(p: ThrustProgram, s: ThrustState, x0: number, b: number): [number, number] {
  let best = { sigma: 0, x: 0 };
  s.joints.forEach((a, j) => {
    const sec = p.joints[j]!;
    if (!(a.N > 0)) return;
    const room = Math.min(sec.up - a.e, sec.down + a.e);
    const sigma = room > 0 ? a.N / (2 * room * b) : Infinity;
    if (sigma > best.sigma) best = { sigma, x: sec.mid.x + a.e * sec.u.x + x0 };
  });
  return [best.sigma, best.x];
}
