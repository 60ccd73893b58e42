import { describe, expect, it } from 'vitest';
import { math } from '../../../cells/math.js';
import { numberHtml, numberTex, unitHtml, unitTex, valueHtml, valueTex } from '../../../engine/render/quantity.js';
import { formatUtilization as utilizationText } from '../../../engine/values/format.js';

const NNBSP = '\u202f';
const NBSP = '\u00a0';
const u = (v: number, unit: string) => math.unit(v, unit);

describe('rounding and unit display', () => {
  // Rounding to significant figures without trailing zeros; digit groups of three from five digits up
  // (ISO 80000-1, 7.3.1); powers of ten for very small and very large values.
  it.each([
    [72000, 4, `72${NNBSP}000`],
    [12345.6, 4, `12${NNBSP}350`],
    [1234.56, 4, '1235'],
    [0.30000000000000004, 4, '0.3'],
    [6.4, 4, '6.4'],
    [2.345678, 3, '2.35'],
    [-0.25, 4, '−0.25'],
    [0.0000123, 3, '1.23\u2009×\u200910<sup>−5</sup>'],
    [0, 4, '0'],
    [1e10, 4, '1\u2009×\u200910<sup>10</sup>'],
  ])('numberHtml(%s, %s) is %s', (x, sf, expected) => {
    expect(numberHtml(x, sf)).toBe(expected);
  });

  it.each([
    [72000, 4, '72\\,000'],
    [-0.25, 4, '-0.25'],
    [0.0000123, 3, '1.23\\times10^{-5}'],
    [Infinity, 4, '\\infty'],
  ])('numberTex(%s, %s) is %s', (x, sf, expected) => {
    expect(numberTex(x, sf)).toBe(expected);
  });

  it.each([
    ['kN/m^3', 'kN/m<sup>3</sup>', '\\mathrm{kN}/\\mathrm{m}^{3}'],
    ['kN m', 'kN·m', '\\mathrm{kN}{\\cdot}\\mathrm{m}'],
    ['kN m/m', 'kN·m/m', '\\mathrm{kN}{\\cdot}\\mathrm{m}/\\mathrm{m}'],
    ['deg', '°', '{}^{\\circ}'],
    ['kg / (m s^2)', 'kg/(m·s<sup>2</sup>)', '\\mathrm{kg}/(\\mathrm{m}{\\cdot}\\mathrm{s}^{2})'],
    ['m^-1', 'm<sup>−1</sup>', '\\mathrm{m}^{-1}'],
  ])('unit %s is %s in HTML and %s in TeX', (unit, html, tex) => {
    expect(unitHtml(unit)).toBe(html);
    expect(unitTex(unit)).toBe(tex);
  });

  // Quantities: the unit written by hand is kept; bare SI force units as kernels return them are shown in
  // engineering units (common practice: kN, kN/m, kN/m², MPa).
  it.each([
    [u(6.4, 'm'), null, 4, `6.4${NBSP}<span class="vb-unit">m</span>`],
    [u(18, 'kN/m^3'), null, 4, `18${NBSP}<span class="vb-unit">kN/m<sup>3</sup></span>`],
    [u(17090, 'N'), null, 4, `17.09${NBSP}<span class="vb-unit">kN</span>`],
    [u(72000, 'N/m'), null, 4, `72${NBSP}<span class="vb-unit">kN/m</span>`],
    [u(2.5e6, 'Pa'), null, 3, `2.5${NBSP}<span class="vb-unit">MPa</span>`],
    [u(352100, 'Pa'), null, 4, `352.1${NBSP}<span class="vb-unit">kN/m<sup>2</sup></span>`],
    [u(0.08885, 'm'), 'mm', 4, `88.85${NBSP}<span class="vb-unit">mm</span>`],
    [u(Math.PI / 6, 'rad'), 'deg', 4, '30<span class="vb-unit">°</span>'],
    [u(1234.5678, 'kN'), null, 3, `1230${NBSP}<span class="vb-unit">kN</span>`],
  ])('valueHtml(%s, unit %s, %s sig. figs)', (value, unit, sf, expected) => {
    expect(valueHtml(value, { sigfigs: sf, unit })).toBe(expected);
  });

  it('valueHtml escapes text values and never shows an SVG string as markup', () => {
    expect(valueHtml('<b>x</b>', { sigfigs: 4 })).toBe('“&lt;b&gt;x&lt;/b&gt;”');
    expect(valueHtml('<svg onload=alert(1)>', { sigfigs: 4 })).toBe('[figure]');
    expect(valueHtml(true, { sigfigs: 4 })).toBe('true');
  });

  it('valueTex gives a quantity with a thin space, and null for records', () => {
    expect(valueTex(u(6.4, 'm'), { sigfigs: 4 })).toBe('6.4\\,\\mathrm{m}');
    expect(valueTex(u(30, 'deg'), { sigfigs: 4 })).toBe('30{}^{\\circ}');
    expect(valueTex({ a: 1 }, { sigfigs: 4 })).toBeNull();
  });

  // Utilizations are printed rounded up to 0.01 so that a printed 1.00 never hides a ratio above one.
  it.each([
    [0.713, '0.72'],
    [0.95, '0.95'],
    [0.9501, '0.96'],
    [1.0004, '1.01'],
    [1, '1.00'],
    [0.1 + 0.2, '0.30'], // float noise does not push a ratio up a step
    [0, '0.00'],
  ])('utilizationText(%s) is %s', (x, expected) => {
    expect(utilizationText(x)).toBe(expected);
  });
});
