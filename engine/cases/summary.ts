/**
 * summariseCases: adds the cases to a document's JSON summary, keeping every field it had:
 * top-level `cases`, and per check `governing` and `cases`, with `pass` and `utilization`
 * becoming the verdict over every case the check is judged in. Only for a document that has a
 * ```cases cell: any other keeps exactly the JSON it had.
 */
import type { CaseEntry, Summary } from '../summary.js';
import type { CompiledDocument } from '../types.js';
import type { CaseRun } from './index.js';

/**
 * The summary with the cases' verdicts (changes and returns `summary`).
 * @example summariseCases(summarise(doc, states, warnings), run, doc).checks[0].governing // {case: 'EQU', pass: true, utilization: 0.6}
 */
export function summariseCases(summary: Summary, run: CaseRun, doc: CompiledDocument): Summary {
  // A document without a ```cases cell keeps the JSON it always had.
  if (!doc.blocks.some((b) => b.kind === 'calc' && b.cellKind === 'cases') && run.diagnostics.length === 0) return summary;
  summary.cases = run.cases.map((c): CaseEntry => ({
    name: c.name, family: c.family, index: c.index, overrides: c.overrides, description: c.description, line: c.line,
  }));
  const checks = doc.graph.cells.filter((c) => c.kind === 'check');
  summary.checks.forEach((entry, i) => {
    const env = run.checks.get(checks[i]!.id);
    if (!env) return;
    entry.pass = env.pass;
    entry.utilization = env.utilization;
    // No governing case is claimed for a check that holds everywhere without utilizations to compare, nor for one
    // judged in none of the cases shown (--case NAME, a check limited to others: `cases: []`): `governing` is left out.
    if (env.governing) entry.governing = { ...env.governing };
    entry.cases = env.cases.map((x) => ({ ...x }));
  });
  if (run.diagnostics.length) {
    summary.diagnostics.push(...run.diagnostics.map((d) => ({ ...d, cell: d.cellId })));
    summary.diagnostics.sort((a, b) => a.line - b.line || a.column - b.column);
  }
  return summary;
}
