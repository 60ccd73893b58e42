import { describe, it, expect } from 'vitest';
import { groinVault } from '../../../../cells/vault/groin/groin-vault.js';
import { expectClose } from '../../../helpers/close.js';
import { meshHalfWeb, round, twoCentred, type TestProfile } from './mesh.js';

const PI = Math.PI;

/** Half vault x > 0 from the test's own mesh: (own = barrel spanning x, other = barrel spanning y). */
function meshHalfVault(X: TestProfile, Y: TestProfile, n = 160) {
  const mx = meshHalfWeb(X, Y, n), my = meshHalfWeb(Y, X, n);
  const W_half = 2 * mx.load + 2 * my.load;
  return { area_web_x: 2 * mx.area, area_web_y: 2 * my.area, W_half, x_half: (2 * mx.mx + 2 * my.my) / W_half };
}

describe('groinVault, square semicircular vault under uniform surface weight g', () => {
  const R = 4, g = 3.6e3;
  const v = groinVault({ span_x: 2 * R, g });

  it('groinVault({span_x: 2R, g}) gives one web (π − 2)R² (exact integration of R/√(R² − y²) over the web)', () => {
    // ∫_{−R}^{R} (R − |y|)·R/√(R² − y²) dy = 2R(R·π/2 − R) = (π − 2)R².
    expectClose(v.area_web_x, (PI - 2) * R * R, 1e-12);
    expectClose(v.area_web_y, (PI - 2) * R * R, 1e-12);
    expectClose(v.area, 4 * (PI - 2) * R * R, 1e-12);
  });

  it('groinVault: half-vault weight 2(π − 2)gR² ≈ 2.28 gR², centroid 0.532R from the cut (Heyman, Equilibrium of Shell Structures 1977, cross-vault chapter, from memory)', () => {
    expectClose(v.W_half, 2 * (PI - 2) * g * R * R, 1e-12);
    expectClose(v.W_half / (g * R * R), 2.28, 2e-3);
    // Own exact integration: ∫x dA = πR³/4 (whole web) + 2R³(1 − π/4) (two half webs) = (2 − π/4)R³.
    expectClose(v.x_half, ((2 - PI / 4) / (2 * (PI - 2))) * R, 1e-12);
    expectClose(v.x_half / R, 0.532, 1e-3);
    expectClose(1 - v.x_half / R, 0.468, 2e-3);
  });

  it('groinVault: crown hoop force gR, thrust across the cut 2gR² (Heyman 1977, from memory; membrane N_φ = −gR cos φ)', () => {
    expectClose(v.N_crown, -g * R, 1e-12);
    expectClose(v.thrust_cut, 2 * g * R * R, 1e-12);
    expectClose(v.H_corner_x, g * R * R, 1e-12);
    expectClose(v.H_corner_y, g * R * R, 1e-12);
    expectClose(v.H_corner, Math.SQRT2 * g * R * R, 1e-12);
    expectClose(v.V_corner, (PI - 2) * g * R * R, 1e-12);
  });

  it('groinVault: corner thrust 0.534R below the crown, 0.466R above the springing (Heyman 1977, from memory)', () => {
    // Own closed form: h = W_half(R − x_half)/(2gR²) = (9π/4 − 6)R/2.
    expectClose(v.h_thrust, ((9 * PI) / 4 - 6) / 2 * R, 1e-12);
    expectClose(v.h_thrust / R, 0.534, 1e-3);
    expectClose(v.z_thrust / R, 0.466, 1e-3);
    expect(v.ridge_load_x).toBe(0);
  });

  it('groinVault agrees with an independent triangulation of the surface (polyhedral mesh, bisected groins)', () => {
    const m = meshHalfVault(round(R), round(R));
    expectClose(v.area_web_x, m.area_web_x, 1e-4);
    expectClose(v.W_half / g, m.W_half, 1e-4);
    expectClose(v.x_half, m.x_half, 1e-4);
  });
});

describe('groinVault on other plans and shapes, against the independent mesh', () => {
  it('groinVault({span_x: 8, span_y: 6}) stilts the narrow barrel by 1 m to the same crown', () => {
    const v = groinVault({ span_x: 8, span_y: 6, g: 1 });
    const m = meshHalfVault(round(4), round(3, 1));
    expectClose(v.crown, 4, 1e-15);
    expectClose(v.area_web_x, m.area_web_x, 1e-4);
    expectClose(v.area_web_y, m.area_web_y, 1e-4);
    expectClose(v.W_half, m.W_half, 1e-4);
    expectClose(v.x_half, m.x_half, 1e-4);
    const my = meshHalfVault(round(3, 1), round(4));
    expectClose(v.x_half_y, my.x_half, 1e-4);
    // Crown hoop forces gR of each barrel.
    expectClose(v.N_crown, -4, 1e-12);
    expectClose(v.N_crown_y, -3, 1e-12);
  });

  it('groinVault({shape: "pointed"}) is equilateral: radius = span, ridge at 30°', () => {
    const a = 4, g = 1;
    const v = groinVault({ span_x: 2 * a, shape: 'pointed', g });
    const m = meshHalfVault(twoCentred(2 * a, a), twoCentred(2 * a, a));
    expectClose(v.crown, Math.sqrt(3) * a, 1e-14);
    expectClose(v.area_web_x, m.area_web_x, 1e-4);
    expectClose(v.x_half, m.x_half, 1e-4);
    // Membrane hoop force at the ridge −g·r·cos 30°; its horizontal part crosses the cut.
    expectClose(v.N_crown, -g * 2 * a * Math.cos(PI / 6), 1e-12);
    expectClose(v.thrust_cut, g * 2 * a * Math.cos(PI / 6) ** 2 * 2 * a, 1e-12);
    expectClose(v.ridge_load_x, 2 * g * 2 * a * Math.cos(PI / 6) * 0.5, 1e-12);
  });

  it('groinVault with a thickness analyses the middle surface, R = span/2 + t/2', () => {
    const v = groinVault({ span_x: 8, thickness: 0.4, unit_weight: 20e3 });
    expectClose(v.area_web_x, (PI - 2) * 4.2 ** 2, 1e-12);
    expectClose(v.W, 4 * (PI - 2) * 4.2 ** 2 * 0.4 * 20e3, 1e-12);
    expectClose(v.crown, 4.2, 1e-15);
  });

  it('groinVault: dead and live load per plan area add p·(plan of the middle surface)', () => {
    const bare = groinVault({ span_x: 8, span_y: 6, g: 2e3 });
    const loaded = groinVault({ span_x: 8, span_y: 6, g: 2e3, dead: 1.5e3, live: 2e3 });
    expectClose(loaded.W - bare.W, 3.5e3 * 8 * 6, 1e-12);
    // A uniform plan load has its half-vault centroid at the quarter point of the plan.
    const dW = loaded.W_half - bare.W_half;
    expectClose((loaded.W_half * loaded.x_half - bare.W_half * bare.x_half) / dW, 2, 1e-12);
  });

  it('groinVault: pocket fill weighs γ_f·∫(z_f − extrados)⁺ over the plan (independent plan-grid sum)', () => {
    const R = 4, t = 0.3, zf = 2, gf = 16e3;
    const bare = groinVault({ span_x: 2 * R, thickness: t, unit_weight: 18e3 });
    const v = groinVault({ span_x: 2 * R, thickness: t, unit_weight: 18e3, fill_level: zf, fill_unit_weight: gf });
    // Plan of the middle surface, |x|, |y| ≤ R + t/2; each web's fill from its own extrados circle.
    const e = R + t / 2, ro = R + t, n = 1200;
    let fill = 0;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const x = ((i + 0.5) / n) * e, y = ((j + 0.5) / n) * e;
      const u = Math.min(x, y); // the web whose surface varies with the smaller coordinate
      fill += Math.max(0, zf - Math.sqrt(Math.max(0, ro * ro - u * u)));
    }
    fill *= 4 * gf * (e / n) ** 2;
    expectClose(v.W - bare.W, fill, 2e-4);
    expect(v.z_thrust).toBeLessThan(bare.z_thrust);
  });
});

describe('groinVault: global equilibrium of the result', () => {
  const cases = [
    { span_x: 8, g: 3e3 },
    { span_x: 9, span_y: 6, thickness: 0.3, unit_weight: 18e3, fill_level: 2.5, fill_unit_weight: 16e3, dead: 1e3, live: 2e3 },
    { span_x: 7, span_y: 10, shape: 'pointed', thickness: 0.25, unit_weight: 20e3, fill_level: 3, fill_unit_weight: 15e3 },
  ];
  for (const o of cases) {
    it(`groinVault(${JSON.stringify(o)}) balances forces and moments to 1e-9`, () => {
      const v = groinVault(o);
      const ex = o.span_x / 2 + (o.thickness ?? 0) / 2, ey = (o.span_y ?? o.span_x) / 2 + (o.thickness ?? 0) / 2;
      // Vertical: four corners carry the whole load; each half vault two corners.
      expectClose(4 * v.V_corner, v.W, 1e-12);
      expectClose(2 * v.V_corner, v.W_half, 1e-9);
      expectClose(2 * v.V_corner, v.W_half_y, 1e-9);
      // Horizontal: the corners of a half vault resist the force across the cut.
      expectClose(2 * v.H_corner_x, v.thrust_cut, 1e-12);
      expectClose(2 * v.H_corner_y, v.thrust_cut_y, 1e-12);
      // Moments of the half vault x > 0 about the corner line (y-axis through x = e_x, z = z_thrust):
      // weight W_half at x_half, cut force at the crown, corner reactions through the axis.
      const mx = v.W_half * (ex - v.x_half) - v.thrust_cut * (v.crown - v.z_thrust);
      expect(Math.abs(mx)).toBeLessThan(1e-9 * v.W_half * ex);
      const my = v.W_half_y * (ey - v.x_half_y) - v.thrust_cut_y * (v.crown - v.z_thrust_y);
      expect(Math.abs(my)).toBeLessThan(1e-9 * v.W_half_y * ey);
    });
  }
});

describe('groinVault refuses bad input', () => {
  it.each([
    [{ span_x: -8, g: 1 }, /span_x must be positive, got -8 m/],
    [{ span_x: 8, span_y: 0, g: 1 }, /span_y must be positive/],
    [{ span_x: 8, g: 1, shape: 'gothic' }, /shape must be "semicircular" or "pointed"/],
    [{ span_x: 8, g: 1, unit_weight: 18e3, thickness: 0.2 }, /either g or thickness × unit_weight/],
    [{ span_x: 8 }, /self-weight needs g, or thickness and unit_weight/],
    [{ span_x: 8, thickness: 4, unit_weight: 18e3 }, /thickness must be less than half the smaller span/],
    [{ span_x: 8, g: 1, fill_level: 2 }, /fill_level needs fill_unit_weight/],
    [{ span_x: 8, g: 1, live: -1 }, /live must be zero or more/],
  ])('groinVault(%j) throws a RangeError naming the option', (o, msg) => {
    expect(() => groinVault(o as never)).toThrow(RangeError);
    expect(() => groinVault(o as never)).toThrow(msg);
  });
});
