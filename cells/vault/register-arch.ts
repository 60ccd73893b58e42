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

/** Where a joint is: φ, the angle of the joint (normal to the centreline) from the vertical through the crown. */
const JOINT_ANGLE = 'Angle φ of the joint: the joint is normal to the centreline, and φ is the angle of that normal from the vertical, '
  + 'so 0 at the crown, negative on the left half, positive on the right half, and ±half_angle at the springing joints.';

/** The loads record of arch_limit and thrust_line: reference text for each option. */
export const LOADS_REFERENCE: Record<string, string> = {
  loads: 'Loads on the strip besides the self-weight of the ring; every entry optional, all zero by default. '
    + 'Positions are measured horizontally from the left springing of the intrados.',
  'loads.fill_unit_weight': 'Unit weight of the fill over the ring. Give it together with fill_level.',
  'loads.fill_level': 'Level of the top of the fill above the springing of the intrados (≥ 0). The vertical column of fill between '
    + 'the upward-facing extrados and this level bears on the voussoir beneath it; the fill adds weight only (no spreading, no passive resistance).',
  'loads.dead': 'Superimposed permanent load per unit plan area (e.g. paving), over the plan projection of the extrados; kept at its nominal value when load_factor is sought.',
  'loads.live': 'Variable load per unit plan area over the stretch from live_from to live_to; multiplied by λ when load_factor is sought.',
  'loads.live_from': 'Start of the live load, from the left springing of the intrados. Default: the left end of the ring.',
  'loads.live_to': 'End of the live load, from the left springing of the intrados; must exceed live_from. Default: the right end of the ring.',
  'loads.P': 'A point load on the strip (total over the depth, not per metre), vertical, applied on the extrados at P_at; multiplied by λ when load_factor is sought.',
  'loads.P_at': 'Where P acts, from the left springing of the intrados; required with P, and must lie over the ring.',
};

const RING_PARAM = 'A ring made by arch_ring (its geometry, unit weight, depth and voussoirs).';

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
      options: 'The ring: its shape, its size (span and rise of the intrados, or for a circular ring radius and half_angle of the centreline), thickness and material.',
      'options.shape': 'Family of the intrados: "circular", "pointed" (two-centred, both centres on the springing line), "elliptical", "parabolic", '
        + '"catenary", "cycloid", or a number n for the profile whose radius of curvature is R(φ) = R0·cos^n φ. With radius and half_angle only "circular" is accepted.',
      'options.span': 'Clear span of the intrados between the springings. Give span and rise, or radius and half_angle, not both.',
      'options.rise': 'Rise of the intrados from the springing line to the crown. Required with span, except for "pointed", '
        + 'where it defaults to span·√3/2 (the equilateral arch) and must be at least span/2.',
      'options.radius': 'Circular rings only: radius of the centreline (not of the intrados), with half_angle instead of span and rise; must exceed thickness/2.',
      'options.half_angle': 'Circular rings only: angle at the centre from the crown to the springing joint (90 deg for a semicircle), with radius.',
      'options.thickness': 'Thickness of the ring, constant, measured normal to the centreline. The centreline is the curve thickness/2 outside the intrados. '
        + 'Must be less than the span.',
      'options.unit_weight': 'Unit weight of the masonry, a force per volume (18 kN/m^3, not a mass density in kg/m^3).',
      'options.depth': 'Width of the strip along the vault, across the span. Default 1 m; every force of arch_limit and thrust_line is for a strip this wide.',
      'options.voussoirs': 'Number of voussoirs the ring is cut into, of equal length along the centreline, with joints normal to it. Default 200 '
        + '(at least 2). A pointed ring gets half of them on each side of the apex.',
    },
    fields: {
      shape: 'The shape as given ("power n = …" for an exponent).',
      span: 'Clear span of the intrados (computed from radius and half_angle when those were given).',
      rise: 'Rise of the intrados from its springing to its crown (or apex).',
      radius: 'Radius of the centreline; present only for a ring given by radius and half_angle.',
      half_angle: 'Angle of the springing joint from the vertical (see arch_limit hinges.angle): 90 deg for a semicircle, less for a segmental ring.',
      thickness: 'Thickness as given.',
      unit_weight: 'Unit weight as given.',
      depth: 'Width of the strip (default 1 m).',
      voussoirs: 'Number of voussoirs used.',
      weight: 'Self-weight of the whole ring strip, springing to springing: unit_weight · depth · area of the ring.',
    },
    method: 'The intrados of the chosen family is built from span and rise (or the circular centreline from radius and half_angle); '
      + 'the centreline is its parallel curve at thickness/2, and the ring is cut into voussoirs of equal centreline length. '
      + 'Coordinates used by arch_limit and thrust_line: x horizontal from the crown axis (right positive), y above the springing of the intrados.',
    assumptions: ['Constant thickness, normal to the centreline.', 'Symmetric about the crown.'],
    sources: ['Geometry of the profiles only (circle, ellipse, parabola, catenary, cycloid, two-centred arch); no published method is followed.'],
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
  reference: {
    params: { ring: RING_PARAM, ...LOADS_REFERENCE },
    fields: {
      H_min: 'Least horizontal thrust for which a line of thrust in equilibrium with the loads fits within the ring (per strip of depth). '
        + 'Positive: the ring pushes its springings apart, so this is the least outward push the supports receive. Left out when no line fits (safe is false).',
      H_max: 'Greatest horizontal thrust for which a line of thrust fits within the ring: the most the ring can push on its supports if they do not move apart. '
        + 'Left out when unbounded (a straight line of thrust fits, see notes) or when no line fits.',
      V_left: 'Vertical reaction at the left springing in the state of least thrust, positive upwards on the ring (the load it puts on the left support). Left out when no line fits.',
      V_right: 'Vertical reaction at the right springing in the state of least thrust; V_left + V_right is the total load. Left out when no line fits.',
      t_min: 'Least thickness, the ring scaled about its centreline and all loads (self-weight, fill) recomputed with it, for which a line of thrust still fits. '
        + 'Left out when no thickness below the span fits.',
      gsf: 'Geometric factor of safety thickness / t_min: 1 means the ring is as thin as it can be; 0 when no thickness fits. '
        + 'A common criterion asks 2 or more for arches (Heyman; common practice).',
      hinges: 'Joints where the line of least thrust touches the intrados or the extrados, from left to right. Left out when no line fits.',
      'hinges.angle': JOINT_ANGLE,
      'hinges.face': 'Which face the line touches there: "intrados" or "extrados".',
      load_factor: 'Collapse load factor λ: the live load and the point load multiplied by λ (self-weight, fill and dead load kept at 1) bring the ring to a mechanism. '
        + 'Computed only when there is live load or a point load; left out when the live load never causes collapse or the ring cannot carry its dead loads (see notes).',
      mechanism: 'The hinges of the collapse mechanism at load_factor, from left to right (usually four for a fixed arch). Present with load_factor.',
      'mechanism.angle': JOINT_ANGLE,
      'mechanism.face': 'Which face the line touches at that hinge: "intrados" or "extrados".',
      safe: 'true when a line of thrust fits within the ring under the loads as given (λ = 1): by the safe theorem the ring then stands.',
      notes: 'Plain-language reasons for every field left out.',
    },
    method: 'Limit analysis of a rigid no-tension ring. A line of thrust is fixed by three unknowns (H, V, M0); it lies within the ring when at every joint '
      + 'the eccentricity of the normal force is at most thickness/2. These conditions are linear, so H_min and H_max are linear programs in three unknowns, '
      + 'load_factor a linear program in four (by the uniqueness theorem the largest admissible multiplier is the collapse multiplier), and t_min the root of the fitting margin in t, '
      + 'found by the Illinois variant of regula falsi. All programs are solved exactly (Seidel\'s randomised algorithm); hinges are joints where |e| reaches thickness/2.',
    assumptions: [
      'Masonry has no tensile strength, unlimited compressive strength, and joints do not slide (Heyman\'s assumptions).',
      'Loads are vertical; fill adds weight only and gives no passive resistance.',
      'The ring is cut into the voussoirs of arch_ring; hinges form only at those joints.',
      'The supports do not move.',
    ],
    sources: [
      'J. Heyman, "The stone skeleton", International Journal of Solids and Structures 2, 1966 (the safe and uniqueness theorems for masonry).',
      'J. Heyman, "The safety of masonry arches", International Journal of Mechanical Sciences 11, 1969 (minimum thickness, geometric factor of safety).',
      'J. Heyman, The Stone Skeleton, Cambridge University Press, 1995.',
      'M. Dowell and P. Jarratt, BIT 11, 1971 (the Illinois variant of regula falsi).',
    ],
  },
});

export const thrust_line = defineCellFunction({
  name: 'thrust_line',
  doc: 'The best-centred line of thrust of a ring for a given horizontal thrust H under symmetric loads: points {x, y}.',
  params: [{ name: 'ring', type: { ref: 'arch_ring' } }, { name: 'loads', type: LOADS }, { name: 'H', type: 'N' }],
  returns: { list: { object: { x: 'm', y: 'm' } } },
  fn: thrustLine,
  reference: {
    params: {
      ring: RING_PARAM,
      ...LOADS_REFERENCE,
      loads: LOADS_REFERENCE.loads + ' Must be symmetric about the crown (use arch_limit for other loads); write {} for self-weight alone.',
      H: 'Horizontal thrust per strip, positive. Within [H_min, H_max] of arch_limit the line lies within the ring; outside it, the line shows where it leaves.',
    },
    fields: {
      result: 'The centres of pressure on the joints, from the left springing to the right: a list of points {x, y}.',
      x: 'Horizontal position from the crown axis, positive to the right.',
      y: 'Height above the springing of the intrados.',
    },
    method: 'Symmetry fixes the vertical reaction at half the total load; of the lines of thrust left with the given H, the one returned is the best centred: '
      + 'the one whose largest ratio of eccentricity to half the joint length is least (a minimax in the crown position, solved as a two-unknown linear program).',
    assumptions: ['Loads vertical and symmetric about the crown.', 'The thrust stays compressive at every joint (refused otherwise).'],
    sources: ['J. Heyman, The Stone Skeleton, Cambridge University Press, 1995 (lines of thrust).'],
  },
});
