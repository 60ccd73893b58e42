/**
 * compile → bind → summarise: the engine's public surface.
 *
 * Runs in Node and in the browser: nothing here imports a Node module.
 */
import type { Block, CalcBlock, Cell, CellState, CompiledDocument } from './types.js';
import type { Diagnostic, StageContext } from './diagnostic.js';
import { normaliseNewlines } from './parse/position.js';
import { readFrontMatter } from './parse/frontmatter.js';
import { splitBlocks } from './parse/blocks.js';
import { parseCells, type FailedStatement } from './parse/cell.js';
import { buildGraph } from './graph/build.js';
import { checkFields } from './graph/fields.js';
import { bindGraph, type Session } from './runtime/bind.js';
import { registerLibrary } from './library.js';
import { readOverride } from './parse/override.js';
import { setDimensionProblem } from './parse/set-dimension.js';
import { summarise, type Summary } from './summary.js';
import { readCaseBook } from './cases/read.js';
import { judgeCases, findCase, type CaseRun, type CaseRunner } from './cases/index.js';
import { summariseCases } from './cases/summary.js';
import { documentUnitSystem } from './values/format.js';

export interface CompileOptions {
  /** File name used in diagnostics. */
  file?: string;
  /** Input overrides: name → expression text, as from `--set NAME=EXPR`. */
  overrides?: Record<string, string>;
}

function applyOverrides(cells: Cell[], overrides: Record<string, string>, ctx: StageContext): void {
  const names = new Set(cells.map((c) => c.name));
  for (const [name, text] of Object.entries(overrides)) {
    const cell = cells.find((c) => c.name === name);
    const read = readOverride(cell, name, text, (n) => names.has(n));
    const wrong = read.ok ? setDimensionProblem(read.cell, text) : null;
    const reading = wrong ? { ok: false as const, ruleId: 'units/mismatch' as const, message: wrong } : read;
    if (!reading.ok) {
      const inputs = cells.filter((c) => c.kind === 'given').map((c) => c.name).join(', ');
      const list = reading.ruleId === 'set/unknown-input' && inputs ? ` (inputs: ${inputs})` : '';
      ctx.diagnostics.push({
        message: `--set ${name}: ${reading.message}${list}`, file: ctx.file, line: cell?.span.start.line ?? 1, column: 1,
        endLine: cell?.span.end.line ?? 1, endColumn: 1, cellId: name, ruleId: reading.ruleId, severity: 'error',
      });
      continue;
    }
    const given = reading.cell;
    given.originalSource = given.source;
    given.node = reading.node;
    given.source = text;
    given.displayUnit = null;
    given.overridden = true;
  }
}

/**
 * Parses a calc document and builds its dependency graph.
 * @param source the markdown text
 * @returns blocks, cells, graph and every diagnostic found before evaluation; never throws on bad input
 * @example const doc = compile(text, {file: 'calc.md', overrides: {L: '7 m'}})
 */
export function compile(source: string, options: CompileOptions = {}): CompiledDocument {
  if (typeof source !== 'string') throw new TypeError('compile: expected source to be a string');
  const ctx: StageContext = { file: options.file ?? 'document.md', diagnostics: [] };
  const text = normaliseNewlines(source);
  const lib = registerLibrary();
  const { meta, length } = readFrontMatter(text, ctx);
  const blocks: Block[] = splitBlocks(text, length, ctx);
  const cells: Cell[] = [];
  const failed: FailedStatement[] = [];
  blocks.forEach((b, i) => {
    if (b.kind !== 'calc' || b.cellKind === 'cases') return;
    const parsed = parseCells(b as CalcBlock, i, ctx);
    cells.push(...parsed.cells);
    failed.push(...parsed.failed);
  });
  applyOverrides(cells, options.overrides ?? {}, ctx);
  const graph = buildGraph(cells, failed, lib, ctx);
  checkFields(graph, text, ctx);
  const cases = readCaseBook(blocks, graph, lib, ctx);
  return { file: ctx.file, source: text, meta, blocks, graph, diagnostics: ctx.diagnostics, cases };
}

/** Starts a live session on a compiled document. */
export function startSession(doc: CompiledDocument): Session {
  const sigfigs = typeof doc.meta.sigfigs === 'number' ? doc.meta.sigfigs : undefined;
  // A given input written in ft, kip, psf … makes the document's messages US customary.
  return bindGraph(doc.graph, { file: doc.file, diagnostics: doc.diagnostics, ...(sigfigs ? { sigfigs } : {}), units: documentUnitSystem(doc) });
}

export interface Evaluation {
  doc: CompiledDocument;
  /** The document as written (or as the case asked for with `case`). */
  states: Map<string, CellState>;
  warnings: Map<string, Diagnostic>;
  summary: Summary;
  /** Every check in every case, with its governing case. */
  cases: CaseRun;
}

export interface EvaluateOptions extends CompileOptions {
  /** Evaluate this case as if its inputs were written in the document (`--case NAME`). */
  case?: string;
  /** Evaluates the cases elsewhere (worker threads) instead of one after another here. */
  caseRunner?: CaseRunner;
}

/**
 * Compiles and evaluates a document once, in every case of its ```cases cells.
 * @example const {summary} = await evaluateDocument(text, {file: 'calc.md'})
 */
export async function evaluateDocument(source: string, options: EvaluateOptions = {}): Promise<Evaluation> {
  let doc = compile(source, options);
  let session = startSession(doc);
  let shown: Awaited<ReturnType<typeof findCase>> | undefined;
  if (options.case !== undefined) {
    shown = await findCase(doc, session, options.case);
    if ('case' in shown) {
      session.dispose();
      doc = compile(source, { ...options, overrides: { ...shown.case.overrides, ...options.overrides } });
      session = startSession(doc);
    } else doc.diagnostics.push(shown.error);
  }
  const states = new Map(await session.settle());
  const warnings = new Map(session.warnings);
  const cases = await judgeCases(doc, session, states, {
    ...(shown && 'case' in shown ? { shown } : {}), ...(options.caseRunner ? { runner: options.caseRunner } : {}),
  });
  const summary = summariseCases(summarise(doc, states, warnings), cases, doc);
  session.dispose();
  return { doc, states, warnings, summary, cases };
}

export { formatDiagnostic } from './diagnostic.js';
export { formatValue, formatNumber, formatUtilization, documentUnitSystem, type UnitSystem } from './values/format.js';
export { toJsonValue } from './values/json.js';
export { expandCases, judgeCases } from './cases/index.js';
export type { Session } from './runtime/bind.js';
export type { Case, CaseResult, CheckCase } from './cases/index.js';
export type { Summary } from './summary.js';
export type { CaseRun, CaseRunner } from './cases/index.js';
export type { Diagnostic } from './diagnostic.js';
export type * from './types.js';
