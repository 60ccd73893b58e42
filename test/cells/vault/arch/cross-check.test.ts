// Source of the expected values: the same programmes solved by an outside general simplex code
// (javascript-lp-solver), and t_min by plain bisection on the feasibility LP.
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { archRing, type ArchRingOptions } from '../../../../cells/vault/arch/arch-ring.js';
import { archLimit } from '../../../../cells/vault/arch/arch-limit.js';
import type { ArchLoads } from '../../../../cells/vault/arch/types.js';
import { minimumThickness } from '../../../../cells/vault/arch/minimum-thickness.js';
import { admissibleProgram } from '../../../../cells/vault/arch/admissible-program.js';
import { thrustProgram } from '../../../../cells/vault/arch/thrust-program.js';
import { seidelLP } from '../../../../cells/vault/arch/seidel-lp.js';
import { simplexLP } from './lp-solver-adapter.js';

/** Small deterministic generator for test data. */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

/** A random ring of a random family and random loads on it (fill, plan loads, a point load). */
function randomCase(rand: () => number): [ArchRingOptions, ArchLoads] {
  const span = 4 + 8 * rand();
  const shapes = ['circular', 'pointed', 'elliptical', 'parabolic', 'catenary', 'cycloid'];
  const shape = shapes[Math.floor(rand() * shapes.length)]!;
  const riseRange: Record<string, [number, number]> = {
    circular: [0.2, 0.5], pointed: [0.5, 1.2], elliptical: [0.25, 0.7], parabolic: [0.15, 0.6], catenary: [0.15, 0.6], cycloid: [0.15, 0.31],
  };
  const [lo, hi] = riseRange[shape]!;
  const rise = span * (lo + (hi - lo) * rand());
  const ring = { shape, span, rise, thickness: span * (0.04 + 0.08 * rand()), unit_weight: 18e3 + 4e3 * rand(), voussoirs: 24 + 2 * Math.floor(20 * rand()) };
  const loads: ArchLoads = {};
  if (rand() < 0.5) Object.assign(loads, { fill_unit_weight: 16e3 + 4e3 * rand(), fill_level: rise * (0.3 + rand()) });
  if (rand() < 0.5) loads.dead = 5e3 * rand();
  if (rand() < 0.6) Object.assign(loads, { live: 10e3 * rand(), live_from: span * 0.4 * rand(), live_to: span * (0.5 + 0.5 * rand()) });
  if (rand() < 0.6) Object.assign(loads, { P: 5e4 * rand(), P_at: span * (0.1 + 0.8 * rand()) });
  return [ring, loads];
}

describe('archLimit with seidelLP agrees with the same programmes solved by javascript-lp-solver', () => {
  it('archLimit(random rings and loads): H_min, H_max, load_factor to 1e-6, t_min (same root finder) to 1e-6, same verdicts', () => {
    const rand = lcg(31415);
    let compared = 0;
    for (let k = 0; k < 16; k++) {
      const [options, loads] = randomCase(rand);
      const ring = archRing(options);
      const ours = archLimit(ring, loads);
      const theirs = archLimit(ring, loads, simplexLP);
      const label = JSON.stringify({ options, loads });
      expect(ours.safe, label).toBe(theirs.safe);
      for (const key of ['H_min', 'H_max', 'load_factor', 't_min'] as const) {
        const [a, b] = [ours[key], theirs[key]];
        expect(typeof a, `${key} of ${label}`).toBe(typeof b);
        if (typeof a === 'number' && typeof b === 'number' && Number.isFinite(a)) {
          expectClose(a, b, 1e-6);
          compared++;
        }
      }
    }
    // The random cases exercise every quantity many times over.
    expect(compared).toBeGreaterThan(35);
  });
});

describe('minimumThickness against plain bisection on the feasibility LP', () => {
  it('minimumThickness(random rings and loads) is where a thrust line stops fitting, as bisection finds it to 1e-7', () => {
    const rand = lcg(2718);
    let compared = 0;
    for (let k = 0; k < 10; k++) {
      const [options, loads] = randomCase(rand);
      const ring = archRing(options);
      const tmin = minimumThickness(ring, loads, seidelLP);
      if (tmin === undefined) continue;
      const fits = (t: number) => seidelLP(admissibleProgram(thrustProgram(ring, t, loads), [-1, 0, 0], false)).feasible;
      // Bisection from a bracket that does not use the root finder's answer.
      let [lo, hi] = [0, 2 * ring.thickness];
      while (!fits(hi)) hi *= 1.5;
      while (hi - lo > 1e-9 * hi) {
        const mid = (lo + hi) / 2;
        if (fits(mid)) hi = mid;
        else lo = mid;
      }
      expectClose(tmin, hi, 1e-7);
      compared++;
    }
    expect(compared).toBeGreaterThan(5);
  });
});
