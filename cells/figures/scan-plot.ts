/**
 * scan_plot(s): the collapse load factor λ of a vehicle against the
 * position of its lead axle (from arch_scan), with the worst position marked
 * and the level λ = 1 drawn.
 */
import type { ArchScan } from '../vault/arch/arch-scan.js';
import { el, svgDocument, text, INK, MUTED, SMALL_TEXT } from './svg.js';
import { wrapLines } from './labels.js';
import { panel } from './axes.js';
import { markFigure } from './registry.js';
import { label } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';

const WIDTH = 170;
const CURVE = { stroke: '#2c4a6b', 'stroke-width': 0.6, fill: 'none' };

/**
 * Draws λ(x) of a vehicle scan.
 * @param s from arch_scan (SI)
 * @returns an SVG string, recorded as a figure
 * @example scanPlot(archScan(ring, loads, {axles: [5e4]}))
 */
export function scanPlot(s: ArchScan, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const finite = s.curve.filter((p) => Number.isFinite(p.lambda));
  // Positions in the document's length unit (the kernel gives metres).
  const xs = s.curve.map((p) => say.value('length', p.x));
  const top = finite.length ? Math.max(...finite.map((p) => p.lambda)) : 1;
  // Where λ is unbounded (the vehicle off the ring, or never a mechanism) the curve is cut.
  const clip = Math.max(1.2, Math.min(top, 4 * (typeof s.lambda_min === 'number' && Number.isFinite(s.lambda_min) ? s.lambda_min : 1)));
  // The load spread in words, under the title at the least print size, on as many lines as it takes.
  const spread = wrapLines(s.load_spread, WIDTH - 20, SMALL_TEXT);
  // Two lines fit between the title and the top of the panel (its top tick label starts at 14.7 mm).
  const extra = Math.max(0, spread.length - 2) * 3.4;
  const p = panel({ left: 24, top: 16 + extra, width: 136, height: 62 }, [Math.min(...xs), Math.max(...xs)], [0, clip * 1.05],
    `position of the lead axle from the left springing of the intrados (${say.unit('length')})`, 'collapse load factor λ');
  let body = p.frame;
  // λ = 1: the vehicle as given just causes collapse.
  body += el('line', { x1: p.x(Math.min(...xs)), y1: p.y(1), x2: p.x(Math.max(...xs)), y2: p.y(1), stroke: '#a3162b', 'stroke-width': 0.3, 'stroke-dasharray': '1.2 0.8' });
  body += text(p.x(Math.max(...xs)) - 1, p.y(1) - 1, 'λ = 1', { 'text-anchor': 'end', fill: '#a3162b' });
  // The curve in runs of finite λ below the clip.
  let run: Array<[number, number]> = [];
  const flush = () => { if (run.length > 1) body += p.curve(run, CURVE); run = []; };
  for (const q of s.curve) {
    if (Number.isFinite(q.lambda) && q.lambda <= clip * 1.05) run.push([say.value('length', q.x), q.lambda]);
    else flush();
  }
  flush();
  let title = 'Vehicle rolled across the span: collapse load factor against position';
  if (typeof s.lambda_min === 'number' && typeof s.x_worst === 'number' && Number.isFinite(s.lambda_min)) {
    const cx = p.x(say.value('length', s.x_worst)), cy = p.y(s.lambda_min);
    body += el('circle', { cx, cy, r: 1.1, fill: '#a3162b' });
    body += el('line', { x1: cx, y1: cy, x2: cx, y2: p.y(0), stroke: '#a3162b', 'stroke-width': 0.25, 'stroke-dasharray': '0.8 0.6' });
    const right = cx < 24 + 136 * 0.6;
    // A label: the placement pass moves it off the curve and the line λ = 1 when it lands on them.
    body += label(cx + (right ? 2 : -2), cy + 4.2, `worst: λ = ${s.lambda_min.toFixed(2)} at x = ${say.length(s.x_worst)}`, right ? 'start' : 'end', { fill: '#a3162b', 'font-weight': 'bold' });
  } else {
    title += ' (no position causes collapse)';
  }
  body = text(10, 6, title, { fill: INK, 'font-weight': 'bold' }) + spread.map((line, i) => text(10, 9.9 + i * 3.4, line, { fill: MUTED, 'font-size': SMALL_TEXT })).join('') + body;
  return markFigure(svgDocument(WIDTH, 94 + extra, 'Collapse load factor of a vehicle against the position of its lead axle', body), units, (u) => scanPlot(s, u));
}
