/**
 * steps(a, b, n): the one function a ```cases line may call besides the library's.
 */
import { math } from '../../cells/math.js';

/**
 * n evenly spaced values from a to b inclusive, keeping units.
 * @param a first value (number or quantity)
 * @param b last value, same dimension as a
 * @param n how many values, a whole number ≥ 0 (0 gives an empty family, reported as such)
 * @example steps(1 m, 2 m, 3) // [1 m, 1.5 m, 2 m]
 */
export function steps(a: unknown, b: unknown, n: unknown): unknown[] {
  if (typeof n !== 'number' || !Number.isInteger(n) || n < 0) throw new RangeError(`steps: n must be a whole number, 0 or more; got ${String(n)}`);
  if (n === 1) return [a];
  const span = math.subtract(b as never, a as never);
  const out: unknown[] = [];
  for (let i = 0; i < n; i++) {
    // The last value is b itself, not a + (b - a), which may differ by rounding.
    out.push(i === n - 1 ? b : math.add(a as never, math.multiply(span, i / (n - 1)) as never));
  }
  return out;
}
