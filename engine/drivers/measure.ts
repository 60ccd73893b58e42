/**
 * Elasticity, one-sided elasticities, kink and swing from the measures at the perturbed values.
 *
 * The elasticity d ln u / d ln x is a central difference in logarithms:
 *   e = ln(u₊ / u₋) / ln((1 + h) / (1 − h)),
 * exact for a power law u ∝ xⁿ (it gives n for any h). The one-sided values use u₀ and one side each;
 * where they differ by more than KINK_TOLERANCE the dependence is marked kinked (min, max, a kernel
 * whose governing mode changes at the value as written).
 */
import { SMALL_STEP } from './steps.js';

/** Difference of the one-sided elasticities (relative to the larger, and at least to 1) above which the dependence is called kinked. */
export const KINK_TOLERANCE = 0.01;

/** A measure (utilization, or a value in SI) at the value as written and at the four perturbed values. */
export interface Samples {
  at: number | null;
  small: [number | null, number | null];
  swing: [number | null, number | null];
}

export interface Elasticity {
  elasticity: number | null;
  elasticity_minus: number | null;
  elasticity_plus: number | null;
  kinked: boolean;
}

/** All of one sign and none zero: ln |u| is defined on all of them (a value in SI may be negative). */
const oneSign = (...xs: Array<number | null>): boolean => xs.every((x) => x !== null && x > 0) || xs.every((x) => x !== null && x < 0);

/**
 * @param absolute the input is at zero and moved by an absolute step: no elasticity, only the kink test
 * @example elasticityOf({at: 1, small: [0.998001, 1.002001], swing: [0.81, 1.21]}, false).elasticity // 2
 */
export function elasticityOf(s: Samples, absolute: boolean): Elasticity {
  const [dn, up] = s.small;
  const u0 = s.at;
  let kinked = false;
  if (u0 !== null && dn !== null && up !== null) {
    const plus = up - u0;
    const minus = u0 - dn;
    // Compared on the scale of an elasticity of 1, so that a small but smooth dependence (e ≈ 0.07,
    // curving a little) is not called kinked: in elasticities, |e₊ − e₋| > tol · max(1, |e₊|, |e₋|).
    const size = Math.max(Math.abs(plus), Math.abs(minus), Math.abs(u0) * SMALL_STEP);
    kinked = size > 1e-9 * Math.max(1, Math.abs(u0)) && Math.abs(plus - minus) > KINK_TOLERANCE * size;
  }
  if (absolute || !oneSign(u0, dn, up)) return { elasticity: null, elasticity_minus: null, elasticity_plus: null, kinked };
  const h = SMALL_STEP;
  return {
    elasticity: Math.log(up! / dn!) / Math.log((1 + h) / (1 - h)),
    elasticity_minus: Math.log(u0! / dn!) / -Math.log(1 - h),
    elasticity_plus: Math.log(up! / u0!) / Math.log(1 + h),
    kinked,
  };
}

/** The size of the swing: the range the measure covers over −10 %, as written and +10 %. */
export function swingOf(s: Samples): number {
  const xs = [s.swing[0], s.at, s.swing[1]].filter((x): x is number => x !== null);
  return xs.length < 2 ? 0 : Math.max(...xs) - Math.min(...xs);
}
