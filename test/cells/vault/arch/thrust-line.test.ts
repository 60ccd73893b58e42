import { describe, it, expect } from 'vitest';
import { archRing } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from './loose-limit.js';
import { thrustLine } from '../../../../cells/vault/arch/thrust-line.js';
import { archFigure } from '../../../../cells/vault/arch/arch-figure.js';
import type { Point } from '../../../../cells/vault/profile.js';
import { numberField } from '../../../helpers/close.js';

const R = 5;
const t = 0.75;
const ring = archRing({ shape: 'circular', radius: R, half_angle: Math.PI / 2, thickness: t, unit_weight: 2e4, voussoirs: 120 });
const limit = archLimit(ring);
/** Distance from the centre of the semicircle, which is the origin of the ring's frame. */
const radial = (pts: Point[]) => pts.map((p) => Math.hypot(p.x, p.y));

describe('thrustLine', () => {
  it('thrustLine(semicircle, {}, H) lies within the ring for H from H_min to H_max — safe theorem (Heyman 1966)', () => {
    for (const f of [0, 0.25, 0.5, 0.75, 1]) {
      const pts = thrustLine(ring, {}, numberField(limit.H_min) + f * (numberField(limit.H_max) - numberField(limit.H_min)));
      expect(pts.length).toBe(ring.joints.length);
      for (const r of radial(pts)) {
        expect(r).toBeGreaterThanOrEqual(R - t / 2 - 1e-9);
        expect(r).toBeLessThanOrEqual(R + t / 2 + 1e-9);
      }
    }
  });

  it('thrustLine(semicircle, {}, H_min) touches the extrados at the crown and the intrados at the haunches', () => {
    const r = radial(thrustLine(ring, {}, numberField(limit.H_min)));
    expect(r[60]).toBeCloseTo(R + t / 2, 9);
    expect(Math.min(...r)).toBeCloseTo(R - t / 2, 9);
  });

  it('thrustLine(semicircle, {}, H) refuses an H outside [H_min, H_max] and names the range; H_min and H_max themselves give a line in the ring', () => {
    // Safe theorem (Heyman 1966): a line of thrust within the ring exists exactly for H in [H_min, H_max].
    const range = /no line of thrust within the ring: it lies outside H_min = \d+(\.\d+)? N … H_max = \d+(\.\d+)? N/;
    expect(() => thrustLine(ring, {}, numberField(limit.H_min) * 0.9)).toThrow(range);
    expect(() => thrustLine(ring, {}, numberField(limit.H_max) * 1.1)).toThrow(range);
    for (const H of [numberField(limit.H_min), numberField(limit.H_max)]) {
      expect(radial(thrustLine(ring, {}, H)).every((r) => r >= R - t / 2 - 1e-6 && r <= R + t / 2 + 1e-6)).toBe(true);
    }
  });

  it('thrustLine(thin parabola, uniform plan load, mid-range H) runs along the centreline — funicular of a uniform load (common practice)', () => {
    const thin = archRing({ shape: 'parabolic', span: 10, rise: 2.5, thickness: 0.02, unit_weight: 20e3 });
    const a = archLimit(thin, { dead: 1e6 });
    const pts = thrustLine(thin, { dead: 1e6 }, (numberField(a.H_min) + numberField(a.H_max)) / 2);
    const off = thin.joints.map((j, k) => Math.hypot(pts[k]!.x - j.mid.x, pts[k]!.y - j.mid.y));
    expect(Math.max(...off)).toBeLessThan(0.05 * 0.01);
  });

  it('thrustLine refuses asymmetric loads and a non-positive H with a RangeError', () => {
    expect(() => thrustLine(ring, { P: 1e3, P_at: 2 }, 5e4)).toThrow(/symmetric/);
    expect(() => thrustLine(ring, {}, 0)).toThrow(/H must be positive/);
  });
});

describe('archFigure', () => {
  it('archFigure(semicircle) gives the faces, the joints and the two extreme lines of thrust, all within the ring', () => {
    const fig = archFigure(ring);
    expect(fig.joints.length).toBe(ring.joints.length);
    expect(fig.intrados.length).toBe(4 * 120 + 1);
    for (const r of radial(fig.intrados)) expect(r).toBeCloseTo(R - t / 2, 9);
    for (const r of radial(fig.extrados)) expect(r).toBeCloseTo(R + t / 2, 9);
    for (const line of [fig.thrust_min!, fig.thrust_max!]) {
      for (const r of radial(line)) expect(Math.abs(r - R)).toBeLessThanOrEqual(t / 2 + 1e-9);
    }
  });

  it('archFigure(a ring too thin to stand) has no lines of thrust', () => {
    const thin = archRing({ shape: 'circular', radius: R, half_angle: Math.PI / 2, thickness: 0.3, unit_weight: 2e4, voussoirs: 60 });
    const fig = archFigure(thin);
    expect(fig.thrust_min).toBeUndefined();
    expect(fig.thrust_max).toBeUndefined();
  });
});
