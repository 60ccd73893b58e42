/**
 * A given input is shown with every digit it was written with, whatever the sheet's significant figures:
 * a reviewer redoing the sums from the inputs table must have the numbers the calc used.
 * The beam: M = p·q·L²/8 for a simply supported span under a uniform load (any statics text,
 * e.g. Gere & Timoshenko, Mechanics of Materials, App. G); the numbers below are worked by hand.
 */
import { describe, expect, it } from 'vitest';
import { parse } from 'node-html-parser';
import { writtenSigfigs, formatValue } from '../../../engine/values/format.js';
import { evaluateDocument } from '../../../engine/index.js';
import { math } from '../../../cells/math.js';
import { renderText } from '../render/helpers.js';
import { fence } from '../../helpers/settle.js';

const BEAM = [
  '---', 'title: written digits (fictional)', 'sigfigs: 3', '---', '',
  fence('given', 'p = 1.0004  # a factor written with five figures', 'L = 5.4 m  # span', 'q = 12.345 kN/m  # line load', 'r = 10/3 m  # a third of ten metres'),
  fence('calc', 'M = p * q * L^2 / 8 to kN m'),
  fence('check', 'c = M <= 45 kN m  # bending'),
].join('\n');

describe('writtenSigfigs', () => {
  it('writtenSigfigs gives the figures a number was written with, never fewer than asked, and keeps the figures asked for a computed number', () => {
    expect(writtenSigfigs(1.0004, 3)).toBe(5);
    expect(writtenSigfigs(12.345, 3)).toBe(5);
    expect(writtenSigfigs(5.4, 3)).toBe(3);
    expect(writtenSigfigs(10 / 3, 3)).toBe(3);
    // 12.345 in stored in metres and read back in inches is 12.344999999999999: still written with five figures.
    expect(writtenSigfigs(math.unit(12.345, 'inch').toNumber('inch'), 3)).toBe(5);
  });
  it('formatValue({written}) shows the written digits in the document\'s unit, and rounds as before without it', () => {
    expect(formatValue(math.unit(1.2345, 'm'), { sigfigs: 3, written: true })).toBe('1.2345 m');
    expect(formatValue(math.unit(1.2345, 'm'), { sigfigs: 3 })).toBe('1.23 m');
  });
});

describe('a given input on the sheet and in the JSON', () => {
  it('renderSheet shows p = 1.0004 and q = 12.345 kN/m in full in the inputs table and the substituted working at 3 figures', async () => {
    // Hand check: M = 1.0004 · 12.345 · 5.4² / 8 = 45.016 kN m > 45 kN m, so the check fails; the inputs rounded
    // to 3 figures (1 · 12.3 · 5.4² / 8 = 44.83 kN m) would let a reviewer believe it holds.
    const r = await renderText(BEAM);
    const root = parse(r.html);
    const shown = (name: string) => root.querySelector(`[data-input="${name}"]`)!.text.replace(/\s+/g, ' ');
    expect([shown('p'), shown('q'), shown('L'), shown('r')]).toEqual(['1.0004', '12.345 kN/m', '5.4 m', '3.33 m']);
    const tex = [...r.html.matchAll(/<annotation encoding="application\/x-tex">(.*?)<\/annotation>/g)].map((m) => m[1]!);
    expect(tex).toContain('\\displaystyle = \\frac{1.0004 \\cdot 12.345\\,\\mathrm{kN}/\\mathrm{m} \\cdot {(5.4\\,\\mathrm{m})}^{2}}{8}');
    // A computed result keeps the sheet's 3 figures.
    expect(tex).toContain('M = 45\\,\\mathrm{kN}{\\cdot}\\mathrm{m}');
  });
  it('evaluateDocument gives a given input\'s text with its written digits, a result\'s at the sheet\'s figures', async () => {
    const { summary } = await evaluateDocument(BEAM, { file: 'beam.md' });
    expect([summary.values.p!.text, summary.values.q!.text, summary.values.r!.text, summary.values.M!.text]).toEqual(['1.0004', '12.345 kN/m', '3.33 m', '45 kN m']);
    expect(summary.checks[0]!.pass).toBe(false);
  });
});
