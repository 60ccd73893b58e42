/**
 * How values are shown: engineering units, sensible significant figures.
 */
import type { Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import type { CellState, CheckResult, CompiledDocument } from '../types.js';
import { isNotAvailable } from '../../cells/not-available.js';
import { formatNumber, NOISE } from '../../cells/format-number.js';

/**
 * The system of units a document is written in: 'us' when its inputs are in US customary units
 * (ft, kip, psf …), else 'si'. Quantities whose own units are not kept are shown in the system's units.
 */
export type UnitSystem = 'si' | 'us';

type Preferred = Array<[string, (v: number) => string]>;

/** Preferred display unit for each SI dimension; a value's own unit wins when it was written by hand. */
const PREFERRED_SI: Preferred = [
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

/**
 * The same dimensions in US customary units (common practice on US structural calcs: loads and soil
 * pressures in psf, stresses from 1 MPa up in psi, as the SI list moves to MPa there).
 */
const PREFERRED_US: Preferred = [
  ['m', () => 'ft'],
  ['m^2', () => 'ft^2'],
  ['m^3', () => 'ft^3'],
  ['N', () => 'kip'],
  ['N/m', () => 'kip/ft'],
  ['Pa', (v) => (Math.abs(v) >= 1e6 ? 'psi' : 'psf')],
  ['N/m^3', () => 'pcf'],
  ['kg/m^3', () => 'lb/ft^3'],
  ['N m', () => 'kip ft'],
  ['N m/m', () => 'kip ft/ft'],
  ['m^2/m', () => 'ft^2/ft'],
  ['m^3/m', () => 'ft^3/ft'],
  ['rad', () => 'deg'],
];
const PREFERRED_UNITS: Record<UnitSystem, ReadonlyArray<readonly [Unit, (v: number) => string]>> = {
  si: PREFERRED_SI.map(([si, pick]) => [math.unit(1, si), pick] as const),
  us: PREFERRED_US.map(([si, pick]) => [math.unit(1, si), pick] as const),
};
const IMPERIAL = new Set(['ft', 'inch', 'in', 'yd', 'mi', 'lbf', 'lb', 'lbm', 'kip', 'kips', 'psi', 'ksi', 'psf', 'pcf', 'plf', 'klf', 'kipft']);

export { formatNumber, NOISE } from '../../cells/format-number.js';

/** Units that mark a quantity as written in US customary units. */
export const US_WRITTEN = /\b(ft|in|inch|yd|kip|kips|ksi|ksf|psf|pcf|plf|klf|kipft|lbf|psi)\b/;

/**
 * The system of units of a document, from the values of its given inputs: 'us' when any is written
 * in US customary units (L = 24 ft, w = 120 pcf), else 'si'.
 * @example unitSystemOf([math.unit('24 ft')]) // "us"
 */
export function unitSystemOf(inputs: Iterable<unknown>): UnitSystem {
  for (const v of inputs) if (math.isUnit(v) && US_WRITTEN.test((v as Unit).formatUnits())) return 'us';
  return 'si';
}

/** Each compiled document's system of units, worked out once (every edit's rendering asks for it). */
const systems = new WeakMap<CompiledDocument, UnitSystem>();

/**
 * The system of units a document is written in: 'us' when any given input is written in US customary
 * units (`L = 24 ft`, `w = 120 pcf`; quoted text aside), else 'si'. Read from what the document wrote,
 * so it is known before evaluation (a kernel's messages) and is the same for the sheet, the JSON,
 * the drivers and the live page; overrides (`--set`, live edits) do not change it.
 * @example documentUnitSystem(doc) // "us" for a calc with `L = 24 ft`
 */
export function documentUnitSystem(doc: CompiledDocument): UnitSystem {
  let system = systems.get(doc);
  if (system === undefined) {
    system = doc.graph.cells.some((c) => c.kind === 'given' && US_WRITTEN.test(c.source.replace(/"[^"]*"/g, ''))) ? 'us' : 'si';
    systems.set(doc, system);
  }
  return system;
}

/**
 * The unit a dimension is shown in when the value's own are not kept.
 * @param si an SI unit of the dimension ('m', 'N/m', 'Pa')
 * @param magnitude the SI value (stress switches to MPa or psi from 1 MPa)
 * @example displayUnitFor('N/m', 'us') // "kip/ft"
 */
export function displayUnitFor(si: string, system: UnitSystem = 'si', magnitude = 0): string {
  const u = math.unit(1, si);
  const found = PREFERRED_UNITS[system].find(([ref]) => u.equalBase(ref));
  return found ? found[1](magnitude) : si;
}

export interface FormatOptions {
  /** Significant figures (default 4). */
  sigfigs?: number;
  /** The document's system of units (default 'si'): the units a quantity is shown in when its own are not kept. */
  units?: UnitSystem;
  /** A given input: shown with every digit it was written with (see writtenSigfigs), never rounded to `sigfigs`. */
  written?: boolean;
}

/** The most significant figures a number written by hand is shown with. */
const WRITTEN_MOST = 12;

/**
 * The significant figures that show a given input's number with every digit it was written with:
 * `sigfigs`, or more when fewer would round it (1.0004 at 3 is "1"; a reviewer redoing the sums from
 * the sheet must have the numbers the calc used). A number that no decimal of 12 significant
 * figures gives (10/3 m: computed, not written) keeps `sigfigs`. Compared within 1e-12 relative, so
 * that 12.345 in stored as metres and read back as 12.344999999999999 in still counts as written.
 * @example writtenSigfigs(1.0004, 3) // 5
 * @example writtenSigfigs(10 / 3, 3) // 3
 */
export function writtenSigfigs(x: number, sigfigs: number): number {
  if (!Number.isFinite(x) || Math.abs(x) < NOISE) return sigfigs;
  for (let sf = sigfigs; sf <= WRITTEN_MOST; sf++) {
    if (Math.abs(Number(math.format(x, { precision: sf })) - x) <= 1e-12 * Math.abs(x)) return sf;
  }
  return sigfigs;
}

/** The significant figures one number is shown with under `opts`. */
export function sigfigsFor(x: number, opts: FormatOptions): number {
  const sf = opts.sigfigs ?? 4;
  return opts.written ? writtenSigfigs(x, sf) : sf;
}

/** Compact unit text: 'kN / m' → 'kN/m'. */
export function compactUnit(text: string): string {
  return text.replace(/\s*\/\s*/g, '/').replace(/\s*\^\s*/g, '^').trim();
}

/**
 * The unit a quantity is shown in: its own when written by hand or fixed by `to`,
 * else the engineering unit for its dimension.
 */
export function displayUnitOf(u: Unit, system: UnitSystem = 'si'): string {
  const own = compactUnit(u.formatUnits());
  if ((u as Unit & { fixPrefix?: boolean }).fixPrefix || (u as Unit & { skipAutomaticSimplification?: boolean }).skipAutomaticSimplification) return own;
  if (u.units.some((part) => IMPERIAL.has(part.unit.name))) return compactUnit(u.toString().replace(/^[-\d.e+\s]+/, ''));
  const si = u.value === null ? 1 : (u.value as number);
  for (const [ref, pick] of PREFERRED_UNITS[system]) {
    if (u.equalBase(ref)) return pick(si);
  }
  const simplified = u.clone();
  return compactUnit(simplified.toString().replace(/^[-\d.e+\s]+/, ''));
}

/**
 * The engineering unit for a quantity's dimension, ignoring the unit it happens to carry:
 * kernel results come back in N, m, Pa and read better as kN, m, kN/m².
 * @example engineeringUnit(math.unit(17090, 'N')) // "kN"
 */
export function engineeringUnit(u: Unit, system: UnitSystem = 'si'): string {
  const plain = u.clone();
  Object.assign(plain, { skipAutomaticSimplification: false, fixPrefix: false });
  return displayUnitOf(plain, system);
}

/** Bare SI units of force and stress, as kernels return them: shown in engineering units instead. */
const BARE_SI = /^(N|Pa|N\/m|N\/m\^2|N\/m\^3|N m|N m\/m)$/;

/**
 * The unit a quantity is shown in when no display unit is asked for: its own when written
 * by hand (6.4 m, 40 kN, 2.5 MPa), the engineering unit when it carries bare SI force units.
 * Every output (command line, JSON, sheet, live page) picks units through this function.
 * @example readableUnit(math.unit(17090, 'N')) // "kN"
 */
export function readableUnit(u: Unit, system: UnitSystem = 'si'): string {
  const own = displayUnitOf(u, system);
  return BARE_SI.test(own) ? engineeringUnit(u, system) : own;
}

/** A quantity as {number, unit} in the unit asked for, else in its readable unit. */
export function splitQuantity(u: Unit, unit?: string | null, system: UnitSystem = 'si'): { number: number; unit: string } {
  const target = unit ?? readableUnit(u, system);
  try {
    return { number: u.toNumber(target), unit: compactUnit(target) };
  } catch {
    return { number: u.toNumber(), unit: compactUnit(u.formatUnits()) };
  }
}

/** The most significant figures a double carries. */
const MAX_SIGFIGS = 17;

/**
 * The significant figures to print two values with that differ: `sigfigs`, or more when at
 * `sigfigs` they would print alike (1.0004 and 1 both as "1"), so that a sheet never shows
 * `1 ≤ 1` beside a check that fails.
 * @param show the two values' texts at a number of significant figures
 * @param differ whether the values differ (else `sigfigs` is kept)
 * @example separatingSigfigs((sf) => [formatNumber(1.0004, sf), formatNumber(1, sf)], 4, true) // 5
 */
export function separatingSigfigs(show: (sf: number) => [string, string], sigfigs: number, differ: boolean): number {
  if (!differ) return sigfigs;
  for (let sf = sigfigs; sf <= MAX_SIGFIGS; sf++) {
    const [a, b] = show(sf);
    if (a !== b) return sf;
  }
  return sigfigs;
}

/** How far above 1 a utilization may lie and still be the round-off of a check that holds (mathjs compares with this relative tolerance). */
const HOLDS_TOLERANCE = 1e-9;

/**
 * A utilization as every output prints it: two decimals, rounded UP, so that a printed 1.00
 * never hides a ratio above one (common practice). Given the check's verdict, the text agrees
 * with it at the limit: a check that fails never prints as 1.00 or less, one that holds never
 * above 1.00.
 * @param u demand/capacity (≤ 1 holds)
 * @param pass the check's verdict, when known
 * @example formatUtilization(1.0043) // "1.01"
 * @example formatUtilization(0.9512) // "0.96"
 */
export function formatUtilization(u: number, pass?: boolean | null): string {
  if (Number.isNaN(u)) return '—';
  if (!Number.isFinite(u)) return u > 0 ? '∞' : '−∞';
  // The small allowance keeps 0.07 (7.000000000000001 hundredths in binary) from rounding up to 0.08.
  let hundredths = Math.ceil(u * 100 - 1e-9);
  // At the limit the verdict decides: a ratio of 1 + 1e-12 that fails is 1.01, one within round-off that holds is 1.00.
  if (pass === false && u >= 1 && hundredths <= 100) hundredths = 101;
  if (pass === true && hundredths > 100 && u <= 1 + HOLDS_TOLERANCE) hundredths = 100;
  return (hundredths / 100).toFixed(2);
}

function isCheck(v: unknown): v is CheckResult {
  return typeof v === 'object' && v !== null && (v as CheckResult).isCheck === true;
}

/**
 * One line of text for any cell value.
 * @example formatValue(math.unit(72000, 'N/m')) // "72 kN/m"
 */
export function formatValue(value: unknown, opts: FormatOptions = {}, unit?: string | null): string {
  if (typeof value === 'number') return formatNumber(value, sigfigsFor(value, opts));
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (typeof value === 'string') return value.startsWith('<svg') ? '[figure]' : value;
  if (math.isUnit(value)) {
    const q = splitQuantity(value as Unit, unit, opts.units);
    const sf = sigfigsFor(q.number, opts);
    return q.unit ? `${formatNumber(q.number, sf)} ${q.unit}` : formatNumber(q.number, sf);
  }
  if (isCheck(value)) {
    const u = value.utilization === null ? '' : ` (utilization ${formatUtilization(value.utilization, value.pass)})`;
    return `${value.pass ? 'holds' : 'FAILS'}${u}`;
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
