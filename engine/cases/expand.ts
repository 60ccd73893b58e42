/**
 * expandCases: CaseBook + the document's values as written → the list of cases to evaluate.
 *
 * Each value expression is evaluated with the document's values (so `0.05 * L` is the
 * document's span); a value that is a list makes the line a family, one case per element
 * (`axle[1]` …), and several lists give every combination. Problems found here (a value of
 * the wrong dimension, an empty family, more cases than MAX_CASES) are reported on the line.
 */
import type { Unit } from 'mathjs';
import { evaluateNode } from '../sandbox/index.js';
import { math, parseExpression } from '../../cells/math.js';
import type { CaseLine, CellState, CompiledDocument } from '../types.js';
import type { Diagnostic, RuleId } from '../diagnostic.js';
import { formatValue } from '../values/format.js';
import { steps } from './steps.js';
import { checkRange } from '../runtime/evaluate.js';

/** The most cases a document may ask for (the document as written not counted). */
export const MAX_CASES = 1000;

/** One case: the inputs it changes, as exact value text a `--set` would take. */
export interface Case {
  /** `EQU`, or `axle[3]` for the third member of the family `axle`. */
  name: string;
  /** The line's name when the case belongs to a family, else null. */
  family: string | null;
  /** 1-based position in its family, else null. */
  index: number | null;
  /** Input → value text; parsing it gives exactly the value the case expression gave. */
  overrides: Record<string, string>;
  /** Input → the value the case is evaluated with (for the sheet, and plotting a family against the swept value); an input set with --set has its --set value. */
  values: Record<string, unknown>;
  /** Input set with --set → the value the case itself gives, which --set overrides. */
  setOver: Record<string, unknown>;
  /** The inputs whose value runs through a list on this line (empty for a single case). */
  swept: string[];
  description: string;
  line: number;
}

export interface Expansion {
  cases: Case[];
  diagnostics: Diagnostic[];
}

/**
 * Evaluates every case line and expands its families.
 * @param base the document's states as written (with --set applied)
 * @param pinned inputs set with --set: they stay as set in every case
 * @example expandCases(doc, states, new Set()).cases.map((c) => c.name) // ['EQU', 'STR', 'axle[1]', …]
 */
export function expandCases(doc: CompiledDocument, base: Map<string, CellState>, pinned: ReadonlySet<string> = new Set()): Expansion {
  const scope = new Map<string, unknown>([['steps', steps]]);
  for (const cell of doc.graph.cells) {
    const s = base.get(cell.id);
    if (cell.name && s?.status === 'ok') scope.set(cell.name, s.value);
  }
  const cases: Case[] = [];
  const diagnostics: Diagnostic[] = [];
  let total = 0;
  for (const line of doc.cases.lines) {
    const say = (ruleId: RuleId, message: string, column = 1, severity: Diagnostic['severity'] = 'error') => diagnostics.push({
      message: `${line.name}: ${message}`, file: doc.file, line: line.span.start.line, column, endLine: line.span.end.line,
      endColumn: line.span.end.column, cellId: line.name, ruleId, severity,
    });
    const lists = evaluateLine(line, doc, base, scope, say);
    if (!lists) continue;
    for (const l of lists) if (!pinned.has(l.input)) warnOutOfRange(doc, l, say);
    const count = lists.reduce((n, l) => n * l.values.length, 1);
    if (count === 0) {
      const empty = lists.find((l) => l.values.length === 0)!;
      say('cases/empty-family', `the list for ${empty.input} is empty, so the family has no case`, empty.column);
      continue;
    }
    total += count;
    if (total > MAX_CASES) {
      const sizes = lists.filter((l) => l.isList).map((l) => l.values.length);
      say('cases/limit', `this line asks for ${count} case${count === 1 ? '' : 's'}${sizes.length > 1 ? ` (${sizes.join(' × ')})` : ''}, `
        + `${total} in the document so far; at most ${MAX_CASES} are evaluated. Use fewer steps.`);
      return { cases: [], diagnostics };
    }
    const isFamily = lists.some((l) => l.isList);
    const swept = lists.filter((l) => l.isList).map((l) => l.input);
    for (let k = 0; k < count; k++) {
      const overrides: Record<string, string> = {};
      const values: Record<string, unknown> = {};
      const setOver: Record<string, unknown> = {};
      let rest = k;
      for (let j = lists.length - 1; j >= 0; j--) {
        const l = lists[j]!;
        const v = l.values[rest % l.values.length]!;
        rest = Math.floor(rest / l.values.length);
        if (pinned.has(l.input)) {
          // --set applies on top of every case: the case runs with the --set value.
          values[l.input] = l.used;
          setOver[l.input] = v.value;
        } else {
          values[l.input] = v.value;
          overrides[l.input] = v.text;
        }
      }
      cases.push({
        name: isFamily ? `${line.name}[${k + 1}]` : line.name, family: isFamily ? line.name : null, index: isFamily ? k + 1 : null,
        overrides: ordered(overrides, line), values: ordered(values, line), setOver: ordered(setOver, line), swept, description: line.description, line: line.span.start.line,
      });
    }
  }
  return { cases, diagnostics };
}

/** A warning on the case line (once per input, a family's count) when a value lies outside the input's `[lo, hi]`. */
function warnOutOfRange(doc: CompiledDocument, l: ValueList, say: (r: RuleId, m: string, c?: number, severity?: Diagnostic['severity']) => void): void {
  const given = doc.graph.byId.get(l.input);
  if (!given?.range) return;
  const outside = l.values.map((v) => checkRange(given, v.value, { file: doc.file, diagnostics: [] })).filter((d): d is Diagnostic => d !== null);
  if (!outside.length) return;
  const more = outside.length > 1 ? ` (and ${outside.length - 1} more of the ${l.values.length} values)` : '';
  say('value/range', `${outside[0]!.message}${more}`, l.column, 'warning');
}

function ordered<T>(record: Record<string, T>, line: CaseLine): Record<string, T> {
  const out: Record<string, T> = {};
  for (const v of line.values) if (v.input in record) out[v.input] = record[v.input]!;
  return out;
}

interface ValueList {
  input: string;
  column: number;
  isList: boolean;
  values: Array<{ value: unknown; text: string }>;
  /** The input's value in the document (with --set applied). */
  used: unknown;
}

function evaluateLine(line: CaseLine, doc: CompiledDocument, base: Map<string, CellState>, scope: Map<string, unknown>, say: (r: RuleId, m: string, c?: number) => void): ValueList[] | null {
  const lists: ValueList[] = [];
  for (const v of line.values) {
    let value: unknown;
    try {
      value = evaluateNode(v.node, scope);
    } catch (e) {
      const missing = doc.graph.cells.find((c) => c.name && !scope.has(c.name) && v.source.includes(c.name) && base.get(c.id)?.status !== 'ok');
      say('eval/error', missing ? `${v.input} is not computed because ${missing.name} failed` : `cannot evaluate ${v.input}: ${(e as Error).message}`, v.column);
      return null;
    }
    if (math.isMatrix(value)) value = (value as { toArray(): unknown[] }).toArray();
    const isList = Array.isArray(value);
    const elements = isList ? (value as unknown[]) : [value];
    const given = doc.graph.byId.get(v.input)!;
    const current = base.get(given.id);
    const values: ValueList['values'] = [];
    for (const element of elements) {
      const mismatch = current?.status === 'ok' ? dimensionMismatch(element, current.value) : null;
      if (mismatch) { say('cases/dimension', `${v.input}: ${mismatch}`, v.column); return null; }
      const text = exactText(element);
      if (text === null) { say('cases/dimension', `${v.input}: a case value must be a number, a quantity, true/false or text; this gives ${formatValue(element)}`, v.column); return null; }
      values.push({ value: element, text });
    }
    lists.push({ input: v.input, column: v.column, isList, values, used: current?.status === 'ok' ? current.value : undefined });
  }
  return lists;
}

/** Why a case value cannot stand in for an input's value, or null when it can. */
function dimensionMismatch(value: unknown, written: unknown): string | null {
  const describe = (x: unknown) => (math.isUnit(x) ? `a quantity in ${(x as Unit).formatUnits()}` : typeof x === 'number' ? 'a plain number' : `a ${typeof x}`);
  if (math.isUnit(written) && math.isUnit(value)) {
    return (written as Unit).equalBase(value as Unit) ? null
      : `the value ${formatValue(value)} does not have the dimension of the document's ${formatValue(written)}`;
  }
  const kind = (x: unknown) => (math.isUnit(x) ? 'unit' : typeof x);
  if (kind(value) !== kind(written)) return `the document's value is ${describe(written)} (${formatValue(written)}); this gives ${describe(value)} (${formatValue(value)})`;
  return null;
}

/**
 * The shortest text that parses back to exactly this value, so a case gives the same numbers as
 * the document with that text written in. Null for values an input cannot hold.
 * @example exactText(parse('0.05 * 6.4 m').evaluate()) // '0.32000000000000006 m'
 */
export function exactText(value: unknown): string | null {
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : null;
  if (typeof value === 'boolean') return String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (!math.isUnit(value)) return null;
  const u = value as Unit;
  if (typeof u.value !== 'number' || !Number.isFinite(u.value)) return null;
  const units = u.formatUnits();
  const own = u.toNumber();
  const candidates = [`${own} ${units}`, `${own.toPrecision(17)} ${units}`];
  const si = u.toSI();
  candidates.push(`${si.toNumber()} ${si.formatUnits()}`);
  for (const text of candidates) {
    try {
      const back = evaluateNode(parseExpression(text)) as Unit;
      if (math.isUnit(back) && back.value === u.value && back.equalBase(u)) return text;
    } catch { /* try the next form */ }
  }
  return null;
}
