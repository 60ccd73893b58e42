/**
 * Design compressive strength of masonry.
 */

/**
 * EN 1996-1-1:2005 §2.4.3: f_d = f_k / γ_M. γ_M comes from the National Annex
 * (the recommended values in the note to 2.4.3 range from about 1.5 to 3.0
 * with the class of execution control and the unit category — from memory).
 * @param fk characteristic compressive strength (Pa)
 * @param gammaM partial factor for the material γ_M, at least 1
 * @returns f_d (Pa)
 * @example masonryFd(8.93e6, 2.5) // 3.57e6 Pa
 */
export function masonryFd(fk: number, gammaM: number): number {
  if (!(Number.isFinite(fk) && fk > 0)) throw new RangeError(`masonry_fd: f_k must be positive, got ${fk / 1e6} N/mm²`);
  // Would the factor raise the strength? A material partial factor is never below 1.
  if (!(Number.isFinite(gammaM) && gammaM >= 1)) throw new RangeError(`masonry_fd: gamma_M must be at least 1, got ${gammaM}`);
  return fk / gammaM;
}
