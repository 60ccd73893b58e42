/**
 * Numbers and units as the sheet shows them, in HTML and in TeX: significant
 * figures from the front matter, digits grouped in threes above 9 999,
 * powers of ten written out, units upright with real superscripts.
 */
import type { Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import { engineeringUnit, formatNumber, formatValue, readableUnit, sigfigsFor, splitQuantity, type UnitSystem } from '../values/format.js';

export { engineeringUnit, readableUnit } from '../values/format.js';
import type { CheckResult } from '../types.js';
import { escapeHtml, texText } from './escape.js';

/** A number split into mantissa text and power of ten, with grouping applied. */
interface NumberParts {
  negative: boolean;
  mantissa: string;
  exponent: string | null;
}

function numberParts(x: number, sigfigs: number): NumberParts | string {
  const text = formatNumber(x, sigfigs);
  if (!/\d/.test(text)) return text; // NaN, ∞
  const negative = text.startsWith('−');
  const [m, e] = text.replace(/^−/, '').split('e');
  // Group the whole part in threes when it has five digits or more (ISO 80000-1, 7.3.1).
  const [whole, frac] = m!.split('.');
  const grouped = whole!.length > 4 ? whole!.replace(/\B(?=(\d{3})+(?!\d))/g, ' ') : whole!;
  return { negative, mantissa: frac !== undefined ? `${grouped}.${frac}` : grouped, exponent: e ? String(Number(e)) : null };
}

/**
 * A number as HTML text: "12 350", "−0.25", "1.2 × 10<sup>−5</sup>".
 * @example numberHtml(12345.6, 4) // "12 350" (narrow no-break space)
 */
export function numberHtml(x: number, sigfigs = 4): string {
  const p = numberParts(x, sigfigs);
  if (typeof p === 'string') return escapeHtml(p);
  const m = `${p.negative ? '−' : ''}${p.mantissa.replace(/ /g, '\u202f')}`;
  return p.exponent ? `${m}\u2009×\u200910<sup>${p.exponent.replace('-', '−')}</sup>` : m;
}

/**
 * A number as TeX: "12\,350", "-0.25", "1.2 \times 10^{-5}".
 * @example numberTex(0.0000123, 3) // "1.23\\times10^{-5}"
 */
export function numberTex(x: number, sigfigs = 4): string {
  const p = numberParts(x, sigfigs);
  if (typeof p === 'string') return p === '∞' ? '\\infty' : p === '−∞' ? '-\\infty' : `\\text{${texText(p)}}`;
  const m = `${p.negative ? '-' : ''}${p.mantissa.replace(/ /g, '\\,')}`;
  return p.exponent ? `${m}\\times10^{${p.exponent}}` : m;
}

type UnitToken = { kind: 'name'; text: string; power: string | null } | { kind: 'op'; text: string };

/** Splits a unit string such as 'kN/m^3', 'kN m', 'kg / (m s^2)' into names with powers and operators. */
function unitTokens(unit: string): UnitToken[] {
  const out: UnitToken[] = [];
  const re = /([A-Za-z]+)(?:\s*\^\s*(?:\((-?\d+(?:\.\d+)?)\)|(-?\d+(?:\.\d+)?)))?|(\/|\(|\)|\*|\s+)/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(unit))) {
    if (m[1]) out.push({ kind: 'name', text: m[1], power: m[2] ?? m[3] ?? null });
    else if (m[4]!.trim() === '' || m[4] === '*') out.push({ kind: 'op', text: ' ' });
    else out.push({ kind: 'op', text: m[4]! });
  }
  // Spaces next to '/' or brackets carry no meaning.
  return out.filter((t, i) => !(t.kind === 'op' && t.text === ' ' && (i === 0 || i === out.length - 1
    || (out[i - 1]!.kind === 'op' && out[i - 1]!.text !== ')') || (out[i + 1]!.kind === 'op' && out[i + 1]!.text !== '('))));
}

const HTML_NAMES: Record<string, string> = { deg: '°', inch: 'in', ohm: 'Ω' };

/**
 * A unit as HTML: 'kN/m^3' → "kN/m<sup>3</sup>", 'kN m' → "kN·m", 'deg' → "°".
 * @example unitHtml('kN/m^2') // "kN/m<sup>2</sup>"
 */
export function unitHtml(unit: string): string {
  return unitTokens(unit).map((t) => {
    if (t.kind === 'op') return t.text === ' ' ? '·' : escapeHtml(t.text);
    const name = escapeHtml(HTML_NAMES[t.text] ?? t.text);
    return t.power ? `${name}<sup>${escapeHtml(t.power.replace('-', '−'))}</sup>` : name;
  }).join('');
}

/**
 * A unit as TeX: 'kN/m^3' → "\mathrm{kN}/\mathrm{m}^{3}", 'deg' → "{}^{\circ}".
 * @example unitTex('kN m') // "\\mathrm{kN}{\\cdot}\\mathrm{m}"
 */
export function unitTex(unit: string): string {
  return unitTokens(unit).map((t) => {
    if (t.kind === 'op') return t.text === ' ' ? '{\\cdot}' : t.text;
    const name = t.text === 'deg' ? '{}^{\\circ}' : `\\mathrm{${HTML_NAMES[t.text] === 'in' ? 'in' : t.text}}`;
    return t.power ? `${name}^{${t.power}}` : name;
  }).join('');
}

/** Does this unit sit against its number without a space (degrees)? */
function isAngleMark(unit: string): boolean {
  return unit === 'deg';
}

/** Options for showing one value. */
export interface ShowOptions {
  sigfigs: number;
  /** Display unit for a quantity (else its own unit when written by hand, or its engineering unit). */
  unit?: string | null;
  /** Show in the engineering unit for the dimension (kN, kN/m, kN/m²…) even when the value carries another. */
  engineering?: boolean;
  /** The document's system of units (default 'si'): engineering units are kip, kip/ft, psf … in 'us'. */
  units?: UnitSystem;
  /** A given input: every digit it was written with (engine/values/format.ts writtenSigfigs), not rounded to `sigfigs`. */
  written?: boolean;
}

function unitFor(u: Unit, opts: ShowOptions): string {
  return opts.unit ?? (opts.engineering ? engineeringUnit(u, opts.units) : readableUnit(u, opts.units));
}

function isCheck(v: unknown): v is CheckResult {
  return typeof v === 'object' && v !== null && (v as CheckResult).isCheck === true;
}

/**
 * Any scalar value as HTML: quantities with their unit, numbers, text (escaped), true/false;
 * records and lists as escaped one-line text.
 * @example valueHtml(math.unit(72000, 'N/m'), {sigfigs: 4}) // "72 kN/m"
 */
export function valueHtml(value: unknown, opts: ShowOptions): string {
  if (typeof value === 'number') return numberHtml(value, sigfigsFor(value, opts));
  if (math.isUnit(value)) {
    const q = splitQuantity(value as Unit, unitFor(value as Unit, opts));
    if (!q.unit) return numberHtml(q.number, sigfigsFor(q.number, opts));
    const gap = isAngleMark(q.unit) ? '' : '\u00a0';
    return `${numberHtml(q.number, sigfigsFor(q.number, opts))}${gap}<span class="vb-unit">${unitHtml(q.unit)}</span>`;
  }
  if (typeof value === 'string') return value.startsWith('<svg') ? '[figure]' : `“${escapeHtml(value)}”`;
  const written = opts.written ? { written: true } : {};
  if (Array.isArray(value) && value.length <= 6 && value.every((v) => typeof v === 'number' || math.isUnit(v))) {
    return `[${value.map((v) => valueHtml(v, { sigfigs: opts.sigfigs, engineering: opts.engineering, units: opts.units, ...written })).join(', ')}]`;
  }
  if (isCheck(value)) return escapeHtml(formatValue(value, { sigfigs: opts.sigfigs }));
  return escapeHtml(formatValue(value, { sigfigs: opts.sigfigs, ...written }));
}

/**
 * A scalar value as TeX, or null when it has no sensible typeset form (records, figures).
 * @example valueTex(math.unit(6.4, 'm'), {sigfigs: 4}) // "6.4\\,\\mathrm{m}"
 */
export function valueTex(value: unknown, opts: ShowOptions): string | null {
  if (typeof value === 'number') return numberTex(value, sigfigsFor(value, opts));
  if (typeof value === 'boolean') return `\\mathrm{${value ? 'true' : 'false'}}`;
  if (math.isUnit(value)) {
    const q = splitQuantity(value as Unit, unitFor(value as Unit, opts));
    if (!q.unit) return numberTex(q.number, sigfigsFor(q.number, opts));
    return `${numberTex(q.number, sigfigsFor(q.number, opts))}${isAngleMark(q.unit) ? '' : '\\,'}${unitTex(q.unit)}`;
  }
  if (typeof value === 'string' && !value.startsWith('<svg')) return `\\text{“${texText(value)}”}`;
  return null;
}

/** Is a value negative (so that it needs brackets when substituted into a product or power)? */
export function isNegativeValue(value: unknown): boolean {
  if (typeof value === 'number') return value < 0;
  if (math.isUnit(value)) return ((value as Unit).value ?? 0) < 0;
  return false;
}

/** Does a value carry a unit (so that a power of it needs brackets)? */
export function hasUnit(value: unknown): boolean {
  return math.isUnit(value) && (value as Unit).units.length > 0;
}
