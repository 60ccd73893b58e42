/**
 * One worker of the archive pool, a child process: reads and evaluates the files it is sent, one
 * at a time, saying which file it starts and sending a FileReport for each. Never throws back at
 * the pool: a file that breaks the engine becomes an error report for that file. A file that ends
 * the process itself (a V8 fatal error, the memory or time limit) is reported by the pool, which
 * knows which file was running. The worker ends when the pool closes its channel.
 */
import { loadAndEvaluate } from '../load.js';
import { parentPort } from 'node:worker_threads';
import { reportOf, failedReport, type FileReport } from './report.js';
import { evaluateCaseSlice, type CaseJob } from './cases.js';

export interface Job {
  id: number;
  file: string;
  overrides: Record<string, string>;
  full: boolean;
}

/** What a worker sends: once ready, then for each file when it starts it and its report. */
export type WorkerMessage = { ready: true } | { started: number } | { id: number; report: FileReport };

if (parentPort) {
  // A worker thread evaluating a slice of one document's cases (bin/archive/cases.ts).
  const port = parentPort;
  port.on('message', async (job: { caseJob: CaseJob }) => {
    try {
      port.postMessage({ caseResults: await evaluateCaseSlice(job.caseJob) });
    } catch (e) {
      port.postMessage({ caseError: (e as Error).message });
    }
  });
  port.postMessage({ ready: true });
} else {
  serveFiles();
}

/** A child process of the archive pool (bin/archive/pool.ts): one file at a time, each on its own. */
function serveFiles(): void {
  const send = process.send?.bind(process);
  if (!send) throw new Error('bin/archive/worker.ts must run as a worker thread or as a child process with an IPC channel (child_process.fork)');
  const post = (msg: WorkerMessage) => new Promise<void>((ok) => send(msg, undefined, undefined, () => ok()));
  const queue: Job[] = [];
  let busy = false;

  async function drain(): Promise<void> {
    busy = true;
    for (let job = queue.shift(); job; job = queue.shift()) {
      await post({ started: job.id });
      let report: FileReport;
      try {
        const loaded = await loadAndEvaluate(job.file, job.overrides);
        report = reportOf(loaded.summary, { full: job.full, unreadable: loaded.unreadable });
      } catch (e) {
        report = failedReport(job.file, `internal error while evaluating: ${(e as Error).message}`, job.full, 'eval/error');
      }
      try {
        await post({ id: job.id, report });
      } catch (e) {
        // A summary the channel cannot carry (a value it cannot serialise) is that file's error.
        await post({ id: job.id, report: failedReport(job.file, `internal error while reporting: ${(e as Error).message}`, job.full, 'eval/error') });
      }
    }
    busy = false;
  }

  process.on('message', (job: Job) => {
    queue.push(job);
    if (!busy) void drain();
  });
  process.on('disconnect', () => process.exit(0));
  void post({ ready: true });
}
