/**
 * Cases: the arch-ring template with its axle rolled across the span as a family of 37 cases.
 * - cost per case (runCases on the document's session, all 37) against the cost of evaluating the
 *   case's dirty subgraph once, cell by cell with evaluateCell and no runtime (target ratio ≤ 1.2);
 * - cold `vaultbook check` wall time of that file (target ≤ 3 s on the 2-core machine), with the
 *   default threads and with --jobs 1.
 * Targets are printed, never asserted.
 */
import { performance } from 'node:perf_hooks';
import { median, coldWall } from './timing.js';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { compile, startSession, type CellState } from '../../engine/index.js';
import { downstreamOf, errorKeys, expandCases, runCases } from '../../engine/cases/index.js';
import { evaluateCell } from '../../engine/runtime/evaluate.js';
import { parseExpression } from '../../cells/math.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const CASES = 37;

/** The arch-ring template with one more axle position, `x_P`, rolled across the span as a family. */
export function archRingWithAxleFamily(): string {
  const text = readFileSync(join(root, 'templates/arch-ring.md'), 'utf8');
  return `${text}\n\n## Bench: the axle rolled across the span\n\n`
    + '```given\nx_P = 1.5 m   # axle position from the left springing\n```\n\n'
    + '```calc\na_x = arch_limit(r, {fill_unit_weight: gamma_fill, fill_level: z_fill, dead: g_surf, P: P_rear, P_at: x_P})\nlambda_x = a_x.load_factor   # collapse load factor, axle at x_P\n```\n\n'
    + '```check\nc_axle = lambda_x >= lambda_req   # collapse load factor at every axle position [in axle]\n```\n\n'
    + `\`\`\`cases\naxle = {x_P: steps(0.05 * L, 0.95 * L, ${CASES})}   # the axle rolled across the span\n\`\`\`\n`;
}

const wall = (args: string[]) => coldWall('cases.bench', args, 1);

export async function run(): Promise<string[]> {
  const text = archRingWithAxleFamily();
  const doc = compile(text, { file: 'arch-ring-axle.md' });
  const session = startSession(doc);
  const base = new Map(await session.settle());
  const { cases, diagnostics } = expandCases(doc, base);
  if (diagnostics.length || cases.length !== CASES) throw new Error(`cases.bench: expected ${CASES} cases, got ${cases.length} (${diagnostics.map((d) => d.message).join('; ')})`);
  const known = errorKeys(doc.graph, base);
  // The same work without the runtime: each dirty cell once, in order, from the values as written.
  const dirty = downstreamOf(doc.graph, ['x_P']);
  const order = doc.graph.order.filter((id) => dirty.has(id)).map((id) => doc.graph.byId.get(id)!);
  const ctx = { file: doc.file, diagnostics: [] };
  const written = new Map<string, unknown>();
  for (const [id, s] of base) if ((s as CellState).status === 'ok') written.set(id, (s as { value: unknown }).value);
  const directly = () => {
    for (const c of cases) {
      const values = new Map(written);
      for (const cell of order) {
        const target = cell.name === 'x_P' ? { ...cell, node: parseExpression(c.overrides.x_P!) } : cell;
        values.set(cell.id, evaluateCell(target, cell.uses.map((u) => values.get(u)), ctx));
      }
    }
  };
  await runCases(session, cases, known); // warm-up of both: compiled expressions, JIT
  directly();
  // Rounds alternate, so that the other helpers' load on the shared machine falls on both alike.
  // Wall time, and CPU time (what the work costs, whatever else the machine is doing).
  const rounds: number[] = [];
  const direct: number[] = [];
  const roundsCpu: number[] = [];
  const directCpu: number[] = [];
  const cpu = () => { const u = process.cpuUsage(); return (u.user + u.system) / 1000; };
  for (let i = 0; i < 5; i++) {
    let t0 = performance.now(), c0 = cpu();
    await runCases(session, cases, known);
    rounds.push((performance.now() - t0) / cases.length);
    roundsCpu.push((cpu() - c0) / cases.length);
    t0 = performance.now(); c0 = cpu();
    directly();
    direct.push((performance.now() - t0) / cases.length);
    directCpu.push((cpu() - c0) / cases.length);
  }
  const perCase = median(rounds);
  const perCaseCpu = median(roundsCpu), onceCpu = median(directCpu);
  const once = median(direct);
  session.dispose();

  const scratch = mkdtempSync(join(tmpdir(), 'vb-cases-bench-'));
  const file = join(scratch, 'arch-ring-axle.md');
  writeFileSync(file, text);
  try {
    wall(['check', file]); // builds the bundle if needed and writes its code cache
    const cold = [0, 1, 2].map(() => wall(['check', file]));
    const single = [0, 1, 2].map(() => wall(['check', file, '--jobs', '1']));
    return [
      `cases: arch-ring with the axle rolled across the span, ${CASES} cases; dirty subgraph ${order.length} cells (${order.map((c) => c.id).join(', ')})`,
      `cases: cost per case ${perCase.toFixed(2)} ms, its dirty subgraph once ${once.toFixed(2)} ms: ratio ${(perCase / once).toFixed(2)} (target ≤ 1.2; wall time)`,
      `cases: CPU time per case ${perCaseCpu.toFixed(2)} ms, its dirty subgraph once ${onceCpu.toFixed(2)} ms: ratio ${(perCaseCpu / onceCpu).toFixed(2)} (target ≤ 1.2)`,
      `cases: cold check wall time median ${(median(cold) / 1000).toFixed(2)} s (target ≤ 3 s); with --jobs 1 ${(median(single) / 1000).toFixed(2)} s`,
    ];
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}
