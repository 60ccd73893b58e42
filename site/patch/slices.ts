/**
 * Worker mode's sliced patching: the queue of an answer's elements in or near view, swapped a slice
 * at a time (WORKER_SLICE_MS, WORKER_SLICE_CHARS), one slice per frame, so that no task of the page
 * grows long; `vaultbook:patched` once the last of them is in, then the deferred cells (further away)
 * a slice per frame too. The Patcher (./patcher.ts) decides what goes in the queue.
 */
import type { PatchEvent } from './patcher.js';
import type { SheetElements } from './elements.js';

/**
 * Evaluating in a worker: milliseconds of element swapping per task of the page. Kept well below the
 * 50 ms of a long task, because the layout and paint of the swapped elements come on top of it and a
 * loaded machine stretches every task.
 */
export const WORKER_SLICE_MS = 4;

/**
 * Evaluating in a worker: characters of new HTML per slice. The new elements' style, layout and paint
 * are done in the frame drawn after the slice; parsing is the smaller part of their cost, so the
 * slice is also bounded by what it adds (about 1,000 elements of a typical sheet).
 */
const WORKER_SLICE_CHARS = 24_000;

/**
 * Runs `fn` in a task right after the next frame is drawn, so that each frame lays out the elements of
 * one slice only; after 100 ms without a frame (a hidden page draws none) it runs anyway.
 */
function afterFrame(fn: () => void): void {
  let done = false;
  const go = () => {
    if (done) return;
    done = true;
    clearTimeout(timer);
    nextTask(fn);
  };
  const timer = setTimeout(go, 100);
  requestAnimationFrame(go);
}

/** Runs `fn` in a task of its own, right after the tasks already queued (no timer clamping). */
export function nextTask(fn: () => void): void {
  const channel = new MessageChannel();
  channel.port1.onmessage = () => {
    channel.port1.close();
    fn();
  };
  channel.port2.postMessage(null);
}

/** What the slices ask of the Patcher. */
export interface SliceHost {
  /** performance.now() when the change being patched began; cleared once its `vaultbook:patched` fired. */
  turnStart: number;
  readonly deferredCount: number;
  /** Renders one cell with its current state; true when its element was replaced. */
  patchCell(id: string): boolean;
  /** Patches deferred cells for up to `budget` ms; schedules the rest. */
  patchDeferred(budget: number): void;
  /** `vaultbook:settled` once nothing is computing or waiting for its patch. */
  settleIfDone(): void;
  /** Tells the listeners of a patch (and fires `name` when given). */
  emit(name: string | null, changed: string[], patched: string[], computeStart: number, renderStart: number): void;
}

export class Slices {
  /** The in-view elements of the result being patched (`@part` for a summary part, `!id` for a cell only reported). */
  private inView: string[] = [];
  private inViewChanged: string[] = [];
  private inViewPatched: string[] = [];
  private renderStart = 0;
  private slicing = false;
  /** A result is being patched whose `vaultbook:patched` has not been fired yet. */
  private awaitedPatch = false;
  /** When the worker took, settled and posted the latest answer. */
  times: PatchEvent['worker'];

  /** @param partRenderers the sheet's parts that depend on every cell, each with its renderer */
  constructor(private readonly host: SliceHost, private readonly elements: SheetElements, private readonly partRenderers: () => Array<[string, () => string]>) {}

  get length(): number {
    return this.inView.length;
  }

  /** A new sheet: nothing queued. */
  reset(): void {
    this.inView = [];
    this.awaitedPatch = false;
  }

  /** The worker failed: its answers not swapped in yet are dropped. */
  drop(): void {
    this.inView = [];
  }

  /**
   * A result's elements in or near view (rendering began at `renderStart`), before those of an
   * earlier result not patched yet; the first slice now unless one is scheduled.
   */
  add(near: string[], renderStart: number): void {
    this.renderStart = renderStart;
    this.inViewChanged = [];
    this.inViewPatched = [];
    // Cells of an earlier result not patched yet keep their place after this one's.
    const queued = new Set(near);
    this.inView = [...near, ...this.inView.filter((id) => !queued.has(id))];
    this.awaitedPatch = true;
    if (!this.slicing) this.slice();
  }

  /** Deferred cells scrolled to: they go first, still a slice per task. */
  seen(wanted: string[]): void {
    this.inView.unshift(...wanted);
    this.kick();
  }

  /** One slice of the in-view queue, then of the deferred cells; schedules the next. */
  slice(): void {
    this.slicing = false;
    if (!this.inView.length) {
      if (this.host.deferredCount) this.host.patchDeferred(WORKER_SLICE_MS);
      else this.host.settleIfDone();
      return;
    }
    const start = performance.now();
    const changed: string[] = [];
    const patched: string[] = [];
    const parts = new Map(this.partRenderers());
    let chars = 0;
    do {
      const id = this.inView.shift()!;
      if (id.startsWith('!')) {
        changed.push(id.slice(1));
        continue;
      }
      if (id.startsWith('@')) {
        if (this.elements.patchPart(id.slice(1), parts.get(id.slice(1))!)) patched.push(id);
        continue;
      }
      changed.push(id);
      if (this.host.patchCell(id)) {
        patched.push(id);
        chars += this.elements.lastHtml.get(id)!.length;
      }
    } while (this.inView.length && performance.now() - start < WORKER_SLICE_MS && chars < WORKER_SLICE_CHARS);
    this.inViewChanged.push(...changed);
    this.inViewPatched.push(...patched);
    if (this.inView.length) {
      this.host.emit(null, changed, patched, start, start);
      this.kick();
      return;
    }
    this.host.emit(null, changed, patched, start, start);
    // Every element in or near view has its new value: the patch the edit waited for.
    if (this.awaitedPatch) {
      this.awaitedPatch = false;
      const event: PatchEvent = {
        changed: this.inViewChanged, patched: this.inViewPatched, deferred: this.host.deferredCount, computeStart: this.host.turnStart || this.renderStart,
        renderStart: this.renderStart, at: performance.now(), ...(this.times ? { worker: this.times } : {}),
      };
      document.dispatchEvent(new CustomEvent('vaultbook:patched', { detail: event }));
      this.host.turnStart = 0;
    }
    if (this.host.deferredCount) this.kick();
    else this.host.settleIfDone();
  }

  /** The next slice, after the next frame (one at a time). */
  kick(): void {
    if (this.slicing) return;
    this.slicing = true;
    afterFrame(() => this.slice());
  }
}
