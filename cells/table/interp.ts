/**
 * Linear interpolation in a table, the way values are read from code tables.
 * Works on plain numbers or on mathjs quantities of one dimension per column.
 */
import { math } from '../math.js';
import { CellArgumentError } from '../define.js';

/**
 * y at x by linear interpolation between the bracketing rows of (xs, ys).
 * @param x where to read
 * @param xs strictly increasing abscissae (same dimension as x)
 * @param ys ordinates, one per abscissa
 * @returns the interpolated ordinate; outside the table it refuses rather than extrapolate
 * @example interp(2.5, [2, 3], [10, 20]) // 15
 */
export function interp(x: unknown, xs: unknown[], ys: unknown[]): unknown {
  if (xs.length !== ys.length) throw new CellArgumentError(`interp: xs has ${xs.length} entries but ys has ${ys.length}`);
  if (xs.length < 2) throw new CellArgumentError('interp: a table needs at least two rows');
  for (let i = 1; i < xs.length; i++) {
    if (!math.larger(xs[i] as never, xs[i - 1] as never)) {
      throw new CellArgumentError(`interp: xs must increase strictly (row ${i + 1})`);
    }
  }
  // Is x inside the table? Extrapolating a code table is a decision the engineer makes, not the tool.
  if (math.smaller(x as never, xs[0] as never) || math.larger(x as never, xs[xs.length - 1] as never)) {
    throw new RangeError(`interp: x = ${math.format(x as never, 4)} is outside the table [${math.format(xs[0] as never, 4)}, ${math.format(xs[xs.length - 1] as never, 4)}]`);
  }
  let i = 1;
  while (math.larger(x as never, xs[i] as never)) i++;
  const x0 = xs[i - 1], x1 = xs[i], y0 = ys[i - 1], y1 = ys[i];
  const f = math.divide(math.subtract(x as never, x0 as never), math.subtract(x1 as never, x0 as never)) as unknown as number;
  return math.add(y0 as never, math.multiply(math.subtract(y1 as never, y0 as never), f) as never);
}
