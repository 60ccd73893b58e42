import { describe, it, expect } from 'vitest';
import { fence, sessionOf, settle } from '../helpers/settle.js';

const DOC = fence('given', 'L = 6 m', 'w = 10 kN/m', 'f = 1.5 m') +
  fence('calc', 'W = w * L to kN', 'H = w * L^2 / (8 * f) to kN', 'V = W / 2', 'Lf = L / f');

describe('bindGraph — reactive recompute', () => {
  it('evaluates every cell once on start', async () => {
    const s = sessionOf(DOC);
    await s.settle();
    expect(Object.fromEntries(s.evaluations)).toEqual({ L: 1, w: 1, f: 1, W: 1, H: 1, V: 1, Lf: 1 });
  });

  it('setInput(name, text) recomputes exactly the dependents of that input', async () => {
    const s = sessionOf(DOC);
    await s.settle();
    s.evaluations.clear();
    expect(s.setInput('w', '12 kN/m')).toBeNull();
    await s.settle();
    // w feeds W, H and (through W) V; L, f and Lf are untouched.
    expect(Object.fromEntries(s.evaluations)).toEqual({ w: 1, W: 1, H: 1, V: 1 });
    const H = (await settle(s, 'H')) as { value: { toNumber(u: string): number } };
    expect(H.value.toNumber('kN')).toBeCloseTo(12 * 36 / 12, 10);
  });

  it('resetInput puts the document value back', async () => {
    const s = sessionOf(DOC);
    s.setInput('L', '8 m');
    await s.settle();
    s.resetInput('L');
    const W = (await settle(s, 'W')) as { value: { toNumber(u: string): number } };
    expect(W.value.toNumber('kN')).toBeCloseTo(60, 10);
    expect(s.graph.byId.get('L')!.overridden).toBe(false);
  });

  it('setInput refuses names that are not given inputs, and unreadable text', () => {
    const s = sessionOf(DOC);
    expect(s.setInput('H', '3 kN')).toMatchObject({ ruleId: 'set/unknown-input' });
    expect(s.setInput('L', '6 m +')).toMatchObject({ ruleId: 'set/syntax' });
    expect(s.setInput('L', 'f * 2')).toMatchObject({ ruleId: 'set/syntax' });
  });

  it('a failure that is fixed by an edit unblocks the dependents', async () => {
    const s = sessionOf(fence('given', 'a = 2 m', 'b = 3 kN') + fence('calc', 'c = a + b', 'd = c * 2'));
    expect(await settle(s, 'd')).toEqual({ blockedBy: 'c' });
    s.setInput('b', '3 m');
    const d = (await settle(s, 'd')) as { value: { toNumber(u: string): number } };
    expect(d.value.toNumber('m')).toBeCloseTo(10, 12);
  });
});
