/**
 * Cross vaults by slicing (issue 15). Sources: the method of slices, Heyman, The Stone Skeleton,
 * Cambridge 1995 (from memory); the least thrust of a symmetric arch is the line through the
 * extrados at the crown that just clears the intrados at the haunch, H = max_j M_j/(z_c − z_j)
 * (the classical hand method; Heyman 1969, "The safety of masonry arches", from memory), computed
 * here independently of the arch kernel for every slice; web areas (π − 2)R² per web of a square
 * semicircular vault (closed form, tested for groin_vault).
 */
import { describe, it, expect } from 'vitest';
import { crossVault, type CrossVault } from '../../../../cells/vault/groin/cross-vault.js';
import { crossWebs, webZ, type WebArc } from '../../../../cells/vault/groin/cross-webs.js';
import { groinVault } from '../../../../cells/vault/groin/groin-vault.js';
import { isNotAvailable } from '../../../../cells/not-available.js';
import { cross_vault } from '../../../../cells/vault/register-groin.js';
import { math } from '../../../../cells/math.js';
import { expectClose } from '../../../helpers/close.js';

const n = (v: unknown): number => { expect(typeof v, String(v)).toBe('number'); return v as number; };

/**
 * Least thrust of one slice by hand: the half arch from the crown to φ_g in 400 voussoirs (annular
 * sectors, exact areas and centroids), the line through the extrados of the crown joint, clearing
 * every intrados joint point: H = max_j M_j/(z_c − z_j). A pointed slice's crown joint is the radial
 * joint through the apex of the middle surface, as the arch kernel cuts a pointed ring; the kernel
 * also counts the keystone between the two crown joints, which this hand check leaves out.
 */
function handLeastThrust(w: WebArc, phiG: number, depth: number, gamma: number): { H: number; W: number } {
  const N = 400, ri = w.r - w.h, re = w.r + w.h;
  const zc = w.zc + re * Math.cos(w.phiC); // extrados end of the crown joint
  let W = 0, Mx = 0, H = 0;
  for (let i = 0; i < N; i++) {
    const a = w.phiC + ((phiG - w.phiC) * i) / N, b = w.phiC + ((phiG - w.phiC) * (i + 1)) / N, d = b - a;
    const area = ((re * re - ri * ri) / 2) * d;
    const rc = ((2 / 3) * (re ** 3 - ri ** 3)) / (re * re - ri * ri) * (Math.sin(d / 2) / (d / 2));
    const x = rc * Math.sin((a + b) / 2) - w.c;
    W += gamma * depth * area; Mx += gamma * depth * area * x;
    const xj = ri * Math.sin(b) - w.c, zj = w.zc + ri * Math.cos(b);
    H = Math.max(H, (W * xj - Mx) / (zc - zj));
  }
  return { H, W: 2 * W };
}

function handCorner(v: CrossVault, dir: 'x' | 'y', gamma: number): number {
  const other = dir === 'x' ? v.model.y : v.model.x, dv = other.e / v.slices;
  return v.model.slices.filter((s) => s.web === dir && s.H_min > 0).reduce((sum, s) => sum + handLeastThrust(v.model[dir], s.phi, dv, gamma).H, 0);
}

const gamma = 20e3;
const semi = crossVault({ span_x: 6, span_y: 6, thickness: 0.4, unit_weight: gamma, solid_level: 0 });
const point = crossVault({ span_x: 6, span_y: 6, shape: 'pointed', thickness: 0.4, unit_weight: gamma, solid_level: 0 });

describe('cross_vault by slicing, against closed forms and an independent hand slicing', () => {
  it('the slices carry the whole vault: W within 1 % of the closed-form web area (π − 2)R² × 4 × γt (10 slices per web)', () => {
    const g = groinVault({ span_x: 6, thickness: 0.4, unit_weight: gamma });
    expect(Math.abs(n(semi.W) - g.W) / g.W).toBeLessThan(0.01);
    expectClose(n(semi.V_corner), n(semi.W) / 4, 1e-12);
  });

  it('each corner thrust equals the slice-by-slice hand check of its web: within 0.5 % for semicircular webs; for pointed ones above it by the keystone, within 8 %', () => {
    const hs = handCorner(semi, 'x', gamma), hp = handCorner(point, 'x', gamma);
    expect(Math.abs(n(semi.H_x_min) - hs) / hs).toBeLessThan(0.005);
    expect(n(point.H_x_min)).toBeGreaterThan(hp);
    expect((n(point.H_x_min) - hp) / hp).toBeLessThan(0.08);
  });

  it('pointed webs thrust less per unit weight than semicircular ones of the same span: by the hand check and by the kernel alike', () => {
    const kernel = (n(point.H_x_min) / n(point.V_corner)) / (n(semi.H_x_min) / n(semi.V_corner));
    const hand = (handCorner(point, 'x', gamma) / n(point.V_corner)) / (handCorner(semi, 'x', gamma) / n(semi.V_corner));
    expect(kernel).toBeLessThan(0.7); // about half for a 6 m square bay, t = 0.4 m
    expect(hand).toBeLessThan(0.7);
    expect(Math.abs(kernel - hand) / hand).toBeLessThan(0.08); // the pointed keystone, as above
  });

  it('the membrane solution is kept beside it for semicircular webs; its thrust is one admissible state, not less than the least', () => {
    const m = groinVault({ span_x: 6, thickness: 0.4, unit_weight: gamma });
    expectClose(n(semi.H_x_membrane), m.H_corner_x, 1e-12);
    expectClose(n(semi.z_x_membrane), m.z_thrust, 1e-12);
    expect(n(semi.H_x_min)).toBeLessThanOrEqual(m.H_corner_x);
    expect(isNotAvailable(point.H_x_membrane)).toBe(true);
  });

  it('an oblong bay (6 × 4.2 m, the narrow web stilted): the slices carry groin_vault\'s closed-form load within 0.5 % at 10 slices per web, 0.1 % at 40', () => {
    for (const [slices, tol] of [[10, 0.005], [40, 0.001]] as const) {
      const v = crossVault({ span_x: 6, span_y: 4.2, thickness: 0.25, unit_weight: gamma, solid_level: 0, slices });
      const g = groinVault({ span_x: 6, span_y: 4.2, thickness: 0.25, unit_weight: gamma });
      expect(Math.abs(n(v.W) - g.W) / g.W).toBeLessThan(tol);
      expect(Math.abs(n(v.V_corner) - g.V_corner) / g.V_corner).toBeLessThan(tol);
      expectClose(n(v.H_y_membrane), g.H_corner_y, 1e-12);
    }
  });

  it('an oblong bay (6 × 4.2 m, t = 0.4 m): pointed webs thrust less per unit weight than semicircular ones in both directions, by the kernel and the hand check alike', () => {
    const s6 = crossVault({ span_x: 6, span_y: 4.2, thickness: 0.4, unit_weight: gamma, solid_level: 0 });
    const p6 = crossVault({ span_x: 6, span_y: 4.2, shape: 'pointed', thickness: 0.4, unit_weight: gamma, solid_level: 0 });
    for (const dir of ['x', 'y'] as const) {
      const Hs = n(dir === 'x' ? s6.H_x_min : s6.H_y_min), Hp = n(dir === 'x' ? p6.H_x_min : p6.H_y_min);
      const hs = handCorner(s6, dir, gamma), hp = handCorner(p6, dir, gamma);
      expect(Math.abs(Hs - hs) / hs).toBeLessThan(0.005); // semicircular and stilted slices: the kernel is the hand check
      const kernel = (Hp / n(p6.V_corner)) / (Hs / n(s6.V_corner)), hand = (hp / n(p6.V_corner)) / (hs / n(s6.V_corner));
      // x (the 6 m webs): about 0.5; y (the 4.2 m webs, two-centred to the same crown, steeper): about 0.3.
      expect(kernel).toBeLessThan(dir === 'x' ? 0.6 : 0.4);
      expect(hand).toBeLessThan(dir === 'x' ? 0.6 : 0.4);
      expect(Math.abs(kernel - hand) / hand).toBeLessThan(0.08); // the pointed keystone, as above
    }
  });

  it('slicing converges: 10 and 20 slices per web agree within 4 % on the least corner thrust (midpoint slicing)', () => {
    const fine = crossVault({ span_x: 6, span_y: 6, thickness: 0.4, unit_weight: gamma, solid_level: 0, slices: 20 });
    expect(Math.abs(n(fine.H_x_min) - n(semi.H_x_min)) / n(fine.H_x_min)).toBeLessThan(0.04);
  });

  it('symmetry: a square bay thrusts alike in x and y; an oblong bay turned by 90° swaps them', () => {
    expectClose(n(semi.H_x_min), n(semi.H_y_min), 1e-9);
    const a = crossVault({ span_x: 6, span_y: 4.2, shape: 'pointed', thickness: 0.25, unit_weight: 18e3 });
    const b = crossVault({ span_x: 4.2, span_y: 6, shape: 'pointed', thickness: 0.25, unit_weight: 18e3 });
    expectClose(n(a.H_x_min), n(b.H_y_min), 1e-9);
    expectClose(n(a.z_x_min), n(b.z_y_min), 1e-9);
    expectClose(a.crown, b.crown, 1e-12);
  });

  it('the thrust acts below the crown, and in the least-thrust state it meets the corner plane within the solid pocket or below the springing (inside the pier)', () => {
    for (const v of [semi, point]) {
      expect(n(v.z_x_min)).toBeLessThan(v.crown);
      expect(n(v.z_x_min)).toBeLessThanOrEqual(v.solid_level + 1e-9);
    }
    expect(n(point.z_x_max)).toBeLessThan(point.crown);
    expect(n(point.H_x_max)).toBeGreaterThan(n(point.H_x_min));
    expect(semi.H_x_max).toBe(Infinity); // shallow slices near the crown fit a straight line: no upper bound
  });

  it('pocket fill: below fill_needed a slice holds no line of thrust and the thrust range is not available, with the reason', () => {
    const thin = crossVault({ span_x: 6, span_y: 6, thickness: 0.12, unit_weight: 18e3, dead: 1000 });
    expect(thin.fill_needed).toBeGreaterThan(0);
    expect(thin.solid_level).toBe(thin.fill_needed);
    expect(thin.safe).toBe(true);
    const low = crossVault({ span_x: 6, span_y: 6, thickness: 0.12, unit_weight: 18e3, dead: 1000, solid_level: 0 });
    expect(low.safe).toBe(false);
    expect(isNotAvailable(low.H_x_min) && low.H_x_min.reason).toMatch(/solid higher/);
  });

  it('oblong bays: the narrow web meets the wide one at the same crown (segmental with the same rise, pointed two-centred, semicircular stilted)', () => {
    for (const shape of ['semicircular', 'segmental', 'pointed', 'stilted'] as const) {
      const w = crossWebs(6, 4.2, shape, 0.25, shape === 'segmental' ? 2 : undefined, shape === 'stilted' ? 0.6 : 0);
      expectClose(w.y.crown, w.x.crown, 1e-12);
      expectClose(webZ(w.x, w.x.phiEnd) - w.x.h * Math.cos(w.x.phiEnd), w.x.stilt, 1e-9, 1); // the wide web's intrados springs on its stilt
    }
    expectClose(crossWebs(6, 4.2, 'segmental', 0.25, 2).y.rise, 2, 1e-12);
    expectClose(crossWebs(6, 4.2, 'semicircular', 0.25).y.stilt, 0.9, 1e-12);
  });

  it('cross_vault refuses bad input, naming the option', () => {
    const ok = { span_x: 6, thickness: 0.3, unit_weight: gamma };
    expect(() => crossVault({ ...ok, shape: 'ogee' })).toThrow(/shape must be/);
    expect(() => crossVault({ ...ok, shape: 'segmental' })).toThrow(/rise/);
    expect(() => crossVault({ ...ok, shape: 'pointed', rise: 2 })).toThrow(/at least half its span/);
    expect(() => crossVault({ ...ok, shape: 'stilted' })).toThrow(/stilt/);
    expect(() => crossVault({ ...ok, thickness: 2 })).toThrow(/thickness/);
    expect(() => crossVault({ ...ok, slices: 1 })).toThrow(/slices/);
    expect(() => crossVault({ ...ok, fill_level: 1 })).toThrow(/fill/);
  });

  it('cross_vault refuses a solid pocket so high that no slice above it is wider than two thicknesses (before: W = 0, H = 0 and the heights NaN)', () => {
    const ok = { span_x: 6, thickness: 0.25, unit_weight: gamma };
    // Middle surface radius 3.125 m, intrados 3.0 m: a slice two thicknesses wide (0.5 m) springs where
    // 3.0·sin φ = 0.5, at z = 3.125·cos φ = 3.081 m above the springing (geometry of the circle).
    const zTop = 3.125 * Math.cos(Math.asin(0.5 / 3.0));
    expect(() => crossVault({ ...ok, solid_level: 10 })).toThrow(/solid_level must be below 3\.08 m/);
    expect(() => crossVault({ ...ok, solid_level: zTop + 0.01 })).toThrow(/solid_level/);
    const high = crossVault({ ...ok, solid_level: zTop - 0.2 });
    for (const f of ['W', 'H_x_min', 'z_x_min', 'z_y_min'] as const) expect(Number.isFinite(n(high[f])), f).toBe(true);
  });

  it('cross_vault.call takes units and returns every field', () => {
    const u = (v: number, unit: string) => math.unit(v, unit);
    const r = cross_vault.call({ span_x: u(6, 'm'), span_y: u(4.2, 'm'), shape: 'pointed', thickness: u(250, 'mm'), unit_weight: u(18, 'kN/m^3') }) as Record<string, any>;
    expect(r.H_x_min.toNumber('kN')).toBeGreaterThan(0);
    for (const f of ['H_x_min', 'H_x_max', 'H_y_min', 'H_y_max', 'z_x_min', 'z_x_max', 'z_y_min', 'z_y_max', 'V_corner', 'fill_needed', 'H_x_membrane']) expect(r[f], f).toBeDefined();
  });
});
