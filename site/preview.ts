/**
 * LiveSheet: one document on the page, kept in step with its session.
 *
 * The whole sheet is rendered once per document text. After that every state
 * change marks its cell. Once no cell is pending any more (still inside the
 * runtime's turn, so the patch lands in the same frame as the computation)
 * the marked cells in or near the viewport are rendered again
 * (renderCellOutput) and only the elements whose HTML differs are replaced;
 * the page then fires `vaultbook:patched`. Marked cells further away are
 * patched in idle time right after (or at once when scrolled to, or before
 * printing); when none is left the page fires `vaultbook:settled`.
 *
 * By default the evaluation runs in a worker (site/worker/): an edit is sent there, the cells it may
 * move are marked waiting, and the worker answers with the changed cells' HTML. The page swaps them a
 * slice at a time (WORKER_SLICE_MS, WORKER_SLICE_CHARS), one slice per frame, those in or near view
 * first; `vaultbook:patched` fires when those are in, `vaultbook:settled` when all are. Without a
 * worker, or once it fails, the page evaluates on its main thread as above (fallBack).
 */
import { compile, startSession } from '../engine/index.js';
import { readOverride } from '../engine/parse/override.js';
import { compareVerdicts, type CheckVerdict, type ResultChange } from './review.js';
import { checksShownByCases, verdictsOverCases } from './cases.js';
import { WorkerClient, type WorkerCases } from './worker/client.js';
import type { CaseRun, Cell, CellState, CompiledDocument, Diagnostic, Session } from '../engine/index.js';
import { checkCasesNote, makeRenderContext, renderCasesBlock, renderCellOutput, renderCheckSummary, renderDiagnostics, renderSheet, renderStatus, type ArchiveInfo, type RenderContext } from './sheet.js';

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

/** The cases' verdicts for a document being loaded (LiveCases.judgeLoading). */
export interface LoadCases {
  /** With the page's trial values (less the chosen case's own): what the page shows. */
  run: CaseRun;
  /** The document as written, with no trial value: what a check limited to cases is reviewed against. */
  asWritten: CaseRun;
  trials: Record<string, string>;
}

/** The cases' verdicts as the page shows them, each part rendered when its turn comes (LiveSheet.applyCases). */
interface CasesShown {
  blocks: Array<[number, () => string]>;
  /** null: leave the cell as it is (it is patched when it settles). */
  cells: Array<[string, () => string | null]>;
  notes: Array<[string, () => string]>;
  summary: () => string;
  verdicts: Map<string, CheckVerdict>;
}

export interface LoadResult {
  /** Overrides whose input the document no longer has (or no longer accepts), with the reason. */
  dropped: Array<{ name: string; reason: string }>;
}

/**
 * Replaces an element's content with parsed HTML. Parsing into a detached
 * fragment first is cheaper than innerHTML on a styled, attached element.
 */
function replaceInner(el: HTMLElement, html: string): void {
  const range = document.createRange();
  range.selectNodeContents(el);
  el.replaceChildren(range.createContextualFragment(html));
}

type Idle = (fn: (deadline?: IdleDeadline) => void) => void;
const idle: Idle = (fn) => (typeof requestIdleCallback === 'function' ? requestIdleCallback(fn, { timeout: 100 }) : setTimeout(fn, 0));

/** Milliseconds of deferred patching per idle slice. */
const SLICE_MS = 8;

/**
 * Evaluating in a worker: milliseconds of element swapping per task of the page. Kept well below the
 * 50 ms of a long task, because the layout and paint of the swapped elements come on top of it and a
 * loaded machine stretches every task.
 */
const WORKER_SLICE_MS = 4;

/**
 * Evaluating in a worker: characters of new HTML per slice. The new elements' style, layout and paint
 * are done in the frame drawn after the slice; parsing is the smaller part of their cost, so the
 * slice is also bounded by what it adds (about 1,000 elements of a typical sheet).
 */
const WORKER_SLICE_CHARS = 24_000;

/**
 * Evaluate in a worker (site/worker/evaluate.ts), off the page's main thread: the default wherever
 * the page can start one. localStorage `vaultbook:evaluate` = `main` evaluates on the main thread
 * (as does a page whose worker cannot start or fails; see LiveSheet.fallBack).
 */
export function workerChosen(): boolean {
  try {
    return typeof Worker === 'function' && localStorage.getItem('vaultbook:evaluate') !== 'main';
  } catch {
    return typeof Worker === 'function';
  }
}

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
function nextTask(fn: () => void): void {
  const channel = new MessageChannel();
  channel.port1.onmessage = () => {
    channel.port1.close();
    fn();
  };
  channel.port2.postMessage(null);
}

/** The class (with aria-busy) of a cell whose new value is being computed. */
export const WAITING_CLASS = 'lv-computing';

/**
 * The class of a part whose values are out of date until the cases are judged again (each check
 * limited to cases, each cases block), or until an edit's answer arrives (the checks summary). Only
 * a printout shows it (print.css), with the body's PENDING_CLASS banner: the screen has the waiting marks.
 */
export const STALE_CLASS = 'lv-stale';

/** The body's class while any value on the page is pending (print.css prints a banner then). */
export const PENDING_CLASS = 'lv-pending';

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
  /** The HTML each element shows, as rendered (not as the DOM serialises it). */
  private lastHtml = new Map<string, string>();
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
  private turnStart = 0;
  private settledChanged = new Set<string>();
  private settledPatched: string[] = [];
  /** Set by the first state change after a load. */
  private touched = false;
  private unsubscribe: (() => void) | null = null;
  private listeners = new Set<(e: PatchEvent) => void>();

  /** The evaluation worker, when evaluating off the main thread (see workerChosen); null on the main thread. */
  get worker(): Worker | null {
    return this.client?.worker ?? null;
  }
  /** The page's side of the worker (site/worker/client.ts); null on the main thread. */
  private client: WorkerClient | null = null;
  /** The document shown: a load, or the worker's failure, makes the cases' verdicts on their way out of date. */
  private token = 0;
  /**
   * Each check limited to cases: its verdict over them as written, and as shown now (from the latest
   * cases' verdicts); its change of state is between the two (caseChange).
   */
  private casesBefore = new Map<string, CheckVerdict>();
  private casesNow = new Map<string, CheckVerdict>();
  /** The cases are being judged again: what shows their verdicts is out of date. */
  private casesStale = false;
  /** Each cell's evaluations when the load settled (main-thread mode). */
  private loadEvaluations = new Map<string, number>();
  /** Worker mode: cells marked waiting for their new values. */
  private waiting = new Set<string>();
  /** Worker mode: the in-view elements of the result being patched, a slice per task; then `deferred`. */
  private inView: string[] = [];
  private inViewChanged: string[] = [];
  private inViewPatched: string[] = [];
  private renderStart = 0;
  private slicing = false;
  /** Worker mode: a result is being patched whose `vaultbook:patched` has not been fired yet. */
  private awaitedPatch = false;
  private workerTimes: PatchEvent['worker'];
  /** Why the page evaluates on its main thread although a worker was chosen (null: it does not). */
  fallbackReason: string | null = null;

  constructor(readonly root: HTMLElement, readonly isHeld: (el: HTMLElement) => boolean = () => false, useWorker = workerChosen()) {
    if (useWorker) {
      try {
        this.client = new WorkerClient({
          answered: (cells, times) => this.answered(cells, times),
          cases: (m, done) => this.showWorkerCases(m, done),
          failed: (reason, sent) => this.fallBack(reason, sent),
        });
      } catch (e) {
        this.client = null;
        this.fallbackReason = `the worker could not start: ${(e as Error).message}`;
      }
    }
    // A printout must show every value: finish the slices and deferred patches first.
    window.addEventListener('beforeprint', () => {
      while (this.inView.length) this.slice();
      this.patchDeferred(Infinity);
      // Values still computing print marked as such, even within the moment before the page marks them.
      this.markWaiting([...this.waiting]);
    });
  }

  /** Called after each patch (visible cells, then each idle slice), before the DOM events. */
  onPatch(listener: (e: PatchEvent) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /**
   * Compiles and shows a document text, then re-applies the page's overrides where the inputs still exist.
   * @param text the document as read from disk
   */
  /**
   * @param judge the cases' verdicts for the document just evaluated (site/cases.ts), awaited before the sheet
   *   is painted so that the cases block and the checks summary take their full height from the start
   */
  async load(text: string, file: string, archive?: ArchiveInfo, judge?: (doc: CompiledDocument) => Promise<LoadCases | undefined>): Promise<LoadResult> {
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
    this.loadEvaluations = new Map(this.session.evaluations);
    // The context reads session.states live, so one context serves every later patch.
    const options = { standalone: false, ...(archive ? { archive } : {}) };
    const judged = await judge?.(this.doc);
    const cases = judged?.run;
    this.casesStale = false;
    this.casesBefore = judged ? verdictsOverCases(this.doc, judged.asWritten) : new Map();
    this.casesNow = judged ? verdictsOverCases(this.doc, judged.run) : new Map();
    this.ctx = makeRenderContext(this.doc, this.session.states, this.session.warnings, options);
    if (cases) this.ctx.cases = cases;
    this.root.innerHTML = renderSheet({ doc: this.doc, states: this.session.states, warnings: this.session.warnings, options, ...(cases ? { cases } : {}) });
    this.index();
    this.unsubscribe = this.session.subscribe((id, state) => this.mark(id, state));
    this.token++;
    this.client?.load(this.doc, text, file, archive, [...this.overrides], judged?.trials);
    return { dropped };
  }

  private index(): void {
    for (const set of [this.dirty, this.held, this.deferred, this.visible, this.pending, this.settledChanged, this.waiting]) set.clear();
    this.cells.clear();
    this.parts.clear();
    this.lastHtml.clear();
    this.settledPatched = [];
    this.touched = false;
    this.inView = [];
    this.awaitedPatch = false;
    this.observer?.disconnect();
    this.observer = typeof IntersectionObserver === 'function'
      ? new IntersectionObserver((entries) => this.seen(entries), { rootMargin: '50% 0px 50% 0px' })
      : null;
    for (const el of this.root.querySelectorAll<HTMLElement>('[data-cell]')) {
      this.cells.set(el.dataset.cell!, el);
      this.observer?.observe(el);
    }
    for (const el of this.root.querySelectorAll<HTMLElement>('[data-part]')) this.parts.set(el.dataset.part!, el);
    for (const [part, render] of this.partRenderers()) {
      this.lastHtml.set(`@${part}`, render());
      const el = this.parts.get(part);
      if (el) this.observer?.observe(el);
    }
    for (const cell of this.doc.graph.cells) if (cell.kind === 'check') this.lastHtml.set(`~note-${cell.id}`, checkCasesNote(cell, this.ctx));
    this.showPending();
    // In worker mode the states on the page are those of the load only: nothing to learn from them.
    if (!this.worker) this.learnShownHtml();
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
    if (!this.worker) this.patchDeferred(Infinity);
    else {
      for (const id of wanted) this.deferred.delete(id);
      this.inView.unshift(...wanted);
      this.kick();
    }
  }

  /**
   * In idle time after a load, renders each cell once more to learn the HTML it shows,
   * so the first edit compares against it instead of replacing every changed element.
   */
  private learnShownHtml(): void {
    const doc = this.doc;
    const states = new Map(this.session.states);
    const ids = [...this.cells.keys()];
    const step = (deadline?: IdleDeadline) => {
      // Only while the page is as loaded: a render reads the current states, which an edit changes.
      while (ids.length && this.doc === doc && !this.touched && (!deadline || deadline.timeRemaining() > 2)) {
        const id = ids.pop()!;
        const state = states.get(id);
        if (!this.lastHtml.has(id) && state && state.status !== 'pending') this.lastHtml.set(id, this.render(id, state));
      }
      if (ids.length && this.doc === doc && !this.touched) idle(step);
    };
    idle(step);
  }

  /** The sheet's parts that depend on every cell: status banner, checks summary, diagnostics list. */
  private partRenderers(): Array<[string, () => string]> {
    if (this.worker) {
      const incoming = this.client!.incomingParts;
      return ['status', 'check-summary', 'diagnostics'].map((part) => [part, () => incoming.get(part) ?? this.lastHtml.get(`@${part}`) ?? '']);
    }
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

  /** Is every change on the page (no cell computing, none waiting for its patch)? */
  get settled(): boolean {
    return this.waiting.size === 0 && this.pending.size === 0 && this.dirty.size === 0 && this.deferred.size === 0 && this.inView.length === 0;
  }

  /** The value text an input has now (the override, else the document's). */
  sourceOf(name: string): string {
    return this.overrides.get(name) ?? this.documentSourceOf(name);
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
    if (this.client) {
      const d = this.check(name, value);
      if (d) return d;
      this.overrides.set(name, value);
      this.send(name, { type: 'set', name, value });
      return null;
    }
    const d = this.session.setInput(name, value);
    if (!d) this.overrides.set(name, value);
    return d;
  }

  resetInput(name: string): void {
    if (!this.overrides.has(name)) return;
    this.overrides.delete(name);
    if (this.client) this.send(name, { type: 'reset', name });
    else this.session.resetInput(name);
  }

  /** Worker mode: is a value text acceptable for this input (as session.setInput judges it)? */
  private check(name: string, value: string): Diagnostic | null {
    const cell = this.doc.graph.byId.get(name);
    const reading = readOverride(cell, name, value, (n) => this.doc.graph.byId.has(n));
    if (reading.ok) return null;
    return {
      message: reading.message, file: this.doc.file ?? '', line: cell?.span.start.line ?? 1, column: 1, endLine: cell?.span.end.line ?? 1,
      endColumn: 1, cellId: name, ruleId: reading.ruleId, severity: 'error',
    };
  }

  /** Worker mode: sends an edit and marks the cells it moves as waiting. */
  private send(name: string, m: { type: 'set'; name: string; value: string } | { type: 'reset'; name: string }): void {
    this.touched = true;
    this.turnStart = performance.now();
    const moved = this.client!.send(name, m).filter((id) => !this.waiting.has(id));
    for (const id of moved) this.waiting.add(id);
    // Marked on the page with the answer's task, or once the answer is late: a quick answer then
    // patches in the task after the edit's, with no frame drawn in between for the marks.
    this.withAnswer(() => this.markWaiting(moved));
  }

  /** Marks the cells still waiting for their new values among `ids` (class and aria-busy). */
  private markWaiting(ids: string[]): void {
    let marked = false;
    for (const id of ids) {
      const el = this.waiting.has(id) ? this.cells.get(id) : undefined;
      if (!el) continue;
      el.classList.add(WAITING_CLASS);
      el.setAttribute('aria-busy', 'true');
      marked = true;
    }
    if (marked) this.showPending();
  }

  /**
   * The cases are being judged again (site/cases.ts, from the moment the page settles after a change
   * until their verdicts are shown): what shows them is out of date meanwhile.
   */
  judgingCases(on: boolean): void {
    if (this.casesStale === on) return;
    this.casesStale = on;
    this.showPending();
  }

  /**
   * Marks what is out of date, for a printout (print.css): the parts that show the cases' verdicts
   * while they are judged again, the checks summary while an edit's answer is awaited too, and the
   * body (a banner) while anything is pending.
   */
  private showPending(): void {
    const waiting = this.waiting.size > 0 && [...this.waiting].some((id) => this.cells.get(id)?.classList.contains(WAITING_CLASS));
    document.body.classList.toggle(PENDING_CLASS, waiting || this.casesStale);
    this.parts.get('check-summary')?.classList.toggle(STALE_CLASS, waiting || this.casesStale);
    for (const el of this.root.querySelectorAll<HTMLElement>('[data-cases]')) el.classList.toggle(STALE_CLASS, this.casesStale);
    if (this.doc) for (const cell of checksShownByCases(this.doc)) this.cells.get(cell.id)?.classList.toggle(STALE_CLASS, this.casesStale);
  }

  /**
   * Runs a change of the page that goes with an edit: evaluating in a worker, together with the
   * worker's answer or once it is late (WorkerClient.withAnswer); at once otherwise.
   */
  withAnswer(fn: () => void): void {
    if (this.client) this.client.withAnswer(fn);
    else fn();
  }

  /** Worker mode: a cell's new value arrived (or none is coming): no longer marked waiting. */
  private unmark(id: string): void {
    if (!this.waiting.delete(id)) return;
    const el = this.cells.get(id);
    el?.classList.remove(WAITING_CLASS);
    el?.removeAttribute('aria-busy');
    if (this.waiting.size === 0) this.showPending();
  }

  /** Worker mode: an edit's answer (its cells' HTML is in the client's `incoming`): patched a slice at a time. */
  private answered(cells: string[], times: NonNullable<PatchEvent['worker']>): void {
    this.workerTimes = times;
    for (const id of cells) this.dirty.add(id);
    // Cells the edit might have moved but did not: nothing is coming for them.
    for (const id of [...this.waiting]) if (!this.dirty.has(id)) this.unmark(id);
    if (this.dirty.size) this.flush();
    else this.emitSettled();
  }

  /**
   * The worker cannot start, or failed: the page evaluates on its main thread from now on. Its
   * session still holds the load's values; the trial values set since are applied to it, and the
   * cells they move are patched as after any edit. `sent`: every cell the worker had sent, shown
   * again from this page's session (some of its answers may not have been swapped in yet, or belong
   * to a trial value taken back since).
   */
  private fallBack(reason: string, sent: string[]): void {
    console.warn(`vaultbook: evaluating on the page's main thread (${reason})`);
    this.fallbackReason = reason;
    this.client = null;
    this.token++;
    for (const id of [...this.waiting]) this.unmark(id);
    this.inView = [];
    if (!this.doc) return; // not loaded yet: the load evaluates on the main thread
    for (const cell of this.doc.graph.cells) {
      if (cell.kind !== 'given') continue;
      const value = this.overrides.get(cell.id);
      if (value === undefined) this.session.resetInput(cell.id);
      else if (this.session.setInput(cell.id, value)) this.overrides.delete(cell.id);
    }
    for (const id of sent) this.dirty.add(id);
    this.schedule();
    document.dispatchEvent(new CustomEvent('vaultbook:fallback', { detail: { reason } }));
  }

  /**
   * A check limited to cases: its change of state as the page shows it, its verdict over its cases as
   * written against the latest judged (null: none); undefined for any other cell.
   */
  caseChange(id: string): ResultChange | null | undefined {
    const before = this.casesBefore.get(id);
    return before ? compareVerdicts(id, before, this.casesNow.get(id) ?? before) : undefined;
  }

  /** Worker mode: the review change of a result, as the worker computed it (undefined: no news). */
  workerChange(id: string): ResultChange | null | undefined {
    return this.client?.changes.get(id);
  }

  /** How many cell evaluations the edits since the load ran (in the worker, in worker mode). */
  evaluationCount(): number {
    return [...this.evaluationCounts().values()].reduce((a, b) => a + b, 0);
  }

  /** Each cell's evaluations for the edits since the load (in the worker, in worker mode); the load's own are not counted. */
  evaluationCounts(): Map<string, number> {
    if (this.client) return new Map(this.client.evaluations);
    const out = new Map<string, number>();
    for (const [id, n] of this.session.evaluations) if (n > (this.loadEvaluations.get(id) ?? 0)) out.set(id, n - (this.loadEvaluations.get(id) ?? 0));
    return out;
  }

  /**
   * Worker mode: judges every case in the worker and shows the verdicts.
   * @returns false when a newer request or load came first
   */
  judgeCasesInWorker(trials: Record<string, string>, generation: number): Promise<boolean> {
    return this.client ? this.client.judgeCases(trials, generation) : Promise.resolve(false);
  }

  /**
   * Worker mode: what drives a check, worked out in the worker with the page's trial values.
   * @returns the drivers table's HTML, null when the check could not be explained, undefined when a
   *   newer request came first or the worker failed (the page then works it out itself)
   */
  driversInWorker(text: string, target: string): Promise<string | null | undefined> {
    return this.client ? this.client.drivers(text, this.doc.file ?? '', Object.fromEntries(this.overrides), target) : Promise.resolve(undefined);
  }

  /** Worker mode: the cases' verdicts as the worker rendered them (see applyCases); then `done(true)`. */
  private showWorkerCases(m: WorkerCases, done: (ok: boolean) => void): void {
    const html = (h: string) => () => h;
    void this.applyCases({
      blocks: m.blocks.map(([line, h]) => [line, html(h)]), cells: m.cells.map(([id, h]) => [id, html(h)]),
      notes: m.notes.map(([id, h]) => [id, html(h)]), summary: html(m.summary), verdicts: new Map(m.verdicts),
    }).then(done);
  }

  /**
   * The cases' verdicts on the page, a part per task (a cases block is a table; a check's output is
   * typeset), WORKER_SLICE_MS of them at most: each cases block, the output of each check limited to
   * cases (it shows its verdict over them), each check's cases note, then in one last task the checks
   * summary with the review badges and panel (the listeners, told of every check limited to cases).
   * A part that reads as before is left alone.
   * @returns false when a load, or the worker's failure, came first
   */
  private applyCases(shown: CasesShown): Promise<boolean> {
    const token = this.token;
    const patched: string[] = [];
    const steps: Array<() => void> = [
      ...shown.blocks.map(([line, render]) => () => {
        const html = render();
        if (this.lastHtml.get(`#cases-${line}`) === html) return;
        const el = this.root.querySelector<HTMLElement>(`#line-${line} [data-cases]`);
        if (el) el.outerHTML = html;
        this.lastHtml.set(`#cases-${line}`, html);
      }),
      ...shown.cells.map(([id, render]) => () => {
        const html = render();
        if (html === null) return;
        // Worker mode: a later patch of this cell shows this HTML, not an older answer's.
        this.client?.incoming.set(id, html);
        const el = this.cells.get(id);
        if (!el || html === this.lastHtml.get(id)) return;
        replaceInner(el, html);
        this.lastHtml.set(id, html);
        patched.push(id);
      }),
      ...shown.notes.map(([id, render]) => () => this.patchNote(id, render())),
      () => {
        this.casesNow = shown.verdicts;
        this.casesStale = false;
        this.showPending();
        const summary = shown.summary();
        this.client?.incomingParts.set('check-summary', summary);
        if (this.patchPart('check-summary', () => summary)) patched.push('@check-summary');
        const at = performance.now();
        const event: PatchEvent = { changed: [...shown.verdicts.keys()], patched, deferred: this.deferred.size, computeStart: at, renderStart: at, at };
        for (const l of this.listeners) l(event);
      },
    ];
    return new Promise((done) => {
      const step = () => {
        // A load, or the worker's failure, since: these verdicts are of a document no longer shown.
        if (token !== this.token) return done(false);
        const start = performance.now();
        do steps.shift()!();
        while (steps.length && performance.now() - start < WORKER_SLICE_MS);
        if (steps.length) nextTask(step);
        else done(true);
      };
      step();
    });
  }

  /** A check's cases note (its governing case), above its output; '' removes it. */
  private patchNote(id: string, html: string): void {
    const key = `~note-${id}`;
    const out = this.cells.get(id);
    if (this.lastHtml.get(key) === html || !out?.parentElement) return;
    out.parentElement.querySelector(':scope > .vb-casenote')?.remove();
    if (html) out.insertAdjacentHTML('beforebegin', html);
    this.lastHtml.set(key, html);
  }

  resetAll(): void {
    for (const name of [...this.overrides.keys()]) this.resetInput(name);
  }

  private mark(id: string, state: CellState): void {
    this.touched = true;
    if (state.status === 'pending') {
      if (this.turnStart === 0) this.turnStart = performance.now();
      this.pending.add(id);
      return;
    }
    this.pending.delete(id);
    this.dirty.add(id);
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

  private render(id: string, state: CellState): string {
    if (this.client) return this.client.incoming.get(id) ?? this.lastHtml.get(id) ?? '';
    const cell = this.doc.graph.byId.get(id);
    return cell ? renderCellOutput(cell, state, this.ctx) : '';
  }

  /** Renders one cell with its current state; true when its element was replaced. */
  private patchCell(id: string): boolean {
    if (this.worker) this.unmark(id);
    const el = this.cells.get(id)!;
    const state = this.session.states.get(id)!;
    // Unknown HTML (not learned yet) is replaced: rendering the old state now would mix in new input values.
    const html = this.render(id, state);
    if (html === this.lastHtml.get(id)) return false;
    replaceInner(el, html);
    this.lastHtml.set(id, html);
    return true;
  }

  private flush(): void {
    if (this.dirty.size === 0) return;
    if (this.worker) {
      this.flushSliced();
      return;
    }
    const renderStart = performance.now();
    const changed: string[] = [];
    const patched: string[] = [];
    for (const id of this.dirty) {
      const state = this.session.states.get(id);
      if (!state || state.status === 'pending') continue;
      const el = this.cells.get(id);
      if (el && this.observer && !this.visible.has(id) && !this.isHeld(el)) {
        this.deferred.add(id); // reported when its slice patches it
        continue;
      }
      changed.push(id);
      if (!el) continue;
      if (this.isHeld(el)) this.held.add(id);
      else {
        this.deferred.delete(id);
        if (this.patchCell(id)) patched.push(id);
      }
    }
    this.dirty.clear();
    // The summary parts change with the cells: patched now when in view, else with the deferred cells.
    for (const [part, render] of this.partRenderers()) {
      if (this.observer && !this.visible.has(`@${part}`)) this.deferred.add(`@${part}`);
      else if (this.patchPart(part, render)) patched.push(`@${part}`);
    }
    this.emit('vaultbook:patched', changed, patched, this.turnStart || renderStart, renderStart);
    this.turnStart = 0;
    if (this.deferred.size && !this.deferring) {
      this.deferring = true;
      this.later();
    } else if (!this.deferred.size) this.emitSettled();
  }

  /**
   * Worker mode: a result's cells, swapped a slice of WORKER_SLICE_MS per task: those in or near view
   * first (then `vaultbook:patched`), the summary parts in view with them, the rest after (then
   * `vaultbook:settled`). Each cell loses its waiting mark as its new value lands.
   */
  private flushSliced(): void {
    this.renderStart = performance.now();
    this.inViewChanged = [];
    this.inViewPatched = [];
    const near: string[] = [];
    for (const id of this.dirty) {
      const el = this.cells.get(id);
      if (!el || this.isHeld(el)) {
        // No element, or its field is open (patched when it closes): reported with the first slice.
        this.unmark(id);
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
    // Cells of an earlier result not patched yet keep their place after this one's.
    const queued = new Set(near);
    this.inView = [...near, ...this.inView.filter((id) => !queued.has(id))];
    this.awaitedPatch = true;
    if (!this.slicing) this.slice();
  }

  /** Worker mode: one slice of the in-view queue, then of the deferred cells; schedules the next. */
  private slice(): void {
    this.slicing = false;
    if (!this.inView.length) {
      if (this.deferred.size) this.patchDeferred(WORKER_SLICE_MS);
      else this.settleIfDone();
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
        if (this.patchPart(id.slice(1), parts.get(id.slice(1))!)) patched.push(id);
        continue;
      }
      changed.push(id);
      if (this.patchCell(id)) {
        patched.push(id);
        chars += this.lastHtml.get(id)!.length;
      }
    } while (this.inView.length && performance.now() - start < WORKER_SLICE_MS && chars < WORKER_SLICE_CHARS);
    this.inViewChanged.push(...changed);
    this.inViewPatched.push(...patched);
    if (this.inView.length) {
      this.emit(null, changed, patched, start, start);
      this.kick();
      return;
    }
    this.emit(null, changed, patched, start, start);
    // Every element in or near view has its new value: the patch the edit waited for.
    if (this.awaitedPatch) {
      this.awaitedPatch = false;
      const event: PatchEvent = {
        changed: this.inViewChanged, patched: this.inViewPatched, deferred: this.deferred.size, computeStart: this.turnStart || this.renderStart,
        renderStart: this.renderStart, at: performance.now(), ...(this.workerTimes ? { worker: this.workerTimes } : {}),
      };
      document.dispatchEvent(new CustomEvent('vaultbook:patched', { detail: event }));
      this.turnStart = 0;
    }
    if (this.deferred.size) this.kick();
    else this.settleIfDone();
  }

  /** Worker mode: the next slice, after the next frame (one at a time). */
  private kick(): void {
    if (this.slicing) return;
    this.slicing = true;
    afterFrame(() => this.slice());
  }

  /**
   * Schedules the next slice of waiting cells: in idle time, as long as the idle period allows; in
   * worker mode one short slice per frame, so that no task of the page grows long.
   */
  private later(): void {
    if (this.worker) {
      this.deferring = false;
      this.kick();
    }
    else idle((deadline) => this.patchDeferred(deadline ? Math.max(SLICE_MS, deadline.timeRemaining()) : SLICE_MS));
  }

  /** Patches waiting cells for up to `budget` ms; schedules the rest. */
  private patchDeferred(budget: number): void {
    this.deferring = false;
    if (!this.deferred.size) return;
    const start = performance.now();
    const patched: string[] = [];
    const done: string[] = [];
    const parts = new Map(this.partRenderers());
    for (const id of this.deferred) {
      if (performance.now() - start > budget) break;
      done.push(id);
      if (id.startsWith('@')) {
        if (this.patchPart(id.slice(1), parts.get(id.slice(1))!)) patched.push(id);
        continue;
      }
      const state = this.session.states.get(id);
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
  private settleIfDone(): void {
    if (this.pending.size || this.dirty.size || this.inView.length) return;
    // Worker mode: an edit sent since is still to be answered; its answer settles the page.
    if (this.client && !this.client.answered) return;
    this.emitSettled();
  }

  private emit(name: string | null, changed: string[], patched: string[], computeStart: number, renderStart: number): void {
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

  /**
   * The cases' verdicts (site/cases.ts), judged on the main thread: each cases block, each check
   * limited to cases, the cases notes and the checks summary show them from now on (see applyCases).
   * @returns false when a load or the worker's failure came first
   */
  showCases(run: CaseRun): Promise<boolean> {
    this.ctx.cases = run;
    const { doc, ctx } = this;
    const states = this.session.states;
    return this.applyCases({
      blocks: doc.blocks.flatMap((block): Array<[number, () => string]> => (block.kind === 'calc' && block.cellKind === 'cases' ? [[block.span.start.line, () => renderCasesBlock(block, ctx)]] : [])),
      // A check computing again is patched when it settles (with these verdicts).
      cells: checksShownByCases(doc).map((cell) => [cell.id, () => { const state = states.get(cell.id); return state && state.status !== 'pending' ? renderCellOutput(cell, state, ctx) : null; }]),
      notes: doc.graph.cells.filter((c) => c.kind === 'check').map((cell) => [cell.id, () => checkCasesNote(cell, ctx)]),
      summary: () => renderCheckSummary(doc, states, ctx),
      verdicts: verdictsOverCases(doc, run),
    });
  }

  private patchPart(part: string, render: () => string): boolean {
    const el = this.parts.get(part);
    if (!el) return false;
    const html = render();
    if (html === this.lastHtml.get(`@${part}`)) return false;
    replaceInner(el, html);
    this.lastHtml.set(`@${part}`, html);
    return true;
  }
}
