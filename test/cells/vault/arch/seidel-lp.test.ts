// Sources: a hand calculation for the small programme; an outside general simplex code (javascript-lp-solver)
// for the random ones.
import { describe, it, expect } from 'vitest';
import { expectClose } from '../../../helpers/close.js';
import { seidelLP, type LinearProgram } from '../../../../cells/vault/arch/seidel-lp.js';
import { simplexLP } from './lp-solver-adapter.js';

/** Small deterministic generator for test data (not the kernel's). */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

/** m random half-spaces around a feasible point x0 (or with a contradiction added), in d unknowns. */
function randomProgram(rand: () => number, d: number, m: number, infeasible = false): LinearProgram {
  const x0 = Array.from({ length: d }, () => 4 * rand() - 2);
  const a = new Float64Array((m + (infeasible ? 2 : 0)) * d);
  const b = new Float64Array(m + (infeasible ? 2 : 0));
  for (let i = 0; i < m; i++) {
    let ax = 0;
    for (let j = 0; j < d; j++) ax += (a[i * d + j] = 2 * rand() - 1) * x0[j]!;
    b[i] = ax + 3 * rand();
  }
  if (infeasible) {
    // x_0 ≤ −5 and −x_0 ≤ −6 (x_0 ≥ 6) cannot both hold.
    a[m * d] = 1;
    b[m] = -5;
    a[(m + 1) * d] = -1;
    b[m + 1] = -6;
  }
  return { a, b, c: Array.from({ length: d }, () => 2 * rand() - 1), lo: Array(d).fill(-50), hi: Array(d).fill(50) };
}

const value = (lp: LinearProgram, x: number[]) => lp.c.reduce((s, c, i) => s + c * x[i]!, 0);

describe('seidelLP', () => {
  it('seidelLP(max x + y, x + 2y ≤ 4, 3x + y ≤ 6) is the vertex (8/5, 6/5) — hand calculation', () => {
    const r = seidelLP({ a: Float64Array.of(1, 2, 3, 1), b: Float64Array.of(4, 6), c: [1, 1], lo: [0, 0], hi: [10, 10] });
    expect(r.feasible).toBe(true);
    if (!r.feasible) return;
    expectClose(r.x[0]!, 8 / 5, 1e-12);
    expectClose(r.x[1]!, 6 / 5, 1e-12);
  });

  it('seidelLP reports no feasible point for x ≤ −1, x ≥ 1', () => {
    expect(seidelLP({ a: Float64Array.of(1, -1), b: Float64Array.of(-1, -1), c: [1], lo: [-9], hi: [9] }).feasible).toBe(false);
  });

  it('seidelLP stops at the box when nothing else bounds the objective', () => {
    const r = seidelLP({ a: Float64Array.of(1, -1), b: Float64Array.of(1), c: [0, 1], lo: [-5, -5], hi: [5, 5] });
    expect(r.feasible && r.x[1]).toBe(5);
  });

  it('seidelLP agrees with javascript-lp-solver on random programmes in 2, 3 and 4 unknowns', () => {
    const rand = lcg(20240611);
    for (let k = 0; k < 60; k++) {
      const d = 2 + (k % 3);
      const lp = randomProgram(rand, d, 20 + Math.floor(400 * rand()));
      const ours = seidelLP(lp);
      const theirs = simplexLP(lp);
      expect(ours.feasible).toBe(true);
      expect(theirs.feasible).toBe(true);
      if (!ours.feasible || !theirs.feasible) return;
      expectClose(value(lp, ours.x), value(lp, theirs.x), 1e-7, 1);
      // Every constraint holds at our optimum.
      for (let i = 0; i < lp.b.length; i++) {
        const ax = ours.x.reduce((s, x, j) => s + lp.a[i * d + j]! * x, 0);
        expect(ax).toBeLessThanOrEqual(lp.b[i]! + 1e-8);
      }
    }
  });

  it('seidelLP and javascript-lp-solver both find contradictory programmes infeasible', () => {
    const rand = lcg(7);
    for (let k = 0; k < 10; k++) {
      const lp = randomProgram(rand, 3 + (k % 2), 100, true);
      expect(seidelLP(lp).feasible).toBe(false);
      expect(simplexLP(lp).feasible).toBe(false);
    }
  });

  it('seidelLP gives the same answer every time (fixed seed)', () => {
    const lp = randomProgram(lcg(99), 4, 300);
    expect(seidelLP(lp)).toEqual(seidelLP(lp));
  });
});
