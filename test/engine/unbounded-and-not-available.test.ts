/**
 * Infinity and "not available" as values: a ring that never collapses has load_factor = ∞, which
 * min() and checks take as the number it is; a field that does not exist (the thrust of a ring that
 * holds no line of thrust) stops what uses it, with the reason — in the states, the JSON and the sheet.
 * The rings are invented for the test. That a parabola is the funicular of a uniform plan load (so a
 * multiple of that load never forms a mechanism) is any statics text; that a 0.1 m semicircle of 6 m
 * span holds no line of thrust follows from t/R ≈ 0.107 for the least thickness of a semicircle
 * (Milankovitch 1907, from memory; the kernel's own test checks the value).
 */
import { describe, it, expect } from 'vitest';
import { evaluateDocument } from '../../engine/index.js';
import { fence } from '../helpers/settle.js';
import { renderText } from './render/helpers.js';

const DOC = fence('given', 'gamma = 20 kN/m^3', 'lambda_req = 2')
  + fence('calc',
    'r = arch_ring({shape: "parabolic", span: 8 m, rise: 2 m, thickness: 0.4 m, unit_weight: gamma})',
    'a = arch_limit(r, {live: 1000 kN/m^2})',
    'lam = a.load_factor',
    'lam_1 = min(lam, 3)',
    'lam_2 = min(lam, Infinity)',
    'thin = arch_ring({shape: "circular", span: 6 m, rise: 3 m, thickness: 0.1 m, unit_weight: gamma})',
    'b = arch_limit(thin)',
    'H = b.H_min to kN',
    'H_2 = H * 2',
    'flat = arch_limit(arch_ring({shape: "circular", span: 10 m, rise: 0.3 m, thickness: 0.5 m, unit_weight: gamma}))',
    'H_top = flat.H_max',
    'nothing = 1 m / 0')
  + fence('check', 'c_lam = lam >= lambda_req', 'c_H = b.H_min <= 40 kN');

describe('Infinity is a value; "not available" blocks with its reason', async () => {
  const { summary, states } = await evaluateDocument(DOC, { file: 'calc.md' });

  it('a load factor of ∞ passes through min() and a check holds with utilization 0', () => {
    expect(summary.values.lam).toMatchObject({ value: null, infinite: true, text: '∞' });
    expect(summary.values.lam_1).toMatchObject({ value: 3 });
    expect(summary.values.lam_2).toMatchObject({ infinite: true });
    expect(summary.checks.find((c) => c.name === 'c_lam')).toMatchObject({ pass: true, utilization: 0 });
  });

  it('an unbounded H_max keeps its unit: "value": null, "infinite": true, text "∞ kN"', () => {
    expect(summary.values.H_top).toMatchObject({ value: null, unit: 'kN', text: '∞ kN', infinite: true });
  });

  it('∞ made by the cell itself (a division by zero) is still an error', () => {
    expect(summary.diagnostics.map((d) => [d.cellId, d.ruleId])).toEqual([['nothing', 'value/non-finite']]);
  });

  it('a field that is not available is "value": null with its reason inside the record', () => {
    const fields = summary.values.b!.value as Record<string, { value: unknown; reason?: string; text: string }>;
    expect(fields.H_min).toEqual({
      value: null, unit: null, reason: 'the ring holds no line of thrust (gsf 0.31 < 1)',
      text: 'not available — the ring holds no line of thrust (gsf 0.31 < 1)',
    });
  });

  it('using it blocks the cell and what follows, with the reason, and is no error of the document', () => {
    const note = 'not computed: b.H_min is not available — the ring holds no line of thrust (gsf 0.31 < 1)';
    expect(states.get('H')).toEqual({ status: 'blocked', by: 'b', note });
    expect(states.get('H_2')).toEqual({ status: 'blocked', by: 'b', note });
    expect(summary.values.H).toMatchObject({ value: null, text: note, blocked_by: 'b', reason: note });
    expect(summary.checks.find((c) => c.name === 'c_H')).toMatchObject({ pass: null, utilization: null, blocked_by: 'b', reason: note });
  });

  it('a field read through a call is stopped the same way', async () => {
    const text = fence('calc', 'thin = arch_ring({shape: "circular", span: 6 m, rise: 3 m, thickness: 0.1 m, unit_weight: 20 kN/m^3})', 'H = arch_limit(thin).H_min * 2');
    const { states: s } = await evaluateDocument(text);
    expect(s.get('H')).toEqual({ status: 'blocked', by: 'thin', note: 'not computed: arch_limit(thin).H_min is not available — the ring holds no line of thrust (gsf 0.31 < 1)' });
  });

  it('the sheet prints ∞ and "not available — reason" in place', async () => {
    const { html } = await renderText(DOC);
    expect(html).toContain('not computed: b.H_min is not available — the ring holds no line of thrust (gsf 0.31 &lt; 1)');
    expect(html).toMatch(/∞(&nbsp;|\u00a0)?<span class="vb-unit">kN<\/span>/);
    // The table of fields used from b shows the field itself as not available, with the reason.
    expect(html).toContain('vb-num">not available — the ring holds no line of thrust (gsf 0.31 &lt; 1)');
  });
});
