/**
 * setDimensionProblem: a `--set` value must have the dimension of the document's value for that
 * input, the same rule the live page and the server apply to an edit (engine/values/input-value.ts):
 * `--set "R=5 m"` for a force is refused instead of failing later on the lines that use R.
 */
import type { Cell } from '../types.js';
import { readInputValue } from '../values/input-value.js';
import { evaluateNode } from '../sandbox/index.js';

/** The document's own value of a given input, evaluated on its own; undefined when it does not evaluate so. */
function writtenValue(cell: Cell): unknown {
  try {
    // Through the sandbox like every expression: the written value of a stranger's calc is untrusted too.
    return evaluateNode(cell.node);
  } catch {
    return undefined;
  }
}

/**
 * Why `text` cannot stand in for the given input `cell` (call before the override replaces its node), or null.
 * @example setDimensionProblem(cellR, '5 m') // 'R is a force (kN); "5 m" is a length (m)'
 */
export function setDimensionProblem(cell: Cell, text: string): string | null {
  const name = cell.name ?? cell.id;
  const written = writtenValue(cell);
  const reading = readInputValue(name, text, written);
  if (!reading.ok) return reading.message.replace(/\.?\s*Not applied\.$/, '');
  // A bare number for a quantity: the live page adds the document's unit; on the command line, say so.
  if (reading.text !== text.trim()) return `"${text.trim()}" has no unit, and ${name} is written in ${reading.text.slice(text.trim().length).trim()}; write "${reading.text}"`;
  return null;
}
