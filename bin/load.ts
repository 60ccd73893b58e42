/**
 * Reads and evaluates a calc file for a command; unreadable files become diagnostics, not crashes.
 */
import { readFile } from 'node:fs/promises';
import { evaluateDocument, type Summary } from '../engine/index.js';

export interface Loaded {
  file: string;
  summary: Summary;
  /** Set when the file could not be read at all. */
  unreadable?: string;
}

export async function loadAndEvaluate(file: string, overrides: Record<string, string>): Promise<Loaded> {
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
  const { summary } = await evaluateDocument(text, { file, overrides });
  return { file, summary };
}

export function hasErrors(s: Summary): boolean {
  return s.diagnostics.some((d) => d.severity === 'error');
}
