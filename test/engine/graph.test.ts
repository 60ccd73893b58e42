import { describe, it, expect } from 'vitest';
import { compile } from '../../engine/index.js';
import { fence, sessionOf, settle } from '../helpers/settle.js';

describe('buildGraph — dependencies and static problems', () => {
  it('gives the same values whatever order the cells are written in', async () => {
    const a = sessionOf([fence('calc', 'H = w * L^2 / (8 * f)'), fence('given', 'w = 10 kN/m', 'L = 6 m', 'f = 1.5 m')].join('\n'));
    const b = sessionOf([fence('given', 'f = 1.5 m', 'L = 6 m', 'w = 10 kN/m'), fence('calc', 'H = w * L^2 / (8 * f)')].join('\n'));
    const ha = (await settle(a, 'H')) as { value: { toNumber(u: string): number } };
    const hb = (await settle(b, 'H')) as { value: { toNumber(u: string): number } };
    // wL²/8f for a parabolic arch under uniform load (any statics text): 10·36/12 = 30 kN
    expect(ha.value.toNumber('kN')).toBeCloseTo(30, 10);
    expect(hb.value.toNumber('kN')).toBeCloseTo(30, 10);
  });

  it('orders cells so every cell comes after what it uses', () => {
    const doc = compile(fence('calc', 'c = b + 1', 'b = a + 1', 'a = 1'));
    expect(doc.graph.order).toEqual(['a', 'b', 'c']);
  });

  it('names the whole cycle on every cell of it, and blocks what depends on it', async () => {
    const s = sessionOf(fence('calc', 'a = c + 1', 'b = a + 1', 'c = b + 1', 'd = a * 2', 'e = 5'));
    const msgs = s.graph.failed;
    expect([...msgs.keys()].sort()).toEqual(['a', 'b', 'c']);
    expect(msgs.get('a')!.message).toMatch(/circular definition: (a → c → b → a|c → b → a → c|b → a → c → b)/);
    expect(msgs.get('a')!.ruleId).toBe('graph/cycle');
    expect(await settle(s, 'd')).toEqual({ blockedBy: 'a' });
    expect(await settle(s, 'e')).toEqual({ value: 5 });
  });

  it('reports an unknown name with a did-you-mean suggestion and its line', () => {
    const doc = compile(fence('given', 'span = 6 m') + fence('calc', 'H = spn * 2'));
    const d = doc.diagnostics.find((x) => x.ruleId === 'graph/unknown-name')!;
    expect(d.message).toBe('unknown name "spn"; did you mean "span"?');
    expect(d.line).toBe(5);
    expect(d.cellId).toBe('H');
  });

  it('reports an unknown function and an unknown unit', () => {
    const doc = compile(fence('calc', 'a = zzqx(2)', 'b = 3 furlongz', 'c = clampp(1, 0, 2)'));
    expect(doc.diagnostics.map((d) => d.message)).toEqual(['unknown function "zzqx"', 'unknown unit "furlongz"', 'unknown function "clampp"; did you mean "clamp"?']);
  });

  it('refuses a definition that shadows a unit used as a unit elsewhere', () => {
    const doc = compile(fence('given', 'm = 2', 'L = 6 m'));
    const d = doc.diagnostics.find((x) => x.ruleId === 'graph/shadow-unit')!;
    expect(d).toMatchObject({ line: 2, cellId: 'm', severity: 'error' });
    expect(d.message).toMatch(/also a unit, used as one on line 3/);
  });

  it('allows t as a thickness when tonnes are not used as a unit', () => {
    const doc = compile(fence('given', 't = 0.23 m', 'L = 6 m'));
    expect(doc.diagnostics).toEqual([]);
  });

  it('refuses t as a name when the document also writes tonnes', () => {
    const doc = compile(fence('given', 't = 0.23 m', 'load = 2 t'));
    expect(doc.diagnostics.map((d) => d.ruleId)).toEqual(['graph/shadow-unit']);
  });

  it('reports a duplicate definition at the second one', () => {
    const doc = compile(fence('given', 'L = 6 m', 'L = 7 m'));
    expect(doc.diagnostics).toMatchObject([{ ruleId: 'graph/duplicate', line: 3, message: '"L" is defined twice (lines 2 and 3)' }]);
  });

  it('blocks what uses a name defined twice, saying so', async () => {
    const s = sessionOf(fence('given', 'a_w = 3 m', 'a_w = 4 m') + fence('calc', 'q = a_w * 2'));
    await s.settle();
    expect(s.states.get('q')).toEqual({ status: 'blocked', by: 'a_w', note: 'not computed because "a_w" is defined twice (lines 2 and 3)' });
  });

  it('blocks dependents of a failed cell instead of repeating its message', async () => {
    const s = sessionOf(fence('given', 'L = 6 m', 'q = 2 kN/m') + fence('calc', 'bad = L + q', 'worse = bad * 2', 'fine = L * 2'));
    expect(await settle(s, 'bad')).toMatchObject({ ruleId: 'units/mismatch' });
    expect(await settle(s, 'worse')).toEqual({ blockedBy: 'bad' });
    expect(await settle(s, 'fine')).toMatchObject({ value: expect.anything() });
  });
});
