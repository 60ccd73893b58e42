/**
 * Timing of the issue-15 kernels: a cross vault by slicing (ms for one bay at the default slicing,
 * 10 slices per web of 24 voussoirs, with the search for the pocket fill needed) and the limit
 * analysis of a dome by lunes (32 courses, bisection on the thickness).
 */
import { performance } from 'node:perf_hooks';
import { timeCalls } from './timing.js';
import { crossVault } from '../../cells/vault/groin/cross-vault.js';
import { dome } from '../../cells/vault/dome/dome.js';
import { domeLimit } from '../../cells/vault/dome/dome-limit.js';
import { flyingButtress } from '../../cells/supports/flyer.js';

/** Median over `runs` timed calls after `warm` untimed ones (ms per call). */
function time(fn: () => unknown, runs = 7, warm = 2): number {
  return timeCalls(fn, runs, warm);
}

/** Lines to print: the median time per call of each case. */
export async function run(): Promise<string[]> {
  const cases: Array<[string, () => unknown]> = [
    ['cross_vault, square 6 m semicircular, t 0.4 m, solid_level 0 (no pocket search)', () => crossVault({ span_x: 6, thickness: 0.4, unit_weight: 20e3, solid_level: 0 })],
    ['cross_vault, oblong 6 × 4.2 m pointed, t 0.25 m, fill + dead, pocket fill searched', () => crossVault({ span_x: 6, span_y: 4.2, shape: 'pointed', thickness: 0.25, unit_weight: 18e3, fill_level: 1.5, fill_unit_weight: 16e3, dead: 1e3 })],
    ['cross_vault, oblong 6 × 4.2 m semicircular, t 0.25 m, fill + dead, pocket fill searched', () => crossVault({ span_x: 6, span_y: 4.2, thickness: 0.25, unit_weight: 18e3, fill_level: 1.5, fill_unit_weight: 16e3, dead: 1e3 })],
    ['dome_limit, closed hemisphere R 10 m, t 0.6 m', () => domeLimit(dome({ radius: 10, half_angle: Math.PI / 2, thickness: 0.6, unit_weight: 20e3 }))],
    ['dome_limit, hemisphere with oculus and lantern', () => domeLimit(dome({ span: 7.2, rise: 3.6, thickness: 0.46, unit_weight: 18e3, oculus_angle: 0.28, lantern: 36e3 }))],
    ['flying_buttress, arched', () => flyingButtress({ shape: 'arched', span: 4.5, rise: 2, sag: 0.5, thickness: 0.45, unit_weight: 22e3 })],
  ];
  return cases.map(([name, fn]) => `${name}: median ${time(fn).toFixed(1)} ms per call`);
}
