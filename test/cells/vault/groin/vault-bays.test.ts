import { describe, it, expect } from 'vitest';
import { groinVault } from '../../../../cells/vault/groin/groin-vault.js';
import { vaultBays } from '../../../../cells/vault/groin/vault-bays.js';
import { expectClose } from '../../../helpers/close.js';

describe('vaultBays', () => {
  const v = groinVault({ span_x: 6, span_y: 9, thickness: 0.3, unit_weight: 18e3, fill_level: 2, fill_unit_weight: 16e3 });

  it('vaultBays(v, n): the piers carry the whole row, vertically and transversely (statics, common practice)', () => {
    for (const n of [1, 2, 5]) {
      const b = vaultBays(v, n);
      expect(b.n_intermediate).toBe(2 * (n - 1));
      expectClose(b.n_end * b.V_end + b.n_intermediate * b.V_intermediate, n * v.W, 1e-12);
      // Each side of the row resists the transverse thrust of every bay: 2 corners a bay.
      expectClose(2 * b.H_end_y + (b.n_intermediate / 2) * b.H_intermediate, n * 2 * v.H_corner_y, 1e-12);
      // Longitudinally only the two ends of the row push (on each side): equal and opposite.
      expectClose(b.H_end_x, v.H_corner_x, 1e-15);
    }
  });

  it('vaultBays: an intermediate pier takes two corners and only the transverse thrust; an end pier both', () => {
    const b = vaultBays(v, 4);
    expectClose(b.V_intermediate, 2 * v.V_corner, 1e-15);
    expectClose(b.H_intermediate, 2 * v.H_corner_y, 1e-15);
    expectClose(b.H_end, Math.hypot(v.H_corner_x, v.H_corner_y), 1e-12);
    expectClose(b.z_intermediate, v.z_thrust_y, 1e-15);
  });

  it('vaultBays refuses a row of no bays or of part of a bay', () => {
    expect(() => vaultBays(v, 0)).toThrow(/n must be a whole number ≥ 1, got 0/);
    expect(() => vaultBays(v, 2.5)).toThrow(RangeError);
  });
});
