/**
 * The per-round time budget of a document, wired end to end. The limit is replaced by one
 * already used up (-1 ms), so the refusal is certain rather than a matter of timing.
 */
import { describe, it, expect, vi } from 'vitest';

vi.mock('../../engine/sandbox/limits.js', async (importOriginal) => {
  const { LIMITS } = await importOriginal<typeof import('../../engine/sandbox/limits.js')>();
  return { LIMITS: { ...LIMITS, documentMs: -1 } };
});

const { compile, startSession } = await import('../../engine/index.js');
const { fence } = await import('../helpers/settle.js');

describe('per-round time budget (mocked as already spent)', () => {
  it('refuses the cells of a round that has used its budget, with a located sandbox/limit error, and again after a live edit', async () => {
    const session = startSession(compile(fence('given', 'L = 6 m'), { file: 'round.md' }));
    for (const round of [0, 1]) {
      if (round === 1) expect(session.setInput('L', '7 m')).toBeNull();
      const state = (await session.settle()).get('L')!;
      expect(state.status === 'error' && [state.diagnostic.ruleId, state.diagnostic.line]).toEqual(['sandbox/limit', 2]);
      expect(state.status === 'error' && state.diagnostic.message).toMatch(/evaluation budget/);
    }
    session.dispose();
  });
});
