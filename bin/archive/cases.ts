/**
 * Cases of a large family on worker threads: the main thread expands the cases and evaluates the
 * first slice on its own session while each worker compiles the same text, evaluates it as written
 * and then its contiguous slice with the engine's own runCases, and posts the results back. The
 * results are those of a single-thread run: each case sets the same inputs on the same document.
 */
import { Worker } from 'node:worker_threads';
import { availableParallelism } from 'node:os';
import { compile, startSession, type Case, type CaseResult, type CaseRunner } from '../../engine/index.js';
import { expandCases, errorKeys, runCases } from '../../engine/cases/index.js';
import { workerUrl } from '../worker-url.js';

/** Cases per thread below which no worker starts: a worker costs about a second to start, and a case of the templates 10–30 ms. */
export const CASES_PER_WORKER = 100;

const WORKER_ENTRY = workerUrl('archive-worker.cjs', new URL('./worker-entry.js', import.meta.url));

/** What a worker is sent to evaluate some cases of a document. */
export interface CaseJob {
  id: number;
  text: string;
  file: string;
  overrides: Record<string, string>;
  names: string[];
}

/**
 * Evaluates the named cases of a document, as runCases does on the main thread.
 * @example await evaluateCaseSlice({id: 0, text, file: 'a.md', overrides: {}, names: ['axle[1]']})
 */
export async function evaluateCaseSlice(job: CaseJob): Promise<CaseResult[]> {
  const doc = compile(job.text, { file: job.file, overrides: job.overrides });
  const session = startSession(doc);
  try {
    const base = new Map(await session.settle());
    const pinned = new Set(Object.keys(job.overrides));
    const wanted = new Set(job.names);
    const cases = expandCases(doc, base, pinned).cases.filter((c) => wanted.has(c.name));
    return await runCases(session, cases, errorKeys(doc.graph, base, session.warnings));
  } finally {
    session.dispose();
  }
}

export interface CasePoolOptions {
  /** Threads for the cases (default os.availableParallelism()); 1 keeps them on the main thread. */
  jobs?: number;
  /** Below this many cases per thread, the main thread does them all (default CASES_PER_WORKER). */
  perWorker?: number;
  workerEntry?: URL;
  /** Told where each slice was evaluated (for tests and progress). */
  onSlice?: (where: 'main thread' | 'worker', names: string[]) => void;
}

/**
 * A CaseRunner that spreads a document's cases over worker threads.
 * @example await evaluateDocument(text, {file, caseRunner: casePool(text, file, {}, {jobs: 2})})
 */
export function casePool(text: string, file: string, overrides: Record<string, string>, options: CasePoolOptions = {}): CaseRunner {
  return async (cases: Case[], here: (slice: Case[]) => Promise<CaseResult[]>) => {
    const threads = Math.min(options.jobs ?? availableParallelism(), Math.floor(cases.length / (options.perWorker ?? CASES_PER_WORKER)));
    if (threads < 2) return null;
    const size = Math.ceil(cases.length / threads);
    const slices = Array.from({ length: threads }, (_, i) => cases.slice(i * size, (i + 1) * size)).filter((s) => s.length);
    const away = slices.slice(1).map((slice, i) => runOnWorker({ id: i, text, file, overrides, names: slice.map((c) => c.name) }, options.workerEntry ?? WORKER_ENTRY)
      .then((results) => { options.onSlice?.('worker', slice.map((c) => c.name)); return results; })
      // A worker that cannot run leaves its slice to the main thread.
      .catch(() => null));
    const parts = [await here(slices[0]!)];
    options.onSlice?.('main thread', slices[0]!.map((c) => c.name));
    for (const [i, part] of (await Promise.all(away)).entries()) {
      if (part) { parts.push(part); continue; }
      parts.push(await here(slices[i + 1]!));
      options.onSlice?.('main thread', slices[i + 1]!.map((c) => c.name));
    }
    return parts.flat();
  };
}

function runOnWorker(job: CaseJob, entry: URL): Promise<CaseResult[]> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(entry, { stdout: false, stderr: false });
    let settled = false;
    const finish = (f: () => void) => { if (!settled) { settled = true; f(); void worker.terminate(); } };
    worker.on('message', (msg: { ready?: true; caseResults?: CaseResult[]; caseError?: string }) => {
      if (msg.ready) worker.postMessage({ caseJob: job });
      else if (msg.caseResults) finish(() => resolve(msg.caseResults!));
      else if (msg.caseError !== undefined) finish(() => reject(new Error(msg.caseError)));
    });
    worker.on('error', (e) => finish(() => reject(e)));
    worker.on('exit', (code) => finish(() => reject(new Error(`worker exited with code ${code}`))));
  });
}
