/**
 * Parabolic vault profile: R(φ) = R0 / cos³φ (n = −3).
 */
import type { Metres, Radians } from '../profile.js';
import type { CrownRadiusProfile } from './power.js';
import { degrees, requirePositive } from './positive.js';

/**
 * Parabola y = ys − x²/(2R0) from its crown radius. With tan φ = dy/dx
 * (in magnitude) = x/R0: x = R0 tan φ, drop from the crown R0 tan²φ/2,
 * R = R0 sec³φ, and the arc length is the standard integral
 * s = (R0/2)(sec φ tan φ + ln(sec φ + tan φ)) (any calculus table).
 * @param R0 radius of curvature at the crown (m)
 * @param phiSpringing φ at the springing (rad), below 90°
 * @returns the profile (n = −3)
 * @example parabolicArc(4, Math.atan(1)).point(0) // {x: 0, y: 2}
 */
export function parabolicArc(R0: Metres, phiSpringing: Radians): CrownRadiusProfile {
  requirePositive('parabolic', 'R0', R0, 'm');
  requirePositive('parabolic', 'half_angle', phiSpringing, 'rad');
  if (phiSpringing >= Math.PI / 2) {
    throw new RangeError(`parabolic: half_angle must be below 90°, got ${degrees(phiSpringing)}`);
  }
  const ts = Math.tan(phiSpringing);
  return {
    shape: 'parabolic', n: -3, R0, phiCrown: 0, phiSpringing,
    point: (phi) => ({ x: R0 * Math.tan(phi), y: (R0 * (ts * ts - Math.tan(phi) ** 2)) / 2 }),
    radius: (phi) => R0 / Math.cos(phi) ** 3,
    arcLength: (phi) => (R0 / 2) * (Math.tan(phi) / Math.cos(phi) + Math.asinh(Math.tan(phi))),
  };
}

/**
 * Parabola y = 4f·x(L − x)/L² (x from a springing) with clear span L and rise f:
 * R0 = L²/(8f), tan φs = 4f/L.
 * @param span clear span L (m)
 * @param rise rise f (m)
 * @returns the profile
 * @example parabolic(8, 2).R0 // 4
 */
export function parabolic(span: Metres, rise: Metres): CrownRadiusProfile {
  requirePositive('parabolic', 'span', span, 'm');
  requirePositive('parabolic', 'rise', rise, 'm');
  return parabolicArc((span * span) / (8 * rise), Math.atan((4 * rise) / span));
}
