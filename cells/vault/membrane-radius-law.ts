/**
 * The radius law: what membrane theory of a barrel vault needs from its profile.
 */
import type { Metres, Radians } from './profile.js';

/**
 * R(φ) of the middle surface and the two terms its change contributes to the
 * tangential equilibrium of a cylindrical shell, a(φ) = cos φ·R′/R and
 * b(φ) = cos²φ·R′/R, with their φ-derivatives. Grouping them this way keeps
 * the forces finite where R → 0 at a 90° springing (cycloid).
 */
export interface RadiusLaw {
  /** φ at the springing (rad); the law holds on [0, phiSpringing]. */
  readonly phiSpringing: Radians;
  R(phi: Radians): Metres;
  a(phi: Radians): number;
  da(phi: Radians): number;
  b(phi: Radians): number;
  db(phi: Radians): number;
}

/**
 * The radius law from R, R′ and R″, with λ = R′/R and λ′ = R″/R − λ²:
 * a = λ cos φ, a′ = λ′ cos φ − λ sin φ, b = λ cos²φ, b′ = λ′ cos²φ − 2λ sin φ cos φ.
 * @param phiSpringing φ at the springing (rad)
 * @param R radius of curvature (m)
 * @param dR dR/dφ (m/rad)
 * @param d2R d²R/dφ² (m/rad²)
 * @returns the law; valid wherever R > 0
 * @example lawFromDerivatives(1, () => 4, () => 0, () => 0).a(0.5) // 0 — a circle
 */
export function lawFromDerivatives(
  phiSpringing: Radians, R: (phi: Radians) => Metres, dR: (phi: Radians) => number, d2R: (phi: Radians) => number,
): RadiusLaw {
  const terms = (phi: Radians) => {
    const r = R(phi), lam = dR(phi) / r, dlam = d2R(phi) / r - lam * lam;
    return { c: Math.cos(phi), s: Math.sin(phi), lam, dlam };
  };
  return {
    phiSpringing, R,
    a: (phi) => { const t = terms(phi); return t.c * t.lam; },
    da: (phi) => { const t = terms(phi); return t.c * t.dlam - t.s * t.lam; },
    b: (phi) => { const t = terms(phi); return t.c * t.c * t.lam; },
    db: (phi) => { const t = terms(phi); return t.c * t.c * t.dlam - 2 * t.s * t.c * t.lam; },
  };
}
