/**
 * One worker of the archive pool: reads and evaluates the files it is sent,
 * posting a FileReport for each. Never throws back at the pool: a file that
 * breaks the engine becomes an error report for that file.
 */
import { parentPort } from 'node:worker_threads';
import { loadAndEvaluate } from '../load.js';
import { reportOf, failedReport } from './report.js';
import { evaluateCaseSlice, type CaseJob } from './cases.js';

export interface Job {
  id: number;
  file: string;
  overrides: Record<string, string>;
  full: boolean;
}

if (!parentPort) throw new Error('bin/archive/worker.ts must run in a worker thread');
const port = parentPort;

port.on('message', async (job: Job | { caseJob: CaseJob }) => {
  if ('caseJob' in job) {
    try {
      port.postMessage({ caseResults: await evaluateCaseSlice(job.caseJob) });
    } catch (e) {
      port.postMessage({ caseError: (e as Error).message });
    }
    return;
  }
  try {
    const loaded = await loadAndEvaluate(job.file, job.overrides);
    port.postMessage({ id: job.id, report: reportOf(loaded.summary, { full: job.full, unreadable: loaded.unreadable }) });
  } catch (e) {
    port.postMessage({ id: job.id, report: failedReport(job.file, `internal error while evaluating: ${(e as Error).message}`, job.full) });
  }
});
port.postMessage({ ready: true });
