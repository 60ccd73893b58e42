/**
 * Membrane forces at one point of a barrel vault already solved.
 */
import type { Metres, Radians } from './profile.js';
import type { BarrelMembrane } from './membrane-summary.js';
import type { MembraneForces } from './membrane-field.js';
import { degrees } from './profiles/positive.js';

/**
 * Nφ, Nx and Nxφ at (x, φ) of a vault returned by barrelMembrane
 * (formulas in membraneField).
 * @param m the solved vault
 * @param x distance from mid-length (m), within ±length/2
 * @param phi inclination of the normal (rad): positive on the right half, negative on the left, within ±half-angle
 * @returns forces per unit length (N/m), compression negative
 * @example membraneAt(m, 3, Math.PI / 6).N_x
 */
export function membraneAt(m: BarrelMembrane, x: Metres, phi: Radians): MembraneForces {
  const { halfLength: l, phiSpringing: phiS } = m.field;
  if (!Number.isFinite(x) || Math.abs(x) > l * (1 + 1e-12)) {
    throw new RangeError(`membrane_at: x must be within ±${l} m (the end walls), got ${x} m`);
  }
  if (!Number.isFinite(phi) || Math.abs(phi) > phiS * (1 + 1e-12)) {
    throw new RangeError(`membrane_at: phi must be within ±${degrees(phiS)} (the springings), got ${degrees(phi)}`);
  }
  return m.field.at(x, Math.sign(phi) * Math.min(Math.abs(phi), phiS));
}
