/**
 * The working of a step, typeset so that it never runs out of its column.
 *
 * KaTeX never breaks a display formula, so each row of working is set as
 * inline maths in display style: the browser may then break it after any
 * top-level operator or relation (and after the commas of an argument
 * list), on screen and on paper. Rows share one grid: the name sits in the
 * first column, every row's `=` starts the second, and a row that breaks
 * carries on indented under its own first term (a hanging indent).
 */
import { typeset } from './katex.js';

/** One row: the left-hand side (only on the first row of a definition) and the rest, starting with its relation. */
export interface WorkingRow {
  lhs?: string;
  tex: string;
}

/**
 * Rows of working as HTML.
 * @param rows TeX of each row; `lhs` set on rows that name what they define
 * @example workingHtml([{lhs: 'H', tex: '= \\frac{w L^2}{8 f}'}, {tex: '= 39.7\\,\\mathrm{kN/m}'}])
 */
export function workingHtml(rows: WorkingRow[]): string {
  const named = rows.some((r) => r.lhs !== undefined);
  const cells = rows.map((r) => (named ? `<span class="vb-lhs">${r.lhs ? typeset(`\\displaystyle ${r.lhs}`) : ''}</span>` : '')
    + `<span class="vb-rhs">${typeset(`\\displaystyle ${r.tex}`)}</span>`).join('');
  return `<div class="vb-rows${named ? ' vb-rows--named' : ''}">${cells}</div>`;
}
