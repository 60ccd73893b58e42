/**
 * Figures in the document's units. A figure function draws in SI engineering units to 4 significant
 * figures; the sheet asks it for the document's units (ft, kip, psf … for a calc written in US customary
 * units) and significant figures, chosen by the same rules as every other value (engine/values/format.ts).
 */
import { displayUnitFor, type UnitSystem } from '../values/format.js';
import { FIGURE_KINDS, type FigureKind, type FigureUnits } from '../../cells/figures/readout.js';

/**
 * What the sheet asks a figure for: one unit per kind (the display unit of its dimension; stresses
 * at the smaller of the two, kN/m² or psf) and the sheet's significant figures.
 * @example figureUnitsFor(3, 'us') // { sigfigs: 3, units: { length: 'ft', force: 'kip', … } }
 */
export function figureUnitsFor(sigfigs: number, system: UnitSystem): FigureUnits {
  const units = {} as Record<FigureKind, string>;
  for (const kind of Object.keys(FIGURE_KINDS) as FigureKind[]) units[kind] = displayUnitFor(FIGURE_KINDS[kind], system);
  return { sigfigs, units };
}
