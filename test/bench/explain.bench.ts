/**
 * Explain: every check of the barrel-vault template.
 * - cell evaluations of the moves against the sum of their dirty subgraphs (target ratio 1): each
 *   settle's changed inputs, and everything downstream of them in the graph explain evaluates (the
 *   document cut to what the checks need);
 * - in-process time of explainDocument (one thread), and cold `vaultbook explain` wall time with the
 *   default threads and with --jobs 1 (target ≤ 3 s on the 2-core machine).
 * Targets are printed, never asserted.
 */
import { performance } from 'node:perf_hooks';
import { median, coldWall } from './timing.js';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { compile } from '../../engine/index.js';
import { downstreamOf } from '../../engine/cases/index.js';
import { explainDocument } from '../../engine/drivers/index.js';
import { prunedDocument } from '../../engine/drivers/prune.js';

const root = fileURLToPath(new URL('../../', import.meta.url));

function wall(args: string[]): number {
  return coldWall('explain.bench', args);
}

export async function run(): Promise<string[]> {
  const file = join(root, 'templates/barrel-vault.md');
  const text = readFileSync(file, 'utf8');
  const t0 = performance.now();
  const e = await explainDocument(text, { file: 'barrel-vault.md' });
  const inProcess = performance.now() - t0;
  const doc = compile(text, { file: 'barrel-vault.md' });
  const pruned = prunedDocument(doc, doc.graph.cells.filter((c) => c.kind === 'check').map((c) => c.id));
  const dirty = e.stats.changes.reduce((n, change) => n + downstreamOf(pruned.graph, change).size, 0);
  const inputs = new Set(e.checks.flatMap((c) => c.inputs.map((i) => i.name))).size;
  const cases = new Set(e.checks.map((c) => c.case ?? 'as written'));
  wall(['explain', 'templates/barrel-vault.md']); // builds the bundle if needed and writes its code cache
  const cold = [0, 1, 2].map(() => wall(['explain', 'templates/barrel-vault.md']));
  const single = [0, 1, 2].map(() => wall(['explain', 'templates/barrel-vault.md', '--jobs', '1']));
  return [
    `explain: barrel-vault, ${e.checks.length} checks, ${inputs} inputs, explained in ${cases.size} cases (${[...cases].join(', ')}); `
      + `${pruned.graph.cells.length} of ${doc.graph.cells.length} cells kept`,
    `explain: ${e.stats.settles} settles, ${e.stats.evaluations} cell evaluations against ${dirty} in the dirty subgraphs: ratio ${(e.stats.evaluations / dirty).toFixed(3)} (target 1)`,
    `explain: in process ${(inProcess / 1000).toFixed(2)} s; cold explain wall time median ${(median(cold) / 1000).toFixed(2)} s (target ≤ 3 s); with --jobs 1 ${(median(single) / 1000).toFixed(2)} s`,
  ];
}
