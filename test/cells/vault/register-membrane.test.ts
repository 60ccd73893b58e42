import { describe, it, expect } from 'vitest';
import type { Unit } from 'mathjs';
import { expectClose } from '../../helpers/close.js';
import { math } from '../../../cells/math.js';
import { CellArgumentError } from '../../../cells/define.js';
import { UnitMismatchError } from '../../../cells/units.js';
import { barrel_membrane, membrane_at } from '../../../cells/vault/register-membrane.js';

const u = (v: number, unit: string) => math.unit(v, unit);
const kN = (x: unknown) => (x as Unit).toNumber('kN/m');

describe('barrel_membrane / membrane_at registered for cells', () => {
  const m = barrel_membrane.call({
    shape: 'circular', R0: u(4, 'm'), half_angle: u(90, 'deg'), length: u(12, 'm'),
    thickness: u(0.12, 'm'), unit_weight: u(18, 'kN/m^3'),
  }) as Record<string, unknown>;

  it('membrane_at.call(m, 3 m, 30 deg).N_x equals −(g/R) cos φ (l² − x²), l = half-length (Timoshenko & Woinowsky-Krieger §110, from memory)', () => {
    const g = 18 * 0.12; // kN/m²
    const f = membrane_at.call(m, u(3, 'm'), u(30, 'deg')) as Record<string, unknown>;
    expectClose(kN(f.N_x), -(g / 4) * Math.cos(Math.PI / 6) * (36 - 9), 1e-12);
    expectClose(kN(f.N_phi), -g * 4 * Math.cos(Math.PI / 6), 1e-12);
    expectClose(kN(f.N_xphi), -2 * g * 3 * 0.5, 1e-12);
  });

  it('returns every listed field with its unit', () => {
    expect(Object.keys(m).sort()).toEqual(['H_wall', 'N_phi_crown', 'N_phi_springing', 'N_x_max', 'N_x_min', 'N_xphi_max',
      'V_wall', 'W', 'end_shear', 'sigma_max', 'tension'].sort());
    expectClose(kN(m.N_phi_crown), -18 * 0.12 * 4, 1e-12);
    expectClose((m.W as Unit).toNumber('kN'), 12 * Math.PI * 4 * 18 * 0.12, 1e-12);
    expectClose((m.end_shear as Unit).toNumber('kN'), (12 * Math.PI * 4 * 18 * 0.12) / 2, 1e-12);
    expect((m.sigma_max as Unit).equalBase(math.unit(1, 'Pa'))).toBe(true);
    expect(m.tension).toBe(true);
  });

  it('takes the exponent n as shape and gives sigma_max as not available without a thickness', () => {
    const c = barrel_membrane.call({ shape: -2, span: u(8, 'm'), rise: u(3, 'm'), length: u(10, 'm'), g: u(2.5, 'kN/m^2') }) as Record<string, unknown>;
    expect(kN(c.N_xphi_max)).toBe(0);
    expect(String(c.sigma_max)).toMatch(/^not available — no thickness is given/);
    expect(c.tension).toBe(false);
  });

  it.each<[string, Record<string, unknown>, new (...a: any[]) => Error, RegExp]>([
    ['negative span', { shape: 'circular', span: u(-6, 'm'), rise: u(2, 'm'), length: u(10, 'm'), g: u(2, 'kPa') }, RangeError, /barrel_membrane: span must be positive, got -6 m/],
    ['zero span', { shape: 'parabolic', span: u(0, 'm'), rise: u(2, 'm'), length: u(10, 'm'), g: u(2, 'kPa') }, RangeError, /span must be positive, got 0 m/],
    ['rise > span/2 for a circle', { shape: 'circular', span: u(6, 'm'), rise: u(7, 'm'), length: u(10, 'm'), g: u(2, 'kPa') }, RangeError, /circular: rise must be at most span\/2/],
    ['half_angle 90° for a catenary', { shape: 'catenary', R0: u(3, 'm'), half_angle: u(90, 'deg'), length: u(10, 'm'), g: u(2, 'kPa') }, RangeError, /catenary: half_angle must be below 90°, got 90°/],
    ['no load', { shape: 'circular', span: u(6, 'm'), rise: u(2, 'm'), length: u(10, 'm') }, RangeError, /no load given: set g, or thickness and unit_weight, and\/or p/],
    ['no length', { shape: 'circular', span: u(6, 'm'), rise: u(2, 'm'), g: u(2, 'kPa') }, CellArgumentError, /option "length" is required/],
    ['unknown option', { shape: 'circular', span: u(6, 'm'), rise: u(2, 'm'), length: u(10, 'm'), load: u(2, 'kPa') }, CellArgumentError, /unknown option "load"/],
    ['span in kN', { shape: 'circular', span: u(6, 'kN'), rise: u(2, 'm'), length: u(10, 'm'), g: u(2, 'kPa') }, UnitMismatchError, /span needs length/],
    ['g in kN/m^3', { shape: 'circular', span: u(6, 'm'), rise: u(2, 'm'), length: u(10, 'm'), g: u(2, 'kN/m^3') }, UnitMismatchError, /g needs pressure or stress/],
  ])('refuses %s with a clear error naming the option', (_, options, type, message) => {
    expect(() => barrel_membrane.call(options)).toThrow(type);
    expect(() => barrel_membrane.call(options)).toThrow(message);
  });

  it('membrane_at refuses a point outside the vault and a value that is not a barrel_membrane result', () => {
    expect(() => membrane_at.call(m, u(7, 'm'), u(0, 'deg'))).toThrow(/membrane_at: x must be within ±6 m/);
    expect(() => membrane_at.call(m, u(0, 'm'), u(-95, 'deg'))).toThrow(/phi must be within ±90° \(the springings\), got -95°/);
    expect(() => membrane_at.call({ N_x: 1 }, u(0, 'm'), u(0, 'deg'))).toThrow(CellArgumentError);
  });
});
