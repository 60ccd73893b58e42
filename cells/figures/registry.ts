/**
 * Which strings are figures. A figure cell's value is an SVG string, and the
 * sheet embeds it as markup; any other string (one a document built itself,
 * say "<svg onload=…>") must be shown as text. So every SVG made by a figure
 * function is recorded here, and the renderer embeds only recorded strings.
 */

import { sameFigureUnits, type FigureUnits } from './readout.js';

/** A figure drawn again in other units or significant figures, and the last such drawing kept. */
interface Redraw {
  drawnWith: FigureUnits;
  draw: (units: FigureUnits) => string;
  last?: { units: FigureUnits; svg: string };
}

const produced = new Map<string, Redraw | null>();
/** Enough for every figure of a large sheet several times over; the oldest are forgotten first. */
const LIMIT = 500;

/**
 * Records an SVG string as made by one of our figure functions.
 * @param svg markup built only from numbers and escaped text
 * @param drawnWith the units and significant figures it was drawn with
 * @param draw the same figure drawn with other units (the sheet asks for the document's)
 * @returns the same string
 * @example return markFigure(svgDocument(...), units, (u) => section(ring, limit, loads, u))
 */
export function markFigure(svg: string, drawnWith?: FigureUnits, draw?: (units: FigureUnits) => string): string {
  if (typeof svg !== 'string' || !svg.startsWith('<svg')) throw new TypeError('markFigure: expected an SVG string');
  produced.delete(svg);
  produced.set(svg, drawnWith && draw ? { drawnWith, draw } : null);
  if (produced.size > LIMIT) produced.delete(produced.keys().next().value!);
  return svg;
}

/**
 * Was this value made by a figure function (so that it may be embedded as markup)?
 * @example isFigure('<svg onload="alert(1)"/>') // false
 */
export function isFigure(value: unknown): value is string {
  return typeof value === 'string' && produced.has(value);
}

/**
 * A figure in the units and significant figures asked for: the figure itself when drawn so,
 * else drawn again by the function that made it (the last such drawing is kept).
 * @param svg a string isFigure recognises
 * @example figureIn(state.value, { sigfigs: 3, units: {...} }) // the same figure, labelled to 3 significant figures
 */
export function figureIn(svg: string, units: FigureUnits): string {
  const redraw = produced.get(svg);
  if (!isFigure(svg)) throw new TypeError('figureIn: not a figure made by a figure function');
  if (!redraw || sameFigureUnits(redraw.drawnWith, units)) return svg;
  if (redraw.last && sameFigureUnits(redraw.last.units, units)) return redraw.last.svg;
  const again = redraw.draw(units);
  redraw.last = { units, svg: again };
  return again;
}
