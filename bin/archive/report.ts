/**
 * FileReport: what one evaluated file contributes to an archive check. Small
 * enough to send from a worker process for each of thousands of files.
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

/**
 * A report for a file that could not be evaluated at all: unreadable or an unmatched pattern
 * ('io/read'), or stopped while evaluating (a worker that died or ran past the time limit, 'eval/error').
 */
export function failedReport(file: string, message: string, full: boolean, ruleId: 'io/read' | 'eval/error' = 'io/read'): FileReport {
  const diagnostic: Diagnostic = {
    message, file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null, ruleId, severity: 'error',
  };
  return reportOf({ file, meta: {}, values: {}, checks: [], diagnostics: [diagnostic] }, { full, ...(ruleId === 'io/read' ? { unreadable: message } : {}) });
}

/**
 * Summaries as JSON, each written on its own: a summary that cannot be written (a value JSON
 * cannot hold) is replaced by one with that error, so one file never stops the others being written.
 * @returns the text (one summary, or a list when `list`) and how many summaries were replaced
 * @example const {text, failures} = summariesJson([summary], false)
 */
export function summariesJson(summaries: Summary[], list = true): { text: string; failures: number } {
  let failures = 0;
  const parts = summaries.map((summary) => {
    try {
      return JSON.stringify(summary, null, 2);
    } catch (e) {
      failures++;
      const diagnostic: Diagnostic = {
        message: `the results of this file cannot be written as JSON (${(e as Error).message.split('\n')[0]}); nothing of it is reported`,
        file: summary.file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null, ruleId: 'eval/error', severity: 'error',
      };
      return JSON.stringify({ file: String(summary.file), meta: {}, values: {}, checks: [], diagnostics: [diagnostic] }, null, 2);
    }
  });
  if (!list) return { text: parts.join('\n'), failures };
  return { text: parts.length === 0 ? '[]' : `[\n${parts.map((p) => p.replace(/^/gm, '  ')).join(',\n')}\n]`, failures };
}
