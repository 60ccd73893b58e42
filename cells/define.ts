/**
 * Registration of the functions a cell may call.
 *
 * A cell function is described, not hand-wrapped: its parameters and result
 * fields name their SI units, and `defineCellFunction` builds the wrapper that
 * checks and converts units on the way in, calls the pure kernel with plain SI
 * numbers, and attaches units to the result on the way out.
 */
import { math } from './math.js';
import { toSI, fromSI, UnitMismatchError } from './units.js';
import { isNotAvailable } from './not-available.js';

/**
 * What a parameter, option or result field holds.
 * - an SI unit string ('m', 'N/m', 'Pa', 'rad', 'N/m^3'); '1' for a plain number
 * - 'text', 'boolean', 'count' (a whole number ≥ 0), 'any'
 * - `{object: {...}}` a record of named fields; `{list: T}` a list of T
 * - `{ref: 'arch_ring'}` a value returned earlier by that cell function
 * - `{refWithArgs: 'arch_limit'}` the same, handed over as {value, args}: the raw result and the SI
 *   arguments of the call that made it (a figure draws a result with the loads it was computed for)
 */
export type FieldType =
  | string
  | { object: Record<string, FieldType> }
  | { list: FieldType }
  | { ref: string }
  | { refWithArgs: string };

export interface ParamSpec {
  name: string;
  type: FieldType;
  optional?: boolean;
}

export interface CellFunctionSpec<K = any> {
  /** The snake_case name a document calls. */
  name: string;
  /** One sentence for the function list and the sheet. */
  doc: string;
  params: ParamSpec[];
  /** Units of the kernel's result; fields not listed pass through unchanged. */
  returns: FieldType;
  /** The pure kernel: plain SI numbers in, plain SI numbers out. */
  fn: (...args: any[]) => K;
  /** Names of option fields that must be present (checked before the kernel runs). */
  required?: string[];
  /** The kernel reference: what `vaultbook help NAME` and docs/ print. */
  reference?: CellFunctionReference;
}

/**
 * The text of a function's entry in the kernel reference, kept beside its declaration so the two
 * cannot drift apart. Keys of `params` and `fields` are parameter / option names and result field
 * names (dotted for nested ones, e.g. `options.thickness`, `hinges.angle`).
 */
export interface CellFunctionReference {
  /** Meaning of each argument and option: what it is, its default, its sign convention. */
  params?: Record<string, string>;
  /** Meaning of each result field: what it is, sign and angle conventions, when it is ∞ or not available. */
  fields?: Record<string, string>;
  /** The method, in a sentence or two. */
  method?: string;
  /** Assumptions the result rests on. */
  assumptions?: string[];
  /** Published sources followed (author, title, year, equation or clause). */
  sources?: string[];
}

/** A registered cell function: the spec plus the unit-converting wrapper. */
export interface CellFunction {
  readonly isCellFunction: true;
  readonly name: string;
  readonly doc: string;
  readonly params: ParamSpec[];
  readonly returns: FieldType;
  /** Names of option fields that must be present. */
  readonly required: readonly string[];
  /** The kernel reference text (see CellFunctionReference). */
  readonly reference: CellFunctionReference;
  /** Called by mathjs with document values. */
  readonly call: (...args: unknown[]) => unknown;
}

/** A mistake in how a document called a cell function (missing option, wrong type). */
export class CellArgumentError extends Error {
  override name = 'CellArgumentError';
}

/**
 * A kernel refused its arguments (a RangeError at the edge of its domain). It carries the values as
 * the document gave them, so that the message can quote them in the document's units rather than
 * in the kernel's SI numbers.
 */
export class KernelDomainError extends RangeError {
  override name = 'KernelDomainError';
  constructor(message: string, readonly given: GivenQuantity[]) {
    super(message);
  }
}

/** One quantity handed to a kernel: its SI unit and number, and the value as the document gave it. */
export interface GivenQuantity {
  si: string;
  number: number;
  value: unknown;
}

/** The quantities among a call's arguments (options and lists included), as the kernel saw them and as written. */
function givenQuantities(value: unknown, type: FieldType, out: GivenQuantity[]): void {
  if (typeof type === 'string') {
    if (!KEYWORDS.has(type) && type !== '1' && math.isUnit(value)) {
      try {
        out.push({ si: type, number: (value as { toNumber(u: string): number }).toNumber(type), value });
      } catch {
        // A value of the wrong dimension never reaches the kernel.
      }
    }
    return;
  }
  if ('list' in type) {
    const items = math.isMatrix(value) ? (value as { toArray(): unknown[] }).toArray() : value;
    if (Array.isArray(items)) for (const item of items) givenQuantities(item, type.list, out);
    return;
  }
  if ('object' in type && typeof value === 'object' && value !== null) {
    for (const [key, field] of Object.entries(value as Record<string, unknown>)) {
      if (type.object[key]) givenQuantities(field, type.object[key]!, out);
    }
  }
}

/** Hidden keys on returned objects: not reachable from an expression. */
export const KERNEL_VALUE = Symbol('vaultbook.kernelValue');
export const KERNEL_SOURCE = Symbol('vaultbook.kernelSource');
export const KERNEL_ARGS = Symbol('vaultbook.kernelArgs');

const KEYWORDS = new Set(['text', 'boolean', 'count', 'any']);

/** The largest 'count' a document may pass (voussoirs, bays …): a kernel's work grows with it (README "Security model"). */
export const MAX_COUNT = 100_000;

/** Is this value an object returned by a cell function? */
export function isKernelResult(value: unknown): value is Record<string | symbol, unknown> {
  return typeof value === 'object' && value !== null && KERNEL_SOURCE in value;
}

function describeType(type: FieldType): string {
  if (typeof type === 'string') return KEYWORDS.has(type) ? type : `a quantity in ${type}`;
  if ('ref' in type) return `the result of ${type.ref}(…)`;
  if ('refWithArgs' in type) return `the result of ${type.refWithArgs}(…)`;
  if ('list' in type) return 'a list';
  return 'a record {…}';
}

function toKernel(value: unknown, type: FieldType, what: string): unknown {
  if (typeof type === 'string') {
    switch (type) {
      case 'any':
        return value;
      case 'text':
        if (typeof value !== 'string') throw new CellArgumentError(`${what} must be text in quotes, e.g. "circular"`);
        return value;
      case 'boolean':
        if (typeof value !== 'boolean') throw new CellArgumentError(`${what} must be true or false`);
        return value;
      case 'count': {
        const n = toSI(value, '1', what);
        if (!Number.isInteger(n) || n < 0) throw new CellArgumentError(`${what} must be a whole number ≥ 0, got ${n}`);
        if (n > MAX_COUNT) throw new CellArgumentError(`${what} must be at most ${MAX_COUNT.toLocaleString('en-US')}, got ${n}`);
        return n;
      }
      default:
        return toSI(value, type, what);
    }
  }
  if ('ref' in type) {
    if (!isKernelResult(value) || value[KERNEL_SOURCE] !== type.ref) {
      throw new CellArgumentError(`${what} must be ${describeType(type)}`);
    }
    return value[KERNEL_VALUE];
  }
  if ('refWithArgs' in type) {
    if (!isKernelResult(value) || value[KERNEL_SOURCE] !== type.refWithArgs) {
      throw new CellArgumentError(`${what} must be ${describeType(type)}`);
    }
    return { value: value[KERNEL_VALUE], args: value[KERNEL_ARGS] };
  }
  if ('list' in type) {
    const items = math.isMatrix(value) ? (value as { toArray(): unknown[] }).toArray() : value;
    if (!Array.isArray(items)) throw new CellArgumentError(`${what} must be a list [ … ]`);
    return items.map((item, i) => toKernel(item, type.list, `${what}[${i + 1}]`));
  }
  if (typeof value !== 'object' || value === null || Array.isArray(value) || math.isUnit(value)) {
    throw new CellArgumentError(`${what} must be a record {name: value, …}`);
  }
  const out: Record<string, unknown> = {};
  const known = Object.keys(type.object);
  for (const [key, field] of Object.entries(value as Record<string, unknown>)) {
    if (!(key in type.object)) {
      throw new CellArgumentError(`${what.replace(/:$/, '')}: unknown option "${key}"; known options: ${known.join(', ')}`);
    }
    out[key] = toKernel(field, type.object[key]!, what.endsWith(':') ? `${what} ${key}` : `${what}.${key}`);
  }
  return out;
}

function fromKernel(value: unknown, type: FieldType | undefined): unknown {
  if (isNotAvailable(value)) return value;
  if (value === undefined || value === null || math.isUnit(value) || math.isMatrix(value)) return value;
  if (type === undefined || (typeof type === 'string' && KEYWORDS.has(type))) {
    if (Array.isArray(value)) return value.map((v) => fromKernel(v, undefined));
    if (typeof value === 'object') return fromKernel(value, { object: {} });
    return value;
  }
  if (typeof type === 'string') {
    if (typeof value !== 'number') return value;
    return fromSI(value, type);
  }
  if ('ref' in type || 'refWithArgs' in type) return value;
  if ('list' in type) {
    return Array.isArray(value) ? value.map((v) => fromKernel(v, type.list)) : value;
  }
  if (typeof value !== 'object') return value;
  const out: Record<string, unknown> = {};
  for (const [key, field] of Object.entries(value as Record<string, unknown>)) {
    if (typeof field === 'function') continue;
    out[key] = fromKernel(field, type.object[key]);
  }
  return out;
}

/**
 * Describes a kernel function so that cells can call it with units.
 * @param spec name, parameter and result units, and the pure kernel
 * @returns the registered function; list it in cells/index.ts to expose it
 * @example
 * export const clamp = defineCellFunction({name: 'clamp', doc: 'Limits x to [lo, hi].',
 *   params: [{name: 'x', type: 'any'}, ...], returns: 'any', fn: clampKernel});
 */
export function defineCellFunction<K>(spec: CellFunctionSpec<K>): CellFunction {
  if (!/^[a-z][a-z0-9_]*$/.test(spec.name)) {
    throw new TypeError(`defineCellFunction: name must be snake_case, got "${spec.name}"`);
  }
  const required = spec.params.filter((p) => !p.optional).length;
  const call = (...args: unknown[]): unknown => {
    if (args.length < required || args.length > spec.params.length) {
      const list = spec.params.map((p) => (p.optional ? `[${p.name}]` : p.name)).join(', ');
      throw new CellArgumentError(`${spec.name} takes (${list}), got ${args.length} argument${args.length === 1 ? '' : 's'}`);
    }
    // Messages name an option as the document writes it ("arch_ring: thickness"), an argument by its name.
    const kernelArgs = args.map((a, i) => {
      const p = spec.params[i]!;
      return toKernel(a, p.type, typeof p.type === 'object' && 'object' in p.type ? `${spec.name}:` : `${spec.name}: ${p.name}`);
    });
    for (const name of spec.required ?? []) {
      const opts = kernelArgs[0] as Record<string, unknown>;
      if (opts?.[name] === undefined) throw new CellArgumentError(`${spec.name}: option "${name}" is required`);
    }
    let raw: unknown;
    try {
      raw = spec.fn(...kernelArgs);
    } catch (err) {
      if (!(err instanceof RangeError) || err instanceof KernelDomainError) throw err;
      const given: GivenQuantity[] = [];
      args.forEach((a, i) => givenQuantities(a, spec.params[i]!.type, given));
      throw new KernelDomainError(err.message, given);
    }
    const shown = fromKernel(raw, spec.returns);
    if (typeof shown === 'object' && shown !== null && !Array.isArray(shown) && !math.isUnit(shown)) {
      Object.defineProperty(shown, KERNEL_VALUE, { value: raw, enumerable: false });
      Object.defineProperty(shown, KERNEL_SOURCE, { value: spec.name, enumerable: false });
      Object.defineProperty(shown, KERNEL_ARGS, { value: kernelArgs, enumerable: false });
    }
    return shown;
  };
  return Object.freeze({
    isCellFunction: true as const, name: spec.name, doc: spec.doc, params: spec.params, returns: spec.returns,
    required: spec.required ?? [], reference: spec.reference ?? {}, call,
  });
}

export { UnitMismatchError };
