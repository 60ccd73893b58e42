/**
 * Load cases, combinations and sweeps: one calc judged in every case, with the governing one shown.
 *
 *   ```cases
 *   EQU = {gamma_G: 1.1, gamma_Q: 1.5}            # overturning
 *   axle = {x_P: steps(0.05 * L, 0.95 * L, 37)}   # a family: axle[1] … axle[37]
 *   ```
 *
 * read.ts reads the cell when the document compiles; expand.ts evaluates its values against the
 * document as written; run.ts evaluates each case on the document's session (only what lies
 * downstream of the case's inputs); envelope.ts finds each check's worst verdict and governing case.
 */
import type { CellState, CompiledDocument } from '../types.js';
import type { Diagnostic } from '../diagnostic.js';
import type { Session } from '../runtime/bind.js';
import { suggestName } from '../graph/suggest.js';
import { expandCases, type Case } from './expand.js';
import { runCases, resultOf, errorKeys, type CaseResult, type RunOptions } from './run.js';
import { envelopeOf, type CheckEnvelope } from './envelope.js';
import { missingMembers } from './read.js';

/**
 * Evaluates the cases partly elsewhere (worker threads) and returns their results in order, or
 * null to leave them all to this session (too few to be worth it, or no workers). `here`
 * evaluates a slice on this session meanwhile.
 */
export type CaseRunner = (cases: Case[], here: (slice: Case[]) => Promise<CaseResult[]>) => Promise<CaseResult[] | null>;

/** Everything the cases of a document give. */
export interface CaseRun {
  /** Every case of the document, in order (the document as written is not one of them). */
  cases: Case[];
  /** The case shown in place of the document as written (`--case NAME`), else null. */
  shown: Case | null;
  /** Results of the document as written (case null; absent when a case is shown) and of every case evaluated. */
  results: CaseResult[];
  /** Check id → its envelope over every case it is judged in. */
  checks: Map<string, CheckEnvelope>;
  /** Problems of the cases: their lines, and errors and warnings a case causes that the document as written does not have. */
  diagnostics: Diagnostic[];
}

export interface JudgeOptions extends RunOptions {
  /** The case the document was compiled as (`--case`): only it is judged. */
  shown?: { case: Case; diagnostics: Diagnostic[] };
  /** Evaluates the cases elsewhere instead of on this session. */
  runner?: CaseRunner;
}

/** Inputs set with --set: they stay as set in every case. */
function pinnedInputs(doc: CompiledDocument): Set<string> {
  return new Set(doc.graph.cells.filter((c) => c.kind === 'given' && c.overridden).map((c) => c.name!));
}

/** The errors and warnings each case adds, once per cell and rule (a family reports its first member and how many more). */
function caseErrors(results: CaseResult[], cases: readonly (Case | null)[]): Diagnostic[] {
  const seen = new Map<string, { d: Diagnostic; first: string; more: number }>();
  results.forEach((r, i) => {
    const c = cases[i];
    if (!c) return;
    for (const d of r.diagnostics) {
      // A case value outside its input's range is warned about on the case line (expandCases).
      if (d.ruleId === 'value/range' && d.cellId !== null && d.cellId in c.overrides) continue;
      const key = `${c.family ?? c.name}\n${d.cellId}\n${d.ruleId}`;
      const entry = seen.get(key);
      if (entry) entry.more++;
      else seen.set(key, { d, first: c.name, more: 0 });
    }
  });
  return [...seen.values()].map(({ d, first, more }) => ({
    ...d, message: `in case ${first}${more ? ` (and ${more} more of its family)` : ''}: ${d.message}`,
  }));
}

/**
 * Judges every check in the document as written and in every case.
 * @param session the document's session, settled as written
 * @param base a copy of its settled states (the session's own map changes while cases run)
 * @example const run = await judgeCases(doc, session, new Map(await session.settle()))
 */
export async function judgeCases(doc: CompiledDocument, session: Session, base: Map<string, CellState>, options: JudgeOptions = {}): Promise<CaseRun> {
  const known = errorKeys(doc.graph, base, session.warnings);
  if (options.shown) {
    const { case: shown, diagnostics } = options.shown;
    const results = [resultOf(doc.graph, base, shown.name, known)];
    return { cases: [shown], shown, results, checks: envelopeOf(doc.graph, doc.cases, [shown], results), diagnostics };
  }
  const { cases, diagnostics } = expandCases(doc, base, pinnedInputs(doc));
  const here = (slice: Case[]) => runCases(session, slice, known, options);
  const elsewhere = options.runner && cases.length > 0 ? await options.runner(cases, here) : null;
  const evaluated = elsewhere ?? await runCases(session, cases, known, options);
  const results = [resultOf(doc.graph, base, null, new Set()), ...evaluated];
  const order = [null, ...cases];
  return {
    cases, shown: null, results, checks: envelopeOf(doc.graph, doc.cases, order, results),
    diagnostics: [...diagnostics, ...(diagnostics.length ? [] : missingMembers(doc, cases)), ...caseErrors(results, order)],
  };
}

/**
 * Finds a case by name, evaluating the document as written to expand its families.
 * @returns the case, or a diagnostic naming the cases there are
 * @example await findCase(doc, session, 'axle[3]') // {case: {name: 'axle[3]', overrides: {x_P: '…'}, …}, diagnostics: []}
 */
export async function findCase(doc: CompiledDocument, session: Session, name: string): Promise<{ case: Case; diagnostics: Diagnostic[] } | { error: Diagnostic }> {
  const base = await session.settle();
  const { cases, diagnostics } = expandCases(doc, base, pinnedInputs(doc));
  const found = cases.find((c) => c.name === name);
  if (found) return { case: found, diagnostics };
  const families = [...new Set(cases.map((c) => c.family ?? c.name))];
  const guess = suggestName(name, [...cases.map((c) => c.name), ...families]);
  const list = families.length ? ` (cases: ${families.map((f) => (cases.some((c) => c.family === f) ? `${f}[1…${cases.filter((c) => c.family === f).length}]` : f)).join(', ')})` : ' (this document has no cases)';
  return {
    error: {
      message: `--case ${name}: no such case${guess ? `; did you mean "${guess}"?` : ''}${list}`, file: doc.file, line: 1, column: 1,
      endLine: 1, endColumn: 1, cellId: null, ruleId: 'cases/unknown-case', severity: 'error',
    },
  };
}

export { expandCases, exactText, MAX_CASES, type Case } from './expand.js';
export { runCases, resultOf, errorKeys, type CaseResult, type CheckCase } from './run.js';
export { envelopeOf, governingOf, isJudgedIn, type CheckEnvelope } from './envelope.js';
export { readCaseBook, LIMIT_MARKER } from './read.js';
export { steps } from './steps.js';
export { downstreamOf } from './dirty.js';
