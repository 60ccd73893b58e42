import { describe, it, expect } from 'vitest';
import { evaluateDocument } from '../../engine/index.js';
import { fence } from '../helpers/settle.js';
import { expectClose } from '../helpers/close.js';

async function valueOf(lines: string[], name: string) {
  const { summary } = await evaluateDocument(fence('calc', ...lines));
  return summary.values[name]!;
}

describe('units — display and mismatch messages', () => {
  it('shows 72000 kg/s^2 as 72 kN/m when the expression says to kN/m', async () => {
    expect((await valueOf(['q = 72000 kg / s^2 to kN/m'], 'q'))).toMatchObject({ value: 72, unit: 'kN/m', text: '72 kN/m' });
  });

  it('picks engineering units for computed values', async () => {
    const v = await valueOf(['w = 18 kN/m^3 * 0.25 m * 4 m', 'H = w * 3 m'], 'w');
    expect(v).toMatchObject({ unit: 'kN/m', text: '18 kN/m' });
    expect(await valueOf(['M = 20 kN * 3 m'], 'M')).toMatchObject({ unit: 'kN m', value: 60 });
    expect(await valueOf(['s = 300 kN / (0.1 m^2)'], 's')).toMatchObject({ unit: 'MPa', value: 3 });
    expect(await valueOf(['p = 5 kN / (2 m^2)'], 'p')).toMatchObject({ unit: 'kN/m^2', value: 2.5 });
  });

  it('knows kip, ksi, psf, pcf, plf and klf', async () => {
    // Exact factors, NIST SP 811 Appendix B: 1 psf = 47.880259 Pa, 1 klf = 14.593903 kN/m.
    expect((await valueOf(['p = 100 psf to kN/m^2'], 'p')).value).toBeCloseTo(4.7880259, 6);
    expect((await valueOf(['q = 1 klf to kN/m'], 'q')).value).toBeCloseTo(14.593903, 5);
    expect((await valueOf(['g = 120 pcf to kN/m^3'], 'g')).value).toBeCloseTo(18.850496, 5);
    expect((await valueOf(['w = 1000 plf to klf'], 'w')).value).toBeCloseTo(1, 10);
    expect((await valueOf(['f = 1 ksi to MPa'], 'f')).value).toBeCloseTo(6.894757, 6);
    expect((await valueOf(['P = 1 kip to kN'], 'P')).value).toBeCloseTo(4.448222, 6);
  });

  it('a kip is exactly 1000 lbf and a psi exactly 1 lbf/in² (mathjs\'s own kip was 4448.2216 N, 3.4e-9 short: 1 kip − 1000 lbf gave −3.4e-6 lbf)', async () => {
    // NIST SP 811 (2008) Appendix B: 1 lbf = 4.4482216152605 N, 1 in = 0.0254 m, 1 kip = 1000 lbf (exact).
    const lbf = 4.4482216152605;
    expect((await valueOf(['d = 1 kip - 1000 lbf to lbf'], 'd')).value).toBe(0);
    // (the JSON value has 12 significant figures: relative 1e-11 tells the old factors from the exact ones)
    expectClose((await valueOf(['P = 1 kip to N'], 'P')).value as number, 1000 * lbf, 1e-11);
    expect((await valueOf(['r = 1 ksi / (1000 psi)'], 'r')).value).toBe(1);
    expectClose((await valueOf(['p = 1 psi to Pa'], 'p')).value as number, lbf / 0.0254 ** 2, 1e-11);
    expectClose((await valueOf(['q = 1 kip / ft^2 to psf'], 'q')).value as number, 1000, 1e-11);
  });

  it('says which dimensions clash instead of "Units do not match"', async () => {
    const { summary } = await evaluateDocument(fence('given', 'L = 6 m', 'P = 5 kN') + fence('calc', 'x = L + P', 'y = (P to kN/m)'));
    const [x, y] = summary.diagnostics;
    expect(x).toMatchObject({ ruleId: 'units/mismatch', line: 6, cellId: 'x', message: 'cannot add length (m) to force (kN) in "L + P"' });
    expect(y).toMatchObject({ ruleId: 'units/mismatch', line: 7, cellId: 'y' });
    expect(y!.message).toMatch(/cannot convert force \(kN\) to force per length/);
  });

  it('flags a division by zero as a non-finite result', async () => {
    const { summary } = await evaluateDocument(fence('calc', 'a = 0 m', 'b = 3 kN / a'));
    expect(summary.diagnostics).toMatchObject([{ ruleId: 'value/non-finite', line: 3, cellId: 'b' }]);
  });
});

describe('given ranges', () => {
  it('warns, with the line, when an input is outside its range', async () => {
    const { summary } = await evaluateDocument(fence('given', 'L = 15 m  # span [3 m, 12 m]', 'f = 2 m # rise [0.5 m, 4 m]'));
    expect(summary.diagnostics).toEqual([expect.objectContaining({
      severity: 'warning', ruleId: 'value/range', line: 2, message: 'L = 15 m is outside the allowed range [3 m, 12 m]',
    })]);
  });

  it('warns when a range has other units than its value', async () => {
    const { summary } = await evaluateDocument(fence('given', 'L = 5 m  # span [3 kN, 12 kN]'));
    expect(summary.diagnostics[0]).toMatchObject({ severity: 'warning', ruleId: 'value/range' });
  });
});
