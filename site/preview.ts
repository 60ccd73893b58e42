/**
 * LiveSheet: one document on the page, kept in step with its session.
 *
 * The whole sheet is rendered once per document text (load); after that the page's edits go to the
 * session, or by default to the evaluation worker (site/worker/: an edit is sent there, the cells it
 * may move are marked waiting, and the worker answers with the changed cells' HTML). What changed is
 * swapped in by the patcher (site/patch/patcher.ts: in view first, then the rest; in worker mode a
 * slice per frame, site/patch/slices.ts), which fires `vaultbook:patched` and `vaultbook:settled`.
 * Waiting marks and what a printout marks pending are in site/patch/waiting.ts; the cases' verdicts
 * on the page in site/cases-view.ts. Without a worker, or once it fails, the page evaluates on its
 * main thread (fallBack).
 */
import { compile, startSession } from '../engine/index.js';
import { readOverride } from '../engine/parse/override.js';
import type { ResultChange } from './review.js';
import { CasesView, type LoadCases } from './cases-view.js';
import { SheetElements } from './patch/elements.js';
import { idle, Patcher, type PatchEvent } from './patch/patcher.js';
import { WaitingMarks } from './patch/waiting.js';
import { WorkerClient } from './worker/client.js';
import type { CaseRun, Cell, CellState, CompiledDocument, Diagnostic, Session } from '../engine/index.js';
import { checkCasesNote, makeRenderContext, renderCellOutput, renderCheckSummary, renderDiagnostics, renderSheet, renderStatus, type ArchiveInfo, type RenderContext } from './sheet.js';

export type { PatchEvent } from './patch/patcher.js';
export type { LoadCases } from './cases-view.js';

export interface LoadResult {
  /** Overrides whose input the document no longer has (or no longer accepts), with the reason. */
  dropped: Array<{ name: string; reason: string }>;
}

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


export class LiveSheet {
  doc!: CompiledDocument;
  session!: Session;
  /** The document's own results, before any override: what a review compares against. */
  baseline = new Map<string, CellState>();
  /** Inputs set on the page: name → value text. */
  readonly overrides = new Map<string, string>();
  private ctx!: RenderContext;
  /** Set by the first state change after a load. */
  private touched = false;
  private unsubscribe: (() => void) | null = null;

  /** The evaluation worker, when evaluating off the main thread (see workerChosen); null on the main thread. */
  get worker(): Worker | null {
    return this.client?.worker ?? null;
  }
  /** The page's side of the worker (site/worker/client.ts); null on the main thread. */
  private client: WorkerClient | null = null;
  /** Each cell's evaluations when the load settled (main-thread mode). */
  private loadEvaluations = new Map<string, number>();
  /** Why the page evaluates on its main thread although a worker was chosen (null: it does not). */
  fallbackReason: string | null = null;
  private readonly elements = new SheetElements();
  /** Worker mode: cells marked waiting for their new values; what a printout marks pending. */
  private readonly waiting: WaitingMarks;
  private readonly patcher: Patcher;
  private readonly cases: CasesView;

  constructor(readonly root: HTMLElement, readonly isHeld: (el: HTMLElement) => boolean = () => false, useWorker = workerChosen()) {
    this.waiting = new WaitingMarks(root, this.elements, () => this.doc);
    this.patcher = new Patcher({
      inWorker: () => this.worker !== null,
      states: () => this.session.states,
      render: (id, state) => this.render(id, state),
      partRenderers: () => this.partRenderers(),
      isHeld: (el) => this.isHeld(el),
      awaitingAnswer: () => this.client !== null && !this.client.answered,
    }, this.elements, this.waiting);
    this.cases = new CasesView(root, this.elements, this.waiting, this.patcher, () => this.client);
    if (useWorker) {
      try {
        this.client = new WorkerClient({
          answered: (cells, times) => this.patcher.answered(cells, times),
          cases: (m, done) => this.cases.showFromWorker(m, done),
          failed: (reason, sent) => this.fallBack(reason, sent),
        });
      } catch (e) {
        this.client = null;
        this.fallbackReason = `the worker could not start: ${(e as Error).message}`;
      }
    }
    // A printout must show every value: finish the slices and deferred patches first.
    window.addEventListener('beforeprint', () => {
      this.patcher.finish();
      // Values still computing print marked as such, even within the moment before the page marks them.
      this.waiting.mark(this.waiting.ids());
    });
  }

  /** Called after each patch (visible cells, then each idle slice), before the DOM events. */
  onPatch(listener: (e: PatchEvent) => void): () => void {
    return this.patcher.onPatch(listener);
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
    this.cases.load(this.doc, judged);
    this.ctx = makeRenderContext(this.doc, this.session.states, this.session.warnings, options);
    if (cases) this.ctx.cases = cases;
    this.root.innerHTML = renderSheet({ doc: this.doc, states: this.session.states, warnings: this.session.warnings, options, ...(cases ? { cases } : {}) });
    this.index();
    this.unsubscribe = this.session.subscribe((id, state) => {
      this.touched = true;
      this.patcher.mark(id, state);
    });
    this.cases.outdate();
    this.client?.load(this.doc, text, file, archive, [...this.overrides], judged?.trials);
    return { dropped };
  }

  private index(): void {
    this.waiting.clear();
    this.touched = false;
    this.elements.index(this.root);
    this.patcher.reset();
    for (const [part, render] of this.partRenderers()) {
      this.elements.lastHtml.set(`@${part}`, render());
      this.patcher.observe(this.elements.parts.get(part));
    }
    for (const cell of this.doc.graph.cells) if (cell.kind === 'check') this.elements.lastHtml.set(`~note-${cell.id}`, checkCasesNote(cell, this.ctx));
    this.waiting.showPending();
    // In worker mode the states on the page are those of the load only: nothing to learn from them.
    if (!this.worker) this.learnShownHtml();
  }

  /**
   * In idle time after a load, renders each cell once more to learn the HTML it shows,
   * so the first edit compares against it instead of replacing every changed element.
   */
  private learnShownHtml(): void {
    const doc = this.doc;
    const states = new Map(this.session.states);
    const ids = [...this.elements.cells.keys()];
    const lastHtml = this.elements.lastHtml;
    const step = (deadline?: IdleDeadline) => {
      // Only while the page is as loaded: a render reads the current states, which an edit changes.
      while (ids.length && this.doc === doc && !this.touched && (!deadline || deadline.timeRemaining() > 2)) {
        const id = ids.pop()!;
        const state = states.get(id);
        if (!lastHtml.has(id) && state && state.status !== 'pending') lastHtml.set(id, this.render(id, state));
      }
      if (ids.length && this.doc === doc && !this.touched) idle(step);
    };
    idle(step);
  }

  /** The sheet's parts that depend on every cell: status banner, checks summary, diagnostics list. */
  private partRenderers(): Array<[string, () => string]> {
    if (this.worker) {
      const incoming = this.client!.incomingParts;
      const lastHtml = this.elements.lastHtml;
      return ['status', 'check-summary', 'diagnostics'].map((part) => [part, () => incoming.get(part) ?? lastHtml.get(`@${part}`) ?? '']);
    }
    const { doc, ctx } = this;
    const states = this.session.states, warnings = this.session.warnings;
    return [
      ['status', () => renderStatus(doc, states, warnings)],
      ['check-summary', () => renderCheckSummary(doc, states, ctx)],
      ['diagnostics', () => renderDiagnostics(doc, states, warnings)],
    ];
  }

  private render(id: string, state: CellState): string {
    if (this.client) return this.client.incoming.get(id) ?? this.elements.lastHtml.get(id) ?? '';
    const cell = this.doc.graph.byId.get(id);
    return cell ? renderCellOutput(cell, state, this.ctx) : '';
  }

  cellElement(id: string): HTMLElement | undefined {
    return this.elements.cells.get(id);
  }

  cell(id: string): Cell | undefined {
    return this.doc.graph.byId.get(id);
  }

  /** Is every change on the page (no cell computing, none waiting for its patch)? */
  get settled(): boolean {
    return this.waiting.size === 0 && this.patcher.settled;
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

  resetAll(): void {
    for (const name of [...this.overrides.keys()]) this.resetInput(name);
  }

  /** Re-renders cells that were held back (an input being edited) once they are free. */
  release(): void {
    this.patcher.release();
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
    this.patcher.turnStart = performance.now();
    const moved = this.client!.send(name, m).filter((id) => !this.waiting.has(id));
    this.waiting.add(moved);
    // Marked on the page with the answer's task, or once the answer is late: a quick answer then
    // patches in the task after the edit's, with no frame drawn in between for the marks.
    this.withAnswer(() => this.waiting.mark(moved));
  }

  /**
   * The cases are being judged again (site/cases.ts, from the moment the page settles after a change
   * until their verdicts are shown): what shows them is out of date meanwhile.
   */
  judgingCases(on: boolean): void {
    this.waiting.judgingCases(on);
  }

  /**
   * Runs a change of the page that goes with an edit: evaluating in a worker, together with the
   * worker's answer or once it is late (WorkerClient.withAnswer); at once otherwise.
   */
  withAnswer(fn: () => void): void {
    if (this.client) this.client.withAnswer(fn);
    else fn();
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
    this.cases.outdate();
    for (const id of this.waiting.ids()) this.waiting.unmark(id);
    this.patcher.dropSlices();
    if (!this.doc) return; // not loaded yet: the load evaluates on the main thread
    for (const cell of this.doc.graph.cells) {
      if (cell.kind !== 'given') continue;
      const value = this.overrides.get(cell.id);
      if (value === undefined) this.session.resetInput(cell.id);
      else if (this.session.setInput(cell.id, value)) this.overrides.delete(cell.id);
    }
    this.patcher.refresh(sent);
    document.dispatchEvent(new CustomEvent('vaultbook:fallback', { detail: { reason } }));
  }

  /**
   * A check limited to cases: its change of state as the page shows it, its verdict over its cases as
   * written against the latest judged (null: none); undefined for any other cell.
   */
  caseChange(id: string): ResultChange | null | undefined {
    return this.cases.change(id);
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

  /**
   * The cases' verdicts (site/cases.ts), judged on the main thread: each cases block, each check
   * limited to cases, the cases notes and the checks summary show them from now on (site/cases-view.ts).
   * @returns false when a load or the worker's failure came first
   */
  showCases(run: CaseRun): Promise<boolean> {
    this.ctx.cases = run;
    return this.cases.showJudged(this.doc, this.session.states, this.ctx, run);
  }
}
