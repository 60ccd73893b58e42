/**
 * The server's second line of defence for a write: every new value must evaluate
 * on its own and have the dimension of the document's value for that input
 * (the page refuses such values first; this refuses them from any other client).
 */
import type { MathNode } from 'mathjs';
import { compile } from '../../engine/index.js';
import { checkExpression, evaluateNode } from '../../engine/sandbox/index.js';
import { readInputValue } from '../../engine/values/input-value.js';

/** The document's own value of a given input, evaluated on its own; undefined when it does not evaluate so. */
function documentValueOf(node: MathNode): unknown {
  // Through the same sandbox as every cell (engine/sandbox).
  if (checkExpression(node, { isDocumentName: () => false })) return undefined;
  try {
    return evaluateNode(node, new Map());
  } catch {
    return undefined;
  }
}

/**
 * Why these values cannot be written, or null when each has its input's dimension.
 * Names that are not given inputs are left to the rewrite, which says why.
 * @example wrongDimension(source, {t: '3 kN'}) // 't is a length (m); "3 kN" is a force (N). Not applied.'
 */
export function wrongDimension(source: string, values: Record<string, string>): string | null {
  const doc = compile(source);
  for (const [name, text] of Object.entries(values)) {
    const cell = doc.graph.byId.get(name);
    if (!cell || cell.kind !== 'given') continue;
    const reading = readInputValue(name, text, documentValueOf(cell.node));
    if (!reading.ok) return `${reading.message.replace(/ Not applied\.$/, '')} Nothing was written.`;
    // A bare number would be written without the unit the document gives it.
    if (reading.text !== text.trim()) return `${name}: "${text.trim()}" has no unit; write it as "${reading.text}". Nothing was written.`;
  }
  return null;
}
