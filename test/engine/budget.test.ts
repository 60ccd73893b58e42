/**
 * The per-cell time budget, wired end to end. The limit is replaced by one already used up
 * (-1 ms), so the refusal is certain rather than a matter of timing.
 */
import { describe, it, expect, vi } from 'vitest';

vi.mock('../../engine/sandbox/limits.js', async (importOriginal) => {
  const { LIMITS } = await importOriginal<typeof import('../../engine/sandbox/limits.js')>();
  return { LIMITS: { ...LIMITS, cellMs: -1 } };
});

const { evaluateDocument } = await import('../../engine/index.js');
const { fence } = await import('../helpers/settle.js');

describe('per-cell time budget (mocked as already spent)', () => {
  it('a cell past its budget fails at its next guarded call with a located sandbox/limit error; a cell without one is unaffected', async () => {
    const { summary } = await evaluateDocument(fence('calc', 'a = sum(1:10)', 'b = sqrt(25)'), { file: 'budget.md' });
    expect(summary.diagnostics).toEqual([expect.objectContaining({ ruleId: 'sandbox/limit', line: 2, cellId: 'a' })]);
    expect(summary.diagnostics[0]!.message).toMatch(/ran longer than/);
    expect(summary.values.b!.value).toBe(5);
  });
});
