/**
 * What a parsed expression refers to: names read as values, names called as
 * functions, and names that stand in a unit position (`6 m`, `to kN/m`).
 */
import type { MathNode } from 'mathjs';

export interface SymbolUse {
  name: string;
  role: 'value' | 'call' | 'unit';
  /** Character index in the expression where mathjs saw it, when known. */
}

type AnyNode = MathNode & { fn?: string | MathNode; args?: MathNode[]; implicit?: boolean; name?: string; value?: unknown };

function isNumberLiteral(n: AnyNode): boolean {
  return n.type === 'ConstantNode' && typeof n.value === 'number';
}

/** Symbols forming the unit part of a unit expression: kN, kN/m, m^2, kN m. */
function unitSymbols(n: AnyNode, out: string[]): boolean {
  if (n.type === 'SymbolNode') { out.push(n.name!); return true; }
  if (n.type === 'ParenthesisNode') return unitSymbols((n as unknown as { content: AnyNode }).content, out);
  if (n.type === 'OperatorNode' && n.args) {
    if (n.fn === 'pow') return unitSymbols(n.args[0] as AnyNode, out) && isNumberLiteral(n.args[1] as AnyNode) || isNumberLiteral(n.args[1] as AnyNode);
    if (n.fn === 'multiply' || n.fn === 'divide') return n.args.every((a) => unitSymbols(a as AnyNode, out) || isNumberLiteral(a as AnyNode));
  }
  return false;
}

/**
 * A number written with its unit, `6.4 m` or `18 kN/m^3`: returns the unit symbols,
 * or null when the node is not such a literal.
 */
function quantityLiteralUnits(n: AnyNode): string[] | null {
  if (n.type !== 'OperatorNode' || !n.args || n.args.length !== 2) return null;
  const [a, b] = n.args as AnyNode[];
  if (n.fn === 'multiply' && n.implicit && isNumberLiteral(a!)) {
    const out: string[] = [];
    return unitSymbols(b!, out) ? out : null;
  }
  if ((n.fn === 'divide' || n.fn === 'multiply') && (isNumberLiteral(a!) || quantityLiteralUnits(a!))) {
    const left = quantityLiteralUnits(a!) ?? [];
    const out: string[] = [];
    if (quantityLiteralUnits(a!) && unitSymbols(b!, out)) return [...left, ...out];
  }
  return null;
}

/** Every name an expression uses, with its role. */
export function collectSymbols(root: MathNode): SymbolUse[] {
  const uses: SymbolUse[] = [];
  const visit = (node: AnyNode): void => {
    const units = quantityLiteralUnits(node);
    if (units) {
      for (const name of units) uses.push({ name, role: 'unit' });
      return;
    }
    if (node.type === 'OperatorNode' && node.fn === 'to' && node.args) {
      visit(node.args[0] as AnyNode);
      const out: string[] = [];
      if (unitSymbols(node.args[1] as AnyNode, out)) {
        for (const name of out) uses.push({ name, role: 'unit' });
        return;
      }
      visit(node.args[1] as AnyNode);
      return;
    }
    if (node.type === 'SymbolNode') { uses.push({ name: node.name!, role: 'value' }); return; }
    if (node.type === 'FunctionNode') {
      const fn = node.fn as AnyNode;
      if (fn.type === 'SymbolNode') uses.push({ name: fn.name!, role: 'call' });
      else visit(fn);
      for (const a of node.args ?? []) visit(a as AnyNode);
      return;
    }
    node.forEach((child) => visit(child as AnyNode));
  };
  visit(root as AnyNode);
  return uses;
}
