/**
 * Which strings are figures. A figure cell's value is an SVG string, and the
 * sheet embeds it as markup; any other string (one a document built itself,
 * say "<svg onload=…>") must be shown as text. So every SVG made by a figure
 * function is recorded here, and the renderer embeds only recorded strings.
 */

const produced = new Set<string>();
/** Enough for every figure of a large sheet several times over; the oldest are forgotten first. */
const LIMIT = 500;

/**
 * Records an SVG string as made by one of our figure functions.
 * @param svg markup built only from numbers and escaped text
 * @returns the same string
 * @example return markFigure(svgDocument(...))
 */
export function markFigure(svg: string): string {
  if (typeof svg !== 'string' || !svg.startsWith('<svg')) throw new TypeError('markFigure: expected an SVG string');
  produced.delete(svg);
  produced.add(svg);
  if (produced.size > LIMIT) produced.delete(produced.values().next().value!);
  return svg;
}

/**
 * Was this value made by a figure function (so that it may be embedded as markup)?
 * @example isFigure('<svg onload="alert(1)"/>') // false
 */
export function isFigure(value: unknown): value is string {
  return typeof value === 'string' && produced.has(value);
}
