/**
 * Turns what mathjs and the kernel throw into a plain-words diagnostic.
 */
import type { MathNode, Unit } from 'mathjs';
import { math, SandboxError } from '../../cells/math.js';
import { UnitMismatchError, describeDimension, massForceHint, ownUnits } from '../../cells/units.js';
import { CellArgumentError, KernelDomainError } from '../../cells/define.js';
import { displayUnitOf } from '../values/format.js';
import { suggestName } from '../graph/suggest.js';
import { quoteInUserUnits } from './quote.js';
import { plainWords } from './plain-words.js';
import { evaluateNode, LimitError } from '../sandbox/index.js';
import type { Cell } from '../types.js';
import type { Diagnostic, RuleId, StageContext } from '../diagnostic.js';

type AnyNode = MathNode & { fn?: string | MathNode; args?: MathNode[]; op?: string };

const VERBS: Record<string, (a: string, b: string) => string> = {
  add: (a, b) => `cannot add ${a} to ${b}`,
  subtract: (a, b) => `cannot subtract ${b} from ${a}`,
  smaller: (a, b) => `cannot compare ${a} with ${b}`,
  smallerEq: (a, b) => `cannot compare ${a} with ${b}`,
  larger: (a, b) => `cannot compare ${a} with ${b}`,
  largerEq: (a, b) => `cannot compare ${a} with ${b}`,
  equal: (a, b) => `cannot compare ${a} with ${b}`,
  unequal: (a, b) => `cannot compare ${a} with ${b}`,
  to: (a, b) => `cannot convert ${a} to ${b}`,
};

/** A value's dimension with the units the document wrote, or the display unit where mathjs combined them. */
function unitLabel(v: unknown): string {
  if (math.isUnit(v)) {
    const u = v as Unit;
    return describeDimension(u).replace(/\(([^)]*)\)$/, `(${ownUnits(u) ?? displayUnitOf(u)})`);
  }
  return describeDimension(v);
}

/** Finds the innermost operator whose operands evaluate but whose own evaluation fails on units. */
function findUnitClash(node: AnyNode, scope: Map<string, unknown>): string | null {
  const kids: AnyNode[] = [];
  node.forEach((c) => kids.push(c as AnyNode));
  for (const k of kids) {
    try {
      evaluateNode(k, scope);
    } catch {
      return findUnitClash(k, scope);
    }
  }
  if (node.type === 'FunctionNode' && node.args?.length) {
    // A function comparing its arguments (interp, clamp, min, max): name the first two kinds that differ.
    const first = (v: unknown): unknown => (Array.isArray(v) ? first(v[0]) : math.isMatrix(v) ? first((v as { toArray(): unknown[] }).toArray()) : v);
    const labels = [...new Set(node.args.map((a) => unitLabel(first(evaluateNode(a, scope)))))];
    if (labels.length >= 2) return `cannot compare ${labels[0]} with ${labels[1]} in "${node.toString()}"`;
  }
  if (node.type === 'OperatorNode' && typeof node.fn === 'string' && VERBS[node.fn] && node.args?.length === 2) {
    const a = evaluateNode(node.args[0]!, scope);
    const b = node.fn === 'to' ? math.unit(node.args[1]!.toString()) : evaluateNode(node.args[1]!, scope);
    const hint = math.isUnit(a) && math.isUnit(b) ? massForceHint(a, b as Unit) || massForceHint(b, a as Unit) : '';
    return `${VERBS[node.fn](unitLabel(a), unitLabel(b))} in "${node.toString()}"${hint}`;
  }
  return null;
}

/** The calls named fn in a line, with their arguments evaluated where they can be. */
function callsOf(cell: Cell, fn: string, scope: Map<string, unknown>): unknown[][] {
  const out: unknown[][] = [];
  (cell.node as MathNode).traverse((n) => {
    const any = n as AnyNode & { fn?: { name?: string } };
    if (n.type !== 'FunctionNode' || (any.fn as { name?: string } | undefined)?.name !== fn) return;
    try {
      out.push((any.args ?? []).map((a) => evaluateNode(a, scope)));
    } catch {
      // An argument that fails on its own is explained by its own error.
    }
  });
  return out;
}

/**
 * mathjs's messages that name no argument or the wrong cause, said from the line itself: max() has no
 * argument, log(L) has a length where a plain number goes, L^L has a unit in the exponent, L[1] indexes a
 * single quantity, a comparison meets a complex number.
 */
function callWords(err: unknown, cell: Cell, scope: Map<string, unknown>): string | null {
  const message = err instanceof Error ? err.message : String(err);
  if (/No ordering relation is defined for complex numbers/.test(message)) {
    return 'cannot compare a complex number: a square root, power or logarithm of a negative value in this line';
  }
  if (/Cannot apply a numeric index as object property|Cannot apply index/.test(message)) {
    return 'cannot take an item [n] of this value: it is a single value or a record, not a list';
  }
  let m = /Too few arguments in function (\w+)/.exec(message);
  if (m) {
    const calls = callsOf(cell, m[1]!, scope);
    if (calls.some((args) => args.length === 0)) return `${m[1]}(…) needs at least one argument`;
    const withUnit = calls.flat().find((a) => math.isUnit(a));
    if (withUnit) return `${m[1]}(…) takes a plain number, not ${unitLabel(withUnit)}; divide by a unit first (e.g. L / (1 m))`;
    return null;
  }
  m = /Unexpected type of argument in function pow \(.*actual: Unit, index: 1\)/.exec(message);
  if (m) {
    const node = cell.node as MathNode;
    const pow = node.filter((n) => (n as AnyNode).type === 'OperatorNode' && (n as AnyNode).fn === 'pow');
    for (const p of pow) {
      try {
        const e = evaluateNode((p as AnyNode).args![1]!, scope);
        if (math.isUnit(e)) return `a power takes a plain number as exponent, not ${unitLabel(e)}, in "${p.toString()}"`;
      } catch {
        // Explained by its own error.
      }
    }
  }
  return null;
}

/** "did you mean" for an unknown option, from the list the message gives. */
function withOptionGuess(message: string): string {
  const m = /unknown option "([^"]+)"; known options: (.*)$/.exec(message);
  const guess = m ? suggestName(m[1]!, m[2]!.split(', ')) : null;
  return guess ? message.replace(/; known options:/, `; did you mean "${guess}"? Known options:`) : message;
}

function classify(err: unknown, sigfigs?: number, units?: 'si' | 'us'): { ruleId: RuleId; message: string; actual?: string; expected?: string } {
  const message = err instanceof Error ? err.message : String(err);
  if (err instanceof LimitError) return { ruleId: 'sandbox/limit', message };
  if (err instanceof UnitMismatchError) return { ruleId: 'units/mismatch', message, actual: err.actual, expected: err.expected };
  if (err instanceof CellArgumentError) return { ruleId: 'kernel/argument', message: withOptionGuess(message) };
  if (err instanceof KernelDomainError) return { ruleId: 'kernel/domain', message: quoteInUserUnits(message, err.given, sigfigs, units) };
  if (err instanceof SandboxError || /No access to (property|method)/.test(message)) {
    return { ruleId: 'sandbox/refused', message: message.replace(/^No access to/, 'a calc document has no access to') };
  }
  if (err instanceof RangeError && !/Dimension mismatch|Index out of range/.test(message)) return { ruleId: 'kernel/domain', message };
  if (/Units do not match|Cannot compare units|base units/i.test(message)) return { ruleId: 'units/mismatch', message };
  if (/Unexpected type of argument/.test(message)) return { ruleId: 'units/mismatch', message: plainWords(message) };
  return { ruleId: 'eval/error', message: plainWords(message) };
}

/**
 * A diagnostic for an error thrown while evaluating a cell.
 * @param scope the cell's inputs, used to name the two sides of a unit clash
 */
export function explainError(err: unknown, cell: Cell, scope: Map<string, unknown>, ctx: StageContext): Diagnostic {
  const c = classify(err, ctx.sigfigs, ctx.units);
  let message = c.message;
  if (c.ruleId === 'units/mismatch' && !(err instanceof UnitMismatchError)) {
    try {
      message = findUnitClash(cell.node as AnyNode, scope) ?? message;
    } catch {
      // Keep the plain-words version of mathjs's message when the clash cannot be isolated.
    }
  }
  if (c.ruleId === 'eval/error' || c.ruleId === 'units/mismatch') message = callWords(err, cell, scope) ?? message;
  message = plainWords(message);
  // mathjs names the wrong trigonometric function in its message (cot for cos): name the one written.
  const trig = /^(\w+)\(…\) needs an angle/.exec(message);
  if (trig) {
    const written = (cell.node as MathNode).filter((n) => n.type === 'FunctionNode' && /^(a?(sin|cos|tan|sec|csc|cot)h?)$/.test(String((n as AnyNode & { name?: string }).name)));
    if (written.length === 1) message = message.replace(trig[1]!, String((written[0] as AnyNode & { name?: string }).name));
  }
  return {
    message, file: ctx.file, line: cell.span.start.line, column: cell.span.start.column,
    endLine: cell.span.end.line, endColumn: cell.span.end.column, cellId: cell.id, ruleId: c.ruleId, severity: 'error',
    ...(c.actual ? { actual: c.actual } : {}), ...(c.expected ? { expected: c.expected } : {}),
  };
}
