/**
 * evaluateCell: one cell's expression, with its inputs, to a value.
 */
import type { EvalFunction, MathNode, Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import type { Cell, CheckResult } from '../types.js';
import type { Diagnostic, StageContext } from '../diagnostic.js';
import { CellFailure, NotComputed } from './failure.js';
import { explainError } from './explain.js';
import { checkReads, checkCalledReads } from './reads.js';
import { isNotAvailable } from '../../cells/not-available.js';
import { formatValue } from '../values/format.js';

type AnyNode = MathNode & { fn?: string; args?: MathNode[] };

/**
 * Compiled expressions, kept per parse node: a live edit re-evaluates every dependent, and
 * compiling is the larger part of evaluating a short expression. An edited input gets a new
 * node, so nothing stale is ever reused.
 */
const compiled = new WeakMap<MathNode, EvalFunction>();
function compiledOf(node: MathNode): EvalFunction {
  let c = compiled.get(node);
  if (!c) {
    c = node.compile();
    compiled.set(node, c);
  }
  return c;
}

const OPS: Record<string, CheckResult['op']> = { smallerEq: '<=', largerEq: '>=', smaller: '<', larger: '>' };

/** Does the expression read an infinite value (an input, a field such as a.H_max, or Infinity itself)? */
function readsInfinity(node: MathNode, scope: Map<string, unknown>): boolean {
  let found = false;
  node.traverse((n) => {
    if (found) return;
    const any = n as AnyNode & { name?: string };
    if (any.type === 'SymbolNode' && (any.name === 'Infinity' || (scope.has(any.name!) && isNonFinite(scope.get(any.name!))))) found = true;
    else if (any.type === 'AccessorNode') {
      try {
        found = isNonFinite(compiledOf(n).evaluate(scope));
      } catch {
        // An accessor that cannot be evaluated on its own reads nothing infinite.
      }
    }
  });
  return found;
}

function isNonFinite(v: unknown): boolean {
  if (typeof v === 'number') return !Number.isFinite(v);
  if (math.isUnit(v)) {
    const x = (v as Unit).value;
    return typeof x === 'number' && !Number.isFinite(x);
  }
  return false;
}

function isInfinite(v: unknown): boolean {
  const x = math.isUnit(v) ? (v as Unit).value : v;
  return x === Infinity || x === -Infinity;
}

/** A quantity with a complex value (sqrt(x - 5 m^2) for x = 4 m^2), or a list or record holding one: mathjs makes it, nothing can show it. */
function holdsComplex(v: unknown, depth = 0): boolean {
  if (depth > 4) return false;
  if (math.isComplex(v)) return true;
  if (math.isUnit(v)) return math.isComplex((v as Unit).value);
  if (Array.isArray(v)) return v.some((x) => holdsComplex(x, depth + 1));
  if (math.isMatrix(v)) return holdsComplex((v as { toArray(): unknown[] }).toArray(), depth + 1);
  // A record written in the line ({a: sqrt(-4 m^2)}); kernel results are plain records too.
  if (typeof v === 'object' && v !== null && Object.getPrototypeOf(v) === Object.prototype) return Object.values(v).some((x) => holdsComplex(x, depth + 1));
  return false;
}

/** What made a complex number, from the functions the line calls. */
function complexCause(node: MathNode): string {
  const names = new Set<string>();
  node.traverse((n) => {
    const any = n as AnyNode & { name?: string };
    if (any.type === 'FunctionNode' && typeof any.fn === 'object') names.add(String((any.fn as { name?: string }).name));
    // A whole-number power (m^2) cannot make one; a fractional one can.
    const exponent = any.type === 'OperatorNode' && any.fn === 'pow' ? (any.args?.[1] as { value?: unknown } | undefined) : undefined;
    if (exponent && !Number.isInteger(Number(exponent.value))) names.add('pow');
  });
  if (names.has('sqrt') && names.size === 1) return 'the square root of a negative value (check the sign of what is under sqrt)';
  return 'a square root, power or logarithm of a negative value';
}

/** A figure is SVG text from a figure function (or an object carrying it). */
function isFigureValue(v: unknown): boolean {
  if (typeof v === 'string') return v.trimStart().startsWith('<svg');
  return typeof v === 'object' && v !== null && typeof (v as { svg?: unknown }).svg === 'string';
}

/** Ratio of two same-dimension values as a plain number, or null. */
function ratio(a: unknown, b: unknown): number | null {
  try {
    const r = math.divide(a as never, b as never) as unknown;
    const n = math.isUnit(r) ? (r as Unit).toNumber() : r;
    return typeof n === 'number' && Number.isFinite(n) ? n : null;
  } catch {
    return null;
  }
}

function evaluateCheck(cell: Cell, scope: Map<string, unknown>): CheckResult {
  const node = cell.node as AnyNode;
  const op = node.type === 'OperatorNode' && node.fn ? OPS[node.fn] : undefined;
  if (op && node.args?.length === 2) {
    const demand = compiledOf(node.args[0]!).evaluate(scope);
    const capacity = compiledOf(node.args[1]!).evaluate(scope);
    // The same mathjs function the operator calls, on the sides already evaluated.
    const compare = math[node.fn as 'smallerEq'] as (a: unknown, b: unknown) => boolean;
    const pass = compare(demand, capacity);
    // Utilization is demand over capacity for ≤ and capacity over demand for ≥, so ≤ 1 passes.
    let utilization: number | null = null;
    if (op === '<=') utilization = ratio(demand, capacity);
    if (op === '>=') utilization = ratio(capacity, demand);
    if (utilization !== null && utilization < 0) utilization = null;
    return { isCheck: true, source: cell.source, op, demand, capacity, utilization, pass };
  }
  const value = compiledOf(node).evaluate(scope);
  if (typeof value !== 'boolean') {
    throw new TypeError(`a check must be a comparison or true/false, but this line gives ${formatValue(value)}`);
  }
  return { isCheck: true, source: cell.source, op: null, demand: null, capacity: null, utilization: null, pass: value };
}

/** What is wrong with a value a line gives, when something is: never a silent NaN, "—" or complex number. */
function valueProblem(cell: Cell, value: unknown, scope: Map<string, unknown>): { message: string; ruleId: Diagnostic['ruleId'] } | null {
  // ∞ read from an input (a ring that never collapses) is a value; ∞ or NaN made here is an error.
  if (isNonFinite(value) && !(isInfinite(value) && readsInfinity(cell.node, scope))) {
    return { message: `the result is ${formatValue(value)}: a division by zero or a value out of range`, ruleId: 'value/non-finite' };
  }
  if (math.isComplex(value)) {
    return { message: `the result is the complex number ${String(value)}: ${complexCause(cell.node)}`, ruleId: 'value/non-finite' };
  }
  if (holdsComplex(value)) {
    return { message: `the result is a complex number: ${complexCause(cell.node)}`, ruleId: 'value/non-finite' };
  }
  if (value === undefined) {
    // An index by a name (a[k]) can reach a field that is not there.
    return { message: 'this line gives no value: it reads something that does not exist (a field or an item that is not there)', ruleId: 'value/type' };
  }
  if (cell.kind === 'figure' && !isFigureValue(value)) {
    return { message: `a figure line must give a figure (e.g. section(r, a)); this gives ${formatValue(value)}`, ruleId: 'value/type' };
  }
  return null;
}

/**
 * Evaluates a cell. Throws CellFailure (with a located diagnostic) when it fails.
 * @param inputs values of cell.uses, in the same order
 */
export function evaluateCell(cell: Cell, inputs: unknown[], ctx: StageContext): unknown {
  const scope = new Map<string, unknown>();
  cell.uses.forEach((name, i) => scope.set(name, inputs[i]));
  let value: unknown;
  try {
    checkReads(cell, (node) => compiledOf(node).evaluate(scope), ctx.file);
    value = cell.kind === 'check' ? evaluateCheck(cell, scope) : compiledOf(cell.node).evaluate(scope);
  } catch (err) {
    if (err instanceof CellFailure || err instanceof NotComputed) throw err;
    checkCalledReads(cell, (node) => compiledOf(node).evaluate(scope));
    throw new CellFailure(cell.id, explainError(err, cell, scope, ctx));
  }
  if (isNotAvailable(value)) {
    checkCalledReads(cell, (node) => compiledOf(node).evaluate(scope));
    throw new NotComputed(cell.id, cell.uses[0] ?? cell.id, `not computed: ${value.toString().replace(/^not available/, 'a value it reads is not available')}`);
  }
  const problem = valueProblem(cell, value, scope);
  if (problem) {
    throw new CellFailure(cell.id, {
      message: problem.message, file: ctx.file, line: cell.span.start.line, column: cell.span.start.column,
      endLine: cell.span.end.line, endColumn: cell.span.end.column, cellId: cell.id, ruleId: problem.ruleId, severity: 'error',
    });
  }
  return value;
}

/** Warnings for a given value outside its documented range. */
export function checkRange(cell: Cell, value: unknown, ctx: StageContext): Diagnostic | null {
  if (!cell.range) return null;
  let lo: unknown, hi: unknown;
  try {
    lo = compiledOf(cell.range.loNode).evaluate(new Map());
    hi = compiledOf(cell.range.hiNode).evaluate(new Map());
  } catch (e) {
    return rangeDiag(cell, ctx, `the allowed range [${cell.range.lo}, ${cell.range.hi}] cannot be evaluated: ${(e as Error).message}`);
  }
  try {
    if (math.smaller(value as never, lo as never) || math.larger(value as never, hi as never)) {
      return rangeDiag(cell, ctx, `${cell.name} = ${formatValue(value)} is outside the allowed range [${cell.range.lo}, ${cell.range.hi}]`);
    }
  } catch {
    return rangeDiag(cell, ctx, `the allowed range [${cell.range.lo}, ${cell.range.hi}] does not have the units of ${cell.name} = ${formatValue(value)}`);
  }
  return null;
}

function rangeDiag(cell: Cell, ctx: StageContext, message: string): Diagnostic {
  return {
    message, file: ctx.file, line: cell.span.start.line, column: cell.span.start.column, endLine: cell.span.end.line,
    endColumn: cell.span.end.column, cellId: cell.id, ruleId: 'value/range', severity: 'warning',
  };
}
