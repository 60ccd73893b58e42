/**
 * Pier reactions under a row of equal cross-vault bays.
 */
import type { GroinVault } from './groin-vault.js';

export interface VaultBays {
  /** Bays in the row. */
  bays: number;
  /** Piers between bays (two per joint, one each side of the row) and piers at the ends (four). */
  n_intermediate: number; n_end: number;
  /** Intermediate pier: vertical load (N) from the two corners it carries. */
  V_intermediate: number;
  /** Intermediate pier: transverse (y) thrust (N); the longitudinal thrusts of the neighbours cancel. */
  H_intermediate: number;
  /** Height of the transverse thrust above the springing (m). */
  z_intermediate: number;
  /** End pier: vertical load (N) from its one corner. */
  V_end: number;
  /** End pier: longitudinal (x) and transverse (y) thrusts and their resultant (N). */
  H_end_x: number; H_end_y: number; H_end: number;
  /** Heights of the end pier's longitudinal and transverse thrusts above the springing (m). */
  z_end_x: number; z_end_y: number;
}

/**
 * A row of n equal bays running along x (span_x is the bay length along the
 * row, span_y the transverse span). Each pier between two bays carries a
 * corner of each: their vertical loads add, their longitudinal thrusts are
 * equal and opposite and cancel, their transverse thrusts add. An end pier
 * carries one corner and both of its thrusts. Statics of the free body
 * (common practice); the longitudinal thrust cancels only while every bay is
 * loaded alike — an unloaded neighbour leaves part of it unbalanced.
 * @param v one bay, from groinVault
 * @param n number of bays (whole number ≥ 1)
 * @returns reactions at an intermediate and at an end pier
 * @example vaultBays(groinVault({span_x: 8, g: 1}), 3).H_intermediate // 2·16
 */
export function vaultBays(v: GroinVault, n: number): VaultBays {
  if (!(Number.isInteger(n) && n >= 1)) throw new RangeError(`vault_bays: n must be a whole number ≥ 1, got ${n}`);
  return {
    bays: n,
    n_intermediate: 2 * (n - 1), n_end: 4,
    V_intermediate: 2 * v.V_corner,
    H_intermediate: 2 * v.H_corner_y,
    z_intermediate: v.z_thrust_y,
    V_end: v.V_corner,
    H_end_x: v.H_corner_x, H_end_y: v.H_corner_y, H_end: v.H_corner,
    z_end_x: v.z_thrust, z_end_y: v.z_thrust_y,
  };
}
