/**
 * The registration point: every cell function listed in cells/index.ts is
 * made callable from expressions, under its snake_case name.
 */
import * as cellExports from '../cells/index.js';
import type { CellFunction } from '../cells/define.js';
import { registerFunctions } from '../cells/math.js';
import type { Library } from './graph/build.js';

function isCellFunction(v: unknown): v is CellFunction {
  return typeof v === 'object' && v !== null && (v as CellFunction).isCellFunction === true;
}

/** Every registered cell function, by name. */
export const cellFunctions: ReadonlyMap<string, CellFunction> = new Map(
  Object.values(cellExports).filter(isCellFunction).map((f) => [f.name, f]),
);

let registered = false;

/** Puts the cell functions into the mathjs instance (once) and returns the library description. */
export function registerLibrary(): Library {
  if (!registered) {
    const table: Record<string, (...args: unknown[]) => unknown> = {};
    for (const [name, f] of cellFunctions) table[name] = f.call;
    registerFunctions(table);
    registered = true;
  }
  return { functions: new Set(cellFunctions.keys()) };
}
