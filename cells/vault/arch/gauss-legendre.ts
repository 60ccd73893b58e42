/**
 * Visits the nodes of 6-point Gauss–Legendre quadrature on [a, b] with their
 * weights, so Σ w·f(x) over the visits is ∫ f over [a, b], exact for
 * polynomials of degree 11 (Abramowitz & Stegun, Handbook, Table 25.4). Over
 * one voussoir the integrands are smooth, so this is exact to rounding. A
 * visitor lets one pass accumulate several integrals.
 * @param a lower limit
 * @param b upper limit
 * @param visit called with each node x and its weight w
 * @returns nothing
 * @example let s = 0; gaussLegendre(0, 3, (x, w) => { s += w * x * x; }); // s = 9
 */
export function gaussLegendre(a: number, b: number, visit: (x: number, w: number) => void): void {
  const h = (b - a) / 2;
  const c = (a + b) / 2;
  for (let i = 0; i < NODES.length; i++) {
    visit(c - h * NODES[i]!, h * WEIGHTS[i]!);
    visit(c + h * NODES[i]!, h * WEIGHTS[i]!);
  }
}

const NODES = [0.2386191860831969, 0.6612093864662645, 0.9324695142031521];
const WEIGHTS = [0.4679139345726910, 0.3607615730481386, 0.1713244923791704];
