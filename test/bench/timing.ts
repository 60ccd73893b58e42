/**
 * The measures the benchmarks share: medians, timed calls in process, and the wall time of a cold
 * `vaultbook` process. Benchmarks print figures; none of them asserts a time.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';

/** The repository's root folder. */
export const ROOT = fileURLToPath(new URL('../../', import.meta.url));

/** The median of a list of numbers (the mean of the middle two for an even count). */
export function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** Median over `runs` timed calls after `warm` untimed ones, in ms per call. */
export function timeCalls(fn: () => unknown, runs = 7, warm = 2): number {
  for (let i = 0; i < warm; i++) fn();
  const ts: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    ts.push(performance.now() - t0);
  }
  return median(ts);
}

/**
 * Wall time of one cold `node bin/vaultbook.js ARGS` process, in ms.
 * @param highestExit the largest exit code that still counts as a run (1: a failing check is a result)
 */
export function coldWall(label: string, args: string[], highestExit = 0): number {
  const t0 = performance.now();
  const r = spawnSync(process.execPath, [join(ROOT, 'bin/vaultbook.js'), ...args], { cwd: ROOT, encoding: 'utf8' });
  const ms = performance.now() - t0;
  if (r.status === null || r.status > highestExit) throw new Error(`${label}: ${args.join(' ')} failed (${r.status}): ${r.stdout}${r.stderr}`);
  return ms;
}
