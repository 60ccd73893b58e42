/**
 * vault_plan(v): a cross vault in plan — webs, groins and the thrusts at the
 * corners, clear spans dimensioned — and in elevation across both spans, with the corner thrust at
 * the height where it acts (the statics of groin_vault: Heyman, Equilibrium
 * of Shell Structures, 1977, cross-vault chapter).
 */
import type { GroinVault } from '../vault/groin/groin-vault.js';
import type { BarrelSection } from '../vault/groin/sections.js';
import { el, pathData, svgDocument, text, INK, MUTED, SMALL_TEXT, type P } from './svg.js';
import { fitFrame } from './frame.js';
import { arrow, dimension, label, scaleBar } from './marks.js';
import { readout, SI_FIGURE_UNITS, type FigureUnits } from './readout.js';
import { markFigure } from './registry.js';
import { wrapLines } from './labels.js';

const WIDTH = 170;
const RED = '#a3162b';

/** Points of a section's middle surface from the left springing to the right, offset d along the normal. */
function arch(sec: BarrelSection, d: number, n = 36): P[] {
  const right: P[] = [];
  for (let i = 0; i <= n; i++) {
    const phi = sec.phiCrown + ((Math.PI / 2 - sec.phiCrown) * i) / n;
    right.push({ x: sec.u(phi) + d * Math.sin(phi), y: sec.z(phi) + d * Math.cos(phi) });
  }
  const left = right.map((p) => ({ x: -p.x, y: p.y })).reverse();
  // A pointed section's two halves meet at the ridge; a round one shares its crown point.
  return sec.phiCrown > 0 ? [...left, ...right] : [...left, ...right.slice(1)];
}

/**
 * Draws a cross vault in plan and in elevation with its corner thrusts.
 * @param v from groin_vault (SI)
 * @returns an SVG string, recorded as a figure
 * @example vault_plan(v)
 */
export function vaultPlan(v: GroinVault, units: FigureUnits = SI_FIGURE_UNITS): string {
  const say = readout(units);
  const { x: sx, y: sy } = v.model;
  const ex = sx.section.e, ey = sy.section.e, h = sx.section.h;
  const reach = Math.max(ex, ey) * 0.55;
  // One scale for plan and elevation: plan in the left box, elevation in the right.
  const planBox = { left: 8, top: 14, width: 72, height: 72 };
  const frameP = fitFrame({ xMin: -ex - reach, xMax: ex + reach, yMin: -ey - reach, yMax: ey + reach }, planBox);
  const elevTop = v.crown + h;
  // Two elevations stacked on the right: across the x-span (top) and across the y-span (bottom).
  const elevBox = (k: number) => ({ left: 90, top: 14 + k * 40, width: 76, height: 34 });
  const frameE0 = fitFrame({ xMin: -Math.max(ex, ey) - reach, xMax: Math.max(ex, ey) + reach, yMin: -0.15 * ex, yMax: elevTop + 0.1 * ex }, elevBox(0));
  const scale = Math.min(frameP.scale, frameE0.scale);
  const P0 = { x: planBox.left + planBox.width / 2, y: planBox.top + planBox.height / 2 };
  const pl = (p: P): P => ({ x: P0.x + p.x * scale, y: P0.y - p.y * scale });
  const evAt = (k: number) => {
    const base = elevBox(k).top + elevBox(k).height - 6;
    return (p: P): P => ({ x: 90 + 76 / 2 + p.x * scale, y: base - p.y * scale });
  };
  let body = text(8, 6, 'PLAN', { fill: INK, 'font-weight': 'bold' }) + text(90, 6, 'ELEVATIONS across the x-span and the y-span', { fill: INK, 'font-weight': 'bold' });
  // Plan: the bay, the groins where the two barrels meet (at equal heights), and generator lines on each web.
  const corners = [{ x: ex, y: ey }, { x: -ex, y: ey }, { x: -ex, y: -ey }, { x: ex, y: -ey }];
  body += el('path', { d: pathData(corners.map(pl), true), fill: '#f1f3f5', stroke: INK, 'stroke-width': 0.45 });
  const groin: P[] = [];
  for (let i = 0; i <= 40; i++) {
    const z = sx.section.s + (v.crown - sx.section.s) * (i / 40) + 0;
    groin.push({ x: sx.section.planAt(Math.max(z, sy.section.s)), y: sy.section.planAt(Math.max(z, sx.section.s)) });
  }
  const groinPaths = [[1, 1], [-1, 1], [-1, -1], [1, -1]].map(([a, b]) => el('path', { d: pathData(groin.map((p) => pl({ x: a! * p.x, y: b! * p.y }))), stroke: INK, 'stroke-width': 0.5 })).join('');
  // Generators: web x (barrel spanning x) runs along y, between a groin and the side y = ±e_y.
  let gens = '';
  for (let k = -4; k <= 4; k++) {
    const gx = (k / 5) * ex, gy = (k / 5) * ey;
    const yAtGroin = groinAt(groin, 'x', Math.abs(gx)), xAtGroin = groinAt(groin, 'y', Math.abs(gy));
    for (const sgn of [1, -1]) {
      gens += el('line', { x1: pl({ x: gx, y: sgn * yAtGroin }).x, y1: pl({ x: gx, y: sgn * yAtGroin }).y, x2: pl({ x: gx, y: sgn * ey }).x, y2: pl({ x: gx, y: sgn * ey }).y });
      gens += el('line', { x1: pl({ x: sgn * xAtGroin, y: gy }).x, y1: pl({ x: sgn * xAtGroin, y: gy }).y, x2: pl({ x: sgn * ex, y: gy }).x, y2: pl({ x: sgn * ex, y: gy }).y });
    }
  }
  body += el('g', { stroke: MUTED, 'stroke-width': 0.12 }, gens) + groinPaths;
  body += label(pl({ x: 0, y: ey * 0.62 }).x, pl({ x: 0, y: ey * 0.62 }).y, 'web x') + label(pl({ x: ex * 0.62, y: 0 }).x, pl({ x: ex * 0.62, y: 0 }).y + 0.9, 'web y');
  // Corner thrusts, to a common force scale; the resultant heavier.
  const fmax = Math.max(v.H_corner, 1e-9), len = (f: number) => (f / fmax) * reach * 0.85 * scale;
  for (const c of corners) {
    const q = pl(c), sx1 = Math.sign(c.x), sy1 = Math.sign(c.y);
    body += el('rect', { x: q.x - 1.3, y: q.y - 1.3, width: 2.6, height: 2.6, fill: INK });
    body += arrow(q, { x: q.x + sx1 * len(v.H_corner_x), y: q.y }, '', '#2c4a6b') + arrow(q, { x: q.x, y: q.y - sy1 * len(v.H_corner_y) }, '', '#2c4a6b');
    const r = { x: q.x + sx1 * len(v.H_corner_x), y: q.y - sy1 * len(v.H_corner_y) };
    body += arrow(q, r, '', RED);
  }
  const q = pl(corners[0]!);
  body += label(q.x + len(v.H_corner_x) + 1, q.y - len(v.H_corner_y) - 1.5, `H = ${say.force(v.H_corner)}`, 'end', { fill: RED, 'font-weight': 'bold' });
  // The components are labelled in the elevations, where they act (in the plan H_x ran into the elevation drawing).
  // Clear spans between the faces of the supports (the corners stand half a thickness further out).
  const cx = v.model.input.spanX / 2, cy = v.model.input.spanY / 2;
  body += dimension(pl({ x: -cx, y: -ey }), pl({ x: cx, y: -ey }), -4, `clear ${say.length(2 * cx)} (x)`);
  body += dimension(pl({ x: -ex, y: cy }), pl({ x: -ex, y: -cy }), -(reach * 0.85 * scale + 4), `clear ${say.length(2 * cy)} (y)`);
  // Elevations: each barrel's shell, the piers, the thrust at its height and the corner load.
  const views = [
    { sec: sx.section, e: ex, H: v.H_corner_x, z: v.z_thrust, name: 'x', clear: v.model.input.spanX },
    { sec: sy.section, e: ey, H: v.H_corner_y, z: v.z_thrust_y, name: 'y', clear: v.model.input.spanY },
  ];
  views.forEach((w, k) => {
    const ev = evAt(k);
    // The thrust's height in the title: a dimension of a few mm has no room for its label.
    body += text(90, elevBox(k).top + 1, `across the ${w.name}-span; thrust at z = ${say.length(w.z)}`, { fill: MUTED, 'font-size': SMALL_TEXT });
    const outline = [...arch(w.sec, h), ...arch(w.sec, -h).reverse()];
    body += el('path', { d: pathData(outline.map(ev), true), fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35 });
    const ground = ev({ x: 0, y: 0 }).y;
    for (const side of [-1, 1]) {
      const a = ev({ x: side * (w.e - h), y: 0 }), b = ev({ x: side * (w.e + h), y: w.sec.s });
      if (w.sec.s > 0) body += el('rect', { x: Math.min(a.x, b.x), y: b.y, width: Math.abs(b.x - a.x), height: a.y - b.y, fill: '#e4e7ea', stroke: INK, 'stroke-width': 0.35 });
      const c = ev({ x: side * w.e, y: w.z });
      const tip = { x: c.x + side * len(w.H), y: c.y };
      body += arrow(c, tip, '', RED) + el('circle', { cx: c.x, cy: c.y, r: 0.8, fill: RED });
      body += arrow({ x: c.x, y: ground + 0.8 }, { x: c.x, y: ground + 5 }, '', INK);
      if (side > 0) {
        body += label(c.x + 1, c.y + 3.8, `H_${w.name} = ${say.force(w.H)}`, 'start', { fill: RED });
        body += label(c.x + 1.5, ground + 4.5, `V = ${say.force(v.V_corner)}`, 'start');
      }
    }
    body += el('line', { x1: ev({ x: -w.e - reach, y: 0 }).x, y1: ground, x2: ev({ x: w.e + reach, y: 0 }).x, y2: ground, stroke: INK, 'stroke-width': 0.3 });
    body += dimension(ev({ x: -w.clear / 2, y: 0 }), ev({ x: w.clear / 2, y: 0 }), -2.5, `clear ${say.length(w.clear)}`);
    body += dimension(ev({ x: -w.e, y: 0 }), ev({ x: -w.e, y: w.z }), len(w.H) + 3, '');
    // The crown height left of the centre line: the corner thrust is labelled on the right. Labelled with its
    // number alone, as the dome figure labels its height: "crown 1.851 m" is longer than the line and ran onto
    // the clear span's label.
    if (k === 0) body += dimension(ev({ x: 0, y: 0 }), ev({ x: 0, y: v.crown }), 3, say.length(v.crown));
  });
  body += scaleBar(scale, { x: 8, y: 92 }, 40, say.unit('length'), say.perSI('length'));
  body += wrapLines('Clear spans between the supports; corners at the springing of the middle surface; thrust per corner.', WIDTH - 90 - 2, SMALL_TEXT)
    .map((line, i) => text(90, 94 + i * 3.6, line, { fill: MUTED, 'font-size': SMALL_TEXT })).join('');
  return markFigure(svgDocument(WIDTH, 102, 'Cross vault in plan and in both elevations with its corner thrusts', body), units, (u) => vaultPlan(v, u));
}

/** Where a groin crosses a generator line: for web x the |y| of the groin at plan x, for web y the |x| at plan y. */
function groinAt(groin: P[], web: 'x' | 'y', at: number): number {
  const key = web === 'x' ? 'x' : 'y', other = web === 'x' ? 'y' : 'x';
  for (let i = 1; i < groin.length; i++) {
    const a = groin[i - 1]!, b = groin[i]!;
    if ((a[key] - at) * (b[key] - at) <= 0 && a[key] !== b[key]) {
      const s = (at - a[key]) / (b[key] - a[key]);
      return a[other] + s * (b[other] - a[other]);
    }
  }
  return groin[groin.length - 1]![other];
}
