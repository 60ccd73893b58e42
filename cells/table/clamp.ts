import { math } from '../math.js';
import { CellArgumentError } from '../define.js';

/**
 * x limited to the interval [lo, hi], with units.
 * @example clamp(7 m, 3 m, 6 m) // 6 m
 */
export function clamp(x: unknown, lo: unknown, hi: unknown): unknown {
  if (math.larger(lo as never, hi as never)) throw new CellArgumentError('clamp: lo must not exceed hi');
  if (math.smaller(x as never, lo as never)) return lo;
  if (math.larger(x as never, hi as never)) return hi;
  return x;
}
