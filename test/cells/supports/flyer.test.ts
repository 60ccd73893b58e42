/**
 * Sources: a flat bar as an arch (the least thrust of a straight bar whose line of thrust rises the
 * full vertical depth d of its section between the ends and the middle is H = wL²/(8d), the parabola
 * of a uniformly loaded funicular — any statics text); rigid-block limit analysis of the flying
 * buttress after Heyman, The Stone Skeleton, 1995 (from memory).
 */
import { describe, it, expect } from 'vitest';
import { flyingButtress } from '../../../cells/supports/flyer.js';
import { flying_buttress } from '../../../cells/supports/register.js';
import { math } from '../../../cells/math.js';
import { expectClose } from '../../helpers/close.js';

describe('flying_buttress', () => {
  it('a straight bar, level or inclined: H_min = wL²/(8·d_v) with w the weight per metre of span and d_v the vertical depth (parabolic funicular)', () => {
    for (const rise of [0, 2]) {
      const L = 4, t = 0.4, g = 20e3, f = flyingButtress({ span: L, rise, thickness: t, unit_weight: g });
      const dv = t * Math.hypot(L, rise) / L, w = g * dv;
      expectClose(f.H_min, (w * L * L) / (8 * dv), 1e-9);
      expectClose(f.W, w * L, 1e-12);
      expect(f.H_max).toBe(Infinity); // a straight line of thrust fits along the bar
      expectClose(f.V_wall + f.V_pier, f.W, 1e-12);
    }
  });

  it('a level bar carries half its weight at each end; the line of thrust lies within the bar', () => {
    const f = flyingButtress({ span: 4, rise: 0, thickness: 0.4, unit_weight: 20e3 });
    expectClose(f.V_wall, f.W / 2, 1e-9);
    const m = (f as unknown as { model: { zi: number[]; ze: number[] } }).model;
    f.thrust_min.forEach((p, i) => {
      expect(p.z).toBeGreaterThanOrEqual(m.zi[i]! - 1e-9);
      expect(p.z).toBeLessThanOrEqual(m.ze[i]! + 1e-9);
    });
  });

  it('an arched flyer has a finite range; every vault thrust inside it fits, both extreme lines lie within the bar, and equilibrium holds: H·(z(L) − z(0)) = H·s·L − M(L)', () => {
    const f = flyingButtress({ shape: 'arched', span: 4.5, rise: 2, sag: 0.5, thickness: 0.45, unit_weight: 22e3 });
    expect(f.H_max).toBeGreaterThan(f.H_min);
    expect(Number.isFinite(f.H_max)).toBe(true);
    const m = (f as unknown as { model: { zi: number[]; ze: number[] } }).model;
    for (const line of [f.thrust_min, f.thrust_max]) {
      line.forEach((p, i) => {
        expect(p.z).toBeGreaterThanOrEqual(m.zi[i]! - 1e-7);
        expect(p.z).toBeLessThanOrEqual(m.ze[i]! + 1e-7);
      });
    }
    // Moments about the lower end of the line: V_wall·L − H·(z(0) − z(L)) = moment of the weight about that end... checked as W·x̄ with x̄ from the sections.
    const xs = f.thrust_min.map((p) => p.x);
    const d = m.ze.map((z, i) => z - m.zi[i]!);
    let Wx = 0, W = 0;
    for (let i = 1; i < xs.length; i++) { const dx = xs[i]! - xs[i - 1]!, a = 22e3 * (d[i - 1]! + d[i]!) / 2 * dx; W += a; Wx += a * (xs[i - 1]! + xs[i]!) / 2; }
    const z0 = f.thrust_min[0]!.z, zL = f.thrust_min[xs.length - 1]!.z, L = 4.5;
    expectClose(f.V_wall * L + f.H_min * (z0 - zL), W * L - Wx, 2e-3);
  });

  it('an arched flyer\'s H_min and H_max agree with an independent search: for each H, does a straight line fit between z_i + M/H and z_e + M/H?', () => {
    // Independent of the kernel's linear programme: with H fixed, z(x) = z0 + s·x − M(x)/H lies within the bar
    // iff the straight line z0 + s·x fits between L = z_i + M/H and U = z_e + M/H. The gap
    // g(s) = min(U − s·x) − max(L − s·x) is concave in s, so its maximum is found by ternary search; the
    // feasible H form an interval (projection of a convex set), found by bisection from both sides.
    const o = { shape: 'arched', span: 4.5, rise: 2, sag: 0.5, thickness: 0.45, unit_weight: 22e3 } as const;
    const f = flyingButtress(o);
    const m = (f as unknown as { model: { xs: number[]; zi: number[]; ze: number[] } }).model;
    const { xs, zi, ze } = m;
    // M(x) = ∫₀ˣ (x − ξ)·w(ξ) dξ, w = γ·(z_e − z_i) per metre of span, by Simpson's rule on each interval of a finer grid.
    const depthAt = (x: number) => {
      const i = Math.min(xs.length - 2, Math.floor((x / o.span) * (xs.length - 1)));
      const u = (x - xs[i]!) / (xs[i + 1]! - xs[i]!);
      return (1 - u) * (ze[i]! - zi[i]!) + u * (ze[i + 1]! - zi[i + 1]!);
    };
    const M = xs.map((x) => {
      const n = 200, hh = x / n;
      let sum = 0;
      for (let k = 0; k <= n; k++) {
        const xi = k * hh, wk = k === 0 || k === n ? 1 : k % 2 ? 4 : 2;
        sum += wk * (x - xi) * o.unit_weight * depthAt(xi);
      }
      return (sum * hh) / 3;
    });
    const gap = (H: number) => {
      const g = (s: number) => Math.min(...xs.map((x, i) => ze[i]! + M[i]! / H - s * x)) - Math.max(...xs.map((x, i) => zi[i]! + M[i]! / H - s * x));
      let lo = -10, hi = 10;
      for (let k = 0; k < 200; k++) { const a = lo + (hi - lo) / 3, b = hi - (hi - lo) / 3; if (g(a) < g(b)) lo = a; else hi = b; }
      return g((lo + hi) / 2);
    };
    const fits = (H: number) => gap(H) >= 0;
    // A thrust that fits, found by scanning: 1 … 1000 kN.
    const inside = [1, 2, 5, 10, 20, 50, 100, 200, 500, 1000].map((k) => k * 1e3).find(fits)!;
    expect(inside).toBeDefined();
    const edge = (lo: number, hi: number) => { for (let k = 0; k < 60; k++) { const mid = (lo + hi) / 2; if (fits(mid) === fits(hi)) hi = mid; else lo = mid; } return (lo + hi) / 2; };
    expectClose(f.H_min, edge(1, inside), 1e-5); // 26.10 kN
    expectClose(f.H_max, edge(inside, 1e8), 1e-5); // 1193 kN
  });

  it('H_crush = f·b·t·cos α for a straight bar (uniform stress along it); not available without strength', () => {
    const f = flyingButtress({ span: 4, rise: 3, thickness: 0.4, width: 0.6, unit_weight: 2e4, strength: 4e6 });
    expectClose(f.H_crush as number, 4e6 * 0.6 * 0.4 * (4 / 5), 1e-12);
    expect(typeof flyingButtress({ span: 4, rise: 3, thickness: 0.4, unit_weight: 2e4 }).H_crush).toBe('object');
  });

  it('refuses bad geometry, naming the option', () => {
    expect(() => flyingButtress({ span: 4, rise: 2, thickness: 2, unit_weight: 2e4 })).toThrow(/thickness/);
    expect(() => flyingButtress({ shape: 'arched', span: 4, rise: 2, thickness: 0.4, unit_weight: 2e4 })).toThrow(/sag/);
    expect(() => flyingButtress({ span: 4, rise: -1, thickness: 0.4, unit_weight: 2e4 })).toThrow(/rise/);
    expect(() => flyingButtress({ shape: 'bent', span: 4, rise: 1, thickness: 0.4, unit_weight: 2e4 })).toThrow(/shape/);
  });

  it('flying_buttress.call takes units', () => {
    const u = (v: number, unit: string) => math.unit(v, unit);
    const r = flying_buttress.call({ span: u(4, 'm'), rise: u(0, 'm'), thickness: u(400, 'mm'), unit_weight: u(20, 'kN/m^3') }) as Record<string, any>;
    expectClose(r.H_min.toNumber('kN'), 40, 1e-9);
  });
});
