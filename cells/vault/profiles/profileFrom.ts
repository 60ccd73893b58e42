/**
 * One entry point for every vault profile: by clear span and rise, or by
 * crown radius and half-angle. Vault functions call these and nothing deeper.
 */
import type { Metres, Profile, Radians } from '../profile.js';
import { circular, circularFromRadius } from './circular.js';
import { pointed } from './pointed.js';
import { elliptical } from './elliptical.js';
import { parabolic, parabolicArc } from './parabolic.js';
import { catenary, catenaryArc } from './catenary.js';
import { cycloid, cycloidArc } from './cycloid.js';
import { power, powerArc, type CrownRadiusProfile } from './power.js';

export type { CrownRadiusProfile };

/** Profile families with a name. */
export type ProfileShape = 'circular' | 'pointed' | 'elliptical' | 'parabolic' | 'catenary' | 'cycloid';

/** Named members of the R(φ) = R0·cos^n φ family and their exponent n. */
export const PROFILE_EXPONENTS = Object.freeze({ circular: 0, cycloid: 1, catenary: -2, parabolic: -3 } as const);

export type CrownRadiusShape = keyof typeof PROFILE_EXPONENTS;

export const PROFILE_SHAPES: readonly ProfileShape[] = ['circular', 'pointed', 'elliptical', 'parabolic', 'catenary', 'cycloid'];

/** Does this profile carry R0 and n (so R(φ) = R0·cos^n φ in closed form)? */
export function isCrownRadiusProfile(p: Profile): p is CrownRadiusProfile {
  return typeof (p as CrownRadiusProfile).n === 'number' && typeof (p as CrownRadiusProfile).R0 === 'number';
}

function unknownShape(shape: unknown, known: readonly string[]): RangeError {
  return new RangeError(`profile: unknown shape ${JSON.stringify(shape)}; known shapes: ${known.join(', ')}, or an exponent n`);
}

/**
 * The profile of the given family with that clear span and rise.
 * @param shape a named family, or the exponent n of R0·cos^n φ
 * @param span clear span between springings (m)
 * @param rise rise from springing line to crown (m); optional only for 'pointed' (equilateral)
 * @returns the Profile; y is measured above its springing line
 * @example profileFromSpanRise('parabolic', 8, 2).radius(0) // 4
 */
export function profileFromSpanRise(shape: ProfileShape | number, span: Metres, rise?: Metres): Profile {
  if (typeof shape === 'number') return power(shape, span, rise as Metres);
  if (shape === 'pointed') return pointed(span, rise);
  if (rise === undefined) throw new RangeError(`${shape}: rise is required`);
  switch (shape) {
    case 'circular': return circular(span, rise);
    case 'elliptical': return elliptical(span, rise);
    case 'parabolic': return parabolic(span, rise);
    case 'catenary': return catenary(span, rise);
    case 'cycloid': return cycloid(span, rise);
    default: throw unknownShape(shape, PROFILE_SHAPES);
  }
}

/**
 * The R0·cos^n φ profile with crown radius R0 and springing angle halfAngle.
 * A number equal to a named exponent gives the named closed form.
 * @param shape 'circular' | 'cycloid' | 'catenary' | 'parabolic', or the exponent n
 * @param R0 radius of curvature at the crown (m)
 * @param halfAngle φ at the springing (rad): 90° for a semicircle; < 90° when n < 0
 * @returns the profile, with n and R0 attached
 * @example profileFromCrownRadius(-2, 3, 1).shape // 'catenary'
 */
export function profileFromCrownRadius(shape: CrownRadiusShape | number, R0: Metres, halfAngle: Radians): CrownRadiusProfile {
  const n = typeof shape === 'number' ? shape : PROFILE_EXPONENTS[shape];
  if (n === undefined) throw unknownShape(shape, Object.keys(PROFILE_EXPONENTS));
  switch (n) {
    case 0: return circularFromRadius(R0, halfAngle);
    case 1: return cycloidArc(R0, halfAngle);
    case -2: return catenaryArc(R0, halfAngle);
    case -3: return parabolicArc(R0, halfAngle);
    default: return powerArc(n, R0, halfAngle);
  }
}
