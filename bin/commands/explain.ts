/**
 * `vaultbook explain FILE [CHECK ...] [--json] [--set …] [--case NAME] [--jobs N]`: what drives each check.
 * For each check (or named value asked for): the given inputs it depends on, ranked by the swing
 * of its utilization at the input ±10 %, with the elasticity d ln u / d ln x beside each.
 * Exit 2 on any error diagnostic or unreadable file, else 0 (a failing check is not an error here).
 */
import { readFile } from 'node:fs/promises';
import { formatDiagnostic, formatNumber } from '../../engine/index.js';
import { availableParallelism } from 'node:os';
import type { InputDriver, Explanation } from '../../engine/drivers/index.js';
import { explainOnThreads } from '../explain/threads.js';
import { parse, readOverrides, SET_OPTION, JSON_OPTION, CASE_OPTION, UsageError } from '../args.js';
import { table } from '../table.js';

const num = (x: number | null | undefined, digits = 3): string => (x === null || x === undefined ? '–' : formatNumber(x, digits));
const verdict = (p: boolean | null | undefined): string => (p === true ? 'holds' : p === false ? 'FAILS' : '–');

function inputRow(i: InputDriver, isCheck: boolean): string[] {
  const kink = i.kinked ? `kinked: ${num(i.elasticity_minus)} below, ${num(i.elasticity_plus)} above` : '';
  const at = isCheck
    ? (i.u_minus === null && i.u_plus === null ? [verdict(i.pass_minus), verdict(i.pass_plus)] : [num(i.u_minus), num(i.u_plus)])
    : [i.value_minus ?? '–', i.value_plus ?? '–'];
  return [i.name, i.text, i.step, num(i.elasticity), ...at, [kink, i.note].filter(Boolean).join('; ')];
}

/** The explanation as text for a terminal. */
export function formatExplanation(e: Explanation): string {
  const parts: string[] = [];
  const caseWords = (c: string | null) => (c === null ? '' : `  [in case ${c}, its governing case]`);
  for (const c of e.checks) {
    parts.push(`${c.name === c.source ? c.source : `${c.name}: ${c.source}`}  (line ${c.line})  utilization ${num(c.utilization)}, ${verdict(c.pass)}${caseWords(c.case)}`);
    parts.push(c.inputs.length ? table(['input', 'value', 'moved by', 'elasticity', 'u at −', 'u at +'], c.inputs.map((i) => inputRow(i, true)).map((r) => r.slice(0, 6).concat(r[6] ? [r[6]] : []))) : '  depends on no input');
    parts.push('');
  }
  for (const v of e.values) {
    parts.push(`${v.name} = ${v.text}  (line ${v.line})`);
    parts.push(v.inputs.length ? table(['input', 'value', 'moved by', 'elasticity', 'value at −', 'value at +'], v.inputs.map((i) => inputRow(i, false)).map((r) => r.slice(0, 6).concat(r[6] ? [r[6]] : []))) : '  depends on no input');
    parts.push('');
  }
  parts.push('Ranked by the swing: the range of the utilization (or value) with the input moved by −10 % and +10 %. '
    + 'Elasticity: d ln u / d ln x by a central difference (±0.1 %); "kinked" where the one-sided values differ. '
    + 'An input at zero moves by the absolute step shown.');
  return parts.join('\n');
}

export async function explainCommand(args: string[], out: (s: string) => void): Promise<number> {
  const { values, positionals } = parse(args, { ...SET_OPTION, ...JSON_OPTION, ...CASE_OPTION, jobs: { type: 'string', short: 'j' } });
  if (positionals.length === 0) throw new UsageError('explain needs a FILE, optionally followed by the checks or values to explain');
  const [file, ...targets] = positionals as [string, ...string[]];
  const overrides = readOverrides(values.set as string[] | undefined);
  const jobs = values.jobs === undefined ? availableParallelism() : Number(values.jobs);
  if (!(Number.isInteger(jobs) && jobs >= 1)) throw new UsageError(`--jobs expects a whole number of threads, got "${values.jobs}"`);
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch (e) {
    const reason = (e as NodeJS.ErrnoException).code === 'ENOENT' ? 'no such file' : (e as Error).message;
    const d = { message: `cannot read ${file}: ${reason}`, file, line: 1, column: 1, endLine: 1, endColumn: 1, cellId: null, ruleId: 'io/read' as const, severity: 'error' as const };
    out(values.json ? JSON.stringify({ file, checks: [], diagnostics: [{ ...d, cell: null }] }, null, 2) : formatDiagnostic(d));
    return 2;
  }
  // The moves are spread over threads (the main one included); the result is the same on one.
  const e = await explainOnThreads(text, { file, overrides, targets, ...(values.case !== undefined ? { case: values.case as string } : {}) }, jobs);
  if (values.json) {
    out(JSON.stringify({
      file: e.file, checks: e.checks, ...(e.values.length ? { values: e.values } : {}),
      diagnostics: e.diagnostics.map((d) => ({ ...d, cell: d.cellId })),
    }, null, 2));
  } else {
    out(formatExplanation(e));
    for (const d of e.diagnostics) out(formatDiagnostic(d));
  }
  return e.diagnostics.some((d) => d.severity === 'error') ? 2 : 0;
}
