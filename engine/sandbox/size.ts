/**
 * How big a value is: elements of a list or matrix, characters of a text.
 * Counting never recurses on the JavaScript stack, so a deeply nested list is
 * measured as safely as a flat one.
 */
import { math } from '../../cells/math.js';

type Sized = { size(): number[] };

function isMatrixLike(v: unknown): v is Sized {
  return math.isMatrix(v);
}

/** Dimensions of a list or matrix (a list of lists is read along its first entries); [] for a scalar. */
export function dimsOf(v: unknown): number[] {
  if (isMatrixLike(v)) return v.size();
  const dims: number[] = [];
  let cur: unknown = v;
  while (Array.isArray(cur) && dims.length < 64) {
    dims.push(cur.length);
    cur = cur[0];
  }
  return dims;
}

/** Number of scalar entries in a list or matrix (1 for anything else). */
export function elementsOf(v: unknown): number {
  if (isMatrixLike(v)) return v.size().reduce((a, b) => a * b, 1);
  if (!Array.isArray(v)) return 1;
  let count = 0;
  const stack: unknown[] = [v];
  while (stack.length) {
    const cur = stack.pop();
    if (Array.isArray(cur)) for (const x of cur) stack.push(x);
    else count++;
  }
  return count;
}

/** Is this a list or a matrix? */
export function isCollection(v: unknown): boolean {
  return Array.isArray(v) || isMatrixLike(v);
}

/** A plain number from a number, a unit (its SI value), a big number or a numeric text; NaN otherwise. */
export function numberOf(v: unknown): number {
  if (typeof v === 'number') return v;
  if (typeof v === 'boolean') return v ? 1 : 0;
  if (math.isUnit(v)) return typeof (v as { value: unknown }).value === 'number' ? (v as { value: number }).value : NaN;
  if (typeof v === 'string' && v.trim() !== '') return Number(v);
  if (typeof v === 'bigint') return Number(v);
  if (v !== null && typeof v === 'object' && typeof (v as { valueOf(): unknown }).valueOf === 'function') {
    const n = Number((v as { valueOf(): unknown }).valueOf());
    return Number.isNaN(n) ? NaN : n;
  }
  return NaN;
}

/**
 * The first quantity in a value (itself, or inside a list or record) whose number is not a
 * plain real one, e.g. `sqrt(-4 m^2)` gives a complex quantity; null when there is none.
 */
export function oddQuantity(value: unknown): unknown {
  const stack: unknown[] = [value];
  let seen = 0;
  while (stack.length > 0 && seen++ < 1_000_000) {
    const cur = stack.pop();
    if (cur === null || typeof cur !== 'object') continue;
    if (math.isUnit(cur)) {
      const v = (cur as { value: unknown }).value;
      if (v !== null && typeof v !== 'number') return cur;
    } else if (Array.isArray(cur)) {
      for (const x of cur) stack.push(x);
    } else if (Object.getPrototypeOf(cur) === Object.prototype) {
      for (const x of Object.values(cur)) stack.push(x);
    }
  }
  return null;
}
