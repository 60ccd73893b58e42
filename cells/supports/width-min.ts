/**
 * The least width of a support that keeps the resultant inside a given
 * fraction of its base.
 */
import type { Block } from './blocks.js';

/** The larger root of a2·Δ² + a1·Δ + a0 (a2 > 0), or −∞ when there is none (the quadratic is never negative). */
function largerRoot(a2: number, a1: number, a0: number): number {
  const disc = a1 * a1 - 4 * a2 * a0;
  if (disc < 0) return -Infinity;
  const sq = Math.sqrt(disc);
  // Written to avoid cancellation when a1 > 0.
  return a1 >= 0 ? (a1 + sq === 0 ? 0 : (-2 * a0) / (a1 + sq)) : (-a1 + sq) / (2 * a2);
}

/**
 * Least base width from which on every wider support keeps the resultant at the base between
 * (1 − α)·B and α·B from the inner face (B the base width), the support being widened by the same
 * amount Δ at every level (the outer face moves out, the inner face stays). α = 2/3 keeps it in the
 * middle third (both edges: a heavy load on the inner face can push it out on the inner side), α = 1
 * in the base. With k = γ·depth, H = Σh, S1 = Σh·b, S2 = Σh·b², N(Δ) = k(S1 + HΔ) + V and the moment
 * about the inner heel M(Δ) = k(S2 + 2S1Δ + HΔ²)/2 + V·x_V + T·z_T, the two conditions are
 *   outer: α(B + Δ)·N(Δ) − M(Δ) ≥ 0,   inner: M(Δ) − (1 − α)(B + Δ)·N(Δ) ≥ 0,
 * quadratics in Δ with positive leading coefficients kH(α − ½) and kH(½ − (1 − α)); every Δ beyond
 * the larger root of each holds (statics of a rigid block, any statics text; solved in closed form).
 * A single block with V = 0 gives the textbook w² = T·z/(kH(α − ½)).
 * @param blocks the support's blocks from the base up
 * @param k unit weight × depth (N/m³ · m)
 * @param V vertical load at the top (N) at x_V from the inner face (m)
 * @param T thrust (N) at z_T above the base (m)
 * @param alpha fraction of the base width from the inner face, in (½, 1]
 * @returns the least base width (m); undefined when any width down to the one at which the narrowest block vanishes keeps it inside
 * @example widthMin([{z0: 0, h: 6, b: 1}], 2e4, 0, 0, 1e4, 6, 1) // √(2·1e4·6/(2e4·6)) = 1
 */
export function widthMin(blocks: Block[], k: number, V: number, xV: number, T: number, zT: number, alpha: number): number | undefined {
  let H = 0, S1 = 0, S2 = 0;
  for (const { h, b } of blocks) { H += h; S1 += h * b; S2 += h * b * b; }
  const B = blocks[0]!.b;
  const n0 = k * S1 + V, n1 = k * H;
  const m0 = (k * S2) / 2 + V * xV + T * zT, m1 = k * S1, m2 = (k * H) / 2;
  const beta = 1 - alpha;
  const outer = largerRoot(alpha * n1 - m2, alpha * (n0 + B * n1) - m1, alpha * B * n0 - m0);
  const inner = beta > 0 ? largerRoot(m2 - beta * n1, m1 - beta * (n0 + B * n1), m0 - beta * B * n0) : -Infinity;
  const floor = -Math.min(...blocks.map((bl) => bl.b));
  const root = Math.max(outer, inner);
  return root > floor ? B + root : undefined;
}
