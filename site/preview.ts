/**
 * LiveSheet: one document on the page, kept in step with its session.
 *
 * The whole sheet is rendered once per document text. After that every state
 * change marks its cell; once the runtime has finished its turn the marked
 * cells are rendered again (renderCellOutput) and only the elements whose
 * HTML differs are replaced. When no cell is pending any more the page fires
 * `vaultbook:patched` on document, with the ids patched.
 */
import { compile, startSession } from '../engine/index.js';
import type { Cell, CellState, CompiledDocument, Diagnostic, Session } from '../engine/index.js';
import { makeRenderContext, renderCellOutput, renderCheckSummary, renderDiagnostics, renderSheet, renderStatus, type ArchiveInfo, type RenderContext } from './sheet.js';

export interface PatchEvent {
  /** Cells whose state changed in this turn (patched or not). */
  changed: string[];
  /** Cells whose element was replaced. */
  patched: string[];
  /** performance.now() when the patch finished. */
  at: number;
}

export interface LoadResult {
  /** Overrides whose input the document no longer has (or no longer accepts), with the reason. */
  dropped: Array<{ name: string; reason: string }>;
}

/** Posts a task after the current one, sooner than setTimeout(0) (which may be clamped to 4 ms). */
function nextTask(): (fn: () => void) => void {
  const channel = new MessageChannel();
  let queued: (() => void) | null = null;
  channel.port1.onmessage = () => { const f = queued; queued = null; f?.(); };
  return (fn) => {
    if (queued) return;
    queued = fn;
    channel.port2.postMessage(null);
  };
}

export class LiveSheet {
  doc!: CompiledDocument;
  session!: Session;
  /** The document's own results, before any override: what a review compares against. */
  baseline = new Map<string, CellState>();
  /** Inputs set on the page: name → value text. */
  readonly overrides = new Map<string, string>();
  private ctx!: RenderContext;
  private cells = new Map<string, HTMLElement>();
  private parts = new Map<string, HTMLElement>();
  private lastHtml = new Map<string, string>();
  private shown = new Map<string, CellState>();
  private dirty = new Set<string>();
  private held = new Set<string>();
  private turnChanged = new Set<string>();
  private turnPatched: string[] = [];
  private unsubscribe: (() => void) | null = null;
  private schedule = nextTask();
  private listeners = new Set<(e: PatchEvent) => void>();

  constructor(readonly root: HTMLElement, readonly isHeld: (el: HTMLElement) => boolean = () => false) {}

  /** Called after each patch turn (before the DOM event). */
  onPatch(listener: (e: PatchEvent) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /**
   * Compiles and shows a document text, then re-applies the page's overrides where the inputs still exist.
   * @param text the document as read from disk
   */
  async load(text: string, file: string, archive?: ArchiveInfo): Promise<LoadResult> {
    this.unsubscribe?.();
    this.session?.dispose();
    this.doc = compile(text, { file });
    this.session = startSession(this.doc);
    this.baseline = new Map(await this.session.settle());
    const dropped: LoadResult['dropped'] = [];
    for (const [name, value] of [...this.overrides]) {
      const cell = this.doc.graph.byId.get(name);
      if (!cell || cell.kind !== 'given') {
        dropped.push({ name, reason: `the document has no input "${name}" any more` });
        this.overrides.delete(name);
      } else if (value.trim() === cell.source) {
        this.overrides.delete(name); // the document now says the same
      } else {
        const d = this.session.setInput(name, value);
        if (d) {
          dropped.push({ name, reason: d.message });
          this.overrides.delete(name);
        }
      }
    }
    await this.session.settle();
    // The context reads session.states live, so one context serves every later patch.
    const options = { standalone: false, ...(archive ? { archive } : {}) };
    this.ctx = makeRenderContext(this.doc, this.session.states, this.session.warnings, options);
    this.root.innerHTML = renderSheet({ doc: this.doc, states: this.session.states, warnings: this.session.warnings, options });
    this.index();
    this.unsubscribe = this.session.subscribe((id, state) => this.mark(id, state));
    return { dropped };
  }

  private index(): void {
    this.cells.clear();
    this.parts.clear();
    this.lastHtml.clear();
    this.shown = new Map(this.session.states);
    this.dirty.clear();
    this.held.clear();
    for (const el of this.root.querySelectorAll<HTMLElement>('[data-cell]')) this.cells.set(el.dataset.cell!, el);
    for (const el of this.root.querySelectorAll<HTMLElement>('[data-part]')) this.parts.set(el.dataset.part!, el);
    for (const [part, render] of this.partRenderers()) this.lastHtml.set(`@${part}`, render());
  }

  /** The sheet's parts that depend on every cell: status banner, checks summary, diagnostics list. */
  private partRenderers(): Array<[string, () => string]> {
    const { doc, ctx } = this;
    const states = this.session.states, warnings = this.session.warnings;
    return [
      ['status', () => renderStatus(doc, states, warnings)],
      ['check-summary', () => renderCheckSummary(doc, states, ctx)],
      ['diagnostics', () => renderDiagnostics(doc, states, warnings)],
    ];
  }

  cellElement(id: string): HTMLElement | undefined {
    return this.cells.get(id);
  }

  cell(id: string): Cell | undefined {
    return this.doc.graph.byId.get(id);
  }

  /** The value text an input has now (the override, else the document's). */
  sourceOf(name: string): string {
    return this.overrides.get(name) ?? this.doc.graph.byId.get(name)?.originalSource ?? this.doc.graph.byId.get(name)?.source ?? '';
  }

  /** The document's own value text of an input. */
  documentSourceOf(name: string): string {
    const cell = this.doc.graph.byId.get(name);
    return cell?.originalSource ?? cell?.source ?? '';
  }

  /**
   * Sets an input; the document's own text clears the override.
   * @returns a diagnostic when the text is not acceptable (nothing changes then)
   */
  setInput(name: string, text: string): Diagnostic | null {
    const value = text.trim();
    if (value === this.documentSourceOf(name)) {
      this.resetInput(name);
      return null;
    }
    if (this.overrides.get(name) === value) return null;
    const d = this.session.setInput(name, value);
    if (!d) this.overrides.set(name, value);
    return d;
  }

  resetInput(name: string): void {
    if (!this.overrides.has(name)) return;
    this.overrides.delete(name);
    this.session.resetInput(name);
  }

  resetAll(): void {
    for (const name of [...this.overrides.keys()]) this.resetInput(name);
  }

  private mark(id: string, state: CellState): void {
    if (state.status === 'pending') return;
    this.dirty.add(id);
    this.schedule(() => this.flush());
  }

  /** Re-renders cells that were held back (an input being edited) once they are free. */
  release(): void {
    for (const id of this.held) this.dirty.add(id);
    this.held.clear();
    this.schedule(() => this.flush());
  }

  private render(id: string, state: CellState): string {
    const cell = this.doc.graph.byId.get(id);
    return cell ? renderCellOutput(cell, state, this.ctx) : '';
  }

  private flush(): void {
    const states = this.session.states;
    for (const id of this.dirty) {
      const state = states.get(id);
      const el = this.cells.get(id);
      if (!state || state.status === 'pending') continue;
      this.turnChanged.add(id);
      if (!el) continue;
      if (this.isHeld(el)) {
        this.held.add(id);
        continue;
      }
      const before = this.lastHtml.get(id) ?? this.render(id, this.shown.get(id) ?? { status: 'pending' });
      const html = this.render(id, state);
      if (html !== before) {
        el.innerHTML = html;
        this.turnPatched.push(id);
      }
      this.lastHtml.set(id, html);
      this.shown.set(id, state);
    }
    this.dirty.clear();
    for (const [part, render] of this.partRenderers()) this.patchPart(part, render);
    for (const s of states.values()) if (s.status === 'pending') return;
    const event: PatchEvent = { changed: [...this.turnChanged], patched: this.turnPatched, at: performance.now() };
    this.turnChanged = new Set();
    this.turnPatched = [];
    for (const l of this.listeners) l(event);
    document.dispatchEvent(new CustomEvent('vaultbook:patched', { detail: event }));
  }

  private patchPart(part: string, render: () => string): void {
    const el = this.parts.get(part);
    if (!el) return;
    const html = render();
    if (html === this.lastHtml.get(`@${part}`)) return;
    el.innerHTML = html;
    this.turnPatched.push(`@${part}`);
    this.lastHtml.set(`@${part}`, html);
  }
}
