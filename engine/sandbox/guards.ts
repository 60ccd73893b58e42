/**
 * Size and work guards for the mathjs functions whose result or running time is not
 * bounded by the size of their arguments: the ones that build a list from a count
 * (`zeros(1e5, 1e5)`, `1:1e9`), combine two lists into a bigger one (`kron`, an
 * outer product, broadcasting), do n × m or n³ work, or write n digits.
 *
 * Every other function's result is at most as big as its arguments, which are
 * themselves bounded; so bounding these bounds every value a document can make.
 * Each guard predicts from the arguments, before any work is done, and refuses
 * with a LimitError; the result is measured again after the call.
 */
import { LIMITS } from './limits.js';
import { dimsOf, elementsOf, isCollection, numberOf } from './size.js';

/** A document asked for more than a stated limit allows. */
export class LimitError extends Error {
  override name = 'LimitError';
}

type Guard = (args: unknown[], name: string) => void;

function refuse(name: string, what: string, limit: number): never {
  throw new LimitError(`${name}(…) would ${what}; a calc document allows at most ${limit.toLocaleString('en-US')}`);
}

function capElements(name: string, n: number): void {
  if (n > LIMITS.elements) refuse(name, `make ${fmt(n)} elements`, LIMITS.elements);
}

function capWork(name: string, n: number): void {
  if (n > LIMITS.work) refuse(name, `take ${fmt(n)} steps`, LIMITS.work);
}

function fmt(n: number): string {
  return Number.isFinite(n) && n < 1e15 ? Math.round(n).toLocaleString('en-US') : 'unboundedly many';
}

/** The dimensions asked for by `zeros(2, 3)`, `zeros([2, 3])` or `zeros(matrix([2, 3]))`. */
function requestedDims(args: unknown[]): number[] {
  if (args.length > 0 && isCollection(args[0])) return flatNumbers(args[0]);
  return args.filter((a) => typeof a !== 'string').map(numberOf);
}

function flatNumbers(v: unknown): number[] {
  const data = Array.isArray(v) ? v : (v as { toArray(): unknown[] }).toArray();
  return data.flat(8).map(numberOf);
}

function productOf(dims: number[]): number {
  return dims.reduce((a, b) => a * Math.max(0, Math.abs(b)), 1);
}

const bySize: Guard = (args, name) => capElements(name, productOf(requestedDims(args)));
const bySecondSize: Guard = (args, name) => { if (args.length > 1) capElements(name, productOf(requestedDims([args[1]]))); };

/** Broadcasting: two lists of sizes a and b give a list of the larger size in each dimension. */
const elementwise: Guard = (args, name) => {
  const lists = args.filter(isCollection);
  if (lists.length < 2) return;
  const shapes = lists.map(dimsOf);
  const rank = Math.max(...shapes.map((s) => s.length));
  const out: number[] = [];
  for (let i = 0; i < rank; i++) {
    out.push(Math.max(...shapes.map((s) => s[s.length - rank + i] ?? 1)));
  }
  capElements(name, productOf(out));
};

/** Matrix product: rows of a by columns of b, each entry an inner product. */
const product: Guard = (args, name) => {
  const lists = args.filter(isCollection).map(dimsOf);
  for (let i = 0; i + 1 < lists.length; i++) {
    const a = lists[i]!, b = lists[i + 1]!;
    const rows = a.length === 2 ? a[0]! : 1, inner = a[a.length - 1] ?? 1, cols = b.length === 2 ? b[1]! : 1;
    capElements(name, rows * cols);
    capWork(name, rows * cols * inner);
  }
};

/** n³ work on an n × n matrix. */
const cubic: Guard = (args, name) => {
  for (const a of args.filter(isCollection)) {
    const n = Math.max(...dimsOf(a), 1);
    capWork(name, n * n * n);
  }
};

/** n × m comparisons between two lists. */
const pairwise: Guard = (args, name) => {
  const lists = args.filter(isCollection).map(elementsOf);
  if (lists.length >= 2) capWork(name, lists[0]! * lists[1]!);
};

const range: Guard = (args, name) => {
  let start: number, end: number, step = 1;
  if (typeof args[0] === 'string') {
    const parts = args[0].split(':').map(Number);
    if (parts.length === 3) [start, step, end] = parts as [number, number, number];
    else [start, end] = parts as [number, number];
  } else {
    start = numberOf(args[0]);
    end = numberOf(args[1]);
    if (args.length > 2 && typeof args[2] !== 'boolean') step = numberOf(args[2]);
  }
  if (step === 0 || Number.isNaN(start) || Number.isNaN(end) || Number.isNaN(step)) return; // mathjs says why
  const count = (end - start) / step;
  if (count > 0 || !Number.isFinite(count)) capElements(name, Math.floor(count) + 1);
};

const identity: Guard = (args, name) => {
  const dims = requestedDims(args);
  capElements(name, dims.length === 1 ? dims[0]! * dims[0]! : productOf(dims));
};

const diag: Guard = (args, name) => {
  const d = dimsOf(args[0]);
  if (d.length !== 1) return; // a matrix gives its diagonal: smaller than itself
  const n = d[0]! + Math.abs(numberOf(args[1] ?? 0) || 0);
  capElements(name, n * n);
};

const kron: Guard = (args, name) => capElements(name, elementsOf(args[0]) * elementsOf(args[1]));

const concat: Guard = (args, name) => {
  if (args.some((a) => typeof a === 'string')) {
    const chars = args.reduce<number>((s, a) => s + (typeof a === 'string' ? a.length : 0), 0);
    if (chars > LIMITS.textChars) refuse(name, `make a text of ${fmt(chars)} characters`, LIMITS.textChars);
    return;
  }
  capElements(name, args.reduce<number>((s, a) => s + elementsOf(a), 0));
};

const powerset: Guard = (args, name) => {
  const n = elementsOf(args[0]);
  capElements(name, n * 2 ** Math.max(0, n - 1));
};

const cartesian: Guard = (args, name) => capElements(name, 2 * elementsOf(args[0]) * elementsOf(args[1]));

/** `subset(x, index, replacement)` grows x to reach the index. */
const subset: Guard = (args, name) => {
  if (args.length < 3) return;
  const index = args[1] as { max?: () => unknown } | undefined;
  if (!index || typeof index.max !== 'function') return;
  const max = index.max();
  const dims = (Array.isArray(max) ? max : [max]).map((m) => numberOf(m) + 1);
  capElements(name, productOf(dims));
};

function digitsOf(option: unknown): number[] {
  if (typeof option === 'number') return [option];
  if (option !== null && typeof option === 'object' && !isCollection(option)) {
    const o = option as Record<string, unknown>;
    return ['precision', 'wordSize'].filter((k) => k in o).map((k) => Math.abs(numberOf(o[k])));
  }
  return [];
}

/** `format(x, 1e9)` or `format(x, {precision: 1e9})` would write a billion digits. */
const digits = (at: number): Guard => (args, name) => {
  for (const d of digitsOf(args[at])) {
    if (!(d <= LIMITS.digits)) refuse(name, `write ${fmt(d)} digits`, LIMITS.digits);
  }
};

const counts: Guard = (args, name) => {
  for (const a of args) {
    const n = Math.abs(numberOf(isCollection(a) ? elementsOf(a) : a));
    if (n > LIMITS.count) refuse(name, `loop ${fmt(n)} times`, LIMITS.count);
  }
};

const combinations: Guard = (args, name) => {
  const n = numberOf(args[0]), k = numberOf(args[1]);
  const loops = Math.min(Math.abs(k), Math.abs(n - k));
  if (loops > LIMITS.count) refuse(name, `loop ${fmt(loops)} times`, LIMITS.count);
};

/** Only plain numbers: big numbers, fractions and bigints have no bound on their digits. */
const plainNumbersOnly: Guard = (args, name) => {
  if (args.length > 1 && args[1] !== 'number') {
    throw new LimitError(`${name}(…, ${JSON.stringify(args[1])}): a calc document computes with plain numbers only`);
  }
};

/** The guarded functions, by the name a document calls them. */
export const GUARDS: Readonly<Record<string, Guard>> = {
  range,
  zeros: bySize, ones: bySize, random: (a, n) => { if (isCollection(a[0])) bySize([a[0]], n); },
  randomInt: (a, n) => { if (isCollection(a[0])) bySize([a[0]], n); },
  pickRandom: (a, n) => { if (typeof a[1] === 'number') capElements(n, a[1]); },
  matrixFromFunction: (a, n) => bySize([a[0]], n),
  resize: bySecondSize, reshape: bySecondSize, identity, diag, kron, concat, subset,
  setPowerset: powerset, setCartesian: cartesian,
  setDifference: pairwise, setIntersect: pairwise, setSymDifference: pairwise, setUnion: pairwise,
  setIsSubset: pairwise, setMultiplicity: pairwise, setDistinct: pairwise,
  multiply: product,
  add: elementwise, subtract: elementwise, dotMultiply: elementwise, dotDivide: elementwise, dotPow: elementwise,
  mod: elementwise, equal: elementwise, unequal: elementwise, smaller: elementwise, smallerEq: elementwise,
  larger: elementwise, largerEq: elementwise, compare: elementwise, compareNatural: elementwise,
  and: elementwise, or: elementwise, xor: elementwise, bitAnd: elementwise, bitOr: elementwise, bitXor: elementwise,
  leftShift: elementwise, rightArithShift: elementwise, rightLogShift: elementwise, atan2: elementwise,
  gcd: elementwise, lcm: elementwise, nthRoot: elementwise, log: elementwise, round: elementwise, fix: elementwise,
  ceil: elementwise, floor: elementwise, hypot: elementwise, nullish: elementwise, map: elementwise,
  det: cubic, inv: cubic, lup: cubic, lusolve: cubic, lsolve: cubic, usolve: cubic, lsolveAll: cubic,
  usolveAll: cubic, qr: cubic, slu: cubic, eigs: cubic, schur: cubic, sylvester: cubic, lyap: cubic,
  pinv: cubic, expm: cubic, sqrtm: cubic, divide: cubic, pow: cubic,
  format: digits(1), print: digits(2), bin: digits(1), oct: digits(1), hex: digits(1),
  combinations, combinationsWithRep: counts, permutations: counts, stirlingS2: counts, bellNumbers: counts,
  catalan: counts, composition: counts, multinomial: counts,
  freqz: (a, n) => { if (typeof a[2] === 'number') capElements(n, a[2]); },
  numeric: plainNumbersOnly,
};

/** Throws a LimitError when a value is bigger than a document may hold. */
export function checkValueSize(value: unknown, what: string): void {
  if (typeof value === 'string') {
    if (value.length > LIMITS.textChars) refuse(what, `give a text of ${fmt(value.length)} characters`, LIMITS.textChars);
    return;
  }
  if (isCollection(value)) capElements(what, elementsOf(value));
}
