/** Arch and barrel-ring limit analysis, registered for cells. */
import { defineCellFunction, type FieldType } from '../define.js';
import { archRing } from './arch/arch-ring.js';
import { archLimit } from './arch/arch-limit.js';
import { thrustLine } from './arch/thrust-line.js';

const LOADS: FieldType = {
  object: {
    fill_unit_weight: 'N/m^3', fill_level: 'm', dead: 'Pa', live: 'Pa',
    live_from: 'm', live_to: 'm', P: 'N', P_at: 'm',
  },
};
const HINGES: FieldType = { list: { object: { angle: 'rad', face: 'text' } } };

export const arch_ring = defineCellFunction({
  name: 'arch_ring',
  doc: 'A masonry ring one strip deep: shape, span + rise of the intrados (or radius of the centreline + half_angle), thickness, unit_weight, depth, voussoirs.',
  params: [{
    name: 'options',
    type: {
      object: {
        shape: 'any', span: 'm', rise: 'm', radius: 'm', half_angle: 'rad', thickness: 'm',
        unit_weight: 'N/m^3', depth: 'm', voussoirs: 'count',
      },
    },
  }],
  returns: {
    object: {
      shape: 'text', span: 'm', rise: 'm', radius: 'm', half_angle: 'rad', thickness: 'm',
      unit_weight: 'N/m^3', depth: 'm', voussoirs: '1', weight: 'N',
    },
  },
  required: ['shape', 'thickness', 'unit_weight'],
  fn: archRing,
  reference: {
    params: {
      'options.shape': 'profile family of the intrados in quotes ("circular", "pointed", "elliptical", "parabolic", "catenary", "cycloid"), or the exponent n of the R0·cos^n φ family',
      'options.span': 'clear span of the intrados between the springings (length); give span and rise, or radius and half_angle',
      'options.rise': 'rise of the intrados from the springing line to the crown (length); not needed for "pointed"',
      'options.radius': 'centreline radius of a circular ring (length), with half_angle instead of span and rise',
      'options.half_angle': 'angle from the crown to the springing joint (angle; 90 deg for a semicircle), with radius',
      'options.thickness': 'ring thickness, constant, measured along the joints (length)',
      'options.unit_weight': 'unit weight of the masonry (force per volume, e.g. 18 kN/m^3; lb/ft^3 is a mass density: write lbf/ft^3)',
      'options.depth': 'width of the strip along the barrel (length), default 1 m',
      'options.voussoirs': 'number of voussoirs the ring is cut into for the analysis (whole number ≥ 2), default 200',
    },
    fields: {
      shape: 'the profile family, as given (an exponent n shows as "power n = …")',
      span: 'clear span of the intrados (m)',
      rise: 'rise of the intrados from the springing to the crown (m)',
      radius: 'centreline radius of a circular ring (m); not available for other shapes, which have no single radius',
      half_angle: 'angle of the springing joint from the crown, measured from the vertical (rad, shown in degrees)',
      thickness: 'ring thickness (m)',
      unit_weight: 'unit weight of the masonry (N/m^3)',
      depth: 'width of the strip (m)',
      voussoirs: 'number of voussoirs',
      weight: 'self-weight of the whole ring strip (N)',
    },
    method: 'The centreline is the parallel curve at t/2 outside the intrados; the ring is cut into voussoirs by joints normal to the centreline. The ring frame has y = 0 at the springing of the intrados and x = 0 on the crown axis.',
    assumptions: ['constant thickness', 'symmetric about the crown', 'joints normal to the centreline'],
    sources: ['J. Heyman, The Stone Skeleton, Cambridge University Press, 1995 (the ring as an assembly of voussoirs)'],
  },
});

export const arch_limit = defineCellFunction({
  name: 'arch_limit',
  doc: "Limit analysis of a ring under Heyman's assumptions: thrust range, minimum thickness, geometric factor of safety, hinges, collapse load factor.",
  params: [{ name: 'ring', type: { ref: 'arch_ring' } }, { name: 'loads', type: LOADS, optional: true }],
  returns: {
    object: {
      H_min: 'N', H_max: 'N', V_left: 'N', V_right: 'N', t_min: 'm', gsf: '1', hinges: HINGES,
      load_factor: '1', mechanism: HINGES, safe: 'boolean', notes: { list: 'text' },
    },
  },
  fn: (ring, loads) => archLimit(ring, loads ?? {}),
});

export const thrust_line = defineCellFunction({
  name: 'thrust_line',
  doc: 'The best-centred line of thrust of a ring for a given horizontal thrust H under symmetric loads: points {x, y}.',
  params: [{ name: 'ring', type: { ref: 'arch_ring' } }, { name: 'loads', type: LOADS }, { name: 'H', type: 'N' }],
  returns: { list: { object: { x: 'm', y: 'm' } } },
  fn: thrustLine,
});
