import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { expectClose } from '../../helpers/close.js';
import { barrelMembrane, type BarrelMembraneOptions } from '../../../cells/vault/barrel-membrane.js';
import { membraneAt } from '../../../cells/vault/membrane-at.js';
import { endExtremes, principalForces } from '../../../cells/vault/membrane-summary.js';

const deg = Math.PI / 180;

describe('barrelMembrane: circular vault against the textbook closed forms', () => {
  // Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, 2nd ed., §110, and Flügge,
  // Stresses in Shells, ch. 3 (from memory; re-derived in membrane-field.ts). Dead load g per unit
  // surface, radius a, l = HALF the length (Timoshenko writes l for the whole length, Nx = −(q/a)(l²/4 − x²) cos φ):
  //   Nφ = −g a cos φ,  Nxφ = −2 g x sin φ,  Nx = −(g/a) cos φ (l² − x²).
  const a = 4, l = 6, g = 18000 * 0.12;
  const m = barrelMembrane({ shape: 'circular', R0: a, halfAngle: 90 * deg, length: 2 * l, thickness: 0.12, unitWeight: 18000 });

  it.each([[0, 0], [3, 30 * deg], [-4.5, 60 * deg], [6, -75 * deg], [1.2, 90 * deg]])('membraneAt(m, %d m, φ) = closed forms', (x, phi) => {
    const f = membraneAt(m, x, phi);
    expectClose(f.N_phi, -g * a * Math.cos(phi), 1e-12, g * a * 1e-3);
    expectClose(f.N_xphi, -2 * g * x * Math.sin(phi), 1e-12, g * a * 1e-3);
    expectClose(f.N_x, -(g / a) * Math.cos(phi) * (l * l - x * x), 1e-12, g * a * 1e-3);
  });

  it('summary fields: Nφ crown −g a, springing 0, |Nxφ|max = 2 g l, Nx max −g l²/a, no Nx tension', () => {
    expectClose(m.N_phi_crown, -g * a, 1e-12);
    expect(m.N_phi_springing).toBe(0);
    expectClose(m.N_xphi_max, 2 * g * l, 1e-12);
    expectClose(m.N_x_max, (-g * l * l) / a, 1e-12);
    expect(m.N_x_min).toBe(0);
    // A semicircle carries all of its weight to the end walls by shear (Nφ = 0 at the springing).
    expect(m.V_wall).toBe(0);
    expectClose(m.W, 2 * l * Math.PI * a * g, 1e-12);
    expectClose(m.end_shear, m.W / 2, 1e-12);
  });

  it('tension is reported: pure shear Nxφ at the end walls (Nx = 0 there) gives a tensile principal force (Mohr\'s circle, common practice)', () => {
    expect(m.tension).toBe(true);
    expect(principalForces(membraneAt(m, l, 45 * deg))[0]).toBeGreaterThan(0);
  });

  it('sigma_max is the largest principal compression / t, checked on a 201 × 201 grid of the quarter vault', () => {
    let worst = 0;
    for (let i = 0; i <= 200; i++) for (let j = 0; j <= 200; j++) {
      worst = Math.min(worst, principalForces(membraneAt(m, (l * i) / 200, (90 * deg * j) / 200))[1]);
    }
    expect((m.sigma_max as number) * 0.12).toBeGreaterThanOrEqual(-worst * (1 - 1e-12));
    expectClose(m.sigma_max as number, -worst / 0.12, 1e-4);
  });

  it('segmental circle under plan load p: Nφ = −p a cos²φ, Nxφ = −3 p x sin φ cos φ, Nx = −(3p/2a) cos 2φ (l² − x²) (Timoshenko §110, snow load, from memory; re-derived)', () => {
    const p = 3000, v = barrelMembrane({ shape: 'circular', R0: a, halfAngle: 50 * deg, length: 2 * l, p });
    for (const [x, phi] of [[2, 20 * deg], [-5, -45 * deg]] as const) {
      const f = membraneAt(v, x, phi);
      expectClose(f.N_phi, -p * a * Math.cos(phi) ** 2, 1e-12);
      expectClose(f.N_xphi, -3 * p * x * Math.sin(phi) * Math.cos(phi), 1e-12);
      expectClose(f.N_x, -((3 * p) / (2 * a)) * Math.cos(2 * phi) * (l * l - x * x), 1e-12);
    }
    // cos 2φ < 0 beyond 45°: Nx turns tensile near the springing at mid-length.
    expectClose(v.N_x_min, ((3 * p) / (2 * a)) * -Math.cos(100 * deg) * l * l, 1e-12);
  });
});

describe('barrelMembrane: funicular profiles carry their load by arch action alone', () => {
  it('catenary under self-weight: Nxφ = Nx = 0 and Nφ·cos φ = −g·a constant (common practice: H = w·a)', () => {
    const m = barrelMembrane({ shape: 'catenary', span: 10, rise: 4, length: 8, g: 2500 });
    expect(m.N_xphi_max).toBe(0);
    expect(m.N_x_max).toBe(0);
    expect(m.tension).toBe(false);
    expectClose(m.end_shear, 0, 1e-12, m.W);
    const H = -m.N_phi_crown;
    for (const phi of [10 * deg, 35 * deg, -50 * deg]) {
      const f = membraneAt(m, 1.5, phi);
      expectClose(-f.N_phi * Math.cos(phi), H, 1e-12);
      expect(f.N_xphi).toBe(0);
    }
    expectClose(m.H_wall, H, 1e-12);
    expectClose(m.V_wall, m.W / 2 / 8, 1e-12);
  });

  it('parabola under uniform plan load: Nxφ = Nx = 0 and thrust H = p L²/(8f) (any statics text)', () => {
    const L = 9, f = 2.5, p = 4000;
    const m = barrelMembrane({ shape: 'parabolic', span: L, rise: f, length: 7, p });
    expect(m.N_xphi_max).toBe(0);
    expect(m.N_x_max).toBe(0);
    expect(m.tension).toBe(false);
    expectClose(m.H_wall, (p * L * L) / (8 * f), 1e-12);
    expectClose(m.V_wall, (p * L) / 2, 1e-12);
    for (const phi of [0, 30 * deg, -45 * deg]) expectClose(-membraneAt(m, -2, phi).N_phi * Math.cos(phi), (p * L * L) / (8 * f), 1e-12);
  });

  it('catenary with thickness: span and rise are the intrados; the middle surface (offset t/2) is no longer funicular', () => {
    const m = barrelMembrane({ shape: 'catenary', span: 10, rise: 4, length: 8, thickness: 0.4, unitWeight: 20000 });
    expect(m.N_xphi_max).toBeGreaterThan(0);
    expectClose(2 * 2 * 4 * m.V_wall + 2 * m.end_shear, m.W, 1e-9);
  });
});

const CASES: Array<[string, BarrelMembraneOptions]> = [
  ['semicircle, g', { shape: 'circular', R0: 4, halfAngle: 90 * deg, length: 12, g: 2160 }],
  ['segmental circle by span/rise with thickness, g + p', { shape: 'circular', span: 8, rise: 2, thickness: 0.25, unitWeight: 18000, length: 10, p: 4000 }],
  ['catenary, g + p', { shape: 'catenary', span: 8, rise: 3, thickness: 0.3, unitWeight: 18000, length: 10, p: 5000 }],
  ['catenary by R0/half_angle, p', { shape: 'catenary', R0: 3, halfAngle: 60 * deg, length: 6, p: 5000 }],
  ['parabola, g', { shape: 'parabolic', span: 6, rise: 4, length: 5, g: 3000 }],
  ['full cycloid, g', { shape: 'cycloid', R0: 4, halfAngle: 90 * deg, length: 9, g: 3000 }],
  ['segmental cycloid with thickness, g + p', { shape: 'cycloid', span: 9, rise: 2, thickness: 0.3, unitWeight: 17000, length: 9, p: 2000 }],
  ['n = 0.5, g + p', { shape: 0.5, span: 8, rise: 3, thickness: 0.3, unitWeight: 18000, length: 10, p: 5000 }],
  ['n = −1 via option n, g', { n: -1, R0: 2, halfAngle: 70 * deg, length: 4, g: 1500 }],
  ['n = −2.5, g + p', { shape: -2.5, span: 7, rise: 5, length: 14, g: 1500, p: 800 }],
  ['horseshoe circle (half-angle 120°), g + p', { shape: 'circular', R0: 3, halfAngle: 120 * deg, length: 8, g: 1500, p: 800 }],
];

describe.each(CASES)('barrelMembrane(%s)', (_, options) => {
  const m = barrelMembrane(options);
  it('edge reactions balance the total load: 2 lateral walls × length × V_wall + 2 × end_shear = W (statics)', () => {
    expectClose(2 * options.length! * m.V_wall + 2 * m.end_shear, m.W, 1e-9);
  });
  it('returns only finite numbers', () => {
    for (const v of Object.values(m)) if (typeof v === 'number') expect(Number.isFinite(v)).toBe(true);
  });
});

describe('barrelMembrane: bad input', () => {
  it.each<[BarrelMembraneOptions, RegExp]>([
    [{ shape: 'circular', span: -6, rise: 2, length: 10, g: 2000 }, /barrel_membrane: span must be positive, got -6 m/],
    [{ shape: 'circular', span: 0, rise: 2, length: 10, g: 2000 }, /barrel_membrane: span must be positive, got 0 m/],
    [{ shape: 'circular', span: 6, rise: 4, length: 10, g: 2000 }, /barrel_membrane: circular: rise must be at most span\/2/],
    [{ shape: 'cycloid', span: 6, rise: 3, length: 10, g: 2000 }, /barrel_membrane: cycloid: rise must be at most span\/π/],
    [{ shape: 'catenary', R0: 3, halfAngle: 90 * deg, length: 10, g: 2000 }, /barrel_membrane: catenary: half_angle must be below 90°, got 90°/],
    [{ shape: 'catenary', R0: 3, halfAngle: 100 * deg, length: 10, g: 2000 }, /catenary: half_angle must be below 90°, got 100°/],
    [{ shape: 'circular', span: 6, rise: 2, length: 10 }, /barrel_membrane: no load given/],
    [{ shape: 'circular', span: 6, rise: 2, g: 2000 }, /barrel_membrane: length .* is required/],
    [{ shape: 'circular', span: 6, length: 10, g: 2000 }, /barrel_membrane: rise is required/],
    [{ shape: 'circular', span: 6, rise: 2, R0: 3, length: 10, g: 2000 }, /not both/],
    [{ shape: 'elliptical', span: 6, rise: 2, length: 10, g: 2000 }, /shape must be one of circular, cycloid, catenary, parabolic, power/],
    [{ span: 6, rise: 2, length: 10, g: 2000 }, /give shape/],
    [{ shape: 'circular', n: 1, span: 6, rise: 2, length: 10, g: 2000 }, /shape "circular" has n = 0, but n = 1/],
    [{ shape: 'circular', span: 6, rise: 2, length: 10, unitWeight: 18000 }, /unit_weight needs thickness/],
    [{ shape: 'circular', span: 6, rise: 2, length: 10, g: 100, thickness: 0.2, unitWeight: 18000 }, /either as g or as thickness × unit_weight/],
    [{ shape: 'circular', span: 6, rise: 2, length: 10, g: -100 }, /g must be zero or positive, got -100 Pa/],
    [{ shape: 'circular', span: 6, rise: 2, length: -1, g: 100 }, /length must be positive, got -1 m/],
    [{ shape: 'circular', span: 6, rise: 2, length: 10, g: NaN }, /g must be zero or positive, got NaN/],
    [{ shape: 'cycloid', R0: 4, halfAngle: 90 * deg, length: 10, p: 1000 }, /N_x is unbounded under the plan load p/],
    [{ shape: 2, R0: 4, halfAngle: 90 * deg, length: 10, g: 1000 }, /n = 2 .* N_x is unbounded/],
    [{ shape: 'cycloid', R0: 4, halfAngle: 90 * deg, length: 10, thickness: 0.2, unitWeight: 5000 }, /the intrados would fold/],
  ])('%# %o throws a RangeError naming the option', (o, message) => {
    expect(() => barrelMembrane(o)).toThrow(RangeError);
    expect(() => barrelMembrane(o)).toThrow(message);
  });
});

describe('membraneAt(m, x, φ): range', () => {
  const m = barrelMembrane({ shape: 'parabolic', span: 6, rise: 2, length: 10, g: 2000 });
  it('refuses a point beyond the end walls or the springings', () => {
    expect(() => membraneAt(m, 5.1, 0)).toThrow(/membrane_at: x must be within ±5 m/);
    expect(() => membraneAt(m, 0, -70 * deg)).toThrow(/membrane_at: phi must be within ±53.1301°/);
    expect(() => membraneAt(m, NaN, 0)).toThrow(RangeError);
  });
  it('is symmetric: Nφ, Nx even in φ; Nxφ odd in φ and in x', () => {
    const a = membraneAt(m, 2, 0.4), b = membraneAt(m, 2, -0.4), c = membraneAt(m, -2, 0.4);
    expect(b.N_phi).toBe(a.N_phi);
    expect(b.N_x).toBe(a.N_x);
    expect(b.N_xphi).toBe(-a.N_xphi);
    expect(c.N_xphi).toBe(-a.N_xphi);
  });
});

describe('barrelMembrane over random valid-looking input (property, fast-check)', () => {
  it('either throws a RangeError naming barrel_membrane or returns finite numbers in equilibrium', () => {
    const shape = fc.oneof(fc.constantFrom<string | number>('circular', 'catenary', 'parabolic', 'cycloid'), fc.double({ min: -4, max: 3, noNaN: true }));
    fc.assert(fc.property(
      shape, fc.double({ min: 1, max: 30, noNaN: true }), fc.double({ min: 0.05, max: 1.5, noNaN: true }),
      fc.double({ min: 1, max: 50, noNaN: true }), fc.option(fc.double({ min: 0.05, max: 1, noNaN: true }), { nil: undefined }),
      fc.double({ min: 0, max: 1e4, noNaN: true }), fc.double({ min: 0, max: 1e4, noNaN: true }),
      (sh, span, ratio, length, thickness, g, p) => {
        let m;
        try {
          m = barrelMembrane({ shape: sh, span, rise: ratio * span, length, thickness, g, p });
        } catch (e) {
          expect(e).toBeInstanceOf(RangeError);
          expect((e as Error).message).toMatch(/^barrel_membrane: /);
          return;
        }
        for (const v of Object.values(m)) if (typeof v === 'number') expect(Number.isFinite(v)).toBe(true);
        expect(Math.abs(2 * length * m.V_wall + 2 * m.end_shear - m.W)).toBeLessThanOrEqual(1e-9 * Math.max(m.W, 1));
      },
    ), { numRuns: 40, seed: 20240611 });
  });
});

describe('principal membrane forces along a generatrix: extremes at x = 0 or x = l (endExtremes)', () => {
  // The summary looks for the largest principal forces only at the crown section (x = 0) and at the
  // end walls (x = l), on the derivation in membrane-summary.ts. Here a dense scan of x, which needs
  // no theory, must never find anything beyond those two ends.
  it('a scan of 2001 points along x never beats the two ends (property, fast-check)', () => {
    const force = fc.double({ min: -1e5, max: 1e5, noNaN: true });
    fc.assert(fc.property(force, force, fc.double({ min: -1e4, max: 1e4, noNaN: true }), fc.double({ min: 0.5, max: 40, noNaN: true }), (N_phi, F, G, l) => {
      const ends = endExtremes(N_phi, F, G, l).map(principalForces);
      const endMax = Math.max(ends[0]![0], ends[1]![0]), endMin = Math.min(ends[0]![1], ends[1]![1]);
      const scale = Math.max(Math.abs(N_phi), Math.abs(F) * l, Math.abs(G) * l * l, 1);
      let scanMax = -Infinity, scanMin = Infinity;
      for (let i = 0; i <= 2000; i++) {
        const x = (l * i) / 2000;
        const [n1, n2] = principalForces({ N_phi, N_x: G * (l * l - x * x), N_xphi: F * x });
        scanMax = Math.max(scanMax, n1);
        scanMin = Math.min(scanMin, n2);
      }
      expect(scanMax).toBeLessThanOrEqual(endMax + 1e-12 * scale);
      expect(scanMin).toBeGreaterThanOrEqual(endMin - 1e-12 * scale);
    }), { numRuns: 300, seed: 20261202 });
  });

  it.each(['circular', 'catenary', 'parabolic'])('%s barrel: sigma_max agrees with a dense scan of the whole quarter vault (x and φ)', (shape) => {
    const m = barrelMembrane({ shape, span: 6, rise: 2, length: 10, thickness: 0.15, g: 2700, p: 1500 });
    const phiS = m.profile.phiSpringing;
    let most = 0;
    for (let i = 0; i <= 300; i++) {
      for (let k = 0; k <= 300; k++) most = Math.max(most, -principalForces(membraneAt(m, (5 * i) / 300, (phiS * k) / 300))[1]);
    }
    expectClose(m.sigma_max as number, most / 0.15, 1e-4);
  });
});
