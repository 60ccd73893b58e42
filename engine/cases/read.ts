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
import type { Block, CalcBlock, CaseBook, CaseLine, Cell, CellGraph, CompiledDocument, Span } from '../types.js';
import type { Diagnostic, RuleId, StageContext } from '../diagnostic.js';
import { splitStatements, locateInStatement, type RawStatement } from '../parse/statements.js';
import { collectSymbols } from '../graph/symbols.js';
import { suggestName } from '../graph/suggest.js';
import { isUnitName, type Library } from '../graph/build.js';
import { refusalOf } from './sandbox.js';
import { evaluateUntrusted } from '../sandbox/index.js';

const CASE_PREFIX = /^\s*([A-Za-z_][A-Za-z0-9_]*)\s*=(?!=)/;
/** The limitation marker at the end of a check's comment: `[in EQU]`, `[in EQU, axle]`, `[in axle[2]]` (one member of a family). */
export const LIMIT_MARKER = /\[in\s+((?:[^[\]]|\[\d+\])*)\]\s*$/;
/**
 * The check's comment without its `[in …]` marker: the sheet, `check` and the JSON say the limit in words.
 * @example withoutLimitMarker('overturning [in EQU]') // 'overturning'
 */
export function withoutLimitMarker(description: string): string {
  return description.replace(LIMIT_MARKER, '').trim();
}
/** Anything in a comment that looks like a limitation marker (`[in`, `[In`, `[ in:` …): it must be LIMIT_MARKER. */
const LOOKS_LIKE_LIMIT = /\[\s*in\b/gi;
/** One name in a marker: a case or family, or one member of a family (`axle[2]`). */
const LIMIT_NAME = /^([A-Za-z_][A-Za-z0-9_]*)(?:\[(\d+)\])?$/;
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
    for (const stmt of splitCaseStatements(block.body)) {
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
      if (stmt.unclosed) {
        report(span, 'cases/syntax', name, `${name}: a bracket opened here is not closed before the next case line or the end of the cell; end the record with }, e.g. ${name} = {gamma_G: 1.1}`);
        continue;
      }
      const twice = repeatedKey(stmt, head![0].length);
      if (twice) {
        report({ ...span, start: { ...span.start, line: block.bodyStart.line + twice.bodyLine } }, 'cases/duplicate', name,
          `${name}: the input "${twice.key}" is given twice in this case; give each input once`, twice.column);
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
  return { lines, limits: readLimits(graph, named, report, blocks) };
}

/**
 * splitStatements for a ```cases cell, where a line that starts a new `NAME =` always starts a new
 * statement: a record left open on one line (`B = {x_P: 2 m`) is an error of that line alone, and
 * the lines after it are still read.
 */
export function splitCaseStatements(body: string): RawStatement[] {
  const lines = body.split('\n');
  const starts = lines.map((l, i) => (i === 0 || CASE_PREFIX.test(l) ? i : -1)).filter((i) => i >= 0);
  return starts.flatMap((from, k) => {
    const to = starts[k + 1] ?? lines.length;
    return splitStatements(lines.slice(from, to).join('\n')).map((stmt) => ({
      ...stmt, lastLine: stmt.lastLine + from, lines: stmt.lines.map((l) => ({ ...l, bodyLine: l.bodyLine + from })),
    }));
  });
}

/** The first input a case record names twice (mathjs would keep the last one silently), with where it is. */
function repeatedKey(stmt: RawStatement, from: number): { key: string; bodyLine: number; column: number } | null {
  const seen = new Set<string>();
  const code = stmt.code;
  let depth = 0;
  let expectKey = false;
  for (let i = from; i < code.length; i++) {
    const c = code[i]!;
    let key: string | null = null;
    if (c === '"' || c === "'") {
      const end = code.indexOf(c, i + 1);
      if (end < 0) return null;
      if (depth === 1 && expectKey) key = code.slice(i + 1, end);
      else { i = end; continue; }
    } else if (c === '{' || c === '(' || c === '[') {
      depth++;
      expectKey = depth === 1 && c === '{';
      continue;
    } else if (c === '}' || c === ')' || c === ']') {
      depth--;
      continue;
    } else if (depth === 1 && c === ',') {
      expectKey = true;
      continue;
    } else if (depth === 1 && expectKey && /[\p{L}_]/u.test(c)) {
      key = /^[\p{L}_][\p{L}\p{N}_]*/u.exec(code.slice(i))![0];
    }
    if (key === null) continue;
    if (seen.has(key)) return { key, ...locateInStatement(stmt, i) };
    seen.add(key);
    expectKey = false;
    i += c === '"' || c === "'" ? key.length + 1 : key.length - 1;
  }
  return null;
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

/**
 * Where the text `marker` of a check's comment stands: the line of its statement holding it and
 * the 1-based column (the statement's first line and column 1 when it cannot be found).
 */
export function markerPosition(cell: Cell, blocks: readonly Block[], marker: string): { line: number; column: number } {
  const block = blocks[cell.block];
  if (block?.kind === 'calc') {
    const lines = block.body.split('\n');
    for (let line = cell.span.start.line; line <= cell.span.end.line; line++) {
      const text = lines[line - block.bodyStart.line] ?? '';
      const hash = text.indexOf('#');
      const at = hash < 0 ? -1 : text.indexOf(marker, hash);
      if (at >= 0) return { line, column: at + 1 };
    }
  }
  return { line: cell.span.start.line, column: 1 };
}

/** The bracketed text starting at `from` (a `[` followed by `[digits]` members), or the rest of the text when it never closes. */
function bracketed(text: string, from: number): string {
  const m = /^\[(?:[^[\]]|\[[^[\]]*\])*\]?/.exec(text.slice(from));
  return m ? m[0] : text.slice(from);
}

function readLimits(graph: CellGraph, named: Map<string, number>, report: (span: Span, ruleId: RuleId, cellId: string | null, message: string, column?: number) => void, blocks: readonly Block[]): Map<string, string[]> {
  const limits = new Map<string, string[]>();
  for (const cell of graph.cells) {
    if (cell.kind !== 'check') continue;
    const m = LIMIT_MARKER.exec(cell.description);
    const at = (marker: string) => {
      const p = markerPosition(cell, blocks, marker);
      return { span: { ...cell.span, start: { ...cell.span.start, line: p.line } }, column: p.column };
    };
    // A marker not written exactly as [in NAME, …] at the end of the comment would be silently ignored: refuse it.
    for (const look of cell.description.matchAll(LOOKS_LIKE_LIMIT)) {
      if (m && look.index === m.index) continue;
      const text = bracketed(cell.description, look.index);
      const names = text.replace(/^\[\s*in\b\s*:?\s*/i, '').replace(/\]$/, '').trim() || 'NAME';
      const after = m ? '' : cell.description.slice(look.index + text.length).trim();
      const why = after && /^\[in\s/.test(text) && text.endsWith(']') ? `the marker must end the comment (here "${after}" follows it)` : 'it is not read as a limit';
      const { span, column } = at(text);
      report(span, 'cases/syntax', cell.id, `cannot read the limit marker "${text}": ${why}; write [in ${names}] at the very end of the check's comment `
        + '(lower-case "in", a space, then cases or families separated by commas; one member of a family as axle[2])', column);
    }
    if (!m) continue;
    const { span, column } = at(m[0].trimEnd());
    const names = m[1]!.split(',').map((s) => s.trim()).filter(Boolean);
    const known: string[] = [];
    for (const n of names) {
      const parts = LIMIT_NAME.exec(n);
      if (parts && named.has(parts[1]!) && (parts[2] === undefined || Number(parts[2]) >= 1)) { known.push(n); continue; }
      if (parts && named.has(parts[1]!)) {
        report(span, 'cases/unknown-case', cell.id, `the check is limited to "${n}": members of a family count from 1 (${parts[1]}[1])`, column);
        continue;
      }
      const guess = suggestName(parts?.[1] ?? n, named.keys());
      const list = named.size ? ` (cases: ${[...named.keys()].join(', ')})` : ' (this document has no ```cases cell)';
      report(span, 'cases/unknown-case', cell.id, `the check is limited to "${n}", which is no case or family${guess ? `; did you mean "${guess}"?` : list}`, column);
    }
    if (names.length === 0) report(span, 'cases/unknown-case', cell.id, 'the marker [in …] names no case; write e.g. [in EQU] or [in EQU, STR]', column);
    limits.set(cell.id, known);
  }
  return limits;
}

/**
 * A limit naming one member of a family (`[in axle[9]]`) can only be checked once the families are
 * expanded: an error on the check's line for each member that does not exist.
 * @example missingMembers(doc, cases) // [{message: 'the check is limited to "axle[9]", but axle has 5 cases (axle[1…5])', …}]
 */
export function missingMembers(doc: CompiledDocument, cases: readonly { name: string; family: string | null }[]): Diagnostic[] {
  const names = new Set(cases.map((c) => c.name));
  const out: Diagnostic[] = [];
  for (const [id, limit] of doc.cases.limits) {
    const cell = doc.graph.byId.get(id);
    if (!cell) continue;
    for (const n of limit) {
      const family = LIMIT_NAME.exec(n);
      if (!family?.[2] || names.has(n)) continue;
      const size = cases.filter((c) => c.family === family[1]).length;
      const has = size ? `${family[1]} has ${size} case${size === 1 ? '' : 's'} (${family[1]}[1…${size}])` : `${family[1]} is a single case, not a family; write [in ${family[1]}]`;
      const p = markerPosition(cell, doc.blocks, n);
      out.push({
        message: `the check is limited to "${n}", but ${has}`, file: doc.file, line: p.line, column: p.column,
        endLine: p.line, endColumn: p.column + n.length, cellId: id, ruleId: 'cases/unknown-case', severity: 'error',
      });
    }
  }
  return out;
}
