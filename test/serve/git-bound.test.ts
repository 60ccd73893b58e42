/**
 * The live server's git look-ups are bounded: many page loads at once share one git process.
 * A `git` early on PATH logs each start and hands over to the real git.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { startServer, type ServeHandle } from '../../bin/serve/server.js';
import { sharedArchive, type HeadLookup } from '../../bin/git.js';
import { FIXTURES, rawRequest, tempCopy } from './helpers.js';

const REAL_GIT = execFileSync('sh', ['-c', 'command -v git'], { encoding: 'utf8' }).trim();

let server: ServeHandle;
let tmp: ReturnType<typeof tempCopy>;
let log = '';
const path = process.env.PATH;

beforeAll(async () => {
  tmp = tempCopy(join(FIXTURES, 'barrel.md'));
  const git = (...a: string[]) => execFileSync(REAL_GIT, ['-c', 'user.name=t', '-c', 'user.email=t@example.invalid', '-c', 'commit.gpgsign=false', ...a], { cwd: tmp.dir });
  git('init', '-q');
  git('add', 'calc.md');
  git('commit', '-q', '-m', 'fictional calc');
  const bin = join(tmp.dir, 'shim');
  mkdirSync(bin);
  log = join(tmp.dir, 'git-starts.log');
  writeFileSync(join(bin, 'git'), `#!/bin/sh\necho "$*" >> '${log}'\nexec '${REAL_GIT}' "$@"\n`);
  chmodSync(join(bin, 'git'), 0o755);
  process.env.PATH = `${bin}:${path}`;
  server = await startServer({ file: tmp.file, port: 0, logLevel: 'silent' });
});

afterAll(async () => {
  process.env.PATH = path;
  await server?.close();
  tmp?.cleanup();
});

describe('GET /__doc and git', () => {
  it('300 page loads at once start at most a few git processes (not 600), and all get the commit', { timeout: 120_000 }, async () => {
    const head = execFileSync(REAL_GIT, ['rev-parse', 'HEAD'], { cwd: tmp.dir, encoding: 'utf8' }).trim();
    const replies = await Promise.all(Array.from({ length: 300 }, () => rawRequest(server.port, '/__doc')));
    const starts = existsSync(log) ? readFileSync(log, 'utf8').trim().split('\n').length : 0;
    console.log(`300 concurrent GET /__doc: ${starts} git processes`);
    expect(replies.every((r) => r.status === 200 && JSON.parse(r.body).archive.commit === head)).toBe(true);
    expect(starts).toBeGreaterThan(0);
    expect(starts).toBeLessThanOrEqual(10);
  });
});

describe('sharedArchive', () => {
  it('sharedArchive(file) runs one look-up for every caller that asks while it is in flight', async () => {
    let calls = 0;
    let release: (v: HeadLookup) => void = () => {};
    const lookup = () => { calls++; return new Promise<HeadLookup>((ok) => { release = ok; }); };
    let clock = 0;
    const archive = sharedArchive('calc.md', lookup, 1000, () => clock);
    const bytes = Buffer.from('x = 1\n');
    const waiting = Array.from({ length: 50 }, () => archive(bytes));
    // The blob id of 'x = 1\n' as `printf 'x = 1\n' | git hash-object --stdin` gives it.
    release({ format: 'sha1', commit: 'a'.repeat(40), blob: '7d4290a117a4ddcc11daae7ea675841033830c8f' });
    const infos = await Promise.all(waiting);
    expect(calls).toBe(1);
    expect(infos.every((i) => i.commit === 'a'.repeat(40) && i.dirty === false)).toBe(true);
    // Within a second the answer is reused; other bytes are dirty at once.
    clock = 999;
    expect((await archive(Buffer.from('x = 2\n'))).dirty).toBe(true);
    expect(calls).toBe(1);
    // Later, a look-up of its own (HEAD may have moved).
    clock = 1000;
    const later = archive(Buffer.from('x = 2\n'));
    expect(calls).toBe(2);
    release({ format: 'sha1', commit: 'a'.repeat(40), blob: '7d4290a117a4ddcc11daae7ea675841033830c8f' });
    expect((await later).dirty).toBe(true);
  });
});
