// Sources: the rectangular stress block of depth a = N/(f_c·b) (common practice; the form used in
// masonry design codes for eccentric compression — from memory); Coulomb friction on a joint: a block on
// a plane stays put while its resultant lies within the cone tan⁻¹μ about the plane's normal (any statics
// text, e.g. Meriam & Kraige, Engineering Mechanics: Statics, ch. 6 — from memory).
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { thrustProgram } from '../../../../cells/vault/arch/thrust-program.js';
import { solveAdmissible } from '../../../../cells/vault/arch/admissible-program.js';
import { thrustState } from '../../../../cells/vault/arch/thrust-state.js';
import { seidelLP } from '../../../../cells/vault/arch/seidel-lp.js';
import { voussoirLoads } from '../../../../cells/vault/arch/voussoir-loads.js';

const segment = { shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3, voussoirs: 120 };
const loads = { fill_unit_weight: 19e3, fill_level: 2.24, dead: 2.3e3, P: 60e3, P_at: 1.5 };

describe('finite compressive strength: a stress block of depth N/(f_c·b) inside each face', () => {
  it('at collapse every section keeps its block inside the ring, and at each hinge the resultant stands exactly a/2 = N/(2·f_c·b) from the face', () => {
    const f_c = 4e6;
    const ring = archRing({ ...segment, f_c, depth: 1.5 });
    const p = thrustProgram(ring, ring.thickness, loads);
    const r = solveAdmissible(p, [0, 0, 0, 1], { lambdaFree: true }, seidelLP);
    expect(r.feasible).toBe(true);
    if (!r.feasible) return;
    expect(r.rounds).toBeGreaterThan(1);
    const s = thrustState(p, r.x, true);
    let touching = 0;
    s.joints.forEach((a, j) => {
      const sec = p.joints[j]!;
      const half = a.N / (2 * f_c * 1.5); // a/2, with b = depth = 1.5 m
      const room = Math.min(sec.up - a.e, sec.down + a.e);
      expect(room).toBeGreaterThanOrEqual(half - 1e-7 * ring.thickness);
      if (room < half + 1e-6 * ring.thickness) touching++;
    });
    expect(touching).toBeGreaterThanOrEqual(4);
  });

  it('f_c → ∞ gives the results of uncrushable blocks (f_c = 1e13 Pa: λ, H_min, H_max, gsf within 1e-6)', () => {
    const rigid = archLimit(archRing(segment), loads);
    const strong = archLimit(archRing({ ...segment, f_c: 1e13 }), loads);
    for (const k of ['load_factor', 'H_min', 'H_max', 'gsf'] as const) expectClose(strong[k], rigid[k], 1e-6);
    expect(strong.governs).toBe('hinges');
    expect(rigid.notes.join(' ')).not.toMatch(/f_c/);
    expect(strong.notes.join(' ')).toMatch(/finite strength: λ/);
  });

  it('λ falls as f_c falls, and the least peak stress the loads need is the same whatever f_c above it', () => {
    const lam = [50e6, 10e6, 4e6, 2e6].map((f_c) => archLimit(archRing({ ...segment, f_c }), loads));
    for (let k = 1; k < lam.length; k++) expect(lam[k]!.load_factor).toBeLessThan(lam[k - 1]!.load_factor);
    expectClose(lam[1]!.sigma_max, lam[0]!.sigma_max, 2e-4);
    expect(lam[3]!.sigma_max).toBeLessThan(2e6);
    expect(isFinite(lam[0]!.sigma_max_at)).toBe(true);
  });

  it('a shallow thick ring that never collapses with rigid blocks (λ = ∞) has a finite λ with f_c, and crushing governs', () => {
    const flat = { shape: 'circular', span: 6, rise: 0.4, thickness: 0.6, unit_weight: 2e4, voussoirs: 120 };
    const P = { P: 100e3, P_at: 2 };
    expect(archLimit(archRing(flat), P).load_factor).toBe(Infinity);
    const a = archLimit(archRing({ ...flat, f_c: 5e6 }), P);
    expect(Number.isFinite(a.load_factor)).toBe(true);
    expect(a.governs).toBe('crushing');
    expect(a.notes.join(' ')).toMatch(/crushing governs the load factor: λ unbounded with uncrushable blocks/);
  });
});

describe('sliding: |T| ≤ μ·N at every joint', () => {
  // A flat segment: without friction a near-straight line of thrust fits, so H_max is unbounded.
  const flat = { shape: 'circular', span: 10, rise: 0.3, thickness: 0.5, unit_weight: 2e4, voussoirs: 60 };

  it('without μ the result reports the largest T/N and where, in each state', () => {
    const a = archLimit(archRing(segment), loads);
    expect(a.sliding.map((s) => s.state)).toEqual(['least thrust', 'greatest thrust', 'collapse']);
    for (const s of a.sliding) {
      expect(s.ratio).toBeGreaterThan(0);
      expect(s.x).toBeGreaterThanOrEqual(-0.4);
    }
  });

  it('H_max of a flat segment with friction μ is the thrust at which some joint\'s resultant reaches the friction cone: H = V_j·cot(θ_j − tan⁻¹μ) (block on an incline)', () => {
    const mu = 0.05;
    const ring = archRing({ ...flat, friction: mu });
    expect(archLimit(archRing(flat)).H_max).toBe(Infinity);
    const a = archLimit(ring);
    // Independent: the vertical force passed on at each left-half joint, from the voussoir weights.
    const { fixed } = voussoirLoads(ring, ring.thickness, {});
    const W = fixed.reduce((s, f) => s + f.W, 0);
    let V = W / 2; // symmetric: each springing carries half
    let bound = Infinity;
    ring.joints.forEach((j, k) => {
      if (k > 0) V -= fixed[k - 1]!.W;
      const theta = -j.angle; // left half: the joint leans by θ from the vertical
      if (theta > Math.atan(mu)) bound = Math.min(bound, V / Math.tan(theta - Math.atan(mu)));
    });
    expectClose(a.H_max, bound, 1e-6);
    expect(a.sliding[1]!.ratio).toBeCloseTo(mu, 6);
  });

  it('μ above every ratio found without friction changes nothing; μ below the least-thrust ratio makes the ring unsafe and sliding governs λ', () => {
    const free = archLimit(archRing(segment), loads);
    const most = Math.max(...free.sliding.map((s) => s.ratio));
    const loose = archLimit(archRing({ ...segment, friction: most * 1.01 }), loads);
    expectClose(loose.load_factor, free.load_factor, 1e-9);
    expectClose(loose.H_min, free.H_min, 1e-9);
    const tight = archLimit(archRing({ ...segment, friction: 0.2 }), loads);
    expect(tight.governs).toBe('sliding');
    expect(tight.load_factor).toBeLessThan(free.load_factor);
  });
});

describe('friction alone makes a ring inadmissible: it says where, and gsf is not a misleading 0', () => {
  it('a semicircle (R 5 m, t 0.8 m) with μ = 0.2 names the springing joint, |T|/N = H/V there, and keeps the geometric gsf with a note', () => {
    const semi = { shape: 'circular', radius: 5, half_angle: Math.PI / 2, thickness: 0.8, unit_weight: 2e4, voussoirs: 120 };
    const free = archLimit(archRing(semi));
    const a = archLimit(archRing({ ...semi, friction: 0.2 }));
    expect(a.safe).toBe(false);
    // At a horizontal springing joint T = H and N = V (Coulomb: the resultant must lie within tan⁻¹μ of the normal).
    const s = a.sliding.find((x) => x.state === 'least thrust without friction')!;
    expectClose(s.ratio, free.H_min! / free.V_left!, 1e-6);
    expect(s.ratio).toBeGreaterThan(0.2);
    expectClose(Math.abs(s.angle), Math.PI / 2, 1e-9);
    expect(a.notes.join('\n')).toMatch(/friction makes the ring inadmissible: without the friction limit a line of thrust fits, but the least-thrust line needs \|T\|\/N = 0\.\d+ at the joint at -90\.0°/);
    expectClose(a.gsf, free.gsf, 1e-9);
    expect(a.gsf).toBeGreaterThan(1);
    expect(a.notes.join('\n')).toMatch(/t_min and gsf \(\d\.\d\d\) are geometric, without the friction limit/);
  });
});
