/**
 * diffValue: two versions of one named value → the fields that moved.
 *
 * Values come from the JSON summary ({value, unit, text}, objects nested in the
 * same shape), so two `--json` outputs can be compared as well as two files.
 * Numbers are compared in ONE unit — the new version's display unit — so
 * "45 kN m" against "45000 N m" is no change, and a percentage means something.
 * Kernel results are walked field by field (`a.H_min`); lists are compared by
 * meaning, not by index: their items are paired by an alignment that keeps their
 * order and pairs the closest items (a hinge with the hinge of the same face at the
 * nearest angle, up to 15° away), so a hinge added before others reads as one hinge added, not as
 * every later hinge moved. Pure: no Node imports.
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
  change: 'moved' | 'changed' | 'dimension' | 'status' | 'added' | 'removed' | 'item added' | 'item removed' | 'item moved';
  old: Leaf | null;
  new: Leaf | null;
  /** Unit both numbers are compared in (the new one's), when they are quantities. */
  unit: string | null;
  /** new − old in `unit`, for numbers. */
  delta: number | null;
  /** 100·(new − old)/|old|; null when old is 0 or not a number. */
  percent: number | null;
  /** Item changes of a list: the item's position in the old and in the new list (0-based), null where absent. */
  item?: { old: number | null; new: number | null };
}

/** A value of the JSON summary: {value, unit, text}, lists and records nested in the same shape. */
interface Node {
  value: unknown;
  unit: string | null;
  text: string;
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

/** Gap cost of the list alignment: two items further apart than twice this (in the fields' own spread) are one removed and one added, not one moved. */
const GAP = 0.15;

const isList = (n: Node | undefined): n is Node & { value: Node[] } => n !== undefined && Array.isArray(n.value);
const isRecord = (n: Node | undefined): n is Node & { value: Record<string, Node> } =>
  n !== undefined && n.value !== null && typeof n.value === 'object' && !Array.isArray(n.value);

/**
 * How far apart two list items are: the largest move of a numeric field, in units of that field's
 * spread over both lists; Infinity when they differ in anything that is not a number (a face, a name).
 */
function itemDistance(a: Map<string, Leaf>, b: Map<string, Leaf>, spread: Map<string, number>): number {
  if (a.size !== b.size) return Infinity;
  const hinge = hingeDistance(a, b);
  if (hinge !== undefined) return hinge;
  // Items named by their state (a sliding ratio of "least thrust", "collapse"): the same state is the same item.
  const [sa, sb] = [a.get('.state')?.value, b.get('.state')?.value];
  if (typeof sa === 'string' && typeof sb === 'string') return sa === sb ? 0 : Infinity;
  let d = 0;
  for (const [path, x] of a) {
    const y = b.get(path);
    if (!y) return Infinity;
    if (typeof x.value === 'number' && typeof y.value === 'number') {
      const was = convert(x.value, x.unit, y.unit);
      if (was === null) return Infinity;
      d = Math.max(d, Math.abs(y.value - was) / spread.get(path)!);
    } else if (x.value !== y.value) {
      return Infinity;
    }
  }
  return d;
}

/** A hinge that moves along its face by up to this angle is the same hinge moved (common practice for reading mechanisms; ours). */
const HINGE_MOVE_DEG = 15;

/**
 * How far apart two hinges are (items with an angle and a face): on the same face, the angle moved as a
 * fraction of HINGE_MOVE_DEG, scaled under the cost of one removal and one addition so that any move up
 * to HINGE_MOVE_DEG pairs; Infinity on another face or further. Their forces (N, T) follow the loads and
 * say nothing about which hinge is which. Undefined for items that are not hinges.
 */
function hingeDistance(a: Map<string, Leaf>, b: Map<string, Leaf>): number | undefined {
  const [ax, bx] = [a.get('.angle'), b.get('.angle')];
  if (!ax || !bx || !a.has('.face') || typeof ax.value !== 'number' || typeof bx.value !== 'number') return undefined;
  if (a.get('.face')!.value !== b.get('.face')?.value) return Infinity;
  const [da, db] = [convert(ax.value, ax.unit, 'deg'), convert(bx.value, bx.unit, 'deg')];
  if (da === null || db === null) return undefined;
  const moved = Math.abs(db - da);
  return moved <= HINGE_MOVE_DEG ? (moved / HINGE_MOVE_DEG) * 2 * GAP * 0.999 : Infinity;
}

/** Spread of each numeric field over the items of both lists (range, else magnitude, else 1). */
function spreads(items: Array<Map<string, Leaf>>): Map<string, number> {
  const lo = new Map<string, number>(), hi = new Map<string, number>();
  for (const leaves of items) {
    for (const [path, l] of leaves) {
      if (typeof l.value !== 'number') continue;
      lo.set(path, Math.min(lo.get(path) ?? Infinity, l.value));
      hi.set(path, Math.max(hi.get(path) ?? -Infinity, l.value));
    }
  }
  const out = new Map<string, number>();
  for (const [path, l] of lo) out.set(path, (hi.get(path)! - l) || Math.max(Math.abs(l), Math.abs(hi.get(path)!)) || 1);
  return out;
}

/**
 * Pairs the items of two lists, keeping their order, at the least total cost (distance of each pair,
 * GAP for each item left unpaired): a sequence alignment by dynamic programming.
 * @returns pairs [old index | null, new index | null] in list order
 */
export function alignLists(a: Node[], b: Node[]): Array<[number | null, number | null]> {
  const la = a.map((n) => leavesOf(n)), lb = b.map((n) => leavesOf(n));
  const spread = spreads([...la, ...lb]);
  const n = a.length, m = b.length;
  const cost = Array.from({ length: n + 1 }, () => new Float64Array(m + 1));
  for (let i = 0; i <= n; i++) cost[i]![0] = i * GAP;
  for (let j = 0; j <= m; j++) cost[0]![j] = j * GAP;
  for (let i = 1; i <= n; i++) {
    for (let j = 1; j <= m; j++) {
      const d = itemDistance(la[i - 1]!, lb[j - 1]!, spread);
      cost[i]![j] = Math.min(cost[i - 1]![j - 1]! + d, cost[i - 1]![j]! + GAP, cost[i]![j - 1]! + GAP);
    }
  }
  const pairs: Array<[number | null, number | null]> = [];
  let i = n, j = m;
  while (i > 0 || j > 0) {
    const here = cost[i]![j]!;
    if (i > 0 && j > 0 && here === cost[i - 1]![j - 1]! + itemDistance(la[i - 1]!, lb[j - 1]!, spread)) pairs.push([--i, --j]);
    // Walking backwards, an added item is taken before a removed one, so that a removal reads first.
    else if (j > 0 && here === cost[i]![j - 1]! + GAP) pairs.push([null, --j]);
    else pairs.push([--i, null]);
  }
  return pairs.reverse();
}

/** Walks two versions of a value together; lists are aligned by meaning, records field by field. */
function walk(path: string, a: Node | undefined, b: Node | undefined, tol: number, out: FieldChange[]): void {
  if (isList(a) && isList(b)) {
    for (const [i, j] of alignLists(a.value, b.value)) {
      const x = i === null ? null : a.value[i]!, y = j === null ? null : b.value[j]!;
      const base = { path, unit: null, delta: null, percent: null, item: { old: i, new: j } };
      const leaf = (n: Node) => ({ value: null, unit: null, text: n.text });
      if (x === null) out.push({ ...base, change: 'item added', old: null, new: leaf(y!) });
      else if (y === null) out.push({ ...base, change: 'item removed', old: leaf(x), new: null });
      else {
        const inner: FieldChange[] = [];
        walk('', x, y, tol, inner);
        if (inner.length > 0) out.push({ ...base, change: 'item moved', old: leaf(x), new: leaf(y) });
      }
    }
    return;
  }
  if (isRecord(a) && isRecord(b)) {
    for (const key of new Set([...Object.keys(a.value), ...Object.keys(b.value)])) walk(`${path}.${key}`, a.value[key], b.value[key], tol, out);
    return;
  }
  const la = a === undefined ? undefined : leavesOf(a, path), lb = b === undefined ? undefined : leavesOf(b, path);
  for (const p of new Set([...(la?.keys() ?? []), ...(lb?.keys() ?? [])])) {
    const c = compareLeaf(p, la?.get(p), lb?.get(p), tol);
    if (c) out.push(c);
  }
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
  const changes: FieldChange[] = [];
  walk('', a, b, tol, changes);
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
