// Sources: Cocchetti & Rizzi, Frattura ed Integrità Strutturale 51 (2020), eq. (4), t/R = 0.107426 (confirmed
// in the text); the rest checks the unit boundary.
import { describe, it, expect } from 'vitest';
import type { Unit } from 'mathjs';
import { math } from '../../../../cells/math.js';
import { arch_ring, arch_limit, thrust_line } from '../../../../cells/index.js';
import { UnitMismatchError } from '../../../../cells/units.js';
import { CellArgumentError } from '../../../../cells/define.js';
import { isNotAvailable } from '../../../../cells/not-available.js';

const u = (value: number, unit: string) => math.unit(value, unit);
const num = (value: unknown, unit: string) => (value as Unit).toNumber(unit);
const ringOptions = { shape: 'circular', radius: u(5, 'm'), half_angle: u(90, 'deg'), thickness: u(0.75, 'm'), unit_weight: u(20, 'kN/m^3') };

describe('arch_ring, arch_limit, thrust_line as cells call them', () => {
  it('arch_limit(arch_ring({circular, radius 5 m, half_angle 90 deg, 0.75 m, 20 kN/m^3})).t_min / 5 m is 0.107426 within 0.001 — Cocchetti & Rizzi (2020), confirmed in the text', () => {
    const a = arch_limit.call(arch_ring.call(ringOptions)) as Record<string, unknown>;
    expect(Math.abs(num(a.t_min, 'm') / 5 - 0.107426)).toBeLessThan(0.001);
    expect(a.safe).toBe(true);
    expect(a.gsf as number).toBeCloseTo(0.75 / num(a.t_min, 'm'), 12);
    expect(num(a.H_min, 'kN')).toBeLessThan(num(a.H_max, 'kN'));
    const hinges = a.hinges as { angle: Unit; face: string }[];
    expect(hinges.map((h) => h.face)).toEqual(['intrados', 'extrados', 'intrados']);
    expect(num(hinges[1]!.angle, 'deg')).toBeCloseTo(0, 9);
  });

  it('arch_ring(…) shows its geometry with units and hides the kernel objects', () => {
    const r = arch_ring.call({ ...ringOptions, depth: u(2, 'm'), voussoirs: 60 }) as Record<string, unknown>;
    expect(num(r.span, 'm')).toBeCloseTo(2 * (5 - 0.375), 12);
    expect(num(r.weight, 'kN')).toBeCloseTo(20 * 2 * Math.PI * 5 * 0.75, 9);
    expect(num(r.half_angle, 'deg')).toBeCloseTo(90, 12);
    expect(r.voussoirs).toBe(60);
    expect(Object.keys(r)).not.toContain('centreline');
    expect(Object.keys(r)).not.toContain('joints');
  });

  it('arch_limit(ring, loads) takes loads with units and reports the collapse load factor and mechanism', () => {
    const ring = arch_ring.call({ shape: 'pointed', span: u(8, 'm'), thickness: u(0.6, 'm'), unit_weight: u(20, 'kN/m^3'), voussoirs: 60 });
    const a = arch_limit.call(ring, { dead: u(2, 'kN/m^2'), P: u(40, 'kN'), P_at: u(4, 'm') }) as Record<string, unknown>;
    expect(typeof a.load_factor).toBe('number');
    expect((a.mechanism as unknown[]).length).toBeGreaterThanOrEqual(4);
    expect(num(a.V_left, 'kN') + num(a.V_right, 'kN')).toBeGreaterThan(40);
  });

  it('thrust_line(ring, {}, H) returns points {x, y} in metres', () => {
    const ring = arch_ring.call(ringOptions);
    const pts = thrust_line.call(ring, {}, u(50, 'kN')) as { x: Unit; y: Unit }[];
    expect(pts.length).toBe(201);
    expect(num(pts[100]!.x, 'm')).toBeCloseTo(0, 9);
  });

  it('wrong units, unknown options and a missing ring are refused by the cell boundary', () => {
    expect(() => arch_ring.call({ ...ringOptions, thickness: u(0.75, 'kN') })).toThrow(UnitMismatchError);
    expect(() => arch_ring.call({ ...ringOptions, colour: 'red' })).toThrow(CellArgumentError);
    expect(() => arch_limit.call({ span: u(5, 'm') })).toThrow(CellArgumentError);
    expect(() => arch_limit.call(arch_ring.call(ringOptions), { dead: u(-1, 'kN/m^2') })).toThrow(/dead must be ≥ 0/);
  });

  it('arch_ring takes f_c, friction and gsf with units; arch_limit then reports every field, Infinity and "not available" included', () => {
    const ring = arch_ring.call({ ...ringOptions, f_c: u(3, 'MPa'), friction: 0.7, gsf: 'ring_scaled' }) as Record<string, unknown>;
    expect(num(ring.f_c, 'MPa')).toBeCloseTo(3, 12);
    expect(ring.gsf_definition).toBe('ring_scaled');
    const a = arch_limit.call(ring) as Record<string, unknown>;
    expect(String(a.gsf_definition)).toMatch(/ring scaled/);
    expect(num(a.sigma_max, 'MPa')).toBeGreaterThan(0);
    // Self-weight only: no live load for λ to multiply, so λ, mechanism and governs are "not available".
    for (const k of ['load_factor', 'mechanism', 'governs']) expect(isNotAvailable(a[k]), k).toBe(true);
    const plain = arch_limit.call(arch_ring.call(ringOptions)) as Record<string, unknown>;
    expect(isNotAvailable(plain.sigma_max)).toBe(true);
    expect((plain.sliding as unknown[]).length).toBe(2);
  });
});
