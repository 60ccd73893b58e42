/**
 * The live sheet's patcher: which changed cells are swapped in when, and the events that say so.
 *
 * Main thread: every state change marks its cell; once none is pending (still inside the runtime's
 * turn) the marked cells in or near the viewport are rendered again and replaced where their HTML
 * differs (`vaultbook:patched`); those further away in idle slices right after, at once when
 * scrolled to, or before printing (`vaultbook:settled` when none is left).
 *
 * Worker mode: the cells of an answer in or near view are swapped a slice per frame (./slices.ts),
 * then `vaultbook:patched`; the rest after, a slice per frame too, then `vaultbook:settled`. Each
 * cell loses its waiting mark (./waiting.ts) as its new value lands.
 */
import type { CellState } from '../../engine/index.js';
import type { SheetElements } from './elements.js';
import type { WaitingMarks } from './waiting.js';
import { Slices, type SliceHost } from './slices.js';

export interface PatchEvent {
  /** Cells whose state changed and were handled in this patch (replaced, or the same HTML). */
  changed: string[];
  /** Elements replaced (cell ids; `@part` for the summary parts). */
  patched: string[];
  /** Changed cells out of view, left for idle time (0 in `vaultbook:settled`). */
  deferred: number;
  /** performance.now() when the runtime began computing this turn (its first pending cell). */
  computeStart: number;
  /** performance.now() when the last cell settled and rendering began. */
  renderStart: number;
  /** performance.now() when the patch finished. */
  at: number;
  /**
   * Worker mode, `vaultbook:patched`: performance.now() (the page's clock) when the worker took the
   * edit, when its evaluation settled, and when it posted the result.
   */
  worker?: { received: number; settled: number; posted: number };
}

/** What the patcher asks of the sheet (LiveSheet). */
export interface PatchHost {
  /** Evaluating in a worker (slices per frame) rather than on the main thread. */
  inWorker(): boolean;
  /** Each cell's state now. */
  states(): Map<string, CellState>;
  /** A cell's output HTML for its state. */
  render(id: string, state: CellState): string;
  /** The sheet's parts that depend on every cell, each with its renderer. */
  partRenderers(): Array<[string, () => string]>;
  /** Is an element's field open (its cell is patched once it closes)? */
  isHeld(el: HTMLElement): boolean;
  /** Worker mode: an edit sent is still to be answered. */
  awaitingAnswer(): boolean;
}

type Idle = (fn: (deadline?: IdleDeadline) => void) => void;
export const idle: Idle = (fn) => (typeof requestIdleCallback === 'function' ? requestIdleCallback(fn, { timeout: 100 }) : setTimeout(fn, 0));

/** Milliseconds of deferred patching per idle slice. */
const SLICE_MS = 8;

export class Patcher implements SliceHost {
  private dirty = new Set<string>();
  /** Cells whose field is open: patched when it closes. */
  private held = new Set<string>();
  /** Changed cells out of view, patched in idle time. */
  private deferred = new Set<string>();
  private deferring = false;
  /** Cells in or near the viewport. */
  private visible = new Set<string>();
  private observer: IntersectionObserver | null = null;
  /** Cells the runtime is computing now; the patch waits until this is empty. */
  private pending = new Set<string>();
  private flushQueued = false;
  /** performance.now() when the change being patched began (its first pending cell, or the edit sent). */
  turnStart = 0;
  private settledChanged = new Set<string>();
  private settledPatched: string[] = [];
  private readonly listeners = new Set<(e: PatchEvent) => void>();
  /** Worker mode: the in-view elements of the result being patched, a slice per task; then `deferred`. */
  private readonly slices: Slices;

  constructor(private readonly host: PatchHost, private readonly elements: SheetElements, private readonly waiting: WaitingMarks) {
    this.slices = new Slices(this, elements, () => host.partRenderers());
  }

  get deferredCount(): number {
    return this.deferred.size;
  }

  /** Called after each patch (visible cells, then each idle slice), before the DOM events. */
  onPatch(listener: (e: PatchEvent) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Tells the listeners of a change shown outside the patches (the cases' verdicts). */
  tell(changed: string[], patched: string[]): void {
    const at = performance.now();
    const event: PatchEvent = { changed, patched, deferred: this.deferred.size, computeStart: at, renderStart: at, at };
    for (const l of this.listeners) l(event);
  }

  /** A new sheet (its elements just indexed): nothing queued; every cell's element watched for the viewport. */
  reset(): void {
    for (const set of [this.dirty, this.held, this.deferred, this.visible, this.pending, this.settledChanged]) set.clear();
    this.settledPatched = [];
    this.slices.reset();
    this.observer?.disconnect();
    this.observer = typeof IntersectionObserver === 'function'
      ? new IntersectionObserver((entries) => this.seen(entries), { rootMargin: '50% 0px 50% 0px' })
      : null;
    for (const el of this.elements.cells.values()) this.observer?.observe(el);
  }

  /** Watches a part's element for the viewport. */
  observe(el: HTMLElement | undefined): void {
    if (el) this.observer?.observe(el);
  }

  /** Is every change on the page patched (no cell computing, none waiting for its patch)? */
  get settled(): boolean {
    return this.pending.size === 0 && this.dirty.size === 0 && this.deferred.size === 0 && this.slices.length === 0;
  }

  private seen(entries: IntersectionObserverEntry[]): void {
    const wanted: string[] = [];
    for (const e of entries) {
      const el = e.target as HTMLElement;
      const id = el.dataset.cell ?? `@${el.dataset.part}`;
      if (!e.isIntersecting) this.visible.delete(id);
      else {
        this.visible.add(id);
        if (this.deferred.has(id)) wanted.push(id);
      }
    }
    if (!wanted.length) return;
    // Scrolled to a cell still waiting for its patch: patch what is waiting now (in worker mode,
    // those scrolled to go first, still a slice per task).
    if (!this.host.inWorker()) this.patchDeferred(Infinity);
    else {
      for (const id of wanted) this.deferred.delete(id);
      this.slices.seen(wanted);
    }
  }

  /** A cell's state changed (main thread: the session's subscription). */
  mark(id: string, state: CellState): void {
    if (state.status === 'pending') {
      if (this.turnStart === 0) this.turnStart = performance.now();
      this.pending.add(id);
      return;
    }
    this.pending.delete(id);
    this.dirty.add(id);
    this.schedule();
  }

  /** Cells to show again (the worker's failure: every cell it had sent), once nothing is pending. */
  refresh(ids: string[]): void {
    for (const id of ids) this.dirty.add(id);
    this.schedule();
  }

  /** Flushes at the end of the current microtask run, once nothing is pending. */
  private schedule(): void {
    if (this.flushQueued) return;
    this.flushQueued = true;
    queueMicrotask(() => {
      this.flushQueued = false;
      if (this.pending.size === 0) this.flush();
    });
  }

  /** Re-renders cells that were held back (an input being edited) once they are free. */
  release(): void {
    if (this.held.size === 0) return;
    for (const id of this.held) this.dirty.add(id);
    this.held.clear();
    this.schedule();
  }

  /**
   * Worker mode: an edit's answer (its cells' HTML is in the client's `incoming`): patched a slice at
   * a time; the cells it might have moved but did not lose their waiting marks (nothing is coming for them).
   */
  answered(cells: string[], times: NonNullable<PatchEvent['worker']>): void {
    this.slices.times = times;
    for (const id of cells) this.dirty.add(id);
    for (const id of this.waiting.ids()) if (!this.dirty.has(id)) this.waiting.unmark(id);
    if (this.dirty.size) this.flush();
    else this.emitSettled();
  }

  /** The worker failed: the slices of its answers still queued are dropped. */
  dropSlices(): void {
    this.slices.drop();
  }

  /** Before printing: every slice and deferred patch done now. */
  finish(): void {
    while (this.slices.length) this.slices.slice();
    this.patchDeferred(Infinity);
  }

  /** Renders one cell with its current state; true when its element was replaced. */
  patchCell(id: string): boolean {
    if (this.host.inWorker()) this.waiting.unmark(id);
    const el = this.elements.cells.get(id)!;
    const state = this.host.states().get(id)!;
    // Unknown HTML (not learned yet) is replaced: rendering the old state now would mix in new input values.
    return this.elements.replaceCell(el, id, this.host.render(id, state));
  }

  private flush(): void {
    if (this.dirty.size === 0) return;
    if (this.host.inWorker()) {
      this.flushSliced();
      return;
    }
    const renderStart = performance.now();
    const changed: string[] = [];
    const patched: string[] = [];
    const states = this.host.states();
    for (const id of this.dirty) {
      const state = states.get(id);
      if (!state || state.status === 'pending') continue;
      const el = this.elements.cells.get(id);
      if (el && this.observer && !this.visible.has(id) && !this.host.isHeld(el)) {
        this.deferred.add(id); // reported when its slice patches it
        continue;
      }
      changed.push(id);
      if (!el) continue;
      if (this.host.isHeld(el)) this.held.add(id);
      else {
        this.deferred.delete(id);
        if (this.patchCell(id)) patched.push(id);
      }
    }
    this.dirty.clear();
    // The summary parts change with the cells: patched now when in view, else with the deferred cells.
    for (const [part, render] of this.host.partRenderers()) {
      if (this.observer && !this.visible.has(`@${part}`)) this.deferred.add(`@${part}`);
      else if (this.elements.patchPart(part, render)) patched.push(`@${part}`);
    }
    this.emit('vaultbook:patched', changed, patched, this.turnStart || renderStart, renderStart);
    this.turnStart = 0;
    if (this.deferred.size && !this.deferring) {
      this.deferring = true;
      this.later();
    } else if (!this.deferred.size) this.emitSettled();
  }

  /**
   * Worker mode: a result's cells, swapped a slice per task (./slices.ts): those in or near view
   * first (then `vaultbook:patched`), the summary parts in view with them, the rest after (then
   * `vaultbook:settled`). Each cell loses its waiting mark as its new value lands.
   */
  private flushSliced(): void {
    const renderStart = performance.now();
    const near: string[] = [];
    for (const id of this.dirty) {
      const el = this.elements.cells.get(id);
      if (!el || this.host.isHeld(el)) {
        // No element, or its field is open (patched when it closes): reported with the first slice.
        this.waiting.unmark(id);
        if (el) this.held.add(id);
        near.unshift(`!${id}`);
      } else if (this.observer && !this.visible.has(id)) this.deferred.add(id);
      else {
        this.deferred.delete(id);
        near.push(id);
      }
    }
    this.dirty.clear();
    for (const part of ['status', 'check-summary', 'diagnostics']) {
      if (this.observer && !this.visible.has(`@${part}`)) this.deferred.add(`@${part}`);
      else near.push(`@${part}`);
    }
    this.slices.add(near, renderStart);
  }

  /**
   * Schedules the next slice of waiting cells: in idle time, as long as the idle period allows; in
   * worker mode one short slice per frame, so that no task of the page grows long.
   */
  private later(): void {
    if (this.host.inWorker()) {
      this.deferring = false;
      this.slices.kick();
    }
    else idle((deadline) => this.patchDeferred(deadline ? Math.max(SLICE_MS, deadline.timeRemaining()) : SLICE_MS));
  }

  /** Patches waiting cells for up to `budget` ms; schedules the rest. */
  patchDeferred(budget: number): void {
    this.deferring = false;
    if (!this.deferred.size) return;
    const start = performance.now();
    const patched: string[] = [];
    const done: string[] = [];
    const parts = new Map(this.host.partRenderers());
    const states = this.host.states();
    for (const id of this.deferred) {
      if (performance.now() - start > budget) break;
      done.push(id);
      if (id.startsWith('@')) {
        if (this.elements.patchPart(id.slice(1), parts.get(id.slice(1))!)) patched.push(id);
        continue;
      }
      const state = states.get(id);
      // A cell computing again is marked anew when it settles.
      if (!state || state.status === 'pending') continue;
      if (this.patchCell(id)) patched.push(id);
    }
    for (const id of done) this.deferred.delete(id);
    this.emit(null, done.filter((id) => !id.startsWith('@')), patched, start, start);
    if (this.deferred.size) {
      this.deferring = true;
      this.later();
    } else this.settleIfDone();
  }

  /** `vaultbook:settled` once nothing is computing or waiting for its patch. */
  settleIfDone(): void {
    if (this.pending.size || this.dirty.size || this.slices.length) return;
    // Worker mode: an edit sent since is still to be answered; its answer settles the page.
    if (this.host.awaitingAnswer()) return;
    this.emitSettled();
  }

  emit(name: string | null, changed: string[], patched: string[], computeStart: number, renderStart: number): void {
    const event: PatchEvent = { changed, patched, deferred: this.deferred.size, computeStart, renderStart, at: 0 };
    for (const id of changed) this.settledChanged.add(id);
    this.settledPatched.push(...patched);
    // The review badges and panel are part of the patch: time it after them.
    for (const l of this.listeners) l(event);
    event.at = performance.now();
    if (name) document.dispatchEvent(new CustomEvent(name, { detail: event }));
  }

  private emitSettled(): void {
    const at = performance.now();
    const event: PatchEvent = { changed: [...this.settledChanged], patched: this.settledPatched, deferred: 0, computeStart: at, renderStart: at, at };
    this.settledChanged = new Set();
    this.settledPatched = [];
    document.dispatchEvent(new CustomEvent('vaultbook:settled', { detail: event }));
  }
}
