/**
 * Unit weights of the materials a masonry vault is built of and loaded with.
 */

/** A tabulated unit weight and where it comes from. */
export interface UnitWeightEntry {
  /** N/m³ */
  value: number;
  source: string;
}

const kN = 1000;

/**
 * One representative value per material. Ranges in the sources are wide: the
 * value chosen is stated with its range so that a sheet can show the choice.
 * "[M]" = from memory, not checked against the text; "[C]" = checked.
 */
export const UNIT_WEIGHTS: Readonly<Record<string, UnitWeightEntry>> = Object.freeze({
  'brick masonry': { value: 18 * kN, source: 'Circolare n. 7/2019 (NTC 2018) Table C8.5.I, solid brick with lime mortar, 18 kN/m³ [M]' },
  'rubble masonry': { value: 19 * kN, source: 'Circolare n. 7/2019 (NTC 2018) Table C8.5.I, irregular rubble stone, 19 kN/m³ [C]' },
  limestone: { value: 24 * kN, source: 'EN 1991-1-1 Annex A, dense limestone 20–29 kN/m³, mid-range value [M]' },
  sandstone: { value: 24 * kN, source: 'EN 1991-1-1 Annex A, sandstone 21–27 kN/m³, mid-range value [M]' },
  granite: { value: 27 * kN, source: 'EN 1991-1-1 Annex A, granite 27–30 kN/m³, lower value [M]' },
  tuff: { value: 16 * kN, source: 'Circolare n. 7/2019 Table C8.5.I, soft stone (tuff, calcarenite) masonry 13–16 kN/m³, upper value [C]; EN 1991-1-1 Annex A gives volcanic tuff 20 kN/m³ [M]' },
  'lime mortar': { value: 18 * kN, source: 'EN 1991-1-1 Annex A Table A.1, lime mortar 12–18 kN/m³, upper value [M]' },
  'loose fill': { value: 16 * kN, source: 'handbook value for loose earth or rubble fill, 14–17 kN/m³ [M]' },
  'compacted fill': { value: 19 * kN, source: 'handbook value for compacted earth or gravel fill, 18–20 kN/m³ [M]; EN 1991-1-1 Annex A bulked gravel and sand 15–20 kN/m³ [M]' },
  concrete: { value: 24 * kN, source: 'EN 1991-1-1 Annex A Table A.1, normal-weight concrete, unreinforced, 24 kN/m³ [M]' },
});

/** Lower case, single spaces: 'Brick_Masonry' and 'brick-masonry' name the same material. */
export function normalMaterialName(name: string): string {
  return name.trim().toLowerCase().replace(/[\s_-]+/g, ' ');
}

/**
 * Unit weight of a common vault material (sources in UNIT_WEIGHTS).
 * @param name material: brick masonry, rubble masonry, limestone, sandstone, granite, tuff,
 *   lime mortar, loose fill, compacted fill, concrete
 * @returns unit weight (N/m³)
 * @example unitWeight('brick masonry') // 18000
 */
export function unitWeight(name: string): number {
  const entry = UNIT_WEIGHTS[normalMaterialName(name)];
  if (entry === undefined) {
    throw new RangeError(`unit_weight: unknown material "${name}"; known: ${Object.keys(UNIT_WEIGHTS).join(', ')}`);
  }
  return entry.value;
}
