/**
 * evaluateCell: one cell's expression, with its inputs, to a value.
 */
import type { MathNode, Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import { evaluateNode, chargeDocument, ComplexValueError } from '../sandbox/index.js';
import type { Cell, CheckResult } from '../types.js';
import type { Diagnostic, StageContext } from '../diagnostic.js';
import { CellFailure, NotComputed } from './failure.js';
import { explainError } from './explain.js';
import { checkReads, checkCalledReads } from './reads.js';
import { isNotAvailable } from '../../cells/not-available.js';
import { formatValue } from '../values/format.js';

type AnyNode = MathNode & { fn?: string; args?: MathNode[] };

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
        found = isNonFinite(evaluateNode(n, scope));
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

/**
 * The utilization of a check `lhs op rhs`: demand over capacity, lhs/rhs for ≤ and rhs/lhs for ≥,
 * only when the demand is ≥ 0 and the capacity > 0; then it is ≤ 1 exactly when the check holds.
 * Otherwise (a negative demand or capacity, a zero capacity, <, >, values that do not divide) null:
 * never a number that contradicts the verdict.
 * @example utilizationOf('<=', unit(-2, 'kN'), unit(-1, 'kN')) // null (the check holds; 2.00 would say it is near its limit)
 */
function utilizationOf(op: string, lhs: unknown, rhs: unknown): number | null {
  if (op !== '<=' && op !== '>=') return null;
  const [demand, capacity] = op === '<=' ? [lhs, rhs] : [rhs, lhs];
  try {
    if (math.isNegative(demand as never) || !math.isPositive(capacity as never)) return null;
  } catch {
    return null;
  }
  const u = ratio(demand, capacity);
  return u !== null && u >= 0 ? u : null;
}

function evaluateCheck(cell: Cell, scope: Map<string, unknown>): CheckResult {
  const node = cell.node as AnyNode;
  const op = node.type === 'OperatorNode' && node.fn ? OPS[node.fn] : undefined;
  if (op && node.args?.length === 2) {
    const demand = evaluateNode(node.args[0]!, scope);
    const capacity = evaluateNode(node.args[1]!, scope);
    // The same mathjs function the operator calls, on the sides already evaluated.
    const compare = math[node.fn as 'smallerEq'] as (a: unknown, b: unknown) => boolean;
    const pass = compare(demand, capacity);
    const utilization = utilizationOf(op, demand, capacity);
    return { isCheck: true, source: cell.source, op, demand, capacity, utilization, pass };
  }
  const value = evaluateNode(node, scope);
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
    checkReads(cell, (node) => evaluateNode(node, scope), ctx.file);
    // Through the sandbox (engine/sandbox), charged to this document's evaluation round.
    value = chargeDocument(ctx, () => (cell.kind === 'check' ? evaluateCheck(cell, scope) : evaluateNode(cell.node, scope)));
  } catch (err) {
    if (err instanceof CellFailure || err instanceof NotComputed) throw err;
    if (err instanceof ComplexValueError) {
      // The sandbox refuses a complex value wherever it appears; the line says what made it.
      const message = cell.kind === 'check'
        ? 'cannot compare a complex number: a square root, power or logarithm of a negative value in this line'
        : `the result is a complex number: ${complexCause(cell.node)}`;
      throw new CellFailure(cell.id, {
        message, file: ctx.file, line: cell.span.start.line, column: cell.span.start.column,
        endLine: cell.span.end.line, endColumn: cell.span.end.column, cellId: cell.id, ruleId: 'value/non-finite', severity: 'error',
      });
    }
    checkCalledReads(cell, (node) => evaluateNode(node, scope));
    throw new CellFailure(cell.id, explainError(err, cell, scope, ctx));
  }
  if (isNotAvailable(value)) {
    checkCalledReads(cell, (node) => evaluateNode(node, scope));
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
    lo = evaluateNode(cell.range.loNode);
    hi = evaluateNode(cell.range.hiNode);
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
