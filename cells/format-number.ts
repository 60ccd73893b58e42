/**
 * The one number formatter every output uses (sheet, figures, command line, JSON, live page).
 * It lives here, at the first stage that prints numbers, so that figures drawn by cell functions
 * use it too; engine/values/format.ts re-exports it beside the unit choices.
 */
import { math } from './math.js';

/** Magnitudes below this are floating-point noise in any quantity a vault calc shows. */
export const NOISE = 1e-10;

/**
 * A number to `sigfigs` significant figures, without trailing zeros, exponent only for extreme values.
 * @example formatNumber(0.215, 3) // "0.215"
 * @example formatNumber(6.4, 4) // "6.4"
 */
export function formatNumber(x: number, sigfigs = 4): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  // Round-off from the kernel (a hinge at the crown at 1e-14 deg) is shown as the zero it is.
  if (Math.abs(x) < NOISE) return '0';
  const text = math.format(x, { precision: sigfigs, lowerExp: -4, upperExp: 9 });
  return text.replace(/^-/, '−');
}
