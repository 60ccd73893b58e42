/** Figure functions, registered for ```figure cells: each returns an SVG string recorded as a figure. */
import { defineCellFunction, type FieldType } from '../define.js';
import type { ArchLimit, ArchLoads } from '../vault/arch/types.js';

/** A result handed over with the arguments of the call that made it ({refWithArgs}). */
interface WithArgs<T> {
  value: T;
  args: unknown[];
}
import { section as sectionFigure } from './section.js';
import { forcePolygon } from './force-polygon.js';
import { membranePlot } from './membrane-plot.js';
import { vaultPlan } from './vault-plan.js';
import { supportFigure } from './support-figure.js';
import { LOADS_REFERENCE } from '../vault/arch/reference.js';
import { buttress } from '../supports/register.js';
import { scanPlot } from './scan-plot.js';
import { ARCH_LOADS } from '../vault/register-arch.js';
import { domeFigure } from './dome-figure.js';
import { crossVaultFigure } from './cross-vault-figure.js';
import { flyerFigure } from './flyer-figure.js';
import type { Dome } from '../vault/dome/dome.js';
import type { DomeLimit } from '../vault/dome/dome-limit.js';

/** buttress's options, as support_figure takes them too. */
const BUTTRESS_OPTIONS: Record<string, string> = {
  options: 'The support and the forces the vault puts on it, as given to buttress.',
  ...(buttress.reference?.params ?? {}),
};

const SVG = 'An SVG drawing to scale, recorded as the figure of a ```figure cell and printed on the sheet.';
const HEYMAN_BOOK = 'J. Heyman, The Stone Skeleton, Cambridge University Press, 1995.';

/** section and force_polygon: the ring, its arch_limit result, and the loads to draw. */
const RING_FIGURE_REFERENCE = {
  ring: 'The ring, from arch_ring.',
  limit: 'Its limit analysis, from arch_limit on the same ring; drawn with the loads it was computed for.',
  ...LOADS_REFERENCE,
  loads: 'Other loads to draw instead of those arch_limit was given (rarely needed); the same record as arch_limit\'s loads.',
};


/** section and force_polygon: the ring, its arch_limit result, and optionally other loads to draw. */
const RING_FIGURE_PARAMS = [{ name: 'ring', type: { ref: 'arch_ring' } }, { name: 'limit', type: { refWithArgs: 'arch_limit' } }, { name: 'loads', type: ARCH_LOADS, optional: true }];

/** The loads arch_limit was called with (its second argument), or none. */
function loadsOf(limit: WithArgs<ArchLimit>): ArchLoads {
  return (limit.args[1] as ArchLoads | undefined) ?? {};
}

export const section = defineCellFunction({
  name: 'section',
  doc: 'Figure: the ring to scale with intrados, extrados, the lines of least and greatest thrust and the hinges: section(r, a), drawn with the loads a was computed for (or section(r, a, loads)).',
  params: RING_FIGURE_PARAMS,
  returns: 'text',
  fn: (ring, limit: WithArgs<ArchLimit>, loads?: ArchLoads) => sectionFigure(ring, limit.value, loads ?? loadsOf(limit)),
  reference: {
    params: RING_FIGURE_REFERENCE,
    fields: { result: SVG },
    method: 'Draws the ring to scale with its intrados and extrados, the lines of least and greatest thrust of arch_limit and the hinges where the line of least thrust touches a face: '
      + 'the picture behind the safe theorem. The hinges drawn are checked against the line drawn, so ring, result and loads belong together.',
    sources: [HEYMAN_BOOK + ' (ch. 2–3, lines of thrust).'],
  },
});

export const force_polygon = defineCellFunction({
  name: 'force_polygon',
  doc: 'Figure: the force polygon of the line of least thrust — load line, pole at H, rays and springing reactions: force_polygon(r, a), for the loads a was computed for.',
  params: RING_FIGURE_PARAMS,
  returns: 'text',
  fn: (ring, limit: WithArgs<ArchLimit>, loads?: ArchLoads) => forcePolygon(ring, limit.value, loads ?? loadsOf(limit)),
  reference: {
    params: RING_FIGURE_REFERENCE,
    fields: { result: SVG },
    method: 'Graphic statics of the line of least thrust: the loads on the ring, left to right, make the vertical load line; the pole stands H_min to its left, '
      + 'level with the point that splits the load line into V_left and V_right; each ray is the thrust between two parts of the ring, the first and last the springing reactions.',
    sources: [HEYMAN_BOOK + ' (ch. 2).', 'Funicular and force polygons: any text on graphic statics (common practice).'],
  },
});

export const membrane_plot = defineCellFunction({
  name: 'membrane_plot',
  doc: 'Figure: membrane forces N_φ, N_x, N_xφ of a barrel vault along the profile and along the generatrix: membrane_plot(m) with m from barrel_membrane.',
  params: [{ name: 'm', type: { ref: 'barrel_membrane' } }],
  returns: 'text',
  fn: membranePlot,
  reference: {
    params: { m: 'A barrel vault solved by barrel_membrane.' },
    fields: { result: SVG },
    method: 'Plots N_φ, N_x and N_xφ of the membrane state along the profile and along the generatrix; compression negative, as barrel_membrane gives them.',
    sources: ['W. Flügge, Stresses in Shells, Springer, ch. 3 (membrane theory of cylindrical shells).'],
  },
});

export const vault_plan = defineCellFunction({
  name: 'vault_plan',
  doc: 'Figure: a cross vault in plan (webs, groins, corner thrusts) and in elevation (thrust at its height, corner load): vault_plan(v) with v from groin_vault.',
  params: [{ name: 'vault', type: { ref: 'groin_vault' } }],
  returns: 'text',
  fn: vaultPlan,
  reference: {
    params: { vault: 'A result of groin_vault(…).' },
    fields: { result: SVG },
    method: 'Plan: the bay with its clear spans dimensioned, the groins, generator lines and the corner thrusts with their resultant. Elevations across the x-span and the y-span: each barrel\'s shell (a stilt where it has one), the corner thrust at its height z and the corner load.',
    sources: ['Heyman, Equilibrium of Shell Structures, Oxford 1977, cross-vault chapter (from memory).'],
  },
});

/** The options record of buttress, so the figure can rebuild the support's geometry. */
const SUPPORT_OPTIONS: FieldType = {
  object: {
    height: 'm', width: 'm', depth: 'm', unit_weight: 'N/m^3', T: 'N', z_T: 'm', V: 'N', x_V: 'm',
    steps: { list: { object: { height: 'm', width: 'm' } } }, friction: '1', bearing: 'Pa',
  },
};

export const support_figure = defineCellFunction({
  name: 'support_figure',
  doc: 'Figure: a wall or buttress in elevation with the thrust, the path of the resultant and the middle third: support_figure(b) with b from buttress.',
  params: [{ name: 'support', type: { refWithArgs: 'buttress' } }, { name: 'options', type: SUPPORT_OPTIONS, optional: true }],
  returns: 'text',
  fn: (support: WithArgs<Parameters<typeof supportFigure>[0]>, options?: Parameters<typeof supportFigure>[1]) =>
    supportFigure(support.value, options ?? (support.args[0] as Parameters<typeof supportFigure>[1])),
  reference: {
    params: {
      support: 'A support checked by buttress; drawn with the options it was given.',
      ...BUTTRESS_OPTIONS,
      options: 'Other options to draw the geometry from (rarely needed; by default those given to buttress). ' + BUTTRESS_OPTIONS.options,
    },
    fields: { result: SVG },
    method: 'Draws the support in elevation with the thrust, the path of the resultant through every level and the middle third of each section.',
    sources: [HEYMAN_BOOK + ' (buttresses).'],
  },
});

export const scan_plot = defineCellFunction({
  name: 'scan_plot',
  doc: 'Figure: the collapse load factor of a vehicle against the position of its lead axle, the worst position marked: scan_plot(s) with s from arch_scan.',
  params: [{ name: 'scan', type: { ref: 'arch_scan' } }],
  returns: 'text',
  fn: scanPlot,
  reference: {
    params: { scan: 'A vehicle scan made by arch_scan.' },
    fields: { result: SVG },
    method: 'Plots the collapse load factor λ against the position of the lead axle (from the left springing of the intrados) and marks the least value and its position.',
  },
});

export const dome_figure = defineCellFunction({
  name: 'dome_figure',
  doc: 'Figure: a dome\'s meridian section to scale with the hoop-tension zone and, given dome_limit, the least-thrust line of a lune; N_φ and N_θ along the meridian: dome_figure(d) or dome_figure(d, dome_limit(d)).',
  params: [{ name: 'dome', type: { ref: 'dome' } }, { name: 'limit', type: { refWithArgs: 'dome_limit' }, optional: true }],
  returns: 'text',
  fn: (d: Dome, limit?: WithArgs<DomeLimit>) => {
    if (limit && limit.args[0] !== d) throw new RangeError('dome_figure: this dome_limit result was computed for another dome; pass the same dome');
    return domeFigure(d, limit?.value);
  },
  reference: {
    params: { dome: 'A result of dome(…).', limit: 'Optional: dome_limit(…) of the same dome, to draw the least-thrust line of a lune and print t_min and the thrust range.' },
    fields: { result: SVG },
    method: 'Draws the shell to scale (intrados, extrados; both halves), marks the membrane hoop-tension zone on the middle surface, and plots N_φ and N_θ against the angle from the crown.',
    sources: ['Timoshenko & Woinowsky-Krieger, Theory of Plates and Shells, 1959, §§128–129.'],
  },
});

export const cross_vault_figure = defineCellFunction({
  name: 'cross_vault_figure',
  doc: 'Figure: a cross vault by slicing — slice planes in plan with the least corner thrusts; both elevations with the webs, the solid pocket, where each slice springs and the corner thrust at its height; clear spans dimensioned: cross_vault_figure(c).',
  params: [{ name: 'vault', type: { ref: 'cross_vault' } }],
  returns: 'text',
  fn: crossVaultFigure,
  reference: {
    params: { vault: 'A result of cross_vault(…).' },
    fields: { result: SVG },
    method: 'Plan: the bay, the groins, each slice\'s plane (red where a slice holds no line of thrust) and the least corner thrusts. Elevations across both spans: the wider and narrower webs, the top of the solid pocket, the points where the least-thrust lines of the slices cross their springings, and the corner\'s least horizontal thrust at its height z_x_min / z_y_min, drawn on the corner\'s plane (the vertical reaction V_corner acts a_x_min / a_y_min inside it and is not drawn there).',
    sources: ['Heyman, The Stone Skeleton, Cambridge 1995 (slicing; from memory).'],
  },
});

export const flyer_figure = defineCellFunction({
  name: 'flyer_figure',
  doc: 'Figure: a flying buttress in elevation with its lines of least and greatest thrust: flyer_figure(f) with f from flying_buttress.',
  params: [{ name: 'flyer', type: { ref: 'flying_buttress' } }],
  returns: 'text',
  fn: flyerFigure,
  reference: {
    params: { flyer: 'A result of flying_buttress(…).' },
    fields: { result: SVG },
    method: 'Draws the bar to scale between the wall face and the pier face, with the lines of least and greatest thrust (the latter left out when unbounded).',
    sources: ['Heyman, The Stone Skeleton, Cambridge 1995, on the flying buttress (from memory).'],
  },
});
