/**
 * Numbers in a kernel's message, said in the document's units. Kernels speak SI ("got -10000 N",
 * "got 0 rad"); the document wrote "-10 kN" and "0 deg". Each SI quantity in the message is replaced
 * by the value the document gave for it when one matches, else by the same quantity in the display
 * unit of its dimension (in US customary units when the call's quantities were written so); long plain
 * numbers are rounded to the document's significant figures.
 */
import { fromSI } from '../../cells/units.js';
import type { GivenQuantity } from '../../cells/define.js';
import { formatNumber, formatValue, unitSystemOf } from '../values/format.js';

/** A number, optionally followed by one of the SI units kernels write. */
const QUANTITY = /(?<![\w.^])(-?\d+(?:\.\d+)?(?:e[+-]?\d+)?)(?:\s(N\/m\^3|N\/m\^2|N\/m|N m|Pa|N|m|rad)(?![\w^/²³]))?(?![\w.])/g;

function sameNumber(a: number, b: number): boolean {
  return a === b || Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b));
}

/**
 * The message with its quantities in the document's units.
 * @param given the quantities of the call, as the document gave them
 * @param documentUnits the document's system of units, used when the call's quantities are all SI or it has none
 * @example quoteInUserUnits('T must be positive, got -10000 N', [], 4) // 'T must be positive, got −10 kN'
 */
export function quoteInUserUnits(message: string, given: GivenQuantity[], sigfigs = 4, documentUnits: 'si' | 'us' = 'si'): string {
  // US customary when the call's quantities are written so, or the document is (a call without quantities of its own, dome_limit(d)).
  const units = unitSystemOf(given.map((g) => g.value)) === 'us' || documentUnits === 'us' ? 'us' : 'si';
  return message.replace(QUANTITY, (whole, digits: string, si: string | undefined) => {
    const x = Number(digits);
    if (!Number.isFinite(x)) return whole;
    if (!si) return digits.replace(/^-/, '').replace('.', '').replace(/^0+/, '').length > sigfigs + 2 ? formatNumber(x, sigfigs) : whole;
    const mine = given.find((g) => g.si === si && sameNumber(g.number, x));
    return formatValue(mine ? mine.value : fromSI(x, si), { sigfigs, units });
  });
}
