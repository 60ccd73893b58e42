import { describe, it, expect } from 'vitest';
import type { Unit } from 'mathjs';
import { expectClose } from '../../helpers/close.js';
import { math } from '../../../cells/math.js';
import { CellArgumentError } from '../../../cells/define.js';
import { UnitMismatchError } from '../../../cells/units.js';
import { masonryFk } from '../../../cells/materials/masonry-fk.js';
import { masonryFd } from '../../../cells/materials/masonry-fd.js';
import { unitWeight, UNIT_WEIGHTS } from '../../../cells/materials/unit-weight.js';
import { masonry_fk, masonry_fd, unit_weight } from '../../../cells/materials/register.js';

const MPa = (x: number) => math.unit(x, 'MPa');
const inMPa = (x: unknown) => (x as Unit).toNumber('MPa');

describe('masonryFk(f_b, f_m, {K, alpha, beta}) — EN 1996-1-1:2005 eq. (3.1)', () => {
  it('masonryFk(20 MPa, 10 MPa) = 0.55·20^0.7·10^0.3 N/mm² (defaults: Group 1 clay, general-purpose mortar, from memory)', () => {
    expectClose(masonryFk(20e6, 10e6) / 1e6, 0.55 * 20 ** 0.7 * 10 ** 0.3, 1e-14);
    expectClose(masonryFk(20e6, 10e6) / 1e6, 8.934776, 1e-6); // hand calculation
  });

  it('masonryFk(f_b, f_m, {K: 0.45}) for dimensioned natural stone (K = 0.45, from memory)', () => {
    expectClose(masonryFk(40e6, 5e6, { K: 0.45 }) / 1e6, 0.45 * 40 ** 0.7 * 5 ** 0.3, 1e-14);
  });

  // German National Annex, solid clay and calcium-silicate units in general-purpose mortar:
  // K = 0.95, α = 0.585, β = 0.162 with f_st for f_b (Mauerwerk-Kalender 2012, Table 6 [C]); strength class
  // 12 / 20 / 28 → f_st = 15 / 25 / 35 N/mm² [C]; tabulated f_k, DIN EN 1996-3/NA Annex D [C], to 0.1 N/mm².
  it.each([
    [15, [5.4, 6.0, 6.7, 7.5]], [25, [7.2, 8.1, 9.1, 10.1]], [35, [8.8, 9.9, 11.0, 12.4]],
  ])('masonryFk(f_st = %d MPa, f_m, German NA parameters) reproduces the DIN EN 1996-3/NA Annex D table', (fst, row) => {
    [2.5, 5, 10, 20].forEach((fm, i) => {
      const fk = masonryFk(fst * 1e6, fm * 1e6, { K: 0.95, alpha: 0.585, beta: 0.162 }) / 1e6;
      expect(Math.abs(fk - row[i]!)).toBeLessThanOrEqual(0.05);
    });
  });

  it.each<[() => number, RegExp]>([
    [() => masonryFk(-5e6, 10e6), /masonry_fk: f_b must be positive, got -5 N\/mm²/],
    [() => masonryFk(20e6, 0), /masonry_fk: f_m must be positive, got 0 N\/mm²/],
    [() => masonryFk(80e6, 10e6), /f_b = 80 N\/mm² is above 75 N\/mm²/],
    [() => masonryFk(20e6, 25e6), /f_m = 25 N\/mm² is above min\(20 N\/mm², 2·f_b = 40 N\/mm²\)/],
    [() => masonryFk(4e6, 10e6), /f_m = 10 N\/mm² is above min\(20 N\/mm², 2·f_b = 8 N\/mm²\)/],
    [() => masonryFk(20e6, 10e6, { alpha: 0 }), /alpha must be in \(0, 1\]/],
    [() => masonryFk(20e6, 10e6, { K: NaN }), /K must be positive, got NaN/],
  ])('%# refuses input outside eq. (3.1) with a RangeError', (fn, message) => {
    expect(fn).toThrow(RangeError);
    expect(fn).toThrow(message);
  });
});

describe('masonryFd(f_k, γ_M) — EN 1996-1-1 2.4.3', () => {
  it('masonryFd(f_k, 2.5) = f_k / 2.5', () => {
    expectClose(masonryFd(8.934776e6, 2.5), 3.5739104e6, 1e-12);
  });
  it('refuses γ_M below 1 and a non-positive f_k', () => {
    expect(() => masonryFd(8e6, 0.9)).toThrow(/masonry_fd: gamma_M must be at least 1, got 0.9/);
    expect(() => masonryFd(0, 2)).toThrow(/masonry_fd: f_k must be positive/);
  });
});

describe('unitWeight(name)', () => {
  it('unitWeight("brick masonry") = 18 kN/m³ (Circolare n. 7/2019 Table C8.5.I, from memory)', () => {
    expect(unitWeight('brick masonry')).toBe(18000);
    expect(unitWeight('Brick_Masonry')).toBe(18000);
  });
  it('unitWeight of natural stones lies in the EN 1991-1-1 Annex A ranges (from memory): granite 27–30, sandstone 21–27, dense limestone 20–29 kN/m³', () => {
    expect(unitWeight('granite')).toBeGreaterThanOrEqual(27000);
    expect(unitWeight('granite')).toBeLessThanOrEqual(30000);
    expect(unitWeight('sandstone')).toBeGreaterThanOrEqual(21000);
    expect(unitWeight('sandstone')).toBeLessThanOrEqual(27000);
    expect(unitWeight('limestone')).toBeGreaterThanOrEqual(20000);
    expect(unitWeight('limestone')).toBeLessThanOrEqual(29000);
    expect(unitWeight('tuff')).toBeLessThanOrEqual(16000); // Circolare C8.5.I soft stone 13–16 kN/m³ [C]
  });
  it('every material names its source', () => {
    for (const entry of Object.values(UNIT_WEIGHTS)) expect(entry.source).toMatch(/\[(M|C)\]/);
    expect(Object.keys(UNIT_WEIGHTS)).toEqual(expect.arrayContaining(['brick masonry', 'limestone', 'sandstone', 'granite', 'tuff', 'lime mortar', 'loose fill', 'compacted fill', 'concrete']));
  });
});

describe('masonry_fk / masonry_fd / unit_weight registered for cells', () => {
  it('masonry_fk(20 MPa, 10 MPa) and masonry_fd(f_k, 2.5) carry units', () => {
    const fk = masonry_fk.call(MPa(20), MPa(10));
    expectClose(inMPa(fk), 0.55 * 20 ** 0.7 * 10 ** 0.3, 1e-12);
    expectClose(inMPa(masonry_fd.call(fk, 2.5)), (0.55 * 20 ** 0.7 * 10 ** 0.3) / 2.5, 1e-12);
    expectClose(inMPa(masonry_fk.call(math.unit(20, 'N/mm^2'), MPa(10), { K: 0.45 })), 0.45 * 20 ** 0.7 * 10 ** 0.3, 1e-12);
  });
  it('masonry_fk refuses a length and an unknown parameter', () => {
    expect(() => masonry_fk.call(math.unit(20, 'm'), MPa(10))).toThrow(UnitMismatchError);
    expect(() => masonry_fk.call(MPa(20), MPa(10), { gamma: 2 })).toThrow(CellArgumentError);
  });
  it('unit_weight("limestone") in kN/m^3; an unknown name lists the known ones', () => {
    expect((unit_weight.call('limestone') as Unit).toNumber('kN/m^3')).toBeCloseTo(24, 12);
    expect(() => unit_weight.call('marble')).toThrow(CellArgumentError);
    expect(() => unit_weight.call('marble')).toThrow(/unknown material "marble"; known materials: brick masonry, .*concrete/);
  });
});
