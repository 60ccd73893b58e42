/**
 * The shape check every expression passes before it is compiled: what a
 * document may write, decided on the parse tree, whatever the values turn
 * out to be. It walks the tree with a list, never recursion, so a chain of
 * 30,000 factors is refused rather than overflowing the stack.
 */
import type { MathNode } from 'mathjs';
import { LIMITS } from './limits.js';
import { NOT_FOR_DOCUMENTS } from './names.js';

type AnyNode = MathNode & {
  fn?: MathNode | string; name?: string; value?: unknown; dimensions?: MathNode[]; properties?: Record<string, MathNode>;
};

/**
 * Property names no value of a document has: the ones every JavaScript object inherits
 * (`constructor`, `__proto__`, `toString` …), `prototype`, and `__` internals. mathjs refuses
 * them again when it evaluates, and reads properties of plain records and lists only.
 */
export function isHiddenProperty(name: string): boolean {
  return name.startsWith('__') || name === 'prototype' || name in Object.prototype;
}

function refusalOf(node: AnyNode): string | null {
  switch (node.type) {
    case 'FunctionAssignmentNode':
      return 'a calc document cannot define functions (here one is defined inside an expression)';
    case 'AssignmentNode':
      return 'an assignment can only start a line ("H = …"); one inside an expression is not available';
    case 'BlockNode':
      return 'one statement per line: split the line at ";"';
    case 'FunctionNode':
      if ((node.fn as AnyNode).type !== 'SymbolNode') {
        return 'calling a method of a value, or a function computed by the expression, is not available in a calc document';
      }
      return null;
    case 'IndexNode':
      for (const d of node.dimensions ?? []) {
        const c = d as AnyNode;
        if (c.type === 'ConstantNode' && typeof c.value === 'string' && isHiddenProperty(c.value)) {
          return `a calc document has no access to property "${c.value}"`;
        }
      }
      return null;
    case 'ObjectNode':
      // `{__proto__: …}` does not make a field: mathjs's parser sets the prototype of its own table.
      if (node.properties && Object.getPrototypeOf(node.properties) !== Object.prototype) return 'a record cannot have a field called "__proto__"';
      for (const key of Object.keys(node.properties ?? {})) {
        if (isHiddenProperty(key)) return `a record cannot have a field called "${key}"`;
      }
      return null;
    default:
      return null;
  }
}

export interface GateOptions {
  /**
   * Is this name a value of the document (so a refused library name is shadowed by it)?
   * Leave out to leave names to the graph builder, which knows the document's names.
   */
  isDocumentName?: (name: string) => boolean;
}

/** Why an expression may not be evaluated: a refused construct or name, or a size limit. */
export interface Refusal {
  message: string;
  ruleId: 'sandbox/refused' | 'sandbox/limit';
}

interface Inspection {
  refusal: Refusal | null;
  /** Refused library names the expression reads or calls (allowed only when the document defines them). */
  refusedNames: string[];
}

const inspections = new WeakMap<MathNode, Inspection>();

function inspect(root: MathNode): Inspection {
  const known = inspections.get(root);
  if (known) return known;
  const stack: Array<[AnyNode, number]> = [[root as AnyNode, 1]];
  const refusedNames = new Set<string>();
  let count = 0;
  let refusal: Refusal | null = null;
  while (stack.length > 0 && !refusal) {
    const [node, depth] = stack.pop()!;
    if (++count > LIMITS.treeNodes) {
      refusal = { ruleId: 'sandbox/limit', message: `this expression has more than ${LIMITS.treeNodes.toLocaleString('en-US')} parts; split it into named steps` };
    } else if (depth > LIMITS.treeDepth) {
      refusal = { ruleId: 'sandbox/limit', message: `this expression nests more than ${LIMITS.treeDepth} levels deep; split it into named steps` };
    } else {
      const message = refusalOf(node);
      if (message) refusal = { ruleId: 'sandbox/refused', message };
      if (node.type === 'SymbolNode' && NOT_FOR_DOCUMENTS.has(node.name!)) refusedNames.add(node.name!);
      node.forEach((child) => { stack.push([child as AnyNode, depth + 1]); });
    }
  }
  const found = { refusal, refusedNames: [...refusedNames] };
  inspections.set(root, found);
  return found;
}

/**
 * Why an expression may not be evaluated, or null when it may. Walks the tree once per node
 * object (the answer is kept), with a list rather than recursion.
 * @param root the value of a statement (after its `name =`), a range bound, an override, a case value
 * @example checkExpression(parseExpression('P.fill(10 kN)'), {isDocumentName: () => false})
 *   // {ruleId: 'sandbox/refused', message: 'calling a method of a value … is not available in a calc document'}
 */
export function checkExpression(root: MathNode, options: GateOptions = {}): Refusal | null {
  const { refusal, refusedNames } = inspect(root);
  if (refusal) return refusal;
  const isDocumentName = options.isDocumentName;
  if (!isDocumentName) return null;
  const name = refusedNames.find((n) => !isDocumentName(n));
  return name ? { ruleId: 'sandbox/refused', message: `"${name}" is not available in a calc document` } : null;
}
