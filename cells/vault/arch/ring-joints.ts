import type { Profile, Radians } from '../profile.js';
import type { Joint } from './types.js';
import { ringPoint } from './ring-point.js';

/**
 * The joints of a ring cut into voussoirs of equal centreline length, each
 * joint normal to the centreline, listed from the left springing to the right.
 * A smooth profile with an even count has a joint at the crown, an odd count a
 * keystone across it. A pointed profile (phiCrown > 0) gets n voussoirs per
 * half, split at ±phiCrown, and the keystone between those two joints.
 * @param centreline ring centreline in the ring frame
 * @param voussoirs voussoirs of the whole ring (per half for a pointed profile: voussoirs / 2, rounded)
 * @returns voussoirs + 1 joints (smooth) or 2·round(voussoirs/2) + 2 joints (pointed)
 * @example ringJoints(circularArc(5, Math.PI / 2), 2).map((j) => j.angle) // [-π/2, 0, π/2]
 */
export function ringJoints(centreline: Profile, voussoirs: number): Joint[] {
  const { phiCrown: a, phiSpringing: b } = centreline;
  const S = centreline.arcLength(b) - centreline.arcLength(a);
  const at = (s: number): Radians => angleAtArcLength(centreline, s);
  let angles: Radians[];
  if (a > 0) {
    const half = Math.max(1, Math.round(voussoirs / 2));
    const right = Array.from({ length: half + 1 }, (_, k) => at((S * k) / half));
    angles = [...right.map((t) => -t).reverse(), ...right];
  } else {
    angles = Array.from({ length: voussoirs + 1 }, (_, k) => {
      const s = -S + (2 * S * k) / voussoirs;
      return Math.sign(s) * at(Math.abs(s));
    });
  }
  return angles.map((angle) => ({
    angle,
    mid: ringPoint(centreline, angle, 0),
    u: { x: Math.sin(angle), y: Math.cos(angle) },
    n: { x: Math.cos(angle), y: -Math.sin(angle) },
  }));
}

/** φ at which the arc length from phiCrown equals s: Newton's method kept inside a bisection bracket. */
function angleAtArcLength(p: Profile, s: number): Radians {
  let lo = p.phiCrown;
  let hi = p.phiSpringing;
  const s0 = p.arcLength(lo);
  const target = s0 + s;
  if (s <= 0) return lo;
  if (target >= p.arcLength(hi)) return hi;
  let phi = lo + ((hi - lo) * s) / (p.arcLength(hi) - s0);
  for (let k = 0; k < 100; k++) {
    const g = p.arcLength(phi) - target;
    if (g > 0) hi = phi;
    else lo = phi;
    if (Math.abs(g) <= 1e-15 * (Math.abs(target) + 1)) break;
    const next = phi - g / p.radius(phi);
    phi = next > lo && next < hi ? next : (lo + hi) / 2;
    if (hi - lo <= 1e-16 * hi) break;
  }
  return phi;
}
