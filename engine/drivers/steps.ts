/**
 * stepsFor: the values an input is moved to — a small step either side for the elasticity, and ±10 %
 * for the swing — as exact value text a `--set` would take.
 *
 * A step is relative to the input's own value, in its own units. An input at zero has no scale of
 * its own: it moves by an absolute step, a fraction of its allowed range `[lo, hi]` when it has one,
 * else of one of its own units, and the step is stated.
 */
import type { Unit } from 'mathjs';
import { evaluateNode } from '../sandbox/index.js';
import { math, parseExpression } from '../../cells/math.js';
import type { Cell } from '../types.js';
import { exactText } from '../cases/index.js';
import { formatValue } from '../values/format.js';

/** Relative step of the central difference (d ln u / d ln x). */
export const SMALL_STEP = 1e-3;
/** Relative move for the swing: the utilization at the input −10 % and +10 %. */
export const SWING_STEP = 0.1;

export interface InputSteps {
  /** Value text at −small, +small. */
  small: [string, string];
  /** Value text at −10 %, +10 % (or ± the absolute swing step). */
  swing: [string, string];
  /** True when the input is at zero and moves by an absolute step. */
  absolute: boolean;
  /** The swing step in words: `±10 %`, or `±0.1 m` for an absolute one. */
  swingText: string;
  /** The small step in words: `±0.1 %`, or `±0.001 m`. */
  smallText: string;
}

const isQuantity = (v: unknown): v is Unit => math.isUnit(v) && typeof (v as Unit).value === 'number';

/** The absolute scale of an input at zero: the width of its range, else one of its own units. */
function scaleOf(cell: Cell, value: number | Unit): number | Unit {
  if (cell.range) {
    try {
      const width = math.subtract(evaluateNode(cell.range.hiNode) as never, evaluateNode(cell.range.loNode) as never) as unknown;
      const n = isQuantity(width) ? (width as Unit).value! : width;
      if ((typeof n === 'number' && Number.isFinite(n) && n > 0) && (typeof value === 'number') === (typeof width === 'number')) return width as number | Unit;
    } catch { /* a range of other units: fall back to one unit */ }
  }
  return typeof value === 'number' ? 1 : (evaluateNode(parseExpression(`1 ${value.formatUnits()}`)) as Unit);
}

function isZero(value: number | Unit): boolean {
  return typeof value === 'number' ? value === 0 : value.value === 0;
}

/**
 * The perturbed values of an input, or why it cannot be perturbed.
 * @example stepsFor(cellT, unit(0.215, 'm')) // {small: ['0.214785 m', '0.215215 m'], swing: ['0.1935 m', '0.2365 m'], absolute: false, …}
 */
export function stepsFor(cell: Cell, value: unknown): InputSteps | { reason: string } {
  if (!(typeof value === 'number' && Number.isFinite(value)) && !(isQuantity(value) && Number.isFinite(value.value))) {
    return { reason: `not a number (${formatValue(value)}): not varied` };
  }
  const x = value as number | Unit;
  const absolute = isZero(x);
  const scale = absolute ? scaleOf(cell, x) : null;
  const at = (r: number): string | null => {
    try {
      return exactText(absolute ? math.add(x as never, math.multiply(scale as never, r) as never) : math.multiply(x as never, 1 + r));
    } catch {
      return null; // a range in units that do not add to the value's
    }
  };
  const texts = [at(-SMALL_STEP), at(SMALL_STEP), at(-SWING_STEP), at(SWING_STEP)];
  if (texts.some((t) => t === null)) return { reason: `its value ${formatValue(x)} cannot be written back exactly: not varied` };
  const [sm, sp, wm, wp] = texts as string[];
  const words = (r: number) => (absolute ? `±${formatValue(math.multiply(scale as never, r))}` : `±${+(r * 100).toPrecision(6)} %`);
  return { small: [sm!, sp!], swing: [wm!, wp!], absolute, swingText: words(SWING_STEP), smallText: words(SMALL_STEP) };
}
