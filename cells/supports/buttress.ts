/**
 * Stability of a wall or buttress under the thrust of a vault.
 */
import { buttressBlocks, type ButtressOptions } from './blocks.js';
import { thrustPath, type PathPoint } from './thrust-path.js';
import { widthMin } from './width-min.js';
import { notAvailable, type NotAvailable } from '../not-available.js';

export interface Buttress {
  /** Base width (m), weight of the masonry (N) and normal force on the base (N). */
  base_width: number; W_self: number; N: number;
  /** Where the resultant cuts the base, from the outer toe (m), and its eccentricity from the base centre, positive outwards (m). */
  x_R: number; e: number;
  middle_third: boolean; in_base: boolean;
  /** Restoring over overturning moment about the outer toe; Infinity when nothing overturns (T = 0). */
  sf_overturning: number;
  /** Base pressures (Pa); not available when the resultant is outside the base, where no pressure can balance it. */
  sigma_max: number | NotAvailable; sigma_min: number | NotAvailable;
  /** µ·N/T (Infinity when T = 0); not available when friction is not given. */
  sf_sliding: number | NotAvailable;
  /** Least base width from which on the resultant stays in the middle third / in the base, widening every level alike (m). */
  width_min_third: number | NotAvailable; width_min_base: number | NotAvailable;
  path: PathPoint[];
  /** sigma_max ≤ bearing and the resultant in the base; not available when bearing is not given. */
  bearing_ok: boolean | NotAvailable;
}

/**
 * Rigid-block statics of a support with no tension at its base (Heyman,
 * The Stone Skeleton, 1995; Huerta 2010, "The safety of masonry buttresses",
 * Proc. ICE Eng. Hist. Heritage 163: the resultant must stay in the base,
 * better in the middle third). Moments about the inner heel place the
 * resultant; its distance a from the nearer edge sets the pressures:
 *   |e| ≤ B/6: σ = N/(B·d)·(1 ± 6e/B);  beyond the kern: σ_max = 2N/(3·a·d), σ_min = 0
 * (any statics text). N·x_R = M_restoring − M_overturning about the outer toe,
 * so the resultant leaves the base exactly when sf_overturning falls to 1.
 * @param o geometry, unit weight, thrust T at z_T, vault load V at x_V, friction, bearing (SI)
 * @returns position of the resultant, safety factors, pressures, least widths and the thrust path
 * @example buttress({height: 6, width: 1.5, depth: 1, unit_weight: 2e4, T: 1e4, z_T: 6}).x_R // 0.75 − 60/180 m
 */
export function buttress(o: ButtressOptions): Buttress {
  const blocks = buttressBlocks(o);
  const k = o.unit_weight * o.depth, V = o.V ?? 0, xV = o.x_V ?? 0, T = o.T, z_T = o.z_T ?? 0;
  const B = blocks[0]!.b;
  let W = 0, Mw = 0, restoring = V * (B - xV);
  for (const { h, b } of blocks) {
    W += k * h * b;
    Mw += (k * h * b * b) / 2;
    restoring += k * h * b * (B - b / 2);
  }
  const N = W + V;
  const xInner = (Mw + V * xV + T * z_T) / N;
  const x_R = B - xInner, e = xInner - B / 2;
  const in_base = x_R > 0 && xInner > 0;
  const least = (alpha: number, zone: string) => {
    const w = widthMin(blocks, k, V, xV, T, z_T, alpha);
    return w ?? notAvailable(`the resultant stays ${zone} however narrow the support is made (down to its narrowest block vanishing); its width is set by other checks (bearing, slenderness)`);
  };
  const middle_third = Math.abs(e) <= B / 6 * (1 + 1e-12);
  const outside = `the resultant cuts the base line ${Math.abs(x_R < 0 ? x_R : xInner).toPrecision(3)} m beyond the ${x_R < 0 ? 'outer toe' : 'inner heel'}: the support overturns and no base pressure can balance it`;
  let sigma_max: number | NotAvailable = notAvailable(outside), sigma_min: number | NotAvailable = notAvailable(outside);
  if (in_base) {
    const area = B * o.depth;
    if (middle_third) {
      sigma_max = (N / area) * (1 + (6 * Math.abs(e)) / B);
      sigma_min = (N / area) * (1 - (6 * Math.abs(e)) / B);
    } else {
      // Outside the kern: the base opens and a triangle of pressure 3a long carries N.
      sigma_max = (2 * N) / (3 * Math.min(x_R, xInner) * o.depth);
      sigma_min = 0;
    }
  }
  return {
    base_width: B, W_self: W, N, x_R, e, middle_third, in_base,
    sf_overturning: T > 0 ? restoring / (T * z_T) : Infinity,
    sigma_max, sigma_min,
    sf_sliding: o.friction === undefined ? notAvailable('friction is not given') : T > 0 ? (o.friction * N) / T : Infinity,
    width_min_third: least(2 / 3, 'within the middle third'),
    width_min_base: least(1, 'within the base'),
    path: thrustPath(blocks, k, V, xV, T, z_T),
    bearing_ok: o.bearing === undefined ? notAvailable('bearing (the allowable pressure under the base) is not given')
      : in_base && typeof sigma_max === 'number' && sigma_max <= o.bearing,
  };
}
