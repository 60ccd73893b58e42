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

/** The units a value carries, as written ('lb/ft^3', 'kN/m'), or null when mathjs has combined them (N kN/m^3). */
export function ownUnits(u: Unit): string | null {
  const bases = u.units.map((part) => part.unit.base.key);
  if (new Set(bases).size !== bases.length) return null;
  const text = u.formatUnits().replace(/\s*\/\s*/g, '/').replace(/\s*\^\s*/g, '^').trim();
  return text && !/[()]/.test(text) ? text : null;
}

/** A dimension no name fits, in plain SI units: force and length powers (N^2/m) where they fit, else kg, m, s. */
function dimensionUnits(u: Unit): string {
  const [mass = 0, length = 0, time = 0, ...rest] = u.dimensions;
  const powers: Array<[string, number]> = rest.some((d) => d !== 0)
    ? [['kg', mass], ['m', length], ['s', time], ['A', rest[0] ?? 0], ['K', rest[1] ?? 0], ['rad', rest[4] ?? 0]]
    : time === -2 * mass ? [['N', mass], ['m', length - mass]] : [['kg', mass], ['m', length], ['s', time]];
  const show = (name: string, p: number) => (Math.abs(p) === 1 ? name : `${name}^${+Math.abs(p).toFixed(3)}`);
  const up = powers.filter(([, p]) => p > 0).map(([n, p]) => show(n, p));
  const down = powers.filter(([, p]) => p < 0).map(([n, p]) => show(n, p));
  if (up.length === 0 && down.length === 0) return '1';
  return `${up.join(' ') || '1'}${down.length ? `/${down.length > 1 ? `(${down.join(' ')})` : down[0]}` : ''}`;
}

/** Plain-words name of a value's dimension, with the units it carries: "length (ft)", "force (kN)", "a plain number". */
export function describeDimension(value: unknown): string {
  if (typeof value === 'number') return 'a plain number';
  if (!math.isUnit(value)) return typeof value === 'string' ? 'text' : typeof value === 'boolean' ? 'true/false' : 'a record or list';
  const u = value as Unit;
  if (isDimensionless(u)) return 'a plain number';
  const own = ownUnits(u);
  for (const [si, name] of DIMENSION_NAMES) {
    if (u.equalBase(math.unit(si))) return `${name} (${own ?? si})`;
  }
  return `a quantity in ${own ?? dimensionUnits(u)}`;
}

/** Force units to suggest, by dimension, when a mass was written instead. */
const FORCE_UNITS: Array<[string, string]> = [['N', 'kN'], ['N/m', 'kN/m'], ['Pa', 'kN/m^2'], ['N/m^3', 'kN/m^3']];

/**
 * What to write instead, when a mass stands where a force is meant (lb/ft^3 for a unit weight,
 * kg for a load), or the other way round; '' when that is not the mix-up.
 * @param expected the SI unit expected ('N/m^3'), or a value of the expected dimension
 */
export function massForceHint(value: unknown, expected: string | Unit): string {
  if (!math.isUnit(value) || expected === '' || expected === '1') return '';
  const u = value as Unit, gravity = math.unit(9.80665, 'm/s^2');
  const target = typeof expected === 'string' ? math.unit(1, expected) : expected;
  if ((math.multiply(u, gravity) as Unit).equalBase(target)) {
    const own = ownUnits(u) ?? '';
    const force = own.replace(/\blbm?\b/, 'lbf');
    const unit = FORCE_UNITS.find(([si]) => target.equalBase(math.unit(1, si)));
    const what = unit?.[0] === 'N/m^3' ? 'a mass density' : unit?.[0] === 'N' ? 'a mass' : 'a mass per area or length';
    const suggestion = force !== own ? `write ${force}` : `write it as a force${unit ? ` (${unit[1]})` : ''}`;
    return `: ${own || 'this'} is ${what}, not a weight; ${suggestion}, or multiply by gravity`;
  }
  if ((math.divide(u, gravity) as Unit).equalBase(target)) return ': this is a weight (a force), not a mass; divide by gravity';
  return '';
}

/** Name of the dimension of an SI unit string, for messages: 'N/m' → 'force per length (N/m)'. */
export function describeUnit(si: string): string {
  if (si === '' || si === '1') return 'a plain number';
  return describeDimension(math.unit(1, si));
}

const UNIT_EXAMPLE: Record<string, string> = { N: 'kN', 'N/m': 'kN/m', Pa: 'kN/m^2', 'N/m^3': 'kN/m^3', 'N m': 'kN m' };

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
      `${what} needs ${describeUnit(si)}, got the plain number ${+value.toPrecision(6)}; write its unit, e.g. ${+value.toPrecision(6)} ${UNIT_EXAMPLE[si] ?? si}`,
      'a plain number', describeUnit(si));
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
      throw new UnitMismatchError(`${what} needs ${describeUnit(si)}, got ${describeDimension(u)}${massForceHint(u, si)}`,
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
