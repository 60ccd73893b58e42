/**
 * What keeps a cold `vaultbook serve` short, checked on a real process started as a user starts it
 * (`node bin/vaultbook.js serve FILE --port 0`), with the page already built (it is built once):
 * it never loads Vite (the built page needs only a plain Node server; Vite is for the development
 * server and for building the page), and it writes its V8 code cache once the first paint is rendered
 * (Vite's own exit handler used to end the process before the launcher wrote it, so serve never had one).
 * The time itself is measured by `npm run bench` (test/bench/serve-start.bench.ts), not asserted here.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { buildSite } from '../../bin/serve/built-site.js';
import { FIXTURES, REPO, rawRequest, tempCopy } from './helpers.js';

const RECORD = join(FIXTURES, 'loads', 'record.mjs');
const CACHE = join(REPO, 'node_modules', '.cache', 'vaultbook');

let tmp: ReturnType<typeof tempCopy>;
beforeAll(async () => {
  tmp = tempCopy(join(FIXTURES, 'barrel.md'));
  await buildSite(); // a first use builds the page (with Vite); the starts after it must not need it
}, 180_000);
afterAll(() => tmp?.cleanup());

/** Runs `vaultbook serve` with every module it loads recorded; resolves with its address. */
function serve(log: string): { child: ChildProcess; url: Promise<string>; stderr: () => string } {
  const child = spawn(process.execPath, ['--import', RECORD, join(REPO, 'bin', 'vaultbook.js'), 'serve', tmp.file, '--port', '0'], {
    cwd: tmp.dir, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, VB_LOADS_LOG: log },
  });
  let out = '';
  let err = '';
  child.stderr!.on('data', (d: Buffer) => { err += d.toString(); });
  const url = new Promise<string>((ok, fail) => {
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = /\bat (http:\/\/127\.0\.0\.1:\d+\/)/.exec(out);
      if (m) ok(m[1]!);
    });
    child.on('exit', (code) => fail(new Error(`serve ended (${code}): ${out}${err}`)));
  });
  return { child, url, stderr: () => err };
}

const stop = (child: ChildProcess) => new Promise<number | null>((ok) => {
  if (child.exitCode !== null) return ok(child.exitCode);
  child.once('exit', (code) => ok(code));
  child.kill('SIGTERM');
});

describe('a cold `vaultbook serve` of the built page', () => {
  it('the recorder sees Vite when a process does load it (so its silence below means something)', () => {
    const log = join(tmp.dir, 'control.log');
    const r = spawnSync(process.execPath, ['--import', RECORD, '--input-type=module', '-e', "await import('vite')"], { cwd: REPO, env: { ...process.env, VB_LOADS_LOG: log }, encoding: 'utf8', timeout: 60_000 });
    expect(r.status, r.stderr).toBe(0);
    expect(readFileSync(log, 'utf8')).toMatch(/node_modules\/vite\//);
  }, 60_000);

  it('paints the sheet from the built page without loading Vite, and writes the serve command\'s code cache once it has', async () => {
    const log = join(tmp.dir, 'serve.log');
    // The cache a first start writes; removed so that this start has to write it.
    const current = () => join(CACHE, (JSON.parse(readFileSync(join(CACHE, 'current'), 'utf8')) as { dir: string }).dir, 'cli.serve.v8cache');
    if (existsSync(join(CACHE, 'current'))) rmSync(current(), { force: true });
    const s = serve(log);
    try {
      const port = Number(new URL(await s.url).port);
      // The page with the sheet written into it: the first paint has been rendered by then.
      const page = await rawRequest(port, '/');
      expect(page.body).toMatch(/<main id="lv-sheet"[^>]*><article class="vb-sheet"/);
      // The launcher writes the cache right after the render; give it the turn it takes.
      for (let i = 0; i < 50 && !existsSync(current()); i++) await new Promise((ok) => setTimeout(ok, 100));
      expect(existsSync(current())).toBe(true);
    } finally {
      await stop(s.child);
    }
    expect(s.stderr()).not.toContain('running without the command bundle');
    expect(s.stderr()).not.toContain('could not build the page');
    const loaded = readFileSync(log, 'utf8');
    // The recorder was active in this process: it saw the launcher load its bundle loader.
    expect(loaded).toContain('/bin/bundle.js');
    expect(loaded.split('\n').filter((l) => /node_modules\/vite\//.test(l))).toEqual([]);
  }, 120_000);
});
