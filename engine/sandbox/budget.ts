/**
 * Time budgets: one per cell, checked at every guarded call, and one per
 * evaluation round of a document, checked before each cell starts.
 *
 * JavaScript cannot interrupt a running function, so the per-cell budget stops
 * a cell between calls; the size guards keep each single call short.
 */
import { LIMITS } from './limits.js';
import { LimitError } from './guards.js';

const now = (): number => (typeof performance !== 'undefined' ? performance.now() : Date.now());

let deadline = Infinity;

/** Called by every guarded function: throws once the running cell has used its time. */
export function chargeCall(name: string): void {
  if (now() > deadline) {
    throw new LimitError(`this line ran longer than ${LIMITS.cellMs / 1000} s (stopped at ${name}); split the work or make it smaller`);
  }
}

/**
 * Runs one cell's evaluation within the per-cell budget.
 * @example withinCellBudget(() => compiled(scope, {}, null))
 */
export function withinCellBudget<T>(run: () => T): T {
  const outer = deadline;
  deadline = Math.min(outer, now() + LIMITS.cellMs);
  try {
    return run();
  } finally {
    deadline = outer;
  }
}

interface Round {
  spent: number;
}

const rounds = new WeakMap<object, Round>();

/**
 * Runs one cell's work, charged to its document's evaluation round; throws a LimitError
 * instead when the round had already used its budget before this cell started.
 * @param key one object per document session (its stage context)
 * @example chargeDocument(ctx, () => evaluateNode(cell.node, scope))
 */
export function chargeDocument<T>(key: object, run: () => T): T {
  const round = rounds.get(key) ?? { spent: 0 };
  rounds.set(key, round);
  if (round.spent > LIMITS.documentMs) {
    throw new LimitError(`the document used its evaluation budget (${LIMITS.documentMs / 1000} s) before reaching this line`);
  }
  const start = now();
  try {
    return run();
  } finally {
    round.spent += now() - start;
  }
}

/** Starts a new evaluation round (a live edit, a reset): the document's budget is whole again. */
export function resetDocumentBudget(key: object): void {
  rounds.delete(key);
}
