/**
 * diffChecks: the checks of two versions → flips and utilization changes.
 *
 * A check is the same check in both versions when it has the same name, or,
 * unnamed, the same expression (lines move in any revision, so they cannot be
 * the key). What the reviewer must see first is a check that held and now
 * fails; a check that only got closer to its limit comes next.
 * Pure: no Node imports.
 */
import type { CheckEntry } from '../../engine/summary.js';

export type Verdict = 'holds' | 'fails' | 'not evaluated';

export interface CheckSide {
  line: number;
  source: string;
  verdict: Verdict;
  utilization: number | null;
}

export interface CheckChange {
  /** The check's name, or its expression when unnamed. */
  key: string;
  description: string;
  change: 'to-fail' | 'to-pass' | 'to-not-evaluated' | 'utilization' | 'expression' | 'added' | 'removed';
  old: CheckSide | null;
  new: CheckSide | null;
  /** new − old utilization, when both have one. */
  delta: number | null;
}

export function verdictOf(c: CheckEntry): Verdict {
  return c.pass === true ? 'holds' : c.pass === false ? 'fails' : 'not evaluated';
}

const side = (c: CheckEntry): CheckSide => ({ line: c.line, source: c.source, verdict: verdictOf(c), utilization: c.utilization });
const keyOf = (c: CheckEntry) => c.name ?? c.source.replace(/\s+/g, ' ').trim();

/**
 * Pairs the checks of two versions and says how each changed.
 * @param tol utilization changes at or below this are not reported (absolute)
 * @example diffChecks(old.checks, next.checks, 1e-9).filter((c) => c.change === 'to-fail')
 */
export function diffChecks(oldChecks: CheckEntry[], newChecks: CheckEntry[], tol: number): CheckChange[] {
  const pool = new Map<string, CheckEntry[]>();
  for (const c of oldChecks) pool.set(keyOf(c), [...(pool.get(keyOf(c)) ?? []), c]);
  const changes: CheckChange[] = [];
  for (const c of newChecks) {
    const key = keyOf(c);
    const was = pool.get(key)?.shift();
    if (!was) {
      changes.push({ key, description: c.description, change: 'added', old: null, new: side(c), delta: null });
      continue;
    }
    const a = side(was), b = side(c);
    const delta = a.utilization !== null && b.utilization !== null ? b.utilization - a.utilization : null;
    let change: CheckChange['change'] | null = null;
    if (a.verdict !== b.verdict) change = b.verdict === 'fails' ? 'to-fail' : b.verdict === 'holds' ? 'to-pass' : 'to-not-evaluated';
    else if (delta !== null && Math.abs(delta) > tol) change = 'utilization';
    else if (a.source !== b.source) change = 'expression';
    if (change) changes.push({ key, description: c.description, change, old: a, new: b, delta });
  }
  for (const [key, left] of pool) {
    for (const c of left) changes.push({ key, description: c.description, change: 'removed', old: side(c), new: null, delta: null });
  }
  return changes;
}

/** Does this change leave a check failing that did not fail before (a flip, or a new check that fails)? */
export function isNewFailure(c: CheckChange): boolean {
  return c.change === 'to-fail' || (c.change === 'added' && c.new!.verdict === 'fails');
}
