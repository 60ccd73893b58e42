/**
 * Adapts the runtime's pending/fulfilled/rejected callbacks into CellStates.
 */
import type { Observer } from '@observablehq/runtime';
import type { CellState } from '../types.js';
import { CellFailure, NotComputed } from './failure.js';

/**
 * An observer for one cell that reports every change of state.
 * @param cellId the cell observed
 * @param report called with each new state
 */
export function observeCell(cellId: string, report: (id: string, state: CellState) => void, stateOf: (id: string) => CellState | undefined): Observer {
  return {
    pending: () => report(cellId, { status: 'pending' }),
    fulfilled: (value) => report(cellId, { status: 'ok', value }),
    rejected: (error) => {
      if (error instanceof NotComputed) {
        report(cellId, { status: 'blocked', by: error.by, note: error.note });
      } else if (error instanceof CellFailure) {
        report(cellId, error.cellId === cellId ? { status: 'error', diagnostic: error.diagnostic } : { status: 'blocked', by: error.cellId });
      } else if (error instanceof Error && typeof (error as { input?: unknown }).input === 'string') {
        // The runtime re-wraps an input's failure as RuntimeError(message, inputName);
        // follow that input back to the cell where the failure started.
        const input = (error as unknown as { input: string }).input;
        const upstream = stateOf(input);
        report(cellId, upstream?.status === 'blocked' ? { status: 'blocked', by: upstream.by, ...(upstream.note ? { note: upstream.note } : {}) }
          : upstream?.status === 'error' && upstream.diagnostic.ruleId === 'graph/duplicate'
            ? { status: 'blocked', by: input, note: `not computed because ${upstream.diagnostic.message}` }
            : { status: 'blocked', by: input });
      } else {
        // Only the runtime itself throws anything else; keep it visible rather than lose it.
        const message = error instanceof Error ? error.message : String(error);
        report(cellId, {
          status: 'error',
          diagnostic: { message, file: '', line: 1, column: 1, endLine: 1, endColumn: 1, cellId, ruleId: 'eval/error', severity: 'error' },
        });
      }
    },
  };
}
