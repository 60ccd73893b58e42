import type { Hinge, SlidingRatio } from './types.js';
import type { ThrustProgram } from './thrust-program.js';
import type { ThrustState } from './thrust-state.js';

/**
 * The hinges of a state: where its line of thrust touches the intrados or
 * extrados (Heyman, The Stone Skeleton, 1995, ch. 3: four for a mechanism of
 * a fixed arch, or three and a sliding joint; three for the least-thrust line
 * of a thicker ring; a symmetric state may show five). With many voussoirs
 * the line touches a face over a run of neighbouring sections; each run is
 * one hinge, placed at the section where the line goes deepest. A section
 * touches when e reaches its bound within 1e-6 of the half-thickness; with
 * finite strength the bound stands a/2 = N/(2·f_c·b) inside the face.
 * @param p the programme the state solves (sections, strength)
 * @param s an equilibrium state
 * @param x0 added to x (the kernel's frame has x = 0 on the crown axis; documents measure from the left springing)
 * @returns hinges, left to right: angle, face, point on the face (x, z), N and T there
 * @example touchingJoints(p, minState, span / 2).length // 3 for a semicircle thicker than t_min
 */
export function touchingJoints(p: ThrustProgram, s: ThrustState, x0 = 0): Hinge[] {
  const out: Hinge[] = [];
  let run: { j: number; face: 'intrados' | 'extrados'; depth: number } | null = null;
  const close = () => {
    if (!run) return;
    const sec = p.joints[run.j]!;
    const a = s.joints[run.j]!;
    const extrados = run.face === 'extrados';
    const off = extrados ? sec.up : -sec.down;
    out.push({
      angle: extrados ? sec.angleUp : sec.angleDown, face: run.face,
      x: sec.mid.x + off * sec.u.x + x0, z: sec.mid.y + off * sec.u.y, N: a.N, T: a.T,
    });
    run = null;
  };
  s.joints.forEach((a, j) => {
    const sec = p.joints[j]!;
    const block = Number.isFinite(p.fb) && a.N > 0 ? a.N / (2 * p.fb) : 0;
    const tol = 1e-6 * (sec.up + sec.down) / 2;
    const up = a.e - (sec.up - block);
    const down = -a.e - (sec.down - block);
    const face = up >= -tol ? 'extrados' : down >= -tol ? 'intrados' : null;
    if (face === null || !Number.isFinite(a.e)) return close();
    const depth = face === 'extrados' ? up : down;
    if (run && run.face !== face) close();
    if (!run) run = { j, face, depth };
    else if (depth > run.depth) run = { j, face, depth };
  });
  close();
  return out;
}

/**
 * The largest ratio |T|/N of tangential to normal force over the joints of a
 * state (vertical cuts are not bed joints and are left out), and where.
 * @param p the programme; s the state; state a name for it; x0 as touchingJoints
 * @returns the worst joint
 * @example slidingRatio(p, s, 'least thrust', span / 2).ratio // tan of the resultant's angle to the joint normal
 */
export function slidingRatio(p: ThrustProgram, s: ThrustState, state: string, x0 = 0): SlidingRatio {
  let best = { ratio: -1, j: 0 };
  s.joints.forEach((a, j) => {
    if (p.joints[j]!.kind !== 'joint' || !(a.N > 0)) return;
    const ratio = Math.abs(a.T) / a.N;
    if (ratio > best.ratio) best = { ratio, j };
  });
  const sec = p.joints[best.j]!;
  return { state, ratio: Math.max(best.ratio, 0), angle: sec.angle, x: sec.mid.x + x0, z: sec.mid.y };
}
