/**
 * The one place where a case value meets the sandbox (engine/sandbox): the same refusals as every
 * cell, range bound, override and live edit.
 */
import type { MathNode } from 'mathjs';
import { checkExpression, type Refusal } from '../sandbox/index.js';

/**
 * Why a case value may not be evaluated (a refused name or construct, or a size limit), or null.
 * @param isDocumentName names the document defines (they shadow refused library names)
 * @example refusalOf(parseExpression('evaluate("1")'), () => false) // {ruleId: 'sandbox/refused', …}
 */
export function refusalOf(node: MathNode, isDocumentName: (name: string) => boolean): Refusal | null {
  return checkExpression(node, { isDocumentName });
}
