import { compile, startSession, type Session } from '../../engine/index.js';
import type { CellState } from '../../engine/types.js';

/** Settles a session and gives one cell's outcome as {value} or {error} or {blockedBy}. */
export async function settle(session: Session, cellId: string): Promise<{ value: unknown } | { error: string; ruleId: string } | { blockedBy: string } | { pending: true }> {
  const states = await session.settle();
  return outcome(states.get(cellId));
}

export function outcome(state: CellState | undefined) {
  if (!state || state.status === 'pending') return { pending: true as const };
  if (state.status === 'ok') return { value: state.value };
  if (state.status === 'blocked') return { blockedBy: state.by };
  return { error: state.diagnostic.message, ruleId: state.diagnostic.ruleId };
}

/** A session on a document given as text. */
export function sessionOf(text: string, file = 'test.md'): Session {
  return startSession(compile(text, { file }));
}

/** Wraps cell lines in a fence. */
export function fence(kind: string, ...lines: string[]): string {
  return ['```' + kind, ...lines, '```', ''].join('\n');
}
