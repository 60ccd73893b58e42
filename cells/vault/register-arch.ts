/** Arch and barrel-ring limit analysis, registered for cells. */
import { defineCellFunction, type FieldType } from '../define.js';
import { archRing } from './arch/arch-ring.js';
import { archLimit } from './arch/arch-limit.js';
import { thrustLine } from './arch/thrust-line.js';
import { archScan } from './arch/arch-scan.js';
import { ARCH_RING_REFERENCE, ARCH_LIMIT_REFERENCE, THRUST_LINE_REFERENCE, ARCH_SCAN_REFERENCE } from './arch/reference.js';

/** The loads record of arch_limit, arch_scan and the arch figures. */
export const ARCH_LOADS: FieldType = {
  object: {
    fill_unit_weight: 'N/m^3', fill_level: 'm', dead: 'Pa', live: 'Pa',
    live_from: 'm', live_to: 'm', P: 'N', P_at: 'm', spread: '1', fill_pressure: '1',
    axles: { list: { object: { W: 'N', at: 'm' } } },
  },
};
const LOADS = ARCH_LOADS;
const HINGES: FieldType = { list: { object: { angle: 'rad', face: 'text', x: 'm', z: 'm', N: 'N', T: 'N' } } };
const SLIDING: FieldType = { list: { object: { state: 'text', ratio: '1', angle: 'rad', x: 'm', z: 'm' } } };

export const arch_ring = defineCellFunction({
  name: 'arch_ring',
  doc: 'A masonry ring one strip deep: shape, span + rise of the intrados (or radius of the centreline + half_angle), thickness, unit_weight, depth, voussoirs; optional f_c, friction, gsf.',
  params: [{
    name: 'options',
    type: {
      object: {
        shape: 'any', span: 'm', rise: 'm', radius: 'm', half_angle: 'rad', thickness: 'm',
        unit_weight: 'N/m^3', depth: 'm', voussoirs: 'count', f_c: 'Pa', friction: '1', gsf: 'text',
      },
    },
  }],
  returns: {
    object: {
      shape: 'text', span: 'm', rise: 'm', radius: 'm', half_angle: 'rad', thickness: 'm',
      unit_weight: 'N/m^3', depth: 'm', voussoirs: '1', weight: 'N', f_c: 'Pa', friction: '1', gsf_definition: 'text',
    },
  },
  required: ['shape', 'thickness', 'unit_weight'],
  fn: archRing,
  reference: ARCH_RING_REFERENCE,
});

export const arch_limit = defineCellFunction({
  name: 'arch_limit',
  doc: "Limit analysis of a ring (Heyman's safe theorem): thrust range, minimum thickness, geometric factor of safety (by name), hinges, collapse load factor and mechanism, with finite strength and friction if the ring gives them.",
  params: [{ name: 'ring', type: { ref: 'arch_ring' } }, { name: 'loads', type: LOADS, optional: true }],
  returns: {
    object: {
      H_min: 'N', H_max: 'N', V_left: 'N', V_right: 'N', t_min: 'm', gsf: '1', gsf_definition: 'text', hinges: HINGES,
      load_factor: '1', mechanism: HINGES, governs: 'text', sigma_max: 'Pa', sigma_max_at: 'm', sliding: SLIDING,
      load_spread: 'text', safe: 'boolean', notes: { list: 'text' },
    },
  },
  fn: (ring, loads) => archLimit(ring, loads ?? {}),
  reference: ARCH_LIMIT_REFERENCE,
});

export const thrust_line = defineCellFunction({
  name: 'thrust_line',
  doc: 'The best-centred line of thrust of a ring for a given horizontal thrust H under symmetric loads: points {x, y}.',
  params: [{ name: 'ring', type: { ref: 'arch_ring' } }, { name: 'loads', type: LOADS }, { name: 'H', type: 'N' }],
  returns: { list: { object: { x: 'm', y: 'm' } } },
  fn: thrustLine,
  reference: THRUST_LINE_REFERENCE,
});

export const arch_scan = defineCellFunction({
  name: 'arch_scan',
  doc: 'A vehicle (axle loads and spacings) rolled across the ring: least collapse load factor, the lead axle\'s worst position, λ against position, and the mechanism there.',
  params: [
    { name: 'ring', type: { ref: 'arch_ring' } },
    { name: 'loads', type: LOADS },
    { name: 'vehicle', type: { object: { axles: { list: 'N' }, spacing: { list: 'm' }, from: 'm', to: 'm', steps: 'count' } } },
  ],
  returns: {
    object: {
      lambda_min: '1', x_worst: 'm', curve: { list: { object: { x: 'm', lambda: '1' } } }, mechanism: HINGES,
      governs: 'text', load_spread: 'text', notes: { list: 'text' },
    },
  },
  fn: (ring, loads, vehicle) => archScan(ring, loads, vehicle),
  reference: ARCH_SCAN_REFERENCE,
});
