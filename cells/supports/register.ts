/** Supports that resist a vault's thrust, registered for cells. */
import { defineCellFunction } from '../define.js';
import { buttress as buttressKernel } from './buttress.js';
import { tie as tieKernel } from './tie.js';

/** Reference text of buttress's options (support_figure takes the same record). */
export const BUTTRESS_OPTIONS: Record<string, string> = {
  options: 'The support (a wall checked per metre, or a buttress) and the forces the vault puts on it. Lengths across the support are measured from its inner face, the face the vault bears on.',
  'options.height': 'Height from the base to the top of the support.',
  'options.width': 'Width of the top block in the direction of the thrust (the whole width when there are no steps).',
  'options.depth': 'Dimension perpendicular to the thrust: 1 m for a wall checked per metre, the buttress\'s length otherwise.',
  'options.unit_weight': 'Unit weight of the masonry.',
  'options.T': 'Horizontal thrust of the vault on the support, pushing outwards (away from the vault), positive; total over depth.',
  'options.z_T': 'Height above the base at which T acts; above 0 and not above height.',
  'options.V': 'Vertical load from the vault on the top, downwards. Default 0.',
  'options.x_V': 'Where V acts, from the inner face, on the top (0 to width). Default 0 (at the inner face).',
  'options.steps': 'Blocks below the top one, listed from the base up, each {height, width}, all with the inner face plumb (a stepped outer face). '
    + 'The top block has width and the rest of the height. Default: none.',
  'options.steps.height': 'Height of the step block.',
  'options.steps.width': 'Width of the step block, from the inner face.',
  'options.friction': 'Coefficient of friction µ at the base, in (0, 1.5]; gives sf_sliding. Optional.',
  'options.bearing': 'Allowable (or design) bearing pressure under the base; gives bearing_ok. Optional.',
};

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
  reference: {
    params: BUTTRESS_OPTIONS,
    fields: {
      base_width: 'Width of the base (the lowest block).',
      W_self: 'Weight of the masonry of the support.',
      N: 'Normal force on the base: W_self + V.',
      x_R: 'Where the resultant cuts the base, measured from the outer toe (the edge away from the vault) towards the vault. Negative or beyond base_width: outside the base.',
      e: 'Eccentricity of the resultant from the centre of the base, positive outwards (towards the outer toe).',
      middle_third: 'true when |e| ≤ base_width/6: the whole base is in compression.',
      in_base: 'true when the resultant cuts the base at all (it overturns otherwise).',
      sf_overturning: 'Restoring over overturning moment about the outer toe: (moment of W_self and V) / (T·z_T). The resultant leaves the base exactly when it falls to 1.',
      sigma_max: 'Largest base pressure. In the middle third N/(B·d)·(1 + 6|e|/B); beyond it the base opens and a triangle 3a long (a the distance to the nearer edge) carries N: 2N/(3·a·d). '
        + 'Left out when the resultant is outside the base.',
      sigma_min: 'Smallest base pressure: N/(B·d)·(1 − 6|e|/B) in the middle third, 0 beyond it. Left out when the resultant is outside the base.',
      sf_sliding: 'µ·N/T: resistance to sliding on the base over the thrust. Present only when friction is given.',
      width_min_third: 'Least base width that keeps the resultant in the middle third, widening every level by the same amount (the outer face moves out, the inner face stays).',
      width_min_base: 'Least base width that keeps the resultant within the base, widened the same way.',
      path: 'The line of thrust through the support: where the resultant of everything above each level cuts it, from the top down to the base '
        + '(24 equal divisions of the height, every step and the thrust level).',
      'path.z': 'Level above the base.',
      'path.x': 'Where the resultant cuts that level, from the outer toe of the base, positive towards the vault.',
      bearing_ok: 'true when the resultant is in the base and sigma_max ≤ bearing. Present only when bearing is given.',
    },
    method: 'Rigid-block statics with no tension at the base: moments about the inner face place the resultant of the masonry, V and T at each level; '
      + 'base pressures from the linear (middle third) or triangular (beyond it) distribution; least widths from the quadratic condition on the widening, solved in closed form.',
    assumptions: [
      'Masonry blocks are rigid, the base takes no tension, and the support does not slide unless sf_sliding says so.',
      'Forces act in the plane of the thrust; the depth carries them evenly.',
      'Soil and foundation are checked only through bearing; settlement is not considered.',
    ],
    sources: [
      'J. Heyman, The Stone Skeleton, Cambridge University Press, 1995 (buttresses; from memory).',
      'Base pressures and the middle third: statics of a rigid block on a no-tension base (any statics text; common practice).',
    ],
  },
});

export const tie = defineCellFunction({
  name: 'tie',
  doc: 'Steel tie taking a thrust: required area T·γ_M/f_y and the smallest round bar of the series 8…50 mm that suffices.',
  params: [{ name: 'options', type: { object: { T: 'N', f_y: 'Pa', gamma_M: '1' } } }],
  required: ['T', 'f_y'],
  returns: { object: { force: 'N', area: 'm^2', bar_diameter: 'm', bar_area: 'm^2', utilization: '1' } },
  fn: tieKernel,
  reference: {
    params: {
      options: 'The force and the steel.',
      'options.T': 'Tension the tie must carry, positive: the horizontal thrust it replaces (already factored when designing).',
      'options.f_y': 'Yield strength of the steel (e.g. 235 MPa for S235, 355 MPa for S355).',
      'options.gamma_M': 'Partial factor for the steel, between 1 and 3. Default 1.0 (γ_M0 recommended in EN 1993-1-1; check the National Annex).',
    },
    fields: {
      force: 'The tension T, as given.',
      area: 'Required area of the bar: T·γ_M/f_y.',
      bar_diameter: 'Smallest round bar of the series 8, 10, 12, 16, 20, 25, 32, 40, 50 mm whose area suffices. More than one 50 mm bar is refused (use several ties).',
      bar_area: 'Area of that bar, π·d²/4.',
      utilization: 'area / bar_area (≤ 1).',
    },
    method: 'Yield of the gross section: N_pl,Rd = A·f_y/γ_M ≥ T, so A = T·γ_M/f_y; the bar is the first of the series that reaches A.',
    assumptions: [
      'Gross section in tension only. A threaded end has a smaller net area and needs its own check (γ_M2 on the ultimate strength f_u), which this does not make.',
      'Anchorage plates and the masonry behind them are not checked.',
    ],
    sources: ['EN 1993-1-1, 6.2.3 (tension resistance of the gross section; from memory).', 'The bar series: common practice for tie rods.'],
  },
});
