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

/**
 * The half slice by hand for its statics at the springing: weight and centroid of the 400 annular
 * sectors from the crown joint to φ_g, and the least and greatest thrusts of the classical hand method
 * (least: the line through the extrados of the crown joint clearing every intrados joint point, as
 * above; greatest: through the intrados of the crown joint, under every extrados joint point lower than
 * it, H = min_j M_j/(z_c − z_j) — Heyman 1969, from memory).
 */
function handHalfSlice(w: WebArc, phiG: number, depth: number, gamma: number) {
  const N = 400, ri = w.r - w.h, re = w.r + w.h;
  const topE = w.zc + re * Math.cos(w.phiC), topI = w.zc + ri * Math.cos(w.phiC);
  let W = 0, Mx = 0, Hmin = 0, Hmax = Infinity;
  for (let i = 0; i < N; i++) {
    const a = w.phiC + ((phiG - w.phiC) * i) / N, b = w.phiC + ((phiG - w.phiC) * (i + 1)) / N, d = b - a;
    const area = ((re * re - ri * ri) / 2) * d;
    const rc = ((2 / 3) * (re ** 3 - ri ** 3)) / (re * re - ri * ri) * (Math.sin(d / 2) / (d / 2));
    W += gamma * depth * area; Mx += gamma * depth * area * (rc * Math.sin((a + b) / 2) - w.c);
    Hmin = Math.max(Hmin, (W * (ri * Math.sin(b) - w.c) - Mx) / (topE - (w.zc + ri * Math.cos(b))));
    const ze = w.zc + re * Math.cos(b);
    if (ze < topI) Hmax = Math.min(Hmax, (W * (re * Math.sin(b) - w.c) - Mx) / (topI - ze));
  }
  return { W, xbar: Mx / W, Hmin, Hmax, topE, topI };
}

/**
 * Independent statics of the corner (no thrust_line, no arch_limit): each half slice, pushed at its crown
 * by H (least: at the extrados of the crown joint; greatest: at its intrados) and loaded by its weight at
 * its centroid, is balanced by the groin at the point P of its springing joint (radius ρ from the centre,
 * at φ_g) about which those two have no moment: H·(z_top − z_P) = (W/2)·(x_P − x̄), so
 * ρ = [H·(z_top − z_c) + (W/2)·(c + x̄)] / [H·cos φ_g + (W/2)·sin φ_g].
 * Gathered on the quarter's groin: z = ΣH·z_P/ΣH, a = ΣV·(e − x)/ΣV (the crossing web's slices and the
 * slivers at the plan points the kernel reports for them), and, by a second route, the resultant's
 * crossing of the corner plane from moments about the corner of the crown thrusts and the half slices'
 * weights: z_T = [ΣH·z_top − Σ(W/2)·(e − x̄) − ΣV_other·(e − v)] / ΣH.
 */
function handCornerStatics(v: CrossVault, dir: 'x' | 'y', which: 'min' | 'max', gamma: number) {
  const own = v.model[dir], other = v.model[dir === 'x' ? 'y' : 'x'], dv = other.e / v.slices, e = own.e;
  let H = 0, Hz = 0, V = 0, Va = 0, Mc = 0;
  for (const s of v.model.slices) {
    const load = (W: number, x: number) => { V += W; Va += W * (e - x); Mc -= W * (e - x); };
    if (s.web !== dir) { load(s.W / 2, s.v); continue; }
    if (!(s.H_min > 0)) { load(s.W / 2, s.u); continue; } // a sliver at the crown: its weight straight onto the groin
    const h = handHalfSlice(own, s.phi, dv, gamma);
    const Hk = which === 'min' ? h.Hmin : h.Hmax, top = which === 'min' ? h.topE : h.topI;
    const rho = (Hk * (top - own.zc) + h.W * (own.c + h.xbar)) / (Hk * Math.cos(s.phi) + h.W * Math.sin(s.phi));
    const xP = rho * Math.sin(s.phi) - own.c, zP = own.zc + rho * Math.cos(s.phi);
    H += Hk; Hz += Hk * zP; V += h.W; Va += h.W * (e - xP);
    Mc += Hk * top - h.W * (e - h.xbar);
  }
  return { H, V, z: Hz / H, a: Va / V, zT: Mc / H };
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
    expectClose(n(a.a_x_min), n(b.a_y_min), 1e-9);
    expectClose(n(semi.z_x_min), n(semi.z_y_min), 1e-9);
    expectClose(a.crown, b.crown, 1e-12);
  });

  // Square and oblong bays of every shape (self-weight only, which the hand statics takes).
  const bays: Array<[string, CrossVault, number]> = [
    ['square semicircular', semi, gamma],
    ['square pointed', point, gamma],
    ['oblong semicircular (narrow web stilted)', crossVault({ span_x: 6, span_y: 4.2, thickness: 0.25, unit_weight: 18e3 }), 18e3],
    ['oblong segmental', crossVault({ span_x: 6, span_y: 4.2, shape: 'segmental', rise: 2, thickness: 0.25, unit_weight: 18e3 }), 18e3],
    ['oblong stilted', crossVault({ span_x: 6, span_y: 4.2, shape: 'stilted', stilt: 0.6, thickness: 0.25, unit_weight: 18e3 }), 18e3],
    ['oblong pointed on its solid pocket', crossVault({ span_x: 6, span_y: 4.2, shape: 'pointed', thickness: 0.25, unit_weight: 18e3 }), 18e3],
  ];

  it('the corner thrust acts within the vault, above the springing and below the crown, least and greatest alike: against the independent hand statics of every slice', () => {
    let checked = 0;
    for (const [name, v, g] of bays) {
      for (const dir of ['x', 'y'] as const) {
        for (const which of ['min', 'max'] as const) {
          const z = v[`z_${dir}_${which}`];
          if (which === 'max' && v[`H_${dir}_max`] === Infinity) {
            // Shallow slices near the crown fit a straight line: no greatest thrust, so no height for it.
            expect(isNotAvailable(z) && z.reason, `${name} ${dir} max`).toMatch(/unbounded/);
            continue;
          }
          const hand = handCornerStatics(v, dir, which, g);
          expect(n(z), `${name} z_${dir}_${which}`).toBeGreaterThanOrEqual(0);
          expect(n(z), `${name} z_${dir}_${which}`).toBeLessThan(v.crown);
          expect(hand.z, `${name}: the hand statics too`).toBeGreaterThanOrEqual(0);
          expect(hand.z).toBeLessThan(v.crown);
          // Hand statics against the kernel: 400 voussoirs against 24 and the hand least thrust within 0.5 % of
          // the kernel's (above) move the heights by millimetres; a pointed slice's keystone, which the hand
          // statics leaves out, moves its least thrust by up to 8 % and the mean height by a few centimetres:
          // 0.5 % of the crown height for round webs and for every greatest thrust, 2 % for pointed least thrusts.
          const tol = v.shape === 'pointed' && which === 'min' ? 0.02 : 0.005;
          expect(Math.abs(n(z) - hand.z) / v.crown, `${name} z_${dir}_${which}: kernel ${n(z)} m, hand ${hand.z} m`).toBeLessThan(tol);
          expect(Math.abs(n(v[`a_${dir}_${which}`]) - hand.a) / v.crown, `${name} a_${dir}_${which}`).toBeLessThan(tol);
          checked++;
        }
      }
    }
    expect(checked).toBe(16); // 12 least-thrust states and the 4 bounded greatest ones (pointed webs)
  });

  it('the resultant of H and V crosses the corner plane at z − a·V/H; by moments of the crown thrusts and half-slice weights about the corner it is the same, and for the least thrust mostly below the springing', () => {
    const below: string[] = [];
    for (const [name, v, g] of bays) {
      for (const dir of ['x', 'y'] as const) {
        const zT = n(v[`z_${dir}_min`]) - (n(v[`a_${dir}_min`]) * n(v.V_corner)) / n(v[`H_${dir}_min`]);
        if (zT < 0) below.push(`${name} ${dir}`);
        if (v.shape === 'pointed') continue; // the keystone moves the pointed least thrust (above): not a test of this statics
        // The hand's crown route against the kernel's springing reactions; the tolerance as for the heights above.
        expect(Math.abs(zT - handCornerStatics(v, dir, 'min', g).zT) / v.crown, `${name} ${dir}`).toBeLessThan(0.005);
      }
    }
    const zTmax = n(point.z_x_max) - (n(point.a_x_max) * n(point.V_corner)) / n(point.H_x_max);
    expect(Math.abs(zTmax - handCornerStatics(point, 'x', 'max', gamma).zT) / point.crown).toBeLessThan(0.005);
    // The slices' least thrusts, with no thrust between the groins, leave V/H at 2.5 to 7.5: the resultant reaches the
    // springing level inside the clear span. Reported (z − a·V/H), not hidden: 10 of the 12 cases here.
    expect(below.length).toBe(10);
    expect(below).not.toContain('oblong semicircular (narrow web stilted) y');
  });

  it('the greatest thrust, where bounded, exceeds the least and acts higher', () => {
    expect(n(point.H_x_max)).toBeGreaterThan(n(point.H_x_min));
    expect(n(point.z_x_max)).toBeGreaterThan(n(point.z_x_min));
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

  it('crossWebs keeps a square bay\'s semicircular webs semicircular, stilt exactly 0, whatever the span (before: a rounding residue of 7e-17 m made them "stilted" in cross_vault_figure\'s headings for a 16 ft bay)', () => {
    // 16 ft = 4.8768 m, 0.75 ft = 0.2286 m (NIST SP 811: 1 ft = 0.3048 m); the other spans and thicknesses are arbitrary.
    for (const [span, t] of [[4.8768, 0.2286], [3.6, 0.1025], [5.1, 0.33], [7.3, 0.29]] as const) {
      const w = crossWebs(span, span, 'semicircular', t);
      for (const web of [w.x, w.y]) {
        expect(web.shape, `${span} m, t ${t} m`).toBe('semicircular');
        expect(web.stilt, `${span} m, t ${t} m`).toBe(0);
      }
      const seg = crossWebs(span, span * 0.8, 'segmental', t, span / 4);
      expect(seg.x.shape).toBe('segmental');
      expect(seg.x.stilt).toBe(0);
      expect(seg.x.rise).toBe(span / 4); // the rise given, not the rise recovered from the crown height
    }
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
    for (const f of ['H_x_min', 'H_x_max', 'H_y_min', 'H_y_max', 'z_x_min', 'z_x_max', 'z_y_min', 'z_y_max', 'a_x_min', 'a_x_max', 'a_y_min', 'a_y_max', 'V_corner', 'fill_needed', 'H_x_membrane']) expect(r[f], f).toBeDefined();
  });
});
