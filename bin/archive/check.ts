/**
 * archiveCheck: the several-files half of `vaultbook check` — evaluate on the
 * worker pool, draw progress on a terminal, print one table and the findings.
 */
import { formatDiagnostic, formatUtilization } from '../../engine/index.js';
import { table } from '../table.js';
import type { Expansion } from './glob.js';
import { evaluateArchive, type ArchiveOptions } from './pool.js';
import { progressBar, type ProgressStream } from './progress.js';
import { failedReport, summariesJson, type FileReport } from './report.js';

export interface ArchiveCheckOptions {
  overrides: Record<string, string>;
  json: boolean;
  jobs?: number;
  out: (s: string) => void;
  /** Where the progress bar goes (default process.stderr; drawn only on a terminal). */
  progress?: ProgressStream;
  /** The worker pool's limits and code (tests set these). */
  pool?: Pick<ArchiveOptions, 'workerEntry' | 'fileTimeoutMs' | 'workerMemoryMb'>;
}

/** 0 when every check holds, 1 when any fails, 2 when any file has an error or could not be read. */
export function archiveExitCode(reports: FileReport[]): number {
  if (reports.some((r) => r.errors > 0)) return 2;
  if (reports.some((r) => r.fails > 0)) return 1;
  return 0;
}

function verdictOf(r: FileReport): string {
  if (r.unreadable !== undefined) return 'UNREADABLE';
  if (r.errors > 0) return 'ERRORS';
  if (r.fails > 0) return 'FAILS';
  if (r.undecided > 0) return 'NOT EVALUATED';
  return r.checks === 0 ? 'no checks' : 'holds';
}

/**
 * Checks many files and prints the archive table.
 * @returns the exit code
 */
export async function archiveCheck(expanded: Expansion, options: ArchiveCheckOptions): Promise<number> {
  const { out } = options;
  const bar = progressBar(options.progress ?? process.stderr);
  const tally = { fails: 0, errors: 0 };
  const started = Date.now();
  const { reports, workerFailure } = await evaluateArchive(expanded.files, {
    ...options.pool, overrides: options.overrides, jobs: options.jobs, full: options.json,
    onReport: (r, done, total) => {
      if (r.fails > 0) tally.fails++;
      if (r.errors > 0) tally.errors++;
      bar.update(done, total, tally);
    },
  });
  bar.finish();
  if (workerFailure !== undefined) process.stderr.write(`vaultbook check: note: worker processes could not start (${workerFailure}); the files were checked in this process alone, so one file that crashes it ends the run\n`);
  for (const pattern of expanded.unmatched) reports.push(failedReport(pattern, `no file matches ${pattern}`, options.json));
  if (options.json) {
    const { text, failures } = summariesJson(reports.map((r) => r.summary!));
    out(text);
    return failures > 0 ? 2 : archiveExitCode(reports);
  }

  const rows = reports.map((r) => [
    r.file, String(r.checks), String(r.fails), String(r.errors), r.worst === null ? '—' : formatUtilization(r.worst, r.worstPass), verdictOf(r),
  ]);
  out(table(['file', 'checks', 'fails', 'errors', 'highest utilization', 'verdict'], rows));

  const failing = reports.flatMap((r) => r.failing.map((c) => `${r.file}:${c.line}  ${c.name ? `${c.name}: ` : ''}${c.source}  utilization ${c.utilization === null ? '—' : formatUtilization(c.utilization, c.pass)}${c.description ? ` — ${c.description}` : ''}`));
  if (failing.length > 0) out(`\nFailing checks (${failing.length}):\n${failing.map((l) => `  ${l}`).join('\n')}`);
  const errors = reports.flatMap((r) => r.errorDiagnostics.map(formatDiagnostic));
  if (errors.length > 0) out(`\nErrors (${errors.length}):\n${errors.map((l) => `  ${l}`).join('\n')}`);

  const sum = (f: (r: FileReport) => number) => reports.reduce((a, r) => a + f(r), 0);
  const worst = reports.reduce<FileReport | null>((w, r) => (r.worst !== null && (w === null || r.worst > w.worst!) ? r : w), null);
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? '' : 's'}`;
  out([
    `\n${plural(reports.length, 'file')}: ${plural(sum((r) => r.checks), 'check')}, ${sum((r) => r.holds)} hold, ${sum((r) => r.fails)} fail`,
    ` (in ${plural(reports.filter((r) => r.fails > 0).length, 'file')})`,
    sum((r) => r.undecided) ? `, ${sum((r) => r.undecided)} not evaluated` : '',
    `; ${plural(sum((r) => r.errors), 'error')} (in ${plural(reports.filter((r) => r.errors > 0).length, 'file')})`,
    worst ? `; highest utilization ${formatUtilization(worst.worst!, worst.worstPass)} in ${worst.file}` : '',
    `; ${((Date.now() - started) / 1000).toFixed(1)} s`,
  ].join(''));
  return archiveExitCode(reports);
}
