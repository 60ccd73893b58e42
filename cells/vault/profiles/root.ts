/**
 * Root of a continuous function inside a bracket, for the span/rise solves
 * of profiles whose closed form cannot be inverted (catenary, cycloid, power).
 */

/**
 * x in [lo, hi] with f(x) = 0, by bisection: slow but it cannot leave the
 * bracket or fail to converge, which matters more here than speed.
 * @param f continuous function with f(lo) and f(hi) of opposite signs (or one zero)
 * @param lo lower end of the bracket
 * @param hi upper end of the bracket
 * @param what name used in the error message when the bracket holds no sign change
 * @returns the root to within a few ulps
 * @example findRoot((x) => x * x - 2, 0, 2, 'sqrt2') // 1.4142135623730951
 */
export function findRoot(f: (x: number) => number, lo: number, hi: number, what: string): number {
  let flo = f(lo);
  const fhi = f(hi);
  if (flo === 0) return lo;
  if (fhi === 0) return hi;
  if (!(Math.sign(flo) !== Math.sign(fhi))) {
    throw new RangeError(`${what}: no solution between ${lo} and ${hi} (f = ${flo} and ${fhi})`);
  }
  for (let i = 0; i < 2000; i++) {
    const mid = lo + (hi - lo) / 2;
    if (mid <= lo || mid >= hi) break;
    const fm = f(mid);
    if (fm === 0) return mid;
    if (Math.sign(fm) === Math.sign(flo)) {
      lo = mid;
      flo = fm;
    } else {
      hi = mid;
    }
  }
  return lo + (hi - lo) / 2;
}
