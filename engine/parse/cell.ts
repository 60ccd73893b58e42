/**
 * parseCells: CalcBlock → Cell[], one per statement, with document positions.
 */
import type { MathNode } from 'mathjs';
import { parseUntrusted, checkExpression, LimitError, LIMITS } from '../sandbox/index.js';
import type { CalcBlock, Cell, Position, Span, ValueRange } from '../types.js';
import type { Diagnostic, RuleId, StageContext } from '../diagnostic.js';
import { compactUnit } from '../values/format.js';
import { splitStatements, locateInStatement, type RawStatement } from './statements.js';
import { NAME_PREFIX, nameProblem } from './name.js';

const RANGE_SUFFIX = /\[([^[\]]+),([^[\]]+)\]\s*$/;

/** A statement that could not become a cell; the graph treats its name (if any) as failed. */
export interface FailedStatement {
  name: string | null;
  id: string;
  kind: CalcBlock['cellKind'];
  diagnostic: Diagnostic;
}

export interface ParsedBlock {
  cells: Cell[];
  failed: FailedStatement[];
}

function docPos(block: CalcBlock, bodyLine: number, column: number): Position {
  return { line: block.bodyStart.line + bodyLine, column, offset: -1 };
}

function makeDiagnostic(ctx: StageContext, span: Span, message: string, ruleId: RuleId, cellId: string | null, severity: 'error' | 'warning' = 'error'): Diagnostic {
  return {
    message, file: ctx.file, line: span.start.line, column: span.start.column, endLine: span.end.line,
    endColumn: span.end.column, cellId, ruleId, severity,
  };
}

function statementSpan(block: CalcBlock, stmt: RawStatement): Span {
  const last = stmt.lines[stmt.lines.length - 1]!;
  const lastLen = stmt.code.length - last.codeOffset;
  return { start: docPos(block, stmt.lines[0]!.bodyLine, 1), end: docPos(block, last.bodyLine, lastLen + 1) };
}

/** Position of mathjs's "(char N)" inside the statement, mapped to the document. */
function syntaxErrorSpan(block: CalcBlock, stmt: RawStatement, message: string, fallback: Span): Span {
  const m = /\(char (\d+)\)/.exec(message);
  if (!m) return fallback;
  const at = locateInStatement(stmt, Math.max(0, Number(m[1]) - 1));
  const p = docPos(block, at.bodyLine, at.column);
  return { start: p, end: { ...p, column: p.column + 1 } };
}

interface RangeReading {
  description: string;
  range: ValueRange | null;
  problem: { message: string; ruleId: RuleId; severity: 'error' | 'warning' } | null;
}

/** The `[lo, hi]` at the end of a given's comment; its bounds pass the same sandbox as a cell (they can use no name). */
function parseRange(comment: string): RangeReading {
  const m = RANGE_SUFFIX.exec(comment);
  if (!m) return { description: comment, range: null, problem: null };
  const description = comment.slice(0, m.index).trim();
  const what = `the allowed range [${m[1]}, ${m[2]}]`;
  try {
    const loNode = parseUntrusted(m[1]!.trim());
    const hiNode = parseUntrusted(m[2]!.trim());
    const refusal = checkExpression(loNode, { isDocumentName: () => false }) ?? checkExpression(hiNode, { isDocumentName: () => false });
    if (refusal) return { description, range: null, problem: { message: `${what}: ${refusal.message}`, ruleId: refusal.ruleId, severity: 'error' } };
    return { description, range: { lo: m[1]!.trim(), hi: m[2]!.trim(), loNode, hiNode }, problem: null };
  } catch (e) {
    const limit = e instanceof LimitError;
    return {
      description, range: null,
      problem: { message: `${what} is not understood: ${(e as Error).message}`, ruleId: limit ? 'sandbox/limit' : 'value/range', severity: limit ? 'error' : 'warning' },
    };
  }
}

/** The unit of a top-level `expr to UNIT`, written compactly ('kN/m'). */
function displayUnitOf(node: MathNode): string | null {
  const n = node as MathNode & { fn?: string; args?: MathNode[] };
  if (n.type === 'OperatorNode' && n.fn === 'to' && n.args?.[1]) return compactUnit(n.args[1].toString());
  return null;
}

/** Statements parsed so far in each document (keyed by its stage context). */
const statementsSeen = new WeakMap<StageContext, number>();

/**
 * Parses every statement of one calc block.
 * @param block the block from splitBlocks
 * @param index its position in the block list
 */
export function parseCells(block: CalcBlock, index: number, ctx: StageContext): ParsedBlock {
  const cells: Cell[] = [];
  const failed: FailedStatement[] = [];
  for (const stmt of splitStatements(block.body)) {
    const span = statementSpan(block, stmt);
    // The document's statement budget: past it, statements are not even parsed.
    const count = (statementsSeen.get(ctx) ?? 0) + 1;
    statementsSeen.set(ctx, count);
    if (count > LIMITS.cells) {
      if (count === LIMITS.cells + 1) {
        ctx.diagnostics.push(makeDiagnostic(ctx, span,
          `a calc document may have at most ${LIMITS.cells.toLocaleString('en-US')} statements; this one and the ones after it are not evaluated`, 'sandbox/limit', null));
      }
      continue;
    }
    const nameMatch = NAME_PREFIX.exec(stmt.code);
    const name = nameMatch ? nameMatch[1]! : null;
    const id = name ?? `${block.cellKind}@L${span.start.line}`;
    const fail = (message: string, ruleId: RuleId, where: Span = span) => {
      const diagnostic = makeDiagnostic(ctx, where, message, ruleId, id);
      ctx.diagnostics.push(diagnostic);
      failed.push({ name, id, kind: block.cellKind, diagnostic });
    };
    if (stmt.unclosed) {
      fail('a bracket opened here is never closed before the end of the cell', 'parse/syntax');
      continue;
    }
    const refused = nameProblem(stmt.code);
    if (refused) {
      fail(refused, 'parse/name');
      continue;
    }
    let node: MathNode;
    try {
      node = parseUntrusted(stmt.code);
    } catch (e) {
      const message = (e as Error).message;
      if (e instanceof LimitError) { fail(message, 'sandbox/limit'); continue; }
      fail(`cannot read this line: ${message.replace(/\s*\(char \d+\)/, '')}`, 'parse/syntax', syntaxErrorSpan(block, stmt, message, span));
      continue;
    }
    const t = node.type;
    if (t === 'BlockNode') { fail('one statement per line: split the line at ";"', 'parse/cell'); continue; }
    if (t === 'FunctionAssignmentNode') { fail('a cell cannot define a function; define a value instead', 'parse/cell'); continue; }
    if (t === 'AssignmentNode' && !name) { fail('only a plain name can be defined here, e.g. "H = …"', 'parse/cell'); continue; }
    let value = node;
    if (t === 'AssignmentNode') value = (node as MathNode & { value: MathNode }).value;
    const refusal = checkExpression(value);
    if (refusal) { fail(refusal.message, refusal.ruleId); continue; }
    if (!name && (block.cellKind === 'given' || block.cellKind === 'calc')) {
      fail(`a ${block.cellKind} line must define a name: "name = expression"`, 'parse/cell');
      continue;
    }
    const { description, range, problem } = block.cellKind === 'given' ? parseRange(stmt.comment) : { description: stmt.comment, range: null, problem: null };
    if (problem) ctx.diagnostics.push(makeDiagnostic(ctx, span, problem.message, problem.ruleId, id, problem.severity));
    const source = name ? stmt.code.slice(nameMatch![0].length).trim() : stmt.code.trim();
    cells.push({
      id, name, kind: block.cellKind, text: stmt.code.trim(), source, node: value, description, range,
      displayUnit: displayUnitOf(value), uses: [], calls: [], span, block: index, overridden: false, originalSource: null,
    });
  }
  return { cells, failed };
}
