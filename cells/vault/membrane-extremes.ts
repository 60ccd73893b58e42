/**
 * Largest value of a membrane force over the vault, for the summary fields.
 */

/** Where a function is largest on an interval, and the value there. */
export interface Largest {
  value: number;
  at: number;
}

const GOLD = (Math.sqrt(5) - 1) / 2;

/**
 * Maximum of f on [lo, hi]: a scan of n + 1 evenly spaced points (ends
 * included) finds the best sample; a golden-section search (Kiefer 1953) on
 * the two neighbouring intervals then refines it. Membrane forces are smooth
 * in φ and x, so a peak between samples is found to ~1e-12 of the interval.
 * @param f function to maximise
 * @param lo lower end
 * @param hi upper end
 * @param n number of scan intervals
 * @returns the largest value found and where
 * @example largest((x) => -(x - 0.3) ** 2, 0, 1).at // 0.3
 */
export function largest(f: (x: number) => number, lo: number, hi: number, n = 240): Largest {
  let best: Largest = { value: -Infinity, at: lo };
  let bestIndex = 0;
  for (let i = 0; i <= n; i++) {
    const x = i === n ? hi : lo + ((hi - lo) * i) / n;
    const v = f(x);
    if (v > best.value) [best, bestIndex] = [{ value: v, at: x }, i];
  }
  if (hi === lo) return best;
  let a = lo + ((hi - lo) * Math.max(0, bestIndex - 1)) / n;
  let b = lo + ((hi - lo) * Math.min(n, bestIndex + 1)) / n;
  let x1 = b - GOLD * (b - a), x2 = a + GOLD * (b - a);
  let f1 = f(x1), f2 = f(x2);
  for (let k = 0; k < 60 && b - a > 1e-13 * (hi - lo); k++) {
    if (f1 >= f2) {
      // The peak lies in [a, x2]: x1 becomes the upper probe.
      b = x2; x2 = x1; f2 = f1;
      x1 = b - GOLD * (b - a); f1 = f(x1);
    } else {
      a = x1; x1 = x2; f1 = f2;
      x2 = a + GOLD * (b - a); f2 = f(x2);
    }
  }
  const [x, v] = f1 >= f2 ? [x1, f1] : [x2, f2];
  return v > best.value ? { value: v, at: x } : best;
}
