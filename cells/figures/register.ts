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
import { domeFigure } from './dome-figure.js';
import { crossVaultFigure } from './cross-vault-figure.js';
import { flyerFigure } from './flyer-figure.js';
import type { Dome } from '../vault/dome/dome.js';
import type { DomeLimit } from '../vault/dome/dome-limit.js';

/** The loads record of arch_limit, so a figure can be drawn for the same loads. */
const ARCH_LOADS: FieldType = {
  object: {
    fill_unit_weight: 'N/m^3', fill_level: 'm', dead: 'Pa', live: 'Pa', live_from: 'm', live_to: 'm', P: 'N', P_at: 'm',
  },
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
});

export const force_polygon = defineCellFunction({
  name: 'force_polygon',
  doc: 'Figure: the force polygon of the line of least thrust — load line, pole at H, rays and springing reactions: force_polygon(r, a), for the loads a was computed for.',
  params: RING_FIGURE_PARAMS,
  returns: 'text',
  fn: (ring, limit: WithArgs<ArchLimit>, loads?: ArchLoads) => forcePolygon(ring, limit.value, loads ?? loadsOf(limit)),
});

export const membrane_plot = defineCellFunction({
  name: 'membrane_plot',
  doc: 'Figure: membrane forces N_φ, N_x, N_xφ of a barrel vault along the profile and along the generatrix: membrane_plot(m) with m from barrel_membrane.',
  params: [{ name: 'm', type: { ref: 'barrel_membrane' } }],
  returns: 'text',
  fn: membranePlot,
});

export const vault_plan = defineCellFunction({
  name: 'vault_plan',
  doc: 'Figure: a cross vault in plan (webs, groins, corner thrusts) and in elevation (thrust at its height, corner load): vault_plan(v) with v from groin_vault.',
  params: [{ name: 'vault', type: { ref: 'groin_vault' } }],
  returns: 'text',
  fn: vaultPlan,
  reference: {
    params: { vault: 'A result of groin_vault(…).' },
    fields: {},
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
    fields: {},
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
    fields: {},
    method: 'Plan: the bay, the groins, each slice\'s plane (red where a slice holds no line of thrust) and the least corner thrusts. Elevations across both spans: the wider and narrower webs, the top of the solid pocket, the points where the least-thrust lines of the slices cross their springings, and the corner resultant at z_x_min / z_y_min.',
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
    fields: {},
    method: 'Draws the bar to scale between the wall face and the pier face, with the lines of least and greatest thrust (the latter left out when unbounded).',
    sources: ['Heyman, The Stone Skeleton, Cambridge 1995, on the flying buttress (from memory).'],
  },
});
