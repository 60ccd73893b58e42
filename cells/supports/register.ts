/** Supports that resist a vault's thrust, registered for cells. */
import { defineCellFunction } from '../define.js';
import { buttress as buttressKernel } from './buttress.js';
import { tie as tieKernel } from './tie.js';
import { flyingButtress } from './flyer.js';

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
  required: ['height', 'width', 'depth', 'unit_weight', 'T'],
  returns: {
    object: {
      base_width: 'm', W_self: 'N', N: 'N', x_R: 'm', e: 'm', middle_third: 'boolean', in_base: 'boolean',
      sf_overturning: '1', sigma_max: 'Pa', sigma_min: 'Pa', sf_sliding: '1',
      width_min_third: 'm', width_min_base: 'm', path: { list: { object: { z: 'm', x: 'm' } } }, bearing_ok: 'boolean',
    },
  },
  fn: buttressKernel,
  reference: {
    params: {
      options: 'The support (a wall checked per metre run, or a buttress) and the forces the vault puts on it (options below).',
      'options.height': 'Total height from the base to the top (m).',
      'options.width': 'Width of the top block in the direction of the thrust (m); the whole width when there are no steps.',
      'options.depth': 'Dimension perpendicular to the thrust (m): 1 m for a wall checked per metre run.',
      'options.unit_weight': 'Unit weight of the masonry (kN/m³).',
      'options.T': 'Horizontal thrust of the vault pushing outwards (kN), zero or more: 0 for a wall under vertical load only.',
      'options.z_T': 'Height of the thrust above the base (m); required when T > 0, at most the height.',
      'options.V': 'Vertical load from the vault on the top (kN), default 0.',
      'options.x_V': 'Where V acts, from the inner (vault-side) face (m), on the top block; default 0.',
      'options.steps': 'Wider blocks below the top one, from the base up, [{height, width}], aligned at the plumb inner face (setbacks of the outer face).',
      'options.steps.height': 'Height of the block (m).',
      'options.steps.width': 'Width of the block in the direction of the thrust (m).',
      'options.friction': 'Coefficient of friction at the base, in (0, 1.5]; gives sf_sliding.',
      'options.bearing': 'Allowable bearing pressure under the base (kPa); gives bearing_ok.',
    },
    fields: {
      base_width: 'Width of the base block (m).',
      W_self: 'Weight of the masonry (kN).',
      N: 'Normal force on the base, W_self + V (kN).',
      x_R: 'Where the resultant cuts the base, from the outer toe (m); negative when it falls outside the toe.',
      e: 'Eccentricity of the resultant from the centre of the base, positive towards the outer toe (m).',
      middle_third: 'true when |e| ≤ base_width/6 (no tension anywhere under the base).',
      in_base: 'true when the resultant cuts the base inside it.',
      sf_overturning: 'Restoring over overturning moment about the outer toe; ∞ when T = 0.',
      sigma_max: 'Greatest base pressure (kPa): trapezoid inside the kern, triangle 3a long beyond it; not available when the support overturns.',
      sigma_min: 'Least base pressure (kPa), 0 once the base opens; not available when the support overturns.',
      sf_sliding: 'µ·N/T; ∞ when T = 0; not available when friction is not given.',
      width_min_third: 'Least base width from which on every wider support keeps the resultant in the middle third (both edges), widening every block alike by moving the outer face (m); not available when any width keeps it there.',
      width_min_base: 'The same for the resultant within the base (m).',
      path: 'Line of thrust through the support: points {z above the base, x from the outer toe} from the top down.',
      'path.z': 'Height of the point above the base (m).',
      'path.x': 'Horizontal distance of the resultant from the outer toe at that level (m).',
      bearing_ok: 'sigma_max ≤ bearing with the resultant in the base; not available when bearing is not given.',
    },
    method: 'Rigid-block statics of the free body above each level, no tension at the joints; least widths in closed form from the two quadratic conditions on the resultant (outer and inner edge of the zone).',
    assumptions: ['Masonry rigid, no tensile strength, no sliding at the joints above the base.', 'Inner face plumb; steps widen the outer face.', 'Loads per depth given; the thrust horizontal.'],
    sources: ['Heyman, The Stone Skeleton, Cambridge 1995, on buttresses.', 'Huerta, "The safety of masonry buttresses", Proc. ICE Eng. Hist. Heritage 163 (2010).', 'Base pressure under an eccentric load: any statics text.'],
  },
});

export const tie = defineCellFunction({
  name: 'tie',
  doc: 'Steel tie taking a thrust, checked on its bar (A·f_y/γ_M0) and on its threaded ends (0.9·f_u·A_s/γ_M2): utilizations, which governs, and the bar of the series 8…50 mm to choose.',
  params: [{ name: 'options', type: { object: { T: 'N', f_y: 'Pa', gamma_M: '1', f_u: 'Pa', gamma_M2: '1', diameter: 'm' } } }],
  required: ['T', 'f_y'],
  returns: {
    object: {
      force: 'N', area: 'm^2', bar_diameter: 'm', bar_area: 'm^2', thread: 'text', thread_diameter: 'm', thread_area: 'm^2',
      N_bar_Rd: 'N', N_thread_Rd: 'N', utilization_bar: '1', utilization_thread: '1', utilization: '1', governs: 'text', bar_needed: 'm',
    },
  },
  fn: tieKernel,
  reference: {
    params: {
      options: 'The tie: the thrust it carries, the steel and the bar (options below).',
      'options.T': 'Tension the tie takes: the thrust it replaces (kN), > 0.',
      'options.f_y': 'Yield strength of the bar steel (MPa).',
      'options.gamma_M': 'Partial factor γ_M0 of the gross section, default 1.0 (EN 1993-1-1 §6.1 recommended value).',
      'options.f_u': 'Ultimate strength of the steel (MPa), ≥ f_y; without it the threaded ends are not checked and utilization is not available.',
      'options.gamma_M2': 'Partial factor γ_M2 of the threaded ends, default 1.25 (EN 1993-1-8 Table 2.1 recommended value).',
      'options.diameter': 'The chosen bar (mm), from 8 mm to under 68 mm (the thread table ends at M64; M68 is the next coarse size); its ends carry the largest metric coarse thread not above it (31 mm → M30). When omitted, the smallest bar of the series 8, 10, 12, 16, 20, 25, 32, 40, 50 mm that passes both checks.',
    },
    fields: {
      force: 'Tension in the tie (kN).',
      area: 'Required gross area T·γ_M0/f_y (mm²).',
      bar_diameter: 'Diameter of the bar checked (mm).',
      bar_area: 'Its gross area π·d²/4 (mm²).',
      thread: 'Thread on its ends: the largest ISO metric coarse size not above the bar diameter (cut thread), e.g. "M30" on a 32 mm bar.',
      thread_diameter: 'Nominal diameter of that thread (mm).',
      thread_area: 'Tensile stress area A_s of that thread (mm²), ISO 898-1 table.',
      N_bar_Rd: 'Resistance of the bar A·f_y/γ_M0 (kN).',
      N_thread_Rd: 'Resistance of the threaded end k2·f_u·A_s/γ_M2, k2 = 0.9 (kN); not available without f_u.',
      utilization_bar: 'T / N_bar_Rd.',
      utilization_thread: 'T / N_thread_Rd; not available without f_u.',
      utilization: 'The greater of utilization_bar and utilization_thread; not available without f_u.',
      governs: '"bar" or "thread", whichever utilization is greater; not available without f_u.',
      bar_needed: 'Smallest bar of the series whose bar and thread both suffice (mm); not available when even 50 mm does not.',
    },
    method: 'Gross-section yield of the bar and tension resistance of its threaded end; the tie passes when both utilizations are ≤ 1.',
    assumptions: ['Threads cut on the bar (not upset ends); nut, anchorage plate and the bearing under it are not checked.', 'Static tension; no fatigue, no bending of the tie.'],
    sources: [
      'EN 1993-1-1 §6.2.3: N_pl,Rd = A·f_y/γ_M0 (from memory).',
      'EN 1993-1-8 §3.6.1 Table 3.4: F_t,Rd = k2·f_ub·A_s/γ_M2, k2 = 0.9 (from memory).',
      'ISO 898-1 (stress area A_s = π/4·((d2 + d3)/2)²) and ISO 261 / ISO 724 (coarse pitches, d2 = d − 0.649519·P) (from memory).',
      'EN 10080 bar series (from memory).',
    ],
  },
});

export const flying_buttress = defineCellFunction({
  name: 'flying_buttress',
  doc: 'Flying buttress (a straight or arched inclined bar from the wall head to an outer pier): the least thrust it exerts under its own weight and the greatest it can carry, with the lines of thrust.',
  params: [{
    name: 'options',
    type: { object: { shape: 'text', span: 'm', rise: 'm', sag: 'm', thickness: 'm', width: 'm', unit_weight: 'N/m^3', strength: 'Pa' } },
  }],
  required: ['span', 'rise', 'thickness', 'unit_weight'],
  returns: {
    object: {
      W: 'N', H_min: 'N', H_max: 'N', H_crush: 'N', V_wall: 'N', V_pier: 'N',
      thrust_min: { list: { object: { x: 'm', z: 'm' } } }, thrust_max: { list: { object: { x: 'm', z: 'm' } } },
    },
  },
  fn: flyingButtress,
  reference: {
    params: {
      options: 'The flyer: its geometry, thickness, unit weight and strength (options below).',
      'options.shape': '"straight" (default): a straight bar; "arched": its centreline a circular arc bowed up by sag.',
      'options.span': 'Horizontal distance from the face of the clerestory wall to the face of the outer pier (m).',
      'options.rise': 'Height of the upper end (at the wall head) above the lower end (on the pier), on the centreline (m); 0 for a level flyer.',
      'options.sag': 'Arched only: sagitta of the centreline above the chord between its ends (m), less than half the chord.',
      'options.thickness': 'Thickness perpendicular to the centreline (m), less than a third of the length.',
      'options.width': 'Width of the flyer across its plane (m), default 1 m.',
      'options.unit_weight': 'Unit weight of the masonry (kN/m³).',
      'options.strength': 'Design compressive strength of the masonry (MPa), for H_crush; optional.',
    },
    fields: {
      W: 'Weight of the flyer (kN).',
      H_crush: 'Horizontal thrust at which the bar crushes under a uniform stress f·b·t along it, min over sections of f·b·t·cos α (kN); the rigid-block H_max ignores crushing, so the flyer carries at most the smaller. Not available without strength.',
      H_min: 'Least horizontal thrust the flyer exerts on the wall under its own weight (kN): the line of thrust at its flattest within the bar.',
      H_max: 'Greatest horizontal thrust it can pass from the wall to the pier with a line of thrust within it (kN); ∞ for a straight bar, which can carry any thrust along its axis until the masonry crushes (not checked).',
      V_wall: 'Vertical force of the wall head on the flyer in the least-thrust state (kN), upwards positive; negative when the wall must press its end down.',
      V_pier: 'Vertical load on the pier in the least-thrust state, W − V_wall (kN).',
      thrust_min: 'Line of thrust of the least-thrust state: {x from the wall face, z above the lower end of the centreline} (m), at 121 vertical sections.',
      thrust_max: 'The same for the greatest-thrust state; empty when H_max is unbounded.',
      'thrust_min.x': 'Horizontal distance of the point from the wall face (m).',
      'thrust_min.z': 'Height of the point above the lower end of the centreline (m).',
      'thrust_max.x': 'Horizontal distance of the point from the wall face (m).',
      'thrust_max.z': 'Height of the point above the lower end of the centreline (m).',
    },
    method: 'Vertical sections; under vertical loads H is constant and z(x) = z0 + s·x − M(x)/H. With A = H·z0 and B = H·s the section conditions are linear in (H, A, B): least and greatest H by linear programming (two-phase simplex). A vault thrust between H_min and H_max can be carried (safe theorem).',
    assumptions: ['Heyman\'s assumptions: no tension, no sliding, unlimited compression.', 'Self-weight only; the vault thrust enters at the wall head as a horizontal force at a height the line may choose within the end section.'],
    sources: ['Heyman, The Stone Skeleton, Cambridge 1995, ch. on the flying buttress (from memory).', 'Heyman, "The stone skeleton", Int. J. Solids Struct. 2 (1966) (from memory).'],
  },
});
