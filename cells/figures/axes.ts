/**
 * A plot panel: linear axes with round ticks, a light grid, a heavier zero
 * line, and curves drawn in distinct dash patterns (readable in greyscale).
 */
import { el, pathData, text, INK, MUTED, SMALL_TEXT, type P } from './svg.js';
import { niceStep } from './frame.js';

export interface Box { left: number; top: number; width: number; height: number }

export interface Panel {
  x(v: number): number;
  y(v: number): number;
  /** Axes, ticks and grid. */
  frame: string;
  /** A curve through (v, w) pairs. */
  curve(points: Array<[number, number]>, style: Record<string, string | number>): string;
}

/** A tick label: no more digits than the step needs. */
function tickText(v: number, step: number): string {
  const digits = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const t = v.toFixed(Math.min(digits, 6));
  return t.startsWith('-') ? `−${t.slice(1)}` : t;
}

function ticks(lo: number, hi: number, count: number): { values: number[]; step: number } {
  const step = niceStep((hi - lo) / count);
  const values: number[] = [];
  for (let v = Math.ceil(lo / step - 1e-9) * step; v <= hi + step * 1e-9; v += step) values.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return { values, step };
}

/**
 * A panel for values in [xr] × [yr], widened to round ticks and always including zero on y.
 * @param box paper box (mm)
 * @param xLabel, yLabel axis titles (our own words)
 */
export function panel(box: Box, xr: [number, number], yr: [number, number], xLabel: string, yLabel: string): Panel {
  let [y0, y1] = [Math.min(yr[0], 0), Math.max(yr[1], 0)];
  if (y1 - y0 < 1e-12) { y0 -= 1; y1 += 1; }
  const ty = ticks(y0, y1, 5);
  y0 = Math.min(y0, ty.values[0]!); y1 = Math.max(y1, ty.values[ty.values.length - 1]!);
  const [x0, x1] = xr[1] - xr[0] < 1e-12 ? [xr[0] - 1, xr[0] + 1] : xr;
  const tx = ticks(x0, x1, 6);
  const x = (v: number) => box.left + ((v - x0) / (x1 - x0)) * box.width;
  const y = (v: number) => box.top + ((y1 - v) / (y1 - y0)) * box.height;
  let frame = el('rect', { x: box.left, y: box.top, width: box.width, height: box.height, stroke: INK, 'stroke-width': 0.25 });
  // The grid: pale hairlines under everything, marked so that a measure of the printed sheet can tell them from
  // the drawing (a label's halo may lie over them; it must not lie over a drawn line).
  frame += el('g', { class: 'vb-grid', stroke: '#d9dee3', 'stroke-width': 0.15 }, ty.values.map((v) => el('line', { x1: box.left, y1: y(v), x2: box.left + box.width, y2: y(v) })).join('')
    + tx.values.filter((v) => v >= x0 && v <= x1).map((v) => el('line', { x1: x(v), y1: box.top, x2: x(v), y2: box.top + box.height })).join(''));
  frame += el('line', { x1: box.left, y1: y(0), x2: box.left + box.width, y2: y(0), stroke: INK, 'stroke-width': 0.35 });
  frame += el('g', { fill: MUTED, 'font-size': SMALL_TEXT }, ty.values.map((v) => text(box.left - 1.2, y(v) + 0.8, tickText(v, ty.step), { 'text-anchor': 'end' })).join('')
    + tx.values.filter((v) => v >= x0 && v <= x1).map((v) => text(x(v), box.top + box.height + 3, tickText(v, tx.step), { 'text-anchor': 'middle' })).join(''));
  frame += text(box.left + box.width / 2, box.top + box.height + 6.5, xLabel, { 'text-anchor': 'middle', fill: INK });
  const yl: P = { x: box.left - 11, y: box.top + box.height / 2 };
  frame += text(yl.x, yl.y, yLabel, { 'text-anchor': 'middle', fill: INK, transform: `rotate(-90 ${yl.x.toFixed(2)} ${yl.y.toFixed(2)})` });
  return {
    x, y, frame,
    curve: (points, style) => el('path', { d: pathData(points.map(([a, b]) => ({ x: x(a), y: y(b) }))), 'stroke-linejoin': 'round', ...style }),
  };
}
