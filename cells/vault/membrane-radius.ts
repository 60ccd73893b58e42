/**
 * How the radius of curvature of a barrel vault's middle surface changes
 * with φ — the only geometry membrane theory of a cylindrical shell needs.
 */
import type { Metres, Profile } from './profile.js';
import { offsetProfile } from './profile.js';
import { isCrownRadiusProfile } from './profiles/profileFrom.js';
import { numericRadiusLaw } from './membrane-radius-numeric.js';
import { lawFromDerivatives, type RadiusLaw } from './membrane-radius-law.js';

export type { RadiusLaw };

/**
 * The radius law of the middle surface: profile offset outward by `offset`.
 * For the R0·cos^n φ family it is exact: R′ = −n R0 cos^(n−1)φ sin φ and
 * R″ = −n R0 (cos^n φ + (1 − n) cos^(n−2)φ sin²φ); with no offset R′/R = −n tan φ,
 * so a = −n sin φ, a′ = −n cos φ, b = −n sin φ cos φ, b′ = −n cos 2φ.
 * Any other profile gets a Chebyshev fit of R on [φcrown, φs], differentiated
 * term by term (numericRadiusLaw).
 * @param profile the curve (intrados, or the middle surface itself)
 * @param offset normal distance from it to the middle surface (m), e.g. t/2
 * @returns the law on [0, profile.phiSpringing]
 * @example radiusLaw(circularArc(4, Math.PI / 2)).a(0.3) // 0 — a circle has R′ = 0
 */
export function radiusLaw(profile: Profile, offset: Metres = 0): RadiusLaw {
  const phiS = profile.phiSpringing;
  if (!isCrownRadiusProfile(profile)) return numericRadiusLaw(offset === 0 ? profile : offsetProfile(profile, offset));
  const { n, R0 } = profile;
  if (offset === 0) {
    return {
      phiSpringing: phiS,
      R: (phi) => R0 * Math.cos(phi) ** n,
      a: (phi) => -n * Math.sin(phi),
      da: (phi) => -n * Math.cos(phi),
      b: (phi) => -n * Math.sin(phi) * Math.cos(phi),
      db: (phi) => -n * Math.cos(2 * phi),
    };
  }
  return lawFromDerivatives(
    phiS,
    (phi) => R0 * Math.cos(phi) ** n + offset,
    (phi) => (n === 0 ? 0 : -n * R0 * Math.cos(phi) ** (n - 1) * Math.sin(phi)),
    (phi) => (n === 0 ? 0 : -n * R0 * (Math.cos(phi) ** n + (1 - n) * Math.cos(phi) ** (n - 2) * Math.sin(phi) ** 2)),
  );
}
