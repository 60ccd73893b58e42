/**
 * Values handed from one cell to the next are frozen: lists, records and
 * quantities. No expression can change what another cell reads, whatever
 * path it finds (the shape check already refuses methods and assignments).
 */
import { math } from '../../cells/math.js';

function isPlainObject(v: object): boolean {
  const proto = Object.getPrototypeOf(v);
  return proto === Object.prototype || proto === null;
}

/**
 * Deep-freezes lists, plain records and units (with their unit list), in place, without recursion.
 * Class instances other than units are left as they are.
 * @returns the same value
 */
export function freezeValue<T>(value: T): T {
  const stack: unknown[] = [value];
  while (stack.length > 0) {
    const cur = stack.pop();
    if (cur === null || typeof cur !== 'object' || Object.isFrozen(cur)) continue;
    if (Array.isArray(cur) || isPlainObject(cur)) {
      Object.freeze(cur);
      for (const v of Object.values(cur)) stack.push(v);
    } else if (math.isUnit(cur)) {
      const u = cur as unknown as { units: Array<Record<string, unknown>>; dimensions: number[] };
      Object.freeze(u.units);
      for (const part of u.units) Object.freeze(part);
      Object.freeze(u.dimensions);
      Object.freeze(cur);
    }
  }
  return value;
}
