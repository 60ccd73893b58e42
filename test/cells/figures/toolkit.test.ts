/**
 * Sources: none needed — these tests check the SVG plumbing (escaping, finite numbers, frames, scale
 * bars), not engineering values. The engineering shown in figures is checked in figures.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { el, esc, num, pathData, svgDocument } from '../../../cells/figures/svg.js';
import { boundsOf, fitFrame, niceStep } from '../../../cells/figures/frame.js';
import { isFigure, markFigure } from '../../../cells/figures/registry.js';
import { dimension, scaleBar } from '../../../cells/figures/marks.js';
import { expectClose } from '../../helpers/close.js';

describe('SVG toolkit', () => {
  it('num(x) writes two decimals and refuses NaN and infinities', () => {
    expect(num(12.3456)).toBe('12.35');
    expect(num(-0.001)).toBe('0');
    expect(num(3)).toBe('3');
    expect(() => num(NaN)).toThrow(RangeError);
    expect(() => num(Infinity)).toThrow(RangeError);
  });

  it('esc(text) and el(tag, attrs) escape text and refuse names that are not plain identifiers', () => {
    expect(esc('<a href="x">&</a>')).toBe('&lt;a href=&quot;x&quot;&gt;&amp;&lt;/a&gt;');
    expect(el('text', { x: 1, fill: '"><script>' }, esc('<b>'))).toBe('<text x="1" fill="&quot;&gt;&lt;script&gt;">&lt;b&gt;</text>');
    expect(() => el('text', { 'onload=alert(1) x': 1 })).toThrow(TypeError);
    expect(() => el('script x', {})).toThrow(TypeError);
  });

  it('pathData(points) joins points into move and line commands', () => {
    expect(pathData([{ x: 0, y: 0 }, { x: 1.234, y: 2 }], true)).toBe('M0 0L1.23 2Z');
  });

  it('svgDocument sizes the drawing in millimetres with a matching viewBox', () => {
    const svg = svgDocument(170, 90, 'T & <t>', '');
    expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg" viewBox="0 0 170 90" width="170mm" height="90mm"/);
    expect(svg).toContain('<title>T &amp; &lt;t&gt;</title>');
  });

  it.each([[3.7, 5], [0.013, 0.01], [1.4, 1], [2.9, 2], [7.6, 10], [450, 500]])('niceStep(%s) is %s', (x, step) => {
    expectClose(niceStep(x), step, 1e-12);
  });

  it('fitFrame keeps one scale for both axes, y up, centred in the box', () => {
    const f = fitFrame({ xMin: 0, xMax: 10, yMin: 0, yMax: 2 }, { left: 5, top: 5, width: 100, height: 100 });
    expect(f.scale).toBe(10);
    expect(f.at({ x: 0, y: 2 })).toEqual({ x: 5, y: 45 });
    expect(f.at({ x: 10, y: 0 })).toEqual({ x: 105, y: 65 });
    expect(boundsOf([[{ x: 1, y: 2 }, { x: 3, y: -1 }]], 0.5)).toEqual({ xMin: 0.5, xMax: 3.5, yMin: -1.5, yMax: 2.5 });
  });

  it('scaleBar(scale) draws four blocks of a round length and writes the total', () => {
    const bar = scaleBar(10, { x: 0, y: 0 }, 40);
    expect(bar.match(/<rect/g)!.length).toBe(4);
    expect(bar).toContain('>4 m<');
    expect(scaleBar(0.002, { x: 0, y: 0 }, 40, 'kN', 0.001)).toContain('>20 kN<');
  });

  it('dimension(a, b) draws the line with two arrowheads and the label', () => {
    const d = dimension({ x: 0, y: 0 }, { x: 50, y: 0 }, -5, 'span 6.40 m');
    expect(d.match(/<path/g)!.length).toBe(2);
    expect(d).toContain('>span 6.40 m<');
  });
});

describe('figure registry', () => {
  it('markFigure records an SVG and isFigure recognises exactly that string', () => {
    const svg = markFigure(svgDocument(10, 10, 'registry test', ''));
    expect(isFigure(svg)).toBe(true);
    expect(isFigure(`${svg} `)).toBe(false);
    expect(isFigure('<svg onload="alert(1)"></svg>')).toBe(false);
    expect(isFigure({ toString: () => svg })).toBe(false);
  });

  it('markFigure refuses anything that is not an SVG string', () => {
    expect(() => markFigure('<div></div>')).toThrow(TypeError);
  });
});
