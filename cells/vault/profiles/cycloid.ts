/**
 * Cycloidal vault profile: R(φ) = R0·cos φ (n = 1), R0 = 4r with r the
 * radius of the generating circle.
 */
import type { Metres, Radians } from '../profile.js';
import type { CrownRadiusProfile } from './power.js';
import { findRoot } from './root.js';
import { degrees, requirePositive } from './positive.js';

/**
 * Inverted cycloid x = r(θ + sin θ), y = r(1 + cos θ) with the crown at θ = 0.
 * Its slope is tan(θ/2), so φ = θ/2: x = r(2φ + sin 2φ), height above the
 * cusps 2r·cos²φ, R = ds/dφ = 4r·cos φ, s = 4r·sin φ (standard results).
 * The full cycloid (φs = 90°) has span 2πr and rise 2r.
 * @param R0 radius of curvature at the crown, 4r (m)
 * @param phiSpringing φ at the springing (rad), at most 90°
 * @returns the profile (n = 1)
 * @example cycloidArc(4, Math.PI / 2).point(Math.PI / 2).x // π — half of 2πr with r = 1
 */
export function cycloidArc(R0: Metres, phiSpringing: Radians): CrownRadiusProfile {
  requirePositive('cycloid', 'R0', R0, 'm');
  requirePositive('cycloid', 'half_angle', phiSpringing, 'rad');
  if (phiSpringing > Math.PI / 2) {
    throw new RangeError(`cycloid: half_angle must be at most 90°, got ${degrees(phiSpringing)}`);
  }
  const r = R0 / 4, cs2 = Math.cos(phiSpringing) ** 2;
  return {
    shape: 'cycloid', n: 1, R0, phiCrown: 0, phiSpringing,
    point: (phi) => ({ x: r * (2 * phi + Math.sin(2 * phi)), y: 2 * r * (Math.cos(phi) ** 2 - cs2) }),
    radius: (phi) => R0 * Math.cos(phi),
    arcLength: (phi) => R0 * Math.sin(phi),
  };
}

/**
 * Cycloid with clear span L and rise f, cut off at φs where
 * f/(L/2) = 2 sin²φs / (2φs + sin 2φs); this ratio grows from 0 to 2/π at
 * φs = 90°, so rise/span cannot exceed 1/π (the full cycloid).
 * @param span clear span L (m)
 * @param rise rise f (m), at most L/π
 * @returns the profile
 * @example cycloid(2 * Math.PI, 2).R0 // 4
 */
export function cycloid(span: Metres, rise: Metres): CrownRadiusProfile {
  requirePositive('cycloid', 'span', span, 'm');
  requirePositive('cycloid', 'rise', rise, 'm');
  const target = (2 * rise) / span;
  const ratio = (phi: Radians): number => (phi === 0 ? 0 : (2 * Math.sin(phi) ** 2) / (2 * phi + Math.sin(2 * phi)));
  if (target > (2 / Math.PI) * (1 + 1e-12)) {
    throw new RangeError(`cycloid: rise must be at most span/π = ${span / Math.PI} m (the full cycloid), got ${rise} m`);
  }
  const phiS = target >= 2 / Math.PI ? Math.PI / 2 : findRoot((phi) => ratio(phi) - target, 0, Math.PI / 2, 'cycloid');
  return cycloidArc((4 * rise) / (2 * Math.sin(phiS) ** 2), phiS);
}
