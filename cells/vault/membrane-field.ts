/**
 * Membrane forces of a barrel vault (cylindrical shell between end
 * diaphragms) at any point, for a general profile R(φ).
 */
import type { Metres, Radians } from './profile.js';
import type { RadiusLaw } from './membrane-radius-law.js';

/** Membrane forces at a point (N/m), compression negative. */
export interface MembraneForces {
  N_phi: number;
  N_x: number;
  N_xphi: number;
}

/** The membrane state: per-φ coefficients and the forces at (x, φ). */
export interface MembraneField {
  readonly halfLength: Metres;
  readonly phiSpringing: Radians;
  /** Nφ(φ), independent of x (N/m). */
  Nphi(phi: Radians): number;
  /** F(φ) with Nxφ = F·x (N/m²). */
  F(phi: Radians): number;
  /** G(φ) with Nx = G·(l² − x²) (N/m³). */
  G(phi: Radians): number;
  /** Forces at x ∈ [−l, l] from mid-length and φ ∈ [−φs, φs] (negative on the left half). */
  at(x: Metres, phi: Radians): MembraneForces;
}

/**
 * Membrane theory of a cylindrical shell (Flügge, Stresses in Shells, 2nd ed.
 * 1973, ch. 3; Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells,
 * 2nd ed. 1959, §§110–112 — equations from memory, re-derived here), with
 * φ the inclination of the normal, ds = R dφ, x from mid-length:
 *   normal:      Nφ = −p_r·R                (p_r inward, so gravity gives compression)
 *   tangential:  ∂Nxφ/∂x = −p_φ − (1/R)·dNφ/dφ
 *   axial:       ∂Nx/∂x = −(1/R)·∂Nxφ/∂φ
 * with Nxφ = 0 at x = 0 (symmetry) and Nx = 0 at the end diaphragms x = ±l.
 * Dead load g per unit surface: p_r = g cos φ, p_φ = g sin φ; load p per unit
 * plan area, i.e. p cos φ per unit surface: p_r = p cos²φ, p_φ = p sin φ cos φ.
 * Then Nφ = −R(g cos φ + p cos²φ), Nxφ = F(φ)·x, Nx = F′(φ)(l² − x²)/(2R), with
 *   F  = −2g sin φ + g·a − 3p sin φ cos φ + p·b,
 *   F′ = −2g cos φ + g·a′ − 3p cos 2φ + p·b′,
 * a = cos φ·R′/R and b = cos²φ·R′/R (RadiusLaw). Circle (a = b = 0):
 * Nxφ = −2g x sin φ, Nx = −(g/R) cos φ (l² − x²); R0·cos^n φ:
 * F = −(n+2) g sin φ − (n+3) p sin φ cos φ, zero for the catenary under g
 * and for the parabola under p.
 * @param law radius law of the middle surface
 * @param loads g (Pa, per unit surface) and p (Pa, per unit plan area)
 * @param halfLength l = half the distance between end diaphragms (m)
 * @returns the field
 * @example membraneField(radiusLaw(circularArc(4, Math.PI / 2)), {g: 2000, p: 0}, 6).at(0, 0).N_phi // −8000
 */
export function membraneField(law: RadiusLaw, loads: { g: number; p: number }, halfLength: Metres): MembraneField {
  const { g, p } = loads, l = halfLength;
  // Coefficients on the right half; Nφ and F′ are even in φ, F is odd (the left half mirrors the right).
  const Nphi = (phi: Radians): number => {
    const c = Math.cos(phi);
    return -law.R(Math.abs(phi)) * (g * c + p * c * c);
  };
  const F = (phi: Radians): number => {
    const q = Math.abs(phi), s = Math.sin(q), c = Math.cos(q);
    return Math.sign(phi) * (-2 * g * s + g * law.a(q) - 3 * p * s * c + p * law.b(q));
  };
  const G = (phi: Radians): number => {
    const q = Math.abs(phi);
    const dF = -2 * g * Math.cos(q) + g * law.da(q) - 3 * p * Math.cos(2 * q) + p * law.db(q);
    return dF / (2 * law.R(q));
  };
  return {
    halfLength: l,
    phiSpringing: law.phiSpringing,
    Nphi, F, G,
    // Adding 0 turns a −0 (from a zero coefficient times a negative x or φ) into 0.
    at: (x, phi) => ({ N_phi: Nphi(phi) + 0, N_x: G(phi) * (l * l - x * x) + 0, N_xphi: F(phi) * x + 0 }),
  };
}
