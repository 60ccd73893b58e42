/**
 * formatDiff: a DocumentDiff as text for a reviewer at a terminal — the
 * verdict-changing news first (checks), then what drove it (inputs, results),
 * then housekeeping (cells, figures, prose, title block).
 * Pure: no Node imports.
 */
import { formatDiagnostic, formatNumber, formatUtilization } from '../../engine/index.js';
import type { DocumentDiff, ValueChange } from './document.js';
import type { CheckChange, CheckSide } from './checks.js';
import type { CaseCheckChange } from './cases.js';
import { formatMove, formatPercent } from './values.js';

/** Cases whose utilization moved, shown per check before "… and N more". */
const CASES_SHOWN = 5;

/** Fields shown per kernel result before "… and N more". */
const FIELDS_SHOWN = 4;

/** Left-aligned columns, two spaces apart, no header. */
function columns(rows: string[][], indent = '  '): string[] {
  const widths: number[] = [];
  for (const r of rows) r.forEach((c, i) => { widths[i] = Math.max(widths[i] ?? 0, c.length); });
  return rows.map((r) => indent + r.map((c, i) => (i === r.length - 1 ? c : c.padEnd(widths[i]!))).join('  ').trimEnd());
}

/** What one item of a list is called: "hinge" for `.hinges` and `.mechanism`, else "item". */
function itemNoun(path: string): string {
  const last = path.slice(path.lastIndexOf('.') + 1);
  if (last === 'mechanism') return 'hinge';
  return last.length > 1 && last.endsWith('s') ? last.slice(0, -1) : 'item';
}

/**
 * @param reformulated names whose formula changed: their moves are marked, so a reader can tell them from moves caused by inputs
 */
function valueRows(changes: ValueChange[], reformulated = new Set<string>()): string[][] {
  const rows: string[][] = [];
  for (const v of changes) {
    // The biggest relative moves of a kernel result are the ones worth reading.
    // A list item that only moved reads after the numbers; one added or removed comes first.
    const rank = (f: ValueChange['fields'][number]) => (f.change === 'item moved' ? -1 : f.percent === null ? Infinity : Math.abs(f.percent));
    const fields = [...v.fields].sort((x, y) => rank(y) - rank(x));
    const kindNote = v.old_kind ? `(was ${v.old_kind})` : reformulated.has(v.name) ? `formula changed, line ${v.line_new}` : '';
    if (fields.length === 0) rows.push([v.name, 'same value', kindNote, `line ${v.line_new}`]);
    for (const f of fields.slice(0, FIELDS_SHOWN)) {
      const what = f.change === 'moved' ? formatPercent(f.percent) || `${f.delta! > 0 ? '+' : '−'}${formatNumber(Math.abs(f.delta!), 3)}${f.unit ? ` ${f.unit}` : ''}`
        : f.change === 'dimension' ? 'dimension changed'
        : f.change === 'status' ? 'now ' + (f.new!.text.startsWith('error') ? 'an error' : f.new!.text.startsWith('not computed') ? 'not computed' : 'computed')
        : f.item ? `${itemNoun(f.path)} ${f.change.slice('item '.length)}`
        : f.change;
      rows.push([v.name + f.path, f.change === 'status' ? `${f.old!.text} → ${f.new!.text}` : formatMove(f), what, kindNote || `line ${v.line_new}`]);
    }
    if (fields.length > FIELDS_SHOWN) rows.push([v.name, `… and ${fields.length - FIELDS_SHOWN} more fields changed`, '', '']);
  }
  return rows;
}

const VERDICT_TEXT: Record<CheckSide['verdict'], string> = { holds: 'holds', fails: 'FAILS', 'not evaluated': 'NOT EVALUATED' };
const MARK: Record<CheckChange['change'], string> = {
  'to-fail': '!!', 'to-pass': 'ok', 'to-not-evaluated': '??', utilization: '··', expression: '··', added: '+ ', removed: '- ',
};

function checkRow(c: CheckChange): string[] {
  const u = (s: CheckSide | null) => (s === null || s.utilization === null ? '—' : formatUtilization(s.utilization, s.verdict === 'not evaluated' ? null : s.verdict === 'holds'));
  const verdict = c.change === 'added' ? `added, ${VERDICT_TEXT[c.new!.verdict]}`
    : c.change === 'removed' ? `removed (${VERDICT_TEXT[c.old!.verdict]})`
    : c.old!.verdict === c.new!.verdict ? VERDICT_TEXT[c.new!.verdict] : `${VERDICT_TEXT[c.old!.verdict]} → ${VERDICT_TEXT[c.new!.verdict]}`;
  const util = c.change === 'added' ? `utilization ${u(c.new)}` : c.change === 'removed' ? `utilization ${u(c.old)}` : `utilization ${u(c.old)} → ${u(c.new)}`;
  const sideNow = c.new ?? c.old!;
  const expr = c.change === 'expression' || (c.old && c.new && c.old.source !== c.new.source) ? `${c.old!.source} ⇒ ${c.new!.source}` : sideNow.source;
  return [MARK[c.change], c.key, verdict, util, `${expr === c.key ? '' : expr}  (line ${sideNow.line})`.trim()];
}

const quoted = (s: string | null) => (s === null ? '—' : `"${s}"`);

/** One changed definition: the formula old → new (as written), or the description, range or display unit. */
function definitionRow(c: DocumentDiff['definitions'][number]): string[] {
  const move = c.what === 'description' ? `${quoted(c.old)} → ${quoted(c.new)}` : `${c.old ?? '—'} → ${c.new ?? '—'}`;
  return [c.name, c.what, move, c.line_old === c.line_new ? `line ${c.line_new}` : `line ${c.line_old} → ${c.line_new}`];
}

/** A verdict flip in the three words: holds, fails, not evaluated. */
const NOW: Record<string, string> = { 'to-fail': 'now FAILS', 'to-pass': 'now holds', 'to-not-evaluated': 'now NOT EVALUATED' };

/** Governing-case changes first, then each check's changes case by case. */
function casesLines(d: DocumentDiff): string[] {
  const name = (c: string | null) => c ?? 'as written';
  const u = (v: { utilization: number | null; pass: boolean | null } | null) => (v === null || v.utilization === null ? '—' : formatUtilization(v.utilization, v.pass));
  const governs = (g: { case: string | null } | null) => (g === null ? 'none' : name(g.case));
  const gov = d.cases!.governing.map((g) => ['>>', g.check, `governing case ${governs(g.old)} → ${governs(g.new)}`, `utilization ${u(g.old)} → ${u(g.new)}`]);
  const marks: Record<string, string> = { 'to-fail': '!!', 'to-pass': 'ok', 'to-not-evaluated': '??', utilization: '··', added: '+ ', removed: '- ' };
  const what = (c: (CaseCheckChange)) => (c.change === 'added' ? 'now judged' : c.change === 'removed' ? 'no longer judged' : c.change === 'utilization' ? 'moved' : NOW[c.change]);
  // A family can change in dozens of cases: the verdict flips of a check are all shown, its moves up to CASES_SHOWN.
  const rows: string[][] = [];
  const byCheck = new Map<string, CaseCheckChange[]>();
  for (const c of d.cases!.changes) byCheck.set(c.check, [...(byCheck.get(c.check) ?? []), c]);
  for (const [check, list] of byCheck) {
    const shown = list.filter((c, i) => c.change !== 'utilization' || i < CASES_SHOWN);
    for (const c of shown) rows.push([marks[c.change]!, `${c.check} in ${name(c.case)}`, what(c), `utilization ${u(c.old)} → ${u(c.new)}`]);
    if (shown.length < list.length) rows.push(['··', check, `… and ${list.length - shown.length} more cases moved`, '']);
  }
  return columns([...gov, ...rows]);
}

function preview(text: string, width = 70): string {
  const flat = text.replace(/\s+/g, ' ').trim();
  return `"${flat.length > width ? flat.slice(0, width - 1) + '…' : flat}"`;
}

/**
 * The human report of `vaultbook diff`.
 * @example out(formatDiff(diffDocuments(a, b)))
 */
export function formatDiff(d: DocumentDiff): string {
  const out: string[] = [`${d.old.label} → ${d.new.label}`];
  const section = (title: string, lines: string[]) => { if (lines.length > 0) out.push('', title, ...lines); };
  const order: CheckChange['change'][] = ['to-fail', 'to-not-evaluated', 'to-pass', 'utilization', 'expression', 'added', 'removed'];
  const checks = [...d.checks].sort((x, y) => order.indexOf(x.change) - order.indexOf(y.change));
  section(`Checks (${checks.length} changed)`, columns(checks.map(checkRow)));
  section(`Definitions changed (${d.definitions.length})`, columns(d.definitions.map(definitionRow)));
  if (d.cases) section(`Cases (${d.cases.changes.length} check${d.cases.changes.length === 1 ? '' : 's'} changed in a case; ${d.cases.governing.length} governing case${d.cases.governing.length === 1 ? '' : 's'} changed)`, casesLines(d));
  section(`Inputs changed (${d.inputs.length})`, columns(valueRows(d.inputs)));
  const reformulated = new Set(d.definitions.filter((c) => c.what === 'formula').map((c) => c.name));
  section(`Results moved (${d.results.length})`, columns(valueRows(d.results, reformulated)));
  // Added and removed checks are already listed under Checks.
  const cellList = (cs: DocumentDiff['added']) => cs.filter((c) => c.kind !== 'check').map((c) => `${c.name} (${c.kind}, line ${c.line})`).join(', ');
  const added = cellList(d.added), removed = cellList(d.removed);
  section('Cells', [...(added ? [`  added:   ${added}`] : []), ...(removed ? [`  removed: ${removed}`] : [])]);
  if (d.figures.length) section('Figures', [`  redrawn: ${d.figures.map((f) => f.name).join(', ')}`]);
  const p = d.prose;
  if (p.paragraphs.length > 0) {
    const counts = [`${p.changed} paragraph${p.changed === 1 ? '' : 's'} changed`, p.added ? `${p.added} added` : '', p.removed ? `${p.removed} removed` : ''].filter(Boolean).join(', ');
    section(`Prose: ${counts} (+${p.lines_added} −${p.lines_removed} lines)`, columns(p.paragraphs.map((c) => {
      const at = c.new ? `line ${c.new.line}` : `was line ${c.old!.line}`;
      return [c.change === 'changed' ? '~' : c.change === 'added' ? '+' : '-', at, preview((c.new ?? c.old)!.text)];
    })));
  }
  section('Title block', columns(d.meta.map((m) => [m.key, `${m.old === null ? '—' : String(m.old)} → ${m.new === null ? '—' : String(m.new)}`])));
  section(`Errors introduced (${d.errors_introduced.length})`, d.errors_introduced.map((e) => `  ${formatDiagnostic(e)}`));
  const nothing = d.checks.length + d.definitions.length + d.inputs.length + d.results.length + d.added.length + d.removed.length + d.figures.length + p.paragraphs.length + d.meta.length === 0;
  if (nothing) out.push('', 'No differences in values, checks, prose or title block.');
  const errorsNote = d.new.errors > 0 ? `; the new version has ${d.new.errors} error${d.new.errors === 1 ? '' : 's'}` : '';
  out.push('', d.new_failures > 0
    ? `Verdict: ${d.new_failures} check${d.new_failures === 1 ? '' : 's'} now fail${d.new_failures === 1 ? 's' : ''} that did not before${errorsNote}.`
    : `Verdict: no check newly fails${errorsNote}.`);
  return out.join('\n');
}
