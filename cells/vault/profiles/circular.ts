/**
 * Circular vault profiles given by clear span and rise: segmental
 * (rise < span/2) or semicircular (rise = span/2).
 */
import { circularArc, type Metres } from '../profile.js';
import type { CrownRadiusProfile } from './power.js';
import { requirePositive } from './positive.js';

/**
 * Circular arc through both springings and the crown. Chord geometry (any
 * geometry text): R = (L²/4 + f²)/(2f); the half-angle is twice the slope
 * angle of the chord from springing to crown, φs = 2·atan(2f/L).
 * @param span clear span L (m)
 * @param rise rise f (m), at most L/2 (horseshoe arches are not supported)
 * @returns the profile (n = 0, R0 = R)
 * @example circular(8, 4).radius(0) // 4 — a semicircle
 */
export function circular(span: Metres, rise: Metres): CrownRadiusProfile {
  requirePositive('circular', 'span', span, 'm');
  requirePositive('circular', 'rise', rise, 'm');
  // Allow a rounding hair over L/2 so that rise = span/2 computed in a document is a semicircle.
  if (rise > (span / 2) * (1 + 1e-12)) {
    throw new RangeError(`circular: rise must be at most span/2 = ${span / 2} m (a semicircle), got ${rise} m`);
  }
  const R = (span * span) / 4 / (2 * rise) + rise / 2;
  const phiS = Math.min(2 * Math.atan((2 * rise) / span), Math.PI / 2);
  return { ...circularArc(R, phiS), n: 0, R0: R };
}

/**
 * Circular arc given by its radius and half-angle, tagged as a member of the
 * R0·cos^n φ family (n = 0).
 * @param R radius (m)
 * @param phiSpringing half-angle (rad), π/2 for a semicircle
 * @returns the profile
 * @example circularFromRadius(4, Math.PI / 3).point(Math.PI / 3) // {x: 3.46…, y: 0}
 */
export function circularFromRadius(R: Metres, phiSpringing: number): CrownRadiusProfile {
  return { ...circularArc(R, phiSpringing), n: 0, R0: R };
}
