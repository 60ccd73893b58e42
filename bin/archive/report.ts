/**
 * FileReport: what one evaluated file contributes to an archive check. Small
 * enough to post from a worker thread for each of thousands of files.
 */
import type { Diagnostic, Summary } from '../../engine/index.js';
import type { CheckEntry } from '../../engine/summary.js';

export interface FileReport {
  file: string;
  checks: number;
  holds: number;
  fails: number;
  /** Checks that could not be judged (blocked by an error). */
  undecided: number;
  errors: number;
  /** Highest utilization among the checks that have one; null when none has. */
  worst: number | null;
  /** Whether that check holds, so its utilization prints in agreement with its verdict. */
  worstPass: boolean | null;
  /** The check with the highest utilization, as `name: source` or the source. */
  worstCheck: string | null;
  /** The checks that fail, to list after the table. */
  failing: CheckEntry[];
  /** The error diagnostics, to list after the table. */
  errorDiagnostics: Diagnostic[];
  /** Set when the file could not be read at all. */
  unreadable?: string;
  /** The whole summary, only when asked for (--json). */
  summary?: Summary;
}

/**
 * Condenses a summary into a report.
 * @example reportOf(summary, {full: false}).fails
 */
export function reportOf(summary: Summary, options: { full: boolean; unreadable?: string }): FileReport {
  let worst: number | null = null;
  let worstCheck: string | null = null;
  let worstPass: boolean | null = null;
  for (const c of summary.checks) {
    if (c.utilization !== null && (worst === null || c.utilization > worst)) {
      worst = c.utilization;
      worstPass = c.pass;
      worstCheck = c.name ? `${c.name}: ${c.source}` : c.source;
    }
  }
  const errorDiagnostics = summary.diagnostics.filter((d) => d.severity === 'error');
  return {
    file: summary.file,
    checks: summary.checks.length,
    holds: summary.checks.filter((c) => c.pass === true).length,
    fails: summary.checks.filter((c) => c.pass === false).length,
    undecided: summary.checks.filter((c) => c.pass === null).length,
    errors: errorDiagnostics.length,
    worst,
    worstPass,
    worstCheck,
    failing: summary.checks.filter((c) => c.pass === false),
    errorDiagnostics,
    ...(options.unreadable !== undefined ? { unreadable: options.unreadable } : {}),
    ...(options.full ? { summary } : {}),
  };
}

/** A report for a file that could not be evaluated at all (worker crash, unmatched pattern). */
export function failedReport(file: string, message: string, full: boolean): FileReport {
  const diagnostic: Diagnostic = {
    message, file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null, ruleId: 'io/read', severity: 'error',
  };
  return reportOf({ file, meta: {}, values: {}, checks: [], diagnostics: [diagnostic] }, { full, unreadable: message });
}
