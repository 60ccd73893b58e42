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

  it('diffDocuments reports a governing case that disappears or appears (no governing case is "none"), in text and JSON', async () => {
    // c_M as `<` has no utilization, so a check that holds in every case has no governing case (README, Cases).
    // Old `<=`: STR governs, M = 1.35 · 10 · 3 · 3 / 6 = 20.25 kN m against 30 kN m (0.675).
    const strict = (s: string) => s.replace('c_M = M <= 30 kN m', 'c_M = M < 30 kN m');
    const toNone = await versions(beam('3 m', '30 kN m'), strict(beam('3 m', '30 kN m')));
    const g = toNone.cases!.governing.find((x) => x.check === 'c_M');
    expect(g).toEqual({ check: 'c_M', old: { case: 'STR', pass: true, utilization: expect.closeTo(20.25 / 30, 12) }, new: null });
    expect(JSON.parse(JSON.stringify(toNone)).cases.governing.find((x: { check: string }) => x.check === 'c_M').new).toBe(null);
    expect(formatDiff(toNone)).toMatch(/>>\s+c_M\s+governing case STR → none\s+utilization 0\.68 → —/);
    const fromNone = await versions(strict(beam('3 m', '30 kN m')), beam('3 m', '30 kN m'));
    expect(fromNone.cases!.governing.find((x) => x.check === 'c_M')).toMatchObject({ old: null, new: { case: 'STR' } });
    expect(formatDiff(fromNone)).toMatch(/c_M\s+governing case none → STR\s+utilization — → 0\.68/);
    // c_R (left alone) keeps its governing case: not listed.
    expect(toNone.cases!.governing.map((x) => x.check)).toEqual(['c_M']);
  });

  it('diffDocuments of documents without cases has no cases part (the diff JSON is as before)', async () => {
    const plain = (cap: string) => [fence('given', 'a = 1 m'), fence('check', `a <= ${cap}`)].join('\n');
    const d = await versions(plain('2 m'), plain('3 m'));
    expect('cases' in d).toBe(false);
  });
});
