/**
 * diffCases: two versions of a calc with cases → each check compared case by case, and the
 * checks whose governing case changed. Checks pair as in checks.ts (name, else expression);
 * cases pair by name (`case: null` is the document as written). Pure: no Node imports.
 */
import type { CheckEntry, CaseVerdict } from '../../engine/summary.js';

export interface CaseCheckChange {
  check: string;
  /** The case, or null for the document as written. */
  case: string | null;
  change: 'to-fail' | 'to-pass' | 'to-not-evaluated' | 'utilization' | 'added' | 'removed';
  old: CaseVerdict | null;
  new: CaseVerdict | null;
}

export interface GoverningChange {
  check: string;
  /** null: no governing case (the check holds everywhere without utilizations to compare, or the version has no cases). */
  old: CaseVerdict | null;
  new: CaseVerdict | null;
}

export interface CasesDiff {
  /** Per check and case, what changed (a case judged in only one version is added or removed). */
  changes: CaseCheckChange[];
  /** Checks whose governing case is another case now, or that gained or lost a governing case. */
  governing: GoverningChange[];
}

const keyOf = (c: CheckEntry) => c.name ?? c.source.replace(/\s+/g, ' ').trim();
const verdict = (v: CaseVerdict) => (v.pass === true ? 'holds' : v.pass === false ? 'fails' : 'not evaluated');

/**
 * Compares the per-case verdicts of the checks two versions share.
 * @param tol utilization changes at or below this are not reported (absolute)
 * @example diffCases(old.checks, next.checks, 1e-9).governing // [{check: 'c_M', old: {case: 'STR', …}, new: {case: 'axle[9]', …}}]
 */
export function diffCases(oldChecks: CheckEntry[], newChecks: CheckEntry[], tol: number): CasesDiff {
  const olds = new Map(oldChecks.map((c) => [keyOf(c), c]));
  const changes: CaseCheckChange[] = [];
  const governing: GoverningChange[] = [];
  for (const b of newChecks) {
    const a = olds.get(keyOf(b));
    if (!a || (!a.cases && !b.cases)) continue;
    const check = keyOf(b);
    const before = new Map((a.cases ?? []).map((x) => [x.case, x]));
    for (const y of b.cases ?? []) {
      const x = before.get(y.case);
      before.delete(y.case);
      if (!x) { changes.push({ check, case: y.case, change: 'added', old: null, new: y }); continue; }
      if (verdict(x) !== verdict(y)) changes.push({ check, case: y.case, change: y.pass === false ? 'to-fail' : y.pass === true ? 'to-pass' : 'to-not-evaluated', old: x, new: y });
      else if (x.utilization !== null && y.utilization !== null && Math.abs(y.utilization - x.utilization) > tol) changes.push({ check, case: y.case, change: 'utilization', old: x, new: y });
    }
    for (const x of before.values()) changes.push({ check, case: x.case, change: 'removed', old: x, new: null });
    // A governing case that appears or disappears is a change as much as one that moves.
    const ga = a.governing ?? null, gb = b.governing ?? null;
    if (ga === null ? gb !== null : gb === null || ga.case !== gb.case) governing.push({ check, old: ga, new: gb });
  }
  return { changes, governing };
}
