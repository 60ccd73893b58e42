/**
 * readCaseBook: the ```cases cells of a document → CaseBook, with every problem found before
 * evaluation reported on its line: a line that is not `NAME = {input: value, …}`, a key that is
 * not a given input (with "did you mean"), a name the sandbox refuses, an unknown name in a
 * value, duplicate case names, a case named like a cell, and a check limited to a case that
 * does not exist.
 *
 * A check is limited to some cases or families by a trailing `[in EQU, STR]` in its comment.
 */
import type { MathNode } from 'mathjs';
import { parseExpression } from '../../cells/math.js';
import type { Block, CalcBlock, CaseBook, CaseLine, CellGraph, Span } from '../types.js';
import type { RuleId, StageContext } from '../diagnostic.js';
import { splitStatements, locateInStatement, type RawStatement } from '../parse/statements.js';
import { collectSymbols } from '../graph/symbols.js';
import { suggestName } from '../graph/suggest.js';
import { isUnitName, type Library } from '../graph/build.js';
import { refusalOf } from './sandbox.js';
import { evaluateUntrusted } from '../sandbox/index.js';

const CASE_PREFIX = /^\s*([A-Za-z_][A-Za-z0-9_]*)\s*=(?!=)/;
/** The limitation marker at the end of a check's comment: `[in EQU]`, `[in EQU, axle]`. */
export const LIMIT_MARKER = /\[in\s+([^[\]]*)\]\s*$/;
/** The one function a case value may call besides the library's. */
export const CASE_FUNCTIONS = new Set(['steps']);

type AnyNode = MathNode & { properties?: Record<string, MathNode> };

function lineSpan(block: CalcBlock, stmt: RawStatement): Span {
  const last = stmt.lines[stmt.lines.length - 1]!;
  const at = (bodyLine: number, column: number) => ({ line: block.bodyStart.line + bodyLine, column, offset: -1 });
  return { start: at(stmt.lines[0]!.bodyLine, 1), end: at(last.bodyLine, stmt.code.length - last.codeOffset + 1) };
}

/**
 * Reads every ```cases cell and every `[in …]` marker on a check.
 * @param blocks the document's blocks; only cases blocks are read
 * @param graph the built graph (to know the given inputs, the cells and the checks)
 * @example const book = readCaseBook(blocks, graph, lib, ctx) // {lines: [{name: 'EQU', values: [...]}], limits}
 */
export function readCaseBook(blocks: Block[], graph: CellGraph, lib: Library, ctx: StageContext): CaseBook {
  const lines: CaseLine[] = [];
  const named = new Map<string, number>();
  const givens = graph.cells.filter((c) => c.kind === 'given').map((c) => c.name!);
  const report = (span: Span, ruleId: RuleId, cellId: string | null, message: string, column = 1) => {
    ctx.diagnostics.push({
      message, file: ctx.file, line: span.start.line, column, endLine: span.end.line, endColumn: span.end.column,
      cellId, ruleId, severity: 'error',
    });
  };
  for (const block of blocks) {
    if (block.kind !== 'calc' || block.cellKind !== 'cases') continue;
    for (const stmt of splitStatements(block.body)) {
      const span = lineSpan(block, stmt);
      const head = CASE_PREFIX.exec(stmt.code);
      const name = head?.[1] ?? null;
      if (name === null) { report(span, 'cases/syntax', null, 'a case line reads NAME = {input: value, …}, e.g. EQU = {gamma_G: 1.1}'); continue; }
      const prior = named.get(name);
      if (prior !== undefined) { report(span, 'cases/duplicate', name, `the case "${name}" is already defined on line ${prior}`); continue; }
      named.set(name, span.start.line);
      const cell = graph.byId.get(name);
      if (cell || graph.failed.has(name)) {
        report(span, 'cases/duplicate', name, `"${name}" is already the name of a cell${cell ? ` on line ${cell.span.start.line}` : ''}; give the case another name`);
        continue;
      }
      const line = readLine(stmt, span, name, head![0].length);
      if (typeof line === 'string') { report(span, 'cases/syntax', name, line); continue; }
      let ok = true;
      for (const v of line.values) {
        const at = { ...span, start: { ...span.start, line: v.line } };
        const cellOf = graph.byId.get(v.input);
        if (cellOf?.kind !== 'given') {
          const guess = suggestName(v.input, givens);
          const what = cellOf ? `"${v.input}" is a ${cellOf.kind} cell, not a given input` : `"${v.input}" is not a given input of this document`;
          report(at, 'cases/unknown-input', name, `${name}: ${what}${guess ? `; did you mean "${guess}"?` : ''}`, v.column);
          ok = false;
          continue;
        }
        const problem = unknownNameIn(v.node, graph, lib);
        if (problem) { report(at, problem.ruleId, name, `${name}: ${v.input}: ${problem.message}`, v.column); ok = false; }
      }
      if (ok) lines.push({ name, description: stmt.comment, span, values: line.values.map(({ input, source, node, column }) => ({ input, source, node, column })) });
    }
  }
  return { lines, limits: readLimits(graph, named, report) };
}

function readLine(stmt: RawStatement, span: Span, name: string, headLength: number): { values: Array<{ input: string; source: string; node: MathNode; column: number; line: number }> } | string {
  const text = stmt.code.slice(headLength);
  let node: AnyNode;
  try {
    node = parseExpression(text) as AnyNode;
  } catch (e) {
    return `${name}: cannot read this case: ${(e as Error).message.replace(/\s*\(char \d+\)/, '')}`;
  }
  if (node.type !== 'ObjectNode' || !node.properties) return `${name}: a case is a record of inputs, e.g. ${name} = {gamma_G: 1.1}`;
  const keys = Object.keys(node.properties);
  if (keys.length === 0) return `${name}: the case changes no input; name at least one, e.g. ${name} = {gamma_G: 1.1}`;
  return {
    values: keys.map((input) => {
      const found = new RegExp(`(^|[{,\\s])["']?${input.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}["']?\\s*:`).exec(stmt.code);
      const at = found ? locateInStatement(stmt, found.index + found[1]!.length) : { bodyLine: stmt.lines[0]!.bodyLine, column: 1 };
      const valueNode = node.properties![input]!;
      return { input, source: valueNode.toString(), node: valueNode, column: at.column, line: span.start.line + at.bodyLine - stmt.lines[0]!.bodyLine };
    }),
  };
}

/** A name a case value may not use: refused by the sandbox, or unknown (with "did you mean"). */
function unknownNameIn(node: MathNode, graph: CellGraph, lib: Library): { ruleId: RuleId; message: string } | null {
  const refusal = refusalOf(node, (n) => graph.byId.has(n));
  if (refusal) return refusal;
  for (const use of collectSymbols(node)) {
    if (use.role === 'unit') {
      if (!isUnitName(use.name)) return { ruleId: 'graph/unknown-name', message: `unknown unit "${use.name}"` };
      continue;
    }
    if (use.role === 'call' && (CASE_FUNCTIONS.has(use.name) || lib.functions.has(use.name))) continue;
    if (use.role === 'value' && (graph.byId.has(use.name) || graph.failed.has(use.name) || isUnitName(use.name))) continue;
    if (use.role === 'call' && isMathFunction(use.name)) continue;
    const known = use.role === 'call' ? [...CASE_FUNCTIONS, ...lib.functions] : [...graph.byId.keys()];
    const guess = suggestName(use.name, known);
    return { ruleId: 'graph/unknown-name', message: `unknown ${use.role === 'call' ? 'function' : 'name'} "${use.name}"${guess ? `; did you mean "${guess}"?` : ''}` };
  }
  return null;
}

function isMathFunction(name: string): boolean {
  try {
    const r = evaluateUntrusted(name);
    return r.ok && typeof r.value === 'function';
  } catch {
    return false;
  }
}

function readLimits(graph: CellGraph, named: Map<string, number>, report: (span: Span, ruleId: RuleId, cellId: string | null, message: string) => void): Map<string, string[]> {
  const limits = new Map<string, string[]>();
  for (const cell of graph.cells) {
    if (cell.kind !== 'check') continue;
    const m = LIMIT_MARKER.exec(cell.description);
    if (!m) continue;
    const names = m[1]!.split(',').map((s) => s.trim()).filter(Boolean);
    const unknown = names.filter((n) => !named.has(n));
    for (const n of unknown) {
      const guess = suggestName(n, named.keys());
      const list = named.size ? ` (cases: ${[...named.keys()].join(', ')})` : ' (this document has no ```cases cell)';
      report(cell.span, 'cases/unknown-case', cell.id, `the check is limited to "${n}", which is no case or family${guess ? `; did you mean "${guess}"?` : list}`);
    }
    if (names.length === 0) report(cell.span, 'cases/unknown-case', cell.id, 'the marker [in …] names no case; write e.g. [in EQU] or [in EQU, STR]');
    limits.set(cell.id, names.filter((n) => named.has(n)));
  }
  return limits;
}
