/**
 * Sources: the registered functions are compared with their kernels (same numbers, units converted).
 * The tie area A = T·γ_M/f_y is the plastic tension resistance of a bar, EN 1993-1-1 6.2.3 (from memory);
 * the nominal bar series 8–50 mm is EN 10080 (from memory). Rigid-block statics of the buttress are
 * checked against closed forms in buttress.test.ts (any statics text).
 */
import { describe, it, expect } from 'vitest';
import { math } from '../../../cells/math.js';
import { buttress, tie } from '../../../cells/supports/register.js';
import { buttress as buttressKernel } from '../../../cells/supports/buttress.js';
import { UnitMismatchError } from '../../../cells/units.js';
import { expectClose } from '../../helpers/close.js';

const u = (v: number, unit: string) => math.unit(v, unit);
const num = (x: unknown, unit: string) => (x as { toNumber(u: string): number }).toNumber(unit);

describe('buttress and tie registered for cells', () => {
  it('buttress.call({...}) with mathjs units matches the kernel', () => {
    const r = buttress.call({
      height: u(6, 'm'), width: u(1, 'm'), depth: u(1, 'm'), unit_weight: u(20, 'kN/m^3'),
      T: u(10, 'kN'), z_T: u(5, 'm'), V: u(20, 'kN'), x_V: u(200, 'mm'),
      steps: [{ height: u(2, 'm'), width: u(2, 'm') }], friction: 0.6, bearing: u(0.5, 'N/mm^2'),
    }) as Record<string, any>;
    const k = buttressKernel({ height: 6, width: 1, depth: 1, unit_weight: 20e3, T: 10e3, z_T: 5, V: 20e3, x_V: 0.2,
      steps: [{ height: 2, width: 2 }], friction: 0.6, bearing: 0.5e6 });
    expectClose(num(r.x_R, 'm'), k.x_R, 1e-12);
    expectClose(num(r.sigma_max, 'kPa'), (k.sigma_max as number) / 1e3, 1e-12);
    expectClose(r.sf_overturning, k.sf_overturning, 1e-12);
    expect(r.middle_third).toBe(k.middle_third);
    expect(r.bearing_ok).toBe(true);
    expectClose(num(r.path[r.path.length - 1].x, 'm'), k.x_R, 1e-12);
  });

  it('buttress.call refuses a thrust given as a length and a missing height', () => {
    expect(() => buttress.call({ height: u(6, 'm'), width: u(1, 'm'), depth: u(1, 'm'), unit_weight: u(20, 'kN/m^3'), T: u(10, 'm'), z_T: u(5, 'm') }))
      .toThrow(UnitMismatchError);
    expect(() => buttress.call({ width: u(1, 'm'), depth: u(1, 'm'), unit_weight: u(20, 'kN/m^3'), T: u(10, 'kN'), z_T: u(5, 'm') }))
      .toThrow(/"height" is required/);
  });

  it('tie.call({T: 100 kN, f_y: 235 MPa}) gives a 25 mm bar', () => {
    const r = tie.call({ T: u(100, 'kN'), f_y: u(235, 'MPa') }) as Record<string, unknown>;
    expectClose(num(r.bar_diameter, 'mm'), 25, 1e-12);
    expectClose(num(r.area, 'mm^2'), 100e3 / 235, 1e-12);
  });
});

describe('fields that are not available pass through the cell wrapper unchanged (issue 12 §2, issue 15)', () => {
  it('tie without f_u: utilization and governs (a text field) stay "not available" with the reason', async () => {
    const { isNotAvailable } = await import('../../../cells/not-available.js');
    const r = tie.call({ T: u(100, 'kN'), f_y: u(235, 'MPa') }) as Record<string, unknown>;
    expect(isNotAvailable(r.utilization)).toBe(true);
    expect(isNotAvailable(r.governs)).toBe(true);
    const b = buttress.call({ height: u(6, 'm'), width: u(1, 'm'), depth: u(1, 'm'), unit_weight: u(20, 'kN/m^3'), T: u(0, 'kN') }) as Record<string, unknown>;
    expect(isNotAvailable(b.bearing_ok)).toBe(true);
    expect(b.sf_overturning).toBe(Infinity);
  });
});

describe('tie in a document: a bar the thread table cannot serve (issue 15)', () => {
  it('tie({..., diameter: 70 mm}) is an error on its line, in the document\'s units (kernel/domain), not a number', async () => {
    const { evaluateDocument } = await import('../../../engine/index.js');
    const doc = ['```given', 'T = 100 kN', 'f_y = 235 MPa', 'f_u = 360 MPa', '```', '', '```calc', 'b = tie({T: T, f_y: f_y, f_u: f_u, diameter: 70 mm})', '```', ''].join('\n');
    const { summary } = await evaluateDocument(doc, { file: 'calc.md' });
    expect(summary.diagnostics.map((d) => [d.line, d.ruleId])).toEqual([[8, 'kernel/domain']]);
    expect(summary.diagnostics[0]!.message).toMatch(/diameter .*less than 68 mm.*got 70 mm/);
  });
});
