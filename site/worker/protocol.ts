/**
 * Messages between the live page and its evaluation worker (site/worker/evaluate.ts).
 *
 * Every edit carries a sequence number; a result says which edit it answers, and the page drops a
 * result whose edit is no longer the latest. So that no change is lost with it, the worker keeps
 * every cell changed since the last result the page accepted (`accepted`, sent back with each edit)
 * and repeats it in each result until the page has taken it.
 */
import type { ArchiveInfo } from '../sheet.js';
import type { CheckVerdict, ResultChange } from '../review.js';

export type ToWorker =
  /**
   * `cases`: the trial values the cases are judged with (site/cases.ts), when the document has cases:
   * the worker judges them once loaded, so that it renders each check limited to cases with its
   * verdict over them, as the page painted it.
   */
  | { type: 'load'; token: number; text: string; file: string; archive?: ArchiveInfo; overrides: Array<[string, string]>; cases?: Record<string, string> }
  | { type: 'set'; seq: number; accepted: number; name: string; value: string }
  | { type: 'reset'; seq: number; accepted: number; name: string }
  | { type: 'cases'; generation: number; trials: Record<string, string> }
  /** What drives one check (site/drivers.ts), with the page's trial values; answered apart from the edits' queue. */
  | { type: 'drivers'; generation: number; text: string; file: string; overrides: Record<string, string>; target: string };

/** One cell's new rendering and its move against the document as written (for the review badges). */
export interface CellPatch {
  id: string;
  html: string;
  change: ResultChange | null;
}

export type FromWorker =
  | { type: 'loaded'; token: number }
  /**
   * `evaluations`: each cell's evaluations for the page's edits since the load (the load's own are not
   * counted); `times`: when the worker took the edit, when its evaluation settled and when the result
   * was posted (performance.timeOrigin + performance.now(), comparable across threads).
   */
  | { type: 'result'; seq: number; token: number; cells: CellPatch[]; parts: Array<[string, string]>; evaluations: Array<[string, number]>; times: [number, number, number] }
  /**
   * The cases' verdicts: each cases block (by its line), the checks summary, and what they change in
   * each check: `cells`, the output of every check limited to cases (it shows its verdict over them);
   * `verdicts`, that verdict (for the review); `notes`, every check's cases note ('' for none).
   */
  | { type: 'cases'; generation: number; token: number; blocks: Array<[number, string]>; summary: string; cells: Array<[string, string]>; verdicts: Array<[string, CheckVerdict]>; notes: Array<[string, string]> }
  /** The drivers table of the check asked for (the HTML of the sheet appendix's table for it), null when it could not be explained. */
  | { type: 'drivers'; generation: number; html: string | null }
  | { type: 'failed'; message: string };
