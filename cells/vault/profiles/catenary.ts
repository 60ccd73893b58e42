/**
 * Catenary vault profile: R(φ) = a / cos²φ (n = −2), a = R0 the parameter.
 */
import type { Metres, Radians } from '../profile.js';
import type { CrownRadiusProfile } from './power.js';
import { findRoot } from './root.js';
import { degrees, requirePositive } from './positive.js';

/**
 * Inverted catenary y = ys + a − a·cosh(x/a). With sinh(x/a) = tan φ:
 * x = a·asinh(tan φ), y = ys + a − a·sec φ, R = a·sec²φ, s = a·tan φ
 * (standard results; the radius of y = a cosh(x/a) is y²/a).
 * @param a catenary parameter = radius of curvature at the crown (m)
 * @param phiSpringing φ at the springing (rad), below 90°
 * @returns the profile (n = −2)
 * @example catenaryArc(3, Math.PI / 4).radius(Math.PI / 4) // 6
 */
export function catenaryArc(a: Metres, phiSpringing: Radians): CrownRadiusProfile {
  requirePositive('catenary', 'R0', a, 'm');
  requirePositive('catenary', 'half_angle', phiSpringing, 'rad');
  if (phiSpringing >= Math.PI / 2) {
    throw new RangeError(`catenary: half_angle must be below 90°, got ${degrees(phiSpringing)}`);
  }
  const secS = 1 / Math.cos(phiSpringing);
  return {
    shape: 'catenary', n: -2, R0: a, phiCrown: 0, phiSpringing,
    point: (phi) => ({ x: a * Math.asinh(Math.tan(phi)), y: a * (secS - 1 / Math.cos(phi)) }),
    radius: (phi) => a / Math.cos(phi) ** 2,
    arcLength: (phi) => a * Math.tan(phi),
  };
}

/**
 * Catenary with clear span L and rise f. With u = L/(2a) the rise is
 * f = a(cosh u − 1), i.e. f/L = sinh²(u/2)/u, which increases monotonically
 * from 0 with u; u is bracketed by doubling and found by bisection.
 * @param span clear span L (m)
 * @param rise rise f (m)
 * @returns the profile
 * @example catenary(10, 5).point(0).y // 5
 */
export function catenary(span: Metres, rise: Metres): CrownRadiusProfile {
  requirePositive('catenary', 'span', span, 'm');
  requirePositive('catenary', 'rise', rise, 'm');
  const ratio = rise / span;
  const g = (u: number): number => (u === 0 ? 0 : Math.sinh(u / 2) ** 2 / u) - ratio;
  let hi = 1;
  while (g(hi) < 0) {
    hi *= 2;
    if (hi > 1400) throw new RangeError(`catenary: rise/span = ${ratio} is too large to represent`);
  }
  const u = findRoot(g, 0, hi, 'catenary');
  return catenaryArc(span / (2 * u), Math.atan(Math.sinh(u)));
}
