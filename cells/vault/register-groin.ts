/** Cross vaults, registered for cells. */
import { defineCellFunction } from '../define.js';
import { groinVault } from './groin/groin-vault.js';
import { webMembrane } from './groin/web-membrane.js';
import { vaultBays } from './groin/vault-bays.js';
import { crossVault } from './groin/cross-vault.js';

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
      options: 'The bay: its spans, web shape, thickness, unit weight, fill and loads (options below).',
      'options.span_x': 'Clear span of the barrel spanning x: the bay\'s side along x (m). The middle surface is the intrados offset by t/2, so the corners stand at span/2 + t/2.',
      'options.span_y': 'Clear span of the barrel spanning y (m); square when omitted. On an oblong plan the narrower semicircular barrel is stilted to the same crown.',
      'options.shape': '"semicircular" (default) or "pointed" (the wider barrel equilateral, the narrower two-centred through the same crown). For segmental or stilted webs and the limit analysis by slicing, see cross_vault.',
      'options.thickness': 'Shell thickness (m); 0 (a thin shell) when omitted and g is given.',
      'options.unit_weight': 'Unit weight of the masonry (kN/m³); self-weight = thickness × unit_weight.',
      'options.g': 'Self-weight per unit surface area (kPa), instead of thickness × unit_weight.',
      'options.fill_level': 'Height of the pocket fill above the springing (m); with fill_unit_weight.',
      'options.fill_unit_weight': 'Unit weight of the fill (kN/m³).',
      'options.dead': 'Superimposed dead load per unit plan area (kPa).',
      'options.live': 'Live load per unit plan area (kPa), over the whole bay.',
    },
    fields: {
      shape: 'The shape used.',
      crown: 'Height of the middle surface at the crown above the springing (m).',
      area_web_x: 'Surface area of one web of the barrel spanning x (m²).', area_web_y: 'The same for y (m²).', area: 'Total surface of the four webs (m²).',
      W: 'Total vertical load of the bay (kN).',
      W_half: 'Load of the half vault x > 0 (kN).', x_half: 'Distance of its centroid from the cut x = 0 (m).',
      N_crown: 'Membrane hoop force at the crown of the x-barrel, −q·R·cos φ_crown (kN/m), compression negative.',
      thrust_cut: 'Horizontal force across the cut x = 0 (kN).', h_thrust: 'Depth below the crown at which the corner thrust acts (m); z_thrust = crown − h_thrust.',
      W_half_y: 'As W_half for the cut y = 0 (kN).', x_half_y: 'As x_half for y (m).', N_crown_y: 'As N_crown for the y-barrel (kN/m).',
      thrust_cut_y: 'As thrust_cut for y (kN).', h_thrust_y: 'As h_thrust for y (m).',
      V_corner: 'Vertical reaction at each corner, W/4 (kN).',
      H_corner_x: 'Horizontal corner thrust in x, thrust_cut/2 (kN).', H_corner_y: 'In y (kN).', H_corner: 'Their resultant (kN).',
      z_thrust: 'Height above the springing at which the x-thrust acts on the corner: crown − h_thrust (m).', z_thrust_y: 'The same for y (m).',
      ridge_load_x: 'Pointed webs: the downward line load their membrane state needs along the ridge, 2|N_crown|·sin φ_crown (kN/m); 0 when round.',
      ridge_load_y: 'The same for the y-webs (kN/m).',
    },
    method: 'Membrane theory of each web as a barrel segment (N_φ = p_r·R) and statics of the half vault cut through the crown: 2H = thrust across the cut, thrust·h = W_half·(e − x_half). Web integrals by Gauss–Legendre between the kinks of the load.',
    assumptions: ['Membrane state of the webs; the groins collect what the webs leave there.', 'All four webs loaded alike.', 'For a pointed web the crown membrane force is not an upper bound on the thrust: use cross_vault for the thrust range.'],
    sources: ['Heyman, Equilibrium of Shell Structures, Oxford 1977, cross-vault chapter (from memory).', 'Flügge, Stresses in Shells, ch. 3 (membrane theory of the cylinder).'],
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
      vault: 'A result of groin_vault(…).',
      x: 'Distance along the generators from the centre line of the bay (m), on the web (between the groin and the face arch).',
      phi: 'Inclination of the web\'s normal from the vertical (deg or rad), from the crown (φ_crown, 0 when round) to the springing (90°).',
      web: '"x" (default) for the webs of the barrel spanning x, "y" for the others.',
    },
    fields: {
      N_phi: 'Hoop force across the generators (kN/m), compression negative: −q·R·cos φ.',
      N_x: 'Force along the generators (kN/m), compression negative; zero at the face arch.',
      N_xphi: 'Membrane shear (kN/m); zero on the centre line of the bay.',
    },
    method: 'Membrane theory of the circular cylinder under a load uniform along the generators, with N_xφ = 0 on the centre line and N_x = 0 at the face arch.',
    sources: ['Flügge, Stresses in Shells, ch. 3.', 'Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, 1959, §110.'],
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
    params: { vault: 'A result of groin_vault(…): one bay; the row runs along x.', n: 'Number of equal bays in the row, a whole number ≥ 1.' },
    fields: {
      bays: 'Bays in the row.',
      n_intermediate: 'Piers between bays: 2·(n − 1).', n_end: 'Piers at the ends: 4.',
      V_intermediate: 'Vertical load on an intermediate pier from the two corners it carries (kN).',
      H_intermediate: 'Transverse (y) thrust on an intermediate pier, 2·H_corner_y (kN); the longitudinal thrusts of the neighbours cancel.',
      z_intermediate: 'Height of that thrust above the springing (m).',
      V_end: 'Vertical load on an end pier (kN).',
      H_end_x: 'Longitudinal thrust on an end pier (kN).', H_end_y: 'Transverse thrust on an end pier (kN).', H_end: 'Their resultant (kN).',
      z_end_x: 'Height of the longitudinal thrust above the springing (m).', z_end_y: 'Height of the transverse thrust (m).',
    },
    method: 'Statics of the free body: at a pier between bays the longitudinal thrusts are equal and opposite and cancel, the transverse thrusts and vertical loads add.',
    assumptions: ['Every bay loaded alike; an unloaded neighbour leaves part of the longitudinal thrust unbalanced.'],
    sources: ['Statics of the free body (common practice).'],
  },
});

export const cross_vault = defineCellFunction({
  name: 'cross_vault',
  doc: 'One bay of a cross vault of any bay (square or oblong; semicircular, segmental, pointed or stilted webs) by slicing: each web cut into arches analysed by limit analysis; corner thrust range, its height, vertical reaction and the pocket fill needed, with the membrane solution beside it for semicircular webs.',
  params: [{
    name: 'options',
    type: {
      object: {
        span_x: 'm', span_y: 'm', shape: 'text', rise: 'm', stilt: 'm', thickness: 'm', unit_weight: 'N/m^3',
        fill_level: 'm', fill_unit_weight: 'N/m^3', dead: 'Pa', live: 'Pa', solid_level: 'm', slices: 'count',
      },
    },
  }],
  required: ['span_x', 'thickness', 'unit_weight'],
  returns: {
    object: {
      shape: 'text', span_x: 'm', span_y: 'm', rise_x: 'm', rise_y: 'm', stilt_x: 'm', stilt_y: 'm', crown: 'm', slices: 'count',
      fill_needed: 'm', solid_level: 'm', safe: 'boolean', W: 'N', V_corner: 'N',
      H_x_min: 'N', H_x_max: 'N', H_y_min: 'N', H_y_max: 'N', z_x_min: 'm', z_x_max: 'm', z_y_min: 'm', z_y_max: 'm',
      a_x_min: 'm', a_x_max: 'm', a_y_min: 'm', a_y_max: 'm',
      H_x_membrane: 'N', H_y_membrane: 'N', z_x_membrane: 'm', z_y_membrane: 'm',
    },
  },
  fn: crossVault,
  reference: {
    params: {
      options: 'The bay: its spans, web shape, thickness, unit weight, fill and loads (options below).',
      'options.span_x': 'Clear span of the webs spanning x: the bay\'s side along x, between the faces of the supports (m).',
      'options.span_y': 'Clear span of the webs spanning y (m); the bay is square when omitted.',
      'options.shape': '"semicircular" (default), "segmental", "pointed" or "stilted". The wider web takes this shape; the narrower one is brought to the same crown height with its own curvature where its family allows (segmental: the same rise; pointed: two-centred through the same crown), else as a semicircle on a stilt.',
      'options.rise': 'Rise of the wider web\'s intrados arc above its springing (m): required for segmental (less than half its span); for pointed at least half its span, equilateral (span·√3/2) by default.',
      'options.stilt': 'For "stilted": height of the vertical stilt under both webs (m). The stilt belongs to the pier; slices spring on it at the least.',
      'options.thickness': 'Thickness of the webs (m), less than a quarter of the smaller span.',
      'options.unit_weight': 'Unit weight of the masonry (kN/m³).',
      'options.fill_level': 'Height of the loose pocket fill above the springing (m), loading the slices above their extrados; with fill_unit_weight.',
      'options.fill_unit_weight': 'Unit weight of that fill (kN/m³).',
      'options.dead': 'Superimposed dead load per unit plan area (kPa).',
      'options.live': 'Live load per unit plan area (kPa), taken over the whole bay.',
      'options.solid_level': 'Height above the springing to which the pockets are built solid (coursed masonry, the tas-de-charge) (m); slices spring on it where it is above the groin. Default: fill_needed. It must stay below the level where a slice springing on it is two thicknesses wide (higher, every slice is a sliver that carries no thrust).',
      'options.slices': 'Slices per web, 2 to 60 (default 10); each slice is a ring of 24 voussoirs.',
    },
    fields: {
      shape: 'The shape given.',
      span_x: 'Clear span of the webs spanning x (m).', span_y: 'Clear span of the webs spanning y (m).',
      rise_x: 'Rise of the x-web\'s intrados arc above its own springing (m).', rise_y: 'The same for the y-web (m).',
      stilt_x: 'Stilt under the x-web\'s arc (m).', stilt_y: 'Stilt under the y-web\'s arc (m).',
      crown: 'Height of the middle surface at the crown above the springing of the bay (m).',
      slices: 'Slices per web.',
      fill_needed: 'Least height of solid pocket above the springing for which the deepest slice of each web (the one by the face arch) holds a line of thrust (m); 0 when it holds springing from the corner. Shallower slices are taken to be no worse; `safe` reports whether all hold.',
      solid_level: 'The height of solid pocket used (m).',
      safe: 'true when every slice holds a line of thrust within its thickness.',
      W: 'Load the slices carry down the groins: webs above the solid pocket, fill and plan loads (kN). The solid pocket and the webs below it belong to the pier. Not available when a slice holds no line of thrust.',
      V_corner: 'Vertical reaction at each corner, W/4 (kN); not available when a slice holds no line of thrust.',
      H_x_min: 'Least corner thrust in x (kN per corner): the sum of the least thrusts of the slices of one x-web. Not available when a slice holds no line.',
      H_x_max: 'Greatest corner thrust in x (kN); ∞ when a slice\'s thrust is unbounded (a shallow slice near the crown fits a straight line).',
      H_y_min: 'Least corner thrust in y (kN).', H_y_max: 'Greatest corner thrust in y (kN); ∞ when unbounded.',
      z_x_min: 'Height above the springing at which the corner\'s least thrust in x acts (m): ΣH_k·z_k/ΣH_k over the slices of one x-web, each slice\'s thrust H_k acting on the groin at the height z_k where its least-thrust line crosses its springing joint. A weighted mean of those heights, so it lies within the vault, below the crown, and at or above the solid pocket. With a_x_min it fixes the line of the corner\'s resultant (see method).',
      z_x_max: 'The same in the greatest-thrust state (m); not available when that thrust is unbounded.',
      z_y_min: 'As z_x_min for the thrust in y (m).', z_y_max: 'As z_x_max for the thrust in y (m).',
      a_x_min: 'Arm of the corner\'s vertical reaction V_corner in the least-thrust state (m): how far inside the vertical plane of the corner (through the middle surface\'s springing of the x-web, at e = half the x-span plus half the thickness) its resultant acts, ΣV_k·(e − x_k)/ΣV_k over every slice reaction on the quarter\'s groin.',
      a_x_max: 'The same in the greatest-thrust state (m); not available when that thrust is unbounded.',
      a_y_min: 'As a_x_min, measured in y from the plane of the corner across the y-span (m).', a_y_max: 'As a_x_max for y (m).',
      H_x_membrane: 'Membrane corner thrust in x of groin_vault for the same bay and loads (kN): semicircular webs with solid_level 0 only, else not available.',
      H_y_membrane: 'The same in y (kN).',
      z_x_membrane: 'Height of the membrane thrust in x (groin_vault z_thrust) (m). groin_vault takes the whole corner reaction in the corner\'s vertical plane (its arm is 0), so compare it with z_x_min − a_x_min·V_corner/H_x_min, not with z_x_min.', z_y_membrane: 'The same in y (m).',
    },
    method: 'Each web is cut by vertical planes across its generators into slices (midpoint slicing). A slice springs where the middle surfaces of the two webs meet (the groin), or on the solid pocket where that is higher, and is a ring of the arch kernel (arch_limit: least and greatest thrust; thrust_line: where each extreme line crosses the springing joint) under its own weight, the loose fill above it and the plan loads. The half vault cut through the crowns of one barrel\'s slices stands on two corners, so each corner\'s thrust is the sum of one web\'s slice thrusts. Each slice hands the groin its thrust H_k at the height z_k where its line crosses the springing joint, and its load V_k at x_k; the corner\'s resultant is reported as the horizontal thrust H at z = ΣH_k·z_k/ΣH_k with the vertical reaction V at the arm a = ΣV_k·(e − x_k)/ΣV_k inside the corner\'s plane. Its line crosses the corner\'s vertical plane at z − a·V/H (moments about the corner: H·z_T = ΣH_k·z_k − ΣV_k·(e − x_k)); in the least-thrust state V/H is large (2.5 to 7.5 in the bays of the tests) and in most bays that crossing lies below the springing, by up to about three quarters of the rise for steep pointed webs: the resultant reaches the springing level inside the corner plane (in most of those bays inside the clear span), and the groin and the pocket and pier under it must carry it there. Slivers narrower than two thicknesses at the crown hand their weight straight to the groin.',
    assumptions: ['Heyman\'s assumptions for every slice: no tension, no sliding, unlimited compression.', 'Slices act independently (no shear between them); the groins carry the slices\' reactions to the corners, with no thrust between the four groins at the boss. Whether a groin can hold the line of its own resultant is not checked.', 'All bays and both halves loaded alike (symmetric loads).'],
    sources: [
      'Heyman, The Stone Skeleton, Cambridge 1995, on the cross vault and its slicing (from memory).',
      'Heyman, Equilibrium of Shell Structures, Oxford 1977 (from memory).',
      'Ungewitter & Mohrmann, Lehrbuch der gotischen Konstruktionen, 1890 (slicing of webs; from memory).',
    ],
  },
});
