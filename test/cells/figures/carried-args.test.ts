/**
 * Sources: none needed for the engineering — this checks that a figure drawn from a result uses the
 * loads and options of the call that made it, the same drawing as when they are passed again.
 */
import { describe, it, expect } from 'vitest';
import { math } from '../../../cells/math.js';
import { arch_ring, arch_limit, buttress, section, force_polygon, support_figure } from '../../../cells/index.js';
import { KERNEL_ARGS } from '../../../cells/define.js';

const u = (v: number, unit: string) => math.unit(v, unit);
const loads = { live: u(5, 'kN/m^2'), live_from: u(0, 'm'), live_to: u(3, 'm') };
const ring = arch_ring.call({ shape: 'circular', span: u(6, 'm'), rise: u(2, 'm'), thickness: u(0.4, 'm'), unit_weight: u(18, 'kN/m^3'), voussoirs: 60 });
const limit = arch_limit.call(ring, loads);
const options = { height: u(5, 'm'), width: u(1.2, 'm'), depth: u(1, 'm'), unit_weight: u(18, 'kN/m^3'), T: u(20, 'kN'), z_T: u(4.5, 'm'), V: u(30, 'kN'), x_V: u(0.3, 'm') };
const support = buttress.call(options);

describe('figures take the arguments their result was computed with', () => {
  it('a result keeps the SI arguments of its call, out of sight of expressions', () => {
    const args = (limit as Record<symbol, unknown[]>)[KERNEL_ARGS]!;
    expect(args).toHaveLength(2);
    expect(args[1]).toEqual({ live: 5000, live_from: 0, live_to: 3 });
    expect(Object.keys(limit as object)).not.toContain('args');
  });

  it('section(r, a) draws the same as section(r, a, loads) for the loads a was computed for', () => {
    expect(section.call(ring, limit)).toBe(section.call(ring, limit, loads));
  });

  it('force_polygon(r, a) draws the same as force_polygon(r, a, loads)', () => {
    expect(force_polygon.call(ring, limit)).toBe(force_polygon.call(ring, limit, loads));
  });

  it('support_figure(b) draws the same as support_figure(b, options)', () => {
    expect(support_figure.call(support)).toBe(support_figure.call(support, options));
  });
});
