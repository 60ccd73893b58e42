/**
 * Barrel vault by membrane theory: options in, summary out.
 */
import { offsetProfile, type Metres, type Profile, type Radians } from './profile.js';
import { profileFromCrownRadius, profileFromSpanRise, PROFILE_EXPONENTS, type CrownRadiusProfile } from './profiles/profileFrom.js';
import { degrees, requirePositive } from './profiles/positive.js';
import { radiusLaw, type RadiusLaw } from './membrane-radius.js';
import { membraneSummary, type BarrelMembrane } from './membrane-summary.js';

export type { BarrelMembrane };

/** Options of barrel_membrane (SI). Messages use the document's names: half_angle, unit_weight. */
export interface BarrelMembraneOptions {
  /** 'circular' | 'catenary' | 'parabolic' | 'cycloid' | 'power', or the exponent n of R0·cos^n φ. */
  shape?: string | number;
  span?: Metres; rise?: Metres;
  R0?: Metres; n?: number; halfAngle?: Radians;
  length?: Metres;
  thickness?: Metres; unitWeight?: number; g?: number; p?: number;
}

const F = 'barrel_membrane';

function exponent(o: BarrelMembraneOptions): number {
  const named = typeof o.shape === 'string' && o.shape !== 'power' ? (PROFILE_EXPONENTS as Record<string, number>)[o.shape] : undefined;
  if (typeof o.shape === 'string' && o.shape !== 'power' && named === undefined) {
    throw new RangeError(`${F}: shape must be one of ${Object.keys(PROFILE_EXPONENTS).join(', ')}, power, or an exponent n; got "${o.shape}"`);
  }
  const n = typeof o.shape === 'number' ? o.shape : named ?? o.n;
  if (n === undefined) throw new RangeError(`${F}: give shape (${Object.keys(PROFILE_EXPONENTS).join(', ')}) or the exponent n`);
  if (!Number.isFinite(n)) throw new RangeError(`${F}: n must be a finite number, got ${n}`);
  if (o.n !== undefined && o.n !== n) throw new RangeError(`${F}: shape "${o.shape}" has n = ${n}, but n = ${o.n} was given`);
  return n;
}

/** Middle surface and its radius law, from span + rise (intrados) or R0 + half_angle (middle surface). */
function geometry(o: BarrelMembraneOptions, n: number): { middle: Profile; law: RadiusLaw } {
  const bySpan = o.span !== undefined || o.rise !== undefined, byRadius = o.R0 !== undefined || o.halfAngle !== undefined;
  if (bySpan && byRadius) throw new RangeError(`${F}: give either span and rise, or R0 and half_angle, not both`);
  if (!bySpan && !byRadius) throw new RangeError(`${F}: give span and rise, or R0 and half_angle`);
  const t = o.thickness;
  const wrap = <T>(make: () => T): T => {
    try { return make(); } catch (e) { throw e instanceof RangeError ? new RangeError(`${F}: ${e.message}`) : e; }
  };
  if (bySpan) {
    requirePositive(F, 'span', o.span as number, 'm');
    requirePositive(F, 'rise', o.rise as number, 'm');
    const named = Object.entries(PROFILE_EXPONENTS).find(([, m]) => m === n)?.[0] as 'circular' | undefined;
    const intrados = wrap(() => profileFromSpanRise(named ?? n, o.span!, o.rise!) as CrownRadiusProfile);
    // The given span and rise are the intrados'; the middle surface lies t/2 outside it.
    return t === undefined ? { middle: intrados, law: radiusLaw(intrados) }
      : { middle: offsetProfile(intrados, t / 2), law: radiusLaw(intrados, t / 2) };
  }
  requirePositive(F, 'R0', o.R0 as number, 'm');
  requirePositive(F, 'half_angle', o.halfAngle as number, 'rad');
  const middle = wrap(() => profileFromCrownRadius(n, o.R0!, o.halfAngle!));
  if (t !== undefined) {
    // Does the intrados (middle surface − t/2) exist, i.e. is t/2 below the least radius of curvature?
    const Rmin = Math.min(middle.radius(0), middle.radius(middle.phiSpringing));
    if (t / 2 >= Rmin) throw new RangeError(`${F}: thickness ${t} m is at least twice the least radius of curvature of the middle surface (${Rmin} m); the intrados would fold`);
  }
  return { middle, law: radiusLaw(middle) };
}

/**
 * Membrane state of a barrel vault between two end walls (diaphragms) on two
 * lateral walls, under self-weight and a uniform plan load; see
 * membraneField for the theory and membraneSummary for the reactions.
 * Profile: span + rise are the clear span and rise of the INTRADOS, and the
 * middle surface is its offset by t/2 when the thickness is given (else the
 * curve itself); R0 + half_angle give the middle surface directly. Self-weight:
 * g per unit middle-surface area, or thickness × unit_weight (exact for a
 * cylinder: the volume between offsets ±t/2 is t per unit middle surface).
 * @param o options (SI): shape or n, span+rise or R0+halfAngle, length, g or thickness+unitWeight, p
 * @returns the summary, compression negative
 * @example barrelMembrane({shape: 'circular', R0: 4, halfAngle: Math.PI / 2, length: 12, g: 2160}).N_phi_crown // −8640
 */
export function barrelMembrane(o: BarrelMembraneOptions): BarrelMembrane {
  const n = exponent(o);
  if (o.length === undefined) throw new RangeError(`${F}: length (distance between the end walls) is required`);
  requirePositive(F, 'length', o.length, 'm');
  if (o.thickness !== undefined) requirePositive(F, 'thickness', o.thickness, 'm');
  if (o.unitWeight !== undefined) requirePositive(F, 'unit_weight', o.unitWeight, 'N/m^3');
  if (o.g !== undefined && o.unitWeight !== undefined) throw new RangeError(`${F}: give the self-weight either as g or as thickness × unit_weight, not both`);
  if (o.unitWeight !== undefined && o.thickness === undefined) throw new RangeError(`${F}: unit_weight needs thickness for the self-weight`);
  if (o.g === undefined && o.unitWeight === undefined && o.p === undefined) {
    throw new RangeError(`${F}: no load given: set g, or thickness and unit_weight, and/or p`);
  }
  if (o.g !== undefined && !(Number.isFinite(o.g) && o.g >= 0)) throw new RangeError(`${F}: g must be zero or positive, got ${o.g} Pa`);
  if (o.p !== undefined && !(Number.isFinite(o.p) && o.p >= 0)) throw new RangeError(`${F}: p must be zero or positive, got ${o.p} Pa`);
  const g = o.g ?? (o.unitWeight === undefined ? 0 : o.unitWeight * o.thickness!), p = o.p ?? 0;
  const { middle, law } = geometry(o, n);
  // Where R = 0 at a 90° springing (n > 0, no offset), Nx = F′(l² − x²)/(2R) stays finite only for n ≤ 1 without plan load.
  if (law.R(middle.phiSpringing) <= 1e-12 * law.R(0) && (n > 1 || p !== 0)) {
    throw new RangeError(`${F}: with n = ${n} and half_angle = ${degrees(middle.phiSpringing)} the radius of curvature vanishes at the springing and N_x is unbounded${p !== 0 ? ' under the plan load p' : ''}; use a half_angle below 90° or give span and rise with a thickness`);
  }
  return membraneSummary(middle, law, { g, p }, o.length / 2, o.thickness);
}
