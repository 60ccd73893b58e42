import { describe, it, expect } from 'vitest';
import { tie } from '../../../cells/supports/tie.js';
import { expectClose } from '../../helpers/close.js';

describe('tie', () => {
  it('tie({T, f_y}) needs T/f_y and picks the next bar of the series (EN 1993-1-1 §6.2.3, γ_M0 = 1.0, from memory)', () => {
    const r = tie({ T: 100e3, f_y: 235e6 });
    expectClose(r.area, 100e3 / 235e6, 1e-15); // 425.5 mm²
    expectClose(r.bar_diameter, 0.025, 1e-15); // 20 mm = 314 mm² is short; 25 mm = 491 mm²
    expectClose(r.bar_area, (Math.PI * 0.025 ** 2) / 4, 1e-15);
    expect(r.force).toBe(100e3);
    expect(r.utilization).toBeLessThanOrEqual(1);
  });

  it('tie: a partial factor raises the area; an exact fit takes that bar', () => {
    expectClose(tie({ T: 100e3, f_y: 235e6, gamma_M: 1.15 }).area, (1.15 * 100e3) / 235e6, 1e-15);
    const exact = (Math.PI * 0.016 ** 2) / 4 * 355e6;
    expect(tie({ T: exact, f_y: 355e6 }).bar_diameter).toBe(0.016);
  });

  it('tie refuses a thrust no bar of the series can take, and bad input', () => {
    expect(() => tie({ T: 2e6, f_y: 235e6 })).toThrow(/use several ties/);
    expect(() => tie({ T: -1, f_y: 235e6 })).toThrow(/T must be positive/);
    expect(() => tie({ T: 1e3, f_y: 0 })).toThrow(/f_y must be positive/);
    expect(() => tie({ T: 1e3, f_y: 235e6, gamma_M: 0.5 })).toThrow(/gamma_M/);
  });
});
