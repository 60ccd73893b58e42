/**
 * explainOnThreads: `vaultbook explain` with its moves spread over threads. Each thread compiles the
 * same text and moves every n-th input (ExplainOptions.part); the main thread takes the first share.
 * The parts merge to what one thread gives: each input is moved on the same compiled document with
 * the same steps. Falls back to the main thread alone when a worker cannot run.
 */
import { Worker } from 'node:worker_threads';
import { explainDocument, mergeExplanations, type Explanation, type ExplainOptions } from '../../engine/drivers/index.js';
import { workerUrl } from '../worker-url.js';

const WORKER_ENTRY = workerUrl('explain-worker.cjs', new URL('./worker-entry.js', import.meta.url));

function runOnWorker(text: string, options: ExplainOptions, entry: URL): Promise<Explanation> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(entry, { stdout: false, stderr: false });
    let settled = false;
    const finish = (f: () => void) => { if (!settled) { settled = true; f(); void worker.terminate(); } };
    worker.on('message', (msg: { ready?: true; part?: Explanation; error?: string }) => {
      if (msg.ready) worker.postMessage({ text, options });
      else if (msg.part) finish(() => resolve(msg.part!));
      else if (msg.error !== undefined) finish(() => reject(new Error(msg.error)));
    });
    worker.on('error', (e) => finish(() => reject(e)));
    worker.on('exit', (code) => finish(() => reject(new Error(`worker exited with code ${code}`))));
  });
}

/**
 * @param jobs threads in all, the main thread included; 1 runs on the main thread alone
 * @returns the explanation, and how many threads gave it (1 after falling back)
 * @example await explainOnThreads(text, {file: 'calc.md'}, 2)
 */
export async function explainOnThreads(text: string, options: ExplainOptions, jobs: number, entry: URL = WORKER_ENTRY): Promise<Explanation & { threads: number }> {
  if (jobs < 2) return { ...await explainDocument(text, options), threads: 1 };
  const workers = Array.from({ length: jobs - 1 }, (_, k) => runOnWorker(text, { ...options, part: { index: k + 1, of: jobs } }, entry));
  const mine = explainDocument(text, { ...options, part: { index: 0, of: jobs } });
  try {
    return { ...mergeExplanations([await mine, ...(await Promise.all(workers))]), threads: jobs };
  } catch {
    await Promise.allSettled(workers);
    return { ...await explainDocument(text, options), threads: 1 };
  }
}
