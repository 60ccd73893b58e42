/**
 * Bench: `vaultbook check` as an engineer meets it — a spawned process, wall time.
 *   1. one template, cold (target ≤ 1 s);
 *   2. an archive of 1,000 generated calcs on 2 threads (target ≤ 60 s on 2 cores).
 */
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir, availableParallelism, loadavg } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeArchive } from '../cli/archive-fixtures.js';

const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const CLI = join(ROOT, 'bin', 'vaultbook.js');

/** GNU time, when present, also reports the CPU seconds the process used: on a loaded machine wall time alone misleads. */
const GNU_TIME = existsSync('/usr/bin/time') ? '/usr/bin/time' : null;

function timed(args: string[]): { seconds: number; cpu: number | null; code: number | null; last: string } {
  const t0 = performance.now();
  const r = GNU_TIME
    ? spawnSync(GNU_TIME, ['-f', 'cpu %U %S', process.execPath, CLI, ...args], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 })
    : spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', maxBuffer: 256 * 1024 * 1024 });
  const seconds = (performance.now() - t0) / 1000;
  const lines = (r.stdout ?? '').trim().split('\n');
  const m = /cpu ([\d.]+) ([\d.]+)\s*$/.exec(r.stderr ?? '');
  // GNU time exits with the command's own status.
  return { seconds, cpu: m ? Number(m[1]) + Number(m[2]) : null, code: r.status, last: lines[lines.length - 1] ?? '' };
}

const cpuText = (c: { cpu: number | null }) => (c.cpu === null ? '' : `, ${c.cpu.toFixed(2)} s CPU`);

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

export async function run(): Promise<string[]> {
  const lines: string[] = [`archive.bench: ${availableParallelism()} cores, load average ${loadavg()[0]!.toFixed(1)}`];
  const dir = await mkdtemp(join(tmpdir(), 'vaultbook-bench-'));
  try {
    const planted = await writeArchive(join(dir, 'archive'), 1000);
    const template = join(ROOT, 'templates', 'barrel-vault.md');
    const one = existsSync(template) ? template : planted[0]!.path;
    const label = existsSync(template) ? 'templates/barrel-vault.md' : 'one generated calc (templates/barrel-vault.md not there yet)';
    const cold = [0, 1, 2].map(() => timed(['check', one]));
    lines.push(`  check ${label}, cold process: median ${median(cold.map((c) => c.seconds)).toFixed(2)} s wall of 3 (${cold.map((c) => `${c.seconds.toFixed(2)} s${cpuText(c)}`).join('; ')}; exit ${cold[0]!.code}; target ≤ 1 s)`);
    const archive = timed(['check', `${dir}/archive/**/*.md`, '--jobs', '2']);
    lines.push(`  check 1,000 generated calcs, --jobs 2: ${archive.seconds.toFixed(1)} s wall${cpuText(archive)} (exit ${archive.code}; target ≤ 60 s)`);
    lines.push(`    ${archive.last}`);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
  return lines;
}
