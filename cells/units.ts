/**
 * The one place where mathjs units meet the plain SI numbers of the kernel.
 */
import type { Unit } from 'mathjs';
import { math } from './math.js';

/** A unit argument had the wrong dimension (or none where one is needed). */
export class UnitMismatchError extends Error {
  override name = 'UnitMismatchError';
  constructor(message: string, readonly actual: string, readonly expected: string) {
    super(message);
  }
}

const DIMENSION_NAMES: Array<[string, string]> = [
  ['m', 'length'], ['m^2', 'area'], ['m^3', 'volume'], ['N', 'force'], ['N/m', 'force per length'],
  ['Pa', 'pressure or stress'], ['N/m^3', 'unit weight'], ['kg/m^3', 'density'], ['N m', 'moment'],
  ['N m/m', 'moment per length'], ['kg', 'mass'], ['s', 'time'], ['rad', 'angle'],
];

/** Plain-words name of a value's dimension: "length (m)", "force (N)", "a plain number". */
export function describeDimension(value: unknown): string {
  if (typeof value === 'number') return 'a plain number';
  if (!math.isUnit(value)) return typeof value === 'string' ? 'text' : typeof value;
  const u = value as Unit;
  for (const [si, name] of DIMENSION_NAMES) {
    if (u.equalBase(math.unit(si))) return `${name} (${si})`;
  }
  const si = u.clone().toSI().formatUnits();
  return si ? `a quantity in ${si}` : 'a plain number';
}

/** Name of the dimension of an SI unit string, for messages: 'N/m' → 'force per length (N/m)'. */
export function describeUnit(si: string): string {
  if (si === '' || si === '1') return 'a plain number';
  return describeDimension(math.unit(1, si));
}

function isDimensionless(u: Unit): boolean {
  return u.dimensions.every((d) => d === 0);
}

/**
 * Converts a document value to a plain SI number, checking its dimension.
 * @param value mathjs Unit or number from a cell
 * @param si SI unit string expected ('m', 'N/m', 'Pa', 'rad'); '' or '1' for a plain number
 * @param what name of the argument, used in messages
 * @returns the value in SI units
 * @example toSI(math.unit(6.4, 'm'), 'm', 'span') // 6.4
 */
export function toSI(value: unknown, si: string, what = 'value'): number {
  const plain = si === '' || si === '1';
  if (typeof value === 'number') {
    // Angles given as plain numbers are radians, as everywhere in mathjs.
    if (plain || si === 'rad') return value;
    throw new UnitMismatchError(
      `${what} needs ${describeUnit(si)}, got the plain number ${value}`, 'a plain number', describeUnit(si));
  }
  if (math.isUnit(value)) {
    const u = value as Unit;
    if (plain) {
      if (isDimensionless(u)) return u.toNumber();
      throw new UnitMismatchError(`${what} must be a plain number, got ${describeDimension(u)}`,
        describeDimension(u), 'a plain number');
    }
    const target = math.unit(1, si);
    if (!u.equalBase(target)) {
      throw new UnitMismatchError(`${what} needs ${describeUnit(si)}, got ${describeDimension(u)}`,
        describeDimension(u), describeUnit(si));
    }
    if (u.value === null) throw new UnitMismatchError(`${what} has a unit but no number`, 'a bare unit', describeUnit(si));
    return u.toNumber(si);
  }
  throw new UnitMismatchError(`${what} needs ${describeUnit(si)}, got ${describeDimension(value)}`,
    describeDimension(value), describeUnit(si));
}

/**
 * Builds a mathjs value from an SI number.
 * @param x number in SI units
 * @param si SI unit of x ('' for a plain number)
 * @returns a Unit (or the number itself when si is '')
 * @example fromSI(72000, 'N/m') // 72000 N / m
 */
export function fromSI(x: number, si: string): Unit | number {
  if (si === '' || si === '1') return x;
  const u = math.unit(x, si);
  // A kernel result is computed, not written by hand: let the display pick engineering units.
  (u as unknown as { skipAutomaticSimplification: boolean }).skipAutomaticSimplification = false;
  return u;
}
