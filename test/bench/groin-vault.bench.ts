/**
 * Timing of the cross-vault kernel: median time of one groin_vault call,
 * through the kernel and through the registered cell function (units in and out).
 */
import { timeCalls } from './timing.js';
import { groinVault } from '../../cells/vault/groin/groin-vault.js';
import { groin_vault } from '../../cells/vault/register-groin.js';
import { math } from '../../cells/math.js';

/** Median over `runs` timed calls, after `warm` untimed ones (µs per call). */
function time(fn: () => unknown, runs = 300, warm = 50): number {
  return timeCalls(fn, runs, warm) * 1e3;
}

/** Lines to print: the median time per call of each case. */
export async function run(): Promise<string[]> {
  const cases: Array<[string, () => unknown]> = [
    ['groin_vault kernel, square semicircular, g only', () => groinVault({ span_x: 8, g: 3.6e3 })],
    ['groin_vault kernel, oblong, fill + dead + live', () => groinVault({ span_x: 9, span_y: 6, thickness: 0.3, unit_weight: 18e3, fill_level: 2.5, fill_unit_weight: 16e3, dead: 1e3, live: 2e3 })],
    ['groin_vault kernel, pointed', () => groinVault({ span_x: 8, shape: 'pointed', thickness: 0.25, unit_weight: 20e3 })],
    ['groin_vault registered, with mathjs units', () => groin_vault.call({ span_x: math.unit(8, 'm'), thickness: math.unit(0.2, 'm'), unit_weight: math.unit(18, 'kN/m^3') })],
  ];
  return cases.map(([name, fn]) => `${name}: median ${time(fn).toFixed(1)} µs per call`);
}
