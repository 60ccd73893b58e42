/**
 * Fixed composite Gauss–Legendre quadrature for the web integrals of the
 * cross vault. The integrands (web width × load, written in the angle φ of
 * the web's normal) are smooth between the kinks the caller splits at, so a
 * fixed rule converges to rounding error and costs the same on every call.
 */

// 8-point Gauss–Legendre nodes and weights on [−1, 1] (Abramowitz & Stegun,
// Handbook of Mathematical Functions, Table 25.4), symmetric pairs.
const NODES = [0.18343464249564978, 0.525532409916329, 0.7966664774136267, 0.9602898564975362];
const WEIGHTS = [0.36268378337836166, 0.3137066458778869, 0.22238103445337443, 0.10122853629037706];

/**
 * ∫ f(t) dt from a to b by composite 8-point Gauss–Legendre on equal panels,
 * for several integrands at once (f returns a vector of fixed length, so the
 * geometry at each node is computed once). Exact for polynomials of degree 15
 * on each panel; the error of a smooth integrand falls as (panel width)^16.
 * @param f integrand, returning a vector
 * @param a lower limit
 * @param b upper limit (b < a gives the negative)
 * @param panels number of equal panels (≥ 1)
 * @returns the integral of each component
 * @example gaussLegendre((t) => [Math.cos(t), 1], 0, Math.PI / 2, 4) // [1, π/2]
 */
export function gaussLegendre(f: (t: number) => number[], a: number, b: number, panels = 16): number[] {
  const h = (b - a) / panels;
  let sum: number[] | undefined;
  for (let k = 0; k < panels; k++) {
    const mid = a + (k + 0.5) * h;
    for (let i = 0; i < NODES.length; i++) {
      const d = (h / 2) * NODES[i]!;
      const lo = f(mid - d), hi = f(mid + d);
      sum ??= lo.map(() => 0);
      for (let j = 0; j < sum.length; j++) sum[j] = sum[j]! + WEIGHTS[i]! * (lo[j]! + hi[j]!);
    }
  }
  return (sum ?? []).map((v) => (v * h) / 2);
}
