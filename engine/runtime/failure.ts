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

/**
 * Thrown when a cell cannot be computed although nothing in it is wrong: it reads a field that is
 * not available in the state the kernel found. The cell is blocked by the cell holding the record,
 * with the reason in full; it is not an error of the document.
 */
export class NotComputed extends Error {
  override name = 'NotComputed';
  constructor(readonly cellId: string, readonly by: string, readonly note: string) {
    super(note);
  }
}
