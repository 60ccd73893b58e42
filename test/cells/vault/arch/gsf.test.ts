// Sources: Heyman, "The safety of masonry arches", Int. J. Mech. Sci. 11 (1969) — the geometric factor of
// safety with the loads of the arch as built (from memory); the ring-scaled minimum-thickness arch of the
// published semicircle t/R = 0.1075 (see arch-limit.test.ts). The reference t_min here is plain bisection
// with a general simplex code (javascript-lp-solver) on the programme of the ring as built.
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { admissibleProgram } from '../../../../cells/vault/arch/admissible-program.js';
import { thrustProgram } from '../../../../cells/vault/arch/thrust-program.js';
import { simplexLP } from './lp-solver-adapter.js';

describe('geometric factor of safety: two definitions, named on the result', () => {
  const options = { shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3, voussoirs: 120 };
  const loads = { fill_unit_weight: 19e3, fill_level: 2.24, dead: 2.3e3 };

  it("the default is Heyman's loads as built, and the result says which definition it used", () => {
    const a = archLimit(archRing(options), loads);
    expect(archRing(options).gsf_definition).toBe('loads_as_built');
    expect(a.gsf_definition).toMatch(/loads as built \(Heyman\)/);
    const b = archLimit(archRing({ ...options, gsf: 'ring_scaled' }), loads);
    expect(b.gsf_definition).toMatch(/ring scaled/);
    expect(a.gsf).not.toBeCloseTo(b.gsf, 3);
  });

  it('loads as built: t_min is where the built loads stop fitting within the shrunk bounds, as bisection with javascript-lp-solver finds it', () => {
    const ring = archRing(options);
    const a = archLimit(ring, loads);
    // Joints only here (no point load, so no vertical cuts): every joint's bounds are ±t/2.
    const p = thrustProgram(ring, ring.thickness, loads);
    expect(p.joints.every((s) => s.kind === 'joint')).toBe(true);
    const fits = (t: number) => simplexLP(admissibleProgram(p, [-1, 0, 0], { offsets: { down: p.joints.map(() => t / 2), up: p.joints.map(() => t / 2) } })).feasible;
    let [lo, hi] = [0, ring.thickness];
    expect(fits(hi)).toBe(true);
    while (hi - lo > 1e-9 * hi) {
      const mid = (lo + hi) / 2;
      if (fits(mid)) hi = mid;
      else lo = mid;
    }
    expectClose(a.t_min, hi, 1e-6);
    expectClose(a.gsf, ring.thickness / hi, 1e-6);
  });

  it('semicircle under self-weight (t/R = 0.15 as built): ring scaled gives t/R 0.1075 (Milankovitch, from memory); loads as built differs only through the centroids of the thicker ring, by under 0.1 %', () => {
    const semi = (gsf: string) => archLimit(archRing({ shape: 'circular', radius: 1, half_angle: Math.PI / 2, thickness: 0.15, unit_weight: 1, gsf }));
    const scaled = semi('ring_scaled').t_min;
    const built = semi('loads_as_built').t_min;
    expect(scaled.toFixed(4)).toBe('0.1075');
    expectClose(built, scaled, 1e-3);
    expect(Math.abs(built - scaled)).toBeGreaterThan(1e-6);
  });

  it('arch_ring refuses an unknown gsf definition, naming both', () => {
    expect(() => archRing({ ...options, gsf: 'heyman' })).toThrow(/loads_as_built.*ring_scaled/);
  });
});
