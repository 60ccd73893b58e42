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
});

export const masonry_fd = defineCellFunction({
  name: 'masonry_fd',
  doc: 'Design compressive strength of masonry f_d = f_k / γ_M (EN 1996-1-1 2.4.3; γ_M from the National Annex).',
  params: [{ name: 'f_k', type: 'Pa' }, { name: 'gamma_M', type: '1' }],
  returns: 'Pa',
  fn: masonryFd,
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
});
