/**
 * envelopeOf: per check, the cases it is judged in, the worst verdict and the governing case.
 *
 * The worst verdict: fails if the check fails in any case it is judged in; else not evaluated
 * if it could not be evaluated in one; else holds. The governing case is the failing case of
 * highest utilization (the first failing case when none of them has a utilization), else the
 * first not evaluated case, else, when the check holds in every case and every case has a
 * utilization, the case of highest utilization (the first one on a tie; the document as written
 * comes first). A check that holds everywhere but lacks a utilization in some case (a `<` or `>`
 * check, a negative demand or capacity) has no governing case (null): the cases were not
 * compared, so none is claimed.
 */
import type { CaseBook, CellGraph } from '../types.js';
import type { Case } from './expand.js';
import type { CaseResult, CheckCase } from './run.js';

export interface CheckEnvelope {
  /** The check's verdict over every case it is judged in. */
  pass: boolean | null;
  /** Highest utilization over those cases (null when none has one). */
  utilization: number | null;
  /** The case that sets the verdict; null when the check is judged in no case, or holds in every case without a utilization to compare them by. */
  governing: CheckCase | null;
  /** The check in each case it is judged in, in case order. */
  cases: CheckCase[];
}

/** Is the check judged in this case? `limit` lists case and family names; `case: null` is the document as written. */
export function isJudgedIn(limit: readonly string[] | undefined, c: Case | null): boolean {
  if (!limit) return true;
  if (c === null) return false;
  return limit.includes(c.name) || (c.family !== null && limit.includes(c.family));
}

function higher(a: number | null, b: number | null): boolean {
  return a !== null && (b === null || a > b);
}

/** The governing entry of a list of results of one check. */
export function governingOf(list: readonly CheckCase[]): CheckCase | null {
  const fails = list.filter((x) => x.pass === false);
  if (fails.length) return fails.reduce((g, x) => (higher(x.utilization, g.utilization) ? x : g));
  const none = list.find((x) => x.pass === null);
  if (none) return none;
  if (!list.length || list.some((x) => x.utilization === null)) return null;
  return list.reduce((g, x) => (higher(x.utilization, g.utilization) ? x : g));
}

/** The worst verdict of a list of results of one check: fails, else not evaluated, else holds (null when the list is empty). */
export function worstOf(list: readonly CheckCase[]): boolean | null {
  if (!list.length) return null;
  if (list.some((x) => x.pass === false)) return false;
  return list.some((x) => x.pass === null) ? null : true;
}

/**
 * Every check's envelope.
 * @param results the document as written first (case null), then one per case, in the order of `cases`
 * @example envelopeOf(graph, book, cases, results).get('c_ot')!.governing // {case: 'EQU', pass: true, utilization: 0.62}
 */
export function envelopeOf(graph: CellGraph, book: CaseBook, cases: readonly (Case | null)[], results: readonly CaseResult[]): Map<string, CheckEnvelope> {
  const out = new Map<string, CheckEnvelope>();
  for (const cell of graph.cells) {
    if (cell.kind !== 'check') continue;
    const limit = book.limits.get(cell.id);
    const list: CheckCase[] = [];
    results.forEach((r, i) => {
      const entry = r.checks[cell.id];
      if (entry && isJudgedIn(limit, cases[i] ?? null)) list.push(entry);
    });
    const governing = governingOf(list);
    const utilization = list.reduce<number | null>((u, x) => (higher(x.utilization, u) ? x.utilization : u), null);
    out.set(cell.id, { pass: worstOf(list), utilization, governing, cases: list });
  }
  return out;
}
