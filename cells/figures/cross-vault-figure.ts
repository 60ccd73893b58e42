/**
 * cross_vault_figure(c): a cross vault cut into slices — in plan the slice planes of each web and
 * the corner thrusts of the least-thrust state; the two elevations with the webs, the solid pocket,
 * where each slice springs and the corner's horizontal thrust at its height z_x_min / z_y_min, on the
 * corner's plane (slicing after Heyman, The Stone Skeleton, 1995; from memory).
 */
import type { CrossVault } from '../vault/groin/cross-vault.js';
import { webU, webZ, type WebArc } from '../vault/groin/cross-webs.js';
import { el, pathData, svgDocument, text, INK, MUTED, SMALL_TEXT, type P } from './svg.js';
import { fitFrame } from './frame.js';
import { arrow, dimension, factLines, scaleBar } from './marks.js';
import { wrapLines } from './labels.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';
import { markFigure } from './registry.js';

const RED = '#a3162b', BLUE = '#2c4a6b';
const WIDTH = 170;
/** Where the elevations stand: right of the plan, each drawing in a box this high under its heading (mm). */
const ELEV = { left: 90, width: 76, height: 34 };

/** The web's middle surface offset by d, left springing to right. */
function webOutline(w: WebArc, d: number): P[] {
  const right = Array.from({ length: 37 }, (_, i) => {
    const phi = w.phiC + ((w.phiEnd - w.phiC) * i) / 36;
    return { x: webU(w, phi) + d * Math.sin(phi), y: webZ(w, phi) + d * Math.cos(phi) };
  });
  return [...right.map((p) => ({ x: -p.x, y: p.y })).reverse(), ...right];
}

/**
 * Draws a sliced cross vault.
 * @param c from cross_vault (SI)
 * @returns an SVG string, recorded as a figure
 * @example cross_vault_figure(c)
 */
export function crossVaultFigure(c: CrossVault, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const { x: wx, y: wy, slices } = c.model;
  const ex = wx.e, ey = wy.e, reach = Math.max(ex, ey) * 0.5;
  const views = [
    { w: wx, name: 'x', H: c.H_x_min, z: c.z_x_min, clear: c.span_x },
    { w: wy, name: 'y', H: c.H_y_min, z: c.z_y_min, clear: c.span_y },
  ].map((view) => {
    const thrust = typeof view.H === 'number' && typeof view.z === 'number'
      ? `H_${view.name},min = ${say.force(view.H)} at z = ${say.length(view.z)}`
      : 'a slice holds no line of thrust';
    // Each elevation's heading, wrapped to the elevation's width: the drawing stands under it, not through it.
    const title = wrapLines(`across the ${view.name}-span (${view.w.shape}): ${thrust}`, ELEV.width, SMALL_TEXT);
    return { ...view, title, outline: [...webOutline(view.w, view.w.h), ...webOutline(view.w, -view.w.h).reverse()] };
  });
  // Plan left, the two elevations stacked right; one scale for all three. An elevation's ground line
  // stands 6 mm above its box's foot, room for the clear span's dimension under it.
  const planBox = { left: 8, top: 14, width: 72, height: 72 };
  const frameP = fitFrame({ xMin: -ex - reach, xMax: ex + reach, yMin: -ey - reach, yMax: ey + reach }, planBox);
  const top = Math.max(...views.flatMap((v) => v.outline.map((p) => p.y)));
  const scale = Math.min(frameP.scale, ELEV.width / (2 * (Math.max(ex, ey) + reach)), (ELEV.height - 6) / top);
  const pl = (p: P): P => ({ x: planBox.left + planBox.width / 2 + p.x * scale, y: planBox.top + planBox.height / 2 - p.y * scale });
  let body = text(8, 6, 'PLAN: slice planes', { fill: INK, 'font-weight': 'bold' });
  const heading = wrapLines('ELEVATIONS: slices\u2019 springings, solid pocket, corner thrust', WIDTH - ELEV.left - 2);
  body += heading.map((line, i) => text(ELEV.left, 6 + i * 3.6, line, { fill: INK, 'font-weight': 'bold' })).join('');
  const corners = [{ x: ex, y: ey }, { x: -ex, y: ey }, { x: -ex, y: -ey }, { x: ex, y: -ey }];
  body += el('path', { d: pathData(corners.map(pl), true), fill: '#f1f3f5', stroke: INK, 'stroke-width': 0.45 });
  // Slice planes: an x-web slice at y = ±v spans x between the groins at ±u; a y-web slice at x = ±v.
  let lines = '';
  for (const s of slices) {
    for (const a of [1, -1]) {
      const [p, q] = s.web === 'x' ? [{ x: -s.u, y: a * s.v }, { x: s.u, y: a * s.v }] : [{ x: a * s.v, y: -s.u }, { x: a * s.v, y: s.u }];
      lines += el('line', { x1: pl(p).x, y1: pl(p).y, x2: pl(q).x, y2: pl(q).y, stroke: Number.isFinite(s.H_min) ? MUTED : RED });
    }
  }
  body += el('g', { 'stroke-width': 0.2 }, lines);
  for (const [a, b] of [[1, 1], [-1, 1], [-1, -1], [1, -1]]) body += el('line', { x1: pl({ x: 0, y: 0 }).x, y1: pl({ x: 0, y: 0 }).y, x2: pl({ x: a! * ex, y: b! * ey }).x, y2: pl({ x: a! * ex, y: b! * ey }).y, stroke: INK, 'stroke-width': 0.35, 'stroke-dasharray': '1.2 0.8' });
  const Hx = typeof c.H_x_min === 'number' ? c.H_x_min : 0, Hy = typeof c.H_y_min === 'number' ? c.H_y_min : 0;
  const fmax = Math.max(Hx, Hy, 1e-9), len = (f: number) => (f / fmax) * reach * 0.8 * scale;
  for (const k of corners) {
    const q = pl(k);
    body += el('rect', { x: q.x - 1.3, y: q.y - 1.3, width: 2.6, height: 2.6, fill: INK });
    body += arrow(q, { x: q.x + Math.sign(k.x) * len(Hx), y: q.y }, '', BLUE) + arrow(q, { x: q.x, y: q.y - Math.sign(k.y) * len(Hy) }, '', BLUE);
  }
  body += dimension(pl({ x: -c.span_x / 2, y: -ey }), pl({ x: c.span_x / 2, y: -ey }), -4, `clear ${say.length(c.span_x)} (x)`);
  body += dimension(pl({ x: -ex, y: c.span_y / 2 }), pl({ x: -ex, y: -c.span_y / 2 }), -(reach * 0.8 * scale + 4), `clear ${say.length(c.span_y)} (y)`);
  // Each elevation under its heading; y is where the next begins.
  let y = 6 + 3.6 * heading.length;
  for (const view of views) {
    body += view.title.map((line, i) => text(ELEV.left, y + 1 + i * 3.4, line, { fill: typeof view.H === 'number' ? MUTED : RED, 'font-size': SMALL_TEXT })).join('');
    const base = y + 3.4 * view.title.length + ELEV.height - 6;
    const ev = (p: P): P => ({ x: ELEV.left + ELEV.width / 2 + p.x * scale, y: base - p.y * scale });
    const w = view.w;
    body += el('path', { d: pathData(view.outline.map(ev), true), fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35 });
    if (c.solid_level > 0) {
      const a = ev({ x: -w.e - w.h, y: c.solid_level }), b = ev({ x: w.e + w.h, y: c.solid_level });
      body += el('line', { x1: a.x, y1: a.y, x2: b.x, y2: b.y, stroke: BLUE, 'stroke-width': 0.3, 'stroke-dasharray': '1.5 1' });
    }
    for (const s of slices.filter((sl) => sl.web === view.name && sl.H_min > 0)) {
      for (const side of [-1, 1]) body += el('circle', { cx: ev({ x: side * s.x_min, y: s.z_min }).x, cy: ev({ x: side * s.x_min, y: s.z_min }).y, r: 0.45, fill: RED });
    }
    body += el('line', { x1: ev({ x: -w.e - reach, y: 0 }).x, y1: base, x2: ev({ x: w.e + reach, y: 0 }).x, y2: base, stroke: INK, 'stroke-width': 0.3 });
    body += dimension(ev({ x: -view.clear / 2, y: 0 }), ev({ x: view.clear / 2, y: 0 }), -2.5, `clear ${say.length(view.clear)}`);
    if (typeof view.H === 'number' && typeof view.z === 'number' && view.z >= 0) {
      const cpt = ev({ x: w.e, y: view.z });
      body += arrow(cpt, { x: cpt.x + len(view.H), y: cpt.y }, '', RED) + el('circle', { cx: cpt.x, cy: cpt.y, r: 0.8, fill: RED });
    }
    y = base + 6 + 3;
  }
  // Under the plan its scale bar; under everything the facts of the pocket and the corner, with room above them
  // for the last clear span's label to step off its line.
  const bar = planBox.top + planBox.height + 4;
  body += scaleBar(scale, { x: 8, y: bar }, 30, say.unit('length'), say.perSI('length'));
  const facts = factLines([[`solid pocket to ${say.length(c.solid_level)} (needed ${say.length(c.fill_needed)}); V = ${typeof c.V_corner === 'number' ? say.force(c.V_corner) : 'not available'} per corner; ${c.slices} slices per web`, { fill: MUTED }]],
    { x: 8, y: Math.max(bar + 10, y + 1.5) }, WIDTH - 16);
  body += facts.body;
  return markFigure(svgDocument(WIDTH, facts.y, 'Cross vault by slicing: slice planes in plan, both elevations with the slices\u2019 springings and the corner thrust', body), units, (u) => crossVaultFigure(c, u));
}
