/**
 * `vaultbook eval FILE [--set NAME=EXPR …] [--json]`: every value of a calc.
 */
import { formatDiagnostic } from '../../engine/index.js';
import { parse, readOverrides, SET_OPTION, JSON_OPTION, CASE_OPTION, UsageError } from '../args.js';
import { loadAndEvaluate, hasErrors } from '../load.js';
import { table } from '../table.js';
import { summariesJson } from '../archive/report.js';

export async function evalCommand(args: string[], out: (s: string) => void): Promise<number> {
  const { values, positionals } = parse(args, { ...SET_OPTION, ...JSON_OPTION, ...CASE_OPTION });
  if (positionals.length !== 1) throw new UsageError('eval takes exactly one FILE');
  const { summary } = await loadAndEvaluate(positionals[0]!, readOverrides(values.set as string[] | undefined), values.case !== undefined ? { case: values.case as string } : {});
  if (values.json) {
    const { text, failures } = summariesJson([summary], false);
    out(text);
    if (failures > 0) return 2;
  } else {
    const rows = Object.entries(summary.values).map(([name, v]) => [
      String(v.line), v.kind, name + (v.overridden_from !== undefined ? ' *' : ''), v.text,
    ]);
    out(table(['line', 'kind', 'name', 'value'], rows));
    if (Object.values(summary.values).some((v) => v.overridden_from !== undefined)) out(values.case !== undefined ? `* input overridden with --set or by the case ${values.case}` : '* input overridden with --set');
    for (const d of summary.diagnostics) out(formatDiagnostic(d));
  }
  return hasErrors(summary) ? 2 : 0;
}
