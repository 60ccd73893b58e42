/**
 * Every problem the engine finds is a Diagnostic that knows where it is.
 */
export type Severity = 'error' | 'warning' | 'info';

export type RuleId =
  | 'parse/syntax' | 'parse/front-matter' | 'parse/cell' | 'parse/name'
  | 'graph/cycle' | 'graph/unknown-name' | 'graph/unknown-field' | 'graph/duplicate' | 'graph/shadow-unit' | 'graph/shadow-function'
  | 'units/mismatch' | 'kernel/domain' | 'kernel/argument' | 'value/non-finite' | 'value/range'
  | 'value/type' | 'eval/error' | 'sandbox/refused' | 'set/unknown-input' | 'set/syntax' | 'io/read'
  | 'cases/syntax' | 'cases/unknown-input' | 'cases/dimension' | 'cases/empty-family' | 'cases/duplicate' | 'cases/limit' | 'cases/unknown-case'
  | 'explain/unknown-name'
  | 'sandbox/limit'
  | 'io/not-text' | 'doc/no-cells';

export interface Diagnostic {
  message: string;
  file: string;
  line: number;
  column: number;
  endLine: number;
  endColumn: number;
  cellId: string | null;
  ruleId: RuleId;
  severity: Severity;
  actual?: string;
  expected?: string;
  note?: string;
}

/** Shared by every stage: the file being compiled and the diagnostics found so far. */
export interface StageContext {
  file: string;
  diagnostics: Diagnostic[];
  /** Significant figures for numbers quoted in messages (the document's, default 4). */
  sigfigs?: number;
  /** The document's system of units, for a kernel's refusal whose call carries no quantity of its own (default 'si'). */
  units?: 'si' | 'us';
}

/**
 * One line for a terminal: `file:line:column  message  [ruleId]`.
 * @example formatDiagnostic(d) // "calc.md:7:3  unknown name "spn"; did you mean "span"?  [graph/unknown-name]"
 */
export function formatDiagnostic(d: Diagnostic): string {
  const note = d.note ? `\n    ${d.note}` : '';
  return `${d.file}:${d.line}:${d.column}  ${d.severity}: ${d.message}  [${d.ruleId}]${note}`;
}
