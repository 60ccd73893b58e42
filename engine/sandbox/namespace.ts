/**
 * The namespace a document's expressions are compiled against: our own frozen
 * object, not the mathjs instance. It holds the mathjs functions and constants a
 * calc may use and the registered cell functions; `config`, `typed`, `import` and
 * the instance's other handles are simply not in it, so no expression can reach
 * them, and the functions that build big values are replaced by guarded ones.
 */
import type { MathNode } from 'mathjs';
import { math } from '../../cells/math.js';
import { registerLibrary } from '../library.js';
import { GUARDS, checkValueSize } from './guards.js';
import { chargeCall } from './budget.js';
import { NOT_FOR_DOCUMENTS } from './names.js';
import { freezeValue } from './freeze.js';

/** What mathjs's compiled node functions take as scope. */
export interface Scope {
  has(name: string): boolean;
  get(name: string): unknown;
  set(name: string, value: unknown): unknown;
  keys(): Iterable<string>;
}
export type Compiled = (scope: Scope, args: Record<string, unknown>, context: unknown) => unknown;
type Compilable = MathNode & { _compile(math: object, argNames: Record<string, boolean>): Compiled };
type Raw = ((args: MathNode[], math: object, scope: Scope) => unknown) & { rawArgs?: boolean };

const withTransforms = (math as unknown as { expression: { mathWithTransform: Record<string, unknown> } })
  .expression.mathWithTransform;

let namespace: Readonly<Record<string, unknown>> | null = null;
const compiled = new WeakMap<MathNode, Compiled>();

/**
 * Compiles a node against the document namespace (once per node).
 * The caller has passed it through checkExpression.
 */
export function compileNode(node: MathNode): Compiled {
  let c = compiled.get(node);
  if (!c) {
    c = (node as Compilable)._compile(documentNamespace(), {});
    compiled.set(node, c);
  }
  return c;
}

/** A stand-in for an argument node of a raw function: compiled here, and each value seen by `onValue`. */
function shadowOf(node: MathNode, onValue: (v: unknown) => void): MathNode {
  return Object.create(node, {
    compile: {
      value: () => ({
        evaluate: (scope: Scope) => {
          const v = compileNode(node)(scope, {}, null);
          onValue(v);
          return v;
        },
      }),
    },
  }) as MathNode;
}

/**
 * mathjs's lazy functions (`and`, `or`, `map`, `filter` …) compile their own arguments
 * with the default namespace; here they compile them through ours, and the guard sees
 * their values as they come.
 */
function rawForDocuments(name: string, fn: Raw): Raw {
  const guard = GUARDS[name];
  const raw: Raw = (args, _math, scope) => {
    chargeCall(name);
    const seen: unknown[] = [];
    const shadows = args.map((a) => shadowOf(a, (v) => { seen.push(v); guard?.(seen, name); }));
    const out = fn(shadows, documentNamespace(), scope);
    checkValueSize(out, name);
    return out;
  };
  raw.rawArgs = true;
  return raw;
}

function guardedForDocuments(name: string, fn: (...args: unknown[]) => unknown): (...args: unknown[]) => unknown {
  const guard = GUARDS[name]!;
  const guarded = (...args: unknown[]) => {
    chargeCall(name);
    guard(args, name);
    const out = fn(...args);
    checkValueSize(out, name);
    return out;
  };
  Object.defineProperty(guarded, 'name', { value: name });
  return guarded;
}

function forDocuments(name: string, value: unknown): unknown {
  if (typeof value !== 'function') return freezeValue(value);
  if ((value as Raw).rawArgs === true) return rawForDocuments(name, value as Raw);
  if (GUARDS[name]) return guardedForDocuments(name, value as (...args: unknown[]) => unknown);
  return value;
}

/** The frozen namespace (built on first use, after the cell functions are registered). */
export function documentNamespace(): Readonly<Record<string, unknown>> {
  if (namespace) return namespace;
  registerLibrary();
  const ns: Record<string, unknown> = {};
  for (const name of Object.keys(withTransforms)) {
    if (NOT_FOR_DOCUMENTS.has(name)) continue;
    let resolved = false;
    let value: unknown;
    Object.defineProperty(ns, name, {
      enumerable: true,
      get: () => {
        if (!resolved) {
          value = forDocuments(name, withTransforms[name]);
          resolved = true;
        }
        return value;
      },
    });
  }
  // mathjs's ArrayNode reads `math.config.matrix` when it compiles; this is all it gets.
  Object.defineProperty(ns, 'config', { value: Object.freeze({ matrix: (math.config as unknown as () => { matrix: string })().matrix }) });
  namespace = Object.freeze(ns);
  return namespace;
}

/** Is this a function or constant a document may use (a mathjs one or a cell function)? */
export function isDocumentFunction(name: string): boolean {
  return Object.prototype.propertyIsEnumerable.call(documentNamespace(), name);
}
