/**
 * dome_figure(d [, limit]): a dome's meridian section to scale with the hoop-tension zone of its
 * membrane state and, given dome_limit, the least-thrust surface of a lune; below it, the membrane
 * forces N_φ and N_θ along the meridian (Timoshenko & Woinowsky-Krieger 1959, §§128–129;
 * compression negative, angles from the crown, as the kernel).
 */
import type { Dome } from '../vault/dome/dome.js';
import type { DomeLimit } from '../vault/dome/dome-limit.js';
import { membraneForces } from '../vault/dome/meridian.js';
import { el, pathData, svgDocument, text, INK, MUTED, type P } from './svg.js';
import { boundsOf, fitFrame } from './frame.js';
import { panel } from './axes.js';
import { dimension, factLines, label, legendItem, scaleBar } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';
import { markFigure } from './registry.js';

const WIDTH = 170;
const RED = '#a3162b';
const STYLES = {
  phi: { stroke: INK, 'stroke-width': 0.55 },
  theta: { stroke: RED, 'stroke-width': 0.55, 'stroke-dasharray': '2.4 1.2' },
  thrust: { stroke: '#2c4a6b', 'stroke-width': 0.6 },
  zone: { stroke: RED, 'stroke-width': 1.6, 'stroke-opacity': 0.35 },
};

/**
 * Draws a dome and its membrane forces.
 * @param d from dome (SI)
 * @param limit from dome_limit of the same dome, optional
 * @returns an SVG string, recorded as a figure
 * @example dome_figure(d, dome_limit(d))
 */
export function domeFigure(d: Dome, limit?: DomeLimit, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const m = d.model, { a, c, t } = m;
  const zb = a * Math.cos(m.phiBase);
  const deg = (p: number) => (p * 180) / Math.PI;
  // A face of the shell (offset ζ from the middle surface), right half from its top to the base.
  const face = (zeta: number): P[] => {
    const R = a + zeta, top = m.open ? m.phiTop : Math.asin(Math.min(1, c / R));
    return Array.from({ length: 61 }, (_, i) => {
      const p = top + ((m.phiBase - top) * i) / 60;
      return { x: R * Math.sin(p) - c, y: R * Math.cos(p) - zb };
    });
  };
  const both = (pts: P[]) => [...pts.slice().reverse().map((p) => ({ x: -p.x, y: p.y })), ...pts];
  const intr = face(-t / 2), extr = face(t / 2), mid = face(0);
  const b = boundsOf([both(extr), both(intr)], 0.08 * a);
  b.yMin = Math.min(b.yMin, -0.12 * a);
  // The section left of x = 90: its height dimension stands outside the shell, right of it, clear of the facts at 100.
  const frame = fitFrame(b, { left: 10, top: 10, width: 80, height: 58 });
  const at = (p: P) => frame.at(p);
  let body = text(10, 5, 'Dome: meridian section, hoop-tension zone and thrust surface; membrane forces along the meridian', { fill: INK, 'font-weight': 'bold' });
  if (t > 0) {
    for (const side of [1, -1]) {
      const outline = [...extr, ...intr.slice().reverse()].map((p) => at({ x: side * p.x, y: p.y }));
      body += el('path', { d: pathData(outline, true), fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35 });
    }
  } else {
    body += el('path', { d: pathData(both(mid).map(at)), stroke: INK, 'stroke-width': 0.5 });
  }
  // Hoop-tension zone of the membrane state, along the middle surface, both halves.
  const N = 121;
  const samples = Array.from({ length: N }, (_, i) => m.phiTop + ((m.phiBase - m.phiTop) * i) / (N - 1));
  let run: P[] = [];
  const flush = () => {
    if (run.length > 1) for (const side of [1, -1]) body += el('path', { d: pathData(run.map((p) => at({ x: side * p.x, y: p.y }))), ...STYLES.zone });
    run = [];
  };
  for (const p of samples) {
    if (membraneForces(m, p).N_theta > 0) run.push({ x: a * Math.sin(p) - c, y: a * Math.cos(p) - zb });
    else flush();
  }
  flush();
  // Base line and dimensions.
  const rb = a * Math.sin(m.phiBase) - c;
  body += el('line', { x1: frame.x(-rb - t) - 4, y1: frame.y(0), x2: frame.x(rb + t) + 4, y2: frame.y(0), stroke: MUTED, 'stroke-width': 0.2, 'stroke-dasharray': '1 0.8' });
  const ri = (a - t / 2) * Math.sin(m.phiBase) - c;
  body += dimension(at({ x: -ri, y: 0 }), at({ x: ri, y: 0 }), 4, `clear span ${say.length(2 * ri)}`);
  const re = (a + t / 2) * Math.sin(m.phiBase) - c;
  body += dimension(at({ x: re, y: 0 }), at({ x: re, y: d.height }), -4, `${say.length(d.height)}`);
  // The least-thrust line of a lune, drawn on both halves.
  const facts: Array<[string, string]> = [
    [`middle surface: radius ${say.length(a)}, half-angle ${deg(m.phiBase).toFixed(1)}°${m.open ? `, oculus at ${deg(m.phiTop).toFixed(1)}°` : ''}`, INK],
    [typeof d.phi_hoop_tension === 'number' ? `hoop tension (membrane) from ${deg(d.phi_hoop_tension).toFixed(1)}° to the base, largest ${say.line(d.N_theta_max)}` : 'hoop in compression everywhere (membrane)', typeof d.phi_hoop_tension === 'number' ? RED : INK],
    [`base: N_φ ${say.line(d.N_phi_base)}, thrust ${say.line(d.H_base)}, ring ${say.force(d.ring_tension)}`, INK],
  ];
  if (limit) {
    if (limit.safe && Array.isArray(limit.thrust_min)) {
      const pts = limit.thrust_min.map((p) => ({ x: p.r, y: p.z }));
      for (const side of [1, -1]) body += el('path', { d: pathData(pts.map((p) => at({ x: side * p.x, y: p.y }))), ...STYLES.thrust });
    }
    facts.push([`lunes, no hoop tension: t_min ${typeof limit.t_min === 'number' ? say.length(limit.t_min) : 'none fits'}, gsf ${Number.isFinite(limit.gsf) ? limit.gsf.toFixed(2) : '∞'}`, limit.gsf < 1 ? RED : INK]);
    if (typeof limit.H_min === 'number') facts.push([`base thrust from ${say.line(limit.H_min)} to ${Number.isFinite(limit.H_max as number) ? say.line(limit.H_max as number) : '∞'}`, INK]);
  }
  // The legend, then each fact wrapped to the room right of the section.
  body += legendItem({ x: 100, y: 14 }, STYLES.zone, 'hoop tension in the membrane state');
  if (limit) body += legendItem({ x: 100, y: 18.5 }, STYLES.thrust, 'least-thrust line of a lune');
  const written = factLines(facts.map(([f, col]) => [f, { fill: col }]), { x: 100, y: limit ? 25 : 20.5 }, WIDTH - 100 - 2);
  body += written.body;
  body += scaleBar(frame.scale, { x: 12, y: 80 }, 30, say.unit('length'), say.perSI('length'));
  // Forces along the meridian, under the section and the facts, whichever reaches lower.
  const down = Math.max(0, written.y - 86);
  const nphi = samples.map((p): [number, number] => [deg(p), say.value('force per length', membraneForces(m, p).N_phi)]);
  const nth = samples.map((p): [number, number] => [deg(p), say.value('force per length', membraneForces(m, p).N_theta)]);
  const ys = [...nphi, ...nth].map(([, y]) => y);
  const pl = panel({ left: 26, top: 96 + down, width: 134, height: 44 }, [deg(m.phiTop), deg(m.phiBase)], [Math.min(...ys), Math.max(...ys)],
    'angle from the crown φ (°), top edge to base', say.unit('force per length'));
  body += pl.frame + pl.curve(nphi, STYLES.phi) + pl.curve(nth, STYLES.theta);
  body += legendItem({ x: 28, y: 91 + down }, STYLES.phi, 'N_φ meridional') + legendItem({ x: 80, y: 91 + down }, STYLES.theta, 'N_θ hoop (tension above zero)');
  if (typeof d.phi_hoop_tension === 'number') body += label(pl.x(deg(d.phi_hoop_tension)), pl.y(0) - 2, `${deg(d.phi_hoop_tension).toFixed(1)}°`, 'middle', { fill: RED });
  return markFigure(svgDocument(WIDTH, 152 + down, 'Dome meridian section with the hoop-tension zone and thrust line, and membrane forces along the meridian', body), units, (u) => domeFigure(d, limit, u));
}
