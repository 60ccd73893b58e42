/**
 * diff with cases: each check compared case by case, and a change of governing case reported.
 * The beam of judge.test.ts: M = P·a·b/L, R_left = P·b/L (any statics text).
 */
import { describe, it, expect } from 'vitest';
import { evaluateDocument } from '../../../engine/index.js';
import { diffDocuments } from '../../../bin/diff/document.js';
import { formatDiff } from '../../../bin/diff/format.js';
import { fence } from '../../helpers/settle.js';

const beam = (x: string, cap: string) => [
  fence('given', 'L = 6 m  # span', 'gamma_G = 1.0  # factor on the load', 'P = 10 kN  # point load', `x_P = ${x}  # where the load stands`),
  fence('calc', 'M = gamma_G * P * x_P * (L - x_P) / L to kN m', 'R = gamma_G * P * (L - x_P) / L to kN'),
  fence('check', `c_M = M <= ${cap}  # bending`, 'c_R = R <= 9.5 kN  # left reaction [in STR, axle]'),
  fence('cases', 'STR = {gamma_G: 1.35}  # strength', 'axle = {x_P: steps(0.1 * L, 0.9 * L, 5)}  # the load rolled across'),
].join('\n');

async function versions(a: string, b: string) {
  const [x, y] = await Promise.all([evaluateDocument(a, { file: 'old.md' }), evaluateDocument(b, { file: 'new.md' })]);
  return diffDocuments({ label: 'old.md', summary: x.summary, blocks: x.doc.blocks }, { label: 'new.md', summary: y.summary, blocks: y.doc.blocks });
}

describe('diff with cases', () => {
  it('diffDocuments reports a check that newly fails in one case, and the change of its governing case', async () => {
    // Old: x_P = 3 m; STR gives R = 1.35 · 10 · 3 / 6 = 6.75 kN, axle[1] gives 9 kN (governing, 0.947).
    // New: x_P = 0.5 m; STR gives R = 1.35 · 10 · 5.5 / 6 = 12.375 kN > 9.5 kN: fails and governs.
    const d = await versions(beam('3 m', '20 kN m'), beam('0.5 m', '20 kN m'));
    // c_M's governing case moves too (old STR 20.25 kN m, new axle[3] 15 kN m); c_R is the one checked here.
    expect(d.cases!.governing.map((g) => g.check)).toEqual(['c_M', 'c_R']);
    expect(d.cases!.governing[1]).toEqual({ check: 'c_R', old: { case: 'axle[1]', pass: true, utilization: expect.closeTo(9 / 9.5, 12) }, new: { case: 'STR', pass: false, utilization: expect.closeTo(12.375 / 9.5, 12) } });
    expect(d.cases!.changes.filter((c) => c.change === 'to-fail').map((c) => `${c.check} ${c.case}`)).toEqual(['c_R STR']);
    expect(d.new_failures).toBe(1);
    const text = formatDiff(d);
    expect(text).toContain('>>  c_R');
    expect(text).toMatch(/c_R\s+governing case axle\[1\] → STR\s+utilization 0\.95 → 1\.31/); // one formatter: two decimals, rounded up
  });

  it('diffDocuments of documents without cases has no cases part (the diff JSON is as before)', async () => {
    const plain = (cap: string) => [fence('given', 'a = 1 m'), fence('check', `a <= ${cap}`)].join('\n');
    const d = await versions(plain('2 m'), plain('3 m'));
    expect('cases' in d).toBe(false);
  });
});
