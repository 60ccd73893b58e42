/** Barrel-vault membrane theory, registered for cells. */
import { defineCellFunction } from '../define.js';
import { barrelMembrane as barrelMembraneKernel, type BarrelMembrane } from './barrel-membrane.js';
import { membraneAt as membraneAtKernel } from './membrane-at.js';

interface DocumentOptions {
  shape?: string | number; span?: number; rise?: number; R0?: number; n?: number; half_angle?: number;
  length: number; thickness?: number; unit_weight?: number; g?: number; p?: number;
}

export const barrel_membrane = defineCellFunction({
  name: 'barrel_membrane',
  doc: 'Membrane forces of a barrel vault between end walls (membrane theory of cylindrical shells): '
    + 'barrel_membrane({shape, span, rise | R0, half_angle, length, thickness, unit_weight | g, p}). '
    + 'span and rise are the intrados\'; with a thickness the middle surface is the intrados offset by t/2. '
    + 'R0 and half_angle give the middle surface itself. Compression negative; N_x_max is the largest compression, '
    + 'N_x_min the largest tension of Nx; tension is true where a principal membrane force is tensile (shear alone counts); '
    + 'V_wall (down) and H_wall (outward) per unit length of each lateral wall; end_shear the total vertical force on each end wall.',
  params: [{
    name: 'options',
    type: {
      object: {
        shape: 'any', span: 'm', rise: 'm', R0: 'm', n: '1', half_angle: 'rad', length: 'm',
        thickness: 'm', unit_weight: 'N/m^3', g: 'Pa', p: 'Pa',
      },
    },
  }],
  returns: {
    object: {
      N_phi_crown: 'N/m', N_phi_springing: 'N/m', N_xphi_max: 'N/m', N_x_max: 'N/m', N_x_min: 'N/m',
      tension: 'boolean', V_wall: 'N/m', H_wall: 'N/m', end_shear: 'N', W: 'N', sigma_max: 'Pa',
    },
  },
  required: ['length'],
  fn: (o: DocumentOptions): BarrelMembrane => barrelMembraneKernel({
    shape: o.shape, span: o.span, rise: o.rise, R0: o.R0, n: o.n, halfAngle: o.half_angle,
    length: o.length, thickness: o.thickness, unitWeight: o.unit_weight, g: o.g, p: o.p,
  }),
});

export const membrane_at = defineCellFunction({
  name: 'membrane_at',
  doc: 'Membrane forces {N_phi, N_x, N_xphi} at x from mid-length and φ from the crown (negative on the left half) of a barrel_membrane result.',
  params: [{ name: 'm', type: { ref: 'barrel_membrane' } }, { name: 'x', type: 'm' }, { name: 'phi', type: 'rad' }],
  returns: { object: { N_phi: 'N/m', N_x: 'N/m', N_xphi: 'N/m' } },
  fn: membraneAtKernel,
});
