// Source of the expected values: arch_limit itself at the same positions (an independent call per
// position, rebuilding nothing shared), and a brute-force scan at a finer step.
import { describe, it, expect } from 'vitest';
import type { Unit } from 'mathjs';
import { expectClose } from '../../../helpers/close.js';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archScan } from '../../../../cells/vault/arch/arch-scan.js';
import { archLimit } from './loose-limit.js';
import { math } from '../../../../cells/math.js';
import { arch_ring, arch_scan } from '../../../../cells/index.js';

const options = { shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3, voussoirs: 80 };
const loads = { fill_unit_weight: 19e3, fill_level: 2.24, dead: 2.3e3 };

describe('arch_scan: a vehicle rolled across the span', () => {
  it('one axle: every point of the curve is arch_limit\'s λ with P at that position (same origin as P_at)', () => {
    const ring = archRing(options);
    const s = archScan(ring, loads, { axles: [60e3], steps: 12 });
    expect(s.curve.length).toBeGreaterThanOrEqual(13);
    for (const p of s.curve.filter((_, i) => i % 4 === 0)) {
      const inside = p.x >= 0 && p.x <= 6;
      if (!inside) continue;
      const alone = archLimit(ring, { ...loads, P: 60e3, P_at: p.x }).load_factor;
      // Over a springing the axle goes straight into the abutment: λ is unbounded in both.
      if (!Number.isFinite(alone)) expect(p.lambda).toBe(Infinity);
      else expectClose(p.lambda, alone, 1e-9);
    }
    expectClose(s.lambda_min as number, archLimit(ring, { ...loads, P: 60e3, P_at: s.x_worst as number }).load_factor, 1e-9);
  });

  it('two axles enter and leave: the lead axle runs from 0 to span + spacing, and the worst position is found to 0.001·L (a brute-force scan at 0.0005·L around it finds nothing lower)', () => {
    const ring = archRing(options);
    const s = archScan(ring, loads, { axles: [50e3, 50e3], spacing: [1.8], steps: 40 });
    expect(s.curve[0]!.x).toBe(0);
    expect(s.curve.at(-1)!.x).toBeCloseTo(7.8, 12);
    const x = s.x_worst as number;
    let brute = Infinity;
    for (let k = -40; k <= 40; k++) {
      const at = x + (k * 0.0005 * 6);
      const l = archScan(ring, loads, { axles: [50e3, 50e3], spacing: [1.8], from: at, to: at + 1e-9, steps: 2 }).curve[0]!.lambda;
      brute = Math.min(brute, l);
    }
    expect(s.lambda_min as number).toBeLessThanOrEqual(brute * (1 + 2e-4));
    expect(Array.isArray(s.mechanism) && s.mechanism.length).toBeGreaterThanOrEqual(4);
  });

  it('spread through the fill raises λ of the vehicle, and the result says which spread was used', () => {
    const ring = archRing(options);
    const bare = archScan(ring, loads, { axles: [50e3, 50e3], spacing: [1.8], steps: 30 });
    const spread = archScan(ring, { ...loads, spread: 0.5 }, { axles: [50e3, 50e3], spacing: [1.8], steps: 30 });
    expect(spread.lambda_min as number).toBeGreaterThan(bare.lambda_min as number);
    expect(bare.load_spread).toMatch(/no spread/);
    expect(spread.load_spread).toMatch(/0\.5 horizontal per unit depth/);
  });

  it('arch_scan as a cell: units in and out, lists of axles and spacings', () => {
    const u = (v: number, unit: string) => math.unit(v, unit);
    const ring = arch_ring.call({ shape: 'circular', span: u(6, 'm'), rise: u(1.5, 'm'), thickness: u(0.34, 'm'), unit_weight: u(18, 'kN/m^3'), voussoirs: 60 });
    const s = arch_scan.call(ring, { fill_unit_weight: u(19, 'kN/m^3'), fill_level: u(2.24, 'm') },
      { axles: math.matrix([u(50, 'kN'), u(50, 'kN')]), spacing: [u(1.8, 'm')], steps: 10 }) as Record<string, unknown>;
    expect(typeof s.lambda_min).toBe('number');
    expect((s.x_worst as Unit).toNumber('m')).toBeGreaterThan(0);
    expect((s.curve as unknown[]).length).toBeGreaterThan(10);
  });

  it('bad vehicles are refused, naming the option', () => {
    const ring = archRing(options);
    expect(() => archScan(ring, loads, { axles: [50e3, 50e3] })).toThrow(/spacing needs 1 distance/);
    expect(() => archScan(ring, loads, { axles: [] })).toThrow(/axles/);
    expect(() => archScan(ring, loads, { axles: [-1] })).toThrow(/axles\[1\]/);
    expect(() => archScan(ring, loads, { axles: [1e3], from: 3, to: 1 })).toThrow(/from must be less than to/);
    expect(() => archScan(ring, loads, { axles: [1e3], steps: 1 })).toThrow(/steps/);
  });
});
