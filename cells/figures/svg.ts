/**
 * The smallest SVG writer that can be trusted: every number passes through
 * `num` (finite, fixed precision), every text through `esc`, and element and
 * attribute names come only from this code. Coordinates are paper
 * millimetres; the sheet scales the drawing to its column.
 */

import { placeLabels } from './labels.js';

const XML: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/**
 * Text safe inside an SVG element or a quoted attribute.
 * @example esc('<b>') // "&lt;b&gt;"
 */
export function esc(text: string): string {
  return String(text).replace(/[&<>"']/g, (c) => XML[c]!).replace(/[\u0000-\u0008\u000b\u000c\u000e-\u001f]/g, '');
}

/**
 * A coordinate: two decimals (0.01 mm on paper), no trailing zeros, never NaN.
 * @example num(12.3456) // "12.35"
 */
export function num(x: number): string {
  if (!Number.isFinite(x)) throw new RangeError(`figure: a coordinate is not a finite number (${x})`);
  const r = Math.round(x * 100) / 100;
  return String(r === 0 ? 0 : r);
}

export type Attrs = Record<string, string | number | undefined>;

/** Attribute names we write are fixed identifiers; a wrong one is a bug here, not document input. */
const NAME = /^[a-zA-Z][a-zA-Z0-9-]*$/;

/**
 * One element.
 * @param tag element name (a constant of this code)
 * @param attrs numbers are written with num(), strings escaped; undefined leaves the attribute out
 * @param children inner markup already built by these helpers
 * @example el('line', {x1: 0, y1: 0, x2: 10, y2: 0, stroke: '#000'}) // '<line x1="0" …/>'
 */
export function el(tag: string, attrs: Attrs = {}, children?: string): string {
  if (!NAME.test(tag)) throw new TypeError(`el: bad tag ${tag}`);
  const list = Object.entries(attrs).filter(([, v]) => v !== undefined).map(([k, v]) => {
    if (!NAME.test(k)) throw new TypeError(`el: bad attribute ${k}`);
    return ` ${k}="${typeof v === 'number' ? num(v) : esc(v!)}"`;
  }).join('');
  return children === undefined ? `<${tag}${list}/>` : `<${tag}${list}>${children}</${tag}>`;
}

/** A text label (escaped). */
export function text(x: number, y: number, content: string, attrs: Attrs = {}): string {
  return el('text', { x, y, ...attrs }, esc(content));
}

export interface P { x: number; y: number }

/**
 * Path data through points: "M x y L x y …", closed with Z when asked.
 * @example pathData([{x: 0, y: 0}, {x: 1, y: 1}]) // "M0 0L1 1"
 */
export function pathData(points: readonly P[], closed = false): string {
  if (points.length === 0) return '';
  return points.map((p, i) => `${i === 0 ? 'M' : 'L'}${num(p.x)} ${num(p.y)}`).join('') + (closed ? 'Z' : '');
}

/** Shared pen and type for every figure: print-friendly, readable in greyscale. */
export const INK = '#1c2630';
export const MUTED = '#5b6773';
export const FONT = 'Liberation Sans, DejaVu Sans, Arial, sans-serif';
/**
 * Text size in paper mm: a figure is drawn 170 mm wide and printed in a column of about 168 mm,
 * so 2.9 mm prints at 8.1 pt, the least we print (small print below 8 pt is hard to read on a site copy).
 */
export const TEXT_SIZE = 2.9;
/** Tick labels, notes: the same least size, so nothing on paper is smaller. */
export const SMALL_TEXT = 2.9;

/**
 * The whole figure: an <svg> of the given paper size (mm) with a title for screen readers.
 * @example svgDocument(170, 90, 'Ring section', body)
 */
export function svgDocument(width: number, height: number, title: string, body: string): string {
  // Labels move off lines and other texts before the drawing is closed.
  const drawn = placeLabels(body, width, height);
  return el('svg', {
    xmlns: 'http://www.w3.org/2000/svg', viewBox: `0 0 ${num(width)} ${num(height)}`, width: `${num(width)}mm`, height: `${num(height)}mm`,
    role: 'img', 'font-family': FONT, 'font-size': TEXT_SIZE, fill: 'none', stroke: 'none',
  }, el('title', {}, esc(title)) + drawn);
}
