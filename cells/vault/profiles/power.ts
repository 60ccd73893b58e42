/**
 * The R(φ) = R0·cos^n φ family of vault profiles: n = 0 circle, 1 cycloid,
 * −2 catenary, −3 parabola, and any other real n between or beyond them.
 */
import type { Metres, Profile, Radians } from '../profile.js';
import { integrate } from './integrate.js';
import { findRoot } from './root.js';
import { degrees, requirePositive } from './positive.js';

/** A profile whose radius of curvature is R0·cos^n φ (φ = inclination of the normal). */
export interface CrownRadiusProfile extends Profile {
  /** Exponent n of R(φ) = R0·cos^n φ. */
  readonly n: number;
  /** Radius of curvature at the crown (m). */
  readonly R0: Metres;
}

/** Height of the crown above the point at φ, per unit R0: ∫ cos^n t sin t dt = (1 − cos^(n+1) φ)/(n + 1). */
function dropPerR0(n: number, phi: Radians): number {
  const m = n + 1, lnc = Math.log(Math.cos(phi));
  // −expm1(m·ln c)/m keeps its accuracy as m → 0, where it tends to −ln cos φ.
  return m === 0 ? -lnc : -Math.expm1(m * lnc) / m;
}

/** Horizontal distance from the crown axis per unit R0: ∫ cos^(n+1) t dt. */
function abscissaPerR0(n: number, phi: Radians): number {
  return integrate((t) => Math.cos(t) ** (n + 1), 0, phi);
}

/**
 * Profile with R(φ) = R0·cos^n φ, built by integrating dx = R cos φ dφ and
 * dy = −R sin φ dφ from the crown (the intrinsic equation of a plane curve,
 * φ being the tangent angle; e.g. Lamb, An Elementary Course of Infinitesimal
 * Calculus, ch. on curvature — from memory).
 * @param n exponent (any finite real)
 * @param R0 radius of curvature at the crown (m)
 * @param phiSpringing φ at the springing (rad): ≤ π/2 when n ≥ 0, < π/2 when n < 0
 * @returns the profile, with y above its springing line
 * @example powerArc(-2, 3, 1).radius(1) // 3 / cos²(1) — a catenary
 */
export function powerArc(n: number, R0: Metres, phiSpringing: Radians): CrownRadiusProfile {
  if (!Number.isFinite(n)) throw new RangeError(`power: n must be a finite number, got ${n}`);
  requirePositive('power', 'R0', R0, 'm');
  requirePositive('power', 'half_angle', phiSpringing, 'rad');
  // Is the springing reachable? For n < 0 the radius (n > −1) or the height (n ≤ −1) is infinite at 90°.
  if (n >= 0 ? phiSpringing > Math.PI / 2 : phiSpringing >= Math.PI / 2) {
    throw new RangeError(`power: half_angle must be ${n >= 0 ? 'at most' : 'below'} 90° for n = ${n}, got ${degrees(phiSpringing)}`);
  }
  const ySpringing = R0 * dropPerR0(n, phiSpringing);
  return {
    shape: 'power', n, R0, phiCrown: 0, phiSpringing,
    point: (phi) => ({ x: R0 * abscissaPerR0(n, phi), y: ySpringing - R0 * dropPerR0(n, phi) }),
    radius: (phi) => R0 * Math.cos(phi) ** n,
    arcLength: (phi) => R0 * integrate((t) => Math.cos(t) ** n, 0, phi),
  };
}

/**
 * The R0·cos^n φ profile with the given clear span and rise. The chord slope
 * from the crown, drop(φ)/x(φ), grows monotonically with φ on a convex curve,
 * so φ at the springing is found by bisection and R0 then follows from the rise.
 * @param n exponent
 * @param span clear span (m)
 * @param rise rise (m)
 * @returns the profile
 * @example power(-3, 8, 2).R0 // 4 — the parabola L²/(8f)
 */
export function power(n: number, span: Metres, rise: Metres): CrownRadiusProfile {
  if (!Number.isFinite(n)) throw new RangeError(`power: n must be a finite number, got ${n}`);
  requirePositive('power', 'span', span, 'm');
  requirePositive('power', 'rise', rise, 'm');
  const target = (2 * rise) / span;
  const slope = (phi: Radians): number => (phi === 0 ? 0 : dropPerR0(n, phi) / abscissaPerR0(n, phi));
  const hi = n >= 0 ? Math.PI / 2 : Math.PI / 2 - 1e-9;
  if (slope(hi) < target) {
    throw new RangeError(`power: rise/span = ${rise / span} is more than the n = ${n} curve can reach (${slope(hi) / 2})`);
  }
  const phiS = findRoot((phi) => slope(phi) - target, 0, hi, 'power');
  return powerArc(n, rise / dropPerR0(n, phiS), phiS);
}
