/**
 * Drafting marks shared by every figure: dimension lines, a scale bar,
 * force arrows and labels with a white halo so they stay legible over lines.
 * The quantities they write come from readout.ts (the document's units and significant figures).
 */
import { el, num, text, INK, MUTED, SMALL_TEXT, TEXT_SIZE, type Attrs, type P } from './svg.js';
import { niceStep } from './frame.js';
import { wrapLines } from './labels.js';

/** A label with a white halo. */
export function label(x: number, y: number, content: string, anchor: 'start' | 'middle' | 'end' = 'middle', extra: Record<string, string | number> = {}): string {
  // Marked for the placement pass (labels.ts), which moves it off lines and other texts; a rotated label slides along its line.
  const place = 'transform' in extra ? 'along' : 'free';
  return text(x, y, content, { 'text-anchor': anchor, fill: INK, stroke: '#fff', 'stroke-width': 0.8, 'paint-order': 'stroke', 'data-place': place, ...extra });
}

/**
 * A dimension line between two paper points, offset to one side, with
 * extension lines, closed arrowheads and the label along it.
 * @param a first point (mm), b second point (mm)
 * @param offset distance of the dimension line from a–b (mm; + to the left of a→b)
 * @param content the label ('' for none: the value is written elsewhere)
 */
export function dimension(a: P, b: P, offset: number, content: string): string {
  const len = Math.hypot(b.x - a.x, b.y - a.y);
  if (len < 1e-6) return '';
  const ux = (b.x - a.x) / len, uy = (b.y - a.y) / len;
  const nx = uy, ny = -ux;
  const a2 = { x: a.x + nx * offset, y: a.y + ny * offset }, b2 = { x: b.x + nx * offset, y: b.y + ny * offset };
  const ext = (p: P, q: P) => el('line', { x1: p.x + nx * Math.sign(offset) * 0.8, y1: p.y + ny * Math.sign(offset) * 0.8, x2: q.x + nx * Math.sign(offset) * 1.2, y2: q.y + ny * Math.sign(offset) * 1.2 });
  const head = (p: P, dir: number) => el('path', { d: `M${num(p.x)} ${num(p.y)}l${num(dir * (ux * 2.2 + nx * 0.6))} ${num(dir * (uy * 2.2 + ny * 0.6))}l${num(-dir * nx * 1.2)} ${num(-dir * ny * 1.2)}Z`, fill: INK });
  let angle = (Math.atan2(uy, ux) * 180) / Math.PI;
  if (angle >= 90 || angle < -90) angle += 180;
  // The label sits beside the dimension line, on the side away from the object.
  const side = Math.sign(offset || 1) * 2;
  const mid = { x: (a2.x + b2.x) / 2 + nx * side, y: (a2.y + b2.y) / 2 + ny * side };
  return el('g', { stroke: INK, 'stroke-width': 0.18 },
    ext(a, a2) + ext(b, b2) + el('line', { x1: a2.x, y1: a2.y, x2: b2.x, y2: b2.y }) + head(a2, 1) + head(b2, -1))
    + (content === '' ? '' : label(mid.x, mid.y, content, 'middle', { transform: `rotate(${num(angle)} ${num(mid.x)} ${num(mid.y)})`, 'dominant-baseline': 'central' }));
}

/**
 * A scale bar of alternating blocks with its length written under it.
 * @param scale paper mm per world unit (per m for drawings, per N for force diagrams)
 * @param at left end of the bar (mm)
 * @param maxWidth longest bar allowed (mm)
 * @param unit the unit written, and how many of it make one world unit (kN: 0.001 per N; ft: 1/0.3048 per m)
 */
export function scaleBar(scale: number, at: P, maxWidth = 40, unit = 'm', perWorld = 1): string {
  const step = niceStep((maxWidth / scale / 4) * perWorld);
  const seg = (step / perWorld) * scale;
  let body = '';
  for (let i = 0; i < 4; i++) {
    body += el('rect', { x: at.x + i * seg, y: at.y, width: seg, height: 1.2, fill: i % 2 === 0 ? INK : '#fff', stroke: INK, 'stroke-width': 0.15 });
  }
  body += text(at.x, at.y + 1.2 + TEXT_SIZE + 0.4, '0', { 'text-anchor': 'middle', fill: MUTED });
  body += text(at.x + 4 * seg, at.y + 1.2 + TEXT_SIZE + 0.4, `${+(4 * step).toPrecision(6)} ${unit}`, { 'text-anchor': 'middle', fill: MUTED });
  return el('g', {}, body);
}

/**
 * A force arrow ending at `tip` (mm), drawn from `tail`, with a label at the tail.
 */
export function arrow(tail: P, tip: P, content: string, colour = INK, anchor: 'start' | 'middle' | 'end' = 'middle'): string {
  const len = Math.hypot(tip.x - tail.x, tip.y - tail.y);
  if (len < 1e-6) return '';
  const ux = (tip.x - tail.x) / len, uy = (tip.y - tail.y) / len;
  const back = { x: tip.x - ux * 2.6, y: tip.y - uy * 2.6 };
  const head = `M${num(tip.x)} ${num(tip.y)}L${num(back.x - uy * 1)} ${num(back.y + ux * 1)}L${num(back.x + uy * 1)} ${num(back.y - ux * 1)}Z`;
  const lx = tail.x - ux * 1.5, ly = tail.y - uy * 1.5 + (uy < -0.5 ? -0.6 : uy > 0.5 ? -0.6 : 0.9);
  return el('line', { x1: tail.x, y1: tail.y, x2: back.x, y2: back.y, stroke: colour, 'stroke-width': 0.5 })
    + el('path', { d: head, fill: colour }) + (content ? label(lx, ly, content, anchor, { fill: colour }) : '');
}

/** A legend entry: a short sample of a line style and its words. */
export function legendItem(at: P, style: Record<string, string | number>, content: string): string {
  return el('line', { x1: at.x, y1: at.y, x2: at.x + 8, y2: at.y, ...style }) + text(at.x + 10, at.y + 0.9, content, { fill: INK });
}

/**
 * Facts written beside or under a drawing at the least print size, each wrapped to the room it has; the
 * lines of one fact sit closer than two facts.
 * @param facts each fact's words and its text attributes (fill, weight)
 * @param at the first line's left end and baseline (mm)
 * @param maxWidth the room to the right of `at` (mm)
 * @returns the markup, and the baseline (mm) a next fact would take: the figure's height follows it
 * @example factLines([['weight 24.9 kN', { fill: INK }]], { x: 116, y: 29 }, 52)
 */
export function factLines(facts: ReadonlyArray<readonly [string, Attrs]>, at: P, maxWidth: number): { body: string; y: number } {
  let body = '';
  let y = at.y;
  for (const [words, attrs] of facts) {
    for (const part of wrapLines(words, maxWidth, SMALL_TEXT)) {
      body += text(at.x, y, part, { ...attrs, 'font-size': SMALL_TEXT });
      y += 3.6;
    }
    y += 1.2;
  }
  return { body, y };
}
