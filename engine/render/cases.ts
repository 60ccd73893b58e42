/**
 * Cases on the sheet: where the ```cases cell stands, the list of cases with the inputs they
 * change and why, then the envelope: each check against the document as written, each case and
 * each family (its worst member), and for a family swept over one input a small plot of each
 * check's utilization against the swept value. The checks summary reads its verdict, utilization
 * and governing case from here (caseVerdict).
 */
import type { Cell, CalcBlock } from '../types.js';
import type { Case, CaseRun, CheckCase } from '../cases/index.js';
import { withoutLimitMarker } from '../cases/read.js';
import { isJudgedIn } from '../cases/envelope.js';
import { formatValue, formatNumber } from '../values/format.js';
import { anchorId, escapeHtml } from './escape.js';
import { formatUtilization } from '../values/format.js';
import type { RenderContext } from './context.js';
import { typeset } from './katex.js';
import { symbolTex } from './names.js';
import { NEAR_LIMIT } from './check.js';

type Verdict = 'pass' | 'near' | 'fail' | 'none';
const MARK: Record<Verdict, string> = { pass: '✓', near: '◆', fail: '✗', none: '?' };

function verdictOfCase(x: { pass: boolean | null; utilization: number | null }): Verdict {
  if (x.pass === null) return 'none';
  if (!x.pass) return 'fail';
  return x.utilization !== null && x.utilization > NEAR_LIMIT ? 'near' : 'pass';
}

/** The name a reader sees for a case: the document as written has none of its own. */
export function caseLabel(name: string | null): string {
  return name ?? 'as written';
}

/**
 * A check's verdict over every case, for the summary; null when the document has no cases.
 * @example caseVerdict(cell, ctx) // {verdict: 'pass', utilization: 0.81, governing: 'STR', limit: null}
 */
export function caseVerdict(cell: Cell, ctx: RenderContext): { verdict: Verdict; utilization: number | null; governing: string; limit: string[] | null; note: string; neutral: boolean } | null {
  const run = ctx.cases;
  if (!run || (run.cases.length === 0 && !ctx.doc.cases.limits.size)) return null;
  const env = run.checks.get(cell.id);
  if (!env) return null;
  const limit = ctx.doc.cases.limits.get(cell.id) ?? null;
  const governing = env.governing ? caseLabel(env.governing.case)
    : env.cases.length ? 'none (it holds in every case, with no utilization to compare the cases by)'
    : `none in the case shown (${caseLabel(run.shown?.name ?? null)})`; // shown in one case it is not judged in
  const note = `governing: ${governing}${limit ? ` (judged in ${limit.join(', ')} only)` : ''}`;
  const neutral = !limit && env.cases.every((x) => x.pass === env.cases[0]?.pass && x.utilization === env.cases[0]?.utilization);
  const verdict = env.cases.length ? verdictOfCase(env.governing ?? { case: null, pass: env.pass, utilization: env.utilization }) : 'none';
  return { verdict, utilization: env.utilization, governing, limit, note, neutral };
}

/**
 * For a check that is not judged in the document shown (limited to other cases), its verdict
 * over the cases it is judged in: the body then shows that, not the shown document's numbers.
 * @example notJudgedHere(cOverturn, ctx) // {verdict: 'pass', utilization: 0.49}
 */
export function notJudgedHere(cell: Cell, ctx: RenderContext): { verdict: Verdict; utilization: number | null } | null {
  const limit = ctx.doc.cases.limits.get(cell.id);
  if (!limit || !ctx.cases || isJudgedIn(limit, ctx.cases.shown)) return null;
  const env = ctx.cases.checks.get(cell.id);
  return env?.cases.length && !ctx.cases.shown ? { verdict: verdictOfCase(env.governing ?? { case: null, pass: env.pass, utilization: env.utilization }), utilization: env.utilization } : { verdict: 'none', utilization: null };
}

/**
 * A check's verdict over the cases it is judged in, as the sheet shows a check limited to cases
 * (notJudgedHere): `pass` null when it is judged in no case or could not be evaluated in one.
 * @example verdictOverCases(run, 'c_overturn') // {pass: true, utilization: 0.6}
 */
export function verdictOverCases(run: CaseRun, checkId: string): { pass: boolean | null; utilization: number | null } {
  const env = run.checks.get(checkId);
  if (!env?.cases.length) return { pass: null, utilization: null };
  return { pass: (env.governing ?? env).pass, utilization: env.utilization };
}

/** The sentence under a check in the body: the cases it is judged in and the one that governs. */
export function checkCasesNote(cell: Cell, ctx: RenderContext): string {
  const v = caseVerdict(cell, ctx);
  // A check no case moves reads as it always did.
  if (!v || v.neutral) return '';
  const shown = caseLabel(ctx.cases?.shown?.name ?? null);
  const where = v.limit ? `Judged in ${v.limit.join(', ')} only` : 'Judged as written and in every case';
  const u = v.utilization === null ? '' : ` (u = ${formatUtilization(v.utilization, v.verdict === 'fail' ? false : v.verdict === 'none' ? null : true)})`;
  const governing = ctx.cases?.checks.get(cell.id)?.governing?.case ?? null;
  const below = notJudgedHere(cell, ctx)
    ? (governing ? ` Its working: render --case ${governing}.` : '')
    : ` Worked below: ${shown}.`;
  return `<p class="vb-note vb-casenote">${escapeHtml(`${where}; governing: ${v.governing}${u}.${below}`)}</p>`;
}

interface Group {
  name: string;
  members: Case[];
}

function groupsOf(cases: readonly Case[]): Group[] {
  const groups: Group[] = [];
  for (const c of cases) {
    const name = c.family ?? c.name;
    const last = groups[groups.length - 1];
    if (last && last.name === name && c.family !== null) last.members.push(c);
    else groups.push({ name, members: [c] });
  }
  return groups;
}

function overridesHtml(g: Group, sigfigs: number): string {
  const first = g.members[0]!;
  return Object.keys(first.values).map((input) => {
    const values = g.members.map((m) => m.values[input]);
    const shown = (v: unknown) => escapeHtml(formatValue(v, { sigfigs }));
    const name = typeset(symbolTex(input));
    if (input in first.setOver) {
      // --set applies on top of every case: the value used is the --set one, not the line's.
      const own = g.members.map((m) => shown(m.setOver[input]));
      const ownText = first.swept.includes(input) ? `${own[0]} … ${own[own.length - 1]}` : own[0];
      return `<span class="vb-caseset">${name} = ${shown(values[0])} <span class="vb-note">(--set; the case gives ${ownText})</span></span>`;
    }
    if (!first.swept.includes(input)) return `<span class="vb-caseset">${name} = ${shown(values[0])}</span>`;
    const distinct = new Set(values.map(shown)).size;
    return `<span class="vb-caseset">${name} = ${shown(values[0])} … ${shown(values[values.length - 1])} (${distinct} values)</span>`;
  }).join('; ');
}

function listHtml(run: CaseRun, ctx: RenderContext): string {
  const rows = groupsOf(run.cases).map((g) => {
    const name = g.members[0]!.family ? `${g.name}[1…${g.members.length}]` : g.name;
    return `<tr><td><b>${escapeHtml(name)}</b></td><td>${overridesHtml(g, ctx.sigfigs)}</td>`
      + `<td>${escapeHtml(g.members[0]!.description)}</td><td class="vb-ref">line ${g.members[0]!.line}</td></tr>`;
  }).join('');
  return `<table class="vb-summary vb-cases"><thead><tr><th>case</th><th>inputs changed</th><th>why</th><th class="vb-ref">where</th></tr></thead><tbody>${rows}</tbody></table>`;
}

function entryHtml(x: CheckCase | null, governing: CheckCase | null, note = ''): string {
  if (!x) return '<td class="vb-num vb-env-off">—</td>';
  const u = x.utilization === null ? (x.pass === null ? '?' : x.pass ? 'holds' : 'fails') : formatUtilization(x.utilization, x.pass);
  const gov = governing && governing.case === x.case;
  return `<td class="vb-num vb-env vb-sum--${verdictOfCase(x)}">${gov ? '<b>' : ''}${MARK[verdictOfCase(x)]} ${u}${gov ? '</b>' : ''}${note}</td>`;
}

function envelopeHtml(run: CaseRun, ctx: RenderContext): string {
  const checks = ctx.doc.graph.cells.filter((c) => c.kind === 'check');
  const groups = groupsOf(run.cases);
  const head = ['as written', ...groups.map((g) => (g.members[0]!.family ? `${g.name} (worst)` : g.name))];
  const neutral = checks.filter((cell) => caseVerdict(cell, ctx)?.neutral);
  const rows = checks.filter((cell) => !neutral.includes(cell)).map((cell) => {
    const env = run.checks.get(cell.id);
    const by = new Map((env?.cases ?? []).map((x) => [x.case, x]));
    const cells = [entryHtml(by.get(null) ?? null, env?.governing ?? null)];
    for (const g of groups) {
      const judged = g.members.map((m) => by.get(m.name)).filter((x): x is CheckCase => x !== undefined);
      if (!g.members[0]!.family) { cells.push(entryHtml(judged[0] ?? null, env?.governing ?? null)); continue; }
      const worst = worstOf(judged);
      cells.push(entryHtml(worst, env?.governing ?? null, worst ? ` <span class="vb-note">${escapeHtml(worst.case ?? '')}</span>` : ''));
    }
    const label = cell.name ?? `line ${cell.span.start.line}`;
    return `<tr><td><a href="#${anchorId(cell.id)}">${escapeHtml(label)}</a></td>${cells.join('')}</tr>`;
  }).join('');
  const same = neutral.length
    ? ` The same in every case: ${neutral.map((c) => `<a href="#${anchorId(c.id)}">${escapeHtml(c.name ?? `line ${c.span.start.line}`)}</a>`).join(', ')}.` : '';
  return `<table class="vb-summary vb-envelope"><thead><tr><th>check</th>${head.map((h) => `<th class="vb-num">${escapeHtml(h)}</th>`).join('')}</tr></thead><tbody>${rows}</tbody></table>`
    + `<p class="vb-note">Utilization per check and case; bold: the governing case; —: the check is not judged in that case.${same}</p>`;
}

function worstOf(list: CheckCase[]): CheckCase | null {
  const fails = list.filter((x) => x.pass === false);
  const pool = fails.length ? fails : list.filter((x) => x.pass === null).length ? list.filter((x) => x.pass === null) : list;
  return pool.reduce<CheckCase | null>((w, x) => (w === null || (x.utilization ?? -1) > (w.utilization ?? -1) ? x : w), null);
}

/** Numeric value of a swept input, in the unit of its first value (null when not a number or quantity). */
function sweptNumber(v: unknown, unit: string | null): number | null {
  if (typeof v === 'number') return v;
  const u = v as { toNumber?: (unit?: string) => number };
  if (unit && typeof u?.toNumber === 'function') return u.toNumber(unit);
  return null;
}

function unitOf(v: unknown): string | null {
  const u = v as { formatUnits?: () => string };
  return typeof u?.formatUnits === 'function' ? u.formatUnits() : null;
}

const W = 420;
const H = 170;
const PAD = { l: 40, r: 110, t: 10, b: 30 };

/** A family swept over one input: each check's utilization against the swept value, as SVG. */
function plotHtml(g: Group, run: CaseRun, ctx: RenderContext): string {
  const first = g.members[0]!;
  if (!first.family || first.swept.length !== 1 || g.members.length < 2) return '';
  const input = first.swept[0]!;
  // An input pinned by --set does not move: nothing to plot against.
  if (input in first.setOver) return '';
  const unit = unitOf(first.values[input]);
  const xs = g.members.map((m) => sweptNumber(m.values[input], unit));
  if (xs.some((x) => x === null)) return '';
  const series = ctx.doc.graph.cells.filter((c) => c.kind === 'check').map((cell) => {
    const by = new Map((run.checks.get(cell.id)?.cases ?? []).map((x) => [x.case, x.utilization]));
    const points = g.members.map((m, i) => [xs[i]!, by.get(m.name) ?? null] as const).filter((p): p is readonly [number, number] => p[1] !== null && p[1] !== undefined);
    return { label: cell.name ?? `line ${cell.span.start.line}`, points };
  }).filter((s) => s.points.length > 1);
  if (!series.length) return '';
  const x0 = Math.min(...(xs as number[])), x1 = Math.max(...(xs as number[]));
  const uMax = Math.max(1.1, ...series.flatMap((s) => s.points.map((p) => p[1])));
  const px = (x: number) => PAD.l + ((x - x0) / (x1 - x0 || 1)) * (W - PAD.l - PAD.r);
  const py = (u: number) => H - PAD.b - (Math.max(0, u) / uMax) * (H - PAD.t - PAD.b);
  const dashes = ['', '5 3', '2 2', '8 3 2 3', '1 3'];
  const lines = series.map((s, i) => {
    const d = s.points.map((p, j) => `${j ? 'L' : 'M'}${px(p[0]).toFixed(1)} ${py(p[1]).toFixed(1)}`).join(' ');
    const y = PAD.t + 12 * i + 6;
    return `<path d="${d}" fill="none" stroke="currentColor" stroke-width="1.2" stroke-dasharray="${dashes[i % dashes.length]}"/>`
      + `<line x1="${W - PAD.r + 8}" y1="${y}" x2="${W - PAD.r + 28}" y2="${y}" stroke="currentColor" stroke-dasharray="${dashes[i % dashes.length]}"/>`
      + `<text x="${W - PAD.r + 32}" y="${y + 3}" font-size="9">${escapeHtml(s.label)}</text>`;
  }).join('');
  const label = (x: number) => `${formatNumber(x, 3)}${unit ? ` ${unit}` : ''}`;
  const axes = `<line x1="${PAD.l}" y1="${H - PAD.b}" x2="${W - PAD.r}" y2="${H - PAD.b}" stroke="currentColor" stroke-width="0.6"/>`
    + `<line x1="${PAD.l}" y1="${PAD.t}" x2="${PAD.l}" y2="${H - PAD.b}" stroke="currentColor" stroke-width="0.6"/>`
    + `<line x1="${PAD.l}" y1="${py(1).toFixed(1)}" x2="${W - PAD.r}" y2="${py(1).toFixed(1)}" stroke="currentColor" stroke-width="0.6" stroke-dasharray="1 2"/>`
    + `<text x="${PAD.l - 4}" y="${py(1) + 3}" font-size="9" text-anchor="end">1</text><text x="${PAD.l - 4}" y="${H - PAD.b + 3}" font-size="9" text-anchor="end">0</text>`
    + `<text x="${PAD.l}" y="${H - 8}" font-size="9">${escapeHtml(label(x0))}</text><text x="${W - PAD.r}" y="${H - 8}" font-size="9" text-anchor="end">${escapeHtml(label(x1))}</text>`
    + `<text x="${(PAD.l + W - PAD.r) / 2}" y="${H - 8}" font-size="9" text-anchor="middle">${escapeHtml(input)}</text>`;
  return `<figure class="vb-figure vb-caseplot"><div class="vb-ref"></div><div class="vb-figbody"><div class="vb-svg" style="max-width:120mm"><svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${W} ${H}" width="${W}" height="${H}" role="img" aria-label="utilization of each check against ${escapeHtml(input)} in ${escapeHtml(g.name)}">${axes}${lines}</svg></div>`
    + `<figcaption>Utilization of each check against ${escapeHtml(input)}, family ${escapeHtml(g.name)} (${g.members.length} cases); dotted: u = 1.</figcaption></div></figure>`;
}

/**
 * The body of a ```cases block on the sheet: the list of cases, then the envelope and plots.
 * @example renderCasesBlock(block, ctx)
 */
export function renderCasesBlock(_block: CalcBlock, ctx: RenderContext): string {
  const run = ctx.cases;
  // The wrapper stays when there is nothing to show yet, so that a live page can fill it in.
  if (!run || run.cases.length === 0) return '<div class="vb-cases" data-cases></div>';
  const shown = run.shown ? `<p class="vb-note">This sheet shows the case <b>${escapeHtml(run.shown.name)}</b> in place of the document as written.</p>` : '';
  const plots = run.shown ? '' : groupsOf(run.cases).map((g) => plotHtml(g, run, ctx)).join('');
  return `<div class="vb-cases" data-cases><h3 class="vb-h">Cases</h3>${shown}${listHtml(run, ctx)}`
    + (run.shown ? '' : `<h3 class="vb-h">Envelope: each check in each case</h3>${envelopeHtml(run, ctx)}${plots}`) + '</div>';
}

export { withoutLimitMarker };
