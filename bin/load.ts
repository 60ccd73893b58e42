/**
 * Reads and evaluates a calc file for a command; unreadable files become diagnostics, not crashes.
 */
import { readFile } from 'node:fs/promises';
import { evaluateDocument, type Summary } from '../engine/index.js';
import { casePool } from './archive/cases.js';

export interface Loaded {
  file: string;
  summary: Summary;
  /** Set when the file could not be read at all. */
  unreadable?: string;
}

export interface LoadOptions {
  /** `--case NAME`: evaluate this case as if written in. */
  case?: string;
  /** Threads for a large family of cases (the main thread alone when absent or 1). */
  caseJobs?: number;
}

export async function loadAndEvaluate(file: string, overrides: Record<string, string>, options: LoadOptions = {}): Promise<Loaded> {
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (e) {
    const reason = (e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message;
    const diagnostic = {
      message: `cannot read ${file}: ${reason}`, file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null,
      ruleId: 'io/read' as const, severity: 'error' as const, cell: null,
    };
    return { file, unreadable: reason, summary: { file, meta: {}, values: {}, checks: [], diagnostics: [diagnostic] } };
  }
  const caseRunner = options.caseJobs && options.caseJobs > 1 ? casePool(text, file, overrides, { jobs: options.caseJobs }) : undefined;
  const { summary } = await evaluateDocument(text, { file, overrides, ...(options.case !== undefined ? { case: options.case } : {}), ...(caseRunner ? { caseRunner } : {}) });
  return { file, summary };
}

export function hasErrors(s: Summary): boolean {
  return s.diagnostics.some((d) => d.severity === 'error');
}
