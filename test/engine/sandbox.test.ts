import { describe, it, expect } from 'vitest';
import { evaluateDocument } from '../../engine/index.js';
import { DISABLED_FUNCTIONS, WITHHELD_NAMES } from '../../cells/math.js';
import { fence } from '../helpers/settle.js';

async function diagnosticsOf(expr: string) {
  const { summary } = await evaluateDocument(fence('calc', `x = ${expr}`));
  return summary;
}

// The functions mathjs's own security documentation advises disabling when evaluating untrusted text.
describe('sandbox — a document cannot run code', () => {
  for (const name of [...DISABLED_FUNCTIONS, ...WITHHELD_NAMES]) {
    it(`refuses ${name}(…) with a located diagnostic`, async () => {
      const s = await diagnosticsOf(`${name}("1 + 1")`);
      expect(s.values.x!.value).toBeNull();
      expect(s.diagnostics).toEqual([expect.objectContaining({ severity: 'error', ruleId: 'sandbox/refused', line: 2, cellId: 'x' })]);
    });
  }

  const reaches = [
    '{}.constructor',
    '"".constructor',
    '"".constructor("return 1")',
    '{a: 1}["constructor"]',
    '[1, 2].constructor',
    'sin.constructor("return process")()',
    '{}.__proto__',
    '{a: 1}.toString',
  ];
  for (const expr of reaches) {
    it(`refuses ${expr}`, async () => {
      const s = await diagnosticsOf(expr);
      expect(s.values.x!.value).toBeNull();
      const d = s.diagnostics.find((x) => x.severity === 'error');
      expect(d, `no error for ${expr}`).toBeDefined();
      expect(d!.line).toBe(2);
    });
  }

  it('still evaluates ordinary functions after the sandbox is set up', async () => {
    const s = await diagnosticsOf('sqrt(16) + max(1, 2) + sin(pi / 2)');
    expect(s.values.x!.value).toBeCloseTo(7, 12);
  });
});
