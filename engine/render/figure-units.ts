/**
 * Figures in the document's units. A figure function draws in SI engineering units (m, kN, kN/m,
 * kN/m²); when the document is written in US customary units (its inputs in ft, kip, psf …) the
 * quantities a figure writes are shown in those instead, to the sheet's significant figures.
 * The drawing itself (geometry, scale bars, plot axes) is unchanged.
 */
import { math } from '../../cells/math.js';
import type { CellState, CompiledDocument } from '../types.js';
import { formatNumber } from '../values/format.js';

/** Units that mark a document as written in US customary units. */
const US_UNITS = /\b(ft|in|kip|ksi|psf|pcf|plf|klf|kipft|lbf|psi)\b/;

/** SI unit as a figure writes it → [mathjs unit, US unit, the US unit as written]. */
const TO_US: Record<string, [string, string, string]> = {
  'm': ['m', 'ft', 'ft'],
  'kN': ['kN', 'kip', 'kip'],
  'kN/m': ['kN/m', 'klf', 'kip/ft'],
  'kN/m²': ['kN/m^2', 'psf', 'psf'],
  'kN/m³': ['kN/m^3', 'pcf', 'pcf'],
};

/**
 * Does the document write its inputs in US customary units?
 * @example usesUsUnits(doc, states) // true for a calc with `L = 24 ft`
 */
export function usesUsUnits(doc: CompiledDocument, states: ReadonlyMap<string, CellState>): boolean {
  return doc.graph.cells.some((c) => {
    if (c.kind !== 'given') return false;
    const s = states.get(c.id);
    return s?.status === 'ok' && math.isUnit(s.value) && US_UNITS.test((s.value as { formatUnits(): string }).formatUnits());
  });
}

/**
 * The figure's SVG with each quantity it writes ("6.40 m", "77.0 kN", "−35.2 kN/m") in US customary units.
 * @param svg markup made by a figure function (numbers and escaped text only)
 * @example figureInUsUnits('<text x="1" y="2">span 6.40 m</text>', 4) // '…span 21 ft…'
 */
export function figureInUsUnits(svg: string, sigfigs: number): string {
  return svg.replace(/>([^<]+)</g, (_, text: string) => `>${text.replace(/(−|-)?(\d+(?:\.\d+)?) (kN\/m²|kN\/m³|kN\/m|kN|m)(?![\w²³/])/g, (whole, sign: string | undefined, n: string, unit: string) => {
    const [from, to, shown] = TO_US[unit]!;
    const value = (sign ? -1 : 1) * Number(n);
    const us = math.unit(value, from).toNumber(to);
    return Number.isFinite(us) ? `${formatNumber(us, Math.min(sigfigs, 3))} ${shown}` : whole;
  })}<`);
}
