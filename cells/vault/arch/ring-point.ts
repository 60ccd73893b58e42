import type { Metres, Point, Profile, Radians } from '../profile.js';

/**
 * A point of the ring at signed angle θ (negative on the left half) and
 * normal offset d from the centreline (outwards positive: −t/2 is the
 * intrados, +t/2 the extrados). The left half is the mirror image of the
 * right one, so its outward normal is (sin θ, cos θ) with θ < 0.
 * @param centreline the ring's centreline (right half, φ = |θ|)
 * @param theta signed inclination of the joint from the vertical (rad)
 * @param d offset along the outward normal (m)
 * @returns the point (m)
 * @example ringPoint(circularArc(5, Math.PI / 2), -Math.PI / 2, 0.25) // {x: -5.25, y: 0}
 */
export function ringPoint(centreline: Profile, theta: Radians, d: Metres): Point {
  const q = centreline.point(Math.abs(theta));
  const x = theta < 0 ? -q.x : q.x;
  return { x: x + d * Math.sin(theta), y: q.y + d * Math.cos(theta) };
}
