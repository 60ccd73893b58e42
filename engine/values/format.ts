/**
 * How values are shown: engineering units, sensible significant figures.
 */
import type { Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import type { CheckResult } from '../types.js';
import { isNotAvailable } from '../../cells/not-available.js';

/** Preferred display unit for each SI dimension; a value's own unit wins when it was written by hand. */
const PREFERRED: Array<[string, (v: number) => string]> = [
  ['m', () => 'm'],
  ['m^2', () => 'm^2'],
  ['m^3', () => 'm^3'],
  ['N', () => 'kN'],
  ['N/m', () => 'kN/m'],
  ['Pa', (v) => (Math.abs(v) >= 1e6 ? 'MPa' : 'kN/m^2')],
  ['N/m^3', () => 'kN/m^3'],
  ['kg/m^3', () => 'kg/m^3'],
  ['N m', () => 'kN m'],
  ['N m/m', () => 'kN m/m'],
  ['m^2/m', () => 'm^2/m'],
  ['m^3/m', () => 'm^3/m'],
  ['rad', () => 'deg'],
];
const PREFERRED_UNITS = PREFERRED.map(([si, pick]) => [math.unit(1, si), pick] as const);
const IMPERIAL = new Set(['ft', 'inch', 'in', 'yd', 'mi', 'lbf', 'lb', 'lbm', 'kip', 'kips', 'psi', 'ksi', 'psf', 'pcf', 'plf', 'klf', 'kipft']);

/** Magnitudes below this are floating-point noise in any quantity a vault calc shows. */
export const NOISE = 1e-10;

export interface FormatOptions {
  /** Significant figures (default 4). */
  sigfigs?: number;
}

/** A number to `sigfigs` significant figures, without trailing zeros, exponent only for extreme values. */
export function formatNumber(x: number, sigfigs = 4): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  // Round-off from the kernel (a hinge at the crown at 1e-14 deg) is shown as the zero it is.
  if (Math.abs(x) < NOISE) return '0';
  const text = math.format(x, { precision: sigfigs, lowerExp: -4, upperExp: 9 });
  return text.replace(/^-/, '−');
}

/** Compact unit text: 'kN / m' → 'kN/m'. */
export function compactUnit(text: string): string {
  return text.replace(/\s*\/\s*/g, '/').replace(/\s*\^\s*/g, '^').trim();
}

/**
 * The unit a quantity is shown in: its own when written by hand or fixed by `to`,
 * else the engineering unit for its dimension.
 */
export function displayUnitOf(u: Unit): string {
  const own = compactUnit(u.formatUnits());
  if ((u as Unit & { fixPrefix?: boolean }).fixPrefix || (u as Unit & { skipAutomaticSimplification?: boolean }).skipAutomaticSimplification) return own;
  if (u.units.some((part) => IMPERIAL.has(part.unit.name))) return compactUnit(u.toString().replace(/^[-\d.e+\s]+/, ''));
  const si = u.value === null ? 1 : (u.value as number);
  for (const [ref, pick] of PREFERRED_UNITS) {
    if (u.equalBase(ref)) return pick(si);
  }
  const simplified = u.clone();
  return compactUnit(simplified.toString().replace(/^[-\d.e+\s]+/, ''));
}

/** A quantity as {number, unit} in its display unit. */
export function splitQuantity(u: Unit, unit?: string | null): { number: number; unit: string } {
  const target = unit ?? displayUnitOf(u);
  try {
    return { number: u.toNumber(target), unit: compactUnit(target) };
  } catch {
    return { number: u.toNumber(), unit: compactUnit(u.formatUnits()) };
  }
}

function isCheck(v: unknown): v is CheckResult {
  return typeof v === 'object' && v !== null && (v as CheckResult).isCheck === true;
}

/**
 * One line of text for any cell value.
 * @example formatValue(math.unit(72000, 'N/m')) // "72 kN/m"
 */
export function formatValue(value: unknown, opts: FormatOptions = {}, unit?: string | null): string {
  const sf = opts.sigfigs ?? 4;
  if (typeof value === 'number') return formatNumber(value, sf);
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (typeof value === 'string') return value.startsWith('<svg') ? '[figure]' : value;
  if (math.isUnit(value)) {
    const q = splitQuantity(value as Unit, unit);
    return q.unit ? `${formatNumber(q.number, sf)} ${q.unit}` : formatNumber(q.number, sf);
  }
  if (isCheck(value)) {
    const u = value.utilization === null ? '' : ` (utilization ${formatNumber(value.utilization, 3)})`;
    return `${value.pass ? 'satisfied' : 'NOT satisfied'}${u}`;
  }
  if (math.isMatrix(value)) return formatValue((value as { toArray(): unknown[] }).toArray(), opts);
  if (Array.isArray(value)) return `[${value.map((v) => formatValue(v, opts)).join(', ')}]`;
  if (value === null || value === undefined) return '—';
  if (isNotAvailable(value)) return String(value);
  if (typeof value === 'object') {
    const fields = Object.entries(value as Record<string, unknown>).filter(([, v]) => typeof v !== 'function');
    return `{${fields.map(([k, v]) => `${k}: ${formatValue(v, opts)}`).join(', ')}}`;
  }
  return String(value);
}
