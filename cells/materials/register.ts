/** Masonry material functions, registered for cells. */
import { CellArgumentError, defineCellFunction } from '../define.js';
import { masonryFk } from './masonry-fk.js';
import { masonryFd } from './masonry-fd.js';
import { UNIT_WEIGHTS, normalMaterialName, unitWeight as unitWeightKernel } from './unit-weight.js';

export const masonry_fk = defineCellFunction({
  name: 'masonry_fk',
  doc: 'Characteristic compressive strength of masonry, EN 1996-1-1 eq. (3.1): f_k = K·f_b^α·f_m^β; '
    + 'masonry_fk(f_b, f_m) uses K = 0.55, α = 0.7, β = 0.3 (Group 1 clay units, general-purpose mortar); '
    + 'masonry_fk(f_b, f_m, {K, alpha, beta}) for other units or a National Annex.',
  params: [
    { name: 'f_b', type: 'Pa' },
    { name: 'f_m', type: 'Pa' },
    { name: 'parameters', type: { object: { K: '1', alpha: '1', beta: '1' } }, optional: true },
  ],
  returns: 'Pa',
  fn: masonryFk,
  reference: {
    params: {
      f_b: 'Normalised mean compressive strength of the masonry units f_b. Refused above 75 N/mm² (the limit of the clause; from memory).',
      f_m: 'Compressive strength of the mortar f_m. Refused above 20 N/mm² or above 2·f_b (the clause says not to take it greater; from memory): cap it in the document where it shows.',
      parameters: 'Other constants of eq. (3.1), e.g. for other unit groups or a National Annex. Each optional.',
      'parameters.K': 'The constant K of Table 3.3. Default 0.55 (Group 1 clay units, general-purpose mortar; from memory).',
      'parameters.alpha': 'Exponent α of f_b, in (0, 1]. Default 0.7.',
      'parameters.beta': 'Exponent β of f_m, in [0, 1). Default 0.3.',
    },
    fields: { result: 'Characteristic compressive strength of the masonry f_k = K·f_b^α·f_m^β (with f_b, f_m, f_k in N/mm²).' },
    method: 'EN 1996-1-1 eq. (3.1), evaluated in N/mm².',
    assumptions: ['Unreinforced masonry made with general-purpose mortar unless other K, α, β are given.', 'Inputs within the range the equation was calibrated for (checked).'],
    sources: ['EN 1996-1-1:2005, 3.6.1.2, eq. (3.1) and Table 3.3 (values from memory).'],
  },
});

export const masonry_fd = defineCellFunction({
  name: 'masonry_fd',
  doc: 'Design compressive strength of masonry f_d = f_k / γ_M (EN 1996-1-1 2.4.3; γ_M from the National Annex).',
  params: [{ name: 'f_k', type: 'Pa' }, { name: 'gamma_M', type: '1' }],
  returns: 'Pa',
  fn: masonryFd,
  reference: {
    params: {
      f_k: 'Characteristic compressive strength of the masonry, e.g. from masonry_fk.',
      gamma_M: 'Partial factor for the material γ_M, at least 1, from the National Annex (the recommended values range from about 1.5 to 3.0 with the class of execution control; from memory).',
    },
    fields: { result: 'Design compressive strength f_d = f_k / γ_M.' },
    method: 'f_d = f_k / γ_M.',
    sources: ['EN 1996-1-1:2005, 2.4.3 (γ_M from the National Annex).'],
  },
});

export const unit_weight = defineCellFunction({
  name: 'unit_weight',
  doc: `Unit weight of a vault material: unit_weight("brick masonry"). Known: ${Object.keys(UNIT_WEIGHTS).join(', ')}.`,
  params: [{ name: 'name', type: 'text' }],
  returns: 'N/m^3',
  fn: (name: string): number => {
    // A misspelt material is a mistake in the document, not a domain edge.
    if (!(normalMaterialName(name) in UNIT_WEIGHTS)) {
      throw new CellArgumentError(`unit_weight: unknown material "${name}"; known materials: ${Object.keys(UNIT_WEIGHTS).join(', ')}`);
    }
    return unitWeightKernel(name);
  },
  reference: {
    params: { name: `Material, in quotes; case, spaces, hyphens and underscores do not matter. Known: ${Object.keys(UNIT_WEIGHTS).join(', ')}.` },
    fields: { result: `One representative unit weight per material, with its source and range: ${Object.entries(UNIT_WEIGHTS).map(([k, v]) => `${k}: ${v.source}`).join('; ')}.` },
    method: 'A table look-up. [M] marks values from memory, not checked against the text; [C] values checked.',
    assumptions: ['Ranges in the sources are wide: write the project\'s own value where it is known.'],
    sources: [
      'EN 1991-1-1, Annex A (from memory).',
      'Circolare n. 7/2019 to NTC 2018, Table C8.5.I (some values checked, others from memory, as marked).',
    ],
  },
});
