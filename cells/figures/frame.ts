/**
 * World metres → paper millimetres at one scale for both axes, y up.
 */
import type { P } from './svg.js';

export interface Bounds { xMin: number; xMax: number; yMin: number; yMax: number }

export interface Frame {
  /** Paper mm per world m. */
  scale: number;
  x(wx: number): number;
  y(wy: number): number;
  at(p: P): P;
}

/**
 * The bounds of point sets, grown by a margin (m).
 * @example boundsOf([[{x: 0, y: 0}, {x: 2, y: 1}]], 0.1) // {xMin: -0.1, xMax: 2.1, yMin: -0.1, yMax: 1.1}
 */
export function boundsOf(sets: ReadonlyArray<readonly P[]>, margin = 0): Bounds {
  const all = sets.flat();
  if (all.length === 0) throw new RangeError('figure: nothing to draw');
  const xs = all.map((p) => p.x), ys = all.map((p) => p.y);
  return { xMin: Math.min(...xs) - margin, xMax: Math.max(...xs) + margin, yMin: Math.min(...ys) - margin, yMax: Math.max(...ys) + margin };
}

/**
 * The largest scale that fits the bounds into a paper box, centred in it.
 * @param b world bounds (m)
 * @param box paper box (mm): left, top, width, height
 * @example fitFrame({xMin: 0, xMax: 10, yMin: 0, yMax: 5}, {left: 0, top: 0, width: 100, height: 100}).scale // 10
 */
export function fitFrame(b: Bounds, box: { left: number; top: number; width: number; height: number }): Frame {
  const w = Math.max(b.xMax - b.xMin, 1e-9), h = Math.max(b.yMax - b.yMin, 1e-9);
  const scale = Math.min(box.width / w, box.height / h);
  const left = box.left + (box.width - w * scale) / 2;
  const top = box.top + (box.height - h * scale) / 2;
  const x = (wx: number) => left + (wx - b.xMin) * scale;
  const y = (wy: number) => top + (b.yMax - wy) * scale;
  return { scale, x, y, at: (p) => ({ x: x(p.x), y: y(p.y) }) };
}

/**
 * A round step near a target: 1, 2 or 5 × 10ⁿ.
 * @example niceStep(3.7) // 5
 */
export function niceStep(target: number): number {
  if (!(target > 0) || !Number.isFinite(target)) return 1;
  const p = 10 ** Math.floor(Math.log10(target));
  const m = target / p;
  return (m < 1.5 ? 1 : m < 3.5 ? 2 : m < 7.5 ? 5 : 10) * p;
}
