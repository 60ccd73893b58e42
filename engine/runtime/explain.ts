/**
 * Turns what mathjs and the kernel throw into a plain-words diagnostic.
 */
import type { MathNode, Unit } from 'mathjs';
import { math, SandboxError } from '../../cells/math.js';
import { evaluateNode, LimitError } from '../sandbox/index.js';
import { UnitMismatchError, describeDimension } from '../../cells/units.js';
import { CellArgumentError } from '../../cells/define.js';
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

function unitLabel(v: unknown): string {
  if (math.isUnit(v)) {
    const u = v as Unit;
    const d = describeDimension(u);
    const own = u.formatUnits().replace(/\s*\/\s*/g, '/');
    return d.replace(/\(([^)]*)\)$/, `(${own || '$1'})`);
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
  if (node.type === 'OperatorNode' && typeof node.fn === 'string' && VERBS[node.fn] && node.args?.length === 2) {
    const a = evaluateNode(node.args[0]!, scope);
    const b = node.fn === 'to' ? math.unit(node.args[1]!.toString()) : evaluateNode(node.args[1]!, scope);
    return `${VERBS[node.fn](unitLabel(a), unitLabel(b))} in "${node.toString()}"`;
  }
  return null;
}

function classify(err: unknown): { ruleId: RuleId; message: string; actual?: string; expected?: string } {
  const message = err instanceof Error ? err.message : String(err);
  if (err instanceof LimitError) return { ruleId: 'sandbox/limit', message };
  if (err instanceof UnitMismatchError) return { ruleId: 'units/mismatch', message, actual: err.actual, expected: err.expected };
  if (err instanceof CellArgumentError) return { ruleId: 'kernel/argument', message };
  if (err instanceof SandboxError || /No access to (property|method)/.test(message)) {
    return { ruleId: 'sandbox/refused', message: message.replace(/^No access to/, 'a calc document has no access to') };
  }
  if (err instanceof RangeError && !/Dimension mismatch|Index out of range/.test(message)) return { ruleId: 'kernel/domain', message };
  if (/Units do not match|Cannot compare units|base units/i.test(message)) return { ruleId: 'units/mismatch', message };
  if (/Unexpected type of argument/.test(message)) {
    return { ruleId: 'units/mismatch', message: message.replace(/\s*\(index: \d+\)/, '').replace(/Unexpected type of argument in function (\w+)/, 'cannot use these values in $1') };
  }
  return { ruleId: 'eval/error', message };
}

/**
 * A diagnostic for an error thrown while evaluating a cell.
 * @param scope the cell's inputs, used to name the two sides of a unit clash
 */
export function explainError(err: unknown, cell: Cell, scope: Map<string, unknown>, ctx: StageContext): Diagnostic {
  const c = classify(err);
  let message = c.message;
  if (c.ruleId === 'units/mismatch' && !(err instanceof UnitMismatchError)) {
    try {
      message = findUnitClash(cell.node as AnyNode, scope) ?? message;
    } catch {
      // Keep mathjs's own words when the clash cannot be isolated.
    }
  }
  return {
    message, file: ctx.file, line: cell.span.start.line, column: cell.span.start.column,
    endLine: cell.span.end.line, endColumn: cell.span.end.column, cellId: cell.id, ruleId: c.ruleId, severity: 'error',
    ...(c.actual ? { actual: c.actual } : {}), ...(c.expected ? { expected: c.expected } : {}),
  };
}
