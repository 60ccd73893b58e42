/**
 * exprTex: a mathjs parse tree → TeX, symbolically (`\frac{w L^{2}}{8 f}`) or
 * with every document name replaced by its value (`\frac{12\,\mathrm{kN/m} \cdot (6.4\,\mathrm{m})^{2}}{8 \cdot 1.6\,\mathrm{m}}`).
 * Written over the node types directly, so names are typeset our way (names.ts).
 */
import type { MathNode } from 'mathjs';
import { isUnitName } from '../graph/build.js';
import { numberTex, unitTex, valueTex, isNegativeValue, hasUnit } from './quantity.js';
import { symbolTex, fieldTex } from './names.js';
import type { UnitSystem } from '../values/format.js';
import { texText } from './escape.js';

/** What the converter needs to know about a document's names. */
export interface TexScope {
  /** Is this a value defined in the document (so not a unit or a library constant)? */
  isDefined(name: string): boolean;
  /** The value behind a name or a field chain (`a.H_min` → ['a', 'H_min']); undefined when unknown. */
  resolve?(path: string[]): { value: unknown; unit: string | null; written?: boolean } | undefined;
  sigfigs: number;
  /** The document's system of units, for values shown in their engineering unit (default 'si'). */
  units?: UnitSystem;
}

type AnyNode = MathNode & {
  fn?: string | AnyNode; op?: string; args?: AnyNode[]; implicit?: boolean; name?: string; value?: unknown;
  content?: AnyNode; object?: AnyNode; index?: AnyNode & { dimensions: AnyNode[]; dotNotation?: boolean };
  properties?: Record<string, AnyNode>; items?: AnyNode[]; condition?: AnyNode; trueExpr?: AnyNode; falseExpr?: AnyNode;
  start?: AnyNode; end?: AnyNode; step?: AnyNode | null; conditionals?: string[]; params?: AnyNode[];
};

/** Precedence of what a piece of TeX is: lower binds more loosely. */
const enum Prec { Relation = 0, Sum = 1, Product = 2, Unary = 3, Power = 4, Atom = 5 }

interface Piece {
  tex: string;
  prec: Prec;
  /** Starts with a minus sign (a substituted negative value). */
  negative?: boolean;
  /** A number with a unit, which needs brackets before a power. */
  quantity?: boolean;
  /** A \frac, which needs brackets before a power. */
  fraction?: boolean;
}

interface Walk {
  scope: TexScope;
  substitute: boolean;
  /** When set, records `{…}` are typeset as numbered placeholders and collected here (to be listed below the formula). */
  records?: MathNode[];
  /** Inside an exponent or a fraction: further fractions are written a/b. */
  exponent: boolean;
}

const RELATIONS: Record<string, string> = {
  smaller: '<', larger: '>', smallerEq: '\\le', largerEq: '\\ge', equal: '=', unequal: '\\ne',
};
const LOGIC: Record<string, string> = { and: '\\wedge', or: '\\vee', xor: '\\veebar' };
const NAMED_FUNCTIONS = new Set(['sin', 'cos', 'tan', 'cot', 'sec', 'csc', 'sinh', 'cosh', 'tanh', 'exp', 'max', 'min']);
const ARC_FUNCTIONS: Record<string, string> = { asin: '\\arcsin', acos: '\\arccos', atan: '\\arctan', log: '\\ln', log10: '\\log_{10}' };
const CONSTANTS: Record<string, string> = { pi: '\\pi', e: 'e', Infinity: '\\infty', tau: '\\tau' };

/** Content that is taller than a line and needs brackets that grow with it. */
const TALL = /\\frac|\\sqrt|\\begin|\\left|\\sum|\\int/;
/** TeX longer than this may have to break across lines on the sheet. */
const LONG = 80;
/**
 * Brackets around a piece. KaTeX cannot break a line inside `\left … \right`, so those grow with short tall
 * content only; long tall content gets fixed tall brackets and anything else plain ones, and the sheet may
 * then break a long sum inside them at its operators.
 */
const brackets = (tex: string, open = '(', close = ')'): string => {
  if (!TALL.test(tex)) return `${open}${tex}${close}`;
  return tex.length > LONG ? `\\biggl${open}${tex}\\biggr${close}` : `\\left${open}${tex}\\right${close}`;
};
const wrap = (p: Piece): string => brackets(p.tex);
/** Between arguments and list items: a comma after which a long line may break. */
const LIST_SEP = ',\\allowbreak\\,';
const atom = (tex: string, extra: Partial<Piece> = {}): Piece => ({ tex, prec: Prec.Atom, ...extra });

/** The unit text of a pure unit expression (`kN/m^3`), or null when it contains anything else. */
function unitExpression(n: AnyNode, scope: TexScope): string | null {
  if (n.type === 'SymbolNode') return !scope.isDefined(n.name!) && isUnitName(n.name!) ? n.name! : null;
  if (n.type === 'ParenthesisNode') {
    const inner = unitExpression(n.content!, scope);
    return inner === null ? null : `(${inner})`;
  }
  if (n.type !== 'OperatorNode' || !n.args || n.args.length !== 2) return null;
  const [a, b] = n.args as [AnyNode, AnyNode];
  if (n.fn === 'pow') {
    const base = unitExpression(a, scope);
    const power = b.type === 'ConstantNode' && typeof b.value === 'number' ? b.value
      : b.type === 'OperatorNode' && b.fn === 'unaryMinus' && b.args![0]!.type === 'ConstantNode' ? -(b.args![0]!.value as number) : null;
    return base !== null && power !== null ? `${base}^${power}` : null;
  }
  if (n.fn === 'multiply' || n.fn === 'divide') {
    const l = unitExpression(a, scope);
    const r = unitExpression(b, scope);
    return l !== null && r !== null ? `${l}${n.fn === 'divide' ? '/' : ' '}${r}` : null;
  }
  return null;
}

/** A number written with its unit (`6.4 m`, `18 kN/m^3`, `5 kN m`): the number and unit text, or null. */
function quantityLiteral(n: AnyNode, scope: TexScope): { number: number; unit: string } | null {
  if (n.type !== 'OperatorNode' || !n.args || n.args.length !== 2 || (n.fn !== 'multiply' && n.fn !== 'divide')) return null;
  const [a, b] = n.args as [AnyNode, AnyNode];
  const unit = unitExpression(b, scope);
  if (unit === null) return null;
  if (n.fn === 'multiply' && a.type === 'ConstantNode' && typeof a.value === 'number') return { number: a.value, unit };
  const left = quantityLiteral(a, scope);
  return left ? { number: left.number, unit: `${left.unit}${n.fn === 'divide' ? '/' : ' '}${unit}` } : null;
}

/** The name chain of `a`, `a.H_min` or `a.ring.span`, or null for anything else. */
function namePath(n: AnyNode): string[] | null {
  if (n.type === 'SymbolNode') return [n.name!];
  if (n.type === 'AccessorNode' && n.index?.dotNotation && n.index.dimensions.length === 1) {
    const base = namePath(n.object!);
    const key = n.index.dimensions[0]!;
    return base && key.type === 'ConstantNode' && typeof key.value === 'string' ? [...base, key.value] : null;
  }
  return null;
}

function substituted(path: string[], w: Walk): Piece | null {
  if (!w.substitute || !w.scope.resolve || !w.scope.isDefined(path[0]!)) return null;
  const found = w.scope.resolve(path);
  if (!found) return null;
  // Fields of kernel results come in SI base units: show them in engineering units.
  const tex = valueTex(found.value, { sigfigs: w.scope.sigfigs, unit: found.unit, engineering: path.length > 1, units: w.scope.units, written: found.written === true });
  if (tex === null) return null;
  const negative = isNegativeValue(found.value);
  return { tex, prec: negative ? Prec.Unary : Prec.Atom, negative, quantity: hasUnit(found.value) };
}

function bare(n: AnyNode): AnyNode {
  return n.type === 'ParenthesisNode' ? bare(n.content!) : n;
}

function fnName(n: AnyNode): string | null {
  const f = n.fn as AnyNode | undefined;
  return f && typeof f === 'object' && f.type === 'SymbolNode' ? f.name! : null;
}

function functionTex(n: AnyNode, w: Walk): Piece {
  const name = fnName(n);
  const args = (n.args ?? []).map((a) => walk(bare(a), w).tex);
  const list = args.join(LIST_SEP);
  switch (name) {
    case 'sqrt': return atom(`\\sqrt{${list}}`);
    case 'cbrt': return atom(`\\sqrt[3]{${list}}`);
    case 'nthRoot': return atom(`\\sqrt[${args[1] ?? 2}]{${args[0]}}`);
    case 'abs': return atom(`\\left|${list}\\right|`);
    case 'floor': return atom(`\\left\\lfloor ${list}\\right\\rfloor`);
    case 'ceil': return atom(`\\left\\lceil ${list}\\right\\rceil`);
    case 'exp': if (args.length === 1 && !w.exponent) return atom(`e^{${walk(bare(n.args![0]!), { ...w, exponent: true }).tex}}`); break;
    case 'pow': if (args.length === 2) return atom(`{${powBase(walk(n.args![0]!, w))}}^{${walk(bare(n.args![1]!), { ...w, exponent: true }).tex}}`); break;
  }
  if (name && NAMED_FUNCTIONS.has(name)) return atom(`\\${name}${brackets(list)}`);
  if (name && name in ARC_FUNCTIONS) return atom(`${ARC_FUNCTIONS[name]}${brackets(list)}`);
  const head = name ? `\\operatorname{${texText(name)}}` : walk(n.fn as AnyNode, w).tex;
  return atom(`${head}${brackets(list)}`);
}

function powBase(p: Piece): string {
  return p.prec < Prec.Atom || p.negative || p.quantity || p.fraction ? wrap(p) : p.tex;
}

function operatorTex(n: AnyNode, w: Walk): Piece {
  const fn = n.fn as string;
  const args = n.args ?? [];
  if (fn === 'to') return walk(args[0]!, w);
  const literal = quantityLiteral(n, w.scope);
  if (literal) {
    const gap = literal.unit === 'deg' ? '' : '\\,';
    return atom(`${numberTex(literal.number, 15)}${gap}${unitTex(literal.unit)}`, { quantity: true, negative: literal.number < 0 });
  }
  const unitOnly = unitExpression(n, w.scope);
  if (unitOnly !== null) return atom(unitTex(unitOnly));
  if (args.length === 1) {
    const p = walk(args[0]!, w);
    if (fn === 'unaryMinus') return { tex: `-${p.prec < Prec.Power || p.negative ? wrap(p) : p.tex}`, prec: Prec.Unary, negative: true };
    if (fn === 'unaryPlus') return { tex: `+${p.prec < Prec.Power ? wrap(p) : p.tex}`, prec: Prec.Unary };
    if (fn === 'not') return { tex: `\\neg ${p.prec < Prec.Unary ? wrap(p) : p.tex}`, prec: Prec.Unary };
    if (fn === 'factorial') return atom(`${p.prec < Prec.Atom ? wrap(p) : p.tex}!`);
    if (fn === 'ctranspose' || fn === 'transpose') return atom(`${p.prec < Prec.Atom ? wrap(p) : p.tex}^{\\top}`);
    return { tex: `${texText(n.op ?? fn)}${wrap(p)}`, prec: Prec.Unary };
  }
  const [a, b] = args as [AnyNode, AnyNode];
  switch (fn) {
    case 'add': case 'subtract': {
      const l = walk(a, w);
      const r = walk(b, w);
      const rightNeedsBrackets = r.negative || (fn === 'subtract' && r.prec <= Prec.Sum);
      return { tex: `${l.prec < Prec.Sum ? wrap(l) : l.tex} ${fn === 'add' ? '+' : '-'} ${rightNeedsBrackets ? wrap(r) : r.tex}`, prec: Prec.Sum, negative: l.negative };
    }
    case 'multiply': case 'dotMultiply': {
      const l = walk(a, w);
      const r = walk(b, w);
      const lt = l.prec < Prec.Product ? wrap(l) : l.tex;
      const rt = r.prec < Prec.Product || r.negative ? wrap(r) : r.tex;
      // Written side by side when the reader cannot mistake it; a dot between two numbers and in substitutions.
      const numeric = (p: Piece, x: AnyNode) => p.quantity || x.type === 'ConstantNode' || p.negative || /^[\d-]/.test(p.tex);
      const dot = w.substitute || numeric(r, bare(b)) ? ' \\cdot ' : '\\,';
      return { tex: `${lt}${dot}${rt}`, prec: Prec.Product, negative: l.negative };
    }
    case 'divide': case 'dotDivide': {
      if (w.exponent) {
        const l = walk(a, w);
        const r = walk(b, w);
        return { tex: `${l.prec < Prec.Product ? wrap(l) : l.tex}/${r.prec < Prec.Power ? wrap(r) : r.tex}`, prec: Prec.Product };
      }
      const inner = { ...w, exponent: true };
      return atom(`\\frac{${walk(bare(a), inner).tex}}{${walk(bare(b), inner).tex}}`, { fraction: true });
    }
    case 'pow': case 'dotPow':
      return { tex: `{${powBase(walk(a, w))}}^{${walk(bare(b), { ...w, exponent: true }).tex}}`, prec: Prec.Power };
    case 'mod': {
      const l = walk(a, w);
      const r = walk(b, w);
      return { tex: `${l.prec < Prec.Product ? wrap(l) : l.tex} \\bmod ${r.prec < Prec.Power ? wrap(r) : r.tex}`, prec: Prec.Product };
    }
  }
  if (fn in RELATIONS || fn in LOGIC) {
    const l = walk(a, w);
    const r = walk(b, w);
    const op = RELATIONS[fn] ?? LOGIC[fn]!;
    const side = (p: Piece) => (fn in LOGIC && p.prec <= Prec.Relation ? wrap(p) : p.tex);
    return { tex: `${side(l)} ${op} ${side(r)}`, prec: Prec.Relation };
  }
  return { tex: `${walk(a, w).tex} \\mathbin{${texText(n.op ?? fn)}} ${walk(b, w).tex}`, prec: Prec.Relation };
}

function walk(n: AnyNode, w: Walk): Piece {
  switch (n.type) {
    case 'ConstantNode': {
      const v = n.value;
      if (typeof v === 'number') return atom(numberTex(v, 15), { negative: v < 0 });
      if (typeof v === 'string') return atom(`\\text{“${texText(v)}”}`);
      return atom(`\\mathrm{${String(v)}}`);
    }
    case 'SymbolNode': {
      const name = n.name!;
      const sub = substituted([name], w);
      if (sub) return sub;
      if (!w.scope.isDefined(name)) {
        if (name in CONSTANTS) return atom(CONSTANTS[name]!);
        if (isUnitName(name)) return atom(unitTex(name));
      }
      return atom(symbolTex(name));
    }
    case 'AccessorNode': {
      const path = namePath(n);
      if (path) {
        const sub = substituted(path, w);
        if (sub) return sub;
        return atom(`${path.slice(0, -1).map(symbolTex).join('{.}')}{.}${fieldTex(path[path.length - 1]!)}`);
      }
      const key = n.index!.dimensions[0];
      if (n.index!.dotNotation && key?.type === 'ConstantNode' && typeof key.value === 'string') {
        const obj = walk(n.object!, w);
        return atom(`${obj.prec < Prec.Atom ? wrap(obj) : obj.tex}{.}${fieldTex(key.value)}`);
      }
      const dims = n.index!.dimensions.map((d) => walk(bare(d), w).tex).join(',');
      return atom(`${walk(n.object!, w).tex}\\left[${dims}\\right]`);
    }
    case 'ParenthesisNode': {
      const inner = walk(n.content!, w);
      // Brackets around a lone value add nothing after substitution.
      return inner.prec === Prec.Atom && !inner.negative ? inner : atom(wrap(inner));
    }
    case 'FunctionNode': return functionTex(n, w);
    case 'OperatorNode': return operatorTex(n, w);
    case 'ObjectNode': {
      if (w.records) {
        let i = w.records.indexOf(n);
        if (i < 0) i = w.records.push(n) - 1;
        return atom(`\\left\\{\\ldots\\right\\}_{\\text{\\tiny ${i + 1}}}`);
      }
      const entries = Object.entries(n.properties ?? {}).map(([k, v]) => `\\text{${texText(k)}}{:}\\ ${walk(bare(v), w).tex}`);
      return atom(`\\left\\{${entries.join(',\\ ')}\\right\\}`);
    }
    case 'ArrayNode': {
      const items = (n.items ?? []).map((i) => walk(bare(i), w).tex).join(`${LIST_SEP}\\ `);
      return atom(brackets(items, '[', ']'));
    }
    case 'ConditionalNode':
      return atom(`\\begin{cases}${walk(bare(n.trueExpr!), w).tex} & \\text{if } ${walk(bare(n.condition!), w).tex}\\\\ ${walk(bare(n.falseExpr!), w).tex} & \\text{otherwise}\\end{cases}`);
    case 'RangeNode': {
      const parts = [n.start!, ...(n.step ? [n.step] : []), n.end!].map((p) => walk(p, w).tex);
      return { tex: parts.join('{:}'), prec: Prec.Relation };
    }
    case 'RelationalNode': {
      const params = (n.params ?? []).map((p) => walk(p, w).tex);
      const tex = params.reduce((acc, p, i) => (i === 0 ? p : `${acc} ${RELATIONS[n.conditionals![i - 1]!] ?? '?'} ${p}`), '');
      return { tex, prec: Prec.Relation };
    }
    case 'AssignmentNode': return walk((n as unknown as { value: AnyNode }).value, w);
    default: return atom(`\\text{${texText(n.toString())}}`);
  }
}

/**
 * Typesets an expression.
 * @param node a mathjs parse tree (a cell's right-hand side)
 * @param scope what the document's names are, and their values for substitution
 * @param substitute true to replace every document name by its value and unit
 * @returns TeX for KaTeX
 * @example exprTex(parse('w*L^2/(8 f)'), scope, false) // "\\frac{w\\,{L}^{2}}{8\\,f}"
 */
export function exprTex(node: MathNode, scope: TexScope, substitute = false, records?: MathNode[]): string {
  return walk(node as AnyNode, { scope, substitute, exponent: false, ...(records ? { records } : {}) }).tex;
}

/** Does an expression contain a record literal `{…}`? */
export function hasRecords(node: MathNode): boolean {
  let found = false;
  (node as AnyNode).traverse((c) => { if (c.type === 'ObjectNode') found = true; });
  return found;
}

/** Does an expression read any document name (so that a substituted line says something new)? */
export function readsNames(node: MathNode, scope: TexScope): boolean {
  let found = false;
  (node as AnyNode).traverse((child) => {
    const c = child as AnyNode;
    if (c.type === 'SymbolNode' && scope.isDefined(c.name!)) found = true;
  });
  return found;
}
