/**
 * Fields read from records: `a.load_factor` of a kernel result, `loads.fill_level` of a record the
 * document writes. A misspelled field is found here, before evaluation, from the registrations'
 * declared result fields and from record literals, and reported at the column of the field.
 * Where the shape of a record is only known once it is computed, the runtime checks the same
 * thing (`fieldProblem`), with the same words and the same column.
 */
import type { MathNode } from 'mathjs';
import type { FieldType } from '../../cells/define.js';
import { cellFunctions } from '../library.js';
import type { Cell, CellGraph } from '../types.js';
import type { Diagnostic, StageContext } from '../diagnostic.js';
import { commentStart } from '../parse/statements.js';
import { suggestName } from './suggest.js';

type AnyNode = MathNode & {
  object?: AnyNode; index?: { dimensions: AnyNode[] }; name?: string; value?: unknown;
  fn?: AnyNode; properties?: Record<string, AnyNode>; args?: AnyNode[];
};

/** Where a field name stands in the document: 1-based line and columns. */
export interface FieldSpot {
  line: number;
  column: number;
  endColumn: number;
}

/** The field an accessor reads, when it is a name (`a.H_min`, `a["H_min"]`), else null. */
export function fieldOf(node: MathNode): string | null {
  const n = node as AnyNode;
  if (n.type !== 'AccessorNode' || n.index?.dimensions.length !== 1) return null;
  const d = n.index.dimensions[0]!;
  return d.type === 'ConstantNode' && typeof d.value === 'string' ? d.value : null;
}

/** Accessors of an expression in the order they are written (the object before its field). */
export function accessorsOf(root: MathNode): MathNode[] {
  const out: MathNode[] = [];
  const visit = (node: AnyNode): void => {
    if (node.type === 'AccessorNode') {
      visit(node.object!);
      for (const d of node.index?.dimensions ?? []) visit(d);
      out.push(node);
      return;
    }
    node.forEach((child) => visit(child as AnyNode));
  };
  visit(root as AnyNode);
  return out;
}

const spots = new WeakMap<MathNode, FieldSpot>();

/** Where the field of this accessor is written, when compile located it. */
export function fieldSpotOf(node: MathNode): FieldSpot | undefined {
  return spots.get(node);
}

/** Finds each `.field` of a cell in its source lines, in the order written, outside comments. */
function locateFields(cell: Cell, lines: string[]): void {
  const found: Array<{ field: string; spot: FieldSpot }> = [];
  for (let line = cell.span.start.line; line <= cell.span.end.line; line++) {
    const text = lines[line - 1] ?? '';
    const end = commentStart(text).at;
    const code = end < 0 ? text : text.slice(0, end);
    for (const m of code.matchAll(/\.\s*([\p{L}_$][\p{L}\p{N}_$]*)|\[\s*"([^"]+)"\s*\]/gu)) {
      const field = m[1] ?? m[2]!;
      const column = m.index! + m[0].indexOf(field) + 1;
      found.push({ field, spot: { line, column, endColumn: column + field.length } });
    }
  }
  for (const node of accessorsOf(cell.node)) {
    const field = fieldOf(node);
    const at = field === null ? -1 : found.findIndex((f) => f.field === field);
    if (at >= 0) spots.set(node, found.splice(at, 1)[0]!.spot);
  }
}

/** What a record is, for messages: `arch_limit result`, `record "loads"`. */
export interface RecordShape {
  label: string;
  type: FieldType;
}

function literalType(node: AnyNode): FieldType {
  if (node.type === 'ObjectNode') {
    return { object: Object.fromEntries(Object.entries(node.properties ?? {}).map(([k, v]) => [k, literalType(v)])) };
  }
  const fn = node.type === 'FunctionNode' && node.fn?.type === 'SymbolNode' ? cellFunctions.get(node.fn.name!) : undefined;
  return fn ? fn.returns : 'any';
}

/** The shape of a cell's value, when its expression shows it: a kernel call, a record literal, or another such cell. */
function shapeOfCell(cell: Cell | undefined, graph: CellGraph, depth = 0): RecordShape | null {
  if (!cell || depth > 20) return null;
  const node = cell.node as AnyNode;
  if (node.type === 'SymbolNode') return shapeOfCell(graph.byId.get(node.name!), graph, depth + 1);
  if (node.type === 'ObjectNode') return { label: `record "${cell.name}"`, type: literalType(node) };
  const fn = node.type === 'FunctionNode' && node.fn?.type === 'SymbolNode' ? cellFunctions.get(node.fn.name!) : undefined;
  return fn ? { label: `${fn.name} result`, type: fn.returns } : null;
}

/** The field names of a record type, or null when its fields are not declared. */
function fieldsOf(type: FieldType): string[] | null {
  return typeof type === 'object' && 'object' in type && Object.keys(type.object).length > 0 ? Object.keys(type.object) : null;
}

/**
 * The words for a field that a record does not have.
 * @example missingFieldMessage('arch_limit result', 'laod_factor', ['H_min', 'load_factor'])
 * // 'arch_limit result has no field "laod_factor"; did you mean "load_factor"? Its fields: H_min, load_factor'
 */
export function missingFieldMessage(label: string, field: string, fields: string[]): string {
  const guess = suggestName(field, fields);
  return `${label} has no field "${field}"${guess ? `; did you mean "${guess}"?` : '.'} Its fields: ${fields.join(', ')}`;
}

/** The static type reached by an accessor chain, or a message when a field does not exist. */
function resolve(node: AnyNode, graph: CellGraph, scopeNames: ReadonlySet<string>): { shape: RecordShape | null; problem?: { node: MathNode; message: string } } {
  if (node.type === 'SymbolNode') {
    return { shape: scopeNames.has(node.name!) ? shapeOfCell(graph.byId.get(node.name!), graph) : null };
  }
  if (node.type === 'ParenthesisNode') return resolve((node as AnyNode & { content: AnyNode }).content, graph, scopeNames);
  if (node.type === 'ObjectNode' || node.type === 'FunctionNode') {
    const type = literalType(node);
    return { shape: type === 'any' ? null : { label: node.type === 'ObjectNode' ? 'this record' : `${(node.fn as AnyNode).name} result`, type } };
  }
  if (node.type !== 'AccessorNode') return { shape: null };
  const parent = resolve(node.object!, graph, scopeNames);
  if (parent.problem || !parent.shape) return parent;
  const { label, type } = parent.shape;
  const field = fieldOf(node);
  if (field === null) {
    // An index into a list: the element has the list's item type.
    return { shape: typeof type === 'object' && 'list' in type ? { label: `${node.toString()}`, type: type.list } : null };
  }
  const fields = fieldsOf(type);
  if (!fields) return { shape: null };
  if (!fields.includes(field)) return { shape: null, problem: { node, message: missingFieldMessage(label, field, fields) } };
  return { shape: { label: `${node.object!.toString()}.${field}`, type: (type as { object: Record<string, FieldType> }).object[field]! } };
}

/**
 * Is this accessor a plain chain from a name (`a.hinges[1].angle`), cheap to look into before the
 * expression runs? A chain from a call (`arch_limit(r).gsf`) would run the call twice.
 */
export function isNameChain(node: MathNode): boolean {
  let n = node as AnyNode;
  while (n.type === 'AccessorNode' || n.type === 'ParenthesisNode') {
    if (n.type === 'AccessorNode' && !n.index!.dimensions.every((d) => d.type === 'ConstantNode')) return false;
    n = (n.type === 'AccessorNode' ? n.object : (n as AnyNode & { content: AnyNode }).content) as AnyNode;
  }
  return n.type === 'SymbolNode';
}

/**
 * Checks every field a cell reads against what the record it reads from is known to hold, and
 * records where each field is written (for the runtime's messages).
 * @param graph from buildGraph; cells with an unknown field are added to graph.failed
 * @param source the normalised document text
 */
export function checkFields(graph: CellGraph, source: string, ctx: StageContext): void {
  const lines = source.split('\n');
  for (const cell of graph.cells) {
    locateFields(cell, lines);
    if (graph.failed.has(cell.id)) continue;
    const names = new Set(cell.uses);
    for (const node of accessorsOf(cell.node)) {
      const { problem } = resolve(node as AnyNode, graph, names);
      if (!problem) continue;
      const d = fieldDiagnostic(cell, problem.node, problem.message, ctx.file);
      ctx.diagnostics.push(d);
      graph.failed.set(cell.id, d);
      break;
    }
  }
}

/** A diagnostic for an unknown field, at the field when its place is known. */
export function fieldDiagnostic(cell: Cell, node: MathNode, message: string, file: string): Diagnostic {
  const spot = fieldSpotOf(node);
  return {
    message, file, line: spot?.line ?? cell.span.start.line, column: spot?.column ?? cell.span.start.column,
    endLine: spot?.line ?? cell.span.end.line, endColumn: spot?.endColumn ?? cell.span.end.column,
    cellId: cell.id, ruleId: 'graph/unknown-field', severity: 'error',
  };
}
