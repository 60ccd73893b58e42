/**
 * The one place where a case value meets the sandbox's refusals. Cells are refused the same
 * names in engine/graph/build.ts; when those move into a sandbox module of their own, only this
 * function is re-pointed.
 */
import type { MathNode } from 'mathjs';
import { DISABLED_FUNCTIONS, WITHHELD_NAMES } from '../../cells/math.js';
import { collectSymbols } from '../graph/symbols.js';

const REFUSED = new Set<string>([...DISABLED_FUNCTIONS, ...WITHHELD_NAMES]);

/**
 * The first name in an expression that a calc document may not use, or null.
 * @example refusedName(parseExpression('evaluate("1")')) // 'evaluate'
 */
export function refusedName(node: MathNode): string | null {
  return collectSymbols(node).find((u) => REFUSED.has(u.name))?.name ?? null;
}
