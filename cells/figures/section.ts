/**
 * section(ring, limit): the ring to scale with its intrados and extrados,
 * the lines of least and greatest thrust inside it, and the hinges where the
 * line of least thrust touches a face — the picture behind Heyman's safe
 * theorem (Heyman, The Stone Skeleton, 1995, ch. 2–3).
 */
import type { ArchLimit, ArchLoads, ArchRing, Hinge } from '../vault/arch/types.js';
import { archFigure } from '../vault/arch/arch-figure.js';
import { ringPoint } from '../vault/arch/ring-point.js';
import { el, pathData, svgDocument, text, INK, MUTED, type P } from './svg.js';
import { boundsOf, fitFrame } from './frame.js';
import { dimension, kilonewtons, label, legendItem, metres, scaleBar } from './marks.js';
import { markFigure } from './registry.js';

const LEAST = { stroke: '#2c4a6b', 'stroke-width': 0.55, 'stroke-dasharray': '2.4 1.2' };
const GREATEST = { stroke: '#a3162b', 'stroke-width': 0.55, 'stroke-dasharray': '3.2 1 0.7 1' };
const WIDTH = 170;

/** Hinge positions on the faces, checked against the line drawn so that ring, limit and loads belong together. */
function hingePoints(ring: ArchRing, hinges: readonly Hinge[], line: readonly P[] | undefined, what: string): P[] {
  return hinges.map((h) => {
    const face = ringPoint(ring.centreline, h.angle, (h.face === 'extrados' ? 1 : -1) * ring.thickness / 2);
    if (line) {
      const j = ring.joints.findIndex((jt) => Math.abs(jt.angle - h.angle) < 1e-9);
      const on = j >= 0 ? line[j] : undefined;
      if (!on || Math.hypot(on.x - face.x, on.y - face.y) > 1e-3 * ring.thickness) {
        throw new RangeError(`section: the ${what} of arch_limit do not lie on the line of thrust drawn for this ring; `
          + 'pass section(r, a, loads) with the same ring and loads as arch_limit');
      }
    }
    return face;
  });
}

/**
 * Draws the section of a ring with its extreme lines of thrust.
 * @param ring from arch_ring (SI)
 * @param limit from arch_limit on the same ring
 * @param loads the loads given to arch_limit, if any
 * @returns an SVG string, recorded as a figure
 * @example section(archRing({...}), archLimit(ring)) // '<svg …'
 */
export function section(ring: ArchRing, limit: ArchLimit, loads: ArchLoads = {}): string {
  const fig = archFigure(ring, loads);
  const hinges = hingePoints(ring, Array.isArray(limit.hinges) ? limit.hinges : [], fig.thrust_min, 'hinges');
  const mechanism = hingePoints(ring, Array.isArray(limit.mechanism) ? limit.mechanism : [], undefined, 'mechanism hinges');
  const s = ring.span / 2;
  const abutment = 0.06 * ring.span + ring.thickness;
  const bounds = boundsOf([fig.extrados, fig.intrados, [{ x: -s - abutment, y: -0.05 * ring.span }, { x: s + abutment, y: 0 }]], 0.02 * ring.span);
  const aspect = (bounds.yMax - bounds.yMin) / (bounds.xMax - bounds.xMin);
  const drawH = Math.min(110, Math.max(35, 150 * aspect));
  const top = 22;
  const frame = fitFrame(bounds, { left: 10, top, width: 150, height: drawH });
  const at = (p: P) => frame.at(p);
  const ringOutline = pathData([...fig.extrados.map(at), ...[...fig.intrados].reverse().map(at)], true);
  let body = el('path', { d: ringOutline, fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35, 'stroke-linejoin': 'round' });
  // A few joints only: the analysis uses many thin voussoirs, the drawing suggests the coursing.
  const every = Math.max(1, Math.ceil(fig.joints.length / 24));
  body += el('g', { stroke: MUTED, 'stroke-width': 0.12 }, fig.joints.filter((_, i) => i % every === 0).map((j) => {
    const a = at(j.intrados), b = at(j.extrados);
    return el('line', { x1: a.x, y1: a.y, x2: b.x, y2: b.y });
  }).join(''));
  // Abutments: hatched blocks under each springing.
  const hatch = (x0: number, x1: number) => {
    const a = at({ x: x0, y: 0 }), b = at({ x: x1, y: -0.05 * ring.span });
    let h = el('line', { x1: a.x, y1: a.y, x2: b.x, y2: a.y, stroke: INK, 'stroke-width': 0.35 });
    for (let x = a.x; x < b.x - 0.1; x += 1.6) h += el('line', { x1: x, y1: b.y, x2: Math.min(x + 1.6, b.x), y2: a.y, stroke: MUTED, 'stroke-width': 0.15 });
    return h;
  };
  body += hatch(-s - abutment, -s + ring.thickness * 0.2) + hatch(s - ring.thickness * 0.2, s + abutment);
  if (fig.thrust_max) body += el('path', { d: pathData(fig.thrust_max.map(at)), ...GREATEST });
  if (fig.thrust_min) body += el('path', { d: pathData(fig.thrust_min.map(at)), ...LEAST });
  body += hinges.map((p) => { const q = at(p); return el('circle', { cx: q.x, cy: q.y, r: 1.1, fill: '#fff', stroke: INK, 'stroke-width': 0.4 }); }).join('');
  body += mechanism.map((p) => { const q = at(p); return el('circle', { cx: q.x, cy: q.y, r: 0.8, fill: INK }); }).join('');
  // Dimensions: span along the springing line, rise at the crown, thickness at the crown.
  const base = top + drawH;
  body += dimension(at({ x: -s, y: 0 }), at({ x: s, y: 0 }), -(base - frame.y(0) + 5), `span ${metres(ring.span)}`);
  body += dimension(at({ x: s * 0.0, y: 0 }), at({ x: 0, y: ring.rise }), -4, `rise ${metres(ring.rise)}`);
  const crownTop = fig.extrados.reduce((m, p) => (p.y > m.y ? p : m));
  body += label(frame.x(crownTop.x), frame.y(crownTop.y) - 3.5, `t = ${metres(ring.thickness)}`);
  // Legend.
  let legend = '';
  let y = 5;
  if (fig.thrust_min) { legend += legendItem({ x: 10, y }, LEAST, `line of least thrust${typeof limit.H_min === 'number' ? `, H_min = ${kilonewtons(limit.H_min)}` : ''}`); y += 4; }
  if (fig.thrust_max) { legend += legendItem({ x: 10, y }, GREATEST, `line of greatest thrust${typeof limit.H_max === 'number' && Number.isFinite(limit.H_max) ? `, H_max = ${kilonewtons(limit.H_max)}` : ''}`); y += 4; }
  if (!fig.thrust_min) { legend += text(10, y + 0.9, 'no line of thrust fits within the ring: NOT SAFE', { fill: '#a3162b', 'font-weight': 'bold' }); y += 4; }
  if (hinges.length) { legend += el('circle', { cx: 14, cy: y, r: 1.1, fill: '#fff', stroke: INK, 'stroke-width': 0.4 }) + text(20, y + 0.9, 'hinge of the least-thrust line', { fill: INK }); y += 4; }
  if (mechanism.length) legend += el('circle', { cx: 14, cy: y, r: 0.8, fill: INK }) + text(20, y + 0.9, `hinge of the collapse mechanism${typeof limit.load_factor === 'number' ? ` (load factor ${limit.load_factor.toFixed(2)})` : ''}`, { fill: INK });
  legend += text(WIDTH - 10, 5.9, `geometric factor of safety ${limit.gsf.toFixed(2)}`, { 'text-anchor': 'end', fill: INK, 'font-weight': 'bold' });
  const height = base + 22;
  body += scaleBar(frame.scale, { x: 10, y: height - 9 });
  return markFigure(svgDocument(WIDTH, height, `Section of the ${ring.shape} ring with its lines of thrust`, legend + body));
}
