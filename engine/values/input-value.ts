/**
 * Reading a value typed for an input, as the live page and the server's write both do:
 * a bare number takes the document's unit, the text must evaluate on its own, and the
 * value must have the dimension of the document's value (a thickness stays a length).
 * Pure: no DOM, no I/O, so the page and the server (bin/serve/dimension.ts) share it.
 */
import type { Unit } from 'mathjs';
import { evaluateUntrusted } from '../sandbox/index.js';
import { math, parseExpression } from '../../cells/math.js';
import { describeDimension } from '../../cells/units.js';

export type InputReading =
  | { ok: true; text: string; value: unknown }
  | { ok: false; text: string; message: string };

const NUMBER = /^\s*[-+−]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*$/;

function isUnit(v: unknown): v is Unit {
  return math.isUnit(v);
}

/**
 * The value text to apply: a bare number gets the unit of the document's value.
 * @example withDocumentUnit('7', math.unit(6.4, 'm')) // "7 m"
 * @example withDocumentUnit('7 ft', math.unit(6.4, 'm')) // "7 ft"
 */
export function withDocumentUnit(text: string, documentValue: unknown): string {
  const t = text.trim().replace(/^−/, '-');
  if (!NUMBER.test(t) || !isUnit(documentValue) || documentValue.units.length === 0) return t;
  const unit = documentValue.formatUnits().replace(/\s*\/\s*/g, '/').replace(/\s*\^\s*/g, '^').trim();
  return unit ? `${t} ${unit}` : t;
}

/** Evaluates a value text that stands alone (an input's value refers to no other cell). */
function evaluateText(text: string): { ok: true; value: unknown } | { ok: false; message: string } {
  // Through the same sandbox as every cell (engine/sandbox).
  const r = evaluateUntrusted(text);
  return r.ok ? { ok: true, value: r.value } : { ok: false, message: r.message };
}

/** Does `value` have the kind of the document's value: same dimension, or a plain number for a plain number? */
function sameKind(value: unknown, documentValue: unknown): boolean {
  if (isUnit(documentValue)) return isUnit(value) && documentValue.equalBase(value) && Number.isFinite(value.value as number);
  if (typeof documentValue === 'number') return typeof value === 'number' && Number.isFinite(value);
  if (documentValue === undefined) return true;
  return typeof value === typeof documentValue;
}

/**
 * Reads a value typed for an input.
 * @param name the input's name, for the message
 * @param raw what was typed
 * @param documentValue the document's own (evaluated) value; undefined when it has none
 * @returns the text to apply and its value, or why it is refused
 * @example readInputValue('t', '3 kN', math.unit(0.215, 'm'))
 *          // {ok: false, message: 't is a length (m); "3 kN" is a force (N). Not applied.'}
 */
export function readInputValue(name: string, raw: string, documentValue: unknown): InputReading {
  const text = withDocumentUnit(raw, documentValue);
  if (text === '') return { ok: false, text, message: `${name} needs a value. Not applied (Escape keeps the value it had).` };
  const r = evaluateText(text);
  if (!r.ok) return { ok: false, text, message: `cannot read "${text}": ${r.message}. Not applied.` };
  if (!sameKind(r.value, documentValue)) {
    return { ok: false, text, message: `${name} is ${describeDimension(documentValue)}; "${text}" is ${describeDimension(r.value)}. Not applied.` };
  }
  return { ok: true, text, value: r.value };
}

/**
 * Are two values the same (within round-off), whatever their units: `5.40 m` and `5.4 m`, `5400 mm` and `5.4 m`?
 * @example sameValue(math.unit('5.40 m'), math.unit('5.4 m')) // true
 */
export function sameValue(a: unknown, b: unknown): boolean {
  if (isUnit(a) && isUnit(b)) {
    if (!a.equalBase(b)) return false;
    const x = a.value as number, y = b.value as number;
    return Math.abs(x - y) <= 1e-12 * Math.max(Math.abs(x), Math.abs(y));
  }
  if (typeof a === 'number' && typeof b === 'number') return Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b));
  return a === b;
}

/** The value of a text (undefined when it does not evaluate), to compare with sameValue. */
export function valueOfText(text: string): unknown {
  const r = evaluateText(text);
  return r.ok ? r.value : undefined;
}
