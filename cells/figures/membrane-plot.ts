/**
 * membrane_plot(m): the membrane forces of a barrel vault, along the
 * profile and along the generatrix (membrane theory of cylindrical shells,
 * Flügge, Stresses in Shells, ch. 3; compression negative, as the kernel).
 */
import type { BarrelMembrane } from '../vault/membrane-summary.js';
import { el, pathData, svgDocument, text, INK, MUTED } from './svg.js';
import { boundsOf, fitFrame } from './frame.js';
import { panel } from './axes.js';
import { dimension, label, legendItem, scaleBar } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';
import { markFigure } from './registry.js';

const WIDTH = 170;
const STYLES = {
  phi: { stroke: INK, 'stroke-width': 0.55 },
  x: { stroke: '#2c4a6b', 'stroke-width': 0.55, 'stroke-dasharray': '2.4 1.2' },
  xphi: { stroke: '#a3162b', 'stroke-width': 0.55, 'stroke-dasharray': '3.2 1 0.7 1' },
  x2: { stroke: '#2c4a6b', 'stroke-width': 0.35, 'stroke-dasharray': '0.6 0.8' },
};
const SAMPLES = 73;

function range(pairs: Array<[number, number]>[]): [number, number] {
  const ys = pairs.flat().map(([, y]) => y);
  return [Math.min(...ys), Math.max(...ys)];
}

/**
 * Draws the membrane forces of a solved barrel vault.
 * @param m from barrel_membrane (SI)
 * @returns an SVG string, recorded as a figure
 * @example membrane_plot(m)
 */
export function membranePlot(m: BarrelMembrane, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const { field, profile } = m;
  const l = field.halfLength, phiS = field.phiSpringing;
  const kN = (v: number) => say.value('force per length', v);
  const deg = (p: number) => (p * 180) / Math.PI;
  // Section of the middle surface, to scale.
  const right = Array.from({ length: 49 }, (_, i) => profile.point((phiS * i) / 48));
  const curve = [...right.slice(1).reverse().map((p) => ({ x: -p.x, y: p.y })), ...right];
  const b = boundsOf([curve, [{ x: 0, y: profile.point(phiS).y }]], 0.03 * 2 * right[48]!.x);
  const frame = fitFrame(b, { left: 12, top: 9, width: 58, height: 30 });
  let body = text(10, 5, `Membrane forces of the barrel vault (${say.unit('force per length')}, compression negative)`, { fill: INK, 'font-weight': 'bold' });
  body += el('path', { d: pathData(curve.map((p) => frame.at(p))), stroke: INK, 'stroke-width': 0.6 });
  const spring = profile.point(phiS);
  body += el('line', { x1: frame.x(-spring.x) - 3, y1: frame.y(spring.y), x2: frame.x(spring.x) + 3, y2: frame.y(spring.y), stroke: MUTED, 'stroke-width': 0.2, 'stroke-dasharray': '1 0.8' });
  // The inclination φ of the normal, shown at one point of the right half.
  const p30 = profile.point(phiS * 0.55);
  const q = frame.at(p30);
  const n = { x: Math.sin(phiS * 0.55), y: -Math.cos(phiS * 0.55) };
  body += el('line', { x1: q.x, y1: q.y, x2: q.x + n.x * 7, y2: q.y + n.y * 7, stroke: INK, 'stroke-width': 0.25 });
  body += el('line', { x1: q.x, y1: q.y, x2: q.x, y2: q.y - 7, stroke: MUTED, 'stroke-width': 0.2, 'stroke-dasharray': '0.8 0.6' });
  body += label(q.x + n.x * 7 + 1.5, q.y + n.y * 7, 'φ', 'start');
  body += dimension(frame.at({ x: -spring.x, y: spring.y }), frame.at({ x: spring.x, y: spring.y }), -3.5, say.length(2 * spring.x));
  body += scaleBar(frame.scale, { x: 12, y: 47 }, 30, say.unit('length'), say.perSI('length'));
  // Key values from the kernel's summary.
  const facts = [
    `span of middle surface ${say.length(2 * spring.x)}, length between end walls ${say.length(2 * l)}`,
    `N_φ at crown ${say.line(m.N_phi_crown)}, at springing ${say.line(m.N_phi_springing)}`,
    `N_x most compressive ${say.line(m.N_x_max)}, most tensile ${say.line(m.N_x_min)}`,
    `|N_xφ| largest ${say.line(m.N_xphi_max)}`,
    `wall: H ${say.line(m.H_wall)} outward, V ${say.line(m.V_wall)} down`,
    m.tension ? 'TENSION: a principal membrane force is tensile somewhere' : 'no tensile principal membrane force',
  ];
  body += facts.map((f, i) => text(80, 13 + i * 4.6, f, { fill: i === 5 && m.tension ? '#a3162b' : INK, 'font-weight': i === 5 && m.tension ? 'bold' : undefined })).join('');
  // Along the profile: φ from the left springing to the right one.
  const phis = Array.from({ length: SAMPLES }, (_, i) => -phiS + (2 * phiS * i) / (SAMPLES - 1));
  const nphi = phis.map((p): [number, number] => [deg(p), kN(field.at(0, p).N_phi)]);
  const nxMid = phis.map((p): [number, number] => [deg(p), kN(field.at(0, p).N_x)]);
  const nxphiEnd = phis.map((p): [number, number] => [deg(p), kN(field.at(l, p).N_xphi)]);
  const a = panel({ left: 26, top: 60, width: 134, height: 40 }, [-deg(phiS), deg(phiS)], range([nphi, nxMid, nxphiEnd]),
    'along the profile: inclination φ of the normal (°), left springing – crown – right springing', say.unit('force per length'));
  body += a.frame + a.curve(nphi, STYLES.phi) + a.curve(nxMid, STYLES.x) + a.curve(nxphiEnd, STYLES.xphi);
  body += legendItem({ x: 28, y: 55 }, STYLES.phi, 'N_φ (any x)') + legendItem({ x: 70, y: 55 }, STYLES.x, 'N_x at mid-length')
    + legendItem({ x: 114, y: 55 }, STYLES.xphi, 'N_xφ at the end walls');
  // Along the generatrix: x from one end wall to the other.
  const xs = Array.from({ length: SAMPLES }, (_, i) => -l + (2 * l * i) / (SAMPLES - 1));
  const along = (x: number) => say.value('length', x);
  const nxCrown = xs.map((x): [number, number] => [along(x), kN(field.at(x, 0).N_x)]);
  const nxSpring = xs.map((x): [number, number] => [along(x), kN(field.at(x, phiS).N_x)]);
  const nxphiSpring = xs.map((x): [number, number] => [along(x), kN(field.at(x, phiS).N_xphi)]);
  const c = panel({ left: 26, top: 124, width: 134, height: 40 }, [along(-l), along(l)], range([nxCrown, nxSpring, nxphiSpring]),
    `along the generatrix: x from mid-length (${say.unit('length')}), end wall to end wall`, say.unit('force per length'));
  body += c.frame + c.curve(nxCrown, STYLES.x) + c.curve(nxSpring, STYLES.x2) + c.curve(nxphiSpring, STYLES.xphi);
  body += legendItem({ x: 28, y: 119 }, STYLES.x, 'N_x at the crown') + legendItem({ x: 70, y: 119 }, STYLES.x2, 'N_x at the springing')
    + legendItem({ x: 114, y: 119 }, STYLES.xphi, 'N_xφ at the springing');
  return markFigure(svgDocument(WIDTH, 176, 'Membrane forces of a barrel vault along the profile and along the generatrix', body), units, (u) => membranePlot(m, u));
}
