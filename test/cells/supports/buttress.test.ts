import { describe, it, expect } from 'vitest';
import { buttress } from '../../../cells/supports/buttress.js';
import { isNotAvailable } from '../../../cells/not-available.js';
import { expectClose } from '../../helpers/close.js';

/** A field that must be a number here. */
const n = (v: unknown): number => {
  expect(typeof v, `expected a number, got ${String(v)}`).toBe('number');
  return v as number;
};

// A plain rectangular block b wide, H high, d deep, thrust T at the top.
const H = 6, d = 1, gamma = 20e3, T = 10e3;
const block = (b: number, extra: object = {}) => buttress({ height: H, width: b, depth: d, unit_weight: gamma, T, z_T: H, ...extra });

describe('buttress, rectangular block (statics of a rigid block, any statics text)', () => {
  it('buttress({...}) puts the resultant b/2 − T·z/W from the outer toe, eccentricity T·z/W', () => {
    const b = 1.5, W = gamma * H * b * d, r = block(b);
    expectClose(r.N, W, 1e-15);
    expectClose(r.x_R, b / 2 - (T * H) / W, 1e-12);
    expectClose(r.e, (T * H) / W, 1e-12);
    expectClose(r.sf_overturning, (W * b) / 2 / (T * H), 1e-12);
  });

  it('buttress: inside the kern |e| ≤ b/6 the pressure is trapezoidal N/(bd)·(1 ± 6e/b)', () => {
    const b = 2, W = gamma * H * b * d, e = (T * H) / W, r = block(b);
    expect(e).toBeLessThan(b / 6);
    expect(r.middle_third).toBe(true);
    expectClose(n(r.sigma_max), (W / (b * d)) * (1 + (6 * e) / b), 1e-12);
    expectClose(n(r.sigma_min), (W / (b * d)) * (1 - (6 * e) / b), 1e-12);
  });

  it('buttress: at the kern limit e = b/6 the pressure just reaches zero at the heel', () => {
    // e = T·H/(γHbd) = b/6  ⇔  b² = 6T/(γd).
    const b = Math.sqrt((6 * T) / (gamma * d)), r = block(b);
    expectClose(r.e, b / 6, 1e-12);
    expect(r.middle_third).toBe(true);
    expect(Math.abs(n(r.sigma_min))).toBeLessThan(1e-9 * n(r.sigma_max));
    expectClose(n(r.sigma_max), (2 * r.N) / (b * d), 1e-12);
  });

  it('buttress: beyond the kern the base opens and σ_max = 2N/(3·a·d), a from the toe', () => {
    const b = 1.2, r = block(b);
    expect(r.middle_third).toBe(false);
    expect(r.in_base).toBe(true);
    expectClose(n(r.sigma_max), (2 * r.N) / (3 * r.x_R * d), 1e-12);
    expect(r.sigma_min).toBe(0);
  });

  it('buttress: a block that overturns returns in_base = false and a factor below 1, not an exception', () => {
    const r = block(0.5);
    expect(r.in_base).toBe(false);
    expect(r.sf_overturning).toBeLessThan(1);
    expect(r.x_R).toBeLessThan(0);
    expect(isNotAvailable(r.sigma_max) && r.sigma_max.reason).toMatch(/overturns/);
    expect(isNotAvailable(r.sigma_min)).toBe(true);
    expect(block(0.5, { bearing: 1e6 }).bearing_ok).toBe(false);
  });

  it('buttress: the resultant leaves the base exactly where sf_overturning passes 1 (N·x_R = M_restoring − M_overturning)', () => {
    for (const b of [0.6, 0.9, 1, 1.1, 2.5]) {
      const r = block(b);
      expectClose(r.N * r.x_R, r.sf_overturning * T * H - T * H, 1e-9, T * H);
      expect(r.in_base).toBe(r.sf_overturning > 1);
    }
  });

  it('buttress: least widths √(2Tz/(γdH)) for the base and √(6Tz/(γdH)) for the middle third', () => {
    const r = block(1.5);
    expectClose(n(r.width_min_base), Math.sqrt((2 * T * H) / (gamma * d * H)), 1e-12);
    expectClose(n(r.width_min_third), Math.sqrt((6 * T * H) / (gamma * d * H)), 1e-12);
  });

  it('buttress: sliding µN/T and bearing against an allowable pressure', () => {
    const r = block(2, { friction: 0.6, bearing: 150e3 });
    expectClose(n(r.sf_sliding), (0.6 * r.N) / T, 1e-15);
    expect(r.bearing_ok).toBe(n(r.sigma_max) <= 150e3);
    expect(block(2, { bearing: 1e3 }).bearing_ok).toBe(false);
    expect(isNotAvailable(block(2).sf_sliding)).toBe(true);
    expect(isNotAvailable(block(2).bearing_ok)).toBe(true);
  });
});

describe('buttress with steps and a vault load', () => {
  // Hand calculation: base 2.0 × 2 m, then 1.5 × 2 m, top 1.0 × 2 m; V = 20 kN at 0.2 m; T = 10 kN at 5 m.
  const o = { height: 6, width: 1, depth: 1, unit_weight: 20e3, T: 10e3, z_T: 5, V: 20e3, x_V: 0.2,
    steps: [{ height: 2, width: 2 }, { height: 2, width: 1.5 }] };
  const r = buttress(o);

  it('buttress(steps) stacks the setbacks on a plumb inner face (hand calculation)', () => {
    // Weights 80, 60, 40 kN at 1.0, 0.75, 0.5 m from the inner face.
    const M = 80e3 * 1 + 60e3 * 0.75 + 40e3 * 0.5 + 20e3 * 0.2 + 10e3 * 5; // 199 kN·m
    expectClose(r.W_self, 180e3, 1e-15);
    expectClose(r.N, 200e3, 1e-15);
    expectClose(r.x_R, 2 - M / 200e3, 1e-12);
    expectClose(r.sf_overturning, (80e3 * 1 + 60e3 * 1.25 + 40e3 * 1.5 + 20e3 * 1.8) / (10e3 * 5), 1e-12);
  });

  it('buttress: the least widths, fed back, put the resultant on the third point and on the toe', () => {
    // A heavier thrust, so that neither least width is set by a block vanishing.
    const heavy = { ...o, T: 60e3 }, h = buttress(heavy);
    const grow = (w: number) => {
      const dlt = w - 2;
      return buttress({ ...heavy, width: heavy.width + dlt, steps: heavy.steps.map((s) => ({ height: s.height, width: s.width + dlt })) });
    };
    expect(n(h.width_min_base)).toBeGreaterThan(1);
    const third = grow(n(h.width_min_third)), base = grow(n(h.width_min_base));
    expectClose(third.x_R, n(h.width_min_third) / 3, 1e-9);
    expectClose(base.x_R, 0, 1e-9, 1);
  });

  it('buttress: a support that stays within its base however far it is narrowed has no least width (not available, with the reason)', () => {
    // g(Δ) > 0 down to Δ = −1 m, where the 1 m top block is gone: no width bounds it from below.
    expect(isNotAvailable(r.width_min_base) && r.width_min_base.reason).toMatch(/however narrow/);
  });

  it('buttress: the path starts under the vault load and ends at x_R; between, a hand-checked level', () => {
    const top = r.path[0]!, base = r.path[r.path.length - 1]!;
    expectClose(top.z, 6, 1e-15);
    expectClose(top.x, 2 - 0.2, 1e-12);
    expect(base.z).toBe(0);
    expectClose(base.x, r.x_R, 1e-12);
    // At z = 3: top block 40 kN at 0.5 m, 1 m of the middle step 30 kN at 0.75 m, V, T·(5 − 3).
    const at3 = r.path.find((p) => p.z === 3)!;
    expectClose(at3.x, 2 - (40e3 * 0.5 + 30e3 * 0.75 + 20e3 * 0.2 + 10e3 * 2) / 90e3, 1e-12);
  });

  it('buttress: the forces and moments on the free body balance to 1e-9', () => {
    // Σ vertical: base reaction N = masonry + V; Σ moments about the inner heel: N·(B − x_R) = Σ W·x + V·x_V + T·z_T.
    const Mheel = 80e3 * 1 + 60e3 * 0.75 + 40e3 * 0.5 + 20e3 * 0.2 + 10e3 * 5;
    expect(Math.abs(r.N - (r.W_self + 20e3))).toBeLessThan(1e-9 * r.N);
    expect(Math.abs(r.N * (r.base_width - r.x_R) - Mheel)).toBeLessThan(1e-9 * Mheel);
    // The pressure block carries N: trapezoid area (σ_max + σ_min)/2·B·d.
    expectClose(((n(r.sigma_max) + n(r.sigma_min)) / 2) * r.base_width * 1, r.N, 1e-12);
  });
});

describe('buttress against the historic rule for a semicircular vault (common practice)', () => {
  it('buttress: width_min_base stays below the traditional L/4 and width_min_third lies near L/4…L/3', () => {
    // Least-thickness semicircle: t/R = 0.107426, thrust H = 0.621772·w·R with w = γ·t
    // (Cocchetti & Rizzi 2020, eq. 4). Half the arch weight w·πR/2 on the wall at t/2 from its face.
    // The rule: divide the intrados in three, extend the chord from the springing by its
    // own length; for a semicircle its horizontal projection is R/2 = L/4 (geometry).
    const R = 3, L = 2 * R, t = 0.107426 * R, w = 20e3 * t;
    for (const h of [L / 2, L, 2 * L]) {
      const r = buttress({ height: h, width: 1, depth: 1, unit_weight: 20e3, T: 0.621772 * w * R, z_T: h, V: (w * Math.PI * R) / 2, x_V: t / 2 });
      expect(n(r.width_min_base)).toBeLessThan(L / 4);
      expect(n(r.width_min_base)).toBeGreaterThan(L / 10);
      expect(n(r.width_min_third)).toBeGreaterThan(L / 5);
      expect(n(r.width_min_third)).toBeLessThan(L / 3);
    }
  });
});

describe('buttress under a vertical load alone, and a middle third failed on the inner side (issue 15)', () => {
  // A wall 0.45 m wide, 3 m high, 20 kN/m³, carrying 60 kN/m on its inner edge (x_V = 0.05 m) and a small thrust.
  const wall = { height: 3, width: 0.45, depth: 1, unit_weight: 20e3, V: 60e3, x_V: 0.05 };

  it('buttress({T: 0}) is valid: no overturning (∞), no sliding demand (∞), the resultant from moments of weights alone', () => {
    const r = buttress({ ...wall, T: 0, friction: 0.6 });
    const W = 20e3 * 3 * 0.45, xInner = (W * 0.225 + 60e3 * 0.05) / (W + 60e3); // moments about the inner heel
    expectClose(r.x_R, 0.45 - xInner, 1e-12);
    expect(r.sf_overturning).toBe(Infinity);
    expect(r.sf_sliding).toBe(Infinity);
    expect(r.middle_third).toBe(false); // x_inner = 0.107 m < 0.15 m: outside the kern on the inner side
  });

  it('buttress({T: 0}) failing the middle third at 0.45 m: the least width is the larger root of the statics of the widened wall, not a width below 0.45 m', () => {
    const r = buttress({ ...wall, T: 0 });
    // Widened to b: x_inner = (γHb²/2 + V·x_V)/(γHb + V) ≥ b/3  ⇔  γH·b²/6 − V·b/3 + V·x_V ≥ 0 (statics of a rigid block).
    const a2 = (20e3 * 3) / 6, a1 = -60e3 / 3, a0 = 60e3 * 0.05;
    const root = (-a1 + Math.sqrt(a1 * a1 - 4 * a2 * a0)) / (2 * a2); // 1.837 m
    expectClose(n(r.width_min_third), root, 1e-12);
    expect(n(r.width_min_third)).toBeGreaterThan(0.45);
    // Within the base (outer edge: x_inner ≤ b ⇔ γH·b²/2 + V·b − V·x_V ≥ 0) it stays down to 0.049 m, where the
    // load 0.05 m from the inner face is about to hang beyond the outer one.
    const c2 = (20e3 * 3) / 2, c1 = 60e3, c0 = -60e3 * 0.05;
    expectClose(n(r.width_min_base), (-c1 + Math.sqrt(c1 * c1 - 4 * c2 * c0)) / (2 * c2), 1e-9);
  });

  it('buttress: a wall that fails the middle third on the inner side gets a least width wider than itself, which puts the resultant on the inner third point', () => {
    const r = buttress({ ...wall, T: 0.5e3, z_T: 3 });
    expect(r.middle_third).toBe(false);
    const w = n(r.width_min_third);
    expect(w).toBeGreaterThan(0.45); // before issue 15: 0.148 m, from the outer-side condition alone
    // Fed back: x_inner = w/3, i.e. x_R = 2w/3 from the outer toe (statics of the widened block).
    const grown = buttress({ ...wall, T: 0.5e3, z_T: 3, width: w });
    expectClose(grown.x_R, (2 * w) / 3, 1e-9);
    expect(grown.middle_third).toBe(true);
    // Independent check of the closed form: the width where x_inner(b) = b/3, by bisection on b.
    const xin = (b: number) => (20e3 * 3 * b * b / 2 + 60e3 * 0.05 + 0.5e3 * 3) / (20e3 * 3 * b + 60e3);
    let lo = 0.45, hi = 3;
    for (let i = 0; i < 100; i++) { const mid = (lo + hi) / 2; if (xin(mid) < mid / 3) lo = mid; else hi = mid; }
    expectClose(w, hi, 1e-9);
  });
});

describe('buttress refuses bad input', () => {
  const ok = { height: 6, width: 1, depth: 1, unit_weight: 20e3, T: 10e3, z_T: 6 };
  it.each([
    [{ height: 0 }, /height must be positive, got 0 m/],
    [{ width: -1 }, /width must be positive/],
    [{ depth: 0 }, /depth must be positive/],
    [{ unit_weight: 0 }, /unit_weight must be positive/],
    [{ T: -1 }, /T must be zero or more/],
    [{ z_T: 6.5 }, /above the top of the buttress/],
    [{ z_T: 0 }, /z_T must be above the base/],
    [{ friction: 0 }, /friction must be in \(0, 1.5\], got 0/],
    [{ friction: 1.6 }, /friction must be in \(0, 1.5\]/],
    [{ x_V: 1.5 }, /x_V must lie on the top/],
    [{ steps: [{ height: 6, width: 2 }] }, /leaves nothing of the height/],
    [{ steps: [{ height: 2, width: 0 }] }, /steps\[1\].width must be positive/],
    [{ bearing: -1 }, /bearing must be positive/],
  ])('buttress(%j) throws a RangeError naming the option', (bad, msg) => {
    expect(() => buttress({ ...ok, ...bad })).toThrow(RangeError);
    expect(() => buttress({ ...ok, ...bad })).toThrow(msg);
  });
});
