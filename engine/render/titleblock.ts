/**
 * The front matter as a title block on the first page and as a running
 * header and footer on every printed page (CSS paged media margin boxes, so
 * that "sheet n of N" comes from the print engine itself).
 */
import type { Meta } from '../types.js';
import { cssString, escapeHtml } from './escape.js';

/** The identification a firm files a calc under; absent fields are empty strings. */
export interface TitleInfo {
  title: string;
  project: string;
  job: string;
  calcRef: string;
  revision: string;
  date: string;
  prepared: string;
  checked: string;
  basis: string[];
  sigfigs: number | null;
  /** Front-matter keys we do not know, kept in order, as text. */
  extra: Array<[string, string]>;
}

type Field = Exclude<keyof TitleInfo, 'basis' | 'extra' | 'sigfigs'> | 'basis' | 'sigfigs';

/** Spellings accepted for each field, compared without case, spaces, '_' or '-'. */
const ALIASES: Record<string, Field> = {
  title: 'title', project: 'project', projectname: 'project', job: 'job', jobno: 'job', jobnumber: 'job',
  calcref: 'calcRef', calcreference: 'calcRef', calculationreference: 'calcRef', reference: 'calcRef', ref: 'calcRef',
  revision: 'revision', rev: 'revision', date: 'date', prepared: 'prepared', preparedby: 'prepared', author: 'prepared',
  checked: 'checked', checkedby: 'checked', checker: 'checked', basis: 'basis', codes: 'basis', designbasis: 'basis', sigfigs: 'sigfigs',
};

/**
 * Any front-matter value as one line of text.
 * @example metaText(['EN 1996-1-1', 'EN 1991-1-1']) // "EN 1996-1-1, EN 1991-1-1"
 */
export function metaText(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (v instanceof Date) return Number.isNaN(v.getTime()) ? '' : v.toISOString().slice(0, 10);
  if (Array.isArray(v)) return v.map(metaText).join(', ');
  if (typeof v === 'object') return Object.entries(v as Record<string, unknown>).map(([k, x]) => `${k}: ${metaText(x)}`).join('; ');
  return String(v);
}

/**
 * Reads the title fields from the front matter.
 * @example readTitle({calc_ref: 'VB-014', rev: 'B'}).calcRef // "VB-014"
 */
export function readTitle(meta: Meta): TitleInfo {
  const info: TitleInfo = { title: '', project: '', job: '', calcRef: '', revision: '', date: '', prepared: '', checked: '', basis: [], sigfigs: null, extra: [] };
  for (const [key, value] of Object.entries(meta)) {
    const field = ALIASES[key.toLowerCase().replace(/[\s_-]+/g, '')];
    if (field === 'basis') info.basis = Array.isArray(value) ? value.map(metaText).filter(Boolean) : metaText(value) ? [metaText(value)] : [];
    else if (field === 'sigfigs') info.sigfigs = typeof value === 'number' ? value : null;
    else if (field && !info[field]) info[field] = metaText(value);
    else info.extra.push([key, metaText(value)]);
  }
  return info;
}

function cellHtml(label: string, value: string, cls = ''): string {
  return `<div class="vb-tb-cell${cls}"><span class="vb-tb-label">${label}</span><span class="vb-tb-value">${value ? escapeHtml(value) : '&#8203;'}</span></div>`;
}

/**
 * The title block for the top of the first page.
 * @param file the document's file name, shown when the front matter has no title
 */
export function renderTitleBlock(info: TitleInfo, file: string): string {
  const title = info.title || file;
  const basis = info.basis.length
    ? `<div class="vb-tb-cell vb-tb-wide"><span class="vb-tb-label">design basis</span><ul class="vb-tb-basis">${info.basis.map((b) => `<li>${escapeHtml(b)}</li>`).join('')}</ul></div>`
    : '';
  const extra = info.extra.map(([k, v]) => cellHtml(escapeHtml(k), v, ' vb-tb-extra')).join('');
  return `<header class="vb-titleblock">`
    + `<div class="vb-tb-head"><span class="vb-tb-kind">Calculation sheet</span><h1 class="vb-tb-title">${escapeHtml(title)}</h1></div>`
    + `<div class="vb-tb-grid">${cellHtml('project', info.project, ' vb-tb-span2')}${cellHtml('job', info.job)}${cellHtml('calc reference', info.calcRef)}`
    + `${cellHtml('revision', info.revision)}${cellHtml('date', info.date)}${cellHtml('prepared', info.prepared)}${cellHtml('checked', info.checked)}`
    + `${basis}${extra}</div></header>`;
}

/** A header string, cut to a length that fits a margin box. */
function short(text: string, max = 70): string {
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

/** Characters the running footer holds on its (at most two) lines beside "sheet n of N". */
const FOOTER_ROOM = 190;

/** A name without its remarks in brackets: "J. Marlowe (fictional)" → "J. Marlowe"; the title block keeps them. */
function bare(text: string): string {
  return text.replace(/\s*\([^)]*\)/g, '').replace(/\s+/g, ' ').trim();
}

/**
 * The running footer: project, job and who prepared and checked the calc, in full when they fit on two lines.
 * Otherwise it is shortened sensibly, never cutting a name: remarks in brackets go first, then the project
 * (both are in the title block), then each name is kept to its first part before a comma.
 * @example footerText(readTitle({job: 'J1', prepared: 'A. Author (fictional)'})) // "job J1 · prepared A. Author (fictional)"
 */
export function footerText(info: TitleInfo): string {
  const join = (project: string, prepared: string, checked: string) => [project, info.job && `job ${info.job}`,
    prepared && `prepared ${prepared}`, checked && `checked ${checked}`].filter(Boolean).join('  ·  ');
  const firstPart = (name: string) => bare(name).split(/,|;| with /)[0]!.trim();
  const tries = [
    join(info.project, info.prepared, info.checked),
    join(bare(info.project), bare(info.prepared), bare(info.checked)),
    join('', bare(info.prepared), bare(info.checked)),
    join('', firstPart(info.prepared), firstPart(info.checked)),
  ];
  return tries.find((t) => t.length <= FOOTER_ROOM) ?? tries[tries.length - 1]!;
}

/**
 * The @page rules: paper, margins and the running header and footer.
 * Every document string passes through cssString, so none can end the rule.
 * @example pageStyle(readTitle({calc_ref: 'VB-014'}), 'calc.md')
 */
export function pageStyle(info: TitleInfo, file: string): string {
  const ref = [info.calcRef && `calc ${info.calcRef}`, info.revision && `rev ${info.revision}`, info.date].filter(Boolean).join('  ·  ');
  const who = footerText(info);
  const box = 'font-family: "Liberation Sans", "DejaVu Sans", Arial, sans-serif; font-size: 7.5pt; color: #3a4652;';
  // Two boxes per edge (no centre box), so each may take the width its text needs.
  const rule = (edge: 'top' | 'bottom') => (edge === 'top'
    ? 'vertical-align: bottom; padding-bottom: 3mm; border-bottom: 0.4pt solid #8a96a3;'
    : 'vertical-align: top; padding-top: 3mm; border-top: 0.4pt solid #8a96a3;');
  return `@page { size: A4; margin: 20mm 15mm 18mm 18mm;`
    + ` @top-left { content: ${cssString(short(info.title || file, 80))}; ${box} ${rule('top')} }`
    + ` @top-right { content: ${cssString(short(ref || file, 50))}; ${box} ${rule('top')} font-weight: bold; white-space: nowrap; }`
    + ` @bottom-left { content: ${cssString(who)}; ${box} ${rule('bottom')} }`
    + ` @bottom-right { content: "sheet " counter(page) " of " counter(pages); ${box} ${rule('bottom')} font-weight: bold; white-space: nowrap; }`
    + ` }`;
}
