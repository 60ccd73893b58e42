/**
 * Sources: none needed — these tests check the SVG plumbing (escaping, finite numbers, frames, scale
 * bars), not engineering values. The engineering shown in figures is checked in figures.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { el, esc, num, pathData, svgDocument } from '../../../cells/figures/svg.js';
import { boundsOf, fitFrame, niceStep } from '../../../cells/figures/frame.js';
import { isFigure, markFigure } from '../../../cells/figures/registry.js';
import { dimension, factLines, label, scaleBar } from '../../../cells/figures/marks.js';
import { placeLabels, wrapLines } from '../../../cells/figures/labels.js';
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

describe('labels and facts', () => {
  const attr = (svg: string, content: string, name: string) => Number(new RegExp(`<text[^>]*\\s${name}="([^"]*)"[^>]*>${content}<`).exec(svg)![1]);

  it('factLines(facts) wraps each fact to its room at the least print size and gives the next baseline', () => {
    const { body, y } = factLines([['least thrust 9.92 kN (under its own weight)', { fill: '#000' }], ['weight 24.9 kN', { fill: '#000' }]], { x: 116, y: 29 }, 52);
    // 43 characters at 2.9 mm × 0.55 are 69 mm: two lines in 52 mm; the second fact one line.
    expect(body.match(/<text /g)!.length).toBe(3);
    expect(body.match(/font-size="2.9"/g)!.length).toBe(3);
    expect(y).toBeCloseTo(29 + 3 * 3.6 + 2 * 1.2, 9);
  });

  it('wrapLines(text) never parts a number from its unit, so each quantity stays one text (figure-units converts it whole)', () => {
    const fact = 'least-thrust state: wall 6.01 kN, pier 18.9 kN vertical';
    // The room of flyer_figure's facts, 52 mm: 29 characters at 2.9 mm × 0.55 fit it, so without the rule
    // "least-thrust state: wall 6.01" would be a line and "kN," begin the next.
    const lines = wrapLines(fact, 52, 2.9);
    expect(lines.join(' ')).toBe(fact);
    expect(lines.filter((l) => /\d$/.test(l))).toEqual([]);
    expect(lines[1]).toMatch(/^6\.01 kN,/);
  });

  it('placeLabels steps a dimension label off its line when the arrowheads of a short dimension reach into it, keeping it centred', () => {
    // A 20 mm dimension with a label about 19 mm wide: its arrowheads (2.2 mm long, 0.6 mm either side of the line) reach the label.
    const svg = svgDocument(100, 30, 'short dimension', dimension({ x: 40, y: 10 }, { x: 60, y: 10 }, -4, 'clear 4.20 m'));
    expect(attr(svg, 'clear 4.20 m', 'x')).toBe(50);
    expect(attr(svg, 'clear 4.20 m', 'y')).toBeCloseTo(10 + 4 + 2 + 0.6, 9);
  });

  it('placeLabels puts a label over a pale grid line rather than over a drawn line', () => {
    // A drawn line through the label where it is written; grid lines every millimetre everywhere else.
    const grid = Array.from({ length: 31 }, (_, i) => i).filter((y) => y !== 19).map((y) => `<line x1="0" y1="${y}" x2="100" y2="${y}"/>`).join('');
    const body = `<g class="vb-grid" stroke="#d9dee3">${grid}</g><line x1="0" y1="19" x2="100" y2="19" stroke="#000"/>${label(50, 20, 'abc')}`;
    const y = attr(placeLabels(body, 100, 30), 'abc', 'y');
    // The glyphs sit from 0.75 em above the baseline to 0.2 em below (labels.ts): clear of y = 19 either way.
    expect(y - 0.75 * 2.9 > 19 || y + 0.2 * 2.9 < 19 ? 'clear of the drawn line' : `on it at y = ${y}`).toBe('clear of the drawn line');
  });
});
