/** Barrel-vault membrane theory, registered for cells. */
import { defineCellFunction } from '../define.js';
import { barrelMembrane as barrelMembraneKernel, type BarrelMembrane } from './barrel-membrane.js';
import { membraneAt as membraneAtKernel } from './membrane-at.js';

interface DocumentOptions {
  shape?: string | number; span?: number; rise?: number; R0?: number; n?: number; half_angle?: number;
  length: number; thickness?: number; unit_weight?: number; g?: number; p?: number;
}

const FLUGGE = 'W. Flügge, Stresses in Shells, Springer, 2nd ed. 1973, ch. 3 (membrane theory of cylindrical shells; equations from memory, re-derived in the code).';
const TIMOSHENKO = 'S. Timoshenko and S. Woinowsky-Krieger, Theory of Plates and Shells, McGraw-Hill, 2nd ed. 1959, §§110–112 (from memory).';

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
      options: 'The barrel: its profile (span and rise of the intrados, or R0 and half_angle of the middle surface), its length between end walls, and its loads.',
      'options.shape': '"circular", "cycloid", "catenary" or "parabolic" (the members n = 0, 1, −2, −3 of the family whose radius of curvature is R(φ) = R0·cos^n φ), '
        + '"power" with n, or the exponent n itself as a number.',
      'options.span': 'Clear span of the intrados; give span and rise, or R0 and half_angle.',
      'options.rise': 'Rise of the intrados from springing to crown; with span.',
      'options.R0': 'Radius of curvature of the middle surface at the crown; with half_angle, instead of span and rise.',
      'options.n': 'Exponent n of R(φ) = R0·cos^n φ, with shape "power" (or alone); must agree with a named shape if both are given.',
      'options.half_angle': 'φ of the middle surface at the springing (90 deg for a semicircle); with R0.',
      'options.length': 'Distance between the two end walls (diaphragms) along the barrel.',
      'options.thickness': 'Shell thickness. With span and rise the middle surface is the intrados offset outwards by thickness/2; '
        + 'with unit_weight it gives the self-weight; it also gives sigma_max. Optional.',
      'options.unit_weight': 'Unit weight of the masonry; needs thickness (self-weight per unit middle surface = thickness · unit_weight). Give this or g, not both.',
      'options.g': 'Self-weight per unit area of the middle surface, instead of thickness · unit_weight. Default 0.',
      'options.p': 'Uniform load per unit plan area (fill, finishes, live load spread over the whole vault). Default 0. At least one load must be given.',
    },
    fields: {
      N_phi_crown: 'Hoop force N_φ at the crown, per unit length of the barrel; compression negative.',
      N_phi_springing: 'Hoop force N_φ at the springing; compression negative.',
      N_xphi_max: 'Largest membrane shear |N_xφ| anywhere (at the end walls); a magnitude, ≥ 0.',
      N_x_max: 'The most compressive longitudinal force N_x anywhere (≤ 0; compression negative). Note the name: the largest compression, not the largest value.',
      N_x_min: 'The most tensile longitudinal force N_x anywhere (≥ 0): the largest tension along the barrel.',
      tension: 'true when the larger principal membrane force is tensile somewhere (membrane shear alone counts), i.e. the masonry would need tensile strength for this membrane state.',
      V_wall: 'Vertical force per unit length delivered by N_φ to each lateral wall, positive downwards; negative means uplift.',
      H_wall: 'Horizontal thrust per unit length delivered by N_φ to each lateral wall, positive outwards.',
      end_shear: 'Net vertical force each end wall receives from the membrane shear N_xφ (its horizontal parts cancel by symmetry).',
      W: 'Total load on the vault between the end walls.',
      sigma_max: 'Largest principal compressive stress |N2|/thickness, a magnitude. Not available when no thickness is given (the load came as g).',
    },
    method: 'Membrane theory of a cylindrical shell with φ the inclination of the normal and x from mid-length: N_φ = −R·(g·cos φ + p·cos²φ) from the normal equilibrium, '
      + 'N_xφ = F(φ)·x and N_x = F′(φ)·(l² − x²)/(2R) from the other two, with N_xφ = 0 at mid-length (symmetry) and N_x = 0 at the end walls. '
      + 'Extremes are searched over the profile; along a generatrix they lie at mid-length or at an end wall.',
    assumptions: [
      'Membrane state: no bending; the shell needs tension wherever the principal forces say so (see tension).',
      'End walls are diaphragms: stiff in their plane, taking no force along the barrel.',
      'Loads uniform along the barrel; the lateral walls take N_φ as it arrives.',
    ],
    sources: [FLUGGE, TIMOSHENKO],
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
  reference: {
    params: {
      m: 'A barrel vault solved by barrel_membrane.',
      x: 'Distance along the barrel from mid-length, within ±length/2 (the end walls).',
      phi: 'Inclination of the normal from the vertical: 0 at the crown, positive on the right half, negative on the left, within ±half_angle.',
    },
    fields: {
      N_phi: 'Hoop force per unit length; compression negative.',
      N_x: 'Longitudinal force per unit length; compression negative.',
      N_xphi: 'Membrane shear per unit length; 0 at mid-length, proportional to x.',
    },
    method: 'The membrane field of barrel_membrane evaluated at (x, φ): N_φ(φ), N_xφ = F(φ)·x, N_x = F′(φ)·(l² − x²)/(2R).',
    assumptions: ['Those of barrel_membrane.'],
    sources: [FLUGGE],
  },
});
