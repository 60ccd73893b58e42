/**
 * The sheet's appendix "What drives each check": per check its inputs ranked by the swing, the top
 * few with a small bar of the utilization at the input −10 % and +10 % (SVG), and the elasticity.
 * The full list is in `vaultbook explain FILE --json`.
 */
import type { CheckDrivers, InputDriver } from '../drivers/index.js';
import { escapeHtml, anchorId } from './escape.js';
import { formatNumber } from '../values/format.js';

/** How many inputs each check shows on the sheet. */
export const DRIVERS_SHOWN = 5;

const num = (x: number | null | undefined): string => (x === null || x === undefined ? '–' : formatNumber(x, 3));

/** A bar from u at −10 % to u at +10 %, a dot at the value as written and a tick at 1 (the limit). */
function swingBar(i: InputDriver, u0: number, top: number): string {
  const W = 120, H = 12;
  const x = (u: number) => (Math.max(0, u) / top) * W;
  const ends = [i.u_minus, i.u_plus].filter((u): u is number => u !== null);
  if (ends.length === 0) return '';
  const lo = Math.min(u0, ...ends), hi = Math.max(u0, ...ends);
  const label = `utilization ${num(i.u_minus)} at −10 %, ${num(u0)} as written, ${num(i.u_plus)} at +10 %`;
  return `<svg class="vb-swing" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" role="img" aria-label="${escapeHtml(label)}">`
    + `<line x1="0" y1="${H / 2}" x2="${W}" y2="${H / 2}" stroke="#bbb" stroke-width="0.5"/>`
    + (top >= 1 ? `<line x1="${x(1).toFixed(1)}" y1="0" x2="${x(1).toFixed(1)}" y2="${H}" stroke="#000" stroke-width="0.8" stroke-dasharray="2 1"/>` : '')
    + `<rect x="${x(lo).toFixed(1)}" y="3" width="${Math.max(0.8, x(hi) - x(lo)).toFixed(1)}" height="${H - 6}" fill="#777"/>`
    + `<circle cx="${x(u0).toFixed(1)}" cy="${H / 2}" r="2" fill="#000"/></svg>`;
}

function verdictWords(p: boolean | null | undefined): string {
  return p === true ? 'holds' : p === false ? '<strong>fails</strong>' : '–';
}

function renderOne(c: CheckDrivers, shown: number): string {
  const rows = c.inputs.slice(0, shown);
  const us = rows.flatMap((i) => [i.u_minus, i.u_plus]).filter((u): u is number => u !== null);
  const top = Math.max(1, c.utilization ?? 0, ...us) * 1.05;
  const body = rows.map((i) => {
    const at = c.utilization === null
      ? `<td class="vb-num">${verdictWords(i.pass_minus)}</td><td class="vb-num">${verdictWords(i.pass_plus)}</td><td></td>`
      : `<td class="vb-num">${num(i.u_minus)}</td><td class="vb-num">${num(i.u_plus)}</td><td>${swingBar(i, c.utilization, top)}</td>`;
    const mark = i.kinked ? ` <span title="one-sided elasticities ${num(i.elasticity_minus)} below, ${num(i.elasticity_plus)} above">(kinked: ${num(i.elasticity_minus)} / ${num(i.elasticity_plus)})</span>` : '';
    const step = i.step && i.step !== '±10 %' ? ` <span class="vb-none">moved ${escapeHtml(i.step)}</span>` : '';
    return `<tr><td><code>${escapeHtml(i.name)}</code></td><td class="vb-num">${escapeHtml(i.text)}${step}</td>`
      + `<td class="vb-num">${i.step === '' ? escapeHtml(i.note ?? '') : num(i.elasticity)}${mark}</td>${at}</tr>`
      + (i.step !== '' && i.note ? `<tr><td></td><td colspan="5" class="vb-none">${escapeHtml(i.note)}</td></tr>` : '');
  }).join('');
  const more = c.inputs.length > shown ? `<tr><td colspan="6" class="vb-none">and ${c.inputs.length - shown} more input${c.inputs.length - shown === 1 ? '' : 's'} of smaller swing</td></tr>` : '';
  const where = c.case === null ? '' : `, in its governing case ${escapeHtml(c.case)}`;
  const head = `<h3 class="vb-drivers-head" style="font-size: 10pt; margin: 4mm 0 1mm"><a href="#${anchorId(c.name)}">${escapeHtml(c.name === c.source ? c.source : `${c.name}: ${c.source}`)}</a>`
    + ` <span class="vb-none">(line ${c.line}) utilization ${num(c.utilization)}${where}</span></h3>`;
  if (c.inputs.length === 0) return `${head}<p>It depends on no input.</p>`;
  const uHead = c.utilization === null ? ['verdict at −10 %', 'at +10 %', ''] : ['u at −10 %', 'u at +10 %', 'swing (dashed: 1)'];
  return `${head}<table class="vb-summary vb-drivers"><thead><tr><th>input</th><th class="vb-num">value</th><th class="vb-num">elasticity</th>`
    + `${uHead.map((h, k) => `<th${k < 2 ? ' class="vb-num"' : ''}>${h}</th>`).join('')}</tr></thead><tbody>${body}${more}</tbody></table>`;
}

/**
 * The appendix, or '' when there is nothing to show.
 * @param closing HTML that ends the appendix (the sheet's archive line): kept on one page with the last check's
 *   table in a wrapper that does not break, so that it never prints on a page alone
 * @example renderDriversAppendix((await explainDocument(text)).checks)
 */
export function renderDriversAppendix(checks: readonly CheckDrivers[], shown = DRIVERS_SHOWN, closing = ''): string {
  if (checks.length === 0) return '';
  const blocks = checks.map((c) => renderOne(c, shown));
  if (closing) blocks.push(`<div class="vb-keep-end">${blocks.pop()}${closing}</div>`);
  return `<section class="vb-part vb-appendix" data-part="drivers" aria-label="What drives each check"><h2 class="vb-h">What drives each check</h2>`
    + `<p>For each check, the inputs it depends on, ranked by the <em>swing</em>: the check's utilization with the input moved `
    + `−10 % and +10 % from its value (the bar runs between the two, the dot is the value as written, the dashed tick is 1). `
    + `The <em>elasticity</em> is d ln u / d ln x, the percentage change of the utilization per percent of the input, by a central `
    + `difference of ±0.1 %; "kinked" gives the one-sided values where they differ. An input at zero moves by the absolute step shown. `
    + `A check without a utilization shows its verdict. The top ${shown} inputs are shown; <code>vaultbook explain FILE --json</code> lists all. `
    + `A large swing marks an input worth checking twice; it is not a safety margin.</p>`
    + blocks.join('') + '</section>';
}
