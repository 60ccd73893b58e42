/** Cross vaults, registered for cells. */
import { defineCellFunction } from '../define.js';
import { groinVault } from './groin/groin-vault.js';
import { webMembrane } from './groin/web-membrane.js';
import { vaultBays } from './groin/vault-bays.js';

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
});
