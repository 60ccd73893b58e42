/**
 * diffValue: two versions of one named value → the fields that moved.
 *
 * Values come from the JSON summary ({value, unit, text}, objects nested in the
 * same shape), so two `--json` outputs can be compared as well as two files.
 * Numbers are compared in ONE unit — the new version's display unit — so
 * "45 kN m" against "45000 N m" is no change, and a percentage means something.
 * Kernel results are walked field by field (`a.H_min`, `r.joints[3].x`).
 * Pure: no Node imports.
 */
import { math } from '../../cells/math.js';
import { formatNumber } from '../../engine/index.js';
import type { ValueEntry } from '../../engine/summary.js';

type Scalar = number | string | boolean | null;

export interface Leaf {
  value: Scalar;
  unit: string | null;
  text: string;
}

export interface FieldChange {
  /** '' for the value itself, else `.field` / `[i]` steps into a kernel result. */
  path: string;
  change: 'moved' | 'changed' | 'dimension' | 'status' | 'added' | 'removed';
  old: Leaf | null;
  new: Leaf | null;
  /** Unit both numbers are compared in (the new one's), when they are quantities. */
  unit: string | null;
  /** new − old in `unit`, for numbers. */
  delta: number | null;
  /** 100·(new − old)/|old|; null when old is 0 or not a number. */
  percent: number | null;
}

/** How a value stands: computed, failed, or not computed because another cell failed. */
export type ValueStatus = 'ok' | 'error' | 'blocked';

export function statusOf(e: ValueEntry): ValueStatus {
  if (e.blocked_by !== undefined) return 'blocked';
  if (e.value === null && e.text.startsWith('error: ')) return 'error';
  return 'ok';
}

/** Flattens a JSON value into leaves by path. Figures (SVG strings) stay one leaf. */
export function leavesOf(v: { value: unknown; unit: string | null; text: string }, path = '', out = new Map<string, Leaf>()): Map<string, Leaf> {
  const x = v.value;
  if (Array.isArray(x)) {
    if (x.length === 0) out.set(path, { value: '[]', unit: null, text: v.text });
    x.forEach((item, i) => leavesOf(item as Leaf, `${path}[${i}]`, out));
  } else if (x !== null && typeof x === 'object') {
    const entries = Object.entries(x as Record<string, Leaf>);
    if (entries.length === 0) out.set(path, { value: '{}', unit: null, text: v.text });
    for (const [k, item] of entries) leavesOf(item, `${path}.${k}`, out);
  } else {
    out.set(path, { value: x as Scalar, unit: v.unit, text: v.text });
  }
  return out;
}

/** old's number expressed in `unit`, or null when the dimensions differ. */
function convert(old: number, from: string | null, to: string | null): number | null {
  if (from === to) return old;
  if (from === null || to === null) return null;
  try {
    return math.unit(old, from).toNumber(to);
  } catch {
    return null;
  }
}

/**
 * Compares two leaves.
 * @param tol relative tolerance below which a number has not moved
 * @returns the change, or null when they agree
 */
export function compareLeaf(path: string, a: Leaf | undefined, b: Leaf | undefined, tol: number): FieldChange | null {
  const base = { path, unit: null, delta: null, percent: null };
  if (!a && !b) return null;
  if (!a) return { ...base, change: 'added', old: null, new: b! };
  if (!b) return { ...base, change: 'removed', old: a, new: null };
  if (typeof a.value === 'number' && typeof b.value === 'number') {
    const was = convert(a.value, a.unit, b.unit);
    if (was === null) return { ...base, change: 'dimension', old: a, new: b };
    const delta = b.value - was;
    if (Math.abs(delta) <= tol * Math.max(Math.abs(was), Math.abs(b.value)) || delta === 0) return null;
    const percent = was === 0 ? null : (100 * delta) / Math.abs(was);
    return { path, change: 'moved', old: { ...a, value: was, unit: b.unit }, new: b, unit: b.unit, delta, percent };
  }
  if (a.value === b.value && a.unit === b.unit) return null;
  return { ...base, change: 'changed', old: a, new: b };
}

/**
 * Every field that differs between two versions of a value.
 * @example diffValue(oldEntry, newEntry, 1e-9) // [{path: '', change: 'moved', percent: 16.7, …}]
 */
export function diffValue(a: ValueEntry, b: ValueEntry, tol: number): FieldChange[] {
  const sa = statusOf(a), sb = statusOf(b);
  if (sa !== 'ok' || sb !== 'ok') {
    if (sa === sb && a.text === b.text) return [];
    return [{ path: '', change: 'status', old: { value: null, unit: null, text: a.text }, new: { value: null, unit: null, text: b.text }, unit: null, delta: null, percent: null }];
  }
  const la = leavesOf(a), lb = leavesOf(b);
  const changes: FieldChange[] = [];
  for (const path of new Set([...la.keys(), ...lb.keys()])) {
    const c = compareLeaf(path, la.get(path), lb.get(path), tol);
    if (c) changes.push(c);
  }
  return changes;
}

/** "+16.7 %" style text for a percentage. */
export function formatPercent(p: number | null): string {
  if (p === null) return '';
  const sign = p > 0 ? '+' : p < 0 ? '−' : '±';
  return `${sign}${formatNumber(Math.abs(p), 3)} %`;
}

/** "6 m → 7 m" for a field change, both sides in the compared unit. */
export function formatMove(c: FieldChange, sigfigs = 4): string {
  const side = (l: Leaf | null) => {
    if (!l) return '—';
    if (typeof l.value === 'number') return l.unit ? `${formatNumber(l.value, sigfigs)} ${l.unit}` : formatNumber(l.value, sigfigs);
    if (typeof l.value === 'string' && l.value.startsWith('<svg')) return '[figure]';
    return l.text;
  };
  return `${side(c.old)} → ${side(c.new)}`;
}
