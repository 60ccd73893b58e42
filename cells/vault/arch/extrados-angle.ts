import type { Metres, Profile, Radians } from '../profile.js';
import { ringPoint } from './ring-point.js';

/**
 * The signed angle θ at which the ring's parallel curve at offset d (−t/2
 * intrados, +t/2 extrados) passes the vertical line x. Along the curve
 * x(θ) = ±X(|θ|) + d·sin θ rises with θ while |θ| < 90° (dx/dθ = (R + d)·cos θ),
 * so Newton's method inside a bisection bracket finds it.
 * @param c the ring's centreline (ring frame)
 * @param x the vertical line (m, from the crown axis)
 * @param d offset from the centreline (m)
 * @returns θ (rad), or null when x is off the curve or inside the keystone of a pointed ring
 * @example extradosAngle(circularArc(5, Math.PI / 2), 0, 0.25) // 0
 */
export function extradosAngle(c: Profile, x: Metres, d: Metres): Radians | null {
  const top = Math.min(c.phiSpringing, Math.PI / 2);
  const at = (th: number) => ringPoint(c, th, d).x;
  const key = c.phiCrown;
  // A pointed ring's curve starts at ±phiCrown: between those ends lies the keystone.
  if (key > 0 && at(-key) <= x && x <= at(key)) return null;
  let [lo, hi] = x >= (key > 0 ? at(key) : at(0)) ? [key, top] : [-top, -key];
  if (x < at(lo) - 1e-12 || x > at(hi) + 1e-12) return null;
  let th = (lo + hi) / 2;
  for (let k = 0; k < 100; k++) {
    const g = at(th) - x;
    if (Math.abs(g) <= 1e-13 * (1 + Math.abs(x))) return th;
    if (g > 0) hi = th;
    else lo = th;
    const slope = (c.radius(Math.abs(th)) + d) * Math.cos(th);
    const next = th - g / slope;
    th = slope > 0 && next > lo && next < hi ? next : (lo + hi) / 2;
    if (hi - lo < 1e-15) break;
  }
  return th;
}

/**
 * The angle at which the right half's parallel curve at offset d, continued
 * past its end if need be, meets the axis x = 0 (x rises with θ: bisection).
 * @param c centreline; d offset (m)
 * @returns θ (rad)
 * @example axisAngle(pointedCentreline, 0) // phiCrown
 */
export function axisAngle(c: Profile, d: Metres): number {
  let lo = 0;
  let hi = Math.PI / 2;
  for (let k = 0; k < 100; k++) {
    const mid = (lo + hi) / 2;
    if (ringPoint(c, mid, d).x < 0) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}
