/**
 * What a cell reads from records, checked on the values themselves before the expression runs:
 * a field the record does not have is an error at the field's column (for records whose shape
 * compile could not know), and a field that is "not available" stops the cell with its reason.
 */
import type { MathNode, Unit } from 'mathjs';
import { math } from '../../cells/math.js';
import { KERNEL_SOURCE, isKernelResult } from '../../cells/define.js';
import { isNotAvailable } from '../../cells/not-available.js';
import { describeDimension } from '../../cells/units.js';
import type { Cell } from '../types.js';
import { accessorsOf, fieldDiagnostic, fieldOf, isNameChain, missingFieldMessage } from '../graph/fields.js';
import { CellFailure, NotComputed } from './failure.js';

type AnyNode = MathNode & { object?: MathNode; name?: string };

const accessors = new WeakMap<MathNode, MathNode[]>();

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v) && !math.isUnit(v) && !math.isMatrix(v) && !isNotAvailable(v);
}

/** What a value is, in words, for "… is X, not a record". */
function kindOf(v: unknown): string {
  if (math.isUnit(v)) return `a quantity, ${describeDimension(v as Unit)}`;
  if (typeof v === 'number') return 'a plain number';
  if (typeof v === 'boolean') return 'true/false';
  if (typeof v === 'string') return 'text';
  if (Array.isArray(v) || math.isMatrix(v)) return 'a list';
  return 'a value';
}

/** The cell a record came from, for "not computed" notes: the name at the root of `a.hinges[1].angle`. */
function rootName(node: AnyNode): string | null {
  let n: AnyNode = node;
  while (n.type === 'AccessorNode') n = n.object as AnyNode;
  return n.type === 'SymbolNode' ? n.name! : null;
}

/**
 * Throws when a field the cell reads is missing (CellFailure) or not available (NotComputed).
 * @param evaluate evaluates a sub-expression in the cell's scope
 */
export function checkReads(cell: Cell, evaluate: (node: MathNode) => unknown, file: string): void {
  let list = accessors.get(cell.node);
  if (!list) {
    list = accessorsOf(cell.node).filter((n) => fieldOf(n) !== null && isNameChain(n));
    accessors.set(cell.node, list);
  }
  for (const node of list) {
    const field = fieldOf(node)!;
    const object = evaluate((node as AnyNode).object!);
    // Written out only for a message: this runs on every evaluation of the cell.
    const written = () => (node as AnyNode).object!.toString();
    if (isNotAvailable(object)) {
      throw new NotComputed(cell.id, rootName(node as AnyNode) ?? cell.id, `not computed: ${written()} is not available — ${object.reason}`);
    }
    if (!isRecord(object)) {
      throw new CellFailure(cell.id, fieldDiagnostic(cell, node, `"${written()}" is ${kindOf(object)}, not a record: it has no field "${field}"`, file));
    }
    if (!Object.prototype.hasOwnProperty.call(object, field)) {
      const label = isKernelResult(object) ? `${String(object[KERNEL_SOURCE])} result` : `record "${written()}"`;
      const fields = Object.keys(object).filter((k) => typeof object[k] !== 'function');
      throw new CellFailure(cell.id, fieldDiagnostic(cell, node, missingFieldMessage(label, field, fields), file));
    }
    const value = object[field];
    if (isNotAvailable(value)) {
      throw new NotComputed(cell.id, rootName(node as AnyNode) ?? cell.id, `not computed: ${node.toString()} is not available — ${value.reason}`);
    }
  }
}

/**
 * After a failure (or a value that is not available), the field read through a call that was not
 * looked into beforehand (`arch_limit(r).H_min`): throws NotComputed with its reason when it is
 * not available. Runs only on that path, so a kernel is never called twice on a good line.
 */
export function checkCalledReads(cell: Cell, evaluate: (node: MathNode) => unknown): void {
  for (const node of accessorsOf(cell.node)) {
    if (fieldOf(node) === null || isNameChain(node)) continue;
    let value: unknown;
    try {
      value = evaluate(node);
    } catch {
      continue;
    }
    if (isNotAvailable(value)) {
      throw new NotComputed(cell.id, cell.uses[0] ?? cell.id, `not computed: ${node.toString()} is not available — ${value.reason}`);
    }
  }
}
