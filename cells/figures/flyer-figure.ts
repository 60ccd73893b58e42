/**
 * flyer_figure(f): a flying buttress in elevation with the lines of least and greatest thrust
 * (Heyman, The Stone Skeleton, 1995, on the flying buttress; from memory).
 */
import type { Flyer } from '../supports/flyer.js';
import { el, pathData, svgDocument, text, INK, MUTED, type P } from './svg.js';
import { boundsOf, fitFrame } from './frame.js';
import { dimension, factLines, legendItem, scaleBar } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';
import { markFigure } from './registry.js';

const WIDTH = 170;
const RED = '#a3162b';
const LEAST = { stroke: RED, 'stroke-width': 0.6 };
const MOST = { stroke: '#2c4a6b', 'stroke-width': 0.6, 'stroke-dasharray': '2.4 1.2' };

/**
 * Draws a flyer and its lines of thrust.
 * @param f from flying_buttress (SI)
 * @returns an SVG string, recorded as a figure
 * @example flyer_figure(f)
 */
export function flyerFigure(f: Flyer, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const { xs, zi, ze } = f.model;
  const top = xs.map((x, i) => ({ x, y: ze[i]! })), bottom = xs.map((x, i) => ({ x, y: zi[i]! }));
  const L = xs[xs.length - 1]!;
  const b = boundsOf([top, bottom], 0.12 * L);
  const frame = fitFrame(b, { left: 12, top: 12, width: 100, height: 60 });
  let body = text(10, 6, 'Flying buttress: lines of least and greatest thrust', { fill: INK, 'font-weight': 'bold' });
  body += el('path', { d: pathData([...top, ...bottom.slice().reverse()].map((p) => frame.at(p)), true), fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35 });
  // The wall face at x = 0 and the pier face at x = L.
  for (const [x, y0, y1] of [[0, zi[0]! - 0.3 * L, ze[0]! + 0.1 * L], [L, zi[zi.length - 1]! - 0.3 * L, ze[ze.length - 1]! + 0.05 * L]] as const) {
    const p = frame.at({ x, y: y0 }), q = frame.at({ x, y: y1 });
    body += el('line', { x1: p.x, y1: p.y, x2: q.x, y2: q.y, stroke: MUTED, 'stroke-width': 0.3, 'stroke-dasharray': '1 0.8' });
  }
  body += el('path', { d: pathData(f.thrust_min.map((p) => frame.at({ x: p.x, y: p.z }))), ...LEAST });
  if (f.thrust_max.length > 0) body += el('path', { d: pathData(f.thrust_max.map((p) => frame.at({ x: p.x, y: p.z }))), ...MOST });
  body += dimension(frame.at({ x: 0, y: b.yMin + 0.05 * L }), frame.at({ x: L, y: b.yMin + 0.05 * L }), -2, `span ${say.length(L)}`);
  const facts = [
    `weight ${say.force(f.W)}`,
    `least thrust ${say.force(f.H_min)} (under its own weight)`,
    `greatest thrust ${Number.isFinite(f.H_max) ? say.force(f.H_max) : '∞ (a straight line fits; crushing governs)'}`,
    `least-thrust state: wall ${say.force(f.V_wall)}, pier ${say.force(f.V_pier)} vertical`,
    ...(typeof f.H_crush === 'number' ? [`crushing at a thrust of ${say.force(f.H_crush)}`] : []),
  ];
  // The legend, then each fact wrapped to the room right of the drawing.
  body += legendItem({ x: 116, y: 18 }, LEAST, 'line of least thrust') + legendItem({ x: 116, y: 22.5 }, MOST, 'line of greatest thrust');
  const written = factLines(facts.map((t) => [t, { fill: INK }]), { x: 116, y: 29 }, WIDTH - 116 - 2);
  body += written.body;
  body += scaleBar(frame.scale, { x: 12, y: 80 }, 30, say.unit('length'), say.perSI('length'));
  return markFigure(svgDocument(WIDTH, Math.max(88, written.y + 2), 'Flying buttress in elevation with its lines of least and greatest thrust', body), units, (u) => flyerFigure(f, u));
}
