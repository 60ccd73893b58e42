/**
 * Characteristic compressive strength of masonry from its unit and mortar strengths.
 */

/** Parameters of EN 1996-1-1 eq. (3.1); defaults: Group 1 clay units, general-purpose mortar. */
export interface MasonryFkParameters {
  /** K of Table 3.3. */
  K?: number;
  /** Exponent α of f_b. */
  alpha?: number;
  /** Exponent β of f_m. */
  beta?: number;
}

const MPA = 1e6;

/**
 * EN 1996-1-1:2005 §3.6.1.2, eq. (3.1): f_k = K·f_b^α·f_m^β with f_b, f_m and
 * f_k in N/mm². Defaults K = 0.55, α = 0.7, β = 0.3 are those for Group 1 clay
 * units laid in general-purpose mortar (Table 3.3 — from memory; 0.45 for
 * dimensioned natural stone, also from memory). Other parameter sets (e.g. a
 * National Annex's K, α, β with f_st for f_b) go in `parameters`. The same
 * clause limits the inputs (from memory): f_b not above 75 N/mm², f_m not
 * above 20 N/mm² nor above 2·f_b; this function refuses larger values rather
 * than capping them silently — cap them in the document where they show.
 * @param fb normalised mean compressive strength of the units f_b (Pa)
 * @param fm compressive strength of the mortar f_m (Pa)
 * @param parameters {K, alpha, beta}
 * @returns f_k (Pa)
 * @example masonryFk(20e6, 10e6) // 0.55·20^0.7·10^0.3 N/mm² = 8.93e6 Pa
 */
export function masonryFk(fb: number, fm: number, parameters: MasonryFkParameters = {}): number {
  const { K = 0.55, alpha = 0.7, beta = 0.3 } = parameters;
  const fbN = fb / MPA, fmN = fm / MPA;
  if (!(Number.isFinite(fbN) && fbN > 0)) throw new RangeError(`masonry_fk: f_b must be positive, got ${fbN} N/mm²`);
  if (!(Number.isFinite(fmN) && fmN > 0)) throw new RangeError(`masonry_fk: f_m must be positive, got ${fmN} N/mm²`);
  if (!(Number.isFinite(K) && K > 0)) throw new RangeError(`masonry_fk: K must be positive, got ${K}`);
  if (!(Number.isFinite(alpha) && alpha > 0 && alpha <= 1)) throw new RangeError(`masonry_fk: alpha must be in (0, 1], got ${alpha}`);
  if (!(Number.isFinite(beta) && beta >= 0 && beta < 1)) throw new RangeError(`masonry_fk: beta must be in [0, 1), got ${beta}`);
  // Is the input inside the range eq. (3.1) was calibrated for?
  if (fbN > 75) throw new RangeError(`masonry_fk: f_b = ${fbN} N/mm² is above 75 N/mm², the limit of EN 1996-1-1 3.6.1.2 (from memory)`);
  if (fmN > 20 || fmN > 2 * fbN) {
    throw new RangeError(`masonry_fk: f_m = ${fmN} N/mm² is above min(20 N/mm², 2·f_b = ${2 * fbN} N/mm²); EN 1996-1-1 3.6.1.2 (from memory) says not to take it greater — cap it in the document`);
  }
  return K * fbN ** alpha * fmN ** beta * MPA;
}
