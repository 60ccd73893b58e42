import type { Hinge, Joint } from './types.js';
import type { ThrustState } from './thrust-state.js';

/**
 * The joints where a thrust line touches the intrados or extrados — the
 * hinges of the state (Heyman, The Stone Skeleton, 1995, ch. 3: at least
 * four for a mechanism of a fixed arch, three for the minimum-thrust line of
 * a thicker one). A joint touches when |e| reaches t/2 within 1e-6·t/2, far
 * finer than the change of e between neighbouring joints.
 * @param joints the ring's joints
 * @param s an equilibrium state
 * @returns hinges, left to right: signed angle (rad) and face
 * @example touchingJoints(ring.joints, minState) // [{angle: -0.95, face: 'intrados'}, {angle: 0, face: 'extrados'}, …]
 */
export function touchingJoints(joints: readonly Joint[], s: ThrustState): Hinge[] {
  const limit = (s.t / 2) * (1 - 1e-6);
  const out: Hinge[] = [];
  s.joints.forEach((a, j) => {
    if (Math.abs(a.e) >= limit) out.push({ angle: joints[j]!.angle, face: a.e > 0 ? 'extrados' : 'intrados' });
  });
  return out;
}
