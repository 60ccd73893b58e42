/**
 * support_figure(b, options): a wall or buttress in elevation, with the
 * vault's thrust, the path of the resultant through every level and the
 * middle third of each section (rigid-block statics with no tension;
 * Heyman, The Stone Skeleton, 1995, on buttresses).
 */
import type { Buttress } from '../supports/buttress.js';
import { buttressBlocks, type ButtressOptions } from '../supports/blocks.js';
import { el, pathData, svgDocument, text, INK, MUTED, type P } from './svg.js';
import { fitFrame } from './frame.js';
import { arrow, dimension, factLines, label, legendItem, scaleBar } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits, type Readout } from './readout.js';
import { markFigure } from './registry.js';

const WIDTH = 170;
const RED = '#a3162b';
const PATH = { stroke: RED, 'stroke-width': 0.6 };
const THIRD = { stroke: '#2c4a6b', 'stroke-width': 0.3, 'stroke-dasharray': '1.6 1' };

/** A least width, or "any" when every width keeps the resultant inside. */
function widthText(w: number | { reason: string }, say: Readout): string {
  return typeof w === 'number' ? say.length(w) : 'any';
}

/**
 * Draws a support with its line of thrust.
 * @param b from buttress (SI)
 * @param o the options given to buttress (the result does not carry its geometry)
 * @returns an SVG string, recorded as a figure
 * @example support_figure(b, opts)
 */
export function supportFigure(b: Buttress, o: ButtressOptions, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const blocks = buttressBlocks(o);
  const B = blocks[0]!.b;
  const height = blocks[blocks.length - 1]!.z0 + blocks[blocks.length - 1]!.h;
  if (Math.abs(B - b.base_width) > 1e-9 * B || b.path.length === 0 || Math.abs(b.path[b.path.length - 1]!.x - b.x_R) > 1e-6 * B) {
    throw new RangeError('support_figure: these options do not describe the support of this buttress result; pass the same options as to buttress');
  }
  // World: X from the inner (vault) face, positive outwards; z up from the base.
  const margin = Math.max(height, B) * 0.12;
  const world = { xMin: -B * 1.2 - margin, xMax: B + margin * 2, yMin: -margin * 0.6, yMax: height + margin * 0.5 };
  // The drawing takes the height its proportions need, between 60 and 110 mm.
  const drawH = Math.min(110, Math.max(60, (100 * (world.yMax - world.yMin)) / (world.xMax - world.xMin)));
  // Room above for the vault's load arrow (up to 14 mm).
  const top = 26;
  const frame = fitFrame(world, { left: 10, top, width: 100, height: drawH });
  const at = (X: number, z: number): P => frame.at({ x: X, y: z });
  let body = text(10, 6, 'Support in elevation: the thrust, the path of the resultant and the middle third', { fill: INK, 'font-weight': 'bold' });
  for (const blk of blocks) {
    const a = at(0, blk.z0 + blk.h), c = at(blk.b, blk.z0);
    body += el('rect', { x: a.x, y: a.y, width: c.x - a.x, height: c.y - a.y, fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35 });
    for (const f of [1 / 3, 2 / 3]) {
      const p = at(blk.b * f, blk.z0), q = at(blk.b * f, blk.z0 + blk.h);
      body += el('line', { x1: p.x, y1: p.y, x2: q.x, y2: q.y, ...THIRD });
    }
  }
  // Ground under the base.
  const g0 = at(-B * 0.3, 0), g1 = at(B * 1.3, 0);
  body += el('line', { x1: g0.x, y1: g0.y, x2: g1.x, y2: g1.y, stroke: INK, 'stroke-width': 0.4 });
  for (let x = g0.x; x < g1.x - 0.1; x += 1.6) body += el('line', { x1: x, y1: g0.y + 1.6, x2: x + 1.6, y2: g0.y, stroke: MUTED, 'stroke-width': 0.15 });
  // The path of the resultant; x of the path is measured from the outer toe.
  const path = b.path.map((p) => at(B - p.x, p.z));
  body += el('path', { d: pathData(path), ...PATH });
  // Thrust of the vault and its vertical load, to one force scale.
  const fmax = Math.max(o.T, o.V ?? 0, 1e-9), len = (f: number) => (f / fmax) * Math.min(B * frame.scale, 14);
  if (o.T > 0 && o.z_T !== undefined) {
    const tHead = at(0, o.z_T);
    body += arrow({ x: tHead.x - len(o.T), y: tHead.y }, tHead, '', INK);
    body += label(tHead.x - len(o.T) / 2, tHead.y - 1.6, `T = ${say.force(o.T)}`);
  }
  if (o.V) {
    const v = at(o.x_V ?? 0, height);
    body += arrow({ x: v.x, y: v.y - len(o.V) }, v, '', INK) + label(v.x + 1.5, v.y - len(o.V) / 2, `V = ${say.force(o.V)}`, 'start');
  }
  // The resultant on the base.
  const base = at(B - b.x_R, 0);
  body += arrow({ x: base.x, y: base.y - 9 }, { x: base.x, y: base.y + 0.2 }, '', RED);
  body += label(base.x + 1.5, base.y - 5, `N = ${say.force(b.N)}`, 'start', { fill: RED });
  body += dimension(at(0, 0), at(B, 0), -9, `base ${say.length(B)}`);
  body += dimension(at(B, 0), at(B, height), -(B * 0.1 * frame.scale + 6), `height ${say.length(height)}`);
  if (o.T > 0 && o.z_T !== undefined) body += dimension(at(0, 0), at(0, o.z_T), 5, `z_T ${say.length(o.z_T)}`);
  // Verdicts and the legend, on the right.
  const lines = [
    [`resultant at the base: ${say.length(b.x_R)} from the outer toe,`, INK],
    [`eccentricity e = ${say.length(b.e)} from the centre of the base`, INK],
    [b.middle_third ? 'within the middle third of the base' : b.in_base ? 'OUTSIDE the middle third: part of the base lifts' : 'OUTSIDE the base: the support overturns', b.middle_third ? INK : RED],
    [`overturning: safety factor ${Number.isFinite(b.sf_overturning) ? b.sf_overturning.toFixed(2) : '∞ (no thrust)'}`, b.sf_overturning < 1 ? RED : INK],
    [`least base width: ${widthText(b.width_min_third, say)} (middle third), ${widthText(b.width_min_base, say)} (in base)`, INK],
    ...(typeof b.sigma_max === 'number' ? [[`base pressure: max ${say.pressure(b.sigma_max)}, min ${say.pressure(typeof b.sigma_min === 'number' ? b.sigma_min : 0)}`, INK]] : []),
    ...(typeof b.sf_sliding === 'number' && Number.isFinite(b.sf_sliding) ? [[`sliding: µN/T = ${b.sf_sliding.toFixed(2)}`, b.sf_sliding < 1 ? RED : INK]] : []),
  ] as Array<[string, string]>;
  // Each fact wrapped to the room right of the drawing.
  const facts = factLines(lines.map(([t, c]) => [t, { fill: c, 'font-weight': c === RED ? 'bold' : undefined }]), { x: 112, y: 30 }, WIDTH - 112 - 2);
  body += facts.body;
  const y = facts.y;
  body += legendItem({ x: 112, y: 20 }, PATH, 'path of the resultant') + legendItem({ x: 112, y: 24.5 }, THIRD, 'middle third of each section');
  body += scaleBar(frame.scale, { x: 10, y: top + drawH + 12 }, 35, say.unit('length'), say.perSI('length'));
  return markFigure(svgDocument(WIDTH, Math.max(top + drawH + 20, y + 2), 'Support in elevation with the path of the resultant and the middle third', body), units, (u) => supportFigure(b, o, u));
}
