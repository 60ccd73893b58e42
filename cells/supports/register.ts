/** Supports that resist a vault's thrust, registered for cells. */
import { defineCellFunction } from '../define.js';
import { buttress as buttressKernel } from './buttress.js';
import { tie as tieKernel } from './tie.js';

export const buttress = defineCellFunction({
  name: 'buttress',
  doc: 'Wall or buttress under a vault thrust: where the resultant cuts the base, safety against overturning and sliding, base pressures, least widths and the line of thrust.',
  params: [{
    name: 'options',
    type: {
      object: {
        height: 'm', width: 'm', depth: 'm', unit_weight: 'N/m^3', T: 'N', z_T: 'm', V: 'N', x_V: 'm',
        steps: { list: { object: { height: 'm', width: 'm' } } }, friction: '1', bearing: 'Pa',
      },
    },
  }],
  required: ['height', 'width', 'depth', 'unit_weight', 'T', 'z_T'],
  returns: {
    object: {
      base_width: 'm', W_self: 'N', N: 'N', x_R: 'm', e: 'm', middle_third: 'boolean', in_base: 'boolean',
      sf_overturning: '1', sigma_max: 'Pa', sigma_min: 'Pa', sf_sliding: '1',
      width_min_third: 'm', width_min_base: 'm', path: { list: { object: { z: 'm', x: 'm' } } }, bearing_ok: 'boolean',
    },
  },
  fn: buttressKernel,
});

export const tie = defineCellFunction({
  name: 'tie',
  doc: 'Steel tie taking a thrust: required area T·γ_M/f_y and the smallest round bar of the series 8…50 mm that suffices.',
  params: [{ name: 'options', type: { object: { T: 'N', f_y: 'Pa', gamma_M: '1' } } }],
  required: ['T', 'f_y'],
  returns: { object: { force: 'N', area: 'm^2', bar_diameter: 'm', bar_area: 'm^2', utilization: '1' } },
  fn: tieKernel,
});
