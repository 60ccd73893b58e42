/**
 * `vaultbook check FILE|GLOB… [--set …] [--json] [--jobs N]`: evaluate and judge every check.
 * Exit 0 when all hold, 1 when any fails, 2 on any error or unreadable file.
 *
 * One file prints each verdict; several files (a firm's archive) are evaluated
 * in worker processes, each file on its own, and summed up in one table.
 */
import { formatDiagnostic, formatUtilization } from '../../engine/index.js';
import { parse, readOverrides, SET_OPTION, JSON_OPTION, CASE_OPTION, UsageError } from '../args.js';
import { availableParallelism } from 'node:os';
import { loadAndEvaluate, hasErrors, type Loaded } from '../load.js';
import type { CheckEntry } from '../../engine/summary.js';
import { withoutLimitMarker } from '../../engine/cases/read.js';
import { expandPatterns } from '../archive/glob.js';
import { archiveCheck } from '../archive/check.js';
import { summariesJson } from '../archive/report.js';

/** A check limited to cases other than the one asked for: judged in no case here, which is not "not evaluated". */
function notJudged(c: { cases?: unknown[] }): boolean {
  return c.cases !== undefined && c.cases.length === 0;
}

export function verdictLine(c: { pass: boolean | null; utilization: number | null; name: string | null; source: string; line: number; description: string; governing?: { case: string | null }; cases?: unknown[]; judged_in?: string[]; reason?: string }, withCases = false): string {
  const mark = notJudged(c) ? '  --  not judged in this case' : c.pass === null ? '  ??  NOT EVALUATED' : c.pass ? '  ok  holds        ' : '  !!  FAILS        ';
  const u = c.utilization === null ? '     ' : formatUtilization(c.utilization, c.pass).padStart(5);
  const label = c.name ? `${c.name}: ${c.source}` : c.source;
  // The [in …] marker is said in words, as on the sheet ("judged in STR, axle only"), never printed raw.
  const limit = c.judged_in?.length ? `judged in ${c.judged_in.join(', ')} only` : '';
  // A check that holds everywhere without utilizations to compare the cases by has no governing case.
  const governs = !withCases ? (limit ? `  [${limit}]` : '')
    : c.governing ? `  [governing: ${c.governing.case ?? 'as written'}${limit ? ` (${limit})` : ''}]`
    : c.pass === true ? `  [holds in every case; no governing case${limit ? ` (${limit})` : ''}]` : limit ? `  [${limit}]` : '';
  return `${mark} ${u}  ${label}  (line ${c.line})${c.description ? ` — ${withoutLimitMarker(c.description)}` : ''}${governs}${c.reason ? `\n                     ${c.reason}` : ''}`;
}

export function exitCodeFor(results: Loaded[]): number {
  if (results.some((r) => hasErrors(r.summary))) return 2;
  if (results.some((r) => r.summary.checks.some((c) => c.pass === false))) return 1;
  return 0;
}

export async function checkCommand(args: string[], out: (s: string) => void): Promise<number> {
  const { values, positionals } = parse(args, { ...SET_OPTION, ...JSON_OPTION, ...CASE_OPTION, jobs: { type: 'string', short: 'j' } });
  // --jobs counts the worker processes that evaluate files at once (and the threads for a large family of cases).
  if (positionals.length === 0) throw new UsageError('check needs at least one FILE');
  const overrides = readOverrides(values.set as string[] | undefined);
  const jobs = values.jobs === undefined ? undefined : Number(values.jobs);
  if (jobs !== undefined && !(Number.isInteger(jobs) && jobs >= 1)) throw new UsageError(`--jobs expects a whole number of worker processes, got "${values.jobs}"`);
  const expanded = await expandPatterns(positionals);
  if (values.case !== undefined && (expanded.files.length !== 1 || expanded.unmatched.length > 0)) throw new UsageError('--case applies to one FILE');
  if (expanded.files.length !== 1 || expanded.unmatched.length > 0) {
    return archiveCheck(expanded, { overrides, json: Boolean(values.json), jobs, out });
  }
  const results: Loaded[] = [];
  const caseOptions = { ...(values.case !== undefined ? { case: values.case as string } : {}), caseJobs: jobs ?? availableParallelism() };
  for (const file of expanded.files) results.push(await loadAndEvaluate(file, overrides, caseOptions));
  if (values.json) {
    const { text, failures } = summariesJson(results.map((r) => r.summary), results.length !== 1);
    out(text);
    return failures > 0 ? 2 : exitCodeFor(results);
  }
  for (const r of results) {
    const s = r.summary;
    // A --case that names no case: only the error, not the document's results as if it were one.
    const unknownCase = s.diagnostics.filter((d) => d.ruleId === 'cases/unknown-case' && d.message.startsWith('--case '));
    if (values.case !== undefined && unknownCase.length) {
      for (const d of unknownCase) out(formatDiagnostic(d));
      continue;
    }
    if (results.length > 1) out(`\n${r.file}`);
    const cases = s.cases ?? [];
    if (cases.length) out(values.case !== undefined ? `case ${values.case}, as if its inputs were written in:` : `judged as written and in ${cases.length} case${cases.length === 1 ? '' : 's'}; each verdict is the worst:`);
    for (const c of s.checks) out(verdictLine(c, cases.length > 0 && values.case === undefined));
    for (const d of s.diagnostics) out(formatDiagnostic(d));
    const holds = s.checks.filter((c) => c.pass === true).length;
    const fails = s.checks.filter((c) => c.pass === false).length;
    const errors = s.diagnostics.filter((d) => d.severity === 'error').length;
    const worst = s.checks.reduce<CheckEntry | null>((w, c) => (c.utilization !== null && (w === null || c.utilization > w.utilization!) ? c : w), null);
    const highest = worst ? formatUtilization(worst.utilization!, worst.pass) : '—';
    const open = s.checks.filter((c) => c.pass === null && !notJudged(c)).length;
    const off = s.checks.filter(notJudged).length;
    out(`${r.file}: ${s.checks.length} checks, ${holds} hold, ${fails} fail${open ? `, ${open} not evaluated` : ''}${off ? `, ${off} not judged in this case` : ''}; ${errors} error${errors === 1 ? '' : 's'}; highest utilization ${highest}`);
  }
  return exitCodeFor(results);
}
