/**
 * What every part of the sheet needs to know while rendering: the document,
 * the settled states, the significant figures, and which fields of each
 * kernel result the rest of the document reads.
 */
import type { MathNode } from 'mathjs';
import type { Cell, CellState, CompiledDocument } from '../types.js';
import type { Diagnostic } from '../diagnostic.js';
import type { TexScope } from './tex.js';
import type { CaseRun } from '../cases/index.js';
import { documentUnitSystem, type UnitSystem } from '../values/format.js';

/** Identification of the source for the archive footer. */
export interface ArchiveInfo {
  /** SHA-256 of the source file, hex. */
  hash: string;
  /** Commit of the repository holding the file, when known. */
  commit?: string;
  /** True when the file differs from that commit. */
  dirty?: boolean;
}

export interface SheetOptions {
  /** Significant figures (else the front matter's `sigfigs`, else 4). */
  sigfigs?: number;
  /** true: a whole HTML document with every style and font inlined; false: the <article> only. */
  standalone?: boolean;
  archive?: ArchiveInfo;
  /**
   * KaTeX's stylesheet with its fonts inlined as data: URLs, for standalone sheets.
   * The renderer reads no files, so the host supplies it (bin/commands/render.ts does).
   */
  katexCss?: string;
}

export interface RenderContext {
  doc: CompiledDocument;
  states: Map<string, CellState>;
  warnings: Map<string, Diagnostic>;
  sigfigs: number;
  scope: TexScope;
  /** Kernel-result cell id → the fields other cells read from it, in order of first use. */
  fieldUses: Map<string, string[]>;
  /** Cell id → the cells that use it. */
  usersOf: Map<string, Cell[]>;
  /** Kernel function name → the first cell that calls it at its top level (where its description is printed). */
  firstCall: Map<string, string>;
  /** Every check in every case (engine/cases), when the document was evaluated with its cases. */
  cases?: CaseRun;
  /** The document's system of units: 'us' when it writes its inputs in ft, kip, psf …; results and figures are shown in it. */
  units: UnitSystem;
}

type AnyNode = MathNode & { object?: AnyNode; index?: { dimensions: AnyNode[]; dotNotation?: boolean }; name?: string; value?: unknown };

/** Fields read as `x.field` anywhere in an expression: [['a', 'H_min'], …]. */
export function fieldReads(node: MathNode): Array<[string, string]> {
  const out: Array<[string, string]> = [];
  node.traverse((child) => {
    const n = child as AnyNode;
    if (n.type !== 'AccessorNode' || !n.index?.dotNotation || n.object?.type !== 'SymbolNode') return;
    const key = n.index.dimensions[0];
    if (key?.type === 'ConstantNode' && typeof key.value === 'string') out.push([n.object.name!, key.value]);
  });
  return out;
}

/** Significant figures from the options or the front matter, limited to 1…15. */
function sigfigsOf(doc: CompiledDocument, options: SheetOptions): number {
  const s = options.sigfigs ?? doc.meta.sigfigs;
  return typeof s === 'number' && Number.isInteger(s) && s >= 1 && s <= 15 ? s : 4;
}

/**
 * Builds the render context.
 * @example const ctx = makeRenderContext(doc, states)
 */
export function makeRenderContext(doc: CompiledDocument, states: Map<string, CellState>, warnings?: Map<string, Diagnostic>, options: SheetOptions = {}): RenderContext {
  if (!(states instanceof Map)) throw new TypeError('makeRenderContext: expected states to be a Map');
  const { graph } = doc;
  const fieldUses = new Map<string, string[]>();
  const usersOf = new Map<string, Cell[]>();
  for (const cell of graph.cells) {
    for (const used of cell.uses) usersOf.set(used, [...(usersOf.get(used) ?? []), cell]);
    for (const [name, field] of fieldReads(cell.node)) {
      if (!graph.byId.has(name)) continue;
      const list = fieldUses.get(name) ?? [];
      if (!list.includes(field)) list.push(field);
      fieldUses.set(name, list);
    }
  }
  const firstCall = new Map<string, string>();
  for (const cell of graph.cells) {
    const n = cell.node as AnyNode & { fn?: AnyNode };
    if (n.type === 'FunctionNode' && n.fn?.type === 'SymbolNode' && !firstCall.has(n.fn.name!)) firstCall.set(n.fn.name!, cell.id);
  }
  const sigfigs = sigfigsOf(doc, options);
  const defined = (name: string) => graph.byId.has(name) || graph.failed.has(name);
  const units = documentUnitSystem(doc);
  const scope: TexScope = {
    sigfigs,
    units,
    isDefined: defined,
    resolve: (path) => {
      const cell = graph.byId.get(path[0]!);
      const state = states.get(path[0]!);
      if (!cell || state?.status !== 'ok') return undefined;
      let value: unknown = state.value;
      for (const key of path.slice(1)) {
        if (typeof value !== 'object' || value === null || !Object.prototype.hasOwnProperty.call(value, key)) return undefined;
        value = (value as Record<string, unknown>)[key];
      }
      // A given input is substituted with every digit it was written with, as its table shows it.
      return { value, unit: path.length === 1 ? cell.displayUnit : null, written: path.length === 1 && cell.kind === 'given' };
    },
  };
  return { doc, states, warnings: warnings ?? new Map(), sigfigs, scope, fieldUses, usersOf, firstCall, units };
}

/** The state of a cell, pending when unknown. */
export function stateOf(ctx: RenderContext, id: string): CellState {
  return ctx.states.get(id) ?? { status: 'pending' };
}
