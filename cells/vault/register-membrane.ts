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
  reference: {
    params: {
      'options.shape': 'profile of the cross-section: "circular", "catenary", "parabolic", "cycloid", "power" (with n), or the exponent n of R0·cos^n φ',
      'options.span': 'clear span of the intrados (length), with rise',
      'options.rise': 'rise of the intrados (length), with span',
      'options.R0': 'radius of curvature of the middle surface at the crown (length), with half_angle instead of span and rise',
      'options.n': 'exponent n of R = R0·cos^n φ, with shape "power"',
      'options.half_angle': 'angle of the normal at the springing from the vertical (angle), with R0',
      'options.length': 'length of the barrel between the end walls (length)',
      'options.thickness': 'shell thickness (length); with unit_weight it gives the self-weight, and sigma_max',
      'options.unit_weight': 'unit weight of the masonry (force per volume), with thickness',
      'options.g': 'dead load per unit of vault surface (pressure), instead of thickness × unit_weight',
      'options.p': 'load per unit of plan area (pressure), e.g. fill or live load',
    },
    fields: {
      N_phi_crown: 'hoop force Nφ at the crown per unit length of barrel (N/m); compression negative',
      N_phi_springing: 'hoop force Nφ at the springing (N/m); compression negative',
      N_xphi_max: 'largest membrane shear Nxφ, at the end walls (N/m)',
      N_x_max: 'largest compression of the axial force Nx (N/m, negative or 0)',
      N_x_min: 'largest tension of the axial force Nx (N/m, positive or 0)',
      tension: 'true where a principal membrane force is tensile anywhere (shear alone counts)',
      V_wall: 'downward force per unit length on each lateral wall from Nφ (N/m); negative is uplift',
      H_wall: 'outward thrust per unit length on each lateral wall from Nφ (N/m)',
      end_shear: 'total vertical force delivered to each end wall by Nxφ (N)',
      W: 'total load on the vault (N)',
      sigma_max: 'largest principal compressive stress |N2|/t (Pa); not available when no thickness is given (the load came as g)',
    },
    method: 'Membrane theory of a cylindrical shell between end diaphragms: Nφ from the normal load, Nxφ and Nx by integrating the equilibrium equations with Nxφ = 0 at mid-length and Nx = 0 at the end walls. φ is the inclination of the normal from the vertical, x runs from mid-length.',
    assumptions: ['no bending: membrane forces only', 'end walls are rigid diaphragms in their plane and take no Nx', 'lateral walls take the springing force Nφ as it arrives', 'no support settlement'],
    sources: ['W. Flügge, Stresses in Shells, 2nd ed., Springer, 1973, ch. 3 (from memory)', 'S. Timoshenko, S. Woinowsky-Krieger, Theory of Plates and Shells, 2nd ed., McGraw-Hill, 1959, §§110–112 (from memory)'],
  },
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
