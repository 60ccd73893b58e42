import type { Point } from '../profile.js';
import type { ArchLoads, ArchRing } from './types.js';
import { seidelLP } from './seidel-lp.js';
import { solveAdmissible, LIVE_BOX } from './admissible-program.js';
import { axisAngle } from './extrados-angle.js';
import { thrustProgram } from './thrust-program.js';
import { thrustState } from './thrust-state.js';
import { thrustPoints } from './thrust-points.js';
import { ringPoint } from './ring-point.js';
import { checkLoads } from './check-loads.js';

/** What a figure of a ring needs, in metres in the ring's frame (y above the intrados springing). */
export interface ArchFigure {
  intrados: Point[];
  extrados: Point[];
  joints: { intrados: Point; extrados: Point }[];
  /** Lines of thrust of the minimum- and maximum-thrust states; absent when none fits. */
  thrust_min?: Point[];
  thrust_max?: Point[];
  /** Line of thrust at collapse (λ times the live loads); absent without live loads or when λ is unbounded. */
  thrust_collapse?: Point[];
}

/**
 * Outline, joints and the two extreme lines of thrust of a ring, for
 * drawing: the faces sampled four times per voussoir, every joint as a
 * segment, and the centres of pressure of the least- and greatest-thrust
 * states and of the collapse state (as arch_limit finds them).
 * @param ring the ring
 * @param loads loads, as for arch_limit
 * @returns points in m
 * @example archFigure(ring, {}).joints.length // ring.joints.length
 */
export function archFigure(ring: ArchRing, loads: ArchLoads = {}): ArchFigure {
  checkLoads('arch_figure', ring, loads);
  const { centreline: c, joints, thickness: t } = ring;
  const face = (d: number): Point[] => {
    const pts: Point[] = [];
    joints.forEach((j, k) => {
      if (k === 0) return void pts.push(ringPoint(c, j.angle, d));
      const a = joints[k - 1]!.angle;
      if (a < 0 && j.angle > 0 && c.phiCrown > 0) {
        // Keystone of a pointed ring: each half's face continued along its own arc to the axis.
        const top = axisAngle(c, d);
        for (let s = 0; s <= 8; s++) {
          const th = j.angle + ((top - j.angle) * s) / 8;
          if (th < j.angle) pts.push(ringPoint(c, -th, d));
        }
        pts.push({ x: 0, y: ringPoint(c, top, d).y });
        for (let s = 8; s >= 0; s--) {
          const th = j.angle + ((top - j.angle) * s) / 8;
          if (th < j.angle) pts.push(ringPoint(c, th, d));
        }
      } else {
        for (let s = 1; s < 4; s++) pts.push(ringPoint(c, a + ((j.angle - a) * s) / 4, d));
      }
      pts.push(ringPoint(c, j.angle, d));
    });
    // The intrados of a pointed ring overhangs the axis at the keystone joints: each half stops at the axis.
    const half = Math.floor(pts.length / 2);
    return c.phiCrown > 0 ? pts.filter((p, i) => (i < half ? p.x <= 1e-12 : p.x >= -1e-12) || Math.abs(p.x) < 1e-12) : pts;
  };
  const out: ArchFigure = {
    intrados: face(-t / 2),
    extrados: face(t / 2),
    joints: joints.map((j) => ({ intrados: ringPoint(c, j.angle, -t / 2), extrados: ringPoint(c, j.angle, t / 2) })),
  };
  const p = thrustProgram(ring, t, loads);
  const least = solveAdmissible(p, [-1, 0, 0], {}, seidelLP);
  const most = solveAdmissible(p, [1, 0, 0], {}, seidelLP);
  if (least.feasible) out.thrust_min = thrustPoints(p.joints, thrustState(p, least.x, false));
  if (most.feasible) out.thrust_max = thrustPoints(p.joints, thrustState(p, most.x, false));
  if (p.live > 0) {
    const c = solveAdmissible(p, [0, 0, 0, 1], { lambdaFree: true }, seidelLP);
    if (c.feasible && c.x[3]! < LIVE_BOX / 2) out.thrust_collapse = thrustPoints(p.joints, thrustState(p, c.x, true));
  }
  return out;
}
