/**
 * A worker thread of `vaultbook explain`: explains its share of the inputs (ExplainOptions.part)
 * and posts the part back to be merged.
 */
import { parentPort } from 'node:worker_threads';
import { explainDocument, type ExplainOptions } from '../../engine/drivers/index.js';

if (!parentPort) throw new Error('bin/explain/worker.ts must run in a worker thread');
const port = parentPort;

port.on('message', async (msg: { text: string; options: ExplainOptions }) => {
  try {
    port.postMessage({ part: await explainDocument(msg.text, msg.options) });
  } catch (e) {
    port.postMessage({ error: (e as Error).message });
  }
});
port.postMessage({ ready: true });
