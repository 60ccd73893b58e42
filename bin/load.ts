/**
 * Reads and evaluates a calc file for a command; unreadable files become diagnostics, not crashes.
 */
import { evaluateDocument, type CompiledDocument, type Diagnostic, type Summary } from '../engine/index.js';
import { DocumentError, readDocument } from './document.js';
import { casePool } from './archive/cases.js';

export interface Loaded {
  file: string;
  summary: Summary;
  /** Set when the file could not be read at all. */
  unreadable?: string;
}

export interface LoadOptions {
  /** `--case NAME`: evaluate this case as if written in. */
  case?: string;
  /** Threads for a large family of cases (the main thread alone when absent or 1). */
  caseJobs?: number;
}

/** A summary holding one diagnostic and nothing else. */
export function summaryOfProblem(file: string, diagnostic: Diagnostic): Summary {
  return { file, meta: {}, values: {}, checks: [], diagnostics: [diagnostic] };
}

/**
 * The error for a document with nothing to evaluate (no statement in any cell), or null.
 * An empty file or one of prose alone would otherwise pass `check` and render a blank signed sheet.
 */
export function noCellsDiagnostic(doc: CompiledDocument): Diagnostic | null {
  if (doc.graph.cells.length > 0 || doc.graph.unparsed.length > 0) return null;
  // A document refused as a whole (too large, too many statements) has no cells because of that
  // refusal: its own error says why, and "no cells found" would mislead.
  if (doc.diagnostics.some((d) => d.severity === 'error')) return null;
  return {
    message: 'no cells found: the document has no ```given, ```calc, ```check or ```figure cell with a statement, so there is nothing to evaluate or check',
    file: doc.file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null, ruleId: 'doc/no-cells', severity: 'error',
  };
}

/**
 * Why no sheet can be made of this document, or null when one can: the document has no cells,
 * either because it holds none or because it was refused as a whole (its errors say why).
 */
export function nothingToRender(doc: CompiledDocument): Diagnostic[] | null {
  if (doc.graph.cells.length > 0 || doc.graph.unparsed.length > 0) return null;
  const errors = doc.diagnostics.filter((d) => d.severity === 'error');
  return errors.length > 0 ? errors : [noCellsDiagnostic(doc)!];
}

export async function loadAndEvaluate(file: string, overrides: Record<string, string>, options: LoadOptions = {}): Promise<Loaded> {
  let text: string;
  try {
    ({ text } = await readDocument(file));
  } catch (e) {
    if (!(e instanceof DocumentError)) throw e;
    return { file, unreadable: e.reason, summary: summaryOfProblem(file, e.toDiagnostic()) };
  }
  const caseRunner = options.caseJobs && options.caseJobs > 1 ? casePool(text, file, overrides, { jobs: options.caseJobs }) : undefined;
  const { doc, summary } = await evaluateDocument(text, { file, overrides, ...(options.case !== undefined ? { case: options.case } : {}), ...(caseRunner ? { caseRunner } : {}) });
  const empty = noCellsDiagnostic(doc);
  if (empty) summary.diagnostics.unshift(empty);
  return { file, summary };
}

export function hasErrors(s: Summary): boolean {
  return s.diagnostics.some((d) => d.severity === 'error');
}
