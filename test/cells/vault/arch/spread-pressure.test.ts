// Sources: spread of a wheel load through fill at 2 vertical : 1 horizontal, i.e. 0.5 horizontal per unit
// depth each side (common practice; assessment standards differ — from memory); the resultant of a
// linearly increasing lateral pressure k·γ·z over a height is k·γ·(z2² − z1²)/2 (any soil-mechanics text,
// e.g. Craig, Soil Mechanics, ch. on lateral earth pressure — from memory).
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { voussoirLoads } from '../../../../cells/vault/arch/voussoir-loads.js';

// Segment: intrados radius Ri = (3² + 1.5²)/(2·1.5) = 3.75 m, centre 2.25 m below the springing line.
const options = { shape: 'circular', span: 6, rise: 1.5, thickness: 0.34, unit_weight: 18e3, voussoirs: 200, depth: 2 };
const fill = { fill_unit_weight: 19e3, fill_level: 2.24 };
const Re = 3.75 + 0.34;
const extradosY = (x: number) => Math.sqrt(Re * Re - (x - 3) ** 2) - 2.25;

describe('load spread through the fill', () => {
  it('a point load spread at s per unit depth is the same as a plan load P/(2·s·d) over the width 2·s·d, d the fill over the extrados at the load', () => {
    const [P, at, s] = [80e3, 1.7, 0.5];
    const d = fill.fill_level - extradosY(at);
    const half = s * d;
    const spread = archLimit(archRing(options), { ...fill, P, P_at: at, spread: s });
    const patch = archLimit(archRing(options), { ...fill, live: P / (2 * half) / options.depth, live_from: at - half, live_to: at + half });
    expectClose(spread.load_factor, patch.load_factor, 1e-9);
    expectClose(spread.H_min, patch.H_min, 1e-9);
    expect(spread.load_spread).toMatch(/0\.5 horizontal per unit depth/);
  });

  it('the default is no spread, stated on the result, and it is the conservative choice (λ lower)', () => {
    const none = archLimit(archRing(options), { ...fill, P: 80e3, P_at: 1.7 });
    const spread = archLimit(archRing(options), { ...fill, P: 80e3, P_at: 1.7, spread: 0.5 });
    expect(none.load_spread).toMatch(/no spread/);
    expect(none.load_factor).toBeLessThan(spread.load_factor);
  });
});

describe('fill pressure on the haunches', () => {
  it('the horizontal force on each half is k·γ·b·(h − y_s)²/2 below the fill level, towards the crown, and balances across the crown', () => {
    const k = 0.4;
    const ring = archRing(options);
    const { fixed } = voussoirLoads(ring, ring.thickness, { ...fill, fill_pressure: k });
    const left = fixed.filter((_, i) => i < 100).reduce((s, f) => s + (f.Fx ?? 0), 0);
    const right = fixed.filter((_, i) => i >= 100).reduce((s, f) => s + (f.Fx ?? 0), 0);
    // The springing joint is radial: its extrados end is at x = 3 − Re·sin θs (sin θs = 3/3.75) from the left springing.
    const xs = 3 - Re * (3 / 3.75);
    const yTop = Math.min(fill.fill_level, extradosY(3));
    const y0 = extradosY(xs);
    const expected = (k * 19e3 * 2 * ((fill.fill_level - y0) ** 2 - (fill.fill_level - yTop) ** 2)) / 2;
    expectClose(left, expected, 1e-6);
    expectClose(right, -expected, 1e-6);
  });

  it('pressure of the fill on the haunches raises λ under an axle (it resists the sway of the loaded haunch)', () => {
    const a = archLimit(archRing(options), { ...fill, P: 80e3, P_at: 1.7 });
    const b = archLimit(archRing(options), { ...fill, P: 80e3, P_at: 1.7, fill_pressure: 0.4 });
    expect(b.load_factor).toBeGreaterThan(a.load_factor);
  });
});
