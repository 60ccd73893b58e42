import type { Point } from '../profile.js';
import type { Joint } from './types.js';
import type { ThrustState } from './thrust-state.js';

/**
 * The line of thrust drawn as the centres of pressure on the joints: where
 * each joint's resultant crosses it, at e_j along the joint's normal from its
 * mid-point (the thrust line of Heyman, The Stone Skeleton, 1995, ch. 2).
 * @param joints the ring's joints
 * @param s an equilibrium state
 * @returns one point per joint (m), left springing to right
 * @example thrustPoints(ring.joints, state)[0] // on the left springing joint
 */
export function thrustPoints(joints: readonly Joint[], s: ThrustState): Point[] {
  return joints.map((j, k) => {
    const e = s.joints[k]!.e;
    if (!Number.isFinite(e)) {
      throw new RangeError(`thrust_line: the thrust does not cross the joint at ${((j.angle * 180) / Math.PI).toFixed(1)}° (no compression there)`);
    }
    return { x: j.mid.x + e * j.u.x, y: j.mid.y + e * j.u.y };
  });
}
