/**
 * The live page's side of its evaluation worker (./evaluate.ts, messages in ./protocol.ts): it starts
 * the worker, posts the page's loads, edits and requests, takes the worker's answers (dropping an
 * answer to an edit that is no longer the latest) and says when the worker fails. LiveSheet
 * (site/preview.ts) patches what the worker answers (site/patch/), and marks the cells an edit may move.
 */
import { downstreamOf } from '../../engine/cases/dirty.js';
import type { CompiledDocument } from '../../engine/index.js';
import type { ResultChange } from '../review.js';
import type { ArchiveInfo } from '../sheet.js';
import type { FromWorker, ToWorker } from './protocol.js';

export type WorkerCases = Extract<FromWorker, { type: 'cases' }>;

/** What the page does with the worker's answers (LiveSheet). */
export interface WorkerHost {
  /**
   * An edit's answer, taken: its cells' HTML and review changes are in `incoming` and `changes`, its
   * parts' in `incomingParts`. `times`: when the worker took the edit, settled it and posted the answer
   * (performance.now(), the page's clock).
   */
  answered(cells: string[], times: { received: number; settled: number; posted: number }): void;
  /** The cases' verdicts asked for with judgeCases: `done(true)` once shown. */
  cases(m: WorkerCases, done: (ok: boolean) => void): void;
  /** The worker failed (it is stopped): `sent`, every cell whose HTML it had sent. */
  failed(reason: string, sent: string[]): void;
}

/** How long the page changes that go with an edit wait for its answer (ms). */
const ANSWER_WAIT_MS = 40;

/** Each given input's transitive dependents (itself included): the cells an edit of it may move. */
function dependentsOf(doc: CompiledDocument): Map<string, string[]> {
  const inputs = doc.graph.cells.filter((c) => c.kind === 'given');
  return new Map(inputs.map((c) => [c.id, [...downstreamOf(doc.graph, [c.id])]]));
}

export class WorkerClient {
  readonly worker: Worker;
  /** The latest edit sent, the latest answer taken, the load the worker works on. */
  private seq = 0;
  private accepted = 0;
  token = 0;
  /** Each cell's latest HTML and review change from the worker; each summary part's latest HTML. */
  readonly incoming = new Map<string, string>();
  readonly incomingParts = new Map<string, string>();
  readonly changes = new Map<string, ResultChange | null>();
  /** Each cell's evaluations for the page's edits since the load. */
  evaluations = new Map<string, number>();
  private downstream = new Map<string, string[]>();
  private casesWanted: { generation: number; done: (ok: boolean) => void } | null = null;
  private driversWanted: { generation: number; done: (html: string | null | undefined) => void } | null = null;
  private driversGeneration = 0;
  private withAnswerQueue: Array<() => void> = [];
  private withAnswerTimer: ReturnType<typeof setTimeout> | undefined;
  private stopped = false;

  /** @throws when the browser cannot start the worker */
  constructor(private readonly host: WorkerHost) {
    // Written out in full so that the build bundles the worker as a file of its own.
    this.worker = new Worker(new URL('./evaluate.ts', import.meta.url), { type: 'module' });
    this.worker.addEventListener('message', (e: MessageEvent<FromWorker>) => this.take(e.data));
    // A worker whose script cannot load or run: the page evaluates on its main thread instead.
    this.worker.addEventListener('error', (e) => { e.preventDefault(); this.fail(`the worker stopped: ${e.message || 'its script did not load'}`); });
    this.worker.addEventListener('messageerror', () => this.fail('a message from the worker could not be read'));
  }

  /** Is every edit sent answered? */
  get answered(): boolean {
    return this.accepted === this.seq;
  }

  /** A document (re)loaded on the page: the worker loads it too, with the page's trial values. */
  load(doc: CompiledDocument, text: string, file: string, archive: ArchiveInfo | undefined, overrides: Array<[string, string]>, cases: Record<string, string> | undefined): void {
    this.token++;
    this.accepted = this.seq;
    this.incoming.clear();
    this.incomingParts.clear();
    this.changes.clear();
    this.evaluations = new Map();
    this.downstream = dependentsOf(doc);
    this.post({ type: 'load', token: this.token, text, file, ...(archive ? { archive } : {}), overrides, ...(cases ? { cases } : {}) });
  }

  /**
   * Sends an edit.
   * @returns the cells it may move
   */
  send(name: string, m: { type: 'set'; name: string; value: string } | { type: 'reset'; name: string }): string[] {
    this.post({ ...m, seq: ++this.seq, accepted: this.accepted });
    return this.downstream.get(name) ?? [];
  }

  /**
   * Runs a change of the page that goes with an edit together with the worker's answer (first thing
   * in the task that patches it) or after `ANSWER_WAIT_MS` if the answer is later; at once when every
   * edit is answered. An edit's own task then writes nothing to the page, so the browser draws no
   * frame before a quick answer is patched.
   */
  withAnswer(fn: () => void): void {
    if (this.answered) {
      fn();
      return;
    }
    this.withAnswerQueue.push(fn);
    this.withAnswerTimer ??= setTimeout(() => this.answerArrived(), ANSWER_WAIT_MS);
  }

  /** Runs the page changes held for the answer (see withAnswer). */
  private answerArrived(): void {
    clearTimeout(this.withAnswerTimer);
    this.withAnswerTimer = undefined;
    for (const fn of this.withAnswerQueue.splice(0)) fn();
  }

  /**
   * Judges every case in the worker; the host shows the verdicts.
   * @returns false when a newer request or load came first, or the worker failed
   */
  judgeCases(trials: Record<string, string>, generation: number): Promise<boolean> {
    this.casesWanted?.done(false);
    return new Promise((ok) => {
      this.casesWanted = { generation, done: ok };
      this.post({ type: 'cases', generation, trials });
    });
  }

  /**
   * What drives a check, worked out in the worker with the page's trial values.
   * @returns the drivers table's HTML, null when the check could not be explained, undefined when a
   *   newer request came first or the worker failed
   */
  drivers(text: string, file: string, overrides: Record<string, string>, target: string): Promise<string | null | undefined> {
    this.driversWanted?.done(undefined);
    const generation = ++this.driversGeneration;
    return new Promise((done) => {
      this.driversWanted = { generation, done: (html) => { if (this.driversWanted?.generation === generation) this.driversWanted = null; done(html); } };
      this.post({ type: 'drivers', generation, text, file, overrides, target });
    });
  }

  private post(m: ToWorker): void {
    if (!this.stopped) this.worker.postMessage(m);
  }

  private take(m: FromWorker): void {
    if (this.stopped) return;
    if (m.type === 'failed') {
      this.fail(`the worker failed: ${m.message}`);
      return;
    }
    if (m.type === 'drivers') {
      if (this.driversWanted?.generation === m.generation) this.driversWanted.done(m.html);
      return;
    }
    if (m.type === 'loaded' || m.token !== this.token) return;
    if (m.type === 'cases') {
      // An answer to an older request (a newer one is on its way): dropped.
      if (this.casesWanted?.generation === m.generation) {
        const done = this.casesWanted.done;
        this.casesWanted = null;
        this.host.cases(m, done);
      }
      return;
    }
    // An answer to an edit that is no longer the latest: dropped (the next answer repeats its cells).
    if (m.seq !== this.seq) return;
    this.accepted = m.seq;
    this.answerArrived();
    this.evaluations = new Map(m.evaluations);
    const [received, settled, posted] = m.times.map((t) => t - performance.timeOrigin) as [number, number, number];
    for (const c of m.cells) {
      this.incoming.set(c.id, c.html);
      this.changes.set(c.id, c.change);
    }
    for (const [part, html] of m.parts) this.incomingParts.set(part, html);
    this.host.answered(m.cells.map((c) => c.id), { received, settled, posted });
  }

  /** The worker cannot go on: it is stopped, every request still open is answered as failed, and the host told. */
  private fail(reason: string): void {
    if (this.stopped) return;
    this.stopped = true;
    this.worker.terminate();
    this.token++;
    this.casesWanted?.done(false);
    this.casesWanted = null;
    this.driversWanted?.done(undefined);
    this.driversWanted = null;
    const sent = [...this.incoming.keys()];
    this.incoming.clear();
    this.incomingParts.clear();
    this.changes.clear();
    this.answerArrived();
    this.host.failed(reason, sent);
  }
}
