/**
 * The least width of a support that keeps the resultant inside a given
 * fraction of its base.
 */
import type { Block } from './blocks.js';

/**
 * Least base width for which the resultant at the base stays within
 * α·(base width) of the inner face, the support being widened by the same
 * amount Δ at every level (the outer face moves out, the inner face stays).
 * α = 2/3 keeps it in the middle third, α = 1 in the base. With k = γ·depth,
 * H = Σh, S1 = Σh·b, S2 = Σh·b² and base width B, moments about the inner
 * heel give the condition g(Δ) ≥ 0 with
 *   g(Δ) = α(B + Δ)(k(S1 + HΔ) + V) − k(S2 + 2S1Δ + HΔ²)/2 − V·x_V − T·z_T,
 * a quadratic with leading coefficient kH(α − ½) > 0; the answer is its larger
 * root (statics of a rigid block, any statics text; solved in closed form).
 * A single block with V = 0 gives the textbook w² = T·z/(kH(α − ½)).
 * @param blocks the support's blocks from the base up
 * @param k unit weight × depth (N/m³ · m)
 * @param V vertical load at the top (N) at x_V from the inner face (m)
 * @param T thrust (N) at z_T above the base (m)
 * @param alpha fraction of the base width from the inner face
 * @returns the least base width (m), not less than the width at which the narrowest block vanishes
 * @example widthMin([{z0: 0, h: 6, b: 1}], 2e4, 0, 0, 1e4, 6, 1) // √(2·1e4·6/(2e4·6)) = 1
 */
export function widthMin(blocks: Block[], k: number, V: number, xV: number, T: number, zT: number, alpha: number): number {
  let H = 0, S1 = 0, S2 = 0;
  for (const { h, b } of blocks) { H += h; S1 += h * b; S2 += h * b * b; }
  const B = blocks[0]!.b;
  const a2 = k * H * (alpha - 0.5);
  const a1 = alpha * (k * B * H + k * S1 + V) - k * S1;
  const a0 = alpha * (k * B * S1 + V * B) - (k * S2) / 2 - V * xV - T * zT;
  const floor = -Math.min(...blocks.map((bl) => bl.b));
  const disc = a1 * a1 - 4 * a2 * a0;
  // No real root: every width keeps the resultant inside.
  if (disc < 0) return B + floor;
  const sq = Math.sqrt(disc);
  // Larger root, written to avoid cancellation when a1 > 0.
  const root = a1 >= 0 ? (a1 + sq === 0 ? 0 : (-2 * a0) / (a1 + sq)) : (-a1 + sq) / (2 * a2);
  return B + Math.max(root, floor);
}
