/**
 * Child process of fuzz.bench.ts: evaluates mutated documents FROM..TO (and renders
 * every tenth), printing one line per document: `n ok ms`, `n crash message` or
 * `n unlocated detail`. The parent watches it for hangs and aborts.
 */
import { evaluateDocument } from '../../engine/index.js';
import { renderSheet } from '../../engine/render/index.js';
import { mutatedDocument, seedDocuments, unlocated } from '../helpers/mutate.js';

const [from, to] = process.argv.slice(2).map(Number) as [number, number];
const seeds = seedDocuments();
// Loading the engine through tsx takes seconds; the parent's 5 s watch starts from here.
process.stdout.write('ready\n');
for (let n = from; n < to; n++) {
  const text = mutatedDocument(seeds, n);
  const t0 = performance.now();
  try {
    const { doc, states, summary } = await evaluateDocument(text, { file: `fuzz-${n}.md` });
    JSON.stringify(summary);
    if (n % 10 === 0) renderSheet({ doc, states, warnings: new Map() });
    const bad = unlocated(text, summary.diagnostics);
    const ms = Math.round(performance.now() - t0);
    process.stdout.write(bad.length ? `${n} unlocated ${ms} ${bad[0]!.replace(/\n/g, ' ').slice(0, 200)}\n` : `${n} ok ${ms}\n`);
  } catch (e) {
    process.stdout.write(`${n} crash ${Math.round(performance.now() - t0)} ${String((e as Error)?.stack ?? e).replace(/\n/g, ' | ').slice(0, 300)}\n`);
  }
}
process.stdout.write('done\n');
