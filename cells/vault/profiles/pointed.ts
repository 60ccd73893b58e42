/**
 * Two-centred pointed arch with both centres on the springing line.
 */
import type { Metres, Profile } from '../profile.js';
import { requirePositive } from './positive.js';

/**
 * Pointed (two-centred) profile. The right half is a circular arc whose centre
 * lies on the springing line a distance e to the LEFT of the crown axis, so
 * the two halves meet at the apex at an angle. From R = L/2 + e and
 * R² = e² + f²: e = (f² − L²/4)/L. Equilateral arch (the default): R = L,
 * e = L/2, f = L·√3/2. Drop arches have 0 < e < L/2, lancets e > L/2; f = L/2
 * is the semicircle. φ at the apex is phiCrown = asin(e/R) > 0; the tangent is
 * vertical at the springing (phiSpringing = 90°).
 * @param span clear span L (m)
 * @param rise rise f (m), at least L/2; default L·√3/2 (equilateral)
 * @returns the profile
 * @example pointed(6).radius(1) // 6 — equilateral: radius equals span
 */
export function pointed(span: Metres, rise: Metres = (span * Math.sqrt(3)) / 2): Profile {
  requirePositive('pointed', 'span', span, 'm');
  requirePositive('pointed', 'rise', rise, 'm');
  if (rise < (span / 2) * (1 - 1e-12)) {
    throw new RangeError(`pointed: rise must be at least span/2 = ${span / 2} m with centres on the springing line, got ${rise} m`);
  }
  const e = Math.max(0, (rise * rise - (span * span) / 4) / span);
  const R = span / 2 + e;
  const phiCrown = Math.asin(e / R);
  return {
    shape: 'pointed',
    phiCrown,
    phiSpringing: Math.PI / 2,
    point: (phi) => ({ x: -e + R * Math.sin(phi), y: R * Math.cos(phi) }),
    radius: () => R,
    arcLength: (phi) => R * (phi - phiCrown),
  };
}
