import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { mkdtemp, rm, writeFile, mkdir, copyFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join, relative } from 'node:path';
import { checkCommand } from '../../bin/commands/check.js';
import { archiveCheck } from '../../bin/archive/check.js';
import { expandPatterns, globToRegExp } from '../../bin/archive/glob.js';
import { evaluateArchive } from '../../bin/archive/pool.js';
import { progressBar } from '../../bin/archive/progress.js';
import type { Summary } from '../../engine/index.js';
import { writeArchive, type PlantedFile } from './archive-fixtures.js';
import { expectClose } from '../helpers/close.js';

/** Generated archive size; the bench runs 1,000 (test/bench/archive.bench.ts). */
const COUNT = Number(process.env.VAULTBOOK_ARCHIVE_COUNT ?? 1000);

let dir: string;
let planted: PlantedFile[];
const run = async (...args: string[]) => {
  const out: string[] = [];
  const code = await checkCommand(args, (s) => out.push(s));
  return { code, out: out.join('\n') };
};

beforeAll(async () => {
  dir = await mkdtemp(join(tmpdir(), 'vaultbook-archive-'));
  planted = await writeArchive(join(dir, 'archive'), COUNT);
});
afterAll(() => rm(dir, { recursive: true, force: true }));

describe('glob expansion', () => {
  it('globToRegExp handles *, ** and ?', () => {
    expect(globToRegExp('**/*.md').test('a/b/c.md')).toBe(true);
    expect(globToRegExp('**/*.md').test('c.md')).toBe(true);
    expect(globToRegExp('*.md').test('a/c.md')).toBe(false);
    expect(globToRegExp('pier-00?.md').test('pier-007.md')).toBe(true);
    expect(globToRegExp('pier-00?.md').test('pier-0077.md')).toBe(false);
    expect(globToRegExp('a.b/*.md').test('axb/c.md')).toBe(false);
  });

  it('expandPatterns expands globs and folders, keeps plain paths, reports patterns that match nothing', async () => {
    const root = join(dir, 'archive');
    const e = await expandPatterns([`${root}/block-00/pier-000?.md`, `${root}/block-01`, `${root}/block-00/pier-0001.md`, 'plain.md', `${root}/none/*.md`]);
    expect(e.files.slice(0, 10).map((f) => relative(root, f))).toEqual(Array.from({ length: 10 }, (_, i) => `block-00/pier-000${i}.md`));
    expect(e.files.filter((f) => f.includes('block-01'))).toHaveLength(Math.min(100, Math.max(0, COUNT - 100)));
    expect(e.files.filter((f) => f.endsWith('pier-0001.md'))).toHaveLength(1); // no duplicates
    expect(e.files).toContain('plain.md');
    expect(e.unmatched).toEqual([`${root}/none/*.md`]);
  });

  it('expandPatterns skips hidden folders and node_modules under **', async () => {
    const root = join(dir, 'hidden-test');
    await mkdir(join(root, '.git'), { recursive: true });
    await mkdir(join(root, 'node_modules'), { recursive: true });
    await writeFile(join(root, '.git', 'x.md'), '');
    await writeFile(join(root, 'node_modules', 'y.md'), '');
    await writeFile(join(root, 'z.md'), '');
    expect((await expandPatterns([`${root}/**/*.md`])).files).toEqual([`${root}/z.md`]);
  });
});

describe(`vaultbook check over an archive of ${COUNT} generated calcs`, () => {
  it(`evaluateArchive(${COUNT} files) reports every planted verdict, every file evaluated in a worker process`, { timeout: 120_000 }, async () => {
    const { reports, byWorkers } = await evaluateArchive(planted.map((p) => p.path));
    expect(byWorkers).toBe(COUNT);
    expect(reports).toHaveLength(COUNT);
    let fails = 0, errors = 0;
    reports.forEach((r, i) => {
      const p = planted[i]!;
      expect(r.file).toBe(p.path);
      expect({ checks: r.checks, fails: r.fails, errors: r.errors }, p.path).toEqual({ checks: p.checks, fails: p.fails, errors: p.errors });
      // Utilization against the hand calc in the fixture (N_Ed / N_Rd, λ / 27).
      expectClose(r.worst!, p.worst!, 1e-9);
      fails += r.fails;
      errors += r.errors;
    });
    // Planted: every 10th pier overloaded, every 97th too slender (one error + one failing check each).
    const ids = Array.from({ length: COUNT }, (_, i) => i);
    const slender = ids.filter((i) => i % 97 === 5).length;
    const overloaded = ids.filter((i) => i % 10 === 3 && i % 97 !== 5).length;
    expect(fails).toBe(overloaded + slender);
    expect(errors).toBe(slender);
  });

  it('evaluateArchive(files, {jobs: 2}) runs every file in worker processes, reports in file order', { timeout: 120_000 }, async () => {
    const files = planted.slice(0, 8).map((p) => p.path);
    const seen: number[] = [];
    const { reports, workersStarted, byWorkers } = await evaluateArchive(files, { jobs: 2, onReport: (_r, done) => seen.push(done) });
    expect(workersStarted).toBe(2);
    expect(byWorkers).toBe(8);
    expect(reports.map((r) => r.file)).toEqual(files);
    expect(reports.map((r) => r.fails)).toEqual(planted.slice(0, 8).map((p) => p.fails));
    expect(seen).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
  });

  it('a worker that cannot start: every file is still checked, on the main thread, and the reason is kept for the note', { timeout: 120_000 }, async () => {
    const files = planted.slice(0, 6).map((p) => p.path);
    const result = await evaluateArchive(files, { jobs: 1, workerEntry: new URL('file:///nonexistent/vaultbook-worker.js') });
    expect(result.byWorkers).toBe(0);
    expect(result.workerFailure).toMatch(/Cannot find module '\/nonexistent\/vaultbook-worker\.js'/);
    expect(result.reports.map((r) => r.fails)).toEqual(planted.slice(0, 6).map((p) => p.fails));
    // Workers stopped on purpose (nothing left for them) are no failure.
    expect((await evaluateArchive(files, { jobs: 2, workerDelay: 0, useMainThread: true })).workerFailure).toBeUndefined();
  });

  it('evaluateArchive: a file whose worker process is killed is reported as an error for that file alone; the others are judged', { timeout: 120_000 }, async () => {
    const files = planted.slice(0, 6).map((p) => p.path);
    const dying = join(dir, 'dies-here.md');
    await copyFile(files[0]!, dying);
    const all = [files[0]!, files[1]!, dying, ...files.slice(2)];
    const entry = new URL('./fixtures/faulty-worker.js', import.meta.url);
    const { reports, workersStarted } = await evaluateArchive(all, { jobs: 2, workerEntry: entry });
    expect(reports.map((r) => r.file)).toEqual(all);
    expect(reports[2]!.errorDiagnostics.map((d) => d.message)).toEqual(['not evaluated: evaluating it stopped its worker process (signal SIGKILL)']);
    const others = reports.filter((_, i) => i !== 2);
    expect(others.map((r) => [r.checks, r.fails, r.errors])).toEqual(planted.slice(0, 6).map((p) => [p.checks, p.fails, p.errors]));
    // The killed worker was replaced, or its partner finished the queue.
    expect(workersStarted).toBeGreaterThanOrEqual(2);
  });

  it('evaluateArchive: a file past the time limit for one file is stopped and reported; the run goes on', { timeout: 120_000 }, async () => {
    const stuck = join(dir, 'hangs-here.md');
    await copyFile(planted[0]!.path, stuck);
    const files = [planted[0]!.path, stuck, planted[3]!.path];
    const entry = new URL('./fixtures/faulty-worker.js', import.meta.url);
    const { reports } = await evaluateArchive(files, { jobs: 1, fileTimeoutMs: 5000, workerEntry: entry });
    expect(reports[1]!.errorDiagnostics[0]!.message).toBe('not evaluated: evaluating it took longer than the 5.0 s limit for one file; it was stopped');
    expect(reports.map((r) => r.fails)).toEqual([planted[0]!.fails, 0, planted[3]!.fails]);
  });

  it('check GLOB --json and the table are always written when a file kills its worker (exit 2)', { timeout: 120_000 }, async () => {
    const files = planted.slice(0, 3).map((p) => p.path);
    const dying = join(dir, 'also-dies-here.md');
    await copyFile(files[0]!, dying);
    const pool = { workerEntry: new URL('./fixtures/faulty-worker.js', import.meta.url) };
    const out: string[] = [];
    const code = await archiveCheck({ files: [...files, dying], unmatched: [] }, { overrides: {}, json: true, jobs: 2, out: (s) => out.push(s), pool });
    const summaries = JSON.parse(out.join('\n')) as Summary[];
    expect(summaries.map((s) => s.checks.length)).toEqual([2, 2, 2, 0]);
    expect(summaries[3]!.diagnostics[0]).toMatchObject({ ruleId: 'eval/error', severity: 'error', line: 1, column: 1 });
    expect(code).toBe(2);
    const table: string[] = [];
    await archiveCheck({ files: [...files, dying], unmatched: [] }, { overrides: {}, json: false, jobs: 2, out: (s) => table.push(s), pool });
    expect(table.join('\n')).toMatch(/also-dies-here\.md\s+0\s+0\s+1\s+—\s+ERRORS/);
  });

  it('check FOLDER prints one table row per file and the totals (exit 2 with a planted error)', { timeout: 120_000 }, async () => {
    const r = await run(`${dir}/archive/block-00`);
    const n = Math.min(100, COUNT);
    const rows = r.out.split('\n').filter((l) => /pier-\d{4}\.md\s+\d/.test(l));
    expect(rows).toHaveLength(n);
    // N_Ed is 1.25 N_Rd rounded to a whole kN, a hair above 1.25: utilizations print rounded up, so 1.26.
    expect(rows.find((l) => l.includes('pier-0003.md'))).toMatch(/pier-0003\.md\s+2\s+1\s+0\s+1\.26\s+FAILS$/);
    expect(rows.find((l) => l.includes('pier-0005.md'))).toMatch(/pier-0005\.md\s+2\s+1\s+1\s+\S+\s+ERRORS$/);
    expect(r.out.split('\n')[0]).toMatch(/^file\s+checks\s+fails\s+errors\s+highest utilization\s+verdict$/);
    const fails = planted.slice(0, n).reduce((a, p) => a + p.fails, 0);
    expect(r.out).toMatch(new RegExp(`^${n} files: ${2 * n} checks, ${2 * n - fails - 1} hold, ${fails} fail \\(in ${fails} files\\), 1 not evaluated; 1 error \\(in 1 file\\)`, 'm'));
    expect(r.out).toContain(`Failing checks (${fails}):`);
    expect(r.out).toMatch(/pier-0005\.md:24:1 {2}error: interp: x = \S+ is outside the table/);
    expect(r.code).toBe(2);
  });

  it('check GLOB missing.md --json prints every summary; a missing file or an empty pattern is an error (exit 2)', { timeout: 120_000 }, async () => {
    const missing = join(dir, 'missing.md');
    const r = await run(`${dir}/archive/block-00/pier-001?.md`, missing, `${dir}/nowhere/*.md`, '--json');
    const summaries = JSON.parse(r.out) as Summary[];
    expect(summaries.map((s) => relative(dir, s.file))).toEqual([
      ...Array.from({ length: 10 }, (_, i) => `archive/block-00/pier-001${i}.md`), 'missing.md', 'nowhere/*.md',
    ]);
    expect(summaries[3]!.checks.map((c) => c.pass)).toEqual([false, true]); // pier-0013 is overloaded
    expect(summaries[10]!.diagnostics[0]!.ruleId).toBe('io/read');
    expect(summaries[11]!.diagnostics[0]!.message).toContain('no file matches');
    expect(r.code).toBe(2);
  });

  it('check over files that all hold exits 0; one failing check makes it 1', { timeout: 120_000 }, async () => {
    const ok = await run(join(dir, 'archive/block-00/pier-0000.md'), join(dir, 'archive/block-00/pier-0001.md'));
    expect(ok.code).toBe(0);
    expect(ok.out).toMatch(/^2 files: 4 checks, 4 hold, 0 fail/m);
    const failing = await run(join(dir, 'archive/block-00/pier-0003.md'), join(dir, 'archive/block-00/pier-0004.md'), '--jobs', '1');
    expect(failing.code).toBe(1);
  });

  it('check FILE (one file) keeps the single-file verdict lines, no table', async () => {
    const r = await run(join(dir, 'archive/block-00/pier-0003.md'));
    expect(r.code).toBe(1);
    expect(r.out).toMatch(/^ {2}!! {2}FAILS +1\.26 {2}bearing: N_Ed <= N_Rd {2}\(line 29\)/m);
    expect(r.out).not.toMatch(/^file\s+checks/m);
  });

  it('check --jobs 0 is a usage error', async () => {
    await expect(run(join(dir, 'archive/block-00/pier-0003.md'), '--jobs', '0')).rejects.toThrow(/--jobs/);
  });
});

describe('progressBar', () => {
  it('progressBar(stream) draws only on a terminal', () => {
    const writes: string[] = [];
    progressBar({ isTTY: false, write: (s) => writes.push(s) }).update(1, 2, { fails: 0, errors: 0 });
    expect(writes).toEqual([]);
    let t = 0;
    const bar = progressBar({ isTTY: true, columns: 100, write: (s) => writes.push(s) }, () => t);
    bar.update(1, 4, { fails: 1, errors: 0 });
    t = 50;
    bar.update(2, 4, { fails: 1, errors: 0 }); // throttled
    t = 2500;
    bar.update(4, 4, { fails: 1, errors: 2 });
    bar.finish();
    expect(writes).toHaveLength(3);
    expect(writes[1]).toMatch(/4\/4 files {2}1 failing {2}2 with errors {2}2\.5 s$/);
    expect(writes[2]).toBe('\r\x1b[2K');
  });
});
