/** Cross vaults, registered for cells. */
import { defineCellFunction } from '../define.js';
import { groinVault } from './groin/groin-vault.js';
import { webMembrane } from './groin/web-membrane.js';
import { vaultBays } from './groin/vault-bays.js';

const VAULT_PARAM = 'One bay made by groin_vault.';
const HEYMAN_SHELLS = 'J. Heyman, Equilibrium of Shell Structures, Oxford University Press, 1977 (the cross vault as intersecting barrels; statics of the half vault).';
const FLUGGE = 'W. Flügge, Stresses in Shells, Springer (membrane theory of the circular cylinder, ch. 3).';

export const groin_vault = defineCellFunction({
  name: 'groin_vault',
  doc: 'One bay of a cross (groin) vault on four corners: web areas and weights, crown hoop force, corner reactions and the height of the thrust.',
  params: [{
    name: 'options',
    type: {
      object: {
        span_x: 'm', span_y: 'm', shape: 'text', thickness: 'm', unit_weight: 'N/m^3', g: 'Pa',
        fill_level: 'm', fill_unit_weight: 'N/m^3', dead: 'Pa', live: 'Pa',
      },
    },
  }],
  required: ['span_x'],
  returns: {
    object: {
      shape: 'text', crown: 'm',
      area_web_x: 'm^2', area_web_y: 'm^2', area: 'm^2',
      W: 'N', W_half: 'N', x_half: 'm', N_crown: 'N/m', thrust_cut: 'N', h_thrust: 'm',
      W_half_y: 'N', x_half_y: 'm', N_crown_y: 'N/m', thrust_cut_y: 'N', h_thrust_y: 'm',
      V_corner: 'N', H_corner_x: 'N', H_corner_y: 'N', H_corner: 'N', z_thrust: 'm', z_thrust_y: 'm',
      ridge_load_x: 'N/m', ridge_load_y: 'N/m',
    },
  },
  fn: groinVault,
  reference: {
    params: {
      options: 'The bay: its spans, the shape of its barrels, its self-weight and its loads.',
      'options.span_x': 'Clear span (at the intrados) of the barrel spanning x: the side of the bay along x.',
      'options.span_y': 'Clear span of the barrel spanning y. Default: span_x (a square bay). On an oblong round bay the narrower barrel is stilted so both crowns are level.',
      'options.shape': '"semicircular" (default): both barrels round; or "pointed": the wider barrel an equilateral two-centred arch, the narrower one two-centred with its crown at the same height.',
      'options.thickness': 'Shell thickness; the middle surface is the intrados offset by thickness/2, so the corners stand half a thickness outside the clear spans. '
        + 'With unit_weight it gives the self-weight; must be less than half the smaller span. Default 0 (a thin shell, self-weight from g).',
      'options.unit_weight': 'Unit weight of the masonry; self-weight per unit surface = thickness · unit_weight. Give this pair or g, not both.',
      'options.g': 'Self-weight per unit area of the middle surface, instead of thickness · unit_weight.',
      'options.fill_level': 'Level of the top of the pocket fill above the springing of the bay; each web carries the fill above its own extrados. Default 0 (no fill).',
      'options.fill_unit_weight': 'Unit weight of the fill; required when fill_level is above 0.',
      'options.dead': 'Superimposed dead load per unit plan area over the whole bay. Default 0.',
      'options.live': 'Live load per unit plan area over the whole bay (added to dead; no partial loading). Default 0.',
    },
    fields: {
      shape: 'The shape used.',
      crown: 'Height of the middle surface at the crown above the springing of the bay.',
      area_web_x: 'Surface area (middle surface) of one web of the barrel spanning x; the bay has two such webs.',
      area_web_y: 'Surface area of one web of the barrel spanning y.',
      area: 'Surface area of the four webs together.',
      W: 'Total vertical load of the bay: self-weight, fill and plan loads.',
      W_half: 'Load of the half vault on one side of the vertical plane x = 0 through the crown (the plane the x-thrust crosses).',
      x_half: 'Horizontal distance of the centroid of that half vault from the plane x = 0.',
      N_crown: 'Hoop force of the barrel spanning x at its crown, per unit length of the crown line; compression negative.',
      thrust_cut: 'Total horizontal force, along x, across the plane x = 0 (positive: the halves push each other apart at the corners); twice H_corner_x.',
      h_thrust: 'Depth below the crown (of the middle surface) at which the x-thrust acts, from moments of the half vault about the corner line.',
      W_half_y: 'As W_half, for the half vault on one side of the plane y = 0.',
      x_half_y: 'As x_half, for the plane y = 0.',
      N_crown_y: 'As N_crown, for the barrel spanning y; compression negative.',
      thrust_cut_y: 'As thrust_cut, along y across the plane y = 0; twice H_corner_y.',
      h_thrust_y: 'As h_thrust, for the y-thrust.',
      V_corner: 'Vertical reaction at each corner, W/4, positive downwards on the support.',
      H_corner_x: 'Horizontal thrust at each corner along x, outwards from the bay.',
      H_corner_y: 'Horizontal thrust at each corner along y, outwards from the bay.',
      H_corner: 'Resultant horizontal thrust at each corner, √(H_corner_x² + H_corner_y²), along the diagonal of a square bay.',
      z_thrust: 'Height above the springing of the bay at which H_corner_x acts: crown − h_thrust. Use it as the lever arm of the thrust on the pier (z_T of buttress, measured from the pier\'s base when the springing is the base).',
      z_thrust_y: 'Height above the springing at which H_corner_y acts: crown − h_thrust_y.',
      ridge_load_x: 'Pointed webs only: the downward line load along the ridge of the barrel spanning x that its membrane state needs (2·|N_crown|·sin φ at the ridge); 0 for round barrels.',
      ridge_load_y: 'As ridge_load_x, for the barrel spanning y.',
    },
    method: 'Each web is a segment of its barrel bounded by the groins. Radial equilibrium of the membrane gives the hoop force at the crown, N = −q·R; '
      + 'across the plane through the crown it adds up to thrust_cut, which the half vault sends to its two corners. Moments of the half vault about the line of its '
      + 'corners (at the middle surface\'s springing) place the thrust h_thrust below the crown. Web areas, loads and moments are integrated in the angle of the '
      + 'web\'s normal by Gauss–Legendre quadrature.',
    assumptions: [
      'Membrane state of the webs (no bending); the webs\' loads are vertical and uniform along their generators.',
      'The four corners are fixed supports; the bay is symmetric and loaded uniformly (no partial live load).',
      'The groins (ribs) collect what the webs deliver; their own bending is not modelled.',
    ],
    sources: [HEYMAN_SHELLS, FLUGGE],
  },
});

export const web_membrane_at = defineCellFunction({
  name: 'web_membrane_at',
  doc: 'Membrane forces N_phi, N_x, N_xphi at a point of a web of a cross vault (x along the generators from the centre line, phi the slope of the normal; web "x" or "y").',
  params: [
    { name: 'vault', type: { ref: 'groin_vault' } },
    { name: 'x', type: 'm' },
    { name: 'phi', type: 'rad' },
    { name: 'web', type: 'text', optional: true },
  ],
  returns: { object: { N_phi: 'N/m', N_x: 'N/m', N_xphi: 'N/m' } },
  fn: webMembrane,
  reference: {
    params: {
      vault: VAULT_PARAM,
      x: 'Distance along the web\'s generators (parallel to its crown line) from the centre line of the bay, between the groin and the face arch. '
        + 'For web "x" (the barrel spanning x, whose crown line runs along y) this is a distance in the y direction.',
      phi: 'Inclination of the web\'s normal from the vertical: from the crown (0 for a round web, the ridge angle for a pointed one) to 90 deg at the springing; '
        + 'the web is symmetric, so give the positive value.',
      web: '"x" (default) for the webs of the barrel spanning x, "y" for the webs of the barrel spanning y.',
    },
    fields: {
      N_phi: 'Hoop force across the generators, per unit length; compression negative.',
      N_x: 'Force along the generators, per unit length; compression negative; 0 at the face arch.',
      N_xphi: 'Membrane shear per unit length; 0 on the bay\'s centre line, growing linearly with x.',
    },
    method: 'Membrane theory of the circular cylinder for a vertical load q(φ) per unit surface, uniform along the generators: N_φ = −q·R·cos φ, '
      + 'N_xφ = −A·x and N_x = A′·(x² − l²)/(2R) with A = 2q·sin φ − q′·cos φ, by symmetry N_xφ = 0 on the centre line and N_x = 0 at the face arch (x = ±l). '
      + 'The web carries the state of the whole barrel, cut off at the groin. Derivatives of q by five-point differences.',
    assumptions: ['Membrane state (no bending).', 'The face arches take no force along the generators.'],
    sources: [FLUGGE, 'S. Timoshenko and S. Woinowsky-Krieger, Theory of Plates and Shells, McGraw-Hill, 2nd ed. 1959, §110 (from memory).'],
  },
});

export const vault_bays = defineCellFunction({
  name: 'vault_bays',
  doc: 'Pier reactions under a row of n equal cross-vault bays along x: intermediate piers (transverse thrust only) and end piers (both thrusts).',
  params: [{ name: 'vault', type: { ref: 'groin_vault' } }, { name: 'n', type: 'count' }],
  returns: {
    object: {
      bays: 'count', n_intermediate: 'count', n_end: 'count',
      V_intermediate: 'N', H_intermediate: 'N', z_intermediate: 'm',
      V_end: 'N', H_end_x: 'N', H_end_y: 'N', H_end: 'N', z_end_x: 'm', z_end_y: 'm',
    },
  },
  fn: vaultBays,
  reference: {
    params: {
      vault: VAULT_PARAM + ' The row runs along x: span_x is each bay\'s length along the row, span_y the span across it.',
      n: 'Number of bays in the row, a whole number ≥ 1.',
    },
    fields: {
      bays: 'Number of bays, n.',
      n_intermediate: 'Number of intermediate piers: 2·(n − 1), one each side of the row at every joint between bays.',
      n_end: 'Number of end piers: 4.',
      V_intermediate: 'Vertical load on an intermediate pier: the corners of two bays, 2·V_corner.',
      H_intermediate: 'Horizontal thrust on an intermediate pier, across the row (y), outwards: 2·H_corner_y. The thrusts along the row cancel.',
      z_intermediate: 'Height above the springing at which H_intermediate acts (z_thrust_y).',
      V_end: 'Vertical load on an end pier: one corner, V_corner.',
      H_end_x: 'Thrust on an end pier along the row (x), outwards: H_corner_x.',
      H_end_y: 'Thrust on an end pier across the row (y), outwards: H_corner_y.',
      H_end: 'Resultant horizontal thrust on an end pier, H_corner.',
      z_end_x: 'Height above the springing at which H_end_x acts (z_thrust).',
      z_end_y: 'Height above the springing at which H_end_y acts (z_thrust_y).',
    },
    method: 'Statics of the free body: a pier between two bays carries a corner of each; their vertical loads and their transverse thrusts add, '
      + 'their longitudinal thrusts are equal and opposite and cancel. An end pier carries one corner and both its thrusts.',
    assumptions: ['Every bay is alike and loaded alike: an unloaded or missing neighbour leaves part of the longitudinal thrust unbalanced, which this does not report.'],
    sources: ['Statics of the free body (common practice).'],
  },
});
