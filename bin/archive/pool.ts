/**
 * evaluateArchive: many calc files → one FileReport each, evaluated on every
 * core: the main thread (whose engine is already loaded) plus worker threads.
 *
 * A worker must load the whole engine before its first file, which costs more
 * than evaluating dozens of small calcs (mostly mathjs's module graph), so the
 * main thread starts on the queue at once and workers are only started when
 * files are still waiting after a short while. Files are handed out one or
 * two at a time, so a slow calc never holds up a queue behind it.
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { setImmediate as yieldToEvents } from 'node:timers/promises';
import { loadAndEvaluate } from '../load.js';
import { workerUrl } from '../worker-url.js';
import type { Job } from './worker.js';
import { failedReport, reportOf, type FileReport } from './report.js';

export interface ArchiveOptions {
  overrides?: Record<string, string>;
  /** Threads evaluating files, the main thread included; default os.availableParallelism(). */
  jobs?: number;
  /** Keep each file's whole summary (for --json). */
  full?: boolean;
  /** Called after each file, in completion order. */
  onReport?: (report: FileReport, done: number, total: number) => void;
  /** How long the main thread works alone before workers are started (ms). */
  workerDelay?: number;
  /** false: evaluate on worker threads only (`jobs` of them, started at once). */
  useMainThread?: boolean;
  /** The workers' code (default: the bundled worker, or bin/archive/worker-entry.js from the sources). */
  workerEntry?: URL;
}

export interface ArchiveResult {
  /** One report per file, in the order the files were given. */
  reports: FileReport[];
  /** Worker threads started (replacements included). */
  workersStarted: number;
  /** Files evaluated on worker threads (the rest ran on the main thread). */
  byWorkers: number;
  /** Why the first worker that failed to start did so; absent when none failed. */
  workerFailure?: string;
}

const WORKER_ENTRY = workerUrl('archive-worker.cjs', new URL('./worker-entry.js', import.meta.url));
/** Files a worker holds at once, so it never waits on the main thread for its next one. */
const IN_FLIGHT = 2;

/**
 * Evaluates every file on the main thread and a pool of worker threads.
 * @param files paths as given (already expanded)
 * @returns the reports in file order; a worker that dies costs only the files it held
 * @example const {reports} = await evaluateArchive(['a.md', 'b.md'], {jobs: 2})
 */
export function evaluateArchive(files: string[], options: ArchiveOptions = {}): Promise<ArchiveResult> {
  const total = files.length;
  const reports: FileReport[] = new Array(total);
  const evaluators = Math.max(1, Math.min(total, options.jobs ?? availableParallelism()));
  const overrides = options.overrides ?? {};
  const full = options.full ?? false;
  /** Live workers and the file ids each holds. */
  const workers = new Map<Worker, Set<number>>();
  let next = 0, done = 0, started = 0, byWorkers = 0;
  /** Why the first worker that never got ready stopped; once set, no more workers are started. */
  let workerFailure: string | undefined;

  return new Promise((resolve) => {
    let timer: NodeJS.Timeout | undefined;
    const finishIfDone = () => {
      if (done < total || workers.size > 0) return;
      clearTimeout(timer);
      resolve({ reports, workersStarted: started, byWorkers, ...(workerFailure === undefined ? {} : { workerFailure }) });
    };
    const record = (id: number, report: FileReport) => {
      reports[id] = report;
      done++;
      options.onReport?.(report, done, total);
    };
    /** Workers stopped on purpose: their exit is no failure. */
    const stopping = new WeakSet<Worker>();
    const stopWorker = (w: Worker) => {
      stopping.add(w);
      void w.terminate();
    };
    const stopIdleWorkers = () => {
      if (next < total) return;
      for (const [w, held] of workers) if (held.size === 0) stopWorker(w);
    };

    const spawn = () => {
      const worker = new Worker(options.workerEntry ?? WORKER_ENTRY, { stdout: false, stderr: false });
      const held = new Set<number>();
      workers.set(worker, held);
      started++;
      let ready = false;
      const feed = () => {
        while (held.size < IN_FLIGHT && next < total) {
          const job: Job = { id: next++, file: files[next - 1]!, overrides, full };
          held.add(job.id);
          worker.postMessage(job);
        }
        if (held.size === 0) stopWorker(worker);
      };
      worker.on('message', (msg: { ready?: true; id?: number; report?: FileReport }) => {
        if (msg.ready) { ready = true; return feed(); }
        if (msg.id === undefined || !msg.report) return;
        held.delete(msg.id);
        byWorkers++;
        record(msg.id, msg.report);
        feed();
      });
      let ended = false;
      const end = (reason: string) => {
        if (ended) return;
        ended = true;
        workers.delete(worker);
        // A worker that never got ready points at a broken set-up, not at a calc:
        // stop starting new ones; the main thread carries on with the queue.
        if (!ready && !stopping.has(worker)) workerFailure ??= reason;
        for (const id of held) record(id, failedReport(files[id]!, `worker stopped while evaluating this file: ${reason}`, full));
        held.clear();
        if (next < total && ready && workerFailure === undefined) spawn();
        // No worker left and nobody on the queue: the main thread takes over.
        if (next < total && workers.size === 0 && !mainRunning) void mainLoop();
        finishIfDone();
      };
      worker.on('error', (e) => end(e.message));
      worker.on('exit', (code) => end(`exit code ${code}`));
    };

    // The main thread works through the queue; between files it lets worker messages in.
    let mainRunning = false;
    const mainLoop = async () => {
      mainRunning = true;
      while (next < total) {
        const id = next++;
        try {
          const loaded = await loadAndEvaluate(files[id]!, overrides);
          record(id, reportOf(loaded.summary, { full, unreadable: loaded.unreadable }));
        } catch (e) {
          record(id, failedReport(files[id]!, `internal error while evaluating: ${(e as Error).message}`, full));
        }
        await yieldToEvents();
      }
      mainRunning = false;
      stopIdleWorkers();
      finishIfDone();
    };

    if (options.useMainThread === false) {
      for (let i = 0; i < evaluators; i++) spawn();
      return;
    }
    if (evaluators > 1) {
      timer = setTimeout(() => {
        for (let i = 1; i < evaluators && next < total; i++) spawn();
      }, options.workerDelay ?? 200);
    }
    void mainLoop();
  });
}
