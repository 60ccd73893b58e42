/**
 * What drives each check: dependencies, elasticities, swings, kinks and the governing case.
 *
 * The arch: H = w·L²/(8·f) is the horizontal thrust of a parabolic arch of span L and rise f under a
 * uniform load w per unit of span (common practice: the equilibrium of half the arch about the crown
 * hinge). Its elasticities are exactly 1, 2 and −1; the references below are computed in the test.
 */
import { describe, it, expect } from 'vitest';
import { readFileSync, readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { join } from 'node:path';
import { compile } from '../../../engine/index.js';
import { downstreamOf } from '../../../engine/cases/index.js';
import { explainDocument, inputsOf, type CheckDrivers } from '../../../engine/drivers/index.js';
import { prunedDocument } from '../../../engine/drivers/prune.js';
import { expectClose } from '../../helpers/close.js';
import { fence } from '../../helpers/settle.js';

const ARCH = [
  fence('given', 'w = 12 kN/m  # uniform load per metre of span', 'L = 6 m  # span', 'f = 1.5 m  # rise', 'H_Rd = 60 kN  # what the tie can take',
    'a = 2 kN  # one load', 'b = 2 kN  # another, equal to it', 'c = 3  # read by no check of the arch', 'k = 0.5', 'z = 0 m  # an offset at zero [-1 m, 1 m]'),
  fence('calc', 'H = w * L^2 / (8 * f) to kN  # thrust of a parabolic arch', 'P = k * w * L to kN  # a product', 'Q = L^3 / sqrt(f) to m^2.5  # a power',
    'M = max(a, b) to kN  # the larger load', 'spare = c * f'),
  fence('check', 'c_H = H <= H_Rd  # tie', 'c_P = P <= 50 kN', 'c_Q = Q <= 400 m^2.5', 'c_M = M <= 4 kN  # the larger load', 'c_L = L > 5.5 m + z  # a plain comparison'),
].join('\n');

const byName = (c: CheckDrivers) => Object.fromEntries(c.inputs.map((i) => [i.name, i]));

describe('explainDocument', () => {
  it('explainDocument gives the thrust H = wL²/(8f) elasticities 1, 2 and −1 to w, L and f, and c_H inherits them', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md', targets: ['H', 'c_H'] });
    const h = Object.fromEntries(e.values[0]!.inputs.map((i) => [i.name, i]));
    expect(Object.keys(h).sort()).toEqual(['L', 'f', 'w']);
    expectClose(h.w!.elasticity!, 1, 1e-9);
    expectClose(h.L!.elasticity!, 2, 1e-9);
    expectClose(h.f!.elasticity!, -1, 1e-9);
    const c = byName(e.checks[0]!);
    expect(Object.keys(c).sort()).toEqual(['H_Rd', 'L', 'f', 'w']);
    expectClose(c.w!.elasticity!, 1, 1e-9);
    expectClose(c.L!.elasticity!, 2, 1e-9);
    expectClose(c.f!.elasticity!, -1, 1e-9);
    expectClose(c.H_Rd!.elasticity!, -1, 1e-9);
  });

  it('explainDocument gives the utilization at ±10 % (the swing) and ranks by it', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md', targets: ['c_H'] });
    const c = e.checks[0]!;
    // u = H / H_Rd = 12 · 36 / (8 · 1.5) / 60 = 0.6
    expectClose(c.utilization!, 0.6, 1e-12);
    const L = byName(c).L!;
    expectClose(L.u_minus!, 0.6 * 0.81, 1e-12);
    expectClose(L.u_plus!, 0.6 * 1.21, 1e-12);
    expect(L.step).toBe('±10 %');
    // L² swings most; then 1/f and 1/H_Rd (0.6/0.9 − 0.6/1.1) above w (0.12).
    expect(c.inputs.map((i) => i.name)).toEqual(['L', 'f', 'H_Rd', 'w']);
  });

  it('explainDocument gives a product and a power of inputs their exponents', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md', targets: ['c_P', 'c_Q'] });
    const p = byName(e.checks[0]!);
    for (const x of ['k', 'w', 'L']) expectClose(p[x]!.elasticity!, 1, 1e-9);
    const q = byName(e.checks[1]!);
    expectClose(q.L!.elasticity!, 3, 1e-9);
    expectClose(q.f!.elasticity!, -0.5, 1e-9);
  });

  it('explainDocument never lists an input the check does not depend on', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md' });
    const names = (id: string) => e.checks.find((c) => c.name === id)!.inputs.map((i) => i.name).sort();
    expect(names('c_H')).not.toContain('c');
    expect(names('c_P')).toEqual(['L', 'k', 'w']);
    expect(names('c_M')).toEqual(['a', 'b']);
  });

  it('explainDocument marks max(a, b) at a = b as kinked, with its one-sided elasticities', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md', targets: ['c_M'] });
    const a = byName(e.checks[0]!).a!;
    expect(a.kinked).toBe(true);
    // Below a = b the larger load is b (elasticity 0), above it is a (elasticity 1).
    expect(a.elasticity_minus).toBeCloseTo(0, 9);
    expectClose(a.elasticity_plus!, 1, 1e-9);
    const apart = await explainDocument(ARCH, { file: 'arch.md', targets: ['c_M'], overrides: { b: '1 kN' } });
    expect(byName(apart.checks[0]!).a!.kinked).toBe(false);
  });

  it('explainDocument does not mark a smooth dependence kinked, however it curves (50 + q^20 at q = 1)', async () => {
    const text = [fence('given', 'q = 1'), fence('calc', 's = 50 + q^20'), fence('check', 'c_s = s <= 100')].join('\n');
    const q = byName((await explainDocument(text, { file: 'curve.md' })).checks[0]!).q!;
    expect(q.kinked).toBe(false);
    // d ln s / d ln q = 20 q^20 / (50 + q^20) = 20/51 at q = 1
    expectClose(q.elasticity!, 20 / 51, 1e-3); // a central difference of ±0.1 %: error of order h² times the curvature
  });

  it('explainDocument says why a check is not computed on one side of an input', async () => {
    const text = [fence('given', 'x = 1'), fence('calc', 'r = 1 / (x - 0.9)'), fence('check', 'c_r = r <= 20')].join('\n');
    const x = byName((await explainDocument(text, { file: 'edge.md' })).checks[0]!).x!;
    // At x − 10 % = 0.9 the quotient divides by zero.
    expect(x.u_minus).toBeNull();
    expect(x.u_plus).not.toBeNull();
    expect(x.note).toMatch(/^not computed below the value: r: /);
  });

  it('explainDocument says which field was not available where a check is not computed, not just "not computed"', async () => {
    // Statics of a rectangular wall (common practice): W = 3 m × 0.6 m × 20 kN/m³ = 36 kN; e = T·3 m / W leaves the
    // base (e > 0.3 m) above T = 3.6 kN, so at T + 10 % = 3.74 kN the base pressure is not available.
    const text = [fence('given', 'T = 3.4 kN'), fence('calc', 'w = buttress({height: 3 m, width: 0.6 m, depth: 1 m, unit_weight: 20 kN/m^3, T: T, z_T: 3 m})'),
      fence('check', 'c_s = w.sigma_max <= 500 kN/m^2')].join('\n');
    const t = byName((await explainDocument(text, { file: 'wall.md' })).checks[0]!).T!;
    expect(t.u_plus).toBeNull();
    expect(t.note).toMatch(/^not computed above the value: c_s: .*sigma_max is not available/);
  });

  it('explainDocument gives a plain comparison its verdict at ±10 %, and moves an input at zero by a stated absolute step', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md', targets: ['c_L'] });
    const c = e.checks[0]!;
    expect(c.utilization).toBeNull();
    const i = byName(c);
    // L at −10 % is 5.4 m, not more than 5.5 m: the check fails there.
    expect([i.L!.pass_minus, i.L!.pass_plus]).toEqual([false, true]);
    expect(i.L!.elasticity).toBeNull();
    // z = 0 has no scale of its own: ±10 % of its range [−1 m, 1 m] is ±0.2 m; at +0.2 m, 6 > 5.7 still holds.
    expect(i.z!.step).toBe('±0.2 m');
    expect([i.z!.pass_minus, i.z!.pass_plus]).toEqual([true, true]);
    // The input whose move flips the verdict comes first.
    expect(c.inputs[0]!.name).toBe('L');
  });

  it('explainDocument explains a check in its governing case and says which', async () => {
    const text = [
      fence('given', 'gamma_G = 1.0  # factor on the load', 'G = 10 kN', 'R_d = 20 kN'),
      fence('calc', 'E = gamma_G * G to kN'),
      fence('check', 'c_E = E <= R_d'),
      fence('cases', 'STR = {gamma_G: 1.35}  # strength', 'EQU = {gamma_G: 1.1}'),
    ].join('\n');
    const e = await explainDocument(text, { file: 'cases.md' });
    const c = e.checks[0]!;
    expect(c.case).toBe('STR');
    expectClose(c.utilization!, 1.35 * 10 / 20, 1e-12);
    const g = byName(c).gamma_G!;
    // Moved from the case's value 1.35, not the document's 1.0.
    expect(g.text).toBe('1.35');
    expectClose(g.u_minus!, 1.35 * 0.9 * 10 / 20, 1e-12);
    expectClose(g.elasticity!, 1, 1e-9);
    const asCase = await explainDocument(text, { file: 'cases.md', case: 'EQU' });
    expect(asCase.checks[0]!.case).toBe('EQU');
    expectClose(asCase.checks[0]!.utilization!, 1.1 * 10 / 20, 1e-12);
  });

  it('explainDocument re-evaluates exactly the dirty subgraph of each move (cell evaluations = Σ dirty cells)', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md' });
    const pruned = prunedDocument(compile(ARCH, { file: 'arch.md' }), e.checks.map((c) => (c.name)));
    const dirty = e.stats.changes.reduce((n, change) => n + downstreamOf(pruned.graph, change).size, 0);
    expect(e.stats.evaluations).toBe(dirty);
    // `spare` reads f but no check reads it: it is never evaluated by a move.
    expect(e.stats.changes.some((ch) => downstreamOf(pruned.graph, ch).has('spare'))).toBe(false);
  });

  it('explainDocument names an unknown check with a suggestion', async () => {
    const e = await explainDocument(ARCH, { file: 'arch.md', targets: ['c_HH'] });
    expect(e.diagnostics).toEqual([expect.objectContaining({ ruleId: 'explain/unknown-name', severity: 'error', message: expect.stringContaining('did you mean "c_H"') })]);
  });
});

describe('inputsOf', () => {
  const root = fileURLToPath(new URL('../../../templates/', import.meta.url));
  for (const name of readdirSync(root).filter((f) => f.endsWith('.md'))) {
    it(`inputsOf equals the graph's transitive closure for every check of ${name}`, () => {
      const doc = compile(readFileSync(join(root, name), 'utf8'), { file: name });
      const inputs = doc.graph.cells.filter((c) => c.kind === 'given').map((c) => c.id);
      const checks = doc.graph.cells.filter((c) => c.kind === 'check');
      expect(checks.length).toBeGreaterThan(0);
      // The reference walks the other way: an input is a dependency when the check lies downstream of it.
      const reach = new Map(inputs.map((x) => [x, downstreamOf(doc.graph, [x])]));
      for (const c of checks) expect(inputsOf(doc.graph, c.id), c.id).toEqual(inputs.filter((x) => reach.get(x)!.has(c.id)));
    });
  }
});
