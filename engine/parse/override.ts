/**
 * readOverride: the text a reviewer puts in place of a `given` input (`--set`, or an
 * edit in the live sheet), checked the same way wherever it comes from.
 */
import type { MathNode } from 'mathjs';
import { parseUntrusted, checkExpression } from '../sandbox/index.js';
import { collectSymbols } from '../graph/symbols.js';
import type { Cell } from '../types.js';
import type { RuleId } from '../diagnostic.js';

export type OverrideReading =
  | { ok: true; node: MathNode; cell: Cell }
  | { ok: false; message: string; ruleId: Extract<RuleId, 'set/unknown-input' | 'set/syntax' | 'sandbox/refused' | 'sandbox/limit'> };

/**
 * Parses an override and refuses what cannot stand in for an input.
 * @param cell the cell named by the override (undefined when no cell has that name)
 * @param isCellName whether a name is defined by the document (an override must be a value, not a formula over other cells)
 * @example readOverride(cellL, 'L', '7.2 m', (n) => names.has(n)) // {ok: true, node, cell}
 */
export function readOverride(cell: Cell | undefined, name: string, text: string, isCellName: (n: string) => boolean): OverrideReading {
  if (!cell || cell.kind !== 'given') return { ok: false, ruleId: 'set/unknown-input', message: `"${name}" is not a given input of this document` };
  let node: MathNode;
  try {
    node = parseUntrusted(text);
  } catch (e) {
    return { ok: false, ruleId: 'set/syntax', message: `cannot read the value "${text}": ${(e as Error).message}` };
  }
  // The same sandbox as a cell; an override can use no name of the document.
  const refusal = checkExpression(node, { isDocumentName: () => false });
  if (refusal) return { ok: false, ruleId: refusal.ruleId, message: `the value "${text}": ${refusal.message}` };
  const ref = collectSymbols(node).find((u) => u.role !== 'unit' && isCellName(u.name));
  if (ref) return { ok: false, ruleId: 'set/syntax', message: `an input value must not refer to other cells (${ref.name}); give a value such as 7.2 m` };
  return { ok: true, node, cell };
}
