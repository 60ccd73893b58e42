/**
 * `vaultbook check FILE|GLOB… [--set …] [--json] [--jobs N]`: evaluate and judge every check.
 * Exit 0 when all hold, 1 when any fails, 2 on any error or unreadable file.
 *
 * One file prints each verdict; several files (a firm's archive) are evaluated
 * in worker processes, each file on its own, and summed up in one table.
 */
import { formatDiagnostic, formatNumber } from '../../engine/index.js';
import { parse, readOverrides, SET_OPTION, JSON_OPTION, UsageError } from '../args.js';
import { loadAndEvaluate, hasErrors, type Loaded } from '../load.js';
import { expandPatterns } from '../archive/glob.js';
import { archiveCheck } from '../archive/check.js';
import { summariesJson } from '../archive/report.js';

export function verdictLine(c: { pass: boolean | null; utilization: number | null; name: string | null; source: string; line: number; description: string }): string {
  const mark = c.pass === null ? '  ?? NO VERDICT' : c.pass ? '  ok  holds   ' : '  !!  FAILS   ';
  const u = c.utilization === null ? '     ' : formatNumber(c.utilization, 3).padStart(5);
  const label = c.name ? `${c.name}: ${c.source}` : c.source;
  return `${mark} ${u}  ${label}  (line ${c.line})${c.description ? ` — ${c.description}` : ''}`;
}

export function exitCodeFor(results: Loaded[]): number {
  if (results.some((r) => hasErrors(r.summary))) return 2;
  if (results.some((r) => r.summary.checks.some((c) => c.pass === false))) return 1;
  return 0;
}

export async function checkCommand(args: string[], out: (s: string) => void): Promise<number> {
  const { values, positionals } = parse(args, { ...SET_OPTION, ...JSON_OPTION, jobs: { type: 'string', short: 'j' } });
  // --jobs counts the worker processes that evaluate files at once.
  if (positionals.length === 0) throw new UsageError('check needs at least one FILE');
  const overrides = readOverrides(values.set as string[] | undefined);
  const jobs = values.jobs === undefined ? undefined : Number(values.jobs);
  if (jobs !== undefined && !(Number.isInteger(jobs) && jobs >= 1)) throw new UsageError(`--jobs expects a whole number of worker processes, got "${values.jobs}"`);
  const expanded = await expandPatterns(positionals);
  if (expanded.files.length !== 1 || expanded.unmatched.length > 0) {
    return archiveCheck(expanded, { overrides, json: Boolean(values.json), jobs, out });
  }
  const results: Loaded[] = [];
  for (const file of expanded.files) results.push(await loadAndEvaluate(file, overrides));
  if (values.json) {
    const { text, failures } = summariesJson(results.map((r) => r.summary), results.length !== 1);
    out(text);
    return failures > 0 ? 2 : exitCodeFor(results);
  }
  for (const r of results) {
    const s = r.summary;
    if (results.length > 1) out(`\n${r.file}`);
    for (const c of s.checks) out(verdictLine(c));
    for (const d of s.diagnostics) out(formatDiagnostic(d));
    const holds = s.checks.filter((c) => c.pass === true).length;
    const fails = s.checks.filter((c) => c.pass === false).length;
    const errors = s.diagnostics.filter((d) => d.severity === 'error').length;
    const worst = Math.max(...s.checks.map((c) => c.utilization ?? 0), 0);
    out(`${r.file}: ${s.checks.length} checks, ${holds} hold, ${fails} fail; ${errors} error${errors === 1 ? '' : 's'}; highest utilization ${formatNumber(worst, 3)}`);
  }
  return exitCodeFor(results);
}
