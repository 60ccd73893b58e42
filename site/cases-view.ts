/**
 * The cases' verdicts on the live page (judged by site/cases.ts, on the main thread or in the worker):
 * each cases block, the output of each check limited to cases, each check's cases note and the checks
 * summary show them, swapped in a part per task; and each check limited to cases keeps its verdict
 * over the cases as written and as shown now, between which its review change lies (LiveSheet.caseChange).
 */
import { compareVerdicts, type CheckVerdict, type ResultChange } from './review.js';
import { checksShownByCases, verdictsOverCases } from './cases.js';
import { nextTask, WORKER_SLICE_MS } from './patch/slices.js';
import type { CaseRun, CellState, CompiledDocument } from '../engine/index.js';
import type { SheetElements } from './patch/elements.js';
import type { Patcher } from './patch/patcher.js';
import type { WaitingMarks } from './patch/waiting.js';
import type { WorkerCases, WorkerClient } from './worker/client.js';
import { checkCasesNote, renderCasesBlock, renderCellOutput, renderCheckSummary, type RenderContext } from './sheet.js';

/** The cases' verdicts for a document being loaded (LiveCases.judgeLoading). */
export interface LoadCases {
  /** With the page's trial values (less the chosen case's own): what the page shows. */
  run: CaseRun;
  /** The document as written, with no trial value: what a check limited to cases is reviewed against. */
  asWritten: CaseRun;
  trials: Record<string, string>;
}

/** The cases' verdicts as the page shows them, each part rendered when its turn comes (CasesView.apply). */
interface CasesShown {
  blocks: Array<[number, () => string]>;
  /** null: leave the cell as it is (it is patched when it settles). */
  cells: Array<[string, () => string | null]>;
  notes: Array<[string, () => string]>;
  summary: () => string;
  verdicts: Map<string, CheckVerdict>;
}

export class CasesView {
  /** The document shown: a load, or the worker's failure, makes the cases' verdicts on their way out of date. */
  private token = 0;
  /**
   * Each check limited to cases: its verdict over them as written, and as shown now (from the latest
   * cases' verdicts); its change of state is between the two (change).
   */
  private before = new Map<string, CheckVerdict>();
  private now = new Map<string, CheckVerdict>();

  constructor(
    private readonly root: HTMLElement,
    private readonly elements: SheetElements,
    private readonly waiting: WaitingMarks,
    private readonly patcher: Patcher,
    private readonly client: () => WorkerClient | null,
  ) {}

  /** A document loaded, with the cases' verdicts it was painted with (none: it has no cases). */
  load(doc: CompiledDocument, judged: LoadCases | undefined): void {
    this.before = judged ? verdictsOverCases(doc, judged.asWritten) : new Map();
    this.now = judged ? verdictsOverCases(doc, judged.run) : new Map();
  }

  /** A load, or the worker's failure: the verdicts on their way are of a document no longer shown. */
  outdate(): void {
    this.token++;
  }

  /**
   * A check limited to cases: its change of state as the page shows it, its verdict over its cases as
   * written against the latest judged (null: none); undefined for any other cell.
   */
  change(id: string): ResultChange | null | undefined {
    const before = this.before.get(id);
    return before ? compareVerdicts(id, before, this.now.get(id) ?? before) : undefined;
  }

  /**
   * The cases' verdicts, judged on the main thread, rendered from the page's session (`ctx` holds `run`).
   * @returns false when a load or the worker's failure came first
   */
  showJudged(doc: CompiledDocument, states: Map<string, CellState>, ctx: RenderContext, run: CaseRun): Promise<boolean> {
    return this.apply({
      blocks: doc.blocks.flatMap((block): Array<[number, () => string]> => (block.kind === 'calc' && block.cellKind === 'cases' ? [[block.span.start.line, () => renderCasesBlock(block, ctx)]] : [])),
      // A check computing again is patched when it settles (with these verdicts).
      cells: checksShownByCases(doc).map((cell) => [cell.id, () => { const state = states.get(cell.id); return state && state.status !== 'pending' ? renderCellOutput(cell, state, ctx) : null; }]),
      notes: doc.graph.cells.filter((c) => c.kind === 'check').map((cell) => [cell.id, () => checkCasesNote(cell, ctx)]),
      summary: () => renderCheckSummary(doc, states, ctx),
      verdicts: verdictsOverCases(doc, run),
    });
  }

  /** Worker mode: the cases' verdicts as the worker rendered them; then `done(true)`. */
  showFromWorker(m: WorkerCases, done: (ok: boolean) => void): void {
    const html = (h: string) => () => h;
    void this.apply({
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
  private apply(shown: CasesShown): Promise<boolean> {
    const token = this.token;
    const { elements } = this;
    const patched: string[] = [];
    const steps: Array<() => void> = [
      ...shown.blocks.map(([line, render]) => () => {
        const html = render();
        if (elements.lastHtml.get(`#cases-${line}`) === html) return;
        const el = this.root.querySelector<HTMLElement>(`#line-${line} [data-cases]`);
        if (el) el.outerHTML = html;
        elements.lastHtml.set(`#cases-${line}`, html);
      }),
      ...shown.cells.map(([id, render]) => () => {
        const html = render();
        if (html === null) return;
        // Worker mode: a later patch of this cell shows this HTML, not an older answer's.
        this.client()?.incoming.set(id, html);
        const el = elements.cells.get(id);
        if (el && elements.replaceCell(el, id, html)) patched.push(id);
      }),
      ...shown.notes.map(([id, render]) => () => elements.patchNote(id, render())),
      () => {
        this.now = shown.verdicts;
        this.waiting.casesShown();
        const summary = shown.summary();
        this.client()?.incomingParts.set('check-summary', summary);
        if (elements.patchPart('check-summary', () => summary)) patched.push('@check-summary');
        this.patcher.tell([...shown.verdicts.keys()], patched);
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
}
