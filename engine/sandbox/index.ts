/**
 * The one way into evaluation. Every expression the engine evaluates — a cell,
 * the `[lo, hi]` bounds of a given, a `--set` override, a live edit, a load case
 * value — is parsed by parseUntrusted, passed by checkExpression, compiled against
 * the document namespace and evaluated within the budgets; its value comes back
 * frozen. See README "Security model".
 */
import type { MathNode } from 'mathjs';
import { math, parseExpression, SandboxError } from '../../cells/math.js';
import { oddQuantity } from './size.js';
import { LIMITS } from './limits.js';
import { checkExpression, type GateOptions } from './gate.js';
import { compileNode, type Scope } from './namespace.js';
import { LimitError, checkValueSize } from './guards.js';
import { withinCellBudget } from './budget.js';
import { freezeValue } from './freeze.js';

export { LIMITS } from './limits.js';
export { checkExpression, isHiddenProperty, type GateOptions, type Refusal } from './gate.js';
export { LimitError } from './guards.js';

/** An expression gave a quantity whose value is not a real number (sqrt of a negative quantity). */
export class ComplexValueError extends TypeError {
  override name = 'ComplexValueError';
}
export { SandboxError } from '../../cells/math.js';
export { NOT_FOR_DOCUMENTS } from './names.js';
export { isDocumentFunction, documentNamespace } from './namespace.js';
export { chargeDocument, resetDocumentBudget } from './budget.js';
export { freezeValue } from './freeze.js';

/** Deepest bracket nesting of a text, quotes skipped. */
function bracketDepth(text: string): number {
  let depth = 0, max = 0;
  let quote: string | null = null;
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (quote) {
      if (c === '\\') i++;
      else if (c === quote) quote = null;
    } else if (c === '"' || c === "'") quote = c;
    else if (c === '(' || c === '[' || c === '{') max = Math.max(max, ++depth);
    else if (c === ')' || c === ']' || c === '}') depth = Math.max(0, depth - 1);
  }
  return max;
}

/**
 * Parses an expression a document (or a reviewer) wrote. Throws mathjs's SyntaxError for
 * bad syntax, and a LimitError for nesting the parser cannot take — never a stack overflow.
 * @example parseUntrusted('6.4 m') // a MathNode
 */
export function parseUntrusted(text: string): MathNode {
  if (bracketDepth(text) > LIMITS.bracketDepth) {
    throw new LimitError(`brackets nest more than ${LIMITS.bracketDepth} deep; split the expression into named steps`);
  }
  try {
    return parseExpression(text);
  } catch (e) {
    if (e instanceof RangeError && /call stack/i.test(e.message)) {
      throw new LimitError('this expression nests too deeply to read; split it into named steps');
    }
    throw e;
  }
}

/**
 * Checks and evaluates a node within the per-cell budget; the value comes back frozen.
 * Throws a SandboxError or LimitError when the gate refuses it, else what the expression throws.
 * @param node any parsed expression (the gate's answer is kept per node)
 * @param scope the values of the names it uses; a refused library name is allowed only as one of these
 */
export function evaluateNode(node: MathNode, scope: Map<string, unknown> = new Map()): unknown {
  const refusal = checkExpression(node, { isDocumentName: (n) => scope.has(n) });
  if (refusal) throw refusal.ruleId === 'sandbox/limit' ? new LimitError(refusal.message) : new SandboxError(refusal.message);
  const value = withinCellBudget(() => compileNode(node)(scope as Scope, {}, null));
  checkValueSize(value, 'this line');
  const odd = oddQuantity(value);
  if (odd) throw new ComplexValueError('this gives a complex number (a square root, power or logarithm of a negative value); a calc works with real quantities');
  return freezeValue(value);
}

export type Untrusted = { ok: true; node: MathNode; value: unknown } | { ok: false; message: string; stage: 'parse' | 'refused' | 'evaluate' };

/**
 * Parses, checks and evaluates a text on its own, for values given outside a cell
 * (a load case, a live edit). Never throws on bad text.
 * @param scope values the text may use; any other name of the document is not there
 * @example evaluateUntrusted('55 kN') // {ok: true, node, value: 55 kN}
 * @example evaluateUntrusted('config({})') // {ok: false, stage: 'refused', message: '"config" is not available …'}
 */
export function evaluateUntrusted(text: string, scope: Map<string, unknown> = new Map(), gate: GateOptions = {}): Untrusted {
  let node: MathNode;
  try {
    node = parseUntrusted(text);
  } catch (e) {
    return { ok: false, stage: 'parse', message: (e as Error).message };
  }
  const refusal = checkExpression(node, { isDocumentName: (n) => scope.has(n), ...gate });
  if (refusal) return { ok: false, stage: 'refused', message: refusal.message };
  try {
    return { ok: true, node, value: evaluateNode(node, scope) };
  } catch (e) {
    return { ok: false, stage: 'evaluate', message: (e as Error).message };
  }
}
