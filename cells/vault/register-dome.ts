/** Domes, registered for cells. */
import { defineCellFunction } from '../define.js';
import { dome as domeKernel, domeAt } from './dome/dome.js';
import { domeLimit, DOME_RINGS } from './dome/dome-limit.js';

const SOURCES_MEMBRANE = [
  'Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, 2nd ed., McGraw-Hill 1959, §§128–129: membrane theory of shells of revolution; the spherical dome under self-weight and under a load uniform on plan.',
  'Flügge, Stresses in Shells, Springer 1960, ch. 2 (shells of revolution, membrane forces) (from memory).',
];

export const dome = defineCellFunction({
  name: 'dome',
  doc: 'Membrane analysis of a dome (spherical or pointed, with or without an oculus and a lantern; self-weight and load uniform on plan): forces along the meridian, where the hoop turns to tension, the base thrust and the base ring tension.',
  params: [{
    name: 'options',
    type: {
      object: {
        shape: 'text', radius: 'm', half_angle: 'rad', span: 'm', rise: 'm', thickness: 'm', unit_weight: 'N/m^3', g: 'Pa',
        p: 'Pa', oculus_angle: 'rad', lantern: 'N',
      },
    },
  }],
  returns: {
    object: {
      shape: 'text', radius: 'm', half_angle: 'rad', phi_top: 'rad', base_diameter: 'm', height: 'm', W: 'N',
      phi_hoop_tension: 'rad', N_theta_max: 'N/m', phi_N_theta_max: 'rad', N_phi_min: 'N/m', N_phi_base: 'N/m',
      H_base: 'N/m', V_base: 'N/m', ring_tension: 'N',
    },
  },
  fn: domeKernel,
  reference: {
    params: {
      options: 'The dome: its shape, size, thickness, unit weight, oculus, lantern and loads (options below).',
      'options.shape': '"spherical" (default) or "pointed": each meridian a two-centred arc with its centre on the base plane, across the axis (like a pointed arch).',
      'options.radius': 'Meridian radius of the middle surface (m), with half_angle; spherical only.',
      'options.half_angle': 'Angle from the axis (the crown) to the base joint, at the meridian\'s centre (deg or rad): 90° for a hemisphere, less for a cap.',
      'options.span': 'Clear span of the intrados at the base, the inner diameter (m), with rise. Spherical: rise ≤ span/2 (a cap or hemisphere). Pointed: rise ≥ span/2.',
      'options.rise': 'Rise of the intrados from the base to the crown or apex (m). The middle surface is the intrados offset by t/2 about the same centre.',
      'options.thickness': 'Shell thickness (m).',
      'options.unit_weight': 'Unit weight of the masonry (kN/m³); self-weight per unit surface = thickness × unit_weight.',
      'options.g': 'Self-weight per unit surface area (kPa), instead of thickness × unit_weight.',
      'options.p': 'Load uniform on plan (kPa), e.g. snow or roofing carried on plan; default 0.',
      'options.oculus_angle': 'Angle from the axis to the edge of the oculus (deg or rad); 0 (closed) by default. For a pointed dome it must open below the apex.',
      'options.lantern': 'Total weight of a lantern on the oculus ring (kN), spread evenly round it and carried down the meridians; needs an oculus.',
    },
    fields: {
      shape: '"spherical" or "pointed".',
      radius: 'Meridian radius of the middle surface (m).',
      half_angle: 'Angle from the axis to the base joint (rad).',
      phi_top: 'Angle of the top edge: 0 at a closed crown, the apex angle asin(c/a) of a pointed dome, or the oculus angle (rad).',
      base_diameter: 'Diameter of the middle surface at the base (m).',
      height: 'Height of the middle surface from the base to the crown or apex (m).',
      W: 'Total vertical load on the base: shell, plan load and lantern (kN).',
      phi_hoop_tension: 'Angle from the crown at which the hoop force N_theta turns to tension in the zone that reaches the base (rad; 51.83° for a hemisphere under self-weight, 45° under a load uniform on plan), where an unreinforced dome cracks along its meridians; when the base is in hoop compression, the start of the first tension zone (a heavy lantern can put the top course in tension: see dome_at at the oculus); not available when the hoop stays in compression everywhere.',
      N_theta_max: 'Largest hoop tension (kN/m, positive); 0 when there is none.',
      phi_N_theta_max: 'Where it acts (rad); not available when there is no hoop tension.',
      N_phi_min: 'Largest meridional compression (kN/m, negative).',
      N_phi_base: 'Meridional force at the base (kN/m), compression negative.',
      H_base: 'Horizontal thrust per metre of the base circle, outwards: −N_phi_base·cos(half_angle) (kN/m); 0 for a hemisphere, whose meridians arrive vertical.',
      V_base: 'Vertical load per metre of the base circle: −N_phi_base·sin(half_angle) (kN/m).',
      ring_tension: 'Tension in a ring at the base taking all of H_base: H_base × base radius (kN).',
    },
    method: 'Membrane theory of a shell of revolution under axisymmetric vertical load: N_φ from the vertical equilibrium of the cap above φ, N_θ from equilibrium normal to the surface, N_φ/r1 + N_θ/r2 = −Z. Angles φ from the axis (the crown), measured at the centre of the meridian; compression negative.',
    assumptions: ['Membrane state: no bending; the base free to move radially only as the ring allows.', 'Loads axisymmetric and vertical; the lantern\'s weight enters along the meridians at the oculus.', 'Hoop tension is a membrane demand that unreinforced masonry cannot meet: below phi_hoop_tension it cracks along the meridians (see dome_limit).'],
    sources: SOURCES_MEMBRANE,
  },
});

export const dome_at = defineCellFunction({
  name: 'dome_at',
  doc: 'Membrane forces at a point of a dome\'s meridian: {N_phi, N_theta}, phi from the crown, compression negative.',
  params: [{ name: 'dome', type: { ref: 'dome' } }, { name: 'phi', type: 'rad' }],
  returns: { object: { N_phi: 'N/m', N_theta: 'N/m' } },
  fn: domeAt,
  reference: {
    params: {
      dome: 'A result of dome(…).',
      phi: 'Angle from the axis (the crown) to the point, at the meridian\'s centre (deg or rad), between phi_top and half_angle.',
    },
    fields: {
      N_phi: 'Meridional membrane force (kN/m), compression negative.',
      N_theta: 'Hoop membrane force (kN/m), compression negative, tension positive.',
    },
    method: 'As dome: N_φ = −W(φ)/(2π·r0·sin φ), N_θ = r2·(−Z − N_φ/r1).',
    sources: SOURCES_MEMBRANE,
  },
});

export const dome_limit = defineCellFunction({
  name: 'dome_limit',
  doc: 'Limit analysis of a dome (spherical or pointed) cut into lunes, hoop compression allowed and no hoop tension: least thickness, geometric factor of safety and the range of base thrust.',
  params: [{ name: 'dome', type: { ref: 'dome' } }],
  returns: {
    object: {
      t_min: 'm', gsf: '1', H_min: 'N/m', H_max: 'N/m', hoop_min_state: 'N', thrust_min: { list: { object: { r: 'm', z: 'm' } } }, safe: 'boolean',
    },
  },
  fn: domeLimit,
  reference: {
    params: { dome: `A dome from dome(…) (spherical or pointed) with a thickness and its self-weight (unit_weight, or g above zero: the weight scales with the thickness); cut into ${DOME_RINGS} courses of equal angle from the top edge to the base.` },
    fields: {
      t_min: 'Least thickness (m) for which a thrust surface fits, the thickness scaled about the fixed middle surface; 0 when one fits however thin the shell (no hoop tension in the membrane state); not available when no thickness up to 0.9 of the radius fits.',
      gsf: 'Geometric factor of safety thickness / t_min; ∞ when t_min = 0; 0 when no thickness up to 0.9 of the radius fits.',
      H_min: 'Least horizontal thrust per metre of the base circle (kN/m); not available when the dome is not safe at its thickness.',
      H_max: 'Greatest horizontal thrust per metre of the base circle (kN/m); ∞ when unbounded (the lowest course can take any hoop compression, as on a hemisphere); not available when not safe.',
      hoop_min_state: 'Total hoop compression in the least-thrust state (kN per radian of the circle).',
      thrust_min: 'The least-thrust line of a lune: where it cuts each joint, {r from the axis, z above the base joint\'s centre} (m).',
      'thrust_min.r': 'Distance of the point from the dome\'s axis (m).',
      'thrust_min.z': 'Height of the point above the centre of the base joint (m).',
      safe: 'true when a thrust surface fits within the thickness.',
    },
    method: 'The dome cracks along its meridians into lunes (no hoop tension). Each lune is an arch whose width grows with the radius; each course may push it outwards by a hoop compression acting anywhere within the course\'s section. A state is admissible when the resultant crosses every joint (radial, conical) within the thickness; the admissible states form a polyhedron, so the least and greatest base thrust are linear programmes (two-phase simplex) and t_min is found by bisection on the thickness. Crown thrust at a closed crown anywhere within the crown\'s thickness; the top course of an oculus acts as its compression ring.',
    assumptions: ['Heyman\'s assumptions: no tensile strength, no sliding, unlimited compressive strength.', 'Loads axisymmetric; a pointed dome\'s apex is the radial joint through the apex of its middle surface.', 'Hoop compression unlimited in magnitude; hoop tension zero.'],
    sources: [
      'Heyman, The Stone Skeleton, Cambridge 1995, ch. 3 (the masonry dome): the hemisphere needs t/R ≈ 0.042 (from memory).',
      'Heyman, Equilibrium of Shell Structures, Oxford 1977 (from memory).',
      'Dantzig, Linear Programming and Extensions, 1963; Chvátal, Linear Programming, 1983 (simplex method).',
    ],
  },
});
