/**
 * evaluateArchive: many calc files → one FileReport each, evaluated in worker processes.
 *
 * Each file is judged in isolation. The workers are child processes, not threads: a document
 * that drives V8 into a fatal error or out of memory ends the whole process it runs in, threads
 * included, so only a process of its own keeps the rest of the run alive. A file that kills its
 * worker, or runs past the time limit for one file, is reported as an error for that file alone;
 * the files that worker still held go back to the queue, a fresh worker takes over, and the run
 * goes on to its table and JSON. The main thread evaluates nothing by default; it takes over only
 * when no worker can start at all (a broken installation), and says so.
 *
 * A worker must load the whole engine before its first file, so each takes files one or two at a
 * time and keeps going: a slow calc never holds up a queue behind it.
 */
import { fork, type ChildProcess } from 'node:child_process';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { setImmediate as yieldToEvents } from 'node:timers/promises';
import { loadAndEvaluate } from '../load.js';
import { workerUrl } from '../worker-url.js';
import type { Job, WorkerMessage } from './worker.js';
import { failedReport, reportOf, type FileReport } from './report.js';

export interface ArchiveOptions {
  overrides?: Record<string, string>;
  /** Worker processes evaluating files; default os.availableParallelism(). */
  jobs?: number;
  /** Keep each file's whole summary (for --json). */
  full?: boolean;
  /** Called after each file, in completion order. */
  onReport?: (report: FileReport, done: number, total: number) => void;
  /** How long the main thread works alone before workers are started (ms; only with useMainThread). */
  workerDelay?: number;
  /**
   * true: the main thread evaluates files too (faster for a handful of small files, but a file
   * that aborts the process ends the run). Default false: worker processes only.
   */
  useMainThread?: boolean;
  /** The workers' code (default: the bundled worker, or bin/archive/worker-entry.js from the sources). */
  workerEntry?: URL;
  /** Longest a worker may spend on one file before it is stopped and the file reported (ms). */
  fileTimeoutMs?: number;
  /** Heap limit of each worker process (MB); a file needing more is reported, not the run lost. */
  workerMemoryMb?: number;
}

export interface ArchiveResult {
  /** One report per file, in the order the files were given. */
  reports: FileReport[];
  /** Worker processes started (replacements included). */
  workersStarted: number;
  /** Files evaluated by workers (the rest ran on the main thread). */
  byWorkers: number;
  /** Why the first worker that failed to start did so; absent when none failed. */
  workerFailure?: string;
}

const WORKER_ENTRY = workerUrl('archive-worker.cjs', new URL('./worker-entry.js', import.meta.url));
/** Files a worker holds at once, so it never waits for its next one. */
const IN_FLIGHT = 2;
/** Default time limit for one file: 60 s (the largest document read, 10 MiB, takes well under that). */
export const FILE_TIMEOUT_MS = 60_000;
/** Default heap limit of a worker process, MB. */
export const WORKER_MEMORY_MB = 2048;
/** How much of a worker's error output is kept to explain its end. */
const STDERR_KEPT = 16 * 1024;

/**
 * Every live worker of every pool. A worker busy with a document that never finishes cannot hear
 * its channel close, so when this process ends, for whatever reason it can still act on, they go too.
 */
const LIVE = new Set<ChildProcess>();
let exitHookInstalled = false;
function killAllWorkers(): void {
  for (const w of LIVE) w.kill('SIGKILL');
}

/** A worker's own words about why it ended, without stack frames: the first error line it printed. */
function complaint(stderr: string): string | null {
  const lines = stderr.split('\n').map((l) => l.replace(/^#\s*/, '').trim()).filter(Boolean);
  if (lines.some((l) => /heap out of memory|Reached heap limit/i.test(l))) return 'out of memory';
  return lines.find((l) => /^Fatal JavaScript/.test(l)) ?? lines.find((l) => /^[A-Za-z]*Error\b/.test(l)) ?? lines.find((l) => /^Fatal/.test(l)) ?? null;
}

/**
 * Evaluates every file in a pool of worker processes.
 * @param files paths as given (already expanded)
 * @returns the reports in file order; a worker that dies costs only the file it was evaluating
 * @example const {reports} = await evaluateArchive(['a.md', 'b.md'], {jobs: 2})
 */
export function evaluateArchive(files: string[], options: ArchiveOptions = {}): Promise<ArchiveResult> {
  const total = files.length;
  const reports: FileReport[] = new Array(total);
  const evaluators = Math.max(1, Math.min(total, options.jobs ?? availableParallelism()));
  const overrides = options.overrides ?? {};
  const full = options.full ?? false;
  const fileTimeoutMs = options.fileTimeoutMs ?? FILE_TIMEOUT_MS;
  const memoryMb = options.workerMemoryMb ?? WORKER_MEMORY_MB;
  const entry = fileURLToPath(options.workerEntry ?? WORKER_ENTRY);
  /** Live workers and the file ids each holds. */
  const workers = new Map<ChildProcess, Set<number>>();
  /** The file each worker is evaluating now, and since when. */
  const running = new Map<ChildProcess, { id: number; since: number }>();
  /** Files handed back by a worker that ended before starting them; they go out first. */
  const returned: number[] = [];
  let next = 0, done = 0, started = 0, byWorkers = 0;
  const waiting = () => returned.length > 0 || next < total;
  const take = (): number => returned.shift() ?? next++;
  /** Why the first worker that never got ready stopped; once set, no more workers are started. */
  let workerFailure: string | undefined;

  return new Promise((resolve) => {
    let timer: NodeJS.Timeout | undefined;
    /** Workers stopped because their file ran past the time limit. */
    const timedOut = new WeakSet<ChildProcess>();
    const watchdog = setInterval(() => {
      const now = Date.now();
      for (const [w, r] of running) {
        if (now - r.since > fileTimeoutMs && !timedOut.has(w)) {
          timedOut.add(w);
          w.kill('SIGKILL');
        }
      }
    }, Math.min(1000, Math.max(50, fileTimeoutMs / 4)));
    const finishIfDone = () => {
      if (done < total || workers.size > 0) return;
      clearTimeout(timer);
      clearInterval(watchdog);
      resolve({ reports, workersStarted: started, byWorkers, ...(workerFailure === undefined ? {} : { workerFailure }) });
    };
    const record = (id: number, report: FileReport) => {
      reports[id] = report;
      done++;
      options.onReport?.(report, done, total);
    };
    /** Workers stopped on purpose: their end is no failure. */
    const stopping = new WeakSet<ChildProcess>();
    const stopWorker = (w: ChildProcess) => {
      stopping.add(w);
      if (w.connected) w.disconnect(); // the worker ends when its channel closes
    };
    const stopIdleWorkers = () => {
      if (waiting()) return;
      for (const [w, held] of workers) if (held.size === 0) stopWorker(w);
    };

    const spawn = () => {
      const worker = fork(entry, [], {
        execArgv: [`--max-old-space-size=${memoryMb}`],
        serialization: 'advanced',
        stdio: ['ignore', 'ignore', 'pipe', 'ipc'],
      });
      const held = new Set<number>();
      workers.set(worker, held);
      LIVE.add(worker);
      if (!exitHookInstalled) {
        exitHookInstalled = true;
        process.on('exit', killAllWorkers);
        // Ctrl-C reaches the workers too (one process group); a SIGTERM or SIGHUP sent to this process alone
        // would leave them running, so they are stopped first (only when nobody else handles the signal).
        for (const signal of ['SIGTERM', 'SIGHUP'] as const) {
          if (process.listenerCount(signal) === 0) process.once(signal, () => { killAllWorkers(); process.exit(128 + (signal === 'SIGTERM' ? 15 : 1)); });
        }
      }
      started++;
      let ready = false;
      let stderr = '';
      worker.stderr?.setEncoding('utf8').on('data', (s: string) => { stderr = (stderr + s).slice(-STDERR_KEPT); });
      const feed = () => {
        while (held.size < IN_FLIGHT && waiting()) {
          const id = take();
          const job: Job = { id, file: files[id]!, overrides, full };
          held.add(id);
          worker.send(job);
        }
        if (held.size === 0) stopWorker(worker);
      };
      worker.on('message', (msg: WorkerMessage) => {
        if ('ready' in msg) { ready = true; return feed(); }
        if ('started' in msg) { running.set(worker, { id: msg.started, since: Date.now() }); return; }
        running.delete(worker);
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
        LIVE.delete(worker);
        const current = running.get(worker);
        running.delete(worker);
        // A worker that never got ready points at a broken set-up, not at a calc:
        // stop starting new ones; the main thread carries on with the queue.
        if (!ready && !stopping.has(worker)) workerFailure ??= reason;
        // Only the file it was evaluating is at fault; the others it held go back to the queue.
        for (const id of held) {
          if (id !== current?.id) { returned.push(id); continue; }
          const why = timedOut.has(worker)
            ? `evaluating it took longer than the ${(fileTimeoutMs / 1000).toFixed(fileTimeoutMs < 10_000 ? 1 : 0)} s limit for one file; it was stopped`
            : reason === 'out of memory' ? `evaluating it needed more than the ${memoryMb} MB memory limit; it was stopped`
            : `evaluating it stopped its worker process (${reason})`;
          record(id, failedReport(files[id]!, `not evaluated: ${why}`, full, 'eval/error'));
        }
        returned.sort((a, b) => a - b);
        held.clear();
        if (waiting() && ready && workerFailure === undefined) spawn();
        // No worker left and nobody on the queue: the main thread takes over.
        if (waiting() && workers.size === 0 && !mainRunning) void mainLoop();
        finishIfDone();
      };
      worker.on('error', (e) => end(e.message));
      // 'close' comes once the error output is read to its end, unless a process the worker started
      // (a TypeScript loader's helper) still holds it open: then the exit, and a moment for the rest.
      const gone = (code: number | null, signal: NodeJS.Signals | null) => end(complaint(stderr) ?? (signal ? `signal ${signal}` : `exit code ${code}`));
      worker.on('close', gone);
      worker.on('exit', (code, signal) => { setTimeout(() => gone(code, signal), 200).unref(); });
    };

    // The main thread works through the queue; between files it lets worker messages in.
    let mainRunning = false;
    const mainLoop = async () => {
      mainRunning = true;
      while (waiting()) {
        const id = take();
        try {
          const loaded = await loadAndEvaluate(files[id]!, overrides);
          record(id, reportOf(loaded.summary, { full, unreadable: loaded.unreadable }));
        } catch (e) {
          record(id, failedReport(files[id]!, `internal error while evaluating: ${(e as Error).message}`, full, 'eval/error'));
        }
        await yieldToEvents();
      }
      mainRunning = false;
      stopIdleWorkers();
      finishIfDone();
    };

    if (total === 0) return finishIfDone();
    if (options.useMainThread !== true) {
      for (let i = 0; i < evaluators; i++) spawn();
      return;
    }
    if (evaluators > 1) {
      timer = setTimeout(() => {
        for (let i = 1; i < evaluators && waiting(); i++) spawn();
      }, options.workerDelay ?? 200);
    }
    void mainLoop();
  });
}
