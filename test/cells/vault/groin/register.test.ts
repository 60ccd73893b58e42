/**
 * Sources: the registered functions are compared with their kernels. The closed forms used beside them —
 * crown hoop force g·R and one web's area (π − 2)·R² for a square semicircular cross vault — are
 * Heyman, "Equilibrium of Shell Structures" (1977), from memory, verified by our own integration in
 * groin-vault.test.ts; N_φ = −g·R·cos φ is membrane theory of cylindrical shells (Flügge ch. 3, from memory).
 */
import { describe, it, expect } from 'vitest';
import { math } from '../../../../cells/math.js';
import { groin_vault, web_membrane_at, vault_bays } from '../../../../cells/vault/register-groin.js';
import { groinVault } from '../../../../cells/vault/groin/groin-vault.js';
import { UnitMismatchError } from '../../../../cells/units.js';
import { expectClose } from '../../../helpers/close.js';

const u = (v: number, unit: string) => math.unit(v, unit);
const num = (x: unknown, unit: string) => (x as { toNumber(u: string): number }).toNumber(unit);

describe('groin_vault registered for cells', () => {
  const v = groin_vault.call({ span_x: u(8, 'm'), thickness: u(0.2, 'm'), unit_weight: u(18, 'kN/m^3') }) as Record<string, unknown>;
  const k = groinVault({ span_x: 8, thickness: 0.2, unit_weight: 18e3 });

  it('groin_vault.call({span_x: 8 m, thickness: 0.2 m, unit_weight: 18 kN/m^3}) returns the kernel values with units', () => {
    expectClose(num(v.V_corner, 'kN'), k.V_corner / 1e3, 1e-12);
    expectClose(num(v.H_corner, 'kN'), k.H_corner / 1e3, 1e-12);
    expectClose(num(v.z_thrust, 'm'), k.z_thrust, 1e-12);
    expectClose(num(v.N_crown, 'kN/m'), -3.6 * 4.1, 1e-12); // g·R with g = 0.2·18 kN/m², R = 4 + 0.1 m
    expectClose(num(v.area_web_x, 'm^2'), (Math.PI - 2) * 4.1 ** 2, 1e-12);
    expect(v.shape).toBe('semicircular');
    expect('model' in v).toBe(false);
  });

  it('web_membrane_at(v, x, phi) and vault_bays(v, n) take the registered vault back', () => {
    const m = web_membrane_at.call(v, u(3, 'm'), u(20, 'deg')) as Record<string, unknown>;
    expectClose(num(m.N_phi, 'kN/m'), (-3.6 * 4.1 * Math.cos(Math.PI / 9)), 1e-12);
    const b = vault_bays.call(v, 3) as Record<string, unknown>;
    expectClose(num(b.V_intermediate, 'kN'), (2 * k.V_corner) / 1e3, 1e-12);
    expect(b.n_intermediate).toBe(4);
  });

  it('groin_vault refuses a span without a length unit, and a missing span', () => {
    expect(() => groin_vault.call({ span_x: u(8, 'kN'), g: u(3, 'kPa') })).toThrow(UnitMismatchError);
    expect(() => groin_vault.call({ g: u(3, 'kPa') })).toThrow(/span_x/);
    expect(() => web_membrane_at.call({}, u(1, 'm'), 0.2)).toThrow(/groin_vault/);
  });
});
