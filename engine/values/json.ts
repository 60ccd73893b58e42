/**
 * The JSON shape of a value, as documented in README ("JSON output").
 */
import type { Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import type { CheckResult } from '../types.js';
import { isNotAvailable } from '../../cells/not-available.js';
import { formatValue, formatNumber, sigfigsFor, splitQuantity, NOISE, type FormatOptions } from './format.js';

/** Drops floating-point noise (51.20000000000001 → 51.2) so JSON output diffs cleanly. */
function clean(x: number): number {
  if (Number.isFinite(x) && Math.abs(x) < NOISE) return 0;
  return Number.isFinite(x) ? Number(x.toPrecision(12)) : x;
}

export interface JsonValue {
  value: unknown;
  unit: string | null;
  text: string;
  /** Set on an unbounded quantity: `value` is then null and `text` begins with ∞ (or −∞). */
  infinite?: true;
  /** Set on a field that does not exist in this state: `value` is then null. */
  reason?: string;
}

/** An unbounded number: JSON has no ∞, so value is null and the text says it. */
function infinite(text: string, unit: string | null): JsonValue {
  return { value: null, unit, text, infinite: true };
}

function isInfinity(x: number): boolean {
  return x === Infinity || x === -Infinity;
}

/** A value as {value, unit, text}; objects become nested records of the same shape. */
export function toJsonValue(value: unknown, opts: FormatOptions = {}, unit?: string | null): JsonValue {
  if (math.isUnit(value)) {
    const q = splitQuantity(value as Unit, unit, opts.units);
    const text = formatValue(value, opts, unit);
    if (isInfinity(q.number)) return infinite(text, q.unit || null);
    return { value: Number.isFinite(q.number) ? clean(q.number) : String(q.number), unit: q.unit || null, text };
  }
  if (typeof value === 'number') {
    const text = formatNumber(value, sigfigsFor(value, opts));
    if (isInfinity(value)) return infinite(text, null);
    return { value: Number.isFinite(value) ? clean(value) : String(value), unit: null, text };
  }
  if (isNotAvailable(value)) return { value: null, unit: null, text: String(value), reason: value.reason };
  if (typeof value === 'boolean' || typeof value === 'string') return { value, unit: null, text: formatValue(value, opts) };
  if (value === null || value === undefined) return { value: null, unit: null, text: '—' };
  if ((value as CheckResult).isCheck) {
    const c = value as CheckResult;
    return { value: c.pass, unit: null, text: formatValue(c, opts) };
  }
  if (math.isMatrix(value)) return toJsonValue((value as { toArray(): unknown[] }).toArray(), opts);
  if (Array.isArray(value)) return { value: value.map((v) => toJsonValue(v, opts)), unit: null, text: formatValue(value, opts) };
  if (typeof value === 'object') {
    const out: Record<string, JsonValue> = {};
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
      if (typeof v !== 'function') out[k] = toJsonValue(v, opts);
    }
    return { value: out, unit: null, text: formatValue(value, opts) };
  }
  return { value: String(value), unit: null, text: String(value) };
}
