import type { Diagnostic } from '../diagnostic.js';

/**
 * Thrown inside a runtime variable when its cell fails. The runtime hands the
 * same object to every dependent, which is how a dependent knows it is blocked
 * by another cell rather than failing itself.
 */
export class CellFailure extends Error {
  override name = 'CellFailure';
  constructor(readonly cellId: string, readonly diagnostic: Diagnostic) {
    super(diagnostic.message);
  }
}
