/**
 * force_polygon(ring, limit): the force polygon of the line of least
 * thrust. The loads on the ring, left to right, make the vertical load line;
 * the pole stands H to its left, level with the point that splits the load
 * line into V_left and V_right; each ray is the thrust between two parts of
 * the ring, the first and last rays the springing reactions (graphic statics
 * as in Heyman, The Stone Skeleton, 1995, ch. 2; any text on funicular polygons).
 */
import type { ArchLimit, ArchLoads, ArchRing } from '../vault/arch/types.js';
import { voussoirLoads } from '../vault/arch/voussoir-loads.js';
import { checkLoads } from '../vault/arch/check-loads.js';
import { el, svgDocument, text, INK, MUTED, type P } from './svg.js';
import { label, scaleBar } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';
import { markFigure } from './registry.js';

const WIDTH = 170;
/** Loads are grouped into this many parts of the ring, so the rays stay countable. */
const GROUPS = 12;

/**
 * Draws the force polygon of the least-thrust state.
 * @param ring from arch_ring; limit from arch_limit on it; loads as given to arch_limit
 * @returns an SVG string, recorded as a figure
 * @example force_polygon(r, a)
 */
export function forcePolygon(ring: ArchRing, limit: ArchLimit, loads: ArchLoads = {}, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const { H_min: H, V_left: Vl, V_right: Vr } = limit;
  if (typeof H !== 'number' || typeof Vl !== 'number' || typeof Vr !== 'number') {
    throw new RangeError('force_polygon: no line of thrust fits within this ring, so there is no force polygon to draw');
  }
  checkLoads('force_polygon', ring, loads);
  const { fixed, live } = voussoirLoads(ring, ring.thickness, loads);
  const perVoussoir = fixed.map((f, i) => f.W + live[i]!.W);
  const total = perVoussoir.reduce((a, b) => a + b, 0);
  if (Math.abs(total - (Vl + Vr)) > 1e-6 * total) {
    throw new RangeError('force_polygon: the reactions of arch_limit do not add up to the loads on this ring; '
      + 'pass force_polygon(r, a, loads) with the same ring and loads as arch_limit');
  }
  // Group boundaries: cumulative load after each group of voussoirs.
  const per = Math.ceil(perVoussoir.length / GROUPS);
  const cuts = [0];
  let acc = 0;
  perVoussoir.forEach((w, i) => { acc += w; if ((i + 1) % per === 0 || i === perVoussoir.length - 1) cuts.push(acc); });
  // Force scale: the polygon (H wide, total high) fits 90 × 110 mm.
  const scale = Math.min(90 / H, 110 / total);
  const lineX = 20 + H * scale + 25, top = 14;
  const pole: P = { x: lineX - H * scale, y: top + Vl * scale };
  const on = (w: number): P => ({ x: lineX, y: top + w * scale });
  let body = el('line', { x1: lineX, y1: top, x2: lineX, y2: top + total * scale, stroke: INK, 'stroke-width': 0.7 });
  body += el('g', { stroke: INK, 'stroke-width': 0.3 }, cuts.map((c) => { const q = on(c); return el('line', { x1: q.x - 1.2, y1: q.y, x2: q.x + 1.2, y2: q.y }); }).join(''));
  body += el('g', { stroke: '#2c4a6b', 'stroke-width': 0.25 }, cuts.slice(1, -1).map((c) => { const q = on(c); return el('line', { x1: pole.x, y1: pole.y, x2: q.x, y2: q.y }); }).join(''));
  // The springing reactions and the horizontal thrust, drawn heavier.
  body += el('g', { stroke: '#a3162b', 'stroke-width': 0.6 }, [on(0), on(total)].map((q) => el('line', { x1: pole.x, y1: pole.y, x2: q.x, y2: q.y })).join(''));
  body += el('line', { x1: pole.x, y1: pole.y, x2: lineX, y2: pole.y, stroke: INK, 'stroke-width': 0.45, 'stroke-dasharray': '1.5 0.8' });
  body += el('circle', { cx: pole.x, cy: pole.y, r: 0.9, fill: INK });
  body += label(pole.x - 2, pole.y + 0.9, 'pole O', 'end');
  body += label((pole.x + lineX) / 2, pole.y - 1.4, `H = ${say.force(H)}`);
  const Rl = Math.hypot(H, Vl), Rr = Math.hypot(H, Vr);
  const deg = (v: number) => `${((Math.atan2(v, H) * 180) / Math.PI).toFixed(1)}°`;
  body += label((pole.x + lineX) / 2 - 3, (pole.y + top) / 2 - 1.5, `R_left = ${say.force(Rl)} at ${deg(Vl)}`, 'end', { fill: '#a3162b' });
  body += label((pole.x + lineX) / 2 - 3, (pole.y + on(total).y) / 2 + 3.5, `R_right = ${say.force(Rr)} at ${deg(Vr)}`, 'end', { fill: '#a3162b' });
  body += label(lineX + 3, (top + pole.y) / 2 + 0.9, `V_left = ${say.force(Vl)}`, 'start');
  body += label(lineX + 3, (pole.y + on(total).y) / 2 + 0.9, `V_right = ${say.force(Vr)}`, 'start');
  body += label(lineX + 3, on(total).y + 4.5, `ΣW = ${say.force(total)}`, 'start', { fill: MUTED });
  const height = top + total * scale + 22;
  const notes = text(10, 6, `Force polygon of the line of least thrust: loads in ${cuts.length - 1} parts of the ring, left to right (top to bottom).`, { fill: INK });
  body += scaleBar(scale, { x: 10, y: height - 9 }, 40, say.unit('force'), say.perSI('force'));
  return markFigure(svgDocument(WIDTH, height, 'Force polygon of the line of least thrust', notes + body), units, (u) => forcePolygon(ring, limit, loads, u));
}
