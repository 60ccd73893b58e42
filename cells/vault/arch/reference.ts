/**
 * The kernel reference of the arch functions: every option and field, the
 * conventions and the sources, kept beside the registrations (register-arch.ts).
 */
import type { CellFunctionReference } from '../../define.js';

const FRAME = 'Positions a document reads or gives (P_at, live_from, live_to, axles.at, hinge x, x_worst) are measured horizontally from the left springing of the intrados; heights z above the springing line of the intrados.';
const ANGLE = 'Angles of joints and hinges are those of the ring normal from the vertical: 0 at the crown, negative on the left half, positive on the right, ± half_angle at the springings.';

/** The loads record shared by arch_limit, arch_scan, thrust_line and the arch figures. */
export const LOADS_REFERENCE: Record<string, string> = {
  'loads.fill_unit_weight': 'Unit weight of the fill over the ring (force per volume, ≥ 0). Needs fill_level. Default: no fill.',
  'loads.fill_level': 'Level of the top of the fill (the road surface), above the springing of the intrados (m). The vertical column of fill between the extrados and this level loads each voussoir.',
  'loads.dead': 'Permanent load per unit plan area on the surface (e.g. surfacing), over the whole extrados. Default 0.',
  'loads.live': 'Variable load per unit plan area, multiplied by λ, over live_from…live_to (default the whole ring).',
  'loads.live_from': 'Start of the live load, from the left springing of the intrados (m).',
  'loads.live_to': 'End of the live load, from the left springing of the intrados (m).',
  'loads.P': 'A point load on the road surface (force on the whole strip), multiplied by λ. Needs P_at.',
  'loads.P_at': 'Position of P from the left springing of the intrados (m); must lie over the ring.',
  'loads.axles': 'More point loads multiplied by λ, as a list of {W, at} (force, position from the left springing); axles off the ring go into the abutments and are left out.',
  'loads.axles.W': 'Axle load (force on the whole strip).',
  'loads.axles.at': 'Axle position from the left springing of the intrados (m).',
  'loads.spread': 'Horizontal spread of point loads and axles per unit depth of fill (0.5 = 2 vertical : 1 horizontal, common practice; standards differ). Each becomes a uniform plan load over 2·spread·d, d the fill over the extrados at the load; the part beyond the extrados is left out. Default 0: no spread (conservative), stated in load_spread.',
  'loads.fill_pressure': 'Coefficient k of a horizontal fill pressure k·γ_fill·(fill_level − y) on the extrados, pushing towards the crown on both halves (at rest, or a fraction of passive, as the engineer decides). Default 0: the fill only loads, it gives no resistance.',
};

const HINGE_FIELDS = (what: string): Record<string, string> => ({
  [what]: `One hinge per region where the line of thrust touches a face, at its deepest point, left to right. A mechanism has four hinges (or three and a sliding joint); a symmetric state may show five (the notes say so).`,
  [`${what}.angle`]: `Angle of the ring normal at the hinge, from the vertical: 0 at the crown, negative on the left half, positive on the right (shown in degrees).`,
  [`${what}.face`]: '"intrados" or "extrados": the face the line touches (the hinge opens on the other face).',
  [`${what}.x`]: 'Horizontal position of the hinge on its face, from the left springing of the intrados (m).',
  [`${what}.z`]: 'Height of the hinge above the springing of the intrados (m).',
  [`${what}.N`]: 'Normal force at the joint (compression positive), whole strip.',
  [`${what}.T`]: 'Force along the joint, whole strip: the force the part of the ring left of the joint exerts on the part right of it, resolved along the joint, positive towards the extrados. Mirror-image joints of a symmetric state therefore show equal and opposite T; the force itself has horizontal component N·cos(angle) + T·sin(angle) = H.',
});

export const ARCH_RING_REFERENCE: CellFunctionReference = {
  params: {
    options: 'A record of the ring: shape and size, thickness, unit weight, and the analysis options below.',
    'options.shape': '"circular", "pointed", "elliptical", "parabolic", "catenary", "cycloid", or a number n for the family R = R0·cos^n φ.',
    'options.span': 'Clear span of the intrados (m). With rise; not with radius.',
    'options.rise': 'Rise of the intrados from the springing line to the crown (m); optional for "pointed" (equilateral).',
    'options.radius': 'Centreline radius of a circular ring (m), with half_angle, instead of span and rise.',
    'options.half_angle': 'Angle from the crown to the springing joint (rad; 90° for a semicircle), with radius.',
    'options.thickness': 'Ring thickness, constant, measured normal to the centreline (m).',
    'options.unit_weight': 'Unit weight of the masonry (force per volume).',
    'options.depth': 'Width of the strip (barrel width b) the analysis carries, default 1 m; loads are on the whole strip, stresses use b.',
    'options.voussoirs': 'Number of voussoirs of equal centreline length for the analysis, a whole number from 20 to 10000, default 200 (λ within 0.3 % of the converged value, tested); fewer than 20 joints miss where the hinges form (21 is tested within 1 % of 3200). More joints are added under point loads.',
    'options.f_c': 'Design compressive strength (stress). Given, the resultant at every joint must leave room for a rectangular stress block of depth N/(f_c·b) inside the face (common practice). Default: uncrushable blocks.',
    'options.friction': 'Coefficient of friction μ at the joints. Given, |T| ≤ μ·N at every joint in every programme. Default: no sliding.',
    'options.gsf': 'Definition of the geometric factor of safety: "loads_as_built" (default: Heyman, every load as built, the bounds shrink about the centreline) or "ring_scaled" (the ring shrinks with its own weight, fill replacing the masonry removed).',
  },
  fields: {
    shape: 'The family, or "power n = …".', span: 'Clear span of the intrados (m).', rise: 'Rise of the intrados (m).',
    radius: 'Centreline radius (circular rings given by radius only).', half_angle: 'Angle from the crown to the springing joint.',
    thickness: 'Ring thickness (m).', unit_weight: 'Unit weight of the masonry.', depth: 'Width of the strip (m).',
    voussoirs: 'Voussoirs of the analysis.', weight: 'Self-weight of the ring strip.',
    f_c: 'Design compressive strength; ∞ when none was given.', friction: 'Friction coefficient; ∞ when none was given (no sliding).',
    gsf_definition: 'The definition of gsf arch_limit will use: "loads_as_built" or "ring_scaled".',
  },
  method: 'Builds the centreline as the parallel curve at t/2 outside the intrados and cuts it into voussoirs of equal centreline length, each joint normal to the centreline; voussoir areas and true centroids by Gauss–Legendre over the parallel-curve map. The keystone of a pointed ring is bounded by the true arcs.',
  assumptions: ['Constant thickness; symmetric ring; joints normal to the centreline.', FRAME, ANGLE],
  sources: ['Heyman, The Stone Skeleton, 1995, ch. 2–3 (from memory).', 'do Carmo, Differential Geometry of Curves and Surfaces, §1-5 (parallel curves).'],
};

export const ARCH_LIMIT_REFERENCE: CellFunctionReference = {
  params: {
    ring: 'The result of arch_ring (with its f_c, friction and gsf options).',
    loads: 'Loads on the strip, all optional.',
    ...LOADS_REFERENCE,
  },
  fields: {
    H_min: 'Least horizontal thrust of any admissible line of thrust (whole strip). Not available when no line fits.',
    H_max: 'Greatest horizontal thrust; ∞ when a straight line fits (unbounded). Not available when no line fits.',
    V_left: 'Vertical reaction at the left springing in the least-thrust state (upward positive).',
    V_right: 'Vertical reaction at the right springing in the least-thrust state.',
    t_min: 'Least thickness about the same centreline holding a line of thrust, by the ring\'s gsf definition. Not available when no thickness up to the span fits.',
    gsf: 'Geometric factor of safety t / t_min (0 when no thickness fits). When friction alone makes the ring inadmissible (a line fits without the friction limit), t_min and gsf are the geometric ones without it, and the notes and sliding name the joint where |T|/N exceeds μ.',
    gsf_definition: 'Which definition gsf used, in words (Heyman\'s loads as built, or ring scaled).',
    ...HINGE_FIELDS('hinges'),
    load_factor: 'Collapse load factor λ on the live load, P and axles (the largest λ with an admissible line; by the uniqueness theorem the collapse factor). ∞ when the live load never causes collapse; not available without live loads or when the permanent loads alone cannot be carried.',
    ...HINGE_FIELDS('mechanism'),
    governs: 'What limits λ: "hinges", "crushing" (f_c given and the rigid ring never collapses, or the stress blocks lower λ by more than 5 %; the notes give both λ) or "sliding" (a joint at |T| = μN at collapse).',
    sigma_max: 'With f_c: the least peak compressive stress with which any line of thrust carries the loads at λ = 1 (stress blocks centred on the resultant, found to 1e-4). Not available without f_c or when no line fits.',
    sigma_max_at: 'Where that peak stress occurs: the resultant\'s x at that joint, from the left springing of the intrados (m).',
    sliding: 'The largest |T|/N over the joints in each reported state ("least thrust", "greatest thrust", "collapse"), with the joint\'s angle and position (x, z). With friction given it is at most μ, except in "least thrust without friction", reported when friction alone makes the ring inadmissible: there it exceeds μ at the joint named.',
    'sliding.state': 'The state.', 'sliding.ratio': '|T|/N at the worst joint.', 'sliding.angle': 'Angle of that joint.',
    'sliding.x': 'Mid-point of that joint, from the left springing (m).', 'sliding.z': 'Its height above the springing (m).',
    load_spread: 'The spread of point loads through the fill used, in words (default: none).',
    safe: 'True when a line of thrust fits within the ring under the loads as given (λ = 1).',
    notes: 'Why fields are unbounded or not available; five-hinge states; the effect of crushing or sliding.',
  },
  method: 'Lower-bound (safe theorem) limit analysis: the actions at every joint are linear in the springing reaction (H, V), its moment and λ; "the resultant lies within the joint" is two linear rows per joint (|M| ≤ N·t/2), so H_min, H_max and λ are small linear programmes solved exactly (Seidel\'s algorithm). Under every point load a joint is added where the extrados meets it, and a vertical cut checks the line of thrust where it kinks. Finite strength adds tangents of |M| ≤ N·t/2 − N²/(2·f_c·b) until met; friction adds |T| ≤ μN. t_min is the root of the fitting margin.',
  assumptions: [
    'No tensile strength; compression positive; e = −M/N is the resultant\'s offset from the joint mid-point towards the extrados.',
    'Masonry uncrushable and no sliding unless f_c / friction are given in arch_ring.',
    'Fill loads the ring vertically (and horizontally with fill_pressure) and gives no passive resistance.',
    FRAME, ANGLE,
  ],
  sources: [
    'Heyman, "The stone skeleton", Int. J. Solids Struct. 2, 1966 (safe theorem).',
    'Heyman, "The safety of masonry arches", Int. J. Mech. Sci. 11, 1969 (geometric factor of safety, loads as built — from memory).',
    'Gilbert, Casapulla & Ahmed, Computers & Structures 84, 2006 (friction as linear constraints — from memory).',
    'Kelley, "The cutting-plane method", J. SIAM 8, 1960 (tangents of the stress-block bound).',
  ],
};

export const THRUST_LINE_REFERENCE: CellFunctionReference = {
  params: { ring: 'The result of arch_ring.', loads: 'Symmetric loads (as for arch_limit).', ...LOADS_REFERENCE, H: 'Horizontal thrust of the line (force, whole strip), from H_min to H_max of arch_limit; outside that range the call is refused.' },
  fields: {
    result: 'The line of thrust: a list of points {x, y}, one per joint (and vertical cut), left to right.',
    x: 'Horizontal position of the centre of pressure from the crown axis (m; negative on the left). The result is a list of points {x, y}, one per joint (and vertical cut), left to right.',
    y: 'Height above the springing of the intrados (m).',
  },
  method: 'Symmetry fixes V; of the lines with this H the best centred one (least largest |e|/half-thickness) is returned, a two-variable linear programme. Within [H_min, H_max] it lies in the ring; an H outside that range is refused with the range, since no line of thrust with it lies in the ring.',
  assumptions: ['Loads symmetric about the crown.', 'x here is measured from the crown axis, unlike the positions of arch_limit.'],
  sources: ['Heyman, The Stone Skeleton, 1995, ch. 2 (from memory).'],
};

export const ARCH_SCAN_REFERENCE: CellFunctionReference = {
  params: {
    ring: 'The result of arch_ring (its f_c and friction hold at every position).',
    loads: 'The loads that stay put (fill, dead, live, spread, fill_pressure), as for arch_limit.',
    ...LOADS_REFERENCE,
    vehicle: 'The vehicle and the scan.',
    'vehicle.axles': 'Axle loads, lead axle first (forces on the whole strip), all multiplied by λ.',
    'vehicle.spacing': 'Distances between consecutive axles (m), one fewer than the axles.',
    'vehicle.from': 'First position of the lead axle from the left springing of the intrados (m), default 0.',
    'vehicle.to': 'Last position of the lead axle (m), default span + vehicle length (the last axle leaves the span).',
    'vehicle.steps': 'Even positions of the first pass, a whole number from 2 to 10000, default 100.',
  },
  fields: {
    lambda_min: 'Least collapse load factor over all positions; ∞ when no position causes collapse.',
    x_worst: 'Position of the lead axle there, from the left springing of the intrados (m; the origin of P_at).',
    curve: 'λ at every position evaluated, {x, lambda}, sorted by x (∞ where nothing collapses).',
    'curve.x': 'Lead axle position (m).', 'curve.lambda': 'λ there.',
    ...HINGE_FIELDS('mechanism'),
    governs: 'What limits λ at the worst position: "hinges", "crushing" or "sliding".',
    load_spread: 'The spread of the axles through the fill used, in words.',
    notes: 'A second local minimum, if any; why a field is not available.',
  },
  method: 'The vehicle travels left to right; at each position the collapse programme of arch_limit is solved on the same ring (only the loads change). A first pass at even steps, then golden-section search around the two lowest local minima until the bracket is 0.001·span.',
  assumptions: ['λ is unimodal within one step of the first pass around a minimum.', 'Axles off the ring are carried by the abutments.', FRAME, ANGLE],
  sources: ['Kiefer, "Sequential minimax search for a maximum", Proc. AMS 4, 1953 (golden section).'],
};
