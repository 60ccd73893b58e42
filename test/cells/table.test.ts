/**
 * Sources: linear interpolation between bracketing table rows, and refusing to extrapolate a code
 * table, are common practice in reading design tables; the expected values are hand arithmetic.
 */
import { describe, it, expect } from 'vitest';
import { math } from '../../cells/math.js';
import { interp, clamp } from '../../cells/index.js';

describe('table helpers', () => {
  it('interp(x, xs, ys) reads between rows with units', () => {
    const y = interp.call(math.unit(2.5, 'm'), [math.unit(2, 'm'), math.unit(3, 'm')], [math.unit(10, 'kN'), math.unit(20, 'kN')]);
    expect((y as any).toNumber('kN')).toBeCloseTo(15, 12);
  });
  it('interp refuses to extrapolate outside the table', () => {
    expect(() => interp.call(5, [1, 2], [3, 4])).toThrow(RangeError);
  });
  it('clamp(x, lo, hi) limits x', () => {
    expect((clamp.call(math.unit(7, 'm'), math.unit(3, 'm'), math.unit(6, 'm')) as any).toNumber('m')).toBe(6);
    expect(clamp.call(4, 3, 6)).toBe(4);
  });
});
