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
    // A check limited by [in …] to cases other than the one shown is not judged here: its value as
    // computed here is no verdict (check and the sheet say the same).
    const limited = new Map(summary.checks.filter((c) => c.name && c.judged_in?.length && c.cases).map((c) => [c.name!, c]));
    const shownHere = (c: { cases?: { case: string | null }[] }) => (values.case !== undefined ? c.cases!.length > 0 : c.cases!.some((x) => x.case === null));
    const textOf = (name: string, v: { kind: string; text: string }) => {
      const c = v.kind === 'check' ? limited.get(name) : undefined;
      return c && !shownHere(c) ? `not judged ${values.case !== undefined ? 'in this case' : 'as written'} (judged in ${c.judged_in!.join(', ')} only)` : v.text;
    };
    const rows = Object.entries(summary.values).map(([name, v]) => [
      String(v.line), v.kind, name + (v.overridden_from !== undefined ? ' *' : ''), textOf(name, v),
    ]);
    out(table(['line', 'kind', 'name', 'value'], rows));
    if (Object.values(summary.values).some((v) => v.overridden_from !== undefined)) out(values.case !== undefined ? `* input overridden with --set or by the case ${values.case}` : '* input overridden with --set');
    for (const d of summary.diagnostics) out(formatDiagnostic(d));
  }
  return hasErrors(summary) ? 2 : 0;
}
