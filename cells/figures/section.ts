/**
 * section(ring, limit): the ring to scale as it was analysed — fill to its
 * level, dead load on the surface, live loads, point loads and axles with
 * their values (and their spread through the fill), the lines of least and
 * greatest thrust and the line at collapse, and the hinges on the faces they
 * open about — the picture behind Heyman's safe theorem (Heyman, The Stone
 * Skeleton, 1995, ch. 2–3).
 */
import type { ArchLimit, ArchLoads, ArchRing, Hinge } from '../vault/arch/types.js';
import { archFigure } from '../vault/arch/arch-figure.js';
import { ringPoint } from '../vault/arch/ring-point.js';
import { extradosAngle } from '../vault/arch/extrados-angle.js';
import { el, pathData, svgDocument, text, INK, MUTED, SMALL_TEXT, TEXT_SIZE, type P } from './svg.js';
import { boundsOf, fitFrame } from './frame.js';
import { arrow, dimension, label, legendItem, scaleBar } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';
import { markFigure } from './registry.js';
import { wrapLines } from './labels.js';

const LEAST = { stroke: '#2c4a6b', 'stroke-width': 0.55, 'stroke-dasharray': '2.4 1.2' };
const GREATEST = { stroke: '#a3162b', 'stroke-width': 0.55, 'stroke-dasharray': '3.2 1 0.7 1' };
const COLLAPSE = { stroke: '#1c2630', 'stroke-width': 0.5, 'stroke-dasharray': '0.9 0.7' };
const LOAD = '#7a4b00';
const WIDTH = 170;

/** Hinge positions on the faces, checked against the line drawn so that ring, limit and loads belong together. */
function hingePoints(ring: ArchRing, hinges: readonly Hinge[], line: readonly P[] | undefined, what: string): P[] {
  return hinges.map((h) => {
    const face = { x: h.x - ring.span / 2, y: h.z };
    if (line) {
      // With finite strength the line stands half a stress block, N/(2·f_c·b), inside the face.
      const block = Number.isFinite(ring.f_c) ? h.N / (2 * ring.f_c * ring.depth) : 0;
      const near = Math.min(...line.map((on) => Math.hypot(on.x - face.x, on.y - face.y)));
      if (!(near <= block * 1.05 + 1e-3 * ring.thickness)) {
        throw new RangeError(`section: the ${what} of arch_limit do not lie on the line of thrust drawn for this ring; `
          + 'pass section(r, a, loads) with the same ring and loads as arch_limit');
      }
    }
    return face;
  });
}

/** Labels that keep clear of one another: each tries rows above (or below) its place until its box is free. */
class Labels {
  private boxes: { x0: number; x1: number; y0: number; y1: number }[] = [];
  out = '';
  /** Reserve a box (mm) that labels must avoid. */
  block(x0: number, y0: number, x1: number, y1: number): void {
    this.boxes.push({ x0, x1, y0, y1 });
  }
  place(x: number, y: number, content: string, anchor: 'start' | 'middle' | 'end', step: number, extra: Record<string, string | number> = {}): P {
    const w = content.length * TEXT_SIZE * 0.52;
    const x0 = anchor === 'start' ? x : anchor === 'end' ? x - w : x - w / 2;
    for (let k = 0; k < 40; k++) {
      const yy = y + k * step;
      const box = { x0: x0 - 0.4, x1: x0 + w + 0.4, y0: yy - TEXT_SIZE, y1: yy + 0.8 };
      if (!this.boxes.some((b) => b.x0 < box.x1 && box.x0 < b.x1 && b.y0 < box.y1 && box.y0 < b.y1)) {
        this.boxes.push(box);
        this.out += label(x, yy, content, anchor, extra);
        return { x, y: yy };
      }
    }
    this.out += label(x, y, content, anchor, extra);
    return { x, y };
  }
}

/**
 * Draws the section of a ring with what it carries and its lines of thrust.
 * @param ring from arch_ring (SI)
 * @param limit from arch_limit on the same ring
 * @param loads the loads given to arch_limit, if any
 * @returns an SVG string, recorded as a figure
 * @example section(archRing({...}), archLimit(ring)) // '<svg …'
 */
export function section(ring: ArchRing, limit: ArchLimit, loads: ArchLoads = {}, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const fig = archFigure(ring, loads);
  const hinges = hingePoints(ring, Array.isArray(limit.hinges) ? limit.hinges : [], fig.thrust_min, 'hinges');
  const mechanismHinges = Array.isArray(limit.mechanism) ? limit.mechanism : [];
  const mechanism = hingePoints(ring, mechanismHinges, fig.thrust_collapse, 'mechanism hinges');
  const s = ring.span / 2;
  const t = ring.thickness;
  const abutment = 0.06 * ring.span + t;
  const fillLevel = loads.fill_level !== undefined && (loads.fill_unit_weight ?? 0) > 0 ? loads.fill_level : undefined;
  const crownTop = fig.extrados.reduce((m, p) => (p.y > m.y ? p : m));
  const surface = Math.max(fillLevel ?? crownTop.y, crownTop.y);
  const wheels = [...(loads.P ? [{ W: loads.P, at: loads.P_at! }] : []), ...(loads.axles ?? [])];
  // Room above the surface for arrows only where there are loads to draw.
  const loadTop = surface + (wheels.length ? 0.16 : loads.live ? 0.08 : 0.02) * ring.span;
  const wheelXs = wheels.map((w) => ({ x: w.at - s, y: loadTop }));
  const bounds = boundsOf([fig.extrados, fig.intrados, wheelXs, [{ x: -s - abutment, y: -0.05 * ring.span }, { x: s + abutment, y: loadTop }]], 0.04 * ring.span);
  const aspect = (bounds.yMax - bounds.yMin) / (bounds.xMax - bounds.xMin);
  const drawH = Math.min(115, Math.max(40, 150 * aspect));
  const top = 30;
  const frame = fitFrame(bounds, { left: 10, top, width: 150, height: drawH });
  const at = (p: P) => frame.at(p);
  const labels = new Labels();
  let body = '';
  // Fill: from the abutments' tops up to the fill level, over the extrados.
  if (fillLevel !== undefined) {
    const over = fig.extrados.filter((p) => p.y <= fillLevel);
    const outline = [{ x: -s - abutment, y: 0 }, { x: -s - abutment, y: fillLevel }, { x: s + abutment, y: fillLevel }, { x: s + abutment, y: 0 },
      ...[...over].reverse()];
    body += el('path', { d: pathData(outline.map(at), true), fill: '#efe8d8', stroke: 'none' });
    body += el('line', { x1: frame.x(-s - abutment), y1: frame.y(fillLevel), x2: frame.x(s + abutment), y2: frame.y(fillLevel), stroke: LOAD, 'stroke-width': 0.35 });
  }
  const ringOutline = pathData([...fig.extrados.map(at), ...[...fig.intrados].reverse().map(at)], true);
  body += el('path', { d: ringOutline, fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35, 'stroke-linejoin': 'round' });
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
  body += hatch(-s - abutment, -s + t * 0.2) + hatch(s - t * 0.2, s + abutment);
  // Every drawn element's box, so that labels keep off it.
  const box = (pts: P[]) => {
    const q = pts.map(at);
    labels.block(Math.min(...q.map((p) => p.x)), Math.min(...q.map((p) => p.y)), Math.max(...q.map((p) => p.x)), Math.max(...q.map((p) => p.y)));
  };
  box([{ x: -s - abutment, y: 0 }, { x: -s + t * 0.2, y: -0.05 * ring.span }]);
  box([{ x: s - t * 0.2, y: 0 }, { x: s + abutment, y: -0.05 * ring.span }]);
  // Loads, drawn above the surface.
  const surfaceY = frame.y(surface);
  const loadRow = frame.y(loadTop);
  if (loads.dead) {
    body += el('rect', { x: frame.x(-s - abutment), y: surfaceY - 1.2, width: frame.x(s + abutment) - frame.x(-s - abutment), height: 1.2, fill: '#d9cfb8', stroke: LOAD, 'stroke-width': 0.15 });
    labels.place(frame.x(-s - abutment), surfaceY - 1.8, `dead ${say.pressure(loads.dead)} on plan`, 'start', -3.2, { fill: LOAD });
  }
  if (fillLevel !== undefined) {
    labels.place(frame.x(s + abutment), surfaceY - 1.8, `fill level ${say.length(fillLevel)}, ${say.weight(loads.fill_unit_weight!)}`, 'end', -3.2, { fill: LOAD });
  }
  if (loads.live) {
    const a = frame.x(loads.live_from === undefined ? -s - abutment : -s + loads.live_from);
    const b = frame.x(loads.live_to === undefined ? s + abutment : -s + loads.live_to);
    const y0 = surfaceY - 7;
    body += el('line', { x1: a, y1: y0, x2: b, y2: y0, stroke: LOAD, 'stroke-width': 0.3 });
    for (let k = 0; k <= Math.max(2, Math.round((b - a) / 4)); k++) {
      const x = a + ((b - a) * k) / Math.max(2, Math.round((b - a) / 4));
      body += arrow({ x, y: y0 }, { x, y: surfaceY - 1.4 }, '', LOAD);
    }
    labels.place((a + b) / 2, y0 - 1.2, `live ${say.pressure(loads.live)} (× λ)`, 'middle', -3.2, { fill: LOAD });
  }
  const reach = ringPoint(ring.centreline, Math.min(ring.centreline.phiSpringing, Math.PI / 2), t / 2).x;
  wheels.forEach((w) => {
    const x = w.at - s;
    const X = frame.x(x);
    const off = Math.abs(x) > reach;
    // The load acts on the road surface: the fill level, or the extrados where it stands above the fill.
    const th0 = off ? null : extradosAngle(ring.centreline, x, t / 2);
    const onTop = th0 === null ? surface : Math.max(fillLevel ?? -Infinity, ringPoint(ring.centreline, th0, t / 2).y);
    body += arrow({ x: X, y: loadRow }, { x: X, y: frame.y(onTop) - 0.2 }, '', off ? MUTED : LOAD);
    labels.place(X, loadRow - 1.2, `${say.force(w.W)}${off ? ' (off the ring)' : ''}`, 'middle', -3.2, { fill: off ? MUTED : LOAD, 'font-weight': 'bold' });
    // Spread through the fill to the extrados, as analysed.
    const th = off ? null : extradosAngle(ring.centreline, x, t / 2);
    if (th !== null && (loads.spread ?? 0) > 0 && fillLevel !== undefined) {
      const e = ringPoint(ring.centreline, th, t / 2);
      const half = loads.spread! * Math.max(0, fillLevel - e.y);
      // The part of the spread beyond the extrados goes into the abutment: the lines stop there.
      for (const side of [-1, 1]) {
        const end = Math.min(Math.max(x + side * half, -reach), reach);
        const y1 = fillLevel - (Math.abs(end - x) / Math.max(half, 1e-9)) * (fillLevel - e.y);
        body += el('line', { x1: X, y1: frame.y(fillLevel), x2: frame.x(end), y2: frame.y(y1), stroke: LOAD, 'stroke-width': 0.2, 'stroke-dasharray': '0.8 0.6' });
      }
    }
  });
  // Lines of thrust.
  if (fig.thrust_max) body += el('path', { d: pathData(fig.thrust_max.map(at)), ...GREATEST });
  if (fig.thrust_min) body += el('path', { d: pathData(fig.thrust_min.map(at)), ...LEAST });
  if (fig.thrust_collapse && mechanism.length) body += el('path', { d: pathData(fig.thrust_collapse.map(at)), ...COLLAPSE });
  // Hinges: a marker on the face, a tick across the face into the ring, and a number outside it.
  const tick = (h: Hinge, p: P) => {
    const inward = h.face === 'extrados' ? -1 : 1;
    const n = { x: Math.sin(h.angle), y: Math.cos(h.angle) };
    const a = at(p), b = at({ x: p.x + inward * n.x * t * 0.45, y: p.y + inward * n.y * t * 0.45 });
    return el('line', { x1: a.x, y1: a.y, x2: b.x, y2: b.y, stroke: INK, 'stroke-width': 0.3 });
  };
  body += hinges.map((p, i) => { const q = at(p); return tick((limit.hinges as Hinge[])[i]!, p) + el('circle', { cx: q.x, cy: q.y, r: 1.1, fill: '#fff', stroke: INK, 'stroke-width': 0.4 }); }).join('');
  body += mechanism.map((p, i) => {
    const h = mechanismHinges[i]!;
    const q = at(p);
    const out = h.face === 'extrados' ? 1 : -1;
    const n = { x: Math.sin(h.angle), y: -Math.cos(h.angle) };
    labels.place(q.x + out * n.x * 3.2, q.y + out * n.y * 3.2 + 0.9, String(i + 1), 'middle', out > 0 ? -2.8 : 2.8, { 'font-weight': 'bold' });
    return tick(h, p) + el('circle', { cx: q.x, cy: q.y, r: 0.8, fill: INK });
  }).join('');
  // Dimensions: span along the springing line, rise at the crown, thickness at the crown.
  const base = top + drawH;
  body += dimension(at({ x: -s, y: 0 }), at({ x: s, y: 0 }), -(base - frame.y(0) + 5), `span ${say.length(ring.span)}`);
  body += dimension(at({ x: 0, y: 0 }), at({ x: 0, y: ring.rise }), -4, `rise ${say.length(ring.rise)}`);
  labels.place(frame.x(crownTop.x) + 2, frame.y(crownTop.y) - 2.2, `t = ${say.length(t)}`, 'start', -3.2);
  // Legend, above the drawing.
  let legend = '';
  let y = 5;
  if (fig.thrust_min) { legend += legendItem({ x: 10, y }, LEAST, `line of least thrust${typeof limit.H_min === 'number' ? `, H_min = ${say.force(limit.H_min)}` : ''}`); y += 4; }
  if (fig.thrust_max) { legend += legendItem({ x: 10, y }, GREATEST, `line of greatest thrust${typeof limit.H_max === 'number' && Number.isFinite(limit.H_max) ? `, H_max = ${say.force(limit.H_max)}` : ''}`); y += 4; }
  if (!fig.thrust_min) { legend += text(10, y + 0.9, 'no line of thrust fits within the ring: NOT SAFE', { fill: '#a3162b', 'font-weight': 'bold' }); y += 4; }
  if (hinges.length) { legend += el('circle', { cx: 14, cy: y, r: 1.1, fill: '#fff', stroke: INK, 'stroke-width': 0.4 }) + text(20, y + 0.9, 'hinge of the least-thrust line (tick: into the ring from its face)', { fill: INK }); y += 4; }
  if (mechanism.length && typeof limit.load_factor === 'number') {
    legend += legendItem({ x: 10, y }, COLLAPSE, `line at collapse, λ = ${limit.load_factor.toFixed(2)}; hinges 1–${mechanism.length} of the mechanism (●)`);
    y += 4;
  }
  legend += text(WIDTH - 10, 5.9, `geometric factor of safety ${limit.gsf.toFixed(2)}`, { 'text-anchor': 'end', fill: INK, 'font-weight': 'bold' });
  legend += text(WIDTH - 10, 9.9, `gsf: ${(limit.gsf_definition ?? '').split(':')[0]}`, { 'text-anchor': 'end', fill: MUTED, 'font-size': SMALL_TEXT });
  // Hinge list under the drawing: face and position of each, numbered as drawn.
  let footer = '';
  const footY = base + 12.6;
  let footLines = 0;
  if (mechanism.length) {
    const items = mechanismHinges.map((h, i) => `${i + 1} ${h.face} x ${say.length(h.x)}`);
    // At the least print size, wrapped to the drawing's width; two lines fit above the scale bar, which moves down for more.
    const lines = wrapLines(`mechanism: ${items.join(' · ')} (x from the left springing)`, WIDTH - 20, SMALL_TEXT);
    footer += lines.map((line, i) => text(10, footY + i * 3.4, line, { fill: INK, 'font-size': SMALL_TEXT })).join('');
    footLines = lines.length;
  }
  const height = base + (mechanism.length ? 26 + Math.max(0, footLines - 2) * 3.4 : 22);
  body += scaleBar(frame.scale, { x: 10, y: height - 9 }, 40, say.unit('length'), say.perSI('length'));
  return markFigure(svgDocument(WIDTH, height, `Section of the ${ring.shape} ring with its loads and lines of thrust`, legend + body + labels.out + footer), units, (u) => section(ring, limit, loads, u));
}
