/**
 * diffDocuments: two evaluated versions of a calc → what a reviewer must read.
 *
 * Inputs changed, results moved, checks flipped, cells added or removed, title
 * block edits, prose edits in summary, errors introduced. The result is plain
 * JSON (`vaultbook diff --json` prints it as is). Pure: no Node imports.
 */
import type { MathNode } from 'mathjs';
import type { Block, Cell, Diagnostic, Summary } from '../../engine/index.js';
import type { ValueEntry } from '../../engine/summary.js';
import { diffValue, type FieldChange } from './values.js';
import { diffChecks, isNewFailure, type CheckChange } from './checks.js';
import { diffProse, type ProseDiff } from './prose.js';
import { diffCases, type CasesDiff } from './cases.js';

export interface DiffInput {
  /** How this version is named in the output: a path, or `path@REV`. */
  label: string;
  summary: Summary;
  blocks: Block[];
  /** How each named cell is written; without them only values are compared. */
  cells?: CellDefinition[];
}

/** How a named cell is written: what a reviewer reads in the document, not what it evaluates to. */
export interface CellDefinition {
  name: string;
  kind: ValueEntry['kind'];
  line: number;
  /** The expression without a top-level `to UNIT`, as written. */
  formula: string;
  /** The same, in mathjs's own spelling, so that spacing alone is no change. */
  formula_key: string;
  description: string;
  /** `[lo, hi]` as written, or null. */
  range: string | null;
  /** The `to` unit, or null. */
  display_unit: string | null;
}

/** One named cell whose writing changed: its formula, description, allowed range or display unit. */
export interface DefinitionChange {
  name: string;
  kind: ValueEntry['kind'];
  line_old: number;
  line_new: number;
  what: 'formula' | 'description' | 'range' | 'display unit';
  old: string | null;
  new: string | null;
}

/**
 * The definitions of a compiled document's named cells.
 * @example definitionsOf(compile(text).graph.cells)
 */
export function definitionsOf(cells: Cell[]): CellDefinition[] {
  return cells.filter((c) => c.name !== null).map((c) => {
    const n = c.node as MathNode & { fn?: string; args?: MathNode[] };
    const bare = c.displayUnit !== null && n.type === 'OperatorNode' && n.fn === 'to' ? n.args![0]! : c.node;
    // Up to the last top-level ` to `: the display unit is reported on its own.
    const written = c.displayUnit !== null ? (/^([^]*)\s+to\s+[^]*$/.exec(c.source)?.[1] ?? c.source) : c.source;
    return {
      name: c.name!, kind: c.kind, line: c.span.start.line, formula: written.replace(/\s+/g, ' ').trim(), formula_key: bare.toString(),
      description: c.description, range: c.range ? `[${c.range.lo}, ${c.range.hi}]` : null, display_unit: c.displayUnit,
    };
  });
}

/** What changed in how the cells present in both versions are written. */
function diffDefinitions(a: CellDefinition[], b: CellDefinition[]): DefinitionChange[] {
  const old = new Map(a.map((d) => [d.name, d]));
  const out: DefinitionChange[] = [];
  for (const d of b) {
    const o = old.get(d.name);
    if (!o) continue;
    const at = { name: d.name, kind: d.kind, line_old: o.line, line_new: d.line };
    // An input's expression is its value, reported under inputs; a check's under checks.
    if (o.formula_key !== d.formula_key && d.kind !== 'given' && o.kind !== 'given' && d.kind !== 'check') out.push({ ...at, what: 'formula', old: o.formula, new: d.formula });
    if (o.description !== d.description) out.push({ ...at, what: 'description', old: o.description || null, new: d.description || null });
    if (o.range !== d.range) out.push({ ...at, what: 'range', old: o.range, new: d.range });
    if (o.display_unit !== d.display_unit) out.push({ ...at, what: 'display unit', old: o.display_unit, new: d.display_unit });
  }
  return out;
}

export interface ValueChange {
  name: string;
  kind: ValueEntry['kind'];
  /** The kind in the old version, when it differs (an input that became a calc…). */
  old_kind?: ValueEntry['kind'];
  line_old: number;
  line_new: number;
  fields: FieldChange[];
}

export interface CellPresence {
  name: string;
  kind: ValueEntry['kind'];
  line: number;
  text: string;
}

export interface DocumentDiff {
  old: { label: string; errors: number };
  new: { label: string; errors: number };
  meta: Array<{ key: string; old: unknown; new: unknown }>;
  inputs: ValueChange[];
  results: ValueChange[];
  figures: ValueChange[];
  checks: CheckChange[];
  /** Formulas, descriptions, ranges and display units that changed, for cells in both versions. */
  definitions: DefinitionChange[];
  added: CellPresence[];
  removed: CellPresence[];
  prose: ProseDiff;
  /** Error diagnostics of the new version whose message the old one did not have. */
  errors_introduced: Diagnostic[];
  /** Checks that fail in the new version and did not before (flipped, or added failing). */
  new_failures: number;
  /** When either version has cases: each check compared case by case, and changes of governing case. */
  cases?: CasesDiff;
}

export interface DiffOptions {
  /** Relative tolerance for numbers, absolute for utilizations (default 1e-9: only real moves). */
  tol?: number;
}

const errorsOf = (s: Summary) => s.diagnostics.filter((d) => d.severity === 'error');
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

/**
 * Compares two evaluated versions of a calc document.
 * @example diffDocuments({label: 'old.md', summary, blocks}, {label: 'new.md', summary: s2, blocks: b2})
 */
export function diffDocuments(a: DiffInput, b: DiffInput, options: DiffOptions = {}): DocumentDiff {
  const tol = options.tol ?? 1e-9;
  const va = a.summary.values, vb = b.summary.values;
  const inputs: ValueChange[] = [], results: ValueChange[] = [], figures: ValueChange[] = [];
  const added: CellPresence[] = [], removed: CellPresence[] = [];
  const presence = (name: string, e: ValueEntry): CellPresence => ({ name, kind: e.kind, line: e.line, text: e.text });

  for (const [name, eb] of Object.entries(vb)) {
    const ea = va[name];
    // Checks are compared through summary.checks, which also holds the unnamed ones.
    if (!ea) { if (eb.kind !== 'check') added.push(presence(name, eb)); continue; }
    if (eb.kind === 'check' && ea.kind === 'check') continue;
    const fields = diffValue(ea, eb, tol);
    if (fields.length === 0 && ea.kind === eb.kind) continue;
    const change: ValueChange = {
      name, kind: eb.kind, line_old: ea.line, line_new: eb.line, fields,
      ...(ea.kind !== eb.kind ? { old_kind: ea.kind } : {}),
    };
    if (eb.kind === 'given' || ea.kind === 'given') inputs.push(change);
    else if (eb.kind === 'figure') figures.push(change);
    else results.push(change);
  }
  for (const [name, ea] of Object.entries(va)) {
    if (!vb[name] && ea.kind !== 'check') removed.push(presence(name, ea));
  }

  const checks = diffChecks(a.summary.checks, b.summary.checks, tol);
  for (const c of checks) {
    if (c.change === 'added') added.push({ name: c.key, kind: 'check', line: c.new!.line, text: c.new!.verdict });
    if (c.change === 'removed') removed.push({ name: c.key, kind: 'check', line: c.old!.line, text: c.old!.verdict });
  }

  const meta: DocumentDiff['meta'] = [];
  for (const key of new Set([...Object.keys(a.summary.meta), ...Object.keys(b.summary.meta)])) {
    const x = a.summary.meta[key], y = b.summary.meta[key];
    if (!same(x, y)) meta.push({ key, old: x ?? null, new: y ?? null });
  }

  const oldMessages = new Set(errorsOf(a.summary).map((d) => `${d.ruleId} ${d.cellId} ${d.message.replaceAll(a.label, '')}`));
  const errors_introduced = errorsOf(b.summary).filter((d) => !oldMessages.has(`${d.ruleId} ${d.cellId} ${d.message.replaceAll(b.label, '')}`));

  return {
    old: { label: a.label, errors: errorsOf(a.summary).length },
    new: { label: b.label, errors: errorsOf(b.summary).length },
    meta, inputs, results, figures, checks, definitions: diffDefinitions(a.cells ?? [], b.cells ?? []), added, removed,
    prose: diffProse(a.blocks, b.blocks),
    errors_introduced,
    new_failures: checks.filter(isNewFailure).length,
    ...(a.summary.cases || b.summary.cases ? { cases: diffCases(a.summary.checks, b.summary.checks, tol) } : {}),
  };
}

/**
 * The exit code of `vaultbook diff`: 2 when the new version has errors,
 * 1 when a check fails that did not before, 0 otherwise.
 */
export function diffExitCode(d: DocumentDiff): number {
  if (d.new.errors > 0) return 2;
  return d.new_failures > 0 ? 1 : 0;
}
