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

/**
 * Symbols forming the unit part of a unit expression: kN, kN/m, m^2, kN m.
 * @returns the symbols, or null when the node is not a unit expression
 */
function unitSymbols(n: AnyNode): string[] | null {
  const out: string[] = [];
  // A list, not recursion: `1 m m m … m` is a chain as long as the line.
  const stack: AnyNode[] = [n];
  while (stack.length > 0) {
    const cur = stack.pop()!;
    if (cur.type === 'SymbolNode') { out.push(cur.name!); continue; }
    if (cur.type === 'ParenthesisNode') { stack.push((cur as unknown as { content: AnyNode }).content); continue; }
    if (cur.type === 'OperatorNode' && cur.args) {
      const [a, b] = cur.args as AnyNode[];
      if (cur.fn === 'pow' && b && isNumberLiteral(b)) { if (!isNumberLiteral(a!)) stack.push(a!); continue; }
      if (cur.fn === 'multiply' || cur.fn === 'divide') {
        // Pushed in reverse so that the symbols come out in the order written.
        for (const arg of [...cur.args].reverse() as AnyNode[]) if (!isNumberLiteral(arg)) stack.push(arg);
        continue;
      }
    }
    return null;
  }
  return out;
}

/**
 * A number written with its unit, `6.4 m` or `18 kN/m^3`: returns the unit symbols,
 * or null when the node is not such a literal. Each node is looked at once per call
 * (`memo`), so a long chain costs its length, not its length squared or worse.
 */
function quantityLiteralUnits(n: AnyNode, memo: Map<AnyNode, string[] | null>): string[] | null {
  if (memo.has(n)) return memo.get(n)!;
  // The left operand of a chain is itself a literal or not: settle the innermost first.
  const spine: AnyNode[] = [];
  for (let cur: AnyNode | undefined = n; cur && !memo.has(cur); cur = leftOperand(cur)) spine.push(cur);
  for (let i = spine.length - 1; i >= 0; i--) memo.set(spine[i]!, literalUnitsOf(spine[i]!, memo));
  return memo.get(n)!;
}

function leftOperand(n: AnyNode): AnyNode | undefined {
  if (n.type !== 'OperatorNode' || !n.args || n.args.length !== 2) return undefined;
  return (n.fn === 'multiply' || n.fn === 'divide') ? n.args[0] as AnyNode : undefined;
}

function literalUnitsOf(n: AnyNode, memo: Map<AnyNode, string[] | null>): string[] | null {
  if (n.type !== 'OperatorNode' || !n.args || n.args.length !== 2) return null;
  const [a, b] = n.args as AnyNode[];
  if (n.fn === 'multiply' && n.implicit && isNumberLiteral(a!)) return unitSymbols(b!);
  if (n.fn === 'divide' || n.fn === 'multiply') {
    const left = memo.get(a!) ?? null;
    if (!left) return null;
    const right = unitSymbols(b!);
    return right ? [...left, ...right] : null;
  }
  return null;
}

/** Every name an expression uses, with its role. */
export function collectSymbols(root: MathNode): SymbolUse[] {
  const uses: SymbolUse[] = [];
  const memo = new Map<AnyNode, string[] | null>();
  const visit = (node: AnyNode): void => {
    const units = quantityLiteralUnits(node, memo);
    if (units) {
      for (const name of units) uses.push({ name, role: 'unit' });
      return;
    }
    if (node.type === 'OperatorNode' && node.fn === 'to' && node.args) {
      visit(node.args[0] as AnyNode);
      const out = unitSymbols(node.args[1] as AnyNode);
      if (out) {
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
